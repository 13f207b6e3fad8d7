import { explainQuoteCheck } from '../curve/explainQuote.ts';
import type { ExplainedStep, Explanation } from '../curve/explain.ts';
import { turnLn } from '../bootstrap/turns.ts';
import { presentValue, targetOnCurve } from '../instruments/instrument.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { FitResult, FitSink } from './fitCurve.ts';
import { curvatureLoading, FIT_MODEL_LABEL, parametricZero, slopeLoading } from './parametricForm.ts';


/**
 * A figure of the fit's residual table: a quote's model yield on the fitted curve, or its residual
 * in bp (also the rich/cheap list's yield column); or the rich/cheap list's market minus model price.
 */
export type FitFigure = 'yield' | 'residual' | 'richness';

const PER100 = 'per 100 face';

/**
 * Explains a quote's model yield on the fitted curve (the residual table's 'Model yield') or its
 * residual (model minus market yield, bp): the fitted parameters (inputs: they come from the
 * weighted least squares, not from a formula), at each flow time the form's zero rate
 * y(t) = b0 + b1 L1(t/tau1) + b2 L2(t/tau1) (+ b3 L2(t/tau2)), L1(x) = (1 - e^-x)/x,
 * L2(x) = L1(x) - e^-x (Nelson and Siegel 1987; Svensson 1994) and ln DF = -y t (plus the turns'
 * ln J), then the quote priced on those values by its own quoteFromFlows (explainQuoteCheck with
 * the fit's ln DF, the very function fitCurve's residuals read, from its `FitSink`), its own yield,
 * and the residual, each the table's figure bit for bit.
 */
export function explainFitFigure(fit: FitResult, trace: NonNullable<FitSink['trace']>, index: number, figure: FitFigure): Result<Explanation> {
  const o = trace.observations.find((x) => x.ins.index === index);
  const row = fit.residuals.find((r) => r.index === index);
  if (!o || !row) return fail(coreError('schema', 'index', 'this quote is not in the fit'));
  const q = explainQuoteCheck(fit.curve, o.ins, fit.curve.settlement, 'model', trace.ln);
  if (!q.ok) return q;
  const e = q.value;
  const p = fit.params;
  const sv = p.tau2 !== null;
  const pu = 'decimal per year (continuous)';
  const steps: ExplainedStep[] = ['b0', 'b1', 'b2', ...(sv ? ['b3'] : [])].map((b) => ({ name: b, formula: `${b} = fitted`, inputs: [], value: p[b as 'b0'], unit: pu }));
  steps.push({ name: 'tau1', formula: 'tau1 = fitted', inputs: [], value: p.tau1, unit: 'years' });
  if (sv) steps.push({ name: 'tau2', formula: 'tau2 = fitted', inputs: [], value: p.tau2!, unit: 'years' });
  const params = steps.map((s) => s.name);
  for (const r of e.reads) {
    const t = r.t;
    const y = parametricZero(p, t);
    const j = turnLn(trace.turns, t);
    if (!Object.is(t <= 0 ? 0 : -y * t + j, r.lnDiscount)) return fail(coreError('schema', 'index', 'not on the form'));
    const l = (x: number): string => `L1 = ${slopeLoading(x)}, L2 = ${curvatureLoading(x)}`;
    const at = r.name.slice(3, -1);
    steps.push({ name: `y(${at})`, formula: `y(${at}) = b0 + b1 L1(x) + b2 L2(x)${sv ? ' + b3 L2(x2)' : ''}, x = t/tau1 (${l(t / p.tau1)})${sv ? `, x2 = t/tau2 (${l(t / p.tau2!)})` : ''}`, inputs: [...params, r.name], value: y, unit: pu });
    steps.push({ name: `ln ${r.name}`, formula: `ln ${r.name} = -y(${at}) x t${j === 0 ? '' : ` + ln J(t), the turns' jump ${j}`}`, inputs: [`y(${at})`, r.name], value: r.lnDiscount, unit: 'natural log of a discount factor' });
  }
  const model = e.value;
  const label = FIT_MODEL_LABEL[fit.model];
  const formForm = `${label} fit: y(t) = b0 + b1 L1(t/tau1) + b2 L2(t/tau1)${sv ? ' + b3 L2(t/tau2)' : ''}, L1(x) = (1 - e^-x)/x, L2(x) = L1(x) - e^-x, ln DF(t) = -y(t) t; parameters from weighted least squares of the ${fit.errors} errors (Levenberg-Marquardt).`;
  const reads = e.reads.map((r) => ({ ...r, formula: `${label} form` }));
  if (figure === 'richness') {
    // fitCurve's residual price, the rich/cheap list's figure negated: presentValue and targetOnCurve on the same ln DF.
    const entry = fit.richCheap.find((x) => x.index === index);
    if (!entry) return fail(coreError('schema', 'index', 'this quote is not on the rich/cheap list'));
    const ins = o.ins;
    const pv = presentValue(ins, trace.ln);
    const target = targetOnCurve(ins, trace.ln);
    const value = -((pv - target) * o.per100);
    if (!Object.is(value, entry.richnessPrice)) return fail(coreError('schema', 'index', 'not the figure shown'));
    const names = e.reads.map((r) => r.name);
    const amounts = Array.from(ins.amounts);
    amounts.forEach((a, j) => steps.push({ name: `CF${j}`, formula: `CF${j} = flow at ${names[j]!.slice(3, -1)}`, inputs: [], value: a, unit: PER100 }));
    const terms = amounts.map((_, j) => `CF${j} x ${names[j]}`);
    steps.push({ name: 'model price', formula: `model price = ${terms.length <= 4 ? terms.join(' + ') : `${terms[0]} + ... + ${terms.at(-1)}`}`, inputs: amounts.flatMap((_, j) => [`CF${j}`, names[j]!]), value: pv, unit: PER100 });
    const rec = ins as unknown as { schedule: { w: number; frequency: number }; accrued: number };
    const spot = ins.targetFromFlows !== undefined;
    const dirty = ins.target;
    if (ins.unit === 'rate') {
      steps.push({ name: 'market yield', formula: 'market yield = as quoted', inputs: [], value: ins.market, unit: `decimal per year: ${row.yieldLabel}` });
      steps.push({ name: 'w', formula: 'w = fraction of the current coupon period to run', inputs: [], value: rec.schedule.w, unit: 'periods' });
      steps.push({ name: 'dirty', formula: `dirty = sum_k CF_k (1 + y/${rec.schedule.frequency})^-(w + k), y the market yield (ICMA)`, inputs: ['market yield', 'w'], value: dirty, unit: PER100 });
    } else {
      steps.push({ name: 'clean', formula: 'clean = as quoted', inputs: [], value: ins.market, unit: PER100 });
      steps.push({ name: 'accrued', formula: 'accrued = accrued interest', inputs: [], value: rec.accrued, unit: PER100 });
      steps.push({ name: 'dirty', formula: 'dirty = clean + accrued', inputs: ['clean', 'accrued'], value: dirty, unit: PER100 });
    }
    if (spot) steps.push({ name: 'market price', formula: `market price = dirty x ${names[0]} (paid at settlement)`, inputs: ['dirty', names[0]!], value: target, unit: PER100 });
    const mk = spot ? 'market price' : 'dirty';
    steps.push({ name: 'richness', formula: `richness = -(model price - ${mk})`, inputs: ['model price', mk], value, unit: PER100 });
    return ok({
      ...e,
      quantity: 'fit-figure',
      formula: `${formForm} The bond: market minus model price = dirty price at the quote${spot ? ' x DF(settle)' : ''} - sum CF_i DF(T_i) (positive: rich)`,
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
  if (own) steps.push({ name: 'model yield', formula: 'model yield = own yield at the model value', inputs: ['model'], value: my, unit: yu });
  let value = my;
  if (figure === 'residual') {
    steps.push({ name: 'market yield', formula: 'market yield = own yield at the market value', inputs: [], value: o.marketYield, unit: yu });
    value = (my - o.marketYield) * 1e4;
    steps.push({ name: 'residual', formula: 'residual = (model yield - market yield) x 10,000', inputs: [own ? 'model yield' : 'model', 'market yield'], value, unit: 'bp' });
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
