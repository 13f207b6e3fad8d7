import { describe, expect, it } from 'vitest';
import { analyseRollOnCurve, analyseRollVsTerm, buildCurve, buildNamedCurves, DEFAULT_STRATEGY, readNamedCurves } from '../../../src/core/index.ts';

// Roll versus term on a named curve (issue 18 item 11: it names the curve it uses). Oracle:
// analyseRollVsTerm on that one curve (test/core/roll/rollTextbook.test.ts holds it to published
// examples). The market is the invented two-curve document of test/core/bootstrap/namedCurves.test.ts.

const OIS = (['1Y', '2Y', '5Y', '10Y', '12Y'] as const).map((tenor, i) => ({ kind: 'ois', tenor, rate: [0.021, 0.0222, 0.0246, 0.0271, 0.0277][i]!, conventions: 'eur-estr' }));
const INDEX_6M = [
  { kind: 'deposit', tenor: '6M', rate: 0.0247, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '5Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0252, 0.0263, 0.0286, 0.0311][i]!, frequency: 1, dayCount: '30/360' })),
];
const doc = {
  format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  quotes: OIS,
  curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes: INDEX_6M }],
};
const buildAll = () => {
  const main = buildCurve(doc, { readCurves: readNamedCurves });
  expect(main.errors).toEqual([]);
  return { main, projection: buildNamedCurves(main.workspace!, main.curve)[0]!.build.curve! };
};

describe('analyseRollOnCurve', () => {
  it('on the projection curve: analyseRollVsTerm on that curve, naming it; on the default curve the same as today', () => {
    const { main, projection } = buildAll();
    const curves = { default: main.curve!, euribor6m: projection };
    const r = analyseRollOnCurve(curves, 'euribor6m', DEFAULT_STRATEGY);
    const one = analyseRollVsTerm(projection, DEFAULT_STRATEGY);
    if (!r.ok || !one.ok) throw new Error('no analysis');
    const { curveName, ...rest } = r.value;
    expect(curveName).toBe('euribor6m');
    expect(rest).toEqual(one.value);
    const d = analyseRollOnCurve(curves, 'default', DEFAULT_STRATEGY);
    const today = analyseRollVsTerm(main.curve!, DEFAULT_STRATEGY);
    if (!d.ok || !today.ok) throw new Error('no analysis');
    expect({ ...d.value, curveName: undefined }).toEqual({ ...today.value, curveName: undefined });
    // The two curves give different spot roll rates (the check can tell them apart).
    expect(r.value.spotRollRate).not.toBe(d.value.spotRollRate);
  });

  it('errors name the curve they were read on, and an unknown curve lists the curves', () => {
    const { main, projection } = buildAll();
    const curves = { default: main.curve!, euribor6m: projection };
    const bad = analyseRollOnCurve(curves, 'euribor6m', { ...DEFAULT_STRATEGY, ridingMaturity: '1Y' });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]!.message).toMatch(/^on the curve "euribor6m": strategy\.ridingMaturity: the riding bond must mature after the horizon/);
    const unknown = analyseRollOnCurve(curves, 'govt', DEFAULT_STRATEGY);
    if (!unknown.ok) expect(unknown.errors[0]!.message).toBe('strategy.curve: no curve is named "govt"; use one of "default", "euribor6m"');
    expect(unknown.ok).toBe(false);
  });
});
