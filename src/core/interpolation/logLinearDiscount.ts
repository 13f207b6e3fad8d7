import { copyNodes, segmentIndex, type Interpolation } from './types.ts';

// Performance: module-local bindings and module-level helpers, so that no function object is
// created per build and no imported binding is looked up per evaluation (see types.ts, "hot paths").
const findSegment = segmentIndex;
const copy = copyNodes;
/** The discrete forward of segment i, d_i = -(y_i - y_(i-1)) / (t_i - t_(i-1)). */
const discrete = (t: readonly number[], y: readonly number[], i: number): number => -(y[i]! - y[i - 1]!) / (t[i]! - t[i - 1]!);

/**
 * `log-linear-discount`: ln DF linear in t between nodes, DF(0) = 1; the instantaneous forward is
 * flat on each segment at the discrete forward d_i = -(lnDF_i - lnDF_(i-1)) / (t_i - t_(i-1)).
 * Common practice (piecewise flat forwards).
 */
export function interpolatorLogLinearDiscount(ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number): Interpolation {
  const n = (count ?? ts.length) - 1;
  const t = copy(ts, n + 1);
  const y = copy(lnDfs, n + 1);
  return {
    lnDiscount(x) {
      if (x >= t[n]!) return y[n]! - discrete(t, y, n) * (x - t[n]!);
      const i = findSegment(t, n, x);
      return y[i - 1]! - discrete(t, y, i) * (x - t[i - 1]!);
    },
    forward(x) {
      return discrete(t, y, findSegment(t, n, x));
    },
  };
}
