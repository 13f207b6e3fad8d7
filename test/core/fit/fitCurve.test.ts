import { describe, it, expect } from 'vitest';
import {
  compileQuote,
  fitCurve,
  parametricLnDiscount,
  validateWorkspace,
  type ParametricParams,
  type Workspace,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Noiseless data: every quote is priced on a known parametric curve, so an exact fit exists and the
// fitted yields must come back to 1e-8 (the data are generated here; the check is that the
// optimiser finds the known minimum, not a value from outside).
const SETTLEMENT = '2027-03-10';
const shapes: Record<string, unknown>[] = [
  { kind: 'deposit', tenor: '3M', rate: 0 },
  { kind: 'deposit', tenor: '6M', rate: 0 },
  { kind: 'zero', tenor: '1Y', rate: 0, compounding: 'continuous', dayCount: 'ACT/365F' },
  { kind: 'zero', tenor: '18M', price: 97 },
  { kind: 'bond', maturity: '2029-05-15', coupon: 0.03, frequency: 2, cleanPrice: 100 },
  { kind: 'bond', maturity: '2030-11-15', coupon: 0.035, frequency: 2, yield: 0.03 },
  { kind: 'bond', maturity: '2032-02-15', coupon: 0.04, frequency: 2, cleanPrice: 100 },
  { kind: 'bond', maturity: '2034-08-15', coupon: 0.0275, frequency: 2, cleanPrice: 100 },
  { kind: 'swap', tenor: '10Y', rate: 0 },
  { kind: 'swap', tenor: '12Y', rate: 0 },
  { kind: 'bond', maturity: '2042-02-15', coupon: 0.045, frequency: 2, yield: 0.04 },
  { kind: 'swap', tenor: '20Y', rate: 0 },
  { kind: 'swap', tenor: '25Y', rate: 0 },
  { kind: 'bond', maturity: '2056-11-15', coupon: 0.04, frequency: 2, cleanPrice: 100 },
];

/** A workspace whose every quote is the model quote on the parametric curve p. */
function noiseless(p: ParametricParams, bump: { index: number; by: number } | null = null): Workspace {
  const draft = { format: 'tenorscope-workspace', version: 1, settlement: SETTLEMENT, curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes: shapes };
  const ws = validateWorkspace(draft).workspace!;
  const ln = (t: number): number => parametricLnDiscount(p, t);
  const quotes = ws.quotes.map((q, i) => {
    const ins = compileQuote(q, ws.settlement, ws.curve.dayCount);
    const shape = { ...shapes[i]! };
    shape[ins.field] = ins.modelQuote(ln) + (bump && bump.index === i ? bump.by : 0);
    return shape;
  });
  const out = validateWorkspace({ ...draft, quotes });
  expect(out.errors).toEqual([]);
  return out.workspace!;
}

const NS: ParametricParams = { model: 'nelson-siegel', b0: 0.042, b1: -0.015, b2: 0.012, b3: 0, tau1: 1.8, tau2: null };
const SV: ParametricParams = { model: 'svensson', b0: 0.041, b1: -0.012, b2: -0.02, b3: 0.03, tau1: 1.2, tau2: 9 };

describe('fitCurve on noiseless generated data', () => {
  it('fitCurve(ws, {model: nelson-siegel}) reprices every quote to 1e-8 in yield and recovers the parameters', () => {
    const fit = fitCurve(noiseless(NS), { model: 'nelson-siegel' });
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.value.converged, fit.value.report).toBe(true);
    for (const r of fit.value.residuals) expectClose(r.modelYield, r.marketYield, 1e-8, `noiseless NS data, quotes[${r.index}] ${r.kind}`);
    // One tau: the parameters are identified.
    expectClose(fit.value.params.tau1, NS.tau1, 1e-5, 'generating tau1 = 1.8');
    expectClose(fit.value.params.b0, NS.b0, 1e-7, 'generating b0');
    expectClose(fit.value.params.b1, NS.b1, 1e-7, 'generating b1');
    expectClose(fit.value.params.b2, NS.b2, 1e-7, 'generating b2');
  });

  it('fitCurve(ws, {model: svensson}) reprices to 1e-8 and, with taus well apart (1.2 and 9 years), recovers the parameters', () => {
    const fit = fitCurve(noiseless(SV), { model: 'svensson' });
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.value.converged, fit.value.report).toBe(true);
    for (const r of fit.value.residuals) expectClose(r.modelYield, r.marketYield, 1e-8, `noiseless Svensson data, quotes[${r.index}] ${r.kind}`);
    expectClose(fit.value.params.tau1, SV.tau1, 1e-4, 'generating tau1 = 1.2');
    expectClose(fit.value.params.tau2!, SV.tau2!, 1e-3, 'generating tau2 = 9');
    expectClose(fit.value.params.b3, SV.b3, 1e-6, 'generating b3');
  });

  it('fitCurve(ws, {errors: price}) fits price errors scaled to yield and also reprices to 1e-8', () => {
    const fit = fitCurve(noiseless(NS), { model: 'nelson-siegel', errors: 'price' });
    expect(fit.ok && fit.value.converged).toBe(true);
    if (!fit.ok) return;
    expect(fit.value.errors).toBe('price');
    for (const r of fit.value.residuals) expectClose(r.modelYield, r.marketYield, 1e-8, `noiseless NS data, price errors, quotes[${r.index}]`);
  });
});

describe('fitCurve include/exclude, weights and the rich/cheap list', () => {
  // quotes[6] (the 2032 bond) is put 0.50 above its model price.
  const ws = noiseless(NS, { index: 6, by: 0.5 });

  it('an excluded quote leaves the fit exact for the rest and shows its own residual (-0.50 per 100) as rich', () => {
    const fit = fitCurve(ws, { model: 'nelson-siegel', exclude: [6] });
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    for (const r of fit.value.residuals.filter((x) => x.index !== 6)) expectClose(r.modelYield, r.marketYield, 1e-8, `others exact, quotes[${r.index}]`);
    const bumped = fit.value.residuals.find((x) => x.index === 6)!;
    expect(bumped.included).toBe(false);
    expectClose(bumped.residualPrice, -0.5, 1e-7, 'model minus market price = -0.50 by construction');
    expect(bumped.residualBp).toBeGreaterThan(0);
    const top = fit.value.richCheap[0]!;
    expect(top.index).toBe(6);
    expect(top.verdict).toBe('rich');
    expectClose(top.richnessPrice, 0.5, 1e-7, 'market minus model price');
  });

  it('weight 0 acts as exclude; a positive weight pulls the fit toward that quote', () => {
    const w0 = fitCurve(ws, { model: 'nelson-siegel', weights: { 6: 0 } });
    const ex = fitCurve(ws, { model: 'nelson-siegel', exclude: [6] });
    const heavy = fitCurve(ws, { model: 'nelson-siegel', weights: { 6: 100 } });
    const plain = fitCurve(ws, { model: 'nelson-siegel' });
    if (!w0.ok || !ex.ok || !heavy.ok || !plain.ok) throw new Error('fit failed');
    expectClose(w0.value.params.b0, ex.value.params.b0, 1e-10, 'weight 0 = exclude');
    const r = (f: typeof plain, i: number): number => Math.abs(f.value.residuals.find((x) => x.index === i)!.residualBp);
    expect(r(heavy, 6)).toBeLessThan(r(plain, 6));
  });
});

describe('fitCurve reports what it cannot do', () => {
  it('refuses a Svensson fit with fewer included quotes than its six parameters, naming the count', () => {
    const ws = noiseless(SV);
    const fit = fitCurve(ws, { model: 'svensson', exclude: ws.quotes.slice(5).map((q) => q.index) });
    expect(fit.ok).toBe(false);
    if (fit.ok) return;
    expect(fit.errors[0]!.path).toBe('curve.fit');
    expect(fit.errors[0]!.message).toMatch(/at least 6 included quotes; 5 are included/);
  });
  it('says clearly when the refinement does not converge within the iteration limit', () => {
    const fit = fitCurve(noiseless(SV, { index: 9, by: 0.004 }), { model: 'svensson', maxIterations: 1 });
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.value.converged).toBe(false);
    expect(fit.value.report).toMatch(/did not converge \(max-iterations after 1 iterations\)/);
    expect(fit.value.report).toMatch(/try Nelson-Siegel/);
  });
});
