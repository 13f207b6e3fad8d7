import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compoundOvernight } from '../../../src/core/rates/overnightCompounding.ts';
import { businessCalendar } from '../../../src/core/time/calendars.ts';
import { civilFromSerial, serialFromIso } from '../../../src/core/time/date.ts';

// The Federal Reserve Bank of New York's SOFR, SOFR Averages (30, 90, 180 days) and SOFR Index,
// 2019-08-29 to 2024-08-29, as distributed by FRED (test/fixtures/sofr/SOURCE.md). FRED dates
// SOFR by the business day it applies to, and the averages and the index by the day they are
// published; an average published on day D compounds SOFR over the calendar days [D - N, D).
const read = (name: string): Map<number, number> => {
  const rows = readFileSync(new URL(`../../fixtures/sofr/${name}.csv`, import.meta.url), 'utf8').trim().split('\n').slice(1);
  const out = new Map<number, number>();
  for (const line of rows) {
    const [date, value] = line.split(',');
    if (value !== '.') out.set(serialFromIso(date!), Number(value));
  }
  return out;
};
const fixings = new Map([...read('SOFR')].map(([d, v]) => [d, v / 100]));
const calendar = (() => {
  const o = businessCalendar('us-gov-securities');
  if (!o.ok) throw new Error(o.message);
  return o.calendar;
})();

describe('compoundOvernight against the published SOFR Averages', () => {
  for (const days of [30, 90, 180]) {
    it(`reproduces every published ${days}-day average to its 5 decimals (percent), non-business starts and year ends included`, () => {
      const published = read(`SOFR${days}DAYAVG`);
      const first = Math.min(...fixings.keys());
      const differ: string[] = [];
      let checked = 0;
      let nonBusinessStarts = 0;
      let yearEnds = 0;
      for (const [d, avg] of published) {
        const start = d - days;
        if (start < first) continue;
        const r = compoundOvernight(fixings, start, d, calendar, 360);
        if (!r.ok) throw new Error(r.errors[0]!.message);
        const pct = Math.round(r.value.rate * 100 * 1e5) / 1e5;
        if (Math.abs(pct - avg) > 1e-9) differ.push(`${d}: ${pct} vs ${avg}`);
        checked++;
        if (!calendar.isBusinessDay(start)) nonBusinessStarts++;
        if (civilFromSerial(start).y !== civilFromSerial(d - 1).y) yearEnds++;
      }
      expect(differ).toEqual([]);
      expect(checked).toBeGreaterThan(1000);
      expect(nonBusinessStarts).toBeGreaterThan(100);
      expect(yearEnds).toBeGreaterThan(50);
    });
  }
});

describe('compoundOvernight against the published SOFR Index', () => {
  it("the index ratio over periods of 1 to 250 business days equals the compounded factor within the index's 8 decimals", () => {
    const index = read('SOFRINDEX');
    const days = [...index.keys()];
    let worst = 0;
    let periods = 0;
    for (let i = 0; i < days.length; i += 7) {
      for (const k of [1, 5, 21, 63, 250]) {
        const j = i + k;
        if (j >= days.length) continue;
        // The index published on day D includes SOFR up to the business day before D: the same window [start, D).
        const r = compoundOvernight(fixings, days[i]!, days[j]!, calendar, 360);
        if (!r.ok) throw new Error(r.errors[0]!.message);
        worst = Math.max(worst, Math.abs(r.value.factor - index.get(days[j]!)! / index.get(days[i]!)!));
        periods++;
      }
    }
    expect(periods).toBeGreaterThan(800);
    // Each index value is rounded to 8 decimals (values about 1.03 to 1.13): each end contributes up to 5e-9.
    expect(worst).toBeLessThan(1.5e-8);
  });

  it('names a missing fixing and refuses an empty period', () => {
    const gap = new Map(fixings);
    gap.delete(serialFromIso('2023-03-15'));
    const r = compoundOvernight(gap, serialFromIso('2023-03-01'), serialFromIso('2023-03-31'), calendar);
    expect(!r.ok && r.errors[0]!.message).toBe('there is no fixing for 2023-03-15, a business day on us-gov-securities; add it or check the calendar');
    expect(compoundOvernight(fixings, 100, 100, calendar).ok).toBe(false);
  });
});
