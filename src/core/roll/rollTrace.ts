import type { Curve } from '../curve/curve.ts';
import {
  DF_UNIT,
  explainRead,
  explainedYearFraction,
  explanationSink,
  rateUnit,
  type ExplainedDate,
  type ExplainedRead,
  type ExplainedStep,
  type ExplainedYearFraction,
  type ExplanationSink,
} from '../curve/explain.ts';
import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { RollLeg, ViewSpec } from './rollViews.ts';
import type { BondFlow } from './strategyBonds.ts';

/**
 * The trace of one roll-versus-term figure (issue 19). The analysis's own functions (applyView,
 * bondAtHorizon, strategyGrowths, annualisedReturn, moneyTimes, the break-even solver) take it as
 * an optional last argument and hand it their own values; the recorders here only word them.
 * Without a trace nothing is recorded and the arithmetic is the same. Names in the steps:
 * leg k's rate `r<k>`, year fraction `tau<k>` (roll day count) and growth `g<k>`; a term
 * strategy's flow i `CF<i>` (per 100 face) with its growth to the horizon `R<i>` or its discount
 * factor on the horizon curve `DFH<i>`; each strategy's growth per unit `G_<strategy>`.
 */
export interface RollTrace {
  readonly steps: ExplainedStep[];
  readonly reads: ExplainedRead[];
  readonly yearFractions: ExplainedYearFraction[];
  readonly dates: ExplainedDate[];
  /** The sink of the curve queries the figure rests on (the horizon's discount factor, a leg's forward). */
  readonly sink: ExplanationSink;
  /** The money's unit (the strategy's ISO 4217 code, or the generic sign), given with every money step. */
  readonly money: string;
}

export const rollTrace = (given?: Readonly<Record<string, string>>, money = '\u00a4'): RollTrace => ({ steps: [], reads: [], yearFractions: [], dates: [], sink: explanationSink(given), money });

const GROWTH_UNIT = 'per unit invested';
const RETURN_WORDS = 'ann, ACT/365F';
export const PER_100 = 'per 100 face';

const push = (t: RollTrace, name: string, formula: string, inputs: readonly string[], value: number, unit: string): void => {
  t.steps.push({ name, formula, inputs, value, unit });
};

const cf = (t: RollTrace, i: number, flow: BondFlow): void => push(t, `CF${i}`, `CF${i} = flow on ${flow.date}`, [], flow.amount, PER_100);

/** The product g_a x (g_(a+1) x (... x g_n)) in words, as the code multiplies it (from the last leg back). */
const productWords = (from: number, n: number): string => (from === n ? `g${n}` : from + 1 === n ? `g${from} x g${n}` : `g${from} x (... x g${n})`);

/**
 * Applying a view to the legs (rollViews.ts applyView): leg 1's growth read off the curve, each
 * later leg's rate as the view sets it, the growths and their product, all the view's own values.
 */
export function recordLegs(t: RollTrace, curve: Curve, legs: readonly RollLeg[], dayCount: CurveDayCount, spec: ViewSpec, legRates: readonly number[], legGrowth: readonly number[], rollGrowth: number): void {
  const unit = rateUnit('simple', dayCount);
  const n = legs.length;
  legs.forEach((leg, k) => {
    const i = k + 1;
    t.yearFractions.push(explainedYearFraction(`tau${i}`, dayCount, leg.start, leg.end, leg.tau));
    if (k === 0) {
      const tEnd = curve.time(leg.end);
      const ln = curve.lnDiscountAt(tEnd);
      t.reads.push(explainRead(curve, 'DF(leg 1 end)', leg.end, tEnd, ln));
      push(t, 'r1', "r1 = today's spot (the curve) = expm1(-ln DF(leg 1 end)) / tau1", ['DF(leg 1 end)', 'tau1'], legRates[0]!, unit);
      push(t, 'g1', 'g1 = exp(-ln DF(leg 1 end)) = 1 + r1 x tau1', ['DF(leg 1 end)'], legGrowth[0]!, 'unitless');
    } else {
      push(t, `r${i}`, `r${i} = ${spec.legRate}`, [], legRates[k]!, unit);
      push(t, `g${i}`, `g${i} = 1 + r${i} x tau${i}`, [`r${i}`, `tau${i}`], legGrowth[k]!, 'unitless');
    }
  });
  push(t, 'G_roll', `G_roll = ${n === 0 ? '1' : productWords(1, n)}`, legs.map((_, k) => `g${k + 1}`), rollGrowth, GROWTH_UNIT);
}

/** How growthToHorizon grew one coupon: the leg it falls in and, inside a leg, the view's growth over the rest of it. */
export interface HorizonGrowthParts {
  /** 0-based leg holding the date (-1: at or after the horizon; the first leg for a date at settlement). */
  leg: number;
  /** Growth from the date to the end of its leg, when the date falls inside a leg. */
  stub?: number;
  /** Year fraction of that part of the leg on the roll day count. */
  tau?: number;
}

/** A flow of a term bond paid by the horizon and grown to it at the view's money-market rates. */
export function recordReinvested(t: RollTrace, i: number, flow: BondFlow, parts: HorizonGrowthParts, legCount: number, growth: number): void {
  cf(t, i, flow);
  const k = parts.leg;
  const gs = (from: number): string[] => Array.from({ length: legCount - from + 1 }, (_, j) => `g${from + j}`);
  if (k < 0) {
    push(t, `R${i}`, `R${i} = 1`, [], growth, 'unitless');
    return;
  }
  if (parts.stub === undefined) {
    push(t, `R${i}`, `R${i} = ${productWords(k + 1, legCount)}`, gs(k + 1), growth, 'unitless');
    return;
  }
  push(t, `stub${i}`, `stub${i} = the view's growth to the end of leg ${k + 1} (tau = ${parts.tau})`, [], parts.stub, 'unitless');
  push(t, `R${i}`, `R${i} = stub${i}${k + 1 === legCount ? '' : ` x ${productWords(k + 2, legCount)}`}`, [`stub${i}`, ...gs(k + 2)], growth, 'unitless');
}

/** A flow after the horizon, priced on the view's horizon curve. */
export function recordHorizonPrice(t: RollTrace, i: number, flow: BondFlow, dfh: number, name = 'DFH', on = "the view's horizon curve"): void {
  cfOnce(t, i, flow);
  push(t, `${name}${i}`, `${name}${i} = DF(${flow.date}) on ${on}`, [], dfh, DF_UNIT);
}

/** A flow's step, unless the figure has already recorded it (a bond valued twice: the riding split). */
const cfOnce = (t: RollTrace, i: number, flow: BondFlow): void => {
  if (!t.steps.some((s) => s.name === `CF${i}`)) cf(t, i, flow);
};

/** `name = CF<i> x <b><i> + ...` over the flows `idx`. */
const sumStep = (t: RollTrace, name: string, b: string, idx: readonly number[], value: number): void =>
  push(t, name, `${name} = ${idx.map((i) => `CF${i} x ${b}${i}`).join(' + ') || 0}`, idx.flatMap((i) => [`CF${i}`, `${b}${i}`]), value, PER_100);

/** A term bond's value at the horizon per 100 face and its growth per unit (bought at par). */
export function recordBondTotals(t: RollTrace, id: string, flows: readonly { i: number; after: boolean }[], coupons: number, price: number, growth: number): void {
  sumStep(t, 'coupons', 'R', flows.filter((f) => !f.after).map((f) => f.i), coupons);
  sumStep(t, 'price', 'DFH', flows.filter((f) => f.after).map((f) => f.i), price);
  push(t, `G_${id}`, `G_${id} = (coupons + price) / 100`, ['coupons', 'price'], growth, GROWTH_UNIT);
}

/** A flow paid by the horizon grown to it at today's forwards: R<i> = DF(date) / DF(horizon) (the break-even curve). */
export function recordForwardGrowth(t: RollTrace, curve: Curve, i: number, flow: BondFlow, time: number, ln: number, growth: number): void {
  const df = `DF(${flow.date})`;
  cf(t, i, flow);
  t.reads.push(explainRead(curve, df, flow.date, time, ln));
  push(t, `R${i}`, `R${i} = ${df} / DF(horizon)`, [df, 'DF(horizon)'], growth, 'unitless');
}

/** The break-even curve's terms at the root: the horizon's discount factor, the coupons grown to it, the target and the yields. */
export function recordCurvePoint(t: RollTrace, curve: Curve, horizon: IsoDate, tH: number, lnH: number, coupons: number, target: number, y0: number, y: number): void {
  const u = t.steps.at(-1)!.unit;
  t.reads.push(explainRead(curve, 'DF(horizon)', horizon, tH, lnH));
  sumStep(t, 'coupons', 'R', t.steps.filter((s) => /^R\d/.test(s.name)).map((s) => +s.name.slice(1)), coupons);
  push(t, 'target', 'target = 100 / DF(horizon)', ['DF(horizon)'], target, PER_100);
  push(t, 'y0', 'y0 = its yield today', [], y0, u);
  push(t, 'y', 'y = y0 + d', ['y0', 'd'], y, u);
}

/** A price per 100 face at the yield y (ICMA, f a year): P_y = sum over the flows k = 0, 1, ... of CF x (1 + y/f)^-(w + k). */
export function recordYieldPrice(t: RollTrace, first: number, flows: readonly BondFlow[], f: number, w: number, price: number): void {
  push(t, 'w', 'w = share of the coupon period left', [], w, 'unitless');
  const cfs = flows.map((flow, k) => (cfOnce(t, first + k, flow), `CF${first + k}`));
  push(t, 'P_y', `P_y = sum over k = 0, 1, ... of CF(${first} + k) x (1 + y / ${f})^-(w + k)`, ['y', 'w', ...cfs], price, PER_100);
}

/** The zero to the horizon: its growth from the horizon's discount factor. */
export function recordZero(t: RollTrace, growth: number): void {
  const e = t.sink.explanation;
  if (e) {
    t.reads.push(...e.reads.map((r) => ({ ...r, name: 'DF(horizon)' })));
    t.yearFractions.push(...e.yearFractions);
  }
  push(t, 'G_zero', 'G_zero = 1 / DF(horizon)', ['DF(horizon)'], growth, GROWTH_UNIT);
}

/** The annualised return of a growth over `years` (ACT/365F), annual compounding. */
export function recordReturn(t: RollTrace, growth: string, lnG: number, years: number, value: number): void {
  push(t, 'lnG', `lnG = ln ${growth}`, [growth], lnG, 'natural log of the growth');
  push(t, 'return', 'return = expm1(lnG / T)', ['lnG', 'T'], value, rateUnit('annual', 'ACT/365F'));
}

/** Money: amount x growth in decimal.js, each as the exact decimal text it is computed with. */
export function recordMoney(t: RollTrace, growthName: string, amount: string, growthText: string, terminal: string): void {
  const step = (name: string, formula: string, inputs: string[], text: string, unit: string): number => t.steps.push({ name, formula, inputs, value: Number(text), unit, text });
  step('A', 'A = the amount, as typed', [], amount, `${t.money} today`);
  step('G (decimal)', `G (decimal) = ${growthName}, its shortest decimal text`, [growthName], growthText, 'unitless');
  step('terminal', 'terminal = A x G (decimal), decimal, 40 digits', ['A', 'G (decimal)'], terminal, `${t.money} at the horizon`);
}

/** The money after roll leg k (V0: the amount), decimal: V<k> = V<k-1> x g<k>, g<k> entering as its shortest decimal text. */
export function recordLegValue(t: RollTrace, k: number, text: string): void {
  t.steps.push({ name: `V${k}`, formula: k ? `V${k} = V${k - 1} x g${k}, decimal, 40 digits` : 'V0 = the amount, as typed', inputs: k ? [`V${k - 1}`, `g${k}`] : [], value: Number(text), unit: k ? `${t.money} after leg ${k}` : `${t.money} today`, text });
}

export const recordDate = (t: RollTrace, name: string, given: string, date: IsoDate, rule: string): void => {
  t.dates.push({ name, given, unadjusted: date, adjusted: date, rule });
};

/**
 * A break-even (rollBreakEven.ts): the solver's root `x` of `diff` (names joined by - or +), then
 * the terms evaluated at it by the functions the solver calls (`evaluate` records them and
 * returns the difference), the residual, and the figure: the root times `scale` (1, or 10000 to bp).
 */
export function recordBreakEven(
  t: RollTrace,
  x: string,
  unit: string,
  diff: string,
  root: { readonly x: number; readonly iterations: number },
  [a, b]: readonly [number, number],
  xTol: number,
  evaluate: (t: RollTrace) => number,
  scale = 1,
  residualUnit = GROWTH_UNIT,
): void {
  push(t, x, `${x} = root of ${diff} on [${a}, ${b}], Brent's method, ${root.iterations} steps, tolerance ${xTol}`, [], root.x, unit);
  push(t, 'residual', `residual = ${diff}`, diff.split(/ . /), evaluate(t), residualUnit);
  push(t, `${x}*`, `${x}* = ${x}${scale === 1 ? '' : ' x 10000'}`, [x, 'residual'], root.x * scale, scale === 1 ? unit : unit.replace('decimal per year, ', 'bp of the yield, '));
}

/** The steps both figures of a difference record alike (the money or the return), named for their strategy from step `from` on: `terminal_bond`. */
export function recordOwnNames(t: RollTrace, from: number, id: string): void {
  const own = (n: string): string => (/^(A|G \(decimal\)|terminal|lnG|return)$/.test(n) ? `${n}_${id}` : n);
  for (let i = from; i < t.steps.length; i++) {
    const s = t.steps[i]!;
    t.steps[i] = { ...s, name: own(s.name), formula: s.formula.replace(`${s.name} =`, `${own(s.name)} =`), inputs: s.inputs.map(own) };
  }
}

/** A term strategy against rolling: money (decimal text, `money`) or the returns' difference in bp a year. */
export function recordVsRoll(t: RollTrace, id: string, money: string | null, bp: number): void {
  if (money !== null) t.steps.push({ name: 'vs roll', formula: `vs roll = terminal_${id} - terminal_roll, decimal`, inputs: [`terminal_${id}`, 'terminal_roll'], value: Number(money), unit: `${t.money} at the horizon`, text: money });
  else push(t, 'vs roll', `vs roll = (return_${id} - return_roll) x 10000`, [`return_${id}`, 'return_roll'], bp, `bp a year (${RETURN_WORDS})`);
}

/**
 * The riding bond's split (rollVsTerm.ts ridingSplit) after its values were recorded (coupons and
 * price on the view's horizon curve, y0, P_y, and P0 with its DF0 reads): P0, then each part in
 * decimal, `texts` [carry, roll-down, curve change, total].
 */
export function recordRidingSplit(t: RollTrace, after: readonly number[], p0: number, sums: readonly [number, number, number], texts: readonly string[]): void {
  sumStep(t, 'P0', 'DF0', after, p0);
  push(t, 'C + P_y', 'C + P_y = coupons + P_y', ['coupons', 'P_y'], sums[0], PER_100);
  push(t, 'P0 - P_y', 'P0 - P_y', ['P0', 'P_y'], sums[1], PER_100);
  push(t, 'price - P0', 'price - P0', ['price', 'P0'], sums[2], PER_100);
  const step = (name: string, formula: string, inputs: string[], text: string): number => t.steps.push({ name, formula, inputs, value: Number(text), unit: `${t.money} over the horizon`, text });
  step('carry', 'carry = A x (C + P_y) / 100 - A, decimal', ['C + P_y'], texts[0]!);
  step('roll-down', 'roll-down = A x (P0 - P_y) / 100, decimal', ['P0 - P_y'], texts[1]!);
  step('curve change', 'curve change = A x (price - P0) / 100, decimal', ['price - P0'], texts[2]!);
  step('total', 'total = carry + roll-down + curve change, decimal', ['carry', 'roll-down', 'curve change'], texts[3]!);
}
