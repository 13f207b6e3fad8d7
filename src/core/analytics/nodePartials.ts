import { curveFromNodes, type Curve } from '../curve/curve.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';

/** Step in ln DF used for the node partials of the non-linear interpolations. */
export const NODE_PARTIAL_STEP = 1e-6;

/**
 * Partial derivatives d lnDF(t_k) / d x_j of a curve's interpolated ln discount factor at the
 * times `times` (years on the curve's axis) with respect to its nodes x_j = ln DF(T_j),
 * j = 1..n (the pillars). Returned row-major: out[k * n + (j - 1)].
 *
 * The interpolation (and the flat-forward extension past the last pillar) is rebuilt with node j
 * moved by +-h and differenced centrally, h = NODE_PARTIAL_STEP. For the methods that are linear
 * in the nodes (log-linear discount, linear zero, natural cubic zero) this is exact up to
 * rounding (about 1e-10 relative); for monotone convex the truncation error is O(h^2), about
 * 1e-12. No bootstrap is repeated: this is the "dF/dnodes" half of the implicit-function rule.
 */
export function nodePartials(curve: Curve, times: ArrayLike<number>): Float64Array {
  const n = curve.pillars.length;
  const m = times.length;
  const out = new Float64Array(m * n);
  const ts = new Float64Array(n + 1);
  const ys = new Float64Array(n + 1);
  curve.pillars.forEach((p, i) => {
    ts[i + 1] = p.t;
    ys[i + 1] = Math.log(p.discount);
  });
  const spec = INTERPOLATORS[curve.interpolation];
  const build = (): Curve =>
    curveFromNodes(curve.settlement, curve.dayCount, curve.interpolation, curve.extrapolation, curve.pillars, spec.build(ts, ys));
  const h = NODE_PARTIAL_STEP;
  for (let j = 1; j <= n; j++) {
    const base = ys[j]!;
    ys[j] = base + h;
    const up = build();
    ys[j] = base - h;
    const down = build();
    ys[j] = base;
    for (let k = 0; k < m; k++) {
      const t = times[k]!;
      out[k * n + (j - 1)] = t <= 0 ? 0 : (up.lnDiscountAt(t) - down.lnDiscountAt(t)) / (2 * h);
    }
  }
  return out;
}
