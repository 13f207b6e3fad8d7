import { yearFraction } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import type { DepositQuote } from '../document/types.ts';
import type { Instrument } from './instrument.ts';
import { SingleFlowInstrument } from './singleFlow.ts';

/**
 * Money-market deposit from settlement to maturity at a simple rate r on its day count
 * (default ACT/360): DF(T) = 1 / (1 + r tau). Common practice for money-market deposits.
 */
export function compileDeposit(q: DepositQuote, settlement: IsoDate, t: number): Instrument {
  const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
  return new DepositInstrument(q, t, [t], tau, q.rate);
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
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return Math.expm1(-ln[offset]!) / this.tau;
  }

  requote(value: number): Instrument {
    return new DepositInstrument(this.quote, this.t, this.times, this.tau, value);
  }
}
