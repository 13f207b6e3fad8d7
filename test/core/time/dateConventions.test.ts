import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  addTenor,
  adjustSerial,
  civilFromSerial,
  EVERY_DAY,
  isoFromCivil,
  isoFromSerial,
  marketDate,
  marketDateCivil,
  parseIsoDate,
  parseTenor,
  resolveMarketDate,
  serialFromCivil,
  serialFromIso,
  UNADJUSTED,
  UNADJUSTED_END_OF_MONTH,
  WEEKENDS_ONLY,
  type ConventionSet,
  type Tenor,
} from '../../../src/core/index.ts';

const value = (r: ReturnType<typeof resolveMarketDate>): string => {
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('; '));
  return r.value;
};
const errorOf = (r: ReturnType<typeof resolveMarketDate>) => {
  if (r.ok) throw new Error(`expected an error, got ${r.value}`);
  return r.errors[0]!;
};
const t = (text: string): Tenor => parseTenor(text)!;

// Weekdays of the dates below are calendar facts (1 January 2024 was a Monday; 1 January 1970 a
// Thursday; 1 January 2000 a Saturday), each checked against the weekday formula in the first test.
const weekdayOf = (iso: string): string => ['Thu', 'Fri', 'Sat', 'Sun', 'Mon', 'Tue', 'Wed'][((serialFromIso(iso) % 7) + 7) % 7]!;

describe('resolveMarketDate under UNADJUSTED (today\'s conventions)', () => {
  // Source for the expected dates: the Gregorian calendar (2024 is a leap year, 2023 and 2025 are
  // not) and the engine's documented tenor rule (README: tenors are added to the settlement date
  // unadjusted, the day of month clipped to the month's end, k x tenor counted from the anchor).
  it('resolveMarketDate(anchor, "nD" / "nW") adds calendar days and weeks', () => {
    expect(value(resolveMarketDate('2024-02-27', '3D'))).toBe('2024-03-01');
    expect(value(resolveMarketDate('2023-12-29', '1W'))).toBe('2024-01-05');
    expect(value(resolveMarketDate('2024-01-01', '52W'))).toBe('2024-12-30');
  });

  it('resolveMarketDate(anchor, "nM" / "nY") keeps the day of month, clipped to the month end, never rolling to month ends', () => {
    expect(value(resolveMarketDate('2024-01-31', '1M'))).toBe('2024-02-29');
    expect(value(resolveMarketDate('2023-01-31', '1M'))).toBe('2023-02-28');
    expect(value(resolveMarketDate('2024-01-31', '2M'))).toBe('2024-03-31');
    expect(value(resolveMarketDate('2024-02-29', '1Y'))).toBe('2025-02-28');
    // no end-of-month rule: the last of February stays on the 28th a year later, and 30 April goes to 30 May
    expect(value(resolveMarketDate('2023-02-28', '1Y'))).toBe('2024-02-28');
    expect(value(resolveMarketDate('2024-04-30', '1M'))).toBe('2024-05-30');
    expect(value(resolveMarketDate('2024-08-15', '30Y'))).toBe('2054-08-15');
    // with the end-of-month rule (a schedule's eom flag) a month-end start keeps month ends: 30 Apr + 1M = 31 May, 28 Feb 2023 + 1Y = 29 Feb 2024
    expect(value(resolveMarketDate('2024-04-30', '1M', UNADJUSTED_END_OF_MONTH))).toBe('2024-05-31');
    expect(value(resolveMarketDate('2023-02-28', '1Y', UNADJUSTED_END_OF_MONTH))).toBe('2024-02-29');
    expect(value(resolveMarketDate('2024-04-29', '1M', UNADJUSTED_END_OF_MONTH))).toBe('2024-05-29');
  });

  it('resolveMarketDate reads tenors in either case with white space around, and parsed tenors', () => {
    expect(value(resolveMarketDate('2024-03-15', ' 10y '))).toBe('2034-03-15');
    expect(value(resolveMarketDate('2024-03-15', { n: 6, unit: 'M' }))).toBe('2024-09-15');
  });

  it('marketDate(anchor, tenor, set, k) counts k tenors from the anchor, never chained', () => {
    // 31 Jan + 2 x 1M is 31 Mar, not 28/29 Feb + 1M
    expect(marketDate('2024-01-31', t('1M'), UNADJUSTED, 2)).toBe('2024-03-31');
    expect(marketDate('2024-01-31', t('1M'), UNADJUSTED, 0)).toBe('2024-01-31');
    expect(marketDate('2024-03-31', t('1M'), UNADJUSTED, -1)).toBe('2024-02-29');
    expect(isoFromCivil(marketDateCivil(parseIsoDate('2024-01-31')!, t('3M')))).toBe('2024-04-30');
  });

  it('resolveMarketDate(anchor, tenor) under UNADJUSTED (and UNADJUSTED_END_OF_MONTH) equals addTenor (with eom), the rule every caller used before the conventions layer', () => {
    const lo = serialFromCivil({ y: 1990, m: 1, d: 1 });
    const hi = serialFromCivil({ y: 2060, m: 12, d: 31 });
    fc.assert(
      fc.property(fc.integer({ min: lo, max: hi }), fc.integer({ min: 1, max: 400 }), fc.constantFrom('D', 'W', 'M', 'Y'), fc.integer({ min: -3, max: 40 }), (s, n, unit, k) => {
        const anchor = isoFromSerial(s);
        const tenor = { n: unit === 'Y' ? 1 + (n % 60) : n, unit } as Tenor;
        expect(value(resolveMarketDate(anchor, tenor))).toBe(addTenor(anchor, tenor));
        expect(marketDate(anchor, tenor, UNADJUSTED, k)).toBe(addTenor(anchor, tenor, k));
        // the eom flag of bond and swap schedules
        expect(marketDate(anchor, tenor, UNADJUSTED_END_OF_MONTH, k)).toBe(addTenor(anchor, tenor, k, true));
      }),
      { seed: 16, numRuns: 5000 },
    );
  });

  it('resolveMarketDate(anchor, date text) passes the date through as given, before or after the anchor', () => {
    expect(value(resolveMarketDate('2024-03-15', '2031-06-30'))).toBe('2031-06-30');
    expect(value(resolveMarketDate('2024-03-15', '2020-01-04'))).toBe('2020-01-04');
    // a weekend date is not moved even under a business-day rule: a date the user typed stays as typed
    const set: ConventionSet = { name: 'test', calendar: 'weekends', businessDay: 'following', endOfMonth: false, spotLagDays: 0 };
    expect(value(resolveMarketDate('2024-03-15', '2024-08-31', set))).toBe('2024-08-31');
  });

  it('resolveMarketDate returns an error a user can act on: which field, what is wrong, what would be valid', () => {
    const e = errorOf(resolveMarketDate('2024-03-15', 'soon', UNADJUSTED, 'strategy.horizon'));
    expect(e.code).toBe('schema');
    expect(e.path).toBe('strategy.horizon');
    expect(e.message).toBe('strategy.horizon: "soon" must be a tenor such as "3M" or "5Y" (a whole number and D, W, M or Y) or a date YYYY-MM-DD');
    expect(errorOf(resolveMarketDate('2024-03-15', '2024-02-30')).message).toMatch(/"2024-02-30" must be a tenor .* or a date YYYY-MM-DD/);
    expect(errorOf(resolveMarketDate('2024-03-15', '0M')).code).toBe('schema');
    // a value that is no text and no parsed tenor (a number from a JSON document) is refused, not thrown
    expect(errorOf(resolveMarketDate('2024-03-15', 5 as never, UNADJUSTED, 'at')).message).toBe('at: the value 5 must be a tenor such as "3M" or "5Y" (a whole number and D, W, M or Y) or a date YYYY-MM-DD');
    expect(errorOf(resolveMarketDate('2024-03-15', { n: 0, unit: 'M' })).code).toBe('schema');
    expect(errorOf(resolveMarketDate('15/03/2024', '1Y', UNADJUSTED, 'at')).message).toBe('at: the date "15/03/2024" it counts from is not a date YYYY-MM-DD');
    const unknown = errorOf(resolveMarketDate('2024-03-15', '1Y', { ...UNADJUSTED, name: 'x', calendar: 'mars' }));
    expect(unknown.code).toBe('unknown-identifier');
    expect(unknown.message).toContain('"mars", which is not known; use one of weekends, us-gov-securities, us-federal-reserve, target, england-wales (joined with + if several) or none');
    expect(errorOf(resolveMarketDate('2024-03-15', '1Y', { ...UNADJUSTED, name: 'x', spotLagDays: -2 })).message).toContain('use a whole number from 0 to 30');
    expect(errorOf(resolveMarketDate('2024-03-15', '1Y', { ...UNADJUSTED, name: 'x', businessDay: 'nearest' as never })).message).toContain(
      'use one of following, modified-following, preceding, modified-preceding, unadjusted',
    );
  });
});

describe('business-day conventions (the layer for calendars to come)', () => {
  it('WEEKENDS_ONLY.isBusinessDay is false on Saturdays and Sundays only (calendar facts)', () => {
    expect(weekdayOf('1970-01-01')).toBe('Thu');
    expect(weekdayOf('2000-01-01')).toBe('Sat');
    expect(weekdayOf('2024-01-01')).toBe('Mon');
    const days = ['2024-01-01', '2024-01-02', '2024-01-03', '2024-01-04', '2024-01-05', '2024-01-06', '2024-01-07'].map((d) => WEEKENDS_ONLY.isBusinessDay(serialFromIso(d)));
    expect(days).toEqual([true, true, true, true, true, false, false]);
    expect(WEEKENDS_ONLY.isBusinessDay(serialFromIso('1969-12-27'))).toBe(false); // a Saturday before serial 0
    expect(EVERY_DAY.isBusinessDay(serialFromIso('2000-01-01'))).toBe(true);
  });

  // ISDA 2006 Definitions, Section 4.12 (cited from memory): Following = the first following day
  // that is a Business Day; Modified Following = the same unless that day is in the next calendar
  // month, then the first preceding Business Day; Preceding = the first preceding Business Day.
  // Weekdays: Sat 31 Aug 2024, Mon 2 Sep 2024, Fri 30 Aug 2024, Sat 1 Jun 2024, Fri 31 May 2024.
  const adjust = (iso: string, rule: Parameters<typeof adjustSerial>[1]): string => isoFromSerial(adjustSerial(serialFromIso(iso), rule, WEEKENDS_ONLY));
  it('adjustSerial(Sat 31 Aug 2024) is Mon 2 Sep following, Fri 30 Aug modified following and preceding (ISDA 2006 4.12)', () => {
    expect(weekdayOf('2024-08-31')).toBe('Sat');
    expect(adjust('2024-08-31', 'following')).toBe('2024-09-02');
    expect(adjust('2024-08-31', 'modified-following')).toBe('2024-08-30');
    expect(adjust('2024-08-31', 'preceding')).toBe('2024-08-30');
    expect(adjust('2024-08-31', 'unadjusted')).toBe('2024-08-31');
  });
  it('adjustSerial(Sat 1 Jun 2024) is Mon 3 Jun following and modified following, Fri 31 May preceding (ISDA 2006 4.12)', () => {
    expect(weekdayOf('2024-06-01')).toBe('Sat');
    expect(adjust('2024-06-01', 'following')).toBe('2024-06-03');
    expect(adjust('2024-06-01', 'modified-following')).toBe('2024-06-03');
    expect(adjust('2024-06-01', 'preceding')).toBe('2024-05-31');
  });
  it('adjustSerial leaves a business day where it is under every rule', () => {
    for (const rule of ['following', 'modified-following', 'preceding', 'unadjusted'] as const) expect(adjust('2024-08-28', rule)).toBe('2024-08-28');
  });

  const T2: ConventionSet = { name: 'weekdays T+2 modified following', calendar: 'weekends', businessDay: 'modified-following', endOfMonth: false, spotLagDays: 2 };
  it('resolveMarketDate counts a tenor from the spot date, the anchor plus the spot lag in business days', () => {
    // Thu 29 Aug 2024 + 2 business days = Mon 2 Sep 2024 (spot); + 1M = Wed 2 Oct 2024; + 1W = Mon 9 Sep 2024
    expect(weekdayOf('2024-10-02')).toBe('Wed');
    expect(value(resolveMarketDate('2024-08-29', '1M', T2))).toBe('2024-10-02');
    expect(value(resolveMarketDate('2024-08-29', '1W', T2))).toBe('2024-09-09');
    // spot Mon 2 Sep + 3M = Mon 2 Dec; + 1D = Tue 3 Sep
    expect(value(resolveMarketDate('2024-08-29', '3M', T2))).toBe('2024-12-02');
    expect(value(resolveMarketDate('2024-08-29', '1D', T2))).toBe('2024-09-03');
  });
  it('resolveMarketDate under modified following stays in the month: 31 Jul 2024 + 1M is Sat 31 Aug, which moves back to Fri 30 Aug', () => {
    const set = { ...T2, spotLagDays: 0 };
    expect(value(resolveMarketDate('2024-07-31', '1M', set))).toBe('2024-08-30');
    expect(value(resolveMarketDate('2024-07-31', '1M', { ...set, businessDay: 'following' }))).toBe('2024-09-02');
  });

  // The end-of-month rule (market usage for swaps and bonds, as in the ISDA 2006 Definitions' roll
  // conventions; cited from memory): a start on the last business day of its month gives an end on
  // the last business day of the end's month. Weekdays: Tue 30 Apr 2024, Fri 31 May 2024,
  // Thu 29 Feb 2024, Fri 29 Mar 2024 (30 and 31 March 2024 are a Saturday and a Sunday).
  it('resolveMarketDate with the end-of-month rule goes from a last business day to a last business day', () => {
    const eom: ConventionSet = { name: 'eom', calendar: 'weekends', businessDay: 'modified-following', endOfMonth: true, spotLagDays: 0 };
    expect(value(resolveMarketDate('2024-04-30', '1M', eom))).toBe('2024-05-31');
    expect(value(resolveMarketDate('2024-04-30', '1M', { ...eom, endOfMonth: false }))).toBe('2024-05-30');
    expect(value(resolveMarketDate('2024-02-29', '1M', eom))).toBe('2024-03-29');
    // Fri 28 Jun 2024 is June's last business day (29 and 30 June are a weekend): + 2M is Fri 30 Aug
    expect(value(resolveMarketDate('2024-06-28', '2M', eom))).toBe('2024-08-30');
    // without a calendar the rule is the month end itself: 28 Feb 2023 + 1Y = 29 Feb 2024
    const noCalendar: ConventionSet = { name: 'eom', calendar: null, businessDay: 'unadjusted', endOfMonth: true, spotLagDays: 0 };
    expect(value(resolveMarketDate('2023-02-28', '1Y', noCalendar))).toBe('2024-02-29');
    expect(value(resolveMarketDate('2023-02-28', '1Y', { ...noCalendar, endOfMonth: false }))).toBe('2024-02-28');
  });

  it('marketDateCivil under every business-day rule lands on a business day for any anchor and tenor (weekends only)', () => {
    const lo = serialFromCivil({ y: 2000, m: 1, d: 1 });
    fc.assert(
      fc.property(fc.integer({ min: lo, max: lo + 20000 }), fc.integer({ min: 1, max: 120 }), fc.constantFrom('D', 'W', 'M', 'Y'), fc.constantFrom('following', 'modified-following', 'preceding'), fc.boolean(), (s, n, unit, rule, eom) => {
        const set: ConventionSet = { name: 'p', calendar: 'weekends', businessDay: rule as ConventionSet['businessDay'], endOfMonth: eom, spotLagDays: 2 };
        const d = marketDateCivil(civilFromSerial(s), { n, unit } as Tenor, set);
        expect(WEEKENDS_ONLY.isBusinessDay(serialFromCivil(d))).toBe(true);
      }),
      { seed: 16, numRuns: 2000 },
    );
  });
});
