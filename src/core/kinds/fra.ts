import type { FraQuote } from '../document/types.ts';
import { compileFra } from '../instruments/fra.ts';
import { DISCOUNTING_AND_PROJECTING } from '../instruments/instrument.ts';
import { coreError, ok, type CoreError } from '../result.ts';
import { addBusinessDays, BUSINESS_DAY_RULES, outsideCalendar, type CalendarContext } from '../time/calendars.ts';
import { civilFromIso, isoFromCivil, isoFromSerial, serialFromCivil, serialFromIso, type IsoDate } from '../time/date.ts';
import { marketDateCivil, quoteCalendar, type ConventionSet } from '../time/dateConventions.ts';
import { parseTenor, tenorMonths } from '../time/tenor.ts';
import { rateTag } from '../format/conventionTag.ts';
import { MAX_LAG, noCouponPeriod, readCalendar, readChoice, readDayCount, readEom, readRate, readWhole, required, typeName, RATE_TEXT, type RawQuote } from './fields.ts';
import { flatDollarDurationOf, quotedRateOrDefault } from './shared.ts';
import type { QuoteKindModule } from './types.ts';
import { CONVENTION_SETS, conventionSet } from './conventionSets.ts';

/** The longest FRA end, in months from spot. */
export const FRA_MAX_MONTHS = 120;
/** Business days from the index's fixing to the FRA's start (MARKET-CONVENTIONS.md f: two TARGET days for EURIBOR). */
export const FRA_FIXING_LAG = 2;

const PERIOD_WHAT = 'start x end in whole months from spot, such as "3x6" (from 3 to 6 months after spot, on the 3-month index)';

/** `AxB` (also `AXB`, `A×B`, spaces around the sign) as its two month counts; null when the text is not of that form. */
export function parseFraPeriod(text: string): { readonly a: number; readonly b: number } | null {
  const m = /^\s*(\d{1,3})\s*[xX×]\s*(\d{1,3})\s*$/.exec(text);
  return m === null ? null : { a: Number(m[1]), b: Number(m[2]) };
}

/**
 * A forward rate agreement on a term index, quoted by its rate (simple on the index's day count),
 * dated by its period `AxB` in months from spot (`ownDates`: no tenor or maturity). Dates as
 * QuantLib's FraRateHelper makes them since its PR#1600 (MARKET-CONVENTIONS.md f): start = spot +
 * A months, end = start + the index tenor, both by the business-day rule with the end-of-month
 * rule; the fixing two business days before the start. On one curve it fixes DF(S)/DF(E)
 * (instruments/fra.ts); it names the projection curve of its index as its node's curve, which is
 * today's one curve.
 */
export const FRA: QuoteKindModule<FraQuote> = {
  kind: 'fra',
  ownDates: true,
  turnSpread: true,
  schema: {
    fields: ['rate', 'period', 'index', 'dayCount', 'calendar', 'spotLag', 'businessDay', 'eom'],
    defaults: { dayCount: 'ACT/360' },
    read: readFra,
  },
  sheet: {
    rateField: 'rate',
    rateWhat: 'FRA rate',
    priceField: null,
    missingValue: 'rate',
    coupon: false,
    frequency: false,
    dayCount: 'yes',
    /** The Maturity cell holds the period, `3x6` (also `3X6`, `3×6`). */
    maturityCell: {
      read(text) {
        const p = parseFraPeriod(text);
        if (p === null) return { ok: false, message: 'an FRA is dated by its period: type start x end in months from spot, such as 3x6 (3 to 6 months on the 3-month index); not a tenor or a date' };
        return { ok: true, fields: { period: `${p.a}x${p.b}` } };
      },
      write: (raw) => (typeof raw.period === 'string' ? raw.period : ''),
    },
  },
  paste: { kindWords: ['fras', 'forward rate agreement', 'forward rate agreements'], headerWords: { frarate: 'rate' } },
  compile: (q, _settlement, _s, _m, t, time) => compileFra(q, t, time),
  curves: DISCOUNTING_AND_PROJECTING,
  nodeRole: 'projection',
  onProjection: () => 'ratio',
  convention: (q) => ({ unit: 'rate', compounding: 'simple', dayCount: q.dayCount }),
  yieldLabel: (q) => `FRA rate (${rateTag('simple', q.dayCount)})`,
  priceYield: () => null,
  shift: (q, d) => ok({ ...q, rate: q.rate + d }),
  /** The forward deposit's: -1 at S and 1 + F tau at E against 0, about tau DF(E). */
  fit: { per100: 100, dollarDuration: (ins) => flatDollarDurationOf(ins.times, [-1, ins.amounts[1]!], 0), richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
  dates: (q) => ({ start: q.start, end: q.end, payment: null, fixing: q.fixing }),
};

function readFra(raw: RawQuote, base: string, index: number, _maturity: IsoDate | null, _m: IsoDate, _tenor: string | null, enabled: boolean, errors: CoreError[], settlement?: IsoDate, calendars?: CalendarContext): FraQuote | null {
  const before = errors.length;
  const rate = required(readRate(raw, base, index, errors, 'rate'), 'rate', `${RATE_TEXT} (the FRA rate as a decimal, 0.031 = 3.1%)`, base, index, errors);
  const dayCount = noCouponPeriod(readDayCount(raw, base, index, errors, 'dayCount', 'ACT/360'), 'FRA', base, index, errors);
  const calendar = readCalendar(raw, base, index, errors);
  const spotLag = readWhole(raw, base, index, errors, 'spotLag', 0, MAX_LAG, 'business days', 0);
  const businessDay = readChoice(raw, base, index, errors, 'businessDay', BUSINESS_DAY_RULES, 'modified-following');
  const eom = readEom(raw, base, index, errors, false);
  if (raw.tenor !== undefined || raw.maturity !== undefined) {
    const field = raw.tenor !== undefined ? 'tenor' : 'maturity';
    errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: an FRA is dated by its period; remove ${field} and give period as ${PERIOD_WHAT}`, index));
  }
  // The period, A x B months from spot.
  let period: { a: number; b: number } | null = null;
  const p = typeof raw.period === 'string' ? parseFraPeriod(raw.period) : null;
  if (raw.period === undefined) errors.push(coreError('schema', `${base}.period`, `${base}.period: required, ${PERIOD_WHAT}`, index));
  else if (p === null) errors.push(coreError('schema', `${base}.period`, `${base}.period: must be ${PERIOD_WHAT}, not ${typeName(raw.period)}`, index));
  else if (p.b <= p.a || p.b > FRA_MAX_MONTHS) {
    const why = p.b <= p.a ? `its end month ${p.b} must be after its start month ${p.a}` : `its end month ${p.b} is beyond ${FRA_MAX_MONTHS}`;
    errors.push(coreError('range', `${base}.period`, `${base}.period: FRA ${raw.period as string}: ${why}; give ${PERIOD_WHAT}, the end at most ${FRA_MAX_MONTHS} months`, index));
  } else period = p;
  // The index tenor: B - A months, or given and then equal to it.
  let indexMonths: number | null = period === null ? null : period.b - period.a;
  if (raw.index !== undefined) {
    const t = typeof raw.index === 'string' ? parseTenor(raw.index) : null;
    const months = t === null ? null : tenorMonths(t);
    if (months === null) {
      errors.push(coreError('schema', `${base}.index`, `${base}.index: must be the index tenor in months or years, such as "3M" or "6M", not ${typeName(raw.index)}`, index));
      indexMonths = null;
    } else if (period !== null && months !== indexMonths) {
      // The index may come from the quote's convention set (eur-euribor-3m): then say so, and which sets fit.
      const set = typeof raw.conventions === 'string' && conventionSet(raw.conventions)?.fields.fra?.index === raw.index ? raw.conventions : null;
      const fits = set === null ? '' : `, or conventions ${CONVENTION_SETS.filter((c) => c.fields.fra?.index === `${indexMonths}M`).map((c) => c.id).join(' or ') || 'none'} (the set ${set} gives index ${raw.index as string})`;
      errors.push(coreError('range', `${base}.index`, `${base}.index: the index ${raw.index as string} (${months} months) disagrees with the period ${period.a}x${period.b}, which spans ${indexMonths} months; give index ${indexMonths}M, or the period ${period.a}x${period.a + months}${fits}`, index));
      indexMonths = null;
    }
  }
  if (errors.length > before || rate === null || !dayCount || calendar === null || spotLag === null || !businessDay || eom === null || period === null || indexMonths === null) return null;
  if (settlement === undefined) {
    errors.push(coreError('schema', base, `${base}: an FRA's dates count from the valuation date, which its reader was not given`, index));
    return null;
  }
  const name = `FRA ${period.a}x${period.b}`;
  const set: ConventionSet = { name: `FRA on ${calendar}`, calendar, businessDay, endOfMonth: eom, spotLagDays: spotLag, ...(calendars ? { calendars } : {}) };
  const v = serialFromIso(settlement);
  const checked = quoteCalendar(set, v, base, index);
  if (!checked.ok) {
    errors.push(...checked.errors);
    return null;
  }
  // Every date made lies within about B + 1 months of spot: the calendar must cover them.
  const outside = outsideCalendar(checked.value, v + 31 * (period.b + 1) + 2 * MAX_LAG);
  if (outside !== null) {
    errors.push(coreError('range', `${base}.period`, `${base}.period (${name}): its dates ${outside}`, index));
    return null;
  }
  const valuation = civilFromIso(settlement);
  const spot = addBusinessDays(v, spotLag, checked.value);
  const toStart = { n: period.a, unit: 'M' } as const;
  const tenor = { n: indexMonths, unit: 'M' } as const;
  const start = marketDateCivil(valuation, toStart, set);
  const unadjusted: ConventionSet = { ...set, businessDay: 'unadjusted' };
  const fromStart: ConventionSet = { ...set, spotLagDays: 0 };
  const end = marketDateCivil(start, tenor, fromStart);
  const fixing = addBusinessDays(serialFromCivil(start), -FRA_FIXING_LAG, checked.value);
  if (fixing < v) {
    errors.push(coreError('range', `${base}.period`, `${base}.period (${name}): its index fixes on ${isoFromSerial(fixing)}, ${FRA_FIXING_LAG} business days before its start ${isoFromCivil(start)}, which is before the valuation date ${settlement}, so its rate is no longer a quote; give a later start month, or spotLag ${FRA_FIXING_LAG}`, index));
    return null;
  }
  return {
    kind: 'fra', index, maturity: isoFromCivil(end), tenor: null, enabled, rate, period: `${period.a}x${period.b}`, startMonths: period.a, endMonths: period.b,
    indexTenor: `${indexMonths}M`, dayCount, calendar, spotLag, businessDay, eom,
    spot: isoFromSerial(spot), start: isoFromCivil(start), end: isoFromCivil(end), fixing: isoFromSerial(fixing),
    unadjustedStart: isoFromCivil(marketDateCivil(valuation, toStart, unadjusted)), unadjustedEnd: isoFromCivil(marketDateCivil(start, tenor, { ...fromStart, businessDay: 'unadjusted' })),
    ...(calendars ? { calendars } : {}),
  };
}
