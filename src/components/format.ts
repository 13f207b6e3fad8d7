import { COMPOUNDING_LABEL, type Compounding } from '../core/index.ts';

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
