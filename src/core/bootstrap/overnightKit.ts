/**
 * The code of turns and meeting steps, handed to the build as a value (`BuildOptions.overnight`)
 * rather than imported by it: a document without turns or steps never needs it, so the workbench
 * loads it on first use (a module of its own) and the first screen stays small. The curve command
 * and the tests pass `OVERNIGHT_KIT` itself. Nothing here keeps state.
 */
import type { Workspace } from '../document/types.ts';
import type { Instrument } from '../instruments/instrument.ts';
import type { CoreError } from '../result.ts';
import type { IsoDate } from '../time/date.ts';
import type { BootstrapSettings } from './bootstrap.ts';
import { stepNodes, type MeetingNode, type StepNodes } from './meetingSteps.ts';
import { resolveTurns, turnForward, turnLn, turnsBeyond, withTurns, type TurnCalendars, type TurnSpan } from './turns.ts';
import { solveTurnSpreads, type TurnedBootstrap } from './turnSolve.ts';
import type { BootstrapOutcome } from './bootstrap.ts';

export interface OvernightKit {
  /** The bootstrap settings with the workspace's turns and (steps on) effective dates, or the errors naming them. */
  /** `time`: the curve's clock, years from the valuation date to a date (the one the instruments were compiled on). */
  readonly settingsFor: (ws: Workspace, plain: BootstrapSettings, time: (date: IsoDate) => number, calendars: TurnCalendars) => { readonly settings: BootstrapSettings; readonly errors: readonly CoreError[] };
  readonly withTurns: (instruments: readonly Instrument[], spans: readonly TurnSpan[]) => readonly Instrument[];
  readonly turnsBeyond: (spans: readonly TurnSpan[], lastT: number, lastDate: IsoDate) => CoreError[];
  readonly turnLn: (spans: readonly TurnSpan[], t: number) => number;
  readonly turnForward: (spans: readonly TurnSpan[], t: number) => number;
  readonly stepNodes: (instruments: readonly Instrument[], meetings: readonly MeetingNode[], settlement: IsoDate) => StepNodes | CoreError[];
  /** The curve with each turn that names a quote (`solveFrom`) solved from it (turnSolve.ts), around `bootstrap`. */
  readonly solveTurnSpreads: (given: BootstrapSettings, market: readonly Instrument[], bootstrap: TurnedBootstrap) => BootstrapOutcome;
}

/**
 * The bootstrap settings with the workspace's turns (placed on the curve's axis, on the business
 * days of each turn's calendar) and, when meeting steps are on, its effective dates as nodes.
 */
function settingsFor(ws: Workspace, plain: BootstrapSettings, time: (date: IsoDate) => number, calendars: TurnCalendars): { settings: BootstrapSettings; errors: CoreError[] } {
  const { spans, errors } = resolveTurns(ws.turns ?? [], ws.settlement, time, ws.quotes, calendars);
  const steps = ws.meetingSteps;
  const meetings: MeetingNode[] | undefined = steps?.on === true ? steps.effectiveDates.map((date, index) => ({ date, index, t: time(date) })) : undefined;
  let settings: BootstrapSettings = spans.length > 0 || meetings !== undefined ? { ...plain, kit: OVERNIGHT_KIT } : plain;
  if (spans.length > 0) settings = { ...settings, turns: spans };
  if (meetings !== undefined) settings = { ...settings, meetings };
  return { settings, errors };
}

export const OVERNIGHT_KIT: OvernightKit = { settingsFor, withTurns, turnsBeyond, turnLn, turnForward, stepNodes, solveTurnSpreads };
