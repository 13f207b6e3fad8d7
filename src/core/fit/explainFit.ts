import { explainQuoteCheck } from '../curve/explainQuote.ts';
import type { ExplainedStep, Explanation } from '../curve/explain.ts';
import { turnLn } from '../bootstrap/turns.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { FitResult, FitSink } from './fitCurve.ts';
import { curvatureLoading, FIT_MODEL_LABEL, parametricZero, slopeLoading } from './parametricForm.ts';


/** A figure of the fit's residual table: a quote's model yield on the fitted curve, or its residual in bp. */
export type FitFigure = 'yield' | 'residual';

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
    formula: `${label} fit: y(t) = b0 + b1 L1(t/tau1) + b2 L2(t/tau1)${sv ? ' + b3 L2(t/tau2)' : ''}, L1(x) = (1 - e^-x)/x, L2(x) = L1(x) - e^-x, ln DF(t) = -y(t) t; parameters from weighted least squares of the ${fit.errors} errors (Levenberg-Marquardt). The quote: ${e.formula}`,
    value,
    unit: figure === 'residual' ? 'bp' : yu,
    reads: e.reads.map((r) => ({ ...r, formula: `${label} form` })),
    steps,
  });
}
