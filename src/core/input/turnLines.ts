/**
 * Turns pasted as lines: `from, to, spread in bp, name` (tab or semicolon between fields, or commas
 * on a line that has neither; the name may be left out, and then reads "turn <from>"). Dates in the
 * sheet's date order, the spread with the sheet's decimal mark (7,5 with a decimal comma, fields
 * then split by tabs or semicolons). Each line not taken is reported by its number with what is wrong.
 */
import type { Turn } from '../document/types.ts';
import { TURN_SPREAD_MAX_BP } from '../document/overnightSections.ts';
import { compareIso } from '../time/date.ts';
import { withDecimalPoint, type DecimalMark } from './conventions.ts';
import { parseDateText, type DateOrder } from './dateText.ts';

export interface TurnLinesReading {
  readonly turns: readonly Turn[];
  readonly problems: readonly { readonly line: number; readonly text: string; readonly message: string }[];
}

const SPREAD = /^[+\u2212-]?\d+(\.\d+)?$/;

export function readTurnLines(text: string, order: DateOrder, mark: DecimalMark = '.'): TurnLinesReading {
  const turns: Turn[] = [];
  const problems: { line: number; text: string; message: string }[] = [];
  text.split(/\r\n|\r|\n/).forEach((lineText, i) => {
    const t = lineText.trim();
    if (t === '') return;
    const fail = (message: string) => problems.push({ line: i + 1, text: t.slice(0, 40), message });
    const tabbed = /[\t;]/.test(t);
    // With a decimal comma, commas cannot also part the fields: 7,5 would read as 7 and a name "5".
    if (!tabbed && mark === ',' && t.includes(',')) return fail('with the decimal comma, part the fields by tabs or semicolons, such as 2027-12-31; 2027-12-31; 7,5; year end');
    const fields = t.split(tabbed ? /\t|;/ : /,/).map((f) => f.trim());
    if (fields.length < 3) return fail('give from, to and the spread in bp (and a name), such as 2027-12-31, 2027-12-31, 10, year end');
    const [fromText, toText, spreadText, ...rest] = fields as [string, string, string, ...string[]];
    const from = parseDateText(fromText, order);
    const to = parseDateText(toText, order);
    if (from === null || !from.ok) return fail(`the first day "${fromText.slice(0, 20)}" is not a date${from && !from.ok ? `: ${from.message}` : ' (use YYYY-MM-DD)'}`);
    if (to === null || !to.ok) return fail(`the last day "${toText.slice(0, 20)}" is not a date${to && !to.ok ? `: ${to.message}` : ' (use YYYY-MM-DD)'}`);
    if (compareIso(to.date, from.date) < 0) return fail(`the last day ${to.date} is before the first ${from.date}`);
    const s = withDecimalPoint(spreadText, mark).replace('\u2212', '-');
    const spreadBp = SPREAD.test(s) ? Number(s) : NaN;
    if (!Number.isFinite(spreadBp) || Math.abs(spreadBp) > TURN_SPREAD_MAX_BP) return fail(`the spread "${spreadText.slice(0, 20)}" must be a number of bp from -${TURN_SPREAD_MAX_BP} to ${TURN_SPREAD_MAX_BP}`);
    const name = rest.join(', ').trim() || `turn ${from.date}`;
    turns.push({ name, from: from.date, to: to.date, spreadBp });
  });
  return { turns, problems };
}
