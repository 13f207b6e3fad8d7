import { describe, expect, it } from 'vitest';
import { buildCurve, fitCurve, fitQuotes, type FitModel, type FitSink, type Workspace } from '../../../src/core/index.ts';
import { workspaceDoc } from '../../helpers/markets.ts';

// The quotes a fitted figure depends on most (fitQuotes): a b parameter's, a model yield's and a
// residual's sensitivity to each quote (bp per bp of its own yield), by the implicit function
// theorem on the fit's first-order condition grad S = 0 with the full Hessian of S (the residuals'
// second derivatives included: without them, the Gauss-Newton approximation, the Svensson fit here
// is off by up to 7%; nonlinear least squares, e.g. Nocedal and Wright, "Numerical Optimization";
// cited from memory). Held here to bump and refit: each rate quote moved 0.1 bp either way, the fit
// made again, the figure's central difference per bp, to 0.2% of the largest. The forms: Nelson and Siegel (1987), Svensson (1994). The
// market is invented test data.

const MARKET = [
  { kind: 'deposit', tenor: '1M', rate: 0.0383 },
  { kind: 'deposit', tenor: '3M', rate: 0.0379 },
  { kind: 'zero', tenor: '1Y', rate: 0.0352, compounding: 'semiannual', dayCount: 'ACT/365F' },
  { kind: 'swap', tenor: '2Y', rate: 0.0345 },
  { kind: 'swap', tenor: '3Y', rate: 0.0349 },
  { kind: 'swap', tenor: '5Y', rate: 0.0358 },
  { kind: 'swap', tenor: '7Y', rate: 0.0371 },
  { kind: 'swap', tenor: '10Y', rate: 0.0381 },
  { kind: 'swap', tenor: '15Y', rate: 0.0392 },
  { kind: 'swap', tenor: '20Y', rate: 0.0389 },
];
const ws = buildCurve(workspaceDoc(MARKET, { settlement: '2026-12-02' })).workspace!;
const H = 1e-5; // 0.1 bp

const bumped = (k: number, h: number): Workspace => ({ ...ws, quotes: ws.quotes.map((q, i) => (i === k ? ({ ...q, rate: (q as { rate: number }).rate + h } as typeof q) : q)) });

describe('fitQuotes: a fitted figure against each quote, bp per bp', () => {
  for (const model of ['nelson-siegel', 'svensson'] as FitModel[]) {
    const sink: FitSink = {};
    const fit = fitCurve(ws, { model }, sink);
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const again = (k: number, h: number) => {
      const r = fitCurve(bumped(k, h), { model });
      if (!r.ok) throw new Error(r.errors[0]!.message);
      return r.value;
    };
    it(`${model}: b0 and b1 move with each quote as a bump and refit moves them (to 0.2% of the largest)`, () => {
      for (const param of ['b0', 'b1'] as const) {
        const listed = fitQuotes(fit.value, sink.trace!, param, false, 99);
        if (!listed.ok) throw new Error(listed.errors[0]!.message);
        const largest = Math.abs(listed.value[0]!.bpPerBp);
        expect(largest).toBeGreaterThan(0.05);
        for (const q of listed.value) {
          const moved = (again(q.index, H).params[param] - again(q.index, -H).params[param]) / (2 * H);
          expect(Math.abs(moved - q.bpPerBp), `${param} to quote ${q.index}`).toBeLessThan(0.002 * largest);
        }
      }
    });
    it(`${model}: a model yield and its residual: the same through the fit, the residual less 1 for its own quote`, () => {
      const i = 5; // the 5Y swap
      const y = fitQuotes(fit.value, sink.trace!, i, false, 99);
      const r = fitQuotes(fit.value, sink.trace!, i, true, 99);
      if (!y.ok || !r.ok) throw new Error('fitQuotes');
      const own = (list: typeof y.value) => list.find((q) => q.index === i)!.bpPerBp;
      expect(own(r.value)).toBeCloseTo(own(y.value) - 1, 12);
      const residualOf = (f: ReturnType<typeof again>) => f.residuals.find((x) => x.index === i)!.residualBp;
      const moved = (residualOf(again(i, H)) - residualOf(again(i, -H))) / (2 * H) / 1e4;
      expect(Math.abs(moved - own(r.value))).toBeLessThan(0.002);
    });
  }
});
