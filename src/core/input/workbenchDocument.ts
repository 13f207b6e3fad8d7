import { COMPOUNDINGS, isCompounding, type Compounding } from '../rates/compounding.ts';
import { CURVE_DAY_COUNTS, isCurveDayCount, type CurveDayCount } from '../time/dayCount.ts';
import { INTERPOLATIONS, isInterpolation, type InterpolationId } from '../interpolation/types.ts';
import { EXTRAPOLATIONS, isExtrapolation, type Extrapolation } from '../curve/curve.ts';
import { FREQUENCIES, RESERVED_KEYS, WORKSPACE_FORMAT, WORKSPACE_VERSION } from '../workspace/validate.ts';
import type { CoreError } from '../result.ts';
import { isQuoteUnitMode, type QuoteUnitMode } from './quoteText.ts';
import { DEFAULT_CONVENTIONS, isDecimalMark, type DecimalMark, type InputConventions } from './conventions.ts';
import { isDateOrder, type DateOrder } from './dateText.ts';
import { parseRow, QUOTE_COLUMNS, type QuoteColumn, type QuoteRow, type RowIssues, type RowParse } from './quoteRow.ts';

export const WORKBENCH_FORMAT = 'tenorscope-workbench';
export const WORKBENCH_VERSION = 1;

export const FORWARD_TENORS = ['1M', '3M', '6M', '1Y'] as const;
export type ForwardTenor = (typeof FORWARD_TENORS)[number];
export const MATURITY_AXES = ['linear', 'sqrt'] as const;
export type MaturityAxis = (typeof MATURITY_AXES)[number];

/** How rates are shown: every rate on screen is re-expressed in this compounding and day count. */
export interface DisplaySettings {
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
  readonly forwardTenor: ForwardTenor;
  readonly axis: MaturityAxis;
  /** Coupons a year of the par-yield line (ACT/ACT-ICMA accrual, as a bond). */
  readonly parFrequency: number;
  readonly showPar: boolean;
  readonly showInstantaneous: boolean;
  readonly showMethodOverlay: boolean;
  /** How a numeric date typed in the sheet is read: month/day/year or day/month/year. */
  readonly dateOrder: DateOrder;
  /** The decimal mark of numbers typed in the sheet: point (3.25) or comma (3,25). */
  readonly decimalMark: DecimalMark;
}

/**
 * The workbench's document: everything the user gave, as typed, and nothing derived. Quote cells
 * are text; `toEngineDocument` turns it into the engine's `tenorscope-workspace` document.
 * Top-level keys `strategy`, `scenarios`, `snapshots`, `view`, `note` belong to other panels and
 * are carried unchanged.
 */
export interface WorkbenchDocument {
  readonly format: typeof WORKBENCH_FORMAT;
  readonly version: typeof WORKBENCH_VERSION;
  /** Settlement date as given (an ISO date when valid). */
  readonly settlement: string;
  readonly curve: { readonly dayCount: CurveDayCount; readonly interpolation: InterpolationId; readonly extrapolation: Extrapolation };
  readonly quoteUnit: QuoteUnitMode;
  readonly quotes: readonly QuoteRow[];
  readonly display: DisplaySettings;
  readonly strategy?: unknown;
  readonly scenarios?: unknown;
  readonly snapshots?: unknown;
  readonly view?: unknown;
  readonly note?: unknown;
}

export const DEFAULT_DISPLAY: DisplaySettings = {
  compounding: 'continuous',
  dayCount: 'ACT/365F',
  forwardTenor: '3M',
  axis: 'linear',
  parFrequency: 2,
  showPar: true,
  showInstantaneous: false,
  showMethodOverlay: false,
  dateOrder: DEFAULT_CONVENTIONS.dateOrder,
  decimalMark: DEFAULT_CONVENTIONS.decimalMark,
};

/** The input conventions a document's sheet is read with (defaults for a document saved before they existed). */
export const conventionsOf = (doc: { readonly display?: Partial<DisplaySettings> }): InputConventions => ({
  dateOrder: isDateOrder(doc.display?.dateOrder) ? doc.display.dateOrder : DEFAULT_CONVENTIONS.dateOrder,
  decimalMark: isDecimalMark(doc.display?.decimalMark) ? doc.display.decimalMark : DEFAULT_CONVENTIONS.decimalMark,
});

export interface EngineConversion {
  /** The engine's document (only rows that parsed), ready for buildCurve. */
  readonly doc: Record<string, unknown>;
  /** rowOfQuote[i] is the sheet row index of the engine document's quotes[i]. */
  readonly rowOfQuote: readonly number[];
  /** One entry per sheet row. */
  readonly rows: readonly RowParse[];
  /** Rows with a wrong cell (left out of the document). */
  readonly invalidRows: number;
  readonly blankRows: number;
}

/**
 * Converts the workbench document into the engine's `tenorscope-workspace` document. `parse` may be
 * a caching wrapper of `parseRow` (the UI keeps one so a one-cell edit re-parses one row).
 */
export function toEngineDocument(
  doc: Pick<WorkbenchDocument, 'settlement' | 'curve' | 'quoteUnit' | 'quotes'> & { readonly display?: Partial<DisplaySettings> } & Partial<Record<(typeof RESERVED_KEYS)[number], unknown>>,
  parse: (row: QuoteRow, mode: QuoteUnitMode, conventions: InputConventions) => RowParse = parseRow): EngineConversion {
  const conventions = conventionsOf(doc);
  const rows = doc.quotes.map((r) => parse(r, doc.quoteUnit, conventions));
  const quotes: Record<string, unknown>[] = [];
  const rowOfQuote: number[] = [];
  let invalidRows = 0;
  let blankRows = 0;
  rows.forEach((p, i) => {
    if (p.blank) blankRows++;
    else if (p.quote) {
      quotes.push(p.quote);
      rowOfQuote.push(i);
    } else invalidRows++;
  });
  const engine: Record<string, unknown> = {
    format: WORKSPACE_FORMAT,
    version: WORKSPACE_VERSION,
    settlement: doc.settlement,
    curve: { ...doc.curve },
    quotes,
  };
  for (const key of RESERVED_KEYS) if (doc[key] !== undefined) engine[key] = doc[key];
  return { doc: engine, rowOfQuote, rows, invalidRows, blankRows };
}

const FIELD_COLUMN: Readonly<Record<string, QuoteColumn>> = {
  rate: 'rate', discountYield: 'rate', yield: 'rate',
  price: 'price', cleanPrice: 'price',
  coupon: 'coupon', frequency: 'frequency', dayCount: 'dayCount',
  tenor: 'maturity', maturity: 'maturity', kind: 'kind',
};

/** The sheet cell an engine error points at (`quotes[3].cleanPrice` -> price); `kind` for a whole-quote error. */
export function columnOfPath(path: string): QuoteColumn {
  const m = /^quotes\[\d+\]\.(\w+)/.exec(path);
  return (m && FIELD_COLUMN[m[1]!]) || 'kind';
}

/**
 * Engine errors about single quotes, as issues on sheet rows: `quotes[i]` in the message is
 * re-worded as the row number the user sees.
 */
export function rowIssuesFromEngine(errors: readonly Pick<CoreError, 'path' | 'quote' | 'message'>[], rowOfQuote: readonly number[]): Map<number, RowIssues> {
  const out = new Map<number, RowIssues>();
  for (const e of errors) {
    if (e.quote === null) continue;
    const row = rowOfQuote[e.quote];
    if (row === undefined) continue;
    const message = e.message.replace(/quotes\[(\d+)\]/g, (_, q: string) => `row ${(rowOfQuote[Number(q)] ?? Number(q)) + 1}`);
    const col = columnOfPath(e.path);
    const prev = out.get(row) ?? {};
    if (!prev[col]) out.set(row, { ...prev, [col]: { severity: 'error', message } });
  }
  return out;
}

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const str = (v: unknown): string => (typeof v === 'string' ? v : typeof v === 'number' ? String(v) : '');

/**
 * Reads a saved workbench document back (from storage or a file). Never throws: a document that
 * cannot be read gives null and a reason; fields with unknown values fall back to defaults.
 * `makeId` supplies row ids for rows saved without one.
 */
export function readWorkbenchDocument(raw: unknown, makeId: () => string): { doc: WorkbenchDocument | null; problem: string | null } {
  if (!isObj(raw)) return { doc: null, problem: 'the saved entry is not a workspace object' };
  if (raw.format !== WORKBENCH_FORMAT) return { doc: null, problem: `the saved entry's format is ${JSON.stringify(raw.format)}, not "${WORKBENCH_FORMAT}"` };
  if (raw.version !== WORKBENCH_VERSION) return { doc: null, problem: `the saved entry is version ${JSON.stringify(raw.version)}; this build reads version ${WORKBENCH_VERSION}` };
  if (!Array.isArray(raw.quotes)) return { doc: null, problem: 'the saved entry has no quote list' };
  const curve = isObj(raw.curve) ? raw.curve : {};
  const display = isObj(raw.display) ? raw.display : {};
  const seen = new Set<string>();
  const quotes: QuoteRow[] = raw.quotes.filter(isObj).map((q) => {
    let id = typeof q.id === 'string' && q.id !== '' && !seen.has(q.id) ? q.id : makeId();
    seen.add(id);
    const row = { id, enabled: q.enabled !== false } as Record<string, unknown>;
    for (const c of QUOTE_COLUMNS) row[c] = str(q[c]);
    return row as unknown as QuoteRow;
  });
  const pick = <T>(v: unknown, ok: (x: unknown) => x is T, fallback: T): T => (ok(v) ? v : fallback);
  const isTenor = (x: unknown): x is DisplaySettings['forwardTenor'] => typeof x === 'string' && (['1M', '3M', '6M', '1Y'] as readonly string[]).includes(x);
  const isAxis = (x: unknown): x is MaturityAxis => x === 'linear' || x === 'sqrt';
  const isFreq = (x: unknown): x is number => typeof x === 'number' && (FREQUENCIES as readonly number[]).includes(x);
  const isBool = (x: unknown): x is boolean => typeof x === 'boolean';
  const doc: Record<string, unknown> = {
    format: WORKBENCH_FORMAT,
    version: WORKBENCH_VERSION,
    settlement: str(raw.settlement),
    curve: {
      dayCount: pick(curve.dayCount, isCurveDayCount, 'ACT/365F'),
      interpolation: pick(curve.interpolation, isInterpolation, 'monotone-convex'),
      extrapolation: pick(curve.extrapolation, isExtrapolation, 'none'),
    },
    quoteUnit: pick(raw.quoteUnit, isQuoteUnitMode, 'percent'),
    quotes,
    display: {
      compounding: pick(display.compounding, isCompounding, DEFAULT_DISPLAY.compounding),
      dayCount: pick(display.dayCount, isCurveDayCount, DEFAULT_DISPLAY.dayCount),
      forwardTenor: pick(display.forwardTenor, isTenor, DEFAULT_DISPLAY.forwardTenor),
      axis: pick(display.axis, isAxis, DEFAULT_DISPLAY.axis),
      parFrequency: pick(display.parFrequency, isFreq, DEFAULT_DISPLAY.parFrequency),
      showPar: pick(display.showPar, isBool, DEFAULT_DISPLAY.showPar),
      showInstantaneous: pick(display.showInstantaneous, isBool, DEFAULT_DISPLAY.showInstantaneous),
      showMethodOverlay: pick(display.showMethodOverlay, isBool, DEFAULT_DISPLAY.showMethodOverlay),
      dateOrder: pick(display.dateOrder, isDateOrder, DEFAULT_DISPLAY.dateOrder),
      decimalMark: pick(display.decimalMark, isDecimalMark, DEFAULT_DISPLAY.decimalMark),
    },
  };
  for (const key of RESERVED_KEYS) if (raw[key] !== undefined) doc[key] = raw[key];
  return { doc: doc as unknown as WorkbenchDocument, problem: null };
}

export { COMPOUNDINGS, CURVE_DAY_COUNTS, INTERPOLATIONS, EXTRAPOLATIONS };
