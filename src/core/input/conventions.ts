import { DATE_ORDERS, isDateOrder, type DateOrder } from './dateText.ts';

/**
 * How the sheet reads what people type, set once for the workspace (saved with it, so a shared
 * workspace reads its text the same way): the order of a numeric date (`11/15/2027` month/day/year
 * or `15/11/2027` day/month/year) and the decimal mark (`3.25` or `3,25`).
 */
export const DECIMAL_MARKS = ['.', ','] as const;
export type DecimalMark = (typeof DECIMAL_MARKS)[number];
export const isDecimalMark = (x: unknown): x is DecimalMark => x === '.' || x === ',';
export const DECIMAL_MARK_LABEL: Readonly<Record<DecimalMark, string>> = { '.': 'point (3.25)', ',': 'comma (3,25)' };

export interface InputConventions {
  readonly dateOrder: DateOrder;
  readonly decimalMark: DecimalMark;
}

/** Month/day/year and a decimal point: what the sheet read before these settings existed. */
export const DEFAULT_CONVENTIONS: InputConventions = { dateOrder: 'mdy', decimalMark: '.' };

export { DATE_ORDERS, isDateOrder };

/**
 * Number text with a decimal comma re-written with a point, for the exact readers: `3,25` ->
 * `3.25`, `1.000,5` -> `1000.5` (points grouping thousands in threes are dropped). With the
 * decimal point the text is returned unchanged.
 */
export function withDecimalPoint(text: string, mark: DecimalMark): string {
  if (mark === '.' || !text.includes(',')) return text;
  const grouped = /^\s*[+\-\u2212]?\d{1,3}(\.\d{3})+,/.test(text) ? text.replace(/\./g, '') : text;
  return grouped.replace(',', '.');
}
