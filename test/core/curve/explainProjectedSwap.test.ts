import { describe, expect, it } from 'vitest';
import { buildCurve, buildNamedCurves, civilFromIso, curveClock, discountOn, explainQuoteCheck, INTERPOLATIONS, readNamedCurves, type Curve, type Explanation, type SwapQuote } from '../../../src/core/index.ts';
import type { ReadSink } from '../../../src/core/instruments/instrument.ts';
import { ProjectedSwap } from '../../../src/core/instruments/projectedSwap.ts';
import { rng } from '../../helpers/seededRandom.ts';
import { rel } from '../../helpers/quoteCheckRecompute.ts';

// The quote check's explanation of a named curve's term-index and basis swaps (they read their
// discounting curve, and a basis swap the curve of its other leg, besides the curve they are solved
// on). Sources: the two-curve par rate S = sum_j (P_p(T_{j-1}) / P_p(T_j) - 1) P_d(T_j) / sum_i
// tau_i P_d(T_i), each index forward a single-period forward off the projection curve, discounted on
// the discounting curve (Ametrano and Bianchetti 2013, "Everything you always wanted to know about
// multiple interest rate curve bootstrapping but were afraid to ask", eq. for the par swap rate;
// the standard practice since OIS discounting, e.g. Hull, "Options, Futures, and Other
// Derivatives", the chapter on OIS discounting; from memory, not re-read here). Every market below
// is invented test data.

const V2 = { format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10' } as const;
const OIS = (['1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '12Y'] as const).map((tenor, i) => ({ kind: 'ois', tenor, rate: [0.021, 0.0222, 0.0231, 0.0246, 0.0259, 0.0271, 0.0277][i]!, conventions: 'eur-estr' }));
const INDEX_6M = [
  { kind: 'deposit', tenor: '6M', rate: 0.0247, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '3Y', '5Y', '7Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0252, 0.0263, 0.0271, 0.0286, 0.0298, 0.0311][i]!, frequency: 1, dayCount: '30/360' })),
];
const INDEX_3M = [
  { kind: 'deposit', tenor: '3M', rate: 0.0239, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '5Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0008, 0.0009, 0.0011, 0.0012][i]!, dayCount: 'ACT/360', against: 'euribor6m' })),
];
const doc = (interpolation: string) => ({
  ...V2,
  curve: { dayCount: 'ACT/365F', interpolation },
  quotes: OIS,
  curves: [
    { name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation }, quotes: INDEX_6M },
    { name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation }, quotes: INDEX_3M },
  ],
});

function built(interpolation: string) {
  const main = buildCurve(doc(interpolation), { readCurves: readNamedCurves });
  expect(main.errors).toEqual([]);
  const named = buildNamedCurves(main.workspace!, main.curve);
  const curves = new Map<string, Curve>([['default', main.curve!], ...named.map((n) => [n.name, n.build.curve!] as [string, Curve])]);
  return { named, curves };
}

/**
 * The model value again from what the explanation shows: its reads by name (ln DF and DF), its year
 * fractions, by the two-curve par rate (or a basis swap's par spread (C - float) / A), each sum
 * checked against its step.
 */
function recomputeProjected(e: Explanation, own: string, discount: string, other: string | null): number {
  const read = (name: string) => e.reads.find((r) => r.name === name);
  const step = (name: string) => e.steps.find((s) => s.name === name)!.value;
  const leg = (curve: string, role: string, onDiscount: boolean): number => {
    let sum = 0;
    let prev = 0;
    for (let k = 1; read(`P_${curve}(${role}${k})`); k++) {
      const cur = read(`P_${curve}(${role}${k})`)!.lnDiscount;
      sum += Math.expm1(prev - cur) * (onDiscount ? read(`P_${discount}(${role}${k})`)!.discount : 1);
      prev = cur;
    }
    return sum;
  };
  const float = leg(own, 'T', true);
  expect(rel(float, step('float'))).toBeLessThanOrEqual(1e-15);
  let A = 0;
  for (let i = 1; read(`P_${discount}(U${i})`); i++) A += e.yearFractions.find((y) => y.name === `tau${i}`)!.value * read(`P_${discount}(U${i})`)!.discount;
  expect(rel(A, step('A'))).toBeLessThanOrEqual(1e-15);
  if (other === null) return float / A;
  const C = leg(other, 'V', true);
  expect(rel(C, step('C'))).toBeLessThanOrEqual(1e-15);
  return (C - float) / A;
}

describe('explainQuoteCheck on a named curve: term-index and basis swaps', () => {
  it.each(INTERPOLATIONS)('every swap of both projection curves: the value is the quote check figure bit for bit, the steps recomputed from the shown inputs to 1e-15 (%s)', (method) => {
    const { named, curves } = built(method);
    let swaps = 0;
    for (const n of named) {
      const curve = n.build.curve!;
      for (const ins of n.build.instruments) {
        const across = ins.readsCurves;
        if (!across) continue;
        swaps++;
        expect(across.discount).toBe('default');
        expect(across.other).toBe(n.name === 'euribor3m' ? 'euribor6m' : null);
        const row = n.build.repricing.find((r) => r.index === ins.index)!;
        const model = explainQuoteCheck(curve, ins, curve.settlement, 'model', undefined, n.name);
        const error = explainQuoteCheck(curve, ins, curve.settlement, 'error', undefined, n.name);
        if (!model.ok || !error.ok) throw new Error('explained');
        expect(Object.is(model.value.value, row.model)).toBe(true);
        expect(Object.is(error.value.value, row.repricingError * 1e4)).toBe(true);
        const e = model.value;
        const again = recomputeProjected(e, n.name, across.discount, across.other);
        expect(rel(again, e.value)).toBeLessThanOrEqual(1e-15);
        // The growths g_j from the shown projection reads.
        for (let j = 1; e.steps.some((s) => s.name === `g${j}`); j++) {
          const prev = j === 1 ? 0 : e.reads.find((r) => r.name === `P_${n.name}(T${j - 1})`)!.lnDiscount;
          expect(e.steps.find((s) => s.name === `g${j}`)!.value).toBe(Math.expm1(prev - e.reads.find((r) => r.name === `P_${n.name}(T${j})`)!.lnDiscount));
        }
        // Every read off another curve is that curve's discount factor on the shown date (the public query), its nodes named by that curve.
        for (const r of e.reads) {
          const name = /^P_(.+)\(/.exec(r.name)![1]!;
          const on = curves.get(name)!;
          const q = discountOn(on, r.date);
          if (!q.ok) throw new Error('read');
          expect(rel(r.discount, q.value.discount)).toBeLessThanOrEqual(1e-15);
          if (name !== n.name) for (const x of r.nodes) expect(x.curve).toBe(name);
        }
        // Steps and formula name both curves (three for a basis swap).
        const text = [e.formula, ...e.steps.map((s) => s.formula)].join(' ');
        for (const c of [n.name, across.discount, ...(across.other ? [across.other] : [])]) expect(text).toContain(`P_${c}(`);
        expect(error.value.steps.at(-1)!.value).toBe(row.repricingError * 1e4);
      }
    }
    expect(swaps).toBe(10);
  });

  it("a 2Y six-month swap's explained par rate equals the hand calculation from discount factors read off both curves to 1e-14", () => {
    // Single-period forwards off euribor6m over 6M periods from 2027-03-10 (unadjusted), paid at
    // each period's end and discounted on the default curve; fixed leg annual 30/360 (accruals 1, 1).
    const { named, curves } = built('monotone-convex');
    const n = named.find((x) => x.name === 'euribor6m')!;
    const ins = n.build.instruments.find((i) => i.maturity === '2029-03-10')!;
    const df = (c: string, d: string): number => {
      const r = discountOn(curves.get(c)!, d);
      if (!r.ok) throw new Error(d);
      return r.value.discount;
    };
    const T = ['2027-09-10', '2028-03-10', '2028-09-10', '2029-03-10'];
    let float = 0;
    let prev = 1;
    for (const d of T) {
      float += (prev / df('euribor6m', d) - 1) * df('default', d);
      prev = df('euribor6m', d);
    }
    const S = float / (1 * df('default', '2028-03-10') + 1 * df('default', '2029-03-10'));
    const e = explainQuoteCheck(n.build.curve!, ins, '2027-03-10', 'model', undefined, 'euribor6m');
    if (!e.ok) throw new Error('explained');
    expect(rel(e.value.value, S)).toBeLessThanOrEqual(1e-14);
    expect(e.value.dates.map((d) => d.adjusted)).toEqual(T);
    expect(e.value.reads.filter((r) => r.name.startsWith('P_default(U')).map((r) => r.date)).toEqual(['2028-03-10', '2029-03-10']);
    expect(e.value.yearFractions.map((y) => [y.from, y.to, y.value])).toEqual([['2027-03-10', '2028-03-10', 1], ['2028-03-10', '2029-03-10', 1]]);
  });

  it("the quotes note's claim by bump-and-rebuild: the swap's own quote moves its model rate one for one, a discounting or other-leg quote by 0", () => {
    // The quote check's explanation lists the quote itself at 1 bp per bp and says the curves it reads move it by 0 (its curve is solved again on them).
    const bumped = (curve: string, index: number) => {
      const d = doc('monotone-convex');
      const up = (qs: readonly Record<string, unknown>[]) => qs.map((q, i) => (i === index ? { ...q, rate: (q.rate as number) + 1e-4 } : q));
      const moved = curve === 'default' ? { ...d, quotes: up(d.quotes) } : { ...d, curves: d.curves.map((c) => (c.name === curve ? { ...c, quotes: up(c.quotes) } : c)) };
      const main = buildCurve(moved, { readCurves: readNamedCurves });
      return buildNamedCurves(main.workspace!, main.curve);
    };
    const modelOf = (named: ReturnType<typeof buildNamedCurves>, curve: string, index: number) => named.find((n) => n.name === curve)!.build.repricing.find((r) => r.index === index)!.model;
    const base = built('monotone-convex').named;
    // euribor6m's 5Y swap (index 4) and euribor3m's 2Y basis swap (index 2, against euribor6m).
    for (const [curve, index, others] of [['euribor6m', 4, [['default', 3]]], ['euribor3m', 2, [['default', 3], ['euribor6m', 4]]]] as const) {
      const own = (modelOf(bumped(curve, index), curve, index) - modelOf(base, curve, index)) / 1e-4;
      expect(Math.abs(own - 1)).toBeLessThanOrEqual(1e-8);
      for (const [c, i] of others) {
        const moved = bumped(c, i);
        expect(Math.abs((modelOf(moved, curve, index) - modelOf(base, curve, index)) / 1e-4)).toBeLessThanOrEqual(1e-8);
        // Not vacuous: the bump moves the curve itself.
        const at = (named: typeof base) => named.find((n) => n.name === curve)!.build.curve!.lnDiscountAt(4.5);
        expect(Math.abs(at(moved) - at(base))).toBeGreaterThan(1e-7);
      }
    }
  });

  it('the traced compile and pricing equal the untraced bit for bit over 400 seeded random swaps', () => {
    const { curves } = built('cubic-zero');
    const random = rng(20261203);
    const pick = <T,>(xs: readonly T[]): T => xs[Math.floor(random() * xs.length)]!;
    const s = civilFromIso('2027-03-10');
    const time = curveClock('ACT/365F', s);
    for (let k = 0; k < 400; k++) {
      const y = 2028 + Math.floor(random() * 9); // inside every curve (they do not extrapolate)
      const maturity = `${y}-${String(1 + Math.floor(random() * 12)).padStart(2, '0')}-${String(1 + Math.floor(random() * 28)).padStart(2, '0')}`;
      const q = { kind: 'swap', index: k, maturity, tenor: '', enabled: true, rate: random() * 0.05 - 0.005, frequency: pick([1, 2, 4]), dayCount: pick(['30/360', 'ACT/360', 'ACT/365F'] as const), eom: random() < 0.3 } as SwapQuote;
      const basis = random() < 0.5 ? { curve: curves.get(pick(['euribor6m', 'default']))!, name: 'other', perYear: pick([1, 2, 4, 12]) } : undefined;
      const args = [q, s, civilFromIso(maturity), time, curves.get('default')!, 'default', pick([1, 2, 4, 12]), basis] as const;
      const plain = ProjectedSwap.compile(...args);
      const seen: Parameters<ReadSink>[] = [];
      const traced = ProjectedSwap.compile(...args, (...r) => seen.push(r));
      if ('beyond' in plain || 'beyond' in traced) throw new Error('in range');
      expect(seen.length).toBeGreaterThan(0);
      for (const key of ['times', 'weights', 'annuity', 'otherLeg', 'reads'] as const) expect(traced[key]).toStrictEqual(plain[key]);
      const ln = plain.times.map((t) => curves.get('euribor6m')!.lnDiscountAt(t) + (random() - 0.5) * 1e-3);
      const trace: number[] = [];
      const a = plain.quoteFromFlows(ln, [], 0);
      const b = plain.quoteFromFlows(ln, [], 0, (_, v) => trace.push(v));
      expect(Object.is(a, b)).toBe(true);
      expect(trace.length).toBe(plain.times.length + 3);
      // retrace hands the same reads as the compile with a sink.
      const again: Parameters<ReadSink>[] = [];
      plain.retrace((...r) => again.push(r));
      expect(again).toStrictEqual(seen);
    }
  });
});
