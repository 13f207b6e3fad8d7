import { curveFromLnDiscount, frameOf, type Curve, type Pillar } from '../curve/curve.ts';
import { addDays, daysBetween, type IsoDate } from '../time/date.ts';

/**
 * Curves as seen from a future date H (the horizon). Each is a `Curve` whose settlement is H and
 * whose clock is today's clock moved to start at H: time(T) = t(T) - t(H), t the base curve's
 * time (years on its day count). With ACT/365F or ACT/360 this is exactly the year fraction from
 * H to T; on a 30/360 clock it is the difference of the two 30/360 times. The query functions
 * (discountOn, zeroOn, forwardOn, parYieldOn) work on them as on any curve.
 */

function movedClock(base: Curve, horizon: IsoDate): { tH: number; time: (date: IsoDate) => number } {
  const tH = base.time(horizon);
  return { tH, time: (date: IsoDate) => base.time(date) - tH };
}

/**
 * The curve seen at the horizon by time to maturity, unchanged: the term structure keeps its shape
 * in time to maturity, so DF_H(T) = DF_0(t(T) - t(H)). The pillars keep their times; their dates
 * move by the same number of days as H is from today. This is the "curve unchanged" horizon
 * curve: a bond rolls down today's curve (carry plus roll-down; Tuckman and Serrat, "Fixed Income
 * Securities", carry-roll-down under an unchanged term structure; cited from memory).
 */
export function curveSeenAtHorizon(base: Curve, horizon: IsoDate): Curve {
  const { time } = movedClock(base, horizon);
  const days = daysBetween(base.settlement, horizon);
  const pillars: Pillar[] = base.pillars.map((p) => ({ ...p, date: addDays(p.date, days) }));
  return curveFromLnDiscount({ ...frameOf(base), settlement: horizon, pillars, time }, { lnDiscount: (t) => base.lnDiscountAt(t), forward: (t) => base.forwardAt(t) }, 'as-given');
}

/**
 * The implied future curve at the horizon: DF_H(T) = DF(T) / DF(H) for T >= H, i.e.
 * ln DF_H(tau) = ln DF(t(H) + tau) - ln DF(t(H)). Its forwards are today's forwards. It is the
 * horizon curve of the "forwards realised" view. Pillars at or before H are dropped.
 */
export function impliedCurveAtHorizon(base: Curve, horizon: IsoDate): Curve {
  const { tH, time } = movedClock(base, horizon);
  const lnH = tH <= 0 ? 0 : base.lnDiscountAt(tH);
  const pillars: Pillar[] = base.pillars.filter((p) => p.t > tH).map((p) => ({ ...p, t: p.t - tH, discount: Math.exp(Math.log(p.discount) - lnH) }));
  return curveFromLnDiscount(
    { ...frameOf(base), settlement: horizon, pillars, lastT: Math.max(0, base.lastT - tH), time },
    { lnDiscount: (tau) => base.lnDiscountAt(tH + tau) - lnH, forward: (tau) => base.forwardAt(tH + tau) },
    'as-given',
  );
}

/**
 * A parallel shift of a curve's zero rates by shiftBp basis points, continuously compounded on the
 * curve's own clock: ln DF'(t) = ln DF(t) - s t, s = shiftBp / 10000; every instantaneous
 * forward moves by s as well.
 */
export function shiftedCurve(base: Curve, shiftBp: number): Curve {
  const s = shiftBp / 10000;
  if (s === 0) return base;
  return curveFromLnDiscount(
    { ...frameOf(base), pillars: base.pillars.map((p) => ({ ...p, discount: p.discount * Math.exp(-s * p.t) })) },
    { lnDiscount: (t) => base.lnDiscountAt(t) - s * t, forward: (t) => base.forwardAt(t) + s },
    'as-given',
  );
}
