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

  // By hand from the named curve's own discount factors: today's spot of leg 1 is simple on ACT/360,
  // (DF(settlement) / DF(end) - 1) / tau (the money-market definition, ISDA 2006 Definitions' ACT/360
  // day count; from memory); the zero to the horizon grows by 1 / DF(H); under forwards realised each
  // leg earns its forward, so rolling grows by the product of DF(start) / DF(end), which telescopes to
  // 1 / DF(H) (Hull, "Options, Futures, and Other Derivatives", forward rates; from memory).
  it('on the projection curve equals the roll computed by hand from its discount factors, and differs from the default curve', () => {
    const { main, projection } = buildAll();
    const r = analyseRollOnCurve({ default: main.curve!, euribor6m: projection }, 'euribor6m', { ...DEFAULT_STRATEGY, view: 'forwards' });
    if (!r.ok) throw new Error(r.errors[0]!.message);
    const a = r.value;
    const df = (date: string) => Math.exp(projection.lnDiscountAt(projection.time(date)));
    const leg1 = a.legs[0]!;
    const days = (Date.parse(leg1.end) - Date.parse(leg1.start)) / 86_400_000;
    const spot = (1 / df(leg1.end) - 1) / (days / 360);
    expect(Math.abs(a.spotRollRate - spot) / spot).toBeLessThanOrEqual(1e-13);
    const growthH = 1 / df(a.horizon);
    const forwards = a.views.find((v) => v.id === 'forwards')!;
    const amount = Number(DEFAULT_STRATEGY.amount);
    for (const id of ['zero', 'roll'] as const) {
      const terminal = forwards.strategies.find((s) => s.id === id)!.terminal.toNumber();
      expect(Math.abs(terminal - amount * growthH) / (amount * growthH), id).toBeLessThanOrEqual(1e-13);
    }
    // The same by hand on the default curve is another number: the check tells the curves apart.
    const d = analyseRollOnCurve({ default: main.curve!, euribor6m: projection }, 'default', { ...DEFAULT_STRATEGY, view: 'forwards' });
    if (!d.ok) throw new Error('default');
    const onDefault = d.value.views.find((v) => v.id === 'forwards')!.strategies.find((s) => s.id === 'zero')!.terminal.toNumber();
    expect(Math.abs(onDefault - amount * growthH)).toBeGreaterThan(100);
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
