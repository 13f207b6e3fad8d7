import { copyNodes, segmentIndex, segmentNear, zeros, type Interpolation } from './types.ts';

/** The positivity collar: v bounded to [0, max(hi, 0)]. */
const collar = (v: number, hi: number): number => Math.min(Math.max(v, 0), Math.max(hi, 0));

const setPair = (pair: [number, number], g: number, G: number): [number, number] => {
  pair[0] = g;
  pair[1] = G;
  return pair;
};

/**
 * g(x) and its integral G(x) = int_0^x g on a segment (x in [0, 1]), written into `pair`:
 * g0 = f_(i-1) - d_i, g1 = f_i - d_i, the four regions of Hagan and West (2006).
 */
function segmentShape(g0: number, g1: number, x: number, pair: [number, number]): [number, number] {
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
    const t = copyNodes(ts, n + 1);
    const y = copyNodes(lnDfs, n + 1);
    const d = zeros(n + 1); // d[i] for segment i, 1..n
    for (let i = 1; i <= n; i++) d[i] = discreteAt(t, y, i);
    const f = zeros(n + 1);
    for (let i = 0; i <= n; i++) f[i] = nodeForward(t, y, n, i, positive);
    // A reused pair: no array is allocated per evaluation; callers read it at once.
    const pair: [number, number] = [0, 0];
    let hint = 1; // the segment of the last lookup (see segmentNear)

    return {
      lnDiscount(x) {
        if (x >= t[n]!) return y[n]! - f[n]! * (x - t[n]!);
        hint = segmentNear(t, n, x, hint);
        return segmentLnFrom(t, y, hint, x, d[hint]!, f[hint - 1]!, f[hint]!, pair);
      },
      forward(x) {
        if (x >= t[n]!) return f[n]!;
        const i = segmentIndex(t, n, x);
        const u = (x - t[i - 1]!) / (t[i]! - t[i - 1]!);
        return d[i]! + segmentShape(f[i - 1]! - d[i]!, f[i]! - d[i]!, u, pair)[0];
      },
    };
  };
}

export const interpolatorMonotoneConvex = monotoneConvexFactory(false);
export const interpolatorMonotoneConvexPositive = monotoneConvexFactory(true);

/**
 * ln DF at x on segment i (t_(i-1) <= x < t_i) of the monotone convex curve on nodes 0..n,
 * straight from the node arrays (nodes i - 3..i + 1 at most: f_(i-1) and f_i need d_(i-1)..d_(i+1),
 * an end f_0 or f_n needs d_1, d_2 or d_(n-1), d_n), with the arithmetic of the built
 * interpolation's lnDiscount, so the two agree bit for bit. The bootstrap's sweeps use it to
 * re-solve one node without rebuilding the whole interpolation at every solver step.
 */
export function monotoneConvexSegmentLn(t: ArrayLike<number>, y: ArrayLike<number>, n: number, i: number, x: number): number {
  return segmentLnFrom(t, y, i, x, discreteAt(t, y, i), nodeForward(t, y, n, i - 1, false), nodeForward(t, y, n, i, false), [0, 0]);
}

/** monotoneConvexSegmentLn for monotone-convex-positive (node forwards collared). */
export function monotoneConvexPositiveSegmentLn(t: ArrayLike<number>, y: ArrayLike<number>, n: number, i: number, x: number): number {
  return segmentLnFrom(t, y, i, x, discreteAt(t, y, i), nodeForward(t, y, n, i - 1, true), nodeForward(t, y, n, i, true), [0, 0]);
}

/** The discrete forward of segment i, d_i = -(y_i - y_(i-1)) / (t_i - t_(i-1)). */
function discreteAt(t: ArrayLike<number>, y: ArrayLike<number>, i: number): number {
  return -(y[i]! - y[i - 1]!) / (t[i]! - t[i - 1]!);
}

/** f_i for 0 < i < n: [(t_i - t_(i-1)) d_(i+1) + (t_(i+1) - t_i) d_i] / (t_(i+1) - t_(i-1)). */
function innerForward(t: ArrayLike<number>, y: ArrayLike<number>, i: number): number {
  return ((t[i]! - t[i - 1]!) * discreteAt(t, y, i + 1) + (t[i + 1]! - t[i]!) * discreteAt(t, y, i)) / (t[i + 1]! - t[i - 1]!);
}

/**
 * The node forward f_i of the curve on nodes 0..n (ends f_0 = d_1 - (f_1 - d_1)/2 and
 * f_n = d_n - (f_(n-1) - d_n)/2; f_0 = f_1 = d_1 with one segment), with the positivity collar
 * when `positive`. One formula for the build and for the segment function.
 */
function nodeForward(t: ArrayLike<number>, y: ArrayLike<number>, n: number, i: number, positive: boolean): number {
  let fi: number;
  if (n === 1) fi = discreteAt(t, y, 1);
  else if (i === 0) {
    const d1 = discreteAt(t, y, 1);
    fi = d1 - 0.5 * (innerForward(t, y, 1) - d1);
  } else if (i === n) {
    const dn = discreteAt(t, y, n);
    fi = dn - 0.5 * (innerForward(t, y, n - 1) - dn);
  } else fi = innerForward(t, y, i);
  if (!positive) return fi;
  if (i === 0) return collar(fi, 2 * discreteAt(t, y, 1));
  if (i === n) return collar(fi, 2 * discreteAt(t, y, n));
  return collar(fi, 2 * Math.min(discreteAt(t, y, i), discreteAt(t, y, i + 1)));
}

/** ln DF at x on segment i: y_(i-1) - h (d_i u + G(u)), u = (x - t_(i-1)) / h. */
function segmentLnFrom(t: ArrayLike<number>, y: ArrayLike<number>, i: number, x: number, di: number, fPrev: number, fi: number, pair: [number, number]): number {
  const h = t[i]! - t[i - 1]!;
  const u = (x - t[i - 1]!) / h;
  return y[i - 1]! - h * (di * u + segmentShape(fPrev - di, fi - di, u, pair)[1]);
}
