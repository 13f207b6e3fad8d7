import { curveFromNodes, type Curve } from '../curve/curve.ts';
import { INTERPOLATORS } from '../interpolation/registry.ts';
import { coreError, fail, type Result } from '../result.ts';

/**
 * Step in ln DF for the node partials of the monotone-convex interpolations (not linear in the
 * nodes). Near a boundary between the method's regions the curve bends sharply within about 1e-5
 * of ln DF (measured on the demo market: a central difference at 1e-5 misses by 12%), so the
 * step is small and two steps are Richardson-combined.
 */
export const NODE_PARTIAL_STEP = 1e-7;
/** Interpolations whose ln DF is linear in the nodes: any step is exact, so a large one avoids rounding. */
const LINEAR_IN_NODES = new Set(['log-linear-discount', 'linear-zero', 'cubic-zero']);
const LINEAR_STEP = 1e-2;

/**
 * Partial derivatives d lnDF(t_k) / d x_j of a curve's interpolated ln discount factor at the
 * times `times` (years on the curve's axis) with respect to its nodes x_j = ln DF(T_j),
 * j = 1..n (the pillars). Returned row-major: out[k * n + (j - 1)].
 *
 * The interpolation (and the flat-forward extension past the last pillar) is rebuilt with node j
 * moved by +-h and differenced centrally. For the methods that are linear in the nodes
 * (log-linear discount, linear zero, natural cubic zero on zeros z_j = -x_j / t_j) the difference
 * is exact for any h, so h = 0.01 keeps rounding near 1e-14; for monotone convex, which bends
 * sharply near the boundaries of its regions, central differences at h = NODE_PARTIAL_STEP = 1e-7
 * and h/2, Richardson-combined (rounding about 1e-9). No bootstrap is repeated: this is the "dF/dnodes" half of the implicit-function rule.
 *
 * A curve with turns (`curve.turned`, bootstrap.ts): the nodes are the smooth curve's,
 * x_j = ln DF(T_j) - ln J(T_j) (the turns' share, turns.ts `turnLn`, moves with no node), which is
 * what the bootstrap solved; and each turn whose spread was solved from a quote (`solveFrom`) is
 * one more unknown after the pillars (the quote has no pillar of its own), with
 * d lnDF(t) / d s = -d(t) / 360, d(t) the turn's days before t. So the columns number
 * `nodeCount(curve)` = pillars + solved spreads, one per quote the curve was built from.
 *
 * `spotBridge`: the time of a build's spot bridge (its `spotGap.t`, bootstrap/spotBridge.ts), a
 * node of the interpolation that is no pillar, tied to the first pillar's node by
 * ln DF(t_s) = (t_s / t_1) x_1; it is rebuilt with that tie, so it moves with x_1. Without it a
 * global method's curve (cubic zero, monotone convex) is rebuilt without the bridge and its
 * partials near the short end are off.
 */
export function nodePartials(curve: Curve, times: ArrayLike<number>, spotBridge?: number): Float64Array {
  const n = curve.pillars.length;
  const turned = curve.turned;
  const solved = solvedSpans(curve);
  const cols = n + solved.length;
  const m = times.length;
  const out = new Float64Array(m * cols);
  const first = curve.pillars[0]?.t ?? 0;
  const bridge = spotBridge !== undefined && spotBridge > 0 && spotBridge < first ? spotBridge / first : null;
  const shift = bridge === null ? 0 : 1;
  const ts = new Float64Array(n + 1 + shift);
  const ys = new Float64Array(n + 1 + shift);
  curve.pillars.forEach((p, i) => {
    ts[i + 1 + shift] = p.t;
    ys[i + 1 + shift] = Math.log(p.discount) - (turned ? turned.lnAt(turned.spans, p.t) : 0);
  });
  if (bridge !== null) (ts[1] = spotBridge!), (ys[1] = bridge * ys[2]!);
  const spec = INTERPOLATORS[curve.interpolation];
  const build = (): Curve =>
    curveFromNodes(curve.settlement, curve.dayCount, curve.interpolation, curve.extrapolation, curve.pillars, spec.build(ts, ys));
  const linear = LINEAR_IN_NODES.has(curve.interpolation);
  const h = linear ? LINEAR_STEP : NODE_PARTIAL_STEP;
  const central = (pillar: number, step: number, into: Float64Array): void => {
    const j = pillar + shift;
    const base = ys[j]!;
    // The bridge's node follows the first pillar's.
    const tied = bridge !== null && pillar === 1;
    ys[j] = base + step;
    if (tied) ys[1] = bridge * ys[j]!;
    const up = build();
    ys[j] = base - step;
    if (tied) ys[1] = bridge * ys[j]!;
    const down = build();
    ys[j] = base;
    if (tied) ys[1] = bridge * base;
    for (let k = 0; k < m; k++) {
      const t = times[k]!;
      into[k] = t <= 0 ? 0 : (up.lnDiscountAt(t) - down.lnDiscountAt(t)) / (2 * step);
    }
  };
  const a = new Float64Array(m);
  const b = new Float64Array(m);
  for (let j = 1; j <= n; j++) {
    central(j, h, a);
    if (!linear) central(j, h / 2, b);
    for (let k = 0; k < m; k++) out[k * cols + (j - 1)] = linear ? a[k]! : (4 * b[k]! - a[k]!) / 3;
  }
  // A solved spread's column: ln J is linear in the spread, lnJump = -s days / 360.
  solved.forEach((span, i) => {
    const unit = [{ ...span, lnJump: -span.days / 360 }];
    for (let k = 0; k < m; k++) out[k * cols + n + i] = turned!.lnAt(unit, times[k]!);
  });
  return out;
}

/** The turns of a curve whose spread was solved from a quote (each one more unknown after the pillars). */
/** The curve's turns whose spread was solved from a quote: its unknowns after the pillars, in this order. */
export const solvedSpans = (curve: Curve) => curve.turned?.spans.filter((s) => typeof s.solveFrom === 'number') ?? [];

/** The unknowns of a curve's build: its pillars and its solved turn spreads, one per quote it was built from. */
export const nodeCount = (curve: Curve): number => curve.pillars.length + solvedSpans(curve).length;

/** Refuses quotes that are not the ones `curve` was built from (one per unknown), naming both counts; null when they match. */
export function wrongQuoteCount(curve: Curve, n: number): Result<never> | null {
  const m = nodeCount(curve);
  return n === m ? null : fail(coreError('schema', 'quotes', `the curve was built from ${m} quotes but ${n} were given; pass the quotes it was built from`));
}
