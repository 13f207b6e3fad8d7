import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  addMonthsCivil,
  civilFromSerial,
  compileSwap,
  curveClock,
  DAY_COUNTS,
  isoFromCivil,
  serialFromCivil,
  SwapLegs,
  type CivilDate,
  type DayCount,
  type SwapQuote,
} from '../../../src/core/index.ts';

// SwapLegs shares the longest swap's schedule with the shorter swaps of a family. The oracle is
// each swap's own leg (fixedLegCivil, checked against the ISDA day-count examples in
// test/core/time/dayCount.test.ts): shared legs must give the same payment times and year
// fractions to the last bit. Markets are random: month ends, 29th-31st, leap days, every day count.

const day = (y: number, m: number, d: number): CivilDate => ({ y, m, d });
const swap = (index: number, maturity: CivilDate, frequency: number, dayCount: DayCount, eom: boolean): SwapQuote => ({
  kind: 'swap', index, maturity: isoFromCivil(maturity), tenor: null, enabled: true, rate: 0.03, frequency, dayCount, eom,
});

const market = fc.record({
  settlement: fc.integer({ min: serialFromCivil(day(2000, 1, 1)), max: serialFromCivil(day(2060, 12, 31)) }).map(civilFromSerial),
  frequency: fc.constantFrom(1, 2, 4, 12),
  dayCount: fc.constantFrom(...DAY_COUNTS),
  eom: fc.boolean(),
  // Maturities as months after settlement (mostly whole periods, as in a par ladder), each with a day-of-month rule.
  maturities: fc.array(fc.tuple(fc.integer({ min: 1, max: 480 }), fc.boolean(), fc.constantFrom('same', 'same', 'same', 'end', 28, 29, 30, 31)), { minLength: 1, maxLength: 12 }),
});

describe('SwapLegs', () => {
  it('SwapLegs.leg(q, M) gives the same times and year fractions as the swap generating its own leg (random markets)', () => {
    // Clock readings with and without sharing: fewer with it shows the shared path ran.
    const calls = { own: 0, viaLegs: 0 };
    fc.assert(
      fc.property(market, ({ settlement, frequency, dayCount, eom, maturities }) => {
        const clock = curveClock('ACT/365F', settlement);
        const counted = (k: keyof typeof calls) => (d: CivilDate) => (calls[k]++, clock(d));
        const step = 12 / frequency;
        const quotes = maturities.map(([n, whole, rule], i): [SwapQuote, CivilDate] => {
          const m = addMonthsCivil(settlement, whole ? Math.ceil(n / step) * step : n, rule === 'end');
          const last = addMonthsCivil(day(m.y, m.m, 1), 1);
          const monthEnd = serialFromCivil(last) - serialFromCivil(day(m.y, m.m, 1));
          const d = typeof rule === 'number' ? Math.min(rule, monthEnd) : m.d;
          const maturity = day(m.y, m.m, d);
          return [swap(i, maturity, frequency, dayCount, eom), maturity];
        });
        const legs = new SwapLegs(settlement, counted('viaLegs'), quotes);
        for (const [q, maturity] of quotes) {
          const t = clock(maturity);
          const own = compileSwap(q, settlement, maturity, t, counted('own')) as unknown as { times: number[]; taus: number[] };
          const viaLegs = compileSwap(q, settlement, maturity, t, clock, legs) as unknown as { times: number[]; taus: number[] };
          expect(viaLegs.times).toEqual(own.times);
          expect(viaLegs.taus).toEqual(own.taus);
        }
      }),
      { seed: 17, numRuns: 1500 },
    );
    // Sharing needs the longest maturity to carry the shorter ones' day rule; with the random
    // rules above it does in part of the markets (0.82 of the readings with this seed).
    expect(calls.viaLegs).toBeLessThan(0.9 * calls.own);
  });
  it('a 30E/360-ISDA ladder ending in February: the shorter swap ending on the last of February keeps its termination-date rule', () => {
    // 2032-02-29 is a leap-day month end; 2031-02-28 is the last of February of a common year.
    const settlement = day(2027, 2, 28);
    const time = curveClock('ACT/365F', settlement);
    const long = swap(0, day(2032, 2, 29), 1, '30E/360-ISDA', true);
    const short = swap(1, day(2031, 2, 28), 1, '30E/360-ISDA', true);
    const legs = new SwapLegs(settlement, time, [
      [long, day(2032, 2, 29)],
      [short, day(2031, 2, 28)],
    ]);
    const { taus } = legs.leg(short, day(2031, 2, 28));
    // 4.16(h): D2 = 28 stays (termination date), D1 = 30 (last of February 2030): 360 - 2 = 358 days.
    expect(taus.at(-1)).toBe(358 / 360);
    expect(legs.leg(long, day(2032, 2, 29)).taus[3]).toBe(1); // 2030-02-28 to 2031-02-28 mid-leg: both 30
  });
});
