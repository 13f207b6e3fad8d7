import {
  analyzeBond,
  BOND_FIGURE_WORDS,
  bondFigureValue,
  bondLnWeights,
  DEFAULT_KEY_TENORS,
  explainBondFigure,
  formatPercent,
  topInfluencesOfLn,
  type BondAnalytics,
  type BondFigure,
  type ShiftFigure,
  type BondInput,
  type BondSide,
  type BondSink,
  type MethodValue,
  type Result,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, noCurve, underEachMethod, type CellExplanation } from '../tables/explainCell.ts';

/**
 * A figure of the Bond on the curve table: the bond as the form reads it, the figure and its column;
 * a shift duration (on the curve): the effective duration, or the key-rate duration of key number `key`.
 */
export interface BondCell {
  readonly bond: {
    readonly input: BondInput;
    readonly figure: BondFigure | ShiftFigure;
    readonly side: BondSide;
    readonly key?: number;
  };
}

/** The figure as the tables show it (bondFigureValue; a shift duration from its own field). */
const shownValue = (a: BondAnalytics, figure: BondFigure | ShiftFigure, side: BondSide, key: number): number | null =>
  figure === 'effectiveDuration' ? a.effectiveDuration : figure === 'keyRateDuration' ? a.keyRateDurations[key]!.duration : bondFigureValue(a, figure, side);

/**
 * The explanation of one bond figure: analyzeBond run again with a sink on the build's curve (the
 * table's own call, so the number is the table's), its trace turned into steps by the core
 * (explainBondFigure), the quotes it depends on most (topInfluencesOfLn with bondLnWeights) and the
 * figure under each interpolation method (the workspace rebuilt per method, as the workbench builds).
 */
export function explainBondCell(result: WorkbenchBuild, cell: BondCell['bond']): Result<CellExplanation> {
  const curve = result.build.curve;
  if (!curve) return noCurve(result);
  const { input, figure, side, key = 0 } = cell;
  const sink: BondSink = {};
  const analysed = analyzeBond(curve, input, DEFAULT_KEY_TENORS, 'bond', sink);
  if (!analysed.ok) return analysed;
  const e = explainBondFigure(sink.trace!, figure, side, key);
  if (!e.ok) return e;
  const explanation = e.value;
  const weights = bondLnWeights(sink.trace!, figure, side, key);
  // Under each method only what reads the curve: the rest is the same number under any method.
  const methods: MethodValue[] = weights
    ? underEachMethod(result, (on) => {
          const a = analyzeBond(on, input);
          return a.ok ? { ok: true, value: shownValue(a.value, figure, side, key)! } : a;
        },
      )
    : [];
  const terms = `${formatPercent(input.coupon)} ${input.frequency}x a year to ${input.maturity}`;
  const words = figure === 'effectiveDuration' ? 'effective duration' : figure === 'keyRateDuration' ? `${DEFAULT_KEY_TENORS[key]} key-rate duration` : BOND_FIGURE_WORDS[figure];
  const title = `Bond ${terms}: ${words} ${side === 'model' || figure === 'accrued' ? 'on the curve' : `at the market ${input.cleanPrice !== undefined ? 'price' : 'yield'}`}`;
  return cellOf(result, title, explanation, weights ? topInfluencesOfLn(curve, result.build.instruments, weights.times, weights.weights) : { ok: true, value: [] }, weights?.note ?? 'none: this figure does not read the curve', methods);
}
