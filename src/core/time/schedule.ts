import { compareCivil, isoFromCivil, civilFromIso, type CivilDate, type IsoDate } from './date.ts';
import { marketDateCivil, UNADJUSTED, UNADJUSTED_END_OF_MONTH } from './dateConventions.ts';
import type { Tenor } from './tenor.ts';

/** The coupon period of each frequency as a tenor (performance: made once, not per schedule). */
const PERIODS: Readonly<Record<number, Tenor>> = { 1: { n: 12, unit: 'M' }, 2: { n: 6, unit: 'M' }, 4: { n: 3, unit: 'M' }, 12: { n: 1, unit: 'M' } };

/**
 * Coupon dates generated backward from an end date: end - k x (12/frequency) months for
 * k = 0, 1, ..., each counted from the end date (never chained), month ends kept when `eom` and
 * the end is a month end.
 */
export interface BackwardSchedule {
  /** Dates strictly after `start`, ascending; the last is `end`. */
  readonly dates: readonly IsoDate[];
  /** The latest generated date on or before `start` (the notional start of the first period). */
  readonly previous: IsoDate;
}

/** The same schedule on civil dates (see backwardSchedule). */
export interface CivilBackwardSchedule {
  readonly dates: readonly CivilDate[];
  readonly previous: CivilDate;
}


/**
 * `backwardSchedule` on civil dates (performance: no ISO text formatted or parsed per date).
 * `end` must be after `start`; frequency: 1, 2, 4 or 12 per year.
 */
export function backwardScheduleCivil(start: CivilDate, end: CivilDate, frequency: number, eom: boolean): CivilBackwardSchedule {
  // Each date is a market date: the end minus k coupon periods under the conventions layer (today
  // unadjusted; the eom flag is the end-of-month rule).
  const period = PERIODS[frequency] ?? { n: 12 / frequency, unit: 'M' };
  const set = eom ? UNADJUSTED_END_OF_MONTH : UNADJUSTED;
  const dates: CivilDate[] = [];
  let k = 0;
  let date = end;
  while (compareCivil(date, start) > 0) {
    dates.push(date);
    k += 1;
    date = marketDateCivil(end, period, set, -k);
  }
  dates.reverse();
  return { dates, previous: date };
}

/** Generates a backward schedule from `end` (which must be after `start`). frequency: 1, 2, 4 or 12 per year. */
export function backwardSchedule(start: IsoDate, end: IsoDate, frequency: number, eom: boolean): BackwardSchedule {
  const civil = backwardScheduleCivil(civilFromIso(start), civilFromIso(end), frequency, eom);
  const dates = civil.dates.map((d, i) => (i === civil.dates.length - 1 ? end : isoFromCivil(d)));
  return { dates, previous: isoFromCivil(civil.previous) };
}
