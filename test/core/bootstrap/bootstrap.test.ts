import { describe, expect, it } from 'vitest';
import { buildCurve, INTERPOLATIONS } from '../../../src/core/index.ts';
import { luFactor, luSolve } from '../../../src/core/numeric/luDecomposition.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Regression: a market the property tests found (invented data, flat 7 %), where a quarterly
// bond matures 34 days after the 7-year swap. Under cubic-zero the bond's present value is not
// monotone in its own node with the others held, so the per-node Gauss-Seidel solve had no
// root and the build failed with no-solution; the joint Newton fallback finds the curve.
const doc = (interpolation: string) => ({
  format: 'tenorscope-workspace',
  version: 1,
  settlement: '2021-11-24',
  curve: { dayCount: 'ACT/365F', interpolation },
  quotes: [
    { kind: 'deposit', tenor: '1W', rate: 0.07 },
    { kind: 'deposit', tenor: '2M', rate: 0.07 },
    { kind: 'deposit', tenor: '6M', rate: 0.07 },
    { kind: 'deposit', tenor: '9M', rate: 0.07 },
    { kind: 'zero', maturity: '2023-02-24', price: 91.62188716508778 },
    { kind: 'zero', maturity: '2023-08-24', price: 88.47059049434839 },
    { kind: 'bond', maturity: '2028-12-28', coupon: 0.09, frequency: 4, eom: false, cleanPrice: 111.10247665180128 },
    { kind: 'bond', maturity: '2023-01-08', coupon: 0, frequency: 4, yield: 0.07 },
    { kind: 'swap', tenor: '2Y', rate: 0.07 },
    { kind: 'swap', tenor: '3Y', rate: 0.07 },
    { kind: 'swap', tenor: '7Y', rate: 0.07 },
    { kind: 'swap', tenor: '10Y', rate: 0.07 },
    { kind: 'swap', tenor: '15Y', rate: 0.07 },
  ],
});

describe('bootstrap acceptance on a market with two pillars 34 days apart', () => {
  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation} builds and every quote reprices within the acceptance bounds`, () => {
      const b = buildCurve(doc(interpolation));
      expect(b.errors).toEqual([]);
      for (const r of b.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
    });
  }
});

describe('luFactor and luSolve (Gaussian elimination with partial pivoting)', () => {
  it('solves a system that needs a row swap, and refuses a singular one', () => {
    // [0 2 1; 1 1 1; 2 1 3] x = [5, 6, 13]: the first pivot is 0, so a row swap is needed.
    const a = Float64Array.from([0, 2, 1, 1, 1, 1, 2, 1, 3]);
    const x = luSolve(luFactor(a, 3)!, Float64Array.from([5, 6, 13]));
    const A = [0, 2, 1, 1, 1, 1, 2, 1, 3];
    for (let r = 0; r < 3; r++) expectClose(A[3 * r]! * x[0]! + A[3 * r + 1]! * x[1]! + A[3 * r + 2]! * x[2]!, [5, 6, 13][r]!, 1e-14, 'substitution back into the system');
    expect(luFactor(Float64Array.from([1, 2, 2, 4]), 2)).toBeNull();
    // Singular to working precision: [1 1; 1 1+1e-15] leaves the second pivot 1.1e-15, below
    // SINGULAR_PIVOT = 1e-14 times the largest entry (hand calculation).
    expect(luFactor(Float64Array.from([1, 1, 1, 1 + 1e-15]), 2)).toBeNull();
    // The test is relative: 1e-20 times the identity is perfectly conditioned (hand calculation: x = b / 1e-20).
    const tiny = luFactor(Float64Array.from([1e-20, 0, 0, 1e-20]), 2);
    expect(tiny).not.toBeNull();
    expectClose(luSolve(tiny!, [3e-20, 4e-20])[1]!, 4, 1e-15, 'hand calculation: 4e-20 / 1e-20');
  });
});

describe('global sweeps stop at the rounding floor (regression)', () => {
  // The invented 40-quote benchmark market: cubic-zero's sweeps used to reach a node change of
  // 1.11e-15 (5 ulps of ln DF) and stay there, running all 100 sweeps.
  it('cubic-zero and monotone-convex converge in a handful of sweeps on market40', async () => {
    const { readFileSync } = await import('node:fs');
    const { validateWorkspace, compileMarket, bootstrapInstruments } = await import('../../../src/core/index.ts');
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/market40/market40.json', import.meta.url), 'utf8'));
    const ws = validateWorkspace(doc).workspace!;
    const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
    for (const interpolation of ['cubic-zero', 'monotone-convex'] as const) {
      const out = bootstrapInstruments({ settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation, extrapolation: 'none' }, market.instruments);
      expect(out.errors).toEqual([]);
      expect(out.sweeps).toBeLessThanOrEqual(10);
      for (const r of out.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
    }
  });
});

describe('bootstrapInstruments without a segment formula (the generic solve a new method gets)', () => {
  // The bootstrap solves nodes with a method's segmentLn when it has one; a method registered
  // without it is solved by rebuilding the interpolation at each solver step. Both must find the
  // same curve: here monotone-convex (global) and log-linear-discount (local) are built both
  // ways on the invented market40 fixture and their discount factors compared at every pillar
  // and between them. Tolerance 1e-13 relative: both solves stop within 1e-15 of a node, and
  // the sweeps' stopping points may differ by a few such steps.
  it('monotone-convex and log-linear-discount give the same curve either way', async () => {
    const { readFileSync } = await import('node:fs');
    const { validateWorkspace, compileMarket, bootstrapInstruments, INTERPOLATORS } = await import('../../../src/core/index.ts');
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/market40/market40.json', import.meta.url), 'utf8'));
    const ws = validateWorkspace(doc).workspace!;
    const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
    const registry = INTERPOLATORS as Record<string, (typeof INTERPOLATORS)['monotone-convex']>;
    for (const id of ['monotone-convex', 'log-linear-discount'] as const) {
      const settings = { settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation: id, extrapolation: 'none' as const };
      const fast = bootstrapInstruments(settings, market.instruments);
      const spec = registry[id]!;
      const { segmentLn: _dropped, ...generic } = spec;
      registry[id] = generic;
      let slow;
      try {
        slow = bootstrapInstruments(settings, market.instruments);
      } finally {
        registry[id] = spec;
      }
      expect(fast.errors).toEqual([]);
      expect(slow.errors).toEqual([]);
      const last = fast.curve!.lastT;
      for (let i = 0; i <= 300; i++) {
        const t = (last * i) / 300;
        expectClose(fast.curve!.lnDiscountAt(t), slow.curve!.lnDiscountAt(t), 1e-13 * Math.max(1, Math.abs(slow.curve!.lnDiscountAt(t))), `${id}: ln DF at t = ${t}, segment solve against generic solve`);
      }
    }
  });
});

describe('the three node solvers find the same nodes (segment formula, affine two-build, rebuild)', () => {
  // nodeSolverFor picks one solver per method and stage; with the method's segmentLn and affine
  // flags taken away the bootstrap falls back to the next one. All three solve the same equation
  // (the instrument's present value equals its target) for the same node, so the curves must
  // agree to the solver tolerance: 1e-13 relative in ln DF, as above. Invented market40 fixture.
  it('log-linear-discount, cubic-zero and monotone-convex give one curve with every solver they can use', async () => {
    const { readFileSync } = await import('node:fs');
    const { validateWorkspace, compileMarket, bootstrapInstruments, INTERPOLATORS } = await import('../../../src/core/index.ts');
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/market40/market40.json', import.meta.url), 'utf8'));
    const ws = validateWorkspace(doc).workspace!;
    const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
    const registry = INTERPOLATORS as Record<string, (typeof INTERPOLATORS)['monotone-convex']>;
    const variants = { 'log-linear-discount': [['segmentLn'], ['segmentLn', 'affine']], 'cubic-zero': [['affine']], 'monotone-convex': [['segmentLn']] } as const;
    for (const [id, drops] of Object.entries(variants) as [keyof typeof variants, readonly (readonly ('segmentLn' | 'affine')[])[]][]) {
      const settings = { settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation: id, extrapolation: 'none' as const };
      const reference = bootstrapInstruments(settings, market.instruments);
      expect(reference.errors).toEqual([]);
      for (const drop of drops) {
        const spec = registry[id]!;
        const reduced: Record<string, unknown> = { ...spec };
        for (const key of drop) delete reduced[key];
        registry[id] = reduced as unknown as typeof spec;
        let other;
        try {
          other = bootstrapInstruments(settings, market.instruments);
        } finally {
          registry[id] = spec;
        }
        expect(other.errors, `${id} without ${drop.join(', ')}`).toEqual([]);
        const last = reference.curve!.lastT;
        for (let i = 0; i <= 200; i++) {
          const t = (last * i) / 200;
          const want = reference.curve!.lnDiscountAt(t);
          expectClose(other.curve!.lnDiscountAt(t), want, 1e-13 * Math.max(1, Math.abs(want)), `${id} without ${drop.join(', ')}: ln DF at t = ${t}, same root as the method's own solver`);
        }
      }
    }
  });
});
