/**
 * The one rounding rule for figures shown to a person (screens, print, messages). CSV cells and the
 * command's JSON fields never pass through here: they keep plain numbers.
 *
 *   1. A missing or non-finite value (null, undefined, NaN, +-Infinity) shows as an em dash, NO_VALUE.
 *   2. A finite value is read as its shortest round-trip decimal text (what String(x) prints; decimal.js
 *      `new Decimal(x)`), scaled exactly by a power of ten to the unit shown (100 for %, 10^4 for bp
 *      from a decimal), and rounded to the quantity's decimals half away from zero (decimal.js
 *      ROUND_HALF_UP). So 1.005 shown to 2 decimals is 1.01, where Number#toFixed, rounding the
 *      binary value 1.00499999999999989..., prints 1.00.
 *   3. A value that rounds to zero prints as an unsigned zero ("0.00", never "-0.00"); -0 too.
 *   4. A negative value carries one minus sign, U+2212 (MINUS); a change may ask for an explicit plus.
 *   5. No exponent ever: 1e21 prints all its digits.
 * The decimals of each quantity are in QUANTITY_DECIMALS (format/quantities.ts).
 */

import { groupThousands, isShown, MINUS, NO_VALUE } from './marks.ts';

export { groupThousands, isShown, MINUS, NO_VALUE };

/**
 * The digits of |x| x 10^scale rounded to `dp` decimals (rule 2), and its sign after rounding:
 * -1, 0 or 1. Only for finite x. Works on the shortest text's digits as a string (the same result
 * as decimal.js scaling and ROUND_HALF_UP, which test/core/format/format.test.ts checks on random
 * doubles), at about a tenth of decimal.js's cost, since tables format hundreds of figures a render.
 */
function roundedDigits(x: number, dp: number, scale: number): { digits: string; sign: -1 | 0 | 1 } {
  return roundedText(String(Math.abs(x)), x < 0, dp, scale);
}

/**
 * roundedDigits on a plain decimal text of |value| ("1234.5", "1.5e-7") and its sign: the rule for
 * an exact amount that is not a double (money kept in decimal.js, whose toFixed() text comes here).
 */
function roundedText(text: string, negative: boolean, dp: number, scale: number): { digits: string; sign: -1 | 0 | 1 } {
  const e = text.indexOf('e');
  const mantissa = e < 0 ? text : text.slice(0, e);
  const exponent = e < 0 ? 0 : Number(text.slice(e + 1));
  const dot = mantissa.indexOf('.');
  const whole = dot < 0 ? mantissa : mantissa.slice(0, dot);
  const digits = dot < 0 ? mantissa : whole + mantissa.slice(dot + 1);
  // value = 0.digits x 10^point, on the shown scale
  const point = whole.length + exponent + scale;
  const keep = point + dp; // digits kept before rounding
  let kept: string;
  if (keep < 0) kept = '';
  else if (keep >= digits.length) kept = digits + '0'.repeat(keep - digits.length);
  else {
    kept = digits.slice(0, keep);
    if (digits.charCodeAt(keep) >= 53 /* '5' */) kept = increment(kept);
  }
  // kept holds the rounded value x 10^dp as digits; a carry may have lengthened it by one
  const padded = kept.length <= dp ? '0'.repeat(dp + 1 - kept.length) + kept : kept;
  const intPart = padded.slice(0, padded.length - dp).replace(/^0+(?=\d)/, '');
  const fracPart = padded.slice(padded.length - dp);
  const zero = !/[1-9]/.test(padded);
  return { digits: dp > 0 ? `${intPart}.${fracPart}` : intPart, sign: zero ? 0 : negative ? -1 : 1 };
}

/** Adds one to a string of decimal digits ("" + 1 = "1", "199" + 1 = "200"). */
function increment(d: string): string {
  let i = d.length - 1;
  while (i >= 0 && d[i] === '9') i--;
  if (i < 0) return '1' + '0'.repeat(d.length);
  return d.slice(0, i) + String.fromCharCode(d.charCodeAt(i) + 1) + '0'.repeat(d.length - 1 - i);
}

/** The digits figure() shows for |x| (no sign, no grouping); tests hold them to decimal.js scaling and ROUND_HALF_UP. */
export const roundedDigitsOf = (x: number, dp: number, scale = 0): string => roundedDigits(x, dp, scale).digits;


export interface FigureOptions {
  /** Power of ten applied before rounding: 2 shows a decimal rate in percent, 4 in bp. Default 0. */
  readonly scale?: number;
  /** Show a plus sign on a positive value (changes and differences). Default false. */
  readonly plus?: boolean;
  /** Group the whole part in threes with commas. Default false. */
  readonly group?: boolean;
}

/**
 * x with `dp` decimals under the one rounding rule: "1.25", "−0.50", "0.00" (for -0.001), "—" for NaN.
 * @param x - the value; null, undefined and non-finite show as NO_VALUE
 * @param dp - decimals shown, a whole number 0..100
 */
export function figure(x: number | null | undefined, dp: number, options: FigureOptions = {}): string {
  if (!isShown(x)) return NO_VALUE;
  const { digits, sign } = roundedDigits(x, dp, options.scale ?? 0);
  const body = options.group ? groupThousands(digits) : digits;
  return sign < 0 ? MINUS + body : sign > 0 && options.plus ? `+${body}` : body;
}

/** A figure's rounded value as a number (for "does it show as zero" checks), or NaN for a non-finite x. */
export function roundedValue(x: number, dp: number, scale = 0): number {
  if (!Number.isFinite(x)) return Number.NaN;
  const { digits, sign } = roundedDigits(x, dp, scale);
  return sign * Number(digits);
}

/** A plain decimal text, optionally signed, with an optional exponent ("-1234.5", "1.5e-7"). */
const DECIMAL_TEXT = /^([+-]?)((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)$/;

/**
 * An exact amount (a decimal.js value, its text, or a number) with `dp` decimals under the same
 * rule; for money and other exact amounts. Anything that is not a finite decimal shows as NO_VALUE.
 */
export function decimalFigure(d: number | string | { toFixed(): string }, dp: number, options: Omit<FigureOptions, 'scale'> = {}): string {
  if (typeof d === 'number' && !Number.isFinite(d)) return NO_VALUE;
  const m = DECIMAL_TEXT.exec(typeof d === 'object' ? d.toFixed() : String(d));
  if (!m) return NO_VALUE;
  const { digits, sign } = roundedText(m[2]!, m[1] === '-', dp, 0);
  const body = options.group ? groupThousands(digits) : digits;
  return sign < 0 ? MINUS + body : sign > 0 && options.plus ? `+${body}` : body;
}

/**
 * A number as "6.9 × 10^−14" (a tooltip's exact figure; never "6.9e-14" on screen), `digits`
 * decimals in the mantissa. Non-finite values show as NO_VALUE.
 */
export function scientific(x: number, digits: number): string {
  if (!Number.isFinite(x)) return NO_VALUE;
  const [m, e] = x.toExponential(digits).split('e') as [string, string];
  return `${m.replace('-', MINUS)} \u00d7 10^${e.replace('+', '').replace('-', MINUS)}`;
}

/**
 * A figure with `dp` decimals where anything smaller in size than `tolerance` (default: half the last
 * decimal shown) shows as an unsigned zero, and its computed value and the tolerance go to `title`
 * (for a tooltip). Never prints "6.9e-14": a desk reads that as noise. The value and the tolerance
 * are in the same unit, named by `unit` ("bp", "per 100 face").
 */
export function nearZero(x: number | null | undefined, dp: number, unit: string, tolerance = 0.5 * 10 ** -dp): { text: string; title: string | undefined } {
  if (!isShown(x)) return { text: NO_VALUE, title: undefined };
  if (Math.abs(x) < tolerance || roundedValue(x, dp) === 0) {
    const tol = tolerance >= 1e-4 ? String(Number(tolerance.toPrecision(2))) : scientific(tolerance, 0);
    return { text: figure(0, dp), title: x === 0 ? undefined : `Zero within ${tol} ${unit} (computed: ${scientific(x, 1)} ${unit})` };
  }
  return { text: figure(x, dp), title: undefined };
}
