/**
 * A turn whose spread is solved from a quote that spans it (`turns[i].solveFrom`): the quote sets
 * the spread instead of a node of its own (one equation, one unknown), so the forward of its period
 * rises by exactly what reprices it, and every other quote's node is solved as usual.
 *
 * The scheme: an outer one-dimensional solve on the spread s around the whole bootstrap. For a
 * trial s the curve is bootstrapped from the other quotes with the turn at s (bootstrap.ts, the
 * turns wrapped as for a spread the user set), and g(s) = the spanning quote's model value on that
 * curve minus its market value. g is affine in s when every node is set in closed form (a deposit
 * curve under log-linear discount) and nearly so otherwise, so a secant from s = 0 and 1 bp lands on
 * the root in two or three bootstraps; once g changes sign the steps stay inside the bracket
 * (bisection when a secant step leaves it), and the search never leaves +-TURN_SPREAD_MAX_BP, the
 * range a user may set. Several solved turns are solved one at a time with the others held, in
 * rounds until every spanning quote reprices (their periods rarely share a turn, so one or two
 * rounds).
 *
 * Why not the spread as one more unknown of the joint Newton step (jointNewton.ts): that step runs
 * only for the global methods' fallback and works on ln DF nodes; the outer solve leaves every node
 * solver, sweep and closed form exactly as it is for a spread the user set (the turned
 * instruments of turns.ts), works the same under every method and with meeting steps, and costs a
 * few bootstraps of a short curve, only in documents that ask for it.
 */
import { TURN_SPREAD_MAX_BP } from '../document/overnightSections.ts';
import type { Instrument } from '../instruments/instrument.ts';
import {
  PRICE_ACCEPTANCE,
  RATE_ACCEPTANCE,
  TURN_SOLVE_ACCEPTANCE_SHARE,
  TURN_SOLVE_FIRST_STEP,
  TURN_SOLVE_MAX_EVALUATIONS,
  TURN_SOLVE_ROUNDS,
  TURN_SOLVE_SPREAD_TOLERANCE,
} from '../numeric/tolerance.ts';
import { coreError, type CoreError } from '../result.ts';
import type { BootstrapOutcome, BootstrapSettings, Repricing } from './bootstrap.ts';
import { withSpread, type TurnSpan } from './turns.ts';

/** The bootstrap of a market with the turns given as they stand (bootstrap.ts). */
export type TurnedBootstrap = (settings: BootstrapSettings, market: readonly Instrument[]) => BootstrapOutcome;

/** One bootstrap at trial spreads: the spans, the outcome, each solved quote's model value and model minus market (NaN without a curve). */
interface Trial {
  readonly spans: readonly TurnSpan[];
  readonly outcome: BootstrapOutcome;
  readonly models: readonly number[];
  readonly gaps: readonly number[];
}

const bpText = (spread: number): string => `${spread * 1e4} bp`;
const bound = (ins: Instrument): number => (ins.unit === 'price' ? PRICE_ACCEPTANCE : RATE_ACCEPTANCE);

/**
 * The curve with every turn that names a quote solved from it. Errors name the turn and the quote:
 * a quote left out of the market, a quote whose period does not hold every day of the turn, no
 * other quote to build from, no spread within +-TURN_SPREAD_MAX_BP (with the quote's error at both
 * ends), or a curve that cannot be built at a spread on the way.
 */
export function solveTurnSpreads(given: BootstrapSettings, market: readonly Instrument[], bootstrap: TurnedBootstrap): BootstrapOutcome {
  const spans = given.turns ?? [];
  const solved: { readonly k: number; readonly ins: Instrument }[] = [];
  const errors: CoreError[] = [];
  spans.forEach((span, k) => {
    if (span.solveFrom === undefined) return;
    const path = `turns[${span.index}].solveFrom`;
    const ins = market.find((x) => x.index === span.solveFrom);
    if (ins === undefined) {
      errors.push(coreError('no-solution', path, `turn "${span.name}" (turns[${span.index}]) is solved from quotes[${span.solveFrom}], which is not in the curve (left out as a duplicate pillar); solve the turn from another quote that spans it, or give its spread in bp`));
      return;
    }
    // The quote's period: from its first flow when its target is read off the curve (a forward
    // start), else from the valuation date (a target of 1 there), to its pillar.
    const start = ins.targetFromFlows !== undefined ? ins.times[0]! : 0;
    if (span.a < start || span.b > ins.t) {
      errors.push(
        coreError(
          'range',
          path,
          `turn "${span.name}" (turns[${span.index}], overnight periods from ${span.start} to ${span.end}) is solved from quotes[${ins.index}] (${ins.kind} ${ins.maturity}), whose period does not hold every day of the turn; pick a quote that starts on or before ${span.start} and ends on or after ${span.end}, or give the spread in bp`,
          ins.index,
        ),
      );
      return;
    }
    solved.push({ k, ins });
  });
  if (errors.length > 0) return failed(errors);
  const used = new Set(solved.map((s) => s.ins));
  const rest = market.filter((ins) => !used.has(ins));
  if (rest.length === 0) {
    const s = spans[solved[0]!.k]!;
    return failed([coreError('no-solution', `turns[${s.index}].solveFrom`, `turn "${s.name}" (turns[${s.index}]) is solved from quotes[${s.solveFrom}], which is then no node of the curve, and no other quote is left to build the curve from; add quotes, or give the spread in bp`)]);
  }

  const run = (trialSpans: readonly TurnSpan[]): Trial => {
    const outcome = bootstrap({ ...given, turns: trialSpans }, rest);
    const curve = outcome.curve;
    const models = solved.map(({ ins }) => (curve === null ? Number.NaN : ins.modelQuote(curve.lnDiscountAt)));
    return { spans: trialSpans, outcome, models, gaps: models.map((m, i) => m - solved[i]!.ins.market) };
  };
  let current = run(spans);
  if (current.outcome.curve === null) return current.outcome;
  const settled = (t: Trial): boolean => solved.every(({ ins }, i) => Math.abs(t.gaps[i]!) <= TURN_SOLVE_ACCEPTANCE_SHARE * bound(ins));
  for (let round = 0; round < TURN_SOLVE_ROUNDS && !settled(current); round++) {
    for (let i = 0; i < solved.length; i++) {
      const next = solveOne(current, i, solved[i]!.k, solved[i]!.ins, run);
      if ('error' in next) return failed([next.error]);
      current = next;
    }
  }
  return finish(current, solved);
}

/** Solves turn i (spans[k]) from its quote with the other spreads held; the trial at its spread, or an error naming both. */
function solveOne(start: Trial, i: number, k: number, ins: Instrument, run: (spans: readonly TurnSpan[]) => Trial): Trial | { readonly error: CoreError } {
  const span = start.spans[k]!;
  const max = TURN_SPREAD_MAX_BP / 1e4;
  const tol = TURN_SOLVE_ACCEPTANCE_SHARE * bound(ins);
  const at = (spread: number): Trial => {
    const spans = start.spans.slice();
    spans[k] = withSpread(span, spread);
    return run(spans);
  };
  const gapOf = (t: Trial): number => t.gaps[i]!;
  const named = `turn "${span.name}" (turns[${span.index}]) solved from quotes[${ins.index}] (${ins.kind} ${ins.maturity})`;
  let x0 = span.spread;
  let t0 = start;
  if (Math.abs(gapOf(t0)) <= tol) return t0;
  let x1 = x0 + TURN_SOLVE_FIRST_STEP <= max ? x0 + TURN_SOLVE_FIRST_STEP : x0 - TURN_SOLVE_FIRST_STEP;
  let t1 = at(x1);
  // The points with the quote's error below and above zero, once seen (the bracket).
  let neg: { x: number; t: Trial } | null = null;
  let pos: { x: number; t: Trial } | null = null;
  const ends = new Map<number, number>(); // the error at each end of the range tried
  const note = (x: number, t: Trial): void => {
    const g = gapOf(t);
    if (x === max || x === -max) ends.set(x, g);
    if (g < 0) neg = { x, t };
    else if (g > 0) pos = { x, t };
  };
  note(x0, t0);
  for (let evaluations = 1; evaluations < TURN_SOLVE_MAX_EVALUATIONS; evaluations++) {
    if (t1.outcome.curve === null) {
      const why = t1.outcome.errors[0]?.message ?? 'no curve';
      return { error: coreError('no-solution', `turns[${span.index}].solveFrom`, `${named}: at a spread of ${bpText(x1)} the curve cannot be built (${why}); check the quote against its neighbours, or give the spread in bp`, ins.index) };
    }
    note(x1, t1);
    const g1 = gapOf(t1);
    if (Math.abs(g1) <= tol) return t1;
    const n = neg as { x: number; t: Trial } | null;
    const p = pos as { x: number; t: Trial } | null;
    if (n !== null && p !== null && Math.abs(n.x - p.x) <= TURN_SOLVE_SPREAD_TOLERANCE) {
      // The bracket is rounding noise wide: the better end.
      return Math.abs(gapOf(n.t)) <= Math.abs(gapOf(p.t)) ? n.t : p.t;
    }
    const g0 = gapOf(t0);
    let next = x1 - (g1 * (x1 - x0)) / (g1 - g0);
    if (n !== null && p !== null) {
      const lo = Math.min(n.x, p.x);
      const hi = Math.max(n.x, p.x);
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    } else {
      if (!Number.isFinite(next)) next = g1 === g0 ? (ends.has(max) ? -max : max) : x1;
      next = Math.min(max, Math.max(-max, next));
      if (next === x1 || ends.has(next)) {
        // Pressed against an end already tried: the other end, unless both were.
        const other = next === max ? -max : max;
        if (ends.has(other) || x1 === other) {
          const at = (x: number) => `${ends.get(x)} in ${ins.unit}`;
          return {
            error: coreError(
              'no-solution',
              `turns[${span.index}].solveFrom`,
              `${named}: no spread from ${bpText(-max)} to ${bpText(max)} reprices the quote (its model minus market value is ${at(-max)} at ${bpText(-max)} and ${at(max)} at ${bpText(max)}); check the quote against its neighbours (another quote spanning the turn takes up the spread too), or give the spread in bp`,
              ins.index,
            ),
          };
        }
        next = other;
      }
    }
    x0 = x1;
    t0 = t1;
    x1 = next;
    t1 = at(x1);
  }
  return { error: coreError('not-converged', `turns[${span.index}].solveFrom`, `${named}: the spread did not settle in ${TURN_SOLVE_MAX_EVALUATIONS} bootstraps (last tried ${bpText(x1)}); give the spread in bp`, ins.index) };
}

/** The last trial's outcome with the solved quotes' repricing rows put in (pillar order), each within its acceptance bound. */
function finish(trial: Trial, solved: readonly { readonly k: number; readonly ins: Instrument }[]): BootstrapOutcome {
  const outcome = trial.outcome;
  const rows: Repricing[] = outcome.repricing.slice();
  for (let i = 0; i < solved.length; i++) {
    const ins = solved[i]!.ins;
    const gap = trial.gaps[i]!;
    const span = trial.spans[solved[i]!.k]!;
    if (!(Math.abs(gap) <= bound(ins))) {
      return failed([
        coreError('not-converged', `turns[${span.index}].solveFrom`, `turn "${span.name}" (turns[${span.index}]) solved from quotes[${ins.index}] (${ins.kind} ${ins.maturity}): the quote reprices off by ${gap} in ${ins.unit} at ${bpText(span.spread)}, beyond the acceptance bound ${bound(ins)}; give the spread in bp`, ins.index),
      ]);
    }
    const row: Repricing = { index: ins.index, kind: ins.kind, maturity: ins.maturity, t: ins.t, unit: ins.unit, field: ins.field, market: ins.market, model: trial.models[i]!, repricingError: gap };
    let at = rows.findIndex((r) => r.t > ins.t || (r.t === ins.t && r.index > ins.index));
    if (at < 0) at = rows.length;
    rows.splice(at, 0, row);
  }
  return { ...outcome, repricing: rows };
}

function failed(errors: CoreError[]): BootstrapOutcome {
  return { curve: null, errors, warnings: [], repricing: [], sweeps: 0 };
}
