import type { Curve } from './curve.ts';
import type { Samples } from './sampling.ts';
import { lnDiscountFromRate, rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount } from '../time/dayCount.ts';
import { marketDate } from '../time/dateConventions.ts';
import type { Tenor } from '../time/tenor.ts';
import type { ReferenceCurve } from '../scenarios/scenarioReference.ts';

/**
 * Comparison lines for the charts: a reference curve read in the display convention, and the
 * samples of another curve (a snapshot's) moved onto the current curve's axis by calendar date.
 * The arithmetic is the queries' (curve/query.ts) and the reference table's (referenceDifferences):
 *   ln DF(T)  = ln D                                         (a discount factor D)
 *             = lnDiscountFromRate(z, c_ref, tau(dc_ref, S, T))  (a zero rate z)
 *   zero      r = rateFromLnDiscount(ln DF(T), c, tau(dc, S, T))
 *   forward   F = rateFromLnDiscount(ln DF(E) - ln DF(B), c, tau(dc, B, E)), E = B + tenor
 * with S the current curve's settlement (a reference file carries no settlement of its own, so it
 * is read from the curve's, as the reference table reads it).
 */

const toSamples = (rows: readonly { date: IsoDate; x: number; y: number; extrapolated: boolean }[]): Samples => ({
  dates: rows.map((r) => r.date),
  x: new Float64Array(rows.map((r) => r.x)),
  y: new Float64Array(rows.map((r) => r.y)),
  extrapolated: rows.map((r) => r.extrapolated),
});

/** ln DF of each reference date after `settlement` (in date order), read as referenceDifferences reads it. */
export function referenceLnDiscounts(ref: ReferenceCurve, settlement: IsoDate): Map<IsoDate, number> {
  const out = new Map<IsoDate, number>();
  for (const { date, value } of ref.points) {
    if (compareIso(date, settlement) <= 0) continue;
    const ln = ref.kind === 'discount' ? Math.log(value) : lnDiscountFromRate(value, ref.compounding, queryYearFraction(ref.dayCount, settlement, date));
    if (Number.isFinite(ln)) out.set(date, ln);
  }
  return out;
}

/**
 * The reference's zero rates at its own dates, in compounding c and day count dc from the curve's
 * settlement, at x = years on the curve's axis. Dates on or before settlement are left out (no period).
 * Only the given dates are points: a chart joins them with straight segments.
 */
export function referenceZeroSamples(ref: ReferenceCurve, curve: Curve, c: Compounding, dc: CurveDayCount): Samples {
  const rows = [...referenceLnDiscounts(ref, curve.settlement)].map(([date, ln]) => ({
    date,
    x: curve.time(date),
    y: rateFromLnDiscount(ln, c, queryYearFraction(dc, curve.settlement, date)),
    extrapolated: false,
  }));
  return toSamples(rows);
}

/**
 * Forwards of `tenor` that follow exactly from the reference: one for each start B (settlement, ln DF 0,
 * or a reference date) whose end B + tenor is itself a reference date, in compounding c and day count dc,
 * at x = B's years on the curve's axis. Nothing is interpolated: with fewer than two such forwards
 * (`exact` false) the reference has no forward line.
 */
export function referenceForwardSamples(ref: ReferenceCurve, curve: Curve, tenor: Tenor, c: Compounding, dc: CurveDayCount): { samples: Samples; exact: boolean } {
  const ln = referenceLnDiscounts(ref, curve.settlement);
  const starts: [IsoDate, number][] = [[curve.settlement, 0], ...ln];
  const rows = starts.flatMap(([b, lnB]) => {
    const e = marketDate(b, tenor);
    const lnE = ln.get(e);
    const tau = queryYearFraction(dc, b, e);
    return lnE === undefined || !(tau > 0) ? [] : [{ date: b, x: curve.time(b), y: rateFromLnDiscount(lnE - lnB, c, tau), extrapolated: false }];
  });
  return { samples: toSamples(rows), exact: rows.length >= 2 };
}

/**
 * Samples of another curve lined up by calendar date on `axis` (the current curve): each sample keeps
 * its date and value (a zero still runs from the other curve's own settlement, as compareCurves reads
 * it by date) and takes x = axis.time(date); dates on or before the axis's settlement are left out.
 */
export function samplesByDate(s: Samples, axis: Curve): Samples {
  const rows: { date: IsoDate; x: number; y: number; extrapolated: boolean }[] = [];
  s.dates.forEach((date, i) => {
    if (compareIso(date, axis.settlement) <= 0) return;
    rows.push({ date, x: axis.time(date), y: s.y[i]!, extrapolated: s.extrapolated[i]! });
  });
  return toSamples(rows);
}
