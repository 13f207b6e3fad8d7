import type { FutureQuote } from '../document/types.ts';
import { compileFuture, FUTURE_BASIS, futureForwardRate } from '../instruments/future.ts';
import { modelConvexityBp, type ConvexityFill } from '../instruments/convexity.ts';
import { DISCOUNTING_AND_PROJECTING, type Instrument } from '../instruments/instrument.ts';
import { coreError, fail, ok, type CoreError } from '../result.ts';
import { businessCalendar, outsideCalendar, type CalendarContext } from '../time/calendars.ts';
import { compareIso, isoFromSerial, parseIsoDate, serialFromIso, type IsoDate } from '../time/date.ts';
import { averagedFixings, FUTURE_CONTRACTS, lastDayOf, futurePeriod, parseContractMonth, type FutureContract } from '../time/futurePeriods.ts';
import { RATE_MAX, RATE_MIN, readChoice, readNumber, required, typeName, type RawQuote } from './fields.ts';
import { flatDollarDurationOf } from './shared.ts';
import type { DocumentContext, QuoteKindModule } from './types.ts';

/** Futures prices the reader takes: above 0 up to 110 (futures rates from 100% down to -10%, the rate fields' range). */
export const FUTURE_PRICE_MAX = 110;
const PRICE_WHAT = `above 0 up to ${FUTURE_PRICE_MAX} (100 minus the futures rate in percent: 96.125 is 3.875%)`;
/** Convexity adjustments the reader takes, in bp. */
export const CONVEXITY_MAX_BP = 500;
const CONVEXITY_WHAT = `of basis points from -${CONVEXITY_MAX_BP} to ${CONVEXITY_MAX_BP} (the futures rate minus the forward rate; 0.5 = half a basis point)`;
/** The default calendar: US government securities business days, SOFR's publication days. */
export const FUTURE_CALENDAR = 'us-gov-securities';

/** How a future is named in messages: `3M future 2027-03` or `1M future 2027-04-01 to 2027-05-01`. */
export const futureName = (contract: string, month: string | null, start: IsoDate, end: IsoDate): string =>
  `${contract} future ${month ?? `${start} to ${end}`}`;

/**
 * A future on an overnight rate (SOFR by default), quoted by its price, 100 minus the futures
 * rate in percent (CME SOFR futures). Fields: `price` (required), `contract` `3M` (default,
 * compounded over the IMM quarter) or `1M` (averaged over the calendar month), `month` (`YYYY-MM`)
 * or `start` and `end` dates (end exclusive), `convexity` in bp (default 0, subtracted from the
 * futures rate), `calendar` (default `us-gov-securities`), `fixings` (a contract in its period: the
 * overnight rate of every business day from its first fixing to the day before the valuation date,
 * `{"YYYY-MM-DD": rate}`). It takes no tenor or maturity: its dates come from its month
 * (`ownDates`). A contract in its period without its fixings, or with every fixing known, is refused.
 */
export const FUTURE: QuoteKindModule<FutureQuote> = {
  kind: 'future',
  ownDates: true,
  turnSpread: true,
  schema: {
    fields: ['price', 'contract', 'month', 'start', 'end', 'convexity', 'calendar', 'fixings'],
    defaults: {},
    read: readFuture,
  },
  sheet: {
    rateField: null,
    rateWhat: 'futures price',
    priceField: 'price',
    missingValue: 'price',
    coupon: false,
    frequency: false,
    dayCount: { refuse: 'day count (a SOFR future is on ACT/360 by definition)' },
    /** The Maturity cell: the contract month, and ` 1M` for a one-month contract (`2027-03`, `2027-03 1M`). */
    maturityCell: {
      read(text) {
        const m = /^(\d{4}-\d{2})(?:\s+(1M|3M))?$/i.exec(text.trim());
        if (m === null) return { ok: false, message: 'a future is dated by its contract month: type it as YYYY-MM (such as 2027-03), followed by 1M for a one-month contract (2027-03 1M); not a tenor or a date' };
        return { ok: true, fields: m[2] === undefined ? { month: m[1] } : { month: m[1], contract: m[2].toUpperCase() } };
      },
      write: (raw) => (typeof raw.month === 'string' ? `${raw.month}${raw.contract === '1M' ? ' 1M' : ''}` : ''),
    },
  },
  paste: { kindWords: ['futures', 'fut', 'futs', 'rate future', 'sofr future', 'sofr futures'], headerWords: { futuresprice: 'price' } },
  compile: (q, settlement, _s, _m, t, time) => compileFuture(q, settlement, t, time),
  curves: DISCOUNTING_AND_PROJECTING,
  nodeRole: 'discount',
  onProjection: () => 'ratio',
  convention: (q) => ({ unit: 'price', clean: false, futuresRate: q.contract === '3M' ? 'compounded' : 'averaged' }),
  yieldLabel: (q) => `futures rate (${q.contract === '3M' ? 'simple, ACT/360, compounded daily over the quarter' : 'simple, ACT/360, average of the month'})`,
  /** Its own yield is the futures rate, (100 - price) / 100, and back. */
  priceYield: (_q, _settlement, label) => ({ toYield: (p) => (100 - p) / 100, fromYield: (y) => 100 - 100 * y, label }),
  /** The futures rate moves by d: the price by -100 d. */
  shift(q, d) {
    const price = q.price - 100 * d;
    if (price > 0 && price <= FUTURE_PRICE_MAX) return ok({ ...q, price });
    const path = `quotes[${q.index}].price`;
    return fail(coreError('range', path, `${path}: the scenario moves the ${futureName(q.contract, q.month, q.start, q.end)} to the price ${price}, outside (0, ${FUTURE_PRICE_MAX}]; use a smaller shift`, q.index));
  },
  fit: { per100: 100, dollarDuration: futureDollarDuration, richCheap: false },
  solver: { firstRate: (ins) => futureForwardRate(ins.market, (ins.quote as FutureQuote).convexity) },
  dates: (q) => ({ start: q.start, end: q.end, payment: null }),
};

function readFuture(raw: RawQuote, base: string, index: number, _maturity: IsoDate | null, _m: IsoDate, _tenor: string | null, enabled: boolean, errors: CoreError[], settlement?: IsoDate, calendars?: CalendarContext, context?: DocumentContext): FutureQuote | null {
  const convexityModel = context?.futuresConvexity;
  const before = errors.length;
  const contract = readChoice<FutureContract>(raw, base, index, errors, 'contract', FUTURE_CONTRACTS, '3M');
  const price = required(readNumber(raw, base, index, errors, 'price', 0, FUTURE_PRICE_MAX, PRICE_WHAT, true), 'price', PRICE_WHAT, base, index, errors);
  const convexity = readNumber(raw, base, index, errors, 'convexity', -CONVEXITY_MAX_BP, CONVEXITY_MAX_BP, CONVEXITY_WHAT) ?? 0;
  let calendar: string | null = FUTURE_CALENDAR;
  if (raw.calendar !== undefined) {
    if (typeof raw.calendar === 'string') calendar = raw.calendar;
    else {
      errors.push(coreError('schema', `${base}.calendar`, `${base}.calendar: must be a calendar name such as ${FUTURE_CALENDAR} (joined with + if several), not ${typeName(raw.calendar)}`, index));
      calendar = null;
    }
  }
  // The period: a contract month, or start and end dates as typed.
  let period: { start: number; end: number } | null = null;
  let month: string | null = null;
  const givenBy = `give month (the contract month, such as "2027-03") or both start and end dates (YYYY-MM-DD, end exclusive)`;
  if (raw.month !== undefined) {
    if (raw.start !== undefined || raw.end !== undefined) {
      errors.push(coreError('schema', base, `${base}: a future takes month or start and end, not both; ${givenBy}`, index));
    } else {
      const parsed = typeof raw.month === 'string' ? parseContractMonth(raw.month) : null;
      if (parsed === null || parsed.y < 1990 || parsed.y > 2099) {
        errors.push(coreError('schema', `${base}.month`, `${base}.month: must be a contract month YYYY-MM (such as "2027-03"), years 1990 to 2099, not ${typeName(raw.month)}`, index));
      } else if (contract !== null) {
        month = raw.month as string;
        period = futurePeriod(contract, parsed.y, parsed.m);
      }
    }
  } else if (raw.start !== undefined || raw.end !== undefined) {
    const date = (field: 'start' | 'end'): IsoDate | null => {
      const v = raw[field];
      if (typeof v === 'string' && parseIsoDate(v) !== null) return v;
      errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: must be a date YYYY-MM-DD (${givenBy}), not ${typeName(v)}`, index));
      return null;
    };
    const s = date('start');
    const e = date('end');
    if (s !== null && e !== null) {
      if (compareIso(e, s) <= 0) errors.push(coreError('range', `${base}.end`, `${base}.end: ${e} must be after the start ${s} (the period runs from start to the day before end)`, index));
      else period = { start: serialFromIso(s), end: serialFromIso(e) };
    }
  } else {
    errors.push(coreError('schema', `${base}.month`, `${base}.month: required; ${givenBy}`, index));
  }
  if (raw.tenor !== undefined || raw.maturity !== undefined) {
    const field = raw.tenor !== undefined ? 'tenor' : 'maturity';
    errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: a future's dates come from its contract month; remove ${field} and ${givenBy}`, index));
  }
  if (errors.length > before || period === null || contract === null || price === null || calendar === null) return null;
  if (settlement === undefined) {
    errors.push(coreError('schema', base, `${base}: a future's dates are checked against the valuation date, which its reader was not given`, index));
    return null;
  }
  const start = isoFromSerial(period.start);
  const end = isoFromSerial(period.end);
  const name = futureName(contract, month, start, end);
  const cal = businessCalendar(calendar, calendars ?? {});
  if (!cal.ok) {
    errors.push(coreError('unknown-identifier', `${base}.calendar`, `${base}.calendar (${name}): ${cal.message}`, index));
    return null;
  }
  for (const s of [period.start - 7, period.end + 7]) {
    const outside = outsideCalendar(cal.calendar, s);
    if (outside !== null) {
      errors.push(coreError('range', `${base}.${month !== null ? 'month' : 'start'}`, `${base} (${name}): the period's dates ${outside}`, index));
      return null;
    }
  }
  // The first fixing the contract reads: the period's start (or the business day before it when it is
  // not one: the compounding's first day carries that rate), or for the average the business day its first day carries.
  const averaged = contract === '1M' ? averagedFixings(period.start, period.end, cal.calendar) : null;
  let firstFixing = averaged !== null ? averaged.days[0]! : period.start;
  while (!cal.calendar.isBusinessDay(firstFixing)) firstFixing--;
  const v = serialFromIso(settlement);
  const field = month !== null ? 'month' : 'start';
  // The business day the curve's part starts on: the first on or after the valuation date.
  let c = v;
  while (!cal.calendar.isBusinessDay(c)) c++;
  const lastNeeded = averaged !== null ? averaged.days[averaged.days.length - 1]! : period.end - 1;
  if (c > lastNeeded) {
    errors.push(coreError('range', `${base}.${field}`, `${base}.${field} (${name}): its reference period ends on ${lastDayOf(end)} and every fixing it reads is known by the valuation date ${settlement}, so nothing of it is left on the curve; remove it or give a later contract`, index));
    return null;
  }
  const own = readFixings(raw, base, index, errors, name, firstFixing, v, cal.calendar);
  if (own === null) return null;
  // Without fixings of its own, a contract in its period reads the days it needs from the workspace's list.
  const fromWorkspace = own === undefined && firstFixing < v && context?.fixings !== undefined;
  const fixings = fromWorkspace ? workspaceFixings(context.fixings!, firstFixing, v, cal.calendar) : own;
  if (firstFixing < v) {
    const missing: string[] = [];
    for (let b = firstFixing; b < v; b++) if (cal.calendar.isBusinessDay(b) && fixings?.[isoFromSerial(b)] === undefined) missing.push(isoFromSerial(b));
    if (missing.length > 0) {
      const path = own === undefined ? `${base}.${field}` : `${base}.fixings`;
      const list = missing.length > 4 ? `${missing.slice(0, 4).join(', ')} and ${missing.length - 4} more` : missing.join(', ');
      const give = fromWorkspace ? "the workspace's fixings lack" : own === undefined ? "give them as fixings, in the workspace's list or on the quote:" : 'fixings lacks';
      errors.push(coreError('range', path, `${path} (${name}): its reference period began on ${isoFromSerial(firstFixing)}${firstFixing < period.start ? ' (the fixing its first day carries)' : ''}, before the valuation date ${settlement}, so it needs the overnight fixings so far; ${give} ${list} (fixings: {"YYYY-MM-DD": rate as a decimal, ...}, one per ${calendar} business day before the valuation date), or remove the contract`, index));
      return null;
    }
  }
  const maturity = isoFromSerial(averaged !== null ? averaged.next : period.end);
  // No typed adjustment: the curve's model fills it from the quoted price, t1 and t2 on ACT/365F from the valuation date.
  const fill: ConvexityFill | undefined =
    raw.convexity === undefined && convexityModel !== undefined ? { ...convexityModel, t1: Math.max(0, (period.start - v) / 365), t2: (period.end - v) / 365 } : undefined;
  const adjustment = fill ? modelConvexityBp(fill, (100 - price) / 100, period.end - period.start, fill.t1, fill.t2) : convexity;
  return {
    kind: 'future', index, maturity, tenor: null, enabled, contract, month, start, end, price, convexity: adjustment, ...(fill ? { convexityFill: fill } : {}), calendar,
    ...(fixings !== undefined && firstFixing < v ? { fixings } : {}), ...(calendars ? { calendars } : {}),
  };
}


/**
 * The `fixings` field: an object of business days (YYYY-MM-DD) to overnight rates (decimals,
 * the rate fields' range), each on a business day of the contract's calendar from its first fixing
 * to the day before the valuation date (a day's rate is published the next morning). Undefined when
 * absent; null with a path-named error when wrong.
 */
function readFixings(raw: RawQuote, base: string, index: number, errors: CoreError[], name: string, first: number, v: number, calendar: { isBusinessDay(s: number): boolean }): Record<IsoDate, number> | null | undefined {
  const f = raw.fixings;
  if (f === undefined) return undefined;
  const path = `${base}.fixings`;
  if (f === null || typeof f !== 'object' || Array.isArray(f)) {
    errors.push(coreError('schema', path, `${path} (${name}): must be an object of dates to rates, such as {"2027-03-17": 0.0365}, not ${typeName(f)}`, index));
    return null;
  }
  const out: Record<IsoDate, number> = {};
  for (const [date, r] of Object.entries(f as Record<string, unknown>)) {
    const at = `${path}.${date.slice(0, 12)}`;
    if (parseIsoDate(date) === null) {
      errors.push(coreError('schema', at, `${at} (${name}): a fixing's key must be a date YYYY-MM-DD, not "${date.slice(0, 40)}"`, index));
      return null;
    }
    if (typeof r !== 'number' || !Number.isFinite(r) || r < RATE_MIN || r > RATE_MAX) {
      errors.push(coreError('range', at, `${at} (${name}): must be a rate as a decimal from ${RATE_MIN} to ${RATE_MAX} (0.0365 = 3.65%), not ${typeof r === 'number' ? String(r) : typeName(r)}`, index));
      return null;
    }
    const s = serialFromIso(date);
    if (s >= v || s < first || !calendar.isBusinessDay(s)) {
      const why = s >= v ? 'is not known at the valuation date (a rate is published the next business morning)' : s < first ? `is before the contract's first fixing ${isoFromSerial(first)}` : 'is not a business day on the contract\'s calendar';
      errors.push(coreError('range', at, `${at} (${name}): ${date} ${why}; give fixings for business days from ${isoFromSerial(first)} to the day before the valuation date`, index));
      return null;
    }
    out[date] = r;
  }
  return out;
}

/** The workspace's fixings of the business days from `first` to the day before `v` (those it has; the caller names the missing). */
function workspaceFixings(all: Readonly<Record<string, number>>, first: number, v: number, calendar: { isBusinessDay(s: number): boolean }): Record<IsoDate, number> {
  const out: Record<IsoDate, number> = {};
  for (let b = first; b < v; b++) {
    if (!calendar.isBusinessDay(b)) continue;
    const date = isoFromSerial(b);
    const r = all[date];
    if (r !== undefined) out[date] = r;
  }
  return out;
}

/**
 * The fit's dollar duration, -d residual / dR per 1 of notional: for 3M the deposit's (flows -1 at
 * the first flow (S, or b0 for a start on a holiday, or c in the period) and the end flow at E
 * against 0, about tau DF(S)); for 1M the growth of the last business day's
 * forward, DF(b_last) n_last / 360 N / w_last / g^2 on the market's own forward.
 */
function futureDollarDuration(ins: Instrument, q: FutureQuote): number {
  const flows = ins.times.length;
  if (q.contract === '3M') return flatDollarDurationOf([ins.times[0]!, ins.times[flows - 1]!], [-1, ins.amounts[flows - 1]!], 0);
  const a = ins as Instrument & { weights: readonly number[]; spans: readonly number[]; days: number };
  const last = a.weights.length - 1;
  // On a flat curve at the forward rate itself, DF(b_last) ~ exp(-R t) and g ~ 1 + R n / 360.
  const r = futureForwardRate(q.price, q.convexity);
  const n = a.spans[last]! / FUTURE_BASIS;
  const g = 1 + r * n;
  return (Math.exp(-r * ins.times[last]!) * n * (a.days / a.weights[last]!)) / (g * g);
}
