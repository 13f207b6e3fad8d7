import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import {
  billInvestmentYield,
  billPriceFromDiscountYield,
  billYearBasis,
  buildCurve,
  daysBetween,
  discountOn,
} from '../../../src/core/index.ts';
import { billDiscountYieldFromPrice } from '../../../src/core/instruments/bill.ts';
import { expectClose } from '../../helpers/asserts.ts';

// US Treasury bill formulas as published by the US Treasury (TreasuryDirect, "Treasury bills"
// price and investment-rate formulas; also 31 CFR Part 356, Appendix B, the bill section):
//   price            P = 100 (1 - d r / 360)                  d discount rate, r days to maturity
//   investment rate  r <= y/2:  i = (100 - P) / P x y / r      y = 365, or 366 when the year after
//                    r >  y/2:  i = [-2r/y + 2 sqrt((r/y)^2 - (2r/y - 1)(1 - 100/P))] / (2r/y - 1)
//                                                             the issue date holds 29 February
// The quadratic form is the root of P (1 + i/2) (1 + (r - y/2) i / y) = 100 (a half-year
// compounded, then simple interest for the rest), which the self-consistency checks use.
// The formulas are cited from memory. No published worked example is reproduced here: the
// examples this author recalls could not be confirmed digit for digit, so the expected values are
// computed independently with decimal.js at 40 significant digits from the formulas above.
// No spreadsheet-formula package is used as an oracle: at least one popular one counts bill days
// on 30/360 and disagrees with the Treasury's actual-day count.
const FORMULA = 'US Treasury bill formulas, computed with decimal.js at 40 digits (formulas from memory)';
const D = Decimal.clone({ precision: 40 });

function refPrice(d: number, r: number): Decimal {
  return new D(100).times(new D(1).minus(new D(d).times(r).div(360)));
}
function refInvestment(P: Decimal, r: number, y: number): Decimal {
  if (r <= y / 2) return new D(100).minus(P).div(P).times(y).div(r);
  const a = new D(r).div(y);
  const b = a.times(2).minus(1);
  const disc = a.pow(2).minus(b.times(new D(1).minus(new D(100).div(P))));
  return a.times(-2).plus(disc.sqrt().times(2)).div(b);
}

describe('bill price from the discount rate (actual days over 360)', () => {
  const cases: [number, number][] = [
    [0.0525, 28],
    [0.0525, 91],
    [0.0431, 182],
    [0.0399, 364],
    [0.001, 182],
  ];
  for (const [d, r] of cases) {
    it(`d = ${d}, ${r} days`, () => {
      expectClose(billPriceFromDiscountYield(d, r), refPrice(d, r).toNumber(), 2e-14, FORMULA);
      expectClose(billDiscountYieldFromPrice(billPriceFromDiscountYield(d, r), r), d, 5e-15, 'round trip of the price formula (100 - P cancels about two digits)');
    });
  }
});

describe('the year basis of the investment rate: 366 when the following year holds 29 February', () => {
  it.each([
    ['2027-03-11', 366, '29 Feb 2028 falls in the year after'],
    ['2025-06-05', 365, 'no 29 February in the year after'],
    ['2027-02-28', 365, 'the year after ends 2028-02-28, before 29 February'],
    ['2028-02-29', 365, 'issued on 29 February: the year after does not hold another'],
    ['2027-12-01', 366, '29 Feb 2028 falls in the year after'],
  ] as [string, number, string][])('%s -> %i (%s)', (settlement, y) => {
    expect(billYearBasis(settlement)).toBe(y);
  });
});

describe('investment rate (coupon-equivalent yield)', () => {
  const cases: [string, string, number, string][] = [
    ['2027-03-11', '2027-06-10', 0.0525, '13-week bill (91 days), simple form'],
    ['2027-03-11', '2027-09-09', 0.0431, '26-week bill (182 days), simple form'],
    ['2025-06-05', '2026-06-04', 0.0399, '52-week bill (364 days), quadratic form, 365-day year'],
    ['2027-03-11', '2028-03-09', 0.0399, '52-week bill (364 days), quadratic form, 366-day year'],
    ['2025-06-05', '2025-12-05', 0.0412, '183 days on a 365-day year: just beyond a half-year, quadratic form'],
    ['2027-03-11', '2027-09-10', 0.0412, '183 days on a 366-day year: a half-year, simple form'],
  ];
  for (const [settlement, maturity, d, what] of cases) {
    it(what, () => {
      const r = daysBetween(settlement, maturity);
      const y = billYearBasis(settlement);
      const P = refPrice(d, r);
      const i = billInvestmentYield(P.toNumber(), settlement, maturity);
      expectClose(i, refInvestment(P, r, y).toNumber(), 1e-14, FORMULA);
      // Self-consistency: the investment rate compounds back to the price.
      const p = P.toNumber();
      const back = r <= y / 2 ? p * (1 + (i * r) / y) : p * (1 + i / 2) * (1 + ((r - y / 2) * i) / y);
      expectClose(back, 100, 1e-11, 'the investment rate grows the price back to 100 (Treasury definition)');
      // The investment rate of a bill always exceeds its discount rate.
      expect(i).toBeGreaterThan(d);
    });
  }
  it('the two forms nearly agree across the half-year boundary (182 vs 183 days, 365-day year)', () => {
    const d = 0.05;
    const i182 = billInvestmentYield(billPriceFromDiscountYield(d, 182), '2025-06-05', '2025-12-04');
    const i183 = billInvestmentYield(billPriceFromDiscountYield(d, 183), '2025-06-05', '2025-12-05');
    // One more day at 5 % moves the yield by well under a basis point; a wrong branch would not.
    expect(Math.abs(i183 - i182)).toBeLessThan(5e-5);
  });
});

describe('a bill quote in a workspace', () => {
  it('its discount factor at maturity is the price per 100 over 100, to the last bit', () => {
    const doc = {
      format: 'tenorscope-workspace',
      version: 1,
      settlement: '2027-03-11',
      curve: { interpolation: 'log-linear-discount' },
      quotes: [
        { kind: 'bill', maturity: '2027-06-10', discountYield: 0.0525 },
        { kind: 'bill', maturity: '2027-09-09', price: 97.82 },
      ],
    };
    const b = buildCurve(doc);
    expect(b.errors).toEqual([]);
    const df1 = discountOn(b.curve!, '2027-06-10');
    const df2 = discountOn(b.curve!, '2027-09-09');
    if (!df1.ok || !df2.ok) throw new Error('query failed');
    expectClose(df1.value.discount, refPrice(0.0525, 91).div(100).toNumber(), 2e-16, FORMULA);
    expectClose(df2.value.discount, 0.9782, 2e-16, 'price 97.82 per 100');
    for (const r of b.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
  });
});
