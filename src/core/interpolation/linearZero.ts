import { copyNodes, segmentIndex, segmentNear, type Interpolation } from './types.ts';

/** Continuously compounded zero at node i (node 0 takes node 1's: flat before the first pillar). */
const zeroOf = (t: ArrayLike<number>, y: ArrayLike<number>, i: number): number => -y[i === 0 ? 1 : i]! / t[i === 0 ? 1 : i]!;
/** Slope of z on segment i (0 on the first segment). */
const slopeOf = (t: ArrayLike<number>, y: ArrayLike<number>, i: number): number =>
  i === 1 ? 0 : (zeroOf(t, y, i) - zeroOf(t, y, i - 1)) / (t[i]! - t[i - 1]!);
const zeroAt = (t: ArrayLike<number>, y: ArrayLike<number>, x: number, i: number): number => zeroOf(t, y, i - 1) + slopeOf(t, y, i) * (x - t[i - 1]!);

/**
 * ln DF at x on segment i of linear-zero nodes: -z(x) x with z linear between z_(i-1) and z_i
 * (z_k = -y_k / t_k; flat at z_1 on the first segment). Reads nodes i - 1 and i only (node 1 on
 * the first segment; the node count n does not matter); valid for t_(i-1) <= x < t_i. Units: t in years on the curve's axis,
 * y = ln DF, z continuously compounded.
 */
export function linearZeroSegmentLn(t: ArrayLike<number>, y: ArrayLike<number>, _n: number, i: number, x: number): number {
  // At the segment's left node, that node's own value (not -z x, which may differ by an ulp).
  return x === t[i - 1]! ? y[i - 1]! : -zeroAt(t, y, x, i) * x;
}

/**
 * `linear-zero`: the continuously compounded zero rate z(t) = -lnDF(t)/t is linear in t between
 * pillars and flat at z(t_1) before the first pillar. f(t) = z(t) + t z'(t). Common practice.
 */
export function interpolatorLinearZero(ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number): Interpolation {
  const n = (count ?? ts.length) - 1;
  const t = copyNodes(ts, n + 1);
  const y = copyNodes(lnDfs, n + 1);
  let hint = 1; // the segment of the last lookup (see segmentNear)
  return {
    lnDiscount(x) {
      if (x === t[n]!) return y[n]!;
      if (x > t[n]!) return n === 0 ? 0 : -(zeroOf(t, y, n) + slopeOf(t, y, n) * (x - t[n]!)) * x;
      hint = segmentNear(t, n, x, hint);
      return linearZeroSegmentLn(t, y, n, hint, x);
    },
    forward(x) {
      const i = Math.min(segmentIndex(t, n, x), n);
      return zeroAt(t, y, x, i) + x * slopeOf(t, y, i);
    },
  };
}
