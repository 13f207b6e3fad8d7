import { isPlainObject } from './plainObject.ts';
import { CURVE_NAME_PATTERN, DEFAULT_CURVE_NAME, INDEX_TENORS, type NamedCurveRole } from './namedCurves.ts';
import { quoteRowText } from './documentBridge.ts';
import { parseRow, type QuoteRow, type RowIssues } from '../input/quoteRow.ts';
import { DEFAULT_CONVENTIONS } from '../input/conventions.ts';
import type { InterpolationId } from '../interpolation/types.ts';

/**
 * Edits of a workbench document's named curves (`curves`, kept in the engine's form: each entry's
 * name, role, index, discountCurve, curve settings and quotes as numbers). Each edit returns the
 * next `curves` (every entry it does not touch the very same object) or the errors by field, and
 * changes nothing else; the caller commits the result as one undo step. A quote is edited as a
 * sheet row (input/quoteRow.ts's parseRow, the sheet's one reader), so a named curve's quote is
 * read exactly as the same row typed in the sheet.
 */

/** What the curve form gives: a new curve, or the settings of one being edited. */
export interface CurveSpec {
  readonly name: string;
  readonly role: NamedCurveRole;
  /** A projection curve's index tenor (`3M`); ignored for other roles. */
  readonly index: string;
  /** A projection curve's discounting curve (DEFAULT_CURVE_NAME or a named curve); ignored for other roles. */
  readonly discountCurve: string;
  readonly interpolation: InterpolationId;
}

/** The curve form's fields an error can sit on. */
export type CurveField = 'name' | 'index' | 'discountCurve';
export type CurveEditResult = { readonly ok: true; readonly curves: readonly unknown[] | undefined } | { readonly ok: false; readonly errors: Partial<Record<CurveField, string>> };

type Entry = Record<string, unknown>;
const entries = (curves: readonly unknown[] | undefined): Entry[] => (curves ?? []).filter(isPlainObject);
const nameOf = (c: unknown): string => (isPlainObject(c) && typeof c.name === 'string' ? c.name : '');
const quotesOf = (c: Entry): readonly unknown[] => (Array.isArray(c.quotes) ? c.quotes : []);
/** The curves an entry needs built first: its discounting curve and its basis swaps' other legs. */
const needsOf = (c: Entry): string[] => [...(typeof c.discountCurve === 'string' ? [c.discountCurve] : []), ...quotesOf(c).flatMap((q) => (isPlainObject(q) && typeof q.against === 'string' ? [q.against] : []))];

/** The names of the curves that need `name` (discounted on it, or a basis swap against it). */
export function dependentsOf(curves: readonly unknown[] | undefined, name: string): string[] {
  return entries(curves)
    .filter((c) => c.name !== name && needsOf(c).includes(name))
    .map(nameOf);
}

/** A circle of curves that each need the next (named in order, the first again at the end), or null. */
function circleOf(curves: readonly Entry[]): string[] | null {
  const byName = new Map(curves.map((c) => [nameOf(c), c]));
  const done = new Set<string>();
  const path: string[] = [];
  const visit = (n: string): string[] | null => {
    if (done.has(n) || !byName.has(n)) return null;
    if (path.includes(n)) return [...path.slice(path.indexOf(n)), n];
    path.push(n);
    for (const m of needsOf(byName.get(n)!)) {
      const circle = visit(m);
      if (circle) return circle;
    }
    path.pop();
    done.add(n);
    return null;
  };
  for (const c of curves) {
    const circle = visit(nameOf(c));
    if (circle) return circle;
  }
  return null;
}

/**
 * Adds a curve (`old` null) or changes the curve named `old`: its name (every curve discounted on
 * it and every basis swap against it follow the new name), role, index, discounting curve and
 * interpolation; its quotes and other settings are kept. Refused, naming the field and what
 * would be valid: an empty or malformed name, a name used twice or the default curve's, a
 * projection curve without an index or a discounting curve, or a discounting curve that closes a
 * circle (naming the curves in it).
 */
export function saveCurve(curves: readonly unknown[] | undefined, old: string | null, spec: CurveSpec): CurveEditResult {
  const errors: Partial<Record<CurveField, string>> = {};
  const list = curves ?? [];
  const at = old === null ? -1 : list.findIndex((c) => nameOf(c) === old);
  const name = spec.name.trim();
  const others = list.filter((_, i) => i !== at).map(nameOf);
  if (name === '') errors.name = `Give the curve a name, such as "euribor3m"`;
  else if (name === DEFAULT_CURVE_NAME || others.includes(name)) errors.name = `"${name}" is used by ${name === DEFAULT_CURVE_NAME ? "the sheet's curve" : 'another curve'}; choose another name`;
  else if (!CURVE_NAME_PATTERN.test(name)) errors.name = `Start with a letter, then up to 31 letters, digits, - or _ (such as "euribor3m")`;
  const projection = spec.role === 'projection';
  if (projection && INDEX_TENORS[spec.index] === undefined) errors.index = `Choose the term index's tenor: one of ${Object.keys(INDEX_TENORS).join(', ')}`;
  if (projection) {
    if (spec.discountCurve === '') errors.discountCurve = `A projection curve needs a discounting curve: choose one`;
    else if (spec.discountCurve === name || (old !== null && spec.discountCurve === old)) errors.discountCurve = `A curve cannot be discounted on itself; choose another`;
    else if (spec.discountCurve !== DEFAULT_CURVE_NAME && !others.includes(spec.discountCurve)) errors.discountCurve = `No curve is named "${spec.discountCurve}"; choose one listed`;
  }
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  const before: Entry = at < 0 ? { quotes: [] } : (list[at] as Entry);
  const { name: _n, role: _r, index: _i, discountCurve: _d, curve: settings, quotes, ...rest } = before;
  const entry: Entry = {
    name,
    role: spec.role,
    ...(projection ? { index: spec.index, discountCurve: spec.discountCurve } : {}),
    curve: { ...(isPlainObject(settings) ? settings : {}), interpolation: spec.interpolation },
    quotes: quotes ?? [],
    ...rest,
  };
  const renamed = old !== null && old !== name;
  const follow = (c: unknown): unknown => {
    if (!renamed || !isPlainObject(c)) return c;
    const qs = quotesOf(c);
    const movesQuotes = qs.some((q) => isPlainObject(q) && q.against === old);
    if (c.discountCurve !== old && !movesQuotes) return c;
    return {
      ...c,
      ...(c.discountCurve === old ? { discountCurve: name } : {}),
      ...(movesQuotes ? { quotes: qs.map((q) => (isPlainObject(q) && q.against === old ? { ...q, against: name } : q)) } : {}),
    };
  };
  const next = at < 0 ? [...list, entry] : list.map((c, i) => (i === at ? entry : follow(c)));
  const circle = circleOf(entries(next));
  if (circle) return { ok: false, errors: { discountCurve: `The curves ${circle.map((n) => `"${n}"`).join(' -> ')} would need each other in a circle; discount "${name}" on "${DEFAULT_CURVE_NAME}" or a curve not built on it` } };
  return { ok: true, curves: next };
}

/**
 * The curves without `name` and, when `withDependents`, every curve that needs it (directly or
 * through another); undefined when none is left (a workspace of one curve again). Refused, naming
 * them, when others need it and `withDependents` is false.
 */
export function removeCurve(curves: readonly unknown[] | undefined, name: string, withDependents: boolean): { readonly ok: true; readonly curves: readonly unknown[] | undefined } | { readonly ok: false; readonly dependents: readonly string[] } {
  const gone = new Set([name]);
  for (let grew = true; grew; ) {
    grew = false;
    for (const c of entries(curves)) {
      if (!gone.has(nameOf(c)) && needsOf(c).some((n) => gone.has(n))) {
        gone.add(nameOf(c));
        grew = true;
      }
    }
  }
  if (gone.size > 1 && !withDependents) return { ok: false, dependents: [...gone].filter((n) => n !== name) };
  const next = (curves ?? []).filter((c) => !gone.has(nameOf(c)));
  return { ok: true, curves: next.length === 0 ? undefined : next };
}

/** A named curve's quote as sheet row text, or null when the sheet's row would not read it the same (a field it has no cell for), so only its value may be typed. */
export function namedQuoteRow(q: unknown): Omit<QuoteRow, 'id'> | null {
  if (!isPlainObject(q)) return null;
  const { against: _a, ...quote } = q;
  const row = quoteRowText(quote);
  const back = parseRow({ id: '', ...row }, 'decimal', DEFAULT_CONVENTIONS).quote;
  const { enabled, ...given } = quote;
  return back !== null && sameFields(back, enabled === false ? { ...given, enabled } : given) ? row : null;
}

const sameFields = (a: Readonly<Record<string, unknown>>, b: Readonly<Record<string, unknown>>): boolean => {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => a[k] === b[k]);
};

/**
 * The curves with quote `k` of the curve `name` set from a sheet row (k past its last quote adds
 * the quote), read by the sheet's parseRow in the file's unit (rates as decimals, a decimal point,
 * ISO dates), `against` the curve of a basis swap's other leg ('' for none). Refused with the
 * row's cell issues when a cell is wrong, the document unchanged.
 */
export function setNamedQuote(curves: readonly unknown[], name: string, k: number, row: Omit<QuoteRow, 'id'>, against: string): { readonly ok: true; readonly curves: readonly unknown[] } | { readonly ok: false; readonly issues: RowIssues } {
  const parsed = parseRow({ id: '', ...row }, 'decimal', DEFAULT_CONVENTIONS);
  if (parsed.quote === null) return { ok: false, issues: parsed.blank ? { kind: { severity: 'error', message: 'Type its kind, maturity and value' } } : parsed.issues };
  const quote = against === '' ? parsed.quote : { ...parsed.quote, against };
  return { ok: true, curves: mapQuotes(curves, name, (qs) => (k >= qs.length ? [...qs, quote] : qs.map((q, j) => (j === k ? quote : q)))) };
}

/** The curves without quote `k` of the curve `name`. */
export const removeNamedQuote = (curves: readonly unknown[], name: string, k: number): readonly unknown[] => mapQuotes(curves, name, (qs) => qs.filter((_, j) => j !== k));

function mapQuotes(curves: readonly unknown[], name: string, f: (qs: readonly unknown[]) => readonly unknown[]): readonly unknown[] {
  return curves.map((c) => (isPlainObject(c) && c.name === name ? { ...c, quotes: f(quotesOf(c)) } : c));
}
