import { QUOTE_COLUMNS, type QuoteColumn, type RowText } from './quoteRow.ts';

/**
 * Text copied from a spreadsheet (tab-separated) or CSV, split into rows of cells. CSV follows
 * RFC 4180 quoting ("a,b" and doubled quotes inside quotes). Trailing empty lines are dropped.
 */
export function splitTable(text: string): { cells: string[][]; separator: '\t' | ',' } {
  const body = text.replace(/\r\n?/g, '\n').replace(/\n+$/, '');
  const separator: '\t' | ',' = body.includes('\t') ? '\t' : ',';
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < body.length; i++) {
    const ch = body[i]!;
    if (quoted) {
      if (ch === '"' && body[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (ch === separator) {
      row.push(cell.trim());
      cell = '';
    } else if (ch === '\n') {
      row.push(cell.trim());
      rows.push(row);
      row = [];
      cell = '';
    } else cell += ch;
  }
  row.push(cell.trim());
  rows.push(row);
  return { cells: rows.filter((r) => r.some((c) => c !== '')), separator };
}

/** Header words (case-, space- and punctuation-insensitive) and the sheet column each maps to. */
const HEADER_WORDS: Readonly<Record<string, QuoteColumn>> = {
  type: 'kind', kind: 'kind', instrument: 'kind', instrumenttype: 'kind',
  maturity: 'maturity', tenor: 'maturity', term: 'maturity', maturitydate: 'maturity', date: 'maturity',
  rate: 'rate', yield: 'rate', rateyield: 'rate', quote: 'rate', discountyield: 'rate', swaprate: 'rate', ytm: 'rate',
  coupon: 'coupon', cpn: 'coupon',
  price: 'price', cleanprice: 'price',
  frequency: 'frequency', freq: 'frequency',
  daycount: 'dayCount', basis: 'dayCount', daycountbasis: 'dayCount',
};

export const headerColumn = (cell: string): QuoteColumn | null => HEADER_WORDS[cell.toLowerCase().replace(/[^a-z]/g, '')] ?? null;

export interface PastedBlock {
  /** True when the first row was read as a header. */
  readonly header: boolean;
  /** With a header: the rows as sheet rows, mapped by column name. */
  readonly rows: readonly RowText[];
  /** Without a header: the raw cells, to fill from the focused cell in column order. */
  readonly cells: readonly (readonly string[])[];
  /** Header cells that name no known column (their columns are ignored). */
  readonly ignored: readonly string[];
}

/**
 * Reads a pasted block. The first row is a header when at least one of its cells is a known
 * header word (kind: type, kind, instrument; maturity: maturity, tenor, term; rate or yield;
 * coupon; price or clean price; frequency; day count) and none of its cells is a number.
 */
export function readPastedBlock(text: string): PastedBlock {
  const { cells } = splitTable(text);
  const first = cells[0] ?? [];
  const mapped = first.map(headerColumn);
  const looksNumeric = first.some((c) => /^[\s+\-\u2212]?\d/.test(c));
  const header = mapped.some((m) => m !== null) && !looksNumeric;
  if (!header) return { header: false, rows: [], cells, ignored: [] };
  const ignored = first.filter((_, i) => mapped[i] === null && first[i] !== '');
  const rows = cells.slice(1).map((r) => {
    const out: Record<QuoteColumn, string> = { kind: '', maturity: '', rate: '', price: '', coupon: '', frequency: '', dayCount: '' };
    r.forEach((value, i) => {
      const col = mapped[i];
      if (col && out[col] === '') out[col] = value;
    });
    return out as RowText;
  });
  return { header, rows, cells: [], ignored };
}

/** Column order for a header-less paste: the sheet's display order. */
export const PASTE_COLUMN_ORDER: readonly QuoteColumn[] = QUOTE_COLUMNS;

/**
 * Whether pasted text is a block for the sheet rather than one cell's value: it has a tab or a
 * line break, or it is one comma-separated line starting with a header word or a quote kind
 * (so a European "3,25" typed into one cell stays a cell value).
 */
export function looksLikeTable(text: string): boolean {
  const body = text.replace(/\r\n?/g, '\n').replace(/\n+$/, '');
  if (body.includes('\t') || body.includes('\n')) return true;
  if (!body.includes(',')) return false;
  const first = (splitTable(body).cells[0] ?? [])[0] ?? '';
  return headerColumn(first) !== null || /^(deposit|bill|zero|bond|swap)s?$/i.test(first);
}
