// Edge markets: each either builds (every quote repricing within its acceptance bound) or fails
// with a message naming the quote. The markets are invented test data; the bounds are the
// engine's contract (README, "Bootstrap and interpolation").
import { describe, expect, it } from 'vitest';
import { acceptanceBound, buildCurve, INTERPOLATIONS, zeroOn, type CurveBuild } from '../../src/core/index.ts';

const doc = (quotes: object[], extra: object = {}) => ({
  format: 'tenorscope-workspace',
  version: 1,
  settlement: '2027-03-10',
  quotes,
  ...extra,
});

function expectBuilds(build: CurveBuild): void {
  expect(build.errors).toEqual([]);
  expect(build.curve).not.toBeNull();
  for (const r of build.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(acceptanceBound(r.unit));
}

const swaps = (rates: Record<string, number>) => Object.entries(rates).map(([tenor, rate]) => ({ kind: 'swap', tenor, rate }));

describe('edge markets build or name the quote at fault', () => {
  it.each(INTERPOLATIONS.filter((m) => m !== 'monotone-convex-positive'))('negative rates down to -2%% build under %s, with a negative-forward warning', (m) => {
    const b = buildCurve(doc([{ kind: 'deposit', tenor: '3M', rate: -0.02 }, ...swaps({ '2Y': -0.015, '5Y': -0.005, '10Y': 0.002 })], { curve: { interpolation: m } }));
    expectBuilds(b);
    expect(b.warnings.some((w) => w.code === 'negative-forward')).toBe(true);
  });

  it('monotone-convex-positive refuses a negative discrete forward and names the quote', () => {
    const b = buildCurve(doc([{ kind: 'deposit', tenor: '3M', rate: -0.02 }, ...swaps({ '2Y': -0.015 })], { curve: { interpolation: 'monotone-convex-positive' } }));
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.message).toMatch(/quotes\[0\]|quotes\[1\]/);
    expect(b.errors[0]!.message).toMatch(/monotone-convex-positive needs positive forwards/);
  });

  it.each(INTERPOLATIONS)('rates up to 50%% build under %s', (m) => {
    expectBuilds(buildCurve(doc([{ kind: 'deposit', tenor: '1M', rate: 0.5 }, ...swaps({ '1Y': 0.45, '3Y': 0.35, '10Y': 0.2 })], { curve: { interpolation: m } })));
  });

  it.each(INTERPOLATIONS)('a 1-day deposit and a 100-year bond build under %s', (m) => {
    const b = buildCurve(
      doc(
        [
          { kind: 'deposit', tenor: '1D', rate: 0.031 },
          { kind: 'deposit', tenor: '6M', rate: 0.033 },
          ...swaps({ '5Y': 0.036, '30Y': 0.04 }),
          { kind: 'bond', maturity: '2127-03-10', coupon: 0.04, frequency: 2, cleanPrice: 96 },
        ],
        { curve: { interpolation: m } },
      ),
    );
    expectBuilds(b);
    expect(b.curve!.pillars[0]!.date).toBe('2027-03-11');
  });

  it.each(INTERPOLATIONS)('inverted and humped curves build under %s', (m) => {
    expectBuilds(buildCurve(doc([{ kind: 'deposit', tenor: '3M', rate: 0.055 }, ...swaps({ '2Y': 0.048, '5Y': 0.041, '10Y': 0.038, '30Y': 0.036 })], { curve: { interpolation: m } })));
    expectBuilds(buildCurve(doc([{ kind: 'deposit', tenor: '3M', rate: 0.03 }, ...swaps({ '2Y': 0.042, '5Y': 0.047, '10Y': 0.04, '30Y': 0.033 })], { curve: { interpolation: m } })));
  });

  it('unsorted quotes build to the same curve as sorted ones', () => {
    const q = [{ kind: 'deposit', tenor: '3M', rate: 0.03 }, ...swaps({ '2Y': 0.032, '5Y': 0.034, '10Y': 0.036 })];
    const a = buildCurve(doc(q));
    const b = buildCurve(doc([...q].reverse()));
    expectBuilds(a);
    expectBuilds(b);
    expect(b.curve!.pillars.map((p) => p.discount)).toEqual(a.curve!.pillars.map((p) => p.discount));
  });

  it('a duplicate maturity is refused with duplicate-pillar naming both quotes, and skipped with --skip-invalid', () => {
    const q = [{ kind: 'deposit', tenor: '1Y', rate: 0.03 }, { kind: 'swap', tenor: '1Y', rate: 0.031 }, ...swaps({ '5Y': 0.034 })];
    const strict = buildCurve(doc(q));
    expect(strict.errors.map((e) => e.code)).toEqual(['duplicate-pillar']);
    expect(strict.errors[0]!.message).toMatch(/quotes\[1\].*quotes\[0\]/);
    const lenient = buildCurve(doc(q), { skipInvalid: true });
    expectBuilds(lenient);
    expect(lenient.leftOut.map((l) => l.index)).toEqual([1]);
  });

  it('a quote that implies a discount factor <= 0 is refused with non-positive-discount naming it', () => {
    const b = buildCurve(doc([{ kind: 'deposit', tenor: '3M', rate: 0.03 }, { kind: 'bill', tenor: '13M', discountYield: 1.0 }, { kind: 'zero', tenor: '2Y', price: 93 }]));
    expect(b.curve).toBeNull();
    expect(b.errors[0]).toMatchObject({ code: 'non-positive-discount', quote: 1 });
    // A 2-year 10% bond at 5 per 100 after an 18-month deposit: its first three coupons, fixed by
    // the deposit's part of the curve, are alone worth more than the price.
    const bond = buildCurve(doc([{ kind: 'deposit', tenor: '18M', rate: 0.03 }, { kind: 'bond', tenor: '2Y', coupon: 0.1, cleanPrice: 5 }]));
    expect(bond.errors[0]).toMatchObject({ code: 'non-positive-discount', quote: 1 });
    expect(bond.errors[0]!.message).toMatch(/^quotes\[1\] \(bond 2029-03-10\)/);
  });

  it('a market of one quote builds a flat curve', () => {
    const b = buildCurve(doc([{ kind: 'zero', tenor: '2Y', rate: 0.04, compounding: 'continuous' }]));
    expectBuilds(b);
    const z = zeroOn(b.curve!, '2028-03-10', 'continuous', 'ACT/365F');
    expect(z.ok && Math.abs(z.value.zero - 0.04)).toBeLessThan(1e-15);
  });
});
