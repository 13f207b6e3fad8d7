import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildCurve, buildNamedCurves, civilFromIso, curveClock, curveFromPillars, INTERPOLATIONS, validateWorkspace, type Curve, type CurveBuild, type SwapQuote, workbenchFromEngine, readNamedCurves } from '../../../src/core/index.ts';
import { ProjectedSwap } from '../../../src/core/instruments/projectedSwap.ts';
import { goldenCase, GOLDEN_SEED } from '../../cli/golden.ts';

// Several curves in one workspace: named curves beside the default one, a projection curve's
// term-index swaps priced with forwards from it and discount factors from its discounting curve.
// Sources: the two-curve par rate S = sum_j tau_j F_j P_d(T_j) / sum_i tau_i P_d(T_i) as stated in
// MARKET-CONVENTIONS.md section i (Ametrano and Bianchetti 2013, "Everything you always wanted to
// know about multiple interest rate curve bootstrapping but were afraid to ask", from the notes,
// not re-read here); the single-curve reference is the engine's own bootstrap, which
// test/cli/golden.test.ts holds bit for bit. Every market below is invented test data.

const V2 = { format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10' } as const;
/** An invented €STR-style discounting ladder (the conventions set eur-estr: T+2 TARGET, annual ACT/360, payment lag 1). */
const OIS = (['1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '12Y'] as const).map((tenor, i) => ({ kind: 'ois', tenor, rate: [0.021, 0.0222, 0.0231, 0.0246, 0.0259, 0.0271, 0.0277][i]!, conventions: 'eur-estr' }));
/** An invented six-month index: deposits from the valuation date and swaps annual 30/360 against it. */
const INDEX_6M = [
  { kind: 'deposit', tenor: '3M', rate: 0.0239, dayCount: 'ACT/360' },
  { kind: 'deposit', tenor: '6M', rate: 0.0247, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '3Y', '5Y', '7Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0252, 0.0263, 0.0271, 0.0286, 0.0298, 0.0311][i]!, frequency: 1, dayCount: '30/360' })),
];
const twoCurveDoc = (interpolation = 'monotone-convex', ois = OIS) => ({
  ...V2,
  curve: { dayCount: 'ACT/365F', interpolation },
  quotes: ois,
  curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation }, quotes: INDEX_6M }],
});

/** The default build and the named builds of a document. */
function buildAll(doc: unknown): { main: CurveBuild; named: ReturnType<typeof buildNamedCurves> } {
  const main = buildCurve(doc, { readCurves: readNamedCurves });
  expect(main.errors).toEqual([]);
  return { main, named: buildNamedCurves(main.workspace!, main.curve) };
}

describe('a term-index swap on two curves', () => {
  it('its par rate equals the hand calculation sum tau_j F_j P_d(T_j) / sum tau_i P_d(T_i) to 1e-15', () => {
    // Two curves given by their discount factors at the swap's dates (invented), log-linear between.
    // 2Y swap from 2027-03-10, fixed annual 30/360, floating on a 6M index (unadjusted dates).
    const d = ['2027-09-10', '2028-03-10', '2028-09-10', '2029-03-10'];
    const Pp = [0.9871, 0.9742, 0.9608, 0.9473];
    const Pd = [0.9893, 0.9788, 0.9681, 0.9577];
    const curveOf = (dfs: number[]): Curve => {
      const time = curveClock('ACT/365F', civilFromIso('2027-03-10'));
      return curveFromPillars('2027-03-10', 'ACT/365F', 'log-linear-discount', 'none', d.map((date, i) => ({ date, t: time(civilFromIso(date)), discount: dfs[i]!, quote: i })));
    };
    const projection = curveOf(Pp);
    const discount = curveOf(Pd);
    // By hand: tau_j on ACT/360 (184, 182, 184, 181 days), F_j = (P_p(T_{j-1}) / P_p(T_j) - 1) / tau_j,
    // fixed accruals 1 and 1 (30/360 over whole years) paid on 2028-03-10 and 2029-03-10.
    const tauJ = [184 / 360, 182 / 360, 184 / 360, 181 / 360];
    const prev = [1, ...Pp.slice(0, 3)];
    const F = Pp.map((p, j) => (prev[j]! / p - 1) / tauJ[j]!);
    const floating = tauJ[0]! * F[0]! * Pd[0]! + tauJ[1]! * F[1]! * Pd[1]! + tauJ[2]! * F[2]! * Pd[2]! + tauJ[3]! * F[3]! * Pd[3]!;
    const annuity = 1 * Pd[1]! + 1 * Pd[3]!;
    const S = floating / annuity;
    const q = { kind: 'swap', index: 0, maturity: '2029-03-10', tenor: '2Y', enabled: true, rate: 0.03, frequency: 1, dayCount: '30/360', eom: false } as SwapQuote;
    const ins = ProjectedSwap.compile(q, civilFromIso('2027-03-10'), civilFromIso('2029-03-10'), curveClock('ACT/365F', civilFromIso('2027-03-10')), discount, 'ois', 2);
    if ('beyond' in ins) throw new Error('in range');
    expect(Math.abs(ins.modelQuote((t) => projection.lnDiscountAt(t)) - S)).toBeLessThanOrEqual(1e-15);
    // Not the single-curve rate on either curve (the check can tell the two apart).
    expect(Math.abs((1 - Pp[3]!) / (Pp[1]! + Pp[3]!) - S)).toBeGreaterThan(1e-5);
  });

  it.each(INTERPOLATIONS)('a projection curve of deposits and term-index swaps over an OIS curve reprices every quote to 1e-14 in rate (%s)', (method) => {
    const { main, named } = buildAll(twoCurveDoc(method));
    expect(named).toHaveLength(1);
    const p = named[0]!;
    expect(p.build.errors).toEqual([]);
    expect(p.build.repricing).toHaveLength(INDEX_6M.length);
    for (const r of p.build.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(1e-14);
    for (const r of main.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(1e-14);
    // Its swaps read the discounting curve: the same swap on one curve would not reprice.
    const ten = p.build.instruments.find((x) => x.kind === 'swap' && x.quote.tenor === '10Y')!;
    expect(ten).toBeInstanceOf(ProjectedSwap);
  });

  it.each(INTERPOLATIONS)('discounted on the one-curve build of its own quotes, a projection curve is that curve (the floating leg telescopes to 1 - P(T_n) when P_p = P_d), nodes to 1e-14 (%s)', (method) => {
    // The identity: sum_j (P(T_{j-1}) / P(T_j) - 1) P(T_j) = sum_j (P(T_{j-1}) - P(T_j)) = 1 - P(T_n), so the
    // single-curve solution solves the two-curve equations too (the curve is unique node by node).
    const doc = { ...V2, curve: { dayCount: 'ACT/365F', interpolation: method }, quotes: INDEX_6M, curves: [{ name: 'p', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: method }, quotes: INDEX_6M }] };
    const { main, named } = buildAll(doc);
    const p = named[0]!.build.curve!;
    expect(p.pillars.map((x) => x.date)).toEqual(main.curve!.pillars.map((x) => x.date));
    p.pillars.forEach((x, i) => expect(Math.abs(Math.log(x.discount) - Math.log(main.curve!.pillars[i]!.discount))).toBeLessThanOrEqual(1e-14));
  });

  it.each(INTERPOLATIONS)('FRAs on a projection curve fix its discount-factor ratio as on one curve: a 6M curve of deposits, FRAs and swaps reprices to 1e-14 (%s)', (method) => {
    // Invented FRA rates; the FRA dates are the kind's (test/core/kinds/fra.test.ts), unadjusted here (no calendar).
    const fras = [{ kind: 'fra', period: '6x12', rate: 0.0255 }, { kind: 'fra', period: '12x18', rate: 0.0266 }];
    const quotes = [...INDEX_6M.filter((q) => q.kind === 'deposit'), ...fras, ...INDEX_6M.filter((q) => q.kind === 'swap' && q.tenor !== '1Y')];
    const doc = { ...twoCurveDoc(method), curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: method }, quotes }] };
    const { named } = buildAll(doc);
    const p = named[0]!;
    expect(p.build.errors).toEqual([]);
    expect(p.build.repricing.filter((r) => r.kind === 'fra')).toHaveLength(2);
    for (const r of p.build.repricing) expect(Math.abs(r.repricingError), `${r.kind} ${r.maturity}`).toBeLessThanOrEqual(1e-14);
    // Independently: the 6x12 FRA rate read off the projection curve (2027-09-10 to 2028-03-10, 182 days, ACT/360).
    const c = p.build.curve!;
    const df = (d: string) => Math.exp(c.lnDiscountAt(c.time(d)));
    expect(Math.abs((df('2027-09-10') / df('2028-03-10') - 1) * (360 / 182) - 0.0255)).toBeLessThanOrEqual(1e-14);
  });

  it('a discounting quote moves a projection forward; its deposits, which read no discounting curve, do not move', () => {
    const base = buildAll(twoCurveDoc()).named[0]!.build.curve!;
    const bumpedOis = OIS.map((q) => (q.tenor === '7Y' ? { ...q, rate: q.rate + 0.0001 } : q));
    const bumped = buildAll(twoCurveDoc('monotone-convex', bumpedOis)).named[0]!.build.curve!;
    // The 6M forward from 6Y to 6.5Y on the projection curve (simple, on the curve's clock).
    const fwd = (c: Curve) => Math.expm1(c.lnDiscountAt(6) - c.lnDiscountAt(6.5)) / 0.5;
    expect(Math.abs(fwd(bumped) - fwd(base))).toBeGreaterThan(1e-9);
    // The deposits' nodes (closed form, ln DF = -ln(1 + r tau)) are the same to the bit.
    expect(bumped.pillars.slice(0, 2)).toEqual(base.pillars.slice(0, 2));
    // A swap node near the bump moves (the 7Y swap discounts on the 7Y region of the OIS curve; a node
    // as short as 1Y may stay the same to the bit, the bump being local enough under monotone convex).
    const at = (c: Curve, tenor: number) => c.pillars.find((p) => Math.abs(p.t - tenor) < 0.05)!.discount;
    expect(at(bumped, 7)).not.toBe(at(base, 7));
  });
});

describe('the single-curve case of the named-curve build', () => {
  /** A version 1 document as version 2 (settlement renamed valuationDate). */
  const asV2 = (doc: Record<string, unknown>) => {
    const { settlement, ...rest } = doc;
    return { ...rest, version: 2, valuationDate: settlement };
  };
  const fixtures: [string, Record<string, unknown>][] = [
    ['market40', JSON.parse(readFileSync('test/fixtures/market40/market40.json', 'utf8'))],
    ['workspace40', JSON.parse(readFileSync('test/fixtures/share/workspace40.json', 'utf8'))],
  ];
  // The golden set's documents (test/cli/golden.ts, fixed seed): the first 400 cases.
  for (let i = 0; i < 400; i++) {
    const text = goldenCase(GOLDEN_SEED, i).input.trim();
    // One pretty-printed document, or one document a line.
    const docs = text.startsWith('{\n') ? [text] : text.split('\n');
    for (const [k, line] of docs.entries()) fixtures.push([`golden ${i}.${k}`, JSON.parse(line)]);
  }

  it('a discounting curve holding a document\'s quotes and settings equals that document\'s build bit for bit, and the default build is unchanged', () => {
    let compared = 0;
    for (const [name, v1] of fixtures) {
      const doc = asV2(v1) as Record<string, unknown>;
      const alone = buildCurve(doc);
      if (alone.workspace === null || !Array.isArray(doc.quotes)) continue;
      const withCurves = { ...doc, curves: [{ name: 'copy', role: 'discounting', ...(doc.curve === undefined ? {} : { curve: doc.curve }), quotes: doc.quotes }] };
      const main = buildCurve(withCurves, { readCurves: readNamedCurves });
      const named = main.workspace === null ? [] : buildNamedCurves(main.workspace, main.curve);
      if (alone.errors.length > 0) {
        expect(main.errors.length, name).toBeGreaterThan(0);
        continue;
      }
      const copy = named[0]!.build;
      for (const b of [main, copy]) {
        expect(b.errors, name).toEqual([]);
        expect(b.repricing, name).toEqual(alone.repricing);
        expect(b.curve!.pillars, name).toEqual(alone.curve!.pillars);
        for (const t of [0.01, 0.3, 1, 2.7, 9, 31]) expect(Object.is(b.curve!.lnDiscountAt(t), alone.curve!.lnDiscountAt(t)), `${name} t=${t}`).toBe(true);
      }
      compared++;
    }
    expect(compared).toBeGreaterThan(200);
  });
});

describe('named curves: errors that name what to change', () => {
  const errorsOf = (curves: unknown) => validateWorkspace({ ...V2, quotes: OIS, curves }, readNamedCurves).errors.map((e) => `${e.path}: ${e.message}`);
  const proj = (over: Record<string, unknown> = {}) => ({ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', quotes: INDEX_6M, ...over });

  it('a projection curve without a discounting curve', () => {
    const { discountCurve: _, ...without } = proj();
    expect(errorsOf([without])).toEqual([expect.stringMatching(/^curves\[0\]\.discountCurve: .*"euribor6m".*needs a discounting curve.*"default"/)]);
  });

  it('a discountCurve that names no curve', () => {
    expect(errorsOf([proj({ discountCurve: 'estr' })])).toEqual([expect.stringMatching(/^curves\[0\]\.discountCurve: .*"estr" names no curve; use "default" or one of euribor6m/)]);
  });

  it('a curve name used twice, or not a plain name', () => {
    expect(errorsOf([proj(), proj()])).toEqual([expect.stringMatching(/^curves\[1\]\.name: .*the curve name "euribor6m" is used twice \(curves\[0\] and curves\[1\]\); rename one/)]);
    expect(errorsOf([proj({ name: 'euribor 6m' })])).toEqual([expect.stringMatching(/^curves\[0\]\.name: curves\[0\]\.name must be a plain name.*not the text "euribor 6m"/)]);
    expect(errorsOf([proj({ name: 'default' })])).toEqual([expect.stringMatching(/^curves\[0\]\.name: .*"default" is the top-level curve's name/)]);
  });

  it('a circular dependency names the curves in the cycle', () => {
    const errors = errorsOf([proj({ name: 'a', discountCurve: 'b' }), proj({ name: 'b', discountCurve: 'c' }), proj({ name: 'c', discountCurve: 'a' })]);
    expect(errors).toEqual([expect.stringMatching(/^curves\[0\]: the curves "a" -> "b" -> "c" -> "a" each need the next built first .* in a circle/)]);
  });

  it('a projection curve refuses a bond and names it; a quote\'s own error is located in its curve', () => {
    const bond = { kind: 'bond', maturity: '2031-03-10', coupon: 0.03, frequency: 1, cleanPrice: 100 };
    expect(errorsOf([proj({ quotes: [...INDEX_6M, bond] })])).toEqual([expect.stringMatching(/^curves\[0\]\.quotes\[8\]\.kind: .*quotes\[8\] is a bond, which a projection curve does not take/)]);
    expect(errorsOf([proj({ quotes: [{ ...INDEX_6M[0], rate: 'x' }] })])).toEqual([expect.stringMatching(/^curves\[0\]\.quotes\[0\]\.rate: curves\[0\] "euribor6m": /)]);
  });

  it('a curve holds at most as many quotes as a workspace (LIMITS.quotes, 500)', () => {
    const many = Array.from({ length: 501 }, () => INDEX_6M[0]!);
    expect(errorsOf([proj({ quotes: many })])).toEqual([expect.stringMatching(/^curves\[0\]\.quotes: .*501 quotes is more than the 500/)]);
  });

  it('a quote that is not an object is a quote error: skipped, the rest of its curve builds', () => {
    const doc = { ...twoCurveDoc(), curves: [{ ...twoCurveDoc().curves[0]!, quotes: [...INDEX_6M, 'x'] }] };
    const main = buildCurve(doc, { readCurves: readNamedCurves, skipInvalid: true });
    expect(main.warnings.map((w) => w.path)).toContain('curves[0].quotes[8]');
    const [p] = buildNamedCurves(main.workspace!, main.curve);
    expect(p!.build.errors).toEqual([]);
    expect(p!.build.repricing).toHaveLength(INDEX_6M.length);
  });

  it('a version 1 document refuses curves, naming version 2', () => {
    const e = validateWorkspace({ format: 'tenorscope-workspace', version: 1, settlement: '2027-03-10', quotes: OIS, curves: [proj()] }, readNamedCurves).errors;
    expect(e.map((x) => x.path)).toEqual(['curves']);
  });

  it('a projection curve whose discounting curve does not build says so', () => {
    const doc = twoCurveDoc();
    const main = buildCurve({ ...doc, quotes: [OIS[0]!], curve: { ...doc.curve, extrapolation: 'none' } }, { readCurves: readNamedCurves });
    const [p] = buildNamedCurves(main.workspace!, null);
    expect(p!.build.errors.map((e) => e.path)).toEqual(['curves[0].discountCurve']);
    // Built on a one-year discounting curve, the long swaps pay beyond it: each named.
    const [q] = buildNamedCurves(main.workspace!, main.curve);
    expect(q!.build.errors[0]!.message).toMatch(/^curves\[0\] "euribor6m": quotes\[\d\] \(swap .*\) pays on .* after the last pillar of its discounting curve "default"/);
  });
});

/** An invented three-month index: deposits, and basis swaps quoted as the spread on its leg against the six-month index. */
const INDEX_3M = [
  { kind: 'deposit', tenor: '3M', rate: 0.0236, dayCount: 'ACT/360' },
  ...(['1Y', '2Y', '5Y', '10Y'] as const).map((tenor, i) => ({ kind: 'swap', tenor, rate: [0.0008, 0.0009, 0.0011, 0.0012][i]!, dayCount: 'ACT/360', against: 'euribor6m' })),
];
const threeCurveDoc = (interpolation = 'monotone-convex', against = 'euribor6m') => {
  const doc = twoCurveDoc(interpolation);
  return { ...doc, curves: [{ name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default', curve: doc.curve, quotes: INDEX_3M.map((q) => ('against' in q ? { ...q, against } : q)) }, ...doc.curves] };
};

describe('basis swaps', () => {
  it('the par spread of a 1Y three-month against six-month basis swap equals the hand calculation to 1e-15', () => {
    // Three curves given by discount factors (invented), log-linear between nodes. The spread K is on
    // the 3M leg, accruing ACT/360 over its periods; both legs paid at their period ends:
    // K = (sum_k tau_k F6_k P_d(T_k) - sum_j tau_j F3_j P_d(T_j)) / sum_j tau_j P_d(T_j).
    const q3 = ['2027-06-10', '2027-09-10', '2027-12-10', '2028-03-10'];
    const P3 = [0.99405, 0.98801, 0.98197, 0.97589];
    const P6 = [0.98772, 0.97541];
    const Pd = [0.99462, 0.98921, 0.98376, 0.97829];
    const time = curveClock('ACT/365F', civilFromIso('2027-03-10'));
    const curveOf = (dates: string[], dfs: number[]): Curve => curveFromPillars('2027-03-10', 'ACT/365F', 'log-linear-discount', 'none', dates.map((date, i) => ({ date, t: time(civilFromIso(date)), discount: dfs[i]!, quote: i })));
    const three = curveOf(q3, P3);
    const six = curveOf([q3[1]!, q3[3]!], P6);
    const discount = curveOf(q3, Pd);
    const tau3 = [92 / 360, 92 / 360, 91 / 360, 91 / 360];
    const leg3 = (1 / P3[0]! - 1) * Pd[0]! + (P3[0]! / P3[1]! - 1) * Pd[1]! + (P3[1]! / P3[2]! - 1) * Pd[2]! + (P3[2]! / P3[3]! - 1) * Pd[3]!;
    const leg6 = (1 / P6[0]! - 1) * Pd[1]! + (P6[0]! / P6[1]! - 1) * Pd[3]!;
    const annuity = tau3[0]! * Pd[0]! + tau3[1]! * Pd[1]! + tau3[2]! * Pd[2]! + tau3[3]! * Pd[3]!;
    const K = (leg6 - leg3) / annuity;
    const q = { kind: 'swap', index: 0, maturity: '2028-03-10', tenor: '1Y', enabled: true, rate: 0.001, frequency: 1, dayCount: 'ACT/360', eom: false } as SwapQuote;
    const ins = ProjectedSwap.compile(q, civilFromIso('2027-03-10'), civilFromIso('2028-03-10'), time, discount, 'ois', 4, { curve: six, name: 'euribor6m', perYear: 2 });
    if ('beyond' in ins) throw new Error('in range');
    expect(Math.abs(ins.modelQuote((t) => three.lnDiscountAt(t)) - K)).toBeLessThanOrEqual(1e-15);
    expect(Math.abs(K)).toBeGreaterThan(1e-5);
  });

  it.each(INTERPOLATIONS)('a three-month curve of deposits and basis swaps against the six-month curve, and one against the overnight curve, reprice to 1e-14 (%s)', (method) => {
    for (const against of ['euribor6m', 'default']) {
      const { named } = buildAll(threeCurveDoc(method, against));
      const three = named.find((n) => n.name === 'euribor3m')!;
      expect(three.build.errors).toEqual([]);
      expect(three.build.repricing).toHaveLength(INDEX_3M.length);
      for (const r of three.build.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(1e-14);
      // Built after the curve of its other leg, whatever the document's order.
      expect(named.map((n) => n.name)).toEqual(against === 'default' ? ['euribor3m', 'euribor6m'] : ['euribor6m', 'euribor3m']);
    }
  });

  it('a six-month quote moves the three-month curve through its basis swaps', () => {
    const base = buildAll(threeCurveDoc()).named.find((n) => n.name === 'euribor3m')!.build.curve!;
    const doc = threeCurveDoc();
    const bumped = { ...doc, curves: doc.curves.map((c) => (c.name === 'euribor6m' ? { ...c, quotes: c.quotes.map((q) => (q.tenor === '5Y' ? { ...q, rate: q.rate + 0.0001 } : q)) } : c)) };
    const moved = buildAll(bumped).named.find((n) => n.name === 'euribor3m')!.build.curve!;
    expect(Math.abs(moved.lnDiscountAt(4) - base.lnDiscountAt(4))).toBeGreaterThan(1e-7);
    expect(moved.pillars[0]).toEqual(base.pillars[0]);
  });

  it('errors: against naming no curve, the curve itself, a quote that is not a swap, and basis swaps in a circle', () => {
    const errorsOf = (curves: unknown) => validateWorkspace({ ...V2, quotes: OIS, curves }, readNamedCurves).errors.map((e) => `${e.path}: ${e.message}`);
    const three = (against: string, extra: Record<string, unknown> = {}) => ({ name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default', quotes: [{ kind: 'swap', tenor: '2Y', rate: 0.001, dayCount: 'ACT/360', against }], ...extra });
    expect(errorsOf([three('euribor1m')])).toEqual([expect.stringMatching(/^curves\[0\]\.quotes\[0\]\.against: .*"euribor1m" names no curve/)]);
    expect(errorsOf([three('euribor3m')])).toEqual([expect.stringMatching(/^curves\[0\]\.quotes\[0\]\.against: .*"euribor3m" is this curve itself/)]);
    expect(errorsOf([{ ...three('default'), quotes: [{ kind: 'deposit', tenor: '3M', rate: 0.02, against: 'default' }] }])).toEqual([expect.stringMatching(/^curves\[0\]\.quotes\[0\]\.against: .*quotes\[0\] is a deposit; against .* belongs on a \{"kind": "swap"\} quote/)]);
    const six = { name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', quotes: [{ kind: 'swap', tenor: '2Y', rate: -0.001, dayCount: 'ACT/360', against: 'euribor3m' }] };
    expect(errorsOf([three('euribor6m'), six])).toEqual([expect.stringMatching(/the curves "euribor3m" -> "euribor6m" -> "euribor3m" each need the next built first/)]);
    // On a discounting curve `against` is not a field of a swap.
    expect(errorsOf([{ name: 'estr', role: 'discounting', quotes: [{ kind: 'swap', tenor: '2Y', rate: 0.02, against: 'default' }] }])[0]).toMatch(/^curves\[0\]\.quotes\[0\]\.against: /);
  });
});

describe('named curves: bad input never throws', () => {
  it('2,000 seeded damages of a three-curve document give a build or errors naming a path, never an exception or a silent NaN', async () => {
    // Damage: one value somewhere under `curves` replaced by junk (invented; the seeded generator of test/cli/golden.ts).
    const { generator } = await import('../../cli/golden.ts');
    const r = generator(18);
    const junk = [null, 0, -1, 1e308, 'x', '', 'default', 'euribor6m', [], {}, true, '3M', 'projection', [{}]];
    for (let n = 0; n < 2000; n++) {
      const doc = JSON.parse(JSON.stringify(threeCurveDoc())) as Record<string, unknown>;
      const paths: [Record<string, unknown> | unknown[], string | number][] = [];
      const walk = (v: unknown) => {
        if (Array.isArray(v)) v.forEach((x, i) => { paths.push([v, i]); walk(x); });
        else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) { paths.push([v as Record<string, unknown>, k]); walk(x); }
      };
      walk(doc.curves);
      const [holder, key] = paths[Math.floor(r() * paths.length)]!;
      (holder as Record<string | number, unknown>)[key] = junk[Math.floor(r() * junk.length)];
      const main = buildCurve(doc, { readCurves: readNamedCurves });
      if (main.errors.length > 0) {
        for (const e of main.errors) expect(e.path === '' || /^(curves|quotes)/.test(e.path), e.message).toBe(true);
        continue;
      }
      for (const b of buildNamedCurves(main.workspace!, main.curve)) {
        if (b.build.errors.length > 0) for (const e of b.build.errors) expect(e.path).toMatch(/^curves\[\d\]\./);
        else for (const x of b.build.repricing) expect(Number.isFinite(x.repricingError)).toBe(true);
      }
    }
  });
});

describe('the workbench and named curves', () => {
  it('without the named-curve reader, refuses an engine file with named curves, naming them; with it, opens the file keeping them as given', () => {
    // The bridge's rule: a conversion is exact or refused (src/core/document/documentBridge.ts);
    // without the named-curve reader (the workbench's default build) validation refuses `curves`.
    const r = workbenchFromEngine(twoCurveDoc(), () => 'id');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toEqual(['curves']);
    expect(r.errors[0]!.message).toMatch(/\("euribor6m"\).*refused rather than drop them.*curve command/);
    expect(buildCurve(twoCurveDoc()).errors.map((e) => e.path)).toEqual(['curves']);
    // The file readers pass the reader (src/share/documentReader.ts): the curves come through unchanged.
    const opened = workbenchFromEngine(twoCurveDoc(), () => 'id', readNamedCurves);
    expect(opened.ok).toBe(true);
    if (!opened.ok) return;
    expect(opened.value.curves).toEqual(twoCurveDoc().curves);
  });
});
