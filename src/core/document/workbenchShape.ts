import { QUOTE_COLUMNS } from '../input/quoteRow.ts';
import { readWorkbenchDocument, toEngineDocument, WORKBENCH_FORMAT, type WorkbenchDocument } from './workbenchDocument.ts';
import { coreError, type CoreError } from '../result.ts';
import { RESERVED_KEYS } from './validate.ts';
import { LIMITS } from './limits.ts';
import { isPlainObject } from './plainObject.ts';
import { MAX_EFFECTIVE_DATES, MAX_TURNS } from './overnightSections.ts';

const TOP = ['format', 'version', 'settlement', 'curve', 'quoteUnit', 'quotes', 'display', 'calendars', 'customCalendars', 'fixings', 'turns', 'meetingSteps', 'curves', ...RESERVED_KEYS];
const ROW_KEYS = ['id', 'enabled', ...QUOTE_COLUMNS];
/** Characters of one typed cell or row id (LIMITS.cell). */
export const CELL_MAX = LIMITS.cell;

const shortText = (v: unknown, max: number = CELL_MAX): boolean => typeof v === 'string' && v.length <= max;
const flatValue = (x: unknown): boolean => shortText(x, LIMITS.setting) || typeof x === 'boolean' || (typeof x === 'number' && Number.isFinite(x));
const flatSettings = (v: unknown): boolean => isPlainObject(v) && Object.keys(v).length <= 20 && Object.values(v).every(flatValue);
/** The curve's settings: flat, but for `futuresConvexity`, itself a flat object of at most 5 settings. */
const curveSettings = (v: unknown): boolean =>
  isPlainObject(v) && Object.keys(v).length <= 20 && Object.entries(v).every(([k, x]) => (k === 'futuresConvexity' ? isPlainObject(x) && Object.keys(x).length <= 5 && Object.values(x).every(flatValue) : flatValue(x)));

/** The shape of `fixings`: at most LIMITS.fixings entries of a date-length key and a finite number (the engine checks dates and rates). */
const fixingsShape = (v: unknown): boolean =>
  isPlainObject(v) && Object.keys(v).length <= LIMITS.fixings && Object.entries(v).every(([d, r]) => d.length <= 10 && typeof r === 'number' && Number.isFinite(r));

/** The shape of `calendars`: at most 10 calendars, each with `add` and `remove` lists of short text (the engine checks the dates). */
const calendarEditsShape = (v: unknown): boolean =>
  isPlainObject(v) &&
  Object.keys(v).length <= 10 &&
  Object.values(v).every(
    (e) => isPlainObject(e) && Object.keys(e).every((k) => k === 'add' || k === 'remove') && Object.values(e).every((list) => Array.isArray(list) && list.length <= LIMITS.calendarDates && list.every((d) => shortText(d, 10))),
  );

/** The shape of `customCalendars`: at most 10 calendars of short names, each a `holidays` list of short text (the engine checks names and dates). */
const customCalendarsShape = (v: unknown): boolean =>
  isPlainObject(v) &&
  Object.keys(v).length <= 10 &&
  Object.entries(v).every(([name, c]) => name.length <= LIMITS.id && isPlainObject(c) && Object.keys(c).every((k) => k === 'holidays') && Array.isArray(c.holidays) && c.holidays.length <= LIMITS.calendarDates && c.holidays.every((d) => shortText(d, 10)));

/** The shape of `turns`: at most MAX_TURNS flat objects of short settings (the engine checks names, dates and spreads). */
const turnsShape = (v: unknown): boolean => Array.isArray(v) && v.length <= MAX_TURNS && v.every((t) => flatSettings(isPlainObject(t) && t.solveFrom === null ? { ...t, solveFrom: 0 } : t)); // a null solveFrom is refused below, naming the turn
/** The shape of `meetingSteps`: `on` and a list of at most MAX_EFFECTIVE_DATES short texts (the engine checks the dates). */
const meetingStepsShape = (v: unknown): boolean =>
  isPlainObject(v) && Object.keys(v).every((k) => k === 'on' || k === 'effectiveDates') && (v.effectiveDates === undefined || (Array.isArray(v.effectiveDates) && v.effectiveDates.length <= MAX_EFFECTIVE_DATES && v.effectiveDates.every((d) => shortText(d, 10))));

/** A named curve's quote in the engine's form: flat settings, but for a future's own `fixings` (dated rates, as the top-level list). */
const engineQuoteShape = (v: unknown): boolean =>
  isPlainObject(v) && Object.keys(v).length <= 20 && Object.entries(v).every(([k, x]) => (k === 'fixings' ? fixingsShape(x) : flatValue(x)));

/**
 * The shape of `curves` (named curves, the engine's form): at most LIMITS.namedCurves objects,
 * each with at most LIMITS.quotes quotes, every quote flat but for its own fixings (the named-curve
 * reader checks names, roles, references and quotes when the curves are shown). What the engine's
 * reader takes, a file saved from it opens again.
 */
const namedCurvesShape = (v: unknown): boolean =>
  Array.isArray(v) &&
  v.length <= LIMITS.namedCurves &&
  v.every((c) => isPlainObject(c) && Object.keys(c).length <= 10 && (c.curve === undefined || curveSettings(c.curve)) && Array.isArray(c.quotes) && c.quotes.length <= LIMITS.quotes && c.quotes.every(engineQuoteShape) && Object.entries(c).every(([k, x]) => k === 'curve' || k === 'quotes' || flatValue(x)));

/**
 * Checks the shape of a workbench document (`tenorscope-workbench`: quote cells as typed text)
 * read from untrusted input, strictly: known keys only, at most LIMITS.quotes rows, every cell
 * text of at most CELL_MAX characters, settings flat and short. The cells' meaning is the
 * workbench's business: a typed cell may be wrong and is shown as such, not refused here.
 * Returns the engine document it converts to (for scenarios), or errors.
 */
export function checkWorkbenchShape(raw: Record<string, unknown>): { errors: CoreError[]; engineDoc: Record<string, unknown> | null } {
  const errors: CoreError[] = [];
  for (const k of Object.keys(raw)) if (!TOP.includes(k)) errors.push(coreError('schema', k.slice(0, 40), `unknown field "${k.slice(0, 40)}"; a workbench document has ${TOP.join(', ')}`));
  if (raw.format !== WORKBENCH_FORMAT) errors.push(coreError('schema', 'format', `format must be "${WORKBENCH_FORMAT}"`));
  if (!shortText(raw.settlement, LIMITS.setting)) errors.push(coreError('schema', 'settlement', 'settlement must be text (a date YYYY-MM-DD)'));
  if (!curveSettings(raw.curve)) errors.push(coreError('schema', 'curve', 'curve must be an object of short settings'));
  if (!flatSettings(raw.display)) errors.push(coreError('schema', 'display', 'display must be an object of short settings'));
  if (raw.calendars !== undefined && !calendarEditsShape(raw.calendars)) errors.push(coreError('schema', 'calendars', `calendars must be an object of edits by calendar id, each {"add": [dates], "remove": [dates]}, at most ${LIMITS.calendarDates} dates in a list`));
  if (raw.customCalendars !== undefined && !customCalendarsShape(raw.customCalendars)) errors.push(coreError('schema', 'customCalendars', `customCalendars must be an object of calendars by name (at most ${LIMITS.id} characters), each {"holidays": [dates]}, at most ${LIMITS.calendarDates} dates in a list`));
  if (raw.fixings !== undefined && !fixingsShape(raw.fixings)) errors.push(coreError('schema', 'fixings', `fixings must be an object of dates to overnight rates (decimals), at most ${LIMITS.fixings} of them`));
  if (raw.turns !== undefined && !turnsShape(raw.turns)) errors.push(coreError('schema', 'turns', `turns must be a list of at most ${MAX_TURNS} turns, each {"name", "from", "to", "spreadBp"}`));
  // The engine's `solveFrom` in a workbench file: the position of a row in `quotes` (readWorkbenchDocument reads it as that row), never beside `solveFromRow`.
  if (Array.isArray(raw.turns) && errors.length === 0)
    raw.turns.forEach((t: Record<string, unknown>, i) => {
      const q = t.solveFrom;
      if (q === undefined) return;
      const rows = Array.isArray(raw.quotes) ? raw.quotes : [];
      const why = t.solveFromRow !== undefined ? 'gives both solveFrom and solveFromRow' : !Number.isInteger(q) || !isPlainObject(rows[q as number]) ? `solveFrom ${q} is no row of quotes (${rows.length} rows, from 0)` : null;
      if (why) errors.push(coreError('schema', `turns[${i}].solveFrom`, `turns[${i}] (${String(t.name).slice(0, 40)}) ${why}: write solveFromRow, the id of the row whose quote sets the spread, or spreadBp`));
    });
  if (raw.meetingSteps !== undefined && !meetingStepsShape(raw.meetingSteps)) errors.push(coreError('schema', 'meetingSteps', `meetingSteps must be {"on": true or false, "effectiveDates": [dates]}, at most ${MAX_EFFECTIVE_DATES} dates`));
  if (raw.curves !== undefined && !namedCurvesShape(raw.curves)) errors.push(coreError('schema', 'curves', `curves must be a list of at most ${LIMITS.namedCurves} named curves, each {"name", "role", "index", "discountCurve", "curve": {settings}, "quotes": [at most ${LIMITS.quotes} quotes of short settings]}`));
  if (!shortText(raw.quoteUnit, 20)) errors.push(coreError('schema', 'quoteUnit', 'quoteUnit must be text such as "percent"'));
  if (!Array.isArray(raw.quotes)) errors.push(coreError('schema', 'quotes', 'quotes must be a list of rows'));
  else if (raw.quotes.length > LIMITS.quotes) errors.push(coreError('range', 'quotes', `${raw.quotes.length} quotes is more than the ${LIMITS.quotes} a workspace may hold`));
  else {
    raw.quotes.forEach((row, i) => {
      const path = `quotes[${i}]`;
      if (!isPlainObject(row)) {
        errors.push(coreError('schema', path, `${path}: must be a row object`, i));
        return;
      }
      for (const k of Object.keys(row)) if (!ROW_KEYS.includes(k)) errors.push(coreError('schema', `${path}.${k.slice(0, 40)}`, `${path}: unknown cell "${k.slice(0, 40)}"; a row has ${ROW_KEYS.join(', ')}`, i));
      if (!shortText(row.id) || typeof row.enabled !== 'boolean') errors.push(coreError('schema', path, `${path}: needs a text id and enabled true or false`, i));
      // The Conventions cell (`terms`) came later: a row saved before it has none.
      for (const c of QUOTE_COLUMNS) if (!shortText(row[c]) && !(c === 'terms' && row[c] === undefined)) errors.push(coreError('schema', `${path}.${c}`, `${path}.${c}: must be text of at most ${CELL_MAX} characters`, i));
    });
  }
  if (errors.length > 0) return { errors, engineDoc: null };
  let n = 0;
  const read = readWorkbenchDocument(raw, () => `link-row-${n++}`);
  if (!read.doc) return { errors: [coreError('schema', '', read.problem ?? 'not a workbench document')], engineDoc: null };
  return { errors, engineDoc: toEngineDocument(read.doc as WorkbenchDocument).doc };
}
