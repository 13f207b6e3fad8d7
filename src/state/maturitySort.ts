import { addTenor, parseIsoDate, parseTenor, serialFromIso } from '../core/index.ts';

/**
 * Sort key of a maturity cell: the day serial of its date (a tenor counted from the settlement
 * date); cells that are not a maturity sort last.
 */
export function maturitySortKey(text: string, settlement: string): number {
  const s = text.trim();
  if (parseIsoDate(s)) return serialFromIso(s);
  const tenor = parseTenor(s);
  if (tenor && parseIsoDate(settlement)) return serialFromIso(addTenor(settlement, tenor));
  return Number.POSITIVE_INFINITY;
}
