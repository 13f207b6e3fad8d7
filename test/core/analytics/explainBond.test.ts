import { describe, expect, it } from 'vitest';
import {
  analyzeBond,
  BOND_FIGURES,
  bondFigureValue,
  bondLnWeights,
  buildCurve,
  curveFromPillars,
  DEFAULT_KEY_TENORS,
  explainBondFigure,
  INTERPOLATIONS,
  quoteDv01s,
  quoteYieldOf,
  requoteAtYield,
  bootstrapInstruments,
  topInfluencesOfLn,
  type BondInput,
  type BondSide,
  type BondSink,
  type Explanation,
} from '../../../src/core/index.ts';
import { expectClose, expectRelClose } from '../../helpers/asserts.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';
import { rng } from '../../helpers/seededRandom.ts';
import { randomBond, randomCurve, tracedRandomBond, valueOf } from '../../helpers/randomBonds.ts';

// Explanations of the bond figures (issue 19). Three claims:
// 1. analyzeBond with a sink returns what it returns without one, bit for bit, and each figure's
//    explanation ends in the very figure the table shows (random curves and bonds, seeded, invented);
// 2. the steps, recomputed here from the shown inputs with the textbook definitions, give the
//    figure to 1e-15 relative: the price sum CF_i DF(t_i) and accrued interest 100 c tau (Fabozzi,
//    "Bond Markets, Analysis, and Strategies", chapters on pricing and yield; cited from memory),
//    the ICMA price-yield formula P = sum CF_k (1 + y/f)^-(w + k) (ICMA Rule 251 as the bond
//    module states it), modified duration -(1/P) dP/dy, Macaulay (1 + y/f) x modified, convexity
//    (1/P) d2P/dy2, DV01 -dP/dy x 1e-4, and the z-spread P = sum CF_i DF(t_i) e^(-z t_i);
//    solved numbers (yield, z) by their defining equation;
// 3. a published worked example: Hull, "Options, Futures, and Other Derivatives", chapter
//    "Interest Rates", section on bond pricing (cited from memory): a 2-year 6% semiannual bond on
//    continuously compounded zero rates 5.0%, 5.8%, 6.4%, 6.8% at 0.5, 1, 1.5, 2 years is worth
//    98.39, and its (continuously compounded) yield is 6.76%.

const value = valueOf;

/** Every figure the table shows, with its side. */
const figuresOf = (market: boolean) =>
  (['model', 'market'] as BondSide[]).flatMap((side) => (side === 'market' && !market ? [] : BOND_FIGURES.filter((f) => !(side === 'model' && f === 'zSpread')).map((figure) => ({ figure, side }))));

/**
 * Each step recomputed from the shown values of its inputs (year fractions, DFs read, given values,
 * earlier steps) with the textbook definitions written out here; solved numbers (y, z) are checked
 * by their equation. Returns [what, recomputed, shown] triples.
 */
function recomputeSteps(e: Explanation, f: number): { what: string; got: number; want: number; tol: number }[] {
  const shown = new Map(e.steps.map((s) => [s.name, s.value]));
  const at = (name: string): number => {
    const v = shown.get(name) ?? e.yearFractions.find((y) => y.name === name)?.value ?? e.reads.find((r) => r.name === name)?.discount;
    if (v === undefined) throw new Error(`no input ${name}`);
    return v;
  };
  const n = e.dates.filter((d) => /^c\d+$/.test(d.name)).length;
  const cfOf = (i: number): number => at(i === n - 1 ? 'CF_N' : 'CF');
  const sum = (xs: readonly number[]): number => xs.reduce((a, b) => a + b, 0);
  const range = Array.from({ length: n }, (_, i) => i);
  const yName = shown.has('y') ? 'y' : 'y_mkt';
  const out: { what: string; got: number; want: number; tol: number }[] = [];
  const EXACT = 1e-15;
  for (const s of e.steps) {
    const k = /^(pv|q)(\d+)$/.exec(s.name);
    let got: number | null = null;
    if (s.name === 'CF') got = (100 * at('c')) / f;
    else if (s.name === 'CF_N') got = n > 1 ? at('CF') + 100 : (100 * at('c')) / f + 100;
    else if (s.name === 'accrued') got = 100 * at('c') * at('tau_acc');
    else if (k && k[1] === 'pv') got = cfOf(Number(k[2]) - 1) * at(`DF(c${k[2]})`);
    else if (k && k[1] === 'q') got = cfOf(Number(k[2]) - 1) * Math.exp((at('w') + (Number(k[2]) - 1)) * at('lnV'));
    else if (s.name === 'dirty') got = sum(range.map((i) => at(`pv${i + 1}`)));
    else if (s.name === 'w') got = at('tau_next') / at('tau_period');
    else if (s.name === 'lnV') got = -Math.log1p(at(yName) / f);
    else if (s.name === 'P') {
      got = sum(range.map((i) => at(`q${i + 1}`)));
      // The ICMA price written with powers, independently of exp and log1p (rounding of N powers: 1e-13).
      out.push({ what: 'P = sum CF_k (1 + y/f)^-(w + k)', got: sum(range.map((i) => cfOf(i) * Math.pow(1 + at(yName) / f, -(at('w') + i)))), want: s.value, tol: 1e-13 });
    } else if (s.name === 'dP/dy') got = -sum(range.map((i) => (((at('w') + i) / f) * at(`q${i + 1}`)) / (1 + at(yName) / f)));
    else if (s.name === 'd2P/dy2') got = sum(range.map((i) => (((at('w') + i) * (at('w') + i + 1)) / (f * f)) * at(`q${i + 1}`) / ((1 + at(yName) / f) * (1 + at(yName) / f))));
    else if (s.name === 'modified') got = -at('dP/dy') / at('P');
    else if (s.name === 'macaulay') got = (1 + at(yName) / f) * at('modified');
    else if (s.name === 'convexity') got = at('d2P/dy2') / at('P');
    else if (s.name === 'DV01') got = -at('dP/dy') * 1e-4;
    else if (s.name === 'clean') got = at('dirty') - at('accrued');
    else if (s.name === 'clean_mkt') got = at('dirty_mkt') - at('accrued');
    else if (s.name === 'dirty_mkt') got = shown.has('quoted clean') ? at('quoted clean') + at('accrued') : at('P');
    else if (s.name === 'yield') got = at(yName);
    else if (s.name === 'P(z)') got = sum(range.map((i) => at(`pv${i + 1}`) * Math.exp(-at('z') * at(`t${i + 1}`))));
    else if (s.name === 'z-spread') got = at('z') * 1e4;
    else if (!['c', 'quoted clean', 'y_mkt', 'y', 'z'].includes(s.name)) throw new Error(`step ${s.name} not checked`);
    if (got !== null) out.push({ what: `${s.name} = ${s.formula}`, got, want: s.value, tol: EXACT });
  }
  // Solved numbers by their equation: the price at y is the price it was solved from, P(z) the market's.
  if (shown.has('y')) out.push({ what: 'P(y) = the dirty price y is solved from', got: at('P'), want: at(shown.has('dirty_mkt') ? 'dirty_mkt' : 'dirty'), tol: 4e-15 });
  if (shown.has('z')) out.push({ what: 'P(z) = dirty_mkt', got: at('P(z)'), want: at('dirty_mkt'), tol: 4e-15 });
  return out;
}

describe('bond explanations: traced equals untraced, and the explanation ends in the shown figure', () => {
  const r = rng(20261203);
  const cases = Array.from({ length: 60 }, (_, i) => ({ i, method: INTERPOLATIONS[i % INTERPOLATIONS.length]! }));
  it.each(cases)('random curve and bond $i under $method', ({ method }) => {
    const { curve, input, plain, traced, sink } = tracedRandomBond(r, method);
    expect(traced).toEqual(plain); // numbers compared with Object.is: bit for bit
    if (!plain.ok) return;
    const a = plain.value;
    for (const { figure, side } of figuresOf(a.market !== null)) {
      const e = value(explainBondFigure(sink.trace!, figure, side));
      const shown = bondFigureValue(a, figure, side)!;
      expect(Object.is(e.value, shown), `${side} ${figure}: ${e.value} vs ${shown}`).toBe(true);
      expect(Object.is(e.steps.at(-1)!.value, shown)).toBe(true);
      for (const s of e.steps) for (const name of s.inputs) expect(e.steps.some((x) => x.name === name) || e.reads.some((x) => x.name === name) || e.yearFractions.some((x) => x.name === name), `${s.name} names ${name}`).toBe(true);
    }
  });
});

describe('bond explanations: the steps recomputed from the shown inputs reproduce the figure', () => {
  const r = rng(7);
  const cases = Array.from({ length: 40 }, (_, i) => ({ i, method: INTERPOLATIONS[i % INTERPOLATIONS.length]! }));
  it.each(cases)('random curve and bond $i under $method: every figure to 1e-15 relative', ({ method }) => {
    const curve = randomCurve(r, method);
    const input = randomBond(r, curve);
    const sink: BondSink = {};
    const a = analyzeBond(curve, input, DEFAULT_KEY_TENORS, 'bond', sink);
    if (!a.ok) return;
    for (const { figure, side } of figuresOf(a.value.market !== null)) {
      const e = value(explainBondFigure(sink.trace!, figure, side));
      // Each step from its shown inputs to 1e-15 relative (a sum of N terms of one sign, a product or
      // quotient); the powers form of the price to 1e-13; solved numbers by their equation to 4e-15.
      for (const c of recomputeSteps(e, input.frequency)) expectRelClose(c.got, c.want, c.tol, `${side} ${figure}: ${c.what}`);
      expect(e.steps.at(-1)!.value).toBe(bondFigureValue(a.value, figure, side));
    }
  });
  it('year fractions on ACT/365F and ACT/360 are the actual days over the denominator, as the dates say', () => {
    const curve = randomCurve(rng(3), 'log-linear-discount');
    for (const dayCount of ['ACT/360', 'ACT/365F'] as const) {
      const sink: BondSink = {};
      value(analyzeBond(curve, { maturity: '2031-02-28', coupon: 0.05, frequency: 2, dayCount }, DEFAULT_KEY_TENORS, 'bond', sink));
      const e = value(explainBondFigure(sink.trace!, 'accrued', 'model'));
      const tau = e.yearFractions.find((y) => y.name === 'tau_acc')!;
      const days = (Date.parse(tau.to) - Date.parse(tau.from)) / 86400000;
      expectClose(tau.value, days / (dayCount === 'ACT/360' ? 360 : 365), 1e-16, `${dayCount}: actual days / denominator (ISDA 2006 4.16)`);
      expect(e.dates.find((d) => d.name === 'previous coupon')!.adjusted).toBe(tau.from);
    }
  });
  it('an interpolated read on log-linear discount is the straight line in ln DF between its two nodes (Hagan and West 2006, from memory)', () => {
    const curve = randomCurve(rng(11), 'log-linear-discount');
    const sink: BondSink = {};
    value(analyzeBond(curve, { maturity: '2036-01-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' }, DEFAULT_KEY_TENORS, 'bond', sink));
    const e = value(explainBondFigure(sink.trace!, 'dirty', 'model'));
    const inner = e.reads.filter((x) => x.how === 'interpolated');
    expect(inner.length).toBeGreaterThan(0);
    for (const x of inner) {
      const [a, b] = x.nodes;
      expectRelClose(x.lnDiscount, a!.lnDiscount + ((x.t - a!.t) / (b!.t - a!.t)) * (b!.lnDiscount - a!.lnDiscount), 1e-14, 'log-linear interpolation from the two nodes shown');
    }
  });
});

describe('a published worked example: Hull\'s two-year 6% bond on a zero curve', () => {
  // Hull (see the top of the file): zero rates 5.0%, 5.8%, 6.4%, 6.8% continuously compounded at
  // 0.5, 1.0, 1.5 and 2.0 years; the bond pays 3 every half year and 100 at two years; price
  // 3e^(-0.05x0.5) + 3e^(-0.058x1) + 3e^(-0.064x1.5) + 103e^(-0.068x2) = 98.39; yield 6.76%
  // (continuous). The curve's nodes sit on the coupon dates with Hull's discount factors.
  const settlement = '2027-03-10';
  const dates = ['2027-09-10', '2028-03-10', '2028-09-10', '2029-03-10'];
  const zs = [0.05, 0.058, 0.064, 0.068];
  const probe = curveFromPillars(settlement, 'ACT/365F', 'log-linear-discount', 'none', [{ date: dates[0]!, t: 1, discount: 0.99, quote: 0 }]);
  const curve = curveFromPillars(
    settlement,
    'ACT/365F',
    'log-linear-discount',
    'none',
    dates.map((date, i) => ({ date, t: probe.time(date), discount: Math.exp(-zs[i]! * 0.5 * (i + 1)), quote: i })),
  );
  const sink: BondSink = {};
  const a = value(analyzeBond(curve, { maturity: '2029-03-10', coupon: 0.06, frequency: 2, dayCount: 'ACT/ACT-ICMA' }, DEFAULT_KEY_TENORS, 'bond', sink));
  it('the model price is 98.39, read off four nodes, and its explanation shows each flow and DF', () => {
    expectClose(a.modelDirtyPrice, 98.39, 0.005, 'Hull: 98.39');
    expect(a.accrued).toBe(0);
    const e = value(explainBondFigure(sink.trace!, 'dirty', 'model'));
    expect(e.reads.map((x) => x.how)).toEqual(['node', 'node', 'node', 'node']);
    expect(e.reads.map((x) => x.date)).toEqual(dates);
    const terms = e.steps.filter((s) => /^pv\d$/.test(s.name));
    terms.forEach((s, i) => expectRelClose(s.value, (i === 3 ? 103 : 3) * Math.exp(-zs[i]! * 0.5 * (i + 1)), 1e-15, `Hull's term ${i + 1}: CF e^(-z t)`));
    expect(e.value).toBe(a.modelDirtyPrice);
  });
  it('the yield is 6.76% continuously compounded (Hull), shown as its semiannual ICMA equivalent', () => {
    const e = value(explainBondFigure(sink.trace!, 'yield', 'model'));
    expectClose(2 * Math.log1p(e.value / 2), 0.0676, 5e-5, 'Hull: 6.76% continuous');
    expect(e.unit).toMatch(/s\.a\., ICMA/);
  });
});

describe('the quotes a bond figure depends on most', () => {
  const doc = workspaceDoc(INVENTED_2027_EVERY_KIND, { settlement: '2027-03-10', interpolation: 'log-linear-discount' }); // invented demo market; a smooth method, so central differences converge
  const built = buildCurve(doc);
  const curve = built.curve!;
  const bond: BondInput = { maturity: '2036-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 98.5 };
  const sink: BondSink = {};
  const a = value(analyzeBond(curve, bond, DEFAULT_KEY_TENORS, 'bond', sink));
  it('the model price\'s per-bp sensitivities equal minus the bump-and-rebuild DV01 to each quote (1e-6 relative)', () => {
    const w = bondLnWeights(sink.trace!, 'dirty', 'model')!;
    const top = value(topInfluencesOfLn(curve, built.instruments, w.times, w.weights, 100));
    const settings = { settlement: curve.settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation };
    const bumped = value(quoteDv01s(settings, built.instruments, a.flows));
    const big = bumped.filter((q) => Math.abs(q.dv01) > 1e-5);
    expect(big.length).toBeGreaterThan(2);
    for (const q of big) {
      const mine = top.find((t) => t.index === q.index)!;
      expectRelClose(mine.bpPerBp, -q.dv01, 1e-6, `quote ${q.index}: central difference of +-1 bp with the curve rebuilt (quoteDv01s)`);
    }
  });
  it('the yield\'s are the price\'s divided by the DV01 at the model yield, and the z-spread\'s hold the market price', () => {
    const price = value(topInfluencesOfLn(curve, built.instruments, ...(Object.values(bondLnWeights(sink.trace!, 'dirty', 'model')!).slice(0, 2) as [number[], number[]]), 100));
    const y = value(topInfluencesOfLn(curve, built.instruments, ...(Object.values(bondLnWeights(sink.trace!, 'yield', 'model')!).slice(0, 2) as [number[], number[]]), 100));
    for (const q of y) expectRelClose(q.bpPerBp, price.find((p) => p.index === q.index)!.bpPerBp / a.dv01, 1e-12, 'dy = dP / (-dP/dy): bp per bp');
    expect(bondLnWeights(sink.trace!, 'accrued', 'model')).toBeNull();
    expect(bondLnWeights(sink.trace!, 'yield', 'market')).toBeNull();
  });
  it('the z-spread\'s equal a central difference of the z-spread with the quote bumped and the curve rebuilt (1e-5 relative)', () => {
    const wz = bondLnWeights(sink.trace!, 'zSpread', 'market')!;
    const settings = { settlement: curve.settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation };
    for (const q of value(topInfluencesOfLn(curve, built.instruments, wz.times, wz.weights, 3))) {
      const k = built.instruments.findIndex((i) => i.index === q.index);
      const z = (dy: number): number => {
        const moved = built.instruments.map((ins, i) => {
          const qy = quoteYieldOf(ins, curve.settlement);
          return i === k ? requoteAtYield(ins, qy, qy.toYield(ins.market) + dy) : ins;
        });
        return value(analyzeBond(bootstrapInstruments(settings, moved).curve!, bond)).market!.zSpread;
      };
      expectRelClose(q.bpPerBp, (z(1e-4) - z(-1e-4)) / 2e-4, 1e-5, `quote ${q.index}: central difference of +-1 bp, curve rebuilt, market price held`);
    }
  });
});
