/**
 * The overnight forward view and the meeting-step table: one-day forward rates read off a curve,
 * simple on ACT/360 (the convention of SOFR, €STR and fed funds fixings: Federal Reserve Bank of
 * New York, SOFR methodology; ECB €STR methodology), each day's rate
 *
 *   F(d) = (DF(d) / DF(d + 1) - 1) x 360 / 1.
 */
import type { Curve } from './curve.ts';
import type { CurveBuild } from '../bootstrap/build.ts';
import { turnLn, type TurnSpan } from '../bootstrap/turns.ts';
import type { IsoDate } from '../time/date.ts';
import { compareIso } from '../time/date.ts';
import { calendarDays, dayAfter, dayBefore } from '../time/overnightDays.ts';
import { resolveMarketDate } from '../time/dateConventions.ts';
import { topInfluencesOfLn, type QuoteInfluence } from '../analytics/explainRisk.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { explanationSink, LN_UNIT, type Explanation } from './explain.ts';
import { joinedDifference } from './explainChange.ts';

/** The convention of every rate here: simple, ACT/360, over one calendar day. */
export const OVERNIGHT_CONVENTION = { compounding: 'simple', dayCount: 'ACT/360' } as const;

/**
 * One day's forward on a curve read through `ln` (ln DF at curve time), simple ACT/360. On a curve
 * log-linear in discount factors with an actual-day axis (every meeting-step curve on ACT/365F or
 * ACT/360), nodes sit on dates, so a day lies inside one segment and its forward is one number:
 * ln DF(d) - ln DF(d + 1) = f x (1 / basis), read as the segment's forward times the day's exact
 * length, not as a difference of two rounded ln DF (about 1e-13 relative against about 1e-16).
 */
function oneDay(curve: Curve, ln: (t: number) => number, date: IsoDate, trace?: OneDayTrace): number {
  const t0 = curve.time(date);
  const t1 = curve.time(dayAfter(date));
  const basis = curve.dayCount === 'ACT/365F' ? 365 : curve.dayCount === 'ACT/360' ? 360 : 0;
  if (ln === curve.lnDiscountAt && curve.interpolation === 'log-linear-discount' && basis > 0) {
    const day = 1 / basis;
    const f = curve.forwardAt(t0 + day / 2);
    trace?.(ln, t0, t1, -(f * day), f, basis);
    return Math.expm1(f * day) * 360;
  }
  const a = ln(t0); // read first, as before (a spline keeps the segment of its last read)
  const lnP = ln(t1) - a;
  trace?.(ln, t0, t1, lnP);
  // -(ln(t1) - ln(t0)) is ln(t0) - ln(t1) bit for bit (a rounded difference changes sign exactly).
  return Math.expm1(-lnP) * 360;
}

/**
 * What oneDay hands an explanation (curve/explainMeetingStep.ts), its own values: the ln DF it reads
 * (turns left out for a meeting step), the times of the day and the next, ln P over the day, and on
 * the fast path the segment's flat forward f (continuous) with lnP = -f / basis.
 */
export type OneDayTrace = (ln: (t: number) => number, t0: number, t1: number, lnP: number, f?: number, basis?: number) => void;

/** The one-day forward from `date` to the next calendar day, simple ACT/360 (turns included). */
export const oneDayForward = (curve: Curve, date: IsoDate): number => oneDay(curve, curve.lnDiscountAt, date);

export interface OvernightPoint {
  readonly date: IsoDate;
  /** One-day forward from `date` to the next day, decimal, simple ACT/360. */
  readonly rate: number;
}

/**
 * The one-day forward of every calendar day from `from` (inclusive) to `to` (exclusive), cut at
 * the curve's last pillar: the overnight forward view, drawn as steps.
 */
export function overnightForwards(curve: Curve, from: IsoDate, to: IsoDate): OvernightPoint[] {
  const last = curve.pillars[curve.pillars.length - 1];
  const end = last !== undefined && compareIso(last.date, to) < 0 ? last.date : to;
  return calendarDays(from, end).map((date) => ({ date, rate: oneDayForward(curve, date) }));
}

export interface MeetingStepRow {
  /** The effective date (the first day at the new level). */
  readonly date: IsoDate;
  /** The one-day forward on the day before and on the effective date, decimal, simple ACT/360, turns left out. */
  readonly before: number;
  readonly after: number;
  /** after - before, in bp. */
  readonly stepBp: number;
}

/**
 * Each meeting node's implied step: the one-day forward on the effective date minus the one on the
 * day before, on the smooth curve (the turns taken out, so a turn beside a meeting does not pass
 * for a policy move). Empty when the build has no meeting steps. `trace(date)` may hand back a
 * recorder for a row's two one-day forwards (before, then after), as explainMeetingStep does.
 */
export function meetingStepTable(build: Pick<CurveBuild, 'curve' | 'overnight'>, trace?: (date: IsoDate) => OneDayTrace | undefined): MeetingStepRow[] {
  const curve = build.curve;
  const shape = build.overnight;
  if (curve === null || shape === undefined) return [];
  const spans: readonly TurnSpan[] = shape.turns;
  // Without turns the smooth curve is the curve, read as the view reads it (oneDay).
  const smooth = spans.length === 0 ? curve.lnDiscountAt : (t: number): number => curve.lnDiscountAt(t) - turnLn(spans, t);
  return shape.meetings.map((m) => {
    const before = oneDay(curve, smooth, dayBefore(m.date), trace?.(m.date));
    const after = oneDay(curve, smooth, m.date, trace?.(m.date));
    return { date: m.date, before, after, stepBp: (after - before) * 1e4 };
  });
}

/** The overnight forward view of a build: what the chart draws, all on the curve's axis (years). */
export interface OvernightView {
  /** One point per calendar day: the one-day forward from that day, simple ACT/360. */
  readonly points: readonly (OvernightPoint & { readonly t: number })[];
  /** The drawn range's end (the valuation date plus `years`, or the last pillar when sooner). */
  readonly end: IsoDate;
  readonly endT: number;
  /** Meeting nodes inside the range (meeting steps on). */
  readonly meetings: readonly { readonly date: IsoDate; readonly t: number }[];
  /** Turns inside the range: their days as [start, end) with times, and the spread in bp. */
  readonly turns: readonly { readonly name: string; readonly start: IsoDate; readonly end: IsoDate; readonly a: number; readonly b: number; readonly spreadBp: number }[];
}

/**
 * The one-day forward curve for the next `years` years from the valuation date (cut at the last
 * pillar), with the meeting dates and turns inside that range. Null without a curve.
 */
export function overnightForwardView(build: Pick<CurveBuild, 'curve' | 'overnight'>, years = 3): OvernightView | null {
  const curve = build.curve;
  if (curve === null) return null;
  const horizon = resolveMarketDate(curve.settlement, `${years}Y`);
  if (!horizon.ok) return null;
  const last = curve.pillars[curve.pillars.length - 1];
  const end = last !== undefined && compareIso(last.date, horizon.value) < 0 ? last.date : horizon.value;
  const points = overnightForwards(curve, curve.settlement, end).map((p) => ({ ...p, t: curve.time(p.date) }));
  const endT = curve.time(end);
  const shape = build.overnight;
  const meetings = (shape?.meetings ?? []).filter((m) => m.t <= endT).map((m) => ({ date: m.date, t: m.t }));
  const turns = (shape?.turns ?? []).filter((s) => s.a < endT).map((s) => ({ name: s.name, start: s.start, end: s.end, a: s.a, b: s.b, spreadBp: s.spread * 1e4 }));
  return { points, end, endT, meetings, turns };
}

/**
 * Each turn's spread on the built curve (empty without a curve): `index` in the document's turns
 * and `spreadBp` in bp (simple ACT/360, added to each of its days' overnight rate; solved from a
 * quote by bootstrap/turnSolve.ts when its span names one).
 */
export const turnSpreads = (build: Pick<CurveBuild, 'overnight'>): readonly { readonly index: number; readonly spreadBp: number }[] =>
  (build.overnight?.turns ?? []).map((s) => ({ index: s.index, spreadBp: s.spread * 1e4 }));

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
  /** The same for the level before (0) or after (1) alone: bp of the level per bp of the quote. */
  readonly levelQuotes: (k: 0 | 1) => Result<QuoteInfluence[]>;
}

export function explainMeetingStep(build: Pick<CurveBuild, 'curve' | 'overnight' | 'instruments'>, date: IsoDate): Result<MeetingStepExplanation> {
  const curve = build.curve!;
  const traces: Parameters<OneDayTrace>[] = [];
  const row = meetingStepTable(build, (d) => (d === date ? (...a) => traces.push(a) : undefined)).find((r) => r.date === date);
  if (!row) return fail(coreError('schema', 'meetingSteps', `no meeting step on ${date}`));
  const times: number[] = [];
  const weights: number[] = [];
  const [b, a] = traces.map(([ln, t0, t1, lnP, f, basis], k): Explanation => {
    const start = k ? date : dayBefore(date);
    const rate = k ? row.after : row.before;
    const sink = explanationSink();
    sink.recorder.forward(curve, sink, start, dayAfter(start), 'simple', 'ACT/360', { t: t0, ln: ln(t0) }, { t: t1, ln: ln(t1) }, 1 / 360, lnP, rate);
    const e = sink.explanation!;
    // d rate / d ln DF: 360 + rate at the day, minus that at the next (rate = expm1(ln DF(d) - ln DF(d + 1)) x 360).
    const w = (k ? 1 : -1) * (360 + rate);
    times.push(t0, t1);
    weights.push(w, -w);
    // The flat-forward read: lnP from the segment's forward f, not from the two rounded ln DF.
    return f === undefined ? e : { ...e, steps: [{ name: 'lnP', formula: `lnP = -f / ${basis}, f = -(ln DF(t2) - ln DF(t1)) / (t2 - t1) between its nodes`, inputs: ['DF(start)', 'DF(end)'], value: lnP, unit: LN_UNIT }, ...e.steps.slice(1)] };
  }) as [Explanation, Explanation];
  const explanation = joinedDifference(
    'meeting-step',
    `step = (after - before) x 10,000 bp, each a one-day forward without turns (after on the effective date, before the day before): ${b.formula}; the same under every method (log-linear in DF)`,
    'step',
    [b, 'before'],
    [a, 'after'],
    row.stepBp,
  );
  // The step's weights carry the level before with a minus sign; a level alone has its own.
  const levelQuotes = (k: 0 | 1) => topInfluencesOfLn(curve, build.instruments, times.slice(2 * k, 2 * k + 2), weights.slice(2 * k, 2 * k + 2).map((w) => (k ? w : -w)));
  return ok({ explanation, before: b, after: a, quotes: topInfluencesOfLn(curve, build.instruments, times, weights), levelQuotes });
}
