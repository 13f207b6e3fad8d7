import { formatNumber } from '../format/quantities.ts';
import { LIMITS } from '../document/limits.ts';
import { CELL_MAX } from '../document/workbenchShape.ts';
import { KIND_HEADER_WORDS } from '../kinds/registry.ts';
import type { QuoteColumn } from './quoteRow.ts';

/*
 * What the page decides at the moment of a paste, before the paste reader (pasteTable.ts, loaded
 * on first use) reads anything: whether the text is a block for the sheet or one cell's value,
 * and whether its size is refused. Kept apart so the first load carries no table reader.
 */

/**
 * Header words (case-, space- and punctuation-insensitive) and the sheet column each maps to:
 * the sheet's own names and the short forms common on trading sheets (px, mat, yld, freq), then
 * the words each quote kind adds for its own fields (`paste.headerWords`: swap rate, clean price, cpn, ...).
 */
const GENERAL_HEADER_WORDS: Readonly<Record<string, QuoteColumn>> = {
  type: 'kind', kind: 'kind', instrument: 'kind', instrumenttype: 'kind', instr: 'kind', product: 'kind', security: 'kind', securitytype: 'kind', quotetype: 'kind',
  maturity: 'maturity', tenor: 'maturity', term: 'maturity', maturitydate: 'maturity', date: 'maturity', mat: 'maturity', matdate: 'maturity', expiry: 'maturity', enddate: 'maturity',
  rate: 'rate', yield: 'rate', rateyield: 'rate', ytm: 'rate', yld: 'rate', midyield: 'rate', midrate: 'rate', midyld: 'rate',
  coupon: 'coupon',
  price: 'price', px: 'price', midprice: 'price', midpx: 'price', pxmid: 'price',
  frequency: 'frequency', freq: 'frequency', payfreq: 'frequency', paymentfrequency: 'frequency',
  daycount: 'dayCount', basis: 'dayCount', daycountbasis: 'dayCount', dcc: 'dayCount', accrualbasis: 'dayCount', daycountconvention: 'dayCount',
  conventions: 'terms', conventionset: 'terms', terms: 'terms',
};
export const HEADER_WORDS: Readonly<Record<string, QuoteColumn>> = { ...GENERAL_HEADER_WORDS, ...KIND_HEADER_WORDS };

/**
 * Header words that name a quote without saying whether it is a rate or a price (mid, quote,
 * last, close, level, value): the column is read as prices when its numbers look like prices
 * per 100 face (see `looksLikePrices`), as rates otherwise.
 */
export const QUOTE_WORDS: ReadonlySet<string> = new Set(['mid', 'quote', 'last', 'close', 'level', 'value', 'bid', 'ask', 'offer']);

export const headerKey = (cell: string): string => cell.toLowerCase().replace(/[^a-z]/g, '');

export const headerColumn = (cell: string): QuoteColumn | null => HEADER_WORDS[headerKey(cell)] ?? (QUOTE_WORDS.has(headerKey(cell)) ? 'rate' : null);

/**
 * The most quotes the sheet takes from one paste: the document cap on quotes (a document over
 * it cannot be saved to a link or file). The paste path reads the cap here only.
 */
export const pasteQuoteCap = (): number => LIMITS.quotes;

/**
 * The most characters of pasted text read as a block: about 2,000 characters a row for the
 * most rows the sheet takes, room for wide sheets with many ignored columns. Larger text is
 * refused before it is read, so no paste can stall the page.
 */
export const PASTE_TEXT_MAX = 1_000_000;

/** Text size in words: "5.2 MB", "340 KB", "812 characters" (decimal units, 1 MB = 10^6 characters of text). */
export function textSizeWords(chars: number): string {
  if (chars >= 1_000_000) return `${formatNumber(chars / 1_000_000, 1)} MB`;
  if (chars >= 10_000) return `${Math.round(chars / 1000)} KB`;
  return `${chars} characters`;
}

/**
 * Why pasted text is refused for its size, naming the cause, or null. A block (`table`) is
 * refused above PASTE_TEXT_MAX characters; one cell's value above the cell cap (the longest
 * cell a saved or shared workspace keeps).
 */
export function pasteSizeRefusal(chars: number, table: boolean): string | null {
  if (table && chars > PASTE_TEXT_MAX) {
    return `the pasted text is ${textSizeWords(chars)}; a paste is read up to ${textSizeWords(PASTE_TEXT_MAX)} (the sheet holds at most ${pasteQuoteCap()} quotes). Paste fewer rows`;
  }
  if (!table && chars > CELL_MAX) return `the pasted text is ${textSizeWords(chars)}; a cell holds at most ${CELL_MAX} characters`;
  return null;
}

/** The first cell of a delimited line: a double-quoted field (doubled quotes inside), or the text up to the first comma or semicolon, trimmed. */
function firstCell(line: string): string {
  const s = line.trimStart();
  if (!s.startsWith('"')) return (/^[^,;]*/.exec(s)?.[0] ?? '').trim();
  let out = '';
  for (let i = 1; i < s.length; i++) {
    if (s[i] !== '"') out += s[i];
    else if (s[i + 1] === '"') {
      out += '"';
      i++;
    } else break;
  }
  return out.trim();
}

/**
 * Whether pasted text is a block for the sheet rather than one cell's value: it has a tab or a
 * line break, or it is one comma- or semicolon-separated line starting with a header word or a
 * quote kind (so a European "3,25" typed into one cell stays a cell value).
 */
export function looksLikeTable(text: string): boolean {
  const body = text.replace(/\r\n?/g, '\n').replace(/\n+$/, '');
  if (body.includes('\t') || body.includes('\n')) return true;
  if (!body.includes(',') && !body.includes(';')) return false;
  // Only the first cell decides: read the start of the line, never all of a long one.
  const first = firstCell(body.slice(0, 2000));
  return headerColumn(first) !== null || /^(deposit|bill|zero|bond|swap)s?$/i.test(first);
}
