import type { DepositQuote } from '../document/types.ts';
import { compileDeposit } from '../instruments/deposit.ts';
import { DISCOUNTING } from '../instruments/instrument.ts';
import { ok } from '../result.ts';
import { MAX_LAG, noCouponPeriod, readCalendar, readChoice, readDayCount, readEom, readRate, readWhole, required, RATE_TEXT } from './fields.ts';
import { coreError } from '../result.ts';
import { BUSINESS_DAY_RULES, type BusinessDayRule } from '../time/calendars.ts';
import { civilFromIso, isoFromCivil } from '../time/date.ts';
import { depositDates, moneyMarketTerm } from '../time/depositDates.ts';
import { parseTenor } from '../time/tenor.ts';
import { flatDollarDuration, flatDollarDurationOf, quotedRateOrDefault } from './shared.ts';
import type { Instrument } from '../instruments/instrument.ts';
import type { QuoteKindModule } from './types.ts';
import { rateTag } from '../format/conventionTag.ts';
import { conventionSet } from './conventionSets.ts';

/**
 * Money-market deposit from its start S to maturity E at a simple rate r (decimal) on its day
 * count, default ACT/360: DF(S) / DF(E) = 1 + r tau(S, E) (instruments/deposit.ts). Quoted by rate
 * only. Tenors ON, TN, SN (time/depositDates.ts) and the optional fields `calendar` (default
 * `weekends`), `spotLag` (business days, default 0), `businessDay` (an ordinary tenor's end,
 * default modified-following) and `eom` (the end-of-month rule for that end, default off), the
 * last two only with a calendar or a spot lag. A deposit on a term index (a EURIBOR 3M deposit) is
 * this kind with its index's conventions (kinds/conventionSets.ts `eur-euribor-3m`). Without any of these a deposit
 * runs from settlement to its maturity, unadjusted, exactly as before they existed.
 */
export const DEPOSIT: QuoteKindModule<DepositQuote> = {
  kind: 'deposit',
  schema: {
    fields: ['rate', 'dayCount', 'calendar', 'spotLag', 'businessDay', 'eom'],
    defaults: { dayCount: 'ACT/360' },
    read(raw, base, index, maturity, m, tenor, enabled, errors, settlement, calendars) {
      const rate = required(readRate(raw, base, index, errors, 'rate'), 'rate', RATE_TEXT, base, index, errors);
      const dayCount = noCouponPeriod(readDayCount(raw, base, index, errors, 'dayCount', 'ACT/360'), 'deposit', base, index, errors);
      const term = tenor === null ? null : moneyMarketTerm(tenor);
      const hasConventions = raw.calendar !== undefined || raw.spotLag !== undefined;
      if (term === null && !hasConventions) {
        for (const field of ['businessDay', 'eom'] as const) {
          if (raw[field] === undefined) continue;
          errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: a deposit's end is moved by ${field === 'eom' ? 'the end-of-month rule' : 'a business-day rule'} only on a calendar; give calendar (such as "weekends") or spotLag with it, or remove ${field}`, index));
          return null;
        }
        // Today's deposit: from settlement to the maturity, unadjusted.
        return rate !== null && dayCount ? { kind: 'deposit', index, maturity: m, tenor, enabled, rate, dayCount, start: settlement ?? m, calendar: null, spotLag: null, businessDay: null } : null;
      }
      const calendar = readCalendar(raw, base, index, errors);
      const spotLag = readWhole(raw, base, index, errors, 'spotLag', 0, MAX_LAG, 'business days', 0);
      let businessDay: BusinessDayRule | null = null;
      let eom: boolean | null | undefined;
      if (term !== null) {
        // A term index's set (eur-euribor-3m) fills businessDay and eom on every deposit it is named
        // on; ON, TN and SN take the set's values without effect (a value of the quote's own is refused).
        const set = typeof raw.conventions === 'string' ? conventionSet(raw.conventions)?.fields.deposit : undefined;
        for (const field of ['businessDay', 'eom'] as const) {
          if (raw[field] === undefined || raw[field] === set?.[field]) continue;
          errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: ${tenor} counts business days on the calendar, so no ${field === 'eom' ? 'end-of-month rule' : 'business-day rule'} applies; remove ${field}`, index));
          return null;
        }
      } else {
        businessDay = readChoice(raw, base, index, errors, 'businessDay', BUSINESS_DAY_RULES, 'modified-following');
        eom = raw.eom === undefined ? undefined : readEom(raw, base, index, errors, false);
        if (businessDay === null || eom === null) return null;
      }
      if (rate === null || !dayCount || calendar === null || spotLag === null || maturity === null) return null;
      if (settlement === undefined) {
        // A programming error (validateWorkspace always passes it), reported rather than dropping the quote.
        errors.push(coreError('schema', base, `${base}: a deposit's dates count from the settlement date, which its reader was not given`, index));
        return null;
      }
      const parsed = tenor === null || term !== null ? null : parseTenor(tenor);
      const when = term !== null ? { term } : parsed !== null ? { tenor: parsed } : { end: civilFromIso(maturity) };
      const dates = depositDates(civilFromIso(settlement), when, { calendar, spotLag, businessDay: businessDay ?? 'following', ...(eom ? { eom } : {}), ...(calendars ? { calendars } : {}) }, base, index);
      if (!dates.ok) {
        errors.push(...dates.errors);
        return null;
      }
      return {
        kind: 'deposit', index, maturity: isoFromCivil(dates.value.end), tenor, enabled, rate, dayCount,
        start: isoFromCivil(dates.value.start), calendar, spotLag, businessDay, ...(eom !== undefined && eom !== null ? { eom } : {}), ...(calendars ? { calendars } : {}),
        ...(dates.value.unadjustedEnd ? { unadjustedEnd: isoFromCivil(dates.value.unadjustedEnd) } : {}),
      };
    },
  },
  sheet: { rateField: 'rate', rateWhat: 'deposit rate', priceField: null, missingValue: 'rate', coupon: false, frequency: false, dayCount: 'yes' },
  paste: { kindWords: ['depo', 'deposits'], headerWords: {} },
  compile: (q, settlement, _s, _m, t, time) => compileDeposit(q, settlement, t, time),
  moneyMarketTerms: true,
  turnSpread: true,
  curves: DISCOUNTING,
  nodeRole: 'discount',
  onProjection: () => 'ratio',
  convention: (q) => ({ unit: 'rate', compounding: 'simple', dayCount: q.dayCount }),
  yieldLabel: (q) => `deposit rate (${rateTag('simple', q.dayCount)})`,
  priceYield: () => null,
  shift: (q, d) => ok({ ...q, rate: q.rate + d }),
  fit: { per100: 100, dollarDuration: depositDollarDuration, richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
  dates: (q) => ({ start: q.start, end: q.maturity, payment: null }),
};

/**
 * The fit's dollar duration of a deposit: of its one flow against 1 (flatDollarDuration), or for a
 * deposit starting after settlement, of -1 at its start and 1 + r tau at its end against 0 (about
 * tau DF(S): its own flows stand for only the end, the start being its target on the curve).
 */
function depositDollarDuration(ins: Instrument): number {
  if (ins.targetFromFlows === undefined) return flatDollarDuration(ins);
  return flatDollarDurationOf(ins.times, [-1, ins.amounts[1]!], 0);
}
