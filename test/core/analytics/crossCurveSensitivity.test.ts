import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  buildNamedCurves,
  forwardInfluencesAcrossCurves,
  INTERPOLATIONS,
  rateFromLnDiscount,
  readNamedCurves,
  topQuoteInfluences,
  topQuoteInfluencesAcrossCurves,
  yearFraction,
  type Compounding,
  type CurveDayCount,
  type CurveWithQuotes,
  type InterpolationId,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Sensitivities across curves (issue 18 item 11, issue 19's top quotes): a forward or zero on a
// projection curve against the quotes of its own curve, of its discounting curve and of the curve
// of a basis swap's other leg. Oracles: the project's own bump-and-rebuild (every curve of the
// document built again by buildCurve and buildNamedCurves with one quote moved up and down,
// central difference), and a hand calculation written out below. The markets are the invented
// two- and three-curve documents of test/core/bootstrap/namedCurves.test.ts.

const V2 = { format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10' } as const;
type Q = Record<string, unknown> & { rate: number };
const OIS: Q[] = (['1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '12Y'] as const).map((tenor, i) => ({ kind: 'ois', tenor, rate: [0.021, 0.0222, 0.0231, 0.0246, 0.0259, 0.0271, 0.0277][i]!, conventions: 'eur-estr' }));
const INDEX_6M: Q[] = [
  { kind: 'deposit', tenor: '3M', rate: 0.0239, dayCount: 'ACT/360' },
  { kind: 'deposit', tenor: '6M', rate: 0.0247, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '3Y', '5Y', '7Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0252, 0.0263, 0.0271, 0.0286, 0.0298, 0.0311][i]!, frequency: 1, dayCount: '30/360' })),
];
const INDEX_3M: Q[] = [
  { kind: 'deposit', tenor: '3M', rate: 0.0236, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '5Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0008, 0.0009, 0.0011, 0.0012][i]!, dayCount: 'ACT/360', against: 'euribor6m' })),
];

interface Doc {
  readonly curve: { dayCount: string; interpolation: string };
  readonly quotes: Q[];
  readonly curves: { name: string; quotes: Q[]; [k: string]: unknown }[];
}
const twoCurveDoc = (interpolation: string): Doc => ({
  ...V2,
  curve: { dayCount: 'ACT/365F', interpolation },
  quotes: OIS,
  curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation }, quotes: INDEX_6M }],
});
const threeCurveDoc = (interpolation: string): Doc => {
  const doc = twoCurveDoc(interpolation);
  return { ...doc, curves: [{ name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default', curve: doc.curve, quotes: INDEX_3M }, ...doc.curves] };
};

/** Every curve of a document built, default first, then in build order. */
function curvesOf(doc: unknown): CurveWithQuotes[] {
  const main = buildCurve(doc, { readCurves: readNamedCurves });
  expect(main.errors).toEqual([]);
  const named = buildNamedCurves(main.workspace!, main.curve);
  for (const n of named) expect(n.build.errors).toEqual([]);
  return [{ name: 'default', curve: main.curve!, instruments: main.instruments }, ...named.map((n) => ({ name: n.name, curve: n.build.curve!, instruments: n.build.instruments }))];
}

/** The document with quote k of curve `name` moved by dy (every quote here is a rate, its own yield). */
function bumped(doc: Doc, name: string, k: number, dy: number): Doc {
  const move = (qs: Q[]) => qs.map((q, i) => (i === k ? { ...q, rate: q.rate + dy } : q));
  return name === 'default' ? { ...doc, quotes: move(doc.quotes) } : { ...doc, curves: doc.curves.map((c) => (c.name === name ? { ...c, quotes: move(c.quotes) } : c)) };
}

const rateOn = (curves: CurveWithQuotes[], name: string, start: string, end: string, c: Compounding, dc: CurveDayCount): number => {
  const curve = curves.find((x) => x.name === name)!.curve;
  const tS = curve.time(start);
  return rateFromLnDiscount(curve.lnDiscountAt(curve.time(end)) - (tS > 0 ? curve.lnDiscountAt(tS) : 0), c, yearFraction(dc, start, end));
};

/**
 * The bump: methods linear in their nodes take 1e-6 (rounding of the rebuild, about 1e-15 in ln DF,
 * then costs about 1e-9 bp per bp); monotone convex bends within about 1e-5 of ln DF
 * (analytics/nodePartials.ts), so a larger bump measures a different slope: 3e-8 there.
 */
const bumpFor = (m: InterpolationId): number => (m.startsWith('monotone') ? 3e-8 : 1e-6);
/** Tolerance against the central bumped rebuild, bp per bp (observed: 5e-11 linear in nodes, 1e-9 monotone convex). */
const TOL = 1e-8;

function checkAgainstRebuild(doc: Doc, method: InterpolationId, target: string, start: string, end: string, c: Compounding, dc: CurveDayCount, from: string[]): number {
  const curves = curvesOf(doc);
  const r = forwardInfluencesAcrossCurves(curves, target, start, end, c, dc);
  if (!r.ok) throw new Error(r.errors[0]!.message);
  const h = bumpFor(method);
  let largest = 0;
  for (const name of from) {
    const quotes = name === 'default' ? doc.quotes : doc.curves.find((x) => x.name === name)!.quotes;
    for (let k = 0; k < quotes.length; k++) {
      const up = rateOn(curvesOf(bumped(doc, name, k, h)), target, start, end, c, dc);
      const down = rateOn(curvesOf(bumped(doc, name, k, -h)), target, start, end, c, dc);
      const fd = (up - down) / (2 * h);
      const got = r.value.find((x) => x.curve === name && x.index === k);
      expect(got, `${name} quotes[${k}]`).toBeDefined();
      expectClose(got!.bpPerBp, fd, TOL, `bump-and-rebuild of every curve, ${name} quotes[${k}] +-${h}, central difference (${method})`);
      largest = Math.max(largest, Math.abs(fd));
    }
  }
  return largest;
}

describe('forwardInfluencesAcrossCurves against bump-and-rebuild', () => {
  it.each(INTERPOLATIONS)('a 6M forward 6Y out on the projection curve, against every discounting and every projection quote (%s)', (method) => {
    const largest = checkAgainstRebuild(twoCurveDoc(method), method, 'euribor6m', '2033-03-10', '2033-09-10', 'simple', 'ACT/360', ['default', 'euribor6m']);
    // The check can fail: the discounting quotes do move this forward.
    expect(largest).toBeGreaterThan(1e-3);
  });

  it.each(INTERPOLATIONS)('the 4Y zero of the projection curve, annual ACT/365F, against the discounting quotes (%s)', (method) => {
    const largest = checkAgainstRebuild(twoCurveDoc(method), method, 'euribor6m', '2027-03-10', '2031-03-10', 'annual', 'ACT/365F', ['default']);
    expect(largest).toBeGreaterThan(1e-4);
  });

  it.each(['log-linear-discount', 'cubic-zero', 'monotone-convex'] as const)('a 3M forward 4Y out on a curve of basis swaps against the 6M curve: the 6M quotes and the discounting quotes (read directly and through the 6M curve) (%s)', (method) => {
    const largest = checkAgainstRebuild(threeCurveDoc(method), method, 'euribor3m', '2031-03-10', '2031-06-10', 'simple', 'ACT/360', ['default', 'euribor6m', 'euribor3m']);
    expect(largest).toBeGreaterThan(1e-2);
  });

  it('the discounting curve itself: its own quotes only, the same numbers as the one-curve topQuoteInfluences where no spot bridge enters (log-linear discount)', () => {
    const curves = curvesOf(twoCurveDoc('log-linear-discount'));
    const r = forwardInfluencesAcrossCurves(curves, 'default', '2030-03-10', '2031-03-10', 'simple', 'ACT/360');
    const one = topQuoteInfluences(curves[0]!.curve, curves[0]!.instruments, '2030-03-10', '2031-03-10', 'simple', 'ACT/360', 99);
    if (!r.ok || !one.ok) throw new Error('no sensitivities');
    expect(new Set(r.value.map((x) => x.curve))).toEqual(new Set(['default']));
    for (const q of one.value) expectClose(r.value.find((x) => x.index === q.index)!.bpPerBp, q.bpPerBp, 1e-12, 'topQuoteInfluences (analytics/explainRisk.ts)');
  });
});

describe('a curve bridged to spot (bootstrap/spotBridge.ts): the one-curve sensitivities move the bridge node with the first pillar', () => {
  it.each(INTERPOLATIONS)('topQuoteInfluences of a 1Y forward 2Y out on the OIS curve (spot T+2, no ON or TN) against bump-and-rebuild (%s)', (method) => {
    // Without the tie the node partials under cubic zero were about 4 % off on the 1Y quote (measured).
    const { curves: _, ...doc } = twoCurveDoc(method);
    const build = buildCurve(doc);
    expect(build.warnings.map((w) => w.code)).toContain('spot-gap');
    const [start, end] = ['2029-03-10', '2030-03-10'];
    const top = topQuoteInfluences(build.curve!, build.instruments, start, end, 'simple', 'ACT/360', 99);
    if (!top.ok) throw new Error(top.errors[0]!.message);
    const h = bumpFor(method);
    const rate = (quotes: Q[]) => {
      const b = buildCurve({ ...doc, quotes });
      return rateOn([{ name: 'default', curve: b.curve!, instruments: b.instruments }], 'default', start, end, 'simple', 'ACT/360');
    };
    for (const q of top.value) {
      const move = (dy: number) => OIS.map((x, i) => (i === q.index ? { ...x, rate: x.rate + dy } : x));
      const fd = (rate(move(h)) - rate(move(-h))) / (2 * h);
      expectClose(q.bpPerBp, fd, TOL, `bump-and-rebuild, quotes[${q.index}] +-${h}, central difference (${method})`);
    }
  });
});

describe('a hand calculation: a flat projection curve whose swap discounts on a flat, shifted curve', () => {
  it('dz/dr of the projection zero equals the implicit derivative of the one-year swap equation, written out', () => {
    // Valuation 2025-03-10 (no leap day in the next year: 365 days, ACT/365F year 1). Discounting: one
    // continuous ACT/365F zero quote r to 1Y, log-linear discount, so D(t) = exp(-r t). Projection: one
    // 1Y swap, fixed annual ACT/365F (one accrual of 1), on a 6M index (periods 2025-03-10 to
    // 2025-09-10, 184 days, and on to 2026-03-10), its one node making a flat continuous rate f:
    // P(t) = exp(-f t). The swap's equation (the two-curve par rate):
    //   Phi(f, r) = g1 D(t1) + g2 D(t2) - K D(t2) = 0,  g1 = exp(f t1) - 1, g2 = exp(f (t2 - t1)) - 1,
    // t1 = 184/365, t2 = 1. Implicit function theorem: df/dr = -Phi_r / Phi_f with
    //   Phi_f = t1 e^{f t1} D(t1) + (t2 - t1) e^{f (t2 - t1)} D(t2),
    //   Phi_r = -t1 g1 D(t1) - t2 (g2 - K) D(t2),
    // and the zero's continuous rate on ACT/365F to 1Y is f itself, its quote r: dz/dr = df/dr.
    const r = 0.021;
    const K = 0.0268;
    const doc = {
      format: 'tenorscope-workspace', version: 2, valuationDate: '2025-03-10',
      curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' },
      quotes: [{ kind: 'zero', tenor: '1Y', rate: r, compounding: 'continuous', dayCount: 'ACT/365F' }],
      curves: [{ name: 'ibor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' }, quotes: [{ kind: 'swap', tenor: '1Y', rate: K, frequency: 1, dayCount: 'ACT/365F' }] }],
    };
    const t1 = 184 / 365;
    const t2 = 1;
    const D = (t: number) => Math.exp(-r * t);
    // f by Newton on Phi (from 2.5%), written out.
    let f = 0.025;
    for (let i = 0; i < 30; i++) {
      const phi = Math.expm1(f * t1) * D(t1) + (Math.expm1(f * (t2 - t1)) - K) * D(t2);
      f -= phi / (t1 * Math.exp(f * t1) * D(t1) + (t2 - t1) * Math.exp(f * (t2 - t1)) * D(t2));
    }
    const g1 = Math.expm1(f * t1);
    const g2 = Math.expm1(f * (t2 - t1));
    const phiF = t1 * Math.exp(f * t1) * D(t1) + (t2 - t1) * Math.exp(f * (t2 - t1)) * D(t2);
    const phiR = -t1 * g1 * D(t1) - t2 * (g2 - K) * D(t2);
    const byHand = -phiR / phiF;
    const curves = curvesOf(doc);
    // The build's projection curve is the hand calculation's flat f.
    expectClose(-curves[1]!.curve.lnDiscountAt(1), f, 1e-15, 'the swap equation solved by Newton above');
    const got = forwardInfluencesAcrossCurves(curves, 'ibor6m', '2025-03-10', '2026-03-10', 'continuous', 'ACT/365F');
    if (!got.ok) throw new Error(got.errors[0]!.message);
    expect(got.value.map((x) => [x.curve, x.index])).toEqual([['ibor6m', 0], ['default', 0]]);
    expectClose(got.value[1]!.bpPerBp, byHand, 1e-12, 'implicit derivative of the two-curve swap equation, by hand above');
    // Not zero (weights that do not cancel: the 6M periods against one annual accrual), and not the
    // projection's own dz/dK = 1 / (Phi_f / D(t2)) either.
    expect(Math.abs(byHand)).toBeGreaterThan(1e-4);
    expectClose(got.value[0]!.bpPerBp, D(t2) / phiF, 1e-12, 'implicit derivative in K by hand: df/dK = D(t2) / Phi_f');
  });
});

describe('topQuoteInfluencesAcrossCurves', () => {
  it('the five largest across curves, each naming its curve, largest first, and errors naming the curve', () => {
    const curves = curvesOf(threeCurveDoc('monotone-convex'));
    const all = forwardInfluencesAcrossCurves(curves, 'euribor3m', '2031-03-10', '2031-06-10', 'simple', 'ACT/360');
    const top = topQuoteInfluencesAcrossCurves(curves, 'euribor3m', '2031-03-10', '2031-06-10', 'simple', 'ACT/360');
    if (!all.ok || !top.ok) throw new Error('no sensitivities');
    expect(all.value).toHaveLength(OIS.length + INDEX_6M.length + INDEX_3M.length);
    const sorted = [...all.value].sort((a, b) => Math.abs(b.bpPerBp) - Math.abs(a.bpPerBp));
    expect(top.value).toEqual(sorted.slice(0, 5));
    // A 3M forward on the basis curve leans on the 6M curve's swaps: some of the top five are not its own.
    expect(top.value.some((q) => q.curve === 'euribor6m')).toBe(true);
    // A curve left out (it did not build) is named.
    const without = curves.filter((c) => c.name !== 'euribor6m');
    const e = topQuoteInfluencesAcrossCurves(without, 'euribor3m', '2031-03-10', '2031-06-10', 'simple', 'ACT/360');
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.errors[0]!.message).toMatch(/"euribor6m" is read by another curve but was not given/);
    const unknown = topQuoteInfluencesAcrossCurves(curves, 'euribor1m', '2031-03-10', '2031-06-10', 'simple', 'ACT/360');
    if (!unknown.ok) expect(unknown.errors[0]!.message).toMatch(/no curve is named "euribor1m"; use one of "default", /);
    expect(unknown.ok).toBe(false);
  });
});
