import { coreError, fail, ok, type Result } from '../result.ts';
import { addBusinessDays, adjustSerial, outsideCalendar, type BusinessDayRule, type CalendarContext } from './calendars.ts';
import { civilFromSerial, compareCivil, isoFromCivil, serialFromCivil, type CivilDate, type IsoDate } from './date.ts';
import { marketDateCivil, quoteCalendar, type ConventionSet } from './dateConventions.ts';
import type { Tenor } from './tenor.ts';

/**
 * The dates of a swap leg with business-day conventions (an overnight-index swap's): accrual
 * periods [S_i, E_i) adjusted on a calendar, each paid at P_i = E_i + payment lag business days.
 * Rules (MARKET-CONVENTIONS.md sections b-d, from Strata's FixedOvernightSwapConventions and the
 * 2006 ISDA Definitions 4.12 as quoted there):
 *   start S_0 = settlement + spot lag business days (counted from the settlement itself);
 *   unadjusted end = S_0 + tenor (month and year tenors keep the day of month, clipped, or the
 *     end-of-month rule when `eom`), or the maturity given;
 *   period dates = unadjusted end - k x (12 / frequency) months, k = 0, 1, ..., each counted from
 *     the unadjusted end and never chained, while after S_0 (a short front stub when the span is
 *     not whole periods; a stub of any length is kept, none merged); one period when the
 *     unadjusted end is at most one year after S_0 (the "term" payment of swaps up to a year);
 *   every accrual date (S_0 included) moved by the business-day rule on the calendar;
 *   P_i = E_i + payment lag business days on the same calendar.
 */
export interface SwapDateConventions {
  /** A calendar id of calendars.ts, built-ins joined with `+`. */
  readonly calendar: string;
  readonly businessDay: BusinessDayRule;
  readonly eom: boolean;
  /** Business days from settlement to the start. */
  readonly spotLag: number;
  /** Business days from each accrual end to its payment. */
  readonly paymentLag: number;
  /** Fixed-leg payments a year: 1, 2, 4 or 12. */
  readonly frequency: number;
  /** The workspace's own calendars and edits (none: the built-ins as published). */
  readonly calendars?: CalendarContext;
}

/** A swap's adjusted dates, ascending: period i runs from starts[i] to ends[i] and pays on payments[i]. */
export interface SwapDates {
  readonly starts: readonly CivilDate[];
  readonly ends: readonly CivilDate[];
  readonly payments: readonly CivilDate[];
  /** The end before the business-day rule (the given maturity, or the start plus the tenor). */
  readonly unadjustedEnd: CivilDate;
  /** Each period's accrual end before the business-day rule (aligned with `ends`). */
  readonly unadjustedEnds: readonly CivilDate[];
}

const PERIODS: Readonly<Record<number, Tenor>> = { 1: { n: 12, unit: 'M' }, 2: { n: 6, unit: 'M' }, 4: { n: 3, unit: 'M' }, 12: { n: 1, unit: 'M' } };
const ONE_YEAR: Tenor = { n: 12, unit: 'M' };

/**
 * The swap's dates from `settlement` under the conventions, its end given by `tenor` or by the
 * unadjusted end date `end` (exactly one). Errors are values naming `base` and the field at fault:
 * an unknown calendar (`calendar`, listing the valid ones), a date outside the calendar's years
 * (`calendar`), an end on or before the start (`maturity`).
 */
export function swapDates(settlement: CivilDate, when: { readonly tenor: Tenor } | { readonly end: CivilDate }, c: SwapDateConventions, base: string, index: number): Result<SwapDates> {
  // The conventions layer's set for this swap: its calendar, no adjustment of the raw dates (the
  // rule is applied once, below), the end-of-month rule as asked, no spot lag (counted here).
  const set: ConventionSet = { name: `swap on ${c.calendar}`, calendar: c.calendar, businessDay: 'unadjusted', endOfMonth: c.eom, spotLagDays: 0, ...(c.calendars ? { calendars: c.calendars } : {}) };
  const settlementSerial = serialFromCivil(settlement);
  const checked = quoteCalendar(set, settlementSerial, base, index);
  if (!checked.ok) return checked;
  const calendar = checked.value;
  const startSerial = adjustSerial(addBusinessDays(settlementSerial, c.spotLag, calendar), c.businessDay, calendar);
  const start = civilFromSerial(startSerial);
  const unadjustedEnd = 'tenor' in when ? marketDateCivil(start, when.tenor, set) : when.end;
  if (compareCivil(unadjustedEnd, start) <= 0) {
    return fail(coreError('before-settlement', `${base}.maturity`, `${base}.maturity: ${isoFromCivil(unadjustedEnd)} is not after the swap's start ${isoFromCivil(start)} (settlement plus ${c.spotLag} business days); give a later maturity`, index));
  }
  const endOutside = outsideCalendar(calendar, serialFromCivil(unadjustedEnd));
  if (endOutside !== null) return fail(coreError('range', `${base}.calendar`, `${base}.calendar: the swap's end ${endOutside}`, index));
  // Unadjusted period ends, latest first, counted back from the unadjusted end.
  const raw: CivilDate[] = [unadjustedEnd];
  if (compareCivil(unadjustedEnd, marketDateCivil(start, ONE_YEAR, set)) > 0) {
    const period = PERIODS[c.frequency] ?? { n: 12 / c.frequency, unit: 'M' };
    for (let k = 1; ; k++) {
      const d = marketDateCivil(unadjustedEnd, period, set, -k);
      if (compareCivil(d, start) <= 0) break;
      raw.push(d);
    }
  }
  raw.reverse();
  const starts: CivilDate[] = [];
  const ends: CivilDate[] = [];
  const payments: CivilDate[] = [];
  const unadjustedEnds: CivilDate[] = [];
  let from = start;
  for (const d of raw) {
    const endSerial = adjustSerial(serialFromCivil(d), c.businessDay, calendar);
    // Two raw dates adjusted onto one day (a stub of a day or two) make one period, not an empty one.
    if (endSerial <= serialFromCivil(from)) continue;
    const end = civilFromSerial(endSerial);
    starts.push(from);
    ends.push(end);
    unadjustedEnds.push(d);
    payments.push(civilFromSerial(addBusinessDays(endSerial, c.paymentLag, calendar)));
    from = end;
  }
  if (ends.length === 0) {
    return fail(coreError('before-settlement', `${base}.maturity`, `${base}.maturity: ${isoFromCivil(unadjustedEnd)} adjusts onto the swap's start ${isoFromCivil(start)}; give a later maturity`, index));
  }
  return ok({ starts, ends, payments, unadjustedEnd, unadjustedEnds });
}

/** ISO text of a swap's dates (schedules shown to the user, tests). */
export const isoDates = (ds: readonly CivilDate[]): IsoDate[] => ds.map(isoFromCivil);
