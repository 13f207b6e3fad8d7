import { civilFromSerial, isoFromSerial, serialFromCivil, serialFromIso, type IsoDate } from './date.ts';
import { weekdayOf, type BusinessCalendar } from './calendars.ts';

/**
 * Reference periods of futures on an overnight rate (MARKET-CONVENTIONS.md section e; CME SOFR
 * futures contract specifications, checked for the three-month and one-month contracts):
 * - three-month (compounded): from and including the third Wednesday of the contract month (its
 *   IMM date) to but excluding the third Wednesday three months later; neither date is moved for a
 *   holiday (2024-06-19, Juneteenth, is the end of the March 2024 contract and the start of June's).
 * - one-month (averaged): every calendar day of the contract month, from the first to the last day;
 *   the accrual ends on the first day of the next month.
 * Dates are day serials (time/date.ts).
 */
export type FutureContract = '3M' | '1M';
export const FUTURE_CONTRACTS: readonly FutureContract[] = ['3M', '1M'];

/** The third Wednesday of a month (1..12): its IMM date. */
export function thirdWednesday(y: number, m: number): number {
  const first = serialFromCivil({ y, m, d: 1 });
  const toWednesday = (3 - weekdayOf(first) + 7) % 7; // weekdayOf: 0 Sunday .. 6 Saturday
  return first + toWednesday + 14;
}

/** The contract month's reference period [start, end) as day serials. */
export function futurePeriod(contract: FutureContract, y: number, m: number): { readonly start: number; readonly end: number } {
  const ny = m === 12 ? y + 1 : y;
  const nm = m === 12 ? 1 : m + 1;
  if (contract === '1M') return { start: serialFromCivil({ y, m, d: 1 }), end: serialFromCivil({ y: ny, m: nm, d: 1 }) };
  const ey = m >= 10 ? y + 1 : y;
  const em = ((m + 2) % 12) + 1;
  return { start: thirdWednesday(y, m), end: thirdWednesday(ey, em) };
}

/** A contract month `YYYY-MM` read, or null when the text is not one. */
export function parseContractMonth(text: string): { readonly y: number; readonly m: number } | null {
  const match = /^(\d{4})-(\d{2})$/.exec(text);
  if (match === null) return null;
  const y = Number(match[1]);
  const m = Number(match[2]);
  return m >= 1 && m <= 12 ? { y, m } : null;
}

/**
 * The fixings an arithmetic average over the calendar days [start, end) reads: each calendar day
 * carries the rate of the business day it is, or of the business day before it (CME one-month SOFR
 * futures: a non-business day takes the preceding business day's rate).
 * - `days[i]` business day i (serial), from the business day on or before `start` to the last
 *   business day before `end`; `next` the business day after the last (on or after `end`), which
 *   the last day's overnight rate runs to.
 * - `weights[i]` the calendar days of [start, end) that carry day i's rate (they sum to end - start);
 *   `spans[i]` the days from day i to the next business day (the overnight rate's n_i).
 * The calendar must answer for every day read (the caller checks its years).
 */
export interface AveragedFixings {
  readonly days: readonly number[];
  readonly next: number;
  readonly weights: readonly number[];
  readonly spans: readonly number[];
}

export function averagedFixings(start: number, end: number, calendar: BusinessCalendar): AveragedFixings {
  let b = start;
  while (!calendar.isBusinessDay(b)) b--;
  const days: number[] = [];
  const weights: number[] = [];
  const spans: number[] = [];
  while (b < end) {
    let nb = b + 1;
    while (!calendar.isBusinessDay(nb)) nb++;
    days.push(b);
    weights.push(Math.min(nb, end) - Math.max(b, start));
    spans.push(nb - b);
    b = nb;
  }
  return { days, next: b, weights, spans };
}

/** The contract month of a period start, as `YYYY-MM` (for labels). */
export function monthLabel(serial: number): string {
  const c = civilFromSerial(serial);
  return `${c.y}-${String(c.m).padStart(2, '0')}`;
}

/** The last day of a period that ends (exclusive) on `end`. */
export const lastDayOf = (end: IsoDate): IsoDate => isoFromSerial(serialFromIso(end) - 1);

/** Each calendar day of [start, end) with the day after it and the business day whose rate it carries (averagedFixings). */
export function averagedDays(start: IsoDate, end: IsoDate, calendar: BusinessCalendar): { readonly day: IsoDate; readonly dayEnd: IsoDate; readonly fixing: IsoDate }[] {
  const s = serialFromIso(start);
  const e = serialFromIso(end);
  const f = averagedFixings(s, e, calendar);
  const out: { day: IsoDate; dayEnd: IsoDate; fixing: IsoDate }[] = [];
  let i = 0;
  for (let d = s; d < e; d++) {
    while (i + 1 < f.days.length && f.days[i + 1]! <= d) i++;
    out.push({ day: isoFromSerial(d), dayEnd: isoFromSerial(d + 1), fixing: isoFromSerial(f.days[i]!) });
  }
  return out;
}
