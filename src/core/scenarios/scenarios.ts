/**
 * Scenarios: named shifts of the zero curve or of the quotes. This file is the entry to the
 * scenario modules (shapes, zero space, quote space, effects, snapshots, reference curves).
 */
import type { BuildOptions } from '../bootstrap/build.ts';
import type { Curve } from '../curve/curve.ts';
import { fail, ok, type CoreError, type Result } from '../result.ts';
import type { Workspace } from '../document/types.ts';
import { buildQuoteScenario } from './scenarioQuotes.ts';
import { resolveShift, type ResolvedShift, type Scenario } from './scenarioShape.ts';
import { shiftZeroCurve } from './scenarioZero.ts';

export * from './scenarioShape.ts';
export * from './scenarioZero.ts';
export * from './scenarioQuotes.ts';
export * from './scenarioEffects.ts';
export * from './scenarioSnapshots.ts';
export * from './scenarioReference.ts';

export interface ScenarioCurve {
  readonly scenario: Scenario;
  readonly shift: ResolvedShift;
  readonly curve: Curve;
}

/**
 * Applies a scenario to a built base: zero space moves the base curve (see shiftZeroCurve); quote
 * space moves the workspace's quotes and bootstraps again (see buildQuoteScenario), with the same
 * build options as the base. Errors are values naming the scenario field or quote at fault.
 */
export function applyScenario(scenario: Scenario, ws: Workspace, base: Curve, options: BuildOptions = {}, path = 'scenario'): Result<ScenarioCurve> {
  const shift = resolveShift(scenario.shape, ws.settlement, ws.curve.dayCount, `${path}.shape`);
  if (!shift.ok) return shift;
  if (scenario.space === 'zero') return ok({ scenario, shift: shift.value, curve: shiftZeroCurve(base, shift.value) });
  const built = buildQuoteScenario(ws, shift.value, options);
  if (!built.ok) return built;
  if (!built.value.curve) {
    const errors: CoreError[] = built.value.errors.map((e) => ({ ...e, message: `${scenario.name}: ${e.message}` }));
    return fail(...errors);
  }
  return ok({ scenario, shift: shift.value, curve: built.value.curve });
}
