import {
  analyzeBond,
  BOND_FIGURE_WORDS,
  bondFigureValue,
  bondLnWeights,
  DEFAULT_KEY_TENORS,
  explainBondFigure,
  explainQuoteDv01,
  formatPercent,
  quoteDv01Of,
  topInfluencesOfLn,
  type BondAnalytics,
  type BondFigure,
  type ShiftFigure,
  type BondInput,
  type BondSide,
  type BondSink,
  type MethodValue,
  type Result,
  valueUnderEachMethod,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { buildUnder, cellOf, noCurve, underEachMethod, type CellExplanation } from '../tables/explainCell.ts';

/**
 * A figure of the Bond on the curve table: the bond as the form reads it, the figure and its column;
 * a shift duration (on the curve): the effective duration, or the key-rate duration of key number `key`.
 */
export interface BondCell {
  readonly bond: {
    readonly input: BondInput;
    readonly figure: BondFigure | ShiftFigure | 'quoteDv01';
    readonly side: BondSide;
    /** The key rate's number, or for 'quoteDv01' the quote's index in the document. */
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
  if (figure === 'quoteDv01') return explainQuoteDv01Cell(result, input, key);
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

/**
 * The explanation of a row of the DV01 to each quote table: explainQuoteDv01 (quoteDv01Of, the
 * table's own function, with a record) on the build's settings and instruments and the bond's flows
 * on its curve; the figure under each method with the workspace rebuilt under it. No list of quotes:
 * the figure is itself the price's sensitivity to the one quote, named in the title.
 */
function explainQuoteDv01Cell(result: WorkbenchBuild, input: BondInput, index: number): Result<CellExplanation> {
  const { curve, settings, instruments } = result.build;
  if (!curve || !settings) return noCurve(result);
  const a = analyzeBond(curve, input);
  if (!a.ok) return a;
  const flows = a.value.flows;
  const k = instruments.findIndex((i) => i.index === index);
  const e = explainQuoteDv01(curve, settings, instruments, flows, k);
  if (!e.ok) return e;
  const builds = new Map<unknown, typeof result.build>();
  const methods = valueUnderEachMethod(
    curve.interpolation,
    (m) => {
      const b = buildUnder(result, m);
      builds.set(b.curve, b);
      return b;
    },
    (on) => {
      const b = builds.get(on)!;
      const j = b.instruments.findIndex((i) => i.index === index);
      return quoteDv01Of(b.settings!, b.instruments, flows, j);
    },
  );
  const ins = instruments[k]!;
  const row = result.conversion.rowOfQuote[index];
  const at = row === undefined ? 'a quote' : `row ${row + 1}`;
  return cellOf(result, `Bond ${formatPercent(input.coupon)} ${input.frequency}x a year to ${input.maturity}: DV01 to ${at} (${ins.kind} ${ins.maturity})`, e.value, { ok: true, value: [] }, `none listed: the figure is the price's sensitivity to ${at} alone`, methods);
}
