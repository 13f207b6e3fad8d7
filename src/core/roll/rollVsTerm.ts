import type { Curve } from '../curve/curve.ts';
import { discountOn } from '../curve/query.ts';
import { coreError, fail, ok, type CoreError, type CoreWarning, type Result } from '../result.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { yearFraction } from '../time/dayCount.ts';
import { resolveMarketDate } from '../time/dateConventions.ts';
import { parseTenor, type Tenor } from '../time/tenor.ts';
import { bondPriceFromYieldOn, bondValueOnCurve, bondYieldFromPriceOn, parBondOn, type TermBond } from './strategyBonds.ts';
import { annualisedReturn, bondAtHorizon, STRATEGY_IDS, strategyGrowths, type RollContext, type StrategyId } from './strategyValues.ts';
import { moneyTimes, parseMoney, MoneyDecimal, type Money } from './strategyMoney.ts';
import { DEFAULT_STRATEGY, type StrategyInputs, type StrategyViewId } from './strategyInputs.ts';
import {
  applyView,
  forwardsView,
  pathRates,
  pathView,
  rollLegs,
  scenarioForwardsView,
  scenarioView,
  shiftView,
  spotRollRate,
  unchangedView,
  type RollLeg,
  type RollView,
  type ViewSpec,
} from './rollViews.ts';
import { curveSeenAtHorizon } from './horizonCurve.ts';
import { moneyUnitOf } from './rollSummary.ts';
import { yieldTag } from '../format/conventionTag.ts';
import { rollBreakEvens, type RollBreakEvens } from './rollBreakEven.ts';
import { recordLegValue, recordRidingSplit, type RollTrace } from './rollTrace.ts';
import type { ExplanationSink } from '../curve/explain.ts';

/**
 * Roll over versus term: what putting money to work for a horizon earns by rolling a short
 * money-market instrument, against (a) a zero-coupon instrument to the horizon, (b) a par coupon
 * bond maturing at the horizon with its coupons reinvested, (c) riding the curve: a par bond of a
 * longer maturity bought now and sold at the horizon, under several views of the future.
 *
 * Conventions (stated in every label of the panel):
 *   - roll legs: simple money-market rates on the roll day count (default ACT/360);
 *   - annualised returns: annual compounding on ACT/365F from settlement to the horizon,
 *     R = (V_H / A)^(1/T) - 1, T = days/365;
 *   - differences in bp: (R_strategy - R_roll) x 10000, both annual, ACT/365F;
 *   - money: decimal.js, exact in the typed amount, rounded to cents only for display;
 *   - bond yields: ICMA, compounded `frequency` times a year on ACT/ACT-ICMA.
 */

/** What each strategy is, for labels. Rates decimals; yields ICMA. */
export interface StrategyDescription {
  readonly id: StrategyId;
  readonly label: string;
  /** The strategy inside a sentence: "rolling 3M", "the zero to the horizon". */
  readonly phrase: string;
  readonly detail: string;
}

export interface StrategyOutcome {
  readonly id: StrategyId;
  /** Terminal value per unit invested (float64). */
  readonly growth: number;
  /** Money at the horizon: amount x growth, unrounded. */
  readonly terminal: Money;
  /** Annualised return, decimal, annual compounding on ACT/365F. */
  readonly annualReturn: number;
  /** terminal - roll terminal, money. */
  readonly vsRoll: Money;
  /** (annualReturn - roll annualReturn) x 10000, bp (annual, ACT/365F). */
  readonly vsRollBp: number;
}

/** The riding bond's horizon return split (money, each the part of terminal - amount). */
export interface RidingSplit {
  /** Dirty price per 100 face at the horizon on the view's horizon curve. */
  readonly horizonPrice: number;
  /** Coupons paid by the horizon with their reinvestment to it, per 100 face. */
  readonly couponsReinvested: number;
  /** Coupons plus reinvestment, plus the pull of price at an unchanged own yield, minus the amount. */
  readonly carry: Money;
  /** Price on today's curve by time to maturity minus price at the unchanged own yield. */
  readonly rollDown: Money;
  /** Price on the view's horizon curve minus price on today's curve by time to maturity. */
  readonly curveChange: Money;
}

export interface ViewOutcome {
  readonly id: StrategyViewId;
  readonly label: string;
  /** The view inside a sentence: "an unchanged curve". */
  readonly phrase: string;
  readonly description: string;
  /** Leg rates, decimals, simple on the roll day count. */
  readonly legRates: readonly number[];
  readonly strategies: readonly StrategyOutcome[];
  readonly riding: RidingSplit;
  /** The strategy with the largest terminal value (ties: the first in STRATEGY_IDS order). */
  readonly best: StrategyId;
}

export interface GrowthPoint {
  /** Years from settlement, ACT/365F. */
  readonly t: number;
  readonly date: IsoDate | null;
  /** Money (float64; for drawing only). */
  readonly value: number;
}

export interface GrowthSeries {
  readonly id: StrategyId;
  /** 'steps': value after each roll leg (constant within a leg); 'line': the term value at its constant annualised return. */
  readonly shape: 'steps' | 'line';
  readonly points: readonly GrowthPoint[];
}

export interface RollAnalysis {
  readonly settlement: IsoDate;
  readonly horizon: IsoDate;
  /** Years from settlement to the horizon, ACT/365F. */
  readonly years: number;
  readonly amount: Money;
  /** The unit shown with money: the strategy's ISO 4217 currency code, or the generic sign (moneyUnitOf). */
  readonly moneyUnit: string;
  readonly rollTenor: string;
  readonly rollDayCount: StrategyInputs['rollDayCount'];
  /** The curve's day count (its clock: horizon-curve shifts are continuous zero rates on it). */
  readonly curveDayCount: Curve['dayCount'];
  readonly legs: readonly RollLeg[];
  /** Today's spot rate for the roll tenor, decimal, simple on the roll day count. */
  readonly spotRollRate: number;
  readonly strategies: readonly StrategyDescription[];
  readonly bond: TermBond;
  readonly ridingBond: TermBond;
  /** ICMA yields of the two par bonds today, decimals compounded at their frequency (= their coupons up to a short first period). */
  readonly bondYield: number;
  readonly ridingYield: number;
  readonly views: readonly ViewOutcome[];
  /** Index of the chosen view in `views`. */
  readonly chosen: number;
  readonly breakEvens: RollBreakEvens;
  /** Money after each roll leg under the chosen view (amount x product of leg growths), unrounded. */
  readonly rollValues: readonly Money[];
  /** Growth of the amount over time under the chosen view. */
  readonly growth: readonly GrowthSeries[];
  readonly warnings: readonly CoreWarning[];
}

/** A scenario's curve as roll versus term reads it: its name and the curve. */
export interface NamedCurve {
  readonly name: string;
  readonly curve: Curve;
}

/** Resolves a horizon or maturity text (tenor or date) against the settlement. */
export function resolveDate(settlement: IsoDate, text: string, path: string): Result<IsoDate> {
  const resolved = resolveMarketDate(settlement, text, undefined, path);
  if (!resolved.ok) return fail(coreError('schema', path, `${path}: must be a tenor such as "2Y" or a date YYYY-MM-DD, not "${text}"`));
  const date = resolved.value;
  if (compareIso(date, settlement) <= 0) return fail(coreError('before-settlement', path, `${path}: ${date} must be after the settlement date ${settlement}`));
  return resolved;
}

/**
 * Runs the analysis: every view by every strategy, the break-evens under the chosen view and the
 * growth series. Errors (as values, with `strategy.*` paths) when the amount, horizon or riding
 * maturity cannot be used with this curve: a horizon beyond the curve without extrapolation, a
 * riding maturity not after the horizon, a scenario curve on another settlement date.
 */
export function analyseRollVsTerm(curve: Curve, strategy: StrategyInputs, scenarios: readonly NamedCurve[] = []): Result<RollAnalysis> {
  const set = rollSetup(curve, strategy, scenarios);
  if (!set.ok) return set;
  const { ctx, specs, chosen, warnings, years, amount, M } = set.value;
  const { legs, horizon: H, bond, riding } = ctx;
  const S = curve.settlement;
  const rollViews = specs.map((spec) => ctx.view(spec));
  const views = rollViews.map((rv) => outcomeOf(ctx, rv, amount, years));
  const chosenView = rollViews[chosen]!;
  const breakEvens = rollBreakEvens(ctx, chosenView);
  const growth = growthSeries(ctx, chosenView, views[chosen]!, amount, years);
  if (legs.some((l, k) => k > 0 && views[chosen]!.legRates[k]! < 0)) {
    warnings.push({ path: 'strategy.view', quote: null, code: 'negative-forward', message: 'some roll legs earn a negative rate under the chosen view' });
  }
  const bondYield = bondYieldFromPriceOn(bond, S, 100);
  const ridingYield = bondYieldFromPriceOn(riding, S, 100);
  // The strategies' detail texts are part of the analysis the golden check holds bit for bit, so
  // their coupon keeps its earlier form (3 decimals, a space before %) rather than formatCoupon's.
  const pct = (x: number): string => `${(x * 100).toFixed(3)} %`;
  return ok({
    settlement: S,
    horizon: H,
    years,
    amount,
    moneyUnit: moneyUnitOf(strategy.currency),
    rollTenor: strategy.rollTenor,
    rollDayCount: strategy.rollDayCount,
    curveDayCount: curve.dayCount,
    legs,
    spotRollRate: ctx.spot,
    strategies: [
      { id: 'roll', label: `Roll ${strategy.rollTenor}`, phrase: `rolling ${strategy.rollTenor}`, detail: `${legs.length} leg${legs.length === 1 ? '' : 's'} of ${strategy.rollTenor}${legs[legs.length - 1]?.short ? ', the last short' : ''}, simple ${strategy.rollDayCount}` },
      { id: 'zero', label: 'Zero to horizon', phrase: 'the zero to the horizon', detail: `zero-coupon to ${H}` },
      { id: 'bond', label: 'Par bond to horizon', phrase: 'the par bond to the horizon', detail: `coupon ${pct(bond.coupon)} (${yieldTag(strategy.bondFrequency)}) paid ${strategy.bondFrequency}x a year, coupons reinvested` },
      { id: 'riding', label: `Ride ${strategy.ridingMaturity} bond`, phrase: `riding the ${strategy.ridingMaturity} bond`, detail: `par bond to ${M}, coupon ${pct(riding.coupon)} (${yieldTag(strategy.ridingFrequency)}) paid ${strategy.ridingFrequency}x a year, sold at the horizon` },
    ],
    bond,
    ridingBond: riding,
    bondYield: bondYield.ok ? bondYield.value : bond.coupon,
    ridingYield: ridingYield.ok ? ridingYield.value : riding.coupon,
    views,
    chosen,
    breakEvens,
    growth,
    rollValues: rollValuesOf(amount, chosenView),
    warnings,
  });
}

/** What every figure of the analysis starts from: the context, the views' specs and the chosen one. */
export interface RollSetup {
  readonly ctx: RollContext;
  readonly specs: readonly ViewSpec[];
  readonly chosen: number;
  readonly warnings: CoreWarning[];
  /** Years from settlement to the horizon, ACT/365F. */
  readonly years: number;
  readonly amount: Money;
  /** The riding bond's maturity. */
  readonly M: IsoDate;
}

/**
 * The inputs resolved against the curve (amount, horizon, legs, the two par bonds, the views); the
 * errors of analyseRollVsTerm. `horizonSink`, when given, receives the explanation of the
 * horizon's discount factor (the zero strategy's growth).
 */
export function rollSetup(curve: Curve, strategy: StrategyInputs, scenarios: readonly NamedCurve[] = [], horizonSink?: ExplanationSink): Result<RollSetup> {
  const errors: CoreError[] = [];
  const warnings: CoreWarning[] = [];
  const money = parseMoney(strategy.amount);
  if (!money.ok) errors.push(coreError('schema', 'strategy.amount', `strategy.amount: ${money.message}`));
  const S = curve.settlement;
  const h = resolveDate(S, strategy.horizon, 'strategy.horizon');
  if (!h.ok) errors.push(...h.errors);
  const m = resolveDate(S, strategy.ridingMaturity, 'strategy.ridingMaturity');
  if (!m.ok) errors.push(...m.errors);
  const tenor: Tenor = parseTenor(strategy.rollTenor) ?? { n: 3, unit: 'M' };
  if (!h.ok || !m.ok || !money.ok) return fail(...errors);
  const H = h.value;
  const M = m.value;
  if (compareIso(M, H) <= 0) {
    // A suggestion past the horizon: whole years from settlement to the horizon, plus two.
    const longer = `${Math.ceil(yearFraction('ACT/365F', S, H)) + 2}Y`;
    errors.push(coreError('range', 'strategy.ridingMaturity', `strategy.ridingMaturity: the riding bond must mature after the horizon ${H}, not on ${M}; choose a longer maturity such as "${longer}"`));
  }
  const dfH = discountOn(curve, H, 'strategy.horizon', horizonSink);
  if (!dfH.ok) errors.push(...dfH.errors);
  const dfM = discountOn(curve, M, 'strategy.ridingMaturity');
  if (!dfM.ok) errors.push(...dfM.errors);
  const spot = spotRollRate(curve, tenor, strategy.rollDayCount);
  if (!spot.ok) errors.push(...spot.errors);
  const legsR = dfH.ok ? rollLegs(curve, tenor, H, strategy.rollDayCount) : dfH;
  if (!legsR.ok && dfH.ok) errors.push(...legsR.errors);
  const bondR = dfH.ok ? parBondOn(curve, H, strategy.bondFrequency, 'strategy.horizon') : dfH;
  if (!bondR.ok && dfH.ok) errors.push(...bondR.errors);
  const ridingR = dfM.ok ? parBondOn(curve, M, strategy.ridingFrequency, 'strategy.ridingMaturity') : dfM;
  if (!ridingR.ok && dfM.ok) errors.push(...ridingR.errors);
  if (errors.length > 0 || !dfH.ok || !spot.ok || !legsR.ok || !bondR.ok || !ridingR.ok) return fail(...dedupe(errors));
  if (dfH.value.extrapolated) warnings.push({ path: 'strategy.horizon', quote: null, code: 'extrapolated', message: `strategy.horizon: ${H} is beyond the last pillar; its discount factor is extrapolated flat-forward` });
  if (dfM.ok && dfM.value.extrapolated) warnings.push({ path: 'strategy.ridingMaturity', quote: null, code: 'extrapolated', message: `strategy.ridingMaturity: ${M} is beyond the last pillar; the riding bond is priced on the flat-forward extrapolation` });

  const legs = legsR.value;
  const amount = money.value;
  const years = yearFraction('ACT/365F', S, H);
  const zeroGrowth = 1 / dfH.value.discount;
  const view = (spec: ViewSpec, trace?: RollTrace): RollView => applyView(curve, legs, strategy.rollDayCount, spec, trace);
  const ctx: RollContext = { curve, strategy, horizon: H, legs, spot: spot.value, zeroGrowth, bond: bondR.value, riding: ridingR.value, view };

  const specs: ViewSpec[] = [
    forwardsView(curve, H),
    unchangedView(curve, H, spot.value, strategy.rollTenor, strategy.rollDayCount),
    pathView(curve, H, legs, pathRates(legs, strategy.path, warnings)),
    shiftView(curve, H, strategy.shiftBp),
  ];
  for (const sc of scenarios) {
    if (sc.curve.settlement !== S) {
      warnings.push({ path: `scenario:${sc.name}`, quote: null, code: 'skipped', message: `scenario "${sc.name}" settles on ${sc.curve.settlement}, not ${S}; it is left out of the views` });
      continue;
    }
    const v = scenarioView(sc.name, sc.curve, H, tenor, strategy.rollDayCount);
    if (!v.ok) {
      warnings.push({ path: `scenario:${sc.name}`, quote: null, code: 'skipped', message: v.errors.map((e) => e.message).join('; ') });
      continue;
    }
    const bm = discountOn(sc.curve, M, `scenario:${sc.name}`);
    if (!bm.ok) {
      warnings.push({ path: `scenario:${sc.name}`, quote: null, code: 'skipped', message: `scenario "${sc.name}": ${bm.errors.map((e) => e.message).join('; ')}` });
      continue;
    }
    specs.push(v.value, scenarioForwardsView(sc.name, sc.curve, H));
  }
  let chosen = specs.findIndex((s) => s.id === strategy.view);
  if (chosen < 0) {
    warnings.push({ path: 'strategy.view', quote: null, code: 'skipped', message: `strategy.view: no view "${strategy.view}" (is the scenario still there?); showing "${DEFAULT_STRATEGY.view}"` });
    chosen = specs.findIndex((s) => s.id === DEFAULT_STRATEGY.view);
  }

  return ok({ ctx, specs, chosen, warnings, years, amount, M });
}

const dedupe = (errors: readonly CoreError[]): CoreError[] => {
  const seen = new Set<string>();
  return errors.filter((e) => (seen.has(e.message) ? false : (seen.add(e.message), true)));
};

/**
 * Every strategy's outcome under a view. With `traced`, the terminal value (money) or the
 * annualised return of `traced.id` is recorded, after its growth.
 */
export function outcomeOf(ctx: RollContext, rv: RollView, amount: Money, years: number, traced?: { readonly trace: RollTrace; readonly id: StrategyId; readonly figure: 'terminal' | 'return' }): ViewOutcome {
  const g = strategyGrowths(ctx.zeroGrowth, ctx.bond, ctx.riding, ctx.horizon, rv, traced);
  const t = (id: StrategyId, figure: 'terminal' | 'return'): RollTrace | undefined => (traced?.id === id && traced.figure === figure ? traced.trace : undefined);
  const rollTerminal = moneyTimes(amount, g.roll, t('roll', 'terminal'), 'G_roll');
  const rollReturn = annualisedReturn(g.roll, years, t('roll', 'return'), 'G_roll');
  const strategies = STRATEGY_IDS.map((id): StrategyOutcome => {
    const terminal = id === 'roll' ? rollTerminal : moneyTimes(amount, g[id], t(id, 'terminal'), `G_${id}`);
    const annualReturn = id === 'roll' ? rollReturn : annualisedReturn(g[id], years, t(id, 'return'), `G_${id}`);
    return { id, growth: g[id], terminal, annualReturn, vsRoll: terminal.minus(rollTerminal), vsRollBp: (annualReturn - rollReturn) * 10000 };
  });
  let best: StrategyId = 'roll';
  for (const s of strategies) if (s.growth > g[best]) best = s.id;
  return { id: rv.id, label: rv.label, phrase: rv.spec.phrase, description: rv.description, legRates: rv.legRates, strategies, best, riding: ridingSplit(ctx, rv, amount) };
}

/**
 * Riding return split (money): with C the reinvested coupons per 100, P_y the horizon price at
 * the bond's unchanged own yield (ICMA), P_0 the price on today's curve by time to maturity
 * (curve unchanged) and P_v the price on the view's horizon curve,
 *   carry = A (C + P_y)/100 - A,  roll-down = A (P_0 - P_y)/100,  curve change = A (P_v - P_0)/100,
 * which add up to the terminal value minus the amount. The split follows the carry / roll-down
 * reading of Tuckman and Serrat, "Fixed Income Securities" (cited from memory): carry is what the
 * bond earns if its yield stays put, roll-down what it gains by ageing along an unchanged curve.
 */
export function ridingSplit(ctx: RollContext, rv: RollView, amount: Money, trace?: RollTrace): RidingSplit {
  const { coupons, price } = bondAtHorizon(ctx.riding, ctx.horizon, rv, trace, 'riding');
  const y = bondYieldFromPriceOn(ctx.riding, ctx.curve.settlement, 100);
  const y0 = y.ok ? y.value : ctx.riding.coupon;
  if (trace) trace.steps.push({ name: 'y', formula: 'y = y0, its own yield today (price 100)', inputs: [], value: y0, unit: `decimal per year, ${yieldTag(ctx.riding.frequency)}` });
  const py = bondPriceFromYieldOn(ctx.riding, ctx.horizon, y0, trace);
  const p0 = bondValueOnCurve(ctx.riding, curveSeenAtHorizon(ctx.curve, ctx.horizon), trace, 'DF0', "today's curve seen from the horizon (by time to maturity)");
  const per100 = (x: number): Money => amount.times(new MoneyDecimal(x)).div(100);
  const split = {
    horizonPrice: price,
    couponsReinvested: coupons,
    carry: per100(coupons + py).minus(amount),
    rollDown: per100(p0 - py),
    curveChange: per100(price - p0),
  };
  if (trace) {
    const total = split.carry.plus(split.rollDown).plus(split.curveChange);
    const after = ctx.riding.flows.flatMap((f, k) => (compareIso(f.date, ctx.horizon) > 0 ? [k + 1] : []));
    recordRidingSplit(trace, after, p0, [coupons + py, p0 - py, price - p0], [split.carry, split.rollDown, split.curveChange, total].map((m) => m.toFixed()));
  }
  return split;
}

/** Money after each roll leg: V_k = V_{k-1} x (1 + r_k tau_k), V_0 = the amount (decimal.js products, unrounded); with `trace`, each V_k as decimal text. */
export function rollValuesOf(amount: Money, rv: RollView, trace?: RollTrace): Money[] {
  let v = amount;
  if (trace) recordLegValue(trace, 0, v.toFixed());
  return rv.legGrowth.map((g, k) => {
    v = moneyTimes(v, g);
    if (trace) recordLegValue(trace, k + 1, v.toFixed());
    return v;
  });
}

/**
 * Points to draw (float64, money): rolling as the value after each leg at its end date; each term
 * strategy as A g^(t/T) on 49 points, its constant annualised pace; t in years ACT/365F.
 */
function growthSeries(ctx: RollContext, rv: RollView, outcome: ViewOutcome, amount: Money, years: number): GrowthSeries[] {
  const A = amount.toNumber();
  const S = ctx.curve.settlement;
  let v = A;
  const rollPoints: GrowthPoint[] = [{ t: 0, date: S, value: A }];
  ctx.legs.forEach((leg, k) => {
    v *= rv.legGrowth[k]!;
    rollPoints.push({ t: yearFraction('ACT/365F', S, leg.end), date: leg.end, value: v });
  });
  const series: GrowthSeries[] = [{ id: 'roll', shape: 'steps', points: rollPoints }];
  const STEPS = 48;
  for (const s of outcome.strategies) {
    if (s.id === 'roll') continue;
    const points: GrowthPoint[] = [];
    for (let i = 0; i <= STEPS; i++) {
      const t = (years * i) / STEPS;
      points.push({ t, date: i === 0 ? S : i === STEPS ? ctx.horizon : null, value: A * Math.pow(s.growth, t / years) });
    }
    series.push({ id: s.id, shape: 'line', points });
  }
  return series;
}

export * from './strategyInputs.ts';
export * from './strategyMoney.ts';
export * from './strategyBonds.ts';
export * from './strategyValues.ts';
export * from './horizonCurve.ts';
export * from './rollViews.ts';
export * from './rollSolve.ts';
export * from './rollBreakEven.ts';
export * from './rollSummary.ts';
export * from './rollCsv.ts';
export * from './rollTrace.ts';
export * from './explainRoll.ts';
