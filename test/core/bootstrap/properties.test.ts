import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  addDays,
  addTenor,
  bondDirtyFromYield,
  bootstrapInstruments,
  compileMarket,
  validateWorkspace,
  bondSchedule,
  buildCurve,
  COMPOUNDINGS,
  convertRate,
  CURVE_DAY_COUNTS,
  curveTime,
  discountOn,
  forwardStrip,
  INTERPOLATIONS,
  isoFromSerial,
  lnDiscountFromRate,
  parseTenor,
  rateFromLnDiscount,
  serialFromIso,
  type Curve,
  type CurveDayCount,
  type InterpolationId,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Property tests with fast-check on a fixed seed, so a failure reproduces. The acceptance bounds
// are the engine contract (issue section 4): |repricing error| <= 1e-11 per 100 for price quotes,
// <= 1e-14 for rate quotes. The random markets are invented test data.
const SEED = 20261202;
const params = (numRuns: number) => ({ seed: SEED, numRuns, endOnFailure: true });
// Property runs build hundreds of curves: allow them more than vitest's default 5 s.
const SLOW = 120_000;

interface Market {
  settlement: string;
  dayCount: CurveDayCount;
  quotes: Record<string, unknown>[];
}

/** A smooth random curve r(t) = level + slope (1 - e^(-t/3)) + hump t e^(-t/4), plus per-quote noise. */
const marketArb = (opts: { dayCounts?: readonly CurveDayCount[] } = {}): fc.Arbitrary<Market> =>
  fc
    .record({
      serial: fc.integer({ min: serialFromIso('2020-01-01'), max: serialFromIso('2035-12-31') }),
      dayCount: fc.constantFrom(...(opts.dayCounts ?? CURVE_DAY_COUNTS)),
      level: fc.double({ min: -0.005, max: 0.07, noNaN: true }),
      slope: fc.double({ min: -0.02, max: 0.03, noNaN: true }),
      hump: fc.double({ min: -0.004, max: 0.004, noNaN: true }),
      deposits: fc.subarray(['1W', '1M', '2M', '3M', '6M', '9M'], { minLength: 1 }),
      billDays: fc.array(fc.integer({ min: 20, max: 360 }), { maxLength: 2 }),
      zeros: fc.array(fc.record({ months: fc.integer({ min: 13, max: 48 }), byPrice: fc.boolean() }), { maxLength: 2 }),
      bonds: fc.array(
        fc.record({ days: fc.integer({ min: 400, max: 5500 }), coupon: fc.double({ min: 0, max: 0.09, noNaN: true }), byYield: fc.boolean(), frequency: fc.constantFrom(1, 2, 4) }),
        { maxLength: 6 },
      ),
      swaps: fc.subarray([2, 3, 5, 7, 10, 12, 15, 20, 25, 30], { minLength: 1 }),
      noise: fc.array(fc.double({ min: -0.0008, max: 0.0008, noNaN: true }), { minLength: 40, maxLength: 40 }),
    })
    .map((g) => {
      const settlement = isoFromSerial(g.serial);
      const rate = (t: number): number => g.level + g.slope * (1 - Math.exp(-t / 3)) + g.hump * t * Math.exp(-t / 4);
      let noiseAt = 0;
      const noise = (): number => g.noise[noiseAt++ % g.noise.length]!;
      const quotes: Record<string, unknown>[] = [];
      const used = new Set<number>();
      const add = (maturity: string, q: Record<string, unknown>): void => {
        const t = curveTime(g.dayCount, settlement, maturity);
        if (used.has(t)) return; // one quote per point of the curve axis
        used.add(t);
        quotes.push(q);
      };
      for (const tenor of g.deposits) {
        const m = addTenor(settlement, parseTenor(tenor)!);
        add(m, { kind: 'deposit', tenor, rate: rate(0.25) + noise() });
      }
      for (const days of g.billDays) {
        const m = addDays(settlement, days);
        add(m, { kind: 'bill', maturity: m, discountYield: Math.max(0.0001, rate(days / 365) + noise()) });
      }
      for (const z of g.zeros) {
        const m = addTenor(settlement, { n: z.months, unit: 'M' });
        const r = rate(z.months / 12) + noise();
        add(m, z.byPrice ? { kind: 'zero', maturity: m, price: 100 * Math.exp(-r * (z.months / 12)) } : { kind: 'zero', maturity: m, rate: r, compounding: 'annual' });
      }
      for (const b of g.bonds) {
        const m = addDays(settlement, b.days);
        const y = rate(b.days / 365) + noise();
        if (b.byYield) {
          add(m, { kind: 'bond', maturity: m, coupon: b.coupon, frequency: b.frequency, yield: y });
        } else {
          const s = bondSchedule({ maturity: m, coupon: b.coupon, frequency: b.frequency, dayCount: 'ACT/ACT-ICMA', eom: false }, settlement);
          add(m, { kind: 'bond', maturity: m, coupon: b.coupon, frequency: b.frequency, eom: false, cleanPrice: bondDirtyFromYield(s, y).price - s.accrued });
        }
      }
      for (const years of g.swaps) {
        const m = addTenor(settlement, { n: years, unit: 'Y' });
        add(m, { kind: 'swap', tenor: `${years}Y`, rate: rate(years) + noise() });
      }
      return { settlement, dayCount: g.dayCount, quotes };
    });

const docOf = (m: Market, interpolation: InterpolationId, extrapolation = 'none') => ({
  format: 'tenorscope-workspace',
  version: 1,
  settlement: m.settlement,
  curve: { dayCount: m.dayCount, interpolation, extrapolation },
  quotes: m.quotes,
});

const lastDate = (curve: Curve): string => curve.pillars[curve.pillars.length - 1]!.date;

describe('every quote reprices within the acceptance bounds, for every interpolation', () => {
  for (const interpolation of INTERPOLATIONS) {
    it(interpolation, () => {
      fc.assert(
        fc.property(marketArb(), (m) => {
          const b = buildCurve(docOf(m, interpolation));
          // monotone-convex-positive refuses a market with a negative discrete forward (by contract).
          if (interpolation === 'monotone-convex-positive' && b.errors.length > 0 && b.errors.every((e) => /needs positive forwards/.test(e.message))) return;
          expect(b.errors).toEqual([]);
          expect(b.repricing.length).toBe(m.quotes.length);
          for (const r of b.repricing) {
            expect(Math.abs(r.repricingError), `quotes[${r.index}] ${r.kind} ${r.unit}`).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
          }
        }),
        params(interpolation === 'cubic-zero' || interpolation.startsWith('monotone') ? 40 : 80),
      );
    }, SLOW);
  }
});

describe('the repricing reported is the built curve\'s own, bit for bit', () => {
  // The local methods reprice from the values their one pass left at every cash flow, not by
  // reading the finished curve again (bootstrap.ts, solveLocal): this holds only if those values
  // are exactly what curve.lnDiscountAt gives at the same times. Checked with toBe, not a tolerance.
  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: every model quote equals modelQuote(curve.lnDiscountAt)`, () => {
      fc.assert(
        fc.property(marketArb(), (m) => {
          const ws = validateWorkspace(docOf(m, interpolation)).workspace!;
          const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
          const out = bootstrapInstruments({ settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation, extrapolation: 'none' }, market.instruments);
          if (!out.curve) return; // monotone-convex-positive refuses negative forwards (by contract)
          market.instruments.forEach((ins, i) => {
            expect(out.repricing[i]!.model, `quotes[${ins.index}] ${ins.kind}`).toBe(ins.modelQuote(out.curve!.lnDiscountAt));
          });
        }),
        params(interpolation === 'cubic-zero' || interpolation.startsWith('monotone') ? 20 : 100),
      );
    }, SLOW);
  }
});

describe('forward strips chain back to spots under every query day count', () => {
  it('the product of growth factors, each on its own year fraction, is the growth to the horizon', () => {
    fc.assert(
      fc.property(
        marketArb(),
        fc.constantFrom(...INTERPOLATIONS.filter((x) => x !== 'monotone-convex-positive')),
        fc.constantFrom('2W', '1M', '3M', '6M', '1Y'),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        (m, interpolation, tenorText, where) => {
          const b = buildCurve(docOf(m, interpolation));
          expect(b.errors).toEqual([]);
          const curve = b.curve!;
          const span = serialFromIso(lastDate(curve)) - serialFromIso(curve.settlement);
          const horizon = addDays(curve.settlement, Math.max(1, Math.round(where * span)));
          const tenor = parseTenor(tenorText)!;
          const dfH = discountOn(curve, horizon);
          if (!dfH.ok) throw new Error(JSON.stringify(dfH.errors));
          for (const dc of CURVE_DAY_COUNTS) {
            for (const c of COMPOUNDINGS) {
              const strip = forwardStrip(curve, tenor, horizon, c, dc);
              if (!strip.ok) throw new Error(JSON.stringify(strip.errors));
              const periods = strip.value;
              expect(periods[0]!.start).toBe(curve.settlement);
              expect(periods[periods.length - 1]!.end).toBe(horizon);
              let lnGrowth = 0;
              periods.forEach((p, k) => {
                if (k > 0) expect(p.start).toBe(periods[k - 1]!.end);
                // Period ends are settlement + k x tenor, counted from settlement, never chained.
                if (k < periods.length - 1) expect(p.end).toBe(addTenor(curve.settlement, tenor, k + 1));
                lnGrowth -= lnDiscountFromRate(p.rate, c, p.tau);
              });
              expectClose(lnGrowth, -Math.log(dfH.value.discount), 1e-13 * Math.max(1, periods.length), `strip identity, issue section 6 (${dc}, ${c})`);
            }
          }
        },
      ),
      params(25),
    );
  }, SLOW);
});

describe('discount factors decrease wherever forwards are positive', () => {
  it('on a one-day grid: f > 0 at both ends and the middle of a day implies DF falls over that day', () => {
    fc.assert(
      fc.property(marketArb({ dayCounts: ['ACT/365F', 'ACT/360', 'ACT/ACT-ISDA'] }), fc.constantFrom(...INTERPOLATIONS), (m, interpolation) => {
        const b = buildCurve(docOf(m, interpolation));
        if (b.errors.length > 0 && interpolation === 'monotone-convex-positive') return;
        expect(b.errors).toEqual([]);
        const curve = b.curve!;
        const days = serialFromIso(lastDate(curve)) - serialFromIso(curve.settlement);
        let prevT = 0;
        for (let k = 1; k <= days; k++) {
          const t = curve.time(addDays(curve.settlement, k));
          const positive = Math.min(curve.forwardAt(prevT), curve.forwardAt(0.5 * (prevT + t)), curve.forwardAt(t - 1e-12)) > 1e-6;
          if (positive) expect(curve.lnDiscountAt(t)).toBeLessThan(curve.lnDiscountAt(prevT));
          prevT = t;
        }
      }),
      params(30),
    );
  }, SLOW);
});

describe('compounding conversions round-trip', () => {
  it('convertRate there and back, and rate <-> ln DF, for every pair of compoundings', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -0.05, max: 0.5, noNaN: true }),
        fc.double({ min: 1 / 365, max: 50, noNaN: true }),
        fc.constantFrom(...COMPOUNDINGS),
        fc.constantFrom(...COMPOUNDINGS),
        (r, tau, from, to) => {
          // Domain (compounding.ts): a simple rate needs 1 + r tau > 0; outside it there is no
          // discount factor to convert (the engine reports non-positive-discount there).
          fc.pre(1 + r * tau > 0.01);
          const there = convertRate(r, from, to, tau);
          const back = convertRate(there, to, from, tau);
          expectClose(back, r, 1e-12 * Math.max(1, Math.abs(r)), `round trip ${from} -> ${to} -> ${from} (definitions, issue section 2.4)`);
          const ln = lnDiscountFromRate(r, from, tau);
          expectClose(rateFromLnDiscount(ln, from, tau), r, 1e-12, `rate -> ln DF -> rate (${from})`);
          // The discount factor is what is conserved.
          expectClose(lnDiscountFromRate(there, to, tau), ln, 1e-12 * Math.max(1, Math.abs(ln)), 'same discount factor in both conventions');
        },
      ),
      params(2000),
    );
  }, SLOW);
});

/** Zero-coupon market from strictly increasing pillar days and discrete forwards (continuous, ACT/365F). */
const zeroMarketArb = (minD: number, maxD: number) =>
  fc
    .record({
      serial: fc.integer({ min: serialFromIso('2021-01-01'), max: serialFromIso('2034-12-31') }),
      gaps: fc.array(fc.integer({ min: 20, max: 1500 }), { minLength: 4, maxLength: 12 }),
      fwds: fc.array(fc.double({ min: minD, max: maxD, noNaN: true }), { minLength: 12, maxLength: 12 }),
    })
    .map((g) => {
      const settlement = isoFromSerial(g.serial);
      let day = 0;
      let lnDf = 0;
      const quotes = g.gaps.map((gap, i) => {
        day += gap;
        lnDf -= g.fwds[i]! * (gap / 365);
        const t = day / 365;
        return { kind: 'zero', maturity: addDays(settlement, day), rate: -lnDf / t, compounding: 'continuous', dayCount: 'ACT/365F' };
      });
      return { settlement, dayCount: 'ACT/365F' as CurveDayCount, quotes };
    });

describe('monotone-convex-positive: every d_i > 0 gives f(t) >= 0 on a one-day grid', () => {
  it('holds on random positive-forward markets with wild swings between pillars', () => {
    fc.assert(
      fc.property(zeroMarketArb(0.0001, 0.2), (m) => {
        const b = buildCurve(docOf(m, 'monotone-convex-positive'));
        expect(b.errors).toEqual([]);
        const curve = b.curve!;
        const days = serialFromIso(lastDate(curve)) - serialFromIso(curve.settlement);
        for (let k = 0; k <= days; k++) {
          const f = curve.forwardAt(curve.time(addDays(curve.settlement, k)));
          expect(f, `f on day ${k}`).toBeGreaterThanOrEqual(0);
        }
      }),
      params(60),
    );
  }, SLOW);
  it('the property can fail: plain monotone-convex goes negative on such a market (a fixed example)', () => {
    // Forwards 10 %, 0.1 %, 10 %: the unconstrained node forwards pull f below zero in the middle segment.
    const m = {
      settlement: '2027-01-04',
      dayCount: 'ACT/365F' as CurveDayCount,
      quotes: [
        { kind: 'zero', maturity: '2028-01-04', rate: 0.1, compounding: 'continuous', dayCount: 'ACT/365F' },
        { kind: 'zero', maturity: '2029-01-03', rate: (0.1 + 0.001) / 2, compounding: 'continuous', dayCount: 'ACT/365F' },
        { kind: 'zero', maturity: '2030-01-03', rate: (0.1 + 0.001 + 0.1) / 3, compounding: 'continuous', dayCount: 'ACT/365F' },
      ],
    };
    const min = (interpolation: InterpolationId): number => {
      const curve = buildCurve(docOf(m, interpolation)).curve!;
      let lo = Infinity;
      for (let k = 0; k <= 1095; k++) lo = Math.min(lo, curve.forwardAt(curve.time(addDays(m.settlement, k))));
      return lo;
    };
    expect(min('monotone-convex')).toBeLessThan(0);
    expect(min('monotone-convex-positive')).toBeGreaterThanOrEqual(0);
  });
});

// Locality of Hagan-West monotone convex (issue section 9): node k moves d_k and d_(k+1), hence
// the node forwards f_(k-1), f_k, f_(k+1), hence f on segments k-1 .. k+2 = (t_(k-2), t_(k+2)).
describe('monotone-convex locality: moving the quote at pillar k leaves f unchanged outside (t_(k-2), t_(k+2))', () => {
  for (const interpolation of ['monotone-convex', 'monotone-convex-positive'] as const) {
    it(interpolation, () => {
      fc.assert(
        fc.property(zeroMarketArb(0.001, 0.08), fc.nat(), fc.double({ min: -0.005, max: 0.005, noNaN: true }), (m, kRaw, bump) => {
          const n = m.quotes.length;
          const k = 1 + (kRaw % n); // pillar k = quote k-1 (quotes are in maturity order)
          const moved = { ...m, quotes: m.quotes.map((q, i) => (i === k - 1 ? { ...q, rate: (q.rate as number) + bump } : q)) };
          const a = buildCurve(docOf(m, interpolation)).curve;
          const b = buildCurve(docOf(moved, interpolation)).curve;
          if (!a || !b) return; // the bump made a discrete forward negative: refused by the positive variant
          const ts = [0, ...a.pillars.map((p) => p.t)];
          const lo = k - 2 >= 0 ? ts[k - 2]! : -Infinity;
          const hi = k + 2 <= n ? ts[k + 2]! : Infinity;
          const days = serialFromIso(lastDate(a)) - serialFromIso(a.settlement);
          for (let day = 0; day < days; day++) {
            const t = a.time(addDays(a.settlement, day));
            if (t > lo && t < hi) continue;
            // The end conditions reach one node further: f_0 = d_1 - (f_1 - d_1)/2 moves with f_1,
            // which moves with d_2, so f(t_0) changes when k = 2 although t_0 = t_(k-2); likewise
            // f_n when k = n - 2 (t_n = t_(k+2), not on this grid, which stops before t_n).
            if (k === 2 && day === 0) continue;
            expectClose(b.forwardAt(t), a.forwardAt(t), 1e-15, `Hagan-West locality (k = ${k}, day ${day})`);
          }
        }),
        params(60),
      );
    }, SLOW);
  }
});
