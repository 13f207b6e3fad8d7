import type { DatedSwapQuote } from '../document/types.ts';
import { yearFractionCivil } from '../time/dayCount.ts';
import { civilFromIso, isoFromCivil, serialFromCivil, type CivilDate } from '../time/date.ts';
import { parseTenor } from '../time/tenor.ts';
import { swapDates, type SwapDates } from '../time/swapSchedule.ts';
import type { Result } from '../result.ts';
import { CompiledInstrument, DISCOUNTING_AND_PROJECTING, type Instrument, type QuoteTrace } from './instrument.ts';
import { fixedLegFlows, parRateFromFlows } from './swap.ts';

/**
 * An overnight-index swap on one curve, which both projects the overnight rate and discounts.
 *
 * Pricing (MARKET-CONVENTIONS.md section d; the telescoping of the compounded floating coupon is
 * QuantLib's overnightindexedcouponpricer.cpp "telescopic property"): period i accrues from S_i
 * to E_i and pays on P_i. On one curve the forecast compound factor of the overnight rate over a
 * period is DF(S_i) / DF(E_i) (the product of the daily growth factors telescopes), so the
 * floating coupon is worth (DF(S_i) / DF(E_i) - 1) DF(P_i), and the par rate is
 *   K = sum_i (DF(S_i) / DF(E_i) - 1) DF(P_i) / sum_i tau_i DF(P_i),
 * tau_i on the fixed leg's day count between the accrual dates. The overnight rate's own day
 * basis (`floatDayCount`) cancels: it enters only the daily growth factors, whose product is the
 * curve's DF ratio.
 *
 * Two forms, the same formula:
 * - Start at settlement and no payment lag (P_i = E_i, S_0 = settlement, DF(S_0) = 1): the sum
 *   telescopes to K = (1 - DF(E_n)) / sum_i tau_i DF(E_i), exactly today's single-curve swap
 *   (instruments/swap.ts): flows K tau_i at E_i and 1 at E_n against a target of 1.
 * - Otherwise (a payment lag, or a start after settlement) the floating leg is not a sum of fixed
 *   flows: DF(S_i) DF(P_i) / DF(E_i) is a ratio of discount factors. The instrument then has fixed
 *   flows K tau_i at each P_i and a target read off the curve, the floating leg's value
 *   (`targetFromFlows`); its flow times are every S_0 after settlement, E_i and P_i, so the
 *   curve's values there are all the formula reads. `target` (1 of notional) is then the scale
 *   of the residual (joint Newton) and of the fit's prices, not a value the flows must meet.
 *   DF(S_0) of a start after settlement is read off the curve like any other date: before the
 *   first pillar that is the curve's own interpolation from t = 0 (ln DF = 0), flat forward on
 *   the first segment for the local methods; no overnight or tom-next quote pins it (section c).
 *
 * The pillar is the last payment date P_n (not the last accrual end), so the last discount factor
 * the quote needs is a node and never extrapolated (MARKET-CONVENTIONS.md section d, QuantLib#618).
 */
export function oisDates(q: DatedSwapQuote, settlement: CivilDate): Result<SwapDates> {
  const tenor = q.tenor === null ? null : parseTenor(q.tenor);
  return swapDates(settlement, tenor === null ? { end: civilFromIso(q.unadjustedEnd) } : { tenor }, q, `quotes[${q.index}]`, q.index);
}

/** Compiles a validated OIS quote (its dates were checked when it was read). */
export function compileOis(q: DatedSwapQuote, settlement: CivilDate, time: (d: CivilDate) => number): Instrument {
  const r = oisDates(q, settlement);
  if (!r.ok) throw new RangeError(r.errors[0]?.message ?? 'bad OIS dates'); // cannot happen: the quote's reader made the same dates
  const { starts, ends, payments } = r.value;
  const n = ends.length;
  const taus = new Array<number>(n);
  for (let i = 0; i < n; i++) taus[i] = yearFractionCivil(q.dayCount, starts[i]!, ends[i]!, q.eom, i === n - 1, 0, q.frequency);
  const s0 = time(starts[0]!);
  if (q.paymentLag === 0 && s0 === 0) {
    const times = new Array<number>(n);
    for (let i = 0; i < n; i++) times[i] = time(ends[i]!);
    return new OisSwapForm(q, times[n - 1]!, times, taus, q.rate, isoFromCivil(ends[n - 1]!));
  }
  // Every date the formula reads, once, in time order; index maps from periods to flows.
  const dated: { serial: number; t: number }[] = [];
  if (s0 !== 0) dated.push({ serial: serialFromCivil(starts[0]!), t: s0 });
  for (let i = 0; i < n; i++) {
    dated.push({ serial: serialFromCivil(ends[i]!), t: time(ends[i]!) });
    dated.push({ serial: serialFromCivil(payments[i]!), t: time(payments[i]!) });
  }
  dated.sort((a, b) => a.serial - b.serial);
  const times: number[] = [];
  for (const d of dated) if (times.length === 0 || times[times.length - 1] !== d.t) times.push(d.t);
  const at = (d: CivilDate): number => times.indexOf(time(d));
  const sIdx = starts.map((d, i) => (i === 0 && s0 === 0 ? -1 : at(d)));
  const eIdx = ends.map(at);
  const pIdx = payments.map(at);
  const Form = sIdx[0]! >= 0 ? ForwardOis : LaggedOis;
  return new Form(q, times[times.length - 1]!, times, taus, sIdx, eIdx, pIdx, q.rate, isoFromCivil(payments[n - 1]!));
}

/** The no-lag, spot-start OIS: today's swap form, flows K tau_i at E_i and 1 at E_n against 1. */
class OisSwapForm extends CompiledInstrument<DatedSwapQuote> {
  declare readonly maturity: string;
  declare readonly amounts: number[];
  readonly taus: readonly number[];

  constructor(q: DatedSwapQuote, t: number, times: readonly number[], taus: readonly number[], rate: number, pillarDate: string) {
    super(q, t, times, 'rate', 'rate', rate, fixedLegFlows(rate, taus), 1, null, DISCOUNTING_AND_PROJECTING);
    this.taus = taus;
    this.maturity = pillarDate;
  }

  /** K = (1 - DF(E_n)) / sum tau_i DF(E_i): the swap's own arithmetic (parRateFromFlows). */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    return parRateFromFlows(this.taus, ln, df, offset, trace);
  }

  requote(value: number): Instrument {
    return new OisSwapForm(this.quote, this.t, this.times, this.taus, value, this.maturity);
  }
}

/**
 * An OIS with a payment lag or a forward start: fixed flows K tau_i at P_i against the floating
 * leg's value on the curve, sum_i (DF(S_i) / DF(E_i) - 1) DF(P_i) (targetFromFlows).
 * sIdx[i], eIdx[i], pIdx[i]: the flow holding S_i, E_i, P_i (sIdx[0] = -1 when S_0 is settlement, DF 1).
 */
class LaggedOis extends CompiledInstrument<DatedSwapQuote> {
  declare readonly maturity: string;
  declare readonly amounts: number[];
  readonly taus: readonly number[];
  readonly sIdx: readonly number[];
  readonly eIdx: readonly number[];
  readonly pIdx: readonly number[];

  constructor(q: DatedSwapQuote, t: number, times: readonly number[], taus: readonly number[], sIdx: readonly number[], eIdx: readonly number[], pIdx: readonly number[], rate: number, pillarDate: string) {
    const amounts = new Array<number>(times.length).fill(0);
    for (let i = 0; i < taus.length; i++) amounts[pIdx[i]!] = amounts[pIdx[i]!]! + rate * taus[i]!;
    super(q, t, times, 'rate', 'rate', rate, amounts, 1, null, DISCOUNTING_AND_PROJECTING);
    this.taus = taus;
    this.sIdx = sIdx;
    this.eIdx = eIdx;
    this.pIdx = pIdx;
    this.maturity = pillarDate;
  }

  /** The floating leg: sum_i (DF(S_i) / DF(E_i) - 1) DF(P_i), each coupon's growth as expm1(ln DF(S_i) - ln DF(E_i)). */
  targetFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    const { sIdx, eIdx, pIdx } = this;
    let float = 0;
    for (let i = 0; i < sIdx.length; i++) {
      const lnS = sIdx[i]! < 0 ? 0 : ln[offset + sIdx[i]!]!;
      float += Math.expm1(lnS - ln[offset + eIdx[i]!]!) * df[offset + pIdx[i]!]!;
    }
    return float;
  }

  /**
   * d targetFromFlows / d ln DF(times[j]) into out[0..times.length): for coupon i with
   * c_i = DF(S_i) DF(P_i) / DF(E_i): + c_i at S_i, - c_i at E_i, + (c_i - DF(P_i)) at P_i.
   */
  targetSlopes(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void {
    const { sIdx, eIdx, pIdx } = this;
    out.fill(0, 0, this.times.length);
    for (let i = 0; i < sIdx.length; i++) {
      const lnS = sIdx[i]! < 0 ? 0 : ln[offset + sIdx[i]!]!;
      const p = df[offset + pIdx[i]!]!;
      const c = Math.exp(lnS - ln[offset + eIdx[i]!]!) * p;
      if (sIdx[i]! >= 0) out[sIdx[i]!] = out[sIdx[i]!]! + c;
      out[eIdx[i]!] = out[eIdx[i]!]! - c;
      out[pIdx[i]!] = out[pIdx[i]!]! + c - p;
    }
  }

  /** K = floating leg / sum tau_i DF(P_i). */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const { taus, pIdx } = this;
    let annuity = 0;
    for (let i = 0; i < taus.length; i++) annuity += taus[i]! * df[offset + pIdx[i]!]!;
    const float = this.targetFromFlows(ln, df, offset);
    trace?.('A', annuity);
    trace?.('float', float);
    return float / annuity;
  }

  requote(value: number): Instrument {
    const Form = this instanceof ForwardOis ? ForwardOis : LaggedOis;
    return new Form(this.quote, this.t, this.times, this.taus, this.sIdx, this.eIdx, this.pIdx, value, this.maturity);
  }
}

/**
 * A LaggedOis that starts after settlement (a spot lag): the same flows and formulas, and the node
 * solvers' residual in rate. Kept apart so that a swap starting at settlement with a payment lag
 * solves exactly as before, bit for bit.
 */
class ForwardOis extends LaggedOis {
  /**
   * The node solvers' residual in rate: K minus the model rate, (fixed leg - floating leg) / annuity,
   * with the same root and sign as the fixed leg minus `targetFromFlows` (the annuity is positive).
   * In the unit the quote reprices in, a short swap's node lands on its root to the last bit
   * (`solveNode`'s stopAtRoot) rather than within NODE_TOLERANCE in ln DF, which for a one-week
   * swap (tau about 1/52) is up to 5e-14 in rate.
   */
  residualFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return this.market - this.quoteFromFlows(ln, df, offset);
  }
}
