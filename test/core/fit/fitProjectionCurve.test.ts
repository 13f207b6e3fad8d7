import { describe, expect, it } from 'vitest';
import { buildCurve, buildNamedCurves, explainFitFigure, fitCurve, type FitSink, parametricLnDiscount, parametricZero, readNamedCurves, type Instrument } from '../../../src/core/index.ts';

// The smooth fit of a named projection curve (its quotes are term-index swaps: the floating leg
// reads the curve being fitted, each period's forward discounted on the discounting curve, the
// two-curve par rate; Ametrano and Bianchetti 2013, cited from memory). The market below is made
// from a Nelson-Siegel projection curve (Nelson and Siegel 1987: y(t) = b0 + b1 (1 - e^-x)/x +
// b2 ((1 - e^-x)/x - e^-x), x = t/tau) by pricing each swap on it with the build's own instruments;
// fitted as those instruments, the form comes back and every residual vanishes. Read as one-curve
// swaps (the fit without the build's instruments), it cannot: the discounting is not the form's.
// The parameters and the discounting quotes are invented test data.

const OIS = (['1Y', '2Y', '3Y', '5Y', '7Y', '10Y'] as const).map((tenor, i) => ({ kind: 'ois', tenor, rate: [0.021, 0.0222, 0.0231, 0.0246, 0.0259, 0.0271][i]!, conventions: 'eur-estr' }));
const SWAPS = (['1Y', '2Y', '3Y', '4Y', '5Y', '7Y', '10Y'] as const).map((tenor) => ({ kind: 'swap', tenor, rate: 0.03, frequency: 1, dayCount: '30/360' }));
const DOC = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2027-03-10',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  quotes: OIS,
  curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes: SWAPS }],
};
const FORM = { model: 'nelson-siegel' as const, b0: 0.034, b1: -0.011, b2: 0.006, b3: 0, tau1: 2.2, tau2: null };

describe('the smooth fit of a named projection curve', () => {
  const main = buildCurve(DOC, { readCurves: readNamedCurves });
  const named = buildNamedCurves(main.workspace!, main.curve).find((n) => n.name === 'euribor6m')!.build;
  const ws = named.workspace!;
  const ln = (t: number) => parametricLnDiscount(FORM, t);
  // Each swap's market: its par rate on the Nelson-Siegel projection curve, on the default curve's discounting.
  const market = new Map(named.instruments.map((i) => [i.index, i.modelQuote(ln)]));
  const instruments: Instrument[] = named.instruments.map((i) => i.requote(market.get(i.index)!));
  const quotes = ws.quotes.map((q) => ({ ...q, rate: market.get(q.index)! }));

  it('fits the term-index swaps as they price (the build instruments): the form comes back, every residual below 1e-6 bp', () => {
    expect(instruments.every((i) => i.readsCurves?.discount === 'default')).toBe(true);
    const fit = fitCurve({ ...ws, quotes } as typeof ws, { model: 'nelson-siegel', instruments });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    for (const r of fit.value.residuals) expect(Math.abs(r.residualBp), `quote ${r.index}`).toBeLessThan(1e-6);
    expect(Math.abs(fit.value.params.b0 - FORM.b0)).toBeLessThan(1e-7);
    expect(Math.abs(fit.value.params.tau1 - FORM.tau1)).toBeLessThan(1e-4);
  });

  it("explains a swap's residual on that fit as it prices: the table's figure bit for bit, its discounting read off the default curve", () => {
    const sink: FitSink = {};
    const fit = fitCurve({ ...ws, quotes } as typeof ws, { model: 'nelson-siegel', instruments }, sink);
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    for (const r of fit.value.residuals) {
      const e = explainFitFigure(fit.value, sink.trace!, r.index, 'residual');
      if (!e.ok) throw new Error(e.errors[0]!.message);
      expect(Object.is(e.value.value, r.residualBp), `quote ${r.index}`).toBe(true);
      if (r.index > 0) expect(e.value.reads.some((x) => x.name.startsWith('P_default('))).toBe(true);
    }
  });

  it('read as one-curve swaps they fit another curve: its zero rates miss the form (by 0.40 bp at worst here; more than 0.2 bp asserted)', () => {
    const fit = fitCurve({ ...ws, quotes } as typeof ws, { model: 'nelson-siegel' });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const miss = Math.max(...[1, 2, 3, 5, 7, 10].map((t) => Math.abs(parametricZero(fit.value.params, t) - parametricZero(FORM, t)) * 1e4));
    expect(miss).toBeGreaterThan(0.2);
  });
});
