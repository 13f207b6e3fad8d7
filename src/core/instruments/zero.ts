import { lnDiscountFromRate, rateFromLnDiscount } from '../rates/compounding.ts';
import { yearFraction } from '../time/dayCount.ts';
import { civilFromIso, type CivilDate, type IsoDate } from '../time/date.ts';
import type { ZeroQuote } from '../document/types.ts';
import type { Instrument, QuoteTrace } from './instrument.ts';
import { SingleFlowInstrument, SpotSingleFlow } from './singleFlow.ts';

/**
 * Zero-coupon bond: price per 100 face (DF = price/100), or a zero rate r in its compounding and
 * day count over (settlement, maturity) (DF from compounding.ts).
 */
export function compileZero(q: ZeroQuote, settlement: IsoDate, t: number, time: (d: CivilDate) => number): Instrument {
  const value = q.rate !== null ? q.rate : q.price!;
  if (q.settle !== undefined && q.settle !== settlement) {
    const tau = yearFraction(q.dayCount, q.settle, q.maturity, { termination: q.maturity });
    return new SpotZero(q, t, [time(civilFromIso(q.settle)), t], tau, value);
  }
  const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
  return new ZeroInstrument(q, t, [t], [100], tau, value);
}

/** A zero settled at spot S: its price, or its rate over (S, maturity), paid at S (SpotSingleFlow). */
class SpotZero extends SpotSingleFlow<ZeroQuote> {
  /** Year fraction from settlement at spot to maturity under the quote's day count. */
  declare readonly tau: number;

  constructor(q: ZeroQuote, t: number, times: readonly number[], tau: number, value: number) {
    const byRate = q.rate !== null;
    super(q, t, times, byRate ? 'rate' : 'price', byRate ? 'rate' : 'price', value, byRate ? lnDiscountFromRate(value, q.compounding, tau) : Math.log(value / 100));
    this.tau = tau;
  }

  protected quoteOfRatio(lnRatio: number): number {
    return this.unit === 'rate' ? rateFromLnDiscount(lnRatio, this.quote.compounding, this.tau) : 100 * Math.exp(lnRatio);
  }

  requote(value: number): Instrument {
    return new SpotZero(this.quote, this.t, this.times, this.tau, value);
  }
}

/** A compiled zero-coupon bond: 100 at maturity against its price. */
class ZeroInstrument extends SingleFlowInstrument<ZeroQuote> {
  /** Year fraction from settlement to maturity under the quote's day count. */
  declare readonly tau: number;

  constructor(q: ZeroQuote, t: number, times: readonly number[], amounts: readonly number[], tau: number, value: number) {
    const byRate = q.rate !== null;
    const ln = byRate ? lnDiscountFromRate(value, q.compounding, tau) : Math.log(value / 100);
    super(q, t, times, byRate ? 'rate' : 'price', byRate ? 'rate' : 'price', value, amounts, byRate ? 100 * Math.exp(ln) : value, ln);
    this.tau = tau;
  }

  /** The zero rate in the quote's compounding and day count, or the price 100 DF per 100 face. */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    trace?.('lnP', ln[offset]!);
    return this.unit === 'rate' ? rateFromLnDiscount(ln[offset]!, this.quote.compounding, this.tau) : 100 * df[offset]!;
  }

  requote(value: number): Instrument {
    return new ZeroInstrument(this.quote, this.t, this.times, this.amounts, this.tau, value);
  }
}
