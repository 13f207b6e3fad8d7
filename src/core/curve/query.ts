import { rateFromLnDiscount, rateLimitFromInstantaneous, type Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { addDays, compareIso, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount, type DayCount } from '../time/dayCount.ts';
import { marketDate, UNADJUSTED } from '../time/dateConventions.ts';
import type { Tenor } from '../time/tenor.ts';
import { fixedLegPeriods } from '../instruments/swap.ts';
import type { Curve } from './curve.ts';
import type { ExplanationSink } from './explain.ts';

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
  if (sink) sink.recorder.discount(curve, sink, date, r.value.t, r.value.ln, discount);
  return ok({ date, t: r.value.t, discount, extrapolated: r.value.extrapolated });
}

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
    if (sink) sink.recorder.zeroAtSettlement(curve, sink, c, dc, f0, ratio, zero);
  } else if (tau <= 0) {
    return fail(coreError('empty-period', path, `${path}: from ${curve.settlement} to ${date} is an empty period on ${dc}; choose a later date or another day count`));
  } else {
    zero = rateFromLnDiscount(ln, c, tau);
    if (sink) sink.recorder.zero(curve, sink, date, c, dc, t, ln, tau, zero);
  }
  return ok({ date, t, discount: Math.exp(ln), extrapolated, zero });
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
  if (sink) sink.recorder.forward(curve, sink, start, end, c, dc, a.value, b.value, tau, lnP, rate);
  return ok({ start, end, tau, rate, extrapolated: a.value.extrapolated || b.value.extrapolated });
}

/** Instantaneous forward f(t) = -d lnDF/dt at a date, continuously compounded per year on the curve's clock. With a sink, its explanation. */
export function instantaneousForwardOn(curve: Curve, date: IsoDate, path = 'date', sink?: ExplanationSink): Result<{ t: number; forward: number; extrapolated: boolean }> {
  const r = lnDiscountOn(curve, date, path);
  if (!r.ok) return r;
  const { t, ln, extrapolated } = r.value;
  const forward = curve.forwardAt(t);
  if (sink) sink.recorder.inst(curve, sink, date, t, ln, forward);
  return ok({ t, forward, extrapolated });
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
  const periods = fixedLegPeriods(start, end, frequency, dc, eom);
  for (const p of periods) annuity += p.tau * Math.exp(curve.lnDiscountAt(curve.time(p.end)));
  // DF(S) - DF(E) as DF(S) (1 - DF(E)/DF(S)) with expm1: no cancellation for a short period.
  const dfS = Math.exp(s.value.ln);
  const numerator = dfS * -Math.expm1(e.value.ln - s.value.ln);
  const rate = numerator / annuity;
  // The recorder reads each payment date's DF as the loop did (the same calls on the same curve: the same doubles).
  if (sink) sink.recorder.par(curve, sink, start, end, frequency, dc, s.value, e.value, periods, annuity, numerator, rate);
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
