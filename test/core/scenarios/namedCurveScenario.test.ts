import { describe, expect, it } from 'vitest';
import {
  applyScenario,
  applyScenarioOnCurve,
  buildCurve,
  buildNamedCurves,
  readNamedCurves,
  type Curve,
  type Scenario,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Scenarios on a named curve (issue 18 item 11: they name the curve they use; roll versus term in
// test/core/roll/rollOnCurve.test.ts). Oracles: the definition of a parallel zero-space shift (every continuous zero rate moves
// by the same bp), the project's own builds of a document whose quotes were moved by hand
// (buildCurve, buildNamedCurves) and applyScenario on one curve. The market
// is the invented two-curve document of test/core/bootstrap/namedCurves.test.ts.

type Q = Record<string, unknown> & { rate: number };
const OIS: Q[] = (['1Y', '2Y', '5Y', '10Y', '12Y'] as const).map((tenor, i) => ({ kind: 'ois', tenor, rate: [0.021, 0.0222, 0.0246, 0.0271, 0.0277][i]!, conventions: 'eur-estr' }));
const INDEX_6M: Q[] = [
  { kind: 'deposit', tenor: '6M', rate: 0.0247, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '5Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0252, 0.0263, 0.0286, 0.0311][i]!, frequency: 1, dayCount: '30/360' })),
];
const docOf = (ois = OIS, index = INDEX_6M) => ({
  format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  quotes: ois,
  curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes: index }],
});
const buildAll = (doc: unknown) => {
  const main = buildCurve(doc, { readCurves: readNamedCurves });
  expect(main.errors).toEqual([]);
  const named = buildNamedCurves(main.workspace!, main.curve);
  return { main, named, ws: main.workspace!, projection: named[0]!.build.curve! };
};
const parallel = (bp: number, space: 'zero' | 'quotes'): Scenario => ({ id: 's', name: `parallel ${bp} bp (${space})`, space, shape: { kind: 'parallel', bp } });
const TIMES = [0.3, 1, 2.5, 4, 7, 9.9, 14];
const sameCurve = (a: Curve, b: Curve, what: string) => {
  expect(a.pillars, what).toEqual(b.pillars);
  for (const t of TIMES) expect(Object.is(a.lnDiscountAt(t), b.lnDiscountAt(t)), `${what} t=${t}`).toBe(true);
};
const up = (qs: Q[], d: number) => qs.map((q) => ({ ...q, rate: q.rate + d }));

describe('applyScenarioOnCurve', () => {
  it('zero space on the projection curve: every continuous zero rate of that curve moves by the scenario\'s bp, the discounting curve does not move', () => {
    const { main, named, ws, projection } = buildAll(docOf());
    const r = applyScenarioOnCurve(parallel(25, 'zero'), ws, main.curve!, named, 'euribor6m');
    if (!r.ok) throw new Error(r.errors[0]!.message);
    expect(r.value.curveName).toBe('euribor6m');
    expect(r.value.curves.euribor6m).toBe(r.value.curve);
    expect(r.value.curves.default).toBe(main.curve);
    for (const t of TIMES) expectClose(-r.value.curve.lnDiscountAt(t) / t - -projection.lnDiscountAt(t) / t, 0.0025, 1e-15, 'a parallel zero-space shift, by definition');
  });

  it('quote space on the discounting curve: its curve is applyScenario\'s bit for bit, and the projection curve is rebuilt on it, as a document with the OIS rates moved by hand', () => {
    const { main, named, ws, projection } = buildAll(docOf());
    const r = applyScenarioOnCurve(parallel(10, 'quotes'), ws, main.curve!, named, 'default');
    if (!r.ok) throw new Error(r.errors[0]!.message);
    const one = applyScenario(parallel(10, 'quotes'), ws, main.curve!);
    if (!one.ok) throw new Error(one.errors[0]!.message);
    sameCurve(r.value.curve, one.value.curve, 'default');
    const byHand = buildAll(docOf(up(OIS, 0.001)));
    sameCurve(r.value.curves.default!, byHand.main.curve!, 'default by hand');
    sameCurve(r.value.curves.euribor6m!, byHand.projection, 'euribor6m by hand');
    // The projection curve did move (its swaps read the discounting curve).
    expect(r.value.curves.euribor6m!.lnDiscountAt(9.9)).not.toBe(projection.lnDiscountAt(9.9));
  });

  it('quote space on the projection curve: it is rebuilt as a document with its quotes moved by hand; the discounting curve does not move', () => {
    const { main, named, ws } = buildAll(docOf());
    const r = applyScenarioOnCurve(parallel(-15, 'quotes'), ws, main.curve!, named, 'euribor6m');
    if (!r.ok) throw new Error(r.errors[0]!.message);
    expect(r.value.curveName).toBe('euribor6m');
    sameCurve(r.value.curve, buildAll(docOf(OIS, up(INDEX_6M, -0.0015))).projection, 'euribor6m by hand');
    expect(r.value.curves.default).toBe(main.curve);
  });

  it('an unknown curve is an error listing the curves', () => {
    const { main, named, ws } = buildAll(docOf());
    const r = applyScenarioOnCurve(parallel(10, 'zero'), ws, main.curve!, named, 'euribor3m');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toBe('parallel 10 bp (zero): no curve is named "euribor3m"; apply it to one of "default", "euribor6m"');
  });
});
