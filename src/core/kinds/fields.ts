import { coreError, type CoreError } from '../result.ts';
import { DAY_COUNTS, isDayCount, type DayCount } from '../time/dayCount.ts';
import { addBusinessDays, BUILT_IN_CALENDARS, type CalendarContext } from '../time/calendars.ts';
import { quoteCalendar, type ConventionSet } from '../time/dateConventions.ts';
import { compareIso, isoFromSerial, serialFromIso, type IsoDate } from '../time/date.ts';

/**
 * The field readers every quote kind's schema is written with, and the ranges they check
 * (inclusive unless stated), decimals: rates -0.10..1.0; coupons 0..0.5; prices (0, 1000].
 * Each reader pushes a path-named error (`quotes[3].rate: ...`) that says what would be valid.
 *
 * Performance: module-level functions taking the quote's context as arguments, not closures made
 * per quote (the command-line runner's transform adds a name-setting call to every closure created).
 * `base` is the quote's path, `quotes[index]`.
 */
export const RATE_MIN = -0.1;
export const RATE_MAX = 1.0;
export const COUPON_MAX = 0.5;
export const PRICE_MAX = 1000;
export const FREQUENCIES = [1, 2, 4, 12] as const;

export const RATE_TEXT = `from ${RATE_MIN} to ${RATE_MAX}`;
export const PRICE_TEXT = `above 0 up to ${PRICE_MAX} (per 100 face)`;
export const COUPON_TEXT = `from 0 to ${COUPON_MAX}`;
/** Fields holding a decimal rate, whose values above 1 get the hint that rates are decimals. */
const RATE_FIELDS = ['rate', 'discountYield', 'yield', 'coupon'];

/** A value named for a message: `null`, `an array`, `the text "..."` or its type. */
export const typeName = (v: unknown): string => (v === null ? 'null' : Array.isArray(v) ? 'an array' : typeof v === 'string' ? `the text "${String(v).slice(0, 40)}"` : typeof v);
export const listOf = (xs: readonly unknown[]): string => xs.map((x) => String(x)).join(', ');

/**
 * What a kind's schema reader is given besides the raw object: the quote's path and index, its
 * maturity (null when the maturity itself was wrong, `m` then the settlement as a stand-in), its
 * tenor as given and its `enabled` flag. The common fields were read already.
 */
export interface QuoteHead {
  readonly base: string;
  readonly index: number;
  readonly maturity: IsoDate | null;
  readonly m: IsoDate;
  readonly tenor: string | null;
  readonly enabled: boolean;
}

export type RawQuote = Readonly<Record<string, unknown>>;

export function readNumber(raw: RawQuote, base: string, index: number, errors: CoreError[], field: string, min: number, max: number, what: string, minExclusive = false): number | null | undefined {
  const v = raw[field];
  if (v === undefined) return undefined;
  if (typeof v !== 'number' || !Number.isFinite(v)) {
    errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: must be a number ${what}, not ${typeName(v)}`, index));
    return null;
  }
  if ((minExclusive ? v <= min : v < min) || v > max) {
    const hint = RATE_FIELDS.includes(field) && v > 1 ? '; rates are decimals: 0.05 = 5%' : '';
    errors.push(coreError('range', `${base}.${field}`, `${base}.${field}: must be a number ${what}, not ${v}${hint}`, index));
    return null;
  }
  return v;
}

/** A rate field from RATE_MIN to RATE_MAX (undefined when absent, null when wrong). */
export const readRate = (raw: RawQuote, base: string, index: number, errors: CoreError[], field: string): number | null | undefined =>
  readNumber(raw, base, index, errors, field, RATE_MIN, RATE_MAX, RATE_TEXT);

/** A price per 100 face in (0, PRICE_MAX] (undefined when absent, null when wrong). */
export const readPrice = (raw: RawQuote, base: string, index: number, errors: CoreError[], field: string): number | null | undefined =>
  readNumber(raw, base, index, errors, field, 0, PRICE_MAX, PRICE_TEXT, true);

export function readDayCount(raw: RawQuote, base: string, index: number, errors: CoreError[], field: string, fallback: DayCount): DayCount | null {
  const v = raw[field] ?? fallback;
  if (isDayCount(v)) return v;
  errors.push(coreError('unknown-identifier', `${base}.${field}`, `${base}.${field}: must be one of ${listOf(DAY_COUNTS)}, not ${typeName(v)}`, index));
  return null;
}

export function required<T>(v: T | null | undefined, field: string, what: string, base: string, index: number, errors: CoreError[]): T | null {
  if (v === undefined) errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: required, a number ${what}`, index));
  return v ?? null;
}

/** Exactly one of two fields (a price or a rate). */
export function oneOf(raw: RawQuote, kind: string, base: string, index: number, errors: CoreError[], a: string, b: string): void {
  if ((raw[a] === undefined) === (raw[b] === undefined)) {
    errors.push(coreError('schema', base, `${base}: a ${kind} takes exactly one of ${a} and ${b}`, index));
  }
}

export function readFrequency(raw: RawQuote, fallback: number, base: string, index: number, errors: CoreError[]): number | null {
  const v = raw.frequency;
  if (v === undefined) return fallback;
  if (typeof v === 'number' && (FREQUENCIES as readonly number[]).includes(v)) return v;
  errors.push(coreError(typeof v === 'number' ? 'range' : 'schema', `${base}.frequency`, `${base}.frequency: must be one of ${listOf(FREQUENCIES)} payments a year, not ${typeof v === 'number' ? String(v) : typeName(v)}`, index));
  return null;
}

export function readEom(raw: RawQuote, base: string, index: number, errors: CoreError[], fallback: boolean): boolean | null {
  if (raw.eom === undefined) return fallback;
  if (typeof raw.eom === 'boolean') return raw.eom;
  errors.push(coreError('schema', `${base}.eom`, `${base}.eom: must be true or false, not ${typeName(raw.eom)}`, index));
  return null;
}

/** ACT/ACT-ICMA needs a coupon period: refused for kinds that have none (deposits, zeros). */
export function noCouponPeriod(dc: DayCount | null, what: string, base: string, index: number, errors: CoreError[]): DayCount | null {
  if (dc !== 'ACT/ACT-ICMA') return dc;
  errors.push(coreError('unknown-identifier', `${base}.dayCount`, `${base}.dayCount: ACT/ACT-ICMA needs a coupon period, which a ${what} has not; use one of ${listOf(DAY_COUNTS.filter((d) => d !== 'ACT/ACT-ICMA'))}`, index));
  return null;
}

/**
 * A whole number field from `min` to `max` (business-day lags), `fallback` when absent; null with
 * a path-named error when wrong.
 */
export function readWhole(raw: RawQuote, base: string, index: number, errors: CoreError[], field: string, min: number, max: number, what: string, fallback: number): number | null {
  const v = raw[field];
  if (v === undefined) return fallback;
  if (typeof v === 'number' && Number.isInteger(v) && v >= min && v <= max) return v;
  errors.push(coreError(typeof v === 'number' ? 'range' : 'schema', `${base}.${field}`, `${base}.${field}: must be a whole number of ${what} from ${min} to ${max}, not ${typeof v === 'number' ? String(v) : typeName(v)}`, index));
  return null;
}

/** A text field that must be one of `choices`, `fallback` when absent; null with a path-named error listing them when wrong. */
export function readChoice<T extends string>(raw: RawQuote, base: string, index: number, errors: CoreError[], field: string, choices: readonly T[], fallback: T): T | null {
  const v = raw[field];
  if (v === undefined) return fallback;
  if (typeof v === 'string' && (choices as readonly string[]).includes(v)) return v as T;
  errors.push(coreError('unknown-identifier', `${base}.${field}`, `${base}.${field}: must be one of ${listOf(choices)}, not ${typeName(v)}`, index));
  return null;
}

/** The calendar id as text (`weekends` when absent); whether it names a calendar is checked with the dates. */
export function readCalendar(raw: RawQuote, base: string, index: number, errors: CoreError[]): string | null {
  const v = raw.calendar;
  if (v === undefined) return 'weekends';
  if (typeof v === 'string') return v;
  errors.push(coreError('schema', `${base}.calendar`, `${base}.calendar: must be a calendar name, one of ${BUILT_IN_CALENDARS.join(', ')} (joined with + if several), not ${typeName(v)}`, index));
  return null;
}

/** The longest spot, settlement or payment lag a quote takes, in business days. */
export const MAX_LAG = 30;

/** A trade's settlement at spot: the date, and the calendar and lag that made it. */
export interface SpotSettlement {
  readonly settle: IsoDate;
  readonly calendar: string;
  readonly spotLag: number;
}

/**
 * A quote's own settlement date when it gives `calendar` or `spotLag` (bonds and bills, which the
 * market settles T+1 or T+2): the valuation date plus `spotLag` business days (default 0) on
 * `calendar` (default `weekends`). Undefined when the quote gives neither (it settles on the
 * valuation date, as before); null with path-named errors when a field is wrong, the calendar
 * unknown, or the maturity not after the settlement.
 */
export function readSpotSettlement(raw: RawQuote, base: string, index: number, errors: CoreError[], valuation: IsoDate | undefined, maturity: IsoDate | null, calendars: CalendarContext | undefined): SpotSettlement | null | undefined {
  if (raw.calendar === undefined && raw.spotLag === undefined) return undefined;
  const calendar = readCalendar(raw, base, index, errors);
  const spotLag = readWhole(raw, base, index, errors, 'spotLag', 0, MAX_LAG, 'business days', 0);
  if (calendar === null || spotLag === null || valuation === undefined || maturity === null) return null;
  const set: ConventionSet = { name: `settlement on ${calendar}`, calendar, businessDay: 'unadjusted', endOfMonth: false, spotLagDays: 0, ...(calendars ? { calendars } : {}) };
  const v = serialFromIso(valuation);
  const checked = quoteCalendar(set, v, base, index);
  if (!checked.ok) {
    errors.push(...checked.errors);
    return null;
  }
  const settle = isoFromSerial(addBusinessDays(v, spotLag, checked.value));
  if (compareIso(maturity, settle) <= 0) {
    errors.push(coreError('before-settlement', `${base}.maturity`, `${base}.maturity: ${maturity} is not after the trade's settlement ${settle} (the valuation date ${valuation} plus ${spotLag} business days on ${calendar}); give a later maturity`, index));
    return null;
  }
  return { settle, calendar, spotLag };
}
