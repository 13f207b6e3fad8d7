import { copyNodes, segmentIndex, zeros, type Interpolation } from './types.ts';

// Performance: module-local bindings and module-level helpers (see types.ts, "hot paths").
const findSegment = segmentIndex;
const copy = copyNodes;
const zeroArray = zeros;
/** The positivity collar: v bounded to [0, max(hi, 0)]. */
const collar = (v: number, hi: number): number => Math.min(Math.max(v, 0), Math.max(hi, 0));

const setPair = (pair: [number, number], g: number, G: number): [number, number] => {
  pair[0] = g;
  pair[1] = G;
  return pair;
};

/**
 * g(x) and its integral G(x) = int_0^x g on segment i (x in [0, 1]), written into `pair`:
 * g0 = f_(i-1) - d_i, g1 = f_i - d_i, the four regions of Hagan and West (2006).
 */
function segmentShape(f: readonly number[], d: readonly number[], i: number, x: number, pair: [number, number]): [number, number] {
  const g0 = f[i - 1]! - d[i]!;
  const g1 = f[i]! - d[i]!;
  if (g0 === 0 && g1 === 0) return setPair(pair, 0, 0);
  // Region (i): g0, g1 of opposite signs within a factor of 2.
  if ((g0 < 0 && -0.5 * g0 <= g1 && g1 <= -2 * g0) || (g0 > 0 && -0.5 * g0 >= g1 && g1 >= -2 * g0)) {
    const g = g0 * (1 - 4 * x + 3 * x * x) + g1 * (-2 * x + 3 * x * x);
    const G = g0 * (x - 2 * x * x + x * x * x) + g1 * (-x * x + x * x * x);
    return setPair(pair, g, G);
  }
  // Region (ii): flat at g0, then a quadratic rise to g1.
  if ((g0 < 0 && g1 > -2 * g0) || (g0 > 0 && g1 < -2 * g0)) {
    const eta = (g1 + 2 * g0) / (g1 - g0);
    if (x <= eta) return setPair(pair, g0, g0 * x);
    const u = (x - eta) / (1 - eta);
    return setPair(pair, g0 + (g1 - g0) * u * u, g0 * x + ((g1 - g0) * (x - eta) * u * u) / 3);
  }
  // Region (iii): a quadratic from g0, then flat at g1.
  if ((g0 > 0 && 0 > g1 && g1 > -0.5 * g0) || (g0 < 0 && 0 < g1 && g1 < -0.5 * g0)) {
    const eta = (3 * g1) / (g1 - g0);
    if (x < eta) {
      const u = (eta - x) / eta;
      return setPair(pair, g1 + (g0 - g1) * u * u, g1 * x + ((g0 - g1) * eta * (1 - u * u * u)) / 3);
    }
    return setPair(pair, g1, g1 * x + ((g0 - g1) * eta) / 3);
  }
  // Region (iv): g0 and g1 of the same sign (or one of them zero).
  const eta = g1 / (g1 + g0);
  const A = (-g0 * g1) / (g0 + g1);
  if (x < eta) {
    const u = (eta - x) / eta;
    return setPair(pair, A + (g0 - A) * u * u, A * x + ((g0 - A) * eta * (1 - u * u * u)) / 3);
  }
  const base = A * x + ((g0 - A) * eta) / 3;
  if (eta >= 1) return setPair(pair, A, base);
  const u = (x - eta) / (1 - eta);
  return setPair(pair, A + (g1 - A) * u * u, base + ((g1 - A) * (x - eta) * u * u) / 3);
}

/**
 * `monotone-convex` and `monotone-convex-positive`: P. S. Hagan and G. West, "Interpolation
 * Methods for Curve Construction", Applied Mathematical Finance 13(2), 2006, section on the
 * monotone convex method.
 *
 * Discrete forwards d_i = -ln(DF_i / DF_(i-1)) / (t_i - t_(i-1)) with a node at t = 0; node forwards
 *   f_i = [(t_i - t_(i-1)) d_(i+1) + (t_(i+1) - t_i) d_i] / (t_(i+1) - t_(i-1)),  0 < i < n,
 *   f_0 = d_1 - (f_1 - d_1)/2,  f_n = d_n - (f_(n-1) - d_n)/2.
 * On segment i, with x = (t - t_(i-1))/h in [0, 1], g(x) = f(t) - d_i, g0 = f_(i-1) - d_i,
 * g1 = f_i - d_i, the paper's four regions give g with integral zero over the segment, so every
 * discrete forward (and so every node discount factor) is reproduced exactly.
 *
 * The positive variant bounds f_0 to [0, 2 d_1], f_i to [0, 2 min(d_i, d_(i+1))], f_n to [0, 2 d_n]
 * (the paper's positivity collar); the bootstrap refuses it when a discrete forward is negative.
 */
export function monotoneConvexFactory(positive: boolean) {
  return function interpolatorMonotoneConvex(ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number): Interpolation {
    const n = (count ?? ts.length) - 1;
    const t = copy(ts, n + 1);
    const y = copy(lnDfs, n + 1);
    const d = zeroArray(n + 1); // d[i] for segment i, 1..n
    for (let i = 1; i <= n; i++) d[i] = -(y[i]! - y[i - 1]!) / (t[i]! - t[i - 1]!);
    const f = zeroArray(n + 1);
    if (n === 1) {
      f[0] = d[1]!;
      f[1] = d[1]!;
    } else {
      for (let i = 1; i < n; i++) {
        f[i] = ((t[i]! - t[i - 1]!) * d[i + 1]! + (t[i + 1]! - t[i]!) * d[i]!) / (t[i + 1]! - t[i - 1]!);
      }
      f[0] = d[1]! - 0.5 * (f[1]! - d[1]!);
      f[n] = d[n]! - 0.5 * (f[n - 1]! - d[n]!);
    }
    if (positive) {
      f[0] = collar(f[0]!, 2 * d[1]!);
      for (let i = 1; i < n; i++) f[i] = collar(f[i]!, 2 * Math.min(d[i]!, d[i + 1]!));
      f[n] = collar(f[n]!, 2 * d[n]!);
    }

    // A reused pair: no array is allocated per evaluation; callers read it at once.
    const pair: [number, number] = [0, 0];

    return {
      lnDiscount(x) {
        if (x >= t[n]!) return y[n]! - f[n]! * (x - t[n]!);
        const i = findSegment(t, n, x);
        const h = t[i]! - t[i - 1]!;
        const u = (x - t[i - 1]!) / h;
        return y[i - 1]! - h * (d[i]! * u + segmentShape(f, d, i, u, pair)[1]);
      },
      forward(x) {
        if (x >= t[n]!) return f[n]!;
        const i = findSegment(t, n, x);
        const u = (x - t[i - 1]!) / (t[i]! - t[i - 1]!);
        return d[i]! + segmentShape(f, d, i, u, pair)[0];
      },
    };
  };
}

export const interpolatorMonotoneConvex = monotoneConvexFactory(false);
export const interpolatorMonotoneConvexPositive = monotoneConvexFactory(true);
