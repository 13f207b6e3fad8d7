import type { QuoteConvention } from '../kinds/types.ts';
import type { Compounding } from '../rates/compounding.ts';

/**
 * The tag every rate carries: its compounding and its day count, "cont, ACT/365F".
 *
 * House style (one for screens, print, CSV headers and the command's texts):
 *   - compounding first, then the day count, separated by ", ";
 *   - compounding in its short word: simple, ann, s.a., qtr, mthly, cont (COMPOUNDING_LABEL); a coupon
 *     paid f times a year in the same words, `f/yr` for any other f;
 *   - the day count as the engine names it (ACT/360, ACT/365F, 30/360, ACT/ACT-ICMA, ...);
 *   - next to a figure the tag stands in parentheses after it: "4.2500% (cont, ACT/365F)" (formatRate);
 *     above a column it stands in the header, and the cells show the bare percent.
 */

/** Short labels for display: "cont", "simple", "ann", "s.a.", "qtr", "mthly". */
export const COMPOUNDING_LABEL: Readonly<Record<Compounding, string>> = {
  simple: 'simple',
  annual: 'ann',
  semiannual: 's.a.',
  quarterly: 'qtr',
  monthly: 'mthly',
  continuous: 'cont',
};

const PER_YEAR: Readonly<Record<number, Compounding>> = { 1: 'annual', 2: 'semiannual', 4: 'quarterly', 12: 'monthly' };

/** The short word of a coupon paid `frequency` times a year: "ann", "s.a.", "qtr", "mthly", else "3/yr". */
export const frequencyLabel = (frequency: number): string => {
  const c = PER_YEAR[frequency];
  return c === undefined ? `${frequency}/yr` : COMPOUNDING_LABEL[c];
};

/** The tag of a rate: rateTag('continuous', 'ACT/365F') = "cont, ACT/365F". */
export const rateTag = (c: Compounding, dayCount: string): string => `${COMPOUNDING_LABEL[c]}, ${dayCount}`;

/** The tag of a coupon-style rate paid f times a year (par yields, swap rates, bond yields): "s.a., ACT/ACT-ICMA". */
export const couponTag = (frequency: number, dayCount: string): string => `${frequencyLabel(frequency)}, ${dayCount}`;

/** The tag of an ICMA bond yield paid f times a year: "s.a., ACT/ACT-ICMA". */
export const yieldTag = (frequency: number): string => couponTag(frequency, 'ACT/ACT-ICMA');

/** Annualised returns of the roll-versus-term analysis: annual compounding on ACT/365F. */
export const RETURN_TAG = rateTag('annual', 'ACT/365F');

/** The conventions of the zero and forward lines: "zero cont, ACT/365F; forward 3M cont, ACT/365F". */
export interface ZeroForwardConventions {
  readonly zeroCompounding: Compounding;
  readonly zeroDayCount: string;
  readonly forwardTenor: string;
  readonly forwardCompounding: Compounding;
  readonly forwardDayCount: string;
}
export const zeroForwardTag = (c: ZeroForwardConventions): string =>
  `zero ${rateTag(c.zeroCompounding, c.zeroDayCount)}; forward ${c.forwardTenor} ${rateTag(c.forwardCompounding, c.forwardDayCount)}`;

/**
 * A quote's convention as a value: its unit, and for a rate how it compounds and counts days.
 * `compounding` is a compounding name, or the number of coupons a year of a coupon-style rate.
 */
export interface ConventionValue {
  readonly unit: string;
  readonly compounding?: Compounding | number | null | undefined;
  readonly dayCount?: string | null | undefined;
}

/**
 * The text of a convention value:
 *   {unit: 'rate', compounding: 'simple', dayCount: 'ACT/360'}   -> "simple, ACT/360"
 *   {unit: 'rate', compounding: 2, dayCount: '30/360'}           -> "s.a., 30/360"
 *   {unit: 'price'}                                              -> "per 100 face"
 *   {unit: 'price', compounding: 2, dayCount: 'ACT/ACT-ICMA'}   -> "per 100 face; yield s.a., ACT/ACT-ICMA"
 *   any other unit                                               -> the unit, then "; " and the tag if any
 */
export function conventionTag(c: ConventionValue): string {
  const tag =
    c.compounding === undefined || c.compounding === null
      ? c.dayCount ?? ''
      : `${typeof c.compounding === 'number' ? frequencyLabel(c.compounding) : COMPOUNDING_LABEL[c.compounding]}${c.dayCount ? `, ${c.dayCount}` : ''}`;
  if (c.unit === 'rate') return tag;
  const unit = c.unit === 'price' ? 'per 100 face' : c.unit;
  return tag === '' ? unit : `${unit}; ${c.unit === 'price' ? 'yield ' : ''}${tag}`;
}

/** The convention of an ICMA bond yield as the command writes it: "ICMA, compounded 2/yr, accrual ACT/ACT-ICMA". */
export const bondYieldConvention = (frequency: number, accrualDayCount: string): string => `ICMA, compounded ${frequency}/yr, accrual ${accrualDayCount}`;

/**
 * How a quote is quoted (its kind's QuoteConvention, src/core/kinds) as a tag: "per 100",
 * "clean, per 100", or a rate's compounding and day count ("simple, ACT/360", "discount, ACT/360",
 * "s.a., ACT/ACT-ICMA"). The one place a quote's convention becomes text.
 */
export const quoteConventionTag = (c: QuoteConvention): string =>
  c.unit === 'price'
    ? c.futuresRate !== undefined
      ? `100 − futures rate (${rateTag('simple', 'ACT/360')}, ${c.futuresRate === 'compounded' ? 'compounded daily over the quarter' : 'averaged over the month'})`
      : c.clean ? 'clean, per 100' : 'per 100'
    : c.compounding === 'bank-discount' ? `discount, ${c.dayCount}` : c.compounding === 'bill-equivalent' ? 'bond-equivalent, ACT/365 or 366' : rateTag(c.compounding, c.dayCount);
