import { describe, expect, it } from 'vitest';
import { bondDirtyFromYield, bondSchedule, bondYieldFromDirty, daysBetween } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

describe('bond price from yield (ICMA convention, settlement on a coupon date)', () => {
  // F. J. Fabozzi, "Bond Markets, Analysis and Strategies", pricing a bond: 20 years, 10 % coupon
  // paid semiannually, required yield 11 % -> price 91.9770 per 100 (cited from memory).
  const s = bondSchedule({ maturity: '2047-03-15', coupon: 0.1, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false }, '2027-03-15');
  it('40 coupons of 5 and the principal; no accrued interest; first exponent 1', () => {
    expect(s.dates).toHaveLength(40);
    expect(s.amounts[0]).toBe(5);
    expect(s.amounts[39]).toBe(105);
    expect(s.accrued).toBe(0);
    expect(s.w).toBe(1);
  });
  it('prices at 91.9770 (the textbook figure) and at the closed-form annuity value', () => {
    const p = bondDirtyFromYield(s, 0.11).price;
    // The remembered figure is trusted to about 1e-4 (the exact value is 91.97694).
    expectClose(p, 91.977, 1e-4, 'Fabozzi, Bond Markets, Analysis and Strategies (from memory)');
    const v = 1 / 1.055;
    const closed = (5 * (1 - v ** 40)) / 0.055 + 100 * v ** 40;
    expectClose(p, closed, 1e-11, 'closed-form level annuity plus principal (hand calculation)');
  });
  it('the yield recovered from the price is the yield priced (round trip), and the derivative is right', () => {
    const { price, dPdy } = bondDirtyFromYield(s, 0.11);
    expectClose(bondYieldFromDirty(s, price)!, 0.11, 1e-15, 'round trip of the price-yield formula');
    const h = 1e-6;
    const fd = (bondDirtyFromYield(s, 0.11 + h).price - bondDirtyFromYield(s, 0.11 - h).price) / (2 * h);
    expectClose(dPdy, fd, 1e-5, 'central difference of the price');
  });
});

describe('accrued interest on ACT/ACT-ICMA uses the actual days of the coupon period', () => {
  // 31 CFR Part 356, Appendix B, Table 1: a February-to-August half-year (1st or 15th) has 181 days
  // in a regular year and 182 in a leap year.
  const TABLE = '31 CFR 356 Appendix B, Table 1 (days in a half-year)';
  it('2027: 15 Feb to 15 Aug is 181 days; accrued to 15 May is 89/181 of the half-year coupon', () => {
    const s = bondSchedule({ maturity: '2030-08-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false }, '2027-05-15');
    expect(s.previous).toBe('2027-02-15');
    expect(daysBetween(s.previous, s.dates[0]!)).toBe(181);
    expectClose(s.accrued, (2 * 89) / 181, 1e-14, TABLE);
    expectClose(s.w, 92 / 181, 1e-15, 'ICMA: fraction of the period still to run');
  });
  it('2028 (leap): 15 Feb to 15 Aug is 182 days', () => {
    const s = bondSchedule({ maturity: '2030-08-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false }, '2028-05-15');
    expect(daysBetween(s.previous, s.dates[0]!)).toBe(182);
    expectClose(s.accrued, (2 * 90) / 182, 1e-14, TABLE);
  });
  it('a coupon paid on the settlement date is excluded, and nothing has accrued', () => {
    const s = bondSchedule({ maturity: '2030-08-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false }, '2027-08-15');
    expect(s.dates[0]).toBe('2028-02-15');
    expect(s.accrued).toBe(0);
  });
  it('month-end bonds keep month ends with eom (31 Aug, 28/29 Feb)', () => {
    const s = bondSchedule({ maturity: '2030-08-31', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: true }, '2027-05-15');
    expect(s.previous).toBe('2027-02-28');
    expect(s.dates.slice(0, 3)).toEqual(['2027-08-31', '2028-02-29', '2028-08-31']);
  });
});
