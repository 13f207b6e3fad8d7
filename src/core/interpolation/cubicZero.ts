import { copyNodes, segmentIndex, zeros, type Interpolation } from './types.ts';

/**
 * z and z' at x on segment i, written into `out`: with h = t_i - t_(i-1), a = (t_i - x)/h,
 * b = (x - t_(i-1))/h, z = a z_(i-1) + b z_i + ((a^3 - a) M_(i-1) + (b^3 - b) M_i) h^2 / 6.
 */
function splineAt(t: readonly number[], z: readonly number[], M: readonly number[], x: number, i: number, out: [number, number]): [number, number] {
  const h = t[i]! - t[i - 1]!;
  const a = (t[i]! - x) / h;
  const b = 1 - a;
  out[0] = a * z[i - 1]! + b * z[i]! + ((a * a * a - a) * M[i - 1]! + (b * b * b - b) * M[i]!) * (h * h) / 6;
  out[1] = (z[i]! - z[i - 1]!) / h + (-(3 * a * a - 1) * M[i - 1]! + (3 * b * b - 1) * M[i]!) * h / 6;
  return out;
}

/**
 * `cubic-zero`: a natural cubic spline (second derivative zero at both ends) through the
 * continuously compounded zero rates, knots at t = 0 and every pillar, with z(0) := z(t_1).
 * f(t) = z(t) + t z'(t). Spline by the standard tridiagonal system for the knot second
 * derivatives (e.g. Burden and Faires, "Numerical Analysis", natural cubic spline algorithm;
 * cited from memory).
 */
export function interpolatorCubicZero(ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number): Interpolation {
  const n = (count ?? ts.length) - 1;
  const t = copyNodes(ts, n + 1);
  const z = zeros(n + 1);
  for (let i = 1; i <= n; i++) z[i] = -lnDfs[i]! / t[i]!;
  z[0] = z[1]!;
  // Second derivatives M_0 = M_n = 0; Thomas algorithm on the interior equations
  // h_(i-1) M_(i-1) + 2 (h_(i-1) + h_i) M_i + h_i M_(i+1) = 6 [(z_(i+1)-z_i)/h_i - (z_i-z_(i-1))/h_(i-1)].
  const M = zeros(n + 1);
  if (n >= 2) {
    const c = zeros(n + 1);
    const d = zeros(n + 1);
    for (let i = 1; i < n; i++) {
      const h0 = t[i]! - t[i - 1]!;
      const h1 = t[i + 1]! - t[i]!;
      const rhs = 6 * ((z[i + 1]! - z[i]!) / h1 - (z[i]! - z[i - 1]!) / h0);
      const diag = 2 * (h0 + h1) - (i > 1 ? h0 * c[i - 1]! : 0);
      c[i] = h1 / diag;
      d[i] = (rhs - (i > 1 ? h0 * d[i - 1]! : 0)) / diag;
    }
    for (let i = n - 1; i >= 1; i--) M[i] = d[i]! - c[i]! * M[i + 1]!;
  }
  // A reused pair: no array is allocated per evaluation; callers read it at once.
  const pair: [number, number] = [0, 0];
  return {
    lnDiscount(x) {
      if (x >= t[n]!) {
        const p = splineAt(t, z, M, t[n]!, n, pair);
        return -(p[0] + p[1] * (x - t[n]!)) * x; // only at x = t_n in normal use
      }
      return -splineAt(t, z, M, x, segmentIndex(t, n, x), pair)[0] * x;
    },
    forward(x) {
      const p = splineAt(t, z, M, x, Math.min(segmentIndex(t, n, x), n), pair);
      return p[0] + x * p[1];
    },
  };
}
