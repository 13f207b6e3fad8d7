import { COMPOUNDING_LABEL, type Compounding, type QuoteConvention } from '../core/index.ts';

/** The tag every rate carries: compounding and day count, e.g. "cont, ACT/365F". */
export const rateTag = (c: Compounding, dayCount: string): string => `${COMPOUNDING_LABEL[c]}, ${dayCount}`;

/** Tag of a coupon-style rate paid f times a year (par yields, forward par rates). */
export const couponTag = (frequency: number, dayCount: string): string =>
  `${frequency === 1 ? 'ann' : frequency === 2 ? 's.a.' : frequency === 4 ? 'qtr' : frequency === 12 ? 'mthly' : `${frequency}/yr`}, ${dayCount}`;

const MINUS = '\u2212';
const sign = (s: string): string => (s.startsWith('-') ? MINUS + s.slice(1) : s);

/** A decimal rate as percent text with `dp` decimals ("4.2500%"); a dash for a missing value. */
export const pct = (r: number | null | undefined, dp = 4): string => (r === null || r === undefined || !Number.isFinite(r) ? '\u2014' : sign(`${(100 * r).toFixed(dp)}%`));
/** A decimal rate difference in basis points. */
export const bp = (d: number | null | undefined, dp = 2): string => (d === null || d === undefined || !Number.isFinite(d) ? '\u2014' : sign(`${(1e4 * d).toFixed(dp)} bp`));
export const num = (x: number | null | undefined, dp: number): string => (x === null || x === undefined || !Number.isFinite(x) ? '\u2014' : sign(x.toFixed(dp)));

/** The sheet's row number (from 1) of the engine document's quotes[quote]; without a map, quote + 1. */
export const rowNumber = (rowOfQuote: readonly number[] | undefined, quote: number): number => (rowOfQuote?.[quote] ?? quote) + 1;

/**
 * A figure shown with `dp` decimals, where anything smaller in size than `tolerance` (default: half
 * the last decimal shown) is shown as an unsigned zero and its computed value and the tolerance go to
 * `title` (for a tooltip). Never prints "-0.00000" or "6.9e-14": a desk reads those as noise. The
 * value and the tolerance are in the same unit, named by `unit` ("bp", "per 100 face").
 */
export function nearZero(x: number | null | undefined, dp: number, unit: string, tolerance = 0.5 * 10 ** -dp): { text: string; title: string | undefined } {
  if (x === null || x === undefined || !Number.isFinite(x)) return { text: '\u2014', title: undefined };
  if (Math.abs(x) < tolerance || Number(x.toFixed(dp)) === 0) {
    const tol = tolerance >= 1e-4 ? String(Number(tolerance.toPrecision(2))) : scientific(tolerance, 0);
    return { text: (0).toFixed(dp), title: x === 0 ? undefined : `Zero within ${tol} ${unit} (computed: ${scientific(x, 1)} ${unit})` };
  }
  return { text: sign(x.toFixed(dp)), title: undefined };
}

/** A number as "6.9 × 10^−14" (a tooltip's exact figure; never "6.9e-14" on screen). */
export function scientific(x: number, digits: number): string {
  const [m, e] = x.toExponential(digits).split('e') as [string, string];
  return `${sign(m)} \u00d7 10^${e.replace('+', '').replace('-', MINUS)}`;
}

/**
 * How a quote is quoted (the core's `QuoteConvention`, from its kind's module) as a tag: "per 100",
 * "clean, per 100", or a rate's compounding and day count ("simple, ACT/360", "discount, ACT/360",
 * "s.a., ACT/ACT-ICMA"). The one place the sheet's tables write a quote's convention.
 */
export const conventionTag = (c: QuoteConvention): string =>
  c.unit === 'price' ? (c.clean ? 'clean, per 100' : 'per 100') : `${c.compounding === 'bank-discount' ? 'discount' : COMPOUNDING_LABEL[c.compounding]}, ${c.dayCount}`;
