import { coreError, type CoreError } from '../result.ts';
import { listOf, typeName } from '../kinds/fields.ts';
import type { Workspace } from './types.ts';
import { moduleOf } from '../kinds/registry.ts';
import { isPlainObject } from './plainObject.ts';
import { LIMITS } from './limits.ts';

/**
 * The roles of a named curve: `discounting` (an overnight-index curve that discounts and projects
 * its own index), `projection` (a term index's forwards, its swaps discounted on `discountCurve`),
 * `government` (a bond curve that discounts its own bonds). The top-level curve is always the
 * discounting curve named DEFAULT_CURVE_NAME.
 */
export const CURVE_ROLES = ['discounting', 'projection', 'government'] as const;
export type NamedCurveRole = (typeof CURVE_ROLES)[number];
/** The name by which a named curve refers to the document's top-level quotes and settings. */
export const DEFAULT_CURVE_NAME = 'default';
/** A term index's tenor and its periods a year (the floating leg of its swaps). */
export const INDEX_TENORS: Readonly<Record<string, number>> = { '1M': 12, '3M': 4, '6M': 2, '12M': 1 };
/** A named curve's name: a letter, then up to 31 letters, digits, - or _. */
export const CURVE_NAME_PATTERN = /^[A-Za-z][A-Za-z0-9_-]{0,31}$/;
const CURVE_ENTRY_KEYS = ['name', 'role', 'index', 'discountCurve', 'curve', 'quotes'];

/** A named curve of a document, its quotes and settings validated as a workspace of their own. */
export interface WorkspaceCurve {
  readonly name: string;
  readonly role: NamedCurveRole;
  /** A projection curve's index tenor (`3M`); null otherwise. */
  readonly index: string | null;
  /** A projection curve's discounting curve (a named curve or DEFAULT_CURVE_NAME); null otherwise. */
  readonly discountCurve: string | null;
  /** Its position in the document's `curves` array (error paths). */
  readonly position: number;
  /**
   * A projection curve's basis swaps: quote index to the curve named by its `against` (a swap
   * quote whose rate is the spread on this curve's index leg against that curve's leg); empty otherwise.
   */
  readonly basis: ReadonlyMap<number, string>;
  /** Its quotes and settings, read exactly as a document's top level (valuation date and calendars shared). */
  readonly workspace: Workspace;
}

/** Validates a document part as a workspace (validate.ts's validateWorkspace, passed in to avoid an import cycle). */
export type ReadWorkspace = (doc: unknown) => { readonly workspace: Workspace | null; readonly errors: readonly CoreError[] };

/**
 * Reads a document's `curves`: an array of {name, role, index (projection), discountCurve
 * (projection), curve (settings as the top-level curve), quotes}. Each curve's quotes and
 * settings are validated as a workspace with the document's valuation date and calendars
 * (`common`); their errors come back with the path `curves[i].` in front and the curve's name in
 * the message, with no quote index (that names a top-level quote). Whole-curve errors (a bad
 * name, role, index or reference, a cycle) make the result null; the curves come back in build
 * order, every curve after the curve it is discounted on.
 */
export function readNamedCurves(raw: unknown, common: Readonly<Record<string, unknown>>, read: ReadWorkspace, errors: CoreError[]): readonly WorkspaceCurve[] | null {
  if (!Array.isArray(raw) || raw.length === 0 || raw.length > LIMITS.namedCurves) {
    errors.push(coreError('schema', 'curves', `curves must be an array of 1 to ${LIMITS.namedCurves} named curves such as [{"name": "euribor3m", "role": "projection", "index": "3M", "discountCurve": "default", "quotes": [...]}], not ${Array.isArray(raw) ? `${raw.length} entries` : typeName(raw)}`));
    return null;
  }
  const before = errors.length;
  const curves: WorkspaceCurve[] = [];
  const names = new Map<string, number>();
  for (let i = 0; i < raw.length; i++) {
    const base = `curves[${i}]`;
    const c: unknown = raw[i];
    if (!isPlainObject(c)) {
      errors.push(coreError('schema', base, `${base} must be an object with name, role and quotes, not ${typeName(c)}`));
      continue;
    }
    for (const key of Object.keys(c)) if (!CURVE_ENTRY_KEYS.includes(key)) errors.push(coreError('schema', `${base}.${key}`, `unknown field "${base}.${key}"; a named curve has ${listOf(CURVE_ENTRY_KEYS)}`));
    const name = c.name;
    if (typeof name !== 'string' || !CURVE_NAME_PATTERN.test(name) || name === DEFAULT_CURVE_NAME) {
      const why = name === DEFAULT_CURVE_NAME ? `"${DEFAULT_CURVE_NAME}" is the top-level curve's name` : `not ${typeName(name)}`;
      errors.push(coreError('schema', `${base}.name`, `${base}.name must be a plain name (a letter, then up to 31 letters, digits, - or _), such as "euribor3m"; ${why}`));
      continue;
    }
    const first = names.get(name);
    if (first !== undefined) errors.push(coreError('schema', `${base}.name`, `${base}.name: the curve name "${name}" is used twice (curves[${first}] and curves[${i}]); rename one`));
    else names.set(name, i);
    const label = `${base} "${name}"`;
    const role = c.role;
    if (!CURVE_ROLES.includes(role as NamedCurveRole)) {
      errors.push(coreError('unknown-identifier', `${base}.role`, `${label}: role must be one of ${listOf(CURVE_ROLES)}, not ${typeName(role)}`));
      continue;
    }
    const projection = role === 'projection';
    let index: string | null = null;
    let discountCurve: string | null = null;
    if (projection) {
      if (typeof c.index !== 'string' || INDEX_TENORS[c.index] === undefined) {
        errors.push(coreError('unknown-identifier', `${base}.index`, `${label}: a projection curve names its term index's tenor, index, one of ${listOf(Object.keys(INDEX_TENORS))}, not ${typeName(c.index)}`));
      } else index = c.index;
      if (c.discountCurve === undefined) {
        errors.push(coreError('schema', `${base}.discountCurve`, `${label}: a projection curve needs a discounting curve: set discountCurve to "${DEFAULT_CURVE_NAME}" (the top-level curve) or the name of another curve`));
      } else if (typeof c.discountCurve !== 'string') {
        errors.push(coreError('schema', `${base}.discountCurve`, `${label}: discountCurve must be a curve's name, not ${typeName(c.discountCurve)}`));
      } else discountCurve = c.discountCurve;
    } else {
      for (const key of ['index', 'discountCurve']) {
        if (c[key] !== undefined) errors.push(coreError('schema', `${base}.${key}`, `${label}: ${key} belongs to a projection curve; a ${String(role)} curve discounts on itself, so remove it`));
      }
    }
    if (Array.isArray(c.quotes) && c.quotes.length > LIMITS.quotes) {
      errors.push(coreError('range', `${base}.quotes`, `${label}: ${c.quotes.length} quotes is more than the ${LIMITS.quotes} a curve may hold`));
      continue;
    }
    // A projection curve's basis swap is a swap quote with `against` (the other leg's curve): the
    // field is taken off before the quote is read as a swap, and kept here by quote index.
    const basis = new Map<number, string>();
    let quotes = c.quotes;
    if (projection && Array.isArray(quotes)) {
      quotes = quotes.map((q: unknown, k) => {
        if (!isPlainObject(q) || q.against === undefined) return q;
        const { against, ...rest } = q;
        if (typeof against !== 'string') errors.push(coreError('schema', `${base}.quotes[${k}].against`, `${label}: quotes[${k}].against names the curve of a basis swap's other leg as a curve's name, not ${typeName(against)}`));
        else basis.set(k, against);
        return rest;
      });
    }
    const sub = read({ ...common, curve: c.curve, quotes });
    for (const e of sub.errors) {
      // A quote's own error stays a quote's error (a caller may skip it); a refused part refuses the document.
      errors.push(coreError(e.code, `${base}.${e.path}`, `${label}: ${e.message}`));
    }
    if (sub.workspace === null) continue;
    let ws = sub.workspace;
    if (projection) {
      const refused = new Set<number>();
      for (const q of ws.quotes) {
        // The kind's module says how it builds a projection curve (kinds/types.ts, onProjection).
        const how = moduleOf(q).onProjection?.(q) ?? null;
        if (how === null) {
          const what = moduleOf(q).onProjection ? `a ${q.kind} with date conventions (calendar, spotLag, businessDay, paymentLag)` : `a ${q.kind}`;
          refused.add(q.index);
          errors.push(coreError('schema', `${base}.quotes[${q.index}].kind`, `${label}: quotes[${q.index}] is ${what}, which a projection curve does not take; it takes deposits, FRAs, futures and swaps from the valuation date (fixed against the index), so move it to a discounting or government curve`));
        } else if (how !== 'index-swap' && basis.has(q.index)) {
          errors.push(coreError('schema', `${base}.quotes[${q.index}].against`, `${label}: quotes[${q.index}] is a ${q.kind}; against names the other leg of a basis swap, so it belongs on a {"kind": "swap"} quote`));
        }
      }
      if (refused.size > 0) ws = { ...ws, quotes: ws.quotes.filter((q) => !refused.has(q.index)) };
    }
    curves.push({ name, role: role as NamedCurveRole, index, discountCurve, position: i, workspace: ws, basis });
  }
  if (errors.length > before && curves.length < raw.length) return null;
  for (const c of curves) {
    if (c.discountCurve !== null && c.discountCurve !== DEFAULT_CURVE_NAME && !names.has(c.discountCurve)) {
      errors.push(coreError('unknown-identifier', `curves[${c.position}].discountCurve`, `curves[${c.position}] "${c.name}": discountCurve "${c.discountCurve}" names no curve; use "${DEFAULT_CURVE_NAME}" or one of ${listOf([...names.keys()])}`));
    }
  }
  for (const c of curves) {
    for (const [k, against] of c.basis) {
      if (against === c.name || (against !== DEFAULT_CURVE_NAME && !names.has(against))) {
        const why = against === c.name ? 'is this curve itself' : 'names no curve';
        errors.push(coreError('unknown-identifier', `curves[${c.position}].quotes[${k}].against`, `curves[${c.position}] "${c.name}": quotes[${k}].against "${against}" ${why}; name the curve of the other leg, "${DEFAULT_CURVE_NAME}" or one of ${listOf([...names.keys()].filter((n) => n !== c.name))}`));
      }
    }
  }
  // Only a quote's own errors leave the curves usable (its quote left out when skipping); `against` is the curve's wiring.
  if (errors.slice(before).some((e) => !/^curves\[\d+\]\.quotes\[\d+\](?!\.against)(\.|$)/.test(e.path))) return null;
  return buildOrder(curves, errors);
}

/** The curves a curve needs built first: its discounting curve and the other legs of its basis swaps (named curves only). */
const needs = (c: WorkspaceCurve): string[] => [...new Set([...(c.discountCurve === null ? [] : [c.discountCurve]), ...c.basis.values()])].filter((n) => n !== DEFAULT_CURVE_NAME);

/**
 * The curves with every curve after the curves it needs (its discounting curve, its basis swaps'
 * other curves), in document order otherwise (a depth-first topological order); curves that need
 * each other in a circle are an error naming them.
 */
function buildOrder(curves: readonly WorkspaceCurve[], errors: CoreError[]): readonly WorkspaceCurve[] | null {
  const byName = new Map(curves.map((c) => [c.name, c]));
  const done = new Set<string>();
  const order: WorkspaceCurve[] = [];
  const path: WorkspaceCurve[] = [];
  const visit = (c: WorkspaceCurve): boolean => {
    if (done.has(c.name)) return true;
    if (path.includes(c)) {
      const cycle = [...path.slice(path.indexOf(c)), c].map((x) => `"${x.name}"`);
      errors.push(coreError('schema', `curves[${c.position}]`, `the curves ${cycle.join(' -> ')} each need the next built first (discountCurve, or a basis swap's against), in a circle, so none can be built first; discount one of them on "${DEFAULT_CURVE_NAME}" or a discounting curve, or quote the basis on the other curve`));
      return false;
    }
    path.push(c);
    for (const n of needs(c)) if (!visit(byName.get(n)!)) return false;
    path.pop();
    done.add(c.name);
    order.push(c);
    return true;
  };
  for (const c of curves) if (!visit(c)) return null;
  return order;
}
