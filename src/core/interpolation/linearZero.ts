import { segmentIndex, type Interpolation } from './types.ts';

/**
 * `linear-zero`: the continuously compounded zero rate z(t) = -lnDF(t)/t is linear in t between
 * pillars and flat at z(t_1) before the first pillar. f(t) = z(t) + t z'(t). Common practice.
 */
export function interpolatorLinearZero(ts: ArrayLike<number>, lnDfs: ArrayLike<number>): Interpolation {
  const n = ts.length - 1;
  const t = Float64Array.from(ts);
  const z = new Float64Array(n + 1);
  for (let i = 1; i <= n; i++) z[i] = -lnDfs[i]! / t[i]!;
  z[0] = z[1]!;
  const slopeOf = (i: number): number => (i === 1 ? 0 : (z[i]! - z[i - 1]!) / (t[i]! - t[i - 1]!));
  const zeroAt = (x: number, i: number): number => z[i - 1]! + slopeOf(i) * (x - t[i - 1]!);
  return {
    lnDiscount(x) {
      if (x >= t[n]!) return n === 0 ? 0 : -(z[n]! + slopeOf(n) * (x - t[n]!)) * x;
      return -zeroAt(x, segmentIndex(t, n, x)) * x;
    },
    forward(x) {
      const i = Math.min(segmentIndex(t, n, x), n);
      return zeroAt(x, i) + x * slopeOf(i);
    },
  };
}
