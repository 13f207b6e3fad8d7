import { parseDateText, parseTenor, resolveMarketDate, serialFromIso, type DateOrder } from '../core/index.ts';

/**
 * Sort key of a maturity cell: the day serial of its date (a tenor counted from the settlement
 * date); cells that are not a maturity sort last.
 */
export function maturitySortKey(text: string, settlement: string, dateOrder: DateOrder = 'mdy'): number {
  const s = text.trim();
  const date = parseDateText(s, dateOrder);
  if (date?.ok) return serialFromIso(date.date);
  const tenor = parseTenor(s);
  const at = tenor ? resolveMarketDate(settlement, tenor) : null;
  if (at?.ok) return serialFromIso(at.value);
  return Number.POSITIVE_INFINITY;
}
