import type { BillQuote, DepositQuote, ZeroQuote } from '../document/types.ts';
import { CompiledInstrument, DISCOUNTING, type QuoteTrace, type QuoteUnit } from './instrument.ts';

/**
 * What the single-flow instruments (deposit, bill, zero) share: one cash flow at the pillar, whose
 * ln DF follows from the quote in closed form (`closedFormLn`, NaN when the quote implies
 * DF <= 0), discounted on the one curve. Each kind adds its own figures (year fraction, days) and
 * its quote formula.
 */
export abstract class SingleFlowInstrument<Q extends DepositQuote | BillQuote | ZeroQuote> extends CompiledInstrument<Q> {
  declare readonly closedFormLn: number;

  /**
   * @param times - `[t]`, shared by every requote of the instrument
   * @param amounts - the one flow, in the unit of `target` (per 1 of notional or per 100 face)
   */
  protected constructor(q: Q, t: number, times: readonly number[], unit: QuoteUnit, field: string, market: number, amounts: readonly number[], target: number, closedFormLn: number) {
    super(q, t, times, unit, field, market, amounts, target, closedFormLn, DISCOUNTING);
  }
}

/**
 * A bill or zero-coupon bond settled at spot S (its `settle`): 100 at maturity M bought at S for
 * the price P per 100, so DF(M) / DF(S) = P / 100, i.e. ln DF(M) - ln DF(S) = `lnRatio`. Flows 0 at
 * t_S and 100 at t_M against P DF(S) read off the curve (`targetFromFlows`, as a deposit starting at
 * spot); the node solvers' residual in ln space is ln DF(M) - ln DF(S) - lnRatio. Each kind gives
 * its quote from the ratio (`quoteOfRatio`) and its requote.
 */
export abstract class SpotSingleFlow<Q extends BillQuote | ZeroQuote> extends CompiledInstrument<Q> {
  /** ln(P / 100) of the market quote (NaN when it implies a price that is not positive). */
  declare readonly lnRatio: number;

  /** @param times - `[t_S, t_M]` */
  protected constructor(q: Q, t: number, times: readonly number[], unit: QuoteUnit, field: string, market: number, lnRatio: number) {
    super(q, t, times, unit, field, market, [0, 100], 100 * Math.exp(lnRatio), null, DISCOUNTING);
    this.lnRatio = lnRatio;
  }

  /** The quote from ln DF(M) - ln DF(S), in the kind's own terms. */
  protected abstract quoteOfRatio(lnRatio: number): number;

  /** P DF(S): what 100 at maturity must be worth today. */
  targetFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return this.target * df[offset]!;
  }

  targetSlopes(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void {
    out[0] = this.target * df[offset]!;
    out[1] = 0;
  }

  residualFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return ln[offset + 1]! - ln[offset]! - this.lnRatio;
  }

  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const lnRatio = ln[offset + 1]! - ln[offset]!;
    trace?.('lnP', lnRatio);
    return this.quoteOfRatio(lnRatio);
  }

}
