import { applyScenarioOnCurve, buildWorkbenchCurves, WORKSPACE_FORMAT, WORKSPACE_VERSION, isPlainObject, type WorkbenchCurveInputs, type WorkbenchCurves } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { curveChoice } from './curveChoice.ts';
import { CurvePicker, ShownCurveNote } from './CurvePicker.tsx';
import { SpreadView } from './SpreadView.tsx';
import './namedCurves.css';

/**
 * The build the charts and tables show: `result` (the default curve, the sheet's) unless the
 * view's chosen curve is a named curve, then that curve's build, with its own quotes as the rows
 * the tables and chart markers count (a named curve's quotes are not sheet rows: `rows` is empty,
 * and quote n is row n of its own list). The method overlay redraws a discounting or government
 * curve under the other methods from its own document; a projection curve's swaps need its
 * discounting curve, so it gets no overlay (an empty market).
 */
export function shownBuild(result: WorkbenchBuild, named: WorkbenchCurves, doc: WorkbenchCurveInputs, view: unknown): WorkbenchBuild {
  const choice = curveChoice(view, named.curves.map((c) => c.name));
  const n = named.curves.find((c) => c.name === choice.shown);
  if (!n) return result;
  const entry = (doc.curves ?? []).find((c) => isPlainObject(c) && c.name === n.name) as Record<string, unknown> | undefined;
  const own = {
    format: WORKSPACE_FORMAT,
    version: WORKSPACE_VERSION,
    valuationDate: doc.settlement,
    ...(isPlainObject(doc.calendars) && Object.keys(doc.calendars).length > 0 ? { calendars: doc.calendars } : {}),
    ...(isPlainObject(doc.customCalendars) && Object.keys(doc.customCalendars).length > 0 ? { customCalendars: doc.customCalendars } : {}),
    ...(entry?.curve === undefined ? {} : { curve: entry.curve }),
    quotes: n.role === 'projection' || !Array.isArray(entry?.quotes) ? [] : entry.quotes,
  };
  const count = n.build.workspace?.quoteCount ?? 0;
  return {
    conversion: { doc: own, rowOfQuote: Array.from({ length: count }, (_, i) => i), rows: [], invalidRows: 0, blankRows: 0, notes: [] },
    build: n.build,
    rowIssues: [],
    invalidCount: n.build.leftOut.length,
    disabledCount: 0,
    curveName: n.name,
    whole: { base: result, inputs: doc },
    fatal: n.build.curve ? null : n.build.errors[0]?.message ?? `the curve "${n.name}" did not build`,
  };
}

/** applyScenarioOnCurve travels with the kit (hooks/useNamedCurves.ts puts it on the build shown), so the first screen's chart overlay does not carry it. */
export const NAMED_CURVES_KIT = { buildWorkbenchCurves, shownBuild, applyScenarioOnCurve, CurvePicker, ShownCurveNote, SpreadView };
export type NamedCurvesKit = typeof NAMED_CURVES_KIT;
