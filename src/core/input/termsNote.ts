import { conventionSet } from '../kinds/conventionSets.ts';
import type { QuoteKind } from '../document/types.ts';
import { parseDayCountText, parseFrequencyText } from './quoteText.ts';
import type { RowTerms, TermField } from './termsText.ts';

/** TERM_FIELDS of termsText.ts, in its order (repeated so this chunk imports nothing of that module). */
const TERM_FIELDS: readonly TermField[] = ['calendar', 'spotLag', 'businessDay', 'paymentLag', 'eom', 'floatDayCount', 'convexity'];

/**
 * What a row's conventions come to, for the sheet: the set that fills its fields (its own, else
 * the workspace's market conventions when that set fills the kind) and, for each field the row
 * gives itself (in its Conventions, Freq or Day count cell), its value and the set's, so the sheet
 * can say what the row overrides. Null when no set applies and the row gives no field.
 */
export interface RowConventions {
  readonly set: string | null;
  /** True when the set is the workspace's (the row's cell names none). */
  readonly fromWorkspace: boolean;
  readonly title: string | null;
  /** Fields the row gives, each with the set's value when the set fills it (an override when they differ). */
  readonly given: readonly { readonly field: string; readonly value: string; readonly setValue: string | null }[];
}

const FIELD_LABEL: Readonly<Record<string, string>> = {
  calendar: 'calendar',
  spotLag: 'spot lag',
  businessDay: 'rule',
  paymentLag: 'payment lag',
  eom: 'eom',
  floatDayCount: 'float day count',
  convexity: 'convexity (bp)',
  frequency: 'frequency',
  dayCount: 'day count',
};

const shownValue = (field: string, v: string | number | boolean): string => (field === 'eom' ? (v === true ? 'on' : 'off') : String(v));

export function rowConventions(kindText: string, terms: RowTerms | null, frequencyCell: string, dayCountCell: string, market: string | undefined): RowConventions | null {
  const kind = kindText.trim().toLowerCase() as QuoteKind;
  if (terms === null) return null;
  const own = terms.set;
  const fills = (id: string | undefined | null) => (id ? conventionSet(id)?.fields[kind] : undefined);
  const setId = own ?? (fills(market) !== undefined ? market! : null);
  const setFields = fills(setId);
  const given: { field: string; value: string; setValue: string | null }[] = [];
  const push = (field: string, v: string | number | boolean) => {
    const sv = setFields?.[field];
    given.push({ field, value: shownValue(field, v), setValue: sv === undefined ? null : shownValue(field, sv) });
  };
  for (const f of TERM_FIELDS) if (terms.fields[f] !== undefined) push(f, terms.fields[f]!);
  const freq = frequencyCell.trim() === '' ? null : parseFrequencyText(frequencyCell);
  if (freq?.ok) push('frequency', freq.value);
  const dc = dayCountCell.trim() === '' ? null : parseDayCountText(dayCountCell);
  if (dc?.ok) push('dayCount', dc.value);
  if (setId === null && given.length === 0) return null;
  const overrides = given.filter((g) => g.setValue !== null && g.setValue !== g.value);
  const parts: string[] = [];
  if (setId !== null) parts.push(`Convention set ${setId}${own === null ? ' (the workspace\u2019s market conventions)' : ''}: ${conventionSet(setId)?.title ?? ''}`);
  if (overrides.length > 0) parts.push(`this row overrides ${overrides.map((o) => `${FIELD_LABEL[o.field]} ${o.value} (the set\u2019s ${o.setValue})`).join(', ')}`);
  const added = given.filter((g) => g.setValue === null);
  if (added.length > 0) parts.push(`${setId === null ? 'this row gives' : 'and adds'} ${added.map((o) => `${FIELD_LABEL[o.field]} ${o.value}`).join(', ')}`);
  return { set: setId, fromWorkspace: own === null && setId !== null, title: parts.join('; '), given };
}
