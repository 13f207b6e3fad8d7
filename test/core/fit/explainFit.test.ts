// The smooth fit's residual table explained: each quote's model yield and residual on a
// Nelson-Siegel or Svensson fit end in the table's figures (fitCurve's residuals) bit for bit; the
// form's zero rate at every flow time is recomputed here from the shown parameters and t by the
// published forms, y(t) = b0 + b1 (1 - e^-x)/x + b2 ((1 - e^-x)/x - e^-x) (+ b3 of the same in
// t/tau2), x = t/tau1 (C. R. Nelson and A. F. Siegel, Journal of Business 60(4), 1987; L. E. O.
// Svensson, NBER WP 4871, 1994), ln DF = -y t, and the quote's model value from those reads by its
// kind's formula (test/helpers/quoteCheckRecompute.ts), all to 1e-15 relative. Market invented.
import { bondDirtyFromYield, buildCurve, explainFitFigure, fitCurve, type FitSink, type FitErrors, type FitModel } from '../../../src/core/index.ts';
import { INVENTED_2026_FIT, workspaceDoc } from '../../helpers/markets.ts';
import { recompute, rel } from '../../helpers/quoteCheckRecompute.ts';

const VALUATION = '2026-12-02';
const MARKET = INVENTED_2026_FIT;
const ws = buildCurve(workspaceDoc(MARKET, { settlement: VALUATION })).workspace!;

/** The form's zero rate by the published formula, (1 - e^-x) as -expm1(-x) for precision at small x. */
function formZero(e: { steps: readonly { name: string; value: number }[] }, t: number): number {
  const v = (n: string): number | undefined => e.steps.find((s) => s.name === n)?.value;
  const L1 = (x: number): number => -Math.expm1(-x) / x;
  const L2 = (x: number): number => L1(x) - Math.exp(-x);
  const x = t / v('tau1')!;
  let y = v('b0')! + v('b1')! * L1(x) + v('b2')! * L2(x);
  if (v('tau2') !== undefined) y += v('b3')! * L2(t / v('tau2')!);
  return y;
}

describe('explainFitFigure', () => {
  for (const model of ['nelson-siegel', 'svensson'] as FitModel[]) {
    for (const errors of ['yield', 'price'] as FitErrors[]) {
      it(`${model}, ${errors} errors: ends in the residual table's model yield and residual bit for bit; steps recomputed to 1e-15`, () => {
        const sink: FitSink = {};
        const fit = fitCurve(ws, { model, errors }, sink);
        if (!fit.ok) throw new Error(fit.errors[0]!.message);
        // Traced equals untraced: the same fit without a sink, bit for bit.
        const plain = fitCurve(ws, { model, errors });
        if (!plain.ok) throw new Error('no fit');
        expect(plain.value.residuals).toEqual(fit.value.residuals);
        for (const row of fit.value.residuals) {
          const where = `${row.kind} ${row.maturity}`;
          const ins = sink.trace!.observations.find((o) => o.ins.index === row.index)!.ins;
          for (const figure of ['yield', 'residual'] as const) {
            const r = explainFitFigure(fit.value, sink.trace!, row.index, figure);
            if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
            const e = r.value;
            expect(Object.is(e.value, figure === 'yield' ? row.modelYield : row.residualBp), where).toBe(true);
            expect(Object.is(e.steps.at(-1)!.value, e.value), where).toBe(true);
            for (const read of e.reads) {
              const y = formZero(e, read.t);
              expect(rel(y, e.steps.find((s) => s.name === `y(${read.name.slice(3, -1)})`)!.value), where).toBeLessThanOrEqual(1e-15);
              expect(rel(-y * read.t, read.lnDiscount), where).toBeLessThanOrEqual(1e-15);
            }
            const modelValue = e.steps.find((s) => s.name === 'model')!.value;
            expect(rel(recompute(ins, e), modelValue), where).toBeLessThanOrEqual(1e-15);
            if (figure === 'residual') {
              const my = e.steps.find((s) => s.name === 'model yield')?.value ?? modelValue;
              const mk = e.steps.find((s) => s.name === 'market yield')!.value;
              expect(Math.abs((my - mk) * 1e4 - e.value)).toBeLessThanOrEqual(1e-15 * Math.abs(e.value) + 1e-12);
            }
          }
        }
      });
    }
  }

  // The rich/cheap list's market minus model price: the dirty price at the quote (ICMA price at a quoted yield,
  // sum CF_k (1 + y/f)^-(w + k), k from 0; clean + accrued for a price, ICMA Rule 251), paid at settlement (x DF(S)
  // for a bond settled at spot), minus sum CF_i DF(T_i) on the fitted form; positive: rich.
  for (const model of ['nelson-siegel', 'svensson'] as FitModel[]) {
    it(`${model}: each bond's richness ends in the rich/cheap figure bit for bit; every step recomputed from the shown inputs to 1e-15`, () => {
      const sink: FitSink = {};
      const fit = fitCurve(ws, { model, errors: 'price' }, sink);
      if (!fit.ok) throw new Error(fit.errors[0]!.message);
      expect(fit.value.richCheap.length).toBe(3);
      const kinds = new Set<string>();
      for (const entry of fit.value.richCheap) {
        const where = `bond ${entry.maturity}`;
        const ins = sink.trace!.observations.find((o) => o.ins.index === entry.index)!.ins;
        const r = explainFitFigure(fit.value, sink.trace!, entry.index, 'richness');
        if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
        const e = r.value;
        expect(Object.is(e.value, entry.richnessPrice), where).toBe(true);
        expect(Object.is(e.steps.at(-1)!.value, entry.richnessPrice), where).toBe(true);
        const v = (n: string): number => e.steps.find((s) => s.name === n)!.value;
        const has = (n: string): boolean => e.steps.some((s) => s.name === n);
        for (const read of e.reads) expect(rel(-formZero(e, read.t) * read.t, read.lnDiscount), where).toBeLessThanOrEqual(1e-15);
        let pv = 0;
        e.reads.forEach((read, j) => (pv += v(`CF${j}`) * read.discount));
        expect(rel(pv, v('model price')), where).toBeLessThanOrEqual(1e-15);
        let dirty: number;
        if (has('market yield')) {
          kinds.add('yield');
          const s = (ins as unknown as { schedule: Parameters<typeof bondDirtyFromYield>[0] }).schedule;
          const y = v('market yield');
          dirty = 0;
          s.amounts.forEach((cf, k) => (dirty += cf * Math.pow(1 + y / s.frequency, -(v('w') + k))));
        } else {
          kinds.add('price');
          dirty = v('clean') + v('accrued');
        }
        expect(rel(dirty, v('dirty')), where).toBeLessThanOrEqual(1e-15);
        let market = v('dirty');
        if (has('market price')) {
          kinds.add('spot');
          market = v('dirty') * e.reads[0]!.discount;
          expect(rel(market, v('market price')), where).toBeLessThanOrEqual(1e-15);
          market = v('market price');
        }
        expect(Object.is(market - v('model price'), e.value), where).toBe(true);
      }
      expect(kinds).toEqual(new Set(['yield', 'price', 'spot']));
    });
  }
});
