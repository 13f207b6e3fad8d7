import { applyScenario, COMPARISON_TENORS, scenarioEffects, type Scenario } from '../../core/index.ts';
import { curveTable, type CurveTableConventions, type CurveTableRow } from '../../core/index.ts';
import { zeroForwardTag, type BuildOptions, type Curve, type Result, type ScenarioCurve, type Workspace } from '../../core/index.ts';
import { describeShape, SPACE_LABEL } from '../scenarios/describeShape.ts';
import type { PrintScenario } from './PrintSummary.tsx';

/** Key-maturity rows for the page, from the core's curve table. */
export const printKeyRows = (curve: Curve, conv: CurveTableConventions, tenors: readonly string[] = COMPARISON_TENORS): CurveTableRow[] => curveTable(curve, conv, tenors);

/** Conventions line of the scenario table. */
export const scenarioConventionsText = (conv: CurveTableConventions): string => zeroForwardTag(conv);

/**
 * The scenarios as printed: each applied by the core (applyScenario with `how`, the build options,
 * or `how` itself: the workbench's applyToShown for a named curve) and its changes at the key
 * maturities (scenarioEffects). Only the first `limit` are computed; the rest are listed by count.
 */
export function printScenarios(
  scenarios: readonly Scenario[],
  ws: Workspace,
  base: Curve,
  conv: CurveTableConventions,
  how: BuildOptions | ((s: Scenario, i: number) => Result<ScenarioCurve>) = {},
  tenors: readonly string[] = COMPARISON_TENORS,
  limit = 4,
): PrintScenario[] {
  return scenarios.map((s, i) => {
    const common = { name: s.name, shape: describeShape(s.shape), space: SPACE_LABEL[s.space] };
    if (i >= limit) return { ...common, rows: null };
    const applied = typeof how === 'function' ? how(s, i) : applyScenario(s, ws, base, how, `scenarios[${i}]`);
    if (!applied.ok) return { ...common, rows: null, error: applied.errors[0]?.message ?? 'no curve' };
    return {
      ...common,
      rows: scenarioEffects(base, applied.value.curve, tenors, {
        zeroCompounding: conv.zeroCompounding,
        zeroDayCount: conv.zeroDayCount,
        forwardTenor: conv.forwardTenor,
        forwardCompounding: conv.forwardCompounding,
        forwardDayCount: conv.forwardDayCount,
      }),
    };
  });
}
