import Decimal from 'decimal.js';

/**
 * Exact reading of numbers typed by a person. The text is read as an exact decimal (decimal.js),
 * scaled exactly (percent: / 100, basis points: / 10,000, 32nds of a point), and only then rounded
 * once to the nearest float64, so "3.25%" gives exactly the double nearest 0.0325 and never
 * 3.25 / 100 rounded twice.
 */

/** Unicode minus signs and dashes a spreadsheet or a word processor may put in front of a number. */
const MINUS_SIGNS = /[\u2212\u2012\u2013\u2014\uFE63\uFF0D]/g;
const NUMBER_RE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Text with Unicode minus signs replaced by "-", non-breaking and thin spaces removed, trimmed. */
export function normaliseNumberText(text: string): string {
  return text.replace(MINUS_SIGNS, '-').replace(/[\s\u00A0\u2009\u202F]+/g, '').trim();
}

/** The exact decimal written in `text` (already normalised), or null when it is not a plain number. */
export function exactDecimal(text: string): Decimal | null {
  if (!NUMBER_RE.test(text)) return null;
  return new Decimal(text);
}

/** The double nearest the exact value `d`, after an exact division by `scale` (1, 100, 10,000). */
export function nearestDouble(d: Decimal, scale: number): number {
  return d.div(scale).toNumber();
}

/** Exact decimal text of `d` times `factor` (for re-writing a typed number in another unit). */
export function scaledText(d: Decimal, factor: Decimal.Value): string {
  return d.times(factor).toFixed();
}

export { Decimal };
