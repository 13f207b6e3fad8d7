import { formatNumber } from '../format/quantities.ts';
import { LIMITS } from '../document/limits.ts';
import { CELL_MAX } from '../document/workbenchShape.ts';
import { KIND_HEADER_WORDS } from '../kinds/registry.ts';
import { QUOTE_COLUMNS, parseRow, type QuoteColumn, type RowText } from './quoteRow.ts';
import type { QuoteUnitMode } from './quoteText.ts';
import { DEFAULT_CONVENTIONS, type InputConventions } from './conventions.ts';
import { splitTable, type PasteDelimiter, type SplitTable } from './splitTable.ts';
import { readTenorColumns } from './tenorColumns.ts';
import { HEADER_WORDS, headerColumn, headerKey, pasteQuoteCap, QUOTE_WORDS } from './pasteGate.ts';

export { headerColumn, looksLikeTable, PASTE_TEXT_MAX, pasteQuoteCap, pasteSizeRefusal, textSizeWords } from './pasteGate.ts';


/**
 * Whether a column's values read as prices per 100 face rather than rates: most of its filled
 * cells are numbers from 20 to 200 without a % or bp suffix, or points-32nds (`99-28`). A rate
 * above 20 % is implausible for the quotes this sheet takes, and a price below 20 per 100 is one
 * too (a 30-year zero at 5 % is about 23).
 */
export function looksLikePrices(values: readonly string[]): boolean {
  const filled = values.filter((v) => v.trim() !== '');
  if (filled.length === 0) return false;
  const priceLike = filled.filter((v) => {
    const s = v.trim();
    if (/^\d+-\d{2}[+0-7]?$/.test(s)) return true;
    const n = Number(s.replace(/^(\d+),(\d+)$/, '$1.$2').replace(/,/g, ''));
    return /^[+]?\d/.test(s) && Number.isFinite(n) && n >= 20 && n <= 200;
  }).length;
  return priceLike * 2 > filled.length;
}

/** How one pasted column was read, for the mapping preview. */
export interface ColumnReading {
  /** The header cell as pasted (empty for a header-less paste). */
  readonly header: string;
  /** The sheet column it fills, or null when ignored. */
  readonly column: QuoteColumn | null;
  /** Why, in words: "header word px", "mid: values look like prices per 100", "unknown header: ignored", "second column named price: ignored". */
  readonly reason: string;
  /** Up to three values of the column, as pasted. */
  readonly sample: readonly string[];
  /** What the column is read as when no sheet column says it (a par curve's tenor, its date column): "par yield 5Y", "date (reported only)". */
  readonly readAs?: string;
}

export interface PastedBlock {
  /** True when the first row was read as a header. */
  readonly header: boolean;
  /** With a header: the rows as sheet rows, mapped by column name. */
  readonly rows: readonly RowText[];
  /** Without a header: the raw cells, to fill from the focused cell in column order. */
  readonly cells: readonly (readonly string[])[];
  /** Header cells that name no known column (their columns are ignored). */
  readonly ignored: readonly string[];
  /** With a header: each pasted column and how it was read. */
  readonly columns: readonly ColumnReading[];
  /** The delimiter the block was split on. */
  readonly separator: PasteDelimiter;
  /** True for a par curve laid out by tenor (tenorColumns.ts): `rows` are one per tenor of the row used. */
  readonly byTenor?: boolean;
  /** What was read, in words, for the preview (a par curve by tenor: its date, the row used, tenors skipped). */
  readonly notes?: readonly string[];
}

/**
 * Reads a pasted block. The first row is a header when at least one of its cells is a known
 * header word (kind: type, kind, instrument, product, security; maturity: maturity, mat, tenor,
 * term, date; rate: rate, yield, yld, ytm; price: price, px, clean price; coupon: coupon, cpn;
 * frequency: freq; day count: basis, dcc; and mid, quote, last, close, bid, ask read as rate or
 * price by their values) and none of its cells is a number. A column named twice is read from
 * its first occurrence; the later ones are listed as ignored. A first row of tenors (`1 Mo, 3 Mo,
 * 1 Yr, 10 Yr`, or `1M 3M 1Y`, optionally after a Date column) is a published par curve by tenor
 * instead: its last row becomes one par-yield quote per tenor (`readTenorColumns`, tenorColumns.ts).
 */
export function readPastedBlock(text: string): PastedBlock {
  return readSplitBlock(splitTable(text));
}

/** readPastedBlock on a table already split (by the reading worker, for a big paste). */
export function readSplitBlock({ cells, separator }: SplitTable): PastedBlock {
  const byTenor = readTenorColumns(cells);
  if (byTenor) {
    const columns = byTenor.columns.map((c): ColumnReading => {
      const readAs = c.tenor === 'date' ? 'date (reported only)' : c.tenor === null ? undefined : `par yield ${c.tenor}`;
      return { header: c.header, column: c.tenor === null || c.tenor === 'date' ? null : 'rate', reason: c.reason, sample: c.sample, ...(readAs ? { readAs } : {}) };
    });
    return { header: true, rows: byTenor.rows, cells: [], ignored: byTenor.ignored, columns, separator, byTenor: true, notes: byTenor.notes };
  }
  const first = cells[0] ?? [];
  const looksNumeric = first.some((c) => /^[\s+\-\u2212]?\d/.test(c));
  const header = !looksNumeric && first.some((c) => headerColumn(c) !== null);
  if (!header) return { header: false, rows: [], cells, ignored: [], columns: [], separator };
  const body = cells.slice(1);
  const taken = new Set<QuoteColumn>();
  const columns: ColumnReading[] = first.map((h, i) => {
    const values = body.map((r) => r[i] ?? '');
    const sample = values.filter((v) => v !== '').slice(0, 3);
    const key = headerKey(h);
    let column = HEADER_WORDS[key] ?? null;
    let reason = column ? `header word "${h}"` : `"${h}" is not a known column: ignored`;
    if (!column && QUOTE_WORDS.has(key)) {
      column = looksLikePrices(values) ? 'price' : 'rate';
      reason = column === 'price' ? `"${h}": its values look like prices per 100` : `"${h}": its values look like rates`;
    }
    if (h === '') reason = 'no header: ignored';
    if (column && taken.has(column)) {
      reason = `a second column read as ${column}: ignored`;
      column = null;
    }
    if (column) taken.add(column);
    return { header: h, column, reason, sample };
  });
  const ignored = columns.filter((c) => c.column === null && c.header !== '').map((c) => c.header);
  const rows = body.map((r) => {
    const out: Partial<Record<QuoteColumn, string>> = { kind: '', maturity: '', rate: '', price: '', coupon: '', frequency: '', dayCount: '' };
    columns.forEach((c, i) => {
      if (c.column) out[c.column] = r[i] ?? '';
    });
    return out as RowText;
  });
  return { header, rows, cells: [], ignored, columns, separator };
}

/** What a header paste would do, before anything is replaced. */
export interface PastePreview {
  readonly rows: number;
  /** Rows that would give a quote (every cell reads) in the given unit mode, among the rows kept. */
  readonly quotes: number;
  /** Rows kept with at least one cell that does not read. */
  readonly withErrors: number;
  /** Rows beyond the quote cap that replacing the sheet would leave out (the first rows are kept). */
  readonly leftOut: number;
  /** Rows beyond the quote cap that appending would leave out. */
  readonly appendLeftOut: number;
  /** Why replacing the sheet is refused, or null when it may go ahead. */
  readonly refusal: string | null;
}

/**
 * Counts the quotes a header paste would give and refuses a replacement that would leave the
 * sheet with no quote. Beyond the quote cap the first rows are kept and the rest counted as left
 * out (`existing` rows already in the sheet count against the cap for an append). `totalRows`: the
 * rows the whole paste has when `block` holds only its first rows (a big paste split in the worker).
 */
export function previewPaste(
  block: PastedBlock,
  mode: QuoteUnitMode,
  existing = 0,
  conventions: InputConventions = DEFAULT_CONVENTIONS,
  totalRows: number = block.rows.length,
): PastePreview & { appendRefusal: string | null } {
  const cap = pasteQuoteCap();
  const n = Math.max(totalRows, block.rows.length);
  const kept = Math.min(n, cap, block.rows.length);
  let quotes = 0;
  let withErrors = 0;
  for (let i = 0; i < kept; i++) {
    const p = parseRow({ id: String(i), enabled: true, ...block.rows[i]! }, mode, conventions);
    if (p.quote) quotes++;
    else if (!p.blank) withErrors++;
  }
  const refusal = quotes > 0 ? null : n === 0 ? 'the paste has a header but no rows; the sheet is kept as it was' : `none of the ${kept} pasted rows reads as a quote; the sheet is kept as it was. Check the column mapping below`;
  const room = Math.max(0, cap - existing);
  const appendRefusal = n === 0 ? 'the paste has no rows' : room === 0 ? `the sheet already holds ${existing} rows, the most it takes (${cap} quotes); nothing can be appended` : null;
  return { rows: n, quotes, withErrors, leftOut: n - kept, appendLeftOut: Math.max(0, n - room), refusal, appendRefusal };
}

/** Column order for a header-less paste: the sheet's display order. */
export const PASTE_COLUMN_ORDER: readonly QuoteColumn[] = QUOTE_COLUMNS;

