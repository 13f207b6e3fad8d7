import type { IsoDate } from '../time/date.ts';
import type { BillQuote, DepositQuote, ZeroQuote } from '../document/types.ts';
import { quoteOnCurve, type Instrument, type QuoteUnit } from './instrument.ts';

/**
 * What the single-flow instruments (deposit, bill, zero) share: one cash flow at the pillar, whose
 * ln DF follows from the quote in closed form (`closedFormLn`, NaN when the quote implies
 * DF <= 0). Each kind adds its own figures (year fraction, days) and its quote formula.
 * Performance: classes, so that a requote creates one object and no closures.
 */
export abstract class SingleFlowInstrument<Q extends DepositQuote | BillQuote | ZeroQuote> implements Instrument {
  declare readonly quote: Q;
  declare readonly index: number;
  declare readonly kind: Q['kind'];
  declare readonly maturity: IsoDate;
  declare readonly t: number;
  declare readonly unit: QuoteUnit;
  declare readonly field: string;
  declare readonly market: number;
  declare readonly times: readonly number[];
  declare readonly amounts: readonly number[];
  declare readonly target: number;
  declare readonly closedFormLn: number;

  /**
   * @param times - `[t]`, shared by every requote of the instrument
   * @param amounts - the one flow, in the unit of `target` (per 1 of notional or per 100 face)
   */
  protected constructor(q: Q, t: number, times: readonly number[], unit: QuoteUnit, field: string, market: number, amounts: readonly number[], target: number, closedFormLn: number) {
    this.quote = q;
    this.index = q.index;
    this.kind = q.kind;
    this.maturity = q.maturity;
    this.t = t;
    this.unit = unit;
    this.field = field;
    this.market = market;
    this.times = times;
    this.amounts = amounts;
    this.target = target;
    this.closedFormLn = closedFormLn;
  }

  modelQuote(lnDiscountAt: (t: number) => number): number {
    return quoteOnCurve(this, lnDiscountAt);
  }

  abstract quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number;
  abstract requote(value: number): Instrument;
}
