import { residualOnCurve, type Instrument } from '../instruments/instrument.ts';
import type { InterpolatorFactory } from '../interpolation/types.ts';
import { luFactor, luSolve } from '../numeric/luDecomposition.ts';
import { JOINT_NEWTON_BUMP, JOINT_NEWTON_HALVINGS, JOINT_NEWTON_ITERATIONS, NODE_TOLERANCE } from '../numeric/tolerance.ts';
import type { BootstrapNodes } from './nodeSolvers.ts';

/**
 * The global methods' fallback when a Gauss-Seidel sweep cannot go on: a damped Newton iteration
 * on all nodes not set in closed form at once, residual_k = (PV_k - target_k) / |target_k| (the target on the
 * curve for an instrument with `targetFromFlows`; its `residualFromFlows` in ln space when it has
 * one, as the node solvers take it: a TN deposit's DF difference stalls some 8e-14 off its rate), with a
 * forward-difference Jacobian (bump JOINT_NEWTON_BUMP in ln DF) and step halving until the
 * largest residual falls. One node alone may have no solution: with cubic-zero and two pillars a
 * month apart, a bond's present value is not monotone in its own node (the spline swings the
 * earlier coupons the other way), so the per-node solve fails although the joint system has a
 * root. Moves `nodes.ys`; returns true when the nodes moved by at most NODE_TOLERANCE in the last
 * step.
 */
export function jointNewton(nodes: BootstrapNodes, build: InterpolatorFactory): boolean {
  const { instruments, closedForm, ts, ys } = nodes;
  const n = instruments.length;
  const free: number[] = [];
  for (let k = 1; k <= n; k++) if (!closedForm[k - 1]) free.push(k);
  const m = free.length;
  if (m === 0) return true;
  /** Fills `out` with the residuals on the nodes as they stand; returns the largest |residual|. */
  const residuals = (out: Float64Array): number => {
    const interp = build(ts, ys);
    const ln = (t: number): number => interp.lnDiscount(t);
    let worstAbs = 0;
    for (let i = 0; i < m; i++) {
      const ins = instruments[free[i]! - 1]!;
      // A short forward span's residual in ln space (residualFromFlows), as the node solvers take
      // it: a one-day deposit's DF difference loses the digits a 1e-14 repricing needs.
      const r = ins.residualFromFlows ? lnResidual(ins, ln) : residualOnCurve(ins, ln) / Math.abs(ins.target);
      out[i] = r;
      worstAbs = Math.max(worstAbs, Number.isFinite(r) ? Math.abs(r) : Infinity);
    }
    return worstAbs;
  };
  const f0 = new Float64Array(m);
  const f1 = new Float64Array(m);
  const y0 = new Float64Array(m);
  const h = JOINT_NEWTON_BUMP;
  for (let iter = 0; iter < JOINT_NEWTON_ITERATIONS; iter++) {
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
    const lu = luFactor(jac, m);
    if (!lu) return false;
    const dx = luSolve(lu, Float64Array.from(f0, (v) => -v));
    for (let i = 0; i < m; i++) y0[i] = ys[free[i]!]!;
    let lambda = 1;
    let maxStep = 0;
    for (let tries = 0; tries < JOINT_NEWTON_HALVINGS; tries++) {
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
}

/** An instrument's `residualFromFlows` on a curve given by ln DF. */
function lnResidual(ins: Instrument, ln: (t: number) => number): number {
  const lns = ins.times.map(ln);
  return ins.residualFromFlows!(lns, lns.map(Math.exp), 0);
}
