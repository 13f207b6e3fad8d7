import { buildFromWorkspace, type BuildOptions, type CurveBuild } from '../bootstrap/build.ts';
import { moduleOf } from '../kinds/registry.ts';
import { fail, ok, type CoreError, type Result } from '../result.ts';
import { curveTime } from '../time/dayCount.ts';
import type { Quote, Workspace } from '../document/types.ts';
import { shiftAt, type ResolvedShift } from './scenarioShape.ts';

const BP = 1e-4;

/**
 * One quote moved by d = Delta(T) (decimal) at its maturity T on the curve's axis, by its kind's
 * module (`QuoteKindModule.shift`, src/core/kinds):
 *  - a rate quote (deposit rate, swap rate, bill discount yield, zero rate, bond yield) moves by d
 *    in its own convention;
 *  - a price quote moves its own yield by d and is repriced:
 *      bill  price = 100 (1 - y days/360)            (bank discount yield, US Treasury formula)
 *      zero  price = 100 DF(r + d), r the zero rate in the quote's compounding and day count
 *      bond  clean = dirty(y + d) - accrued, y the ICMA yield of the quoted dirty price
 *            (bondYieldFromDirty / bondDirtyFromYield).
 */
export function shiftQuote(q: Quote, d: number, settlement: string): Result<Quote> {
  return moduleOf(q).shift(q, d, settlement);
}

/** The workspace with every quote moved by the shift at its maturity (see {@link shiftQuote}); errors name the quotes that cannot move. */
export function shiftWorkspaceQuotes(ws: Workspace, shift: ResolvedShift): Result<Workspace> {
  const quotes: Quote[] = [];
  const errors: CoreError[] = [];
  for (const q of ws.quotes) {
    const T = curveTime(ws.curve.dayCount, ws.settlement, q.maturity);
    const moved = shiftQuote(q, shiftAt(shift, T) * BP, ws.settlement);
    if (moved.ok) quotes.push(moved.value);
    else errors.push(...moved.errors);
  }
  if (errors.length > 0) return fail(...errors);
  return ok({ ...ws, quotes });
}

/** Moves the quotes and bootstraps again with the engine's `buildFromWorkspace`. */
export function buildQuoteScenario(ws: Workspace, shift: ResolvedShift, options: BuildOptions = {}): Result<CurveBuild> {
  const moved = shiftWorkspaceQuotes(ws, shift);
  if (!moved.ok) return moved;
  return ok(buildFromWorkspace(moved.value, options));
}
