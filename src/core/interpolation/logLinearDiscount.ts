import { copyNodes, segmentIndex, segmentNear, type Interpolation } from './types.ts';

/** The discrete forward of segment i, d_i = -(y_i - y_(i-1)) / (t_i - t_(i-1)). */
const discrete = (t: ArrayLike<number>, y: ArrayLike<number>, i: number): number => -(y[i]! - y[i - 1]!) / (t[i]! - t[i - 1]!);

/**
 * ln DF at x on segment i of log-linear nodes: y_(i-1) - d_i (x - t_(i-1)), the forward flat at
 * the discrete forward d_i. Reads nodes i - 1 and i only (so the node count n does not matter);
 * valid for t_(i-1) <= x <= t_i. Units: t in years on the curve's axis, y = ln DF.
 */
export function logLinearSegmentLn(t: ArrayLike<number>, y: ArrayLike<number>, _n: number, i: number, x: number): number {
  return y[i - 1]! - discrete(t, y, i) * (x - t[i - 1]!);
}

/**
 * `log-linear-discount`: ln DF linear in t between nodes, DF(0) = 1; the instantaneous forward is
 * flat on each segment at the discrete forward d_i = -(lnDF_i - lnDF_(i-1)) / (t_i - t_(i-1)).
 * Common practice (piecewise flat forwards).
 */
export function interpolatorLogLinearDiscount(ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number): Interpolation {
  const n = (count ?? ts.length) - 1;
  const t = copyNodes(ts, n + 1);
  const y = copyNodes(lnDfs, n + 1);
  let hint = 1; // the segment of the last lookup (see segmentNear)
  return {
    lnDiscount(x) {
      if (x >= t[n]!) return y[n]! - discrete(t, y, n) * (x - t[n]!);
      hint = segmentNear(t, n, x, hint);
      return logLinearSegmentLn(t, y, n, hint, x);
    },
    forward(x) {
      return discrete(t, y, segmentIndex(t, n, x));
    },
  };
}
