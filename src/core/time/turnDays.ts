/**
 * The calendar days an overnight turn covers. Day arithmetic lives here, in src/core/time, with the
 * other date primitives.
 */
import type { IsoDate } from './date.ts';
import type { BusinessCalendar } from './calendars.ts';

/**
 * What turnDays needs of the calendars and date modules, handed in (the build passes
 * `outsideCalendar`, `MAX_CLOSED_RUN`, `serialFromIso`, `isoFromSerial`), so the code of turns, fetched on first use, shares no module with the first
 * screen beyond what it already had.
 */
export interface CalendarLimits {
  readonly outside: (calendar: BusinessCalendar, serial: number) => string | null;
  readonly maxClosedRun: number;
  /** date.ts's serialFromIso and isoFromSerial (days since 1970-01-01). */
  readonly serialFromIso: (date: IsoDate) => number;
  readonly isoFromSerial: (serial: number) => IsoDate;
}

/**
 * The overnight periods that start on a business day from `from` to `to` (inclusive) of a
 * calendar, as calendar days: `start` is the first business day on or after `from`, `end`
 * (exclusive) the business day after the last business day on or before `to`; each overnight
 * period runs from one business day to the next, so a Friday's covers the weekend. `days` = end
 * minus start. A string when the range holds no business day or lies outside the calendar's years.
 */
export function turnDays(from: IsoDate, to: IsoDate, calendar: BusinessCalendar, limits: CalendarLimits): { start: IsoDate; end: IsoDate; days: number } | string {
  const { serialFromIso: serialOf, isoFromSerial: isoOf } = limits;
  const a = serialOf(from);
  const b = serialOf(to);
  for (const s of [a, b]) {
    const outside = limits.outside(calendar, s);
    if (outside !== null) return outside;
  }
  let first = a;
  while (first <= b && !calendar.isBusinessDay(first)) first++;
  if (first > b) return `it holds no business day of the calendar ${calendar.id} (from ${from} to ${to} every day is a weekend day or holiday); widen it to include the business day whose overnight period carries the turn`;
  let last = b;
  while (!calendar.isBusinessDay(last)) last--;
  let end = last + 1;
  while (!calendar.isBusinessDay(end) && end - last <= limits.maxClosedRun) end++;
  return { start: isoOf(first), end: isoOf(end), days: end - first };
}
