/** The engine document the README shows under "Workspace document" (invented quotes), for tests that read it. */
export const README_DOCUMENT = {
  format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none' },
  quotes: [
    { kind: 'deposit', tenor: '3M', rate: 0.031, dayCount: 'ACT/360' },
    { kind: 'bill', maturity: '2027-09-09', discountYield: 0.03 },
    { kind: 'zero', tenor: '6M', price: 98.4 },
    { kind: 'bond', maturity: '2031-06-15', coupon: 0.04, frequency: 2, cleanPrice: 101.25 },
    { kind: 'swap', tenor: '5Y', rate: 0.0375, frequency: 1, dayCount: '30/360' },
  ],
};
