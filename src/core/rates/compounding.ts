/**
 * Compounding conventions. With tau the year fraction of the period under the rate's day count:
 *   simple       DF = 1 / (1 + r tau)
 *   periodic     DF = (1 + r/m)^(-m tau), m = 1, 2, 4, 12 (annual, semiannual, quarterly, monthly)
 *   continuous   DF = exp(-r tau)
 * Rates are decimals per annum (0.05 = 5 %). Common practice; e.g. Hull, "Options, Futures and
 * Other Derivatives", chapter on interest rates (cited from memory).
 */
export const COMPOUNDINGS = ['simple', 'annual', 'semiannual', 'quarterly', 'monthly', 'continuous'] as const;
export type Compounding = (typeof COMPOUNDINGS)[number];

export const isCompounding = (x: unknown): x is Compounding => typeof x === 'string' && (COMPOUNDINGS as readonly string[]).includes(x);

/** Periods per year of a periodic compounding; 0 for simple, Infinity for continuous. */
export function periodsPerYear(c: Compounding): number {
  switch (c) {
    case 'simple':
      return 0;
    case 'annual':
      return 1;
    case 'semiannual':
      return 2;
    case 'quarterly':
      return 4;
    case 'monthly':
      return 12;
    case 'continuous':
      return Infinity;
  }
}

/**
 * ln DF over a period of tau years for a rate r in compounding c.
 * Domain: tau > 0; simple needs 1 + r tau > 0 and periodic 1 + r/m > 0 (else the result is NaN and
 * callers report `non-positive-discount`).
 */
export function lnDiscountFromRate(r: number, c: Compounding, tau: number): number {
  if (c === 'continuous') return -r * tau;
  if (c === 'simple') return -Math.log1p(r * tau);
  const m = periodsPerYear(c);
  return -m * tau * Math.log1p(r / m);
}

export const discountFromRate = (r: number, c: Compounding, tau: number): number => Math.exp(lnDiscountFromRate(r, c, tau));

/**
 * The rate in compounding c over tau years (tau > 0) whose discount factor is exp(lnDf).
 *   simple     r = (1/DF - 1)/tau = expm1(-lnDF)/tau
 *   periodic   r = m (DF^(-1/(m tau)) - 1) = m expm1(-lnDF/(m tau))
 *   continuous r = -lnDF/tau
 * expm1 keeps full precision for short periods and small rates.
 */
export function rateFromLnDiscount(lnDf: number, c: Compounding, tau: number): number {
  if (c === 'continuous') return -lnDf / tau;
  if (c === 'simple') return Math.expm1(-lnDf) / tau;
  const m = periodsPerYear(c);
  return m * Math.expm1(-lnDf / (m * tau));
}

export const rateFromDiscount = (df: number, c: Compounding, tau: number): number => rateFromLnDiscount(Math.log(df), c, tau);

/**
 * Converts a rate between compoundings over the same period of tau years (on the same day count).
 * tau matters whenever `simple` is involved; periodic and continuous conversions do not depend on it.
 */
export const convertRate = (r: number, from: Compounding, to: Compounding, tau: number): number =>
  from === to ? r : rateFromLnDiscount(lnDiscountFromRate(r, from, tau), to, tau);

/**
 * The limit of the rate in compounding c as the period shrinks to zero, given the instantaneous
 * continuously compounded forward f (per year of the same clock): simple and continuous give f,
 * periodic m (exp(f/m) - 1).
 */
export function rateLimitFromInstantaneous(f: number, c: Compounding): number {
  if (c === 'continuous' || c === 'simple') return f;
  const m = periodsPerYear(c);
  return m * Math.expm1(f / m);
}
