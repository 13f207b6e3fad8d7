import { coreError, explainSolvedTurn, valueUnderEachMethod, type Result } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { buildUnder, cellOf, type CellExplanation } from '../tables/explainCell.ts';

/** A turn's spread solved from a quote, in the Overnight curve section's turns table: its index in the document's turns. */
export interface TurnCell {
  readonly turn: number;
}

/**
 * The explanation of a solved turn's spread (explainSolvedTurn, the solver's own record), the
 * spread solved again under each method (the workspace built under it, as the workbench builds);
 * no bp-per-bp quotes: the spread is the root of its spanning quote's equation on a curve the
 * other quotes build, and its sensitivities to them are not computed (the panel says so).
 */
export function explainTurnCell(result: WorkbenchBuild, index: number): Result<CellExplanation> {
  const r = explainSolvedTurn(result.build, index);
  if (!r.ok) return r;
  const curve = result.build.curve!;
  const spreadOn = (spans: readonly { readonly index: number; readonly spread: number }[] | undefined): Result<number> => {
    const s = spans?.find((x) => x.index === index);
    return s ? { ok: true, value: s.spread * 1e4 } : { ok: false, errors: [coreError('schema', `turns[${index}]`, 'no turn on this curve')] };
  };
  const methods = valueUnderEachMethod(curve.interpolation, (method) => buildUnder(result, method), (on) => spreadOn(on.turned?.spans));
  const quote = result.build.overnight?.turns.find((t) => t.index === index)?.solve?.quote ?? 0;
  const row = result.conversion.rowOfQuote[quote];
  const none = { ok: false as const, errors: [coreError('schema', '', `none computed: the spread is the root of ${row === undefined ? 'its quote' : `row ${row + 1}`}'s equation on the curve the other quotes build, so it moves with that quote and with theirs`)] };
  const name = result.build.overnight?.turns.find((t) => t.index === index)?.name ?? `turn ${index + 1}`;
  return cellOf(result, `Spread of the turn ${name}, solved from ${row === undefined ? 'its quote' : `row ${row + 1}`}`, r.value, none, null, methods);
}
