/**
 * A turn whose spread is solved from a quote that spans it (`turns[i].solveFrom`): the quote sets
 * the spread instead of a node of its own (one equation, one unknown), so the forward of its period
 * rises by exactly what reprices it, and every other quote's node is solved as usual.
 *
 * The scheme: an outer one-dimensional solve on the spread s around the whole bootstrap. For a
 * trial s the curve is bootstrapped from the other quotes with the turn at s (bootstrap.ts, the
 * turns wrapped as for a spread the user set), and g(s) = the spanning quote's model value on that
 * curve minus its market value, solved by the bootstrap's own one-dimensional solver (solve.ts:
 * secant steps, kept inside a bracket once g changes sign, bisection when a step leaves it). g is
 * affine in s when every node is set in closed form (a deposit curve under log-linear discount) and
 * nearly so otherwise, so the secant lands on the root in two or three bootstraps; a spread beyond
 * +-TURN_SPREAD_MAX_BP (the range a user may set) has no value, which ends the search. Several solved turns are solved one at a time with the others held, in
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
import { PRICE_ACCEPTANCE, RATE_ACCEPTANCE, TURN_SOLVE_ROUNDS } from '../numeric/tolerance.ts';
import { coreError, type CoreError, type ErrorCode } from '../result.ts';
import { repricingRows, type BootstrapOutcome, type BootstrapSettings } from './bootstrap.ts';
import { solveNode } from './solve.ts';
import { withSpread, type TurnSolveRecord, type TurnSpan } from './turns.ts';

/** The bootstrap of a market with the turns given as they stand (bootstrap.ts). */
export type TurnedBootstrap = (settings: BootstrapSettings, market: readonly Instrument[]) => BootstrapOutcome;

const bp = (spread: number): string => `${spread * 1e4} bp`;
const bound = (ins: Instrument): number => (ins.unit === 'price' ? PRICE_ACCEPTANCE : RATE_ACCEPTANCE);

/** An error at `turns[i].solveFrom`, led by the turn and its quote. */
const turnError = (code: ErrorCode, span: TurnSpan, ins: Instrument | undefined, text: string): CoreError =>
  coreError(code, `turns[${span.index}].solveFrom`, `turn "${span.name}" (turns[${span.index}]) solved from quotes[${span.solveFrom}]${ins ? ` (${ins.kind} ${ins.maturity})` : ''}: ${text}; or give the spread in bp`, ins?.index ?? null);

/**
 * The curve with every turn that names a quote solved from it, that quote's repricing row added
 * after the others'. Errors name the turn and the quote: a quote left out of the market, one whose
 * period does not hold every day of the turn, no other quote to build from, no spread within
 * +-TURN_SPREAD_MAX_BP (naming the spreads tried), a curve that cannot be built on the way.
 */
export function solveTurnSpreads(given: BootstrapSettings, market: readonly Instrument[], bootstrap: TurnedBootstrap): BootstrapOutcome {
  let spans = given.turns ?? [];
  const solved: [number, Instrument][] = [];
  const errors: CoreError[] = [];
  spans.forEach((span, k) => {
    if (span.solveFrom === undefined) return;
    const ins = market.find((x) => x.index === span.solveFrom);
    // The quote's period: from its first flow when its target is read off the curve (a forward
    // start), else from the valuation date, to its pillar.
    if (ins && span.a >= (ins.targetFromFlows ? ins.times[0]! : 0) && span.b <= ins.t) solved.push([k, ins]);
    else errors.push(turnError('range', span, ins, ins ? `its period does not hold every day of the turn, ${span.start} to ${span.end}; pick a quote over both` : 'it is left out (a duplicate pillar)'));
  });
  const rest = market.filter((ins) => !solved.some((s) => s[1] === ins));
  if (rest.length === 0) errors.push(turnError('no-solution', spans[solved[0]![0]]!, solved[0]![1], 'no other quote is left to build from'));
  if (errors.length > 0) return failed(errors);
  let outcome = bootstrap(given, rest);
  const gap = (i: number): number => (outcome.curve ? solved[i]![1].modelQuote(outcome.curve.lnDiscountAt) - solved[i]![1].market : Number.NaN);
  // Each turn solved with the others held, in rounds until every spanning quote reprices; the
  // spreads each tried in its last round, for its explanation (turns[k].solve on the built curve).
  const tried = new Map<number, { spread: number; gap: number }[]>();
  for (let round = 0; round < TURN_SOLVE_ROUNDS && outcome.curve && solved.some(([, ins], i) => !(Math.abs(gap(i)) <= bound(ins))); round++) {
    for (let i = 0; i < solved.length; i++) {
      const [k, ins] = solved[i]!;
      const span = spans[k]!;
      const max = TURN_SPREAD_MAX_BP / 1e4;
      let lo = span.spread;
      let hi = lo;
      const at = (s: number): readonly TurnSpan[] => spans.map((x, j) => (j === k ? withSpread(span, s) : x));
      const trials = [{ spread: span.spread, gap: gap(i) }];
      tried.set(k, trials);
      const x = solveNode(
        (s) => {
          lo = Math.min(lo, s);
          hi = Math.max(hi, s);
          // Beyond the range a user may set, or no curve: no value, which ends the search.
          if (Math.abs(s) > max) return Number.NaN;
          outcome = bootstrap({ ...given, turns: at(s) }, rest);
          const g = gap(i);
          trials.push({ spread: s, gap: g });
          return g;
        },
        span.spread,
        trials[0]!.gap,
        true,
      );
      if (!x.ok) {
        const why = outcome.curve ? '' : `; no curve at the last: ${outcome.errors[0]?.message}`;
        return failed([turnError('no-solution', span, ins, `no spread from ${bp(Math.max(lo, -max))} to ${bp(Math.min(hi, max))} reprices it${why}`)]);
      }
      spans = at(x.x);
      outcome = bootstrap({ ...given, turns: spans }, rest);
    }
  }
  if (!outcome.curve) return outcome;
  const rows = outcome.repricing.slice();
  const records = new Map<number, TurnSolveRecord>();
  for (let i = 0; i < solved.length; i++) {
    const [k, ins] = solved[i]!;
    const model = ins.modelQuote(outcome.curve.lnDiscountAt);
    const g = model - ins.market;
    if (!(Math.abs(g) <= bound(ins))) return failed([turnError('not-converged', spans[k]!, ins, `it reprices off by ${g}`)]);
    rows.push(...repricingRows([ins], [model]));
    records.set(spans[k]!.index, { quote: ins.index, trials: tried.get(k) ?? [], gap: g });
  }
  const overnight = outcome.overnight && { ...outcome.overnight, turns: outcome.overnight.turns.map((t) => {
    const solve = records.get(t.index);
    return solve ? { ...t, solve } : t;
  }) };
  return { ...outcome, repricing: rows, ...(overnight ? { overnight } : {}) };
}

function failed(errors: CoreError[]): BootstrapOutcome {
  return { curve: null, errors, warnings: [], repricing: [], sweeps: 0 };
}
