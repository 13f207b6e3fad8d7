import { coreError, fail, ok, type Result } from '../result.ts';
import { diffBp, effectDates, effectRate, type EffectConventions, type EffectField } from '../scenarios/scenarioEffects.ts';
import { compareRow, type CompareBy } from '../scenarios/scenarioSnapshots.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import { explainedConventions, explainedYearFraction, explanationSink, LN_UNIT, rateDefinition, rateSteps, rateUnit, type ExplainedQuantity, type ExplainedStep, type Explanation } from './explain.ts';
import { rateTag } from '../format/conventionTag.ts';
import { referenceForwardSamples, referenceLnDiscounts, referenceZeroSamples } from './comparisonLines.ts';
import { marketDate } from '../time/dateConventions.ts';
import { queryYearFraction } from '../time/dayCount.ts';
import type { Tenor } from '../time/tenor.ts';
import { referenceRow, type ReferenceCurve, type ReferenceTrace } from '../scenarios/scenarioReference.ts';
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

const CHANGE_UNIT = 'bp (1 bp = 0.0001 of the rate)';

/** One part of a joined explanation: the part's explanation, its name, and the words leading its steps (its name by default). */
type Part = readonly [Explanation, string, string?];
type Parts = Pick<Explanation, 'dates' | 'yearFractions' | 'reads' | 'steps'>;

/**
 * Two traced numbers and their difference as one explanation: each part's dates, year fractions,
 * reads and steps named `<part> ...` (its steps' formulas led by `<label>:`), then the step `name`
 * = (second rate - first rate) x 10,000 bp with the caller's own figure `value`, in bp.
 */
export function joinedDifference(quantity: ExplainedQuantity, formula: string, name: string, first: Part, second: Part, value: number): Explanation {
  const [p, q] = [first, second].map(([e, part, label = part]): Parts => {
    const named = (n: string): string => `${part} ${n}`;
    return {
      dates: e.dates.map((d) => ({ ...d, name: named(d.name) })),
      yearFractions: e.yearFractions.map((y) => ({ ...y, name: named(y.name) })),
      reads: e.reads.map((r) => ({ ...r, name: named(r.name) })),
      steps: e.steps.map((x) => ({ ...x, name: named(x.name), formula: `${label}: ${x.formula}`, inputs: x.inputs.map(named) })),
    };
  }) as [Parts, Parts];
  const a = first[1];
  const b = second[1];
  return {
    quantity,
    formula,
    value,
    unit: CHANGE_UNIT,
    conventions: first[0].conventions,
    dates: [...p.dates, ...q.dates],
    yearFractions: [...p.yearFractions, ...q.yearFractions],
    reads: [...p.reads, ...q.reads],
    steps: [...p.steps, ...q.steps, { name, formula: `${name} = (${b} rate - ${a} rate) x 10,000 bp`, inputs: [`${b} rate`, `${a} rate`], value, unit: CHANGE_UNIT }],
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
  // The base's dates only: both rates are read on the same dates.
  const explanation: Explanation = {
    ...joinedDifference(field === 'zero' ? 'zero-change' : 'forward-change', `change = (scenario rate - base rate) x 10,000, each rate: ${be.formula} (${be.unit})`, 'change', [be, 'base', 'base curve'], [se, 'scenario', 'scenario curve'], change),
    dates: be.dates,
  };
  return ok({ explanation, base: be, scenario: se });
}

/**
 * Explains a row's difference in the snapshot comparison: the current curve's zero rate at
 * `tenor` minus the other curve's (a snapshot rebuilt from its inputs), each explained by its own
 * traced zeroOn inside compareRow, the very row the table shows, in compounding c and day count dc.
 * By 'time' each curve is read at its own settlement plus the tenor; by 'date' both on the current
 * curve's date. The last step is the table's difference bit for bit, in bp. `otherName` names the
 * other curve in the steps (e.g. `snapshot`).
 */
export function explainCurveDifference(current: Curve, other: Curve, tenor: string, by: CompareBy, c: Compounding, dc: CurveDayCount, otherName = 'snapshot'): Result<Explanation> {
  const currentSink = explanationSink({ date: tenor });
  const otherSink = explanationSink({ date: by === 'time' ? `${tenor} from its own settlement` : `${tenor} from the current settlement` });
  const row = compareRow(current, other, tenor, by, c, dc, { current: currentSink, other: otherSink });
  if (!row) return fail(coreError('schema', 'tenor', `"${tenor}" is not a tenor`));
  const ce = currentSink.explanation;
  const oe = otherSink.explanation;
  if (row.differenceBp === null || !ce || !oe) {
    return fail(coreError('schema', 'tenor', `no zero rate at ${tenor} on ${row.zero === null ? 'the current curve' : `the ${otherName} curve`} (beyond its last node without extrapolation, or on or before its settlement)`));
  }
  const lineUp = by === 'time' ? 'each curve read at its own settlement plus the tenor' : "both read on the current curve's date";
  return ok(joinedDifference('zero-difference', `difference = (current zero rate - ${otherName} zero rate) x 10,000, ${lineUp}; each rate: ${ce.formula} (${ce.unit})`, 'difference', [oe, otherName, `${otherName} curve`], [ce, 'current', 'current curve'], row.differenceBp));
}

/**
 * Explains a row of the reference curve's table: our zero rate on `date` (traced zeroOn inside
 * referenceRow, the very row the table shows) minus the reference's, both in the reference's
 * compounding and day count. A reference zero rate is taken as given; a discount factor D becomes
 * one from ln D over tau from our settlement (the row's own rateFromLnDiscount, in the steps). The
 * last step is the table's difference bit for bit, in bp.
 */
export function explainReferenceDifference(curve: Curve, ref: ReferenceCurve, date: string): Result<Explanation> {
  const point = ref.points.find((p) => p.date === date);
  if (!point) return fail(coreError('schema', 'date', `the reference curve has no row dated ${date}`));
  const trace: ReferenceTrace = { ours: explanationSink({ date }) };
  const row = referenceRow(curve, ref, point, trace);
  const ours = trace.ours.explanation;
  if (row.differenceBp === null || row.referenceZero === null || !ours) return fail(coreError('schema', 'date', `no difference on ${date}: ${row.note ?? 'the reference gives no zero rate there'}`));
  const unit = rateUnit(ref.compounding, ref.dayCount);
  const given = trace.lnDiscount === undefined; // a zero rate as the file gives it (referenceRow converts only a discount factor)
  const reference: Explanation = {
    ...ours,
    formula: given ? 'the reference zero rate on the date, as its file gives it' : ours.formula.replace('P = DF(date)', 'P = D, the reference discount factor on the date'),
    value: row.referenceZero,
    dates: [],
    yearFractions: given ? [] : [explainedYearFraction('tau', ref.dayCount, curve.settlement, date, trace.tau!)],
    reads: [],
    steps: given
      ? [{ name: 'rate', formula: 'rate = the zero rate in the reference file on this date', inputs: [], value: row.referenceZero, unit }]
      : [{ name: 'lnP', formula: `lnP = ln D, D = ${point.value} (the reference file's discount factor on this date)`, inputs: [], value: trace.lnDiscount!, unit: LN_UNIT }, ...rateSteps(trace.lnDiscount!, ref.compounding, trace.tau!, row.referenceZero, unit)],
  };
  return ok(joinedDifference('zero-difference', `difference = (our zero rate - reference zero rate) x 10,000, both ${unit}; ours: ${ours.formula}`, 'difference', [reference, 'reference', 'reference curve'], [ours, 'ours', 'our curve'], row.differenceBp));
}

/**
 * A point of the charts' reference line: its zero rate on `date` (referenceZeroSamples) or, with
 * `tenor`, its forward from `date` (referenceForwardSamples), in c and dc from our settlement; the
 * value is the sampler's own point, the steps its arithmetic from the file's values (ln D, or ln DF
 * of the file's zero rate in its own convention, then the rate from ln P over tau).
 */
export function explainReferencePoint(ref: ReferenceCurve, curve: Curve, date: string, c: Compounding, dc: CurveDayCount, tenor?: Tenor): Result<Explanation> {
  const s = tenor ? referenceForwardSamples(ref, curve, tenor, c, dc).samples : referenceZeroSamples(ref, curve, c, dc);
  const i = s.dates.indexOf(date);
  if (i < 0) return fail(coreError('schema', 'date', `the reference line has no point on ${date}`));
  const S = curve.settlement;
  const ln = referenceLnDiscounts(ref, S);
  const [b, e] = tenor ? [date, marketDate(date, tenor)] : [S, date];
  const unit = rateUnit(c, dc);
  const tau = queryYearFraction(dc, b, e);
  const steps: ExplainedStep[] = [];
  for (const [n, d] of [['start', b], ['end', e]] as const) {
    if (d === S) continue;
    const v = ref.points.find((p) => p.date === d)!.value;
    steps.push({ name: `ln D(${n})`, formula: ref.kind === 'discount' ? `ln D(${n}) = ln ${v}, the file's discount factor on ${d}` : `ln D(${n}) = ln P of the file's zero rate ${v} on ${d} (${rateTag(ref.compounding, ref.dayCount)}, ${rateDefinition(ref.compounding)}, tau = ${queryYearFraction(ref.dayCount, S, d)} from ${S})`, inputs: [], value: ln.get(d)!, unit: LN_UNIT });
  }
  const lnP = ln.get(e)! - (b === S ? 0 : ln.get(b)!);
  return ok({
    quantity: tenor ? 'forward-rate' : 'zero-rate',
    formula: `${rateDefinition(c)}, P = D(end) / D(start), D the file's discount factors (1 at ${S}), tau on ${dc}`,
    value: s.y[i]!,
    unit,
    conventions: explainedConventions(curve, c, dc),
    dates: [],
    yearFractions: [explainedYearFraction('tau', dc, b, e, tau)],
    reads: [],
    steps: [...steps, { name: 'lnP', formula: 'lnP = ln D(end) - ln D(start)', inputs: [], value: lnP, unit: LN_UNIT }, ...rateSteps(lnP, c, tau, s.y[i]!, unit)],
  });
}
