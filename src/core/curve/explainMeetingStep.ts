import type { CurveBuild } from '../bootstrap/build.ts';
import { topInfluencesOfLn, type QuoteInfluence } from '../analytics/explainRisk.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { IsoDate } from '../time/date.ts';
import { dayAfter, dayBefore } from '../time/overnightDays.ts';
import { explanationSink, LN_UNIT, rateUnit, type Explanation } from './explain.ts';
import { CHANGE_UNIT, prefixed } from './explainChange.ts';
import { meetingStepTable, type OneDayTrace } from './overnightView.ts';

/**
 * The explanation of a meeting's implied step (the Overnight curve section's table): the table's
 * own computation (meetingStepTable) run with a trace, its two one-day forwards, the day before the
 * effective date and the effective date, each explained as a forward (simple ACT/360 over one day)
 * from the values oneDay read, joined under `before ...` and `after ...` names, then
 * step = (after - before) x 10,000 bp, the table's figure bit for bit.
 */
export interface MeetingStepExplanation {
  readonly explanation: Explanation;
  readonly before: Explanation;
  readonly after: Explanation;
  /** The quotes the step depends on most (bp of the step per bp of the quote's own yield), or why none. */
  readonly quotes: Result<QuoteInfluence[]>;
}

export function explainMeetingStep(build: Pick<CurveBuild, 'curve' | 'overnight' | 'instruments'>, date: IsoDate): Result<MeetingStepExplanation> {
  const curve = build.curve;
  const sides: Explanation[] = [];
  const traces: Parameters<OneDayTrace>[] = [];
  const row = meetingStepTable(build, (d) => (d === date ? (...a) => traces.push(a) : undefined)).find((r) => r.date === date);
  if (!curve || !row) return fail(coreError('schema', 'meetingSteps', `no meeting step on ${date}`));
  const times: number[] = [];
  const weights: number[] = [];
  traces.forEach(([ln, t0, t1, lnP, f, basis], k) => {
    const start = k === 0 ? dayBefore(date) : date;
    const rate = k === 0 ? row.before : row.after;
    const sink = explanationSink();
    sink.recorder.forward(curve, sink, start, dayAfter(start), 'simple', 'ACT/360', { t: t0, ln: ln(t0) }, { t: t1, ln: ln(t1) }, 1 / 360, lnP, rate);
    const e = sink.explanation!;
    const steps = f === undefined ? e.steps : [
      { name: 'f', formula: 'f = -(ln DF(t2) - ln DF(t1)) / (t2 - t1), the flat forward between the nodes t1, t2 around the day', inputs: ['DF(start)', 'DF(end)'], value: f, unit: rateUnit('continuous', curve.dayCount) },
      { name: 'lnP', formula: `lnP = -f / ${basis} (one day on ${curve.dayCount})`, inputs: ['f'], value: lnP, unit: LN_UNIT },
      ...e.steps.slice(1),
    ];
    sides.push({ ...e, steps });
    // d rate / d ln DF: 360 + rate at the day, minus that at the next (rate = expm1(ln DF(d) - ln DF(d + 1)) x 360).
    const w = (k === 0 ? -1 : 1) * (360 + rate);
    times.push(t0, t1);
    weights.push(w, -w);
  });
  const [b, a] = sides as [Explanation, Explanation];
  const bp = prefixed(b, 'before', 'before');
  const ap = prefixed(a, 'after', 'after');
  const explanation: Explanation = {
    quantity: 'meeting-step',
    formula: `step = (after - before) x 10,000 bp; after the one-day forward from the effective date, before from the day before, turns left out, each: ${b.formula} (${b.unit}); the same under every method (a stepped curve is log-linear in DF)`,
    value: row.stepBp,
    unit: CHANGE_UNIT,
    conventions: b.conventions,
    dates: [...bp.dates, ...ap.dates],
    yearFractions: [...bp.yearFractions, ...ap.yearFractions],
    reads: [...bp.reads, ...ap.reads],
    steps: [...bp.steps, ...ap.steps, { name: 'step', formula: 'step = (after rate - before rate) x 10,000 bp', inputs: ['after rate', 'before rate'], value: row.stepBp, unit: CHANGE_UNIT }],
  };
  return ok({ explanation, before: b, after: a, quotes: topInfluencesOfLn(curve, build.instruments, times, weights) });
}
