import { addMonths, compareIso, type IsoDate } from './date.ts';

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

/** Generates a backward schedule from `end` (which must be after `start`). frequency: 1, 2, 4 or 12 per year. */
export function backwardSchedule(start: IsoDate, end: IsoDate, frequency: number, eom: boolean): BackwardSchedule {
  const step = 12 / frequency;
  const dates: IsoDate[] = [];
  let k = 0;
  let date = end;
  while (compareIso(date, start) > 0) {
    dates.push(date);
    k += 1;
    date = addMonths(end, -k * step, eom);
  }
  dates.reverse();
  return { dates, previous: date };
}
