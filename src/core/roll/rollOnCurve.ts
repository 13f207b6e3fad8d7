import type { Curve } from '../curve/curve.ts';
import { fail, ok, coreError, type Result } from '../result.ts';
import type { StrategyInputs } from './strategyInputs.ts';
import { analyseRollVsTerm, type NamedCurve, type RollAnalysis } from './rollVsTerm.ts';

/** The curve a document's top-level curve is named by (document/namedCurves.ts's DEFAULT_CURVE_NAME, not imported so the roll code reads no document module). */
const DEFAULT = 'default';

/** Roll versus term on one curve of a document with named curves, naming that curve. */
export interface NamedRollAnalysis extends RollAnalysis {
  /** The curve the analysis read (`default` for the top-level curve). */
  readonly curveName: string;
}

/**
 * Roll versus term on the curve `curveName` of a document's curves (by name: the default curve
 * and each named curve built, for example a NamedScenarioCurve's `curves` or the builds), with
 * scenario curves of that same curve. The analysis is analyseRollVsTerm's on that curve, its
 * numbers unchanged; the result names the curve, and on a named curve every error and warning
 * message says which curve it was read on. An unknown name is an error listing the curves.
 */
export function analyseRollOnCurve(curves: Readonly<Record<string, Curve>>, curveName: string, strategy: StrategyInputs, scenarios: readonly NamedCurve[] = []): Result<NamedRollAnalysis> {
  const curve = curves[curveName];
  if (curve === undefined) {
    return fail(coreError('unknown-identifier', 'strategy.curve', `strategy.curve: no curve is named "${curveName}"; use one of ${Object.keys(curves).map((n) => `"${n}"`).join(', ')}`));
  }
  const r = analyseRollVsTerm(curve, strategy, scenarios);
  const on = <T extends { readonly message: string }>(e: T): T => (curveName === DEFAULT ? e : { ...e, message: `on the curve "${curveName}": ${e.message}` });
  if (!r.ok) return fail(...r.errors.map(on));
  return ok({ ...r.value, warnings: r.value.warnings.map(on), curveName });
}
