import { coreError, fail, ok, type CoreError, type CoreWarning, type Result } from '../result.ts';
import { convexityModelFields } from '../instruments/convexity.ts';
import { validateWorkspace, RESERVED_KEYS, type CurvesReader } from './validate.ts';
import type { Quote, QuoteKind } from './types.ts';
import { KIND_PRICE_FIELDS, KIND_RATE_FIELDS, QUOTE_KIND_MODULES } from '../kinds/registry.ts';
import { QUOTE_COLUMN_LABEL, QUOTE_COLUMNS, type QuoteRow } from '../input/quoteRow.ts';
import { TERM_FIELDS, termsText, type TermField } from '../input/termsText.ts';
import { conventionSet } from '../kinds/conventionSets.ts';
import { DEFAULT_DISPLAY, isMarketConventions, readWorkbenchDocument, toEngineDocument, WORKBENCH_FORMAT, WORKBENCH_VERSION, type WorkbenchDocument } from './workbenchDocument.ts';
import { isPlainObject } from './plainObject.ts';
import { checkWorkbenchShape } from './workbenchShape.ts';

/**
 * The two document formats, each readable where the other is written: the workbench's
 * `tenorscope-workbench` (quote cells as typed) and the engine's `tenorscope-workspace` (quotes as
 * numbers, read by the `curve` command). Both conversions are exact or refused: an engine number
 * becomes its shortest round-trip text in the sheet's decimal unit, so it parses back to the same
 * double; a field the sheet cannot hold is an error naming the quote and field, never dropped.
 */


/** The engine field written into each sheet column (the sheet's rate column holds a rate, a discount yield or a yield). */
const COLUMN_FIELDS: Readonly<Record<(typeof QUOTE_COLUMNS)[number], readonly string[]>> = {
  kind: ['kind'],
  maturity: ['tenor', 'maturity', 'month', 'period'],
  rate: KIND_RATE_FIELDS,
  price: KIND_PRICE_FIELDS,
  coupon: ['coupon'],
  frequency: ['frequency'],
  dayCount: ['dayCount'],
  // Written by termsCellOf (the set and the date terms), not read field by field.
  terms: [],
};
/** The fields the Conventions cell holds besides the set (input/termsText.ts). */
const TERM_FIELD_SET: ReadonlySet<string> = new Set(['conventions', ...TERM_FIELDS]);

/**
 * A quote's Conventions cell: its set unless it is the workspace's market conventions (which the
 * sheet's rows of its kinds take anyway), and its own date terms, leaving out a calendar that is
 * the market set's calendar joined to the workspace's own (`curve.joinCalendar`).
 */
function termsCellOf(q: Record<string, unknown>, market: string | null, joinCalendar: string | null): string {
  const fields: Partial<Record<TermField, string | number | boolean>> = {};
  for (const f of TERM_FIELDS) {
    const v = q[f];
    if (typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean') fields[f] = v;
  }
  const takesMarket = market !== null && q.conventions === market;
  if (takesMarket && joinCalendar !== null) {
    const base = conventionSet(market)?.fields[q.kind as QuoteKind]?.calendar;
    if (typeof base === 'string' && fields.calendar === `${base}+${joinCalendar}`) delete fields.calendar;
  }
  const set = typeof q.conventions === 'string' && !takesMarket ? q.conventions : null;
  return termsText({ set, fields });
}
const cellText = (v: unknown): string => (typeof v === 'string' ? v : typeof v === 'number' && Number.isFinite(v) ? String(v) : '');

/**
 * An engine quote as the sheet's cells (every column but Conventions, which termsCellOf writes;
 * numbers as their shortest round-trip text in the decimal unit) and its on/off flag: the one
 * writer of a quote's cells, for a file opened into the sheet and a named curve's quote edited in
 * its own rows (features/namedCurves).
 */
export function sheetCellsOf(q: Record<string, unknown>): Omit<QuoteRow, 'id' | 'terms'> {
  const row: Record<string, unknown> = { enabled: q.enabled !== false };
  for (const c of QUOTE_COLUMNS) row[c] = cellText(COLUMN_FIELDS[c].map((f) => q[f]).find((v) => v !== undefined));
  // A kind dated by its own fields writes its Maturity cell itself (a future: `2027-03 1M`).
  const own = typeof q.kind === 'string' && Object.hasOwn(QUOTE_KIND_MODULES, q.kind) ? QUOTE_KIND_MODULES[q.kind as QuoteKind].sheet.maturityCell : undefined;
  if (own !== undefined) row.maturity = own.write(q);
  return row as unknown as Omit<QuoteRow, 'id' | 'terms'>;
}

/** A quote's full sheet row text without a workspace's market conventions (a named curve's quote, whose set is its own). */
export const quoteRowText = (q: Record<string, unknown>): Omit<QuoteRow, 'id'> => ({ ...sheetCellsOf(q), terms: termsCellOf(q, null, null) });

/** The engine's reading of one quote, without its position: what must survive a conversion unchanged. */
const meaning = (q: Quote): string => {
  const { index: _index, ...rest } = q;
  return JSON.stringify(rest);
};

/**
 * An engine document as a workbench document: quotes as rows of text in the decimal unit, the
 * curve settings, display defaults and the reserved keys as given. Refused, with one error per
 * problem, when the engine refuses the document, or when a quote carries a field the sheet has no
 * column for with a value other than the one the sheet's row implies (a zero's `compounding`, an
 * `eom` flag): the converted document is validated again and every quote must read the same.
 */
export function workbenchFromEngine(raw: unknown, makeId: () => string, readCurves?: CurvesReader): Result<WorkbenchDocument> {
  const first = validateWorkspace(raw, readCurves);
  if (!first.workspace || first.errors.length > 0) return fail(...first.errors);
  const doc = raw as Record<string, unknown>;

  const rawQuotes = doc.quotes as readonly Record<string, unknown>[];
  const rows = rawQuotes.map((q) => ({ id: makeId(), ...sheetCellsOf(q) }) as Record<string, unknown>);
  const ws = first.workspace;
  // A set every quote of its kinds names opens as the workspace's market conventions (the sheet's
  // rows of those kinds take it); any other set a quote names goes in its Conventions cell. The
  // check below refuses the file when that would change any quote.
  const named = [...new Set(rawQuotes.map((q) => q.conventions).filter((c) => c !== undefined))];
  const market =
    named.find(
      (id): id is string =>
        isMarketConventions(id) && id !== 'none' && rawQuotes.every((q) => q.conventions === id || conventionSet(id)?.fields[q.kind as QuoteKind] === undefined),
    ) ?? null;
  // A calendar of the file's own joined to the set's calendar on those quotes (`target+desk-days`) opens as the workbench's joined calendar.
  const joins = [...new Set(rawQuotes.map((q) => (q.conventions === market && typeof q.calendar === 'string' && q.calendar.includes('+') ? q.calendar.slice(q.calendar.lastIndexOf('+') + 1) : undefined)).filter((c) => c !== undefined))];
  const joinCalendar = market && joins.length === 1 ? joins[0]! : null;
  const quotes = rows.map((row, i) => {
    const terms = termsCellOf(rawQuotes[i]!, market, joinCalendar);
    return (terms === '' ? row : { ...row, terms }) as unknown as QuoteRow;
  });
  const out: Record<string, unknown> = {
    format: WORKBENCH_FORMAT,
    version: WORKBENCH_VERSION,
    settlement: ws.settlement,
    curve: { dayCount: ws.curve.dayCount, interpolation: ws.curve.interpolation, extrapolation: ws.curve.extrapolation, ...(market ? { conventions: market } : {}), ...(joinCalendar ? { joinCalendar } : {}), ...(ws.curve.futuresConvexity ? { futuresConvexity: convexityModelFields(ws.curve.futuresConvexity) } : {}) },
    quoteUnit: 'decimal',
    quotes,
    display: DEFAULT_DISPLAY,
  };
  if (doc.calendars !== undefined && Object.keys(doc.calendars as object).length > 0) out.calendars = doc.calendars;
  if (doc.customCalendars !== undefined && Object.keys(doc.customCalendars as object).length > 0) out.customCalendars = doc.customCalendars;
  if (doc.fixings !== undefined && Object.keys(doc.fixings as object).length > 0) out.fixings = doc.fixings;
  // A turn solved from quotes[i] names that quote's row by its id in the workbench (a position past
  // the quotes, no row: the build refuses it naming the turn).
  if (Array.isArray(doc.turns) && doc.turns.length > 0)
    out.turns = (doc.turns as Record<string, unknown>[]).map((t) => {
      if (typeof t.solveFrom !== 'number') return t;
      const { solveFrom, ...rest } = t;
      return { ...rest, solveFromRow: rows[solveFrom]?.id ?? '' };
    });
  if (doc.meetingSteps !== undefined) out.meetingSteps = doc.meetingSteps;
  // Named curves (read by `readCurves`) are kept as the file gives them: the workbench shows them and writes them back unchanged.
  if (Array.isArray(doc.curves)) out.curves = doc.curves;
  for (const key of RESERVED_KEYS) if (doc[key] !== undefined) out[key] = doc[key];
  const wb = out as unknown as WorkbenchDocument;
  const again = validateWorkspace(toEngineDocument(wb).doc, readCurves);
  const errors: CoreError[] = [];
  if (ws.curve.fit !== 'none') errors.push(coreError('schema', 'curve.fit', `curve.fit "${ws.curve.fit}" has no place in the workbench document; choose the fit in the workbench's fit section instead, or remove curve.fit from the file`));
  const back = again.workspace?.quotes ?? [];
  if (back.length !== ws.quotes.length) errors.push(coreError('schema', 'quotes', `the sheet read ${back.length} of the file's ${ws.quotes.length} quotes; open it with the curve command instead`));
  else
    ws.quotes.forEach((q, i) => {
      if (meaning(q) === meaning(back[i]!)) return;
      const extra = Object.keys(rawQuotes[i]!).filter((k) => !Object.values(COLUMN_FIELDS).some((fs) => fs.includes(k)) && !TERM_FIELD_SET.has(k) && k !== 'enabled');
      const what = extra.length > 0 ? `its ${extra.join(', ')} (${extra.map((k) => JSON.stringify(rawQuotes[i]![k])).join(', ')}) has no column in the sheet` : 'the sheet would read it differently';
      errors.push(coreError('schema', `quotes[${i}]`, `quotes[${i}] (a ${q.kind} maturing ${q.maturity}): ${what}; the file was not opened, so nothing would change silently. Open it with the curve command, or remove the field if its default is what you mean.`, i));
    });
  return errors.length > 0 ? fail(...errors) : ok(wb);
}

/**
 * A document of either format as the engine's document (what the `curve` command builds). A
 * workbench document is read as the workbench reads it; each row with a wrong cell is an error
 * naming the row (counted from 1) and column, and is left out of the engine document.
 */
export interface AnyDocumentReading {
  readonly doc: unknown;
  /** Wrong rows of a workbench document (empty for an engine document). */
  readonly errors: readonly CoreError[];
  /**
   * For a workbench document, rowOfQuote[i] is the input row of the engine document's quotes[i];
   * null for an engine document (its positions are the input's own).
   */
  readonly rowOfQuote: readonly number[] | null;
  /** Settings of a workbench document that take no effect (EngineConversion.notes); empty for an engine document. */
  readonly warnings?: readonly CoreWarning[];
}

export function engineFromAnyDocument(raw: unknown): AnyDocumentReading {
  if (!isPlainObject(raw) || raw.format !== WORKBENCH_FORMAT) return { doc: raw, errors: [], rowOfQuote: null };
  // The shape the workbench's file and link readers check first (validateDocument): a section it
  // refuses there is refused here too, not dropped by the lenient saved-entry reader below.
  const shape = checkWorkbenchShape(raw);
  if (shape.errors.length > 0) return { doc: raw, errors: shape.errors, rowOfQuote: null };
  let n = 0;
  const read = readWorkbenchDocument(raw, () => `r${n++}`);
  if (!read.doc) return { doc: raw, errors: [coreError('schema', '', `this workbench document cannot be read: ${read.problem ?? 'unknown problem'}`)], rowOfQuote: null };
  const conv = toEngineDocument(read.doc);
  const errors: CoreError[] = [];
  conv.rows.forEach((row, i) => {
    for (const c of QUOTE_COLUMNS) {
      const issue = row.issues[c];
      if (issue?.severity === 'error') errors.push(coreError('schema', `quotes[${i}].${c}`, `row ${i + 1}, ${QUOTE_COLUMN_LABEL[c]}: ${issue.message}`, i));
    }
  });
  return conv.notes.length === 0 ? { doc: conv.doc, errors, rowOfQuote: conv.rowOfQuote } : { doc: conv.doc, errors, rowOfQuote: conv.rowOfQuote, warnings: conv.notes };
}

/**
 * Engine errors or warnings about the converted document, re-pointed at the input's rows:
 * `quotes[i]` in the path and message, and the quote index, become the row's position.
 */
export function atInputRows<T extends { readonly path: string; readonly quote: number | null; readonly message: string }>(items: readonly T[], rowOfQuote: readonly number[] | null): T[] {
  if (rowOfQuote === null) return items as T[];
  const row = (i: number): number => rowOfQuote[i] ?? i;
  const repoint = (text: string): string => text.replace(/quotes\[(\d+)\]/g, (_, q: string) => `quotes[${row(Number(q))}]`);
  return items.map((e) => ({ ...e, path: repoint(e.path), message: repoint(e.message), quote: e.quote === null ? null : row(e.quote) }));
}

