import type { Curve } from '../curve/curve.ts';
import type { SwapQuote } from '../document/types.ts';
import { isoFromCivil, type CivilDate } from '../time/date.ts';
import { backwardScheduleCivil } from '../time/schedule.ts';
import { CompiledInstrument, DISCOUNTING_AND_PROJECTING, type Instrument } from './instrument.ts';
import { fixedLegCivil } from './swap.ts';

/** Discount factor of a built curve at a date (on that curve's own clock). */
const discountOn = (curve: Curve, d: CivilDate): number => Math.exp(curve.lnDiscountAt(curve.time(isoFromCivil(d))));

/**
 * A term-index swap from the valuation date on a projection curve, discounted on another curve
 * built before it (MARKET-CONVENTIONS.md section i; Ametrano and Bianchetti 2013, "Everything you
 * always wanted to know about multiple interest rate curve bootstrapping but were afraid to ask",
 * the two-curve par rate):
 *   S = sum_j tau_j F_j P_d(T_j) / sum_i tau_i P_d(T_i),
 * fixed periods i on the quote's frequency and day count (accruals tau_i, the dates of today's
 * single-curve swap, instruments/swap.ts), floating periods j of the index tenor, dated backward
 * from the maturity as the fixed leg is (unadjusted, `eom` as the quote's), each paid at its end;
 * tau_j F_j = P_p(T_{j-1}) / P_p(T_j) - 1 is the index's simple forward over period j from the
 * projection curve P_p (its own day count cancels), P_d the discounting curve. The forward is taken
 * over the accrual period itself (no separate fixing dates: periods are unadjusted).
 *
 * The discounting curve is already built and fixed, so its factors are constants here: the
 * weights w_j = P_d(T_j) and the annuity A = sum_i tau_i P_d(T_i). The unknowns are the projection
 * curve's ln DF at the floating dates (the instrument's flow times, the last the pillar). The
 * pricing equation K A = sum_j (P_p(T_{j-1}) / P_p(T_j) - 1) w_j is written as a target on the
 * curve (`targetFromFlows` = floating leg - K A, no fixed flows on the projection curve), so the
 * node solvers, joint Newton step and sensitivities treat it as they treat a lagged OIS.
 * To the bootstrap it reads one curve, the one being solved (DISCOUNTING_AND_PROJECTING in that
 * build); `discountedOn` names the curve its constants came from.
 */
export class ProjectedSwap extends CompiledInstrument<SwapQuote> {
  declare readonly amounts: number[];

  private constructor(
    q: SwapQuote,
    t: number,
    times: readonly number[],
    /** P_d at each floating payment date, aligned with `times`. */
    readonly weights: readonly number[],
    /** sum_i tau_i P_d(T_i) over the fixed leg. */
    readonly annuity: number,
    rate: number,
    /** The curve the fixed discount factors were read from. */
    readonly discountedOn: string,
  ) {
    super(q, t, times, 'rate', 'rate', rate, new Array<number>(times.length).fill(0), 1, null, DISCOUNTING_AND_PROJECTING);
  }

  /**
   * Compiles a swap quote (no date conventions) against its discounting curve: floating periods
   * `indexPerYear` a year. `time` is the projection curve's clock. Null when a payment date lies
   * beyond the discounting curve and that curve does not extrapolate (the date is returned).
   */
  static compile(q: SwapQuote, settlement: CivilDate, maturity: CivilDate, time: (d: CivilDate) => number, discount: Curve, discountedOn: string, indexPerYear: number): ProjectedSwap | { beyond: string } {
    const fixed = fixedLegCivil(settlement, maturity, q.frequency, q.dayCount, q.eom);
    const floating = backwardScheduleCivil(settlement, maturity, indexPerYear, q.eom).dates;
    const last = fixed.dates.length > 0 ? fixed.dates[fixed.dates.length - 1]! : maturity;
    if (discount.extrapolation === 'none' && discount.time(isoFromCivil(last)) > discount.lastT) return { beyond: isoFromCivil(last) };
    let annuity = 0;
    for (let i = 0; i < fixed.dates.length; i++) annuity += fixed.taus[i]! * discountOn(discount, fixed.dates[i]!);
    const times = floating.map(time);
    const weights = floating.map((d) => discountOn(discount, d));
    return new ProjectedSwap(q, times[times.length - 1]!, times, weights, annuity, q.rate, discountedOn);
  }

  /** The floating leg sum_j (P_p(T_{j-1}) / P_p(T_j) - 1) w_j, each growth as expm1 of the ln DF difference (P_p(T_0) = 1 at the valuation date). */
  floatingLeg(ln: ArrayLike<number>, offset: number): number {
    const { weights } = this;
    let float = 0;
    let prev = 0;
    for (let j = 0; j < weights.length; j++) {
      const cur = ln[offset + j]!;
      float += Math.expm1(prev - cur) * weights[j]!;
      prev = cur;
    }
    return float;
  }

  targetFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.floatingLeg(ln, offset) - this.market * this.annuity;
  }

  /** K A - floating leg: the same value as 0 - targetFromFlows, rising with the pillar's DF. */
  residualFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.market * this.annuity - this.floatingLeg(ln, offset);
  }

  /** d targetFromFlows / d ln P_p(T_j): coupon j, c_j = P_p(T_{j-1}) w_j / P_p(T_j), adds c_j at T_{j-1} and -c_j at T_j. */
  targetSlopes(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, out: number[]): void {
    const { weights } = this;
    out.fill(0, 0, weights.length);
    let prev = 0;
    for (let j = 0; j < weights.length; j++) {
      const cur = ln[offset + j]!;
      const c = Math.exp(prev - cur) * weights[j]!;
      if (j > 0) out[j - 1] = out[j - 1]! + c;
      out[j] = out[j]! - c;
      prev = cur;
    }
  }

  /** S = floating leg / A. */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.floatingLeg(ln, offset) / this.annuity;
  }

  requote(value: number): Instrument {
    return new ProjectedSwap(this.quote, this.t, this.times, this.weights, this.annuity, value, this.discountedOn);
  }
}
