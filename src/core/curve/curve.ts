import { civilFromIso, type IsoDate } from '../time/date.ts';
import { curveClock, type CurveDayCount } from '../time/dayCount.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import type { Interpolation, InterpolationId } from '../interpolation/types.ts';
import type { TurnSpan } from '../bootstrap/turns.ts';

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
 * `lnDiscountAt` and `forwardAt` are defined for every t >= 0, with forwardAt = -d lnDiscountAt/dt:
 * beyond `lastT` a curve on nodes or a fitted form keeps its last instantaneous forward
 * (flat-forward), and a curve derived from another (a scenario, a horizon view) moves that one's
 * extension; whether a query may go there is the caller's decision (see query.ts, which enforces
 * `extrapolation`). Made only by {@link curveFromLnDiscount}.
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
  /** True for a curve that is an interpolation of its pillars (`curveFromNodes`): its pillars are its nodes. */
  readonly onNodes?: true;
  /**
   * A bootstrapped curve with turns (bootstrap.ts `turnedCurve`): the turns it carries and their
   * share of ln DF, `lnAt(spans, t)` (turns.ts `turnLn`), so the smooth curve the interpolation holds
   * is lnDiscountAt(t) - lnAt(spans, t); a turn with `solveFrom` had its spread solved from that quote.
   * The sensitivities read it (analytics/nodePartials.ts). Absent on every other curve.
   */
  readonly turned?: { readonly spans: readonly TurnSpan[]; readonly lnAt: (spans: readonly TurnSpan[], t: number) => number };
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

/** A curve's ln DF as a function of t years on its axis, with its derivative. */
export interface LnDiscountFunction {
  /** ln DF at t years. */
  lnDiscount(t: number): number;
  /** The instantaneous forward f(t) = -d lnDiscount/dt, continuously compounded per year; right-continuous. */
  forward(t: number): number;
}

/** Everything of a curve except its ln DF: what it is and where its nodes are. */
export interface CurveFrame {
  readonly settlement: IsoDate;
  readonly dayCount: CurveDayCount;
  readonly interpolation: InterpolationId;
  readonly extrapolation: Extrapolation;
  readonly pillars: readonly Pillar[];
  /** Time of the last pillar, years; default the last pillar's t (0 without pillars). */
  readonly lastT?: number;
  /** Years from settlement to a date; default the clock of `dayCount` from `settlement`. */
  readonly time?: (date: IsoDate) => number;
}

/**
 * How the function is read beyond `lastT`:
 * - 'flat-forward': the function is only read on [0, lastT]; beyond, the forward stays at
 *   forward(lastT) and ln DF goes on linearly from lnDiscount(lastT) (a curve built from nodes or
 *   a fitted form);
 * - 'as-given': the function already holds for every t >= 0 (a curve derived from another curve,
 *   which carries that curve's own extension).
 */
export type BeyondLastPillar = 'flat-forward' | 'as-given';

/**
 * The one constructor of a {@link Curve}: from a log-discount function and its derivative.
 * `lnDiscountAt` and `forwardAt` both come from `fn`, so they agree (forwardAt = -d lnDiscountAt/dt)
 * wherever `fn` does; beyond the last pillar as `beyond` says.
 */
export function curveFromLnDiscount(frame: CurveFrame, fn: LnDiscountFunction, beyond: BeyondLastPillar): Curve {
  const { settlement, dayCount, pillars } = frame;
  const last = pillars[pillars.length - 1];
  const lastT = frame.lastT ?? (last ? last.t : 0);
  // The curve's clock from the settlement date parsed once (the same values as curveTime).
  const time = frame.time ?? clockOf(dayCount, settlement);
  const { interpolation, extrapolation } = frame;
  if (beyond === 'as-given') {
    return { settlement, dayCount, interpolation, extrapolation, pillars, lastT, time, lnDiscountAt: (t) => fn.lnDiscount(t), forwardAt: (t) => fn.forward(t) };
  }
  const lastLn = last ? fn.lnDiscount(lastT) : 0;
  const lastForward = last ? fn.forward(lastT) : 0;
  return {
    settlement,
    dayCount,
    interpolation,
    extrapolation,
    pillars,
    lastT,
    time,
    lnDiscountAt: (t) => (t <= lastT ? fn.lnDiscount(t) : lastLn - lastForward * (t - lastT)),
    forwardAt: (t) => (t < lastT ? fn.forward(t) : lastForward),
  };
}

/** The frame of an existing curve, to derive another curve from it. */
export const frameOf = (base: Curve): CurveFrame => ({
  settlement: base.settlement,
  dayCount: base.dayCount,
  interpolation: base.interpolation,
  extrapolation: base.extrapolation,
  pillars: base.pillars,
  lastT: base.lastT,
  time: base.time,
});

function clockOf(dayCount: CurveDayCount, settlement: IsoDate): (date: IsoDate) => number {
  const clock = curveClock(dayCount, civilFromIso(settlement));
  return (date) => clock(civilFromIso(date));
}

/** A curve on an interpolation of its nodes (the pillars), flat-forward past the last one. */
export function curveFromNodes(
  settlement: IsoDate,
  dayCount: CurveDayCount,
  interpolation: InterpolationId,
  extrapolation: Extrapolation,
  pillars: readonly Pillar[],
  interp: Interpolation,
): Curve {
  return Object.assign(curveFromLnDiscount({ settlement, dayCount, interpolation, extrapolation, pillars }, interp, 'flat-forward'), { onNodes: true as const });
}
