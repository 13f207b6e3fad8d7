import Decimal from 'decimal.js';

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

export type MoneyParse = { readonly ok: true; readonly value: Money } | { readonly ok: false; readonly message: string };

/**
 * Parses a typed amount: digits with an optional decimal point and up to 6 decimals, above 0 and
 * at most 10^15. No separators or signs ("1000000", "250000.50").
 */
export function parseMoney(text: string): MoneyParse {
  const t = text.trim();
  if (!MONEY_RE.test(t)) {
    const hint = /[,_ ]/.test(t) ? '; leave out thousands separators' : '';
    return { ok: false, message: `must be a positive amount such as "1000000" or "250000.50" (digits, at most 6 decimals), not "${text.slice(0, 40)}"${hint}` };
  }
  const value = new MoneyDecimal(t);
  if (value.lte(0)) return { ok: false, message: `must be above 0, not "${t}"` };
  if (value.gt(MONEY_MAX)) return { ok: false, message: `must be at most 1000000000000000 (10^15), not "${t}"` };
  return { ok: true, value };
}

/**
 * amount x growth, where growth is a float64 growth factor (terminal value per unit invested).
 * The factor enters exactly as the decimal expansion of its shortest round-trip text; the product
 * keeps 40 significant digits (no rounding to cents here).
 */
export const moneyTimes = (amount: Money, growth: number): Money => amount.times(new MoneyDecimal(growth));

/** Rounds to cents, half away from zero, and groups thousands with commas: "1,234,567.89". */
export function formatMoney(m: Money): string {
  const fixed = m.toDecimalPlaces(2, MoneyDecimal.ROUND_HALF_UP).toFixed(2);
  const negative = fixed.startsWith('-');
  const body = negative ? fixed.slice(1) : fixed;
  const [whole = '0', cents = '00'] = body.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const text = `${grouped}.${cents}`;
  return negative && text !== '0.00' ? `-${text}` : text;
}

/** formatMoney with an explicit sign for differences: "+1,234.56", "-12.00", "0.00". */
export function formatMoneySigned(m: Money): string {
  const text = formatMoney(m);
  return text.startsWith('-') || text === '0.00' ? text : `+${text}`;
}
