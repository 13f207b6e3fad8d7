import { copyNodes, segmentIndex, type Interpolation } from './types.ts';

/**
 * `log-linear-discount`: ln DF linear in t between nodes, DF(0) = 1; the instantaneous forward is
 * flat on each segment at the discrete forward d_i = -(lnDF_i - lnDF_(i-1)) / (t_i - t_(i-1)).
 * Common practice (piecewise flat forwards).
 */
export function interpolatorLogLinearDiscount(ts: ArrayLike<number>, lnDfs: ArrayLike<number>): Interpolation {
  const n = ts.length - 1;
  const t = copyNodes(ts);
  const y = copyNodes(lnDfs);
  const forwardOf = (i: number): number => -(y[i]! - y[i - 1]!) / (t[i]! - t[i - 1]!);
  return {
    lnDiscount(x) {
      if (x >= t[n]!) return y[n]! - forwardOf(n) * (x - t[n]!);
      const i = segmentIndex(t, n, x);
      return y[i - 1]! - forwardOf(i) * (x - t[i - 1]!);
    },
    forward(x) {
      return forwardOf(segmentIndex(t, n, x));
    },
  };
}
