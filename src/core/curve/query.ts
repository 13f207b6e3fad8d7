import { periodsPerYear, rateFromLnDiscount, rateLimitFromInstantaneous, type Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { addDays, compareIso, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount, type DayCount } from '../time/dayCount.ts';
import { marketDate, UNADJUSTED } from '../time/dateConventions.ts';
import type { Tenor } from '../time/tenor.ts';
import { fixedLegPeriods } from '../instruments/swap.ts';
import type { Curve } from './curve.ts';
import {
  DF_UNIT,
  explainedYearFraction,
  explainRead,
  LN_UNIT,
  queryDate,
  rateDefinition,
  rateSteps,
  rateUnit,
  type ExplainedConventions,
  type ExplainedRead,
  type ExplainedStep,
  type Explanation,
  type ExplanationSink,
} from './explain.ts';

/** A discount factor or rate read off a curve; `extrapolated` when the date is past the last pillar. */
export interface PointValue {
  readonly date: IsoDate;
  /** Years from settlement on the curve's axis. */
  readonly t: number;
  readonly discount: number;
  readonly extrapolated: boolean;
}
export interface ZeroValue extends PointValue {
  /** Zero rate, decimal per year, in the asked compounding and day count. */
  readonly zero: number;
}
export interface ForwardValue {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Year fraction of [start, end] under the asked day count. */
  readonly tau: number;
  /** Forward rate, decimal per year, in the asked compounding and day count. */
  readonly rate: number;
  readonly extrapolated: boolean;
}

/** ln DF at a date, refusing dates before settlement and, without extrapolation, past the last pillar. */
export function lnDiscountOn(curve: Curve, date: IsoDate, path = 'date'): Result<{ t: number; ln: number; extrapolated: boolean }> {
  if (compareIso(date, curve.settlement) < 0) {
    return fail(coreError('before-settlement', path, `${path}: ${date} is before the settlement date ${curve.settlement}`));
  }
  const t = curve.time(date);
  const extrapolated = t > curve.lastT;
  if (extrapolated && curve.extrapolation === 'none') {
    const last = curve.pillars[curve.pillars.length - 1];
    return fail(
      coreError(
        'beyond-curve',
        path,
        `${path}: ${date} is beyond the curve's last pillar ${last?.date ?? curve.settlement}; choose an earlier date or extrapolation flat-forward`,
      ),
    );
  }
  return ok({ t, ln: t <= 0 ? 0 : curve.lnDiscountAt(t), extrapolated });
}

/**
 * Discount factor at a date: DF = exp(ln DF(t)), t on the curve's clock. With a sink, its
 * explanation is recorded from the same values (see explain.ts).
 */
export function discountOn(curve: Curve, date: IsoDate, path = 'date', sink?: ExplanationSink): Result<PointValue> {
  const r = lnDiscountOn(curve, date, path);
  if (!r.ok) return r;
  const discount = Math.exp(r.value.ln);
  if (sink) {
    const { t, ln } = r.value;
    sink.explanation = {
      quantity: 'discount-factor',
      formula: `DF(date) = exp(ln DF(t)), t = year fraction from settlement to the date on ${curve.dayCount} (the curve's clock), ln DF read off the curve (${curve.interpolation})`,
      value: discount,
      unit: DF_UNIT,
      conventions: conventionsOf(curve, null, null),
      dates: [queryDate(sink, 'date', date)],
      yearFractions: [explainedYearFraction('t', curve.dayCount, curve.settlement, date, t)],
      reads: [explainRead(curve, 'DF(date)', date, t, ln)],
      steps: [{ name: 'DF', formula: 'DF = exp(ln DF(date))', inputs: ['DF(date)'], value: discount, unit: DF_UNIT }],
    };
  }
  return ok({ date, t: r.value.t, discount, extrapolated: r.value.extrapolated });
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

/**
 * Zero rate at a date: the rate in compounding c and day count dc whose discount factor over
 * (settlement, date) is DF(date). At settlement it is the limit as t goes to 0: the
 * instantaneous forward f(0), re-expressed in c and scaled from the curve's clock to dc over the
 * first days.
 */
export function zeroOn(curve: Curve, date: IsoDate, c: Compounding, dc: CurveDayCount, path = 'date', sink?: ExplanationSink): Result<ZeroValue> {
  const r = lnDiscountOn(curve, date, path);
  if (!r.ok) return r;
  const { t, ln, extrapolated } = r.value;
  // In the curve's own day count tau is t: the same year fraction from settlement (curveTime).
  const tau = dc === curve.dayCount ? t : queryYearFraction(dc, curve.settlement, date);
  let zero: number;
  if (date === curve.settlement) {
    const f0 = curve.forwardAt(0);
    const ratio = clockRatio(curve, dc);
    zero = rateLimitFromInstantaneous(f0 * ratio, c);
    if (sink) sink.explanation = zeroAtSettlement(curve, sink, c, dc, f0, ratio, zero);
  } else if (tau <= 0) {
    return fail(coreError('empty-period', path, `${path}: from ${curve.settlement} to ${date} is an empty period on ${dc}; choose a later date or another day count`));
  } else {
    zero = rateFromLnDiscount(ln, c, tau);
    if (sink) {
      const unit = rateUnit(c, dc);
      sink.explanation = {
        quantity: 'zero-rate',
        formula: `zero rate from settlement to the date, ${rateDefinition(c)} with P = DF(date), tau = year fraction on ${dc}`,
        value: zero,
        unit,
        conventions: conventionsOf(curve, c, dc),
        dates: [queryDate(sink, 'date', date)],
        yearFractions: [explainedYearFraction('t', curve.dayCount, curve.settlement, date, t), explainedYearFraction('tau', dc, curve.settlement, date, tau)],
        reads: [explainRead(curve, 'DF(date)', date, t, ln)],
        steps: [{ name: 'lnP', formula: 'lnP = ln DF(date)', inputs: ['DF(date)'], value: ln, unit: LN_UNIT }, ...rateSteps(ln, c, tau, zero, unit)],
      };
    }
  }
  return ok({ date, t, discount: Math.exp(ln), extrapolated, zero });
}

/** The explanation of the zero rate at settlement itself: the limit of short zero rates. */
function zeroAtSettlement(curve: Curve, sink: ExplanationSink, c: Compounding, dc: CurveDayCount, f0: number, ratio: number, zero: number): Explanation {
  const unit = rateUnit(c, dc);
  const fUnit = rateUnit('continuous', curve.dayCount);
  const steps: ExplainedStep[] = [
    { name: 'f0', formula: 'f0 = instantaneous forward at settlement (continuous, on the curve\'s clock)', inputs: [], value: f0, unit: fUnit },
    { name: 'k', formula: `k = years on ${curve.dayCount} / years on ${dc} over the first days from settlement`, inputs: [], value: ratio, unit: 'unitless' },
    { name: 'fk', formula: 'fk = f0 x k', inputs: ['f0', 'k'], value: f0 * ratio, unit: rateUnit('continuous', dc) },
  ];
  if (c === 'continuous' || c === 'simple') steps.push({ name: 'rate', formula: 'rate = fk (the limit of short rates)', inputs: ['fk'], value: zero, unit });
  else {
    const m = periodsPerYear(c);
    steps.push({ name: 'growth', formula: `growth = expm1(fk / ${m})`, inputs: ['fk'], value: Math.expm1((f0 * ratio) / m), unit: 'unitless' });
    steps.push({ name: 'rate', formula: `rate = ${m} x growth`, inputs: ['growth'], value: zero, unit });
  }
  return {
    quantity: 'zero-rate',
    formula: `zero rate at settlement: the limit of the zero rate as the date nears settlement, the instantaneous forward f0 restated ${c} on ${dc}`,
    value: zero,
    unit,
    conventions: conventionsOf(curve, c, dc),
    dates: [queryDate(sink, 'date', curve.settlement)],
    yearFractions: [],
    reads: [explainRead(curve, 'DF(date)', curve.settlement, 0, 0)],
    steps,
  };
}

/** d t_curve / d tau_dc near settlement: the ratio of the two clocks over the first days with length. */
function clockRatio(curve: Curve, dc: CurveDayCount): number {
  for (let days = 1; days <= 7; days++) {
    const d = addDays(curve.settlement, days);
    const tau = queryYearFraction(dc, curve.settlement, d);
    if (tau > 0) return curve.time(d) / tau;
  }
  return 1;
}

/** Forward rate over [start, end]: the rate in c and dc with DF(start)/DF(end) over tau = yf(dc, start, end). */
export function forwardOn(curve: Curve, start: IsoDate, end: IsoDate, c: Compounding, dc: CurveDayCount, path = 'forward', sink?: ExplanationSink): Result<ForwardValue> {
  const a = lnDiscountOn(curve, start, `${path}.start`);
  if (!a.ok) return a;
  const b = lnDiscountOn(curve, end, `${path}.end`);
  if (!b.ok) return b;
  const tau = queryYearFraction(dc, start, end);
  if (compareIso(end, start) <= 0 || tau <= 0) {
    return fail(coreError('empty-period', path, `${path}: ${start} to ${end} is an empty period on ${dc}; the end must come after the start`));
  }
  const lnP = b.value.ln - a.value.ln;
  const rate = rateFromLnDiscount(lnP, c, tau);
  if (sink) {
    const unit = rateUnit(c, dc);
    sink.explanation = {
      quantity: 'forward-rate',
      formula: `forward rate from start to end, ${rateDefinition(c)} with P = DF(end) / DF(start), tau = year fraction from start to end on ${dc}`,
      value: rate,
      unit,
      conventions: conventionsOf(curve, c, dc),
      dates: [queryDate(sink, 'start', start), queryDate(sink, 'end', end)],
      yearFractions: [
        explainedYearFraction('t(start)', curve.dayCount, curve.settlement, start, a.value.t),
        explainedYearFraction('t(end)', curve.dayCount, curve.settlement, end, b.value.t),
        explainedYearFraction('tau', dc, start, end, tau),
      ],
      reads: [explainRead(curve, 'DF(start)', start, a.value.t, a.value.ln), explainRead(curve, 'DF(end)', end, b.value.t, b.value.ln)],
      steps: [{ name: 'lnP', formula: 'lnP = ln DF(end) - ln DF(start)', inputs: ['DF(end)', 'DF(start)'], value: lnP, unit: LN_UNIT }, ...rateSteps(lnP, c, tau, rate, unit)],
    };
  }
  return ok({ start, end, tau, rate, extrapolated: a.value.extrapolated || b.value.extrapolated });
}

/** Instantaneous forward f(t) = -d lnDF/dt at a date, continuously compounded per year on the curve's clock. */
export function instantaneousForwardOn(curve: Curve, date: IsoDate, path = 'date'): Result<{ t: number; forward: number; extrapolated: boolean }> {
  const r = lnDiscountOn(curve, date, path);
  if (!r.ok) return r;
  return ok({ t: r.value.t, forward: curve.forwardAt(r.value.t), extrapolated: r.value.extrapolated });
}

/**
 * Forward par rate of a fixed leg from start to end (frequency per year, day count dc, schedule
 * backward from the end with a short front stub): (DF(s) - DF(e)) / sum_i tau_i DF(t_i), a decimal
 * per year on the leg's own convention. With start = settlement it is the par swap rate.
 */
export function forwardParRateOn(
  curve: Curve,
  start: IsoDate,
  end: IsoDate,
  frequency: number,
  dc: DayCount,
  eom = false,
  path = 'forward',
  sink?: ExplanationSink,
): Result<{ rate: number; annuity: number; extrapolated: boolean }> {
  if (compareIso(end, start) <= 0) return fail(coreError('empty-period', path, `${path}: ${start} to ${end} is an empty period; the end must come after the start`));
  const s = lnDiscountOn(curve, start, `${path}.start`);
  if (!s.ok) return s;
  const e = lnDiscountOn(curve, end, `${path}.end`);
  if (!e.ok) return e;
  let annuity = 0;
  const reads: ExplainedRead[] | null = sink ? [] : null;
  const terms: ExplainedStep[] | null = sink ? [] : null;
  const periods = fixedLegPeriods(start, end, frequency, dc, eom);
  for (let i = 0; i < periods.length; i++) {
    const p = periods[i]!;
    const t = curve.time(p.end);
    const ln = curve.lnDiscountAt(t);
    const term = p.tau * Math.exp(ln);
    annuity += term;
    if (reads && terms) {
      reads.push(explainRead(curve, `DF(t${i + 1})`, p.end, t, ln));
      terms.push({ name: `tau${i + 1}`, formula: `tau${i + 1} = year fraction from ${p.start} to ${p.end} on ${dc}`, inputs: [], value: p.tau, unit: `years (${dc})` });
    }
  }
  // DF(S) - DF(E) as DF(S) (1 - DF(E)/DF(S)) with expm1: no cancellation for a short period.
  const dfS = Math.exp(s.value.ln);
  const numerator = dfS * -Math.expm1(e.value.ln - s.value.ln);
  const rate = numerator / annuity;
  if (sink && reads && terms) {
    const n = periods.length;
    const unit = `decimal per year, paid ${frequency} times a year, ${dc}`;
    const names = periods.map((_, i) => i + 1);
    sink.explanation = {
      quantity: 'par-yield',
      formula: `par rate = (DF(start) - DF(end)) / sum over the ${n} periods of tau_i DF(t_i); periods of 1/${frequency} year backward from the end (a short first period), tau_i on ${dc}`,
      value: rate,
      unit,
      conventions: conventionsOf(curve, null, dc, frequency),
      dates: [queryDate(sink, 'start', start), queryDate(sink, 'end', end)],
      yearFractions: periods.map((p, i) => explainedYearFraction(`tau${i + 1}`, dc, p.start, p.end, p.tau)),
      reads: [explainRead(curve, 'DF(start)', start, s.value.t, s.value.ln), explainRead(curve, 'DF(end)', end, e.value.t, e.value.ln), ...reads],
      steps: [
        {
          name: 'annuity',
          formula: `annuity = ${names.map((k) => `tau${k} DF(t${k})`).join(' + ')}`,
          inputs: names.flatMap((k) => [`tau${k}`, `DF(t${k})`]),
          value: annuity,
          unit: 'years (sum of year fractions times discount factors)',
        },
        { name: 'numerator', formula: 'numerator = DF(start) - DF(end) = DF(start) x -expm1(ln DF(end) - ln DF(start))', inputs: ['DF(start)', 'DF(end)'], value: numerator, unit: DF_UNIT },
        { name: 'rate', formula: 'rate = numerator / annuity', inputs: ['numerator', 'annuity'], value: rate, unit },
      ],
    };
  }
  return ok({ rate, annuity, extrapolated: s.value.extrapolated || e.value.extrapolated });
}

/**
 * Par yield at a maturity: the coupon (decimal per year, paid `frequency` times a year) of a bond
 * issued at settlement on regular coupons backward from the maturity that prices at 100. A short
 * first period pays its accrued share (ACT/ACT-ICMA fraction of the notional period).
 *   c = f (1 - DF(T)) / sum_i a_i DF(t_i),  a_i = 1 for full periods.
 */
export function parYieldOn(curve: Curve, maturity: IsoDate, frequency: number, path = 'maturity', sink?: ExplanationSink): Result<{ rate: number; extrapolated: boolean }> {
  const r = forwardParRateOn(curve, curve.settlement, maturity, frequency, 'ACT/ACT-ICMA', false, path, sink);
  if (!r.ok) return r;
  return ok({ rate: r.value.rate, extrapolated: r.value.extrapolated });
}

/**
 * Consecutive forwards of one tenor from settlement to a horizon: period k runs from
 * settlement + k x tenor to settlement + (k+1) x tenor (counted from settlement, never chained),
 * the last cut short at the horizon when the horizon is not a multiple of the tenor.
 */
export function forwardStrip(curve: Curve, tenor: Tenor, horizon: IsoDate, c: Compounding, dc: CurveDayCount): Result<ForwardValue[]> {
  const out: ForwardValue[] = [];
  let start = curve.settlement;
  for (let k = 1; compareIso(start, horizon) < 0 && k <= 5000; k++) {
    let end = marketDate(curve.settlement, tenor, UNADJUSTED, k);
    if (compareIso(end, horizon) > 0) end = horizon;
    const f = forwardOn(curve, start, end, c, dc, `strip[${k - 1}]`);
    if (!f.ok) return f;
    out.push(f.value);
    start = end;
  }
  return ok(out);
}

/** The curve seen from a future date H: DF_H(T) = DF(T) / DF(H) for T >= H, by date. */
export function impliedDiscountOn(curve: Curve, horizon: IsoDate, date: IsoDate, path = 'date'): Result<number> {
  if (compareIso(date, horizon) < 0) return fail(coreError('before-settlement', path, `${path}: ${date} is before the horizon ${horizon}`));
  const h = lnDiscountOn(curve, horizon, 'horizon');
  if (!h.ok) return h;
  const d = lnDiscountOn(curve, date, path);
  if (!d.ok) return d;
  return ok(Math.exp(d.value.ln - h.value.ln));
}
