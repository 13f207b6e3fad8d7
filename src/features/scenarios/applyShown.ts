import { applyScenario, coreError, fail, type BuildOptions, type Result, type Scenario, type ScenarioCurve } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';

/**
 * A scenario applied to the curve a build shows, by the core: the default curve (a workspace of one
 * curve, or the default curve chosen) as before, applyScenario on its workspace; a named curve by
 * applyScenarioOnCurve on the whole document (`onCurves.move`, made with the named curves' code), so a quote-space move of a projection
 * curve is built against its discounting curve, and a move of a discounting curve's quotes rebuilds
 * the curves discounted on it. Every panel that moves the shown curve (the scenario table, the
 * charts' overlay, the roll's views, the print) goes through here, so they agree.
 */
export function applyToShown(s: Scenario, result: WorkbenchBuild, options: BuildOptions, path?: string): Result<ScenarioCurve> {
  const { workspace, curve } = result.build;
  if (!workspace || !curve) return fail(coreError('schema', 'curve', result.fatal ?? 'no curve'));
  return result.onCurves ? result.onCurves.move(s, options, path) : applyScenario(s, workspace, curve, options, path);
}
