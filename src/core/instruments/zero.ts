import { lnDiscountFromRate, rateFromLnDiscount } from '../rates/compounding.ts';
import { yearFraction } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import type { ZeroQuote } from '../workspace/types.ts';
import { quoteOnCurve, type Instrument } from './instrument.ts';

/**
 * Zero-coupon bond: price per 100 face (DF = price/100), or a zero rate r in its compounding and
 * day count over (settlement, maturity) (DF from compounding.ts).
 */
export function compileZero(q: ZeroQuote, settlement: IsoDate, t: number): Instrument {
  const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
  return new ZeroInstrument(q, t, [t], [100], tau, q.rate !== null ? q.rate : q.price!);
}

/** A compiled zero-coupon bond. Performance: a class, so that a requote creates no closures. */
class ZeroInstrument implements Instrument {
  declare readonly quote: ZeroQuote;
  declare readonly index: number;
  declare readonly kind: 'zero';
  declare readonly maturity: IsoDate;
  declare readonly t: number;
  declare readonly unit: 'rate' | 'price';
  declare readonly field: 'rate' | 'price';
  declare readonly market: number;
  declare readonly times: readonly number[];
  declare readonly amounts: number[];
  declare readonly target: number;
  declare readonly closedFormLn: number;
  /** Year fraction from settlement to maturity under the quote's day count. */
  declare readonly tau: number;

  constructor(q: ZeroQuote, t: number, times: readonly number[], amounts: number[], tau: number, value: number) {
    const byRate = q.rate !== null;
    this.quote = q;
    this.index = q.index;
    this.kind = 'zero';
    this.maturity = q.maturity;
    this.t = t;
    this.unit = byRate ? 'rate' : 'price';
    this.field = byRate ? 'rate' : 'price';
    this.market = value;
    this.times = times;
    this.amounts = amounts;
    this.target = byRate ? 100 * Math.exp(lnDiscountFromRate(value, q.compounding, tau)) : value;
    this.closedFormLn = byRate ? lnDiscountFromRate(value, q.compounding, tau) : Math.log(value / 100);
    this.tau = tau;
  }

  modelQuote(lnDiscountAt: (t: number) => number): number {
    return quoteOnCurve(this, lnDiscountAt);
  }

  /** The zero rate in the quote's compounding and day count, or the price 100 DF per 100 face. */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return this.unit === 'rate' ? rateFromLnDiscount(ln[offset]!, this.quote.compounding, this.tau) : 100 * df[offset]!;
  }

  requote(value: number): Instrument {
    return new ZeroInstrument(this.quote, this.t, this.times, this.amounts, this.tau, value);
  }
}
