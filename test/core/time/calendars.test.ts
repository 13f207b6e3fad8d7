import { readFileSync } from 'node:fs';
import easter from 'date-easter';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import ewFeed from '../../fixtures/calendars/gov-uk-england-and-wales.json';
import {
  addBusinessDays,
  adjustSerial,
  BUILT_IN_CALENDARS,
  builtInHolidays,
  businessCalendar,
  closedWeekdays,
  easterSunday,
  isWeekend,
  outsideCalendar,
  type BusinessCalendar,
  type BusinessDayRule,
} from '../../../src/core/time/calendars.ts';
import { civilFromSerial, isoFromSerial, serialFromIso } from '../../../src/core/time/date.ts';

const cal = (spec: string, context = {}): BusinessCalendar => {
  const o = businessCalendar(spec, context);
  if (!o.ok) throw new Error(o.message);
  return o.calendar;
};
const s = serialFromIso;
const iso = isoFromSerial;
const holidaysIn = (spec: string, from: string, to: string): string[] => closedWeekdays(cal(spec), from, to);

describe('easterSunday', () => {
  it('equals the date-easter package (a general-purpose npm library, devDependency oracle) for every year 1900-2100', () => {
    const differ: string[] = [];
    for (let y = 1900; y <= 2100; y++) {
      const e = easter.gregorianEaster(y);
      const want = `${e.year}-${String(e.month).padStart(2, '0')}-${String(e.day).padStart(2, '0')}`;
      if (iso(easterSunday(y)) !== want) differ.push(`${y}: ${iso(easterSunday(y))} vs ${want}`);
    }
    expect(differ).toEqual([]);
  });

  it('gives the dates the publishers print: GOV.UK Good Friday and Easter Monday 2019-2027, and the latest possible, 25 April 2038 (Meeus, the date range 22 March to 25 April)', () => {
    const ew = (ewFeed as { events: { title: string; date: string }[] }).events;
    const goodFridays = ew.filter((e) => e.title === 'Good Friday').map((e) => e.date);
    const easterMondays = ew.filter((e) => e.title === 'Easter Monday').map((e) => e.date);
    expect(goodFridays).toHaveLength(9);
    expect(goodFridays).toEqual(Array.from({ length: 9 }, (_, k) => iso(easterSunday(2019 + k) - 2)));
    expect(easterMondays).toEqual(Array.from({ length: 9 }, (_, k) => iso(easterSunday(2019 + k) + 1)));
    expect(iso(easterSunday(2038))).toBe('2038-04-25');
    for (let y = 1583; y <= 3000; y++) {
      const c = civilFromSerial(easterSunday(y));
      expect(c.m * 100 + c.d).toBeGreaterThanOrEqual(322);
      expect(c.m * 100 + c.d).toBeLessThanOrEqual(425);
    }
  });
});

describe('england-wales against the GOV.UK feed', () => {
  it('gives exactly the 75 bank holidays GOV.UK lists for 2019-2027 (substitute days, the 2020 VE Day move, the 2022 jubilee and state funeral, the 2023 coronation)', () => {
    const published = (ewFeed as { events: { date: string }[] }).events.map((e) => e.date).sort();
    expect(published).toHaveLength(75);
    expect(holidaysIn('england-wales', '2019-01-01', '2027-12-31')).toEqual(published);
  });

  it('moves Christmas and Boxing Day as GOV.UK states: 2021 (Saturday) to 27 and 28, 2022 (Sunday) to 26 and 27, 2020 (Friday) Boxing Day to 28', () => {
    expect(holidaysIn('england-wales', '2020-12-20', '2020-12-31')).toEqual(['2020-12-25', '2020-12-28']);
    expect(holidaysIn('england-wales', '2021-12-20', '2021-12-31')).toEqual(['2021-12-27', '2021-12-28']);
    expect(holidaysIn('england-wales', '2022-12-20', '2022-12-31')).toEqual(['2022-12-26', '2022-12-27']);
  });
});

describe('us-gov-securities against the days SOFR was published (Federal Reserve Bank of New York, via FRED, 2019-08-29 to 2024-08-29)', () => {
  const rows = readFileSync(new URL('../../fixtures/sofr/SOFR.csv', import.meta.url), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));

  it('is closed exactly on the weekdays with no published rate (Good Friday 2021 and 2023, Juneteenth from 2022, Columbus and Veterans Days included)', () => {
    expect(rows[0]![0]).toBe('2019-08-29');
    expect(rows.at(-1)![0]).toBe('2024-08-29');
    const unpublished = rows.filter(([d, v]) => v === '.' && !isWeekend(s(d!))).map(([d]) => d!);
    expect(unpublished.length).toBeGreaterThan(50);
    expect(unpublished).toContain('2021-04-02');
    expect(unpublished).toContain('2023-04-07');
    expect(holidaysIn('us-gov-securities', '2019-08-29', '2024-08-29')).toEqual(unpublished);
  });

  it('stays open on a Saturday New Year and Veterans Day (SOFR published 2021-12-31 and 2023-11-10) but closes the Friday before a Saturday Independence Day and Christmas (2020-07-03, 2021-12-24)', () => {
    const published = new Set(rows.filter(([, v]) => v !== '.').map(([d]) => d));
    for (const d of ['2021-12-31', '2023-11-10']) {
      expect(published.has(d)).toBe(true);
      expect(cal('us-gov-securities').isBusinessDay(s(d))).toBe(true);
    }
    for (const d of ['2020-07-03', '2021-12-24']) {
      expect(published.has(d)).toBe(false);
      expect(cal('us-gov-securities').isBusinessDay(s(d))).toBe(false);
    }
  });
});

describe('us-federal-reserve against the Board of Governors K.8 lists', () => {
  // K.8 "Holidays Observed by the Federal Reserve System 2026-2030" (last update 2025-12-31) and the
  // 2020-2024 edition (last update 2020-08-04, archived; before Juneteenth was a holiday, so its
  // years 2020 and 2021 are used). A Saturday holiday leaves the Reserve Banks open on the Friday;
  // a Sunday one closes the Monday (the lists' own footnotes).
  const K8: Record<number, string[]> = {
    2020: ['01-01', '01-20', '02-17', '05-25', '09-07', '10-12', '11-11', '11-26', '12-25'],
    2021: ['01-01', '01-18', '02-15', '05-31', '07-05', '09-06', '10-11', '11-11', '11-25'],
    2026: ['01-01', '01-19', '02-16', '05-25', '06-19', '09-07', '10-12', '11-11', '11-26', '12-25'],
    2027: ['01-01', '01-18', '02-15', '05-31', '07-05', '09-06', '10-11', '11-11', '11-25'],
    2028: ['01-17', '02-21', '05-29', '06-19', '07-04', '09-04', '10-09', '11-23', '12-25'],
    2029: ['01-01', '01-15', '02-19', '05-28', '06-19', '07-04', '09-03', '10-08', '11-12', '11-22', '12-25'],
    2030: ['01-01', '01-21', '02-18', '05-27', '06-19', '07-04', '09-02', '10-14', '11-11', '11-28', '12-25'],
  };

  it('closes exactly the weekdays of the K.8 lists for 2020, 2021 and 2026-2030', () => {
    for (const [y, days] of Object.entries(K8)) expect(holidaysIn('us-federal-reserve', `${y}-01-01`, `${y}-12-31`), y).toEqual(days.map((d) => `${y}-${d}`));
  });

  it('is open on Good Friday and on 2027-06-18 (Juneteenth on a Saturday), where us-gov-securities closes Good Friday', () => {
    expect(cal('us-federal-reserve').isBusinessDay(s('2027-06-18'))).toBe(true);
    expect(cal('us-federal-reserve').isBusinessDay(s('2026-04-03'))).toBe(true);
    expect(cal('us-gov-securities').isBusinessDay(s('2026-04-03'))).toBe(false);
  });
});

describe('target against the ECB closing-day decisions', () => {
  it('from 2002: New Year, Good Friday, Easter Monday, 1 May, 25 and 26 December with no substitutes (ECB press release 2000-12-14)', () => {
    expect(holidaysIn('target', '2024-01-01', '2024-12-31')).toEqual(['2024-01-01', '2024-03-29', '2024-04-01', '2024-05-01', '2024-12-25', '2024-12-26']);
    // 2005: 1 January and 1 May on a weekend, not replaced (three weekday closures besides Easter).
    expect(holidaysIn('target', '2005-01-01', '2005-12-31')).toEqual(['2005-03-25', '2005-03-28', '2005-12-26']);
  });

  it('1999: only New Year, Christmas and 31 December (ECB releases 1998-09-03 and 1999-03-31); 2000: the six days (release 1999-07-15); none before 1999', () => {
    expect(holidaysIn('target', '1999-01-01', '1999-12-31')).toEqual(['1999-01-01', '1999-12-31']);
    expect(holidaysIn('target', '2000-01-01', '2000-12-31')).toEqual(['2000-04-21', '2000-04-24', '2000-05-01', '2000-12-25', '2000-12-26']);
    expect(outsideCalendar(cal('target'), s('1998-06-01'))).toBe('1998-06-01 is outside the years the calendar target covers (1999 to 2100)');
  });

  it('closes Thursday evening to Tuesday over Easter 2024 (four days: codelist.biz, 2024-03-23)', () => {
    const t = cal('target');
    expect(['2024-03-28', '2024-03-29', '2024-03-30', '2024-03-31', '2024-04-01', '2024-04-02'].map((d) => t.isBusinessDay(s(d)))).toEqual([true, false, false, false, false, true]);
  });
});

describe('business-day rules (2006 ISDA Definitions 4.12)', () => {
  const t = cal('target');
  const adj = (d: string, rule: BusinessDayRule, c: BusinessCalendar = t): string => iso(adjustSerial(s(d), rule, c));

  it('moves a holiday or weekend by each rule; modified following stays in the month at a month end', () => {
    // Saturday 2026-02-28: the next business day is Monday 2 March, in the next month.
    expect(adj('2026-02-28', 'following')).toBe('2026-03-02');
    expect(adj('2026-02-28', 'modified-following')).toBe('2026-02-27');
    expect(adj('2026-02-28', 'preceding')).toBe('2026-02-27');
    expect(adj('2026-02-28', 'unadjusted')).toBe('2026-02-28');
    // Sunday 2026-03-01: preceding leaves the month, modified preceding does not.
    expect(adj('2026-03-01', 'preceding')).toBe('2026-02-27');
    expect(adj('2026-03-01', 'modified-preceding')).toBe('2026-03-02');
    // Good Friday 2026-04-03 on TARGET: Easter Monday is closed too, so following is Tuesday 7 April.
    expect(adj('2026-04-03', 'following')).toBe('2026-04-07');
    expect(adj('2026-04-03', 'modified-following')).toBe('2026-04-07');
    expect(adj('2026-04-03', 'preceding')).toBe('2026-04-02');
  });

  it('counts business days from the date itself, a weekend one included (TARGET, Saturday 2026-06-20 + 2 = Tuesday 2026-06-23: common practice, the conventions notes)', () => {
    expect(iso(addBusinessDays(s('2026-06-20'), 2, t))).toBe('2026-06-23');
    // Over the long Easter weekend of 2024: Thursday + 1 business day is Tuesday.
    expect(iso(addBusinessDays(s('2024-03-28'), 1, t))).toBe('2024-04-02');
    expect(iso(addBusinessDays(s('2024-04-02'), -1, t))).toBe('2024-03-28');
  });

  it('properties: adjusted days are business days; modified following never leaves the month; a joined calendar closes the union', () => {
    const joined = cal('us-gov-securities+england-wales');
    const us = cal('us-gov-securities');
    const uk = cal('england-wales');
    fc.assert(
      fc.property(fc.integer({ min: s('1999-01-01'), max: s('2099-12-01') }), fc.constantFrom(...BUILT_IN_CALENDARS), (day, id) => {
        const c = cal(id);
        for (const rule of ['following', 'modified-following', 'preceding', 'modified-preceding'] as const) expect(c.isBusinessDay(adjustSerial(day, rule, c))).toBe(true);
        expect(civilFromSerial(adjustSerial(day, 'modified-following', c)).m).toBe(civilFromSerial(day).m);
        expect(joined.isBusinessDay(day)).toBe(us.isBusinessDay(day) && uk.isBusinessDay(day));
      }),
      { seed: 17, numRuns: 3000 },
    );
  });
});

describe('calendar names and a workspace\'s own calendars', () => {
  it('refuses an unknown name and lists the valid ones', () => {
    const o = businessCalendar('nyc');
    expect(o.ok).toBe(false);
    expect(!o.ok && o.message).toBe('the calendar "nyc" is not known; use one of weekends, us-gov-securities, us-federal-reserve, target, england-wales, or join them with +');
    expect(businessCalendar('target+').ok).toBe(false);
  });

  it('applies added and removed dates, and reads a calendar defined from a list of dates', () => {
    const edited = cal('target', { edits: { target: { add: ['2026-06-15'], remove: ['2026-05-01'] } } });
    expect(edited.isBusinessDay(s('2026-06-15'))).toBe(false);
    expect(edited.isBusinessDay(s('2026-05-01'))).toBe(true);
    const custom = cal('desk-list+target', { custom: { 'desk-list': { holidays: ['2026-07-14', '2026-08-15'] } } });
    expect(closedWeekdays(custom, '2026-07-01', '2026-08-31')).toEqual(['2026-07-14']); // 15 August 2026 is a Saturday
    expect(builtInHolidays('weekends', 2026)).toEqual([]);
  });
});
