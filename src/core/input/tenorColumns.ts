import { QUOTE_KIND_MODULES } from '../kinds/registry.ts';
import type { RowText } from './quoteRow.ts';

/**
 * A published par curve laid out by tenor (US Treasury's Daily Treasury Par Yield Curve Rates:
 * a header `Date, 1 Mo, 2 Mo, 3 Mo, 4 Mo, 6 Mo, 1 Yr, 2 Yr, 3 Yr, 5 Yr, 7 Yr, 10 Yr, 20 Yr, 30 Yr`
 * and rows of yields in percent): what `readTenorColumns` read, for the paste preview.
 */
export interface TenorColumnsReading {
  /** One sheet row per tenor with a value: kind `par-yield`, the tenor, the yield in percent. */
  readonly rows: readonly RowText[];
  /** Per pasted column: its tenor (`1M`, `10Y`), `date` for the leading date column, or null when the heading is not a tenor. */
  readonly columns: readonly { readonly header: string; readonly tenor: string | 'date' | null; readonly reason: string; readonly sample: readonly string[] }[];
  /** What was read, in words: the layout, the date column, the row used, skipped tenors, headings that are not tenors. */
  readonly notes: readonly string[];
  /** Headings that are not tenors (their columns are ignored). */
  readonly ignored: readonly string[];
}

/** The kind each tenor column becomes. */
const PAR_KIND = QUOTE_KIND_MODULES['par-yield'].kind;

/** Header words of a leading date column (letters only, lower case). */
const DATE_WORDS = new Set(['date', 'asof', 'asofdate', 'curvedate', 'tradedate', 'day']);

/** Cells a published table uses for a missing value. */
const MISSING = new Set(['', 'n/a', 'na', '-', '\u2014', '\u2013', 'nan', 'null']);

/**
 * A column heading that names a tenor: a whole number, or 1.5 months, then a unit: months (`Mo`,
 * `Mos`, `Month(s)`, `M`), years (`Yr`, `Yrs`, `Year(s)`, `Y`), weeks (`Wk`, `Week(s)`, `W`), any
 * case, a space or none between (`1 Mo`, `10 YR`, `3M`, `30Y`). `1.5 Mo` (Treasury's six-week bill
 * column) reads as 6W. Null for anything else.
 */
export function tenorHeading(cell: string): { readonly tenor: string; readonly note: string | null } | null {
  const m = /^(\d{1,3}(?:\.5)?)\s*(mo|mos|mth|mths|month|months|m|yr|yrs|year|years|y|wk|wks|week|weeks|w)\.?$/i.exec(cell.trim());
  if (!m) return null;
  const n = Number(m[1]);
  const unit = m[2]!.charAt(0).toUpperCase() as 'M' | 'Y' | 'W';
  if (n === 1.5 && unit === 'M') return { tenor: '6W', note: `"${cell.trim()}" read as 6W (six weeks)` };
  if (!Number.isInteger(n) || n < 1) return null;
  return { tenor: `${n}${unit}`, note: null };
}

const letters = (cell: string): string => cell.toLowerCase().replace(/[^a-z]/g, '');
const isNumberCell = (cell: string): boolean => /^[+\-\u2212]?\d+(?:[.,]\d+)?\s*%?$/.test(cell.trim());

/**
 * Reads a block whose first row is a header of tenors (at least two cells are tenor headings, no
 * cell is a bare number; an optional first column headed Date or As of) as a published par curve:
 * the last row gives one `par-yield` sheet row per tenor, its value in percent (a bare number gets
 * `%`; the published curves quote percent). Null when the first row is not such a header.
 *
 * Everything read is said in `notes`: the date cell of the row used (reported only, it sets
 * nothing: the workspace's settlement date is not changed), that the last of several rows is
 * used, each tenor skipped for an empty or N/A cell, each heading that is not a tenor (its column
 * named and ignored).
 */
export function readTenorColumns(cells: readonly (readonly string[])[]): TenorColumnsReading | null {
  const head = cells[0];
  if (!head || head.length < 2 || head.some(isNumberCell)) return null;
  const dateCol = DATE_WORDS.has(letters(head[0]!)) ? 0 : -1;
  const headings = head.map((h, i) => (i === dateCol ? null : tenorHeading(h)));
  const tenorCount = headings.filter((h) => h !== null).length;
  const others = head.length - (dateCol === 0 ? 1 : 0);
  if (tenorCount < 2 || tenorCount * 2 < others) return null;

  const body = cells.slice(1);
  const row = body[body.length - 1] ?? [];
  const notes: string[] = [];
  const ignored: string[] = [];
  const rows: RowText[] = [];
  const seen = new Set<string>();
  notes.push(`Read as a par curve by tenor: ${tenorCount} tenor columns, one ${PAR_KIND} quote per tenor, the yields in percent (as the published curves give them).`);
  const dateText = dateCol === 0 ? (row[0] ?? '').trim() : '';
  if (dateCol === 0) {
    notes.push(
      dateText === ''
        ? `The ${head[0]} column is empty in the row used.`
        : `${head[0]} ${dateText}: the curve's date as pasted, reported only; it sets nothing (the settlement date stays as it is in the settings).`,
    );
  }
  if (body.length > 1) {
    const which = dateText !== '' ? `dated ${dateText}` : `row ${body.length} under the header`;
    notes.push(`${body.length} rows of yields: the last (${which}) is used; the other ${body.length - 1} are left out.`);
  }
  const columns = head.map((h, i) => {
    const value = (row[i] ?? '').trim();
    if (i === dateCol) return { header: h, tenor: 'date' as const, reason: 'the curve\u2019s date: reported, sets nothing', sample: value === '' ? [] : [value] };
    const t = headings[i];
    if (!t) {
      ignored.push(h);
      notes.push(h === '' ? `Column ${i + 1} has no heading: ignored.` : `"${h}" (column ${i + 1}) is not a tenor heading such as 1 Mo, 3M, 2 Yr or 10Y: its column is ignored.`);
      return { header: h, tenor: null, reason: h === '' ? 'no header: ignored' : 'not a tenor: ignored', sample: value === '' ? [] : [value] };
    }
    if (t.note) notes.push(`${t.note}.`);
    if (MISSING.has(value.toLowerCase())) {
      notes.push(`${h} (column ${i + 1}): ${value === '' ? 'empty' : value} in the row used, so this column gives no ${t.tenor} quote.`);
      return { header: h, tenor: t.tenor, reason: `tenor ${t.tenor}: no value, skipped`, sample: [] };
    }
    // A tenor named twice (a web table's long-term columns beside the curve's): the first column with a value gives the quote.
    if (seen.has(t.tenor)) {
      notes.push(`"${h}" (column ${i + 1}) is a second ${t.tenor} column with a value: ignored.`);
      return { header: h, tenor: null, reason: `a second ${t.tenor} column: ignored`, sample: [value] };
    }
    seen.add(t.tenor);
    const bare = !/(%|bps?)$/i.test(value);
    rows.push({ kind: PAR_KIND, maturity: t.tenor, rate: bare ? `${value}%` : value, price: '', coupon: '', frequency: '', dayCount: '' });
    return { header: h, tenor: t.tenor, reason: `par yield at ${t.tenor}${bare ? ', in %' : ''}`, sample: [value] };
  });
  if (body.length === 0) notes.push('No row of yields under the tenor header.');
  return { rows, columns, notes, ignored };
}
