import { coreError, fail, ok, type Result } from '../result.ts';
import { addMonthsCivil, civilFromSerial, daysInMonth, isoFromCivil, parseIsoDate, serialFromCivil, type CivilDate, type IsoDate } from './date.ts';
import { addTenorCivil, parseTenor, type Tenor } from './tenor.ts';
import { addBusinessDays, adjustSerial, BUILT_IN_CALENDARS, BUSINESS_DAY_RULES, businessCalendar, lastBusinessDayOfMonth, outsideCalendar, type BusinessCalendar, type BusinessDayRule, type CalendarContext } from './calendars.ts';

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
  /** A workspace's own calendars and its edits of the built-in ones (the document's `calendars` and `customCalendars`); none: the built-ins as published. */
  readonly calendars?: CalendarContext;
}

/** Today's conventions everywhere in the product: no calendar, unadjusted, no end-of-month rule, no spot lag. */
export const UNADJUSTED: ConventionSet = Object.freeze({ name: 'unadjusted', calendar: null, businessDay: 'unadjusted', endOfMonth: false, spotLagDays: 0 });

/** UNADJUSTED with the end-of-month rule: a month-end start gives month ends (the `eom` flag of bond and swap schedules). */
export const UNADJUSTED_END_OF_MONTH: ConventionSet = Object.freeze({ name: 'unadjusted, end of month', calendar: null, businessDay: 'unadjusted', endOfMonth: true, spotLagDays: 0 });

/** Every day a business day (a set without a calendar). */
export const EVERY_DAY: BusinessCalendar = Object.freeze({ id: 'every-day', isBusinessDay: () => true });

/** The built-in calendars (src/core/time/calendars.ts), made once; a joined id (`a+b`) is made when asked for. */
const BUILT_IN: Readonly<Record<string, BusinessCalendar>> = Object.fromEntries(
  BUILT_IN_CALENDARS.map((id) => {
    const o = businessCalendar(id);
    if (!o.ok) throw new RangeError(o.message); // cannot happen: every built-in id reads
    return [id, o.calendar];
  }),
);
/** Saturdays and Sundays only (the `weekends` calendar). */
export const WEEKENDS_ONLY: BusinessCalendar = BUILT_IN.weekends!;
export const CALENDAR_IDS: readonly string[] = BUILT_IN_CALENDARS;

/** The calendar of a set (EVERY_DAY when it names none), or null when its id is unknown. */
export function calendarOf(set: ConventionSet): BusinessCalendar | null {
  if (set.calendar === null) return EVERY_DAY;
  if (set.calendars !== undefined) {
    const own = businessCalendar(set.calendar, set.calendars);
    return own.ok ? own.calendar : null;
  }
  if (Object.prototype.hasOwnProperty.call(BUILT_IN, set.calendar)) return BUILT_IN[set.calendar]!;
  const joined = businessCalendar(set.calendar);
  return joined.ok ? joined.calendar : null;
}

/**
 * The calendar a quote's dates are made on (its set's), checked for the quote: an unknown name is
 * an error on `base.calendar` that lists the valid ones (calendars.ts words it), and a settlement
 * date outside the calendar's years is an error naming them. For the readers of deposits and swaps.
 */
export function quoteCalendar(set: ConventionSet, settlementSerial: number, base: string, index: number): Result<BusinessCalendar> {
  const calendar = calendarOf(set);
  if (calendar === null) {
    const o = businessCalendar(set.calendar ?? '', set.calendars);
    const why = o.ok ? `the calendar "${String(set.calendar).slice(0, 60)}" cannot be used` : o.message;
    return fail(coreError('unknown-identifier', `${base}.calendar`, `${base}.calendar: ${why}`, index));
  }
  const outside = outsideCalendar(calendar, settlementSerial);
  if (outside !== null) return fail(coreError('range', `${base}.calendar`, `${base}.calendar: the settlement date ${outside}`, index));
  return ok(calendar);
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
    raw = set.endOfMonth && spotSerial === lastBusinessDayOfMonth(spotSerial, calendar) ? lastBusinessDayOfMonth(serialFromCivil(end), calendar) : serialFromCivil(end);
  }
  return civilFromSerial(adjustSerial(raw, set.businessDay, calendar));
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
  if (calendarOf(set) === null) return `the convention set "${set.name}" names the calendar "${String(set.calendar)}", which is not known; use one of ${CALENDAR_IDS.join(', ')} (joined with + if several) or none`;
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
