import { describe, expect, it } from 'vitest';
import {
  analyzeBond,
  buildCurve,
  forwardRows,
  INTERPOLATIONS,
  OVERNIGHT_KIT,
  quoteDv01s,
  rateFromLnDiscount,
  sensitivityMapFor,
  tentWeight,
  type CurveBuild,
  type InterpolationId,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// The risk section on a curve with turns and meeting steps: every figure must describe the curve the
// workbench shows (built with the turns, their solved spreads and the meeting steps), not the plain
// bootstrap of the same quotes. Sources, named at each check:
// - The definition of a sensitivity: d(figure)/d(quote) by bump and rebuild, central differences at
//   +-1 bp and +-0.5 bp Richardson-combined (Press et al., "Numerical Recipes", section 5.7, from
//   memory), each rebuild the whole document through buildCurve with the quote's text moved (the
//   path the workbench and the curve command take), so the oracle shares no risk code.
// - The turn model (Ametrano & Bianchetti 2013, section 4.8, as MARKET-CONVENTIONS.md section h
//   quotes it): only a forward period holding a turn day carries the spread, so a quote the turn is
//   solved from drives the forwards over the turn, and no figure of a curve without the turn does.
// - A key-rate duration is -(1/P) dP/dh under a tent shift of the continuously compounded zero
//   (the caption's definition), computed here by hand on the shown curve.
// Rates are invented test data (the ladder of test/core/bootstrap/turnsAndSteps.test.ts).

const VALUATION = '2022-03-01';
const OIS = { calendar: 'us-gov-securities', spotLag: 0, paymentLag: 0 };
const TURN_QUOTES = [
  { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
  { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
  { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
  { kind: 'ois', maturity: '2023-01-17', rate: 0.019, ...OIS },
  { kind: 'deposit', maturity: '2023-02-01', rate: 0.0195 },
  { kind: 'ois', tenor: '1Y', rate: 0.021, ...OIS },
  { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
  { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
  { kind: 'ois', tenor: '5Y', rate: 0.03, ...OIS },
];
const STEP_QUOTES = [
  { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
  { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
  { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
  { kind: 'deposit', maturity: '2023-03-01', rate: 0.025 },
  { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
  { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
];
/** The ladder for a solved turn: the OIS to 2023-01-17 (quotes[3]) alone between 2022-12-01 and 1Y, so it decides the year-end spread (a few bp here). */
const SOLVED_QUOTES = TURN_QUOTES.filter((q) => q.maturity !== '2023-02-01').map((q, i) => (i === 3 ? { ...q, rate: 0.01851 } : q));
const SOFR_EFFECTIVE = ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'];
const YEAR_END = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30' };
const TYPED = [{ ...YEAR_END, spreadBp: 10 }];
/** Solved from the OIS to 2023-01-17 (quotes[3]), which spans the turn. */
const SOLVED = [{ ...YEAR_END, solveFrom: 3 }];

type Doc = { quotes: { rate: number }[] } & Record<string, unknown>;
function doc(quotes: readonly object[], extra: Record<string, unknown>, interpolation: InterpolationId): Doc {
  return { format: 'tenorscope-workspace', version: 2, valuationDate: VALUATION, curve: { dayCount: 'ACT/365F', interpolation }, quotes: quotes.map((q) => ({ ...q })), ...extra } as unknown as Doc;
}
const build = (d: unknown): CurveBuild => {
  const b = buildCurve(d, { overnight: OVERNIGHT_KIT });
  expect(b.errors).toEqual([]);
  return b;
};
/** The document with quotes[k]'s rate moved by dy (every quote here is quoted by rate: its own yield). */
const moved = (d: Doc, k: number, dy: number): Doc => ({ ...d, quotes: d.quotes.map((q, i) => (i === k ? { ...q, rate: q.rate + dy } : q)) });

/** d figure / d quotes[k] by rebuilding the document, Richardson-combined central differences. */
function bumped(d: Doc, k: number, figure: (b: CurveBuild) => number, h = 1e-4): number {
  const central = (step: number) => (figure(build(moved(d, k, step))) - figure(build(moved(d, k, -step)))) / (2 * step);
  return (4 * central(h / 2) - central(h)) / 3;
}
/**
 * The bump for a method: monotone convex bends sharply near its regions' boundaries, so 1 bp
 * straddles kinks (test/core/analytics/forwardSensitivity.test.ts bumps it by 0.001 bp too).
 */
const bumpFor = (d: Doc): number => ((d.curve as { interpolation: string }).interpolation.startsWith('monotone-convex') && (d as { meetingSteps?: unknown }).meetingSteps === undefined ? 1e-7 : 1e-4);

const CASES: readonly { name: string; quotes: readonly object[]; extra: Record<string, unknown>; methods: readonly InterpolationId[] }[] = [
  { name: 'a turn with its spread typed', quotes: TURN_QUOTES, extra: { turns: TYPED }, methods: INTERPOLATIONS },
  { name: 'a turn solved from the OIS over it', quotes: SOLVED_QUOTES, extra: { turns: SOLVED }, methods: INTERPOLATIONS },
  { name: 'meeting steps with a typed turn', quotes: STEP_QUOTES, extra: { turns: TYPED, meetingSteps: { on: true, effectiveDates: SOFR_EFFECTIVE } }, methods: ['monotone-convex'] },
];

describe('sensitivityMapFor with the turns and steps: the heat map of the curve shown', () => {
  for (const c of CASES) {
    for (const method of c.methods) {
      it(`${c.name}, ${method}: every cell equals bump-and-rebuild of the document within 1e-6 bp per bp`, () => {
        const d = doc(c.quotes, c.extra, method);
        const ws = build(d).workspace!;
        const map = sensitivityMapFor(ws, { tenor: { n: 1, unit: 'M' }, step: { n: 1, unit: 'M' }, overnight: OVERNIGHT_KIT });
        if (!map.ok) throw new Error(map.errors[0]!.message);
        const { rows, columns, values } = map.value.map;
        expect(columns.map((col) => col.index).sort()).toEqual(c.quotes.map((_, i) => i));
        // A few rows, the turn's among them (2022-12-01 to 2023-01-01 holds the turn day).
        const picked = rows.map((r, i) => [r, i] as const).filter(([r]) => ['2022-03-01', '2022-12-01', '2023-06-01', '2024-03-01'].includes(r.start));
        expect(picked.length).toBe(4);
        const n = columns.length;
        columns.forEach((col, k) => {
          const expected = picked.map(([r]) => bumped(d, col.index, (b) => rateFromLnDiscount(b.curve!.lnDiscountAt(r.tEnd) - (r.tStart > 0 ? b.curve!.lnDiscountAt(r.tStart) : 0), 'simple', r.tau), bumpFor(d)));
          picked.forEach(([r, i], j) => expectClose(values[i * n + k]!, expected[j]!, 1e-6, `${c.name}, ${method}: d F(${r.start}) / d quotes[${col.index}] against rebuilding the document`));
        });
      });
    }
  }

  it('a solved turn: the forward over the turn moves with the quote it is solved from, unlike the same map without the turn', () => {
    const withTurn = sensitivityMapFor(build(doc(SOLVED_QUOTES, { turns: SOLVED }, 'log-linear-discount')).workspace!, { tenor: { n: 1, unit: 'M' }, step: { n: 1, unit: 'M' }, overnight: OVERNIGHT_KIT });
    const plain = sensitivityMapFor(build(doc(SOLVED_QUOTES, {}, 'log-linear-discount')).workspace!, { tenor: { n: 1, unit: 'M' }, step: { n: 1, unit: 'M' } });
    if (!withTurn.ok || !plain.ok) throw new Error('no map');
    const cell = (m: typeof plain, start: string, quote: number) => {
      const i = m.value.map.rows.findIndex((r) => r.start === start);
      const k = m.value.map.columns.findIndex((col) => col.index === quote);
      return m.value.map.values[i * m.value.map.columns.length + k]!;
    };
    // The December forward holds the turn: with the spread solved from quotes[3] it carries that quote's move through the spread.
    expect(Math.abs(cell(withTurn, '2022-12-01', 3) - cell(plain, '2022-12-01', 3))).toBeGreaterThan(0.1);
    // A forward with no turn day: the same to within what the smooth nodes' small moves give.
    expectClose(cell(withTurn, '2022-06-01', 1), cell(plain, '2022-06-01', 1), 1e-6, 'turn model: a period without a turn day does not see the turn');
  });

  it('without the code of turns and steps a workspace that has them gives no map and says why', () => {
    const ws = build(doc(TURN_QUOTES, { turns: TYPED }, 'monotone-convex')).workspace!;
    const out = sensitivityMapFor(ws);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors[0]!.message).toMatch(/turns and meeting steps are still loading/);
  });
});

/** A 2-year 3% semiannual bond's flows on a build's curve axis (per 100 face). */
const BOND = { maturity: '2024-03-01', coupon: 0.03, frequency: 2, dayCount: 'ACT/ACT-ICMA' as const };

describe('quoteDv01s with the build\'s settings: DV01 to each quote of the curve shown', () => {
  for (const c of CASES) {
    const method: InterpolationId = 'monotone-convex';
    it(`${c.name}, ${method}: each quote's DV01 equals rebuilding the document within 1e-9 per 100 per bp`, () => {
      const d = doc(c.quotes, c.extra, method);
      const b = build(d);
      const a = analyzeBond(b.curve!, BOND);
      if (!a.ok) throw new Error('bond');
      const dv = quoteDv01s(b.settings!, b.instruments, a.value.flows);
      if (!dv.ok) throw new Error(dv.errors[0]!.message);
      expect(dv.value.map((q) => q.index).sort()).toEqual(c.quotes.map((_, i) => i));
      const price = (x: CurveBuild) => a.value.flows.reduce((s, f) => s + f.amount * Math.exp(x.curve!.lnDiscountAt(f.t)), 0);
      for (const q of dv.value) {
        // quoteDv01s is a plain central difference at 1 bp: compare with the same difference of the document.
        const up = price(build(moved(d, q.index, 1e-4)));
        const down = price(build(moved(d, q.index, -1e-4)));
        expectClose(q.dv01, (down - up) / 2, 1e-9, `${c.name}: DV01 to quotes[${q.index}] against rebuilding the document`);
      }
    });
  }

  it('a solved turn: the DV01 to the quote it is solved from is not the plain bootstrap\'s', () => {
    const b = build(doc(SOLVED_QUOTES, { turns: SOLVED }, 'monotone-convex'));
    const plain = build(doc(SOLVED_QUOTES, {}, 'monotone-convex'));
    const a = analyzeBond(b.curve!, BOND);
    if (!a.ok) throw new Error('bond');
    const shown = quoteDv01s(b.settings!, b.instruments, a.value.flows);
    const without = quoteDv01s(plain.settings!, plain.instruments, a.value.flows);
    if (!shown.ok || !without.ok) throw new Error('dv01');
    const of = (l: typeof shown, i: number) => (l.ok ? l.value.find((q) => q.index === i)!.dv01 : NaN);
    // With the turn solved from quotes[3], its move goes into the year-end spread, not a node.
    expect(Math.abs(of(shown, 3) - of(without, 3))).toBeGreaterThan(1e-4);
  });
});

describe('key-rate durations on the curve shown', () => {
  it('analyzeBond on a turned, stepped build: each key-rate duration equals the tent shift of that curve by hand', () => {
    const b = build(doc(STEP_QUOTES, { turns: TYPED, meetingSteps: { on: true, effectiveDates: SOFR_EFFECTIVE } }, 'monotone-convex'));
    const plain = build(doc(STEP_QUOTES, {}, 'monotone-convex'));
    const a = analyzeBond(b.curve!, BOND);
    const p = analyzeBond(plain.curve!, BOND);
    if (!a.ok || !p.ok) throw new Error('bond');
    const keys = a.value.keyRateDurations.map((k) => k.t);
    const ln = b.curve!.lnDiscountAt;
    a.value.keyRateDurations.forEach((k, j) => {
      const pv = (h: number) => a.value.flows.reduce((s, f) => s + f.amount * Math.exp(ln(f.t) - h * tentWeight(keys, j, f.t) * f.t), 0);
      const h = 1e-5;
      expectClose(k.duration, -(pv(h) - pv(-h)) / (2 * h * pv(0)), 1e-8, `tent shift of the shown curve's zero at ${k.tenor}`);
    });
    // The shown curve is not the plain one: the 1Y key (whose tent holds the turn) differs.
    const oneYear = (x: typeof a) => (x.ok ? x.value.keyRateDurations.find((k) => k.tenor === '1Y')!.duration : NaN);
    expect(Math.abs(oneYear(a) - oneYear(p))).toBeGreaterThan(1e-6);
  });
});
