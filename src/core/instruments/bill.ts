import { civilFromIso, daysBetween, isLeapYear, parseIsoDate, serialFromIso, type CivilDate, type IsoDate } from '../time/date.ts';
import { marketDate, UNADJUSTED } from '../time/dateConventions.ts';
import type { Tenor } from '../time/tenor.ts';
import type { BillQuote } from '../document/types.ts';
import type { Instrument, QuoteTrace } from './instrument.ts';
import { SingleFlowInstrument, SpotSingleFlow } from './singleFlow.ts';

const ONE_YEAR: Tenor = Object.freeze({ n: 1, unit: 'Y' });

/**
 * Discount bill. Bank discount yield d on actual days over 360:
 *   price = 100 (1 - d days / 360),  DF(T) = price / 100.
 * Source: US Treasury, "Treasury Bills" price and discount-rate formulas (TreasuryDirect).
 */
export function billPriceFromDiscountYield(d: number, days: number): number {
  return 100 * (1 - (d * days) / 360);
}
export function billDiscountYieldFromPrice(price: number, days: number): number {
  return ((100 - price) / 100) * (360 / days);
}

/**
 * Days in the year used by the investment rate: 366 when the twelve months after the issue
 * (here the settlement) date contain 29 February, else 365 (US Treasury).
 */
export function billYearBasis(settlement: IsoDate): number {
  // The year after issue is a calendar year whatever the market's conventions: always unadjusted.
  const oneYear = marketDate(settlement, ONE_YEAR, UNADJUSTED);
  const s = parseIsoDate(settlement)!;
  for (const y of [s.y, s.y + 1]) {
    if (!isLeapYear(y)) continue;
    const feb29 = serialFromIso(`${y}-02-29`);
    if (feb29 > serialFromIso(settlement) && feb29 <= serialFromIso(oneYear)) return 366;
  }
  return 365;
}

/**
 * Investment rate (coupon-equivalent, bond-equivalent yield) of a bill, decimal per year, on the
 * US Treasury's published formulas, with r days to maturity and y = 365 or 366 (billYearBasis):
 *   r <= y/2 (not more than a half-year):  i = (100 - P) / P x y / r
 *   r >  y/2:  i = [-2r/y + 2 sqrt((r/y)^2 - (2r/y - 1)(1 - 100/P))] / (2r/y - 1)
 * Source: US Treasury (TreasuryDirect), "Treasury Bills: investment rate" formulas.
 */
export function billInvestmentYield(price: number, settlement: IsoDate, maturity: IsoDate): number {
  const r = daysBetween(settlement, maturity);
  const y = billYearBasis(settlement);
  if (r <= y / 2) return ((100 - price) / price) * (y / r);
  const a = r / y;
  const b = 2 * a - 1;
  return (-2 * a + 2 * Math.sqrt(a * a - b * (1 - 100 / price))) / b;
}

export function compileBill(q: BillQuote, settlement: IsoDate, t: number, time: (d: CivilDate) => number): Instrument {
  const value = q.discountYield !== null ? q.discountYield : q.price!;
  if (q.settle !== undefined && q.settle !== settlement) {
    return new SpotBill(q, t, [time(civilFromIso(q.settle)), t], daysBetween(q.settle, q.maturity), value);
  }
  const days = daysBetween(settlement, q.maturity);
  return new BillInstrument(q, t, [t], [100], days, value);
}

/** A compiled bill: 100 at maturity against its price. */
class BillInstrument extends SingleFlowInstrument<BillQuote> {
  /** Actual days from settlement to maturity. */
  declare readonly days: number;

  constructor(q: BillQuote, t: number, times: readonly number[], amounts: readonly number[], days: number, value: number) {
    const byYield = q.discountYield !== null;
    super(
      q,
      t,
      times,
      byYield ? 'rate' : 'price',
      byYield ? 'discountYield' : 'price',
      value,
      amounts,
      byYield ? billPriceFromDiscountYield(value, days) : value,
      byYield ? (value * days < 360 ? Math.log1p((-value * days) / 360) : Number.NaN) : Math.log(value / 100),
    );
    this.days = days;
  }

  /** The discount yield (1 - DF) 360 / days, or the price 100 DF per 100 face. */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    trace?.('lnP', ln[offset]!);
    return this.unit === 'rate' ? (-Math.expm1(ln[offset]!) * 360) / this.days : 100 * df[offset]!;
  }

  requote(value: number): Instrument {
    return new BillInstrument(this.quote, this.t, this.times, this.amounts, this.days, value);
  }
}

/** A bill settled at spot S (its `settle`, Treasury bills T+1): the days of its discount yield count from S (SpotSingleFlow). */
class SpotBill extends SpotSingleFlow<BillQuote> {
  /** Actual days from settlement at spot to maturity. */
  declare readonly days: number;

  constructor(q: BillQuote, t: number, times: readonly number[], days: number, value: number) {
    const byYield = q.discountYield !== null;
    const price = byYield ? billPriceFromDiscountYield(value, days) : value;
    super(q, t, times, byYield ? 'rate' : 'price', byYield ? 'discountYield' : 'price', value, price > 0 ? Math.log(price / 100) : Number.NaN);
    this.days = days;
  }

  /** The discount yield (1 - DF(M)/DF(S)) 360 / days, or the price 100 DF(M)/DF(S), both at S. */
  protected quoteOfRatio(lnRatio: number): number {
    return this.unit === 'rate' ? (-Math.expm1(lnRatio) * 360) / this.days : 100 * Math.exp(lnRatio);
  }

  requote(value: number): Instrument {
    return new SpotBill(this.quote, this.t, this.times, this.days, value);
  }
}
