import { isoFromSerial, isIsoDate } from '../time/date.ts';
import { decimalFigure, figure, isShown, MINUS, NO_VALUE } from './numberText.ts';

/**
 * Each quantity shown to a person, with its one rounding rule. Every row rounds half away from zero
 * on the value's shortest decimal text, prints a value that rounds to zero as an unsigned zero
 * ("0.0000%", never "−0.0000%"), a negative with one U+2212 minus, and a missing, NaN or infinite
 * value as an em dash "—" (numberText.ts states the rule in full).
 *
 * | quantity                           | function             | input          | shown as            | decimals |
 * |------------------------------------|----------------------|----------------|---------------------|----------|
 * | rate (zero, forward, par, yield,   | formatPercent        | decimal / year | 4.2500%             | 4 in %   |
 * |   return, roll and fit rates)      | formatRate (+ tag)   |                | 4.2500% (cont, ...) |          |
 * | quote rate (a market quote and its | formatQuoteRate      | decimal / year | 4.250000%           | 6 in %   |
 * |   repriced value)                  |                      |                |                     |          |
 * | coupon                             | formatCoupon         | decimal / year | 4.125%              | 3 in %   |
 * | rate in a short list (a printed    | formatRateShort      | decimal / year | 4.25%               | 2 in %   |
 * |   path of legs, a sparkline range) |                      |                |                     |          |
 * | basis points                       | formatBp             | bp             | 12.35 bp            | 2        |
 * | change in basis points             | formatBpChange       | bp             | +12.35 bp           | 2        |
 * | bp figure under a "(bp)" header    | bpFigure             | bp             | 12.35               | 2        |
 * | bp setting (a scenario's shift, as | formatBpSetting      | bp             | +25 bp, −12.5 bp    | as given |
 * |   the user gave it; not rounded)   |                      |                |                     |          |
 * | price per 100 face                 | formatPrice          | per 100        | 101.2500            | 4        |
 * | quote price per 100 face           | formatQuotePrice     | per 100        | 101.250000          | 6        |
 * | money                              | formatMoney          | decimal text   | 1,234,567.89        | 2 (cents)|
 * | money with its unit                | formatAmount         | decimal text   | USD 1,234,567.89    | 2        |
 * | change in money                    | formatMoneySigned    | decimal text   | +1,234.56           | 2        |
 * | date                               | formatDate           | ISO / serial   | 2026-12-02          | -        |
 * | any other figure (discount factor, | formatNumber         | its own unit   | 0.98765432          | the      |
 * |   year fraction, duration, size)   |                      |                |                     | caller's |
 * | count (rows, characters, quotes)   | formatCount          | whole number   | 12,345              | 0        |
 * | percent on a chart axis            | formatAxisPercent    | decimal / year | 4.5%                | the axis |
 * |                                    |                      |                |                     | step's   |
 *
 * Money is rounded from its exact decimal text (decimal.js keeps it exact in the roll analysis; a
 * person checks its digits); every other figure from the double's shortest text, which is exact for
 * what JavaScript prints. Neither needs decimal.js here, so the first screen loads without it.
 */
export const QUANTITY_DECIMALS = {
  rate: 4,
  quoteRate: 6,
  coupon: 3,
  rateShort: 2,
  bp: 2,
  price: 4,
  quotePrice: 6,
  money: 2,
} as const;

/** A decimal rate in percent, 4 decimals: 0.0425 -> "4.2500%", -0.001 -> "−0.1000%". */
export const formatPercent = (r: number | null | undefined): string => percent(r, QUANTITY_DECIMALS.rate);

/**
 * A decimal rate with its convention tag: formatRate(0.0425, 'cont, ACT/365F') = "4.2500% (cont, ACT/365F)".
 * A missing rate shows as the dash alone.
 */
export const formatRate = (r: number | null | undefined, tag: string): string => {
  const t = formatPercent(r);
  return t === NO_VALUE ? t : `${t} (${tag})`;
};

/** A market quote (or its repriced value) in percent, 6 decimals: "4.250000%". */
export const formatQuoteRate = (r: number | null | undefined): string => percent(r, QUANTITY_DECIMALS.quoteRate);

/** A coupon in percent, 3 decimals: "4.125%". */
export const formatCoupon = (r: number | null | undefined): string => percent(r, QUANTITY_DECIMALS.coupon);

/** A rate in a short list, 2 decimals: "4.25%". */
export const formatRateShort = (r: number | null | undefined): string => percent(r, QUANTITY_DECIMALS.rateShort);

/** The bare percent figure without the sign "%" (for a column whose header says "%"): "4.2500". */
export const percentFigure = (r: number | null | undefined, quantity: 'rate' | 'rateShort' = 'rate'): string => figure(r, QUANTITY_DECIMALS[quantity], { scale: 2 });

function percent(r: number | null | undefined, dp: number): string {
  const t = figure(r, dp, { scale: 2 });
  return t === NO_VALUE ? t : `${t}%`;
}

/** Basis points, 2 decimals: "12.35 bp", "−3.00 bp". The input is in bp. */
export const formatBp = (bp: number | null | undefined): string => withUnit(figure(bp, QUANTITY_DECIMALS.bp), 'bp');

/** A change in basis points with its sign: "+12.35 bp", "−3.00 bp", "0.00 bp". The input is in bp. */
export const formatBpChange = (bp: number | null | undefined): string => withUnit(figure(bp, QUANTITY_DECIMALS.bp, { plus: true }), 'bp');

/**
 * A bp setting as the user gave it (a scenario's shift), signed and unrounded: its shortest decimal
 * text, "+25 bp", "−12.5 bp", "0 bp". A setting is an input echoed back, so it keeps every digit typed.
 */
export const formatBpSetting = (bp: number | null | undefined): string => {
  if (!isShown(bp)) return NO_VALUE;
  const body = String(Math.abs(bp));
  return `${bp > 0 ? '+' : bp < 0 ? MINUS : ''}${/e/.test(body) ? figure(Math.abs(bp), 20).replace(/\.?0+$/, '') : body} bp`;
};

/** A bp figure for a column headed "(bp)": "12.35". */
export const bpFigure = (bp: number | null | undefined): string => figure(bp, QUANTITY_DECIMALS.bp);

/** A price per 100 face, 4 decimals: "101.2500". */
export const formatPrice = (p: number | null | undefined): string => figure(p, QUANTITY_DECIMALS.price);

/** A quoted price per 100 face (or its repriced value), 6 decimals: "101.250000". */
export const formatQuotePrice = (p: number | null | undefined): string => figure(p, QUANTITY_DECIMALS.quotePrice);

/** Any other figure (discount factor, year fraction, duration) with the caller's decimals, under the same rule. */
export const formatNumber = (x: number | null | undefined, dp: number): string => figure(x, dp);

/** A count with thousands grouped: 12345 -> "12,345". */
export { formatCount } from './marks.ts';

/**
 * A percent tick on a chart axis: `dp` decimals (from the axis step), trailing zeros dropped down to
 * `minDp`: formatAxisPercent(0.045, 2, 1) = "4.5%", formatAxisPercent(-0.0025, 2, 1) = "−0.25%".
 */
export function formatAxisPercent(r: number, dp: number, minDp = dp): string {
  let t = figure(r, dp, { scale: 2 });
  if (t === NO_VALUE) return t;
  for (let k = dp; k > minDp && t.endsWith('0'); k--) t = t.slice(0, -1);
  return `${t.endsWith('.') ? t.slice(0, -1) : t}%`;
}

const withUnit = (t: string, unit: string): string => (t === NO_VALUE ? t : `${t} ${unit}`);

/** An amount of money (a decimal.js value, or its text): cents, half away from zero, thousands grouped: "1,234,567.89", "−12.00". */
export const formatMoney = (m: { toFixed(): string } | string): string => decimalFigure(m, QUANTITY_DECIMALS.money, { group: true });

/** A difference in money with its sign: "+1,234.56", "−12.00", "0.00". */
export const formatMoneySigned = (m: { toFixed(): string } | string): string => decimalFigure(m, QUANTITY_DECIMALS.money, { group: true, plus: true });

/** Money with its unit (an ISO 4217 code, or the generic sign ¤): "USD 1,234,567.89". */
export const formatAmount = (m: { toFixed(): string } | string, unit: string): string => `${unit} ${formatMoney(m)}`;

/**
 * A date as the workbench writes every date, ISO 8601 "YYYY-MM-DD": from ISO text (checked) or a day
 * serial (days since 1970-01-01). Anything else shows as an em dash.
 */
export function formatDate(d: string | number | null | undefined): string {
  if (typeof d === 'string') return isIsoDate(d) ? d : NO_VALUE;
  if (typeof d === 'number' && Number.isInteger(d)) return isoFromSerial(d);
  return NO_VALUE;
}
