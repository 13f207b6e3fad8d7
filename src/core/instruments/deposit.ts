import { yearFraction } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import type { DepositQuote } from '../workspace/types.ts';
import type { Instrument } from './instrument.ts';

/**
 * Money-market deposit from settlement to maturity at a simple rate r on its day count
 * (default ACT/360): DF(T) = 1 / (1 + r tau). Common practice for money-market deposits.
 */
export function compileDeposit(q: DepositQuote, settlement: IsoDate, t: number): Instrument {
  const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
  const times = new Float64Array([t]);
  const make = (rate: number): Instrument => ({
    quote: q,
    index: q.index,
    kind: 'deposit',
    maturity: q.maturity,
    t,
    unit: 'rate',
    field: 'rate',
    market: rate,
    times,
    amounts: new Float64Array([1 + rate * tau]),
    target: 1,
    closedFormLn: 1 + rate * tau > 0 ? -Math.log1p(rate * tau) : Number.NaN,
    modelQuote: (lnDiscountAt) => Math.expm1(-lnDiscountAt(t)) / tau,
    requote: make,
  });
  return make(q.rate);
}
