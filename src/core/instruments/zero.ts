import { lnDiscountFromRate, rateFromLnDiscount } from '../rates/compounding.ts';
import { yearFraction } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import type { ZeroQuote } from '../workspace/types.ts';
import type { Instrument } from './instrument.ts';

/**
 * Zero-coupon bond: price per 100 face (DF = price/100), or a zero rate r in its compounding and
 * day count over (settlement, maturity) (DF from compounding.ts).
 */
export function compileZero(q: ZeroQuote, settlement: IsoDate, t: number): Instrument {
  const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
  const times = new Float64Array([t]);
  const amounts = new Float64Array([100]);
  const byRate = q.rate !== null;
  const make = (value: number): Instrument => ({
    quote: q,
    index: q.index,
    kind: 'zero',
    maturity: q.maturity,
    t,
    unit: byRate ? 'rate' : 'price',
    field: byRate ? 'rate' : 'price',
    market: value,
    times,
    amounts,
    target: byRate ? 100 * Math.exp(lnDiscountFromRate(value, q.compounding, tau)) : value,
    closedFormLn: byRate ? lnDiscountFromRate(value, q.compounding, tau) : Math.log(value / 100),
    modelQuote: (lnDiscountAt) =>
      byRate ? rateFromLnDiscount(lnDiscountAt(t), q.compounding, tau) : 100 * Math.exp(lnDiscountAt(t)),
    requote: make,
  });
  return make(byRate ? q.rate! : q.price!);
}
