// The `strategy` key of the workspace document: defaults, path-named errors a user can act on,
// money parsing and cent rounding, and analysis errors for inputs that do not fit the curve.
import {
  analyseRollVsTerm,
  DEFAULT_STRATEGY,
  formatMoney,
  formatMoneySigned,
  MoneyDecimal,
  moneyTimes,
  parseMoney,
  validateStrategy,
} from '../../../src/core/index.ts';
import { rollMarketCurve } from '../../helpers/rollMarket.ts';

// Four quotes of the invented roll test market (test/helpers/rollMarket.ts).
const curve = rollMarketCurve(['3M', '1Y', '2Y', '5Y']);

describe('validateStrategy', () => {
  it('gives the documented defaults for a missing strategy and for missing fields', () => {
    expect(validateStrategy(undefined)).toEqual({ strategy: DEFAULT_STRATEGY, errors: [] });
    expect(validateStrategy({})).toEqual({ strategy: DEFAULT_STRATEGY, errors: [] });
    expect(DEFAULT_STRATEGY.rollDayCount).toBe('ACT/360');
  });

  it('keeps valid fields as given', () => {
    const raw = { amount: '250000.50', horizon: '2028-06-30', rollTenor: '6M', rollDayCount: 'ACT/365F', view: 'scenario:Bear steepener', path: { fill: 'typed', legs: [0.03, 0.031] }, shiftBp: -25 };
    const { strategy, errors } = validateStrategy(raw);
    expect(errors).toEqual([]);
    expect(strategy).toMatchObject({ amount: '250000.50', horizon: '2028-06-30', rollTenor: '6M', rollDayCount: 'ACT/365F', view: 'scenario:Bear steepener', shiftBp: -25 });
    expect(strategy.path.legs).toEqual([0.03, 0.031]);
  });

  it('names the path of every bad field, says what would be valid, and falls back to the default', () => {
    const { strategy, errors } = validateStrategy({ amount: '1 000 000', horizon: 'two years', rollTenor: '2M', rollDayCount: 'ACT/ACT-ICMA', bondFrequency: 3, shiftBp: 5000, path: { fill: 'wiggle', constant: 4.5, legs: [0.03, 'x'] }, colour: 'red' });
    const byPath = Object.fromEntries(errors.map((e) => [e.path, e.message]));
    expect(Object.keys(byPath).sort()).toEqual(
      ['strategy.amount', 'strategy.bondFrequency', 'strategy.colour', 'strategy.horizon', 'strategy.path.constant', 'strategy.path.fill', 'strategy.path.legs[1]', 'strategy.rollDayCount', 'strategy.rollTenor', 'strategy.shiftBp'].sort(),
    );
    expect(byPath['strategy.amount']).toMatch(/^strategy\.amount: .*group thousands with commas, or leave them out/);
    expect(byPath['strategy.horizon']).toMatch(/^strategy\.horizon: must be a tenor such as "2Y"/);
    expect(byPath['strategy.rollTenor']).toContain('1M, 3M, 6M, 1Y');
    expect(byPath['strategy.path.constant']).toContain('rates are decimals: 0.05 = 5%');
    expect(byPath['strategy.path.legs[1]']).toContain('leg 3');
    expect(strategy.amount).toBe(DEFAULT_STRATEGY.amount);
    expect(strategy.rollTenor).toBe(DEFAULT_STRATEGY.rollTenor);
    expect(strategy.path.legs).toEqual([]);
  });

  it('refuses a strategy that is not an object', () => {
    const { errors } = validateStrategy([1, 2]);
    expect(errors).toHaveLength(1);
    expect(errors[0]!.path).toBe('strategy');
  });
});

describe('money', () => {
  it('parses typed amounts exactly and refuses badly grouped separators, signs and zero', () => {
    const m = parseMoney('1000000.10');
    expect(m.ok && m.value.toFixed()).toBe('1000000.1');
    for (const bad of ['1,00', '10,0000', ',100', '1 000', '-5', '0', '', '1e6', '12.1234567', '10x', '-10m', '1.0000000001k']) expect(parseMoney(bad).ok, bad).toBe(false);
  });

  // Amounts as desks write them: thousands grouped by commas, and k / m (mm) / bn suffixes
  // (common practice on trading desks; "mm" for million is US usage).
  it('reads 10,000,000, 10m, 10mm, 2.5bn and 250k exactly', () => {
    for (const [text, exact] of [['10,000,000', '10000000'], ['1,234,567.89', '1234567.89'], ['10m', '10000000'], ['10MM', '10000000'], ['2.5bn', '2500000000'], ['250k', '250000'], ['1.25m', '1250000'], ['0.000001m', '1']] as const) {
      const r = parseMoney(text);
      expect(r.ok && r.value.toFixed(), text).toBe(exact);
    }
    expect(parseMoney('1,5').ok).toBe(false);
    expect(!parseMoney('1,5').ok && (parseMoney('1,5') as { message: string }).message).toMatch(/groups thousands in threes/);
  });

  it('rounds to cents half away from zero only for display (common practice for cash display)', () => {
    expect(formatMoney(new MoneyDecimal('1234567.005'))).toBe('1,234,567.01');
    expect(formatMoney(new MoneyDecimal('-0.004'))).toBe('0.00');
    expect(formatMoney(new MoneyDecimal('-1234.565'))).toBe('\u22121,234.57'); // the display minus, U+2212 (one minus sign on screen and in print)
    expect(formatMoneySigned(new MoneyDecimal('12'))).toBe('+12.00');
    // 0.1 + 0.2 in decimal is exactly 0.3: no float residue reaches the cents
    expect(new MoneyDecimal('0.1').plus('0.2').toFixed()).toBe('0.3');
    expect(moneyTimes(new MoneyDecimal('1000000'), 1.5).toFixed()).toBe('1500000');
  });
});

describe('analyseRollVsTerm input errors', () => {
  it('says when the horizon is beyond the curve', () => {
    const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, horizon: '7Y', ridingMaturity: '8Y' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toContain('strategy.horizon');
    expect(r.errors.find((e) => e.path === 'strategy.horizon')!.message).toMatch(/beyond the curve's last pillar.*flat-forward/);
  });

  it('says when the riding bond does not mature after the horizon', () => {
    const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, horizon: '2Y', ridingMaturity: '1Y' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors[0]!.path).toBe('strategy.ridingMaturity');
    expect(r.errors[0]!.message).toContain('must mature after the horizon');
  });

  it('warns when typed legs are fewer than the horizon needs and fills the rest from forwards', () => {
    const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, horizon: '1Y', view: 'path', path: { ...DEFAULT_STRATEGY.path, fill: 'typed', legs: [0.05] } });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const path = r.value.views.find((v) => v.id === 'path')!;
    expect(path.legRates[1]).toBeCloseTo(0.05, 15);
    expect(path.legRates[2]).toBeCloseTo(r.value.legs[2]!.forward, 12);
    expect(r.value.warnings.map((w) => w.path)).toContain('strategy.path.legs');
  });
});

describe('validateStrategy currency', () => {
  it('takes an ISO 4217 code of three capitals or "" for none, and names what is valid otherwise', () => {
    expect(validateStrategy({ currency: 'GBP' }).strategy.currency).toBe('GBP');
    expect(validateStrategy({}).strategy.currency).toBe('');
    const bad = validateStrategy({ currency: 'gbp' });
    expect(bad.strategy.currency).toBe('');
    expect(bad.errors[0]).toMatchObject({ path: 'strategy.currency' });
    expect(bad.errors[0]!.message).toMatch(/ISO 4217 code of three capital letters/);
  });
});
