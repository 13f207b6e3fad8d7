// The built-in demo (invented data, demo only): about 20 quotes of every kind out to 30 years,
// whose curve builds with every interpolation method and has an inverted front end and a hump.
import { buildCurve, INTERPOLATIONS, parseTenor, addTenor, zeroOn, acceptanceBound } from '../../src/core/index.ts';
import { toEngineDocument } from '../../src/core/index.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';

let n = 0;
const demo = demoWorkspace(() => `d${n++}`);
const conv = toEngineDocument(demo);

describe('demoWorkspace()', () => {
  it('has about 20 quotes of deposits, bills, bonds and swaps, settling in 2026 or 2027, all valid', () => {
    expect(demo.quotes.length).toBeGreaterThanOrEqual(18);
    expect(demo.quotes.length).toBeLessThanOrEqual(24);
    expect(conv.invalidRows).toBe(0);
    const kinds = new Set(demo.quotes.map((q) => q.kind));
    for (const k of ['deposit', 'bill', 'bond', 'swap']) expect(kinds.has(k), k).toBe(true);
    expect(demo.settlement).toMatch(/^202[67]-/);
  });

  it.each(INTERPOLATIONS)('buildCurve(demo, {interpolation: %s}) builds and reprices every quote within the engine acceptance bound', (interpolation) => {
    const b = buildCurve(conv.doc, { interpolation });
    expect(b.errors).toEqual([]);
    expect(b.curve).not.toBeNull();
    expect(b.repricing).toHaveLength(demo.quotes.length);
    for (const r of b.repricing) expect(Math.abs(r.repricingError), `quote ${r.index}`).toBeLessThanOrEqual(acceptanceBound(r.unit));
    expect(b.curve!.pillars[b.curve!.pillars.length - 1]!.date).toBe('2056-12-15');
  });

  it('has a shape worth looking at: zero rates fall from the 6M point to 3Y (inversion) and peak between 15Y and 25Y (hump)', () => {
    const curve = buildCurve(conv.doc).curve!;
    const z = (t: string): number => {
      const r = zeroOn(curve, addTenor(curve.settlement, parseTenor(t)!), 'continuous', 'ACT/365F');
      if (!r.ok) throw new Error(r.errors[0]!.message);
      return r.value.zero;
    };
    expect(z('6M')).toBeGreaterThan(z('2Y'));
    expect(z('2Y')).toBeGreaterThan(z('3Y'));
    expect(z('20Y')).toBeGreaterThan(z('10Y'));
    expect(z('20Y')).toBeGreaterThan(z('30Y'));
  });
});
