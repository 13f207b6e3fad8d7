import { copyNodes, segmentIndex, type Interpolation } from './types.ts';

// Performance: module-local bindings and module-level helpers, so that no function object is
// created per build and no imported binding is looked up per evaluation (see types.ts, "hot paths").
const findSegment = segmentIndex;
const copy = copyNodes;
/** Continuously compounded zero at node i (node 0 takes node 1's: flat before the first pillar). */
const zeroOf = (t: readonly number[], y: readonly number[], i: number): number => -y[i === 0 ? 1 : i]! / t[i === 0 ? 1 : i]!;
/** Slope of z on segment i (0 on the first segment). */
const slopeOf = (t: readonly number[], y: readonly number[], i: number): number =>
  i === 1 ? 0 : (zeroOf(t, y, i) - zeroOf(t, y, i - 1)) / (t[i]! - t[i - 1]!);
const zeroAt = (t: readonly number[], y: readonly number[], x: number, i: number): number => zeroOf(t, y, i - 1) + slopeOf(t, y, i) * (x - t[i - 1]!);

/**
 * `linear-zero`: the continuously compounded zero rate z(t) = -lnDF(t)/t is linear in t between
 * pillars and flat at z(t_1) before the first pillar. f(t) = z(t) + t z'(t). Common practice.
 */
export function interpolatorLinearZero(ts: ArrayLike<number>, lnDfs: ArrayLike<number>, count?: number): Interpolation {
  const n = (count ?? ts.length) - 1;
  const t = copy(ts, n + 1);
  const y = copy(lnDfs, n + 1);
  return {
    lnDiscount(x) {
      if (x === t[n]!) return y[n]!;
      if (x > t[n]!) return n === 0 ? 0 : -(zeroOf(t, y, n) + slopeOf(t, y, n) * (x - t[n]!)) * x;
      return -zeroAt(t, y, x, findSegment(t, n, x)) * x;
    },
    forward(x) {
      const i = Math.min(findSegment(t, n, x), n);
      return zeroAt(t, y, x, i) + x * slopeOf(t, y, i);
    },
  };
}
