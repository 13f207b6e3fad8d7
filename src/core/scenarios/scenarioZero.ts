import { curveFromLnDiscount, frameOf, type Curve } from '../curve/curve.ts';
import { shiftAt, shiftSlopeAt, type ResolvedShift } from './scenarioShape.ts';

const BP = 1e-4;

/**
 * The base curve moved in zero space: DF'(t) = DF(t) exp(-Delta(t) t), Delta in bp converted to a
 * decimal, t in years on the curve's own axis, so every continuously compounded zero rate on that
 * axis moves by exactly Delta(t):
 *   ln DF'(t) = ln DF(t) - Delta(t) t
 *   f'(t) = -d ln DF'/dt = f(t) + Delta(t) + Delta'(t) t   (instantaneous, continuous; Delta' right-continuous)
 * Pillars keep their dates with moved discount factors. The result is a full {@link Curve}.
 */
export function shiftZeroCurve(base: Curve, shift: ResolvedShift): Curve {
  const d = (t: number): number => shiftAt(shift, t) * BP;
  return curveFromLnDiscount(
    { ...frameOf(base), pillars: base.pillars.map((p) => ({ ...p, discount: p.discount * Math.exp(-d(p.t) * p.t) })) },
    {
      lnDiscount: (t) => base.lnDiscountAt(t) - d(t) * t,
      forward: (t) => base.forwardAt(t) + d(t) + shiftSlopeAt(shift, t) * BP * t,
    },
    'as-given',
  );
}
