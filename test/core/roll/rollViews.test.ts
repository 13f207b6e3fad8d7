// Views of the future: each is a complete rule for the short rates and the horizon curve. Checks
// of their defining arithmetic (hand calculations from the definitions, stated beside each) and of
// how they agree with each other where the definitions say they must.
import type { Curve } from '../../../src/core/index.ts';
import { analyseRollVsTerm, DEFAULT_STRATEGY, shiftedCurve, type StrategyInputs } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';
import { rollMarketCurve } from '../../helpers/rollMarket.ts';

// The invented roll test market (test/helpers/rollMarket.ts), all eight quotes.
const curve: Curve = rollMarketCurve();

const run = (s: Partial<StrategyInputs>, scenarios: { name: string; curve: Curve }[] = []) => {
  const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, ...s }, scenarios);
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join('; '));
  return r.value;
};
const growth = (a: ReturnType<typeof run>, view: string, id: string) => a.views.find((v) => v.id === view)!.strategies.find((s) => s.id === id)!.growth;

describe('views', () => {
  it('curve unchanged: every roll leg earns the 3M spot rate, partial legs pro rata (definition)', () => {
    const a = run({ horizon: '2027-06-15' }); // 6.5 months: legs 3M, 3M, and a short 0.5M
    const v = a.views.find((x) => x.id === 'unchanged')!;
    for (const r of v.legRates) expectClose(r, a.spotRollRate, 1e-14, 'definition of the unchanged view: each leg at the spot rate (float64 round-off of (g - 1)/tau)');
    const expected = a.legs.reduce((g, leg) => g * (1 + a.spotRollRate * leg.tau), 1);
    expectClose(growth(a, 'unchanged', 'roll'), expected, 1e-15, 'hand calculation: product of (1 + r tau) with the short last leg pro rata');
    expect(a.legs[a.legs.length - 1]!.short).toBe(true);
  });

  it('a constant path at r earns (1 + r_1 tau_1) prod (1 + r tau_k) (definition)', () => {
    const a = run({ view: 'path', path: { ...DEFAULT_STRATEGY.path, fill: 'constant', constant: 0.05 } });
    const expected = a.legs.reduce((g, leg, k) => g * (1 + (k === 0 ? leg.forward : 0.05) * leg.tau), 1);
    expectClose(growth(a, 'path', 'roll'), expected, 1e-15, 'hand calculation of a constant path');
  });

  it('a ramp runs linearly from leg 2 to the last leg (definition)', () => {
    const a = run({ view: 'path', path: { ...DEFAULT_STRATEGY.path, fill: 'ramp', rampFrom: 0.03, rampTo: 0.045 } });
    const rates = a.views.find((x) => x.id === 'path')!.legRates;
    expectClose(rates[1]!, 0.03, 1e-15, 'ramp start');
    expectClose(rates[rates.length - 1]!, 0.045, 1e-15, 'ramp end');
    expectClose(rates[4]! - rates[3]!, 0.015 / (rates.length - 2), 1e-15, 'equal ramp steps');
  });

  it('the shift view at 0 bp is the forwards view, and its break-even shift is minus its own shift', () => {
    const zero = run({ shiftBp: 0 });
    for (const id of ['roll', 'zero', 'bond', 'riding']) expect(growth(zero, 'shift', id)).toBe(growth(zero, 'forwards', id));
    const a = run({ view: 'shift', shiftBp: 75 });
    for (const id of ['zero', 'bond', 'riding'] as const) expectClose(a.breakEvens.shiftBp[id]!, -75, 1e-6, 'forwards + 75 bp moved back by 75 bp is forwards, where all end equal');
  });

  it('a scenario equal to today\'s curve reads the same as the unchanged view', () => {
    const a = run({ view: 'scenario:Same' }, [{ name: 'Same', curve }]);
    expect(a.views[a.chosen]!.id).toBe('scenario:Same');
    for (const id of ['roll', 'zero', 'bond', 'riding']) expectClose(growth(a, 'scenario:Same', id), growth(a, 'unchanged', id), 1e-15, 'definition: the curve moves to the scenario and stays unchanged');
  });

  it("a scenario's forwards reading: on today's curve it is forwards realised, where every strategy ends equal", () => {
    const a = run({ view: 'scenario-fwd:Same' }, [{ name: 'Same', curve }]);
    expect(a.views.map((v) => v.id)).toEqual(['forwards', 'unchanged', 'path', 'shift', 'scenario:Same', 'scenario-fwd:Same']);
    for (const id of ['roll', 'zero', 'bond', 'riding']) {
      expectClose(growth(a, 'scenario-fwd:Same', id), growth(a, 'forwards', id), 1e-15, 'definition: the scenario forwards on an unmoved curve are today\'s forwards');
      expectClose(growth(a, 'scenario-fwd:Same', id), growth(a, 'scenario-fwd:Same', 'roll'), 1e-12, 'forwards-realised identity on the scenario curve');
    }
  });

  it('a scenario 100 bp higher lifts rolling and sinks the riding bond against the unchanged view', () => {
    const a = run({ view: 'scenario:Up 100' }, [{ name: 'Up 100', curve: shiftedCurve(curve, 100) }]);
    expect(growth(a, 'scenario:Up 100', 'roll')).toBeGreaterThan(growth(a, 'unchanged', 'roll'));
    expect(growth(a, 'scenario:Up 100', 'riding')).toBeLessThan(growth(a, 'unchanged', 'riding'));
    expect(growth(a, 'scenario:Up 100', 'zero')).toBe(growth(a, 'unchanged', 'zero'));
  });

  it('the riding split adds up to the terminal value under every view', () => {
    const a = run({});
    for (const v of a.views) {
      const riding = v.strategies.find((s) => s.id === 'riding')!;
      const sum = a.amount.plus(v.riding.carry).plus(v.riding.rollDown).plus(v.riding.curveChange);
      expectClose(sum.minus(riding.terminal).abs().toNumber(), 0, 1e-6, `definition of the split (carry + roll-down + curve change), ${v.id}`);
    }
  });

  it('the break-even roll rate makes rolling equal to the zero at a constant rate (Brent root checked by substitution)', () => {
    const a = run({ view: 'path' });
    const r = a.breakEvens.rollRate.zero!;
    const b = run({ view: 'path', path: { ...DEFAULT_STRATEGY.path, fill: 'constant', constant: r } });
    expectClose(growth(b, 'path', 'roll'), growth(b, 'path', 'zero'), 1e-14, 'substituting r* back in: rolling equals the zero');
  });
});
