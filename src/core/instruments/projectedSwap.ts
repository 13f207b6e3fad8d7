import type { Curve } from '../curve/curve.ts';
import type { SwapQuote } from '../document/types.ts';
import { isoFromCivil, type CivilDate } from '../time/date.ts';
import { backwardScheduleCivil } from '../time/schedule.ts';
import { CompiledInstrument, DISCOUNTING_AND_PROJECTING, type Instrument, type QuoteTrace, type ReadSink } from './instrument.ts';
import { fixedLegCivil } from './swap.ts';

/** Discount factor of a built curve at a date (on that curve's own clock), handed to `sink` as date `name` on the curve `on` (with a fixed or spread date's `tau`). */
const discountOn = (curve: Curve, d: CivilDate, sink?: ReadSink, name?: string, on?: string, tau?: number): number => {
  const iso = isoFromCivil(d);
  const t = curve.time(iso);
  const ln = curve.lnDiscountAt(t);
  sink?.(name!, on!, curve, iso, t, ln, tau);
  return Math.exp(ln);
};

/** What `compile` was given after the quote, kept so the swap can be compiled again with a sink (`retrace`). */
type CompileArgs = [CivilDate, CivilDate, (d: CivilDate) => number, Curve, string, number, BasisLeg | undefined];

/**
 * Where a projected swap's constants were read on the curves built before it, kept for the
 * sensitivities across curves (analytics/crossCurveSensitivity.ts): the times are on the clock of
 * the curve read. `annuity`: the fixed (or spread) leg's dates on the discounting curve and each
 * tau_i P_d(T_i); `floating`: the floating dates on the discounting curve (the weights are
 * P_d there); `other`: a basis swap's other leg, its dates on its curve and on the discounting
 * curve, each period's growth P_o(T_{k-1}) / P_o(T_k) and P_d(T_k).
 */
export interface UpstreamReads {
  readonly annuity: { readonly t: readonly number[]; readonly tauDf: readonly number[] };
  readonly floating: readonly number[];
  readonly other: { readonly name: string; readonly t: readonly number[]; readonly tDiscount: readonly number[]; readonly growth: readonly number[]; readonly df: readonly number[] } | null;
}

/** d residual / d ln DF of a curve built before the instrument, at one time on that curve's clock. */
export interface UpstreamSlope {
  readonly curve: string;
  readonly t: number;
  readonly slope: number;
}

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
 *
 * A basis swap (`BasisLeg` given) is the same instrument with the fixed leg replaced: this curve's
 * index leg plus the quoted spread K, accruing over the index periods on the quote's day count
 * (tau^s_j, annuity A_s = sum_j tau^s_j P_d(T_j)), against the other curve's index leg, worth
 * C = sum_k (P_o(T_{k-1}) / P_o(T_k) - 1) P_d(T_k) over that index's periods from the other curve
 * P_o (built before, fixed). Par spread K = (C - floating leg) / A_s; the pricing equation is
 * C - K A_s - floating leg = 0. A convention of this build (the spread on this curve's leg, both
 * legs paid at their period ends, from the valuation date), from general knowledge of basis swaps.
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
    /** For a basis swap, the other leg's value C on its curve (fixed); 0 for a fixed-rate swap. */
    readonly otherLeg: number,
    /** +1 for a fixed-rate swap (K A against the floating leg), -1 for a basis swap (the spread on the floating leg's side). */
    readonly side: 1 | -1,
    /** Where the constants were read on the curves built before (for `upstreamSlopes`). */
    readonly reads: UpstreamReads,
    private readonly args: CompileArgs,
  ) {
    super(q, t, times, 'rate', 'rate', rate, new Array<number>(times.length).fill(0), 1, null, DISCOUNTING_AND_PROJECTING);
  }

  /** The curves built before it whose values it holds (its discounting curve, a basis swap's other leg's curve), by name. */
  get readsCurves(): { readonly discount: string; readonly other: string | null } {
    return { discount: this.discountedOn, other: this.reads.other?.name ?? null };
  }

  /** Compiles this swap again with `sink`, which receives each value `compile` reads off the curves built before it. */
  retrace(sink: ReadSink): void {
    ProjectedSwap.compile(this.quote, ...this.args, sink);
  }

  /**
   * Compiles a swap quote (no date conventions) against its discounting curve: floating periods
   * `indexPerYear` a year. `time` is the projection curve's clock. Null when a payment date lies
   * beyond the discounting curve and that curve does not extrapolate (the date is returned).
   */
  static compile(q: SwapQuote, settlement: CivilDate, maturity: CivilDate, time: (d: CivilDate) => number, discount: Curve, discountedOn: string, indexPerYear: number, basis?: BasisLeg, sink?: ReadSink): ProjectedSwap | { beyond: string; curve: string } {
    const end = isoFromCivil(maturity);
    for (const [c, name] of [[discount, discountedOn], ...(basis ? [[basis.curve, basis.name] as const] : [])] as const) {
      if (c.extrapolation === 'none' && c.time(end) > c.lastT) return { beyond: end, curve: name };
    }
    // The fixed leg, or for a basis swap the spread's accruals over this index's periods.
    const fixed = basis ? fixedLegCivil(settlement, maturity, indexPerYear, q.dayCount, q.eom) : fixedLegCivil(settlement, maturity, q.frequency, q.dayCount, q.eom);
    const floating = backwardScheduleCivil(settlement, maturity, indexPerYear, q.eom).dates;
    const onDiscount = (d: CivilDate): number => discount.time(isoFromCivil(d));
    let annuity = 0;
    const annuityReads = { t: fixed.dates.map(onDiscount), tauDf: [] as number[] };
    for (let i = 0; i < fixed.dates.length; i++) {
      const tauDf = fixed.taus[i]! * discountOn(discount, fixed.dates[i]!, sink, 'U', discountedOn, fixed.taus[i]);
      annuityReads.tauDf.push(tauDf);
      annuity += tauDf;
    }
    let otherLeg = 0;
    let other: UpstreamReads['other'] = null;
    if (basis) {
      let prev = 0;
      const o = { name: basis.name, t: [] as number[], tDiscount: [] as number[], growth: [] as number[], df: [] as number[] };
      for (const d of backwardScheduleCivil(settlement, maturity, basis.perYear, q.eom).dates) {
        const iso = isoFromCivil(d);
        const t = basis.curve.time(iso);
        const ln = basis.curve.lnDiscountAt(t);
        sink?.('V', basis.name, basis.curve, iso, t, ln);
        const df = discountOn(discount, d, sink, 'V', discountedOn);
        otherLeg += Math.expm1(prev - ln) * df;
        o.t.push(t), o.tDiscount.push(onDiscount(d)), o.growth.push(Math.exp(prev - ln)), o.df.push(df);
        prev = ln;
      }
      other = o;
    }
    const times = floating.map(time);
    const weights = floating.map((d) => discountOn(discount, d, sink, 'T', discountedOn));
    const reads: UpstreamReads = { annuity: annuityReads, floating: floating.map(onDiscount), other };
    return new ProjectedSwap(q, times[times.length - 1]!, times, weights, annuity, q.rate, discountedOn, otherLeg, basis ? -1 : 1, reads, [settlement, maturity, time, discount, discountedOn, indexPerYear, basis]);
  }

  /** The floating leg sum_j (P_p(T_{j-1}) / P_p(T_j) - 1) w_j, each growth as expm1 of the ln DF difference (P_p(T_0) = 1 at the valuation date); each growth `g` and the leg `float` to `trace`. */
  floatingLeg(ln: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const { weights } = this;
    let float = 0;
    let prev = 0;
    for (let j = 0; j < weights.length; j++) {
      const cur = ln[offset + j]!;
      const g = Math.expm1(prev - cur);
      trace?.('g', g);
      float += g * weights[j]!;
      prev = cur;
    }
    trace?.('float', float);
    return float;
  }

  /** floating leg - K A (a swap), or floating leg + K A_s - C (a basis swap). */
  targetFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.floatingLeg(ln, offset) - this.side * this.market * this.annuity - this.otherLeg;
  }

  /** K A - floating leg, or C - K A_s - floating leg: the same value as 0 - targetFromFlows, rising with the pillar's DF. */
  residualFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.otherLeg + this.side * this.market * this.annuity - this.floatingLeg(ln, offset);
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

  /** S = floating leg / A, or K = (C - floating leg) / A_s; the growths, the leg, A and C to `trace`. */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const float = this.floatingLeg(ln, offset, trace);
    trace?.('A', this.annuity);
    trace?.('C', this.otherLeg);
    return this.side === 1 ? float / this.annuity : (this.otherLeg - float) / this.annuity;
  }

  requote(value: number): Instrument {
    return new ProjectedSwap(this.quote, this.t, this.times, this.weights, this.annuity, value, this.discountedOn, this.otherLeg, this.side, this.reads, this.args);
  }

  /**
   * d residual / d ln DF of the curves built before this swap, at each date its constants were
   * read (residual = side K A + C - floating leg, `residualFromFlows`): on the discounting curve
   * side K tau_i P_d(T_i) at each fixed (spread) date and -(P_p(T_{j-1}) / P_p(T_j) - 1) P_d(T_j)
   * at each floating date; for a basis swap (g_k - 1) P_d(T_k) at each of the other leg's dates
   * on the discounting curve and, on the other leg's curve (g_k = P_o(T_{k-1}) / P_o(T_k)),
   * -g_k P_d(T_k) + g_{k+1} P_d(T_{k+1}) at T_k. `ln` holds this curve's ln DF at the flow times
   * from `offset`. Times repeat where dates coincide (the slopes add up).
   */
  upstreamSlopes(ln: ArrayLike<number>, offset: number): UpstreamSlope[] {
    const { annuity, floating, other } = this.reads;
    const d = this.discountedOn;
    const out: UpstreamSlope[] = annuity.t.map((t, i) => ({ curve: d, t, slope: this.side * this.market * annuity.tauDf[i]! }));
    let prev = 0;
    for (let j = 0; j < floating.length; j++) {
      const cur = ln[offset + j]!;
      out.push({ curve: d, t: floating[j]!, slope: -Math.expm1(prev - cur) * this.weights[j]! });
      prev = cur;
    }
    if (other !== null) {
      const m = other.t.length;
      for (let k = 0; k < m; k++) {
        out.push({ curve: d, t: other.tDiscount[k]!, slope: (other.growth[k]! - 1) * other.df[k]! });
        const next = k + 1 < m ? other.growth[k + 1]! * other.df[k + 1]! : 0;
        out.push({ curve: other.name, t: other.t[k]!, slope: -other.growth[k]! * other.df[k]! + next });
      }
    }
    return out;
  }
}

/** A basis swap's other leg: the curve projecting it (built before, fixed), its name and its index periods a year. */
export interface BasisLeg {
  readonly curve: Curve;
  readonly name: string;
  readonly perYear: number;
}
