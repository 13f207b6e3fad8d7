import type { Curve } from '../curve/curve.ts';
import { rateFromLnDiscount } from '../rates/compounding.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import type { StrategyInputs } from './strategyInputs.ts';
import { bondValueOnCurve, type TermBond } from './strategyBonds.ts';
import type { RollLeg, RollView, ViewSpec } from './rollViews.ts';

/**
 * Terminal values per unit invested of the four strategies under a view. Bonds are bought at par
 * (100 per 100 face), so the growth of a bond strategy is its horizon value per 100 face / 100.
 */

export const STRATEGY_IDS = ['roll', 'zero', 'bond', 'riding'] as const;
export type StrategyId = (typeof STRATEGY_IDS)[number];
export type TermStrategyId = Exclude<StrategyId, 'roll'>;
export const TERM_STRATEGY_IDS: readonly TermStrategyId[] = ['zero', 'bond', 'riding'];

/** Annualised return, annual compounding on ACT/365F: (growth)^(1/T) - 1 = rateFromLnDiscount(-ln g, annual, T). */
export const annualisedReturn = (growth: number, years: number): number => rateFromLnDiscount(-Math.log(growth), 'annual', years);

/** The value of a term bond at the horizon per 100 face bought: reinvested coupons plus its horizon price. */
export function bondAtHorizon(bond: TermBond, horizon: IsoDate, view: RollView): { coupons: number; price: number } {
  let coupons = 0;
  for (const f of bond.flows) if (compareIso(f.date, horizon) <= 0) coupons += f.amount * view.growthToHorizon(f.date);
  return { coupons, price: compareIso(bond.maturity, horizon) > 0 ? bondValueOnCurve(bond, view.horizonCurve) : 0 };
}

/** Growth per unit invested of each strategy under a view (bonds bought at par, 100 per 100 face). */
export function strategyGrowths(zeroGrowth: number, bond: TermBond, riding: TermBond, horizon: IsoDate, view: RollView): Record<StrategyId, number> {
  const b = bondAtHorizon(bond, horizon, view);
  const r = bondAtHorizon(riding, horizon, view);
  return { roll: view.rollGrowth, zero: zeroGrowth, bond: (b.coupons + b.price) / 100, riding: (r.coupons + r.price) / 100 };
}

export interface RollContext {
  readonly curve: Curve;
  readonly strategy: StrategyInputs;
  readonly horizon: IsoDate;
  readonly legs: readonly RollLeg[];
  readonly spot: number;
  readonly zeroGrowth: number;
  readonly bond: TermBond;
  readonly riding: TermBond;
  readonly view: (spec: ViewSpec) => RollView;
}

