import { coreError, fail, ok, type Result } from '../result.ts';
import { addBusinessDays, outsideCalendar, type BusinessDayRule, type CalendarContext } from './calendars.ts';
import { civilFromSerial, compareCivil, isoFromCivil, serialFromCivil, type CivilDate } from './date.ts';
import { marketDateCivil, quoteCalendar, type ConventionSet } from './dateConventions.ts';
import type { Tenor } from './tenor.ts';

/**
 * The money-market terms counted in business days (MARKET-CONVENTIONS.md section c, from the
 * glossary definitions cited there): overnight (ON) from the trade date to the next business day,
 * tom-next (TN) from the next business day to the one after, spot-next (SN) from spot to the next
 * business day after spot. Here the trade date is the document's settlement date (the curve's
 * t = 0, DF = 1).
 */
export const MONEY_MARKET_TERMS = { ON: 'overnight', TN: 'tom-next', SN: 'spot-next' } as const;
export type MoneyMarketTerm = keyof typeof MONEY_MARKET_TERMS;

/** `ON`, `TN` or `SN` typed exactly, in any case, with or without a slash (`O/N`, `t/n`); null otherwise. */
export function moneyMarketTerm(text: string): MoneyMarketTerm | null {
  const m = /^([OTS])\/?N$/i.exec(text);
  return m ? ((m[1]!.toUpperCase() + 'N') as MoneyMarketTerm) : null;
}

/** A deposit's date conventions: its calendar (built-in ids joined with `+`), spot lag in business days, and the rule for a tenor's end. */
export interface DepositDateConventions {
  readonly calendar: string;
  readonly spotLag: number;
  /** The business-day rule for the end of an ordinary tenor (not used by ON, TN, SN). */
  readonly businessDay: BusinessDayRule;
  /** The end-of-month rule for an ordinary month or year tenor (absent: off): a spot on its month's last business day ends on a last business day. */
  readonly eom?: boolean;
  /** The workspace's own calendars and edits (none: the built-ins as published). */
  readonly calendars?: CalendarContext;
}

/** A deposit's start and end; for a tenor, also its end before the business-day rule. */
export interface DepositDates {
  readonly start: CivilDate;
  readonly end: CivilDate;
  readonly unadjustedEnd?: CivilDate;
}

/**
 * A deposit's start and end from `settlement` under its conventions:
 *   ON: settlement to the next business day after it;
 *   TN: the next business day to the one after (settlement + 1 to + 2 business days);
 *   SN: spot (settlement + spot lag business days) to the next business day after spot;
 *   a tenor: spot to spot + tenor, moved by the business-day rule (the conventions layer's
 *     `marketDateCivil` with the calendar and spot lag); a date: spot to the date as given.
 * Business days are counted from the day itself (addBusinessDays), so a settlement on a closed
 * day still has its overnight deposit end on the next business day. Errors name `base` and the
 * field at fault: an unknown calendar (listing the valid ones), a date outside the calendar's
 * years, an end not after the start.
 */
export function depositDates(
  settlement: CivilDate,
  when: { readonly term: MoneyMarketTerm } | { readonly tenor: Tenor } | { readonly end: CivilDate },
  c: DepositDateConventions,
  base: string,
  index: number,
): Result<DepositDates> {
  const set: ConventionSet = { name: `deposit on ${c.calendar}`, calendar: c.calendar, businessDay: c.businessDay, endOfMonth: c.eom === true, spotLagDays: c.spotLag, ...(c.calendars ? { calendars: c.calendars } : {}) };
  const s = serialFromCivil(settlement);
  const checked = quoteCalendar(set, s, base, index);
  if (!checked.ok) return checked;
  const calendar = checked.value;
  let start: number;
  let end: number;
  let unadjustedEnd: CivilDate | undefined;
  if ('term' in when) {
    if (when.term === 'ON') [start, end] = [s, addBusinessDays(s, 1, calendar)];
    else if (when.term === 'TN') [start, end] = [addBusinessDays(s, 1, calendar), addBusinessDays(s, 2, calendar)];
    else {
      start = addBusinessDays(s, c.spotLag, calendar);
      end = addBusinessDays(start, 1, calendar);
    }
  } else {
    start = addBusinessDays(s, c.spotLag, calendar);
    end = 'tenor' in when ? serialFromCivil(marketDateCivil(settlement, when.tenor, set)) : serialFromCivil(when.end);
    if ('tenor' in when) unadjustedEnd = marketDateCivil(settlement, when.tenor, { ...set, businessDay: 'unadjusted' });
  }
  const startDate = civilFromSerial(start);
  const endDate = civilFromSerial(end);
  if (compareCivil(endDate, startDate) <= 0) {
    return fail(coreError('before-settlement', `${base}.maturity`, `${base}.maturity: ${isoFromCivil(endDate)} is not after the deposit's start ${isoFromCivil(startDate)} (settlement plus ${c.spotLag} business days); give a later maturity`, index));
  }
  const endOutside = outsideCalendar(calendar, end);
  if (endOutside !== null) return fail(coreError('range', `${base}.calendar`, `${base}.calendar: the deposit's end ${endOutside}`, index));
  return ok({ start: startDate, end: endDate, ...(unadjustedEnd ? { unadjustedEnd } : {}) });
}
