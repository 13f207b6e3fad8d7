/**
 * Compounding an overnight rate (SOFR, €STR, SONIA) over a period, as the published compounded
 * averages and overnight-index swaps do:
 *
 *   factor = prod_i (1 + r_i * n_i / B),   rate = (factor - 1) * B / N
 *
 * over the calendar days of [start, end): `r_i` is the fixing of business day i (a decimal per
 * year), `n_i` the calendar days from it to the next business day (or to `end`), `B` the rate's
 * day basis (360 for SOFR and €STR, 365 for SONIA), N = end - start in days. A start that is not
 * a business day takes the fixing of the business day before it for the days up to the next
 * business day (the Federal Reserve Bank of New York's SOFR Averages methodology; common practice
 * for overnight-index swaps without lookback). Float64 throughout: about 20 to 200 factors.
 */
import { coreError, fail, ok, type Result } from '../result.ts';
import { isoFromSerial } from '../time/date.ts';
import type { BusinessCalendar } from '../time/calendars.ts';

/** Fixings of one overnight rate by day serial (decimal per year). */
export type OvernightFixings = ReadonlyMap<number, number>;

export interface CompoundedOvernight {
  /** prod (1 + r_i n_i / B): the growth of 1 over the period. */
  readonly factor: number;
  /** The compounded rate, simple on the basis: (factor - 1) B / N. */
  readonly rate: number;
  /** Business days whose fixing was used (the one before a non-business start included). */
  readonly fixingsUsed: number;
}

/**
 * The compounded overnight rate over [start, end) (day serials, end after start) on a business-day
 * calendar. An error names the first business day without a fixing.
 */
export function compoundOvernight(fixings: OvernightFixings, start: number, end: number, calendar: BusinessCalendar, basis = 360): Result<CompoundedOvernight> {
  if (!(end > start)) return fail(coreError('range', '', `the period's end ${isoFromSerial(end)} must be after its start ${isoFromSerial(start)}`));
  let factor = 1;
  let used = 0;
  let day = start;
  let fixingDay = start;
  while (!calendar.isBusinessDay(fixingDay)) fixingDay--;
  while (day < end) {
    let next = day + 1;
    while (next < end && !calendar.isBusinessDay(next)) next++;
    const r = fixings.get(fixingDay);
    if (r === undefined) return fail(coreError('range', '', `there is no fixing for ${isoFromSerial(fixingDay)}, a business day on ${calendar.id}; add it or check the calendar`));
    factor *= 1 + (r * (next - day)) / basis;
    used++;
    day = next;
    fixingDay = next;
  }
  return ok({ factor, rate: ((factor - 1) * basis) / (end - start), fixingsUsed: used });
}
