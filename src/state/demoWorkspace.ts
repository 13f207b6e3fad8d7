import { DEFAULT_DISPLAY, WORKBENCH_FORMAT, WORKBENCH_VERSION, type QuoteRow, type RowText, type WorkbenchDocument } from '../core/index.ts';

/**
 * The built-in demo: an invented market (not any real market's prices) settling on Tuesday
 * 15 December 2026. Money-market rates sit above the 2- to 5-year bond yields (an inverted front
 * end), and long swap rates rise to a hump near 20 years before easing off at 30 years.
 */
const DEMO_ROWS: readonly (Partial<RowText> & Pick<RowText, 'kind' | 'maturity'>)[] = [
  { kind: 'deposit', maturity: '1W', rate: '4.28' },
  { kind: 'deposit', maturity: '1M', rate: '4.32' },
  { kind: 'deposit', maturity: '2M', rate: '4.37' },
  { kind: 'deposit', maturity: '3M', rate: '4.40' },
  { kind: 'bill', maturity: '6M', rate: '4.34' },
  { kind: 'bill', maturity: '2027-09-14', price: '96.78' },
  { kind: 'bill', maturity: '1Y', rate: '4.12' },
  { kind: 'bond', maturity: '2028-05-15', coupon: '4.25', price: '100.28', frequency: '2' },
  { kind: 'bond', maturity: '2028-11-15', coupon: '3.875', price: '99.70', frequency: '2' },
  { kind: 'bond', maturity: '2029-11-15', coupon: '3.75', price: '99.45', frequency: '2' },
  { kind: 'zero', maturity: '2030-12-15', price: '86.20' },
  { kind: 'bond', maturity: '2031-11-15', coupon: '3.625', price: '99.20', frequency: '2' },
  { kind: 'bond', maturity: '2033-11-15', coupon: '3.875', price: '99.60', frequency: '2' },
  { kind: 'swap', maturity: '10Y', rate: '4.02' },
  { kind: 'swap', maturity: '12Y', rate: '4.10' },
  { kind: 'swap', maturity: '15Y', rate: '4.18' },
  { kind: 'swap', maturity: '20Y', rate: '4.22' },
  { kind: 'swap', maturity: '25Y', rate: '4.16' },
  { kind: 'swap', maturity: '30Y', rate: '4.08' },
];

export const DEMO_SETTLEMENT = '2026-12-15';

/** A fresh copy of the demo workspace; `makeId` names the rows. */
export function demoWorkspace(makeId: () => string): WorkbenchDocument {
  const quotes: QuoteRow[] = DEMO_ROWS.map((r) => ({
    id: makeId(),
    enabled: true,
    kind: r.kind,
    maturity: r.maturity,
    rate: r.rate ?? '',
    price: r.price ?? '',
    coupon: r.coupon ?? '',
    frequency: r.frequency ?? '',
    dayCount: r.dayCount ?? '',
  }));
  return {
    format: WORKBENCH_FORMAT,
    version: WORKBENCH_VERSION,
    settlement: DEMO_SETTLEMENT,
    curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'flat-forward' },
    quoteUnit: 'percent',
    quotes,
    display: DEFAULT_DISPLAY,
  };
}
