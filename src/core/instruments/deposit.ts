import { yearFraction } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import type { DepositQuote } from '../workspace/types.ts';
import { quoteOnCurve, type Instrument } from './instrument.ts';

/**
 * Money-market deposit from settlement to maturity at a simple rate r on its day count
 * (default ACT/360): DF(T) = 1 / (1 + r tau). Common practice for money-market deposits.
 */
export function compileDeposit(q: DepositQuote, settlement: IsoDate, t: number): Instrument {
  const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
  return new DepositInstrument(q, t, [t], tau, q.rate);
}

/** A compiled deposit. Performance: a class, so that a requote creates no closures. */
class DepositInstrument implements Instrument {
  declare readonly quote: DepositQuote;
  declare readonly index: number;
  declare readonly kind: 'deposit';
  declare readonly maturity: IsoDate;
  declare readonly t: number;
  declare readonly unit: 'rate';
  declare readonly field: 'rate';
  declare readonly market: number;
  declare readonly times: readonly number[];
  declare readonly amounts: number[];
  declare readonly target: number;
  declare readonly closedFormLn: number;
  /** Year fraction of the deposit under its day count. */
  declare readonly tau: number;

  constructor(q: DepositQuote, t: number, times: readonly number[], tau: number, rate: number) {
    this.quote = q;
    this.index = q.index;
    this.kind = 'deposit';
    this.maturity = q.maturity;
    this.t = t;
    this.unit = 'rate';
    this.field = 'rate';
    this.market = rate;
    this.times = times;
    this.amounts = [1 + rate * tau];
    this.target = 1;
    this.closedFormLn = 1 + rate * tau > 0 ? -Math.log1p(rate * tau) : Number.NaN;
    this.tau = tau;
  }

  modelQuote(lnDiscountAt: (t: number) => number): number {
    return quoteOnCurve(this, lnDiscountAt);
  }

  /** The simple rate on the deposit's day count, expm1(-ln DF) / tau (full precision for short tenors). */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return Math.expm1(-ln[offset]!) / this.tau;
  }

  requote(value: number): Instrument {
    return new DepositInstrument(this.quote, this.t, this.times, this.tau, value);
  }
}
