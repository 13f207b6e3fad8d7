// Small workspace documents for the tests, on markets of our own invention: every quote below is
// invented test and demo data, not market data from any source. Tests pick the quotes they need,
// in the order they list them (quote indices in a test follow that order), and workspaceDoc()
// wraps them in a workspace document.

/** One quote of a workspace document, as a test writes it. */
export type Quote = Readonly<Record<string, string | number | boolean>>;

export interface DocOptions {
  readonly settlement?: string;
  readonly dayCount?: string;
  readonly interpolation?: string;
  /** Left out of the document when not given (the engine's default applies). */
  readonly extrapolation?: string;
}

// A type alias, not an interface, so that it converts to Record<string, unknown> as a literal did.
export type WorkspaceDoc = {
  format: 'tenorscope-workspace';
  version: 1;
  settlement: string;
  curve: { dayCount: string; interpolation: string; extrapolation?: string };
  quotes: Quote[];
};

/** Settlement date of the invented 2027 market below. */
export const INVENTED_2027_SETTLEMENT = '2027-03-10';

/**
 * A workspace document with these quotes (each copied, so two documents never share a quote
 * object). Defaults: settlement 2027-03-10 (the invented 2027 market), ACT/365F, monotone-convex,
 * no extrapolation key.
 */
export function workspaceDoc(quotes: readonly Quote[], options: DocOptions = {}): WorkspaceDoc {
  const curve: WorkspaceDoc['curve'] = { dayCount: options.dayCount ?? 'ACT/365F', interpolation: options.interpolation ?? 'monotone-convex' };
  if (options.extrapolation !== undefined) curve.extrapolation = options.extrapolation;
  return {
    format: 'tenorscope-workspace',
    version: 1,
    settlement: options.settlement ?? INVENTED_2027_SETTLEMENT,
    curve,
    quotes: quotes.map((q) => ({ ...q })),
  };
}

/**
 * An invented market settling 2027-03-10 (test and demo data), by quote. Some instruments come
 * twice, quoted two ways (the 1Y zero by price and by rate, the 2031 bond by yield and by price).
 */
export const INVENTED_2027 = {
  depo1M: { kind: 'deposit', tenor: '1M', rate: 0.0281 },
  depo3M: { kind: 'deposit', tenor: '3M', rate: 0.0287 },
  depo6M: { kind: 'deposit', tenor: '6M', rate: 0.0291 },
  bill6M: { kind: 'bill', maturity: '2027-09-09', discountYield: 0.0285 },
  zero1Y: { kind: 'zero', tenor: '1Y', price: 97.12 },
  zero1YRate: { kind: 'zero', tenor: '1Y', rate: 0.029 },
  bond2029: { kind: 'bond', maturity: '2029-03-10', coupon: 0.031, frequency: 2, cleanPrice: 100.2 },
  bond2031Yield: { kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, frequency: 2, yield: 0.0331 },
  bond2031Price: { kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, frequency: 2, cleanPrice: 99.6 },
  bond2034: { kind: 'bond', maturity: '2034-05-15', coupon: 0.04, frequency: 2, cleanPrice: 103.1 },
  swap2Y: { kind: 'swap', tenor: '2Y', rate: 0.031 },
  swap5Y: { kind: 'swap', tenor: '5Y', rate: 0.0335 },
  swap7Y: { kind: 'swap', tenor: '7Y', rate: 0.0342 },
  swap10Y: { kind: 'swap', tenor: '10Y', rate: 0.0351 },
  swap30Y: { kind: 'swap', tenor: '30Y', rate: 0.0366 },
} as const satisfies Record<string, Quote>;

/**
 * An invented market valued 2026-12-02 for the smooth fit's tests: deposits, a bill, a zero, an OIS,
 * swaps and bonds by yield and by price (one settled at spot on a calendar).
 */
export const INVENTED_2026_FIT: readonly Quote[] = [
  { kind: 'deposit', tenor: '1M', rate: 0.0383 },
  { kind: 'deposit', tenor: '3M', rate: 0.0379 },
  { kind: 'bill', maturity: '2027-06-03', discountYield: 0.0368 },
  { kind: 'zero', tenor: '1Y', rate: 0.0352, compounding: 'semiannual', dayCount: 'ACT/365F' },
  { kind: 'ois', tenor: '2Y', rate: 0.0345 },
  { kind: 'swap', tenor: '3Y', rate: 0.0349 },
  { kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, frequency: 2, yield: 0.0361 },
  { kind: 'bond', maturity: '2033-05-15', coupon: 0.04, frequency: 2, cleanPrice: 101.2 },
  { kind: 'swap', tenor: '10Y', rate: 0.0381 },
  { kind: 'bond', maturity: '2035-02-15', coupon: 0.0375, frequency: 2, cleanPrice: 99.4, calendar: 'us-gov-securities', spotLag: 1 },
];

/** The invented 2027 market with every quote kind, price and rate quotes (nine quotes). */
export const INVENTED_2027_EVERY_KIND: readonly Quote[] = [
  INVENTED_2027.depo1M,
  INVENTED_2027.depo3M,
  INVENTED_2027.bill6M,
  INVENTED_2027.zero1Y,
  INVENTED_2027.bond2029,
  INVENTED_2027.bond2031Yield,
  INVENTED_2027.swap7Y,
  INVENTED_2027.swap10Y,
  INVENTED_2027.swap30Y,
];

/**
 * An invented 2022 overnight market (version 2 engine document): deposits to one year and OIS to
 * three years, on the default weekends-only calendar, for tests of turns and meeting steps.
 */
export const INVENTED_2022_OVERNIGHT = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-03-01',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  quotes: [
    { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
    { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
    { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
    { kind: 'deposit', maturity: '2023-03-01', rate: 0.025 },
    { kind: 'ois', tenor: '2Y', rate: 0.028 },
    { kind: 'ois', tenor: '3Y', rate: 0.029 },
  ],
} as const;

/**
 * The invented 2022 overnight market stepped on SOFR's 2022-2023 effective dates
 * (MARKET-CONVENTIONS.md section h), with a year-end turn; quotes invented.
 */
export const INVENTED_2022_SOFR_STEPS = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-03-01',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 }],
  meetingSteps: { on: true, effectiveDates: ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'] },
  quotes: [
    { kind: 'deposit', maturity: '2022-03-10', rate: 0.0005 },
    { kind: 'deposit', maturity: '2022-06-01', rate: 0.0125 },
    { kind: 'deposit', maturity: '2022-12-01', rate: 0.0165 },
    { kind: 'deposit', maturity: '2023-03-01', rate: 0.02325 },
    { kind: 'ois', tenor: '2Y', rate: 0.032 },
    { kind: 'ois', tenor: '3Y', rate: 0.034 },
    { kind: 'ois', tenor: '5Y', rate: 0.033 },
  ],
};

/**
 * Three deposits (ACT/360 money market) made from a flat 4% continuously compounded forward on
 * ACT/365F and a 25 bp turn on 2022-12-30 over its 3 days (weekends calendar: Friday to Monday),
 * valued 2022-12-15: the hand calculation of test/core/bootstrap/turnSolve.test.ts (J = exp(-s d / 360),
 * section h of the project's market-conventions notes). Invented rates; no turn of its own (each test adds it).
 */
export const depositFromLnGrowth = (lnGrowth: number, days: number): number => (Math.expm1(lnGrowth) * 360) / days;
export const INVENTED_2022_YEAR_END_DEPOSITS = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-12-15',
  curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' },
  quotes: [
    { kind: 'deposit', maturity: '2022-12-22', rate: depositFromLnGrowth((0.04 * 7) / 365, 7) },
    { kind: 'deposit', maturity: '2023-01-17', rate: depositFromLnGrowth((0.04 * 33) / 365 + (0.0025 * 3) / 360, 33) },
    { kind: 'deposit', maturity: '2023-03-15', rate: depositFromLnGrowth((0.04 * 90) / 365 + (0.0025 * 3) / 360, 90) },
  ],
};

/**
 * An invented 2022 overnight market with a year-end turn solved from the OIS that spans it (the
 * fourth quote, to 17 Jan 2023): deposits to December, OIS to five years on the US government
 * securities calendar, for tests that risk and fit views read the curve with its turns.
 */
const US_OIS = { calendar: 'us-gov-securities', spotLag: 0, paymentLag: 0 } as const;
export const INVENTED_2022_SOLVED_TURN = {
  format: INVENTED_2022_OVERNIGHT.format,
  version: INVENTED_2022_OVERNIGHT.version,
  valuationDate: INVENTED_2022_OVERNIGHT.valuationDate,
  curve: INVENTED_2022_OVERNIGHT.curve,
  quotes: [
    // The deposits to December of INVENTED_2022_OVERNIGHT.
    ...INVENTED_2022_OVERNIGHT.quotes.slice(0, 3),
    { kind: 'ois', maturity: '2023-01-17', rate: 0.01851, ...US_OIS },
    { kind: 'ois', tenor: '1Y', rate: 0.021, ...US_OIS },
    { kind: 'ois', tenor: '2Y', rate: 0.028, ...US_OIS },
    { kind: 'ois', tenor: '3Y', rate: 0.029, ...US_OIS },
    { kind: 'ois', tenor: '5Y', rate: 0.03, ...US_OIS },
  ],
  turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', solveFrom: 3 }],
};
