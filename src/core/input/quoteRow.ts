import { KIND_MODULE_LIST, kindModule } from '../kinds/registry.ts';
import { MONEY_MARKET_TERMS, moneyMarketTerm } from '../time/depositDates.ts';
import {
  parseCouponText,
  parseDayCountText,
  parseFrequencyText,
  parseKindText,
  parseMaturityText,
  parsePriceText,
  parseRateText,
  type CellParse,
  type QuoteUnitMode,
} from './quoteText.ts';
import { DEFAULT_CONVENTIONS, withDecimalPoint, type InputConventions } from './conventions.ts';
import { parseTermsText } from './termsText.ts';

/**
 * One row of the quote sheet, every cell kept exactly as typed. `rate` holds a rate or yield
 * (deposit rate, bill discount yield, zero rate, bond yield, swap rate); `price` a price per 100
 * face (bill, zero, bond clean price). A row gives one of the two.
 */
export interface QuoteRow {
  /** Stable identity of the row in the sheet (not part of the quote). */
  readonly id: string;
  readonly enabled: boolean;
  readonly kind: string;
  readonly maturity: string;
  readonly rate: string;
  readonly price: string;
  readonly coupon: string;
  readonly frequency: string;
  readonly dayCount: string;
  /**
   * The quote's convention set and the date terms it gives itself (`usd-sofr, spot lag 1`; see
   * input/termsText.ts). Absent in a document saved before the column existed, read as empty.
   */
  readonly terms?: string;
}

/** The text columns of the sheet, in display (and header-less paste) order. */
export const QUOTE_COLUMNS = ['kind', 'maturity', 'rate', 'price', 'coupon', 'frequency', 'dayCount', 'terms'] as const;
export type QuoteColumn = (typeof QUOTE_COLUMNS)[number];

export const QUOTE_COLUMN_LABEL: Readonly<Record<QuoteColumn, string>> = {
  kind: 'Kind',
  maturity: 'Maturity',
  rate: 'Rate / yield',
  price: 'Price',
  coupon: 'Coupon',
  frequency: 'Freq',
  dayCount: 'Day count',
  terms: 'Conventions',
};

export type RowText = Omit<QuoteRow, 'id' | 'enabled'>;
export const EMPTY_ROW_TEXT: RowText = { kind: '', maturity: '', rate: '', price: '', coupon: '', frequency: '', dayCount: '', terms: '' };

export interface CellIssue {
  readonly severity: 'error' | 'warning';
  readonly message: string;
}
export type RowIssues = Partial<Record<QuoteColumn, CellIssue>>;

export interface RowParse {
  /** The engine's quote object (rates as decimals), or null when a cell is wrong or the row is blank. */
  readonly quote: Record<string, unknown> | null;
  readonly issues: RowIssues;
  /** True when every text cell is empty (a fresh row): neither a quote nor an error. */
  readonly blank: boolean;
}

export const isBlankRow = (row: RowText): boolean => QUOTE_COLUMNS.every((c) => (row[c] ?? '').trim() === '');

/**
 * Parses one sheet row into the engine's quote object, exactly (decimal.js), with a message on
 * each wrong cell saying what would be valid. The row's `enabled` flag is carried over. Dates
 * and numbers are read by the workspace's input conventions (date order, decimal mark).
 */
export function parseRow(row: QuoteRow, mode: QuoteUnitMode, conventions: InputConventions = DEFAULT_CONVENTIONS): RowParse {
  if (isBlankRow(row)) return { quote: null, issues: {}, blank: true };
  const num = (text: string): string => withDecimalPoint(text, conventions.decimalMark);
  const issues: { -readonly [K in QuoteColumn]?: CellIssue } = {};
  const error = (c: QuoteColumn, message: string): void => {
    issues[c] = { severity: 'error', message };
  };
  const take = <T>(c: QuoteColumn, p: CellParse<T>): T | null => {
    if (p.ok) {
      if (p.warning) issues[c] = { severity: 'warning', message: p.warning };
      return p.value;
    }
    error(c, p.message);
    return null;
  };
  const kindParse = parseKindText(row.kind);
  const maturity = take('maturity', parseMaturityText(row.maturity, conventions.dateOrder));
  if (!kindParse.ok) {
    error('kind', kindParse.message);
    return { quote: null, issues, blank: false };
  }
  const kind = kindParse.value;
  const quote: Record<string, unknown> = { kind };
  const ownCell = kindModule(kind).sheet.maturityCell;
  if (ownCell !== undefined) {
    // A kind dated by its own fields (a future): the Maturity cell holds them (its month, and contract).
    delete issues.maturity;
    const read = ownCell.read(row.maturity);
    if (read.ok) Object.assign(quote, read.fields);
    else error('maturity', read.message);
  } else if (maturity && 'tenor' in maturity && moneyMarketTerm(maturity.tenor) !== null && kindModule(kind).moneyMarketTerms !== true) {
    const takers = KIND_MODULE_LIST.filter((m) => m.moneyMarketTerms === true).map((m) => m.kind);
    error('maturity', `${maturity.tenor} (${MONEY_MARKET_TERMS[moneyMarketTerm(maturity.tenor)!]}) is a ${takers.join(' or ')} tenor; a ${kind} takes a tenor such as 1M or 5Y, or a date`);
  } else if (maturity) Object.assign(quote, maturity);
  if (!row.enabled) quote.enabled = false;

  // Which fields the kind takes from the sheet's columns, and what the rate and price columns mean (src/core/kinds).
  const sheet = kindModule(kind).sheet;
  const hasRate = row.rate.trim() !== '';
  const hasPrice = row.price.trim() !== '';
  const priceField = sheet.priceField;
  const refuse = (c: QuoteColumn, what: string): void => error(c, `a ${kind} takes no ${what}; clear this cell`);

  if (sheet.rateField === null) {
    // Quoted by price only (a future): the Price column holds it.
    if (hasRate) error('rate', `a ${kind} is quoted by its ${sheet.rateWhat} in the Price column; move the number there and clear this cell`);
    else if (!hasPrice) error('price', `a ${kind} needs its ${sheet.rateWhat} (Price)`);
    else if (priceField !== null) {
      const price = take('price', parsePriceText(num(row.price)));
      if (price !== null) quote[priceField] = price;
    }
  } else if (priceField === null) {
    if (hasPrice) refuse('price', 'price');
    const rate = take('rate', parseRateText(num(row.rate), mode, sheet.rateWhat));
    if (rate !== null) quote[sheet.rateField] = rate;
  } else if (hasRate && hasPrice) {
    const both = `give either the ${sheet.rateWhat} or the price, not both; clear one of the two cells`;
    error('rate', both);
    error('price', both);
  } else if (hasPrice) {
    const price = take('price', parsePriceText(num(row.price)));
    if (price !== null) quote[priceField] = price;
  } else if (hasRate) {
    const rate = take('rate', parseRateText(num(row.rate), mode, sheet.rateWhat));
    if (rate !== null) quote[sheet.rateField] = rate;
  } else {
    error(sheet.missingValue, `a ${kind} needs a ${sheet.rateWhat} (Rate / yield) or a price per 100 (Price)`);
  }

  if (sheet.coupon) {
    const coupon = take('coupon', parseCouponText(num(row.coupon), mode));
    if (coupon !== null) quote.coupon = coupon;
  } else if (row.coupon.trim() !== '') refuse('coupon', 'coupon');

  if (row.frequency.trim() !== '') {
    if (sheet.frequency) {
      const f = take('frequency', parseFrequencyText(row.frequency));
      if (f !== null) quote.frequency = f;
    } else refuse('frequency', 'payment frequency');
  }
  if (row.dayCount.trim() !== '') {
    if (typeof sheet.dayCount === 'object') refuse('dayCount', sheet.dayCount.refuse);
    else if (sheet.dayCount === 'with-rate' && !hasRate) refuse('dayCount', 'day count when quoted by price');
    else {
      const dc = take('dayCount', parseDayCountText(row.dayCount));
      if (dc !== null) quote.dayCount = dc;
    }
  }
  // The Conventions cell: the quote's set and the date terms it gives itself (the engine checks
  // which of them the kind takes, and names the field).
  if ((row.terms ?? '').trim() !== '') {
    const terms = take('terms', parseTermsText(row.terms ?? ''));
    if (terms !== null) {
      if (terms.set !== null) quote.conventions = terms.set;
      Object.assign(quote, terms.fields);
    }
  }
  const failed = Object.values(issues).some((i) => i?.severity === 'error');
  return { quote: failed ? null : quote, issues, blank: false };
}
