import { daysInMonth, type IsoDate } from '../time/date.ts';

/**
 * Dates as people type them, read into ISO `YYYY-MM-DD`. Pure and exact: only digits and month
 * names are read, no clock and no locale.
 *
 * - ISO `2027-11-15` (ISO 8601 calendar date, extended format);
 * - day, month name, year: `15-Nov-2027`, `15 Nov 27`, `15 November 2027`, `15Nov2027`;
 * - month name, day, year: `Nov 15 2027`, `Nov 15, 2027`;
 * - numeric with `/`, `.` or `-`: `11/15/2027` or `15/11/2027` by the date-order setting
 *   (month/day/year is usual in the United States, day/month/year in most other places).
 *
 * A two-digit year follows the POSIX `strptime` `%y` rule (POSIX.1-2017): 69 to 99 are 1969 to
 * 1999, 00 to 68 are 2000 to 2068. Month names are English, full or the first three letters
 * (`Sept` too), in any case.
 */
export const DATE_ORDERS = ['mdy', 'dmy'] as const;
export type DateOrder = (typeof DATE_ORDERS)[number];
export const isDateOrder = (x: unknown): x is DateOrder => x === 'mdy' || x === 'dmy';
export const DATE_ORDER_LABEL: Readonly<Record<DateOrder, string>> = { mdy: 'month/day/year', dmy: 'day/month/year' };

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];
const FULL_MONTHS = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];

/** The month number (1..12) of an English month name or its first three letters, or 0. */
function monthOfName(word: string): number {
  const w = word.toLowerCase().replace(/\.$/, '');
  if (w === 'sept') return 9;
  const short = MONTHS.indexOf(w);
  if (short >= 0) return short + 1;
  return FULL_MONTHS.indexOf(w) + 1;
}

/** A year written with 4 digits, or 2 by POSIX %y (69..99 -> 1969..1999, 00..68 -> 2000..2068). */
function fullYear(text: string): number {
  const n = Number(text);
  if (text.length === 4) return n;
  return n >= 69 ? 1900 + n : 2000 + n;
}

const pad = (n: number, width: number): string => String(n).padStart(width, '0');

/** ISO text of y-m-d when it is a real date in 1900..2999, else null. */
function iso(y: number, m: number, d: number): IsoDate | null {
  if (!(y >= 1900 && y <= 2999 && m >= 1 && m <= 12 && d >= 1 && d <= daysInMonth(y, m))) return null;
  return `${pad(y, 4)}-${pad(m, 2)}-${pad(d, 2)}`;
}

export type DateTextParse = { readonly ok: true; readonly date: IsoDate } | { readonly ok: false; readonly message: string } | null;

/**
 * Reads a typed date. Returns null when the text does not look like a date at all (so the caller
 * can try other readings, such as a tenor), a date, or a message when it looks like a date but is
 * not one (`31-Feb-2027`, or `15/11/2027` in month/day/year order).
 */
export function parseDateText(text: string, order: DateOrder): DateTextParse {
  const s = text.trim().replace(/\s+/g, ' ');
  let m = /^(\d{4})-(\d{1,2})-(\d{1,2})$/.exec(s);
  if (m) {
    const date = iso(Number(m[1]), Number(m[2]), Number(m[3]));
    return date ? { ok: true, date } : { ok: false, message: `"${s}" is not a calendar date (that date does not exist)` };
  }
  // 15-Nov-2027, 15 Nov 27, 15Nov2027, 15 November 2027
  m = /^(\d{1,2})[ \-/.]?([A-Za-z]{3,9}\.?)[ \-/.,]*(\d{4}|\d{2})$/.exec(s);
  if (m && monthOfName(m[2]!) > 0) {
    const date = iso(fullYear(m[3]!), monthOfName(m[2]!), Number(m[1]));
    return date ? { ok: true, date } : { ok: false, message: `"${s}" is not a calendar date (that day does not exist in that month)` };
  }
  // Nov 15 2027, Nov 15, 2027
  m = /^([A-Za-z]{3,9}\.?)[ \-/.]?(\d{1,2}),? ?(\d{4}|\d{2})$/.exec(s);
  if (m && monthOfName(m[1]!) > 0) {
    const date = iso(fullYear(m[3]!), monthOfName(m[1]!), Number(m[2]));
    return date ? { ok: true, date } : { ok: false, message: `"${s}" is not a calendar date (that day does not exist in that month)` };
  }
  // 11/15/2027 or 15/11/2027 (also with . or -), by the date order
  m = /^(\d{1,2})([/.\-])(\d{1,2})\2(\d{4}|\d{2})$/.exec(s);
  if (m) {
    const a = Number(m[1]);
    const b = Number(m[3]);
    const y = fullYear(m[4]!);
    const [month, day] = order === 'mdy' ? [a, b] : [b, a];
    const date = iso(y, month, day);
    if (date) return { ok: true, date };
    const other = order === 'mdy' ? iso(y, b, a) : iso(y, a, b);
    const otherOrder: DateOrder = order === 'mdy' ? 'dmy' : 'mdy';
    const hint = other ? `; read as ${DATE_ORDER_LABEL[otherOrder]} it is ${other}: switch the date order in the settings, or type ${other}` : '';
    return { ok: false, message: `"${s}" is not a date in ${DATE_ORDER_LABEL[order]} order${hint}` };
  }
  return null;
}

/**
 * Re-writes a numeric date typed in one date order so it keeps its date in the other (day and
 * month swap places, the separator and year stay: `11/12/2027` month/day/year is `12/11/2027`
 * day/month/year). Any other text, and a numeric date that is not a date in `from`, is returned
 * unchanged.
 */
export function rewriteDateOrder(text: string, from: DateOrder, to: DateOrder): string {
  if (from === to) return text;
  const m = /^(\s*)(\d{1,2})([/.\-])(\d{1,2})\3(\d{4}|\d{2})(\s*)$/.exec(text);
  if (!m) return text;
  const read = parseDateText(text, from);
  if (!read?.ok) return text;
  return `${m[1]}${m[4]}${m[3]}${m[2]}${m[3]}${m[5]}${m[6]}`;
}
