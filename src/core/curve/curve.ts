import { civilFromIso, type IsoDate } from '../time/date.ts';
import { curveClock, type CurveDayCount } from '../time/dayCount.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import type { Interpolation, InterpolationId } from '../interpolation/types.ts';

export const EXTRAPOLATIONS = ['none', 'flat-forward'] as const;
export type Extrapolation = (typeof EXTRAPOLATIONS)[number];
export const isExtrapolation = (x: unknown): x is Extrapolation => x === 'none' || x === 'flat-forward';

/** A node of a bootstrapped curve: the discount factor at a quote's maturity. */
export interface Pillar {
  readonly date: IsoDate;
  /** Years from settlement under the curve's day count. */
  readonly t: number;
  readonly discount: number;
  /** Index of the quote in the workspace document that set this node. */
  readonly quote: number;
}

/**
 * A discount curve on its own time axis t = yearFraction(dayCount, settlement, date).
 * `lnDiscountAt` and `forwardAt` are defined for every t >= 0: beyond `lastT` the instantaneous
 * forward stays at its last value (flat-forward); whether a query may go there is the caller's
 * decision (see query.ts, which enforces `extrapolation`).
 */
export interface Curve {
  readonly settlement: IsoDate;
  readonly dayCount: CurveDayCount;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
  readonly pillars: readonly Pillar[];
  /** Time of the last pillar, years. */
  readonly lastT: number;
  /** ln DF at t years, t >= 0. */
  lnDiscountAt(t: number): number;
  /** Instantaneous forward, continuously compounded per year of the curve's clock, right-continuous. */
  forwardAt(t: number): number;
  /** Years from settlement to a date on this curve's axis. */
  time(date: IsoDate): number;
}

/** Builds a curve through pillars (sorted by t, all t > 0, strictly increasing). */
export function curveFromPillars(
  settlement: IsoDate,
  dayCount: CurveDayCount,
  interpolation: InterpolationId,
  extrapolation: Extrapolation,
  pillars: readonly Pillar[],
): Curve {
  const ts = new Float64Array(pillars.length + 1);
  const ys = new Float64Array(pillars.length + 1);
  pillars.forEach((p, i) => {
    ts[i + 1] = p.t;
    ys[i + 1] = Math.log(p.discount);
  });
  return curveFromNodes(settlement, dayCount, interpolation, extrapolation, pillars, INTERPOLATORS[interpolation].build(ts, ys));
}

export function curveFromNodes(
  settlement: IsoDate,
  dayCount: CurveDayCount,
  interpolation: InterpolationId,
  extrapolation: Extrapolation,
  pillars: readonly Pillar[],
  interp: Interpolation,
): Curve {
  const last = pillars[pillars.length - 1];
  const lastT = last ? last.t : 0;
  const lastLn = last ? interp.lnDiscount(lastT) : 0;
  const lastForward = last ? interp.forward(lastT) : 0;
  // The curve's clock from the settlement date parsed once (the same values as curveTime).
  const clock = curveClock(dayCount, civilFromIso(settlement));
  return {
    settlement,
    dayCount,
    interpolation,
    extrapolation,
    pillars,
    lastT,
    lnDiscountAt: (t) => (t <= lastT ? interp.lnDiscount(t) : lastLn - lastForward * (t - lastT)),
    forwardAt: (t) => (t < lastT ? interp.forward(t) : lastForward),
    time: (date) => clock(civilFromIso(date)),
  };
}
