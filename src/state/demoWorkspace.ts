import { DEFAULT_DISPLAY, WORKBENCH_FORMAT, WORKBENCH_VERSION, type QuoteRow, type RowText, type WorkbenchDocument } from '../core/index.ts';

/**
 * The built-in demo: an invented market (not any real market's prices) settling on Tuesday
 * 15 December 2026. Money-market rates sit above the 2- to 5-year bond yields (an inverted front
 * end), and long swap rates rise to a hump near 20 years before easing off at 30 years.
 * The quotes were priced off one smooth invented zero curve and rounded as a desk would quote them
 * (rates to 0.1 bp, prices to 0.001), so the forwards show the market's shape rather than noise.
 */
const DEMO_ROWS: readonly (Partial<RowText> & Pick<RowText, 'kind' | 'maturity'>)[] = [
  { kind: 'deposit', maturity: '1W', rate: '4.455' },
  { kind: 'deposit', maturity: '1M', rate: '4.412' },
  { kind: 'deposit', maturity: '2M', rate: '4.360' },
  { kind: 'deposit', maturity: '3M', rate: '4.316' },
  { kind: 'bill', maturity: '6M', rate: '4.104' },
  { kind: 'bill', maturity: '2027-09-14', price: '96.988' },
  { kind: 'bill', maturity: '1Y', rate: '3.863' },
  { kind: 'bond', maturity: '2028-05-15', coupon: '4.25', price: '100.440', frequency: '2' },
  { kind: 'bond', maturity: '2028-11-15', coupon: '3.875', price: '100.032', frequency: '2' },
  { kind: 'bond', maturity: '2029-11-15', coupon: '3.75', price: '99.830', frequency: '2' },
  { kind: 'zero', maturity: '2030-12-15', price: '85.862' },
  { kind: 'bond', maturity: '2031-11-15', coupon: '3.625', price: '98.746', frequency: '2' },
  { kind: 'bond', maturity: '2033-11-15', coupon: '3.875', price: '98.986', frequency: '2' },
  { kind: 'swap', maturity: '10Y', rate: '4.240' },
  { kind: 'swap', maturity: '12Y', rate: '4.301' },
  { kind: 'swap', maturity: '15Y', rate: '4.355' },
  { kind: 'swap', maturity: '20Y', rate: '4.384' },
  { kind: 'swap', maturity: '25Y', rate: '4.378' },
  { kind: 'swap', maturity: '30Y', rate: '4.361' },
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
