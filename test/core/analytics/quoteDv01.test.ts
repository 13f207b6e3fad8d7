import { describe, it, expect } from 'vitest';
import { analyzeBond, bootstrapInstruments, compileMarket, quoteDv01s, validateWorkspace } from '../../../src/core/index.ts';
import { expectRelClose } from '../../helpers/asserts.ts';

// Invented zero-rate quotes (continuous, ACT/365F, the curve's own axis). With log-linear discount
// interpolation ln DF is linear in the nodes -z_j t_j, so moving every quote by h moves ln DF(t) by
// exactly -h t inside the curve: a parallel shift of the continuously compounded zero. The quote
// DV01s must then add up to the parallel DV01 (to the O(h^2) of central 1 bp differences).
const tenors = ['6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '15Y', '20Y'];
const doc = {
  format: 'tenorscope-workspace',
  version: 1,
  settlement: '2027-03-10',
  curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' },
  quotes: tenors.map((tenor, i) => ({ kind: 'zero', tenor, rate: 0.028 + 0.0009 * i, compounding: 'continuous', dayCount: 'ACT/365F' })),
};

describe('quoteDv01s: DV01 of a bond to each input quote', () => {
  const ws = validateWorkspace(doc).workspace!;
  const instruments = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false).instruments;
  const settings = { settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation: 'log-linear-discount' as const, extrapolation: 'none' as const };
  const curve = bootstrapInstruments(settings, instruments).curve!;
  const a = analyzeBond(curve, { maturity: '2041-08-15', coupon: 0.045, frequency: 2, dayCount: 'ACT/ACT-ICMA' });
  if (!a.ok) throw new Error(a.errors[0]!.message);
  const dv = quoteDv01s(settings, instruments, a.value.flows);
  if (!dv.ok) throw new Error(dv.errors[0]!.message);

  it('adds up to the parallel-zero DV01 (effective duration x dirty price x 1e-4) when every quote is a zero rate', () => {
    const total = dv.value.reduce((s, q) => s + q.dv01, 0);
    expectRelClose(total, a.value.effectiveDuration * a.value.modelDirtyPrice * 1e-4, 1e-6, 'log-linear nodes: all quotes +1 bp = parallel +1 bp of the cont zero');
  });
  it('is zero for quotes beyond the bond and largest at the pillars around its maturity (2041: 10Y and 15Y)', () => {
    const byTenor = Object.fromEntries(dv.value.map((q, i) => [tenors[i], q.dv01]));
    expect(byTenor['20Y']).toBe(0);
    const top2 = [...dv.value].sort((x, y) => y.dv01 - x.dv01).slice(0, 2).map((q) => tenors[dv.value.indexOf(q)]);
    expect(top2.sort()).toEqual(['10Y', '15Y']);
    for (const q of dv.value) expect(q.dv01).toBeGreaterThanOrEqual(0);
  });
});
