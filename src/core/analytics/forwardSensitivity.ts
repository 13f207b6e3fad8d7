import { bootstrapInstruments, type BootstrapSettings } from '../bootstrap/bootstrap.ts';
import { curveFromPillars, type Curve } from '../curve/curve.ts';
import { residualOnCurve, type Instrument } from '../instruments/instrument.ts';
import { periodsPerYear, rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount } from '../time/dayCount.ts';
import { marketDate, UNADJUSTED } from '../time/dateConventions.ts';
import { formatTenor, type Tenor } from '../time/tenor.ts';
import { luFactor, luInverse } from '../numeric/luDecomposition.ts';
import { nodePartials, wrongQuoteCount } from './nodePartials.ts';
import { spotGapOf } from '../bootstrap/spotBridge.ts';
import { quoteYieldOf, requoteAtYield, type QuoteYield } from './quoteYield.ts';

/** One forward of the sensitivity map: the rate over [start, end] in the map's compounding and day count. */
export interface ForwardRow {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Years from settlement to start and end on the curve's axis. */
  readonly tStart: number;
  readonly tEnd: number;
  /** Year fraction of [start, end] under the map's day count. */
  readonly tau: number;
  /** Forward rate, decimal per year, in the map's compounding and day count. */
  readonly rate: number;
  readonly extrapolated: boolean;
}

/** One quote of the map (a column), in the curve's pillar order. */
export interface SensitivityColumn {
  /** Index of the quote in the workspace document. */
  readonly index: number;
  readonly kind: Instrument['kind'];
  readonly maturity: IsoDate;
  readonly field: string;
  /** The yield the quote is moved through (its own yield; see quoteYield.ts). */
  readonly yieldLabel: string;
}

export interface ForwardSensitivityMap {
  readonly rows: readonly ForwardRow[];
  readonly columns: readonly SensitivityColumn[];
  /** dF_r / dq_k in bp of forward per bp of the quote's own yield, row-major (rows x columns). */
  readonly values: Float64Array;
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
}

/** A bump of 1 bp, as a decimal. */
export const ONE_BP = 1e-4;

/**
 * The forwards of one tenor whose starts step from settlement by `step` (settlement + k x step,
 * counted from settlement, never chained), each running one tenor from its start, for as long as
 * the end is on or before the curve's last pillar. Rates in compounding c and day count dc.
 */
export function forwardRows(curve: Curve, tenor: Tenor, step: Tenor, c: Compounding, dc: CurveDayCount): Result<ForwardRow[]> {
  const last = curve.pillars[curve.pillars.length - 1];
  if (!last) return fail(coreError('schema', 'curve', 'the curve has no pillars; add quotes first'));
  const rows: ForwardRow[] = [];
  for (let k = 0; k <= 2000; k++) {
    const start = marketDate(curve.settlement, step, UNADJUSTED, k);
    const end = marketDate(start, tenor);
    if (compareIso(end, last.date) > 0) break;
    const tau = queryYearFraction(dc, start, end);
    if (!(tau > 0)) return fail(coreError('empty-period', 'tenor', `a ${formatTenor(tenor)} forward from ${start} is an empty period on ${dc}; choose a longer tenor`));
    const tStart = curve.time(start);
    const tEnd = curve.time(end);
    const L = curve.lnDiscountAt(tEnd) - (tStart > 0 ? curve.lnDiscountAt(tStart) : 0);
    rows.push({ start, end, tStart, tEnd, tau, rate: rateFromLnDiscount(L, c, tau), extrapolated: false });
  }
  if (rows.length === 0) {
    return fail(coreError('beyond-curve', 'tenor', `a ${formatTenor(tenor)} forward from settlement ends after the curve's last pillar ${last.date}; choose a shorter tenor`));
  }
  return ok(rows);
}

/** dF/dL for F = rateFromLnDiscount(L, c, tau), L = ln DF(end) - ln DF(start). */
export function dRateDLn(L: number, c: Compounding, tau: number): number {
  if (c === 'continuous') return -1 / tau;
  if (c === 'simple') return -Math.exp(-L) / tau;
  return -Math.exp(-L / (periodsPerYear(c) * tau)) / tau;
}

const columnsOf = (instruments: readonly Instrument[], yields: readonly QuoteYield[]): SensitivityColumn[] =>
  instruments.map((ins, k) => ({ index: ins.index, kind: ins.kind, maturity: ins.maturity, field: ins.field, yieldLabel: yields[k]!.label }));

/**
 * The Jacobian dq/dx of the quotes' own yields q_i with respect to the curve's nodes
 * x_j = ln DF(T_j), by the implicit-function rule on each quote's pricing equation
 * G_i(q_i, x) = PV_i(flows(q_i); x) - target_i(q_i) = 0:
 *   dq_i/dx_j = -(dG_i/dx_j) / (dG_i/dq_i),  dG_i/dx_j = sum_f a_f DF(t_f) d lnDF(t_f)/dx_j,
 * with dG_i/dq_i from central differences of +-1e-4 and +-5e-5 in the own yield on the fixed curve,
 * Richardson-combined (truncation O(h^4), about 1e-13 relative; exact for the kinds whose flows
 * or target are linear in the quote). Row-major, n x n, instruments in
 * pillar order (`spotBridge`: the build's spot bridge time, as nodePartials takes it, by default
 * found again from the instruments as the bootstrap finds it, bootstrap/spotBridge.ts). Also returns the node partials at the extra times asked for, and each quote's
 * dG_i/dq_i (`pricingSlopes`, which the sensitivities across curves divide by).
 */
export function quoteNodeJacobian(
  curve: Curve,
  instruments: readonly Instrument[],
  extraTimes: readonly number[] = [],
  spotBridge: number | undefined = spotGapOf(curve.settlement, curve.dayCount, instruments)?.t,
): { jacobian: Float64Array; yields: QuoteYield[]; extraPartials: Float64Array; pricingSlopes: Float64Array } {
  const n = instruments.length;
  const index = new Map<number, number>();
  const times: number[] = [];
  const slot = (t: number): number => {
    let k = index.get(t);
    if (k === undefined) {
      k = times.length;
      index.set(t, k);
      times.push(t);
    }
    return k;
  };
  const flowSlots = instruments.map((ins) => Array.from(ins.times, slot));
  const extraSlots = extraTimes.map(slot);
  const partials = nodePartials(curve, times, spotBridge);
  const ln = curve.lnDiscountAt;
  const yields = instruments.map((ins) => quoteYieldOf(ins, curve.settlement));
  const jacobian = new Float64Array(n * n);
  const pricingSlopes = new Float64Array(n);
  const delta = 1e-4;
  instruments.forEach((ins, i) => {
    const qy = yields[i]!;
    const y0 = qy.toYield(ins.market);
    const g = (y: number): number => {
      const moved = requoteAtYield(ins, qy, y);
      return residualOnCurve(moved, ln);
    };
    const d1 = (g(y0 + delta) - g(y0 - delta)) / (2 * delta);
    const d2 = (g(y0 + delta / 2) - g(y0 - delta / 2)) / delta;
    const dGdq = (4 * d2 - d1) / 3;
    pricingSlopes[i] = dGdq;
    const slots = flowSlots[i]!;
    // A target on the curve (an OIS's floating leg) moves with the nodes too: dG/d lnDF(t_f) less its slope.
    const targetSlope = curveTargetSlopes(ins, ln);
    for (let f = 0; f < slots.length; f++) {
      const w = targetSlope === null ? ins.amounts[f]! * Math.exp(ln(ins.times[f]!)) : ins.amounts[f]! * Math.exp(ln(ins.times[f]!)) - targetSlope[f]!;
      const row = slots[f]! * n;
      for (let j = 0; j < n; j++) jacobian[i * n + j] = jacobian[i * n + j]! - (w * partials[row + j]!) / dGdq;
    }
  });
  const extraPartials = new Float64Array(extraSlots.length * n);
  extraSlots.forEach((s, k) => extraPartials.set(partials.subarray(s * n, s * n + n), k * n));
  return { jacobian, yields, extraPartials, pricingSlopes };
}

/** d target / d lnDF at each flow of an instrument with a target on the curve (`targetSlopes`); null for a constant target. */
function curveTargetSlopes(ins: Instrument, ln: (t: number) => number): number[] | null {
  if (ins.targetSlopes === undefined) return null;
  const n = ins.times.length;
  const lns = new Array<number>(n);
  const dfs = new Array<number>(n);
  for (let j = 0; j < n; j++) {
    lns[j] = ln(ins.times[j]!);
    dfs[j] = Math.exp(lns[j]!);
  }
  const out = new Array<number>(n).fill(0);
  ins.targetSlopes(lns, dfs, 0, out);
  return out;
}

/**
 * What forwardSensitivities hands an explanation (explainRisk.ts) for one quote, `column` (its
 * position in the instruments), on its last row: its own values.
 */
export interface SensitivityTrace {
  readonly column: number;
  record?: {
    /** ln DF(end) - ln DF(start). */
    readonly L: number;
    /** dF/dL (dRateDLn). */
    readonly dFdL: number;
    /** d lnDF(start) / dx_j and d lnDF(end) / dx_j, the node partials (nodePartials), j in pillar order. */
    readonly start: Float64Array;
    readonly end: Float64Array;
    /** g_j = dF/dL x (end_j - start_j). */
    readonly g: Float64Array;
    /** Column `column` of (dq/dx)^-1: each node's move per unit of the quote's own yield. */
    readonly inverse: Float64Array;
  };
}

/**
 * Sensitivity of each forward to each quote, in bp per bp, computed analytically from the
 * bootstrap: dF/dq = dF/dx (dq/dx)^-1 (implicit-function theorem on the exact bootstrap, whose
 * nodes x reprice every quote). A price quote is moved through its own yield (quoteYield.ts).
 * `curve` must be the bootstrap of `instruments` (sorted by pillar time, as the bootstrap takes
 * them). Cost: 2n interpolation builds, one n x n LU, rows x n^2 multiply-adds. With `trace`,
 * each row's own values for the quote `trace.column` are left there (the last row's stay).
 */
export function forwardSensitivities(
  curve: Curve,
  instruments: readonly Instrument[],
  rows: readonly ForwardRow[],
  c: Compounding,
  dc: CurveDayCount,
  trace?: SensitivityTrace,
): Result<ForwardSensitivityMap> {
  const n = instruments.length;
  const wrong = wrongQuoteCount(curve, n);
  if (wrong) return wrong;
  const extra = rows.flatMap((r) => [r.tStart, r.tEnd]);
  const { jacobian, yields, extraPartials } = quoteNodeJacobian(curve, instruments, extra);
  const lu = luFactor(jacobian, n);
  if (!lu) return fail(coreError('no-solution', 'quotes', 'the quotes do not determine the curve nodes one to one (a singular Jacobian); check for quotes that repeat the same information'));
  const inv = luInverse(lu);
  const values = new Float64Array(rows.length * n);
  const g = new Float64Array(n);
  rows.forEach((r, i) => {
    const L = curve.lnDiscountAt(r.tEnd) - (r.tStart > 0 ? curve.lnDiscountAt(r.tStart) : 0);
    const d = dRateDLn(L, c, r.tau);
    for (let j = 0; j < n; j++) g[j] = d * (extraPartials[(2 * i + 1) * n + j]! - extraPartials[2 * i * n + j]!);
    for (let j = 0; j < n; j++) {
      const gj = g[j]!;
      if (gj === 0) continue;
      for (let k = 0; k < n; k++) values[i * n + k] = values[i * n + k]! + gj * inv[j * n + k]!;
    }
    if (trace) {
      const part = (m: number): Float64Array => extraPartials.slice(m * n, m * n + n);
      trace.record = { L, dFdL: d, start: part(2 * i), end: part(2 * i + 1), g: g.slice(), inverse: Float64Array.from({ length: n }, (_, j) => inv[j * n + trace.column]!) };
    }
  });
  return ok({ rows, columns: columnsOf(instruments, yields), values, compounding: c, dayCount: dc });
}

/** Rebuilds the curve with quote k moved by dy (decimal) through its own yield. */
function rebuildBumped(settings: BootstrapSettings, instruments: readonly Instrument[], yields: readonly QuoteYield[], k: number, dy: number): Result<Curve> {
  const moved = instruments.map((ins, i) => (i === k ? requoteAtYield(ins, yields[i]!, yields[i]!.toYield(ins.market) + dy) : ins));
  const out = bootstrapInstruments(settings, moved);
  if (!out.curve) return { ok: false, errors: out.errors };
  return ok(out.curve);
}

/**
 * The same map by brute force: each quote moved by +-bumpBp through its own yield, the curve
 * rebuilt, the forwards recomputed, central difference. The check on `forwardSensitivities`.
 */
export function bumpedForwardSensitivities(
  settings: BootstrapSettings,
  instruments: readonly Instrument[],
  rows: readonly ForwardRow[],
  c: Compounding,
  bumpBp = 1,
): Result<Float64Array> {
  const n = instruments.length;
  const yields = instruments.map((ins) => quoteYieldOf(ins, settings.settlement));
  const values = new Float64Array(rows.length * n);
  const h = bumpBp * ONE_BP;
  const rate = (curve: Curve, r: ForwardRow): number =>
    rateFromLnDiscount(curve.lnDiscountAt(r.tEnd) - (r.tStart > 0 ? curve.lnDiscountAt(r.tStart) : 0), c, r.tau);
  for (let k = 0; k < n; k++) {
    const up = rebuildBumped(settings, instruments, yields, k, h);
    if (!up.ok) return up;
    const down = rebuildBumped(settings, instruments, yields, k, -h);
    if (!down.ok) return down;
    rows.forEach((r, i) => (values[i * n + k] = (rate(up.value, r) - rate(down.value, r)) / (2 * h)));
  }
  return ok(values);
}

/**
 * d(model own yield of quote i) / d(market own yield of quote k) by rebuilding the curve with
 * each quote moved by +-bumpBp; for an exact bootstrap this is the identity. Row-major n x n.
 */
export function modelQuoteJacobian(settings: BootstrapSettings, instruments: readonly Instrument[], bumpBp = 1): Result<Float64Array> {
  const n = instruments.length;
  const yields = instruments.map((ins) => quoteYieldOf(ins, settings.settlement));
  const h = bumpBp * ONE_BP;
  const out = new Float64Array(n * n);
  const model = (curve: Curve, i: number): number => yields[i]!.toYield(instruments[i]!.modelQuote(curve.lnDiscountAt));
  for (let k = 0; k < n; k++) {
    const up = rebuildBumped(settings, instruments, yields, k, h);
    if (!up.ok) return up;
    const down = rebuildBumped(settings, instruments, yields, k, -h);
    if (!down.ok) return down;
    for (let i = 0; i < n; i++) out[i * n + k] = (model(up.value, i) - model(down.value, i)) / (2 * h);
  }
  return ok(out);
}

/**
 * d(model own yield of quote i)/dx_j read directly off each quote's model-quote formula with the
 * nodes moved by +-1e-5 (monotone convex: +-1e-7 and +-5e-8, Richardson-combined) (no pricing
 * equation, no implicit function): an independent route to
 * dq/dx, so that (this) x (quoteNodeJacobian)^-1 = identity is a real check.
 */
export function modelYieldNodeJacobian(curve: Curve, instruments: readonly Instrument[]): Float64Array {
  const n = instruments.length;
  const yields = instruments.map((ins) => quoteYieldOf(ins, curve.settlement));
  const out = new Float64Array(n * n);
  const base = curve.pillars.map((p) => Math.log(p.discount));
  const linear = curve.interpolation === 'log-linear-discount' || curve.interpolation === 'linear-zero' || curve.interpolation === 'cubic-zero';
  const h = linear ? 1e-5 : 1e-7;
  const curveAt = (j: number, dx: number): Curve => {
    const pillars = curve.pillars.map((p, k) => (k === j ? { ...p, discount: Math.exp(base[k]! + dx) } : p));
    return curveFromPillarsLike(curve, pillars);
  };
  const quoteAt = (c: Curve, i: number): number => yields[i]!.toYield(instruments[i]!.modelQuote(c.lnDiscountAt));
  const central = (j: number, step: number): Float64Array => {
    const up = curveAt(j, step);
    const down = curveAt(j, -step);
    return Float64Array.from(instruments, (_, i) => (quoteAt(up, i) - quoteAt(down, i)) / (2 * step));
  };
  for (let j = 0; j < n; j++) {
    const a = central(j, h);
    const b = linear ? a : central(j, h / 2);
    for (let i = 0; i < n; i++) out[i * n + j] = linear ? a[i]! : (4 * b[i]! - a[i]!) / 3;
  }
  return out;
}

const curveFromPillarsLike = (curve: Curve, pillars: Curve['pillars']): Curve =>
  curveFromPillars(curve.settlement, curve.dayCount, curve.interpolation, curve.extrapolation, pillars);
