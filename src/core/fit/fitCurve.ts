import { quoteYieldOf, type QuoteYield } from '../analytics/quoteYield.ts';
import { compileQuote } from '../bootstrap/build.ts';
import { curveFromLnDiscount, type Curve, type Pillar } from '../curve/curve.ts';
import { presentValue, residualOnCurve, targetOnCurve, type Instrument } from '../instruments/instrument.ts';
import { kindModule, moduleOf } from '../kinds/registry.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { curveTime } from '../time/dayCount.ts';
import type { Workspace } from '../document/types.ts';
import { levenbergMarquardt, type LmResult } from './levenbergMarquardt.ts';
import { turnForward, turnLn, type TurnSpan } from '../bootstrap/turns.ts';
import { formatBp } from '../format/quantities.ts';
import {
  betaCount,
  FIT_MODEL_LABEL,
  parameterCount,
  parametricForward,
  parametricLnDiscount,
  paramsFromVector,
  projectParams,
  TAU_MAX,
  TAU_MIN,
  TAU_RATIO_MIN,
  type FitModel,
  type ParametricParams,
} from './parametricForm.ts';

/** What the fit minimises: yield errors (default) or price errors scaled to yield. */
export const FIT_ERRORS = ['yield', 'price'] as const;
export type FitErrors = (typeof FIT_ERRORS)[number];

export interface FitOptions {
  readonly model: FitModel;
  /** `yield`: model minus market own yield; `price`: (market - model price) / (modified duration x dirty price). */
  readonly errors?: FitErrors;
  /** Weight per quote (by its index in the document), >= 0; default 1. Weight 0 leaves a quote out. */
  readonly weights?: Readonly<Record<number, number>>;
  /** Quotes (by index) left out of the objective; they still get residuals. */
  readonly exclude?: readonly number[];
  /** Svensson: tau2 >= ratio x tau1 (default TAU_RATIO_MIN). */
  readonly tauRatio?: number;
  /** Levenberg-Marquardt iterations at most (default 200). */
  readonly maxIterations?: number;
  /**
   * The turns of the curve shown (its build's `overnight.turns`: spreads as typed or as the exact
   * bootstrap solved them). A smooth form has no jump, so the fit is the form times the turns'
   * jumps, ln DF = ln DF_form + ln J (turns.ts): each quote over a turn meets the fit with its
   * turn, and the form fits the quotes with the turns' effect taken out. Meeting steps are not
   * carried: the form stays smooth through the meeting dates.
   */
  readonly turns?: readonly TurnSpan[];
  /**
   * The curve's build's instruments: a quote whose instrument reads curves built before it (a named
   * curve's term-index or basis swap, `readsCurves`) is fitted as that instrument, its discounting
   * and other leg held as built, so the form is the projection curve; without them it would be
   * read as a one-curve swap.
   */
  readonly instruments?: readonly Instrument[];
}

/** A quote against the fitted curve. Yields in decimals of the quote's own yield; prices per 100 face. */
export interface FitResidual {
  readonly index: number;
  readonly kind: Instrument['kind'];
  readonly maturity: string;
  /** Years on the curve's axis. */
  readonly t: number;
  readonly field: string;
  readonly yieldLabel: string;
  readonly included: boolean;
  readonly weight: number;
  readonly marketYield: number;
  readonly modelYield: number;
  /** Model minus market own yield, in bp. Positive: the market trades above the model price (rich). */
  readonly residualBp: number;
  /** Market and model price per 100 face (bonds dirty; deposits and swaps per 100 notional of their flows). */
  readonly marketPrice: number;
  readonly modelPrice: number;
  /** Model minus market price per 100 face. */
  readonly residualPrice: number;
}

/** A bond on the rich/cheap list. */
export interface RichCheapEntry {
  readonly index: number;
  readonly maturity: string;
  /** Coupon, decimal per year. */
  readonly coupon: number;
  readonly included: boolean;
  /** Model minus market yield, bp (positive: rich). */
  readonly residualBp: number;
  /** Market minus model price per 100 face (positive: rich). */
  readonly richnessPrice: number;
  readonly verdict: 'rich' | 'cheap';
}

export interface FitResult {
  readonly model: FitModel;
  readonly errors: FitErrors;
  readonly params: ParametricParams;
  /** The fitted curve (lnDF = -y(t) t); flat-forward past the last included maturity like any curve. */
  readonly curve: Curve;
  readonly converged: boolean;
  readonly iterations: number;
  /** Why the refinement stopped (see LmResult). */
  readonly stopReason: LmResult['reason'];
  /** Weighted root-mean-square of the included residuals in the fitted measure, bp. */
  readonly rmsBp: number;
  /** Parameters that ended on a bound, e.g. "tau1 = 30 (upper bound)". */
  readonly atBounds: readonly string[];
  /** One sentence for the user: converged or not, and what to try. */
  readonly report: string;
  readonly residuals: readonly FitResidual[];
  /** Bonds from richest to cheapest by residual price. */
  readonly richCheap: readonly RichCheapEntry[];
}

/**
 * Handed to fitCurve to receive what its residuals are computed from (explanations,
 * fit/explainFit.ts): the fitted ln DF the residuals read (the form plus the turns' jump), the
 * turns, and each quote's instrument, own yield and market yield.
 */
export interface FitSink {
  trace?: { readonly ln: (t: number) => number; readonly turns: readonly TurnSpan[]; readonly observations: readonly Observation[] };
}

export interface Observation {
  readonly ins: Instrument;
  readonly qy: QuoteYield;
  readonly weight: number;
  readonly included: boolean;
  readonly marketYield: number;
  /** Dollar duration -dP/dy at the market yield, per unit of target (for price errors). */
  readonly dollarDuration: number;
  /** Scale from the instrument's target to per 100 face. */
  readonly per100: number;
}

function observe(ws: Workspace, options: FitOptions): Observation[] {
  const exclude = new Set(options.exclude ?? []);
  // The build's instruments that read other curves, by quote index (FitOptions.instruments).
  const held = new Map((options.instruments ?? []).filter((i) => i.readsCurves).map((i) => [i.index, i]));
  return ws.quotes
    .filter((q) => q.enabled)
    .map((q) => {
      const ins = held.get(q.index) ?? compileQuote(q, ws.settlement, ws.curve.dayCount);
      const qy = quoteYieldOf(ins, ws.settlement);
      const w = options.weights?.[q.index] ?? 1;
      const weight = Number.isFinite(w) && w > 0 ? w : 0;
      const marketYield = qy.toYield(ins.market);
      // The kind's fit weighting (src/core/kinds): its dollar duration and its target's scale.
      const { fit } = moduleOf(q);
      const dollarDuration = fit.dollarDuration(ins, q, ws.settlement, marketYield);
      const per100 = fit.per100;
      return { ins, qy, weight, included: weight > 0 && !exclude.has(q.index) && ins.t > 0, marketYield, dollarDuration, per100 };
    })
    .sort((a, b) => a.ins.t - b.ins.t || a.ins.index - b.ins.index);
}

/** A curve object on the parametric form; past `lastT` flat-forward as every curve. */
function parametricCurve(ws: Workspace, p: ParametricParams, obs: readonly Observation[], turns: readonly TurnSpan[]): Curve {
  const ln = (t: number): number => parametricLnDiscount(p, t) + turnLn(turns, t);
  const pillars: Pillar[] = [];
  for (const o of obs) {
    if (!o.included) continue;
    const prev = pillars[pillars.length - 1];
    if (prev && prev.t === o.ins.t) continue;
    pillars.push({ date: o.ins.maturity, t: o.ins.t, discount: Math.exp(ln(o.ins.t)), quote: o.ins.index });
  }
  const { settlement, curve } = ws;
  return curveFromLnDiscount(
    { settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation, pillars, time: (date) => curveTime(curve.dayCount, settlement, date) },
    { lnDiscount: ln, forward: (t) => parametricForward(p, t) + turnForward(turns, t) },
    'flat-forward',
  );
}

/** The fitted-measure residual of one observation (decimal yield), NaN when the model has none. */
export function fittedResidual(o: Observation, errors: FitErrors, ln: (t: number) => number): number {
  if (errors === 'yield') return o.qy.toYield(o.ins.modelQuote(ln)) - o.marketYield;
  if (o.ins.targetFromFlows !== undefined) return -residualOnCurve(o.ins, ln) / o.dollarDuration; // a target on the curve (an OIS's floating leg)
  return (o.ins.target - presentValue(o.ins, ln)) / o.dollarDuration;
}

const logGrid = (lo: number, hi: number, count: number): number[] =>
  Array.from({ length: count }, (_, i) => lo * Math.pow(hi / lo, i / (count - 1)));

/**
 * Fits Nelson-Siegel or Svensson to a workspace's enabled quotes by weighted least squares.
 *
 * 1. Profile over tau: on a log grid of tau (Svensson: pairs with tau2 >= ratio x tau1) the betas
 *    are found by linear least squares steps (Gauss-Newton on the betas alone, which is exact in
 *    one step for zero-rate quotes), keeping the grid point with the least weighted sum of squares.
 * 2. Refine all parameters together by Levenberg-Marquardt (levenbergMarquardt.ts) from the best
 *    grid points (the best two), inside the bounds (b in [-1, 1], 0.05 <= tau <= 30, tau2 >= ratio x tau1).
 *
 * Returns an error value when fewer quotes are included than the model has parameters; a fit
 * that does not converge comes back with `converged: false` and a report saying what to try.
 */
export function fitCurve(ws: Workspace, options: FitOptions, sink?: FitSink): Result<FitResult> {
  const model = options.model;
  const errors = options.errors ?? 'yield';
  const ratio = options.tauRatio ?? TAU_RATIO_MIN;
  const label = FIT_MODEL_LABEL[model];
  const obs = observe(ws, options);
  const used = obs.filter((o) => o.included);
  const np = parameterCount(model);
  if (used.length < np) {
    return fail(
      coreError(
        'no-solution',
        'curve.fit',
        `a ${label} fit has ${np} parameters and needs at least ${np} included quotes; ${used.length} ${used.length === 1 ? 'is' : 'are'} included: include more quotes or choose ${model === 'svensson' ? 'Nelson-Siegel' : 'the exact bootstrap'}`,
      ),
    );
  }
  const sqrtW = used.map((o) => Math.sqrt(o.weight));
  const m = used.length;
  const turns = options.turns ?? [];
  const residualOf = (v: Float64Array, out: Float64Array): boolean => {
    const p = paramsFromVector(model, v);
    const ln = (t: number): number => parametricLnDiscount(p, t) + turnLn(turns, t);
    for (let i = 0; i < m; i++) {
      const r = fittedResidual(used[i]!, errors, ln);
      if (!Number.isFinite(r)) return false;
      out[i] = sqrtW[i]! * r;
    }
    return true;
  };
  const project = (v: Float64Array): void => projectParams(model, v, ratio);
  const nb = betaCount(model);

  // 1. Profile over the taus.
  const first = used[0]!;
  const last = used[used.length - 1]!;
  const betas0 = [last.marketYield, first.marketYield - last.marketYield, 0, 0].slice(0, nb);
  const grid = logGrid(TAU_MIN, TAU_MAX, model === 'nelson-siegel' ? 25 : 12);
  const tauSets: number[][] = model === 'nelson-siegel' ? grid.map((t) => [t]) : grid.flatMap((t1) => grid.filter((t2) => t2 >= ratio * t1).map((t2) => [t1, t2]));
  const candidates: { v: Float64Array; ssr: number }[] = [];
  for (const taus of tauSets) {
    const betaResidual = (b: Float64Array, out: Float64Array): boolean => residualOf(Float64Array.from([...b, ...taus]), out);
    const fitB = levenbergMarquardt(betaResidual, betas0, m, {
      maxIterations: 2,
      project: (b) => {
        for (let i = 0; i < b.length; i++) b[i] = Math.min(1, Math.max(-1, b[i]!));
      },
    });
    if (Number.isFinite(fitB.ssr)) candidates.push({ v: Float64Array.from([...fitB.x, ...taus]), ssr: fitB.ssr });
  }
  candidates.sort((a, b) => a.ssr - b.ssr);
  if (candidates.length === 0) {
    return fail(coreError('not-converged', 'curve.fit', `the ${label} fit found no starting point with finite errors; check the quotes for extreme values`));
  }

  // 2. Refine from the best few grid points.
  let best: LmResult | null = null;
  for (const c of candidates.slice(0, 2)) {
    const r = levenbergMarquardt(residualOf, c.v, m, { project, maxIterations: options.maxIterations ?? 200 });
    if (!Number.isFinite(r.ssr)) continue;
    if (!best || (r.converged && !best.converged) || (r.converged === best.converged && r.ssr < best.ssr)) best = r;
  }
  if (!best) return fail(coreError('not-converged', 'curve.fit', `the ${label} fit broke down (non-finite errors); check the quotes for extreme values`));

  const params = paramsFromVector(model, best.x);
  const curve = parametricCurve(ws, params, obs, turns);
  const lnFit = (t: number): number => parametricLnDiscount(params, t) + turnLn(turns, t);
  if (sink) sink.trace = { ln: lnFit, turns, observations: obs };
  const residuals: FitResidual[] = obs.map((o) => {
    const modelYield = o.qy.toYield(o.ins.modelQuote(lnFit));
    const modelPv = presentValue(o.ins, lnFit);
    // The price the flows must meet: the constant target, or the target on the fitted curve (an OIS's floating leg).
    const target = targetOnCurve(o.ins, lnFit);
    return {
      index: o.ins.index,
      kind: o.ins.kind,
      maturity: o.ins.maturity,
      t: o.ins.t,
      field: o.ins.field,
      yieldLabel: o.qy.label,
      included: o.included,
      weight: o.weight,
      marketYield: o.marketYield,
      modelYield,
      residualBp: (modelYield - o.marketYield) * 1e4,
      marketPrice: target * o.per100,
      modelPrice: modelPv * o.per100,
      residualPrice: (modelPv - target) * o.per100,
    };
  });
  const wsum = used.reduce((s, o) => s + o.weight, 0);
  const rmsBp = Math.sqrt(best.ssr / wsum) * 1e4;
  const atBounds: string[] = [];
  const names = model === 'nelson-siegel' ? ['b0', 'b1', 'b2', 'tau1'] : ['b0', 'b1', 'b2', 'b3', 'tau1', 'tau2'];
  names.forEach((name, i) => {
    const v = best.x[i]!;
    if (name.startsWith('tau')) {
      if (v <= TAU_MIN * (1 + 1e-12)) atBounds.push(`${name} = ${TAU_MIN} years (lower bound)`);
      if (v >= TAU_MAX * (1 - 1e-12)) atBounds.push(`${name} = ${TAU_MAX} years (upper bound)`);
    } else if (Math.abs(v) >= 1 - 1e-12) atBounds.push(`${name} = ${v} (bound +-1)`);
  });
  if (model === 'svensson' && params.tau2 !== null && params.tau2 <= ratio * params.tau1 * (1 + 1e-9)) {
    atBounds.push(`tau2 = ${ratio} x tau1 (the ratio bound)`);
  }
  const worst = residuals.filter((r) => r.included).reduce((a, b) => (Math.abs(b.residualBp) > Math.abs(a.residualBp) ? b : a));
  const rmsWords = `weighted RMS error ${formatBp(rmsBp)}`;
  const worstWords = `largest residual quotes[${worst.index}] ${formatBp(worst.residualBp)}`;
  const report = best.converged
    ? `${label} fit converged after ${best.iterations} iterations; ${rmsWords}; ${worstWords}` + (atBounds.length > 0 ? `; on a bound: ${atBounds.join(', ')}` : '')
    : `${label} fit did not converge (${best.reason} after ${best.iterations} iterations); ${rmsWords}, ${worstWords}; ` +
      `try ${model === 'svensson' ? 'Nelson-Siegel, ' : ''}excluding quotes[${worst.index}] or lowering its weight, or check that quote`;
  const richCheap: RichCheapEntry[] = residuals
    .filter((r) => kindModule(r.kind).fit.richCheap)
    .map((r) => {
      const q = obs.find((o) => o.ins.index === r.index)!.ins.quote;
      const richnessPrice = -r.residualPrice;
      return {
        index: r.index,
        maturity: r.maturity,
        coupon: 'coupon' in q ? q.coupon : 0,
        included: r.included,
        residualBp: r.residualBp,
        richnessPrice,
        verdict: richnessPrice >= 0 ? ('rich' as const) : ('cheap' as const),
      };
    })
    .sort((a, b) => b.richnessPrice - a.richnessPrice);
  return ok({
    model,
    errors,
    params,
    curve,
    converged: best.converged,
    iterations: best.iterations,
    stopReason: best.reason,
    rmsBp,
    atBounds,
    report,
    residuals,
    richCheap,
  });
}
