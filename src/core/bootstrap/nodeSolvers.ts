import type { Instrument } from '../instruments/instrument.ts';
import { segmentNear, zeros, type InterpolatorFactory, type InterpolatorSpec } from '../interpolation/types.ts';
import { NODE_SETTLED_RESIDUAL } from '../numeric/tolerance.ts';
import { coreError, type CoreError } from '../result.ts';
import type { FlowTable } from './flowTable.ts';
import { solveNode } from './solve.ts';

/**
 * What the node solvers of one bootstrap share: the instruments in pillar order and the node
 * arrays they solve, node k (k = 1..n) at instruments[k - 1]'s maturity.
 */
export interface BootstrapNodes {
  readonly instruments: readonly Instrument[];
  /** closedForm[k - 1]: node k is set in closed form (one flow, at its own pillar). */
  readonly closedForm: readonly boolean[];
  /** Node times in years: ts[0] = 0, ts[k] = instruments[k - 1].t, strictly increasing. */
  readonly ts: number[];
  /** Node values, ln DF: ys[0] = 0; ys[k] is written while node k is solved. */
  readonly ys: number[];
  /** The curve at every instrument's flows (written by the segment solver only). */
  readonly flows: FlowTable;
}

/**
 * 'pass': node k is solved on the interpolation of nodes 0..k (the first, local pass);
 * 'sweep': on the interpolation of all nodes, starting from the node's current value (a
 * Gauss-Seidel sweep of a global method).
 */
export type SolveStage = 'pass' | 'sweep';

/** Solves one node: the ln DF at pillar k that reprices instrument k. */
export interface NodeSolver {
  /** True when a solve leaves node k's flows in the flow table, valued on the curve as solved. */
  readonly writesFlowTable: boolean;
  /** The node value from the first guess x0, or the reason there is none. Reads and writes ys[k]. */
  solve(k: number, x0: number): CoreError | number;
}

/**
 * The node solver of a method at a stage, chosen once per bootstrap: the method's segment
 * formula when it has one, else the affine two-build solve, else the generic one that rebuilds
 * the interpolation at every solver step. All three find the same root; they differ in how much
 * of the curve they recompute per step.
 */
export function nodeSolverFor(spec: InterpolatorSpec, stage: SolveStage, nodes: BootstrapNodes): NodeSolver {
  if (spec.segmentLn) return new SegmentSolver(nodes, spec.segmentLn, stage === 'pass' ? 1 : (spec.locality ?? nodes.instruments.length), stage);
  if (spec.affine) return new AffineSolver(nodes, spec.build, stage);
  return new RebuildSolver(nodes, spec, stage);
}

type SegmentLn = NonNullable<InterpolatorSpec['segmentLn']>;

/**
 * Solves node k with the method's segment formula (`segmentLn`, the arithmetic of its
 * `lnDiscount`), building no interpolation. On the nodes 0..m (m = k in the pass, n in a sweep)
 * flows before t_(k - locality) sit on segments that node k does not touch (locality 1 in the
 * pass, the method's own in a sweep: 2 for monotone convex), so they are summed once; each solver
 * step re-evaluates only the later flows, and a flow at the pillar itself at y_k exactly, as
 * `lnDiscount` gives there. In a sweep a node whose residual at its current value is already
 * below what a Newton step could resolve is kept as it is.
 *
 * The flow table is left holding ln DF and DF at each of node k's flows on the curve as solved.
 * Swaps (and bonds) of one schedule pay on the same dates, so a fixed flow at the very time of a
 * flow of the donor (the latest earlier instrument with the same first payment time, node j)
 * takes that flow's values from the table instead of another exp, when no node solved since can
 * have moved them: nodes j + 1.. move the curve from t_(j + 1 - locality) on, so flows before
 * that time are still exact. The same number, found by a merge walk of the two ascending time lists.
 */
class SegmentSolver implements NodeSolver {
  readonly writesFlowTable = true;
  private readonly sweep: boolean;

  constructor(
    private readonly nodes: BootstrapNodes,
    private readonly segmentLn: SegmentLn,
    private readonly locality: number,
    stage: SolveStage,
  ) {
    this.sweep = stage === 'sweep';
  }

  solve(k: number, x0: number): CoreError | number {
    const { instruments, ts, ys, flows } = this.nodes;
    const { segmentLn, locality } = this;
    const flowLn = flows.ln;
    const flowDf = flows.df;
    const m = this.sweep ? instruments.length : k;
    const ins = instruments[k - 1]!;
    const { times, amounts, target } = ins;
    const offset = flows.offset[k]!;
    if (this.nodes.closedForm[k - 1]) {
      const x = ins.closedFormLn!;
      if (!Number.isFinite(x)) return solveFailure(ins, 'non-positive-discount');
      flowLn[offset] = x;
      flowDf[offset] = Math.exp(x);
      return x;
    }
    const tFrom = ts[Math.max(k - locality, 0)]!;
    const tk = ts[k]!;
    // The donor, and the time before which its table values are still exact.
    let donor = k - 1;
    while (donor >= 1 && instruments[donor - 1]!.times[0] !== times[0]) donor--;
    const donorTimes = donor >= 1 ? instruments[donor - 1]!.times : null;
    const donorOffset = donor >= 1 ? flows.offset[donor]! : 0;
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
      segment = segmentNear(ts, m, tj, segment);
      const ln = segmentLn(ts, ys, m, segment, tj);
      const df = Math.exp(ln);
      flowLn[offset + j] = ln;
      flowDf[offset + j] = df;
      fixed += amounts[j]! * df;
    }
    const firstSegment = first < times.length ? segmentNear(ts, m, times[first]!, segment) : segment;
    const onCurve = ins.targetFromFlows !== undefined;
    const residual = onCurve ? this.residualOnCurveTarget(ins, k, m, offset, first, firstSegment, fixed) : (x: number): number => {
      ys[k] = x;
      let pv = fixed;
      let seg = firstSegment;
      for (let j = first; j < times.length; j++) {
        const tj = times[j]!;
        if (tj >= tk) {
          pv += amounts[j]! * Math.exp(x);
          continue;
        }
        seg = segmentNear(ts, m, tj, seg);
        pv += amounts[j]! * Math.exp(segmentLn(ts, ys, m, seg, tj));
      }
      return pv - target;
    };
    let x = x0;
    let f0: number | undefined;
    let settled = false;
    if (this.sweep) {
      // Settled when a Newton step from x0, with a quarter of the sensitivity of the flow at the
      // node itself (a_last DF(t_k)) as the slope, would move the node by at most NODE_TOLERANCE.
      f0 = residual(x0);
      // A target on the curve (an OIS's floating leg): 1 of notional at the node as the sensitivity.
      settled = Math.abs(f0) <= NODE_SETTLED_RESIDUAL * (onCurve ? 1 : amounts[times.length - 1]!) * Math.exp(x0);
    }
    if (!settled) {
      const outcome = solveNode(residual, x0, f0, ins.residualFromFlows !== undefined);
      if (!outcome.ok) return solveFailure(ins, outcome.reason);
      x = outcome.x;
    }
    ys[k] = x;
    let seg = firstSegment;
    for (let j = first; j < times.length; j++) {
      const tj = times[j]!;
      let ln = x;
      if (tj < tk) {
        seg = segmentNear(ts, m, tj, seg);
        ln = segmentLn(ts, ys, m, seg, tj);
      }
      flowLn[offset + j] = ln;
      flowDf[offset + j] = Math.exp(ln);
    }
    return x;
  }

  /**
   * The residual of an instrument whose target is read off the curve (`targetFromFlows`): each
   * moving flow's ln DF and DF are written to the table at every step, then the fixed flows'
   * present value less the target read from the table.
   */
  private residualOnCurveTarget(ins: Instrument, k: number, m: number, offset: number, first: number, firstSegment: number, fixed: number): (x: number) => number {
    const { ts, ys, flows } = this.nodes;
    const { segmentLn } = this;
    const { times, amounts } = ins;
    const tk = ts[k]!;
    return (x: number): number => {
      ys[k] = x;
      let pv = fixed;
      let seg = firstSegment;
      for (let j = first; j < times.length; j++) {
        const tj = times[j]!;
        let ln = x;
        if (tj < tk) {
          seg = segmentNear(ts, m, tj, seg);
          ln = segmentLn(ts, ys, m, seg, tj);
        }
        const df = Math.exp(ln);
        flows.ln[offset + j] = ln;
        flows.df[offset + j] = df;
        pv += amounts[j]! * df;
      }
      if (ins.residualFromFlows !== undefined) return ins.residualFromFlows(flows.ln, flows.df, offset);
      return pv - ins.targetFromFlows!(flows.ln, flows.df, offset);
    };
  }
}

/**
 * An instrument's residual with its target read off the curve (`targetFromFlows`), given ln DF
 * at each of its flows by `lnAt(j)`: the flows' present value less the target. `ln` and `df` are
 * scratch arrays of at least its number of flows.
 */
function residualWithCurveTarget(ins: Instrument, lnAt: (j: number) => number, ln: number[], df: number[]): number {
  const { times, amounts } = ins;
  let pv = 0;
  for (let j = 0; j < times.length; j++) {
    ln[j] = lnAt(j);
    df[j] = Math.exp(ln[j]!);
    pv += amounts[j]! * df[j]!;
  }
  if (ins.residualFromFlows !== undefined) return ins.residualFromFlows(ln, df, 0);
  return pv - ins.targetFromFlows!(ln, df, 0);
}

/**
 * Solves node k on an interpolation whose ln DF is affine in each node (spec.affine: linear-zero,
 * log-linear-discount, cubic-zero) from two builds, at x0 and x0 + 1, instead of one per solver
 * step: lnDF(t; x) = lnDF(t; x0) + (x - x0) [lnDF(t; x0 + 1) - lnDF(t; x0)] exactly in real
 * arithmetic (log-linear-discount: y_(k-1) + (y_k - y_(k-1)) w; linear-zero:
 * -t ((1 - w) z_(k-1) + w z_k) with z_k = -y_k / t_k; cubic-zero: a natural spline is linear in
 * its knot values). In the pass (nodes 0..k) flows at or before t_(k-1) do not depend on y_k and
 * are summed once. In a sweep (all nodes) the slopes depend on the knot times only, so they are
 * computed in the first sweep and kept. The final curve is rebuilt from the solved nodes and every
 * quote repriced on it, so a rounding difference could only surface as a failed acceptance check.
 */
class AffineSolver implements NodeSolver {
  readonly writesFlowTable = false;
  private readonly pass: boolean;
  // Node k's flows after t_(k-1) (all of them in a sweep): amount, ln DF at x0, slope in y_k.
  private readonly segAmount: number[];
  private readonly segLn: number[];
  private readonly segSlope: number[];
  // Sweeps only: the slopes of every node's flows (at flows.offset[k]), and which nodes have them.
  private readonly slopeCache: number[];
  private readonly slopeReady: number[];

  constructor(
    private readonly nodes: BootstrapNodes,
    private readonly build: InterpolatorFactory,
    stage: SolveStage,
  ) {
    this.pass = stage === 'pass';
    const scratch = nodes.flows.maxFlows;
    this.segAmount = zeros(scratch);
    this.segLn = zeros(scratch);
    this.segSlope = zeros(scratch);
    this.slopeCache = zeros(this.pass ? 0 : nodes.flows.size);
    this.slopeReady = zeros(this.pass ? 0 : nodes.instruments.length + 1);
  }

  solve(k: number, x0: number): CoreError | number {
    const { instruments, ts, ys, flows } = this.nodes;
    const { build, segAmount, segLn, segSlope, slopeCache, slopeReady } = this;
    const ins = instruments[k - 1]!;
    if (this.nodes.closedForm[k - 1]) return closedFormNode(ins);
    if (ins.targetFromFlows !== undefined) return this.solveCurveTarget(k, x0, ins);
    const local = this.pass;
    const nodes = local ? k + 1 : instruments.length + 1;
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
    if (!local && slopeReady[k] === 1) {
      for (let j = 0; j < count; j++) segSlope[j] = slopeCache[flows.offset[k]! + j]!;
    } else {
      ys[k] = x0 + 1;
      const b = build(ts, ys, nodes);
      for (let j = 0; j < count; j++) segSlope[j] = b.lnDiscount(times[first + j]!) - segLn[j]!;
      ys[k] = x0;
      if (!local) {
        for (let j = 0; j < count; j++) slopeCache[flows.offset[k]! + j] = segSlope[j]!;
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
  }

  /**
   * Node k of an instrument with a target on the curve (`targetFromFlows`): ln DF at every flow
   * affine in y_k from two builds, as above (no fixed part or slope cache: every flow is read).
   */
  private solveCurveTarget(k: number, x0: number, ins: Instrument): CoreError | number {
    const { instruments, ts, ys } = this.nodes;
    const nodes = this.pass ? k + 1 : instruments.length + 1;
    const { times } = ins;
    const n = times.length;
    ys[k] = x0;
    const a = this.build(ts, ys, nodes);
    const lnA = new Array<number>(n);
    for (let j = 0; j < n; j++) lnA[j] = a.lnDiscount(times[j]!);
    ys[k] = x0 + 1;
    const b = this.build(ts, ys, nodes);
    const slope = new Array<number>(n);
    for (let j = 0; j < n; j++) slope[j] = b.lnDiscount(times[j]!) - lnA[j]!;
    ys[k] = x0;
    const ln = new Array<number>(n);
    const df = new Array<number>(n);
    const outcome = solveNode((x) => residualWithCurveTarget(ins, (j) => lnA[j]! + slope[j]! * (x - x0), ln, df), x0, undefined, ins.residualFromFlows !== undefined);
    if (!outcome.ok) return solveFailure(ins, outcome.reason);
    return outcome.x;
  }
}

/**
 * Solves node k by building the interpolation at every solver step: the solve any method gets
 * without a segment formula or the affine property. In a sweep, with a locality, the flows at or
 * before t_(k - locality) do not move with node k and are summed once; a node already settled at
 * its current value is kept (as in the segment solver, with the flow at the node itself as the
 * sensitivity).
 */
class RebuildSolver implements NodeSolver {
  readonly writesFlowTable = false;
  private readonly sweep: boolean;

  constructor(
    private readonly nodes: BootstrapNodes,
    private readonly spec: InterpolatorSpec,
    stage: SolveStage,
  ) {
    this.sweep = stage === 'sweep';
  }

  solve(k: number, x0: number): CoreError | number {
    const { instruments, ts, ys } = this.nodes;
    const { build, locality } = this.spec;
    const ins = instruments[k - 1]!;
    if (this.nodes.closedForm[k - 1]) return closedFormNode(ins);
    const nodes = this.sweep ? instruments.length + 1 : k + 1;
    if (ins.targetFromFlows !== undefined) {
      // A target on the curve (an OIS's floating leg): every flow read at each step.
      const scratchLn = new Array<number>(ins.times.length);
      const scratchDf = new Array<number>(ins.times.length);
      const residualAt = (x: number): number => {
        ys[k] = x;
        const interp = build(ts, ys, nodes);
        return residualWithCurveTarget(ins, (j) => interp.lnDiscount(ins.times[j]!), scratchLn, scratchDf);
      };
      let fStart: number | undefined;
      if (this.sweep) {
        fStart = residualAt(x0);
        if (Math.abs(fStart) <= NODE_SETTLED_RESIDUAL * Math.exp(x0)) return x0;
      }
      const out = solveNode(residualAt, x0, fStart, ins.residualFromFlows !== undefined);
      if (!out.ok) return solveFailure(ins, out.reason);
      return out.x;
    }
    const { times, amounts } = ins;
    let fixed = 0;
    let first = 0;
    let f0: number | undefined;
    if (this.sweep) {
      // One build at x0 gives the residual there and the fixed part.
      const tFixed = locality !== undefined && k - locality >= 1 ? ts[k - locality]! : -Infinity;
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
      f0 = fixed + moving - ins.target;
      if (Math.abs(f0) <= NODE_SETTLED_RESIDUAL * lastPv) return x0;
    }
    const outcome = solveNode(
      (x) => {
        ys[k] = x;
        const interp = build(ts, ys, nodes);
        let pv = fixed;
        for (let j = first; j < times.length; j++) pv += amounts[j]! * Math.exp(interp.lnDiscount(times[j]!));
        return pv - ins.target;
      },
      x0,
      f0,
    );
    if (!outcome.ok) return solveFailure(ins, outcome.reason);
    return outcome.x;
  }
}

/** A single-flow instrument at its own pillar: the node is its closed-form ln DF. */
function closedFormNode(ins: Instrument): CoreError | number {
  const x = ins.closedFormLn!;
  if (!Number.isFinite(x)) return solveFailure(ins, 'non-positive-discount');
  return x;
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
