import type { Curve } from './curve.ts';
import { fixedLegCivil } from '../instruments/swap.ts';
import { rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { civilFromIso, civilFromSerial, daysBetween, isoFromCivil, serialFromCivil, type CivilDate, type IsoDate } from '../time/date.ts';
import { marketDateCivil, UNADJUSTED } from '../time/dateConventions.ts';
import { curveClock, queryYearFractionCivil, yearFractionCivil, type CurveDayCount } from '../time/dayCount.ts';
import type { Tenor } from '../time/tenor.ts';

const ONE_MONTH: Tenor = Object.freeze({ n: 1, unit: 'M' });

/**
 * Chart sampling of a curve on a fixed grid of dates, fast enough for every keystroke: the dates,
 * their times on the curve's axis and the year fractions under the display day count are
 * computed once per grid (they do not depend on the quotes); each curve then costs one
 * `lnDiscountAt` per point. The formulas are those of the queries in curve/query.ts, which the
 * tests use as the oracle:
 *   zero      r = rateFromLnDiscount(ln DF(T), c, tau(dc, settlement, T))              (zeroOn)
 *   forward   F = rateFromLnDiscount(ln DF(E) - ln DF(S), c, tau(dc, S, E))             (forwardOn)
 *   par       c = (1 - DF(T)) / sum_i a_i DF(t_i), a_i the ACT/ACT-ICMA accrual fractions
 *             of a bond issued at settlement with coupons backward from T               (parYieldOn)
 *             (par bonds share their coupon dates along a monthly ladder: see parGrid)
 * Points past the last pillar are flagged `extrapolated`; with extrapolation `none` they are
 * dropped, as the queries refuse them.
 */
export interface SampleGrid {
  readonly settlement: IsoDate;
  readonly dates: readonly IsoDate[];
  /** Years from settlement on the curve's axis. */
  readonly t: Float64Array;
  /** Year fraction from settlement under the display day count (zero rates). */
  readonly tauZero: Float64Array;
  /** Forward period ends, their curve times, and the forward year fractions under the display day count. */
  readonly endT: Float64Array;
  readonly tauForward: Float64Array;
}

/**
 * Sample dates from settlement to `end`: denser at the short end (days grow as a blend of linear
 * and quadratic spacing, so the first weeks are sampled daily or weekly), distinct, ascending.
 */
export function sampleDays(totalDays: number, n: number): number[] {
  const out: number[] = [];
  let prev = -1;
  for (let k = 0; k <= n; k++) {
    const u = k / n;
    const d = Math.round(totalDays * (0.45 * u + 0.55 * u * u));
    if (d === prev) continue;
    prev = d;
    out.push(d);
  }
  return out;
}

export function sampleGrid(settlement: IsoDate, end: IsoDate, n: number, curveDayCount: CurveDayCount, displayDayCount: CurveDayCount, forwardTenor: Tenor): SampleGrid {
  // Civil dates and day serials throughout (performance: no ISO text parsed per point; the
  // dates are written once for the points' labels). The clocks are those of curveTime and
  // queryYearFraction on the same dates.
  const s = civilFromIso(settlement);
  const s0 = serialFromCivil(s);
  const days = sampleDays(daysBetween(settlement, end), n);
  const len = days.length;
  const curveClockOf = curveClock(curveDayCount, s);
  const displayClockOf = curveClock(displayDayCount, s);
  const dates = new Array<IsoDate>(len);
  const t = new Float64Array(len);
  const tauZero = new Float64Array(len);
  const endT = new Float64Array(len);
  const tauForward = new Float64Array(len);
  for (let i = 0; i < len; i++) {
    const d = civilFromSerial(s0 + days[i]!);
    const e = marketDateCivil(d, forwardTenor);
    dates[i] = isoFromCivil(d);
    t[i] = curveClockOf(d);
    tauZero[i] = displayClockOf(d);
    endT[i] = curveClockOf(e);
    tauForward[i] = queryYearFractionCivil(displayDayCount, d, e);
  }
  return { settlement, dates, t, tauZero, endT, tauForward };
}

export interface Samples {
  readonly dates: readonly IsoDate[];
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly extrapolated: readonly boolean[];
}

const usable = (curve: Curve, t: number): boolean => t <= curve.lastT || curve.extrapolation === 'flat-forward';

function collect(n: number, f: (i: number, push: (date: IsoDate, x: number, y: number, ex: boolean) => void) => void): Samples {
  const dates: IsoDate[] = [];
  const x: number[] = [];
  const y: number[] = [];
  const ex: boolean[] = [];
  const push = (date: IsoDate, xi: number, yi: number, e: boolean): void => {
    dates.push(date);
    x.push(xi);
    y.push(yi);
    ex.push(e);
  };
  for (let i = 0; i < n; i++) f(i, push);
  return { dates, x: new Float64Array(x), y: new Float64Array(y), extrapolated: ex };
}

/**
 * ln DF at each of the grid's sample times: what the zero line reads at each date and the forward
 * line at each start. Performance: curveSeries computes it once for both lines.
 */
export function lnOnGrid(curve: Curve, grid: SampleGrid): Float64Array {
  const n = grid.t.length;
  const ln = new Float64Array(n);
  for (let i = 0; i < n; i++) ln[i] = curve.lnDiscountAt(grid.t[i]!);
  return ln;
}

/**
 * Zero rates in compounding c on the grid's display day count (settlement itself is skipped: no
 * period). `ln`: lnOnGrid of the same curve and grid, when the caller has it.
 */
export function zeroSamples(curve: Curve, grid: SampleGrid, c: Compounding, ln: Float64Array = lnOnGrid(curve, grid)): Samples {
  return collect(grid.dates.length, (i, push) => {
    const t = grid.t[i]!;
    const tau = grid.tauZero[i]!;
    if (!(tau > 0) || !usable(curve, t)) return;
    push(grid.dates[i]!, t, rateFromLnDiscount(ln[i]!, c, tau), t > curve.lastT);
  });
}

/**
 * Forwards of the grid's tenor starting at each grid date, in compounding c on the display day
 * count. `ln`: lnOnGrid of the same curve and grid, when the caller has it.
 */
export function forwardSamples(curve: Curve, grid: SampleGrid, c: Compounding, ln: Float64Array = lnOnGrid(curve, grid)): Samples {
  return collect(grid.dates.length, (i, push) => {
    const s = grid.t[i]!;
    const e = grid.endT[i]!;
    if (!usable(curve, e) || !(grid.tauForward[i]! > 0)) return;
    const lnS = s <= 0 ? 0 : ln[i]!;
    push(grid.dates[i]!, s, rateFromLnDiscount(curve.lnDiscountAt(e) - lnS, c, grid.tauForward[i]!), e > curve.lastT);
  });
}

/** Instantaneous forwards f(t), continuously compounded per year of the curve's own clock. */
export function instantaneousSamples(curve: Curve, grid: SampleGrid): Samples {
  return collect(grid.dates.length, (i, push) => {
    const t = grid.t[i]!;
    if (!usable(curve, t)) return;
    push(grid.dates[i]!, t, curve.forwardAt(t), t > curve.lastT);
  });
}

/**
 * Par bonds for the par-yield line, as chains of coupons (computed once per grid). Node k is a
 * coupon at t[k] years (curve clock) with ACT/ACT-ICMA accrual accrual[k]; the bond maturing at
 * node k pays the coupons of the bond maturing at node prev[k] (-1: none, node k is its first
 * coupon) and then node k's. A node's chain only reaches earlier nodes. The bonds drawn are the
 * nodes in `shown` (ascending maturities), dated `dates`.
 */
export interface ParGrid {
  readonly t: Float64Array;
  readonly accrual: Float64Array;
  readonly prev: Int32Array;
  readonly shown: Int32Array;
  readonly dates: readonly IsoDate[];
}

interface ParNodes {
  readonly t: number[];
  readonly accrual: number[];
  readonly prev: number[];
  readonly shown: number[];
  readonly dates: IsoDate[];
}
const parNodes = (): ParNodes => ({ t: [], accrual: [], prev: [], shown: [], dates: [] });
const parGridOf = (n: ParNodes): ParGrid => ({ t: new Float64Array(n.t), accrual: new Float64Array(n.accrual), prev: Int32Array.from(n.prev), shown: Int32Array.from(n.shown), dates: n.dates });

/** Appends one par bond issued at settlement with its own chain: its coupons (fixedLegCivil, ACT/ACT-ICMA, no end-of-month rule), its maturity shown. */
function appendBond(out: ParNodes, s: CivilDate, maturity: CivilDate, frequency: number, clock: (d: CivilDate) => number): void {
  const leg = fixedLegCivil(s, maturity, frequency, 'ACT/ACT-ICMA', false);
  let prev = -1;
  for (let j = 0; j < leg.dates.length; j++) {
    out.t.push(clock(leg.dates[j]!));
    out.accrual.push(leg.taus[j]!);
    out.prev.push(prev);
    prev = out.t.length - 1;
  }
  if (prev < 0) return; // no coupon after settlement: no bond
  out.shown.push(prev);
  out.dates.push(isoFromCivil(maturity));
}

/** Par bonds maturing on the given dates (after settlement), each with its own coupons (the quote markers). */
export function parBondsGrid(settlement: IsoDate, maturities: readonly IsoDate[], curveDayCount: CurveDayCount, frequency: number): ParGrid {
  const s = civilFromIso(settlement);
  const clock = curveClock(curveDayCount, s);
  const out = parNodes();
  for (const m of maturities) appendBond(out, s, civilFromIso(m), frequency, clock);
  return parGridOf(out);
}

/**
 * Par bonds maturing every whole month from settlement up to `end`, and at `end` (with a few
 * shorter than a month, so the line starts near settlement). Performance:
 * they share one ladder of monthly coupon dates. A bond maturing M months out has its coupons,
 * counted back from maturity, M - step, M - 2 step, ... months out (step = 12 / frequency), the
 * first a stub from settlement; so it pays the coupons of the bond maturing M - step months out
 * and one more, and each monthly date is discounted once (about 12 per year of curve instead of
 * a schedule per bond). The ladder's dates are settlement + M months (the day clipped to the
 * month's end: marketDate under UNADJUSTED); a bond whose maturity day is clipped would count its coupons
 * back from the clipped day, so those maturities are not drawn (settlement on the 29th to 31st
 * only). The accruals are those of fixedLegCivil on the same dates, so each par yield equals the
 * one of a bond with its own schedule (parYieldOn), term for term.
 */
export function parGrid(settlement: IsoDate, end: IsoDate, curveDayCount: CurveDayCount, frequency: number): ParGrid {
  const s = civilFromIso(settlement);
  const e = civilFromIso(end);
  const clock = curveClock(curveDayCount, s);
  const out = parNodes();
  const step = 12 / frequency;
  if (!Number.isInteger(step)) throw new RangeError(`parGrid: a coupon frequency of 1, 2, 4 or 12 a year, not ${frequency}`); // programming error: display settings are validated
  const s0 = serialFromCivil(s);
  const eSerial = serialFromCivil(e);
  // Bonds shorter than a month (one coupon each), so the line starts near settlement as the zero line does.
  const firstMonth = serialFromCivil(marketDateCivil(s, ONE_MONTH)) - s0;
  for (const d of sampleDays(Math.min(firstMonth, eSerial - s0), 8)) {
    if (d > 0 && d < firstMonth && s0 + d < eSerial) appendBond(out, s, civilFromSerial(s0 + d), frequency, clock);
  }
  const base = out.t.length; // the node of month M is base + M - 1
  let lastShown = -1;
  for (let M = 1; ; M++) {
    const d = marketDateCivil(s, ONE_MONTH, UNADJUSTED, M);
    const dSerial = serialFromCivil(d);
    if (dSerial > eSerial) break;
    const first = M <= step;
    const before = marketDateCivil(s, ONE_MONTH, UNADJUSTED, M - step);
    const from = first ? s : before;
    out.t.push(clock(d));
    out.accrual.push(yearFractionCivil('ACT/ACT-ICMA', from, d, false, false, dSerial - serialFromCivil(before), frequency));
    out.prev.push(first ? -1 : base + M - 1 - step);
    if (d.d === s.d) {
      out.shown.push(base + M - 1);
      out.dates.push(isoFromCivil(d));
      lastShown = dSerial;
    }
  }
  if (lastShown !== eSerial) appendBond(out, s, e, frequency, clock);
  return parGridOf(out);
}

/** Par yields (coupon rate paid at the grid's frequency, ACT/ACT-ICMA accrual) at each bond drawn: (1 - DF(T)) / sum_i a_i DF(t_i). */
export function parSamples(curve: Curve, grid: ParGrid): Samples {
  const n = grid.t.length;
  // Annuities summed along each chain, first coupon first (the order of parYieldOn's sum).
  const annuity = new Float64Array(n);
  const ln = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const t = grid.t[k]!;
    if (!usable(curve, t)) continue; // no drawn bond's chain holds it (see below)
    const l = curve.lnDiscountAt(t);
    const p = grid.prev[k]!;
    ln[k] = l;
    annuity[k] = (p < 0 ? 0 : annuity[p]!) + grid.accrual[k]! * Math.exp(l);
  }
  return collect(grid.shown.length, (i, push) => {
    const k = grid.shown[i]!;
    const T = grid.t[k]!;
    // A bond past the usable range is not drawn; one within it has all its coupons within it.
    if (!usable(curve, T)) return;
    push(grid.dates[i]!, T, -Math.expm1(ln[k]!) / annuity[k]!, T > curve.lastT);
  });
}
