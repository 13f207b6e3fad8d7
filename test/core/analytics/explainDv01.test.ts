import { describe, expect, it } from 'vitest';
import { analyzeBond, buildCurve, explainQuoteDv01, quoteDv01s, type BondInput } from '../../../src/core/index.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';

// The explanation of a bond's DV01 to one input quote (issue 19; the Bond section's DV01 to each
// quote table). Two claims, on the invented every-kind market (deposits, a bill, bonds, swaps):
// 1. the explanation ends in the table's figure bit for bit (quoteDv01s, the table's own function);
// 2. its steps, recomputed here from the shown inputs with the definitions, give it to 1e-15
//    relative: the dirty price P = sum CF_i DF(t_i) with DF = exp(ln DF) (the price of a bond off a
//    discount curve, common practice), and the central difference DV01 = (P(-1 bp) - P(+1 bp)) / 2
//    per 100 face per bp (the DV01 of a shift of the quote's own yield, common practice);
//    the moved quotes lie 1 bp either side of the quote's own yield (a rate quote moved by 1e-4).

const value = <T,>(r: { ok: true; value: T } | { ok: false; errors: readonly { message: string }[] }): T => {
  if (!r.ok) throw new Error(r.errors[0]!.message);
  return r.value;
};

describe('the DV01 of a bond to one quote, explained', () => {
  const built = buildCurve(workspaceDoc(INVENTED_2027_EVERY_KIND, { settlement: '2027-03-10', interpolation: 'log-linear-discount' }));
  const curve = built.curve!;
  const settings = built.settings!;
  const bond: BondInput = { maturity: '2033-08-15', coupon: 0.0375, frequency: 2, dayCount: 'ACT/ACT-ICMA' };
  const flows = value(analyzeBond(curve, bond)).flows;
  const table = value(quoteDv01s(settings, built.instruments, flows));

  it('ends in the table figure bit for bit for every quote, and the steps recomputed give it to 1e-15 relative', () => {
    let checked = 0;
    built.instruments.forEach((ins, k) => {
      const e = value(explainQuoteDv01(curve, settings, built.instruments, flows, k));
      const shown = table.find((q) => q.index === ins.index)!.dv01;
      expect(e.value, `quote ${k}`).toBe(shown);
      expect(e.steps.at(-1)!.value).toBe(shown);
      const step = (name: string) => e.steps.find((s) => s.name === name)!.value;
      const cf = flows.map((_, i) => step(`CF${i + 1}`));
      expect(cf).toEqual(flows.map((f) => f.amount));
      const price = (s: '+' | '-') => cf.reduce((p, c, i) => p + c * Math.exp(step(`ln DF${s}(t${i + 1})`)), 0);
      expect(price('+')).toBe(step('P+'));
      expect(price('-')).toBe(step('P-'));
      const again = (step('P-') - step('P+')) / 2;
      if (shown !== 0) expect(Math.abs(again - shown) / Math.abs(shown)).toBeLessThanOrEqual(1e-15);
      else expect(again).toBe(0);
      if (ins.unit === 'rate') {
        expect(Math.abs(step('q+') - ins.market - 1e-4)).toBeLessThan(1e-15);
        expect(Math.abs(ins.market - step('q-') - 1e-4)).toBeLessThan(1e-15);
      }
      if (Math.abs(shown) > 1e-4) checked++;
    });
    expect(checked).toBeGreaterThan(1); // the quotes around its maturity move its price most
  });

  it('a position that is not a quote is an error naming it, not a number', () => {
    const r = explainQuoteDv01(curve, settings, built.instruments, flows, built.instruments.length);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toMatch(/not in the curve/);
  });
});
