import type { Curve } from '../curve/curve.ts';
import { fixedLegCivil } from '../instruments/swap.ts';
import { rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { civilFromSerial, daysBetween, isoFromCivil, parseIsoDate, serialFromCivil, type CivilDate, type IsoDate } from '../time/date.ts';
import { curveClock, queryYearFractionCivil, type CurveDayCount } from '../time/dayCount.ts';
import { addTenorCivil, type Tenor } from '../time/tenor.ts';

function civilOf(date: IsoDate): CivilDate {
  const c = parseIsoDate(date);
  if (!c) throw new RangeError(`not an ISO date: ${date}`); // programming error: grids are made from a built curve's dates
  return c;
}

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
  const s = civilOf(settlement);
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
    const e = addTenorCivil(d, forwardTenor);
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

/** Zero rates in compounding c on the grid's display day count (settlement itself is skipped: no period). */
export function zeroSamples(curve: Curve, grid: SampleGrid, c: Compounding): Samples {
  return collect(grid.dates.length, (i, push) => {
    const t = grid.t[i]!;
    const tau = grid.tauZero[i]!;
    if (!(tau > 0) || !usable(curve, t)) return;
    push(grid.dates[i]!, t, rateFromLnDiscount(curve.lnDiscountAt(t), c, tau), t > curve.lastT);
  });
}

/** Forwards of the grid's tenor starting at each grid date, in compounding c on the display day count. */
export function forwardSamples(curve: Curve, grid: SampleGrid, c: Compounding): Samples {
  return collect(grid.dates.length, (i, push) => {
    const s = grid.t[i]!;
    const e = grid.endT[i]!;
    if (!usable(curve, e) || !(grid.tauForward[i]! > 0)) return;
    const lnS = s <= 0 ? 0 : curve.lnDiscountAt(s);
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

/** Coupon times and accrual fractions of par bonds maturing at each grid date (computed once per grid). */
export interface ParGrid {
  readonly dates: readonly IsoDate[];
  readonly t: Float64Array;
  readonly legs: readonly { readonly times: Float64Array; readonly accruals: Float64Array }[];
}

export function parGrid(settlement: IsoDate, end: IsoDate, n: number, curveDayCount: CurveDayCount, frequency: number): ParGrid {
  // Civil dates throughout (performance: 160 par bonds of up to a hundred coupons each; see sampleGrid).
  const s = civilOf(settlement);
  const s0 = serialFromCivil(s);
  const clock = curveClock(curveDayCount, s);
  const days = sampleDays(daysBetween(settlement, end), n).filter((d) => d > 0);
  const len = days.length;
  const dates = new Array<IsoDate>(len);
  const t = new Float64Array(len);
  const legs = new Array<ParGrid['legs'][number]>(len);
  for (let i = 0; i < len; i++) {
    const d = civilFromSerial(s0 + days[i]!);
    const leg = fixedLegCivil(s, d, frequency, 'ACT/ACT-ICMA', false);
    const m = leg.dates.length;
    const times = new Float64Array(m);
    const accruals = new Float64Array(m);
    for (let j = 0; j < m; j++) {
      times[j] = clock(leg.dates[j]!);
      accruals[j] = leg.taus[j]!;
    }
    dates[i] = isoFromCivil(d);
    t[i] = clock(d);
    legs[i] = { times, accruals };
  }
  return { dates, t, legs };
}

/** Par yields (coupon rate paid at the grid's frequency, ACT/ACT-ICMA accrual) at each grid maturity. */
export function parSamples(curve: Curve, grid: ParGrid): Samples {
  return collect(grid.dates.length, (i, push) => {
    const T = grid.t[i]!;
    if (!usable(curve, T)) return;
    const { times, accruals } = grid.legs[i]!;
    let annuity = 0;
    for (let j = 0; j < times.length; j++) annuity += accruals[j]! * Math.exp(curve.lnDiscountAt(times[j]!));
    push(grid.dates[i]!, T, -Math.expm1(curve.lnDiscountAt(T)) / annuity, T > curve.lastT);
  });
}
