import type { DatedSwapQuote, DatedSwapTerms, OisQuote } from '../document/types.ts';
import type { CalendarContext } from '../time/calendars.ts';
import type { IsoDate } from '../time/date.ts';
import type { CoreError } from '../result.ts';
import type { RawQuote } from './fields.ts';
import { DISCOUNTING_AND_PROJECTING, type Instrument } from '../instruments/instrument.ts';
import { compileOis, oisDates } from '../instruments/ois.ts';
import { coreError, ok } from '../result.ts';
import { BUSINESS_DAY_RULES } from '../time/calendars.ts';
import { civilFromIso, isoFromCivil } from '../time/date.ts';
import type { DayCount } from '../time/dayCount.ts';
import { parseTenor } from '../time/tenor.ts';
import { swapDates } from '../time/swapSchedule.ts';
import { MAX_LAG, readChoice, readDayCount, readEom, readFrequency, readRate, readWhole, required, readCalendar, RATE_TEXT } from './fields.ts';
import { compoundingOfFrequency, flatDollarDuration, flatDollarDurationOf, quotedRateOrDefault } from './shared.ts';
import { couponTag } from '../format/conventionTag.ts';
import type { QuoteDates, QuoteKindModule } from './types.ts';

/** The overnight rate's day bases: D = 360 (SOFR, €STR) or 365 (SONIA) (MARKET-CONVENTIONS.md section d). */
const FLOAT_DAY_COUNTS: readonly DayCount[] = ['ACT/360', 'ACT/365F'];

/**
 * Overnight-index swap on one curve (instruments/ois.ts): fixed rate (decimal) against the
 * compounded overnight rate. Fields and defaults: `frequency` 1, `dayCount` ACT/360 (fixed leg),
 * `floatDayCount` ACT/360, `calendar` `weekends`, `spotLag` 0, `businessDay` modified-following,
 * `eom` false, `paymentLag` 0 (MARKET-CONVENTIONS.md section d gives SOFR's T+2 and a 2-day
 * payment lag on US government securities days; the defaults here are the plain ones, so a quote
 * typed in the sheet without these fields is today's swap on an ACT/360 fixed leg with
 * modified-following dates). The quote's maturity is the swap's adjusted end; the instrument's
 * pillar its last payment date.
 */
export const OIS: QuoteKindModule<OisQuote> = {
  kind: 'ois',
  turnSpread: true,
  schema: {
    fields: ['rate', 'frequency', 'dayCount', 'floatDayCount', 'calendar', 'spotLag', 'businessDay', 'eom', 'paymentLag'],
    defaults: { frequency: 1, dayCount: 'ACT/360' },
    read(raw, base, index, maturity, _m, tenor, enabled, errors, settlement, calendars) {
      const rate = required(readRate(raw, base, index, errors, 'rate'), 'rate', RATE_TEXT, base, index, errors);
      const frequency = readFrequency(raw, 1, base, index, errors);
      let dayCount = readDayCount(raw, base, index, errors, 'dayCount', 'ACT/360');
      if (dayCount === 'ACT/ACT-ICMA') {
        errors.push(coreError('unknown-identifier', `${base}.dayCount`, `${base}.dayCount: ACT/ACT-ICMA is a bond's coupon-period count, not an OIS fixed leg's; use ACT/360 or ACT/365F`, index));
        dayCount = null;
      }
      const floatDayCount = readChoice(raw, base, index, errors, 'floatDayCount', FLOAT_DAY_COUNTS, 'ACT/360');
      const eom = readEom(raw, base, index, errors, false);
      const dated = readDatedSwapTerms(raw, base, index, errors, frequency, eom, settlement, maturity, tenor, calendars);
      if (rate === null || frequency === null || !dayCount || !floatDayCount || eom === null || dated === null) return null;
      return { kind: 'ois', index, maturity: dated.maturity, tenor, enabled, rate, frequency, dayCount, floatDayCount, eom, ...dated.terms };
    },
  },
  sheet: { rateField: 'rate', rateWhat: 'OIS rate', priceField: null, missingValue: 'rate', coupon: false, frequency: true, dayCount: 'yes' },
  paste: { kindWords: ['oiss', 'overnight index swap', 'overnight-index swap'], headerWords: { oisrate: 'rate' } },
  compile: (q, _settlement, s, _m, _t, time) => compileOis(q, s, time),
  curves: DISCOUNTING_AND_PROJECTING,
  nodeRole: 'discount',
  convention: (q) => ({ unit: 'rate', compounding: compoundingOfFrequency(q.frequency), dayCount: q.dayCount }),
  yieldLabel: (q) => `OIS rate (${couponTag(q.frequency, q.dayCount)})`,
  priceYield: () => null,
  shift: (q, d) => ok({ ...q, rate: q.rate + d }),
  fit: { per100: 100, dollarDuration: oisDollarDuration, richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
  fixedLeg: (q) => ({ frequency: q.frequency, dayCount: q.dayCount, eom: q.eom }),
  dates: oisQuoteDates,
};

/**
 * The fit's dollar duration of an OIS: that of its fixed leg plus 1 of notional at the last payment
 * against par (the swap kind's measure, flatDollarDuration). With a payment lag or a forward start
 * the instrument's own flows are the fixed coupons alone (the floating leg is its target on the
 * curve), so the notional is added here.
 */
export function oisDollarDuration(ins: Instrument): number {
  if (ins.targetFromFlows === undefined) return flatDollarDuration(ins);
  const amounts = Array.from(ins.amounts);
  amounts[amounts.length - 1] = amounts[amounts.length - 1]! + 1;
  return flatDollarDurationOf(ins.times, amounts, 1);
}

/** The swap's start (spot), adjusted end and last payment date (the pillar), as its reader made them. */
export function oisQuoteDates(q: DatedSwapQuote, valuation: string): QuoteDates {
  const r = oisDates(q, civilFromIso(valuation));
  if (!r.ok) return { start: valuation, end: q.maturity, payment: q.maturity }; // cannot happen: the reader made the same dates
  const { starts, payments } = r.value;
  return { start: isoFromCivil(starts[0]!), end: q.maturity, payment: isoFromCivil(payments[payments.length - 1]!) };
}

/**
 * A swap's date conventions and the dates they make (an OIS's, or a `swap` on a calendar):
 * `calendar` (default `weekends`), `spotLag` (business days, default 0), `businessDay` (default
 * modified-following), `paymentLag` (business days, default 0), with the swap's schedule checked
 * now so every error names the quote (an unknown calendar lists the valid ones; dates within the
 * calendar's years; an end after the start). The maturity is the adjusted end. Null when a field
 * is wrong (its error pushed) or the frequency or eom flag did not read.
 */
export function readDatedSwapTerms(raw: RawQuote, base: string, index: number, errors: CoreError[], frequency: number | null, eom: boolean | null, settlement: IsoDate | undefined, maturity: IsoDate | null, tenor: string | null, calendars: CalendarContext | undefined): { terms: DatedSwapTerms; maturity: IsoDate } | null {
  const calendar = readCalendar(raw, base, index, errors);
  const spotLag = readWhole(raw, base, index, errors, 'spotLag', 0, MAX_LAG, 'business days', 0);
  const businessDay = readChoice(raw, base, index, errors, 'businessDay', BUSINESS_DAY_RULES, 'modified-following');
  const paymentLag = readWhole(raw, base, index, errors, 'paymentLag', 0, MAX_LAG, 'business days', 0);
  if (frequency === null || eom === null || calendar === null || spotLag === null || !businessDay || paymentLag === null) return null;
  if (maturity === null) return null; // the common reader has said why
  if (settlement === undefined) {
    // A programming error (validateWorkspace always passes it), reported rather than dropping the quote.
    errors.push(coreError('schema', base, `${base}: a swap's dates count from the settlement date, which its reader was not given`, index));
    return null;
  }
  const parsedTenor = tenor === null ? null : parseTenor(tenor);
  const conventions = { calendar, businessDay, eom, spotLag, paymentLag, frequency, ...(calendars ? { calendars } : {}) };
  const dates = swapDates(civilFromIso(settlement), parsedTenor === null ? { end: civilFromIso(maturity) } : { tenor: parsedTenor }, conventions, base, index);
  if (!dates.ok) {
    errors.push(...dates.errors);
    return null;
  }
  const { ends, unadjustedEnd } = dates.value;
  return {
    terms: { calendar, spotLag, businessDay, paymentLag, unadjustedEnd: isoFromCivil(unadjustedEnd), ...(calendars ? { calendars } : {}) },
    maturity: isoFromCivil(ends[ends.length - 1]!),
  };
}
