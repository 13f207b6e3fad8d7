import { describe, expect, it } from 'vitest';
import { quoteConvention, quoteConventionTag, validateWorkspace, type Quote } from '../../../src/core/index.ts';
import { workspaceDoc } from '../../helpers/markets.ts';

// The quote check's "Quoted as" tag: the kind's quote convention (a value from its module) written
// in one place. Every rate carries its compounding and day count, every price its unit. The
// conventions themselves: a bill's discount yield is on a 360-day year by actual days (US Treasury,
// TreasuryDirect, "Treasury Bills" formulas); a bond's ICMA yield compounds at the coupon frequency
// (ICMA Rule 251, cited from memory); a money-market deposit is simple interest. Quotes are invented.

const quote = (raw: Record<string, string | number>): Quote => {
  const v = validateWorkspace(workspaceDoc([raw]));
  expect(v.errors).toEqual([]);
  return v.workspace!.quotes[0]!;
};
const tag = (raw: Record<string, string | number>): string => quoteConventionTag(quoteConvention(quote(raw)));

describe('quoteConventionTag(quoteConvention(q))', () => {
  it('writes a rate with its compounding and day count', () => {
    expect(tag({ kind: 'deposit', tenor: '3M', rate: 0.0287 })).toBe('simple, ACT/360');
    expect(tag({ kind: 'bill', maturity: '2027-09-09', discountYield: 0.0285 })).toBe('discount, ACT/360');
    expect(tag({ kind: 'zero', tenor: '1Y', rate: 0.029 })).toBe('ann, ACT/365F');
    expect(tag({ kind: 'zero', tenor: '1Y', rate: 0.029, compounding: 'continuous', dayCount: 'ACT/360' })).toBe('cont, ACT/360');
    expect(tag({ kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, yield: 0.0331 })).toBe('s.a., ACT/ACT-ICMA');
    expect(tag({ kind: 'swap', tenor: '7Y', rate: 0.0342 })).toBe('ann, 30/360');
    expect(tag({ kind: 'swap', tenor: '7Y', rate: 0.0342, frequency: 4, dayCount: 'ACT/360' })).toBe('qtr, ACT/360');
  });

  it('writes a price per 100 face, clean for a bond', () => {
    expect(tag({ kind: 'bill', maturity: '2027-09-09', price: 98.6 })).toBe('per 100');
    expect(tag({ kind: 'zero', tenor: '1Y', price: 97.12 })).toBe('per 100');
    expect(tag({ kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, cleanPrice: 99.6 })).toBe('clean, per 100');
  });
});
