import type { IsoDate } from '../time/date.ts';
import { parseDateText, type DateOrder } from './dateText.ts';
import { readRate, type QuoteUnitMode } from './quoteText.ts';
import { RATE_MAX, RATE_MIN } from '../kinds/fields.ts';
import { ExactDecimal } from './decimalText.ts';
import { MINUS } from '../format/marks.ts';

/** A decimal bound in percent, exact: -0.1 is "−10%". */
const percentText = (x: number): string => `${ExactDecimal.fromNumber(x)!.shifted(2).toFixed().replace('-', MINUS)}%`;

/** A pasted list of overnight fixings: the rates read by date, and the lines not taken, each with why. */
export interface FixingListReading {
  /** Overnight rates as decimals by date, in date order. */
  readonly fixings: Readonly<Record<IsoDate, number>>;
  readonly problems: readonly { readonly line: number; readonly text: string; readonly message: string }[];
}

/**
 * Overnight fixings pasted one per line as a date and a rate (as a central bank or a data page
 * lists them: `2027-03-15  3.65`, `15-Mar-2027, 3.65%`, `03/15/2027<TAB>365bp`), separated by a
 * tab, a comma, a semicolon or spaces. Dates as the sheet reads them (numeric in `order`); a bare
 * rate in the sheet's unit `mode` (percent: 3.65 is 3.65%), `%` or `bp` as typed. A header line
 * (no date in its first field) and blank lines are skipped; a date given twice keeps the later
 * line's rate and says so. With `valuationDate`, a date on or after it is not taken (its rate is not
 * known yet: a rate is published the next business morning). Every line not taken is a problem naming its line.
 */
export function readFixingList(text: string, mode: QuoteUnitMode, order: DateOrder, valuationDate?: IsoDate): FixingListReading {
  const out = new Map<IsoDate, number>();
  const problems: { line: number; text: string; message: string }[] = [];
  text.split(/\r\n|\r|\n/).forEach((lineText, i) => {
    const line = lineText.trim();
    if (line === '') return;
    const tokens = line.split(/[\t;]|,\s*|\s+/).filter((f) => f !== '');
    const at = { line: i + 1, text: line.slice(0, 40) };
    // The date: the longest run of up to three leading tokens that reads as one ("Mar 15 2024", "15 Mar 2024", "2024-03-15").
    let date: { date: IsoDate } | null = null;
    let used = 0;
    for (let k = Math.min(3, tokens.length); k >= 1 && date === null; k--) {
      const p = parseDateText(tokens.slice(0, k).join(' '), order);
      if (p !== null && p.ok) {
        date = p;
        used = k;
      }
    }
    if (date === null) {
      if (i === 0 && !/\d/.test(line)) return; // a header such as "Date, Rate"
      problems.push({ ...at, message: 'does not start with a date (use YYYY-MM-DD, such as 2027-03-15)' });
      return;
    }
    if (valuationDate !== undefined && date.date >= valuationDate) {
      problems.push({ ...at, message: `${date.date} is on or after the valuation date ${valuationDate}: its rate is not known yet` });
      return;
    }
    const rest = tokens.slice(used);
    const rateText = rest.length === 1 ? rest[0]! : rest.length === 2 && /^(%|bps?)$/i.test(rest[1]!) ? rest.join('') : null;
    if (rateText === null) {
      problems.push({ ...at, message: `needs a date and one rate, such as 2027-03-15 ${mode === 'decimal' ? '0.0365' : mode === 'bp' ? '365' : '3.65'}` });
      return;
    }
    const r = readRate(rateText, mode);
    if (!r.ok) {
      problems.push({ ...at, message: r.message });
      return;
    }
    if (!(r.value.rate >= RATE_MIN && r.value.rate <= RATE_MAX)) {
      problems.push({ ...at, message: `the rate ${rateText} is outside ${percentText(RATE_MIN)} to ${percentText(RATE_MAX)}` });
      return;
    }
    if (out.has(date.date)) problems.push({ ...at, message: `${date.date} is listed again; this line's rate is kept` });
    out.set(date.date, r.value.rate);
  });
  const sorted = [...out.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return { fixings: Object.fromEntries(sorted), problems };
}
