import {
  explainRollFigure,
  rollFigure,
  topParQuoteInfluences,
  topQuoteInfluences,
  type MethodValue,
  type NamedCurve,
  type QuoteInfluence,
  type Result,
  type RollFigure,
  type StrategyInputs,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, noCurve, underEachMethod, type CellExplanation } from '../tables/explainCell.ts';

/** A figure of the roll panel (a money value, a return, a break-even, a leg's forward) under the strategy and scenario views it was shown with. */
export interface RollCell {
  readonly roll: {
    readonly figure: RollFigure;
    readonly strategy: StrategyInputs;
    readonly scenarios: readonly NamedCurve[];
  };
}

/** One figure of the roll panel explained: its steps from the core (explainRollFigure), the quotes behind it, and the figure under each method. */
export function explainRollCell(result: WorkbenchBuild, c: RollCell['roll']): Result<CellExplanation> {
  const curve = result.build.curve;
  if (!curve) return noCurve(result);
  const r = explainRollFigure(curve, c.strategy, c.scenarios, c.figure);
  if (!r.ok) return r;
  const { explanation, title, driver } = r.value;
  const instruments = result.build.instruments;
  let influences: Result<QuoteInfluence[]> = { ok: true, value: [] };
  if (driver?.kind === 'rate') influences = topQuoteInfluences(curve, instruments, driver.start, driver.end, driver.compounding, driver.dayCount);
  else if (driver?.kind === 'par') influences = topParQuoteInfluences(curve, instruments, curve.settlement, driver.end, driver.frequency, 'ACT/ACT-ICMA');
  // A scenario's curve is made under the current method only, so a figure under a scenario view is not read under the others.
  const view = 'view' in c.figure ? c.figure.view : c.strategy.view;
  const methods: MethodValue[] = view.startsWith('scenario')
    ? []
    : underEachMethod(result, (on) => {
          const v = rollFigure(on, c.strategy, [], c.figure);
          return v.ok ? { ok: true, value: v.value.value } : v;
        },
      );
  return cellOf(result, title, explanation, influences, driver ? driver.note : (r.value.why ?? 'none computed for this figure'), methods);
}
