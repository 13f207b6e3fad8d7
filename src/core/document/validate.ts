import { isExtrapolation, EXTRAPOLATIONS } from '../curve/curve.ts';
import { FIT_MODELS, isFitModel } from '../fit/parametricForm.ts';
import { INTERPOLATIONS, isInterpolation } from '../interpolation/types.ts';
import { COMPOUNDINGS, isCompounding, type Compounding } from '../rates/compounding.ts';
import { coreError, type CoreError } from '../result.ts';
import { compareIso, isMonthEnd, isoFromCivil, parseIsoDate, type CivilDate, type IsoDate } from '../time/date.ts';
import { CURVE_DAY_COUNTS, DAY_COUNTS, isCurveDayCount, isDayCount, type DayCount } from '../time/dayCount.ts';
import { addTenorCivil, formatTenor, parseTenor } from '../time/tenor.ts';
import { DEFAULT_CURVE, QUOTE_KINDS, type CurveSettings, type Quote, type Workspace } from './types.ts';
import { isPlainObject } from './plainObject.ts';

export const WORKSPACE_FORMAT = 'tenorscope-workspace';
export const WORKSPACE_VERSION = 1;
/** Top-level keys the workbench owns; the engine passes them through. */
export const RESERVED_KEYS = ['scenarios', 'strategy', 'snapshots', 'view', 'note'] as const;
const TOP_KEYS = ['format', 'version', 'settlement', 'curve', 'quotes', ...RESERVED_KEYS];
/** `curve.fit`: none (the exact bootstrap only), nelson-siegel or svensson (src/core/fit). */
const CURVE_KEYS = ['dayCount', 'interpolation', 'extrapolation', 'fit'];

/** Ranges (inclusive unless stated), decimals: rates -0.10..1.0; coupons 0..0.5; prices (0, 1000]. */
export const RATE_MIN = -0.1;
export const RATE_MAX = 1.0;
export const COUPON_MAX = 0.5;
export const PRICE_MAX = 1000;
export const FREQUENCIES = [1, 2, 4, 12] as const;

/** Fields each kind accepts besides `kind`, `tenor`, `maturity` and `enabled`. */
const KIND_FIELDS: Readonly<Record<Quote['kind'], readonly string[]>> = {
  deposit: ['rate', 'dayCount'],
  bill: ['discountYield', 'price'],
  zero: ['price', 'rate', 'compounding', 'dayCount'],
  bond: ['coupon', 'frequency', 'cleanPrice', 'yield', 'dayCount', 'eom'],
  swap: ['rate', 'frequency', 'dayCount', 'eom'],
};

/** Every field a quote of each kind may carry (performance: made once, not per quote; a set, not a list to search). */
const allowedFor = (k: Quote['kind']): ReadonlySet<string> => new Set(['kind', 'tenor', 'maturity', 'enabled', ...KIND_FIELDS[k]]);
const KIND_ALLOWED: Readonly<Record<Quote['kind'], ReadonlySet<string>>> = {
  deposit: allowedFor('deposit'),
  bill: allowedFor('bill'),
  zero: allowedFor('zero'),
  bond: allowedFor('bond'),
  swap: allowedFor('swap'),
};

export interface ValidationOutcome {
  /** Null when the document as a whole is unusable (bad format, version, settlement or curve settings). */
  readonly workspace: Workspace | null;
  /** Document-level errors (fatal) and per-quote errors (their quotes are left out of `workspace.quotes`). */
  readonly errors: readonly CoreError[];
}

const typeName = (v: unknown): string => (v === null ? 'null' : Array.isArray(v) ? 'an array' : typeof v === 'string' ? `the text "${String(v).slice(0, 40)}"` : typeof v);
const listOf = (xs: readonly unknown[]): string => xs.map((x) => String(x)).join(', ');

/**
 * Validates a parsed workspace document (`{"format": "tenorscope-workspace", "version": 1, ...}`).
 * Every error names its path and says what would be valid. Unknown fields are refused with
 * their path (a misspelt `cleanprice` is caught). Quote errors do not stop the others being
 * checked, so a caller may build from the valid quotes (`--skip-invalid`).
 */
export function validateWorkspace(doc: unknown): ValidationOutcome {
  const errors: CoreError[] = [];
  if (!isPlainObject(doc)) {
    return { workspace: null, errors: [coreError('schema', '', `a workspace document must be a JSON object, not ${typeName(doc)}`)] };
  }
  for (const key of Object.keys(doc)) {
    if (!TOP_KEYS.includes(key)) errors.push(coreError('schema', key, `unknown field "${key}"; a workspace has ${listOf(TOP_KEYS)}`));
  }
  if (doc.format !== WORKSPACE_FORMAT) {
    errors.push(coreError('schema', 'format', `format must be "${WORKSPACE_FORMAT}", not ${typeName(doc.format)}`));
  }
  if (typeof doc.version !== 'number' || !Number.isInteger(doc.version) || doc.version < 1) {
    errors.push(coreError('schema', 'version', `version must be the integer ${WORKSPACE_VERSION}, not ${typeName(doc.version)}`));
  } else if (doc.version > WORKSPACE_VERSION) {
    errors.push(
      coreError('unsupported-version', 'version', `version ${doc.version} is newer than this engine reads (${WORKSPACE_VERSION}); open it with a newer Tenorscope`),
    );
  }
  const settlement = checkDate(doc.settlement, 'settlement', errors);
  const curve = checkCurve(doc.curve, errors);
  if (!Array.isArray(doc.quotes)) {
    errors.push(coreError('schema', 'quotes', `quotes must be an array of quote objects, not ${typeName(doc.quotes)}`));
  }
  if (errors.length > 0 || settlement === null || curve === null || !Array.isArray(doc.quotes)) return { workspace: null, errors };

  const quotes: Quote[] = [];
  const settlementCivil = parseIsoDate(settlement)!; // checked above
  for (let index = 0; index < doc.quotes.length; index++) {
    const before = errors.length;
    const q = checkQuote(doc.quotes[index], index, settlement, settlementCivil, errors);
    if (q && errors.length === before) quotes.push(q);
  }
  const reserved: Record<string, unknown> = {};
  for (const key of RESERVED_KEYS) if (key in doc) reserved[key] = doc[key];
  return { workspace: { settlement, curve, quotes, quoteCount: doc.quotes.length, reserved }, errors };
}

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
  if (errors.length > before) return null;
  return { dayCount, interpolation, extrapolation, fit } as CurveSettings;
}

// The readers below take the quote's context as arguments: `base` is the quote's path,
// `quotes[index]`.

function readNumber(raw: Record<string, unknown>, base: string, index: number, errors: CoreError[], field: string, min: number, max: number, what: string, minExclusive = false): number | null | undefined {
  const v = raw[field];
  if (v === undefined) return undefined;
  if (typeof v !== 'number' || !Number.isFinite(v)) {
    errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: must be a number ${what}, not ${typeName(v)}`, index));
    return null;
  }
  if ((minExclusive ? v <= min : v < min) || v > max) {
    const hint = RATE_FIELDS.includes(field) && v > 1 ? '; rates are decimals: 0.05 = 5%' : '';
    errors.push(coreError('range', `${base}.${field}`, `${base}.${field}: must be a number ${what}, not ${v}${hint}`, index));
    return null;
  }
  return v;
}

function readDayCount(raw: Record<string, unknown>, base: string, index: number, errors: CoreError[], field: string, fallback: DayCount): DayCount | null {
  const v = raw[field] ?? fallback;
  if (isDayCount(v)) return v;
  errors.push(coreError('unknown-identifier', `${base}.${field}`, `${base}.${field}: must be one of ${listOf(DAY_COUNTS)}, not ${typeName(v)}`, index));
  return null;
}

function required<T>(v: T | null | undefined, field: string, what: string, base: string, index: number, errors: CoreError[]): T | null {
  if (v === undefined) errors.push(coreError('schema', `${base}.${field}`, `${base}.${field}: required, a number ${what}`, index));
  return v ?? null;
}

function oneOf(raw: Record<string, unknown>, k: Quote['kind'], base: string, index: number, errors: CoreError[], a: string, b: string): void {
  if ((raw[a] === undefined) === (raw[b] === undefined)) {
    errors.push(coreError('schema', base, `${base}: a ${k} takes exactly one of ${a} and ${b}`, index));
  }
}

function readFrequency(raw: Record<string, unknown>, k: Quote['kind'], base: string, index: number, errors: CoreError[]): number | null {
  const v = raw.frequency;
  if (v === undefined) return k === 'bond' ? 2 : 1;
  if (typeof v === 'number' && (FREQUENCIES as readonly number[]).includes(v)) return v;
  errors.push(coreError(typeof v === 'number' ? 'range' : 'schema', `${base}.frequency`, `${base}.frequency: must be one of ${listOf(FREQUENCIES)} payments a year, not ${typeName(v)}`, index));
  return null;
}

function readEom(raw: Record<string, unknown>, base: string, index: number, errors: CoreError[], fallback: boolean): boolean | null {
  if (raw.eom === undefined) return fallback;
  if (typeof raw.eom === 'boolean') return raw.eom;
  errors.push(coreError('schema', `${base}.eom`, `${base}.eom: must be true or false, not ${typeName(raw.eom)}`, index));
  return null;
}

/** ACT/ACT-ICMA needs a coupon period: refused for deposits and zeros, which have none. */
function noCouponPeriod(dc: DayCount | null, what: string, base: string, index: number, errors: CoreError[]): DayCount | null {
  if (dc !== 'ACT/ACT-ICMA') return dc;
  errors.push(coreError('unknown-identifier', `${base}.dayCount`, `${base}.dayCount: ACT/ACT-ICMA needs a coupon period, which a ${what} has not; use one of ${listOf(DAY_COUNTS.filter((d) => d !== 'ACT/ACT-ICMA'))}`, index));
  return null;
}

const RATE_TEXT = `from ${RATE_MIN} to ${RATE_MAX}`;
const PRICE_TEXT = `above 0 up to ${PRICE_MAX} (per 100 face)`;
const COUPON_TEXT = `from 0 to ${COUPON_MAX}`;
/** Fields holding a decimal rate, whose values above 1 get the hint that rates are decimals. */
const RATE_FIELDS = ['rate', 'discountYield', 'yield', 'coupon'];

function checkQuote(raw: unknown, index: number, settlement: IsoDate, settlementCivil: CivilDate, errors: CoreError[]): Quote | null {
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
  const allowed = KIND_ALLOWED[k];
  for (const key of Object.keys(raw)) {
    if (!allowed.has(key)) {
      errors.push(coreError('schema', `${base}.${key}`, `${base}.${key}: unknown field for a ${k}; a ${k} takes ${listOf([...allowed])}`, index));
    }
  }
  // Maturity: exactly one of tenor and maturity.
  let maturity: IsoDate | null = null;
  let tenor: string | null = null;
  const hasTenor = raw.tenor !== undefined;
  const hasMaturity = raw.maturity !== undefined;
  if (hasTenor === hasMaturity) {
    errors.push(coreError('schema', base, `${base}: give exactly one of tenor (such as "5Y") and maturity (a date YYYY-MM-DD)`, index));
  } else if (hasTenor) {
    const parsed = typeof raw.tenor === 'string' ? parseTenor(raw.tenor) : null;
    if (!parsed || raw.tenor !== (raw.tenor as string).trim()) {
      errors.push(coreError('schema', `${base}.tenor`, `${base}.tenor: must be a tenor nD, nW, nM or nY with n >= 1 (such as "3M"), not ${typeName(raw.tenor)}`, index));
    } else {
      tenor = formatTenor(parsed);
      maturity = isoFromCivil(addTenorCivil(settlementCivil, parsed, 1, false));
    }
  } else {
    maturity = checkDate(raw.maturity, `${base}.maturity`, errors, index);
  }
  if (maturity !== null && compareIso(maturity, settlement) <= 0) {
    errors.push(coreError('before-settlement', `${base}.${hasTenor ? 'tenor' : 'maturity'}`, `${base}: maturity ${maturity} must be after the settlement date ${settlement}`, index));
    maturity = null;
  }
  let enabled = true;
  if (raw.enabled !== undefined) {
    if (typeof raw.enabled !== 'boolean') errors.push(coreError('schema', `${base}.enabled`, `${base}.enabled: must be true or false, not ${typeName(raw.enabled)}`, index));
    else enabled = raw.enabled;
  }
  // Performance: the quote objects below spell out their common fields (index, maturity, tenor,
  // enabled) rather than spreading a shared object; a spread per quote cost a third of validation.
  const m = maturity ?? settlement;
  const before = errors.length;
  let quote: Quote | null = null;
  switch (k) {
    case 'deposit': {
      const rate = required(readNumber(raw, base, index, errors, 'rate', RATE_MIN, RATE_MAX, RATE_TEXT), 'rate', RATE_TEXT, base, index, errors);
      const dayCount = noCouponPeriod(readDayCount(raw, base, index, errors, 'dayCount', 'ACT/360'), 'deposit', base, index, errors);
      if (rate !== null && dayCount) quote = { kind: 'deposit', index, maturity: m, tenor, enabled, rate, dayCount };
      break;
    }
    case 'bill': {
      oneOf(raw, k, base, index, errors, 'discountYield', 'price');
      const discountYield = readNumber(raw, base, index, errors, 'discountYield', RATE_MIN, RATE_MAX, RATE_TEXT) ?? null;
      const price = readNumber(raw, base, index, errors, 'price', 0, PRICE_MAX, PRICE_TEXT, true) ?? null;
      quote = { kind: 'bill', index, maturity: m, tenor, enabled, discountYield, price };
      break;
    }
    case 'zero': {
      oneOf(raw, k, base, index, errors, 'price', 'rate');
      const price = readNumber(raw, base, index, errors, 'price', 0, PRICE_MAX, PRICE_TEXT, true) ?? null;
      const rate = readNumber(raw, base, index, errors, 'rate', RATE_MIN, RATE_MAX, RATE_TEXT) ?? null;
      if (raw.rate === undefined && (raw.compounding !== undefined || raw.dayCount !== undefined)) {
        errors.push(coreError('schema', base, `${base}: compounding and dayCount go with a rate; a zero quoted by price takes neither`, index));
      }
      let compounding: Compounding = 'annual';
      if (raw.compounding !== undefined) {
        if (isCompounding(raw.compounding)) compounding = raw.compounding;
        else errors.push(coreError('unknown-identifier', `${base}.compounding`, `${base}.compounding: must be one of ${listOf(COMPOUNDINGS)}, not ${typeName(raw.compounding)}`, index));
      }
      const dayCount = noCouponPeriod(readDayCount(raw, base, index, errors, 'dayCount', 'ACT/365F'), 'zero', base, index, errors);
      if (dayCount) quote = { kind: 'zero', index, maturity: m, tenor, enabled, price, rate, compounding, dayCount };
      break;
    }
    case 'bond': {
      const coupon = required(readNumber(raw, base, index, errors, 'coupon', 0, COUPON_MAX, COUPON_TEXT), 'coupon', COUPON_TEXT, base, index, errors);
      const freq = readFrequency(raw, k, base, index, errors);
      oneOf(raw, k, base, index, errors, 'cleanPrice', 'yield');
      const cleanPrice = readNumber(raw, base, index, errors, 'cleanPrice', 0, PRICE_MAX, PRICE_TEXT, true) ?? null;
      const y = readNumber(raw, base, index, errors, 'yield', RATE_MIN, RATE_MAX, RATE_TEXT) ?? null;
      const dayCount = readDayCount(raw, base, index, errors, 'dayCount', 'ACT/ACT-ICMA');
      const endOfMonth = readEom(raw, base, index, errors, maturity !== null && isMonthEnd(parseIsoDate(maturity)!));
      if (coupon !== null && freq !== null && dayCount && endOfMonth !== null) {
        quote = { kind: 'bond', index, maturity: m, tenor, enabled, coupon, frequency: freq, cleanPrice, yield: y, dayCount, eom: endOfMonth };
      }
      break;
    }
    case 'swap': {
      const rate = required(readNumber(raw, base, index, errors, 'rate', RATE_MIN, RATE_MAX, RATE_TEXT), 'rate', RATE_TEXT, base, index, errors);
      const freq = readFrequency(raw, k, base, index, errors);
      const dayCount = readDayCount(raw, base, index, errors, 'dayCount', '30/360');
      const endOfMonth = readEom(raw, base, index, errors, false);
      if (rate !== null && freq !== null && dayCount && endOfMonth !== null) {
        quote = { kind: 'swap', index, maturity: m, tenor, enabled, rate, frequency: freq, dayCount, eom: endOfMonth };
      }
      break;
    }
  }
  if (errors.length > before || maturity === null) return null;
  return quote;
}
