import { yearFraction } from '../time/dayCount.ts';
import { civilFromIso, type CivilDate, type IsoDate } from '../time/date.ts';
import type { DepositQuote, Quote } from '../document/types.ts';
import { DISCOUNTING, type CurveRoles, type Instrument, type QuoteTrace } from './instrument.ts';
import { SingleFlowInstrument } from './singleFlow.ts';
import { GrowthRatio } from './growthRatio.ts';

/**
 * Money-market deposit from its start S to maturity E at a simple rate r on its day count
 * (default ACT/360): DF(S) / DF(E) = 1 + r tau(S, E). Common practice for money-market deposits;
 * the chain of an overnight and a tom-next deposit, DF(spot) = 1 / ((1 + r_ON tau_ON)
 * (1 + r_TN tau_TN)), is MARKET-CONVENTIONS.md section c.
 * - S at settlement (every deposit without calendar fields, and ON): DF(S) = 1, one flow 1 + r tau
 *   at E against 1, DF(E) = 1 / (1 + r tau) in closed form (unchanged arithmetic).
 * - S after settlement (TN, SN, a tenor counted from spot): the flow 1 + r tau at E against a
 *   target read off the curve, DF(S) (`targetFromFlows`, as the lagged OIS does); flow times
 *   [t_S, t_E] with a zero amount at t_S. A TN after an ON quote reads DF(S) at the ON pillar, so
 *   the chain above holds; with no quote ending at S, DF(S) is the curve's own interpolation.
 */
export function compileDeposit(q: DepositQuote, settlement: IsoDate, t: number, time: (d: CivilDate) => number): Instrument {
  if (q.start === settlement) {
    const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
    return new DepositInstrument(q, t, [t], tau, q.rate);
  }
  const tau = yearFraction(q.dayCount, q.start, q.maturity, { termination: q.maturity });
  return new ForwardDeposit(q, t, [time(civilFromIso(q.start)), t], tau, q.rate);
}

/** A compiled deposit: 1 + r tau at the end against 1 now. */
class DepositInstrument extends SingleFlowInstrument<DepositQuote> {
  /** Year fraction of the deposit under its day count. */
  declare readonly tau: number;

  constructor(q: DepositQuote, t: number, times: readonly number[], tau: number, rate: number) {
    super(q, t, times, 'rate', 'rate', rate, [1 + rate * tau], 1, 1 + rate * tau > 0 ? -Math.log1p(rate * tau) : Number.NaN);
    this.tau = tau;
  }

  /** The simple rate on the deposit's day count, expm1(-ln DF) / tau (full precision for short tenors). */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const g = Math.expm1(-ln[offset]!);
    trace?.('g', g);
    return g / this.tau;
  }

  requote(value: number): Instrument {
    return new DepositInstrument(this.quote, this.t, this.times, this.tau, value);
  }
}

/**
 * A deposit starting after settlement: 0 at t_S and 1 + r tau at t_E against DF(t_S) read off the
 * curve. The residual (1 + r tau) DF(E) - DF(S) rises with the pillar's discount factor. Also a
 * forward rate agreement on one curve (instruments/fra.ts), which fixes the same ratio DF(S)/DF(E)
 * on the curve of its index, with its own curve roles.
 */
export class ForwardDeposit<Q extends Quote = DepositQuote> extends GrowthRatio<Q> {
  declare readonly tau: number;
  declare readonly lnGrowth: number;

  constructor(q: Q, t: number, times: readonly number[], tau: number, rate: number, curves: CurveRoles = DISCOUNTING) {
    super(q, t, times, 'rate', 'rate', rate, [0, 1 + rate * tau], 1, null, curves);
    this.tau = tau;
    // ln(1 + r tau), NaN when the quote implies a growth <= 0.
    this.lnGrowth = 1 + rate * tau > 0 ? Math.log1p(rate * tau) : Number.NaN;
  }

  /** The simple forward rate, expm1(ln DF(S) - ln DF(E)) / tau. */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const g = Math.expm1(ln[offset]! - ln[offset + 1]!);
    trace?.('g', g);
    return g / this.tau;
  }

  requote(value: number): Instrument {
    return new ForwardDeposit(this.quote, this.t, this.times, this.tau, value, this.curves);
  }
}
