// Scenario shapes, the zero-space move and the quote-space move.
import { readFileSync } from 'node:fs';
import { addTenor, billPriceFromDiscountYield, bondSchedule, bondYieldFromDirty, buildCurve, daysBetween, parseTenor, zeroOn, type Curve, type Workspace } from '../../../src/core/index.ts';
import {
  applyScenario,
  resolveShift,
  scenarioEffects,
  shiftAt,
  shiftQuote,
  shiftZeroCurve,
  type ResolvedShift,
  type ScenarioShape,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

const SETTLEMENT = '2026-11-30';
// 30/360 puts the tenors 2Y, 5Y, 10Y at exactly t = 2, 5, 10 years from a 30th (30/360 rule:
// (360 dY + 30 dM + dD)/360), so the shape formulas can be checked by hand.
const resolve30 = (shape: ScenarioShape): ResolvedShift => {
  const r = resolveShift(shape, SETTLEMENT, '30/360');
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('; '));
  return r.value;
};

describe('resolveShift(shape) and shiftAt(shift, t) follow the shape formulas', () => {
  it('twist 2Y/5Y/10Y +30 bp: Delta(S) = -s (P-S)/(L-S) = -11.25, Delta(L) = s (L-P)/(L-S) = 18.75', () => {
    const src = 'hand calculation from the twist formula: -30 x 3/8 and 30 x 5/8';
    const shift = resolve30({ kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: 30 });
    expect(shift.nodes.map((n) => n.t)).toEqual([2, 10]);
    expectClose(shiftAt(shift, 2), -11.25, 1e-12, src);
    expectClose(shiftAt(shift, 10), 18.75, 1e-12, src);
    expectClose(shiftAt(shift, 5), 0, 1e-12, 'pivot: Delta(P) = 0 by construction');
    expectClose(shiftAt(shift, 10) - shiftAt(shift, 2), 30, 1e-12, 'the S-L spread moves by s');
    expectClose(shiftAt(shift, 7), 7.5, 1e-12, 'hand calculation: linear, -11.25 + 30 x (7-2)/8');
    expectClose(shiftAt(shift, 0.5), -11.25, 0, 'flat before the short maturity');
    expectClose(shiftAt(shift, 30), 18.75, 0, 'flat after the long maturity');
    expect(shift.marks.map((m) => [m.role, m.t])).toEqual([['pivot', 5]]);
  });

  it('a flattener is a twist with a negative spread change', () => {
    const shift = resolve30({ kind: 'twist', short: '2Y', pivot: '2Y', long: '10Y', bp: -20 });
    expectClose(shiftAt(shift, 2), 0, 0, 'pivot at S: the short end stays, hand calculation');
    expectClose(shiftAt(shift, 10), -20, 1e-12, 'the long end moves by s, hand calculation');
  });

  it('butterfly 2Y/5Y/10Y, wings -5 bp, belly +15 bp', () => {
    const shift = resolve30({ kind: 'butterfly', short: '2Y', belly: '5Y', long: '10Y', wingsBp: -5, bellyBp: 15 });
    expectClose(shiftAt(shift, 2), -5, 0, 'wing S');
    expectClose(shiftAt(shift, 5), 15, 0, 'belly B');
    expectClose(shiftAt(shift, 10), -5, 0, 'wing L');
    expectClose(shiftAt(shift, 3.5), 5, 1e-12, 'hand calculation: -5 + 20 x 1.5/3');
    expectClose(shiftAt(shift, 7.5), 5, 1e-12, 'hand calculation: 15 - 20 x 2.5/5');
  });

  it('key-rate bumps are sorted by maturity, linear between and flat outside', () => {
    const shift = resolve30({ kind: 'key-rate', points: [{ at: '10Y', bp: 0 }, { at: '2Y', bp: 0 }, { at: '5Y', bp: 10 }] });
    expect(shift.nodes.map((n) => n.label)).toEqual(['2Y', '5Y', '10Y']);
    expectClose(shiftAt(shift, 4), 20 / 3, 1e-12, 'hand calculation: 10 x 2/3');
    expectClose(shiftAt(shift, 1), 0, 0, 'flat outside');
  });

  it('parallel is the same everywhere', () => {
    const shift = resolve30({ kind: 'parallel', bp: 25 });
    for (const t of [0, 0.1, 3, 50]) expectClose(shiftAt(shift, t), 25, 0, 'Delta(t) = a');
  });

  it('refuses shapes that cannot be drawn, naming the field', () => {
    const bad = (shape: ScenarioShape) => {
      const r = resolveShift(shape, SETTLEMENT, '30/360', 'scenarios[1].shape');
      return r.ok ? [] : r.errors.map((e) => e.path);
    };
    expect(bad({ kind: 'twist', short: '10Y', pivot: '5Y', long: '2Y', bp: 1 })).toEqual(['scenarios[1].shape.long']);
    expect(bad({ kind: 'twist', short: '2Y', pivot: '20Y', long: '10Y', bp: 1 })).toEqual(['scenarios[1].shape.pivot']);
    expect(bad({ kind: 'butterfly', short: '2Y', belly: '1Y', long: '10Y', wingsBp: 1, bellyBp: 1 })).toEqual(['scenarios[1].shape.belly']);
    expect(bad({ kind: 'key-rate', points: [{ at: '5Y', bp: 1 }, { at: '60M', bp: 2 }] })).toEqual(['scenarios[1].shape.points']);
    expect(bad({ kind: 'key-rate', points: [{ at: 'soon', bp: 1 }] })).toEqual(['scenarios[1].shape.points[0].at']);
  });
});

const fixture = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
function built(doc: Record<string, unknown>, interpolation?: 'linear-zero'): { ws: Workspace; curve: Curve } {
  const b = buildCurve(doc, interpolation ? { interpolation } : {});
  if (!b.curve || !b.workspace) throw new Error(b.errors.map((e) => e.message).join('; '));
  return { ws: b.workspace, curve: b.curve };
}

describe('shiftZeroCurve(curve, shift): DF\'(t) = DF(t) exp(-Delta(t) t)', () => {
  const { curve } = built(fixture);
  const shift = resolveShift({ kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: 30 }, curve.settlement, curve.dayCount);
  if (!shift.ok) throw new Error('shift');
  const moved = shiftZeroCurve(curve, shift.value);

  it('moves each continuously compounded zero rate on the curve axis by exactly Delta(t)', () => {
    for (const tn of ['6M', '2Y', '4Y', '7Y', '10Y', '25Y']) {
      const date = addTenor(curve.settlement, parseTenor(tn)!);
      const z0 = zeroOn(curve, date, 'continuous', curve.dayCount);
      const z1 = zeroOn(moved, date, 'continuous', curve.dayCount);
      if (!z0.ok || !z1.ok) throw new Error('zero');
      const t = curve.time(date);
      expectClose((z1.value.zero - z0.value.zero) * 1e4, shiftAt(shift.value, t), 1e-9, `definition: -ln(DF')/t = -ln(DF)/t + Delta(t), ${tn}`);
      expectClose(Math.exp(moved.lnDiscountAt(t)), Math.exp(curve.lnDiscountAt(t) - shiftAt(shift.value, t) * 1e-4 * t), 1e-15, `DF'(t) = DF(t) exp(-Delta t), ${tn}`);
    }
  });

  it('gives the instantaneous forward as -d ln DF\'/dt (central difference away from the kinks)', () => {
    for (const t of [1, 3, 4.5, 8, 15]) {
      const h = 1e-5;
      const fd = -(moved.lnDiscountAt(t + h) - moved.lnDiscountAt(t - h)) / (2 * h);
      expectClose(moved.forwardAt(t), fd, 1e-7, `numerical derivative of ln DF' at t = ${t}`);
    }
  });

  it('keeps the pillars on their dates with moved discount factors', () => {
    expect(moved.pillars.map((p) => p.date)).toEqual(curve.pillars.map((p) => p.date));
    const p = curve.pillars[10]!;
    expectClose(moved.pillars[10]!.discount, p.discount * Math.exp(-shiftAt(shift.value, p.t) * 1e-4 * p.t), 1e-16, 'definition at a pillar');
  });
});

describe('shiftQuote(q, d): a price quote moves its own yield by d and is repriced', () => {
  const { ws } = built(fixture);
  const d = 0.001;
  it('bill by price: the bank discount yield moves by d (US Treasury: price = 100 (1 - y days/360))', () => {
    const q = ws.quotes.find((x) => x.kind === 'bill' && x.price !== null)!;
    const moved = shiftQuote(q, d, ws.settlement);
    if (!moved.ok || moved.value.kind !== 'bill') throw new Error('bill');
    const days = daysBetween(ws.settlement, q.maturity);
    const y0 = ((100 - (q.kind === 'bill' ? q.price! : 0)) / 100) * (360 / days);
    expectClose(moved.value.price!, billPriceFromDiscountYield(y0 + d, days), 1e-12, 'US Treasury discount-yield price formula');
    expectClose(moved.value.price!, 100 * (1 - ((y0 + d) * days) / 360), 1e-12, 'the same formula written out');
  });
  it('bond by clean price: the ICMA yield of the moved price is the old yield plus d', () => {
    const q = ws.quotes.find((x) => x.kind === 'bond' && x.cleanPrice !== null)!;
    if (q.kind !== 'bond') throw new Error('bond');
    const moved = shiftQuote(q, d, ws.settlement);
    if (!moved.ok || moved.value.kind !== 'bond') throw new Error('moved');
    const s = bondSchedule(q, ws.settlement);
    const y0 = bondYieldFromDirty(s, q.cleanPrice! + s.accrued)!;
    const y1 = bondYieldFromDirty(s, moved.value.cleanPrice! + s.accrued)!;
    expectClose(y1 - y0, d, 1e-12, 'yield round trip through bondDirtyFromYield/bondYieldFromDirty');
    expect(moved.value.cleanPrice!).toBeLessThan(q.cleanPrice!);
  });
  it('rate quotes move by d in their own convention', () => {
    const q = ws.quotes.find((x) => x.kind === 'swap')!;
    const moved = shiftQuote(q, d, ws.settlement);
    expect(moved.ok && moved.value.kind === 'swap' && q.kind === 'swap' && moved.value.rate === q.rate + d).toBe(true);
  });
  it('says which quote cannot move when the price would leave its range', () => {
    const q = ws.quotes.find((x) => x.kind === 'bill' && x.price !== null)!;
    const r = shiftQuote(q, 3, ws.settlement);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.path).toBe(`quotes[${q.index}].price`);
  });
});

describe('a parallel scenario in zero space and in quote space agree to first order', () => {
  const parallel = (bp: number, space: 'zero' | 'quotes') => ({ id: 'p', name: 'parallel', space, shape: { kind: 'parallel', bp } as const });
  const zeroChange = (base: Curve, moved: Curve, tn: string): number => {
    const date = addTenor(base.settlement, parseTenor(tn)!);
    const a = zeroOn(base, date, 'continuous', 'ACT/365F');
    const b = zeroOn(moved, date, 'continuous', 'ACT/365F');
    if (!a.ok || !b.ok) throw new Error(tn);
    return (b.value.zero - a.value.zero) * 1e4;
  };

  it('exactly when every quote is a continuously compounded zero rate on the curve axis (linear-zero)', () => {
    const doc = {
      format: 'tenorscope-workspace',
      version: 1,
      settlement: SETTLEMENT,
      curve: { dayCount: 'ACT/365F', interpolation: 'linear-zero' },
      quotes: ['6M', '1Y', '2Y', '5Y', '10Y', '30Y'].map((tenor, i) => ({ kind: 'zero', tenor, rate: 0.03 + 0.002 * i, compounding: 'continuous', dayCount: 'ACT/365F' })),
    };
    const { ws, curve } = built(doc);
    const z = applyScenario(parallel(10, 'zero'), ws, curve);
    const q = applyScenario(parallel(10, 'quotes'), ws, curve);
    if (!z.ok || !q.ok) throw new Error('apply');
    for (const tn of ['3M', '9M', '3Y', '7Y', '20Y', '30Y']) {
      // Each node's ln DF moves by -a t; linear interpolation of zero rates carries the same +a between nodes.
      expectClose(zeroChange(curve, q.value.curve, tn), zeroChange(curve, z.value.curve, tn), 1e-8, `algebra: DF_i e^{-a t_i} at every node, ${tn}`);
    }
  });

  it('within 5% of the shift for the 40-quote market, and linear in the shift (second-order residue < 0.001 bp)', () => {
    // Tolerance: a quote moved by a in its own convention moves the continuous ACT/365F zero rate
    // by a times d z/d q: 1/(1 + r) for annual swaps (0.965 at r = 3.6%), 1/(1 + y/2) for
    // semiannual bond yields, (365/360)/(1 + r tau) for ACT/360 money-market rates and up to
    // (365/360)/(1 - d tau) for discount yields: all within [0.95, 1.05] for rates below 5% and
    // bills within a year. Zero space moves it by exactly a. Doubling a doubles the change up to
    // terms in a^2 (a = 1 bp = 1e-4), far below 0.001 bp.
    const { ws, curve } = built(fixture);
    for (const tn of ['3M', '1Y', '2Y', '5Y', '10Y', '30Y']) {
      const one = applyScenario(parallel(1, 'quotes'), ws, curve);
      const two = applyScenario(parallel(2, 'quotes'), ws, curve);
      const zero = applyScenario(parallel(1, 'zero'), ws, curve);
      if (!one.ok || !two.ok || !zero.ok) throw new Error('apply');
      const d1 = zeroChange(curve, one.value.curve, tn);
      const dz = zeroChange(curve, zero.value.curve, tn);
      expectClose(dz, 1, 1e-9, `zero space moves the cont ACT/365F zero by exactly a, ${tn}`);
      expectClose(d1, dz, 0.05, `first-order agreement (convention factors within 5%), ${tn}`);
      expectClose(zeroChange(curve, two.value.curve, tn), 2 * d1, 1e-3, `linear in a to first order, ${tn}`);
    }
  });
});

describe('scenarioEffects(base, moved, tenors, conventions)', () => {
  it('lists zero and forward changes in bp and leaves points beyond the curve empty', () => {
    const doc = { ...fixture, curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none' } };
    const { ws, curve } = built(doc);
    const r = applyScenario({ id: 'p', name: 'p', space: 'zero', shape: { kind: 'parallel', bp: 25 } }, ws, curve);
    if (!r.ok) throw new Error('apply');
    const rows = scenarioEffects(curve, r.value.curve, ['2Y', '10Y', '60Y'], {
      zeroCompounding: 'continuous',
      zeroDayCount: 'ACT/365F',
      forwardTenor: '3M',
      forwardCompounding: 'continuous',
      forwardDayCount: 'ACT/365F',
    });
    expectClose(rows[0]!.zeroBp!, 25, 1e-9, 'parallel zero-space move, by definition');
    expectClose(rows[1]!.forwardBp!, 25, 1e-9, 'a flat shift moves a continuous forward on the same axis by the same amount');
    expect(rows[2]).toMatchObject({ tenor: '60Y', zeroBp: null, forwardBp: null });
  });
});
