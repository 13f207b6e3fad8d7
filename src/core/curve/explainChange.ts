import { coreError, fail, ok, type Result } from '../result.ts';
import { diffBp, effectDates, effectRate, type EffectConventions, type EffectField } from '../scenarios/scenarioEffects.ts';
import { explanationSink, type ExplainedStep, type Explanation } from './explain.ts';

import type { Curve } from './curve.ts';

/**
 * The explanation of a scenario's change at a key maturity: the base curve's rate and the scenario
 * curve's rate, each explained by its own traced query (effectRate, the very query the change
 * table runs, with a sink), then change = (scenario - base) x 10,000 bp through the table's own
 * diffBp, so the last step is the table's figure bit for bit.
 */
export interface ChangeExplanation {
  /** Both parts in one: the scenario curve's reads and steps named `scenario ...`, the base's `base ...`, then the change. */
  readonly explanation: Explanation;
  /** The base curve's rate, as zeroOn / forwardOn explain it. */
  readonly base: Explanation;
  /** The scenario curve's rate, as zeroOn / forwardOn explain it. */
  readonly scenario: Explanation;
}

export const CHANGE_UNIT = 'bp (1 bp = 0.0001 of the rate)';

/** Names of one part's dates, reads, year fractions and steps, prefixed by the part they belong to (a curve, or a meeting step's side). */
export function prefixed(e: Explanation, part: string, label = `${part} curve`): Pick<Explanation, 'dates' | 'yearFractions' | 'reads' | 'steps'> {
  const name = (n: string): string => `${part} ${n}`;
  return {
    dates: e.dates.map((d) => ({ ...d, name: name(d.name) })),
    yearFractions: e.yearFractions.map((y) => ({ ...y, name: name(y.name) })),
    reads: e.reads.map((r) => ({ ...r, name: name(r.name) })),
    steps: e.steps.map((s) => ({ ...s, name: name(s.name), formula: `${label}: ${s.formula}`, inputs: s.inputs.map(name) })),
  };
}

/**
 * Explains the change of the zero rate (or the forward) at key maturity `tenor` between a scenario
 * curve and its base, both on the same settlement, in the conventions of the change table. An error
 * value when the tenor is not one or either curve has no number there.
 */
export function explainScenarioChange(base: Curve, scenario: Curve, tenor: string, field: EffectField, conv: EffectConventions): Result<ChangeExplanation> {
  const dates = effectDates(base.settlement, tenor, conv);
  if (!dates) return fail(coreError('schema', 'tenor', `"${tenor}" is not a tenor`));
  const given = { date: tenor, start: tenor, end: `${conv.forwardTenor} after the start` };
  const baseSink = explanationSink(given);
  const scenarioSink = explanationSink(given);
  const b = effectRate(base, field, dates, conv, baseSink);
  const s = effectRate(scenario, field, dates, conv, scenarioSink);
  const change = diffBp(s, b);
  if (change === null || !baseSink.explanation || !scenarioSink.explanation) {
    return fail(coreError('schema', field, `no ${field === 'zero' ? 'zero rate' : 'forward'} at ${tenor} on ${b === null ? 'the base curve' : 'the scenario curve'} (beyond its last node without extrapolation)`));
  }
  const be = baseSink.explanation;
  const se = scenarioSink.explanation;
  const bp = prefixed(be, 'base');
  const sp = prefixed(se, 'scenario');
  const last: ExplainedStep = {
    name: 'change',
    formula: 'change = (scenario rate - base rate) x 10,000 bp',
    inputs: [sp.steps.at(-1)!.name, bp.steps.at(-1)!.name],
    value: change,
    unit: CHANGE_UNIT,
  };
  const explanation: Explanation = {
    quantity: field === 'zero' ? 'zero-change' : 'forward-change',
    formula: `change = (scenario rate - base rate) x 10,000, each rate: ${be.formula} (${be.unit})`,
    value: change,
    unit: CHANGE_UNIT,
    conventions: be.conventions,
    dates: be.dates,
    yearFractions: [...bp.yearFractions, ...sp.yearFractions],
    reads: [...bp.reads, ...sp.reads],
    steps: [...bp.steps, ...sp.steps, last],
  };
  return ok({ explanation, base: be, scenario: se });
}
