/**
 * Convexity adjustments of rate futures: the futures rate minus the forward rate of the same
 * period, which daily margining makes positive (MARKET-CONVENTIONS.md section e). Two stated
 * one-factor models fill a contract's adjustment from a volatility the user sets:
 *
 * - `ho-lee`: Hull's adjustment for the Ho-Lee model, forward = futures - sigma^2 t1 t2 / 2 with
 *   both rates continuously compounded on ACT/365 (J. Hull, Options, Futures, and Other
 *   Derivatives, the convexity adjustment of Eurodollar futures and its Technical Note 1).
 * - `hull-white`: the Hull-White model with mean reversion a (G. Kirikos and D. Novak, "Convexity
 *   Conundrums", Risk, March 1997): with B(x) = (1 - e^(-a x)) / a and dT = T - t,
 *   z = sigma^2 / 2 (B(2t) B(dT)^2 + B(dT) B(t)^2) and the bias on the simple futures rate F is
 *   (1 - e^(-z)) (F + 1 / dT). As a -> 0 it differs from the Ho-Lee figure (about 0.2 bp at five
 *   years on the published inputs): the model is shown with every adjusted rate.
 *
 * Units: sigma is the short rate's absolute volatility, a decimal per square root of a year
 * (0.01 = 100 bp a year); a per year; t1, t2 (and t, T) in years on ACT/365F from the valuation date,
 * t1 the start of the reference period and t2 its end (for a rate compounded or averaged over its
 * period, the period's start stands for the futures' fixing: a modelling choice, stated). Results
 * are in basis points on the futures rate's own basis (simple, ACT/360 over the period).
 */

import { formatNumber, formatPercent } from '../format/quantities.ts';

export const CONVEXITY_MODELS = ['ho-lee', 'hull-white'] as const;
export type ConvexityModelId = (typeof CONVEXITY_MODELS)[number];

/** The inputs a model takes: volatility 0 to 10% a year (absolute, decimal), mean reversion 0 to 2 a year. */
export const CONVEXITY_VOLATILITY_MAX = 0.1;
export const MEAN_REVERSION_MAX = 2;

/** A model and its inputs: `volatility` (decimal per root year), `meanReversion` (per year; Hull-White only). */
export interface ConvexityModel {
  readonly model: ConvexityModelId;
  readonly volatility: number;
  readonly meanReversion: number;
}

/** What filled a contract's adjustment: the model, its inputs and the times it read. */
export interface ConvexityFill extends ConvexityModel {
  /** Years (ACT/365F) from the valuation date to the reference period's start (0 once it has begun) and end. */
  readonly t1: number;
  readonly t2: number;
}

/** A model as the document writes it (`curve.futuresConvexity`): Ho-Lee takes no mean reversion. */
export const convexityModelFields = (m: ConvexityModel): Readonly<Record<string, unknown>> =>
  m.model === 'ho-lee' ? { model: m.model, volatility: m.volatility } : { model: m.model, volatility: m.volatility, meanReversion: m.meanReversion };

/** Hull's Ho-Lee adjustment, continuously compounded on ACT/365: sigma^2 t1 t2 / 2 (decimal). */
export const hoLeeAdjustment = (sigma: number, t1: number, t2: number): number => 0.5 * sigma * sigma * t1 * t2;

/**
 * The simple rate R over a period of `days` days quoted on ACT/360, as a continuously compounded
 * rate on ACT/365: ln(1 + R days / 360) x 365 / days. (For days = 91.25 this is Hull's conversion:
 * R x 365 / 360 quarterly compounded, then 4 ln(1 + R' / 4).)
 */
export const simpleToContinuous = (rate: number, days: number): number => (Math.log1p((rate * days) / 360) * 365) / days;

/** The inverse of simpleToContinuous: (e^(r days / 365) - 1) x 360 / days. */
export const continuousToSimple = (rate: number, days: number): number => (Math.expm1((rate * days) / 365) * 360) / days;

/** B(x) = (1 - e^(-a x)) / a, exact as a -> 0 (it tends to x). */
const hullWhiteB = (a: number, x: number): number => (a === 0 ? x : -Math.expm1(-a * x) / a);

/**
 * Kirikos and Novak's Hull-White bias of the simple futures rate F (decimal) for a period from t to
 * T years whose rate accrues over `accrual` years on its own basis: (1 - e^(-z)) (F + 1 / accrual).
 */
export function hullWhiteBias(futuresRate: number, t: number, T: number, accrual: number, sigma: number, a: number): number {
  const bDt = hullWhiteB(a, T - t);
  const bT = hullWhiteB(a, t);
  const z = ((sigma * sigma) / 2) * (hullWhiteB(a, 2 * t) * bDt * bDt + bDt * bT * bT);
  return -Math.expm1(-z) * (futuresRate + 1 / accrual);
}

/**
 * The adjustment in bp of a futures rate (simple, ACT/360, decimal) over a reference period of
 * `days` days from t1 to t2 years: Ho-Lee through the continuous ACT/365 rate and back; Hull-White
 * on the simple rate directly, the period accruing days / 360.
 */
export function modelConvexityBp(m: ConvexityModel, futuresRate: number, days: number, t1: number, t2: number): number {
  if (m.model === 'ho-lee') {
    const continuous = simpleToContinuous(futuresRate, days);
    return (futuresRate - continuousToSimple(continuous - hoLeeAdjustment(m.volatility, t1, t2), days)) * 1e4;
  }
  return hullWhiteBias(futuresRate, t1, t2, days / 360, m.volatility, m.meanReversion) * 1e4;
}

/** The model's name as shown: "Ho-Lee (Hull)" or "Hull-White (Kirikos-Novak)". */
export const convexityModelName = (m: ConvexityModelId): string => (m === 'ho-lee' ? 'Ho-Lee (Hull)' : 'Hull-White (Kirikos-Novak)');

/** A model with its inputs as shown: "Hull-White (Kirikos-Novak) model, σ 1.0000% a year, a 0.0300 a year". */
export function convexityModelText(m: ConvexityModel): string {
  const a = m.model === 'hull-white' ? `, a ${formatNumber(m.meanReversion, 4)} a year` : '';
  return `${convexityModelName(m.model)} model, \u03c3 ${formatPercent(m.volatility)} a year${a}`;
}
