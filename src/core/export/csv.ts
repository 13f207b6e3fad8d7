/**
 * CSV text (RFC 4180: comma separated, CRLF rows, fields with a comma, quote or line break in
 * double quotes with quotes doubled) with protection against formula injection: a text cell that
 * starts with =, +, -, @, a tab or a carriage return is prefixed with an apostrophe so a
 * spreadsheet shows it as text (OWASP, "CSV Injection", cited from memory). Numbers are written
 * as numbers and never prefixed, so -0.25 stays -0.25; a text cell that is exactly a decimal
 * number (such as "-12.5") is a number to any reader and is left alone too.
 */
export type CsvCell = string | number | null;

const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** One cell as CSV text. Non-finite numbers are refused (a silent NaN is never exported). */
export function csvCell(cell: CsvCell): string {
  if (cell === null) return '';
  if (typeof cell === 'number') {
    if (!Number.isFinite(cell)) throw new RangeError(`csvCell: ${String(cell)} is not a finite number`);
    return String(cell);
  }
  let text = cell;
  if (FORMULA_START.test(text) && !PLAIN_NUMBER.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows to CSV text with CRLF line ends and a final CRLF. */
export const toCsv = (rows: readonly (readonly CsvCell[])[]): string => rows.map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';

/**
 * Parses CSV text into rows of strings (RFC 4180 quoting; CRLF, LF or CR line ends; a leading
 * byte-order mark dropped; blank lines skipped). Returns an error message for an unclosed quote.
 */
export function parseCsv(text: string): { rows: string[][]; error: string | null } {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 1;
  const endRow = () => {
    row.push(field);
    if (!(row.length === 1 && row[0]!.trim() === '')) rows.push(row);
    row = [];
    field = '';
  };
  while (i < text.length) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        quoted = false;
      } else {
        if (ch === '\n') line++;
        field += ch;
      }
      i++;
      continue;
    }
    if (ch === '"' && field === '') quoted = true;
    else if (ch === ',') {
      row.push(field);
      field = '';
    } else if (ch === '\r' || ch === '\n') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      line++;
      endRow();
    } else field += ch;
    i++;
  }
  if (quoted) return { rows, error: `line ${line}: a quoted field is not closed; add the closing double quote` };
  if (field !== '' || row.length > 0) endRow();
  return { rows, error: null };
}
