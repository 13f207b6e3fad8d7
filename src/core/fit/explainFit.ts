import { explainQuoteCheck } from '../curve/explainQuote.ts';
import { explained, explainedConventions, type ExplainedRead, type ExplainedStep, type Explanation } from '../curve/explain.ts';
import { forwardOn, zeroOn } from '../curve/query.ts';
import { turnForward, turnLn } from '../bootstrap/turns.ts';
import { presentValue, targetOnCurve } from '../instruments/instrument.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import { fittedResidual, type FitResult, type FitSink } from './fitCurve.ts';
import { BETA_BOUND, curvatureLoading, FIT_MODEL_LABEL, parametricForward, parametricLnDiscount, parametricZero, slopeLoading, TAU_MAX, TAU_MIN } from './parametricForm.ts';
import { luFactor, luInverse } from '../numeric/luDecomposition.ts';
import type { QuoteInfluence } from '../analytics/explainRisk.ts';

/** A fitted parameter of the form. */
export type FitParam = 'b0' | 'b1' | 'b2' | 'b3' | 'tau1' | 'tau2';

/**
 * A figure of the fit: a quote's model yield, its residual in bp (also the rich/cheap list's yield
 * column) or per 100 face (`price`), the rich/cheap list's market minus model price; a parameter or
 * the weighted RMS error; the fitted zero rate at a date (`zero`, the charts' fit line).
 */
export type FitFigure = 'yield' | 'residual' | 'richness' | 'price' | 'zero' | 'rms' | FitParam;

/** Where a zero of the fit line is read: its date and the chart's compounding and day count. */
export interface FitZeroAt {
  readonly date: IsoDate;
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
  /** With it, the forward from `date` to `end` on the fitted curve (forwardOn) instead of the zero rate. */
  readonly end?: IsoDate;
}

const PER100 = 'per 100 face';
/** x at which L2(x) = L1(x) - e^-x peaks: the root of e^-x (1 + x + x^2) = 1. */
export const HUMP_PEAK = 1.7932821329007618;
const notShown = () => fail(coreError('schema', 'index', 'not the figure shown'));

/**
 * Explains a figure of the fit. A quote's model yield (the residual table's 'Model yield') or its
 * residual (model minus market yield, bp): the fitted parameters (inputs: they come from the
 * weighted least squares, not from a formula), at each flow time the form's zero rate
 * y(t) = b0 + b1 L1(t/tau1) + b2 L2(t/tau1) (+ b3 L2(t/tau2)), L1(x) = (1 - e^-x)/x,
 * L2(x) = L1(x) - e^-x (Nelson and Siegel 1987; Svensson 1994) and ln DF = -y t (plus the turns'
 * ln J; past the last fitted maturity T flat-forward at the form's f(T), as the fitted curve is),
 * then the quote priced on those values by its own quoteFromFlows (explainQuoteCheck with the fit's
 * ln DF, the very function fitCurve's residuals read, from its `FitSink`), its own yield, and the
 * residual. Its residual per 100 face and richness: presentValue and targetOnCurve on that ln DF,
 * as fitCurve calls them. A zero of the fit line: zeroOn on the fitted curve (what the charts
 * sample) with the form's steps before its read. A parameter or the RMS: each included quote's
 * weight and fitted-measure residual (fittedResidual), the objective S = sum (sqrt(w) r)^2 as the
 * least squares sums it; a parameter is then the minimiser, with checks of what it means, and the
 * RMS sqrt(S / sum w) x 10,000. Each ends in the figure shown bit for bit. `name` names a quote (default its index).
 */
export function explainFitFigure(fit: FitResult, trace: NonNullable<FitSink['trace']>, index: number, figure: FitFigure, at?: FitZeroAt, name: (index: number) => string = String): Result<Explanation> {
  const p = fit.params;
  const sv = p.tau2 !== null;
  const pu = 'decimal per year (continuous)';
  const LN = 'natural log of a discount factor';
  const params = ['b0', 'b1', 'b2', ...(sv ? ['b3', 'tau1', 'tau2'] : ['tau1'])];
  const steps: ExplainedStep[] = params.map((b) => st(b, 'fitted', [], p[b as 'b0']!, b[0] === 't' ? 'years' : pu));
  const label = FIT_MODEL_LABEL[fit.model];
  const formForm = `${label} fit: y(t) = b0 + b1 L1(t/tau1) + b2 L2(t/tau1)${sv ? ' + b3 L2(t/tau2)' : ''}, L1(x) = (1 - e^-x)/x, L2(x) = L1(x) - e^-x, ln DF(t) = -y(t) t; parameters from weighted least squares of the ${fit.errors} errors (Levenberg-Marquardt).`;
  const yAt = (at: string, t: number, inputs: string[]): ExplainedStep => {
    const l = (x: number): string => `L1 = ${slopeLoading(x)}, L2 = ${curvatureLoading(x)}`;
    return st(`y(${at})`, `b0 + b1 L1(x) + b2 L2(x)${sv ? ' + b3 L2(x2)' : ''}, x = t/tau1 (${l(t / p.tau1)})${sv ? `, x2 = t/tau2 (${l(t / p.tau2!)})` : ''}`, [...params, ...inputs], parametricZero(p, t), pu);
  };
  const T = fit.curve.lastT;
  if (figure === 'rms' || params.includes(figure)) {
    // The objective as fitCurve hands it to levenbergMarquardt: sqrt(w) x the fitted-measure residual, squared and summed in order.
    const qs: ExplainedStep[] = [];
    let S = 0;
    let W = 0;
    for (const o of trace.observations) {
      if (!o.included) continue;
      const k = name(o.ins.index);
      const r = fittedResidual(o, fit.errors, trace.ln);
      const e = Math.sqrt(o.weight) * r;
      S += e * e;
      W += o.weight;
      qs.push(st(`w(${k})`, 'weight', [], o.weight, 'unitless'), st(`r(${k})`, fit.errors === 'yield' ? 'model - market yield' : '(target - model price) / dollar duration', [], r, 'decimal'));
    }
    const all = qs.map((q) => q.name);
    qs.push(st('S', 'sum (sqrt(w) r)^2, minimised', all, S, 'decimal^2'));
    const own = steps.find((s) => s.name === figure);
    let value = Math.sqrt(S / W) * 1e4;
    if (own) {
      value = own.value;
      const argmin = (s: ExplainedStep): ExplainedStep => ({ ...s, formula: `${s.name} = argmin S (${fit.iterations} iterations, ${fit.stopReason}${fit.converged ? '' : ', not converged'})` });
      qs.push(...steps.filter((s) => s !== own).map(argmin), yAt('T', T, []), st('y(0+)', 'b0 + b1', ['b0', 'b1'], p.b0 + p.b1, pu), argmin(own));
    } else {
      if (!Object.is(value, fit.rmsBp)) return notShown();
      qs.push(st('W', 'sum w', all.filter((n) => n[0] === 'w'), W, 'unitless'), st('RMS', 'sqrt(S / W) x 10,000', ['S', 'W'], value, 'bp'));
    }
    const tau = /2/.test(figure) ? 'tau2' : 'tau1';
    const means = figure === 'b0' ? 'y(t) -> b0 as t -> infinity' : figure === 'b1' ? 'y(0+) = b0 + b1' : `L2(t/${tau}) peaks at t = ${HUMP_PEAK} ${tau} = ${HUMP_PEAK * p[tau]!} years`;
    return ok({
      quantity: 'fit-figure',
      conventions: explainedConventions(fit.curve, null, null),
      dates: [],
      yearFractions: [],
      reads: [],
      formula: `${formForm} ${own ? `${figure}: ${means}; T = ${T}, the longest fitted maturity; bounds |b| <= ${BETA_BOUND}, ${TAU_MIN} <= tau <= ${TAU_MAX}${fit.atBounds.length ? `; on a bound: ${fit.atBounds.join(', ')}` : ''}` : 'RMS = sqrt(S / W) x 10,000'}`,
      value,
      unit: own ? own.unit : 'bp',
      steps: qs,
    });
  }
  // The form's steps of each read: y(t) and ln DF = -y t + ln J (fitCurve's lnFit, which its residuals read); on the fitted curve (`flat`) flat-forward past T.
  // A read of another curve (a named curve's swap: its discounting, its other leg) is held as built, not the form.
  const other = (r: ExplainedRead): boolean => r.curve !== undefined;
  // The form's forward at T, which the fitted curve carries on past T.
  const f = parametricForward(p, T) + turnForward(trace.turns, T);
  const form = (reads: readonly ExplainedRead[], flat?: boolean): boolean => {
    for (const r of reads) {
      if (other(r)) continue;
      const t = r.t;
      const past = flat && t > T;
      const u = past ? T : t;
      const j = turnLn(trace.turns, u);
      const lnU = u <= 0 ? 0 : -parametricZero(p, u) * u + j;
      if (!Object.is(past ? lnU - f * (t - T) : lnU, r.lnDiscount)) return false;
      const at = past ? 'T' : r.name.slice(r.name.indexOf('(') + 1, -1);
      if (!steps.some((s) => s.name === `y(${at})`)) {
        steps.push(yAt(at, u, past ? [] : [r.name]), st(`ln DF(${at})`, `-y(${at}) x t${j === 0 ? '' : ` + ln J(t), the turns' jump ${j}`}`, [`y(${at})`], lnU, LN));
        if (past) steps.push(st('f(T)', `the form's forward at T = ${T}`, params, f, pu));
      }
      if (past) steps.push(st(`ln ${r.name}`, 'ln DF(T) - f(T) (t - T)', ['ln DF(T)', 'f(T)', r.name], r.lnDiscount, LN));
    }
    return true;
  };
  const relabel = (reads: readonly ExplainedRead[]) => reads.map((r) => (other(r) ? r : { ...r, formula: `${label} form` }));
  if (figure === 'zero' && at) {
    const z = explained<unknown>((sink) => (at.end ? forwardOn(fit.curve, at.date, at.end, at.compounding, at.dayCount, 'forward', sink) : zeroOn(fit.curve, at.date, at.compounding, at.dayCount, 'date', sink)));
    if (!z.ok) return z;
    const e = z.value.explanation;
    if (!form(e.reads, true)) return notShown();
    steps.push(...e.steps);
    return ok({ ...e, quantity: 'fit-figure', formula: `${formForm} The ${at.end ? 'forward' : 'zero'} rate: ${e.formula}`, reads: relabel(e.reads), steps });
  }
  const o = trace.observations.find((x) => x.ins.index === index);
  const row = fit.residuals.find((r) => r.index === index);
  if (!o || !row) return fail(coreError('schema', 'index', 'this quote is not in the fit'));
  const q = explainQuoteCheck(fit.curve, o.ins, fit.curve.settlement, 'model', trace.ln);
  if (!q.ok) return q;
  const e = q.value;
  if (!form(e.reads)) return notShown();
  const model = e.value;
  const reads = relabel(e.reads);
  if (figure === 'richness' || figure === 'price') {
    // fitCurve's residual price (model minus target, per 100) and its negation, the rich/cheap list's figure: presentValue and targetOnCurve on the same ln DF.
    const ins = o.ins;
    const pv = presentValue(ins, trace.ln);
    const target = targetOnCurve(ins, trace.ln);
    const d = (pv - target) * o.per100;
    const value = figure === 'price' ? d : -d;
    if (!Object.is(value, figure === 'price' ? row.residualPrice : fit.richCheap.find((x) => x.index === index)?.richnessPrice)) return notShown();
    const u = o.per100 === 1 ? PER100 : 'per 1 notional';
    const names = e.reads.map((r) => r.name);
    const amounts = Array.from(ins.amounts);
    amounts.forEach((a, j) => steps.push(st(`CF${j}`, `flow at ${names[j]!.slice(3, -1)}`, [], a, u)));
    const terms = amounts.map((_, j) => `CF${j} x ${names[j]}`);
    steps.push(st('model price', terms.length <= 4 ? terms.join(' + ') : `${terms[0]} + ... + ${terms.at(-1)}`, amounts.flatMap((_, j) => [`CF${j}`, names[j]!]), pv, u));
    const rec = ins as unknown as { schedule?: { w: number; frequency: number }; accrued: number };
    const spot = ins.targetFromFlows !== undefined;
    const dirty = ins.target;
    let mk = 'target';
    if (!rec.schedule) steps.push(st(mk, `the price its flows must meet${spot ? ', on the fitted curve' : ''}`, [], target, u));
    else {
      steps.push(
        ...(ins.unit === 'rate'
          ? [
              st('market yield', 'as quoted', [], ins.market, `decimal per year: ${row.yieldLabel}`),
              st('w', 'fraction of the current coupon period to run', [], rec.schedule.w, 'periods'),
              st('dirty', `sum_k CF_k (1 + y/${rec.schedule.frequency})^-(w + k), y the market yield (ICMA)`, ['market yield', 'w'], dirty, PER100),
            ]
          : [st('clean', 'as quoted', [], ins.market, PER100), st('accrued', 'accrued interest', [], rec.accrued, PER100), st('dirty', 'clean + accrued', ['clean', 'accrued'], dirty, PER100)]),
      );
      if (spot) steps.push(st('market price', `dirty x ${names[0]} (paid at settlement)`, ['dirty', names[0]!], target, PER100));
      mk = spot ? 'market price' : 'dirty';
    }
    const x = o.per100 === 1 ? '' : ` x ${o.per100}`;
    steps.push(figure === 'price' ? st('residual', `(model price - ${mk})${x}`, ['model price', mk], value, PER100) : st('richness', `-(model price - ${mk})`, ['model price', mk], value, PER100));
    return ok({
      ...e,
      quantity: 'fit-figure',
      formula: `${formForm} ${figure === 'price' ? `Model minus market price = (sum CF_i DF(T_i) - ${mk})${x}` : `The bond: market minus model price = dirty price at the quote${spot ? ' x DF(settle)' : ''} - sum CF_i DF(T_i) (positive: rich)`}`,
      value,
      unit: PER100,
      reads,
      steps,
    });
  }
  steps.push(...e.steps);
  const yu = `decimal per year: ${row.yieldLabel}`;
  const my = o.qy.toYield(model);
  const own = my !== model || o.ins.unit === 'price';
  if (own) steps.push(st('model yield', 'own yield at the model value', ['model'], my, yu));
  let value = my;
  if (figure === 'residual') {
    value = (my - o.marketYield) * 1e4;
    steps.push(st('market yield', 'own yield at the market value', [], o.marketYield, yu), st('residual', '(model yield - market yield) x 10,000', [own ? 'model yield' : 'model', 'market yield'], value, 'bp'));
  }
  return ok({
    ...e,
    quantity: 'fit-figure',
    formula: `${formForm} The quote: ${e.formula}`,
    value,
    unit: figure === 'residual' ? 'bp' : yu,
    reads,
    steps,
  });
}

/** A step `name = rhs`. */
const st = (name: string, rhs: string, inputs: string[], value: number, unit: string): ExplainedStep => ({ name, formula: `${name} = ${rhs}`, inputs, value, unit });

/**
 * The quotes a fitted figure depends on most, bp per bp of each quote's own yield: a b parameter
 * (`of` its name), or a quote's model yield (`of` its index; with `residual`, its residual). The fit
 * solves grad S = sum_i w_i r_i grad r_i = 0 (r_i = model minus market, d r_i / d q_k = -1 when i = k),
 * so by the implicit function theorem d theta / d q_k = H^-1 grad r_k w_k, H = sum_i w_i (grad r_i
 * grad r_i^T + r_i hess r_i) over the fitted quotes, the derivatives in the free parameters by
 * central differences (a tau on its bound is held, as the fit holds it); a model yield moves by
 * grad r_i . d theta / d q_k, its residual by that less 1 for its own quote. The `count` largest.
 */
export function fitQuotes(fit: FitResult, trace: NonNullable<FitSink['trace']>, of: string | number, residual = false, count = 5): Result<QuoteInfluence[]> {
  const p = fit.params as unknown as Record<string, number>;
  const names = ['b0', 'b1', 'b2', ...(fit.params.tau2 !== null ? ['b3', 'tau1', 'tau2'] : ['tau1'])].filter((k) => k[0] === 'b' || (p[k]! > TAU_MIN && p[k]! < TAU_MAX));
  const all = trace.observations;
  const n = names.length;
  const step = (k: string): number => 1e-5 * Math.max(0.01, Math.abs(p[k]!));
  const res = (q: Record<string, number>): number[] => all.map((o) => fittedResidual(o, fit.errors, (t) => parametricLnDiscount(q as never, t) + turnLn(trace.turns, t)));
  const moved = (q: Record<string, number>, k: string, h: number) => ({ ...q, [k]: q[k]! + h });
  // grad r_i at q: row i, one column per free parameter.
  const grad = (q: Record<string, number>): number[][] => {
    const cols = names.map((k) => {
      const [up, down] = [res(moved(q, k, step(k))), res(moved(q, k, -step(k)))];
      return up.map((u, i) => (u - down[i]!) / (2 * step(k)));
    });
    return all.map((_, i) => cols.map((c) => c[i]!));
  };
  const J = grad(p);
  const r0 = res(p);
  const d2 = names.map((k) => [grad(moved(p, k, step(k))), grad(moved(p, k, -step(k)))]);
  const a = new Float64Array(n * n);
  all.forEach((o, i) => o.included && names.forEach((_, u) => names.forEach((k, v) => (a[u * n + v] = a[u * n + v]! + o.weight * (J[i]![u]! * J[i]![v]! + r0[i]! * (d2[v]![0]![i]![u]! - d2[v]![1]![i]![u]!) / (2 * step(k)))))));
  const f = luFactor(a, n);
  const c = typeof of === 'string' ? names.map((k) => +(k === of)) : J[all.findIndex((o) => o.ins.index === of)];
  if (!f || !c) return fail(coreError('no-solution', 'curve.fit', 'the fit cannot tell its quotes apart here'));
  const inv = luInverse(f);
  const y = names.map((_, u) => names.reduce((s, __, l) => s + inv[l * n + u]! * c[l]!, 0));
  const list = all.map((o, i) => ({ index: o.ins.index, kind: o.ins.kind, maturity: o.ins.maturity, yieldLabel: o.qy.label, bpPerBp: (o.included ? y.reduce((s, v, l) => s + v * J[i]![l]!, 0) * o.weight : 0) - +(residual && o.ins.index === of) }));
  return ok(list.filter((x) => x.bpPerBp !== 0).sort((x, z) => Math.abs(z.bpPerBp) - Math.abs(x.bpPerBp)).slice(0, count));
}
