import { discountOn } from '../curve/query.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { marketDate } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import { shiftedCurve } from './horizonCurve.ts';
import { brentRoot } from './rollSolve.ts';
import { constantRateSpec, shiftedSpec, type RollView } from './rollViews.ts';
import { bondPricerOn, bondYieldFromPriceOn, parBondOn } from './strategyBonds.ts';
import { PER_100, recordBreakEven, recordCurvePoint, recordForwardGrowth, type RollTrace } from './rollTrace.ts';
import { yieldTag } from '../format/conventionTag.ts';
import { rateUnit } from '../curve/explain.ts';
import { strategyGrowths, TERM_STRATEGY_IDS, type RollContext, type StrategyId, type TermStrategyId } from './strategyValues.ts';

/**
 * Break-evens of the roll-versus-term analysis. Every root is found with Brent's method
 * (rollSolve.ts) on a stated bracket; a break-even with no root in its bracket is null (the
 * strategies do not cross there), never a silent NaN.
 */

/** Brackets: roll rates (decimal, simple) and shifts (bp). */
export const ROLL_RATE_BRACKET: readonly [number, number] = [-0.5, 1.5];
export const SHIFT_BRACKET_BP: readonly [number, number] = [-3000, 3000];
/** Maturities of the break-even curve, from settlement; only those after the horizon and on the curve are used. */
export const BREAK_EVEN_TENORS = ['1Y', '2Y', '3Y', '4Y', '5Y', '7Y', '10Y', '15Y', '20Y', '30Y'] as const;

export interface BreakEvenPoint {
  readonly tenor: string;
  readonly maturity: IsoDate;
  /** The par bond's yield today: ICMA, decimal, compounded `frequency` times a year, ACT/ACT-ICMA. */
  readonly yield: number;
  readonly frequency: number;
  /** The rise of that yield over the horizon (bp, same compounding) the carry absorbs; null when none in the bracket. */
  readonly riseBp: number | null;
}

export interface RollBreakEvens {
  /**
   * r*: the constant rate for roll legs 2..n (leg 1 fixed at today's spot), decimal, simple on the
   * roll day count, at which rolling ends equal to each term alternative. The bond's coupons are
   * reinvested at r* as well; the riding bond is sold on the chosen view's horizon curve.
   */
  readonly rollRate: Readonly<Record<TermStrategyId, number | null>>;
  /**
   * The parallel shift (bp) of the chosen view (every rate set after today, simple on the roll day
   * count, and the horizon curve's zero rates, continuous) at which rolling ends equal to each
   * term alternative. Against forwards realised it is 0 for all three.
   */
  readonly shiftBp: Readonly<Record<TermStrategyId, number | null>>;
  /**
   * The parallel rise (bp) of the chosen view's horizon curve (zero rates, continuous, curve clock)
   * at which riding ends equal to each other strategy under the chosen view: how far the curve
   * can rise before riding's advantage is gone (negative: it is behind and needs a fall).
   */
  readonly ridingRiseBp: Readonly<Record<Exclude<StrategyId, 'riding'>, number | null>>;
  /** For each maturity, the yield rise the carry can absorb (see breakEvenCurve). */
  readonly curve: readonly BreakEvenPoint[];
}

/**
 * Brent's root of f on [a, b], or null when f does not change sign there or barely depends on its
 * argument (|f(a) - f(b)| <= 1e-13: e.g. a single roll leg, fixed today, against the zero).
 */
function crossing(f: (x: number) => number, a: number, b: number, xTol: number): { x: number; iterations: number } | null {
  const fa = f(a);
  const fb = f(b);
  if (!(Math.abs(fa - fb) > 1e-13)) return null;
  return brentRoot(f, a, b, xTol);
}

/** Which break-even: rolling's constant rate r* or parallel shift of the view, or riding's rise of the horizon curve. */
export type RollBreakEvenKind = 'rate' | 'shift' | 'rise';

/**
 * A break-even under the chosen view; null when the bracket holds no crossing. `rate` and `shift`:
 * rolling's against term strategy `id`, the constant rate r* for legs 2..n (decimal, simple on the
 * roll day count) or the parallel shift of the view (bp) at which G_roll - G_id = 0. `rise`:
 * riding's against `id`, the parallel rise (bp, zero rates, continuous on the curve's clock) of the
 * view's horizon curve at which G_riding - G_id = 0 (how far the curve can rise before riding's
 * advantage is gone). With `trace`, the root is recorded with both growths evaluated at it (the
 * same functions the solver calls) and the difference left, the solver's residual.
 */
export function rollBreakEven(ctx: RollContext, chosen: RollView, id: StrategyId, kind: RollBreakEvenKind, trace?: RollTrace): number | null {
  const own = kind === 'rise' ? 'riding' : 'roll';
  const view = (x: number, t?: RollTrace): RollView =>
    kind === 'rise' ? { ...(t ? ctx.view(chosen.spec, t) : chosen), horizonCurve: shiftedCurve(chosen.horizonCurve, x) } : ctx.view(kind === 'rate' ? constantRateSpec(chosen.spec, x) : shiftedSpec(chosen.spec, x), t);
  const f = (x: number, t?: RollTrace): number => {
    const v = view(x, t);
    const g = strategyGrowths(ctx.zeroGrowth, ctx.bond, ctx.riding, ctx.horizon, v, t && { trace: t, id });
    if (t) strategyGrowths(ctx.zeroGrowth, ctx.bond, ctx.riding, ctx.horizon, v, { trace: t, id: own });
    return g[own] - g[id];
  };
  const rate = kind === 'rate';
  const [a, b] = rate ? ROLL_RATE_BRACKET : SHIFT_BRACKET_BP;
  const xTol = rate ? 1e-15 : 1e-10;
  const root = crossing(f, a, b, xTol);
  if (trace && root) recordBreakEven(trace, rate ? 'r' : 's', rate ? rateUnit('simple', ctx.strategy.rollDayCount) : shiftUnit(kind, ctx), `G_${own} - G_${id}`, root, [a, b], xTol, (t) => f(root.x, t));
  return root ? root.x : null;
}

/** What a break-even shift or rise is a bp of: the rates it moves, each with its compounding and day count. */
export const shiftUnit = (kind: RollBreakEvenKind, ctx: RollContext): string =>
  `bp, a parallel ${kind === 'rise' ? 'rise' : "shift of every roll rate set after today (simple, " + ctx.strategy.rollDayCount + ') and'} of the horizon curve's zero rates (cont, ${ctx.curve.dayCount})`;

export function rollBreakEvens(ctx: RollContext, chosen: RollView): RollBreakEvens {
  const rollRate = {} as Record<TermStrategyId, number | null>;
  const shiftBp = {} as Record<TermStrategyId, number | null>;
  const ridingRiseBp = {} as Record<Exclude<StrategyId, 'riding'>, number | null>;
  for (const id of TERM_STRATEGY_IDS) {
    rollRate[id] = rollBreakEven(ctx, chosen, id, 'rate');
    shiftBp[id] = rollBreakEven(ctx, chosen, id, 'shift');
  }
  for (const id of ['roll', 'zero', 'bond'] as const) ridingRiseBp[id] = rollBreakEven(ctx, chosen, id, 'rise');
  return { rollRate, shiftBp, ridingRiseBp, curve: breakEvenCurve(ctx) };
}

/**
 * Break-even curve: for each maturity M after the horizon H, the par bond of M (coupon = today's
 * par yield, the riding frequency) is bought today, its coupons up to H reinvested at today's
 * forwards (growth DF(p)/DF(H)), and sold at H at its own yield y_M + d (ICMA). d* is the rise at
 * which it ends equal to the zero-coupon lock-in to H (growth 1/DF(H)):
 *   sum_{p <= H} CF_p DF(p)/DF(H) + P_H(y_M + d*) = 100 / DF(H).
 * It is the yield rise the bond's carry over financing to H can absorb (the break-even yield
 * change of Tuckman and Serrat, "Fixed Income Securities", carry and roll-down; cited from memory),
 * and equals the bond's forward yield at H minus its yield today.
 */
export function breakEvenCurve(ctx: RollContext): BreakEvenPoint[] {
  return BREAK_EVEN_TENORS.flatMap((tenor) => breakEvenPoint(ctx, tenor) ?? []);
}

/** The break-even curve's point at a tenor (null: not after the horizon or not on the curve); with `trace`, its steps at the root. */
export function breakEvenPoint(ctx: RollContext, tenorText: string, trace?: RollTrace): BreakEvenPoint | null {
  const { curve, horizon } = ctx;
  const frequency = ctx.strategy.ridingFrequency;
  const tH = curve.time(horizon);
  const lnH = curve.lnDiscountAt(tH);
  const maturity = marketDate(curve.settlement, parseTenor(tenorText)!);
  if (compareIso(maturity, horizon) <= 0) return null;
  const d = discountOn(curve, maturity);
  if (!d.ok || d.value.extrapolated) return null;
  const bond = parBondOn(curve, maturity, frequency, 'maturity');
  if (!bond.ok) return null;
  const y = bondYieldFromPriceOn(bond.value, curve.settlement, 100);
  if (!y.ok) return null;
  let coupons = 0;
  bond.value.flows.forEach((f, i) => {
    if (compareIso(f.date, horizon) > 0) return;
    const time = curve.time(f.date);
    const ln = curve.lnDiscountAt(time);
    const g = Math.exp(ln - lnH);
    if (trace) recordForwardGrowth(trace, curve, i + 1, f, time, ln, g);
    coupons += f.amount * g;
  });
  const target = 100 / Math.exp(lnH);
  const price = bondPricerOn(bond.value, horizon);
  const root = crossing((dy) => coupons + price(y.value + dy) - target, -0.5, 1, 1e-15);
  if (trace && root) recordBreakEven(trace, 'd', `decimal per year, ${yieldTag(frequency)}`, 'coupons + P_y - target', root, [-0.5, 1], 1e-15, (t) => {
    recordCurvePoint(t, curve, horizon, tH, lnH, coupons, target, y.value, y.value + root.x);
    return coupons + price(y.value + root.x, t) - target;
  }, 10000, PER_100);
  return { tenor: tenorText, maturity, yield: y.value, frequency, riseBp: root === null ? null : root.x * 10000 };
}
