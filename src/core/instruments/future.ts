import { compoundOvernight } from '../rates/overnightCompounding.ts';
import { businessCalendar } from '../time/calendars.ts';
import { civilFromIso, civilFromSerial, isoFromSerial, serialFromIso, type CivilDate, type IsoDate } from '../time/date.ts';
import { averagedFixings } from '../time/futurePeriods.ts';
import type { FutureQuote } from '../document/types.ts';
import { CompiledInstrument, DISCOUNTING_AND_PROJECTING, type Instrument, type QuoteTrace } from './instrument.ts';
import { GrowthRatio } from './growthRatio.ts';

/** The overnight rate's day basis of SOFR futures: ACT/360 (CME SOFR futures specifications). */
export const FUTURE_BASIS = 360;

/**
 * The forward rate a futures price stands for: the futures rate (100 - price) / 100 less the
 * convexity adjustment (bp; futures rate minus forward rate, MARKET-CONVENTIONS.md section e).
 */
export const futureForwardRate = (price: number, convexityBp: number): number => (100 - price) / 100 - convexityBp / 1e4;

/** The futures price of a forward rate R (decimal) with its convexity adjustment: 100 (1 - R - CA). */
export const futurePriceOf = (forward: number, convexityBp: number): number => 100 * (1 - (forward + convexityBp / 1e4));

/**
 * Compiles a future on one curve (the curve both discounts nothing, since a future has no cash
 * flow, and projects the overnight rate):
 * - 3M, compounded: DF(S) / DF(E) = 1 + R tau, tau = (E - S) / 360 (ACT/360; the product of daily
 *   factors over the quarter telescopes on one curve), R the forward rate. Flows 0 at S and
 *   1 + R tau at E against DF(S) read off the curve (as a deposit starting at spot); at S on the
 *   valuation date DF(S) = 1.
 * - 1M, averaged: R = (1 / N) sum_i w_i r_i over the business days i whose rates the month's N
 *   calendar days carry (w_i days each), r_i = (DF(b_i) / DF(b_i+1) - 1) 360 / n_i the curve's
 *   overnight forward from business day i to the next (n_i days). Flows at every b_i and at the
 *   business day after the last (the pillar); the pillar's node sets the last rate r_last:
 *   solved exactly when DF(b_last) / DF(pillar) = 1 + r_need n_last / 360 with
 *   r_need = (N R - sum_{i < last} w_i r_i) / w_last.
 * The quote's unit is its price (per 100); the model price is 100 (1 - R_model - CA).
 */
export function compileFuture(q: FutureQuote, settlement: IsoDate, t: number, time: (d: CivilDate) => number): Instrument {
  const start = serialFromIso(q.start);
  const end = serialFromIso(q.end);
  const outcome = businessCalendar(q.calendar, q.calendars ?? {});
  // The reader checked the calendar; a failure here is a programming error.
  if (!outcome.ok) throw new Error(`future ${q.index}: ${outcome.message}`);
  const calendar = outcome.calendar;
  const rateOf = (b: number): number => q.fixings?.[isoFromSerial(b)] ?? Number.NaN;
  if (q.contract === '3M') {
    const tau = (end - start) / FUTURE_BASIS;
    if (q.fixings === undefined && calendar.isBusinessDay(start)) return new CompoundedFuture(q, t, [time(civilFromIso(q.start)), t], tau, q.price, 0);
    if (q.fixings === undefined) {
      // A start on a holiday (2024-06-19): its first days carry the rate of the business day b0
      // before it, which runs to the next business day b1. Without fixings the reader has made sure
      // b0 is on or after the valuation date, so that rate is read off the curve.
      let b0 = start;
      while (!calendar.isBusinessDay(b0)) b0--;
      let b1 = start;
      while (!calendar.isBusinessDay(b1)) b1++;
      return new HolidayStartFuture(q, t, [time(civilFromSerial(b0)), time(civilFromSerial(b1)), t], tau, (b1 - start) / (b1 - b0), q.price);
    }
    // In its period: the known growth over [S, c) from the fixings, c the first business day on or
    // after the valuation date; the curve gives DF(c) / DF(E).
    let c = serialFromIso(settlement);
    while (!calendar.isBusinessDay(c)) c++;
    const known = compoundOvernight(new Map(Object.entries(q.fixings).map(([d, r]) => [serialFromIso(d), r])), start, c, calendar, FUTURE_BASIS);
    if (!known.ok) throw new Error(`future ${q.index}: ${known.errors[0]!.message}`); // the reader checked every fixing
    return new CompoundedFuture(q, t, [time(civilFromSerial(c)), t], tau, q.price, Math.log(known.value.factor));
  }
  const f = averagedFixings(start, end, calendar);
  // In its period: business days before the valuation date carry known rates (their weighted sum).
  const v = serialFromIso(settlement);
  let first = 0;
  let knownSum = 0;
  while (first < f.days.length && f.days[first]! < v) {
    knownSum += f.weights[first]! * rateOf(f.days[first]!);
    first++;
  }
  const times = [...f.days.slice(first), f.next].map((s) => time(civilFromSerial(s)));
  times[times.length - 1] = t;
  return new AveragedFuture(q, t, times, f.weights.slice(first), f.spans.slice(first), end - start, q.price, knownSum);
}

/** A three-month future: 0 at S and 1 + R tau at E against DF(S) on the curve. */
class CompoundedFuture extends GrowthRatio<FutureQuote> {
  declare readonly tau: number;
  declare readonly lnGrowth: number;
  /** ln of the growth already fixed, over [S, c) (0 for a contract not yet in its period). */
  declare readonly lnKnown: number;

  constructor(q: FutureQuote, t: number, times: readonly number[], tau: number, price: number, lnKnown: number) {
    const r = futureForwardRate(price, q.convexity);
    // The flows: 0 at c and (1 + R tau) / known at E against DF(c).
    super(q, t, times, 'price', 'price', price, [0, (1 + r * tau) / Math.exp(lnKnown)], 1, null, DISCOUNTING_AND_PROJECTING);
    this.tau = tau;
    this.lnKnown = lnKnown;
    // ln(1 + R tau) less the known growth, NaN when the price implies a growth <= 0.
    this.lnGrowth = 1 + r * tau > 0 ? Math.log1p(r * tau) - lnKnown : Number.NaN;
  }

  /** 100 (1 - R - CA) with R = expm1(ln known + ln DF(c) - ln DF(E)) / tau (c = S before the period). */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const g = Math.expm1(this.lnKnown + ln[offset]! - ln[offset + 1]!);
    trace?.('g', g);
    trace?.('R', g / this.tau);
    return futurePriceOf(g / this.tau, this.quote.convexity);
  }

  requote(value: number): Instrument {
    return new CompoundedFuture(this.quote, this.t, this.times, this.tau, value, this.lnKnown);
  }
}

/**
 * A three-month future whose period starts on a holiday S between business days b0 and b1: the
 * growth over the quarter is (1 + r_b0 (b1 - S) / 360) DF(b1) / DF(E), r_b0 = (DF(b0) / DF(b1) - 1)
 * 360 / (b1 - b0) the curve's overnight forward of b0, i.e. (w DF(b0) + (1 - w) DF(b1)) / DF(E) with
 * w = (b1 - S) / (b1 - b0): exactly what the exchange compounds (its first days carry b0's rate).
 * Flows 0 at b0 and b1 and 1 + R tau at E against w DF(b0) + (1 - w) DF(b1).
 */
class HolidayStartFuture extends CompiledInstrument<FutureQuote> {
  declare readonly tau: number;
  /** (b1 - S) / (b1 - b0): the share of b0's overnight span inside the period. */
  declare readonly w: number;
  declare readonly lnGrowth: number;

  constructor(q: FutureQuote, t: number, times: readonly number[], tau: number, w: number, price: number) {
    const r = futureForwardRate(price, q.convexity);
    super(q, t, times, 'price', 'price', price, [0, 0, 1 + r * tau], 1, null, DISCOUNTING_AND_PROJECTING);
    this.tau = tau;
    this.w = w;
    this.lnGrowth = 1 + r * tau > 0 ? Math.log1p(r * tau) : Number.NaN;
  }

  targetFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return this.w * df[offset]! + (1 - this.w) * df[offset + 1]!;
  }

  targetSlopes(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void {
    out[0] = this.w * df[offset]!;
    out[1] = (1 - this.w) * df[offset + 1]!;
    out[2] = 0;
  }

  /** ln(1 + R tau) + ln DF(E) - ln(w DF(b0) + (1 - w) DF(b1)), taken relative to DF(b1) for precision. */
  residualFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return this.lnGrowth + ln[offset + 2]! - ln[offset + 1]! - Math.log1p(this.w * Math.expm1(ln[offset]! - ln[offset + 1]!));
  }

  /** 100 (1 - R - CA), R = expm1(ln(1 + w expm1(ln DF(b0) - ln DF(b1))) + ln DF(b1) - ln DF(E)) / tau. */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const lnStart = Math.log1p(this.w * Math.expm1(ln[offset]! - ln[offset + 1]!)) + ln[offset + 1]!;
    const g = Math.expm1(lnStart - ln[offset + 2]!);
    trace?.('lnStart', lnStart);
    trace?.('g', g);
    trace?.('R', g / this.tau);
    return futurePriceOf(g / this.tau, this.quote.convexity);
  }

  requote(value: number): Instrument {
    return new HolidayStartFuture(this.quote, this.t, this.times, this.tau, this.w, value);
  }
}

/** A one-month future: the month's average of the curve's overnight forwards (see compileFuture). */
class AveragedFuture extends CompiledInstrument<FutureQuote> {
  declare readonly weights: readonly number[];
  declare readonly spans: readonly number[];
  /** Calendar days of the month (N). */
  declare readonly days: number;
  /** The forward rate R the average must meet. */
  declare readonly rate: number;
  /** sum w_i r_i over the business days already fixed (0 before the period). */
  declare readonly knownSum: number;

  constructor(q: FutureQuote, t: number, times: readonly number[], weights: readonly number[], spans: readonly number[], days: number, price: number, knownSum: number) {
    const amounts = new Array<number>(times.length).fill(0);
    amounts[times.length - 1] = 1;
    super(q, t, times, 'price', 'price', price, amounts, 1, null, DISCOUNTING_AND_PROJECTING);
    this.weights = weights;
    this.spans = spans;
    this.days = days;
    this.rate = futureForwardRate(price, q.convexity);
    this.knownSum = knownSum;
  }

  /** Business day i's overnight forward, expm1(ln DF(b_i) - ln DF(b_i+1)) 360 / n_i. */
  private forward(ln: ArrayLike<number>, offset: number, i: number): number {
    return (Math.expm1(ln[offset + i]! - ln[offset + i + 1]!) * FUTURE_BASIS) / this.spans[i]!;
  }

  /** The growth 1 + r_need n_last / 360 the last business day's rate must have. */
  private neededGrowth(ln: ArrayLike<number>, offset: number): number {
    const last = this.weights.length - 1;
    let others = 0;
    for (let i = 0; i < last; i++) others += this.weights[i]! * this.forward(ln, offset, i);
    const need = (this.days * this.rate - this.knownSum - others) / this.weights[last]!;
    return 1 + (need * this.spans[last]!) / FUTURE_BASIS;
  }

  /** DF(b_last) / (1 + r_need n_last / 360): what DF at the pillar must be. */
  targetFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return df[offset + this.weights.length - 1]! / this.neededGrowth(ln, offset);
  }

  /**
   * d target / d ln DF_j: target (delta_{j,last} - (1/g) dg/d ln DF_j), dg/d ln DF_j =
   * -(n_last / 360) / w_last d(sum_{i < last} w_i r_i) / d ln DF_j, d r_i / d ln DF_i =
   * (DF_i / DF_i+1) 360 / n_i = -d r_i / d ln DF_i+1.
   */
  targetSlopes(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void {
    const last = this.weights.length - 1;
    const g = this.neededGrowth(ln, offset);
    const target = df[offset + last]! / g;
    for (let j = 0; j <= last + 1; j++) out[j] = 0;
    const k = this.spans[last]! / FUTURE_BASIS / this.weights[last]!;
    for (let i = 0; i < last; i++) {
      const d = (this.weights[i]! * Math.exp(ln[offset + i]! - ln[offset + i + 1]!) * FUTURE_BASIS) / this.spans[i]!;
      // dS/d ln DF_i += d, dS/d ln DF_i+1 -= d; dg = -k dS; d target = -target/g dg = target k dS / g.
      out[i]! += (target * k * d) / g;
      out[i + 1]! -= (target * k * d) / g;
    }
    out[last]! += target;
  }

  /** ln DF(pillar) - ln DF(b_last) + ln(1 + r_need n_last / 360): the same root, in ln space; NaN when no positive DF meets it. */
  residualFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    const g = this.neededGrowth(ln, offset);
    const last = this.weights.length - 1;
    return g > 0 ? ln[offset + last + 1]! - ln[offset + last]! + Math.log(g) : Number.NaN;
  }

  /** The model price 100 (1 - R_model - CA), R_model = (1 / N) sum_i w_i r_i. */
  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    let sum = this.knownSum;
    for (let i = 0; i < this.weights.length; i++) {
      const r = this.forward(ln, offset, i);
      trace?.('r', r);
      sum += this.weights[i]! * r;
    }
    trace?.('sum', sum);
    trace?.('R', sum / this.days);
    return futurePriceOf(sum / this.days, this.quote.convexity);
  }

  requote(value: number): Instrument {
    return new AveragedFuture(this.quote, this.t, this.times, this.weights, this.spans, this.days, value, this.knownSum);
  }
}
