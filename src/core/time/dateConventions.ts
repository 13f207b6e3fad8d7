import { coreError, fail, ok, type Result } from '../result.ts';
import { addMonthsCivil, civilFromSerial, daysInMonth, isoFromCivil, parseIsoDate, serialFromCivil, type CivilDate, type IsoDate } from './date.ts';
import { addTenorCivil, parseTenor, type Tenor } from './tenor.ts';

/**
 * The conventions layer for market dates: every date the product makes from a tenor (a quote's
 * maturity, a table row, a forward's end, a scenario node, a horizon, a chart grid's bond) is made
 * here, under a named convention set. Other code never adds days or months to a date to make a
 * market date (test/architecture.test.ts enforces it).
 *
 * Today the product uses one set, UNADJUSTED (no calendar, no business-day adjustment, no
 * end-of-month rule, no spot lag): tenors are added to the anchor, month ends clipped. The types
 * already admit calendars, business-day rules, the end-of-month rule and spot lags, so holiday
 * calendars and spot lags plug in here without touching the callers.
 */

/**
 * Business-day conventions, ISDA 2006 Definitions Section 4.12 (cited from memory):
 * - `following`: the first following day that is a business day;
 * - `modified-following`: the first following business day unless it falls in the next calendar
 *   month, in which case the first preceding business day;
 * - `preceding`: the first preceding day that is a business day;
 * - `unadjusted`: the date as it falls (the "No Adjustment" of market usage).
 */
export const BUSINESS_DAY_RULES = ['unadjusted', 'following', 'modified-following', 'preceding'] as const;
export type BusinessDayRule = (typeof BUSINESS_DAY_RULES)[number];

/** A business-day calendar: which days (day serials, days since 1970-01-01) are business days. */
export interface BusinessCalendar {
  readonly id: string;
  isBusinessDay(serial: number): boolean;
}

/** A named set of date conventions. */
export interface ConventionSet {
  /** A short name of our own, shown in messages ("unadjusted"). */
  readonly name: string;
  /** The business-day calendar's id (see CALENDAR_IDS), or null for none: every day is a business day. */
  readonly calendar: string | null;
  /** How a date that is not a business day moves. */
  readonly businessDay: BusinessDayRule;
  /**
   * The end-of-month rule for month and year tenors: when the start is the last business day of
   * its month, the date is the last business day of its month. Off: the start's day of month,
   * clipped to the month's last day (31 Jan + 1M = 28/29 Feb).
   */
  readonly endOfMonth: boolean;
  /** Business days from the anchor (trade date) to the spot date tenors count from; 0 counts from the anchor. */
  readonly spotLagDays: number;
}

/** Today's conventions everywhere in the product: no calendar, unadjusted, no end-of-month rule, no spot lag. */
export const UNADJUSTED: ConventionSet = Object.freeze({ name: 'unadjusted', calendar: null, businessDay: 'unadjusted', endOfMonth: false, spotLagDays: 0 });

/** UNADJUSTED with the end-of-month rule: a month-end start gives month ends (the `eom` flag of bond and swap schedules). */
export const UNADJUSTED_END_OF_MONTH: ConventionSet = Object.freeze({ name: 'unadjusted, end of month', calendar: null, businessDay: 'unadjusted', endOfMonth: true, spotLagDays: 0 });

/** Every day a business day (a set without a calendar). */
export const EVERY_DAY: BusinessCalendar = Object.freeze({ id: 'every-day', isBusinessDay: () => true });

/**
 * Saturdays and Sundays are not business days, every other day is (no holidays). Day serial 0,
 * 1970-01-01, was a Thursday, so serial mod 7 is 2 on Saturdays and 3 on Sundays.
 */
export const WEEKENDS_ONLY: BusinessCalendar = Object.freeze({
  id: 'weekends-only',
  isBusinessDay: (serial: number): boolean => {
    const w = ((serial % 7) + 7) % 7;
    return w !== 2 && w !== 3;
  },
});

/** The calendars a convention set may name. Holiday calendars are added here. */
const CALENDARS: Readonly<Record<string, BusinessCalendar>> = { [WEEKENDS_ONLY.id]: WEEKENDS_ONLY };
export const CALENDAR_IDS: readonly string[] = Object.keys(CALENDARS);

/** The calendar of a set (EVERY_DAY when it names none), or null when its id is unknown. */
export const calendarOf = (set: ConventionSet): BusinessCalendar | null =>
  set.calendar === null ? EVERY_DAY : Object.prototype.hasOwnProperty.call(CALENDARS, set.calendar) ? CALENDARS[set.calendar]! : null;

/** Longest run of non-business days searched before a calendar is judged broken (programming error). */
const MAX_HOLIDAY_RUN = 366;

function nextBusinessDay(serial: number, calendar: BusinessCalendar, direction: 1 | -1): number {
  let s = serial;
  for (let i = 0; i < MAX_HOLIDAY_RUN; i++, s += direction) if (calendar.isBusinessDay(s)) return s;
  throw new RangeError(`calendar ${calendar.id}: no business day within ${MAX_HOLIDAY_RUN} days of serial ${serial}`);
}

/**
 * The day serial of `serial` moved by a business-day rule under a calendar (ISDA 2006 Section
 * 4.12, see BusinessDayRule). A business day never moves; `unadjusted` never moves any day.
 */
export function adjustBusinessDay(serial: number, rule: BusinessDayRule, calendar: BusinessCalendar): number {
  if (rule === 'unadjusted' || calendar.isBusinessDay(serial)) return serial;
  if (rule === 'preceding') return nextBusinessDay(serial, calendar, -1);
  const following = nextBusinessDay(serial, calendar, 1);
  if (rule === 'following') return following;
  // modified following: back to the preceding business day when following leaves the month.
  const c = civilFromSerial(serial);
  const f = civilFromSerial(following);
  return f.m === c.m && f.y === c.y ? following : nextBusinessDay(serial, calendar, -1);
}

/** The last business day of a month (serial). */
const lastBusinessDayOfMonth = (y: number, m: number, calendar: BusinessCalendar): number =>
  nextBusinessDay(serialFromCivil({ y, m, d: daysInMonth(y, m) }), calendar, -1);

/** The anchor advanced by `days` business days (the spot date of a trade date). */
function addBusinessDays(serial: number, days: number, calendar: BusinessCalendar): number {
  let s = serial;
  for (let left = days; left > 0; left--) s = nextBusinessDay(s + 1, calendar, 1);
  return s;
}

/**
 * The market date k tenors after an anchor under a convention set; the rule itself, on a parsed
 * tenor and a valid anchor (it cannot fail for a set whose calendar is known). The tenor counts
 * from the spot date (the anchor plus the set's spot lag in business days); k x tenor is counted
 * from it and never chained (31 Jan + 2 x 1M is 31 Mar, not 28 Mar); k may be zero or negative
 * (a schedule counted back). Day and week tenors are calendar days; month and year tenors keep the
 * day of month, clipped to the month's end, or follow the end-of-month rule; then the date moves
 * by the business-day rule.
 *
 * Under UNADJUSTED (and UNADJUSTED_END_OF_MONTH) this is addTenorCivil (performance: no object made besides the date, as it runs
 * once per quote of every document). A set whose calendar id is unknown throws (programming
 * error: resolveMarketDate checks a set before using it).
 */
export function marketDateCivil(anchor: CivilDate, tenor: Tenor, set: ConventionSet = UNADJUSTED, k = 1): CivilDate {
  if (set === UNADJUSTED) return addTenorCivil(anchor, tenor, k, false);
  if (set === UNADJUSTED_END_OF_MONTH) return addTenorCivil(anchor, tenor, k, true);
  const calendar = calendarOf(set);
  if (calendar === null) throw new RangeError(`convention set ${set.name}: unknown calendar ${String(set.calendar)}`);
  if (calendar === EVERY_DAY) {
    // Every day is a business day: the spot lag is calendar days and nothing moves.
    const spot = set.spotLagDays === 0 ? anchor : civilFromSerial(serialFromCivil(anchor) + set.spotLagDays);
    return addTenorCivil(spot, tenor, k, set.endOfMonth);
  }
  const spotSerial = addBusinessDays(serialFromCivil(anchor), set.spotLagDays, calendar);
  const spot = civilFromSerial(spotSerial);
  let raw: number;
  if (tenor.unit === 'D' || tenor.unit === 'W') raw = spotSerial + (tenor.unit === 'W' ? 7 : 1) * k * tenor.n;
  else {
    const months = (tenor.unit === 'Y' ? 12 : 1) * k * tenor.n;
    const end = addMonthsCivil(spot, months, false);
    raw = set.endOfMonth && spotSerial === lastBusinessDayOfMonth(spot.y, spot.m, calendar) ? lastBusinessDayOfMonth(end.y, end.m, calendar) : serialFromCivil(end);
  }
  return civilFromSerial(adjustBusinessDay(raw, set.businessDay, calendar));
}

/** `marketDateCivil` on ISO dates: the market date k tenors after a valid anchor. */
export const marketDate = (anchor: IsoDate, tenor: Tenor, set: ConventionSet = UNADJUSTED, k = 1): IsoDate => {
  const c = parseIsoDate(anchor);
  if (c === null) throw new RangeError(`not an ISO date: ${anchor}`); // programming error: anchors are validated at the boundary
  return isoFromCivil(marketDateCivil(c, tenor, set, k));
};

/** A parsed tenor: a whole n from 1 and a unit D, W, M or Y (guards a value that did not come from parseTenor). */
const isTenor = (v: unknown): v is Tenor =>
  typeof v === 'object' && v !== null && Number.isInteger((v as Tenor).n) && (v as Tenor).n >= 1 && ['D', 'W', 'M', 'Y'].includes((v as Tenor).unit);

/** What is wrong with a set, or null when it can be used. */
function conventionSetErrors(set: ConventionSet): string | null {
  if (set === UNADJUSTED || set === UNADJUSTED_END_OF_MONTH) return null;
  if (calendarOf(set) === null) return `the convention set "${set.name}" names the calendar "${String(set.calendar)}", which is not known; use one of ${CALENDAR_IDS.join(', ')} or none`;
  if (!(BUSINESS_DAY_RULES as readonly string[]).includes(set.businessDay)) return `the convention set "${set.name}" has the business-day rule "${String(set.businessDay)}"; use one of ${BUSINESS_DAY_RULES.join(', ')}`;
  if (!Number.isInteger(set.spotLagDays) || set.spotLagDays < 0 || set.spotLagDays > 30) return `the convention set "${set.name}" has a spot lag of ${String(set.spotLagDays)} business days; use a whole number from 0 to 30`;
  return null;
}

/**
 * The one function that turns what a user or a document gives for a date into a market date: a
 * tenor text ("3M", "10y"; see parseTenor), a parsed Tenor, or a date text YYYY-MM-DD, read from
 * `anchor` under the convention set (default UNADJUSTED). A tenor is resolved by marketDateCivil
 * (spot lag, tenor, end-of-month rule, business-day rule); a date text is passed through as given
 * (a date the user typed is not moved). Errors are values naming `path`: a text that is neither
 * a tenor nor a date, an anchor that is not a date, a set that cannot be used. Ordering (after
 * settlement, after a start) is the caller's to check, as each says it in its own words.
 */
export function resolveMarketDate(anchor: IsoDate, when: string | Tenor, set: ConventionSet = UNADJUSTED, path = 'date'): Result<IsoDate> {
  const a = parseIsoDate(anchor);
  if (a === null) return fail(coreError('schema', path, `${path}: the date "${String(anchor).slice(0, 20)}" it counts from is not a date YYYY-MM-DD`));
  const problem = conventionSetErrors(set);
  if (problem !== null) return fail(coreError('unknown-identifier', path, `${path}: ${problem}`));
  const tenor = typeof when === 'string' ? parseTenor(when) : isTenor(when) ? when : null;
  if (tenor !== null) return ok(isoFromCivil(marketDateCivil(a, tenor, set)));
  if (typeof when === 'string' && parseIsoDate(when) !== null) return ok(when);
  const shown = typeof when === 'string' ? `"${when.slice(0, 40)}"` : `the value ${JSON.stringify(when)?.slice(0, 40) ?? String(when)}`;
  return fail(coreError('schema', path, `${path}: ${shown} must be a tenor such as "3M" or "5Y" (a whole number and D, W, M or Y) or a date YYYY-MM-DD`));
}
