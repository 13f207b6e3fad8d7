/**
 * The calendar days an overnight turn covers, and the calendar days of the overnight forward view.
 * Day arithmetic lives here, in src/core/time, with the other date primitives.
 */
import { isoFromSerial, serialFromIso, type IsoDate } from './date.ts';
import { MAX_CLOSED_RUN, outsideCalendar, type BusinessCalendar } from './calendars.ts';

/**
 * The overnight periods that start on a business day from `from` to `to` (inclusive) of a
 * calendar, as calendar days: `start` is the first business day on or after `from`, `end`
 * (exclusive) the business day after the last business day on or before `to`; each overnight
 * period runs from one business day to the next, so a Friday's covers the weekend. `days` = end
 * minus start. A string when the range holds no business day or lies outside the calendar's years.
 */
export function turnDays(from: IsoDate, to: IsoDate, calendar: BusinessCalendar): { start: IsoDate; end: IsoDate; days: number } | string {
  const a = serialFromIso(from);
  const b = serialFromIso(to);
  for (const s of [a, b]) {
    const outside = outsideCalendar(calendar, s);
    if (outside !== null) return outside;
  }
  let first = a;
  while (first <= b && !calendar.isBusinessDay(first)) first++;
  if (first > b) return `it holds no business day of the calendar ${calendar.id} (from ${from} to ${to} every day is a weekend day or holiday); widen it to include the business day whose overnight period carries the turn`;
  let last = b;
  while (!calendar.isBusinessDay(last)) last--;
  let end = last + 1;
  while (!calendar.isBusinessDay(end) && end - last <= MAX_CLOSED_RUN) end++;
  return { start: isoFromSerial(first), end: isoFromSerial(end), days: end - first };
}

/** Every calendar day from `from` (inclusive) to `to` (exclusive), as dates. */
export function calendarDays(from: IsoDate, to: IsoDate): IsoDate[] {
  const a = serialFromIso(from);
  const b = serialFromIso(to);
  const out: IsoDate[] = [];
  for (let s = a; s < b; s++) out.push(isoFromSerial(s));
  return out;
}

/** The calendar day after `date` (the end of its one-day period). */
export const dayAfter = (date: IsoDate): IsoDate => isoFromSerial(serialFromIso(date) + 1);
/** The calendar day before `date`. */
export const dayBefore = (date: IsoDate): IsoDate => isoFromSerial(serialFromIso(date) - 1);
