import { buildFromWorkspace, type BuildOptions } from '../bootstrap/build.ts';
import { buildNamedCurves } from '../bootstrap/namedCurveBuild.ts';
import type { Curve } from '../curve/curve.ts';
import { DEFAULT_CURVE_NAME } from '../document/namedCurves.ts';
import type { Workspace } from '../document/types.ts';
import { coreError, fail, ok, type CoreError, type Result } from '../result.ts';
import { shiftWorkspaceQuotes } from './scenarioQuotes.ts';
import { resolveShift, type Scenario } from './scenarioShape.ts';
import { shiftZeroCurve } from './scenarioZero.ts';
import type { ScenarioCurve } from './scenarios.ts';

/** A scenario applied to one curve of a document with named curves, naming that curve, with every curve of the document under it. */
export interface NamedScenarioCurve extends ScenarioCurve {
  /** The curve the scenario was applied to (`default` for the top-level curve). */
  readonly curveName: string;
  /**
   * Every curve of the document under the scenario, by name: in zero space the named curve shifted
   * and the others as built; in quote space the curves that read the moved one (directly or through
   * another) built again on it, the others as built.
   */
  readonly curves: Readonly<Record<string, Curve>>;
}

/**
 * Applies a scenario to the curve `curveName` of a validated workspace with named curves
 * (`ws.curves`), whose default curve built as `defaultCurve` and named curves as `built` (the
 * output of buildNamedCurves, each built). Zero space: that curve's zero curve moved
 * (shiftZeroCurve), as applyScenario moves the default one; no other curve moves, since a zero-space
 * shift changes no quote. Quote space: that curve's quotes moved by the shape at their maturities
 * on its own axis (shiftWorkspaceQuotes) and the document's curves built again in build order with
 * the same options, so a moved discounting curve moves the projection curves discounted on it
 * (their swaps read its discount factors) and a moved six-month curve the three-month curve of
 * basis swaps against it; the curves it reads do not move. On the default curve the scenario
 * curve is applyScenario's, bit for bit. Errors are values naming the curve, the scenario and what
 * failed.
 */
export function applyScenarioOnCurve(
  scenario: Scenario,
  ws: Workspace,
  defaultCurve: Curve,
  built: readonly { readonly name: string; readonly build: { readonly curve: Curve | null } }[],
  curveName: string,
  options: BuildOptions = {},
  path = 'scenario',
): Result<NamedScenarioCurve> {
  const names = [DEFAULT_CURVE_NAME, ...(ws.curves ?? []).map((c) => c.name)];
  const named = (ws.curves ?? []).find((c) => c.name === curveName);
  if (curveName !== DEFAULT_CURVE_NAME && named === undefined) {
    return fail(coreError('unknown-identifier', `${path}.curve`, `${scenario.name}: no curve is named "${curveName}"; apply it to one of ${names.map((n) => `"${n}"`).join(', ')}`));
  }
  const asBuilt: Record<string, Curve> = { [DEFAULT_CURVE_NAME]: defaultCurve };
  for (const b of built) {
    if (b.build.curve === null) return fail(coreError('no-solution', `${path}.curve`, `${scenario.name}: the curve "${b.name}" did not build; correct it before applying a scenario`));
    asBuilt[b.name] = b.build.curve;
  }
  const own = named === undefined ? ws : named.workspace;
  const base = asBuilt[curveName];
  if (base === undefined) return fail(coreError('no-solution', `${path}.curve`, `${scenario.name}: the curve "${curveName}" was not built; build it before applying a scenario`));
  const shift = resolveShift(scenario.shape, own.settlement, own.curve.dayCount, `${path}.shape`);
  if (!shift.ok) return shift;
  if (scenario.space === 'zero') {
    const curve = shiftZeroCurve(base, shift.value);
    return ok({ scenario, shift: shift.value, curve, curveName, curves: { ...asBuilt, [curveName]: curve } });
  }
  const moved = shiftWorkspaceQuotes(own, shift.value);
  if (!moved.ok) return moved;
  const labelled = (es: readonly CoreError[]): Result<never> => fail(...es.map((e) => ({ ...e, message: `${scenario.name} on "${curveName}": ${e.message}` })));
  let top = ws;
  let topCurve = defaultCurve;
  if (named === undefined) {
    const b = buildFromWorkspace(moved.value, options);
    if (!b.curve || b.errors.length > 0) return labelled(b.errors);
    top = moved.value;
    topCurve = b.curve;
  } else top = { ...ws, curves: ws.curves!.map((c) => (c === named ? { ...c, workspace: moved.value } : c)) };
  const curves: Record<string, Curve> = { [DEFAULT_CURVE_NAME]: topCurve };
  for (const b of buildNamedCurves(top, topCurve, options)) {
    if (!b.build.curve || b.build.errors.length > 0) return labelled(b.build.errors);
    curves[b.name] = b.build.curve;
  }
  return ok({ scenario, shift: shift.value, curve: curves[curveName]!, curveName, curves });
}
