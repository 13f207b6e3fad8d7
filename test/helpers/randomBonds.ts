// Seeded random curves and bonds (invented) for the bond explanations' property tests.
import { addDays, analyzeBond, curveFromPillars, DAY_COUNTS, DEFAULT_KEY_TENORS, type BondInput, type BondSink, type Curve, type InterpolationId, type Pillar } from '../../src/core/index.ts';

export const RANDOM_BOND_SETTLEMENT = '2026-07-15';

/** 3 to 10 nodes from 60 days to about 40 years, zero rates from -0.5% to 5.5% (ACT/365F, flat-forward past the last). */
export function randomCurve(r: () => number, method: InterpolationId): Curve {
  const n = 3 + Math.floor(r() * 8);
  const pillars: Pillar[] = [];
  let day = 0;
  for (let i = 0; i < n; i++) {
    day += 60 + Math.floor(r() * 1500);
    const z = -0.005 + r() * 0.06;
    pillars.push({ date: addDays(RANDOM_BOND_SETTLEMENT, day), t: day / 365, discount: Math.exp((-z * day) / 365), quote: i });
  }
  return curveFromPillars(RANDOM_BOND_SETTLEMENT, 'ACT/365F', method, 'flat-forward', pillars);
}

/**
 * A bond maturing by a year past the curve's last node (flat-forward extrapolation beyond it), any
 * frequency and day count; with `market`, a third carry a clean price and a third a yield.
 */
export function randomBond(r: () => number, curve: Curve, market = true): BondInput {
  const span = Math.round((Date.parse(curve.pillars.at(-1)!.date) - Date.parse(RANDOM_BOND_SETTLEMENT)) / 86400000) + 365;
  const frequency = [1, 2, 4, 12][Math.floor(r() * 4)]!;
  const base = {
    maturity: addDays(RANDOM_BOND_SETTLEMENT, 20 + Math.floor(r() * span)),
    coupon: Math.round(r() * 1000) / 10000,
    frequency,
    dayCount: DAY_COUNTS[Math.floor(r() * DAY_COUNTS.length)]!,
  };
  if (!market) return base;
  const q = r();
  return q < 0.33 ? base : q < 0.66 ? { ...base, cleanPrice: 80 + r() * 40 } : { ...base, yield: r() * 0.08 };
}

/** A core result's value, or the test fails with its first message. */
export const valueOf = <T>(x: { ok: true; value: T } | { ok: false; errors: readonly { message: string }[] }): T => {
  if (!x.ok) throw new Error(x.errors[0]!.message);
  return x.value;
};

/** A random curve and bond analysed twice, without and with a sink (analyzeBond's trace), for traced-equals-untraced checks. */
export function tracedRandomBond(r: () => number, method: InterpolationId, market = true) {
  const curve = randomCurve(r, method);
  const input = randomBond(r, curve, market);
  const plain = analyzeBond(curve, input);
  const sink: BondSink = {};
  const traced = analyzeBond(curve, input, DEFAULT_KEY_TENORS, 'bond', sink);
  return { curve, input, plain, traced, sink };
}
