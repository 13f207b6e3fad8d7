import type { Flow } from './keyRates.ts';

/**
 * Zero-volatility spread z (decimal per year, continuously compounded on the curve's axis): the
 * constant added to the curve's continuously compounded zero rates that reprices the flows,
 *   P_dirty = sum CF_i DF(t_i) e^(-z t_i).
 * Newton from z = 0 (the price is convex and decreasing in z), safeguarded by bisection inside a
 * bracket once one is known; null when no z in (-1, 1) reprices (the price is not positive or
 * out of reach). At the model price, f(0) = 0 exactly and z = 0.
 */
export function zSpread(flows: readonly Flow[], lnDiscountAt: (t: number) => number, dirtyPrice: number): number | null {
  if (!(dirtyPrice > 0) || !Number.isFinite(dirtyPrice)) return null;
  const pv = flows.map((f) => f.amount * Math.exp(lnDiscountAt(f.t)));
  const price = (z: number): { p: number; dp: number } => {
    let p = 0;
    let dp = 0;
    flows.forEach((f, i) => {
      const v = pv[i]! * Math.exp(-z * f.t);
      p += v;
      dp -= f.t * v;
    });
    return { p, dp };
  };
  let lo = -1;
  let hi = 1;
  if (price(lo).p < dirtyPrice || price(hi).p > dirtyPrice) return null;
  let z = 0;
  for (let iter = 0; iter < 200; iter++) {
    const { p, dp } = price(z);
    const r = p - dirtyPrice;
    if (r === 0) return z;
    if (r > 0) lo = z;
    else hi = z;
    let next = z - r / dp;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - z) <= 1e-16) return next;
    z = next;
  }
  return z;
}
