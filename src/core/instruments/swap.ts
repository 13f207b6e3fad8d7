import { yearFraction, type DayCount } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import { backwardSchedule } from '../time/schedule.ts';
import type { SwapQuote } from '../workspace/types.ts';
import type { Instrument } from './instrument.ts';

/** One accrual period of a fixed leg. */
export interface FixedPeriod {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Year fraction of the period under the leg's day count. */
  readonly tau: number;
}

/**
 * Fixed-leg periods from start to end: dates backward from the end every 12/frequency months
 * (never chained), the first period from `start` to the first date (a short front stub when the
 * span is not a whole number of periods). ACT/ACT-ICMA takes the notional regular period as its
 * reference; 30E/360-ISDA takes `end` as the termination date.
 */
export function fixedLegPeriods(start: IsoDate, end: IsoDate, frequency: number, dayCount: DayCount, eom: boolean): FixedPeriod[] {
  const { dates, previous } = backwardSchedule(start, end, frequency, eom);
  return dates.map((date, i) => {
    const from = i === 0 ? start : dates[i - 1]!;
    const refStart = i === 0 ? previous : from;
    const tau = yearFraction(dayCount, from, date, { termination: end, eom, refStart, refEnd: date, frequency });
    return { start: from, end: date, tau };
  });
}

/**
 * Single-curve par swap from settlement, the curve both discounting and projecting:
 *   S = (1 - DF(T_n)) / sum_i tau_i DF(T_i).
 * Exact for overnight-indexed swaps; an approximation for term-index swaps (README).
 */
export function compileSwap(q: SwapQuote, settlement: IsoDate, t: number, time: (d: IsoDate) => number): Instrument {
  const periods = fixedLegPeriods(settlement, q.maturity, q.frequency, q.dayCount, q.eom);
  const n = periods.length;
  const times = new Float64Array(n);
  const taus = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    times[j] = time(periods[j]!.end);
    taus[j] = periods[j]!.tau;
  }
  const make = (rate: number): Instrument => {
    const amounts = new Float64Array(n);
    for (let j = 0; j < n; j++) amounts[j] = rate * taus[j]!;
    amounts[n - 1] = amounts[n - 1]! + 1;
    return {
      quote: q,
      index: q.index,
      kind: 'swap',
      maturity: q.maturity,
      t,
      unit: 'rate',
      field: 'rate',
      market: rate,
      times,
      amounts,
      target: 1,
      closedFormLn: null,
      modelQuote: (lnDiscountAt) => {
        let annuity = 0;
        for (let j = 0; j < n; j++) annuity += taus[j]! * Math.exp(lnDiscountAt(times[j]!));
        return -Math.expm1(lnDiscountAt(times[n - 1]!)) / annuity;
      },
      requote: make,
    };
  };
  return make(q.rate);
}
