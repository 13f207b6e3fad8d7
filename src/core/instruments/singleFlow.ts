import type { BillQuote, DepositQuote, ZeroQuote } from '../document/types.ts';
import { CompiledInstrument, DISCOUNTING, type QuoteUnit } from './instrument.ts';

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
