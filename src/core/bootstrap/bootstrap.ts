import { curveFromNodes, type Curve, type Extrapolation, type Pillar } from '../curve/curve.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import { segmentNear, zeros, type InterpolationId, type InterpolatorSpec } from '../interpolation/types.ts';
import { presentValue, type Instrument, type QuoteUnit } from '../instruments/instrument.ts';
import { MAX_SWEEPS, NODE_TOLERANCE, PRICE_ACCEPTANCE, RATE_ACCEPTANCE } from '../numeric/tolerance.ts';
import { coreError, type CoreError, type CoreWarning } from '../result.ts';
import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import { solveNode } from './solve.ts';
import { formatRate } from '../format/quantities.ts';
import { rateTag } from '../format/conventionTag.ts';
import { solveLinear } from '../numeric/linearSolve.ts';

// Performance: a module-local binding (see interpolation/types.ts, "hot paths").
const huntSegment = segmentNear;

/** How one quote came back on the built curve. */
export interface Repricing {
  readonly index: number;
  readonly kind: Instrument['kind'];
  readonly maturity: IsoDate;
  readonly t: number;
  readonly unit: QuoteUnit;
  readonly field: string;
  readonly market: number;
  readonly model: number;
  /** Model quote minus market quote, in `unit`. */
  readonly repricingError: number;
}

export interface BootstrapOutcome {
  readonly curve: Curve | null;
  readonly errors: readonly CoreError[];
  readonly warnings: readonly CoreWarning[];
  /** One entry per instrument, in the order given. Empty when the bootstrap failed. */
  readonly repricing: readonly Repricing[];
  /** Gauss-Seidel sweeps used (0 for local methods). */
  readonly sweeps: number;
}

export interface BootstrapSettings {
  readonly settlement: IsoDate;
  readonly dayCount: CurveDayCount;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
}

export const acceptanceBound = (unit: QuoteUnit): number => (unit === 'price' ? PRICE_ACCEPTANCE : RATE_ACCEPTANCE);

/**
 * Bootstraps a curve through instruments that are already sorted by pillar time, strictly
 * increasing (duplicates are refused before this). Each instrument sets the node at its maturity.
 *
 * Local methods (log-linear-discount, linear-zero): one pass, node k solved with nodes 0..k.
 * Global methods (cubic-zero, monotone-convex[-positive]): start from a log-linear pass, then
 * Gauss-Seidel sweeps re-solving every pillar on the full curve until the largest node change is
 * at most NODE_TOLERANCE and every quote reprices within its acceptance bound, at most MAX_SWEEPS.
 * Single-flow instruments at their own pillar (deposits, bills, zeros) are set in closed form.
 */
export function bootstrapInstruments(settings: BootstrapSettings, instruments: readonly Instrument[]): BootstrapOutcome {
  const n = instruments.length;
  const spec = INTERPOLATORS[settings.interpolation];
  // Performance: plain arrays of doubles throughout, not typed arrays: a typed array above 64
  // bytes gets a backing store outside the JavaScript heap, which costs far more to allocate and
  // to collect than the arithmetic of a log-linear rebuild (measured in Node 20).
  const ts = zeros(n + 1);
  const ys = zeros(n + 1);
  for (let k = 0; k < n; k++) ts[k + 1] = instruments[k]!.t;
  const closedForm = instruments.map((ins) => ins.closedFormLn !== null && ins.times.length === 1 && ins.times[0] === ins.t);

  /** Solves node k with the interpolation built on nodes 0..m (m = k for local, n for global). */
  const solveAt = (k: number, m: number, build: typeof spec.build, x0: number): CoreError | number => {
    const ins = instruments[k - 1]!;
    if (closedForm[k - 1]) {
      const x = ins.closedFormLn!;
      if (!Number.isFinite(x)) return solveFailure(ins, 'non-positive-discount');
      return x;
    }
    const nodes = m + 1; // nodes 0..m (performance: no subarray view per solve)
    const { times, amounts } = ins;
    // Performance: with a locality (monotone convex on the full curve) the flows at or before
    // t_(k - locality) do not move with node k: they are summed once, not at every solver step.
    let fixed = 0;
    let first = 0;
    let f0: number | undefined;
    if (m === n) {
      // A sweep: x0 is the node's current value. One build at x0 gives the residual there, the
      // fixed part (with a locality) and the sensitivity of the flow at the node itself,
      // a_last DF(t_k), a lower bound on dPV/dy_k in normal markets.
      const tFixed = spec.locality !== undefined && k - spec.locality >= 1 ? ts[k - spec.locality]! : -Infinity;
      ys[k] = x0;
      const interp = build(ts, ys, nodes);
      let moving = 0;
      for (let j = 0; j < times.length; j++) {
        const pv = amounts[j]! * Math.exp(interp.lnDiscount(times[j]!));
        if (times[j]! <= tFixed) {
          fixed += pv;
          first = j + 1;
        } else {
          moving += pv;
        }
      }
      const lastPv = amounts[times.length - 1]! * Math.exp(interp.lnDiscount(times[times.length - 1]!));
      // Performance: in the later sweeps most nodes are already solved; when a Newton step from
      // x0 (with a quarter of that sensitivity as the slope) would move the node by at most
      // NODE_TOLERANCE, x0 is the solution and no further build is needed.
      f0 = fixed + moving - ins.target;
      if (Math.abs(f0) <= 0.25 * NODE_TOLERANCE * lastPv) return x0;
    }
    const outcome = solveNode((x) => {
      ys[k] = x;
      const interp = build(ts, ys, nodes);
      let pv = fixed;
      for (let j = first; j < times.length; j++) pv += amounts[j]! * Math.exp(interp.lnDiscount(times[j]!));
      return pv - ins.target;
    }, x0, f0);
    if (!outcome.ok) return solveFailure(ins, outcome.reason);
    return outcome.x;
  };

  const localSpec = spec.global ? INTERPOLATORS['log-linear-discount'] : spec;
  // flowOffset[k]: where node k's flows start in a table of every instrument's flows.
  const flowOffset = zeros(n + 1);
  let totalFlows = 0;
  let maxFlows = 0;
  for (let k = 1; k <= n; k++) {
    const count = instruments[k - 1]!.times.length;
    flowOffset[k] = totalFlows;
    totalFlows += count;
    maxFlows = Math.max(maxFlows, count);
  }
  // The curve at every instrument's flow times (ln DF and DF; node k's from flowOffset[k]), read
  // by Instrument.quoteFromFlows.
  const flowLn = zeros(totalFlows);
  const flowDf = zeros(totalFlows);
  // Scratch space of solveAffineAt: the flows of one instrument that fall in its own last segment
  // (performance: allocated only when that solver runs).
  const affineScratch = spec.affine === true && (spec.global || !localSpec.segmentLn) ? maxFlows : 0;
  const segAmount = zeros(affineScratch);
  const segLn = zeros(affineScratch);
  const segSlope = zeros(affineScratch);
  // Slopes of ln DF in each node for that node's own flows, kept across the cubic-zero sweeps.
  const slopeCache = zeros(spec.global && spec.affine ? totalFlows : 0);
  const slopeReady = zeros(spec.global && spec.affine ? n + 1 : 0);

  /**
   * Solves node k on an interpolation built on nodes 0..m whose ln DF is affine in each node
   * (spec.affine: linear-zero, log-linear-discount, cubic-zero). Performance: instead of
   * rebuilding the interpolation for every solver evaluation, it is built twice, at x0 and x0 + 1:
   * lnDF(t; x) = lnDF(t; x0) + (x - x0) [lnDF(t; x0 + 1) - lnDF(t; x0)] exactly in real arithmetic
   * (log-linear-discount: y_(k-1) + (y_k - y_(k-1)) w; linear-zero: -t ((1 - w) z_(k-1) + w z_k)
   * with z_k = -y_k / t_k; cubic-zero: a natural spline is linear in its knot values). With
   * `local` (nodes 0..k of a local method) flows at or before t_(k-1) do not depend on y_k at all
   * and are summed once. The final curve is rebuilt from the solved nodes and every quote is
   * repriced on it, so a rounding difference could only surface as a failed acceptance check.
   */
  const solveAffineAt = (k: number, m: number, build: typeof spec.build, x0: number, local: boolean): CoreError | number => {
    const ins = instruments[k - 1]!;
    if (closedForm[k - 1]) return solveAt(k, m, build, x0);
    const nodes = m + 1; // nodes 0..m (performance: no subarray view per solve)
    const tPrev = local ? ts[k - 1]! : -Infinity;
    const { times, amounts } = ins;
    // Every value at x0 is read before the node moves to x0 + 1: an interpolation may read the
    // node arrays by reference.
    ys[k] = x0;
    const a = build(ts, ys, nodes);
    let fixed = 0;
    let count = 0;
    let first = times.length; // index of the first flow after t_(k-1); flows are in time order
    for (let j = 0; j < times.length; j++) {
      const tj = times[j]!;
      const lnA = a.lnDiscount(tj);
      if (tj <= tPrev) {
        fixed += amounts[j]! * Math.exp(lnA);
      } else {
        if (count === 0) first = j;
        segAmount[count] = amounts[j]!;
        segLn[count] = lnA;
        count++;
      }
    }
    // On the full curve (local = false) the slopes depend on the knot times only, not on the node
    // values, so they are computed in the first sweep and kept for the later ones.
    const cached = !local && slopeReady[k] === 1;
    if (cached) {
      for (let j = 0; j < count; j++) segSlope[j] = slopeCache[flowOffset[k]! + j]!;
    } else {
      ys[k] = x0 + 1;
      const b = build(ts, ys, nodes);
      for (let j = 0; j < count; j++) segSlope[j] = b.lnDiscount(times[first + j]!) - segLn[j]!;
      ys[k] = x0;
      if (!local) {
        for (let j = 0; j < count; j++) slopeCache[flowOffset[k]! + j] = segSlope[j]!;
        slopeReady[k] = 1;
      }
    }
    const outcome = solveNode((x) => {
      const dx = x - x0;
      let pv = fixed;
      for (let j = 0; j < count; j++) pv += segAmount[j]! * Math.exp(segLn[j]! + segSlope[j]! * dx);
      return pv - ins.target;
    }, x0);
    if (!outcome.ok) return solveFailure(ins, outcome.reason);
    return outcome.x;
  };

  // Pass 1: local bootstrap (log-linear for the global methods' starting point). With a local
  // method's segment formula, solveBySegments leaves the curve's values at node k's flows in flowLn
  // and flowDf; no later node moves them, so after the pass the table is the finished curve's.
  for (let k = 1; k <= n; k++) {
    const x0 = guess(instruments, ts, ys, k);
    const x = localSpec.segmentLn
      ? solveBySegments(instruments, closedForm[k - 1]!, ts, ys, k, k, localSpec.segmentLn, 1, false, x0, flowLn, flowDf, flowOffset)
      : localSpec.affine
        ? solveAffineAt(k, k, localSpec.build, x0, true)
        : solveAt(k, k, localSpec.build, x0);
    if (typeof x !== 'number') return failed([x]);
    ys[k] = x;
  }

  /**
   * Fallback for the global methods when Gauss-Seidel cannot go on: a damped Newton iteration on
   * all nodes not set in closed form at once, residual_k = (PV_k - target_k) / target_k, with a
   * forward-difference Jacobian and step halving until the largest residual falls. Needed because
   * one node alone may have no solution: with cubic-zero and two pillars a month apart, a bond's
   * present value is not monotone in its own node (the spline swings the earlier coupons the other
   * way), so the per-node solve fails although the joint system has a root. Returns true when
   * the nodes moved by at most NODE_TOLERANCE in the last step.
   */
  const jointNewton = (): boolean => {
    const free: number[] = [];
    for (let k = 1; k <= n; k++) if (!closedForm[k - 1]) free.push(k);
    const m = free.length;
    if (m === 0) return true;
    const residuals = (out: Float64Array): number => {
      const interp = spec.build(ts, ys);
      const ln = (t: number): number => interp.lnDiscount(t);
      let worstAbs = 0;
      for (let i = 0; i < m; i++) {
        const ins = instruments[free[i]! - 1]!;
        const r = (presentValue(ins, ln) - ins.target) / Math.abs(ins.target);
        out[i] = r;
        worstAbs = Math.max(worstAbs, Number.isFinite(r) ? Math.abs(r) : Infinity);
      }
      return worstAbs;
    };
    const f0 = new Float64Array(m);
    const f1 = new Float64Array(m);
    const y0 = new Float64Array(m);
    const h = 1e-7;
    for (let iter = 0; iter < 60; iter++) {
      const norm0 = residuals(f0);
      if (!Number.isFinite(norm0)) return false;
      const jac = new Float64Array(m * m);
      for (let c = 0; c < m; c++) {
        const k = free[c]!;
        const keep = ys[k]!;
        ys[k] = keep + h;
        residuals(f1);
        ys[k] = keep;
        for (let r = 0; r < m; r++) jac[r * m + c] = (f1[r]! - f0[r]!) / h;
      }
      const rhs = Float64Array.from(f0, (v) => -v);
      const dx = solveLinear(jac, rhs, m);
      if (!dx) return false;
      for (let i = 0; i < m; i++) y0[i] = ys[free[i]!]!;
      let lambda = 1;
      let maxStep = 0;
      for (let tries = 0; tries < 40; tries++) {
        maxStep = 0;
        for (let i = 0; i < m; i++) {
          ys[free[i]!] = y0[i]! + lambda * dx[i]!;
          maxStep = Math.max(maxStep, Math.abs(lambda * dx[i]!));
        }
        const norm = residuals(f1);
        if (Number.isFinite(norm) && (norm < norm0 || maxStep <= NODE_TOLERANCE)) break;
        lambda *= 0.5;
      }
      if (maxStep <= NODE_TOLERANCE) return true;
    }
    return false;
  };

  let sweeps = 0;
  // A global method's repricing on its final nodes, found when the sweeps stop.
  let sweepRows: Repricing[] | null = null;
  if (spec.global) {
    let converged = false;
    let sweepFailure: CoreError | null = null;
    // The repricing on the nodes as they stand, when every quote passes (else null). `exact`:
    // the flow table already holds the curve's values (a sweep that moved no node, so every value
    // it recorded was taken on the final nodes), so the curve is not read again.
    const accepted = (exact: boolean): Repricing[] | null => {
      let rows: Repricing[];
      if (exact) rows = repricingRows(instruments, modelsFromTable(instruments, flowLn, flowDf, flowOffset));
      else {
        const interp = spec.build(ts, ys);
        rows = reprice(instruments, (t) => interp.lnDiscount(t), flowLn, flowDf, flowOffset);
      }
      const w = worst(rows);
      return !w || w.ratio <= 1 ? rows : null;
    };
    sweepsLoop: while (sweeps < MAX_SWEEPS) {
      sweeps++;
      let maxChange = 0;
      let moved = false;
      for (let k = 1; k <= n; k++) {
        if (closedForm[k - 1]) continue;
        const before = ys[k]!;
        const x = spec.segmentLn
          ? solveBySegments(instruments, false, ts, ys, k, n, spec.segmentLn, spec.locality ?? n, true, before, flowLn, flowDf, flowOffset)
          : spec.affine
            ? solveAffineAt(k, n, spec.build, before, false)
            : solveAt(k, n, spec.build, before);
        if (typeof x !== 'number') {
          sweepFailure = x; // one node alone has no solution: try all nodes at once below
          ys[k] = before;
          break sweepsLoop;
        }
        ys[k] = x;
        if (x !== before) moved = true;
        maxChange = Math.max(maxChange, Math.abs(Math.expm1(x - before)));
      }
      // Fix: the sweeps used to stall at a node change of a few ulps above NODE_TOLERANCE (seen:
      // 1.11e-15 on every sweep for cubic-zero on an ordinary 40-quote market), because each node
      // solve itself stops within NODE_TOLERANCE of its root, so successive sweeps move a node by
      // rounding noise; they then ran all MAX_SWEEPS and ended in not-converged. A change within
      // the rounding floor of ln DF (8 ulps of the largest |ln DF|) now counts as no change.
      let largest = 1;
      for (let k = 1; k <= n; k++) largest = Math.max(largest, Math.abs(ys[k]!));
      const floor = NODE_TOLERANCE + 8 * Number.EPSILON * largest;
      if (maxChange <= floor) {
        sweepRows = accepted(spec.segmentLn !== undefined && !moved);
        if (sweepRows) {
          converged = true;
          break;
        }
      }
    }
    if (!converged && jointNewton()) {
      sweepRows = accepted(false);
      converged = sweepRows !== null;
    }
    if (!converged && sweepFailure) return failed([sweepFailure]);
    if (!converged) {
      const interp = spec.build(ts, ys);
      const w = worst(reprice(instruments, (t) => interp.lnDiscount(t), flowLn, flowDf, flowOffset))!;
      return failed([
        coreError(
          'not-converged',
          `quotes[${w.row.index}].${w.row.field}`,
          `${settings.interpolation}: no consistent curve after ${MAX_SWEEPS} sweeps; the worst quote is quotes[${w.row.index}] (${w.row.kind} ${w.row.maturity}), off by ${w.row.repricingError} in ${w.row.unit}; try log-linear-discount or check the quotes`,
          w.row.index,
        ),
      ]);
    }
  }

  const interp = spec.build(ts, ys);
  const pillars: Pillar[] = instruments.map((ins, k) => ({ date: ins.maturity, t: ins.t, discount: Math.exp(ys[k + 1]!), quote: ins.index }));
  const curve = curveFromNodes(settings.settlement, settings.dayCount, settings.interpolation, settings.extrapolation, pillars, interp);
  // A local method's pass left the curve's own values at every flow in the table, and a global
  // method's sweeps repriced on the final nodes (bit for bit what curve.lnDiscountAt gives there:
  // the same segment formula on the same nodes, y_k exactly at a pillar; a test checks it).
  const tableIsCurve = !spec.global && localSpec.segmentLn !== undefined;
  const repricing =
    sweepRows ?? (tableIsCurve ? repricingRows(instruments, modelsFromTable(instruments, flowLn, flowDf, flowOffset)) : reprice(instruments, curve.lnDiscountAt, flowLn, flowDf, flowOffset));
  const w = worst(repricing);
  if (w && w.ratio > 1) {
    return failed([
      coreError(
        'no-solution',
        `quotes[${w.row.index}].${w.row.field}`,
        `quotes[${w.row.index}] (${w.row.kind} ${w.row.maturity}) reprices off by ${w.row.repricingError} in ${w.row.unit}, beyond the acceptance bound ${acceptanceBound(w.row.unit)}`,
        w.row.index,
      ),
    ]);
  }

  const warnings: CoreWarning[] = [];
  const errors: CoreError[] = [];
  for (let k = 1; k <= n; k++) {
    const d = -(ys[k]! - ys[k - 1]!) / (ts[k]! - ts[k - 1]!);
    if (d >= 0) continue;
    const ins = instruments[k - 1]!;
    const from = k === 1 ? settings.settlement : instruments[k - 2]!.maturity;
    const what = `the forward from ${from} to ${ins.maturity} is ${formatRate(d, rateTag('continuous', settings.dayCount))}`;
    if (settings.interpolation === 'monotone-convex-positive') {
      errors.push(
        coreError('no-solution', `quotes[${ins.index}]`, `quotes[${ins.index}] (${ins.kind} ${ins.maturity}): monotone-convex-positive needs positive forwards, but ${what}; use monotone-convex for a market with negative forwards`, ins.index),
      );
    } else {
      warnings.push({ path: `quotes[${ins.index}]`, quote: ins.index, code: 'negative-forward', message: `negative forward: ${what}` });
    }
  }
  if (errors.length > 0) return failed(errors);
  return { curve, errors: [], warnings, repricing, sweeps };
}

// Performance: helpers of bootstrapInstruments at module level, not closures made per call (the
// command-line runner's transform adds a name-setting call to every closure created).

type SegmentLn = NonNullable<InterpolatorSpec['segmentLn']>;

/**
 * Solves node k on the interpolation over nodes 0..m with the method's segment formula
 * (`segmentLn`, the arithmetic of its `lnDiscount`), building no interpolation per solver step:
 * m = k in the one pass of a local method, m = n in a sweep of a global one. Flows before
 * t_(k - locality) sit on segments that node k does not touch (locality 1 for a local method,
 * 2 for monotone convex), so they are summed once; each solver step re-evaluates only the later
 * flows, and a flow at the pillar itself at y_k exactly, as `lnDiscount` gives there. In a
 * `sweep` a node whose residual at its current value x0 is already below what a Newton step
 * could resolve is returned as it is, without solving.
 *
 * The flow table from flowOffset[k] is left holding ln DF and DF at each of the instrument's flows
 * on the curve as solved. Performance: swaps (and bonds) of one schedule pay on the same dates, so
 * a fixed flow at the very time of a flow of the donor (the latest earlier instrument with the
 * same first payment time, node j) takes that flow's values from the table instead of another
 * exp, when no node solved since then can have moved them: nodes j + 1.. move the curve from
 * t_(j + 1 - locality) on, so flows before that time are still exact. The same number, found by a
 * merge walk of the two ascending time lists.
 */
function solveBySegments(
  instruments: readonly Instrument[],
  closedForm: boolean,
  ts: number[],
  ys: number[],
  k: number,
  m: number,
  segmentLn: SegmentLn,
  locality: number,
  sweep: boolean,
  x0: number,
  flowLn: number[],
  flowDf: number[],
  flowOffset: readonly number[],
): CoreError | number {
  const ins = instruments[k - 1]!;
  const { times, amounts, target } = ins;
  const offset = flowOffset[k]!;
  if (closedForm) {
    const x = ins.closedFormLn!;
    if (!Number.isFinite(x)) return solveFailure(ins, 'non-positive-discount');
    flowLn[offset] = x;
    flowDf[offset] = Math.exp(x);
    return x;
  }
  const tFrom = ts[Math.max(k - locality, 0)]!;
  const tk = ts[k]!;
  // The donor: the latest earlier instrument whose first flow is at the same time, and the time
  // before which its table values are still exact.
  let donor = k - 1;
  while (donor >= 1 && instruments[donor - 1]!.times[0] !== times[0]) donor--;
  const donorTimes = donor >= 1 ? instruments[donor - 1]!.times : null;
  const donorOffset = donor >= 1 ? flowOffset[donor]! : 0;
  const donorValidBefore = donor >= 1 ? ts[Math.max(donor + 1 - locality, 0)]! : 0;
  let d = 0;
  let fixed = 0;
  let first = times.length;
  let segment = 1;
  for (let j = 0; j < times.length; j++) {
    const tj = times[j]!;
    if (tj >= tFrom) {
      first = j;
      break;
    }
    if (donorTimes !== null && tj < donorValidBefore) {
      while (d < donorTimes.length && donorTimes[d]! < tj) d++;
      if (d < donorTimes.length && donorTimes[d] === tj) {
        flowLn[offset + j] = flowLn[donorOffset + d]!;
        const df = flowDf[donorOffset + d]!;
        flowDf[offset + j] = df;
        fixed += amounts[j]! * df;
        continue;
      }
    }
    segment = huntSegment(ts, m, tj, segment);
    const ln = segmentLn(ts, ys, m, segment, tj);
    const df = Math.exp(ln);
    flowLn[offset + j] = ln;
    flowDf[offset + j] = df;
    fixed += amounts[j]! * df;
  }
  const firstSegment = first < times.length ? huntSegment(ts, m, times[first]!, segment) : segment;
  const residual = (x: number): number => {
    ys[k] = x;
    let pv = fixed;
    let seg = firstSegment;
    for (let j = first; j < times.length; j++) {
      const tj = times[j]!;
      if (tj >= tk) {
        pv += amounts[j]! * Math.exp(x);
        continue;
      }
      seg = huntSegment(ts, m, tj, seg);
      pv += amounts[j]! * Math.exp(segmentLn(ts, ys, m, seg, tj));
    }
    return pv - target;
  };
  let x = x0;
  let f0: number | undefined;
  let solved = false;
  if (sweep) {
    // When a Newton step from x0 (with a quarter of the sensitivity of the flow at the node
    // itself, a_last DF(t_k), as the slope) would move the node by at most NODE_TOLERANCE, x0 is
    // the solution.
    f0 = residual(x0);
    solved = Math.abs(f0) <= 0.25 * NODE_TOLERANCE * amounts[times.length - 1]! * Math.exp(x0);
  }
  if (!solved) {
    const outcome = solveNode(residual, x0, f0);
    if (!outcome.ok) return solveFailure(ins, outcome.reason);
    x = outcome.x;
  }
  ys[k] = x;
  let seg = firstSegment;
  for (let j = first; j < times.length; j++) {
    const tj = times[j]!;
    let ln = x;
    if (tj < tk) {
      seg = huntSegment(ts, m, tj, seg);
      ln = segmentLn(ts, ys, m, seg, tj);
    }
    flowLn[offset + j] = ln;
    flowDf[offset + j] = Math.exp(ln);
  }
  return x;
}

function failed(errors: CoreError[]): BootstrapOutcome {
  return { curve: null, errors, warnings: [], repricing: [], sweeps: 0 };
}

function solveFailure(ins: Instrument, reason: 'non-positive-discount' | 'no-solution'): CoreError {
  return coreError(
    reason,
    `quotes[${ins.index}].${ins.field}`,
    reason === 'non-positive-discount'
      ? `quotes[${ins.index}] (${ins.kind} ${ins.maturity}): ${ins.field} ${ins.market} implies a discount factor <= 0 at ${ins.maturity}; check the quote's value and unit`
      : `quotes[${ins.index}] (${ins.kind} ${ins.maturity}): no discount factor at ${ins.maturity} reprices ${ins.field} ${ins.market}; check the quote`,
    ins.index,
  );
}

/** Starting value of node k: the previous segment's discrete forward carried on (3% at first). */
function guess(instruments: readonly Instrument[], ts: readonly number[], ys: readonly number[], k: number): number {
  if (k === 1) {
    const ins = instruments[0]!;
    const rate = ins.unit === 'rate' ? ins.market : 0.03;
    return -rate * ins.t;
  }
  const fwd = k >= 2 && ts[k - 1]! > ts[k - 2]! ? -(ys[k - 1]! - ys[k - 2]!) / (ts[k - 1]! - ts[k - 2]!) : 0.03;
  return ys[k - 1]! - fwd * (ts[k]! - ts[k - 1]!);
}

/** Every quote's model quote on a curve: the flow table filled from the curve, then read. */
function reprice(instruments: readonly Instrument[], lnDiscountAt: (t: number) => number, flowLn: number[], flowDf: number[], flowOffset: readonly number[]): Repricing[] {
  for (let i = 0; i < instruments.length; i++) {
    const { times } = instruments[i]!;
    const offset = flowOffset[i + 1]!;
    for (let j = 0; j < times.length; j++) {
      const ln = lnDiscountAt(times[j]!);
      flowLn[offset + j] = ln;
      flowDf[offset + j] = Math.exp(ln);
    }
  }
  return repricingRows(instruments, modelsFromTable(instruments, flowLn, flowDf, flowOffset));
}

/** Every quote's model quote from the flow table (Instrument.quoteFromFlows). */
function modelsFromTable(instruments: readonly Instrument[], flowLn: readonly number[], flowDf: readonly number[], flowOffset: readonly number[]): number[] {
  const models = new Array<number>(instruments.length);
  for (let i = 0; i < instruments.length; i++) models[i] = instruments[i]!.quoteFromFlows(flowLn, flowDf, flowOffset[i + 1]!);
  return models;
}

/** The repricing rows of instruments given their model quotes. */
function repricingRows(instruments: readonly Instrument[], models: readonly number[]): Repricing[] {
  const rows = new Array<Repricing>(instruments.length);
  for (let i = 0; i < instruments.length; i++) {
    const ins = instruments[i]!;
    const model = models[i]!;
    rows[i] = {
      index: ins.index,
      kind: ins.kind,
      maturity: ins.maturity,
      t: ins.t,
      unit: ins.unit,
      field: ins.field,
      market: ins.market,
      model,
      repricingError: model - ins.market,
    };
  }
  return rows;
}

/** The row with the largest repricing error relative to its acceptance bound (the first on ties). */
function worst(rows: Repricing[]): { row: Repricing; ratio: number } | null {
  let best: Repricing | null = null;
  let bestRatio = 0;
  for (const row of rows) {
    const ratio = Number.isFinite(row.repricingError) ? Math.abs(row.repricingError) / acceptanceBound(row.unit) : Infinity;
    if (best === null || ratio > bestRatio) {
      best = row;
      bestRatio = ratio;
    }
  }
  return best === null ? null : { row: best, ratio: bestRatio };
}
