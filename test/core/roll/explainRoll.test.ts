import { describe, expect, it } from 'vitest';
import {
  analyseRollVsTerm,
  buildCurve,
  DEFAULT_STRATEGY,
  explainRollFigure,
  INTERPOLATIONS,
  MoneyDecimal,
  ROLL_TENORS,
  rollFigure,
  STRATEGY_FREQUENCIES,
  STRATEGY_IDS,
  TERM_STRATEGY_IDS,
  type Curve,
  type Explanation,
  type ExplainedStep,
  type RollFigure,
  type StrategyInputs,
  yieldTag,
} from '../../../src/core/index.ts';
import { rng } from '../../helpers/seededRandom.ts';

// Explanations of the roll panel's figures (issue 19). Three claims, over random curves and
// strategies (invented, seeded):
// 1. the traced figure is the analysis's own figure bit for bit (same code path: analyseRollVsTerm
//    untraced against explainRollFigure traced), money to the last decimal digit;
// 2. the shown steps, recomputed here from the shown inputs with the textbook definitions, give
//    the figure to 1e-15 relative, money exactly. The definitions: a money-market leg grows by
//    1 + r tau, simple interest on its day count (ACT/360: actual days / 360, ACT/365F: days / 365,
//    ISDA 2006 Definitions 4.16; cited from memory); rolling compounds the legs, a coupon is
//    reinvested to the horizon, a bond held past it is priced as the sum of its flows times their
//    discount factors, and the annualised return is G^(1/T) - 1 (Tuckman and Serrat, "Fixed Income
//    Securities", chapters on returns and on carry; cited from memory);
// 3. a break-even is a root: both growths, recomputed from the shown steps at the shown root, are
//    equal to the solver's tolerance.

const pick = <T,>(r: () => number, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;
const iso = (y: number, m: number, d: number): string => `${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`;

function randomCase(r: () => number): { curve: Curve; strategy: StrategyInputs } | null {
  const y = 2024 + Math.floor(r() * 10);
  const m = 1 + Math.floor(r() * 12);
  const d = 1 + Math.floor(r() * 28);
  const quotes: unknown[] = ['1M', '3M', '6M'].map((tenor) => ({ kind: 'deposit', tenor, rate: -0.003 + r() * 0.07 }));
  for (const tenor of ['1Y', '2Y', '3Y', '5Y', '7Y', '10Y']) quotes.push({ kind: r() < 0.5 ? 'swap' : 'zero', tenor, rate: -0.003 + r() * 0.07 });
  const doc = {
    format: 'tenorscope-workspace',
    version: 1,
    settlement: iso(y, m, d),
    curve: { dayCount: pick(r, ['ACT/365F', 'ACT/360', '30/360', 'ACT/ACT-ISDA']), interpolation: pick(r, INTERPOLATIONS), extrapolation: 'none' },
    quotes,
  };
  const curve = buildCurve(doc, {}).curve;
  if (!curve) return null;
  const months = 1 + Math.floor(r() * 60);
  const hm = m - 1 + months;
  const horizon = r() < 0.5 ? `${months}M` : iso(y + Math.floor(hm / 12), (hm % 12) + 1, Math.min(28, d + Math.floor(r() * 20)));
  const fill = pick(r, ['forwards', 'constant', 'ramp'] as const);
  const strategy: StrategyInputs = {
    ...DEFAULT_STRATEGY,
    amount: pick(r, ['1000000', '250000.50', '10000000', '123456.789012']),
    horizon,
    rollTenor: pick(r, ROLL_TENORS),
    rollDayCount: pick(r, ['ACT/360', 'ACT/365F', '30/360'] as const),
    bondFrequency: pick(r, STRATEGY_FREQUENCIES),
    ridingFrequency: pick(r, STRATEGY_FREQUENCIES),
    ridingMaturity: `${Math.ceil(months / 12) + 1 + Math.floor(r() * 4)}Y`,
    view: pick(r, ['forwards', 'unchanged', 'path', 'shift'] as const),
    path: { ...DEFAULT_STRATEGY.path, fill, constant: r() * 0.06, rampFrom: r() * 0.06, rampTo: r() * 0.06 },
    shiftBp: Math.round(-100 + r() * 200),
  };
  return { curve, strategy };
}

/** The cases: random curves and strategies the analysis accepts. */
function cases(count: number, seed: number) {
  const r = rng(seed);
  const out: { curve: Curve; strategy: StrategyInputs }[] = [];
  for (let tries = 0; out.length < count && tries < count * 5; tries++) {
    const c = randomCase(r);
    if (c && analyseRollVsTerm(c.curve, c.strategy).ok) out.push(c);
  }
  return out;
}

const rel = (a: number, b: number): number => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(b), 1e-300));
const stepsOf = (e: Explanation): Map<string, ExplainedStep> => new Map(e.steps.map((s) => [s.name, s]));
const val = (steps: Map<string, ExplainedStep>, name: string): number => {
  const s = steps.get(name);
  if (!s) throw new Error(`no step ${name}`);
  return s.value;
};

/** Independent year fractions on the roll day counts used here (ISDA 2006 4.16, from memory). */
function yearFraction(dc: string, from: string, to: string): number {
  const [y1, m1, d1] = from.split('-').map(Number) as [number, number, number];
  const [y2, m2, d2] = to.split('-').map(Number) as [number, number, number];
  const days = (Date.UTC(y2, m2 - 1, d2) - Date.UTC(y1, m1 - 1, d1)) / 86_400_000;
  if (dc === 'ACT/360') return days / 360;
  if (dc === 'ACT/365F') return days / 365;
  // 30/360 (bond basis): D1 = 31 -> 30; D2 = 31 -> 30 when D1 is 30 or 31.
  const a = d1 === 31 ? 30 : d1;
  const b = d2 === 31 && a === 30 ? 30 : d2;
  return (360 * (y2 - y1) + 30 * (m2 - m1) + (b - a)) / 360;
}

/**
 * Recomputes the growth G_<id> from the shown steps: the legs (g1 = exp(-ln DF), gk = 1 + rk taukk),
 * their product from the last leg back, each flow's growth to the horizon, the coupons and price.
 */
function recomputeGrowth(e: Explanation, id: string, dc: string, fixedRate?: number): number {
  const steps = stepsOf(e);
  const gs = new Map<string, number>();
  if (id !== 'zero') {
    const n = e.yearFractions.filter((y) => /^tau\d+$/.test(y.name)).length;
    for (let k = 1; k <= n; k++) {
      const tau = e.yearFractions.find((y) => y.name === `tau${k}`)!;
      expect(rel(tau.value, yearFraction(dc, tau.from, tau.to)), `tau${k} ${dc} ${tau.from} ${tau.to}`).toBeLessThanOrEqual(1e-15);
      let g: number;
      if (k === 1) {
        const read = e.reads.find((x) => x.name === 'DF(leg 1 end)')!;
        g = Math.exp(-read.lnDiscount);
        expect(rel(val(steps, 'r1'), Math.expm1(-read.lnDiscount) / tau.value), 'r1').toBeLessThanOrEqual(1e-15);
      } else {
        g = 1 + val(steps, `r${k}`) * tau.value;
        // At a break-even rate every later leg earns the root itself.
        if (fixedRate !== undefined) expect(rel(val(steps, `g${k}`), 1 + fixedRate * tau.value), `g${k} at the root`).toBeLessThanOrEqual(1e-15);
      }
      expect(rel(val(steps, `g${k}`), g), `g${k}`).toBeLessThanOrEqual(1e-15);
      gs.set(`g${k}`, val(steps, `g${k}`));
    }
    let p = 1;
    for (let k = n; k >= 1; k--) p *= gs.get(`g${k}`)!;
    expect(rel(val(steps, 'G_roll'), p), 'G_roll').toBeLessThanOrEqual(1e-15);
  }
  if (id === 'roll') return val(steps, 'G_roll');
  if (id === 'zero') {
    const read = e.reads.find((x) => x.name === 'DF(horizon)')!;
    const g = 1 / read.discount;
    expect(rel(val(steps, 'G_zero'), g), 'G_zero').toBeLessThanOrEqual(1e-15);
    return g;
  }
  let coupons = 0;
  let price = 0;
  for (const s of e.steps) {
    const m = /^CF(\d+)$/.exec(s.name);
    if (!m) continue;
    const i = m[1]!;
    const R = steps.get(`R${i}`);
    if (R) {
      // growth to the horizon: the stub of its leg (if inside one) times the later legs, from the last back
      let g = 1;
      const legs = R.inputs.filter((x) => x.startsWith('g'));
      for (let j = legs.length - 1; j >= 0; j--) g *= gs.get(legs[j]!)!;
      if (R.inputs.includes(`stub${i}`)) g = val(steps, `stub${i}`) * g;
      expect(rel(R.value, g), `R${i}`).toBeLessThanOrEqual(1e-15);
      coupons += s.value * R.value;
    } else price += s.value * val(steps, `DFH${i}`);
  }
  expect(rel(val(steps, 'coupons'), coupons), 'coupons').toBeLessThanOrEqual(1e-15);
  expect(rel(val(steps, 'price'), price), 'price').toBeLessThanOrEqual(1e-15);
  const G = (coupons + price) / 100;
  expect(rel(val(steps, `G_${id}`), G), `G_${id}`).toBeLessThanOrEqual(1e-15);
  return G;
}

const CASES = cases(24, 20261203);

describe('explainRollFigure', () => {
  it('draws enough random cases', () => expect(CASES.length).toBe(24));

  it('gives every traced figure equal to the untraced analysis, bit for bit (money to the last digit)', () => {
    for (const { curve, strategy } of CASES) {
      const a = analyseRollVsTerm(curve, strategy);
      if (!a.ok) throw new Error('analysis');
      const an = a.value;
      for (const v of an.views) {
        for (const o of v.strategies) {
          const t = explainRollFigure(curve, strategy, [], { kind: 'terminal', view: v.id, strategy: o.id });
          const u = rollFigure(curve, strategy, [], { kind: 'terminal', view: v.id, strategy: o.id });
          if (!t.ok || !u.ok) throw new Error('figure');
          expect(t.value.money!.toFixed()).toBe(o.terminal.toFixed());
          expect(u.value.money!.toFixed()).toBe(o.terminal.toFixed());
          expect(t.value.explanation.valueText).toBe(o.terminal.toFixed());
          const ret = explainRollFigure(curve, strategy, [], { kind: 'return', view: v.id, strategy: o.id });
          if (!ret.ok) throw new Error('return');
          expect(Object.is(ret.value.value, o.annualReturn)).toBe(true);
          expect(Object.is(ret.value.explanation.steps.at(-1)!.value, o.annualReturn)).toBe(true);
        }
      }
      for (const id of TERM_STRATEGY_IDS) {
        for (const kind of ['break-even-rate', 'break-even-shift'] as const) {
          const shown = kind === 'break-even-rate' ? an.breakEvens.rollRate[id] : an.breakEvens.shiftBp[id];
          const t = explainRollFigure(curve, strategy, [], { kind, against: id });
          if (shown === null) {
            expect(t.ok).toBe(false);
            continue;
          }
          if (!t.ok) throw new Error('break-even');
          expect(Object.is(t.value.value, shown)).toBe(true);
          expect(Object.is(t.value.explanation.steps.at(-1)!.value, shown)).toBe(true);
        }
      }
      an.legs.forEach((leg) => {
        const t = explainRollFigure(curve, strategy, [], { kind: 'leg-forward', leg: leg.index });
        if (!t.ok) throw new Error('leg');
        expect(Object.is(t.value.value, leg.forward)).toBe(true);
        expect(Object.is(t.value.explanation.steps.at(-1)!.value, leg.forward)).toBe(true);
      });
    }
  }, 120_000); // a limit for a hung run on a loaded machine, not a speed check

  it('has steps that, recomputed from the shown inputs, give each terminal value exactly and each return to 1e-15', () => {
    let checked = 0;
    let stubs = 0;
    for (const { curve, strategy } of CASES) {
      const an = analyseRollVsTerm(curve, strategy);
      if (!an.ok) throw new Error('analysis');
      for (const v of an.value.views) {
        for (const id of STRATEGY_IDS) {
          const t = explainRollFigure(curve, strategy, [], { kind: 'terminal', view: v.id, strategy: id });
          if (!t.ok) throw new Error('figure');
          const e = t.value.explanation;
          const G = recomputeGrowth(e, id, strategy.rollDayCount);
          const steps = stepsOf(e);
          if (e.steps.some((x) => x.name.startsWith('stub'))) stubs++;
          // Money in decimal: A x G, G entering as its shortest decimal text (decimal.js; exact).
          const A = steps.get('A')!.text!;
          expect(A).toBe(new MoneyDecimal(strategy.amount).toFixed());
          const gText = steps.get('G (decimal)')!.text!;
          expect(Number(gText)).toBe(val(steps, `G_${id}`));
          expect(rel(Number(gText), G)).toBeLessThanOrEqual(1e-15);
          expect(new MoneyDecimal(A).times(new MoneyDecimal(gText)).toFixed()).toBe(e.valueText);
          expect(e.steps.at(-1)!.text).toBe(e.valueText);
          // The return: G^(1/T) - 1 with T = days / 365 from settlement to the horizon.
          const r = explainRollFigure(curve, strategy, [], { kind: 'return', view: v.id, strategy: id });
          if (!r.ok) throw new Error('return');
          const re = r.value.explanation;
          const Gr = recomputeGrowth(re, id, strategy.rollDayCount);
          const T = yearFraction('ACT/365F', curve.settlement, an.value.horizon);
          expect(rel(re.yearFractions.find((y) => y.name === 'T')!.value, T)).toBeLessThanOrEqual(1e-15);
          expect(rel(re.value, Math.pow(Gr, 1 / T) - 1)).toBeLessThanOrEqual(1e-12); // pow on its own, a looser textbook check
          expect(rel(re.value, Math.expm1(Math.log(Gr) / T))).toBeLessThanOrEqual(1e-15);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(300);
    expect(stubs, 'coupons paid inside a roll leg').toBeGreaterThan(10);
  }, 120_000);

  it('has break-even steps whose growths, recomputed at the shown root, are equal to the solver tolerance', () => {
    let checked = 0;
    for (const { curve, strategy } of CASES) {
      for (const id of TERM_STRATEGY_IDS) {
        for (const kind of ['break-even-rate', 'break-even-shift'] as const) {
          const figure: RollFigure = { kind, against: id };
          const t = explainRollFigure(curve, strategy, [], figure);
          if (!t.ok) continue;
          const e = t.value.explanation;
          const steps = stepsOf(e);
          const root = val(steps, kind === 'break-even-rate' ? 'r' : 's');
          expect(Object.is(root, t.value.value)).toBe(true);
          const Groll = recomputeGrowth(e, 'roll', strategy.rollDayCount, kind === 'break-even-rate' ? root : undefined);
          const Gterm = recomputeGrowth(e, id, strategy.rollDayCount);
          expect(Object.is(val(steps, 'residual'), Groll - Gterm)).toBe(true);
          // Brent stops on a bracket of 1e-15 in r (1e-10 bp in s): the growths then agree to about that.
          expect(Math.abs(Groll - Gterm)).toBeLessThanOrEqual(1e-13);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(40);
  }, 120_000);

  // The break-even curve's Yield today: the yield at 100 of a bond whose coupon is today's par rate,
  // issued on the settlement date. A bond priced at par on a coupon date yields its coupon (ICMA
  // price-yield formula with w = 1 and equal periods; Fabozzi, "Bond Markets, Analysis and
  // Strategies", chapter on yield measures; cited from memory), so y0 = c to the solver's tolerance.
  it("explains each break-even curve's yield today: the par coupon's steps, then the yield at 100, the table's figure bit for bit", () => {
    let points = 0;
    for (const { curve, strategy } of CASES) {
      const a = analyseRollVsTerm(curve, strategy);
      if (!a.ok) throw new Error('analysis');
      for (const p of a.value.breakEvens.curve) {
        const t = explainRollFigure(curve, strategy, [], { kind: 'curve-yield', tenor: p.tenor });
        const u = rollFigure(curve, strategy, [], { kind: 'curve-yield', tenor: p.tenor });
        if (!t.ok || !u.ok) throw new Error(`yield today ${p.tenor}`);
        expect(Object.is(t.value.value, p.yield)).toBe(true);
        expect(Object.is(u.value.value, p.yield)).toBe(true);
        expect(Object.is(t.value.explanation.value, p.yield)).toBe(true);
        const steps = t.value.explanation.steps;
        expect(Object.is(steps.at(-1)!.value, p.yield)).toBe(true);
        const c = steps.at(-2)!.value; // the par coupon, the forward par rate's last step
        expect(Math.abs(p.yield - c)).toBeLessThan(1e-12);
        // The price at y0 by the ICMA formula, recomputed here: n equal periods, w = 1 at issue.
        const f = strategy.ridingFrequency;
        const [, count, unit] = /^(\d+)([MY])$/.exec(p.tenor)!;
        const n = (Number(count) * (unit === 'Y' ? 12 : 1) * f) / 12;
        if (!Number.isInteger(n)) continue; // a stub period: the formula below assumes equal ones
        let price = 0;
        for (let k = 1; k <= n; k++) price += ((100 * c) / f + (k === n ? 100 : 0)) * Math.pow(1 + p.yield / f, -k);
        expect(Math.abs(price - 100)).toBeLessThan(1e-9);
        expect(t.value.driver).toEqual({ kind: 'par', end: p.maturity, frequency: f, note: "of the bond's coupon, today's par yield" });
        points++;
      }
    }
    expect(points).toBeGreaterThan(50);
  }, 120_000);

  it('gives each break-even curve rise and riding rise equal to the untraced analysis, bit for bit', () => {
    let points = 0;
    let rises = 0;
    for (const { curve, strategy } of CASES) {
      const a = analyseRollVsTerm(curve, strategy);
      if (!a.ok) throw new Error('analysis');
      const b = a.value.breakEvens;
      for (const p of b.curve) {
        const t = explainRollFigure(curve, strategy, [], { kind: 'curve-rise', tenor: p.tenor });
        const u = rollFigure(curve, strategy, [], { kind: 'curve-rise', tenor: p.tenor });
        if (p.riseBp === null) {
          expect(t.ok).toBe(false);
          continue;
        }
        if (!t.ok || !u.ok) throw new Error('curve rise');
        expect(Object.is(t.value.value, p.riseBp)).toBe(true);
        expect(Object.is(u.value.value, p.riseBp)).toBe(true);
        expect(Object.is(t.value.explanation.steps.at(-1)!.value, p.riseBp)).toBe(true);
        points++;
      }
      for (const against of ['roll', 'zero'] as const) {
        const shown = b.ridingRiseBp[against];
        const t = explainRollFigure(curve, strategy, [], { kind: 'break-even-rise', against });
        const u = rollFigure(curve, strategy, [], { kind: 'break-even-rise', against });
        if (shown === null) {
          expect(t.ok).toBe(false);
          continue;
        }
        if (!t.ok || !u.ok) throw new Error('riding rise');
        expect(Object.is(t.value.value, shown)).toBe(true);
        expect(Object.is(u.value.value, shown)).toBe(true);
        expect(Object.is(t.value.explanation.steps.at(-1)!.value, shown)).toBe(true);
        rises++;
      }
    }
    expect(points).toBeGreaterThan(50);
    expect(rises).toBeGreaterThan(30);
  }, 120_000);

  // The break-even curve's point: a par bond of the tenor, its coupons to the horizon grown at
  // today's forwards (DF(date) / DF(horizon)) and its dirty price at the horizon at its yield moved
  // by d, priced by the ICMA rule P = sum CF_k (1 + y/f)^-(w + k) with w the share of the current
  // period still to run (Fabozzi, "Bond Markets, Analysis and Strategies", pricing between coupon
  // dates; cited from memory), against 100 / DF(horizon), the zero's lock-in.
  it('has break-even curve steps that, recomputed from the shown inputs, meet at the shown root', () => {
    let checked = 0;
    let withW = 0;
    for (const { curve, strategy } of CASES) {
      const a = analyseRollVsTerm(curve, strategy);
      if (!a.ok) throw new Error('analysis');
      for (const p of a.value.breakEvens.curve) {
        const t = explainRollFigure(curve, strategy, [], { kind: 'curve-rise', tenor: p.tenor });
        if (!t.ok) continue;
        const e = t.value.explanation;
        const steps = stepsOf(e);
        const dfH = e.reads.find((x) => x.name === 'DF(horizon)')!;
        expect(dfH.date).toBe(a.value.horizon);
        let coupons = 0;
        let price = 0;
        let lastCouponDate: string | null = null;
        let firstAfter: string | null = null;
        let k = 0;
        const f = strategy.ridingFrequency;
        const y = val(steps, 'y');
        const w = val(steps, 'w');
        for (const s of e.steps) {
          const m = /^CF(\d+)$/.exec(s.name);
          if (!m) continue;
          const i = m[1]!;
          const date = /on (\d{4}-\d{2}-\d{2})$/.exec(s.formula)![1]!;
          if (steps.has(`R${i}`)) {
            const read = e.reads.find((x) => x.name === `DF(${date})`)!;
            expect(rel(val(steps, `R${i}`), read.discount / dfH.discount), `R${i}`).toBeLessThanOrEqual(1e-15);
            coupons += s.value * val(steps, `R${i}`);
            lastCouponDate = date;
          } else {
            firstAfter ??= date;
            // pow on its own is a looser textbook check (its rounding grows with the power); the log form to 1e-15.
            const v = Math.exp(-(w + k) * Math.log1p(y / f));
            expect(rel(v, Math.pow(1 + y / f, -(w + k))), `v${i}`).toBeLessThanOrEqual(1e-13);
            price += s.value * v;
            k++;
          }
        }
        expect(k).toBeGreaterThan(0);
        // w: days from the horizon to the next coupon over the days of its period (ICMA), checked where the period's start is a paid coupon.
        if (lastCouponDate) {
          const days = (x: string, z: string) => (Date.parse(z) - Date.parse(x)) / 86_400_000;
          expect(rel(w, days(a.value.horizon, firstAfter!) / days(lastCouponDate, firstAfter!))).toBeLessThanOrEqual(1e-15);
          withW++;
        }
        expect(w > 0 && w <= 1).toBe(true);
        expect(rel(val(steps, 'coupons'), coupons)).toBeLessThanOrEqual(1e-15);
        expect(rel(val(steps, 'P_y'), price)).toBeLessThanOrEqual(1e-15);
        expect(Object.is(val(steps, 'target'), 100 / dfH.discount)).toBe(true);
        expect(Object.is(val(steps, 'y0'), p.yield)).toBe(true);
        expect(Object.is(y, val(steps, 'y0') + val(steps, 'd'))).toBe(true);
        const residual = val(steps, 'coupons') + val(steps, 'P_y') - val(steps, 'target');
        expect(Object.is(val(steps, 'residual'), residual)).toBe(true);
        // Brent stops on a bracket of 1e-15 in the yield: both sides then agree to about 1e-15 x 100 x duration.
        expect(Math.abs(residual)).toBeLessThanOrEqual(1e-10);
        expect(Object.is(val(steps, 'd*'), val(steps, 'd') * 10000)).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(50);
    expect(withW).toBeGreaterThan(10);
  }, 120_000);

  it("has riding-rise steps whose growths, recomputed at the shown root, are equal to the solver tolerance", () => {
    let checked = 0;
    for (const { curve, strategy } of CASES) {
      for (const against of ['roll', 'zero'] as const) {
        const t = explainRollFigure(curve, strategy, [], { kind: 'break-even-rise', against });
        if (!t.ok) continue;
        const e = t.value.explanation;
        const steps = stepsOf(e);
        const Griding = recomputeGrowth(e, 'riding', strategy.rollDayCount);
        const Gother = recomputeGrowth(e, against, strategy.rollDayCount);
        expect(Object.is(val(steps, 'residual'), val(steps, 'G_riding') - val(steps, `G_${against}`))).toBe(true);
        expect(Math.abs(Griding - Gother)).toBeLessThanOrEqual(1e-12);
        expect(Object.is(val(steps, 's*'), t.value.value)).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(30);
  }, 120_000);

  // The money after each roll leg: V_k = V_(k-1) x g_k in decimal, V_0 the amount, g_k entering as
  // its shortest decimal text (the same rule as the terminal values above).
  it('gives the value after each leg equal to the analysis to the last digit, and its steps recomputed exactly', () => {
    let checked = 0;
    for (const { curve, strategy } of CASES) {
      const a = analyseRollVsTerm(curve, strategy);
      if (!a.ok) throw new Error('analysis');
      a.value.rollValues.forEach((shown, k) => {
        const figure: RollFigure = { kind: 'leg-value', leg: k + 1 };
        const t = explainRollFigure(curve, strategy, [], figure);
        const u = rollFigure(curve, strategy, [], figure);
        if (!t.ok || !u.ok) throw new Error('leg value');
        expect(u.value.money!.toFixed()).toBe(shown.toFixed());
        expect(t.value.money!.toFixed()).toBe(shown.toFixed());
        const e = t.value.explanation;
        expect(e.valueText).toBe(shown.toFixed());
        expect(e.steps.at(-1)!.name).toBe(`V${k + 1}`);
        recomputeGrowth(e, 'roll', strategy.rollDayCount);
        const steps = stepsOf(e);
        let v = new MoneyDecimal(strategy.amount);
        expect(steps.get('V0')!.text).toBe(v.toFixed());
        for (let j = 1; j <= k + 1; j++) {
          v = v.times(new MoneyDecimal(String(val(steps, `g${j}`))));
          expect(steps.get(`V${j}`)!.text, `V${j}`).toBe(v.toFixed());
        }
        expect(v.toFixed()).toBe(shown.toFixed());
        checked++;
      });
    }
    expect(checked).toBeGreaterThan(100);
  }, 120_000);

  // The chosen view's leg rates: leg 1 is today's spot, r1 = (1/DF(leg 1 end) - 1) / tau1 (simple
  // interest, ISDA 2006 4.16, from memory); each later leg's rate is the view's, as its step says.
  it("gives the chosen view's leg rates bit for bit, leg 1 recomputed from its discount factor to 1e-15", () => {
    let checked = 0;
    for (const { curve, strategy } of CASES) {
      const a = analyseRollVsTerm(curve, strategy);
      if (!a.ok) throw new Error('analysis');
      const view = a.value.views[a.value.chosen]!;
      view.legRates.forEach((shown, k) => {
        const t = explainRollFigure(curve, strategy, [], { kind: 'leg-rate', leg: k + 1 });
        const u = rollFigure(curve, strategy, [], { kind: 'leg-rate', leg: k + 1 });
        if (!t.ok || !u.ok) throw new Error('leg rate');
        expect(Object.is(t.value.value, shown)).toBe(true);
        expect(Object.is(u.value.value, shown)).toBe(true);
        const e = t.value.explanation;
        expect(e.steps.at(-1)!.name).toBe(`r${k + 1}`);
        expect(Object.is(e.steps.at(-1)!.value, shown)).toBe(true);
        if (k === 0) {
          const read = e.reads.find((x) => x.name === 'DF(leg 1 end)')!;
          const tau = e.yearFractions.find((y) => y.name === 'tau1')!;
          expect(rel(tau.value, yearFraction(strategy.rollDayCount, tau.from, tau.to))).toBeLessThanOrEqual(1e-15);
          expect(rel(shown, (1 / read.discount - 1) / tau.value)).toBeLessThanOrEqual(1e-9); // the plain form loses digits in 1/DF - 1 when r tau is small
          expect(rel(shown, Math.expm1(-read.lnDiscount) / tau.value)).toBeLessThanOrEqual(1e-15);
        }
        checked++;
      });
    }
    expect(checked).toBeGreaterThan(100);
  }, 120_000);

  it('says when a figure rests on a view of the user rather than the curve', () => {
    const { curve, strategy } = CASES[0]!;
    const path = explainRollFigure(curve, { ...strategy, path: { ...strategy.path, fill: 'constant', constant: 0.05 } }, [], { kind: 'terminal', view: 'path', strategy: 'roll' });
    const zero = explainRollFigure(curve, strategy, [], { kind: 'terminal', view: 'path', strategy: 'zero' });
    if (!path.ok || !zero.ok) throw new Error('figure');
    expect(path.value.userView).toBe(true);
    expect(path.value.explanation.formula).toMatch(/under "Your path": .* It rests on your view, not on the curve alone\.$/);
    expect(path.value.explanation.steps.find((s) => s.name === 'r2')!.formula).toBe('r2 = your path (your view)');
    expect(zero.value.userView).toBe(false);
    expect(zero.value.explanation.formula).toMatch(/Read off today's curve alone\.$/);
  });

  // Units on every value (issue 19): money steps carry the strategy's currency (ISO 4217 code, or
  // the generic sign when none is set), a break-even shift or rise says which rates it moves by
  // that many bp, each with its compounding and day count.
  it('gives every money step its currency and every break-even shift the rates it moves with their conventions', () => {
    const { curve, strategy } = CASES[0]!;
    for (const [currency, unit] of [['USD', 'USD'], ['', '\u00a4']] as const) {
      const s = { ...strategy, currency, view: 'shift' as const };
      for (const figure of [{ kind: 'terminal', view: 'forwards', strategy: 'roll' }, { kind: 'leg-value', leg: 2 }] as RollFigure[]) {
        const e = explainRollFigure(curve, s, [], figure);
        if (!e.ok) throw new Error(e.errors[0]!.message);
        const money = e.value.explanation.steps.filter((x) => x.text !== undefined && x.name !== 'G (decimal)');
        expect(money.length).toBeGreaterThan(1);
        for (const m of money) expect(m.unit, m.name).toMatch(new RegExp(`^${unit} (today|at the horizon|after leg \\d+)$`));
      }
    }
    const tag = (c: string, d: string) => `(${c}, ${d})`;
    const shift = explainRollFigure(curve, { ...strategy, view: 'shift' }, [], { kind: 'break-even-shift', against: 'zero' });
    const rise = explainRollFigure(curve, strategy, [], { kind: 'break-even-rise', against: 'zero' });
    if (!shift.ok || !rise.ok) throw new Error('break-even');
    expect(shift.value.explanation.unit).toBe(`bp, a parallel shift of every roll rate set after today ${tag('simple', strategy.rollDayCount)} and of the horizon curve's zero rates ${tag('cont', curve.dayCount)}`);
    expect(shift.value.explanation.steps.at(-1)!.unit).toBe(shift.value.explanation.unit);
    expect(rise.value.explanation.unit).toBe(`bp, a parallel rise of the horizon curve's zero rates ${tag('cont', curve.dayCount)}`);
    // A break-even curve's rise is a bp of its par bond's yield, in that yield's convention.
    const a = analyseRollVsTerm(curve, strategy);
    if (!a.ok) throw new Error('analysis');
    const point = a.value.breakEvens.curve.find((p) => p.riseBp !== null)!;
    const c = explainRollFigure(curve, strategy, [], { kind: 'curve-rise', tenor: point.tenor });
    if (!c.ok) throw new Error('curve rise');
    expect(c.value.explanation.unit).toBe(`bp of the yield, ${yieldTag(strategy.ridingFrequency)}`);
  });

  // Against rolling (the results table's "against rolling" figures): the strategy's terminal value
  // (or annualised return) minus rolling's, each made as above; money exact in decimal, the return
  // difference times 10,000 in bp a year.
  it('gives each figure against rolling equal to the analysis bit for bit (money to the last digit), its steps recomputed', () => {
    let checked = 0;
    for (const { curve, strategy } of CASES) {
      const an = analyseRollVsTerm(curve, strategy);
      if (!an.ok) throw new Error('analysis');
      for (const v of an.value.views) {
        for (const id of TERM_STRATEGY_IDS) {
          const o = v.strategies.find((x) => x.id === id)!;
          const m = explainRollFigure(curve, strategy, [], { kind: 'vs-roll', view: v.id, strategy: id });
          const mu = rollFigure(curve, strategy, [], { kind: 'vs-roll', view: v.id, strategy: id });
          const b = explainRollFigure(curve, strategy, [], { kind: 'vs-roll-bp', view: v.id, strategy: id });
          const bu = rollFigure(curve, strategy, [], { kind: 'vs-roll-bp', view: v.id, strategy: id });
          if (!m.ok || !mu.ok || !b.ok || !bu.ok) throw new Error('figure');
          expect(m.value.money!.toFixed()).toBe(o.vsRoll.toFixed());
          expect(mu.value.money!.toFixed()).toBe(o.vsRoll.toFixed());
          expect(m.value.explanation.valueText).toBe(o.vsRoll.toFixed());
          expect(Object.is(b.value.value, o.vsRollBp)).toBe(true);
          expect(Object.is(bu.value.value, o.vsRollBp)).toBe(true);
          // Recomputed: each growth from its shown steps, each money A x G (decimal), their difference.
          const me = m.value.explanation;
          const ms = stepsOf(me);
          for (const who of ['roll', id]) {
            const G = recomputeGrowth(me, who, strategy.rollDayCount);
            expect(Number(ms.get(`G (decimal)_${who}`)!.text)).toBe(G);
            expect(new MoneyDecimal(ms.get(`A_${who}`)!.text!).times(new MoneyDecimal(ms.get(`G (decimal)_${who}`)!.text!)).toFixed()).toBe(ms.get(`terminal_${who}`)!.text);
          }
          expect(new MoneyDecimal(ms.get(`terminal_${id}`)!.text!).minus(new MoneyDecimal(ms.get('terminal_roll')!.text!)).toFixed()).toBe(me.valueText);
          const be = b.value.explanation;
          const bs = stepsOf(be);
          const T = yearFraction('ACT/365F', curve.settlement, an.value.horizon);
          for (const who of ['roll', id]) expect(rel(val(bs, `return_${who}`), Math.expm1(Math.log(recomputeGrowth(be, who, strategy.rollDayCount)) / T)), who).toBeLessThanOrEqual(1e-15);
          expect(Object.is(be.value, (val(bs, `return_${id}`) - val(bs, 'return_roll')) * 10000)).toBe(true);
          expect(Object.is(be.steps.at(-1)!.value, be.value)).toBe(true);
          expect(be.unit).toBe('bp a year (ann, ACT/365F)');
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(200);
  }, 120_000);

  // The riding split (Tuckman and Serrat, "Fixed Income Securities", carry and roll-down; cited from
  // memory): with C the coupons grown to the horizon, P_y the horizon price at the bond's own yield
  // today by the ICMA rule P = sum CF_k (1 + y/f)^-(w + k) (Fabozzi, pricing between coupon dates;
  // from memory), P0 on today's curve seen from the horizon and the price on the view's horizon
  // curve: carry = A (C + P_y)/100 - A, roll-down = A (P0 - P_y)/100, curve change = A (price - P0)/100.
  it('gives each part of the riding split equal to the analysis to the last digit, its steps recomputed', () => {
    let checked = 0;
    for (const { curve, strategy } of CASES) {
      const an = analyseRollVsTerm(curve, strategy);
      if (!an.ok) throw new Error('analysis');
      const r = an.value.views[an.value.chosen]!.riding;
      const shown = { carry: r.carry, 'roll-down': r.rollDown, 'curve change': r.curveChange, total: r.carry.plus(r.rollDown).plus(r.curveChange) };
      for (const part of ['carry', 'roll-down', 'curve change', 'total'] as const) {
        const t = explainRollFigure(curve, strategy, [], { kind: 'riding-split', part });
        const u = rollFigure(curve, strategy, [], { kind: 'riding-split', part });
        if (!t.ok || !u.ok) throw new Error('split');
        expect(t.value.explanation.valueText).toBe(shown[part].toFixed());
        expect(u.value.money!.toFixed()).toBe(shown[part].toFixed());
        expect(t.value.explanation.steps.at(-1)!.name).toBe(part);
      }
      const t = explainRollFigure(curve, strategy, [], { kind: 'riding-split', part: 'total' });
      if (!t.ok) throw new Error('split');
      const e = t.value.explanation;
      const steps = stepsOf(e);
      recomputeGrowth(e, 'riding', strategy.rollDayCount); // the coupons and price
      const f = strategy.ridingFrequency;
      const y = val(steps, 'y');
      const w = val(steps, 'w');
      let py = 0;
      let p0 = 0;
      let k = 0;
      for (const s of e.steps) {
        const m = /^CF(\d+)$/.exec(s.name);
        if (!m || steps.has(`R${m[1]}`)) continue;
        py += s.value * Math.exp(-(w + k++) * Math.log1p(y / f));
        p0 += s.value * val(steps, `DF0${m[1]}`);
      }
      expect(rel(val(steps, 'P_y'), py)).toBeLessThanOrEqual(1e-15);
      expect(rel(val(steps, 'P0'), p0)).toBeLessThanOrEqual(1e-15);
      expect(Object.is(y, an.value.ridingYield)).toBe(true);
      const A = new MoneyDecimal(strategy.amount);
      const per100 = (x: number) => A.times(new MoneyDecimal(x)).div(100);
      expect(Object.is(val(steps, 'C + P_y'), val(steps, 'coupons') + val(steps, 'P_y'))).toBe(true);
      const carry = per100(val(steps, 'C + P_y')).minus(A);
      const rollDown = per100(val(steps, 'P0') - val(steps, 'P_y'));
      const change = per100(val(steps, 'price') - val(steps, 'P0'));
      expect(steps.get('carry')!.text).toBe(carry.toFixed());
      expect(steps.get('roll-down')!.text).toBe(rollDown.toFixed());
      expect(steps.get('curve change')!.text).toBe(change.toFixed());
      expect(e.valueText).toBe(carry.plus(rollDown).plus(change).toFixed());
      checked++;
    }
    expect(checked).toBe(CASES.length);
  }, 120_000);
});
