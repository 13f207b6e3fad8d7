import type { Curve } from '../curve/curve.ts';
import { rateFromLnDiscount } from '../rates/compounding.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import type { StrategyInputs } from './strategyInputs.ts';
import { bondValueOnCurve, type TermBond } from './strategyBonds.ts';
import type { RollLeg, RollView, ViewSpec } from './rollViews.ts';
import { recordBondTotals, recordHorizonPrice, recordReinvested, recordReturn, recordZero, type HorizonGrowthParts, type RollTrace } from './rollTrace.ts';

/**
 * Terminal values per unit invested of the four strategies under a view. Bonds are bought at par
 * (100 per 100 face), so the growth of a bond strategy is its horizon value per 100 face / 100.
 */

export const STRATEGY_IDS = ['roll', 'zero', 'bond', 'riding'] as const;
export type StrategyId = (typeof STRATEGY_IDS)[number];
export type TermStrategyId = Exclude<StrategyId, 'roll'>;
export const TERM_STRATEGY_IDS: readonly TermStrategyId[] = ['zero', 'bond', 'riding'];

/**
 * Annualised return, annual compounding on ACT/365F: (growth)^(1/T) - 1 = rateFromLnDiscount(-ln g, annual, T).
 * With `trace`, the steps from the growth step named `growthName` are recorded.
 */
export function annualisedReturn(growth: number, years: number, trace?: RollTrace, growthName = 'G'): number {
  const lnDf = -Math.log(growth);
  const r = rateFromLnDiscount(lnDf, 'annual', years);
  if (trace) recordReturn(trace, growthName, -lnDf, years, r);
  return r;
}

/**
 * The value of a term bond at the horizon per 100 face bought: reinvested coupons plus its horizon
 * price. With `trace`, each flow, its growth to the horizon or its discount factor on the horizon
 * curve, and the bond's growth `G_<id>` are recorded.
 */
export function bondAtHorizon(bond: TermBond, horizon: IsoDate, view: RollView, trace?: RollTrace, id = 'bond'): { coupons: number; price: number } {
  let coupons = 0;
  const parts: HorizonGrowthParts | undefined = trace ? { leg: -1 } : undefined;
  bond.flows.forEach((f, i) => {
    if (compareIso(f.date, horizon) > 0) return;
    if (parts) delete parts.stub;
    const g = view.growthToHorizon(f.date, parts);
    if (trace) recordReinvested(trace, i + 1, f, parts!, view.legGrowth.length, g);
    coupons += f.amount * g;
  });
  const price = compareIso(bond.maturity, horizon) > 0 ? bondValueOnCurve(bond, view.horizonCurve, trace) : 0;
  if (trace) recordBondTotals(trace, id, bond.flows.map((f, k) => ({ i: k + 1, after: compareIso(f.date, horizon) > 0 })), coupons, price, (coupons + price) / 100);
  return { coupons, price };
}

/**
 * Growth per unit invested of each strategy under a view (bonds bought at par, 100 per 100 face).
 * With `traced`, the steps of that strategy's growth are recorded in its trace (rolling's are the
 * view's own, recorded by applyView).
 */
export function strategyGrowths(zeroGrowth: number, bond: TermBond, riding: TermBond, horizon: IsoDate, view: RollView, traced?: { readonly trace: RollTrace; readonly id: StrategyId }): Record<StrategyId, number> {
  const t = (id: StrategyId): RollTrace | undefined => (traced?.id === id ? traced.trace : undefined);
  const b = bondAtHorizon(bond, horizon, view, t('bond'), 'bond');
  const r = bondAtHorizon(riding, horizon, view, t('riding'), 'riding');
  if (traced?.id === 'zero') recordZero(traced.trace, zeroGrowth);
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
  readonly view: (spec: ViewSpec, trace?: RollTrace) => RollView;
}

