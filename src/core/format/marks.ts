/**
 * The marks every figure shown to a person shares (numberText.ts states the rules), and the whole
 * counts, which need no decimal arithmetic: kept apart from numberText.ts
 * so code that only counts (the reading worker's messages) does not carry it.
 */

/** The minus sign of every figure shown to a person: U+2212, as wide as the plus sign. */
export const MINUS = '\u2212';
/** What a missing or non-finite figure shows: an em dash. */
export const NO_VALUE = '\u2014';

/** Whether a value can be shown as a figure (finite number). */
export const isShown = (x: number | null | undefined): x is number => typeof x === 'number' && Number.isFinite(x);

/** "1234567.89" -> "1,234,567.89": commas every three digits of the whole part. */
export function groupThousands(text: string): string {
  const dot = text.indexOf('.');
  const whole = dot < 0 ? text : text.slice(0, dot);
  return whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',') + (dot < 0 ? '' : text.slice(dot));
}

/**
 * A count (rows, characters, quotes): a whole number grouped in threes, "12,345", by the figure
 * rules (numberText.ts figure(n, 0, { group: true }), which test/core/format/format.test.ts holds
 * it to): half away from zero, an unsigned zero, U+2212 for a negative, an em dash when missing.
 * Below 2^53 Math.round on |n| rounds a double half away from zero exactly as its shortest text
 * does; from 2^53 every double is whole and its digits are those of its shortest text (as the
 * figure rules read a value), the exponent written out.
 */
export function formatCount(n: number | null | undefined): string {
  if (!isShown(n)) return NO_VALUE;
  const a = Math.abs(n);
  const digits = a < 2 ** 53 ? String(Math.round(a)) : wholeDigits(String(a));
  return (n < 0 && digits !== '0' ? MINUS : '') + groupThousands(digits);
}

/** The digits of a whole number's shortest text, "8.3e+21" -> "8300000000000000000000". */
function wholeDigits(text: string): string {
  const e = text.indexOf('e');
  if (e < 0) return text;
  const mantissa = text.slice(0, e);
  const dot = mantissa.indexOf('.');
  const ints = dot < 0 ? mantissa : mantissa.slice(0, dot);
  const frac = dot < 0 ? '' : mantissa.slice(dot + 1);
  return ints + frac + '0'.repeat(Number(text.slice(e + 1)) - frac.length);
}
