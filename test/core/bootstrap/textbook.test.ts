import { describe, expect, it } from 'vitest';
import { buildCurve, discountOn, INTERPOLATIONS, zeroOn } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Textbook bootstrap: J. C. Hull, "Options, Futures, and Other Derivatives", chapter "Interest
// Rates", the table of bond prices bootstrapped to zero rates (cited from memory):
//   principal 100; 0.25 y, no coupon, 97.5; 0.5 y, no coupon, 94.9; 1.0 y, no coupon, 90.0;
//   1.5 y, 8 % coupon paid semiannually, 96.0; 2.0 y, 12 % coupon paid semiannually, 101.6
//   -> continuously compounded zero rates 10.127 %, 10.469 %, 10.536 %, 10.681 %, 10.808 %.
// The book's year fractions are exact quarters and halves. To reproduce them exactly the curve
// axis is 30/360 with a settlement on the 15th of a month: every 3-month step is exactly 0.25 of
// a 30/360 year, and every coupon date (settlement + 6k months) falls on a pillar, so the result
// does not depend on the interpolation at all (each bond's earlier coupons sit on solved nodes).
// Settlement is a coupon date, so accrued interest is zero and the clean price is the book's price.
// (On ACT/365F the quarter would be 90/365 = 0.2466 years, and the zero rate for the same
// discount factor would move by about 1.4 % of itself, far beyond the book's rounding: hence the
// 30/360 axis rather than a looser tolerance.)
const HULL = 'Hull, Options, Futures, and Other Derivatives, bootstrap table (from memory; printed to 3 decimals in %)';
const settlement = '2027-01-15';
const doc = (interpolation: string) => ({
  format: 'tenorscope-workspace',
  version: 1,
  settlement,
  curve: { dayCount: '30/360', interpolation },
  quotes: [
    { kind: 'zero', maturity: '2027-04-15', price: 97.5 },
    { kind: 'zero', maturity: '2027-07-15', price: 94.9 },
    { kind: 'zero', maturity: '2028-01-15', price: 90.0 },
    { kind: 'bond', maturity: '2028-07-15', coupon: 0.08, frequency: 2, cleanPrice: 96.0, dayCount: '30/360' },
    { kind: 'bond', maturity: '2029-01-15', coupon: 0.12, frequency: 2, cleanPrice: 101.6, dayCount: '30/360' },
  ],
});
const maturities = ['2027-04-15', '2027-07-15', '2028-01-15', '2028-07-15', '2029-01-15'];
const times = [0.25, 0.5, 1, 1.5, 2];
const book = [0.10127, 0.10469, 0.10536, 0.10681, 0.10808];

// The same bootstrap by hand, in closed form (Hull's method): each bond's earlier coupons are
// discounted at the zeros already found, the last flow solves for the new zero.
const r1 = -Math.log(0.975) / 0.25;
const r2 = -Math.log(0.949) / 0.5;
const r3 = -Math.log(0.9) / 1;
const r4 = -Math.log((96 - 4 * Math.exp(-r2 * 0.5) - 4 * Math.exp(-r3)) / 104) / 1.5;
const r5 = -Math.log((101.6 - 6 * Math.exp(-r2 * 0.5) - 6 * Math.exp(-r3) - 6 * Math.exp(-r4 * 1.5)) / 106) / 2;
const hand = [r1, r2, r3, r4, r5];

describe('Hull bootstrap of zero rates from zero-coupon and coupon bond prices', () => {
  it('the hand bootstrap itself matches the book (a check on how the table was copied)', () => {
    hand.forEach((r, i) => expectClose(r, book[i]!, 5e-6, HULL));
  });
  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: zero rates match the book to its rounding and the hand bootstrap to 1e-13`, () => {
      const b = buildCurve(doc(interpolation));
      expect(b.errors).toEqual([]);
      const curve = b.curve!;
      maturities.forEach((date, i) => {
        const z = zeroOn(curve, date, 'continuous', '30/360');
        if (!z.ok) throw new Error(JSON.stringify(z.errors));
        expectClose(z.value.t, times[i]!, 0, '30/360 year fraction from the 15th (exact quarter/half)');
        expectClose(z.value.zero, book[i]!, 5e-6, HULL);
        expectClose(z.value.zero, hand[i]!, 1e-13, 'closed-form bootstrap by hand (same method as the book)');
      });
      for (const r of b.repricing) {
        expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(1e-11); // every quote is a price per 100
        expect(r.unit).toBe('price');
      }
    });
  }
  it('a zero read in another compounding is the same discount factor (semiannual 1.5-year zero)', () => {
    const curve = buildCurve(doc('monotone-convex')).curve!;
    const z = zeroOn(curve, '2028-07-15', 'semiannual', '30/360');
    const df = discountOn(curve, '2028-07-15');
    if (!z.ok || !df.ok) throw new Error('query failed');
    // (1 + z/2)^(-2 x 1.5) = DF: compounding conventions, common practice.
    expectClose((1 + z.value.zero / 2) ** -3, df.value.discount, 1e-15, 'periodic compounding definition (issue section 2.4)');
    expectClose(df.value.discount, Math.exp(-r4 * 1.5), 1e-15, 'closed-form bootstrap by hand');
  });
});
