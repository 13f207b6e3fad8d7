import { copyNodes, segmentIndex, type Interpolation } from './types.ts';

/**
 * `linear-zero`: the continuously compounded zero rate z(t) = -lnDF(t)/t is linear in t between
 * pillars and flat at z(t_1) before the first pillar. f(t) = z(t) + t z'(t). Common practice.
 */
export function interpolatorLinearZero(ts: ArrayLike<number>, lnDfs: ArrayLike<number>): Interpolation {
  const n = ts.length - 1;
  const t = copyNodes(ts);
  const y = copyNodes(lnDfs);
  const z = (i: number): number => -y[i === 0 ? 1 : i]! / t[i === 0 ? 1 : i]!;
  const slopeOf = (i: number): number => (i === 1 ? 0 : (z(i) - z(i - 1)) / (t[i]! - t[i - 1]!));
  const zeroAt = (x: number, i: number): number => z(i - 1) + slopeOf(i) * (x - t[i - 1]!);
  return {
    lnDiscount(x) {
      if (x === t[n]!) return y[n]!;
      if (x > t[n]!) return n === 0 ? 0 : -(z(n) + slopeOf(n) * (x - t[n]!)) * x;
      return -zeroAt(x, segmentIndex(t, n, x)) * x;
    },
    forward(x) {
      const i = Math.min(segmentIndex(t, n, x), n);
      return zeroAt(x, i) + x * slopeOf(i);
    },
  };
}
