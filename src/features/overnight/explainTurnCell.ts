import { coreError, explainSolvedTurn, topInfluencesOfSolvedTurn, type Result } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, underEachMethod, type CellExplanation } from '../tables/explainCell.ts';

/** A turn's spread solved from a quote, in the Overnight curve section's turns table: its index in the document's turns. */
export interface TurnCell {
  readonly turn: number;
}

/**
 * The explanation of a solved turn's spread (explainSolvedTurn, the solver's own record), the
 * quotes it depends on most (topInfluencesOfSolvedTurn: the spread's row of the inverse node
 * Jacobian) and the spread solved again under each method (the workspace built under it, as the
 * workbench builds).
 */
export function explainTurnCell(result: WorkbenchBuild, index: number): Result<CellExplanation> {
  const r = explainSolvedTurn(result.build, index);
  if (!r.ok) return r;
  const curve = result.build.curve!;
  const spreadOn = (spans: readonly { readonly index: number; readonly spread: number }[] | undefined): Result<number> => {
    const s = spans?.find((x) => x.index === index);
    return s ? { ok: true, value: s.spread * 1e4 } : { ok: false, errors: [coreError('schema', `turns[${index}]`, 'no turn on this curve')] };
  };
  const methods = underEachMethod(result, (on) => spreadOn(on.turned?.spans));
  // explainSolvedTurn has found the turn and its record.
  const span = result.build.overnight!.turns.find((t) => t.index === index)!;
  const row = result.conversion.rowOfQuote[span.solve!.quote];
  const influences = topInfluencesOfSolvedTurn(curve, result.build.instruments, index);
  const name = span.name;
  return cellOf(result, `Spread of the turn ${name}, solved from ${row === undefined ? 'its quote' : `row ${row + 1}`}`, r.value, influences, 'bp of the spread per bp of each quote: the spread is one of the curve\u2019s unknowns, solved with its nodes', methods);
}
