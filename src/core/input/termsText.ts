import { CONVENTION_SET_IDS } from '../kinds/conventionSets.ts';
import { parseDayCountText, type CellParse } from './quoteText.ts';
import { exactDecimal, normaliseNumberText } from './decimalText.ts';

/**
 * The sheet's Conventions cell: a quote's convention set and the date terms it overrides or adds,
 * as typed: `usd-sofr`, `eur-estr, spot lag 1`, `calendar target, spot lag 2, rule following`. The
 * parts are separated by commas (or semicolons); the first may be a set id (kinds/conventionSets.ts),
 * each other part is a field's words and its value. The engine checks what the kind takes (an OIS
 * takes a payment lag, a deposit does not) and names the field; this reader checks the form.
 */
export interface RowTerms {
  /** The set the row names, or null. */
  readonly set: string | null;
  /** Fields the row gives itself, by engine field name, in TERM_FIELDS order. */
  readonly fields: Readonly<Partial<Record<TermField, string | number | boolean>>>;
}

/** The engine fields the cell can hold besides the set, in the order it is written. */
export const TERM_FIELDS = ['calendar', 'spotLag', 'businessDay', 'paymentLag', 'eom', 'floatDayCount', 'convexity'] as const;
export type TermField = (typeof TERM_FIELDS)[number];

/** Each field's words in the cell (the first is how it is written back). */
const WORDS: Readonly<Record<TermField, readonly string[]>> = {
  calendar: ['calendar'],
  spotLag: ['spot lag', 'spotlag'],
  businessDay: ['rule', 'business day', 'businessday'],
  paymentLag: ['payment lag', 'paymentlag'],
  eom: ['eom', 'month end'],
  floatDayCount: ['float day count', 'floatdaycount'],
  // A future's convexity adjustment in bp (the futures rate minus the forward rate), typed per contract.
  convexity: ['convexity'],
};

/** The field words for people: the examples every message offers. */
const EXAMPLES = 'calendar target, spot lag 2, rule modified-following, payment lag 1, eom on, float day count ACT/360';

/** How a field and its value are written in the cell. */
function writeField(f: TermField, v: string | number | boolean): string {
  if (f === 'eom') return v === true ? 'eom on' : 'eom off';
  if (f === 'convexity') return `convexity ${String(v)}bp`;
  return `${WORDS[f][0]} ${String(v)}`;
}

/** The cell's text for a set and fields (the form the reader reads back to the same terms). */
export function termsText(terms: RowTerms): string {
  const parts: string[] = terms.set === null ? [] : [terms.set];
  for (const f of TERM_FIELDS) {
    const v = terms.fields[f];
    if (v !== undefined) parts.push(writeField(f, v));
  }
  return parts.join(', ');
}

const bad = <T>(message: string): CellParse<T> => ({ ok: false, message });

/** One part `words value`: the field whose words it starts with, and the rest. */
function fieldOf(part: string): { field: TermField; value: string } | null {
  const lower = part.toLowerCase();
  for (const f of TERM_FIELDS) {
    for (const w of WORDS[f]) {
      if (lower === w || lower.startsWith(`${w} `)) return { field: f, value: part.slice(w.length).trim() };
    }
  }
  if (lower === 'no eom') return { field: 'eom', value: 'off' };
  return null;
}

/** Reads the cell (empty: no set, no field). */
export function parseTermsText(text: string): CellParse<RowTerms> {
  const parts = text.split(/[,;]/).map((p) => p.trim().replace(/\s+/g, ' '));
  if (parts.every((p) => p === '')) return { ok: true, value: { set: null, fields: {} } };
  let set: string | null = null;
  const fields: Partial<Record<TermField, string | number | boolean>> = {};
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i]!;
    if (part === '') continue;
    const named = CONVENTION_SET_IDS.find((id) => id === part.toLowerCase());
    if (named !== undefined) {
      if (i !== 0) return bad(`the convention set (${named}) comes first, before the fields it is overridden by`);
      set = named;
      continue;
    }
    const f = fieldOf(part);
    if (f === null) {
      const what = /\s/.test(part) ? `"${part}" is not a field this cell takes` : `"${part}" is not a convention set or a field`;
      return bad(`${what}; the sets are ${CONVENTION_SET_IDS.join(', ')}, then fields such as ${EXAMPLES}`);
    }
    if (fields[f.field] !== undefined) return bad(`${WORDS[f.field][0]} is given twice; keep one`);
    const v = f.value;
    switch (f.field) {
      case 'spotLag':
      case 'paymentLag':
        if (!/^\d{1,2}$/.test(v)) return bad(`${WORDS[f.field][0]} takes a whole number of business days, such as ${WORDS[f.field][0]} 2, not "${v}"`);
        fields[f.field] = Number(v);
        break;
      case 'eom': {
        const s = v.toLowerCase();
        if (s === '' || s === 'on' || s === 'yes' || s === 'true') fields.eom = true;
        else if (s === 'off' || s === 'no' || s === 'false') fields.eom = false;
        else return bad(`eom is on or off (the end-of-month rule), not "${v}"`);
        break;
      }
      case 'convexity': {
        const d = exactDecimal(normaliseNumberText(v.replace(/\s*bps?$/i, '')));
        if (d === null) return bad(`convexity takes basis points, such as convexity 0.5bp (a future's futures rate minus its forward rate), not "${v}"`);
        fields.convexity = d.toNumber();
        break;
      }
      case 'floatDayCount': {
        const dc = parseDayCountText(v);
        if (!dc.ok) return bad(`float day count: ${dc.message}`);
        fields.floatDayCount = dc.value;
        break;
      }
      default:
        if (v === '') return bad(`${WORDS[f.field][0]} needs a value, such as ${f.field === 'calendar' ? 'calendar target' : 'rule modified-following'}`);
        fields[f.field] = f.field === 'businessDay' ? v.toLowerCase() : v;
    }
  }
  return { ok: true, value: { set, fields } };
}

/** The set a row's Conventions cell names, or null (also when the cell does not read). */
export function rowSetOf(termsCell: string): string | null {
  const p = parseTermsText(termsCell);
  return p.ok ? p.value.set : null;
}

/** The cell's reading, or null when it does not read (its error is the row's). */
export function rowTermsOf(termsCell: string): RowTerms | null {
  const p = parseTermsText(termsCell);
  return p.ok ? p.value : null;
}
