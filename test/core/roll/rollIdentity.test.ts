// The forwards-realised identity: if every future rate turns out to be today's forward, rolling,
// the zero to the horizon, the par bond to the horizon with coupons reinvested, and riding a
// longer par bond sold on the implied horizon curve all end with the same money. This is what
// forward rates mean: "if forwards are realised, every bond earns the same return over a period,
// the short rate" (Tuckman and Serrat, "Fixed Income Securities", chapter on returns; cited from
// memory). Checked as a property over random curves bootstrapped from random deposit, zero and
// swap quotes on random curve day counts and interpolations, random settlement dates, horizons, roll tenors and bond frequencies.
import fc from 'fast-check';
import { buildCurve, INTERPOLATIONS, type Curve } from '../../../src/core/index.ts';
import {
  analyseRollVsTerm,
  DEFAULT_STRATEGY,
  ROLL_TENORS,
  STRATEGY_FREQUENCIES,
  type StrategyInputs,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

const IDENTITY = 'forwards-realised identity (Tuckman and Serrat, from memory): all strategies end equal';

const isoOf = (y: number, m: number, d: number): string => `${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`;

/** A random market: deposits to 6M, then zeros or swaps out to 10Y or 15Y, rates -0.5 % to 8 %. */
const marketArb = fc.record({
  y: fc.integer({ min: 2020, max: 2035 }),
  m: fc.integer({ min: 1, max: 12 }),
  d: fc.integer({ min: 1, max: 28 }),
  interpolation: fc.constantFrom(...INTERPOLATIONS),
  dayCount: fc.constantFrom('ACT/365F', 'ACT/360', '30/360', 'ACT/ACT-ISDA'),
  depo: fc.array(fc.double({ min: -0.005, max: 0.08, noNaN: true }), { minLength: 3, maxLength: 3 }),
  long: fc.array(
    fc.record({ rate: fc.double({ min: -0.005, max: 0.08, noNaN: true }), kind: fc.constantFrom('swap', 'zero') }),
    { minLength: 7, maxLength: 7 },
  ),
});

type Market = typeof marketArb extends fc.Arbitrary<infer T> ? T : never;

function curveOf(market: Market): Curve | null {
  const quotes: unknown[] = [
    { kind: 'deposit', tenor: '1M', rate: market.depo[0] },
    { kind: 'deposit', tenor: '3M', rate: market.depo[1] },
    { kind: 'deposit', tenor: '6M', rate: market.depo[2] },
  ];
  ['1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '15Y'].forEach((tenor, i) => {
    const q = market.long[i]!;
    quotes.push(q.kind === 'swap' ? { kind: 'swap', tenor, rate: q.rate } : { kind: 'zero', tenor, rate: q.rate });
  });
  const doc = {
    format: 'tenorscope-workspace',
    version: 1,
    settlement: isoOf(market.y, market.m, market.d),
    curve: { dayCount: market.dayCount, interpolation: market.interpolation, extrapolation: 'none' },
    quotes,
  };
  return buildCurve(doc, {}).curve;
}

const strategyArb = fc.record({
  rollTenor: fc.constantFrom(...ROLL_TENORS),
  horizonMonths: fc.integer({ min: 1, max: 96 }),
  horizonDays: fc.integer({ min: 0, max: 40 }),
  ridingYears: fc.integer({ min: 1, max: 6 }),
  bondFrequency: fc.constantFrom(...STRATEGY_FREQUENCIES),
  ridingFrequency: fc.constantFrom(...STRATEGY_FREQUENCIES),
  rollDayCount: fc.constantFrom('ACT/360' as const, 'ACT/365F' as const, '30/360' as const),
});

describe('forwards realised: every strategy ends equal', () => {
  it('holds to 1e-12 of the amount over random curves, horizons and roll tenors, for all three term strategies', () => {
    let checked = 0;
    fc.assert(
      fc.property(marketArb, strategyArb, (market, s) => {
        const curve = curveOf(market);
        fc.pre(curve !== null);
        // horizon: a whole number of months plus some days, as a date (often not a whole number of rolls)
        const base = curve!.settlement;
        const [y, m, d] = base.split('-').map(Number) as [number, number, number];
        const months = m - 1 + s.horizonMonths;
        const hy = y + Math.floor(months / 12);
        const hm = (months % 12) + 1;
        const horizonDate = isoOf(hy, hm, Math.min(d + Math.floor(s.horizonDays / 2), 28));
        const strategy: StrategyInputs = {
          ...DEFAULT_STRATEGY,
          amount: '1000000',
          horizon: horizonDate,
          rollTenor: s.rollTenor,
          rollDayCount: s.rollDayCount,
          bondFrequency: s.bondFrequency,
          ridingFrequency: s.ridingFrequency,
          ridingMaturity: isoOf(hy + s.ridingYears, hm, 28),
          view: 'forwards',
        };
        const result = analyseRollVsTerm(curve!, strategy);
        if (!result.ok) throw new Error(`analysis failed: ${result.errors.map((e) => e.message).join('; ')}`);
        const forwards = result.value.views.find((v) => v.id === 'forwards')!;
        const roll = forwards.strategies.find((x) => x.id === 'roll')!;
        for (const term of forwards.strategies) {
          // growth is terminal value per unit of the amount: a difference of 1e-12 in growth is 1e-12 of the amount
          expectClose(term.growth, roll.growth, 1e-12, `${IDENTITY}; ${term.id} vs roll, horizon ${horizonDate}, ${s.rollTenor}`);
          const moneyGap = term.terminal.minus(roll.terminal).abs().div(result.value.amount).toNumber();
          expectClose(moneyGap, 0, 1e-12, `${IDENTITY}; ${term.id} money gap relative to the amount`);
        }
        checked++;
      }),
      { numRuns: 150, seed: 20261202 },
    );
    expect(checked).toBeGreaterThan(100);
  }, 120_000); // a limit for a hung run on a loaded machine, not a speed check

  it('puts the break-even parallel shift against forwards at 0 bp for every term strategy', () => {
    fc.assert(
      fc.property(marketArb, fc.constantFrom(...ROLL_TENORS), fc.integer({ min: 13, max: 60 }), (market, rollTenor, months) => {
        const curve = curveOf(market);
        fc.pre(curve !== null);
        const result = analyseRollVsTerm(curve!, { ...DEFAULT_STRATEGY, view: 'forwards', rollTenor, horizon: `${months}M`, ridingMaturity: '10Y' });
        if (!result.ok) throw new Error(result.errors.map((e) => e.message).join('; '));
        for (const id of ['zero', 'bond', 'riding'] as const) {
          const s = result.value.breakEvens.shiftBp[id];
          expect(s, `break-even shift for ${id} exists`).not.toBeNull();
          // the root of a difference that is ~1e-16 at 0 and moves ~1e-4 per bp: |s| well under 1e-6 bp
          expectClose(s!, 0, 1e-6, `${IDENTITY}: under forwards the strategies cross at a zero shift (${id})`);
        }
      }),
      { numRuns: 40, seed: 7 },
    );
  }, 120_000);
});
