import type { Curve } from '../curve/curve.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { INTERPOLATIONS, type InterpolationId } from '../interpolation/types.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type CoreError, type Result } from '../result.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount, type DayCount } from '../time/dayCount.ts';
import { forwardSensitivities, quoteNodeJacobian, type ForwardRow, type SensitivityTrace } from './forwardSensitivity.ts';
import { explainedConventions, explainedYearFraction, explainRead, LN_UNIT, rateUnit, type ExplainedStep, type Explanation } from '../curve/explain.ts';
import { periodsPerYear } from '../rates/compounding.ts';
import { nodeCount, solvedSpans, wrongQuoteCount } from './nodePartials.ts';
import { fixedLegPeriods } from '../instruments/swap.ts';
import { luFactor, luInverse } from '../numeric/luDecomposition.ts';

/** A quote a number depends on, and how much. */
export interface QuoteInfluence {
  /** Index of the quote in the workspace document. */
  readonly index: number;
  readonly kind: Instrument['kind'];
  readonly maturity: IsoDate;
  /** The yield the quote is moved through (its own yield; a price quote through its yield). */
  readonly yieldLabel: string;
  /** d(number) / d(quote's own yield), bp of the number per bp of the quote. */
  readonly bpPerBp: number;
}

/**
 * The quotes a forward rate over [start, end] (a zero rate when start is settlement) depends on
 * most: the `count` largest by |bp per bp|, largest first (ties in document order). The
 * sensitivities are `forwardSensitivities` (implicit-function rule on the exact bootstrap) for
 * the one forward. `curve` must be the bootstrap of `instruments` (a build's `curve` and
 * `instruments`). An empty list for an empty period (the zero rate at settlement itself).
 */
export function topQuoteInfluences(
  curve: Curve,
  instruments: readonly Instrument[],
  start: IsoDate,
  end: IsoDate,
  c: Compounding,
  dc: CurveDayCount,
  count = 5,
): Result<QuoteInfluence[]> {
  if (compareIso(end, start) <= 0) return ok([]);
  const tau = queryYearFraction(dc, start, end);
  if (!(tau > 0)) return fail(coreError('empty-period', 'end', `${start} to ${end} is an empty period on ${dc}; choose a later end`));
  const tStart = curve.time(start);
  const tEnd = curve.time(end);
  const row = { start, end, tStart, tEnd, tau, rate: 0, extrapolated: tEnd > curve.lastT };
  const map = forwardSensitivities(curve, instruments, [row], c, dc);
  if (!map.ok) return map;
  const { columns, values } = map.value;
  const all = columns.map((col, k) => ({ index: col.index, kind: col.kind, maturity: col.maturity, yieldLabel: col.yieldLabel, bpPerBp: values[k]! }));
  all.sort((a, b) => Math.abs(b.bpPerBp) - Math.abs(a.bpPerBp) || a.index - b.index);
  return ok(all.slice(0, count));
}

/**
 * The quotes a forward par rate from `start` to `end` on a fixed leg (frequency, dc, eom, as
 * forwardParRateOn schedules it) depends on most; a par yield with start = settlement and dc =
 * ACT/ACT-ICMA (parYieldOn). With R = (DF(s) - DF(e)) / A, A = sum_i tau_i DF(t_i), its
 * derivatives in ln DF are dR/dlnDF(s) = DF(s)/A, dR/dlnDF(e) = -DF(e)/A and
 * dR/dlnDF(t_i) = -R tau_i DF(t_i)/A (added up where dates coincide); chained to the quotes as
 * forwardSensitivities chains a forward (implicit-function rule on the exact bootstrap). bp per
 * bp of the quote's own yield, the `count` largest by size, largest first.
 */
export function topParQuoteInfluences(
  curve: Curve,
  instruments: readonly Instrument[],
  start: IsoDate,
  end: IsoDate,
  frequency: number,
  dc: DayCount,
  eom = false,
  count = 5,
): Result<QuoteInfluence[]> {
  const n = instruments.length;
  const wrong = wrongQuoteCount(curve, n);
  if (wrong) return wrong;
  if (compareIso(end, start) <= 0) return fail(coreError('empty-period', 'end', `${start} to ${end} is an empty period; the end must come after the start`));
  const df = (t: number): number => Math.exp(curve.lnDiscountAt(t));
  const periods = fixedLegPeriods(start, end, frequency, dc, eom);
  const tS = curve.time(start);
  const tE = curve.time(end);
  const times: number[] = [];
  const weights: number[] = [];
  let annuity = 0;
  for (const p of periods) annuity += p.tau * df(curve.time(p.end));
  const rate = (df(tS) - df(tE)) / annuity;
  // Settlement's DF is 1 whatever the nodes: no weight there.
  if (tS > 0) (times.push(tS), weights.push(df(tS) / annuity));
  times.push(tE);
  weights.push(-df(tE) / annuity);
  for (const p of periods) {
    const t = curve.time(p.end);
    times.push(t);
    weights.push((-rate * p.tau * df(t)) / annuity);
  }
  return topInfluencesOfLn(curve, instruments, times, weights, count);
}

/**
 * The quotes a number depends on most, given how it moves with ln DF at some times:
 * `weights[k]` = d(number)/d lnDF(times[k]) (added up where times coincide). Chained to each
 * quote's own yield through the node Jacobian (implicit-function rule on the exact bootstrap, as
 * forwardSensitivities chains a forward): d(number)/d(quote's yield), the `count` largest by size,
 * largest first (ties in document order). In bp per bp when the number is a rate; a price's weights
 * carry their own scale (the caller's). `curve` must be the bootstrap of `instruments`.
 */
export function topInfluencesOfLn(curve: Curve, instruments: readonly Instrument[], times: readonly number[], weights: readonly number[], count = 5): Result<QuoteInfluence[]> {
  return topInfluencesOfNodes(curve, instruments, times, count, (g, extraPartials, n) =>
    weights.forEach((w, k) => {
      for (let j = 0; j < n; j++) g[j] = g[j]! + w * extraPartials[k * n + j]!;
    }),
  );
}

/**
 * The quotes a turn's solved spread depends on most: the spread is one of the curve's unknowns
 * (nodePartials: one column per solved spread after the pillars), so d spread / d quote is that
 * unknown's row of the inverse node Jacobian, in bp of spread per bp of the quote's own yield.
 */
export function topInfluencesOfSolvedTurn(curve: Curve, instruments: readonly Instrument[], turnIndex: number, count = 5): Result<QuoteInfluence[]> {
  const solved = solvedSpans(curve);
  const k = solved.findIndex((x) => x.index === turnIndex);
  if (k < 0) return fail(coreError('schema', `turns[${turnIndex}]`, 'this turn has no spread solved from a quote on the curve'));
  const column = nodeCount(curve) - solved.length + k;
  return topInfluencesOfNodes(curve, instruments, [], count, (g) => {
    g[column] = 1;
  });
}

/** The quotes that move a number most, given its slopes g_j to the curve's unknowns (filled by `slopes`, which may read the partials of ln DF at `times`). */
function topInfluencesOfNodes(curve: Curve, instruments: readonly Instrument[], times: readonly number[], count: number, slopes: (g: Float64Array, extraPartials: Float64Array, n: number) => void): Result<QuoteInfluence[]> {
  const n = instruments.length;
  const wrong = wrongQuoteCount(curve, n);
  if (wrong) return wrong;
  const { jacobian, yields, extraPartials } = quoteNodeJacobian(curve, instruments, times);
  const lu = luFactor(jacobian, n);
  if (!lu) return fail(coreError('no-solution', 'quotes', 'the quotes do not determine the curve nodes one to one (a singular Jacobian); check for quotes that repeat the same information'));
  const inv = luInverse(lu);
  const g = new Float64Array(n);
  slopes(g, extraPartials, n);
  const all = instruments.map((ins, k) => {
    let v = 0;
    for (let j = 0; j < n; j++) v += g[j]! * inv[j * n + k]!;
    return { index: ins.index, kind: ins.kind, maturity: ins.maturity, yieldLabel: yields[k]!.label, bpPerBp: v };
  });
  all.sort((a, b) => Math.abs(b.bpPerBp) - Math.abs(a.bpPerBp) || a.index - b.index);
  return ok(all.slice(0, count));
}

/** A number read again on the curve built by another interpolation method. */
export interface MethodValue {
  readonly method: InterpolationId;
  readonly label: string;
  /** True for the method of the curve the number was read on. */
  readonly current: boolean;
  /** The number under this method; null when the build or the read failed (see `error`). */
  readonly value: number | null;
  readonly error: string | null;
}

/**
 * The same number under every interpolation method: `curveFor(method)` builds the curve of the
 * same quotes (settlement, day count and extrapolation unchanged) with that method, and `read`
 * reads the number off it. The current method is built again too, so its value is what `read`
 * gives on a fresh build (bit for bit the build's own). Cost: one build per method. The builder
 * is the caller's (the command's bootstrap of its instruments, the workbench's CurveBuilder), so
 * this module carries no bootstrap of its own.
 */
export function valueUnderEachMethod(
  current: InterpolationId,
  curveFor: (method: InterpolationId) => { readonly curve: Curve | null; readonly errors: readonly CoreError[] },
  read: (curve: Curve) => Result<number>,
): MethodValue[] {
  return INTERPOLATIONS.map((method) => {
    const base = { method, label: INTERPOLATORS[method].label, current: method === current };
    const built = curveFor(method);
    if (!built.curve || built.errors.length > 0) return { ...base, value: null, error: built.errors[0]?.message ?? 'no curve' };
    const r = read(built.curve);
    return r.ok ? { ...base, value: r.value, error: null } : { ...base, value: null, error: r.errors[0]!.message };
  });
}

/**
 * The explanation of one cell of the forward-sensitivity map: the forward `row` (the map's own row)
 * against the quote at position `column` of `instruments`, by forwardSensitivities itself run on
 * that row with a trace: ln P and the forward, dF/dL, then for each node j that the forward reads
 * the node partials of ln DF at its end and start (nodePartials, by the curve's method), g_j and
 * the quote's column m_j of (dq/dx)^-1 (implicit-function rule on the exact bootstrap), and
 * dF/dq = sum_j g_j m_j, the map's figure bit for bit (bp of forward per bp of quote).
 */
export function explainForwardSensitivity(curve: Curve, instruments: readonly Instrument[], row: ForwardRow, column: number, c: Compounding, dc: CurveDayCount): Result<Explanation> {
  const trace: SensitivityTrace = { column };
  const map = forwardSensitivities(curve, instruments, [row], c, dc, trace);
  if (!map.ok) return map;
  const r = trace.record!;
  const col = map.value.columns[column]!;
  const rUnit = rateUnit(c, dc);
  const m = periodsPerYear(c);
  const steps: ExplainedStep[] = [
    { name: 'L', formula: 'L = ln DF(end) - ln DF(start)', inputs: ['DF(end)', 'DF(start)'], value: r.L, unit: LN_UNIT },
    { name: 'F', formula: 'F = the forward over tau from L', inputs: ['L', 'tau'], value: row.rate, unit: rUnit },
    { name: 'dF/dL', formula: `dF/dL = ${m === Infinity ? '-1 / tau' : m === 0 ? '-exp(-L) / tau' : `-exp(-L / (${m} tau)) / tau`}`, inputs: ['L', 'tau'], value: r.dFdL, unit: `${rUnit} per unit of ln DF` },
  ];
  const terms: string[] = [];
  // The curve's unknowns: ln DF at each pillar, then each turn spread solved from a quote.
  const solved = solvedSpans(curve);
  const n = curve.pillars.length;
  r.g.forEach((g, j) => {
    if (g === 0) return;
    const k = j + 1;
    const x = `x${k} (${j < n ? `ln DF at node ${k}, ${curve.pillars[j]!.date}` : `the spread of the turn ${solved[j - n]!.name}, solved from its quote`})`;
    steps.push(
      { name: `dE${k}`, formula: `dE${k} = d ln DF(end) / d ${x}, by ${curve.interpolation}`, inputs: [], value: r.end[j]!, unit: 'unitless' },
      { name: `dS${k}`, formula: `dS${k} = d ln DF(start) / d x${k}`, inputs: [], value: r.start[j]!, unit: 'unitless' },
      { name: `g${k}`, formula: `g${k} = dF/dL x (dE${k} - dS${k})`, inputs: ['dF/dL', `dE${k}`, `dS${k}`], value: g, unit: `${rUnit} per unit of x${k}` },
      { name: `m${k}`, formula: `m${k} = d x${k} / d q: the quote's column of (dq/dx)^-1`, inputs: [], value: r.inverse[j]!, unit: 'unitless (per unit of the quote\'s yield)' },
    );
    terms.push(`g${k}`, `m${k}`);
  });
  const sum = terms.length === 0 ? '0' : Array.from({ length: terms.length / 2 }, (_, i) => `${terms[2 * i]} ${terms[2 * i + 1]}`).join(' + ');
  steps.push({ name: 'dF/dq', formula: `dF/dq = ${sum}`, inputs: terms, value: map.value.values[column]!, unit: 'bp of forward per bp of quote' });
  const lnStart = row.tStart > 0 ? curve.lnDiscountAt(row.tStart) : 0;
  return ok({
    quantity: 'forward-sensitivity',
    formula: `dF/dq = sum_j g_j m_j: F the forward from start to end (${rUnit}), x_j = ln DF at node j, g_j = dF/dL (d ln DF(end)/dx_j - d ln DF(start)/dx_j), m = (dq/dx)^-1 for q = the quote's ${col.yieldLabel} (implicit-function rule on the exact bootstrap)`,
    value: map.value.values[column]!,
    unit: 'bp of forward per bp of quote',
    conventions: explainedConventions(curve, c, dc),
    dates: [row.start, row.end].map((d, i) => ({ name: i === 0 ? 'start' : 'end', given: d, unadjusted: d, adjusted: d, rule: 'none (a query date is read as given)' })),
    yearFractions: [
      explainedYearFraction('t(start)', curve.dayCount, curve.settlement, row.start, row.tStart),
      explainedYearFraction('t(end)', curve.dayCount, curve.settlement, row.end, row.tEnd),
      explainedYearFraction('tau', dc, row.start, row.end, row.tau),
    ],
    reads: [explainRead(curve, 'DF(start)', row.start, row.tStart, lnStart), explainRead(curve, 'DF(end)', row.end, row.tEnd, curve.lnDiscountAt(row.tEnd))],
    steps,
  });
}
