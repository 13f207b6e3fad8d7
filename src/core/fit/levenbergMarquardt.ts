import { solveLeastSquares } from './qrLeastSquares.ts';

/** Residuals r(x) into `out` (length m); returns false when a residual is not finite. */
export type ResidualFunction = (x: Float64Array, out: Float64Array) => boolean;

export interface LmOptions {
  /** Keeps x inside its bounds (in place), applied to every trial point. */
  readonly project?: (x: Float64Array) => void;
  readonly maxIterations?: number;
  /** Converged when a step moves every x_j by at most xTol (|x_j| + xTol). */
  readonly xTol?: number;
  /** Converged when an accepted step lowers the sum of squares by at most fTol relative. */
  readonly fTol?: number;
  /** Jacobian by forward differences (n evaluations, default) or central differences (2n). */
  readonly differences?: 'forward' | 'central';
}

export interface LmResult {
  readonly x: Float64Array;
  /** Sum of squared residuals at x. */
  readonly ssr: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly reason: 'zero-residual' | 'small-step' | 'small-decrease' | 'stationary' | 'max-iterations' | 'stalled' | 'non-finite';
  /** Largest |J^T r| relative to |J| |r| at x (0 at an exact minimum). */
  readonly relativeGradient: number;
}

const sumSq = (r: Float64Array): number => {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i]! * r[i]!;
  return s;
};

/**
 * Levenberg-Marquardt for min sum r_i(x)^2 with box constraints by projection. Each iteration
 * solves the damped Gauss-Newton step as the least-squares problem [J; sqrt(lambda) D] d = [-r; 0]
 * (QR, never the normal equations), D = the column norms of J (Marquardt's scaling); lambda
 * shrinks by 3 after an accepted step and grows by 4 after a rejected one. J by forward
 * differences with step 1e-7 x max(|x_j|, 1e-3) (relative error about 1e-7, which moves the
 * minimiser only by that fraction of the residual), or central differences with step 1e-6. K. Levenberg, Quarterly of Applied Mathematics
 * 2, 1944; D. W. Marquardt, SIAM Journal on Applied Mathematics 11, 1963; J. J. More, "The
 * Levenberg-Marquardt algorithm: implementation and theory", 1978 (cited from memory).
 */
export function levenbergMarquardt(residual: ResidualFunction, x0: ArrayLike<number>, m: number, options: LmOptions = {}): LmResult {
  const n = x0.length;
  const project = options.project ?? (() => undefined);
  const maxIterations = options.maxIterations ?? 200;
  const xTol = options.xTol ?? 1e-13;
  const fTol = options.fTol ?? 1e-16;
  const central = options.differences === 'central';
  let x = Float64Array.from(x0);
  project(x);
  let r = new Float64Array(m);
  const done = (converged: boolean, reason: LmResult['reason'], iterations: number, ssr: number, relativeGradient: number): LmResult => ({
    x,
    ssr,
    iterations,
    converged,
    reason,
    relativeGradient,
  });
  if (!residual(x, r)) return done(false, 'non-finite', 0, Number.NaN, Number.NaN);
  let ssr = sumSq(r);
  let lambda = 1e-3;
  const J = new Float64Array(m * n);
  const rp = new Float64Array(m);
  const rm = new Float64Array(m);
  const xt = new Float64Array(n);
  let relGrad = Number.NaN;
  for (let iter = 1; iter <= maxIterations; iter++) {
    if (ssr <= 1e-30) return done(true, 'zero-residual', iter - 1, ssr, 0);
    // Jacobian by finite differences.
    for (let j = 0; j < n; j++) {
      xt.set(x);
      if (central) {
        const h = 1e-6 * Math.max(Math.abs(x[j]!), 1e-3);
        xt[j] = x[j]! + h;
        const okUp = residual(xt, rp);
        xt[j] = x[j]! - h;
        const okDown = residual(xt, rm);
        if (!okUp || !okDown) return done(false, 'non-finite', iter, ssr, relGrad);
        for (let i = 0; i < m; i++) J[i * n + j] = (rp[i]! - rm[i]!) / (2 * h);
      } else {
        const h = 1e-7 * Math.max(Math.abs(x[j]!), 1e-3);
        xt[j] = x[j]! + h;
        if (!residual(xt, rp)) return done(false, 'non-finite', iter, ssr, relGrad);
        for (let i = 0; i < m; i++) J[i * n + j] = (rp[i]! - r[i]!) / h;
      }
    }
    const colNorm = new Float64Array(n);
    let jNorm = 0;
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let i = 0; i < m; i++) s += J[i * n + j]! * J[i * n + j]!;
      colNorm[j] = Math.sqrt(s);
      jNorm = Math.max(jNorm, colNorm[j]!);
    }
    let gMax = 0;
    for (let j = 0; j < n; j++) {
      let g = 0;
      for (let i = 0; i < m; i++) g += J[i * n + j]! * r[i]!;
      gMax = Math.max(gMax, Math.abs(g) / ((colNorm[j]! || 1) * Math.sqrt(ssr)));
    }
    relGrad = gMax;
    if (gMax <= 1e-12) return done(true, 'stationary', iter, ssr, relGrad);
    let accepted = false;
    while (!accepted) {
      const A = new Float64Array((m + n) * n);
      const b = new Float64Array(m + n);
      A.set(J);
      for (let i = 0; i < m; i++) b[i] = -r[i]!;
      const sl = Math.sqrt(lambda);
      for (let j = 0; j < n; j++) A[(m + j) * n + j] = sl * Math.max(colNorm[j]!, 1e-12 * (jNorm || 1));
      const d = solveLeastSquares(A, b, m + n, n);
      if (d) {
        const xn = Float64Array.from(x, (v, j) => v + d[j]!);
        project(xn);
        const rn = new Float64Array(m);
        let small = true;
        for (let j = 0; j < n; j++) if (Math.abs(xn[j]! - x[j]!) > xTol * (Math.abs(x[j]!) + xTol)) small = false;
        if (residual(xn, rn)) {
          const ssrNew = sumSq(rn);
          if (ssrNew >= ssr && small) return done(true, 'small-step', iter, ssr, relGrad);
          if (ssrNew < ssr) {
            const decrease = (ssr - ssrNew) / ssr;
            x = xn;
            r = rn;
            ssr = ssrNew;
            lambda = Math.max(lambda / 3, 1e-12);
            accepted = true;
            if (ssr <= 1e-30) return done(true, 'zero-residual', iter, ssr, 0);
            if (small) return done(true, 'small-step', iter, ssr, relGrad);
            if (decrease <= fTol) return done(true, 'small-decrease', iter, ssr, relGrad);
            continue;
          }
        }
      }
      lambda *= 4;
      if (lambda > 1e16) {
        // No step lowers the sum of squares: a minimum on the bounds or to working precision.
        return done(relGrad <= 1e-6, relGrad <= 1e-6 ? 'stationary' : 'stalled', iter, ssr, relGrad);
      }
    }
  }
  return done(false, 'max-iterations', maxIterations, ssr, relGrad);
}
