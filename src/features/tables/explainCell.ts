import {
  applyScenario,
  coreError,
  fail,
  buildCurve,
  effectDates,
  explainScenarioChange,
  explainMeetingStep,
  discountOn,
  explained,
  explanationSections,
  explanationText,
  forwardOn,
  forwardParRateOn,
  instantaneousForwardOn,
  INTERPOLATORS,
  buildWorkbenchCurves,
  isPlainObject,
  snapshotDocument,
  explainReferencePoint,
  marketDate,
  parseTenor,
  parYieldOn,
  topParQuoteInfluences,
  topQuoteInfluences,
  valueUnderEachMethod,
  zeroOn,
  type BuildOptions,
  type Compounding,
  type Curve,
  type CurveDayCount,
  type EffectConventions,
  type EffectField,
  type Scenario,
  type InterpolationId,
  type DisplaySettings,
  type Explanation,
  type ExplanationSink,
  type ExplanationSection,
  type FixedLegConvention,
  type MethodValue,
  type Result,
  type Snapshot,
  type ReferenceCurve,
  type CurveBuild,
  type WorkbenchCurveInputs,
} from '../../core/index.ts';
import { workbenchBuildOptions } from '../../hooks/overnightKit.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { explainRollCell, type RollCell } from '../roll/explainRollCell.ts';
import { applyToShown } from '../scenarios/applyShown.ts';
import { explainBondCell, type BondCell } from '../risk/explainBondCell.ts';
import { explainDifferenceCell, explainReferenceCell, type DifferenceCell, type ReferenceCell } from '../snapshots/explainDifferenceCell.ts';
import { explainSpreadCell, type SpreadCell } from '../namedCurves/explainSpreadCell.ts';
import { explainTurnCell, type TurnCell } from '../overnight/explainTurnCell.ts';
import { explainSensitivityCell, type SensitivityCell } from '../risk/explainSensitivityCell.ts';
import { explainQuoteCell, type QuoteCheckCell } from './explainQuoteCell.ts';
import { explainFitCell, type FitCell } from '../fit/explainFitCell.ts';

export type { BondCell } from '../risk/explainBondCell.ts';
export type { DifferenceCell, ReferenceCell } from '../snapshots/explainDifferenceCell.ts';
export type { SpreadCell } from '../namedCurves/explainSpreadCell.ts';
export type { TurnCell } from '../overnight/explainTurnCell.ts';
export type { SensitivityCell } from '../risk/explainSensitivityCell.ts';
export type { QuoteCheckCell } from './explainQuoteCell.ts';
export type { FitCell } from '../fit/explainFitCell.ts';

/** The key-maturity cells that explain themselves. */
export type KeyField = 'discount' | 'zero' | 'par' | 'forward';

/** Which cell: its row's tenor and its column. */
export interface KeyCell {
  readonly tenor: string;
  readonly field: KeyField;
}

/**
 * A number given by its dates (the forward strip and grid, the calculator, the charts' readout): a
 * discount factor or zero rate on `start`, a forward from `start` to `end` in the display
 * convention, a forward par rate from `start` to `end` on the swap fixed leg `leg`, the par yield to
 * `start` (display frequency, ACT/ACT-ICMA) or the instantaneous forward at `start`. Read on the
 * build's curve, or on a chart line's own curve: the workspace built under `method`, the shown curve
 * moved by `scenario` (as the charts' overlay moves it, applyToShown), or `snapshot` rebuilt from
 * its inputs.
 */
export interface DatedCell {
  readonly field: 'discount' | 'zero' | 'forward' | 'forwardPar' | 'par' | 'inst';
  readonly method?: InterpolationId;
  readonly scenario?: Scenario;
  readonly snapshot?: Snapshot;
  /** The reference curve's line: its point as the file gives it (explainReferencePoint); no quotes or methods. */
  readonly refCurve?: ReferenceCurve;
  /** A zero rate or forward in these conventions instead of the display's (the reference table's, in the reference's). */
  readonly compounding?: Compounding;
  readonly dayCount?: CurveDayCount;
  /** ISO date: the discount factor's or zero rate's date, or the forward's start. */
  readonly start: string;
  /** ISO date: the forward's end (unused for a zero rate); a forward without one runs the display's forward tenor. */
  readonly end?: string;
  /** The fixed leg of a forward par rate. */
  readonly leg?: FixedLegConvention;
  /** The panel's heading, e.g. "3M forward rate, period 4 of the strip"; by default the number's name and dates. */
  readonly title?: string;
}

/**
 * A change in the Scenarios table: the zero rate or forward at key maturity `tenor` under
 * `scenario`, in bp against the base curve, in the table's conventions. The scenario curve is
 * made again from the build as the table makes it (applyScenario with the same options).
 */
export interface ChangeCell {
  readonly change: {
    readonly scenario: Scenario;
    readonly tenor: string;
    readonly field: EffectField;
    readonly conventions: EffectConventions;
    readonly buildOptions: BuildOptions;
  };
}

/** A meeting's implied step in the Overnight curve section: its effective date; with `level`, the level before or after it. */
export interface StepCell {
  readonly step: string;
  readonly level?: 'before' | 'after';
}

/** Any number the explanation panel explains. */
export type ExplainCell = KeyCell | DatedCell | ChangeCell | RollCell | BondCell | StepCell | DifferenceCell | ReferenceCell | SpreadCell | SensitivityCell | QuoteCheckCell | FitCell | TurnCell;

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
  /** The definition, inputs, steps, quotes and methods as lines (full precision), as Copy as text writes them. */
  readonly sections: readonly ExplanationSection[];
  readonly quotes: readonly CellQuote[];
  /** What the quotes' sensitivities are of, when not the number itself, or why there are none. */
  readonly quotesNote: string | null;
  readonly methods: readonly MethodValue[];
  /** The explanation as plain text (Copy as text). */
  readonly text: string;
}

const FIELD_WORDS: Readonly<Record<KeyField, string>> = { discount: 'discount factor', zero: 'zero rate', par: 'par yield', forward: 'forward rate' };

/** Why a cell cannot be explained when the build has no curve: the build's own reason. */
export const noCurve = (result: WorkbenchBuild): Result<never> => fail(coreError('schema', '', result.fatal ?? 'no curve'));

/** The sheet row of a quote index of the build (the engine document's order), as people count it. */
const rowWords = (row: number | null): string => (row === null ? 'a quote' : `row ${row + 1}`);

/**
 * The explanation of one key-maturity cell, read as keyMaturityRows reads it (same dates, same
 * queries), with the quotes it depends on most and its value under each method. An error value
 * when the cell has no number (beyond the curve without extrapolation).
 */
export function explainKeyCell(result: WorkbenchBuild, display: DisplaySettings, cell: ExplainCell): Result<CellExplanation> {
  if ('change' in cell) return explainChangeCell(result, cell.change);
  if ('roll' in cell) return explainRollCell(result, cell.roll);
  if ('bond' in cell) return explainBondCell(result, cell.bond);
  if ('step' in cell) return explainStepCell(result, cell.step, cell.level);
  if ('difference' in cell) return explainDifferenceCell(result, cell.difference);
  if ('reference' in cell) return explainReferenceCell(result, cell.reference);
  if ('spread' in cell) return explainSpreadCell(result, display, cell.spread);
  if ('sensitivity' in cell) return explainSensitivityCell(result, cell.sensitivity);
  if ('turn' in cell) return explainTurnCell(result, cell.turn);
  if ('quoteCheck' in cell) return explainQuoteCell(result, cell.quoteCheck);
  if ('fit' in cell) return explainFitCell(result, cell.fit);
  const curve = result.build.curve;
  if (!curve) return noCurve(result);
  // The line's curve: built under a method (the build's own by default), a snapshot's, or moved by a scenario.
  const { method, scenario, snapshot, refCurve: reference } = 'tenor' in cell ? ({} as Partial<DatedCell>) : cell;
  if (reference) {
    const { start, field } = cell as DatedCell;
    const fwd = field === 'forward';
    const r = explainReferencePoint(reference, curve, start, display.compounding, display.dayCount, fwd ? parseTenor(display.forwardTenor)! : undefined);
    return r.ok ? cellOf(result, `Reference ${fwd ? `${display.forwardTenor} forward rate starting` : 'zero rate on'} ${start}`, r.value, { ok: true, value: [] }, 'none: the file gives it, no quote or method', []) : r;
  }
  const doc = snapshot && snapshotDocument(snapshot);
  const opts = workbenchBuildOptions();
  const buildOf = (m?: InterpolationId): CurveBuild => (doc ? buildCurve(doc, m ? { interpolation: m } : {}) : m ? buildUnder(result, m, opts) : result.build);
  const lineOf = (b: CurveBuild, shown: boolean): Result<Curve> => {
    if (!b.curve) return b.errors.length ? fail(...b.errors) : noCurve(result);
    if (!scenario) return { ok: true, value: b.curve };
    const moved = shown ? applyToShown(scenario, result, opts) : applyScenario(scenario, b.workspace!, b.curve, { ...opts, interpolation: b.curve.interpolation });
    return moved.ok ? { ok: true, value: moved.value.curve } : moved;
  };
  const own = buildOf(method);
  const line = lineOf(own, !method && !doc);
  if (!line.ok) return line;
  const on = line.value;
  let date: string;
  let end: string;
  if ('tenor' in cell) {
    const tenor = parseTenor(cell.tenor);
    if (!tenor) return { ok: false, errors: [{ path: 'tenor', quote: null, code: 'schema', message: `"${cell.tenor}" is not a tenor` }] };
    date = marketDate(curve.settlement, tenor);
    end = marketDate(date, parseTenor(display.forwardTenor) ?? { n: 3, unit: 'M' });
  } else {
    date = cell.start;
    end = cell.end ?? (cell.field === 'forward' ? marketDate(date, parseTenor(display.forwardTenor) ?? { n: 3, unit: 'M' }) : date);
  }
  const { compounding: c, dayCount: dc, parFrequency } = { ...display, ...('tenor' in cell ? {} : cell) };
  const leg = 'tenor' in cell ? undefined : cell.leg;
  // One query for the number on any curve, traced when given a sink (the panel's number is the table's).
  const read = (on: Curve, sink?: ExplanationSink): Result<number> => {
    const r =
      cell.field === 'discount' ? discountOn(on, date, 'date', sink)
      : cell.field === 'zero' ? zeroOn(on, date, c, dc, 'date', sink)
      : cell.field === 'par' ? parYieldOn(on, date, parFrequency, 'maturity', sink)
      : cell.field === 'inst' ? instantaneousForwardOn(on, date, 'date', sink)
      : cell.field === 'forwardPar' ? forwardParRateOn(on, date, end, leg?.frequency ?? 1, leg?.dayCount ?? '30/360', leg?.eom ?? false, 'forward', sink)
      : forwardOn(on, date, end, c, dc, 'forward', sink);
    if (!r.ok) return r;
    const v = r.value as { discount?: number; zero?: number; rate?: number; forward?: number };
    return { ok: true, value: (cell.field === 'discount' ? v.discount : cell.field === 'zero' ? v.zero : v.forward ?? v.rate)! };
  };
  const given =
    !('tenor' in cell) ? (cell.field === 'par' ? undefined : { date: cell.start, start: cell.start, end })
    : cell.field === 'par' ? { start: 'valuation date', end: cell.tenor }
    : { date: cell.tenor, start: cell.tenor, end: `${display.forwardTenor} after the start` };
  const traced = explained((sink) => read(on, sink), given);
  if (!traced.ok) return traced;
  const explanation = traced.value.explanation;
  const instruments = own.instruments;
  // The quotes of the line's own build: a scenario's read on the base curve (the note says so); a snapshot has none on the sheet.
  const q = scenario ? curve : on;
  let quotesNote: string | null = scenario ? "of the base curve's rate: the scenario curve moves with these quotes as the base does" : null;
  let influences: Influences;
  if (doc) ((influences = { ok: true, value: [] }), (quotesNote = "none: the snapshot's quotes are frozen, not on the sheet"));
  else if (cell.field === 'inst') {
    influences = topQuoteInfluences(q, instruments, date, marketDate(date, { n: 1, unit: 'D' }), 'continuous', q.dayCount);
    quotesNote = `of the 1-day forward from ${date}, its limit`;
  } else if (cell.field === 'par') influences = topParQuoteInfluences(q, instruments, q.settlement, date, parFrequency, 'ACT/ACT-ICMA');
  else if (cell.field === 'forwardPar') influences = topParQuoteInfluences(q, instruments, date, end, leg?.frequency ?? 1, leg?.dayCount ?? '30/360', leg?.eom ?? false);
  else if (cell.field === 'discount') {
    influences = topQuoteInfluences(q, instruments, q.settlement, date, 'continuous', q.dayCount);
    quotesNote = `of its continuously compounded zero rate on ${curve.dayCount} (DF = exp(-z t))`;
  } else if (cell.field === 'zero') influences = topQuoteInfluences(q, instruments, q.settlement, date, c, dc);
  else influences = topQuoteInfluences(q, instruments, date, end, c, dc);
  // The line's document built under each method, as the workbench builds it (skipping wrong rows), the scenario applied on each.
  const methods = valueUnderEachMethod(on.interpolation, (m) => (scenario ? ((b) => (b.ok ? { curve: b.value, errors: [] } : { curve: null, errors: b.errors }))(lineOf(buildOf(m), false)) : buildOf(m)), read);
  const of = method ? ` (${INTERPOLATORS[method].label})` : scenario ? ` under ${scenario.name}` : snapshot ? ` on snapshot ${snapshot.name}` : '';
  const title =
    !('tenor' in cell)
      ? (cell.title ??
        (cell.field === 'zero' ? `Zero rate on ${date}` : cell.field === 'par' ? `Par yield to ${date}` : cell.field === 'inst' ? `Instantaneous forward on ${date}` : `${display.forwardTenor} forward rate starting ${date} (${date} to ${end})`) + of)
    : cell.field === 'forward' ? `${display.forwardTenor} forward rate starting ${cell.tenor} (${date} to ${end})` : `${cell.tenor} ${FIELD_WORDS[cell.field]} (${date})`;
  return cellOf(result, title, explanation, influences, quotesNote, methods);
}

export type Influences = Result<readonly { index: number; kind: string; maturity: string; yieldLabel: string; bpPerBp: number; curve?: string }[]>;

/**
 * A cell's explanation as the panel and Copy as text show it: the quotes behind it, each by its
 * sheet row (`note` says what their sensitivities are of; their error, when there are none), and
 * the number under each method (none listed when not given). When the number reads more than one
 * curve, a quote or node of a curve other than `own` (the name of the sheet's curve there) is named
 * by its curve and position instead of a row.
 */
export function cellOf(result: WorkbenchBuild, title: string, explanation: Explanation, influences: Influences, note: string | null, methods: readonly MethodValue[], own?: string): Result<CellExplanation> {
  const mine = (curve?: string): boolean => curve === undefined || curve === own;
  const rowOf = (index: number, curve?: string): number | null => (mine(curve) ? result.conversion.rowOfQuote[index] ?? null : null);
  const quoteLabel = (index: number, curve?: string): string => (mine(curve) ? rowWords(rowOf(index)) : `${curve} quote ${index + 1}`);
  const quotesNote = influences.ok ? note : influences.errors[0]!.message;
  const listed = (influences.ok ? influences.value : []).map((q) => ({ row: rowOf(q.index, q.curve), kind: mine(q.curve) ? q.kind : `${quoteLabel(q.index, q.curve)}, ${q.kind}`, maturity: q.maturity, yieldLabel: q.yieldLabel, bpPerBp: q.bpPerBp, at: `${quoteLabel(q.index, q.curve)}, ${q.kind}` }));
  const quotes = listed.map(({ at: _, ...q }) => q);
  const extras = {
    title,
    quoteLabel,
    topQuotes: listed.map((q) => ({ label: `${q.at} ${q.maturity}, moved through its ${q.yieldLabel}`, bpPerBp: q.bpPerBp })),
    ...(quotesNote === null ? {} : { topQuotesNote: quotesNote }),
    ...(methods.length > 0 ? { methods } : {}),
  };
  return { ok: true, value: { title, explanation, sections: explanationSections(explanation, extras), quotes, quotesNote, methods, text: explanationText(explanation, extras) } };
}

/**
 * A cell's number read again on the workspace built under each method (buildUnder with `options`,
 * the workbench's by default), the build's own method marked current.
 */
export function underEachMethod(result: WorkbenchBuild, read: (curve: Curve) => Result<number>, options?: BuildOptions): MethodValue[] {
  return valueUnderEachMethod(result.build.curve!.interpolation, (method) => buildUnder(result, method, options), read);
}

/** The default curve and every named curve of `inputs` built under `method`, as the workbench builds them (the named curves each set to that method). */
export function curvesUnder(result: WorkbenchBuild, inputs: WorkbenchCurveInputs, method: InterpolationId) {
  const base = buildUnder(result, method);
  const curves = inputs.curves?.map((c) => (isPlainObject(c) ? { ...c, curve: { ...(isPlainObject(c.curve) ? c.curve : {}), interpolation: method } } : c));
  return { base, named: buildWorkbenchCurves({ ...inputs, curves }, base.curve) };
}

/**
 * The workspace's document built under `method`, as the workbench builds it: skipping wrong rows,
 * with the turns and meeting steps' code when loaded (without it such a document builds no curve).
 */
export function buildUnder(result: WorkbenchBuild, method: InterpolationId, options: BuildOptions = workbenchBuildOptions()) {
  return buildCurve(result.conversion.doc, { ...options, skipInvalid: true, interpolation: method });
}

/**
 * The explanation of a scenario change: the base and scenario rates' explanations and the change in
 * bp (explainScenarioChange); the quotes behind it are those of the base rate (the change is the
 * scenario's shift, which the quotes move only through the curve's shape), and the same change
 * under each method applies the scenario to the base curve built under that method.
 */
function explainChangeCell(result: WorkbenchBuild, c: ChangeCell['change']): Result<CellExplanation> {
  const base = result.build.curve;
  const ws = result.build.workspace;
  if (!base || !ws) return noCurve(result);
  const change = (on: Curve, workspace: typeof ws, method: InterpolationId) => {
    // The shown curve's change as its table moved it (applyToShown: a named curve with the curves it reads); other methods as applyScenario.
    const moved = on === base && result.onCurves ? applyToShown(c.scenario, result, c.buildOptions) : applyScenario(c.scenario, workspace, on, { ...c.buildOptions, interpolation: method });
    return moved.ok ? explainScenarioChange(on, moved.value.curve, c.tenor, c.field, c.conventions) : moved;
  };
  const r = change(base, ws, base.interpolation);
  if (!r.ok) return r;
  const explanation = r.value.explanation;
  const what = c.field === 'zero' ? 'zero rate' : `${c.conventions.forwardTenor} forward rate`;
  const title = `Change of the ${c.tenor} ${what} under ${c.scenario.name} (${explanation.dates[0]!.adjusted})`;
  // The dates the change table reads (explainScenarioChange has already checked the tenor).
  const dates = effectDates(base.settlement, c.tenor, c.conventions)!;
  const conv = c.conventions;
  const influences =
    c.field === 'zero'
      ? topQuoteInfluences(base, result.build.instruments, base.settlement, dates.date, conv.zeroCompounding, conv.zeroDayCount)
      : topQuoteInfluences(base, result.build.instruments, dates.date, dates.end ?? dates.date, conv.forwardCompounding, conv.forwardDayCount);
  const quotesNote = `of the base ${what}: the change is the scenario's shift, and the scenario rate moves with these quotes as the base rate does`;
  // The document is the same under every method (only the interpolation differs), so is its workspace.
  const methods = underEachMethod(
    result,
    (on): Result<number> => {
      const v = change(on, ws, on.interpolation);
      return v.ok ? { ok: true, value: v.value.explanation.value } : v;
    },
    c.buildOptions,
  );
  return cellOf(result, title, explanation, influences, quotesNote, methods);
}

/**
 * The explanation of a meeting's implied step (explainMeetingStep: the table's own computation,
 * traced) with the quotes the step depends on most; no values under other methods, since a stepped
 * curve is log-linear in DF whatever the method (the explanation's formula says so).
 */
function explainStepCell(result: WorkbenchBuild, date: string, level?: 'before' | 'after'): Result<CellExplanation> {
  const r = explainMeetingStep(result.build, date);
  if (!r.ok) return r;
  const v = r.value;
  return level ? cellOf(result, `Overnight level ${level} the step on ${date}`, v[level], v.levelQuotes(level === 'before' ? 0 : 1), null, []) : cellOf(result, `Implied step on ${date}`, v.explanation, v.quotes, null, []);
}
