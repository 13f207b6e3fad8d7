import {
  discountOn,
  explained,
  explanationText,
  forwardOn,
  marketDate,
  parseTenor,
  parYieldOn,
  topQuoteInfluences,
  valueUnderEachMethod,
  zeroOn,
  type Curve,
  type DisplaySettings,
  type Explanation,
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
  const read = (on: Curve): Result<number> => {
    switch (cell.field) {
      case 'discount': {
        const r = discountOn(on, date);
        return r.ok ? { ok: true, value: r.value.discount } : r;
      }
      case 'zero': {
        const r = zeroOn(on, date, c, dc);
        return r.ok ? { ok: true, value: r.value.zero } : r;
      }
      case 'par': {
        const r = parYieldOn(on, date, parFrequency);
        return r.ok ? { ok: true, value: r.value.rate } : r;
      }
      case 'forward': {
        const r = forwardOn(on, date, end, c, dc);
        return r.ok ? { ok: true, value: r.value.rate } : r;
      }
    }
  };
  const given = { date: cell.tenor, end: cell.field === 'forward' ? `${display.forwardTenor} after the start` : cell.tenor, start: cell.tenor };
  const traced: Result<{ explanation: Explanation }> =
    cell.field === 'discount' ? explained((s) => discountOn(curve, date, 'date', s), given)
    : cell.field === 'zero' ? explained((s) => zeroOn(curve, date, c, dc, 'date', s), given)
    : cell.field === 'par' ? explained((s) => parYieldOn(curve, date, parFrequency, 'maturity', s), { start: 'valuation date', end: cell.tenor })
    : explained((s) => forwardOn(curve, date, end, c, dc, 'forward', s), given);
  if (!traced.ok) return traced;
  const explanation = traced.value.explanation;
  const rowOf = (index: number): number | null => result.conversion.rowOfQuote[index] ?? null;
  const instruments = result.build.instruments;
  let quotesNote: string | null = null;
  let influences: Result<readonly { index: number; kind: string; maturity: string; yieldLabel: string; bpPerBp: number }[]>;
  if (cell.field === 'par') {
    influences = { ok: true, value: [] };
    quotesNote = 'not computed for par yields yet; open the zero rate or forward of this row for its quotes';
  } else if (cell.field === 'discount') {
    influences = topQuoteInfluences(curve, instruments, curve.settlement, date, 'continuous', curve.dayCount);
    quotesNote = `of its continuously compounded zero rate on ${curve.dayCount} (DF = exp(-z t))`;
  } else if (cell.field === 'zero') influences = topQuoteInfluences(curve, instruments, curve.settlement, date, c, dc);
  else influences = topQuoteInfluences(curve, instruments, date, end, c, dc);
  if (!influences.ok) quotesNote = influences.errors[0]!.message;
  const quotes = (influences.ok ? influences.value : []).map((q) => ({ row: rowOf(q.index), kind: q.kind, maturity: q.maturity, yieldLabel: q.yieldLabel, bpPerBp: q.bpPerBp }));
  const methods = valueUnderEachMethod({ settlement: curve.settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation }, instruments, read);
  const title = cell.field === 'forward' ? `${display.forwardTenor} forward rate starting ${cell.tenor} (${date} to ${end})` : `${cell.tenor} ${FIELD_WORDS[cell.field]} (${date})`;
  const text = explanationText(explanation, {
    title,
    quoteLabel: (index) => rowWords(rowOf(index)),
    topQuotes: quotes.map((q) => ({ label: `${rowWords(q.row)}, ${q.kind} ${q.maturity}, moved through its ${q.yieldLabel}`, bpPerBp: q.bpPerBp })),
    ...(quotesNote === null ? {} : { topQuotesNote: quotesNote }),
    methods,
  });
  return { ok: true, value: { title, explanation, quotes, quotesNote, methods, text } };
}
