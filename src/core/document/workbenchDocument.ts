import { COMPOUNDINGS, isCompounding, type Compounding } from '../rates/compounding.ts';
import { CURVE_DAY_COUNTS, isCurveDayCount, type CurveDayCount } from '../time/dayCount.ts';
import { INTERPOLATIONS, isInterpolation, type InterpolationId } from '../interpolation/types.ts';
import { EXTRAPOLATIONS, isExtrapolation, type Extrapolation } from '../curve/curve.ts';
import { FREQUENCIES, RESERVED_KEYS, WORKSPACE_FORMAT, WORKSPACE_VERSION } from './validate.ts';
import type { CoreError, CoreWarning } from '../result.ts';
import { isQuoteUnitMode, QUOTE_UNIT_MODES, type QuoteUnitMode } from '../input/quoteText.ts';
import { DECIMAL_MARKS, DEFAULT_CONVENTIONS, isDecimalMark, type DecimalMark, type InputConventions } from '../input/conventions.ts';
import { DATE_ORDERS, isDateOrder, type DateOrder } from '../input/dateText.ts';
import { parseRow, QUOTE_COLUMNS, type QuoteColumn, type QuoteRow, type RowIssues, type RowParse } from '../input/quoteRow.ts';
import { isPlainObject } from './plainObject.ts';
import { CONVENTION_SETS, conventionSet } from '../kinds/conventionSets.ts';
import type { MeetingSteps, QuoteKind, Turn } from './types.ts';
import type { CalendarEdits, CustomCalendar } from '../time/calendars.ts';

/**
 * The workbench's market conventions (`curve.conventions`): none, or a convention set that fills
 * deposits and overnight-index swaps (the sheet's rows of those kinds take it).
 */
export const MARKET_CONVENTIONS: readonly string[] = ['none', ...CONVENTION_SETS.filter((s) => s.fields.deposit !== undefined || s.fields.ois !== undefined).map((s) => s.id)];
export const isMarketConventions = (x: unknown): x is string => typeof x === 'string' && MARKET_CONVENTIONS.includes(x);

export const WORKBENCH_FORMAT = 'tenorscope-workbench';
export const WORKBENCH_VERSION = 1;

/** Forward tenors the charts and tables offer: one day to ten years. */
export const FORWARD_TENORS = ['1D', '1W', '2W', '1M', '2M', '3M', '6M', '9M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y'] as const;
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
  /**
   * `conventions` (absent: none): a convention set (kinds/conventionSets.ts) every row of a kind
   * it fills takes (deposits, overnight-index swaps, FRAs), as the engine document's per-quote `conventions`.
   */
  readonly curve: {
    readonly dayCount: CurveDayCount;
    readonly interpolation: InterpolationId;
    readonly extrapolation: Extrapolation;
    readonly conventions?: string;
    /** A calendar of the workspace's own (customCalendars) joined to the market conventions' calendar for the rows the set fills (deposits, OIS, FRAs; absent: none). */
    readonly joinCalendar?: string;
    /** The model that fills the futures' convexity adjustments (the engine's `curve.futuresConvexity`, as is; absent: none). */
    readonly futuresConvexity?: Readonly<Record<string, unknown>>;
  };
  readonly quoteUnit: QuoteUnitMode;
  readonly quotes: readonly QuoteRow[];
  readonly display: DisplaySettings;
  /**
   * The workspace's edits of built-in calendars, by id: dates closed besides the calendar's own
   * (`add`) and its holidays opened (`remove`); absent when none. The engine document's version 2
   * `calendars` section, as is.
   */
  readonly calendars?: Readonly<Record<string, CalendarEdits>>;
  /** Calendars of the workspace's own, from lists of dates (the engine document's `customCalendars`, as is). */
  readonly customCalendars?: Readonly<Record<string, CustomCalendar>>;
  /** Overnight rates (decimals) by past business day, for futures in their reference period (the engine document's `fixings`, as is). */
  readonly fixings?: Readonly<Record<string, number>>;
  /**
   * Turns on the overnight curve (the engine document's `turns`, but a turn solved from a quote
   * names its sheet row by id, `solveFromRow`, so adding or removing rows above it keeps it on its
   * quote; absent: none). See WorkbenchTurn.
   */
  readonly turns?: readonly WorkbenchTurn[];
  /** Policy effective dates and whether the curve steps on them (the engine document's `meetingSteps`, as is). */
  readonly meetingSteps?: MeetingSteps;
  /**
   * Named curves besides the default one (the engine document's `curves`, as given: each entry's
   * name, role, index, discountCurve, curve settings and quotes as numbers; absent: one curve).
   * The workbench keeps them unchanged through save, link and file; the named-curve reader checks
   * and builds them when they are shown (features/namedCurves).
   */
  readonly curves?: readonly unknown[];
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
  /** Settings of the workbench document that take no effect in the engine document, each said as a warning (a joined calendar without market conventions). */
  readonly notes: readonly CoreWarning[];
}

/**
 * A turn in the workbench document: the engine's Turn, but solved from a sheet row named by its id
 * (`solveFromRow`) rather than from a quote position. A turn solved from a row may keep the spread
 * the user gave before (`spreadBp`), so switching back to a given spread loses nothing; the
 * engine document then gets `solveFrom` alone.
 */
export interface WorkbenchTurn extends Omit<Turn, 'solveFrom'> {
  readonly solveFromRow?: string;
}

/**
 * The engine's turns of a workbench document: `solveFromRow` becomes `solveFrom`, the position of
 * that row's quote among the engine document's quotes (`rowOfQuote[i]` is quote i's row), or null
 * when the row gives no quote (empty, a wrong cell, or removed), which the engine refuses naming
 * the turn; a turn set by the user is passed as is.
 */
export function engineTurns(turns: readonly WorkbenchTurn[], rowIds: readonly string[], rowOfQuote: readonly number[]): readonly (Turn | Record<string, unknown>)[] {
  return turns.map((t) => {
    if (t.solveFromRow === undefined) return t;
    const { solveFromRow, spreadBp: _given, ...rest } = t;
    const q = rowOfQuote.indexOf(rowIds.indexOf(solveFromRow));
    return { ...rest, solveFrom: q < 0 ? null : q };
  });
}

/**
 * Converts the workbench document into the engine's `tenorscope-workspace` document. `parse` may be
 * a caching wrapper of `parseRow` (the UI keeps one so a one-cell edit re-parses one row).
 */
export function toEngineDocument(
  doc: Pick<WorkbenchDocument, 'settlement' | 'curve' | 'quoteUnit' | 'quotes' | 'calendars' | 'customCalendars' | 'fixings' | 'turns' | 'meetingSteps'> & { readonly curves?: readonly unknown[] | undefined } & { readonly display?: Partial<DisplaySettings> } & Partial<Record<(typeof RESERVED_KEYS)[number], unknown>>,
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
  const { conventions: market, joinCalendar, ...curve } = doc.curve;
  const notes: CoreWarning[] = [];
  if (market !== undefined && market !== 'none') {
    // The workspace's market conventions go on each quote of a kind the set fills (deposits,
    // overnight swaps, FRAs) that names no set in its own Conventions cell; a calendar of the
    // workspace's own joined to the set's is the calendar of each quote taking the set, unless the
    // quote gives its own.
    const set = conventionSet(market);
    for (let i = 0; i < quotes.length; i++) {
      const q = quotes[i]!;
      const kind = q.kind as QuoteKind;
      const fields = set?.fields[kind];
      if (fields === undefined || (q.conventions !== undefined && q.conventions !== market)) continue;
      const joined = joinCalendar && typeof fields.calendar === 'string' && q.calendar === undefined ? { calendar: `${fields.calendar}+${joinCalendar}` } : {};
      quotes[i] = { ...q, conventions: market, ...joined };
    }
  } else if (joinCalendar !== undefined) {
    // Without market conventions no row takes a set's calendar, so there is nothing to join the
    // workspace's calendar to: said, so the setting is never silently without effect.
    notes.push({
      path: 'curve.joinCalendar',
      quote: null,
      code: 'not-applied',
      message: `the calendar "${joinCalendar}" is set to close the deposit and OIS rows' calendar, but no market conventions are chosen, so those rows have no calendar to join it to and it changes nothing; choose Market conventions in the curve settings, or clear the joined calendar in the Holidays section`,
    });
  }
  const engine: Record<string, unknown> = {
    format: WORKSPACE_FORMAT,
    version: WORKSPACE_VERSION,
    valuationDate: doc.settlement,
    ...(doc.calendars !== undefined && Object.keys(doc.calendars).length > 0 ? { calendars: doc.calendars } : {}),
    ...(doc.customCalendars !== undefined && Object.keys(doc.customCalendars).length > 0 ? { customCalendars: doc.customCalendars } : {}),
    ...(doc.fixings !== undefined && Object.keys(doc.fixings).length > 0 ? { fixings: doc.fixings } : {}),
    ...(doc.turns !== undefined && doc.turns.length > 0 ? { turns: engineTurns(doc.turns, doc.quotes.map((r) => r.id), rowOfQuote) } : {}),
    ...(doc.meetingSteps !== undefined ? { meetingSteps: doc.meetingSteps } : {}),
    curve,
    quotes,
    ...(doc.curves !== undefined ? { curves: doc.curves } : {}),
  };
  for (const key of RESERVED_KEYS) if (doc[key] !== undefined) engine[key] = doc[key];
  return { doc: engine, rowOfQuote, rows, invalidRows, blankRows, notes };
}

const FIELD_COLUMN: Readonly<Record<string, QuoteColumn>> = {
  rate: 'rate', discountYield: 'rate', yield: 'rate',
  price: 'price', cleanPrice: 'price',
  coupon: 'coupon', frequency: 'frequency', dayCount: 'dayCount',
  tenor: 'maturity', maturity: 'maturity', kind: 'kind',
  // An FRA's Maturity cell holds its period; its index must agree with it.
  period: 'maturity', index: 'maturity',
  conventions: 'terms', calendar: 'terms', spotLag: 'terms', businessDay: 'terms', paymentLag: 'terms', eom: 'terms', floatDayCount: 'terms', convexity: 'terms',
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

const str = (v: unknown): string => (typeof v === 'string' ? v : typeof v === 'number' ? String(v) : '');
const shown = (v: unknown): string => (typeof v === 'string' ? `"${v.slice(0, 40)}"` : v === null ? 'null' : Array.isArray(v) ? 'a list' : typeof v === 'object' ? 'an object' : String(v).slice(0, 40));

/** A setting whose value (or name) this build does not know. */
export interface UnknownSetting {
  /** Where it is, such as `curve.interpolation` or `display.smoothing` (an unknown name). */
  readonly path: string;
  /** The value as found, shown as text (`"cubic-tension"`). */
  readonly value: string;
  /** What this build supports there: the values, or for an unknown name the names it knows. */
  readonly supported: readonly string[];
  /** What this build would use instead (the default), or null: an unknown name is left out. */
  readonly fallback: string | number | boolean | null;
  /** True when the name itself is unknown (the value is then left out of a copy). */
  readonly unknownName: boolean;
}

const FORWARD_TENOR_TEXT: readonly string[] = FORWARD_TENORS;
const SETTINGS: Readonly<Record<'curve' | 'display', Readonly<Record<string, { values: readonly (string | number | boolean)[]; fallback: string | number | boolean }>>>> = {
  curve: {
    dayCount: { values: CURVE_DAY_COUNTS, fallback: 'ACT/365F' },
    interpolation: { values: INTERPOLATIONS, fallback: 'monotone-convex' },
    extrapolation: { values: EXTRAPOLATIONS, fallback: 'none' },
    conventions: { values: MARKET_CONVENTIONS, fallback: 'none' },
  },
  display: {
    compounding: { values: COMPOUNDINGS, fallback: DEFAULT_DISPLAY.compounding },
    dayCount: { values: CURVE_DAY_COUNTS, fallback: DEFAULT_DISPLAY.dayCount },
    forwardTenor: { values: FORWARD_TENOR_TEXT, fallback: DEFAULT_DISPLAY.forwardTenor },
    axis: { values: MATURITY_AXES, fallback: DEFAULT_DISPLAY.axis },
    parFrequency: { values: FREQUENCIES, fallback: DEFAULT_DISPLAY.parFrequency },
    showPar: { values: [true, false], fallback: DEFAULT_DISPLAY.showPar },
    showInstantaneous: { values: [true, false], fallback: DEFAULT_DISPLAY.showInstantaneous },
    showMethodOverlay: { values: [true, false], fallback: DEFAULT_DISPLAY.showMethodOverlay },
    dateOrder: { values: DATE_ORDERS, fallback: DEFAULT_DISPLAY.dateOrder },
    decimalMark: { values: DECIMAL_MARKS, fallback: DEFAULT_DISPLAY.decimalMark },
  },
};

/**
 * The settings of a workbench document this build does not know: a value outside its list (an
 * interpolation, day count, compounding... from another build) or a setting name it does not
 * have. A missing setting is not unknown: it takes its documented default. Such a document is
 * opened read-only, never with a substitute written back (see the store's read-only state).
 */
export function unknownSettings(raw: unknown): UnknownSetting[] {
  if (!isPlainObject(raw)) return [];
  const out: UnknownSetting[] = [];
  if (raw.quoteUnit !== undefined && !isQuoteUnitMode(raw.quoteUnit)) {
    out.push({ path: 'quoteUnit', value: shown(raw.quoteUnit), supported: QUOTE_UNIT_MODES, fallback: 'percent', unknownName: false });
  }
  for (const group of ['curve', 'display'] as const) {
    const v = raw[group];
    if (!isPlainObject(v)) continue;
    const known = SETTINGS[group];
    for (const [k, x] of Object.entries(v)) {
      const spec = known[k];
      const path = `${group}.${k.slice(0, 40)}`;
      if (group === 'curve' && k === 'joinCalendar' && typeof x === 'string') continue; // a name of the document's own calendars, checked when it builds
      if (group === 'curve' && k === 'futuresConvexity' && isPlainObject(x)) continue; // the engine checks its fields when it builds, naming each
      if (!spec) out.push({ path, value: shown(x), supported: Object.keys(known), fallback: null, unknownName: true });
      else if (!spec.values.includes(x as never)) out.push({ path, value: shown(x), supported: spec.values.map(String), fallback: spec.fallback, unknownName: false });
    }
  }
  return out;
}

/**
 * The document with each unknown setting replaced by the given choice (by path; a missing choice
 * takes the setting's fallback) and each unknown name left out: the editable copy the user asks
 * for, every replacement shown to them first. The original is not changed.
 */
export function replaceUnknownSettings(raw: Record<string, unknown>, choices: Readonly<Record<string, string | number | boolean>> = {}): Record<string, unknown> {
  const out: Record<string, unknown> = { ...raw };
  for (const u of unknownSettings(raw)) {
    const choice = choices[u.path] ?? u.fallback;
    if (u.path === 'quoteUnit') {
      out.quoteUnit = choice;
      continue;
    }
    const [group, key] = u.path.split('.') as ['curve' | 'display', string];
    const next = { ...(out[group] as Record<string, unknown>) };
    if (u.unknownName || choice === null) delete next[key];
    else next[key] = choice;
    out[group] = next;
  }
  return out;
}

export interface ReadWorkbenchOptions {
  /** Keep unknown setting values as they are (a read-only opening) instead of the defaults. */
  readonly keepUnknown?: boolean;
}

export interface ReadWorkbench {
  readonly doc: WorkbenchDocument | null;
  readonly problem: string | null;
  /**
   * What was not read as it stood, each with where it was: quote list entries that are not rows
   * (left out), cells that are not text (read as empty), `enabled` flags that are not true or
   * false (read as on). Empty when everything was read as given.
   */
  readonly changes: readonly string[];
}

/** "1, 4 and 7" (row numbers as the user counts them), at most `max` listed. */
const listNumbers = (xs: readonly number[], max = 10): string => {
  const shownXs = xs.slice(0, max).map((x) => String(x + 1));
  const more = xs.length > max ? ` and ${xs.length - max} more` : '';
  if (shownXs.length === 1) return shownXs[0]! + more;
  return more ? shownXs.join(', ') + more : `${shownXs.slice(0, -1).join(', ')} and ${shownXs[shownXs.length - 1]}`;
};

/**
 * Reads a saved workbench document back (from storage or a file). Never throws: a document that
 * cannot be read gives null and a reason. Fields with unknown values fall back to defaults unless
 * `keepUnknown` (callers check `unknownSettings` first and open such a document read-only).
 * Whatever was not read as it stood is listed in `changes`, so the caller can say so.
 * `makeId` supplies row ids for rows saved without one.
 */
export function readWorkbenchDocument(raw: unknown, makeId: () => string, options: ReadWorkbenchOptions = {}): ReadWorkbench {
  if (!isPlainObject(raw)) return { doc: null, problem: 'the saved entry is not a workspace object', changes: [] };
  if (raw.format !== WORKBENCH_FORMAT) return { doc: null, problem: `the saved entry's format is ${JSON.stringify(raw.format)}, not "${WORKBENCH_FORMAT}"`, changes: [] };
  if (raw.version !== WORKBENCH_VERSION) return { doc: null, problem: `the saved entry is version ${JSON.stringify(raw.version)}; this build reads version ${WORKBENCH_VERSION}`, changes: [] };
  if (!Array.isArray(raw.quotes)) return { doc: null, problem: 'the saved entry has no quote list', changes: [] };
  const curve = isPlainObject(raw.curve) ? raw.curve : {};
  const display = isPlainObject(raw.display) ? raw.display : {};
  const seen = new Set<string>();
  const notRows: number[] = [];
  const badCells: string[] = [];
  const badFlags: number[] = [];
  const quotes: QuoteRow[] = [];
  /** The id given to each saved entry that is a row, by its position in the saved list. */
  const idAt: string[] = [];
  raw.quotes.forEach((q, i) => {
    if (!isPlainObject(q)) {
      notRows.push(i);
      return;
    }
    const id = typeof q.id === 'string' && q.id !== '' && !seen.has(q.id) ? q.id : makeId();
    idAt[i] = id;
    seen.add(id);
    if (q.enabled !== undefined && typeof q.enabled !== 'boolean') badFlags.push(i);
    const row = { id, enabled: q.enabled !== false } as Record<string, unknown>;
    for (const c of QUOTE_COLUMNS) {
      const v = q[c];
      if (v !== undefined && typeof v !== 'string' && typeof v !== 'number') badCells.push(`quotes[${i}].${c} (${shown(v)})`);
      row[c] = str(v);
    }
    quotes.push(row as unknown as QuoteRow);
  });
  const changes: string[] = [];
  if (notRows.length > 0) {
    changes.push(
      `${notRows.length} ${notRows.length === 1 ? 'entry' : 'entries'} of the saved quote list ${notRows.length === 1 ? 'is' : 'are'} not a row and ${notRows.length === 1 ? 'was' : 'were'} left out (entry ${listNumbers(notRows)} of ${raw.quotes.length})`,
    );
  }
  if (badCells.length > 0) changes.push(`${badCells.length} ${badCells.length === 1 ? 'cell is' : 'cells are'} not text and ${badCells.length === 1 ? 'was' : 'were'} read as empty: ${badCells.slice(0, 5).join(', ')}${badCells.length > 5 ? ` and ${badCells.length - 5} more` : ''}`);
  if (badFlags.length > 0) changes.push(`the on/off flag of saved row ${listNumbers(badFlags)} is not true or false and was read as on`);
  const keep = options.keepUnknown === true;
  const pick = <T>(v: unknown, ok: (x: unknown) => x is T, fallback: T): T => (ok(v) ? v : keep && v !== undefined ? (v as T) : fallback);
  const isTenor = (x: unknown): x is DisplaySettings['forwardTenor'] => typeof x === 'string' && FORWARD_TENOR_TEXT.includes(x);
  const isAxis = (x: unknown): x is MaturityAxis => x === 'linear' || x === 'sqrt';
  const isFreq = (x: unknown): x is number => typeof x === 'number' && (FREQUENCIES as readonly number[]).includes(x);
  const isBool = (x: unknown): x is boolean => typeof x === 'boolean';
  const extra = (group: Record<string, unknown>, known: Readonly<Record<string, unknown>>): Record<string, unknown> =>
    keep ? Object.fromEntries(Object.entries(group).filter(([k]) => !(k in known))) : {};
  const doc: Record<string, unknown> = {
    format: WORKBENCH_FORMAT,
    version: WORKBENCH_VERSION,
    settlement: str(raw.settlement),
    curve: {
      ...extra(curve, SETTINGS.curve),
      dayCount: pick(curve.dayCount, isCurveDayCount, 'ACT/365F'),
      interpolation: pick(curve.interpolation, isInterpolation, 'monotone-convex'),
      extrapolation: pick(curve.extrapolation, isExtrapolation, 'none'),
      // Absent stays absent (a document saved before the setting existed reads as it was written).
      ...(curve.conventions === undefined ? {} : { conventions: pick(curve.conventions, isMarketConventions, 'none') }),
      // A name of the document's own calendars (the engine names an unknown one when it builds).
      ...(typeof curve.joinCalendar === 'string' ? { joinCalendar: curve.joinCalendar } : {}),
      ...(isPlainObject(curve.futuresConvexity) ? { futuresConvexity: curve.futuresConvexity } : {}),
    },
    quoteUnit: pick(raw.quoteUnit, isQuoteUnitMode, 'percent'),
    quotes,
    display: {
      ...extra(display, SETTINGS.display),
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
  // Calendar edits are kept as saved (the engine checks them and says what is wrong, naming the date).
  if (isPlainObject(raw.calendars)) doc.calendars = raw.calendars;
  if (isPlainObject(raw.customCalendars)) doc.customCalendars = raw.customCalendars;
  if (isPlainObject(raw.fixings)) doc.fixings = raw.fixings;
  // Turns and meeting steps likewise: the engine reads them and names what is wrong.
  // A turn written with the engine's `solveFrom` (a position in `quotes`, here the saved rows) is
  // read as that row (`solveFromRow`); one naming no row is left as it is, which the file and link
  // check refuses (workbenchShape.ts) and the engine names.
  if (Array.isArray(raw.turns))
    doc.turns = raw.turns.map((t) => {
      if (!isPlainObject(t) || t.solveFromRow !== undefined || typeof t.solveFrom !== 'number' || idAt[t.solveFrom] === undefined) return t;
      const { solveFrom, ...rest } = t;
      return { ...rest, solveFromRow: idAt[solveFrom] };
    });
  if (isPlainObject(raw.meetingSteps)) doc.meetingSteps = raw.meetingSteps;
  // Named curves as saved (the named-curve reader checks them when they are shown, naming what is wrong).
  if (Array.isArray(raw.curves)) doc.curves = raw.curves;
  else if (raw.curves !== undefined) changes.push(`the saved named curves (curves) are ${shown(raw.curves)}, not a list of curves, and were left out`);
  for (const key of RESERVED_KEYS) if (raw[key] !== undefined) doc[key] = raw[key];
  return { doc: doc as unknown as WorkbenchDocument, problem: null, changes };
}

export { COMPOUNDINGS, CURVE_DAY_COUNTS, INTERPOLATIONS, EXTRAPOLATIONS };
