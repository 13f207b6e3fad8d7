import { parseDateText, type DateOrder } from '../input/dateText.ts';
import { builtInHolidays, businessCalendar, CALENDAR_FIRST_YEAR, CALENDAR_LAST_YEAR, closedWeekdays, isWeekend, type BuiltInCalendarId, type CalendarEdits } from './calendars.ts';
import { parseIsoDate, serialFromIso, type IsoDate } from './date.ts';

/**
 * A workspace's edits of a built-in calendar, for people: which weekdays of a year are closed and
 * why (the publisher's rule, or added by the workspace), which published holidays it opened, and
 * the edits a user's "close" or "open" makes. Pure: the Holidays section shows these and writes
 * the edits back to the workspace document (`calendars`), which every quote on that calendar uses.
 */
export interface ClosedDay {
  readonly date: IsoDate;
  /** Monday .. Friday. */
  readonly weekday: string;
  /** `published`: a closing by the calendar's own rules or dated entries; `added`: the workspace's. */
  readonly source: 'published' | 'added';
}

export interface CalendarYearView {
  readonly closed: readonly ClosedDay[];
  /** Published holidays of the year that the workspace's edits open. */
  readonly opened: readonly IsoDate[];
}

const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];
const weekdayName = (d: IsoDate): string => WEEKDAYS[(((serialFromIso(d) + 4) % 7) + 7) % 7]!;

/** The closed weekdays of `year` on calendar `id` with the workspace's edits, each with its source. */
export function calendarYear(id: BuiltInCalendarId, year: number, edits: CalendarEdits = {}): CalendarYearView {
  const published = new Set(builtInHolidays(id, year));
  const o = businessCalendar(id, { edits: { [id]: edits } });
  if (!o.ok) return { closed: [], opened: [] }; // cannot happen: a built-in id reads
  const closed = closedWeekdays(o.calendar, `${year}-01-01`, `${year}-12-31`).map((date) => ({ date, weekday: weekdayName(date), source: published.has(date) ? ('published' as const) : ('added' as const) }));
  const open = new Set(closed.map((c) => c.date));
  return { closed, opened: [...published].filter((d) => !open.has(d)).sort() };
}

export type EditOutcome = { readonly ok: true; readonly edits: { readonly add: readonly IsoDate[]; readonly remove: readonly IsoDate[] } } | { readonly ok: false; readonly message: string };

const lists = (edits: CalendarEdits) => ({ add: [...(edits.add ?? [])], remove: [...(edits.remove ?? [])] });

/**
 * The edits after closing `date` on calendar `id`: a published holiday opened before is restored;
 * any other weekday is added. A weekend day, a day already closed, or one outside the calendars'
 * years is refused with the reason.
 */
export function closeDay(id: BuiltInCalendarId, date: IsoDate, edits: CalendarEdits = {}): EditOutcome {
  const civil = parseIsoDate(date);
  if (civil === null) return { ok: false, message: `"${date.slice(0, 20)}" is not a date YYYY-MM-DD` };
  if (civil.y < CALENDAR_FIRST_YEAR || civil.y > CALENDAR_LAST_YEAR) return { ok: false, message: `${date} is outside the calendars' years, ${CALENDAR_FIRST_YEAR} to ${CALENDAR_LAST_YEAR}` };
  if (isWeekend(serialFromIso(date))) return { ok: false, message: `${date} is a ${weekdayName(date)}, closed on every calendar already` };
  const e = lists(edits);
  if (e.remove.includes(date)) return { ok: true, edits: { add: e.add, remove: e.remove.filter((d) => d !== date) } };
  if (builtInHolidays(id, civil.y).includes(date) || e.add.includes(date)) return { ok: false, message: `${date} is closed on ${id} already` };
  return { ok: true, edits: { add: [...e.add, date].sort(), remove: e.remove } };
}

/** The edits after opening `date` (a day the workspace added is taken off; a published holiday is opened). */
export function openDay(id: BuiltInCalendarId, date: IsoDate, edits: CalendarEdits = {}): EditOutcome {
  const civil = parseIsoDate(date);
  if (civil === null) return { ok: false, message: `"${date.slice(0, 20)}" is not a date YYYY-MM-DD` };
  const e = lists(edits);
  if (e.add.includes(date)) return { ok: true, edits: { add: e.add.filter((d) => d !== date), remove: e.remove } };
  if (!builtInHolidays(id, civil.y).includes(date) || e.remove.includes(date)) return { ok: false, message: `${date} is open on ${id} already` };
  return { ok: true, edits: { add: e.add, remove: [...e.remove, date].sort() } };
}

export interface DateListReading {
  readonly dates: readonly IsoDate[];
  /** Lines that are not dates, counted from 1, with what is wrong. */
  readonly problems: readonly { readonly line: number; readonly text: string; readonly message: string }[];
}

/**
 * A pasted list of dates, one per line (or separated by semicolons, tabs, or commas before an ISO date): ISO dates, or dates
 * as the sheet reads them (`24-Dec-2027`, numeric in the given order). Blank lines are skipped; a
 * line that is not a date, or a date outside the calendars' years, is a problem naming its line.
 */
export function readDateList(text: string, order: DateOrder): DateListReading {
  const dates: IsoDate[] = [];
  const problems: { line: number; text: string; message: string }[] = [];
  text.split(/\r\n|\r|\n/).forEach((lineText, i) => {
    for (const piece of lineText.split(/[;\t]|,(?=\s*\d{4}-)/)) {
      const t = piece.trim();
      if (t === '') continue;
      const p = parseDateText(t, order);
      if (p === null || !p.ok) {
        problems.push({ line: i + 1, text: t.slice(0, 40), message: p && !p.ok ? p.message : 'not a date (use YYYY-MM-DD, such as 2027-12-24)' });
        continue;
      }
      const y = Number(p.date.slice(0, 4));
      if (y < CALENDAR_FIRST_YEAR || y > CALENDAR_LAST_YEAR) problems.push({ line: i + 1, text: t.slice(0, 40), message: `outside the calendars' years, ${CALENDAR_FIRST_YEAR} to ${CALENDAR_LAST_YEAR}` });
      else dates.push(p.date);
    }
  });
  return { dates: [...new Set(dates)].sort(), problems };
}
