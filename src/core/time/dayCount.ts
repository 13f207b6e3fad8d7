import {
  daysBetween,
  isLastOfFebruary,
  isLeapYear,
  parseIsoDate,
  serialFromCivil,
  type CivilDate,
  type IsoDate,
} from './date.ts';

/**
 * Day-count conventions. Identifiers are exact and case-sensitive.
 *
 * - `ACT/360`, `ACT/365F`: actual days over 360 or 365 (2006 ISDA Definitions 4.16(e), 4.16(d)).
 * - `30/360`: Bond Basis, 2006 ISDA Definitions 4.16(f).
 * - `30E/360`: Eurobond Basis, 2006 ISDA Definitions 4.16(g).
 * - `30E/360-ISDA`: 2006 ISDA Definitions 4.16(h); needs the instrument's termination date.
 * - `30/360-US`: the securities industry's standard calculation methods (SIFMA), with the
 *   end-of-February rules applied when `eom` is true (always for curve queries).
 * - `ACT/ACT-ISDA`: 2006 ISDA Definitions 4.16(b).
 * - `ACT/ACT-ICMA`: ICMA Rule 251; needs the reference (coupon) period and frequency.
 */
export const DAY_COUNTS = ['ACT/360', 'ACT/365F', '30/360', '30E/360', '30E/360-ISDA', '30/360-US', 'ACT/ACT-ISDA', 'ACT/ACT-ICMA'] as const;
export type DayCount = (typeof DAY_COUNTS)[number];

/** Day counts that need no instrument, so they may serve as the curve's axis and for queries. */
export const CURVE_DAY_COUNTS = ['ACT/360', 'ACT/365F', '30/360', '30E/360', '30/360-US', 'ACT/ACT-ISDA'] as const;
export type CurveDayCount = (typeof CURVE_DAY_COUNTS)[number];

export const isDayCount = (x: unknown): x is DayCount => typeof x === 'string' && (DAY_COUNTS as readonly string[]).includes(x);
export const isCurveDayCount = (x: unknown): x is CurveDayCount =>
  typeof x === 'string' && (CURVE_DAY_COUNTS as readonly string[]).includes(x);

/** What some day counts need beyond the two dates. */
export interface DayCountContext {
  /** 30E/360-ISDA: the instrument's final maturity (termination date). */
  readonly termination?: IsoDate;
  /** 30/360-US: apply the end-of-February rules 1 and 2 (instruments with `eom` true; curve queries). */
  readonly eom?: boolean;
  /** ACT/ACT-ICMA: the coupon period containing [d1, d2] and the coupon frequency per year. */
  readonly refStart?: IsoDate;
  readonly refEnd?: IsoDate;
  readonly frequency?: number;
}

const thirty360 = (a: CivilDate, b: CivilDate, d1: number, d2: number): number =>
  (360 * (b.y - a.y) + 30 * (b.m - a.m) + (d2 - d1)) / 360;

function actActIsda(a: CivilDate, b: CivilDate): number {
  if (a.y === b.y) return (serialFromCivil(b) - serialFromCivil(a)) / (isLeapYear(a.y) ? 366 : 365);
  const endA = serialFromCivil({ y: a.y + 1, m: 1, d: 1 }) - serialFromCivil(a);
  const startB = serialFromCivil(b) - serialFromCivil({ y: b.y, m: 1, d: 1 });
  return endA / (isLeapYear(a.y) ? 366 : 365) + (b.y - a.y - 1) + startB / (isLeapYear(b.y) ? 366 : 365);
}

const NO_CONTEXT: DayCountContext = {};
const EOM_CONTEXT: DayCountContext = { eom: true };

/**
 * Year fraction from d1 to d2 under a day count, in years. d2 before d1 gives the negative of
 * the fraction from d2 to d1 for the actual-day conventions; the 30/360 family is evaluated by
 * its formula as written.
 *
 * ACT/ACT-ICMA needs `refStart`, `refEnd` (the regular coupon period) and `frequency`:
 * fraction = days(d1, d2) / (frequency x days(refStart, refEnd)). Without them it is an error of
 * the caller (a RangeError), never a silent value.
 */
export function yearFraction(dayCount: DayCount, d1: IsoDate, d2: IsoDate, ctx: DayCountContext = NO_CONTEXT): number {
  const a = parseIsoDate(d1);
  const b = parseIsoDate(d2);
  if (!a || !b) throw new RangeError(`yearFraction: not ISO dates: ${d1}, ${d2}`);
  switch (dayCount) {
    case '30E/360-ISDA': {
      if (ctx.termination === undefined) throw new RangeError('30E/360-ISDA needs the termination date');
      return yearFractionCivil(dayCount, a, b, false, d2 === ctx.termination, 0, 0);
    }
    case 'ACT/ACT-ICMA': {
      const { refStart, refEnd, frequency } = ctx;
      if (refStart === undefined || refEnd === undefined || frequency === undefined) {
        throw new RangeError('ACT/ACT-ICMA needs the reference period and frequency');
      }
      return yearFractionCivil(dayCount, a, b, false, false, daysBetween(refStart, refEnd), frequency);
    }
    default:
      return yearFractionCivil(dayCount, a, b, ctx.eom === true, false, 0, 0);
  }
}

/**
 * `yearFraction` on civil dates already parsed, with its context spelled out (performance: schedules
 * and curve times are computed on civil dates without formatting or re-parsing ISO strings, and
 * without a context object per call). Same formulas and sources as `yearFraction`, in years.
 * - `eom`: 30/360-US end-of-February rules;
 * - `bIsTermination`: 30E/360-ISDA, b is the instrument's termination date;
 * - `refDays`, `frequency`: ACT/ACT-ICMA, actual days of the regular reference period and the
 *   coupon frequency per year (fraction = days(a, b) / (frequency x refDays)).
 * The caller checks that the context a day count needs is present.
 */
export function yearFractionCivil(
  dayCount: DayCount,
  a: CivilDate,
  b: CivilDate,
  eom: boolean,
  bIsTermination: boolean,
  refDays: number,
  frequency: number,
): number {
  switch (dayCount) {
    case 'ACT/360':
      return (serialFromCivil(b) - serialFromCivil(a)) / 360;
    case 'ACT/365F':
      return (serialFromCivil(b) - serialFromCivil(a)) / 365;
    case 'ACT/ACT-ISDA':
      return serialFromCivil(b) >= serialFromCivil(a) ? actActIsda(a, b) : -actActIsda(b, a);
    case '30/360': {
      // 4.16(f): if D1 is 31, D1 = 30; if D2 is 31 and D1 is 30 or 31, D2 = 30.
      const D1 = a.d === 31 ? 30 : a.d;
      const D2 = b.d === 31 && D1 === 30 ? 30 : b.d;
      return thirty360(a, b, D1, D2);
    }
    case '30E/360': {
      // 4.16(g): a 31st is the 30th on either side.
      return thirty360(a, b, a.d === 31 ? 30 : a.d, b.d === 31 ? 30 : b.d);
    }
    case '30E/360-ISDA': {
      // 4.16(h): D1 = 30 if the last day of February or the 31st; D2 = 30 if the 31st, or the last
      // day of February unless D2 is the termination date.
      const D1 = a.d === 31 || isLastOfFebruary(a) ? 30 : a.d;
      const D2 = b.d === 31 || (isLastOfFebruary(b) && !bIsTermination) ? 30 : b.d;
      return thirty360(a, b, D1, D2);
    }
    case '30/360-US': {
      // SIFMA standard: (1) D1 and D2 last of February: D2 = 30; (2) D1 last of February: D1 = 30;
      // (3) D2 = 31 and D1 >= 30: D2 = 30; (4) D1 = 31: D1 = 30. Rules 1-2 only with eom.
      let D1 = a.d;
      let D2 = b.d;
      if (eom) {
        if (isLastOfFebruary(a) && isLastOfFebruary(b)) D2 = 30;
        if (isLastOfFebruary(a)) D1 = 30;
      }
      if (D2 === 31 && D1 >= 30) D2 = 30;
      if (D1 === 31) D1 = 30;
      return thirty360(a, b, D1, D2);
    }
    case 'ACT/ACT-ICMA':
      return (serialFromCivil(b) - serialFromCivil(a)) / (frequency * refDays);
  }
}

/**
 * The curve's clock from one settlement date as a function of civil dates, years under the curve
 * day count (the same values as curveTime). Performance: made once per market; the
 * actual-day conventions subtract the settlement's day serial computed once.
 */
export function curveClock(dayCount: CurveDayCount, settlement: CivilDate): (date: CivilDate) => number {
  if (dayCount === 'ACT/365F' || dayCount === 'ACT/360') {
    const s0 = serialFromCivil(settlement);
    const basis = dayCount === 'ACT/360' ? 360 : 365;
    return (date) => (serialFromCivil(date) - s0) / basis;
  }
  return (date) => queryYearFractionCivil(dayCount, settlement, date);
}

/**
 * The curve's clock: year fraction from settlement under a curve day count. The 30/360-US
 * end-of-February rules always apply to curve queries.
 */
export const curveTime = (dayCount: CurveDayCount, settlement: IsoDate, date: IsoDate): number =>
  yearFraction(dayCount, settlement, date, EOM_CONTEXT);

/** Year fraction under a query (curve) day count between two dates. */
export const queryYearFraction = (dayCount: CurveDayCount, d1: IsoDate, d2: IsoDate): number =>
  yearFraction(dayCount, d1, d2, EOM_CONTEXT);

/** `queryYearFraction` on civil dates already parsed (years under the day count). */
export const queryYearFractionCivil = (dayCount: CurveDayCount, d1: CivilDate, d2: CivilDate): number =>
  yearFractionCivil(dayCount, d1, d2, true, false, 0, 0);

