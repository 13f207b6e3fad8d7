import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { analyzeBond, buildCurve, tentWeight } from '../../../src/core/index.ts';
import { expectClose, expectRelClose } from '../../helpers/asserts.ts';
import { INVENTED_2027, workspaceDoc } from '../../helpers/markets.ts';

// Invented demo market; the properties hold for any curve.
const { depo3M, zero1Y, swap2Y, swap5Y, swap10Y, swap30Y } = INVENTED_2027; // test/helpers/markets.ts
const market = workspaceDoc([depo3M, zero1Y, swap2Y, swap5Y, swap10Y, swap30Y], { interpolation: 'monotone-convex', extrapolation: 'flat-forward' });
const curve = buildCurve(market).curve!;

describe('tentWeight', () => {
  const keys = [0.25, 0.5, 1, 2, 3, 5, 7, 10, 20, 30];
  it('the tents sum to 1 at every time, before the first key and after the last (a parallel shift)', () => {
    for (const t of [0, 0.1, 0.25, 0.4, 1.7, 6.2, 10, 25, 30, 45]) {
      expectClose(keys.reduce((s, _, k) => s + tentWeight(keys, k, t), 0), 1, 1e-15, 'partition of unity (definition of the tents)');
    }
  });
  it('is 1 at its own key and 0 at the others', () => {
    keys.forEach((tk, k) => keys.forEach((_, j) => expect(tentWeight(keys, j, tk)).toBe(j === k ? 1 : 0)));
  });
});

describe('key-rate durations, property checks', () => {
  it('for any fixed-coupon bond: key-rate durations are >= 0 and sum to the parallel duration to 1e-8 relative', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 * 12 }),
        fc.integer({ min: 0, max: 1200 }),
        fc.constantFrom(1, 2, 4, 12),
        (months, couponBp, frequency) => {
          const y = 2027 + Math.floor((3 + months) / 12);
          const m = ((2 + months) % 12) + 1;
          const maturity = `${y}-${String(m).padStart(2, '0')}-15`;
          const a = analyzeBond(curve, { maturity, coupon: couponBp / 1e4, frequency, dayCount: 'ACT/ACT-ICMA' });
          if (!a.ok) return a.errors[0]!.code === 'before-settlement';
          for (const k of a.value.keyRateDurations) expect(k.duration).toBeGreaterThanOrEqual(0);
          const sum = a.value.keyRateDurations.reduce((s, k) => s + k.duration, 0);
          expectRelClose(sum, a.value.effectiveDuration, 1e-8, 'key-rate sum rule');
          return true;
        },
      ),
      { numRuns: 200, seed: 20261202 },
    );
  });
});
