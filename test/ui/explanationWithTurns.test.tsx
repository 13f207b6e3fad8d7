// @vitest-environment jsdom
// The explanation's "same number under each method" for a workspace with a year-end turn: each
// method's build must carry the turns' code as the workbench's own build does (before, every method
// but none said the turns were loading, and no figure was shown). The value under the current method
// is the explained number itself. Quotes invented; the turn is a year-end date range as in
// MARKET-CONVENTIONS.md section h (common practice: a spread on the overnight rate over the turn).
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { INVENTED_2022_OVERNIGHT } from '../helpers/markets.ts';
import { workbenchOf } from '../helpers/engineWorkspace.ts';

const ENGINE = { ...INVENTED_2022_OVERNIGHT, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 }] };

beforeAll(() => loadOvernightKit());

describe('explanations of a curve with turns', () => {
  it('give the number under every method, the current one equal to the explained value', () => {
    const doc = workbenchOf(ENGINE);
    const result = deriveBuild(doc);
    expect(result.build.curve).not.toBeNull();
    const model = explainKeyCell(result, doc.display, { tenor: '1Y', field: 'forward' });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    expect(model.value.methods.length).toBe(5);
    for (const m of model.value.methods) {
      expect(m.error).toBeNull();
      expect(Number.isFinite(m.value)).toBe(true);
    }
    expect(model.value.methods.find((m) => m.current)!.value).toBe(model.value.explanation.value);
  });

  it('give a bond figure under every method too (the bond panel rebuilds the curve as the workbench does)', () => {
    const doc = workbenchOf(ENGINE);
    const result = deriveBuild(doc);
    // An invented two-year bond inside the curve's three years.
    const input = { maturity: '2024-03-01', coupon: 0.03, frequency: 2, dayCount: 'ACT/ACT-ICMA' as const };
    const model = explainKeyCell(result, doc.display, { bond: { input, figure: 'dirty', side: 'model' } });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    expect(model.value.methods.length).toBe(5);
    for (const m of model.value.methods) expect(m.error).toBeNull();
    expect(model.value.methods.find((m) => m.current)!.value).toBe(model.value.explanation.value);
  });
});
