import type { Curve } from '../curve/curve.ts';
import { explained, explainedConventions, explainedYearFraction, rateUnit, type ExplainedConventions, type Explanation } from '../curve/explain.ts';
import { forwardOn, forwardParRateOn } from '../curve/query.ts';
import { yieldTag } from '../format/conventionTag.ts';
import { bondPricerOn, bondYieldFromPriceOn, couponBond } from './strategyBonds.ts';
import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import { marketDate } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import { breakEvenPoint, rollBreakEven, type RollBreakEvenKind } from './rollBreakEven.ts';
import { moneyUnitOf } from './rollSummary.ts';
import { recordDate, recordOwnNames, recordVsRoll, rollTrace, type RollTrace } from './rollTrace.ts';
import { outcomeOf, ridingSplit, rollSetup, rollValuesOf, type NamedCurve, type RollSetup } from './rollVsTerm.ts';
import type { StrategyInputs, StrategyViewId } from './strategyInputs.ts';
import type { Money } from './strategyMoney.ts';
import type { StrategyId, TermStrategyId } from './strategyValues.ts';

/**
 * The figures of the roll-versus-term panel, each computed alone (`rollFigure`, the analysis's own
 * functions: rollSetup, applyView, outcomeOf, rollBreakEven) or with its explanation
 * (`explainRollFigure`: the same call with a trace; issue 19).
 */
export type RollFigure =
  /** A strategy's money at the horizon, or its annualised return, under a view. */
  | { readonly kind: 'terminal' | 'return'; readonly view: StrategyViewId; readonly strategy: StrategyId }
  /** Rolling's break-even against a term strategy under the chosen view: the constant rate r* or the shift of the view. */
  | { readonly kind: 'break-even-rate' | 'break-even-shift'; readonly against: TermStrategyId }
  /** Riding's break-even against rolling or the zero: the rise of the chosen view's horizon curve (bp). */
  | { readonly kind: 'break-even-rise'; readonly against: 'roll' | 'zero' }
  /** Today's forward of roll leg `leg` (1-based). */
  | { readonly kind: 'leg-forward'; readonly leg: number }
  /** The money after roll leg `leg` (1-based), or the leg's rate, under the chosen view. */
  | { readonly kind: 'leg-value' | 'leg-rate'; readonly leg: number }
  /** The break-even curve's rise (bp) of the par bond yield at `tenor`. */
  | { readonly kind: 'curve-rise'; readonly tenor: string }
  /** That par bond's yield today (the break-even curve's Yield today). */
  | { readonly kind: 'curve-yield'; readonly tenor: string }
  /** A part of riding's gain under the chosen view (the riding split): carry, roll-down, curve change or their total, money. */
  | { readonly kind: 'riding-split'; readonly part: RidingPart }
  /** A term strategy against rolling under a view: money at the horizon (`vs-roll`) or annualised return in bp a year (`vs-roll-bp`). */
  | { readonly kind: 'vs-roll' | 'vs-roll-bp'; readonly view: StrategyViewId; readonly strategy: TermStrategyId };

/** The riding split's parts, by the names of their steps. */
export type RidingPart = 'carry' | 'roll-down' | 'curve change' | 'total';

/** What the quotes' sensitivities of a figure are taken of: a rate over [start, end] on today's curve, or a par coupon. */
export type RollFigureDriver =
  | { readonly kind: 'rate'; readonly start: IsoDate; readonly end: IsoDate; readonly compounding: Compounding; readonly dayCount: CurveDayCount; readonly note: string | null }
  | { readonly kind: 'par'; readonly end: IsoDate; readonly frequency: number; readonly note: string };

export interface RollFigureValue {
  readonly value: number;
  /** Money figures: the exact decimal (value is its nearest double). */
  readonly money?: Money;
}

export interface RollFigureExplanation extends RollFigureValue {
  readonly explanation: Explanation;
  /** The figure in words for a heading. */
  readonly title: string;
  /** The curve rate whose quote sensitivities stand for the figure's; null when none does (with `why`). */
  readonly driver: RollFigureDriver | null;
  readonly why: string | null;
  /** True when the figure rests on a view of the user's or a scenario rather than today's curve alone. */
  readonly userView: boolean;
}

const noFigure = (message: string) => fail(coreError('schema', 'figure', message));

/**
 * One figure of the analysis, as analyseRollVsTerm computes it (bit for bit: the same functions on
 * the same inputs), with `trace` recording its steps. Errors as analyseRollVsTerm's, or a figure the
 * analysis does not have (a view or leg that is not there, a break-even with no crossing).
 */
export function rollFigure(curve: Curve, strategy: StrategyInputs, scenarios: readonly NamedCurve[], figure: RollFigure, trace?: RollTrace): Result<RollFigureValue> {
  const set = rollSetup(curve, strategy, scenarios, trace?.sink);
  return set.ok ? figureOn(set.value, curve, strategy, figure, trace) : set;
}

/** rollFigure on an analysis already set up (explainRollFigure sets it up once for the figure and its explanation). */
function figureOn(set: RollSetup, curve: Curve, strategy: StrategyInputs, figure: RollFigure, trace?: RollTrace): Result<RollFigureValue> {
  const { ctx, specs, chosen, years, amount } = set;
  if (figure.kind === 'leg-forward') {
    const leg = ctx.legs[figure.leg - 1];
    if (!leg) return noFigure(`there is no roll leg ${figure.leg}`);
    const f = forwardOn(curve, leg.start, leg.end, 'simple', strategy.rollDayCount, 'strategy.horizon', trace?.sink);
    return f.ok ? ok({ value: f.value.rate }) : f;
  }
  if (figure.kind === 'curve-rise') {
    const x = breakEvenPoint(ctx, figure.tenor, trace)?.riseBp;
    return x == null ? noFigure('no crossing in the bracket') : ok({ value: x });
  }
  if (figure.kind === 'curve-yield') {
    const p = breakEvenPoint(ctx, figure.tenor);
    return p ? ok({ value: p.yield }) : noFigure(`no ${figure.tenor} point on the break-even curve`);
  }
  if (figure.kind === 'riding-split') {
    const r = ridingSplit(ctx, ctx.view(specs[chosen]!, trace), amount, trace);
    const parts = { carry: r.carry, 'roll-down': r.rollDown, 'curve change': r.curveChange, total: r.carry.plus(r.rollDown).plus(r.curveChange) };
    const m = parts[figure.part];
    return ok({ value: m.toNumber(), money: m });
  }
  if ('leg' in figure) {
    const rv = ctx.view(specs[chosen]!, trace);
    const x = rv.legRates[figure.leg - 1];
    if (x === undefined) return noFigure(`there is no roll leg ${figure.leg}`);
    if (figure.kind === 'leg-rate') return ok({ value: x });
    const v = rollValuesOf(amount, rv, trace)[figure.leg - 1]!;
    return ok({ value: v.toNumber(), money: v });
  }
  if ('against' in figure) {
    const x = rollBreakEven(ctx, ctx.view(specs[chosen]!), figure.against, figure.kind.slice(11) as RollBreakEvenKind, trace);
    return x === null ? noFigure('rolling and this strategy do not cross in the bracket (or there is a single leg, bought today)') : ok({ value: x });
  }
  const spec = specs.find((s) => s.id === figure.view);
  if (!spec) return noFigure(`there is no view "${figure.view}"`);
  if (figure.kind === 'vs-roll' || figure.kind === 'vs-roll-bp') {
    // Both figures as outcomeOf makes them (rolling's, then the strategy's), each recorded under its own names, then their difference.
    const money = figure.kind === 'vs-roll';
    const id = figure.strategy;
    const rv = ctx.view(spec, trace);
    const traced = (who: StrategyId) => {
      const from = trace?.steps.length ?? 0;
      const o = outcomeOf(ctx, rv, amount, years, trace && { trace, id: who, figure: money ? 'terminal' : 'return' });
      if (trace) recordOwnNames(trace, from, who);
      return o;
    };
    traced('roll');
    const s = traced(id).strategies.find((x) => x.id === id)!;
    if (trace) recordVsRoll(trace, id, money ? s.vsRoll.toFixed() : null, s.vsRollBp);
    return ok(money ? { value: s.vsRoll.toNumber(), money: s.vsRoll } : { value: s.vsRollBp });
  }
  const legsNeeded = figure.strategy !== 'zero';
  const rv = ctx.view(spec, legsNeeded ? trace : undefined);
  const o = outcomeOf(ctx, rv, amount, years, trace ? { trace, id: figure.strategy, figure: figure.kind } : undefined).strategies.find((s) => s.id === figure.strategy)!;
  return ok(figure.kind === 'terminal' ? { value: o.terminal.toNumber(), money: o.terminal } : { value: o.annualReturn });
}

const GROWTH: Readonly<Record<StrategyId, string>> = {
  roll: 'G_roll = (1 + r1 tau1) x ... x (1 + rn taun)',
  zero: 'G_zero = 1 / DF(horizon)',
  bond: "G_bond = (the par bond's flows grown to the horizon) / 100",
  riding: "G_riding = (coupons grown to the horizon + dirty price on the view's horizon curve) / 100",
};

const AGAINST: Readonly<Record<StrategyId, string>> = { roll: 'rolling', zero: 'the zero to the horizon', bond: 'the par bond to the horizon', riding: 'riding the longer bond' };

/** One figure of the analysis with its explanation: the steps of the same computation, ending in the figure to all digits. */
export function explainRollFigure(curve: Curve, strategy: StrategyInputs, scenarios: readonly NamedCurve[], figure: RollFigure): Result<RollFigureExplanation> {
  const trace = rollTrace({ date: strategy.horizon }, moneyUnitOf(strategy.currency));
  const set = rollSetup(curve, strategy, scenarios, trace.sink);
  if (!set.ok) return set;
  const r = figureOn(set.value, curve, strategy, figure, trace);
  if (!r.ok) return r;
  const { ctx, specs, chosen, years, M } = set.value;
  const S = curve.settlement;
  const H = ctx.horizon;
  const dc = strategy.rollDayCount;
  const rate = (start: IsoDate, end: IsoDate, compounding: Compounding, dayCount: CurveDayCount, note: string | null): RollFigureDriver => ({ kind: 'rate', start, end, compounding, dayCount, note });
  const parOn = (end: IsoDate, frequency: number): RollFigureDriver => ({ kind: 'par', end, frequency, note: "of the bond's coupon, today's par yield" });
  const par = (id: 'bond' | 'riding'): RollFigureDriver => parOn(id === 'bond' ? H : M, ctx[id].frequency);
  const zeroNote = 'of the zero rate to the horizon (ann, ACT/365F)';
  if (figure.kind === 'curve-yield') {
    // The par bond breakEvenPoint prices (parBondOn: the forward par rate from settlement as its coupon), then its yield at 100.
    const f = strategy.ridingFrequency;
    const T = marketDate(S, parseTenor(figure.tenor)!);
    const c = explained((sink) => forwardParRateOn(curve, S, T, f, 'ACT/ACT-ICMA', false, 'maturity', sink));
    if (!c.ok) return c;
    const e = c.value.explanation;
    const bond = couponBond(S, T, c.value.value.rate, f);
    const y = r.value.value;
    const again = bondYieldFromPriceOn(bond, S, 100);
    if (!again.ok || !Object.is(again.value, y)) return noFigure('not the figure shown');
    const unit = `decimal per year, ${yieldTag(f)}`;
    const step = { name: 'y0', formula: `y0 = the yield at which sum_k CF_k (1 + y0/${f})^-(w + k) = 100 on ${S}, CF the flows of coupon ${e.steps.at(-1)!.name} (ICMA; Brent's method to 1e-15; the price at y0 is ${bondPricerOn(bond, S)(y)})`, inputs: [e.steps.at(-1)!.name], value: y, unit };
    return ok({ ...r.value, explanation: { ...e, quantity: 'par-yield', formula: `y0: the ICMA yield at price 100 of the ${figure.tenor} bond whose coupon is today's par rate; ${e.formula}`, value: y, unit, steps: [...e.steps, step] }, title: `Yield today of the ${figure.tenor} bond`, driver: parOn(T, f), why: null, userView: false });
  }
  if (figure.kind === 'leg-forward') {
    const leg = ctx.legs[figure.leg - 1]!;
    return ok({ ...r.value, explanation: trace.sink.explanation!, title: `Today's forward of roll leg ${leg.index} (${leg.start} to ${leg.end})`, driver: rate(leg.start, leg.end, 'simple', dc, null), why: null, userView: false });
  }
  recordDate(trace, 'horizon', strategy.horizon, H, 'unadjusted, no calendar');
  const conventions = (c: Compounding | null, d: ExplainedConventions['dayCount']): ExplainedConventions => explainedConventions(curve, c, d);
  if ('leg' in figure) {
    // The view and the money record every leg; the figure's own step ends the explanation.
    const own = trace.steps.findIndex((s) => s.name === `${figure.kind === 'leg-rate' ? 'r' : 'V'}${figure.leg}`);
    if (own >= 0) trace.steps.splice(own + 1);
  }
  if (figure.kind === 'riding-split') trace.steps.splice(trace.steps.findIndex((s) => s.name === figure.part) + 1);
  const last = trace.steps.at(-1)!;
  const base = { dates: trace.dates, yearFractions: trace.yearFractions, reads: trace.reads, steps: trace.steps, value: r.value.value, unit: last.unit };
  if ('leg' in figure) {
    const view = specs[chosen]!;
    const k = figure.leg;
    const money = figure.kind === 'leg-value';
    const explanation: Explanation = {
      ...base,
      quantity: money ? 'roll-terminal' : 'roll-leg-rate',
      formula: `${money ? `V${k} = A x g1 x ... x g${k}, decimal` : `r${k}, simple ${dc}`}, under "${view.label}": ${view.description}`,
      ...(money ? { valueText: last.text!, unit: `${moneyUnitOf(strategy.currency)} after leg ${k}, unrounded` } : {}),
      conventions: money ? conventions(null, null) : conventions('simple', dc),
    };
    return ok({ ...r.value, explanation, title: `${money ? 'Value after' : 'Rate of'} leg ${k} under ${view.label}`, driver: null, why: 'none: it rests on your view as much as on the quotes', userView: view.id !== 'forwards' });
  }
  if (figure.kind === 'riding-split') {
    const view = specs[chosen]!;
    const explanation: Explanation = {
      ...base,
      quantity: 'roll-terminal',
      formula: `${figure.part} of riding the ${strategy.ridingMaturity} bond under "${view.label}": carry = A x (C + P_y) / 100 - A, roll-down = A x (P0 - P_y) / 100, curve change = A x (price - P0) / 100; C its coupons grown to the horizon, P_y its dirty price there at its own yield today (ICMA), P0 on today's curve by time to maturity, price on the view's horizon curve (per 100 face). ${view.description}`,
      valueText: last.text!,
      unit: `${moneyUnitOf(strategy.currency)} over the horizon, unrounded`,
      conventions: conventions(null, null),
    };
    return ok({ ...r.value, explanation, title: `Riding the ${strategy.ridingMaturity} bond: ${figure.part} under ${view.label}`, driver: null, why: 'none: it rests on your view as much as on the quotes', userView: view.id !== 'forwards' });
  }
  if (!('view' in figure)) {
    const view = specs[chosen]!;
    const isRate = figure.kind === 'break-even-rate';
    const against = figure.kind === 'curve-rise' ? 'zero' : figure.against;
    const own = figure.kind === 'break-even-rise' ? 'riding' : 'roll';
    const explanation: Explanation = {
      ...base,
      quantity: 'roll-break-even',
      formula:
        figure.kind === 'curve-rise' ? `d*: the ${figure.tenor} par bond's coupons at today's forwards plus its price at y0 + d equal 100 / DF(horizon)`
        : `${isRate ? `r*: one rate for legs 2 to ${ctx.legs.length}, simple ${dc}` : own === 'riding' ? `s*: a parallel rise of the horizon curve (cont, ${curve.dayCount})` : `s*: a parallel shift of the view (${last.unit})`}, at which G_${own} = G_${against} under "${view.label}"; ${GROWTH[own]}; ${GROWTH[against]}. ${view.description}`,
      conventions: isRate ? conventions('simple', dc) : conventions(null, null),
    };
    const driver =
      figure.kind === 'curve-rise' ? parOn(marketDate(S, parseTenor(figure.tenor)!), strategy.ridingFrequency)
      : own === 'riding' ? par(own)
      : against === 'zero' ? rate(S, H, 'annual', 'ACT/365F', zeroNote)
      : par(against as 'bond');
    const title = figure.kind === 'curve-rise' ? `Break-even rise of the ${figure.tenor} yield` : `Break-even ${isRate ? 'roll rate r*' : own === 'riding' ? 'rise of riding' : 'shift of the view'} against ${AGAINST[against]}`;
    return ok({ ...r.value, explanation, title, driver, why: null, userView: figure.kind !== 'curve-rise' && view.id !== 'forwards' });
  }
  const spec = specs.find((s) => s.id === figure.view)!;
  const id = figure.strategy;
  const userView = id !== 'zero' && spec.id !== 'forwards';
  const phrase = id === 'roll' ? `rolling ${strategy.rollTenor}` : id === 'riding' ? `riding the ${strategy.ridingMaturity} bond` : AGAINST[id];
  const vs = figure.kind === 'vs-roll' || figure.kind === 'vs-roll-bp';
  const money = figure.kind === 'terminal' || figure.kind === 'vs-roll';
  if (!money) trace.yearFractions.push(explainedYearFraction('T', 'ACT/365F', S, H, years));
  const each = `${money ? 'terminal = A x G' : 'return = G^(1/T) - 1'}, ${GROWTH[id]}`;
  const explanation: Explanation = {
    ...base,
    quantity: money ? 'roll-terminal' : 'roll-return',
    formula: `${vs ? `${money ? `vs roll = terminal_${id} - terminal_roll` : `vs roll = (return_${id} - return_roll) x 10000`}, each ${each}; ${GROWTH.roll}` : each}, under "${spec.label}": ${spec.description} ${userView ? 'It rests on your view, not on the curve alone.' : "Read off today's curve alone."}`,
    ...(money ? { valueText: last.text!, unit: `${moneyUnitOf(strategy.currency)} at the horizon, unrounded` } : {}),
    conventions: money ? conventions(null, null) : conventions('annual', 'ACT/365F'),
  };
  const driver =
    vs ? null
    : id === 'zero' || (id === 'roll' && spec.id === 'forwards') ? rate(S, H, 'annual', 'ACT/365F', zeroNote)
    : id === 'roll' && spec.id === 'unchanged' ? rate(S, marketDate(S, parseTenor(strategy.rollTenor)!), 'simple', dc, `of today's ${strategy.rollTenor} spot`)
    : id !== 'roll' && spec.id === 'forwards' ? par(id)
    : null;
  const title = vs ? `${phrase[0]!.toUpperCase()}${phrase.slice(1)} against rolling under ${spec.label}${money ? '' : ', bp a year'}` : `${money ? 'Money at the horizon' : 'Annualised return'} of ${phrase} under ${spec.label}`;
  return ok({ ...r.value, explanation, title, driver, why: driver ? null : vs ? 'none: a difference of two figures; open each for its quotes' : 'none: it rests on your view as much as on the quotes', userView: vs || userView });
}
