import { COUPON_MAX, FREQUENCIES, PRICE_MAX, RATE_MAX, RATE_MIN } from '../kinds/fields.ts';
import { KIND_WORDS } from '../kinds/registry.ts';
import { QUOTE_KINDS, type QuoteKind } from '../document/types.ts';
import { DAY_COUNTS, type DayCount } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import { parseDateText, type DateOrder } from './dateText.ts';
import { formatTenor, parseTenor } from '../time/tenor.ts';
import { MONEY_MARKET_TERMS, moneyMarketTerm } from '../time/depositDates.ts';
import { ExactDecimal, exactDecimal, nearestDouble, normaliseNumberText } from './decimalText.ts';

/**
 * How a bare number typed into a rate, yield or coupon cell is read: `percent` (3.25 is 3.25 %),
 * `decimal` (0.0325 is 3.25 %) or `bp` (325 is 3.25 %). A number with its own `%` or `bp` suffix is
 * read by the suffix whatever the mode.
 */
export const QUOTE_UNIT_MODES = ['percent', 'decimal', 'bp'] as const;
export type QuoteUnitMode = (typeof QUOTE_UNIT_MODES)[number];
export const isQuoteUnitMode = (x: unknown): x is QuoteUnitMode => x === 'percent' || x === 'decimal' || x === 'bp';

export const QUOTE_UNIT_LABEL: Readonly<Record<QuoteUnitMode, string>> = { percent: '%', decimal: 'decimal', bp: 'bp' };

/** A parsed cell: a value, or a message saying what is wrong and what would be valid. */
export type CellParse<T> =
  | { readonly ok: true; readonly value: T; readonly warning?: string }
  | { readonly ok: false; readonly message: string };

/** A hint for a number written with a decimal comma while the sheet reads a decimal point. */
const commaHint = (s: string): string => (/^[+-]?\d+,\d+(%|bps?)?$/i.test(s) ? ` (to type a decimal comma, set the decimal mark to comma in the settings)` : '');

const good = <T>(value: T): CellParse<T> => ({ ok: true, value });
const bad = <T>(message: string): CellParse<T> => ({ ok: false, message });

/** The power of ten a unit divides by: percent 2, basis points 4. */
const SCALE: Readonly<Record<QuoteUnitMode, number>> = { percent: 2, decimal: 0, bp: 4 };

/** Percent text of a decimal rate bound, exact: -0.1 -> "-10%". */
const pctText = (x: number): string => `${ExactDecimal.fromNumber(x)!.shifted(2).toFixed()}%`;

/** A rate's reading: the decimal value and the exact decimal typed with its unit. */
export interface RateReading {
  /** Decimal per year (0.0325 = 3.25 %), the double nearest the exact value typed. */
  readonly rate: number;
  /** The exact number typed, before scaling. */
  readonly typed: ExactDecimal;
  /** Which unit it was read in: from a suffix, or from the mode when bare. */
  readonly unit: QuoteUnitMode;
  /** True when the text had no `%` or `bp` suffix. */
  readonly bare: boolean;
}

/**
 * Reads a rate typed as `3.25%`, `325bp` (or `bps`), or a bare number in the given mode, with
 * a Unicode minus accepted. Exact: the text is an exact decimal scaled by 100 or 10,000 and
 * rounded once to float64. Not a range check; see `parseRateText`.
 */
export function readRate(text: string, mode: QuoteUnitMode): CellParse<RateReading> {
  let s = normaliseNumberText(text);
  if (s === '') return bad('empty');
  let unit: QuoteUnitMode = mode;
  let bare = true;
  const lower = s.toLowerCase();
  if (lower.endsWith('%')) {
    unit = 'percent';
    bare = false;
    s = s.slice(0, -1);
  } else if (lower.endsWith('bps') || lower.endsWith('bp')) {
    unit = 'bp';
    bare = false;
    s = s.slice(0, lower.endsWith('bps') ? -3 : -2);
  }
  const d = exactDecimal(s);
  if (!d) return bad(`"${text.trim()}" is not a number; type a rate such as 3.25%, 325bp or ${mode === 'decimal' ? '0.0325' : mode === 'bp' ? '325' : '3.25'}${commaHint(s)}`);
  return good({ rate: nearestDouble(d, SCALE[unit]), typed: d, unit, bare });
}

/**
 * A hint when a bare number is implausible for the unit it is read in, in both directions (the
 * value is kept; the hint says what it would be in the other reading):
 * - percent mode, 0 < |x| < 0.1: probably a decimal (0.0315 is 0.0315 %; did you mean 3.15 %?);
 * - percent mode, |x| >= 100: probably basis points (345 is 345 %; did you mean 3.45 %?);
 * - bp mode, 0 < |x| < 1: probably a decimal (0.0325 bp; did you mean 3.25 %?).
 * Thresholds: rates on this sheet's instruments have stayed between about -1 % and 20 % in the
 * major currencies (from memory of published central-bank and market series), so 0.1 % as a bare
 * percent and 100 % are where a unit slip is likelier than the value.
 */
export function rateUnitHint(typed: ExactDecimal, mode: QuoteUnitMode, what: string): string | null {
  if (typed.isZero()) return null;
  const x = typed.toFixed();
  const times = (power: number): string => typed.shifted(power).toFixed();
  if (mode === 'percent' && typed.compareSizeToPowerOfTen(-1) < 0) {
    return `${x} in % mode is a ${what} of ${x}%: did you mean ${times(2)}%? If so type ${times(2)}, or switch the unit to decimal`;
  }
  if (mode === 'percent' && typed.compareSizeToPowerOfTen(2) >= 0) {
    return `${x} in % mode is ${x}%: did you mean ${times(-2)}%? If so type ${times(-2)}, or ${x}bp, or switch the unit to bp`;
  }
  if (mode === 'bp' && typed.compareSizeToPowerOfTen(0) < 0) {
    return `${x} in bp mode is ${x}bp (${times(-2)}%): did you mean ${times(2)}%? If so type ${times(4)}, or switch the unit to decimal`;
  }
  return null;
}

/**
 * Reads and range-checks a rate, yield or coupon cell. `what` names the field ("rate", "coupon").
 * In decimal mode a bare value above 1 in size is out of range and the message asks "did you mean %?".
 * A bare value implausible for the mode's unit gets the hint of `rateUnitHint` (as the message
 * when the value is out of range, as a warning when it is kept).
 */
export function parseRateText(text: string, mode: QuoteUnitMode, what: string, min = RATE_MIN, max = RATE_MAX): CellParse<number> {
  const r = readRate(text, mode);
  if (!r.ok) return r.message === 'empty' ? bad(`${what} is required; type a rate such as 3.25%`) : r;
  const { rate, typed, bare } = r.value;
  if (mode === 'decimal' && bare && typed.compareSizeToPowerOfTen(0) > 0) {
    return bad(`${typed.toFixed()} in decimal mode is ${typed.shifted(2).toFixed()}%: did you mean ${typed.toFixed()}%? Type ${typed.toFixed()}% or ${typed.shifted(-2).toFixed()}, or switch the unit to %`);
  }
  const hint = bare ? rateUnitHint(typed, mode, what) : null;
  if (!(rate >= min && rate <= max)) {
    const range = `${what} ${pctText(rate)} is out of range; a ${what} must be from ${pctText(min)} to ${pctText(max)}`;
    return bad(hint ? `${range}. ${hint}` : range);
  }
  return hint ? { ok: true, value: rate, warning: hint } : good(rate);
}

export const parseCouponText = (text: string, mode: QuoteUnitMode): CellParse<number> => parseRateText(text, mode, 'coupon', 0, COUPON_MAX);

/**
 * Reads a price per 100 face: a decimal number (`99.875`), or points and 32nds as bond desks
 * quote them (`99-28` is 99 28/32; `99-28+` adds half a 32nd; `99-283` adds 3/8 of a 32nd;
 * common practice for US Treasury prices). Exact, rounded once. Range (0, 1000].
 */
export function parsePriceText(text: string): CellParse<number> {
  const s = normaliseNumberText(text);
  if (s === '') return bad('price is required; type a price per 100 face such as 99.875 or 99-28');
  let d = exactDecimal(s);
  const m32 = /^(\d+)-(\d{2})(\+|[0-7])?$/.exec(s);
  if (!d && m32) {
    const thirtySeconds = Number(m32[2]);
    if (thirtySeconds < 32) {
      // points + (32nds + eighths / 8) / 32 = points + (8 x 32nds + eighths) / 256 (a half is 4 eighths): a
      // dyadic fraction, exact in a double below 2^44 points, so its shortest text is its exact decimal.
      const eighths = m32[3] === undefined ? 0 : m32[3] === '+' ? 4 : Number(m32[3]);
      const points = Number(m32[1]);
      if (points < 2 ** 44) d = ExactDecimal.fromNumber(points + (8 * thirtySeconds + eighths) / 256);
    }
  }
  if (!d) return bad(`"${text.trim()}" is not a price; type a price per 100 face such as 99.875, or points-32nds such as 99-28${commaHint(s)}`);
  const price = d.toNumber();
  if (!(price > 0 && price <= PRICE_MAX)) return bad(`price ${d.toFixed()} is out of range; a price per 100 face must be above 0 and at most ${PRICE_MAX}`);
  return good(price);
}

/** A maturity: a tenor from settlement (`3M`, `10y`) or a calendar date, kept as ISO `YYYY-MM-DD`. */
export type MaturityText = { readonly tenor: string } | { readonly maturity: IsoDate };

/**
 * A maturity: a tenor (`6M`, `10Y`), a money-market term `ON`, `TN` or `SN` (also `O/N`, any
 * case; a deposit's only, which the row checks) or a date as people type it (`2031-11-15`, `15-Nov-2031`,
 * `15 Nov 31`, `Nov 15 2031`, or `11/15/2031` / `15/11/2031` by `dateOrder`; see `parseDateText`).
 */
export function parseMaturityText(text: string, dateOrder: DateOrder = 'mdy'): CellParse<MaturityText> {
  const s = text.trim();
  if (s === '') return bad('maturity is required; type a tenor such as 3M or 10Y, or a date such as 2031-11-15');
  const tenor = parseTenor(s);
  if (tenor) return good({ tenor: formatTenor(tenor) });
  const term = moneyMarketTerm(s);
  if (term) return good({ tenor: term });
  const loose = moneyMarketTerm(s.replace(/[\s.\-]/g, ''));
  if (loose) return bad(`"${s}": type ${loose} (or ${loose[0]}/N) for ${MONEY_MARKET_TERMS[loose]}, a deposit's tenor`);
  if (/^\d{1,3}\s*[xX×]\s*\d{1,3}$/.test(s)) return bad(`"${s}" is an FRA's period (start x end months from spot); type fra in the Kind cell, or give a tenor such as 6M or a date`);
  const date = parseDateText(s, dateOrder);
  if (date?.ok) return good({ maturity: date.date });
  const valid = `type a tenor such as 6M, 2Y or 30Y, or a date YYYY-MM-DD such as 2031-11-15 (also 15-Nov-2031 or ${dateOrder === 'mdy' ? '11/15/2031' : '15/11/2031'})`;
  if (date) return bad(`${date.message}; ${valid}`);
  return bad(`"${s}" is not a maturity; ${valid}`);
}

/** A quote kind, case-insensitive (`Deposit`, `BOND`); its module's plain plurals and short forms too (`paste.kindWords`). */
export function parseKindText(text: string): CellParse<QuoteKind> {
  const s = text.trim().toLowerCase();
  if (s === '') return bad(`kind is required; type one of ${QUOTE_KINDS.join(', ')}`);
  if ((QUOTE_KINDS as readonly string[]).includes(s)) return good(s as QuoteKind);
  const alias = Object.hasOwn(KIND_WORDS, s) ? KIND_WORDS[s] : undefined;
  if (alias) return good(alias);
  return bad(`"${text.trim()}" is not a quote kind; type one of ${QUOTE_KINDS.join(', ')}`);
}

const FREQUENCY_WORDS: Readonly<Record<string, number>> = {
  annual: 1, annually: 1, a: 1, '1y': 1, '12m': 1,
  semiannual: 2, 'semi-annual': 2, semiannually: 2, s: 2, sa: 2, '6m': 2,
  quarterly: 4, q: 4, '3m': 4,
  monthly: 12, m: 12, '1m': 12,
};

/** Payments a year: 1, 2, 4 or 12, or a word (annual, semiannual, quarterly, monthly) or period (6M). */
export function parseFrequencyText(text: string): CellParse<number> {
  const s = text.trim().toLowerCase();
  const n = /^\d+$/.test(s) ? Number(s) : FREQUENCY_WORDS[s];
  if (n !== undefined && (FREQUENCIES as readonly number[]).includes(n)) return good(n);
  return bad(`"${text.trim()}" is not a payment frequency; type 1, 2, 4 or 12 payments a year (or annual, semiannual, quarterly, monthly)`);
}

const DAY_COUNT_ALIASES: Readonly<Record<string, DayCount>> = {
  'A/360': 'ACT/360', 'ACTUAL/360': 'ACT/360',
  'A/365F': 'ACT/365F', 'ACT/365FIXED': 'ACT/365F', 'ACTUAL/365FIXED': 'ACT/365F', 'ACT/365(FIXED)': 'ACT/365F',
  '30/360BONDBASIS': '30/360', 'BONDBASIS': '30/360',
  '30E/360EUROBOND': '30E/360', 'EUROBONDBASIS': '30E/360',
  'ACT/ACTISDA': 'ACT/ACT-ISDA', 'ACT/ACTICMA': 'ACT/ACT-ICMA', 'ACT/ACT(ISDA)': 'ACT/ACT-ISDA', 'ACT/ACT(ICMA)': 'ACT/ACT-ICMA',
};

/** A day count, case- and space-insensitive (`act/360`, `ACT/365 Fixed`); ambiguous names are refused. */
export function parseDayCountText(text: string): CellParse<DayCount> {
  const s = text.trim().toUpperCase().replace(/\s+/g, '');
  const exact = DAY_COUNTS.find((d) => d.toUpperCase() === s);
  if (exact) return good(exact);
  const alias = DAY_COUNT_ALIASES[s];
  if (alias) return good(alias);
  const why = s === 'ACT/ACT' ? ' ("ACT/ACT" is ambiguous: say ACT/ACT-ISDA or ACT/ACT-ICMA)' : s === 'ACT/365' ? ' ("ACT/365" is ambiguous: say ACT/365F)' : '';
  return bad(`"${text.trim()}" is not a day count${why}; type one of ${DAY_COUNTS.join(', ')}`);
}

/**
 * Re-writes a bare number typed in one unit mode so it keeps its value in another (exact:
 * "3.25" in percent is "0.0325" in decimal and "325" in bp). Text with a `%` or `bp` suffix, and
 * text that is not a number, is returned unchanged.
 */
export function rewriteBareRate(text: string, from: QuoteUnitMode, to: QuoteUnitMode): string {
  if (from === to) return text;
  const r = readRate(text, from);
  if (!r.ok || !r.value.bare) return text;
  return r.value.typed.shifted(SCALE[to] - SCALE[from]).toFixed();
}
