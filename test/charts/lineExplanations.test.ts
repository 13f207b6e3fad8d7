// Every line of the Charts section explains its point (ChartLine.explain, a DatedCell read by
// explainKeyCell): the explanation's value is the plotted sample bit for bit (Object.is), on the
// line's own curve made as its overlay makes it (the base series, the method overlay's CurveBuilder,
// the scenario overlay's applyToShown, the snapshot overlay's rebuildSnapshot), at dates between
// nodes and past the last pillar; and the steps, recomputed here from the inputs the explanation
// shows (its nodes, reads and year fractions), give the value to 1e-15 relative. The formulas
// recomputed are the definitions: zero and forward rates from discount factors (P = exp(-r tau),
// P = (1 + r/m)^(-m tau), P = 1/(1 + r tau)), the par yield (1 - DF(T)) / sum tau_i DF(t_i), and
// on a log-linear curve the instantaneous forward -d ln DF/dt, flat between two nodes (standard
// textbook definitions, written from memory; the base queries' outside-source checks are in
// test/core/curve/explain.test.ts and test/core/curve/query.test.ts).
import {
  CurveBuilder,
  daysBetween,
  referenceForwardSamples,
  referenceZeroSamples,
  type ReferenceCurve,
  INTERPOLATIONS,
  forwardSamples,
  periodsPerYear,
  rebuildSnapshot,
  takeSnapshot,
  zeroSamples,
  type Compounding,
  type DisplaySettings,
  type Explanation,
  type InterpolationId,
  type Scenario,
} from '../../src/core/index.ts';
import { explainKeyCell, type ExplainCell } from '../../src/features/tables/explainCell.ts';
import { applyToShown } from '../../src/features/scenarios/applyShown.ts';
import { workbenchBuildOptions } from '../../src/hooks/overnightKit.ts';
import { curveSeries, forwardSeries, points, sampleGridFor, type SamplePoint } from '../../src/hooks/useCurveSeries.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { datedAt } from '../../src/features/curves/datedAt.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../helpers/markets.ts';
import { workbenchOf } from '../helpers/engineWorkspace.ts';
import { expectRelClose } from '../helpers/asserts.ts';

const RECOMPUTED = 'the definition, recomputed from the inputs the explanation shows';

function market(interpolation: InterpolationId, compounding: Compounding) {
  const doc = workbenchOf(workspaceDoc(INVENTED_2027_EVERY_KIND, { interpolation, extrapolation: 'flat-forward' }));
  const display: DisplaySettings = { ...doc.display, compounding, showPar: true, showInstantaneous: true };
  const result = deriveBuild(doc);
  const curve = result.build.curve!;
  return { doc, display, result, curve };
}

/** A few samples of a line: near the short end, two between nodes, and past the last pillar. */
function someOf(pts: readonly SamplePoint[]): SamplePoint[] {
  const inside = pts.filter((p) => !p.extrapolated);
  const out = pts.filter((p) => p.extrapolated);
  expect(out.length).toBeGreaterThan(0);
  return [inside[3]!, inside[Math.floor(inside.length / 3)]!, inside[Math.floor((2 * inside.length) / 3) + 1]!, out[Math.floor(out.length / 2)]!, out.at(-1)!];
}

/** The rate of ln P over tau years in compounding c, as the definitions give it. */
function rateOf(lnP: number, c: Compounding, tau: number): number {
  const m = periodsPerYear(c);
  if (m === Infinity) return -lnP / tau;
  if (m === 0) return Math.expm1(-lnP) / tau;
  return m * Math.expm1(-lnP / (m * tau));
}

const tau = (e: Explanation, name: string): number => e.yearFractions.find((y) => y.name === name)!.value;
const read = (e: Explanation, name: string): number => e.reads.find((r) => r.name === name)!.lnDiscount;

/** The explanation's value again from its shown inputs, by its kind. */
function recomputed(e: Explanation, c: Compounding): number {
  if (e.quantity === 'zero-rate') return rateOf(read(e, 'DF(date)'), c, tau(e, 'tau'));
  if (e.quantity === 'forward-rate') return rateOf(read(e, 'DF(end)') - read(e, 'DF(start)'), c, tau(e, 'tau'));
  if (e.quantity === 'par-yield') {
    let annuity = 0;
    e.yearFractions.forEach((y, i) => (annuity += y.value * Math.exp(read(e, `DF(t${i + 1})`))));
    // DF(start) - DF(end) as the step writes it, DF(start) (1 - DF(end)/DF(start)) with expm1 (no cancellation near settlement).
    return (Math.exp(read(e, 'DF(start)')) * -Math.expm1(read(e, 'DF(end)') - read(e, 'DF(start)'))) / annuity;
  }
  // The instantaneous forward on a log-linear curve: the slope between the two nodes shown, or the last node's forward carried on.
  const r = e.reads[0]!;
  if (r.how === 'extrapolated') return r.forward!;
  const [a, b] = r.nodes;
  return -(b!.lnDiscount - a!.lnDiscount) / (b!.t - a!.t);
}

/** Opens each point through the line's factory and holds the explanation to the plotted value and to its recomputed steps. */
function expectExplained(m: ReturnType<typeof market>, pts: readonly SamplePoint[], cellOf: (p: SamplePoint) => ExplainCell, title: RegExp, recompute = true) {
  for (const p of someOf(pts)) {
    const r = explainKeyCell(m.result, m.display, cellOf(p));
    if (!r.ok) throw new Error(`${p.date}: ${r.errors[0]!.message}`);
    const e = r.value.explanation;
    expect(Object.is(e.value, p.y), `${p.date}: ${e.value} plotted ${p.y}`).toBe(true);
    expect(e.steps.at(-1)!.value).toBe(p.y);
    expect(r.value.title).toMatch(title);
    if (recompute) expectRelClose(recomputed(e, m.display.compounding), p.y, 1e-15, RECOMPUTED + ` (${e.quantity} on ${p.date})`);
  }
}

describe.each([
  ['log-linear-discount', 'continuous'],
  ['monotone-convex', 'annual'],
  ['linear-zero', 'simple'],
] as const)('the Charts lines explain their points (%s, %s)', (interpolation, compounding) => {
  const m = market(interpolation, compounding);
  const series = curveSeries(m.curve, m.display, m.result.build.repricing);

  it('the zero, forward and par-yield lines, bit for bit, the steps recomputed', () => {
    expectExplained(m, series.zero, datedAt('zero'), /^Zero rate on \d{4}-\d\d-\d\d$/);
    expectExplained(m, series.forward, datedAt('forward'), /^3M forward rate starting/);
    expectExplained(m, series.par, datedAt('par'), /^Par yield to \d{4}-\d\d-\d\d$/);
  });

  it('the instantaneous forward line, through instantaneousForwardOn', () => {
    expectExplained(m, series.instantaneous, datedAt('inst'), /^Instantaneous forward on/, interpolation === 'log-linear-discount');
    const r = explainKeyCell(m.result, m.display, datedAt('inst')(series.instantaneous[40]!));
    if (!r.ok) throw new Error('inst');
    // Its quotes are those of the 1-day forward it is the limit of, and it has a value under each method.
    expect(r.value.quotes.length).toBe(5);
    expect(r.value.quotesNote).toMatch(/^of the 1-day forward/);
    expect(r.value.methods.filter((x) => x.current).map((x) => x.method)).toEqual([interpolation]);
  });

  it("the other methods' forward lines, on the curve the overlay builds (CurveBuilder)", () => {
    const builder = new CurveBuilder();
    for (const method of INTERPOLATIONS) {
      if (method === interpolation) continue;
      const built = builder.build(m.result.conversion.doc, { ...workbenchBuildOptions(), interpolation: method });
      const pts = forwardSeries(built.curve!, m.display);
      expectExplained(m, pts, datedAt('forward', { method }), /^3M forward rate starting .*\) \(.+\)$/);
      const r = explainKeyCell(m.result, m.display, datedAt('forward', { method })(pts[100]!));
      if (!r.ok) throw new Error(method);
      // The line's own method is the one marked, its value the line's.
      const own = r.value.methods.find((x) => x.current)!;
      expect(own.method).toBe(method);
      expect(own.value).toBe(pts[100]!.y);
    }
  });

  const scenarios: Scenario[] = [
    { id: 'a', name: 'Up 50', space: 'zero', shape: { kind: 'parallel', bp: 50 } },
    { id: 'b', name: 'Steeper', space: 'quotes', shape: { kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: 30 } },
  ];
  it.each(scenarios)('the scenario $name lines, on the scenario curve made as the overlay makes it', (s) => {
    const moved = applyToShown(s, m.result, workbenchBuildOptions());
    if (!moved.ok) throw new Error('scenario');
    const sc = curveSeries(moved.value.curve, m.display, []);
    expectExplained(m, sc.zero, datedAt('zero', { scenario: s }), new RegExp(`^Zero rate on .* under ${s.name}$`));
    expectExplained(m, sc.forward, datedAt('forward', { scenario: s }), / under /);
    const r = explainKeyCell(m.result, m.display, datedAt('zero', { scenario: s })(sc.zero[100]!));
    if (!r.ok) throw new Error('scenario');
    // The quotes are the base curve's, and the note says so; the scenario made again under each method.
    expect(r.value.quotesNote).toMatch(/^of the base curve's rate/);
    expect(r.value.methods.find((x) => x.current)!.value).toBe(sc.zero[100]!.y);
    expect(new Set(r.value.methods.map((x) => x.value)).size).toBeGreaterThan(1);
  });

  it('a snapshot line, on the snapshot rebuilt from its inputs, with no quotes on the sheet', () => {
    const other = workbenchOf(workspaceDoc(INVENTED_2027_EVERY_KIND.slice(0, 7), { interpolation, extrapolation: 'flat-forward', settlement: '2027-02-15' }));
    const snapshot = takeSnapshot(deriveBuild(other).conversion.doc, 'February', '2027-02-15T12:00:00Z');
    const c = rebuildSnapshot(snapshot).build.curve!;
    const grid = sampleGridFor(c, m.display);
    // As the comparison overlay samples it (useComparisonOverlay's `sampled`).
    const z = points(zeroSamples(c, grid, m.display.compounding));
    const f = points(forwardSamples(c, grid, m.display.compounding));
    expectExplained(m, z, datedAt('zero', { snapshot }), /on snapshot February$/);
    expectExplained(m, f, datedAt('forward', { snapshot }), /on snapshot February$/);
    const r = explainKeyCell(m.result, m.display, datedAt('zero', { snapshot })(z[50]!));
    if (!r.ok) throw new Error('snapshot');
    expect(r.value.quotes).toEqual([]);
    expect(r.value.quotesNote).toMatch(/frozen/);
    expect(r.value.methods.find((x) => x.current)!.value).toBe(z[50]!.y);
  });

  // An invented reference file, quarterly dates, so 3M forwards follow from it exactly.
  const dates = ['2027-06-10', '2027-09-10', '2027-12-10', '2028-03-10', '2028-06-12', '2028-09-11', '2028-12-11', '2029-03-12'];
  it.each(['zero', 'discount'] as const)('the reference line from a file of %s rates/factors, as the file gives it', (kind) => {
    const z = (i: number): number => 0.029 + 0.0007 * i;
    const ref: ReferenceCurve = { kind, compounding: 'annual', dayCount: 'ACT/360', points: dates.map((date, i) => ({ date, value: kind === 'zero' ? z(i) : Math.exp(-z(i) * (i + 1) * 0.25) })) };
    const { compounding: c, dayCount: dc } = m.display;
    expect(dc).toBe('ACT/365F');
    // ln D at a file date, from the file's value: ln D, or an annual ACT/360 zero rate, P = (1 + z)^(-days/360).
    const lnD = (d: string): number => {
      if (d === m.curve.settlement) return 0;
      const v = ref.points.find((p) => p.date === d)!.value;
      return kind === 'discount' ? Math.log(v) : -(daysBetween(m.curve.settlement, d) / 360) * Math.log1p(v);
    };
    const zero = points(referenceZeroSamples(ref, m.curve, c, dc));
    const fwd = referenceForwardSamples(ref, m.curve, { n: 3, unit: 'M' }, c, dc);
    expect(fwd.exact).toBe(true);
    for (const [pts, field] of [[zero, 'zero'], [points(fwd.samples), 'forward']] as const) {
      expect(pts.length).toBeGreaterThan(3);
      for (const p of pts) {
        const r = explainKeyCell(m.result, m.display, datedAt(field, { refCurve: ref })(p));
        if (!r.ok) throw new Error(`${p.date}: ${r.errors[0]!.message}`);
        const e = r.value.explanation;
        expect(Object.is(e.value, p.y), p.date).toBe(true);
        expect(r.value.title).toMatch(field === 'zero' ? /^Reference zero rate on / : /^Reference 3M forward rate starting /);
        expect(r.value.quotes).toEqual([]);
        expect(r.value.methods).toEqual([]);
        const y = e.yearFractions[0]!;
        expect(y.value).toBe(daysBetween(y.from, y.to) / 365);
        expectRelClose(rateOf(lnD(y.to) - lnD(y.from), c, daysBetween(y.from, y.to) / 365), p.y, 1e-15, `${RECOMPUTED} (the reference ${field} on ${p.date})`);
      }
    }
  });
});
