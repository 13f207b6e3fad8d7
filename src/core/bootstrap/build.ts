import type { Curve, Extrapolation } from '../curve/curve.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { KIND_MODULE_LIST, moduleOf } from '../kinds/registry.ts';
import { compareIso } from '../time/date.ts';
import type { InterpolationId } from '../interpolation/types.ts';
import { coreError, type CoreError, type CoreWarning } from '../result.ts';
import { curveClock, type CurveDayCount } from '../time/dayCount.ts';
import { civilFromIso, isoFromSerial, serialFromIso, type CivilDate, type IsoDate } from '../time/date.ts';
import type { Quote, QuoteKind, Workspace } from '../document/types.ts';
import { validateWorkspace, type CurvesReader, type ValidationOutcome } from '../document/validate.ts';
import type { BootstrapOutcome, BootstrapSettings, Repricing } from './bootstrap.ts';
import { kitMissing } from './bootstrap.ts';
import type { OvernightKit } from './overnightKit.ts';
import { businessCalendar, MAX_CLOSED_RUN, outsideCalendar } from '../time/calendars.ts';
import { bootstrapCurveSet, type CurveSet } from './curveSet.ts';
import type { SpotGap } from './spotBridge.ts';

const NO_CURVES: CurveSet = {};

/** Why a quote of the document is not a node of the curve. */
export interface LeftOut {
  readonly index: number;
  readonly reason: 'disabled' | 'invalid';
  readonly message: string;
}

/**
 * A document's build: the bootstrap's outcome (curve, errors, warnings, repricing, sweeps), its
 * curves by role, and what the document made of its quotes. `curve` is the curve every instrument
 * reads today (discounting and projection), `curves.discount`, or null. `repricing` is in document
 * order here (the bootstrap gives it in pillar order); without a bootstrap (a refused document or
 * market) it is empty and `sweeps` is 0.
 */
export interface CurveBuild extends BootstrapOutcome {
  /** The build's curves by name (CurveSet); one, `discount`, today, none without a curve. */
  readonly curves: CurveSet;
  readonly leftOut: readonly LeftOut[];
  /** The validated workspace (null when the document itself is unusable). */
  readonly workspace: Workspace | null;
  /**
   * The compiled instruments the curve was bootstrapped from, one per pillar in pillar order
   * (empty without a curve). Performance: a caller that re-quotes them (Instrument.requote) and
   * bootstraps again does not compile the market a second time.
   */
  readonly instruments: readonly Instrument[];
  /**
   * The settings `instruments` were bootstrapped with (turns, meeting dates and their code
   * included); absent without a curve. A rebuild with moved quotes (the risk section's) passes them
   * to bootstrapInstruments, so it builds the very curve shown, turns and steps and all.
   */
  readonly settings?: BootstrapSettings;
}

export interface BuildOptions {
  /** Build from the valid quotes, listing the invalid ones as warnings (default false: strict). */
  readonly skipInvalid?: boolean;
  /** Overrides the document's `curve.interpolation`. */
  readonly interpolation?: InterpolationId;
  /** Overrides the document's `curve.extrapolation`. */
  readonly extrapolation?: Extrapolation;
  /**
   * The code of turns and meeting steps (OVERNIGHT_KIT, bootstrap/overnightKit.ts), needed only by a
   * document that has them: without it such a document builds no curve and says why.
   */
  readonly overnight?: OvernightKit;
  /**
   * Reads the document's named curves (`readNamedCurves`, document/namedCurves.ts; the `curve`
   * command passes it). Without it a document with `curves` is refused, naming them (the
   * workbench, which shows one curve).
   */
  readonly readCurves?: CurvesReader;
}

/** Compiles one validated quote against a settlement date and curve day count. */
export function compileQuote(q: Quote, settlement: IsoDate, dayCount: CurveDayCount): Instrument {
  const s = civilFromIso(settlement); // the workspace is validated
  return compileQuoteCivil(q, settlement, curveClock(dayCount, s), s);
}

/**
 * compileQuote with the settlement date parsed and the curve clock made once per market
 * (performance); `m` is the quote's maturity parsed, `shared` what the kind's module made for the
 * market (`QuoteKindModule.share`: a swap ladder's fixed legs).
 */
function compileQuoteCivil(q: Quote, settlement: IsoDate, time: (d: CivilDate) => number, s: CivilDate, m = civilFromIso(q.maturity), shared?: unknown): Instrument {
  return moduleOf(q).compile(q, settlement, s, m, time(m), time, shared);
}

/**
 * A market compiled once (schedules, times, sorting, duplicate check) so that moved quotes
 * rebuild without recompiling: see `rebuildMarket`.
 */
export interface CompiledMarket {
  readonly settlement: IsoDate;
  readonly dayCount: CurveDayCount;
  /** Enabled, valid instruments sorted by pillar time. */
  readonly instruments: readonly Instrument[];
  readonly errors: readonly CoreError[];
  /** Quotes dropped as duplicates (when skipping invalid quotes). */
  readonly duplicates: readonly CoreError[];
}

/** What each kind with a `share` step makes once for the market, from its enabled quotes. */
function shareWork(enabled: readonly Quote[], maturities: readonly CivilDate[], s: CivilDate, time: (d: CivilDate) => number): Partial<Record<QuoteKind, unknown>> {
  const shared: Partial<Record<QuoteKind, unknown>> = {};
  for (const m of KIND_MODULE_LIST) {
    if (!m.share) continue;
    const mine: [Quote, CivilDate][] = [];
    for (let i = 0; i < enabled.length; i++) if (enabled[i]!.kind === m.kind) mine.push([enabled[i]!, maturities[i]!]);
    shared[m.kind] = m.share(s, time, mine);
  }
  return shared;
}

export function compileMarket(settlement: IsoDate, dayCount: CurveDayCount, quotes: readonly Quote[], skipDuplicates: boolean): CompiledMarket {
  const s = civilFromIso(settlement); // the workspace is validated
  const time = curveClock(dayCount, s);
  const enabled = quotes.filter((q) => q.enabled);
  const maturities = enabled.map((q) => civilFromIso(q.maturity));
  const shared = shareWork(enabled, maturities, s, time);
  const compiled: Instrument[] = [];
  for (let i = 0; i < enabled.length; i++) compiled.push(compileQuoteCivil(enabled[i]!, settlement, time, s, maturities[i]!, shared[enabled[i]!.kind]));
  // Documents usually list their quotes by maturity: sort only when they are not in order.
  const byTime = (a: Instrument, b: Instrument) => a.t - b.t || a.index - b.index;
  if (!compiled.every((ins, i) => i === 0 || byTime(compiled[i - 1]!, ins) < 0)) compiled.sort(byTime);
  const instruments: Instrument[] = [];
  const errors: CoreError[] = [];
  const duplicates: CoreError[] = [];
  for (const ins of compiled) {
    const prev = instruments[instruments.length - 1];
    if (prev && ins.t === prev.t) {
      const e = coreError(
        'duplicate-pillar',
        `quotes[${ins.index}].${ins.quote.tenor !== null ? 'tenor' : 'maturity'}`,
        `quotes[${ins.index}] (${ins.kind} ${ins.maturity}) and quotes[${prev.index}] (${prev.kind} ${prev.maturity}) fall on the same point of the curve (t = ${ins.t} years on ${dayCount}); switch one off or remove it`,
        ins.index,
      );
      (skipDuplicates ? duplicates : errors).push(e);
      continue;
    }
    if (ins.t <= 0) {
      errors.push(coreError('before-settlement', `quotes[${ins.index}].maturity`, `quotes[${ins.index}]: maturity ${ins.maturity} is at t = 0 on ${dayCount}; it must be after settlement`, ins.index));
      continue;
    }
    instruments.push(ins);
  }
  return { settlement, dayCount, instruments, errors, duplicates };
}

/**
 * Validates a parsed workspace document and bootstraps its curve. Returns the curve (or null),
 * the errors, the warnings and the quotes left out; never throws on bad input.
 */
export function buildCurve(doc: unknown, options: BuildOptions = {}): CurveBuild {
  return buildValidated(validateWorkspace(doc, options.readCurves), options, compileWorkspace);
}

/** The market of a validated workspace: `compileMarket` of its quotes (or the builder's re-quoted one). */
export type MarketOf = (ws: Workspace, skipDuplicates: boolean) => CompiledMarket;

const compileWorkspace: MarketOf = (ws, skipDuplicates) => compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, skipDuplicates);

/**
 * buildCurve after validation: a refused document gives its errors; otherwise the market made by
 * `marketOf` is bootstrapped (it is not called for a refused document).
 */
export function buildValidated(validation: ValidationOutcome, options: BuildOptions, marketOf: MarketOf): CurveBuild {
  const ws = validation.workspace;
  const empty = { curve: null, curves: NO_CURVES, repricing: [], leftOut: [], warnings: [], instruments: [], sweeps: 0 };
  if (!ws) return { ...empty, errors: validation.errors, workspace: null };
  const skip = options.skipInvalid === true;
  if (validation.errors.length > 0 && !skip) return { ...empty, errors: validation.errors, workspace: ws };
  return buildFromMarket(ws, options, validation.errors, marketOf(ws, skip));
}

/** Builds a validated workspace; `invalid` are the per-quote validation errors being skipped. */
export function buildFromWorkspace(ws: Workspace, options: BuildOptions = {}, invalid: readonly CoreError[] = []): CurveBuild {
  return buildFromMarket(ws, options, invalid, compileWorkspace(ws, options.skipInvalid === true));
}

/** buildFromWorkspace with the workspace's market already made (compiled, or re-quoted by a CurveBuilder). */
function buildFromMarket(ws: Workspace, options: BuildOptions, invalid: readonly CoreError[], market: CompiledMarket): CurveBuild {
  const warnings: CoreWarning[] = [];
  const leftOut: LeftOut[] = [];
  const skipped = new Set<number>();
  for (const e of invalid) {
    warnings.push({ path: e.path, quote: e.quote, code: 'skipped', message: `skipped: ${e.message}` });
    if (e.quote !== null && !skipped.has(e.quote)) {
      skipped.add(e.quote);
      leftOut.push({ index: e.quote, reason: 'invalid', message: e.message });
    }
  }
  for (const q of ws.quotes) {
    if (!q.enabled) leftOut.push({ index: q.index, reason: 'disabled', message: `quotes[${q.index}] is switched off` });
  }
  const plain: BootstrapSettings = {
    settlement: ws.settlement,
    dayCount: ws.curve.dayCount,
    interpolation: options.interpolation ?? ws.curve.interpolation,
    extrapolation: options.extrapolation ?? ws.curve.extrapolation,
  };
  // Turns and meeting steps (absent from a document: the plain settings, today's numbers exactly).
  const shaped =
    (ws.turns?.length ?? 0) === 0 && ws.meetingSteps?.on !== true ? { settings: plain, errors: [] } : options.overnight ? overnightSettings(ws, plain, options.overnight) : { settings: plain, errors: [kitMissing()] };
  const settings = shaped.settings;
  for (const e of market.duplicates) {
    warnings.push({ path: e.path, quote: e.quote, code: 'skipped', message: `skipped: ${e.message}` });
    leftOut.push({ index: e.quote!, reason: 'invalid', message: e.message });
  }
  const base = { leftOut: leftOut.sort((a, b) => a.index - b.index), workspace: ws, instruments: [], sweeps: 0 };
  if (market.errors.length > 0) return { ...base, curve: null, curves: NO_CURVES, errors: market.errors, warnings, repricing: [] };
  if (shaped.errors.length > 0) return { ...base, curve: null, curves: NO_CURVES, errors: shaped.errors, warnings, repricing: [] };
  if (market.instruments.length === 0) {
    return {
      ...base,
      curve: null,
      curves: NO_CURVES,
      errors: [coreError('schema', 'quotes', 'no enabled, valid quote to build a curve from; add at least one quote')],
      warnings,
      repricing: [],
    };
  }
  // Each instrument's pillar is a node of the curve its kind names (today all of `discount`).
  const outcome = bootstrapCurveSet(settings, market.instruments);
  // Performance: the result spelled out, no spreads; repricing (in pillar order) is sorted into
  // document order only when the two differ.
  const byIndex = (a: Repricing, b: Repricing) => a.index - b.index;
  const repricing = outcome.repricing.every((r, i) => i === 0 || outcome.repricing[i - 1]!.index < r.index) ? outcome.repricing : [...outcome.repricing].sort(byIndex);
  const gap = outcome.curve && outcome.spotGap ? spotGapWarning(ws, outcome.spotGap) : null;
  if (gap) warnings.push(gap);
  const later = laterFixings(ws);
  if (later) warnings.push(later);
  const built: CurveBuild = {
    leftOut: base.leftOut,
    workspace: ws,
    instruments: outcome.curve ? market.instruments : [],
    curve: outcome.curve,
    curves: outcome.curves,
    errors: outcome.errors,
    warnings: outcome.warnings.length === 0 ? warnings : [...warnings, ...outcome.warnings],
    repricing,
    sweeps: outcome.sweeps,
    ...(outcome.curve ? { settings } : {}),
  };
  return outcome.overnight === undefined ? built : { ...built, overnight: outcome.overnight };
}

/** The warning for fixings dated on or after the valuation date: kept in the document, not read (not known then). */
function laterFixings(ws: Workspace): CoreWarning | null {
  if (ws.fixings === undefined) return null;
  const later = Object.keys(ws.fixings).filter((d) => compareIso(d, ws.settlement) >= 0).sort();
  if (later.length === 0) return null;
  const which = later.length === 1 ? later[0] : `${later.length} of them, ${later[0]} to ${later[later.length - 1]}`;
  return {
    path: 'fixings',
    quote: null,
    code: 'skipped',
    message: `fixings on or after the valuation date ${ws.settlement} are not read (${which}): a day's rate is published the next business morning, so it is not known then; they stay in the workspace for a later valuation date`,
  };
}

/**
 * The warning for a curve that reaches spot without quotes that link it there (the bootstrap's
 * `spotGap`, found by spotGapOf: the earliest start after the valuation date that lies before the
 * curve's first pillar; no ON or TN deposit ends by then). It states the rule the bootstrap bridged
 * the gap with (spotBridge.ts).
 */
function spotGapWarning(ws: Workspace, gap: SpotGap): CoreWarning {
  const i = gap.index;
  return {
    path: `quotes[${i}]`,
    quote: i,
    code: 'spot-gap',
    message: `quotes[${i}] starts on ${gap.start}, after the valuation date ${ws.settlement} and before the curve's first pillar ${gap.first}: the gap is bridged at the first pillar's average forward, ln DF(${gap.start}) = ln DF(${gap.first}) x t(${gap.start}) / t(${gap.first}), under every interpolation (flat at the first forward under log-linear discount); add quotes that end by then (ON and TN deposits on the same calendar for a spot start)`,
  };
}

/** The kit's settings on the curve's clock of the compiled instruments (curveClock: the same values as curveTime). */
function overnightSettings(ws: Workspace, plain: BootstrapSettings, kit: OvernightKit): { settings: BootstrapSettings; errors: readonly CoreError[] } {
  const clock = curveClock(ws.curve.dayCount, civilFromIso(ws.settlement));
  const calendars = { calendarOf: (id: string) => businessCalendar(id, ws.calendars), outside: outsideCalendar, maxClosedRun: MAX_CLOSED_RUN, serialFromIso, isoFromSerial };
  return kit.settingsFor(ws, plain, (date) => clock(civilFromIso(date)), calendars);
}
