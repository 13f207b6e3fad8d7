import type { ParYieldQuote } from '../document/types.ts';
import { civilFromIso, isoFromCivil, serialFromCivil, type CivilDate, type IsoDate } from '../time/date.ts';
import { bondDirtyFromYield, bondScheduleCivil, type YieldSchedule } from './bond.ts';
import { billYearBasis } from './bill.ts';
import { CompiledInstrument, DISCOUNTING, type Instrument, type QuoteTrace } from './instrument.ts';

/**
 * A government par yield's theoretical security. US Treasury: par yields "on a bond-equivalent
 * basis ... consistent with a semiannual coupon security with that amount of time remaining to
 * maturity" (the Treasury's yield curve FAQ, as quoted in public code; treasury.gov not read here);
 * the curve's inputs are bills' bond-equivalent yields and notes and bonds near par (Treasury's
 * yield curve methodology page).
 *
 * The schedule is a bond's (instruments/bond.ts `bondScheduleCivil`): coupon dates every
 * 12/frequency months back from the maturity, unadjusted, the end-of-month rule when the maturity
 * is a month end; `previous` the last coupon date on or before settlement. With
 *   w = the fraction of the current coupon period still to run (ICMA: yf(settlement, next) / yf(previous, next)
 *       on the day count), N the number of coupon dates after settlement,
 *   n = w + N - 1, the number of coupon periods from settlement to maturity,
 *   a = yf(previous, settlement), the accrual fraction of a year on the day count:
 *
 * - **Par bond** (n > f, above one year): coupon c = y, clean price 100, so
 *     sum_k 100 c/f DF(T_k) + 100 DF(T_N) = 100 (1 + c a)   (dirty = clean + accrued),
 *   and the model par yield from a curve is c = (1 - DF(T_N)) / ((1/f) sum_k DF(T_k) - a). On a
 *   maturity on the coupon cycle (a tenor from settlement) a = 0 and this is the textbook
 *   par = f (1 - D(n)) / sum_k D(k/f) (Federal Reserve GSW 2006 par-yield definition).
 * - **Zero** (n <= f, one year or less; Treasury bills enter the curve as zeros whose
 *   bond-equivalent yield is the spot rate): DF = (1 + y/f)^(-n), i.e. the yield compounded f
 *   times a year over n = f tau coupon periods, tau measured in coupon periods on the day count
 *   (ACT/ACT-ICMA: actual days over the actual days of the coupon period). This is the ICMA yield
 *   of a zero-coupon bond on the same schedule (bondDirtyFromYield with no coupon), the same
 *   yield-to-price rule as a bond's, and the spot rate s_k = f (D_k^(-1/k) - 1) of the par-to-zero
 *   recursion. On any basis but the US Treasury's (below).
 * - **Bill** (n <= f on the US Treasury basis, frequency 2 and ACT/ACT-ICMA): a bill's
 *   bond-equivalent (coupon-equivalent) yield, as Treasury and the SIA formulas define it (SIA,
 *   Fixed Income Securities Formulas, vol. 1, on Treasury bills; the same rule in the open
 *   financial libraries' bill functions; bill.ts billInvestmentYield gives it from a price): with
 *   d the days from settlement to maturity and T = 366 when 29 February falls in the year after
 *   settlement, else 365 (billYearBasis),
 *     d <= T/2:  DF = 1 / (1 + y d / T)                               (simple interest)
 *     d >  T/2:  DF = 1 / ((1 + y/2) (1 + y (d/T - 1/2)))             (a half-year compounded, then simple)
 *   whose inverse for d > 182 is Treasury's quadratic y = (-2a + 2 sqrt(a^2 - (2a - 1)(1 - 1/DF))) / (2a - 1), a = d/T.
 */
export interface ParYieldSchedule {
  readonly dates: readonly CivilDate[];
  readonly previous: CivilDate;
  /** Coupon periods from settlement to maturity, n = w + N - 1. */
  readonly periods: number;
  /** Year fraction from the previous coupon date to settlement on the day count (accrued per unit coupon). */
  readonly accrualFraction: number;
  /** True when n <= frequency: the quote is a zero-coupon bond-equivalent yield. */
  readonly zero: boolean;
  /** The yield terms of a bond on the schedule with coupon c (bondDirtyFromYield). */
  readonly w: number;
  /** For a zero on the US Treasury basis: days from settlement to maturity and the year's days T (365 or 366); null otherwise. */
  readonly bill: { readonly days: number; readonly basis: number } | null;
}

/** The theoretical security's schedule (see ParYieldSchedule) on civil dates. */
export function parYieldScheduleCivil(q: Pick<ParYieldQuote, 'maturity' | 'frequency' | 'dayCount' | 'eom'>, settlement: CivilDate, maturity: CivilDate): ParYieldSchedule {
  // A coupon of 1 gives the accrual fraction as accrued / 100.
  const s = bondScheduleCivil({ maturity: q.maturity, coupon: 1, frequency: q.frequency, dayCount: q.dayCount, eom: q.eom }, settlement, maturity);
  const periods = s.w + s.dates.length - 1;
  const zero = periods <= q.frequency;
  const bill = zero && q.frequency === 2 && q.dayCount === 'ACT/ACT-ICMA' ? { days: serialFromCivil(maturity) - serialFromCivil(settlement), basis: billYearBasis(isoFromCivil(settlement)) } : null;
  return { dates: s.dates, previous: s.previous, periods, accrualFraction: s.accrued / 100, zero, w: s.w, bill };
}

/** ln DF of a bill's bond-equivalent yield y over `days` on a year of `basis` days (bill.ts billYearBasis), the inverse of billInvestmentYield. */
export function billLn(y: number, days: number, basis: number): number {
  const a = days / basis;
  return days <= basis / 2 ? -Math.log1p(y * a) : -(Math.log1p(y / 2) + Math.log1p(y * (a - 0.5)));
}

/** The bond-equivalent yield of a bill from ln DF: simple up to half a year (T/2 days), Treasury's quadratic beyond (bill.ts billInvestmentYield from a price). */
export function billYield(ln: number, days: number, basis: number, trace?: QuoteTrace): number {
  const a = days / basis;
  const growth = Math.expm1(-ln); // 1/DF - 1
  trace?.('g', growth);
  if (days <= basis / 2) return growth / a;
  // (2a - 1)/4 y^2 + a y - growth = 0; the root written to avoid cancellation: y = 2 growth / (a + sqrt(a^2 + (2a - 1) growth)).
  return (2 * growth) / (a + Math.sqrt(a * a + (2 * a - 1) * growth));
}

/** The schedule with ISO dates, for the quote check. */
export function parYieldSchedule(q: ParYieldQuote, settlement: IsoDate): ParYieldSchedule & { readonly isoDates: readonly IsoDate[]; readonly previousIso: IsoDate } {
  const s = parYieldScheduleCivil(q, civilFromIso(settlement), civilFromIso(q.maturity));
  const last = s.dates.length - 1;
  return { ...s, isoDates: s.dates.map((d, i) => (i === last ? q.maturity : isoFromCivil(d))), previousIso: isoFromCivil(s.previous) };
}

/** ln DF of a zero-coupon bond-equivalent yield y compounded f times a year over n coupon periods: -n ln(1 + y/f). */
export const parZeroLn = (y: number, frequency: number, periods: number): number => -periods * Math.log1p(y / frequency);

/** The bond-equivalent yield of ln DF over n coupon periods: f ((DF)^(-1/n) - 1) = f expm1(-ln / n). */
export const parZeroYield = (ln: number, frequency: number, periods: number): number => frequency * Math.expm1(-ln / periods);

/**
 * A par bond's yield terms with coupon c (for its own dollar duration): the schedule's flows
 * 100 c/f and 100 at maturity, first exponent w.
 */
export function parBondYieldSchedule(s: ParYieldSchedule, coupon: number, frequency: number): YieldSchedule {
  const c = (100 * coupon) / frequency;
  return { amounts: s.dates.map((_, i) => (i === s.dates.length - 1 ? c + 100 : c)), w: s.w, frequency, coupon };
}

/**
 * Dollar duration -dP/dy per 100 face of the theoretical security at its own yield y: the par
 * bond's (bondDirtyFromYield with coupon y), or the zero's 100 n/f (1 + y/f)^(-n-1).
 */
export function parYieldDollarDuration(s: ParYieldSchedule, y: number, frequency: number): number {
  if (s.bill) {
    // -d(100 DF)/dy of the bill rule: 100 DF times the derivative of -ln DF.
    const a = s.bill.days / s.bill.basis;
    const df = Math.exp(billLn(y, s.bill.days, s.bill.basis));
    return 100 * df * (s.bill.days <= s.bill.basis / 2 ? a / (1 + y * a) : 0.5 / (1 + y / 2) + (a - 0.5) / (1 + y * (a - 0.5)));
  }
  if (s.zero) return ((100 * s.periods) / frequency) * Math.exp(-(s.periods + 1) * Math.log1p(y / frequency));
  return -bondDirtyFromYield(parBondYieldSchedule(s, y, frequency), y).dPdy;
}

export function compileParYield(q: ParYieldQuote, settlement: CivilDate, maturity: CivilDate, t: number, time: (d: CivilDate) => number): Instrument {
  const s = parYieldScheduleCivil(q, settlement, maturity);
  if (s.zero) return new ParZeroInstrument(q, t, [t], [100], s.periods, s.bill, q.yield);
  const times = new Array<number>(s.dates.length); // plain doubles (see Instrument.times)
  for (let j = 0; j < times.length; j++) times[j] = time(s.dates[j]!);
  return new ParBondInstrument(q, t, times, s.accrualFraction, q.yield);
}

/** At one year or less: 100 at maturity against 100 (1 + y/f)^(-n). */
class ParZeroInstrument extends CompiledInstrument<ParYieldQuote> {
  declare readonly closedFormLn: number;
  /** Coupon periods from settlement to maturity. */
  declare readonly periods: number;

  /** The US Treasury bill basis (days, year days), or null for the compounded zero. */
  declare readonly bill: { readonly days: number; readonly basis: number } | null;

  constructor(q: ParYieldQuote, t: number, times: readonly number[], amounts: readonly number[], periods: number, bill: { readonly days: number; readonly basis: number } | null, value: number) {
    const ln = bill ? billLn(value, bill.days, bill.basis) : parZeroLn(value, q.frequency, periods);
    super(q, t, times, 'rate', 'yield', value, amounts, 100 * Math.exp(ln), ln, DISCOUNTING);
    this.periods = periods;
    this.bill = bill;
  }

  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    trace?.('lnP', ln[offset]!);
    return this.bill ? billYield(ln[offset]!, this.bill.days, this.bill.basis, trace) : parZeroYield(ln[offset]!, this.quote.frequency, this.periods);
  }

  requote(value: number): Instrument {
    return new ParZeroInstrument(this.quote, this.t, this.times, this.amounts, this.periods, this.bill, value);
  }
}

/** Above one year: coupons 100 y/f and 100 at maturity against the dirty price 100 (1 + y a). */
class ParBondInstrument extends CompiledInstrument<ParYieldQuote> {
  declare readonly closedFormLn: null;
  declare readonly accrualFraction: number;

  constructor(q: ParYieldQuote, t: number, times: readonly number[], accrualFraction: number, value: number) {
    const c = (100 * value) / q.frequency;
    const amounts = new Array<number>(times.length);
    for (let j = 0; j < times.length; j++) amounts[j] = c;
    amounts[times.length - 1] = c + 100;
    super(q, t, times, 'rate', 'yield', value, amounts, 100 * (1 + value * accrualFraction), null, DISCOUNTING);
    this.accrualFraction = accrualFraction;
  }

  /** The par yield on the curve: c = (1 - DF(T_N)) / ((1/f) sum_k DF(T_k) - a). */
  quoteFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const n = this.times.length;
    let annuity = 0;
    for (let j = 0; j < n; j++) annuity += df[offset + j]!;
    const num = 1 - df[offset + n - 1]!;
    const den = annuity / this.quote.frequency - this.accrualFraction;
    trace?.('sum', annuity);
    trace?.('den', den);
    trace?.('num', num);
    return num / den;
  }

  requote(value: number): Instrument {
    return new ParBondInstrument(this.quote, this.t, this.times, this.accrualFraction, value);
  }
}
