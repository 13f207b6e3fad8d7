import {
  buildCurve,
  discountOn,
  explained,
  explanationSections,
  explanationText,
  forwardOn,
  marketDate,
  parseTenor,
  parYieldOn,
  topQuoteInfluences,
  valueUnderEachMethod,
  zeroOn,
  type Curve,
  type InterpolationId,
  type DisplaySettings,
  type Explanation,
  type ExplanationSink,
  type ExplanationSection,
  type MethodValue,
  type Result,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';

/** The key-maturity cells that explain themselves. */
export type KeyField = 'discount' | 'zero' | 'par' | 'forward';

/** Which cell: its row's tenor and its column. */
export interface KeyCell {
  readonly tenor: string;
  readonly field: KeyField;
}

/** A quote behind the number, located on the sheet. */
export interface CellQuote {
  /** Sheet row, counted from 0 (null when the quote has no row: not expected). */
  readonly row: number | null;
  readonly kind: string;
  readonly maturity: string;
  readonly yieldLabel: string;
  readonly bpPerBp: number;
}

/** Everything the explanation panel shows for one cell; every figure from the core. */
export interface CellExplanation {
  readonly title: string;
  readonly explanation: Explanation;
  /** The definition, inputs, steps, quotes and methods as lines (full precision), as Copy as text writes them. */
  readonly sections: readonly ExplanationSection[];
  readonly quotes: readonly CellQuote[];
  /** What the quotes' sensitivities are of, when not the number itself, or why there are none. */
  readonly quotesNote: string | null;
  readonly methods: readonly MethodValue[];
  /** The explanation as plain text (Copy as text). */
  readonly text: string;
}

const FIELD_WORDS: Readonly<Record<KeyField, string>> = { discount: 'discount factor', zero: 'zero rate', par: 'par yield', forward: 'forward rate' };

/** The sheet row of a quote index of the build (the engine document's order), as people count it. */
const rowWords = (row: number | null): string => (row === null ? 'a quote' : `row ${row + 1}`);

/**
 * The explanation of one key-maturity cell, read as keyMaturityRows reads it (same dates, same
 * queries), with the quotes it depends on most and its value under each method. An error value
 * when the cell has no number (beyond the curve without extrapolation).
 */
export function explainKeyCell(result: WorkbenchBuild, display: DisplaySettings, cell: KeyCell): Result<CellExplanation> {
  const curve = result.build.curve;
  if (!curve) return { ok: false, errors: [{ path: '', quote: null, code: 'schema', message: result.fatal ?? 'no curve' }] };
  const tenor = parseTenor(cell.tenor);
  if (!tenor) return { ok: false, errors: [{ path: 'tenor', quote: null, code: 'schema', message: `"${cell.tenor}" is not a tenor` }] };
  const date = marketDate(curve.settlement, tenor);
  const end = marketDate(date, parseTenor(display.forwardTenor) ?? { n: 3, unit: 'M' });
  const { compounding: c, dayCount: dc, parFrequency } = display;
  // One query for the number on any curve, traced when given a sink (the panel's number is the table's).
  const read = (on: Curve, sink?: ExplanationSink): Result<number> => {
    const r =
      cell.field === 'discount' ? discountOn(on, date, 'date', sink)
      : cell.field === 'zero' ? zeroOn(on, date, c, dc, 'date', sink)
      : cell.field === 'par' ? parYieldOn(on, date, parFrequency, 'maturity', sink)
      : forwardOn(on, date, end, c, dc, 'forward', sink);
    if (!r.ok) return r;
    const v = r.value as { discount?: number; zero?: number; rate?: number };
    return { ok: true, value: (cell.field === 'discount' ? v.discount : cell.field === 'zero' ? v.zero : v.rate)! };
  };
  const traced = explained((sink) => read(curve, sink), cell.field === 'par' ? { start: 'valuation date', end: cell.tenor } : { date: cell.tenor, start: cell.tenor, end: `${display.forwardTenor} after the start` });
  if (!traced.ok) return traced;
  const explanation = traced.value.explanation;
  const rowOf = (index: number): number | null => result.conversion.rowOfQuote[index] ?? null;
  const instruments = result.build.instruments;
  let quotesNote: string | null = null;
  let influences: Result<readonly { index: number; kind: string; maturity: string; yieldLabel: string; bpPerBp: number }[]>;
  if (cell.field === 'par') {
    influences = { ok: true, value: [] };
    quotesNote = 'not computed for par yields';
  } else if (cell.field === 'discount') {
    influences = topQuoteInfluences(curve, instruments, curve.settlement, date, 'continuous', curve.dayCount);
    quotesNote = `of its continuously compounded zero rate on ${curve.dayCount} (DF = exp(-z t))`;
  } else if (cell.field === 'zero') influences = topQuoteInfluences(curve, instruments, curve.settlement, date, c, dc);
  else influences = topQuoteInfluences(curve, instruments, date, end, c, dc);
  if (!influences.ok) quotesNote = influences.errors[0]!.message;
  const quotes = (influences.ok ? influences.value : []).map((q) => ({ row: rowOf(q.index), kind: q.kind, maturity: q.maturity, yieldLabel: q.yieldLabel, bpPerBp: q.bpPerBp }));
  // The workspace's document built under each method, as the workbench builds it (skipping wrong rows).
  const methods = valueUnderEachMethod(curve.interpolation, (method: InterpolationId) => buildCurve(result.conversion.doc, { skipInvalid: true, interpolation: method }), read);
  const title = cell.field === 'forward' ? `${display.forwardTenor} forward rate starting ${cell.tenor} (${date} to ${end})` : `${cell.tenor} ${FIELD_WORDS[cell.field]} (${date})`;
  const extras = {
    title,
    quoteLabel: (index: number) => rowWords(rowOf(index)),
    topQuotes: quotes.map((q) => ({ label: `${rowWords(q.row)}, ${q.kind} ${q.maturity}, moved through its ${q.yieldLabel}`, bpPerBp: q.bpPerBp })),
    ...(quotesNote === null ? {} : { topQuotesNote: quotesNote }),
    methods,
  };
  const text = explanationText(explanation, extras);
  const sections = explanationSections(explanation, extras);
  return { ok: true, value: { title, explanation, sections, quotes, quotesNote, methods, text } };
}
