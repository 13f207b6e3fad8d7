import { useMemo } from 'react';
import { buildCurve, CurveBuilder, type BuildOptions, type CurveBuild, type NamedCurveBuild, type OvernightKit, type Result, type Scenario, type ScenarioCurve, type WorkbenchCurveInputs } from '../core/index.ts';
import { loadedOvernightKit, needsOvernightKit, useOvernightKit, workbenchBuildOptions } from './overnightKit.ts';
import {
  isQuoteUnitMode,
  parseRow,
  QUOTE_UNIT_MODES,
  rowIssuesFromEngine,
  toEngineDocument,
  type EngineConversion,
  type InputConventions,
  type QuoteRow,
  type QuoteUnitMode,
  type RowIssues,
  type RowParse,
  type WorkbenchDocument,
} from '../core/index.ts';
import { useAppStore } from '../state/store.ts';

/** Parse results by row object: a one-cell edit creates one new row object, so only it is re-parsed. */
const parseCache = new WeakMap<QuoteRow, { mode: QuoteUnitMode; conventions: InputConventions; parse: RowParse }>();
export function parseRowCached(row: QuoteRow, mode: QuoteUnitMode, conventions: InputConventions): RowParse {
  const hit = parseCache.get(row);
  if (hit && hit.mode === mode && hit.conventions.dateOrder === conventions.dateOrder && hit.conventions.decimalMark === conventions.decimalMark) return hit.parse;
  const parse = parseRow(row, mode, conventions);
  parseCache.set(row, { mode, conventions, parse });
  return parse;
}

export interface WorkbenchBuild {
  readonly conversion: EngineConversion;
  readonly build: CurveBuild;
  /** Issues per sheet row: the row's own cell errors merged with the engine's. */
  readonly rowIssues: readonly RowIssues[];
  /** Rows with a wrong cell or refused by the engine (left out of the curve). */
  readonly invalidCount: number;
  /** Rows switched off. */
  readonly disabledCount: number;
  /** A message when there is no curve at all (bad settlement, no valid quote, a failed bootstrap). */
  readonly fatal: string | null;
  /** The named curve built (shownBuild), absent for the default curve, the sheet's. */
  readonly curveName?: string;
  /** With a named curve shown: the default curve's build and the named curves' inputs, so an explanation can build every curve again (under another method). */
  readonly whole?: { readonly base: WorkbenchBuild; readonly inputs: WorkbenchCurveInputs };
  /**
   * With a named curve shown (useNamedCurves): a scenario applied to it on the whole document
   * (applyScenarioOnCurve on the default curve's workspace with the named curves as read, the
   * default curve and every named curve's build), and those builds.
   */
  readonly onCurves?: { readonly move: (s: Scenario, options: BuildOptions, path?: string) => Result<ScenarioCurve>; readonly built: readonly NamedCurveBuild[] };
}

/**
 * The workbench's builder: it keeps the market compiled for the last document, so a number typed
 * into one cell re-quotes the compiled instruments instead of compiling them again (see CurveBuilder).
 */
export const workbenchBuilder = new CurveBuilder();

/** Builds the curve from the document's inputs (engine document, then the workbench builder with skipInvalid). */
export function deriveBuild(
  ws: Pick<WorkbenchDocument, 'quotes' | 'quoteUnit' | 'settlement' | 'curve' | 'calendars' | 'customCalendars' | 'fixings' | 'turns' | 'meetingSteps'> & { readonly display?: Pick<WorkbenchDocument['display'], 'dateOrder' | 'decimalMark'> },
  interpolation?: WorkbenchDocument['curve']['interpolation']): WorkbenchBuild {
  if (!isQuoteUnitMode(ws.quoteUnit)) {
    // A read-only document from another build (see the store's readOnly): its quote unit is not one
    // this build reads, so no cell is read with a guessed unit and there is no curve.
    const conversion = toEngineDocument({ ...ws, quotes: [] });
    const build = buildCurve(conversion.doc, { skipInvalid: true });
    const fatal = `the quote unit ${JSON.stringify(String(ws.quoteUnit)).slice(0, 40)} is not one this build reads (${QUOTE_UNIT_MODES.join(', ')}), so the quotes are not read`;
    return { conversion, build, rowIssues: [], invalidCount: 0, disabledCount: 0, fatal };
  }
  // The default curve alone: named curves (`curves`) are read and built by their own view (features/namedCurves), loaded on first use.
  const { curves: _named, ...single } = ws as typeof ws & { readonly curves?: unknown };
  const conversion = toEngineDocument(single, parseRowCached);
  // The code of turns and steps when it has been loaded (overnightKit.ts); a document without them does not need it.
  const base = workbenchBuildOptions();
  const build = workbenchBuilder.build(conversion.doc, interpolation ? { ...base, interpolation } : base);
  const fromEngine = rowIssuesFromEngine(
    [...build.errors, ...build.warnings.filter((w) => w.code === 'skipped' || w.code === 'negative-forward' || w.code === 'spot-gap').map((w) => ({ ...w, message: w.message.replace(/^skipped: /, '') }))],
    conversion.rowOfQuote,
  );
  // A negative forward is a warning on the quote's value (its rate, or its price when it is quoted
  // by price), the cell that causes it, not on its kind (where an engine message without a field
  // lands); a spot gap is a warning on the maturity (the tenor that starts at spot).
  for (const w of build.warnings) {
    if ((w.code !== 'negative-forward' && w.code !== 'spot-gap') || w.quote === null) continue;
    const row = conversion.rowOfQuote[w.quote];
    const cur = row === undefined ? undefined : fromEngine.get(row);
    if (row === undefined || !cur?.kind) continue;
    const typed = ws.quotes[row];
    const cell = w.code === 'spot-gap' ? 'maturity' : typed && typed.rate.trim() !== '' ? 'rate' : typed && typed.price.trim() !== '' ? 'price' : 'kind';
    const { kind, ...rest } = cur;
    fromEngine.set(row, { ...rest, [cell]: { severity: 'warning', message: kind.message } });
  }
  const rowIssues = conversion.rows.map((p, i) => ({ ...(fromEngine.get(i) ?? {}), ...p.issues }));
  const engineInvalid = build.leftOut.filter((l) => l.reason === 'invalid').length;
  const disabledCount = ws.quotes.filter((r) => !r.enabled).length;
  let fatal: string | null = null;
  if (!build.curve) {
    // A document's error first; the engine's quotes[i] is the sheet's row rowOfQuote[i] + 1 (in a document's error too: a turn solved from a quote).
    fatal = (build.errors.find((e) => e.quote === null) ?? build.errors[0])?.message.replace(/quotes\[(\d+)\]/g, (_, q: string) => `row ${(conversion.rowOfQuote[Number(q)] ?? 0) + 1}`) ?? 'no curve';
  }
  return { conversion, build, rowIssues, invalidCount: conversion.invalidRows + engineInvalid, disabledCount, fatal };
}

/** What the base build reads from the document (the store's objects, compared by identity). */
interface BuildInputs {
  readonly quotes: WorkbenchDocument['quotes'];
  readonly quoteUnit: WorkbenchDocument['quoteUnit'];
  readonly settlement: WorkbenchDocument['settlement'];
  readonly curve: WorkbenchDocument['curve'];
  readonly calendars: WorkbenchDocument['calendars'];
  readonly customCalendars: WorkbenchDocument['customCalendars'];
  readonly fixings: WorkbenchDocument['fixings'];
  readonly turns: WorkbenchDocument['turns'];
  readonly meetingSteps: WorkbenchDocument['meetingSteps'];
  /** The code of turns and steps, once loaded (so its arrival derives the build again). */
  readonly kit: OvernightKit | null;
  readonly dateOrder: WorkbenchDocument['display']['dateOrder'];
  readonly decimalMark: WorkbenchDocument['display']['decimalMark'];
}

/** The last base build and the inputs it was derived from. */
let lastBase: { readonly inputs: BuildInputs; readonly result: WorkbenchBuild } | null = null;

const sameInputs = (a: BuildInputs, b: BuildInputs): boolean =>
  a.quotes === b.quotes && a.quoteUnit === b.quoteUnit && a.settlement === b.settlement && a.curve === b.curve && a.calendars === b.calendars && a.customCalendars === b.customCalendars && a.fixings === b.fixings && a.turns === b.turns && a.meetingSteps === b.meetingSteps && a.kit === b.kit && a.dateOrder === b.dateOrder && a.decimalMark === b.decimalMark;

/** deriveBuild of these inputs, or the last result when they are the very same objects (a pure function's result, reused). */
function baseBuild(inputs: BuildInputs): WorkbenchBuild {
  if (lastBase && sameInputs(lastBase.inputs, inputs)) return lastBase.result;
  const { quotes, quoteUnit, settlement, curve, calendars, customCalendars, fixings, turns, meetingSteps, dateOrder, decimalMark } = inputs;
  const result = deriveBuild({
    quotes,
    quoteUnit,
    settlement,
    curve,
    ...(calendars === undefined ? {} : { calendars }),
    ...(customCalendars === undefined ? {} : { customCalendars }),
    ...(fixings === undefined ? {} : { fixings }),
    ...(turns === undefined ? {} : { turns }),
    ...(meetingSteps === undefined ? {} : { meetingSteps }),
    display: { dateOrder, decimalMark } });
  lastBase = { inputs, result };
  return result;
}

/** The base build of a document, as useCurveBuild derives it (reused while its inputs are the same objects). */
export const baseBuildOf = (ws: WorkbenchDocument): WorkbenchBuild =>
  baseBuild({ quotes: ws.quotes, quoteUnit: ws.quoteUnit, settlement: ws.settlement, curve: ws.curve, calendars: ws.calendars, customCalendars: ws.customCalendars, fixings: ws.fixings, turns: ws.turns, meetingSteps: ws.meetingSteps, kit: loadedOvernightKit(), dateOrder: ws.display.dateOrder, decimalMark: ws.display.decimalMark });

/** The base curve of the workspace, rebuilt only when its inputs change. */
export function useCurveBuild(): WorkbenchBuild {
  const quotes = useAppStore((s) => s.workspace.quotes);
  const quoteUnit = useAppStore((s) => s.workspace.quoteUnit);
  const settlement = useAppStore((s) => s.workspace.settlement);
  const curve = useAppStore((s) => s.workspace.curve);
  const calendars = useAppStore((s) => s.workspace.calendars);
  const customCalendars = useAppStore((s) => s.workspace.customCalendars);
  const fixings = useAppStore((s) => s.workspace.fixings);
  const turns = useAppStore((s) => s.workspace.turns);
  const meetingSteps = useAppStore((s) => s.workspace.meetingSteps);
  const kit = useOvernightKit(needsOvernightKit({ turns, meetingSteps }));
  const dateOrder = useAppStore((s) => s.workspace.display.dateOrder);
  const decimalMark = useAppStore((s) => s.workspace.display.decimalMark);
  return useMemo(
    () => baseBuild({ quotes, quoteUnit, settlement, curve, calendars, customCalendars, fixings, turns, meetingSteps, kit, dateOrder, decimalMark }),
    [quotes, quoteUnit, settlement, curve, calendars, customCalendars, fixings, turns, meetingSteps, kit, dateOrder, decimalMark],
  );
}
