import { curveFromLnDiscount, curveFromNodes, frameOf, type Curve, type Extrapolation, type Pillar } from '../curve/curve.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import { zeros, type InterpolationId, type InterpolatorSpec } from '../interpolation/types.ts';
import type { Instrument, QuoteUnit } from '../instruments/instrument.ts';
import { kindModule } from '../kinds/registry.ts';
import { FLAT_GUESS_FORWARD, MAX_SWEEPS, NODE_TOLERANCE, PRICE_ACCEPTANCE, RATE_ACCEPTANCE, SWEEP_ROUNDING_ULPS } from '../numeric/tolerance.ts';
import { coreError, type CoreError, type CoreWarning } from '../result.ts';
import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import { formatRate } from '../format/quantities.ts';
import { rateTag } from '../format/conventionTag.ts';
import { FlowTable } from './flowTable.ts';
import { jointNewton } from './jointNewton.ts';
import { nodeSolverFor, type BootstrapNodes } from './nodeSolvers.ts';
// Types only: the code of turns and steps comes in `settings.kit` (overnightKit.ts), loaded on first use.
import type { TurnSpan } from './turns.ts';
import type { MeetingNode, StepNodes } from './meetingSteps.ts';
import type { OvernightKit } from './overnightKit.ts';
import { bridgeSpotGap, spotGapOf, type NodeRun, type SpotGap } from './spotBridge.ts';

/** How one quote came back on the built curve. */
export interface Repricing {
  readonly index: number;
  readonly kind: Instrument['kind'];
  readonly maturity: IsoDate;
  readonly t: number;
  readonly unit: QuoteUnit;
  readonly field: string;
  readonly market: number;
  readonly model: number;
  /** Model quote minus market quote, in `unit`. */
  readonly repricingError: number;
}

export interface BootstrapOutcome {
  readonly curve: Curve | null;
  readonly errors: readonly CoreError[];
  readonly warnings: readonly CoreWarning[];
  /** One entry per instrument, in the order given (a quote that sets a turn's spread last). Empty when the bootstrap failed. */
  readonly repricing: readonly Repricing[];
  /** Gauss-Seidel sweeps used (0 for local methods). */
  readonly sweeps: number;
  /** The turns and meeting nodes the curve was built with; absent when it has neither. */
  readonly overnight?: OvernightShape;
  /** The gap from the valuation date to spot before the first pillar (bridged, or a step curve's own); absent when none. */
  readonly spotGap?: SpotGap;
}

/** What a curve with turns or meeting steps was built with (absent on an ordinary curve). */
export interface OvernightShape {
  /** The turns on the curve's axis (bootstrap/turns.ts). */
  readonly turns: readonly TurnSpan[];
  /** The effective dates that are nodes (meeting steps on), in order; empty when off. */
  readonly meetings: readonly MeetingNode[];
}

export interface BootstrapSettings {
  readonly settlement: IsoDate;
  readonly dayCount: CurveDayCount;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
  /** Turns (bootstrap/turns.ts): the instruments see the turned curve, the interpolation carries the smooth one. */
  readonly turns?: readonly TurnSpan[];
  /**
   * Meeting steps on (bootstrap/meetingSteps.ts): nodes on these effective dates, log-linear
   * discount factors whatever `interpolation` says. Absent: steps off.
   */
  readonly meetings?: readonly MeetingNode[];
  /** The code of turns and steps (overnightKit.ts); set with `turns` or `meetings`. */
  readonly kit?: OvernightKit;
}

export const acceptanceBound = (unit: QuoteUnit): number => (unit === 'price' ? PRICE_ACCEPTANCE : RATE_ACCEPTANCE);

/**
 * Bootstraps a curve through instruments that are already sorted by pillar time, strictly
 * increasing (duplicates are refused before this). Each instrument sets the node (ln DF) at its
 * maturity.
 *
 * 1. One pass: node k is solved on the nodes 0..k, from the previous segment's forward carried
 *    on. A local method (log-linear-discount, linear-zero) is done after it; a global one
 *    (cubic-zero, monotone-convex[-positive]) starts from a log-linear-discount pass.
 * 2. Global methods: Gauss-Seidel sweeps re-solve every node on the full curve until no node
 *    moves by more than NODE_TOLERANCE (plus rounding) and every quote reprices within its
 *    acceptance bound, at most MAX_SWEEPS; if they cannot, all nodes are solved at once (joint
 *    Newton).
 * 3. The curve on the solved nodes; every quote repriced on it, refused beyond its acceptance bound.
 * 4. Negative forwards between pillars: a warning, or an error for monotone-convex-positive.
 *
 * Single-flow instruments at their own pillar (deposits, bills, zeros) are set in closed form.
 * Each stage solves its nodes with the one solver its method allows (see nodeSolverFor).
 */
export function bootstrapInstruments(given: BootstrapSettings, market: readonly Instrument[]): BootstrapOutcome {
  // A turn solved from a quote (turnSolve.ts, in the kit): that quote is no node; the kit solves
  // the spread around bootstrapTurned of the other quotes.
  if (given.kit && given.turns?.some((s) => s.solveFrom !== undefined)) return given.kit.solveTurnSpreads(given, market, bootstrapTurned);
  return bootstrapTurned(given, market);
}

/** bootstrapInstruments with every turn's spread as it stands. */
function bootstrapTurned(given: BootstrapSettings, market: readonly Instrument[]): BootstrapOutcome {
  // Turns and meeting steps (absent: nothing below changes). The turns must end by the last
  // pillar; the step rule decides each instrument's node.
  const spans = given.turns ?? [];
  const kit = given.kit;
  const lastIns = market[market.length - 1];
  if ((spans.length > 0 || given.meetings !== undefined) && kit === undefined) return failed([kitMissing()]);
  if (spans.length > 0 && lastIns !== undefined) {
    const beyond = kit!.turnsBeyond(spans, lastIns.t, lastIns.maturity);
    if (beyond.length > 0) return failed(beyond);
  }
  const instruments = spans.length === 0 ? market : kit!.withTurns(market, spans);
  let step: StepNodes | null = null;
  if (given.meetings !== undefined && lastIns !== undefined) {
    const s = kit!.stepNodes(instruments, given.meetings, given.settlement);
    if (Array.isArray(s)) return failed(s);
    step = s;
  }
  const settings: BootstrapSettings = step === null ? given : { ...given, interpolation: 'log-linear-discount' };
  // A quote starts after the valuation date but before the first pillar: the gap is bridged by one
  // rule for every method (bootstrap/spotBridge.ts), from the unbridged curve's first node. A step
  // curve is log-linear between its own nodes, which is that rule already.
  const run = (ins: readonly Instrument[], bridged: boolean): NodeRun<BootstrapOutcome> => solveNodes(given, settings, ins, bridged, step, spans);
  const gap = spotGapOf(settings.settlement, settings.dayCount, instruments);
  if (gap === null) return run(instruments, false).outcome;
  // The outcome carries the gap, so the build's warning needs no second search (build.ts).
  if (step !== null) return { ...run(instruments, false).outcome, spotGap: gap };
  const plain = run(instruments, false);
  return { ...bridgeSpotGap(gap, instruments, plain.ys === null ? null : plain.ys[1]!, (withBridge) => run(withBridge, true)), spotGap: gap };
}

/**
 * Steps 1-4 on the given instruments (with turns already wrapped; with meeting steps on the step
 * rule's nodes). `bridged`: the first is the spot bridge's node (not a quote), left out of the
 * curve's pillars and of the repricing. Returns the node values with the outcome (null when the
 * bootstrap failed).
 */
function solveNodes(given: BootstrapSettings, settings: BootstrapSettings, instruments: readonly Instrument[], bridged: boolean, step: StepNodes | null, spans: readonly TurnSpan[]): NodeRun<BootstrapOutcome> {
  const kit = given.kit;
  const spec = INTERPOLATORS[settings.interpolation];
  const nodes = startNodes(instruments, step);
  const { ts, ys } = nodes;

  // 1. One pass.
  const pass = nodeSolverFor(spec.global ? INTERPOLATORS['log-linear-discount'] : spec, 'pass', nodes);
  for (let k = 1; k <= instruments.length; k++) {
    const x = pass.solve(k, guess(instruments, ts, ys, k));
    if (typeof x !== 'number') return { outcome: failed([x]), ys: null };
    ys[k] = x;
  }

  // 2. Global methods: sweeps until the nodes settle.
  let sweeps = 0;
  let repricing: Repricing[] | null = null;
  if (spec.global) {
    const global = sweepToConvergence(settings, spec, nodes);
    if (!global.ok) return { outcome: failed([global.error]), ys: null };
    ({ sweeps, repricing } = global);
  }

  // 3. The curve, and every quote repriced on it. A global method's sweeps repriced on the final
  // nodes (bit for bit what curve.lnDiscountAt gives there: the same formula on the same nodes,
  // y_k exactly at a pillar; a test checks it). A local method's segment solver left the curve's
  // own values at every flow in the table: no later node moves a flow's segment.
  const smooth = curveOnNodes(settings, spec, nodes, step, bridged);
  const curve = spans.length === 0 ? smooth : turnedCurve(smooth, spans, kit!);
  // The instruments read the smooth curve here (turned ones add the turns to it themselves).
  repricing ??= pass.writesFlowTable ? tableRepricing(nodes) : reprice(nodes, smooth.lnDiscountAt);
  const refused = acceptanceFailure(repricing);
  if (refused) return { outcome: failed([refused]), ys: null };

  // 4. The sign of the forward between pillars.
  const { errors, warnings } = forwardSigns(settings, nodes, step);
  if (errors.length > 0) return { outcome: failed(errors), ys: null };
  const priced = bridged ? repricing.slice(1) : repricing;
  if (spans.length === 0 && step === null) return { outcome: { curve, errors: [], warnings, repricing: priced, sweeps }, ys };
  const overnight: OvernightShape = { turns: spans, meetings: step === null ? [] : given.meetings!.filter((m) => step.dates.includes(m.date)) };
  return { outcome: { curve, errors: [], warnings, repricing: priced, sweeps, overnight }, ys };
}

/**
 * Node 0 at t = 0 and one node per instrument, all values 0; the empty flow table. Node k is at
 * instrument k's pillar, or with meeting steps at the node the step rule gives it (the closed
 * form then only when that node is its pillar).
 */
function startNodes(instruments: readonly Instrument[], step: StepNodes | null): BootstrapNodes {
  const n = instruments.length;
  // Plain arrays of doubles, not typed arrays: see `zeros`.
  const ts = zeros(n + 1);
  const ys = zeros(n + 1);
  for (let k = 0; k < n; k++) ts[k + 1] = step === null ? instruments[k]!.t : step.times[k]!;
  const closedForm = instruments.map((ins, k) => ins.closedFormLn !== null && ins.times.length === 1 && ins.times[0] === ins.t && ts[k + 1] === ins.t);
  return { instruments, closedForm, ts, ys, flows: new FlowTable(instruments) };
}

/** The curve on the solved nodes, one pillar per instrument (with meeting steps, at its node). */
function curveOnNodes(settings: BootstrapSettings, spec: InterpolatorSpec, { instruments, ts, ys }: BootstrapNodes, step: StepNodes | null, bridged = false): Curve {
  const pillars: Pillar[] = instruments.map((ins, k) => ({ date: step === null ? ins.maturity : step.dates[k]!, t: ts[k + 1]!, discount: Math.exp(ys[k + 1]!), quote: ins.index }));
  // The spot bridge's node is a node of the interpolation, not a pillar (no quote ends there).
  if (bridged) pillars.shift();
  return curveFromNodes(settings.settlement, settings.dayCount, settings.interpolation, settings.extrapolation, pillars, spec.build(ts, ys));
}

/** The error for the quote furthest beyond its acceptance bound, or null when every quote is within. */
function acceptanceFailure(repricing: Repricing[]): CoreError | null {
  const w = worst(repricing);
  if (!w || w.ratio <= 1) return null;
  return coreError(
    'no-solution',
    `quotes[${w.row.index}].${w.row.field}`,
    `quotes[${w.row.index}] (${w.row.kind} ${w.row.maturity}) reprices off by ${w.row.repricingError} in ${w.row.unit}, beyond the acceptance bound ${acceptanceBound(w.row.unit)}`,
    w.row.index,
  );
}

type GlobalOutcome = { readonly ok: true; readonly sweeps: number; readonly repricing: Repricing[] } | { readonly ok: false; readonly error: CoreError };

/**
 * Step 2 for a global method: Gauss-Seidel sweeps from the pass's nodes; when they cannot go on
 * (a node alone has no solution) or do not settle, the joint Newton fallback. Returns the
 * repricing on the final nodes, every quote within its bound.
 */
function sweepToConvergence(settings: BootstrapSettings, spec: InterpolatorSpec, nodes: BootstrapNodes): GlobalOutcome {
  const { instruments, closedForm, ys } = nodes;
  const n = instruments.length;
  const solver = nodeSolverFor(spec, 'sweep', nodes);
  // The pass's nodes, a second start for the joint step in a market with a quote whose target is
  // read off the curve (below).
  const passNodes = nodes.instruments.some((ins) => ins.targetFromFlows !== undefined) ? ys.slice() : null;
  let sweeps = 0;
  let stuck: CoreError | null = null;
  sweeping: while (sweeps < MAX_SWEEPS) {
    sweeps++;
    let maxChange = 0;
    let moved = false;
    for (let k = 1; k <= n; k++) {
      if (closedForm[k - 1]) continue;
      const before = ys[k]!;
      const x = solver.solve(k, before);
      if (typeof x !== 'number') {
        stuck = x;
        ys[k] = before;
        break sweeping;
      }
      ys[k] = x;
      if (x !== before) moved = true;
      maxChange = Math.max(maxChange, Math.abs(Math.expm1(x - before)));
    }
    if (maxChange <= roundingFloor(nodes)) {
      // A sweep that moved no node recorded every flow value on the final nodes already.
      const repricing = acceptedRepricing(spec, nodes, solver.writesFlowTable && !moved);
      if (repricing) return { ok: true, sweeps, repricing };
    }
  }
  if (jointNewton(nodes, spec.build)) {
    const repricing = acceptedRepricing(spec, nodes, false);
    if (repricing) return { ok: true, sweeps, repricing };
  }
  // Sweeps can wander far from the root before they stop when a quote starts on a segment that a
  // nearby later node shapes (FRAs 10x13 and 11x14 under cubic-zero: a node's own residual barely
  // moves with it); the joint step from the pass's nodes still finds it. Only for markets with a
  // quote read off the curve (forward starts, lags), so a market of fixed-flow quotes is refused
  // exactly as before (test/cli/golden.test.ts).
  if (passNodes !== null) {
    const wandered = ys.slice();
    for (let k = 0; k < ys.length; k++) ys[k] = passNodes[k]!;
    if (jointNewton(nodes, spec.build)) {
      const repricing = acceptedRepricing(spec, nodes, false);
      if (repricing) return { ok: true, sweeps, repricing };
    }
    for (let k = 0; k < ys.length; k++) ys[k] = wandered[k]!;
  }
  if (stuck) return { ok: false, error: stuck };
  const interp = spec.build(nodes.ts, ys);
  const w = worst(reprice(nodes, (t) => interp.lnDiscount(t)))!;
  return {
    ok: false,
    error: coreError(
      'not-converged',
      `quotes[${w.row.index}].${w.row.field}`,
      `${settings.interpolation}: no consistent curve after ${MAX_SWEEPS} sweeps; the worst quote is quotes[${w.row.index}] (${w.row.kind} ${w.row.maturity}), off by ${w.row.repricingError} in ${w.row.unit}; try log-linear-discount or check the quotes`,
      w.row.index,
    ),
  };
}

/**
 * The largest node change a sweep can show from rounding alone: NODE_TOLERANCE (each node solve
 * stops within it of its root) plus SWEEP_ROUNDING_ULPS ulps of the largest |ln DF|.
 */
function roundingFloor({ instruments, ys }: BootstrapNodes): number {
  let largest = 1;
  for (let k = 1; k <= instruments.length; k++) largest = Math.max(largest, Math.abs(ys[k]!));
  return NODE_TOLERANCE + SWEEP_ROUNDING_ULPS * Number.EPSILON * largest;
}

/**
 * The repricing on the nodes as they stand when every quote passes, else null. `tableIsCurve`:
 * the flow table already holds the curve's values there, so the curve is not read again.
 */
function acceptedRepricing(spec: InterpolatorSpec, nodes: BootstrapNodes, tableIsCurve: boolean): Repricing[] | null {
  let rows: Repricing[];
  if (tableIsCurve) rows = tableRepricing(nodes);
  else {
    const interp = spec.build(nodes.ts, nodes.ys);
    rows = reprice(nodes, (t) => interp.lnDiscount(t));
  }
  const w = worst(rows);
  return !w || w.ratio <= 1 ? rows : null;
}

/** Step 4: the forward between consecutive pillars must not be negative (a warning, or an error for monotone-convex-positive). */
function forwardSigns(settings: BootstrapSettings, { instruments, ts, ys }: BootstrapNodes, step: StepNodes | null): { errors: CoreError[]; warnings: CoreWarning[] } {
  const dateOf = (k: number): IsoDate => (step === null ? instruments[k - 1]!.maturity : step.dates[k - 1]!);
  const warnings: CoreWarning[] = [];
  const errors: CoreError[] = [];
  for (let k = 1; k <= instruments.length; k++) {
    const d = -(ys[k]! - ys[k - 1]!) / (ts[k]! - ts[k - 1]!);
    if (d >= 0) continue;
    const ins = instruments[k - 1]!;
    const from = k === 1 ? settings.settlement : dateOf(k - 1);
    const what = `the forward from ${from} to ${dateOf(k)} is ${formatRate(d, rateTag('continuous', settings.dayCount))}`;
    if (settings.interpolation === 'monotone-convex-positive') {
      errors.push(
        coreError('no-solution', `quotes[${ins.index}]`, `quotes[${ins.index}] (${ins.kind} ${ins.maturity}): monotone-convex-positive needs positive forwards, but ${what}; use monotone-convex for a market with negative forwards`, ins.index),
      );
    } else {
      warnings.push({ path: `quotes[${ins.index}]`, quote: ins.index, code: 'negative-forward', message: `negative forward: ${what}` });
    }
  }
  return { errors, warnings };
}

/** Every quote's repricing on a curve: the flow table filled from the curve, then read. */
function reprice(nodes: BootstrapNodes, lnDiscountAt: (t: number) => number): Repricing[] {
  nodes.flows.fill(nodes.instruments, lnDiscountAt);
  return tableRepricing(nodes);
}

/** Every quote's repricing read from the flow table as it stands. */
function tableRepricing({ instruments, flows }: BootstrapNodes): Repricing[] {
  return repricingRows(instruments, flows.modelQuotes(instruments));
}

/**
 * The curve with the turns on the smooth one: ln DF + ln J, forward + the turns' share, each
 * pillar's discount factor with its jump (bootstrap/turns.ts). Here rather than in the kit so the
 * kit's chunk needs no curve code of its own.
 */
function turnedCurve(smooth: Curve, spans: readonly TurnSpan[], kit: OvernightKit): Curve {
  const pillars = smooth.pillars.map((p) => ({ ...p, discount: Math.exp(smooth.lnDiscountAt(p.t) + kit.turnLn(spans, p.t)) }));
  const curve = curveFromLnDiscount(
    { ...frameOf(smooth), pillars },
    { lnDiscount: (t) => smooth.lnDiscountAt(t) + kit.turnLn(spans, t), forward: (t) => smooth.forwardAt(t) + kit.turnForward(spans, t) },
    'as-given',
  );
  // The sensitivities take the smooth nodes and each solved spread from here (analytics/nodePartials.ts).
  return { ...curve, turned: { spans, lnAt: kit.turnLn } };
}

/** The error of a build asked for turns or steps without their code (overnightKit.ts). */
export const kitMissing = (): CoreError =>
  coreError('no-solution', '', 'the turns and meeting steps are still loading; the curve is built as soon as they are (a caller of the engine passes OVERNIGHT_KIT in the build options)');

function failed(errors: CoreError[]): BootstrapOutcome {
  return { curve: null, errors, warnings: [], repricing: [], sweeps: 0 };
}

/**
 * Starting value of node k: the previous segment's discrete forward carried on; at the first node
 * the first instrument's kind gives the rate (QuoteKindModule.solver, src/core/kinds).
 */
function guess(instruments: readonly Instrument[], ts: readonly number[], ys: readonly number[], k: number): number {
  if (k === 1) {
    const ins = instruments[0]!;
    return -kindModule(ins.kind).solver.firstRate(ins) * ins.t;
  }
  const fwd = k >= 2 && ts[k - 1]! > ts[k - 2]! ? -(ys[k - 1]! - ys[k - 2]!) / (ts[k - 1]! - ts[k - 2]!) : FLAT_GUESS_FORWARD;
  return ys[k - 1]! - fwd * (ts[k]! - ts[k - 1]!);
}

/** The repricing rows of instruments given their model quotes. */
export function repricingRows(instruments: readonly Instrument[], models: readonly number[]): Repricing[] {
  const rows = new Array<Repricing>(instruments.length);
  for (let i = 0; i < instruments.length; i++) {
    const ins = instruments[i]!;
    const model = models[i]!;
    rows[i] = {
      index: ins.index,
      kind: ins.kind,
      maturity: ins.maturity,
      t: ins.t,
      unit: ins.unit,
      field: ins.field,
      market: ins.market,
      model,
      repricingError: model - ins.market,
    };
  }
  return rows;
}

/** The row with the largest repricing error relative to its acceptance bound (the first on ties). */
function worst(rows: Repricing[]): { row: Repricing; ratio: number } | null {
  let best: Repricing | null = null;
  let bestRatio = 0;
  for (const row of rows) {
    const ratio = Number.isFinite(row.repricingError) ? Math.abs(row.repricingError) / acceptanceBound(row.unit) : Infinity;
    if (best === null || ratio > bestRatio) {
      best = row;
      bestRatio = ratio;
    }
  }
  return best === null ? null : { row: best, ratio: bestRatio };
}
