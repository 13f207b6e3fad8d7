import type { Curve } from '../curve/curve.ts';
import { readNamedCurves, type WorkspaceCurve } from '../document/namedCurves.ts';
import { validateWorkspace, WORKSPACE_FORMAT, WORKSPACE_VERSION } from '../document/validate.ts';
import type { CoreError } from '../result.ts';
import { exactDecimal, nearestDouble } from '../input/decimalText.ts';
import { QUOTE_VALUE_FIELDS } from '../kinds/registry.ts';
import { isPlainObject } from '../document/plainObject.ts';
import { buildNamedCurves, type NamedCurveBuild } from './namedCurveBuild.ts';

/** The workbench's named curves, read and built. */
export interface WorkbenchCurves {
  /** Each named curve's build, in the document's order. */
  readonly curves: readonly NamedCurveBuild[];
  /**
   * What the reader refused (a name used twice, a projection curve without a discounting curve, a
   * curve discounted on one that does not exist, a circle: then `curves` is empty) and each named
   * curve's quote errors (that quote is left out of its curve), each naming `curves[i]` and the field.
   */
  readonly errors: readonly CoreError[];
  /**
   * The named curves as read (build order, with their roles and own workspaces): put on the
   * default curve's workspace as its `curves`, it is the document applyScenarioOnCurve moves.
   * Absent when nothing was read.
   */
  readonly read?: readonly WorkspaceCurve[];
}

/** What the named curves read from the workbench document (its `curves`, as given, and what they share with the default curve). */
export interface WorkbenchCurveInputs {
  readonly settlement: string;
  readonly calendars?: unknown;
  readonly customCalendars?: unknown;
  readonly curves?: readonly unknown[] | undefined;
}

/**
 * Reads and builds a workbench document's named curves as the `curve` command does: the
 * document's `curves` validated by readNamedCurves with the valuation date and calendars shared,
 * then buildNamedCurves after the default curve `defaultCurve` (the workbench's own build, null
 * when it did not build), quotes with an error left out (the workbench builds with skipInvalid).
 * Nothing here changes the document.
 */
export function buildWorkbenchCurves(doc: WorkbenchCurveInputs, defaultCurve: Curve | null): WorkbenchCurves {
  if (doc.curves === undefined) return { curves: [], errors: [] };
  const hasEntries = (x: unknown): boolean => typeof x === 'object' && x !== null && Object.keys(x).length > 0;
  const engine: Record<string, unknown> = {
    format: WORKSPACE_FORMAT,
    version: WORKSPACE_VERSION,
    valuationDate: doc.settlement,
    ...(hasEntries(doc.calendars) ? { calendars: doc.calendars } : {}),
    ...(hasEntries(doc.customCalendars) ? { customCalendars: doc.customCalendars } : {}),
    quotes: [],
    curves: doc.curves,
  };
  const read = validateWorkspace(engine, readNamedCurves);
  if (read.workspace === null) return { curves: [], errors: read.errors };
  const built = buildNamedCurves(read.workspace, defaultCurve, { skipInvalid: true });
  const position = new Map((read.workspace.curves ?? []).map((c) => [c.name, c.position]));
  return { curves: [...built].sort((x, y) => position.get(x.name)! - position.get(y.name)!), errors: read.errors, read: read.workspace.curves ?? [] };
}

/** The field a named curve's quote (as the file gives it) holds its value in (`rate`, `price`, `cleanPrice`...), or null when it has none. */
export function namedQuoteValueField(q: unknown): string | null {
  if (!isPlainObject(q)) return null;
  return QUOTE_VALUE_FIELDS.find((f) => q[f] !== undefined) ?? null;
}

/**
 * The named curves with the value of quote `k` of the curve `name` set from typed text: a plain
 * decimal in the file's unit (0.0263 for 2.63%, 99.25 per 100) becomes the double nearest it
 * (as the sheet reads a cell); text that is no number is kept as typed, so nothing typed is lost
 * and the reader names the field and what is wrong. Every other entry is the very same object.
 * Unchanged (the same array) when the curve, quote or value field is not there.
 */
export function setNamedQuoteValue(curves: readonly unknown[], name: string, k: number, text: string): readonly unknown[] {
  const i = curves.findIndex((c) => isPlainObject(c) && c.name === name);
  const c = curves[i];
  if (!isPlainObject(c) || !Array.isArray(c.quotes)) return curves;
  const q: unknown = c.quotes[k];
  const field = namedQuoteValueField(q);
  if (field === null || !isPlainObject(q)) return curves;
  const d = exactDecimal(text.trim());
  const value = d === null ? text : nearestDouble(d, 0);
  const quotes = c.quotes.map((x, j) => (j === k ? { ...q, [field]: value } : x));
  return curves.map((x, j) => (j === i ? { ...c, quotes } : x));
}
