import { rateTag } from '../format/conventionTag.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import type { InterpolationId } from '../interpolation/types.ts';
import { periodsPerYear, type Compounding } from '../rates/compounding.ts';
import { daysBetween, type IsoDate } from '../time/date.ts';
import type { DayCount } from '../time/dayCount.ts';
import type { Curve, Extrapolation } from './curve.ts';
import { ok, type Result } from '../result.ts';

/**
 * Explanations of curve queries: what a number is, read off which nodes, by which steps.
 *
 * An explanation is data (the UI renders it, the command line prints it): the dates, the year
 * fractions with their day-count rule, the discount factors read off the curve (a node, or
 * interpolated between which nodes by which method, or extrapolated), and the arithmetic as an
 * ordered list of steps, each naming the values it is computed from (a small tree: every step's
 * `inputs` are names of dates, year fractions, reads or earlier steps). The last step is the
 * number itself, the very value the query returns.
 *
 * The queries of query.ts fill it when they are handed an {@link ExplanationSink}: the values in
 * it are the query's own (same code path; without a sink nothing is recorded). Intermediate steps
 * that the query folds into one call (the rate from ln DF in a compounding) are spelled out here
 * from the query's own inputs, so a reader can recompute them; the last step is the query's value.
 */

/** The kinds of number explained. */
export type ExplainedQuantity = 'discount-factor' | 'zero-rate' | 'forward-rate' | 'par-yield' | 'zero-change' | 'forward-change' | 'zero-difference' | 'roll-terminal' | 'roll-return' | 'roll-break-even' | 'roll-leg-rate'
  /** A figure of a bond off the curve (analytics/explainBond.ts). */
  | 'bond-figure'
  /** A meeting's implied step on the overnight curve (curve/explainMeetingStep.ts). */
  | 'meeting-step'
  /** A turn's spread solved from the quote that spans it (curve/explainTurn.ts). */
  | 'turn-spread'
  /** The spread between two curves' zero rates or forwards (curve/explainSpread.ts). */
  | 'curve-spread'
  /** A forward's sensitivity to one quote, bp per bp (analytics/explainRisk.ts). */
  | 'forward-sensitivity'
  /** A quote's model value re-priced off the curve, and its difference from the market (curve/explainQuote.ts). */
  | 'quote-model'
  | 'quote-error'
  /** A quote's model yield or residual on a smooth fit (fit/explainFit.ts). */
  | 'fit-figure'
  /** The instantaneous forward f(t) = -d ln DF / dt (instantaneousForwardOn). */
  | 'instantaneous-forward';

/** A date the number is read at. Query dates are calendar dates: no business-day rule moves them. */
export interface ExplainedDate {
  /** Its name in the steps (`date`, or `start` and `end`). */
  readonly name: string;
  /** As the user gave it (a tenor such as `2Y` or a date); the date itself when not known. */
  readonly given: string;
  readonly unadjusted: IsoDate;
  readonly adjusted: IsoDate;
  /** The business-day rule and calendar applied (queries apply none). */
  readonly rule: string;
}

/** A year fraction with the day-count rule applied to its two dates. */
export interface ExplainedYearFraction {
  /** Its name in the steps (`t` for the curve's own clock, `tau` for the rate's). */
  readonly name: string;
  readonly from: IsoDate;
  readonly to: IsoDate;
  readonly dayCount: DayCount;
  /** Actual calendar days from `from` to `to`. */
  readonly days: number;
  /** The rule in words with these dates' numbers. */
  readonly rule: string;
  /** Years. */
  readonly value: number;
}

/** A node of the curve a value is read between. */
export interface ExplainedNode {
  readonly date: IsoDate;
  /** Years on the curve's day count from settlement. */
  readonly t: number;
  readonly lnDiscount: number;
  readonly discount: number;
  /** Index of the quote (document order) that set this node; null for settlement (DF = 1). */
  readonly quote: number | null;
  /** The curve whose quote it is, when an explanation reads more than one curve (a spread's). */
  readonly curve?: string;
}

/** How a discount factor was read off the curve. */
export type ReadHow = 'settlement' | 'node' | 'interpolated' | 'extrapolated' | 'derived';

/** A discount factor read off the curve. */
export interface ExplainedRead {
  /** Its name in the steps (`DF(date)`, `DF(start)`, `DF(end)`, a par rate's payment dates `DF(t1)`, `DF(t2)`...). */
  readonly name: string;
  readonly date: IsoDate;
  /** Years on the curve's day count from settlement (the year fraction named `t...`). */
  readonly t: number;
  readonly lnDiscount: number;
  /** Unitless: the value today of 1 paid on `date`. */
  readonly discount: number;
  readonly how: ReadHow;
  readonly method: InterpolationId;
  /** The nodes it is read from: one for a node or extrapolation, two for an interpolation. */
  readonly nodes: readonly ExplainedNode[];
  /**
   * True when the value is a function of the nodes listed alone (linear zero, log-linear
   * discount, a node, settlement, extrapolation); false when the method reads every node (a spline).
   */
  readonly local: boolean;
  /** The curve it is read off when that is not the curve explained (a named curve's swap: its discounting curve, its other leg's). */
  readonly curve?: string;
  /** The continuously compounded instantaneous forward carried on past the last node (extrapolated only). */
  readonly forward?: number;
  /** How the value follows from the nodes, in plain notation. */
  readonly formula: string;
}

/** One step of the arithmetic. */
export interface ExplainedStep {
  readonly name: string;
  /** What is computed, in plain notation using the names of its inputs. */
  readonly formula: string;
  /** The names of the values it is computed from. */
  readonly inputs: readonly string[];
  readonly value: number;
  readonly unit: string;
  /** Money (decimal.js): the exact decimal text the step is computed with; `value` is its nearest double. */
  readonly text?: string;
}

/** The conventions the number is stated in. */
export interface ExplainedConventions {
  /** Compounding of the rate (null for a discount factor). */
  readonly compounding: Compounding | null;
  /** Day count of the rate's year fraction (null for a discount factor). */
  readonly dayCount: DayCount | null;
  /** Coupons per year (par yields only). */
  readonly frequency?: number;
  readonly curveDayCount: string;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
  /** 'unadjusted' for a query date; a quote's own rule (the quote check). */
  readonly businessDay: string;
  /** 'none' for a query date; a quote's own calendar (the quote check). */
  readonly calendar: string;
}

/** Everything behind one number. */
export interface Explanation {
  readonly quantity: ExplainedQuantity;
  /** The definition with its conventions filled in. */
  readonly formula: string;
  readonly value: number;
  /** Money: the value's exact decimal text (the last step's `text`). */
  readonly valueText?: string;
  readonly unit: string;
  readonly conventions: ExplainedConventions;
  readonly dates: readonly ExplainedDate[];
  readonly yearFractions: readonly ExplainedYearFraction[];
  readonly reads: readonly ExplainedRead[];
  /** The arithmetic in order; the last step's value is `value`. */
  readonly steps: readonly ExplainedStep[];
}

/**
 * Handed to a query to receive its explanation (set when the query succeeds). Made by
 * {@link explanationSink} or {@link explained}. The query hands its own values to `recorder`, which
 * lives here so that the queries carry no explanation code (the first screen loads query.ts, not
 * this module).
 */
export interface ExplanationSink {
  explanation?: Explanation;
  /** What the user typed for each date name (`{ end: '2Y' }`); shown as `given`. */
  readonly given?: Readonly<Record<string, string>>;
  readonly recorder: QueryRecorder;
}

/** A value read by lnDiscountOn: t on the curve's clock and ln DF there. */
interface LnRead {
  readonly t: number;
  readonly ln: number;
}

/** What each query hands over, its own values only (see query.ts). */
export interface QueryRecorder {
  discount(curve: Curve, sink: ExplanationSink, date: IsoDate, t: number, ln: number, discount: number): void;
  zero(curve: Curve, sink: ExplanationSink, date: IsoDate, c: Compounding, dc: DayCount, t: number, ln: number, tau: number, zero: number): void;
  zeroAtSettlement(curve: Curve, sink: ExplanationSink, c: Compounding, dc: DayCount, f0: number, ratio: number, zero: number): void;
  forward(curve: Curve, sink: ExplanationSink, start: IsoDate, end: IsoDate, c: Compounding, dc: DayCount, a: LnRead, b: LnRead, tau: number, lnP: number, rate: number): void;
  inst(curve: Curve, sink: ExplanationSink, date: IsoDate, t: number, ln: number, forward: number): void;
  par(
    curve: Curve,
    sink: ExplanationSink,
    start: IsoDate,
    end: IsoDate,
    frequency: number,
    dc: DayCount,
    s: LnRead,
    e: LnRead,
    periods: readonly { readonly start: IsoDate; readonly end: IsoDate; readonly tau: number }[],
    annuity: number,
    numerator: number,
    rate: number,
  ): void;
}

/**
 * Runs a query with a sink and returns its value with its explanation, or the query's errors.
 * `given`: what the user typed for each date name (`{ end: '2Y' }`).
 */
export function explained<T>(query: (sink: ExplanationSink) => Result<T>, given?: Readonly<Record<string, string>>): Result<{ value: T; explanation: Explanation }> {
  const sink = explanationSink(given);
  const r = query(sink);
  if (!r.ok) return r;
  return ok({ value: r.value, explanation: sink.explanation! });
}

/** The rule and calendar of a query date. */
const QUERY_DATE_RULE = 'none (a query date is read as given)';

const queryDate = (sink: ExplanationSink, name: string, date: IsoDate): ExplainedDate => ({
  name,
  given: sink.given?.[name] ?? date,
  unadjusted: date,
  adjusted: date,
  rule: QUERY_DATE_RULE,
});

/** The unit of a rate: decimal per year in its compounding and day count. */
export const rateUnit = (c: Compounding, dc: string): string => `decimal per year, ${rateTag(c, dc)}`;
export const DF_UNIT = 'unitless';
export const LN_UNIT = 'natural log of a discount factor';

/** The day-count rule applied to two dates, in words with their numbers. */
function yearFractionRule(dc: DayCount, from: IsoDate, to: IsoDate, value: number): string {
  const days = daysBetween(from, to);
  if (dc === 'ACT/360' || dc === 'ACT/365F') return `${dc}: ${days} actual days / ${dc === 'ACT/360' ? 360 : 365}`;
  if (dc === 'ACT/ACT-ISDA') return `${dc}: the days in each calendar year over that year's days (365 or 366), summed (${days} days)`;
  if (dc === 'ACT/ACT-ICMA') return `${dc}: days / (frequency x days of the regular period)`;
  // 2006 ISDA Definitions 4.16(f), (g), (h); SIFMA for 30/360-US: the day-of-month rules differ.
  return `${dc}: (360 (Y2 - Y1) + 30 (M2 - M1) + (D2 - D1)) / 360 with the ${dc} rule for the 31st and the end of February (${Math.round(value * 360)} days)`;
}

export function explainedYearFraction(name: string, dc: DayCount, from: IsoDate, to: IsoDate, value: number): ExplainedYearFraction {
  return { name, from, to, dayCount: dc, days: daysBetween(from, to), rule: yearFractionRule(dc, from, to, value), value };
}

/** The method's rule between two nodes, in plain notation. */
function methodFormula(method: InterpolationId, first: boolean): { formula: string; local: boolean } {
  if (method === 'log-linear-discount') return { formula: 'ln DF(t) = ln DF(t1) + (t - t1) / (t2 - t1) x (ln DF(t2) - ln DF(t1))', local: true };
  if (method === 'linear-zero') {
    return { formula: first ? 'ln DF(t) = -z2 t, z2 = -ln DF(t2) / t2 (flat before the first node)' : 'ln DF(t) = -z t, z = z1 + (t - t1) / (t2 - t1) x (z2 - z1), z_k = -ln DF(t_k) / t_k', local: true };
  }
  return { formula: `${method === 'cubic-zero' ? 'a spline of the zero rates' : 'a forward curve'} through every node, so nodes beyond these two count too`, local: false };
}

/**
 * How the value at t (read by the query as `ln`) comes off the curve: which nodes, which method.
 * Descriptive only: the value is the query's own.
 */
export function explainRead(curve: Curve, name: string, date: IsoDate, t: number, ln: number): ExplainedRead {
  const method = curve.interpolation;
  const base = { name, date, t, lnDiscount: ln, discount: Math.exp(ln), method };
  const pillars = curve.pillars;
  const nodeOf = (i: number): ExplainedNode => {
    if (i < 0) return { date: curve.settlement, t: 0, lnDiscount: 0, discount: 1, quote: null };
    const p = pillars[i]!;
    const y = curve.lnDiscountAt(p.t);
    return { date: p.date, t: p.t, lnDiscount: y, discount: Math.exp(y), quote: p.quote };
  };
  if (t <= 0) return { ...base, how: 'settlement', nodes: [nodeOf(-1)], local: true, formula: 'DF = 1' };
  if (curve.onNodes !== true) {
    return { ...base, how: 'derived', nodes: [], local: false, formula: 'a derived curve' };
  }
  const last = pillars.length - 1;
  if (t > curve.lastT && last >= 0) {
    const forward = curve.forwardAt(curve.lastT);
    return {
      ...base,
      how: 'extrapolated',
      nodes: [nodeOf(last)],
      local: true,
      forward,
      formula: 'ln DF(t) = ln DF(t1) - f1 (t - t1), f1 the last node\'s instantaneous forward (continuous)',
    };
  }
  let i = 0;
  while (i <= last && pillars[i]!.t < t) i++;
  if (i <= last && pillars[i]!.t === t) return { ...base, how: 'node', nodes: [nodeOf(i)], local: true, formula: 'a node' };
  const rule = methodFormula(method, i === 0);
  return { ...base, how: 'interpolated', nodes: [nodeOf(i - 1), nodeOf(i)], local: rule.local, formula: `${INTERPOLATORS[method].label}: ${rule.formula}` };
}

/**
 * The steps that turn ln P (the log of a discount factor over a period of tau years) into the
 * rate in compounding c, ending in `rate`, the query's value. Names: `lnP`, `tau`.
 */
export function rateSteps(lnP: number, c: Compounding, tau: number, rate: number, unit: string): ExplainedStep[] {
  const m = periodsPerYear(c);
  if (m === Infinity) return [{ name: 'rate', formula: 'rate = -lnP / tau', inputs: ['lnP', 'tau'], value: rate, unit }];
  // simple: 1/P - 1 over the period, then / tau; periodic: P^(-1/(m tau)) - 1 per period, then x m.
  return [
    { name: 'growth', formula: m === 0 ? 'growth = 1/P - 1 = expm1(-lnP)' : `growth = P^(-1/(${m} tau)) - 1 = expm1(-lnP / (${m} tau))`, inputs: ['lnP', 'tau'], value: Math.expm1(m === 0 ? -lnP : -lnP / (m * tau)), unit: 'unitless' },
    { name: 'rate', formula: m === 0 ? 'rate = growth / tau' : `rate = ${m} x growth`, inputs: ['growth', 'tau'], value: rate, unit },
  ];
}

/** The rate definition in words for a formula line. */
export function rateDefinition(c: Compounding): string {
  if (c === 'continuous') return 'P = exp(-rate x tau)';
  if (c === 'simple') return 'P = 1 / (1 + rate x tau)';
  const m = periodsPerYear(c);
  return `P = (1 + rate / ${m})^(-${m} tau)`;
}

const conventionsOf = (curve: Curve, c: Compounding | null, dc: DayCount | null, frequency?: number): ExplainedConventions => ({
  compounding: c,
  dayCount: dc,
  ...(frequency === undefined ? {} : { frequency }),
  curveDayCount: curve.dayCount,
  interpolation: curve.interpolation,
  extrapolation: curve.extrapolation,
  businessDay: 'unadjusted',
  calendar: 'none',
});
/** A number's conventions on a curve (queries, bond figures): dates unadjusted, no calendar. */
export { conventionsOf as explainedConventions };

/** The instantaneous forward's slope by how DF(date) is read (by the method between two nodes). */
const INST_SLOPE: Readonly<Record<string, string>> = {
  'log-linear-discount': 'f = -(ln DF(t2) - ln DF(t1)) / (t2 - t1), flat between the two nodes',
  'linear-zero': 'f = z + t (z2 - z1) / (t2 - t1), z = -ln DF(date) / t, z_k = -ln DF(t_k) / t_k',
  extrapolated: 'f = f1, the last node\'s',
};

/** The recorder of the queries in query.ts: builds each explanation from the query's own values. */
export const QUERY_RECORDER: QueryRecorder = {
  discount(curve, sink, date, t, ln, discount) {
    sink.explanation = {
      quantity: 'discount-factor',
      formula: `DF = exp(ln DF(t)), ln DF read off the curve at t, years on ${curve.dayCount} from settlement`,
      value: discount,
      unit: DF_UNIT,
      conventions: conventionsOf(curve, null, null),
      dates: [queryDate(sink, 'date', date)],
      yearFractions: [explainedYearFraction('t', curve.dayCount, curve.settlement, date, t)],
      reads: [explainRead(curve, 'DF(date)', date, t, ln)],
      steps: [{ name: 'DF', formula: 'DF = exp(ln DF(date))', inputs: ['DF(date)'], value: discount, unit: DF_UNIT }],
    };
  },
  zero(curve, sink, date, c, dc, t, ln, tau, zero) {
    const unit = rateUnit(c, dc);
    sink.explanation = {
      quantity: 'zero-rate',
      formula: `${rateDefinition(c)}, P = DF(date), tau on ${dc} from settlement`,
      value: zero,
      unit,
      conventions: conventionsOf(curve, c, dc),
      dates: [queryDate(sink, 'date', date)],
      yearFractions: [explainedYearFraction('t', curve.dayCount, curve.settlement, date, t), explainedYearFraction('tau', dc, curve.settlement, date, tau)],
      reads: [explainRead(curve, 'DF(date)', date, t, ln)],
      steps: [{ name: 'lnP', formula: 'lnP = ln DF(date)', inputs: ['DF(date)'], value: ln, unit: LN_UNIT }, ...rateSteps(ln, c, tau, zero, unit)],
    };
  },
  zeroAtSettlement(curve, sink, c, dc, f0, ratio, zero) {
    const unit = rateUnit(c, dc);
    const steps: ExplainedStep[] = [
      { name: 'f0', formula: 'f0 = instantaneous forward at settlement', inputs: [], value: f0, unit: rateUnit('continuous', curve.dayCount) },
      { name: 'k', formula: `k = years on ${curve.dayCount} / years on ${dc} over the first day`, inputs: [], value: ratio, unit: 'unitless' },
      { name: 'fk', formula: 'fk = f0 x k', inputs: ['f0', 'k'], value: f0 * ratio, unit: rateUnit('continuous', dc) },
    ];
    const m = periodsPerYear(c);
    steps.push({ name: 'rate', formula: m === 0 || m === Infinity ? 'rate = fk' : `rate = ${m} expm1(fk / ${m})`, inputs: ['fk'], value: zero, unit });
    sink.explanation = {
      quantity: 'zero-rate',
      formula: `the limit of the zero rate at settlement: the instantaneous forward f0, ${c} on ${dc}`,
      value: zero,
      unit,
      conventions: conventionsOf(curve, c, dc),
      dates: [queryDate(sink, 'date', curve.settlement)],
      yearFractions: [],
      reads: [explainRead(curve, 'DF(date)', curve.settlement, 0, 0)],
      steps,
    };
  },
  forward(curve, sink, start, end, c, dc, a, b, tau, lnP, rate) {
    const unit = rateUnit(c, dc);
    sink.explanation = {
      quantity: 'forward-rate',
      formula: `${rateDefinition(c)}, P = DF(end) / DF(start), tau on ${dc} from start to end`,
      value: rate,
      unit,
      conventions: conventionsOf(curve, c, dc),
      dates: [queryDate(sink, 'start', start), queryDate(sink, 'end', end)],
      yearFractions: [
        explainedYearFraction('t(start)', curve.dayCount, curve.settlement, start, a.t),
        explainedYearFraction('t(end)', curve.dayCount, curve.settlement, end, b.t),
        explainedYearFraction('tau', dc, start, end, tau),
      ],
      reads: [explainRead(curve, 'DF(start)', start, a.t, a.ln), explainRead(curve, 'DF(end)', end, b.t, b.ln)],
      steps: [{ name: 'lnP', formula: 'lnP = ln DF(end) - ln DF(start)', inputs: ['DF(end)', 'DF(start)'], value: lnP, unit: LN_UNIT }, ...rateSteps(lnP, c, tau, rate, unit)],
    };
  },
  inst(curve, sink, date, t, ln, forward) {
    const unit = rateUnit('continuous', curve.dayCount);
    const read = explainRead(curve, 'DF(date)', date, t, ln);
    const how = read.how === 'interpolated' ? curve.interpolation : read.how;
    sink.explanation = {
      quantity: 'instantaneous-forward',
      formula: `f = -d ln DF(t) / dt, t years on ${curve.dayCount} from settlement`,
      value: forward,
      unit,
      conventions: conventionsOf(curve, 'continuous', curve.dayCount),
      dates: [queryDate(sink, 'date', date)],
      yearFractions: [explainedYearFraction('t', curve.dayCount, curve.settlement, date, t)],
      reads: [read],
      steps: [{ name: 'f', formula: INST_SLOPE[how] ?? `f = -d ln DF / dt of the ${INTERPOLATORS[curve.interpolation].label} curve at t`, inputs: ['DF(date)', 't'], value: forward, unit }],
    };
  },
  par(curve, sink, start, end, frequency, dc, s, e, periods, annuity, numerator, rate) {
    const n = periods.length;
    const unit = `decimal per year, paid ${frequency} times a year, ${dc}`;
    const names = periods.map((_, i) => i + 1);
    sink.explanation = {
      quantity: 'par-yield',
      formula: `rate = (DF(start) - DF(end)) / sum of tau_i DF(t_i) over ${n} periods of 1/${frequency} year back from the end, tau_i on ${dc}`,
      value: rate,
      unit,
      conventions: conventionsOf(curve, null, dc, frequency),
      dates: [queryDate(sink, 'start', start), queryDate(sink, 'end', end)],
      yearFractions: periods.map((p, i) => explainedYearFraction(`tau${i + 1}`, dc, p.start, p.end, p.tau)),
      reads: [explainRead(curve, 'DF(start)', start, s.t, s.ln), explainRead(curve, 'DF(end)', end, e.t, e.ln), ...periods.map((p, i) => {
          const t = curve.time(p.end);
          return explainRead(curve, `DF(t${i + 1})`, p.end, t, curve.lnDiscountAt(t));
        })],
      steps: [
        {
          name: 'annuity',
          formula: `annuity = ${names.map((k) => `tau${k} DF(t${k})`).join(' + ')}`,
          inputs: names.flatMap((k) => [`tau${k}`, `DF(t${k})`]),
          value: annuity,
          unit: 'years',
        },
        { name: 'numerator', formula: 'numerator = DF(start) - DF(end) = DF(start) x -expm1(ln DF(end) - ln DF(start))', inputs: ['DF(start)', 'DF(end)'], value: numerator, unit: DF_UNIT },
        { name: 'rate', formula: 'rate = numerator / annuity', inputs: ['numerator', 'annuity'], value: rate, unit },
      ],
    };
  },
};

/** A sink for one query; `given`: what the user typed for each date name. */
export const explanationSink = (given?: Readonly<Record<string, string>>): ExplanationSink => (given ? { given, recorder: QUERY_RECORDER } : { recorder: QUERY_RECORDER });
