import Decimal from 'decimal.js';
import { recordMoney, type RollTrace } from './rollTrace.ts';

/**
 * Money for the roll-versus-term analysis, in decimal.js so a typed amount is exact and cash
 * figures are rounded once, to cents, for display only. Amounts are in the workspace's currency
 * (the analysis is currency-neutral; the display unit sign is MONEY_UNIT).
 */
export const MoneyDecimal = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });
export type Money = InstanceType<typeof MoneyDecimal>;

/** The currency-neutral unit sign shown beside money: the generic currency sign. */
export const MONEY_UNIT = '¤';
/** Largest amount accepted: 10^15 money units. */
export const MONEY_MAX = '1e15';

const MONEY_RE = /^\d{1,16}(\.\d{1,6})?$/;
/** Digits grouped in threes by commas, the first group of 1 to 3 digits: "10,000,000". */
const GROUPED_RE = /^\d{1,3}(,\d{3})+(\.\d+)?$/;
/** Amount suffixes: k thousand; m, mm, mn million; b, bn billion (common practice on trading desks; mm is US usage). */
const SUFFIX: Readonly<Record<string, number>> = { k: 3, m: 6, mm: 6, mn: 6, b: 9, bn: 9 };

export type MoneyParse = { readonly ok: true; readonly value: Money } | { readonly ok: false; readonly message: string };

const EXAMPLES = '"1000000", "10,000,000", "250000.50", "10m" or "2.5bn"';

/**
 * Parses a typed amount: digits with an optional decimal point (`250000.50`), thousands grouped
 * by commas (`10,000,000`), or a number with a suffix k, m (mm, mn) or bn (b): `10m` is
 * 10,000,000, `2.5bn` is 2,500,000,000. Exact (decimal.js); at most 6 decimals after the suffix
 * is applied; above 0 and at most 10^15. No signs or exponents.
 */
export function parseMoney(text: string): MoneyParse {
  const t = text.trim();
  const lower = t.toLowerCase();
  const suffix = /^([\d.,]+) ?(k|mm|mn|m|bn|b)$/.exec(lower);
  let body = suffix ? suffix[1]! : lower;
  if (GROUPED_RE.test(body)) body = body.replace(/,/g, '');
  const numberOk = suffix ? /^\d{1,16}(\.\d{1,12})?$/.test(body) : MONEY_RE.test(body);
  if (!numberOk) {
    const hint = body.includes(',') ? '; a comma groups thousands in threes (10,000,000); use a point for decimals' : /[_ ]/.test(t) ? '; group thousands with commas, or leave them out' : '';
    return { ok: false, message: `must be a positive amount such as ${EXAMPLES}, not "${text.slice(0, 40)}"${hint}` };
  }
  const value = new MoneyDecimal(body).times(new MoneyDecimal(`1e${suffix ? SUFFIX[suffix[2]!]! : 0}`));
  if (value.decimalPlaces() > 6) return { ok: false, message: `has more than 6 decimals once the suffix is applied: "${t}"` };
  if (value.lte(0)) return { ok: false, message: `must be above 0, not "${t}"` };
  if (value.gt(MONEY_MAX)) return { ok: false, message: `must be at most 1000000000000000 (10^15), not "${t}"` };
  return { ok: true, value };
}

/**
 * amount x growth, where growth is a float64 growth factor (terminal value per unit invested).
 * The factor enters exactly as the decimal expansion of its shortest round-trip text; the product
 * keeps 40 significant digits (no rounding to cents here). With `trace`, the three decimal texts are recorded.
 */
export function moneyTimes(amount: Money, growth: number, trace?: RollTrace, growthName = 'G'): Money {
  const g = new MoneyDecimal(growth);
  const v = amount.times(g);
  if (trace) recordMoney(trace, growthName, amount.toFixed(), g.toFixed(), v.toFixed());
  return v;
}

