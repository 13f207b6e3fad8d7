import { isExtrapolation, EXTRAPOLATIONS } from '../curve/curve.ts';
import { FIT_MODELS, isFitModel } from '../fit/parametricForm.ts';
import { INTERPOLATIONS, isInterpolation } from '../interpolation/types.ts';
import { coreError, type CoreError } from '../result.ts';
import { compareIso, isoFromCivil, parseIsoDate, type CivilDate, type IsoDate } from '../time/date.ts';
import { CURVE_DAY_COUNTS, isCurveDayCount } from '../time/dayCount.ts';
import { marketDateCivil } from '../time/dateConventions.ts';
import { formatTenor, parseTenor } from '../time/tenor.ts';
import { MONEY_MARKET_TERMS, moneyMarketTerm } from '../time/depositDates.ts';
import { listOf, RATE_MAX, RATE_MIN, typeName } from '../kinds/fields.ts';
import type { DocumentContext } from '../kinds/types.ts';
import { KIND_ALLOWED_FIELDS, KIND_MODULE_LIST, QUOTE_KIND_MODULES } from '../kinds/registry.ts';
import { withConventionSet } from '../kinds/conventionSets.ts';
import { DEFAULT_CURVE, QUOTE_KINDS, type CurveSettings, type Quote, type Workspace } from './types.ts';
import { isPlainObject } from './plainObject.ts';
import { LIMITS } from './limits.ts';
import type { ReadWorkspace, WorkspaceCurve } from './namedCurves.ts';
import { isEmptyCalendarContext, readCalendarSections } from './calendarSection.ts';
import type { CalendarContext } from '../time/calendars.ts';
import { CONVEXITY_MODELS, CONVEXITY_VOLATILITY_MAX, MEAN_REVERSION_MAX, type ConvexityModel } from '../instruments/convexity.ts';
import { readMeetingSteps, readTurns } from './overnightSections.ts';

export const WORKSPACE_FORMAT = 'tenorscope-workspace';
/**
 * The document version written: 2 has `valuationDate` (version 1's `settlement`, the same date)
 * and the calendar sections `calendars` and `customCalendars`. Version 1 is read as it always was
 * (no calendar, no lag, unadjusted), and DOCUMENT_MIGRATIONS (document.ts) rewrites it exactly.
 */
export const WORKSPACE_VERSION = 2;
/** Top-level keys the workbench owns; the engine passes them through. */
export const RESERVED_KEYS = ['scenarios', 'strategy', 'snapshots', 'view', 'note'] as const;
const TOP_KEYS_V1 = ['format', 'version', 'settlement', 'curve', 'quotes', ...RESERVED_KEYS];
const TOP_KEYS = ['format', 'version', 'valuationDate', 'calendars', 'customCalendars', 'fixings', 'turns', 'meetingSteps', 'curve', 'quotes', 'curves', ...RESERVED_KEYS];
/** Fields version 2 added: in a version 1 document each is an error that says so. */
const VERSION_2_KEYS = ['valuationDate', 'calendars', 'customCalendars', 'fixings', 'turns', 'meetingSteps', 'curves'];
/** `curve.fit`: none (the exact bootstrap only), nelson-siegel or svensson (src/core/fit). */
const CURVE_KEYS = ['dayCount', 'interpolation', 'extrapolation', 'fit', 'futuresConvexity'];

/** Ranges of quote fields (kinds/fields.ts), re-exported where they were first defined. */
export { COUPON_MAX, FREQUENCIES, PRICE_MAX, RATE_MAX, RATE_MIN } from '../kinds/fields.ts';

export interface ValidationOutcome {
  /** Null when the document as a whole is unusable (bad format, version, settlement or curve settings). */
  readonly workspace: Workspace | null;
  /** Document-level errors (fatal) and per-quote errors (their quotes are left out of `workspace.quotes`). */
  readonly errors: readonly CoreError[];
}


/**
 * Validates a parsed workspace document (`{"format": "tenorscope-workspace", "version": 2, "valuationDate": ...}`,
 * or version 1 with `settlement`, read as it always was).
 * Every error names its path and says what would be valid. Unknown fields are refused with
 * their path (a misspelt `cleanprice` is caught). Quote errors do not stop the others being
 * checked, so a caller may build from the valid quotes (`--skip-invalid`).
 */
export function validateWorkspace(doc: unknown, readCurves: CurvesReader = refuseNamedCurves): ValidationOutcome {
  const errors: CoreError[] = [];
  if (!isPlainObject(doc)) {
    return { workspace: null, errors: [coreError('schema', '', `a workspace document must be a JSON object, not ${typeName(doc)}`)] };
  }
  const version = doc.version;
  const v1 = version === 1;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    errors.push(coreError('schema', 'version', `version must be the integer ${WORKSPACE_VERSION} (or 1, read as before), not ${typeName(version)}`));
  } else if (version > WORKSPACE_VERSION) {
    errors.push(coreError('unsupported-version', 'version', `version ${version} is newer than this engine reads (${WORKSPACE_VERSION}); open it with a newer Tenorscope`));
  } else if (!v1 && doc.settlement !== undefined && doc.valuationDate === undefined) {
    errors.push(coreError('unsupported-version', 'version', `this document says version ${version} but is written in version 1's terms (settlement): set version to 1, or rename settlement to valuationDate`));
  }
  const keys = v1 ? TOP_KEYS_V1 : TOP_KEYS;
  for (const key of Object.keys(doc)) {
    if (keys.includes(key) || (!v1 && key === 'settlement' && doc.valuationDate === undefined)) continue;
    if (v1 && VERSION_2_KEYS.includes(key)) errors.push(coreError('schema', key, `"${key}" is a field of version 2 documents; set version to 2 and write valuationDate in place of settlement`));
    else errors.push(coreError('schema', key, `unknown field "${key}"; a workspace has ${listOf(keys)}`));
  }
  if (doc.format !== WORKSPACE_FORMAT) {
    errors.push(coreError('schema', 'format', `format must be "${WORKSPACE_FORMAT}", not ${typeName(doc.format)}`));
  }
  const dateKey = v1 ? 'settlement' : 'valuationDate';
  const settlement = v1 || doc.settlement === undefined || doc.valuationDate !== undefined ? checkDate(doc[dateKey], dateKey, errors) : null;
  const calendars = v1 ? {} : readCalendarSections(doc.calendars, doc.customCalendars, errors);
  const turns = v1 ? undefined : readTurns(doc.turns, errors);
  const meetingSteps = v1 ? undefined : readMeetingSteps(doc.meetingSteps, errors);
  const curve = checkCurve(doc.curve, errors);
  const fixings = v1 || doc.fixings === undefined || settlement === null ? undefined : checkFixings(doc.fixings, errors);
  if (!Array.isArray(doc.quotes)) {
    errors.push(coreError('schema', 'quotes', `quotes must be an array of quote objects, not ${typeName(doc.quotes)}`));
  }
  if (errors.length > 0 || settlement === null || curve === null || !Array.isArray(doc.quotes)) return { workspace: null, errors };

  const quotes: Quote[] = [];
  const settlementCivil = parseIsoDate(settlement)!; // checked above
  const context = isEmptyCalendarContext(calendars) ? undefined : calendars;
  const fromDocument: DocumentContext = { ...(curve.futuresConvexity ? { futuresConvexity: curve.futuresConvexity } : {}), ...(fixings ? { fixings } : {}) };
  for (let index = 0; index < doc.quotes.length; index++) {
    const before = errors.length;
    const q = checkQuote(doc.quotes[index], index, settlement, settlementCivil, errors, context, fromDocument);
    if (q && errors.length === before) quotes.push(q);
  }
  const reserved: Record<string, unknown> = {};
  for (const key of RESERVED_KEYS) if (key in doc) reserved[key] = doc[key];
  const base: Workspace = { settlement, calendars, curve, quotes, quoteCount: doc.quotes.length, reserved, ...(fixings ? { fixings } : {}) };
  const workspace: Workspace = turns === undefined && meetingSteps === undefined ? base : { ...base, ...(turns === undefined ? {} : { turns }), ...(meetingSteps === undefined ? {} : { meetingSteps }) };
  if (doc.curves === undefined) return { workspace, errors };
  // Named curves besides the default one (document/namedCurves.ts): each read as a workspace of its own.
  const common = { format: doc.format, version: doc.version, valuationDate: settlement, calendars: doc.calendars, customCalendars: doc.customCalendars };
  const curves = readCurves(doc.curves, common, validateWorkspace, errors);
  return curves === null ? { workspace: null, errors } : { workspace: { ...workspace, curves }, errors };
}


/**
 * The document's `fixings` (version 2): the overnight rate of past business days,
 * {"YYYY-MM-DD": rate as a decimal}, each before the valuation date (a rate is published the next
 * business morning). A future in its reference period reads the days it needs from here when the
 * quote gives none of its own; days it does not need are ignored, and days on or after the
 * valuation date are kept but not read (the build warns: a valuation date moved back in time
 * leaves the list whole). Undefined with path-named errors when wrong.
 */
function checkFixings(v: unknown, errors: CoreError[]): Readonly<Record<IsoDate, number>> | undefined {
  const example = '{"2027-03-15": 0.0365, "2027-03-16": 0.0366}';
  if (!isPlainObject(v)) {
    errors.push(coreError('schema', 'fixings', `fixings must be an object of dates to overnight rates as decimals, such as ${example}, not ${typeName(v)}`));
    return undefined;
  }
  const entries = Object.entries(v);
  if (entries.length > LIMITS.fixings) {
    errors.push(coreError('range', 'fixings', `fixings holds ${entries.length} dates; at most ${LIMITS.fixings} are read (keep the ones the futures in their period need)`));
    return undefined;
  }
  const out: Record<IsoDate, number> = {};
  for (const [date, r] of entries) {
    const at = `fixings.${date.slice(0, 12)}`;
    if (parseIsoDate(date) === null) {
      errors.push(coreError('schema', at, `${at}: a fixing's key must be a date YYYY-MM-DD, not "${date.slice(0, 40)}"`));
      continue;
    }
    if (typeof r !== 'number' || !Number.isFinite(r) || r < RATE_MIN || r > RATE_MAX) {
      errors.push(coreError('range', at, `${at}: must be an overnight rate as a decimal from ${RATE_MIN} to ${RATE_MAX} (0.0365 = 3.65%), not ${typeof r === 'number' ? String(r) : typeName(r)}`));
      continue;
    }
    out[date] = r;
  }
  return out;
}

/**
 * Reads a document's `curves` into named curves in build order, or null with errors
 * (document/namedCurves.ts, readNamedCurves: what the `curve` command passes).
 */
export type CurvesReader = (raw: unknown, common: Readonly<Record<string, unknown>>, read: ReadWorkspace, errors: CoreError[]) => readonly WorkspaceCurve[] | null;

/**
 * The reader of `curves` when none is given (the workbench's default build, which builds the
 * default curve alone: its first load does not carry the named-curve reader, and the link and file
 * readers pass it): the document is refused, naming its curves, so none is dropped silently.
 */
const refuseNamedCurves: CurvesReader = (raw, _common, _read, errors) => {
  const names = Array.isArray(raw) ? raw.map((c) => (isPlainObject(c) && typeof c.name === 'string' ? `"${c.name.slice(0, 32)}"` : '?')).join(', ') : '';
  errors.push(coreError('schema', 'curves', `this document holds named curves besides its default one${names ? ` (${names})` : ''}, which this reading does not take, so it is refused rather than drop them: build it with the curve command or open it in the workbench, which read every curve`));
  return null;
};

function checkDate(v: unknown, path: string, errors: CoreError[], quote: number | null = null): IsoDate | null {
  if (typeof v === 'string' && parseIsoDate(v)) return v;
  errors.push(coreError('schema', path, `${path} must be a calendar date YYYY-MM-DD (for example 2027-03-10), not ${typeName(v)}`, quote));
  return null;
}

function checkCurve(v: unknown, errors: CoreError[]): CurveSettings | null {
  if (v === undefined) return DEFAULT_CURVE;
  if (!isPlainObject(v)) {
    errors.push(coreError('schema', 'curve', `curve must be an object such as {"dayCount": "ACT/365F", "interpolation": "monotone-convex"}, not ${typeName(v)}`));
    return null;
  }
  const before = errors.length;
  for (const key of Object.keys(v)) {
    if (!CURVE_KEYS.includes(key)) errors.push(coreError('schema', `curve.${key}`, `unknown field "curve.${key}"; curve has ${listOf(CURVE_KEYS)}`));
  }
  const dayCount = v.dayCount ?? DEFAULT_CURVE.dayCount;
  if (!isCurveDayCount(dayCount)) {
    const why = dayCount === 'ACT/ACT-ICMA' || dayCount === '30E/360-ISDA' ? `${String(dayCount)} needs an instrument and cannot be the curve's axis; ` : '';
    errors.push(coreError('unknown-identifier', 'curve.dayCount', `${why}curve.dayCount must be one of ${listOf(CURVE_DAY_COUNTS)}, not ${typeName(dayCount)}`));
  }
  const interpolation = v.interpolation ?? DEFAULT_CURVE.interpolation;
  if (!isInterpolation(interpolation)) {
    errors.push(coreError('unknown-identifier', 'curve.interpolation', `curve.interpolation must be one of ${listOf(INTERPOLATIONS)}, not ${typeName(interpolation)}`));
  }
  const extrapolation = v.extrapolation ?? DEFAULT_CURVE.extrapolation;
  if (!isExtrapolation(extrapolation)) {
    errors.push(coreError('unknown-identifier', 'curve.extrapolation', `curve.extrapolation must be one of ${listOf(EXTRAPOLATIONS)}, not ${typeName(extrapolation)}`));
  }
  const fit = v.fit ?? DEFAULT_CURVE.fit;
  if (fit !== 'none' && !isFitModel(fit)) {
    errors.push(coreError('unknown-identifier', 'curve.fit', `curve.fit must be one of none, ${listOf(FIT_MODELS)}, not ${typeName(fit)}`));
  }
  const futuresConvexity = v.futuresConvexity === undefined ? undefined : checkConvexityModel(v.futuresConvexity, errors);
  if (errors.length > before) return null;
  return { dayCount, interpolation, extrapolation, fit, ...(futuresConvexity ? { futuresConvexity } : {}) } as CurveSettings;
}


/**
 * `curve.futuresConvexity`: {"model": "ho-lee" | "hull-white", "volatility": decimal per root year,
 * "meanReversion": per year (hull-white; ho-lee takes none)}. Null with path-named errors when wrong.
 */
function checkConvexityModel(v: unknown, errors: CoreError[]): ConvexityModel | null {
  const path = 'curve.futuresConvexity';
  const example = `{"model": "hull-white", "volatility": 0.01, "meanReversion": 0.03} or {"model": "ho-lee", "volatility": 0.01}`;
  if (!isPlainObject(v)) {
    errors.push(coreError('schema', path, `${path} must be an object such as ${example}, not ${typeName(v)}`));
    return null;
  }
  const before = errors.length;
  const model = v.model;
  const keys = model === 'ho-lee' ? ['model', 'volatility'] : ['model', 'volatility', 'meanReversion'];
  for (const key of Object.keys(v)) if (!keys.includes(key)) errors.push(coreError('schema', `${path}.${key}`, `unknown field "${path}.${key}"; ${model === 'ho-lee' ? 'the ho-lee model' : path} has ${listOf(keys)}`));
  if (typeof model !== 'string' || !(CONVEXITY_MODELS as readonly string[]).includes(model)) {
    errors.push(coreError('unknown-identifier', `${path}.model`, `${path}.model must be one of ${listOf(CONVEXITY_MODELS)}, not ${typeName(model)}`));
  }
  const number = (key: string, max: number, what: string, fallback?: number): number => {
    const x = v[key] ?? fallback;
    if (typeof x === 'number' && x >= 0 && x <= max) return x;
    errors.push(coreError('range', `${path}.${key}`, `${path}.${key} must be a number from 0 to ${max} (${what}), not ${typeName(x)}`));
    return 0;
  };
  const volatility = number('volatility', CONVEXITY_VOLATILITY_MAX, "the short rate's absolute volatility, a decimal a year: 0.01 is 100 bp");
  const meanReversion = model === 'ho-lee' ? 0 : number('meanReversion', MEAN_REVERSION_MAX, 'a decimal per year, such as 0.03');
  return errors.length > before ? null : { model: model as ConvexityModel['model'], volatility, meanReversion };
}

function checkQuote(raw: unknown, index: number, settlement: IsoDate, settlementCivil: CivilDate, errors: CoreError[], calendars: CalendarContext | undefined, context: DocumentContext): Quote | null {
  const base = `quotes[${index}]`;
  if (!isPlainObject(raw)) {
    errors.push(coreError('schema', base, `${base}: a quote must be an object such as {"kind": "deposit", "tenor": "3M", "rate": 0.031}, not ${typeName(raw)}`, index));
    return null;
  }
  const kind = raw.kind;
  if (typeof kind !== 'string' || !(QUOTE_KINDS as readonly string[]).includes(kind)) {
    errors.push(coreError('unknown-identifier', `${base}.kind`, `${base}.kind: must be one of ${listOf(QUOTE_KINDS)}, not ${typeName(kind)}`, index));
    return null;
  }
  const k = kind as Quote['kind'];
  const allowed = KIND_ALLOWED_FIELDS[k];
  for (const key of Object.keys(raw)) {
    if (!allowed.has(key)) {
      errors.push(coreError('schema', `${base}.${key}`, `${base}.${key}: unknown field for a ${k}; a ${k} takes ${listOf([...allowed])}`, index));
    }
  }
  // A named convention set fills the fields the quote does not give (kinds/conventionSets.ts).
  const filled = withConventionSet(raw, k, base, index, errors);
  if (filled === null) return null;
  // Maturity: exactly one of tenor and maturity.
  let maturity: IsoDate | null = null;
  let tenor: string | null = null;
  let termTenor = false;
  const hasTenor = raw.tenor !== undefined;
  const hasMaturity = raw.maturity !== undefined;
  if (QUOTE_KIND_MODULES[k].ownDates === true) {
    // The kind's reader makes its dates from its own fields (a future's contract month) and refuses
    // tenor and maturity; the maturity here is a stand-in, checked against settlement by the reader.
    maturity = settlement;
    termTenor = true;
  } else if (hasTenor === hasMaturity) {
    errors.push(coreError('schema', base, `${base}: give exactly one of tenor (such as "5Y") and maturity (a date YYYY-MM-DD)`, index));
  } else if (hasTenor && typeof raw.tenor === 'string' && moneyMarketTerm(raw.tenor) !== null) {
    // ON, TN, SN: the kind's reader makes the dates (on its calendar); the maturity here is a stand-in.
    const term = moneyMarketTerm(raw.tenor)!;
    if (QUOTE_KIND_MODULES[k].moneyMarketTerms === true) {
      tenor = term;
      maturity = settlement;
      termTenor = true;
    } else {
      const takers = KIND_MODULE_LIST.filter((mod) => mod.moneyMarketTerms === true).map((mod) => mod.kind);
      errors.push(coreError('schema', `${base}.tenor`, `${base}.tenor: "${raw.tenor}" (${MONEY_MARKET_TERMS[term]}) is a tenor of ${listOf(takers)} quotes only; a ${k} takes a tenor nD, nW, nM or nY with n >= 1 (such as "3M") or a maturity date`, index));
    }
  } else if (hasTenor) {
    const parsed = typeof raw.tenor === 'string' ? parseTenor(raw.tenor) : null;
    if (!parsed || raw.tenor !== (raw.tenor as string).trim()) {
      errors.push(coreError('schema', `${base}.tenor`, `${base}.tenor: must be a tenor nD, nW, nM or nY with n >= 1 (such as "3M"), not ${typeName(raw.tenor)}`, index));
    } else {
      tenor = formatTenor(parsed);
      maturity = isoFromCivil(marketDateCivil(settlementCivil, parsed));
    }
  } else {
    maturity = checkDate(raw.maturity, `${base}.maturity`, errors, index);
  }
  if (maturity !== null && !termTenor && compareIso(maturity, settlement) <= 0) {
    errors.push(coreError('before-settlement', `${base}.${hasTenor ? 'tenor' : 'maturity'}`, `${base}: maturity ${maturity} must be after the settlement date ${settlement}`, index));
    maturity = null;
  }
  let enabled = true;
  if (raw.enabled !== undefined) {
    if (typeof raw.enabled !== 'boolean') errors.push(coreError('schema', `${base}.enabled`, `${base}.enabled: must be true or false, not ${typeName(raw.enabled)}`, index));
    else enabled = raw.enabled;
  }
  const m = maturity ?? settlement;
  const before = errors.length;
  // The kind's own fields, read by its module (src/core/kinds). Performance: the modules' readers
  // spell out the common fields (index, maturity, tenor, enabled) rather than spreading a shared
  // object; a spread per quote cost a third of validation.
  const quote = QUOTE_KIND_MODULES[k].schema.read(filled, base, index, maturity, m, tenor, enabled, errors, settlement, calendars, context);
  if (errors.length > before || maturity === null) return null;
  return quote;
}
