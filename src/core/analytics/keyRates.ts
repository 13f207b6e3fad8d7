import { marketDate } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import type { Curve } from '../curve/curve.ts';

/** The curve's key maturities: the key-rate grid and the rows of the key-maturity table (common practice for a government curve). */
export const DEFAULT_KEY_TENORS = ['3M', '6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y'] as const;

/** Size of the key-rate and parallel bumps, in bp of the continuously compounded zero rate. */
export const KEY_RATE_BUMP_BP = 1;

/** A fixed cash flow on the curve's axis: `amount` per 100 face at `t` years. */
export interface Flow {
  readonly t: number;
  readonly amount: number;
}

/**
 * Weight of key k's tent at time t (years): 1 at the key, falling linearly to 0 at the
 * neighbouring keys; the first tent is 1 before the first key and the last tent 1 after the last
 * key, so the weights of all tents sum to 1 at every t (the tents add up to a parallel shift).
 */
export function tentWeight(keys: readonly number[], k: number, t: number): number {
  const K = keys.length;
  if (K === 1) return 1;
  const tk = keys[k]!;
  if (k === 0) {
    const t1 = keys[1]!;
    return t <= tk ? 1 : t >= t1 ? 0 : (t1 - t) / (t1 - tk);
  }
  const prev = keys[k - 1]!;
  if (k === K - 1) return t >= tk ? 1 : t <= prev ? 0 : (t - prev) / (tk - prev);
  const next = keys[k + 1]!;
  if (t <= prev || t >= next) return 0;
  return t < tk ? (t - prev) / (tk - prev) : (next - t) / (next - tk);
}

/** The key tenors' times on the curve's axis, from settlement. */
export function keyTimes(curve: Curve, tenors: readonly string[]): number[] {
  return tenors.map((text) => {
    const tenor = parseTenor(text);
    if (!tenor) throw new RangeError(`keyTimes: not a tenor: ${text}`);
    return curve.time(marketDate(curve.settlement, tenor));
  });
}

/** One central difference of shiftDuration, as it computed it (explanations, explainBond.ts). */
export interface CentralDifference {
  /** The shift size, decimal of the continuously compounded zero. */
  readonly step: number;
  /** sum_i pv_i exp(-step w(t_i) t_i): the price with the zero shifted up (per 100 face when the flows are). */
  readonly up: number;
  /** sum_i pv_i exp(+step w(t_i) t_i): shifted down. */
  readonly down: number;
  /** -(up - down) / (2 step P0), years. */
  readonly duration: number;
}

/**
 * Duration (years) of flows under a shift of the continuously compounded zero curve shaped by
 * `weight(t)`: the zero z(t) moves by h w(t), so DF(t) becomes DF(t) e^(-h w(t) t), and
 *   D = -(1/P) dP/dh.
 * Computed by central differences at +-h (h = KEY_RATE_BUMP_BP bp) and +-h/2, combined by
 * Richardson extrapolation, D = (4 D(h/2) - D(h)) / 3, which removes the O(h^2) error of the plain
 * central difference. (The plain one misses by up to about 1e-7 relative on a 30-year bond, which
 * would break the rule that key-rate durations sum to the parallel duration; the combination is
 * exact to about 1e-12.) Richardson extrapolation: e.g. Press et al., "Numerical Recipes",
 * section 5.7 (cited from memory). `trace`: each central difference is pushed there as computed
 * (at h/2, then h); without it nothing is recorded.
 */
export function shiftDuration(flows: readonly Flow[], lnDiscountAt: (t: number) => number, weight: (t: number) => number, trace?: CentralDifference[]): number {
  const h = KEY_RATE_BUMP_BP * 1e-4;
  let p0 = 0;
  const pv: number[] = [];
  for (const f of flows) {
    const v = f.amount * Math.exp(lnDiscountAt(f.t));
    pv.push(v);
    p0 += v;
  }
  const central = (step: number): number => {
    let up = 0;
    let down = 0;
    flows.forEach((f, i) => {
      const x = step * weight(f.t) * f.t;
      up += pv[i]! * Math.exp(-x);
      down += pv[i]! * Math.exp(x);
    });
    const duration = -(up - down) / (2 * step * p0);
    trace?.push({ step, up, down, duration });
    return duration;
  };
  return (4 * central(h / 2) - central(h)) / 3;
}

/** Key-rate durations (years) of flows at key times (ascending), by tent shifts (shiftDuration); `traces[k]`: key k's central differences. */
export function keyRateDurations(flows: readonly Flow[], lnDiscountAt: (t: number) => number, keys: readonly number[], traces?: CentralDifference[][]): number[] {
  return keys.map((_, k) => shiftDuration(flows, lnDiscountAt, (t) => tentWeight(keys, k, t), traces && (traces[k] = [])));
}
