/**
 * An interpolation of the discount curve on the curve's time axis t (years under the curve's day
 * count from settlement). Nodes are (t_0 = 0, lnDF_0 = 0), (t_1, lnDF_1), ..., (t_n, lnDF_n) with
 * t strictly increasing. Evaluation is valid for 0 <= t <= t_n; the curve handles beyond.
 */
export interface Interpolation {
  /** ln of the discount factor at t. */
  lnDiscount(t: number): number;
  /** Instantaneous forward f(t) = -d lnDF/dt, continuously compounded per year; right-continuous at nodes. */
  forward(t: number): number;
}

export const INTERPOLATIONS = ['linear-zero', 'log-linear-discount', 'cubic-zero', 'monotone-convex', 'monotone-convex-positive'] as const;
export type InterpolationId = (typeof INTERPOLATIONS)[number];

export const isInterpolation = (x: unknown): x is InterpolationId =>
  typeof x === 'string' && (INTERPOLATIONS as readonly string[]).includes(x);

/**
 * Builds an interpolation from node arrays (index 0 is t = 0, lnDF = 0). The arrays are read at
 * construction only. `count`: use the first `count` nodes only (default all); performance: the
 * bootstrap builds on a prefix of its node arrays without making a view of them per build.
 */
export type InterpolatorFactory = (ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number) => Interpolation;

export interface InterpolatorSpec {
  readonly id: InterpolationId;
  readonly build: InterpolatorFactory;
  /** True when moving one node moves the curve beyond its own two segments (needs sweeps). */
  readonly global: boolean;
  /**
   * True when ln DF at any fixed t is an affine function of each node's ln DF (linear-zero,
   * log-linear-discount, and cubic-zero, whose spline is linear in the zero rates): the bootstrap
   * then solves a node from two builds instead of one build per solver step.
   */
  readonly affine?: boolean;
  /**
   * Set when ln DF at or before t_(k - locality) does not depend on node k, with the
   * interpolation built on all nodes (monotone convex: 2, since node k moves d_k and d_(k+1), so
   * the node forwards f_(k-1)..f_(k+1), so segments k-1..k+2 only). The bootstrap then sums those
   * flows once per node solve.
   */
  readonly locality?: number;
  /**
   * ln DF at x on segment i (t_(i-1) <= x < t_i) of the interpolation on nodes 0..n, straight from
   * the node arrays and reading only nodes near i (up to i for the local methods; within
   * `locality` of node i otherwise), with the same arithmetic as the built interpolation's
   * `lnDiscount`, bit for bit. The bootstrap uses it to solve a node without building an
   * interpolation at every solver step.
   */
  readonly segmentLn?: (ts: ArrayLike<number>, lnDfs: ArrayLike<number>, n: number, i: number, x: number) => number;
  readonly label: string;
}

/**
 * Index i of the segment [t_(i-1), t_i) holding t, for 1 <= i <= n (t at or past t_n gives n);
 * right-continuous: t = t_i lies in segment i + 1.
 */
export function segmentIndex(ts: ArrayLike<number>, n: number, t: number): number {
  let lo = 1;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (t < ts[mid]!) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * `segmentIndex` starting from a guess: the segment `hint` or the one after it when t lies there,
 * else a binary search. Same result as `segmentIndex` for every t (hint in 1..n). Performance:
 * cash flows are read in ascending time, so the segment of the last lookup, or the next, almost
 * always holds the next flow ("hunt" in Press et al., "Numerical Recipes", section 3.1; cited
 * from memory).
 */
export function segmentNear(ts: ArrayLike<number>, n: number, t: number, hint: number): number {
  if (hint >= 1 && hint <= n && t >= ts[hint - 1]!) {
    if (hint === n || t < ts[hint]!) return hint;
    if (hint + 1 === n || t < ts[hint + 1]!) return hint + 1;
  }
  return segmentIndex(ts, n, t);
}

/**
 * A private copy of node values, as a plain array of doubles rather than a Float64Array: a small
 * typed array costs several times as much to allocate in Node, and interpolations are built once
 * or twice per node solve in the bootstrap. The values stay float64 either way.
 */
export function copyNodes(xs: ArrayLike<number>, n: number = xs.length): number[] {
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = xs[i]!;
  return out;
}

/** n zeros in a plain array of doubles (see copyNodes for why not a Float64Array). */
export function zeros(n: number): number[] {
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = 0;
  return out;
}
