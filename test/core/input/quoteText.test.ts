// Exact reading of typed quotes. Expected doubles are written as decimal literals: JavaScript
// reads a literal as the double nearest its exact decimal value (ECMA-262, Number::toString /
// StringToNumber, round-to-nearest), which is what an exact parse then one rounding must give.
import {
  parseCouponText,
  parseDayCountText,
  parseFrequencyText,
  parseKindText,
  parseMaturityText,
  parsePriceText,
  parseRateText,
  readRate,
  rewriteBareRate,
} from '../../../src/core/index.ts';

const value = <T>(p: { ok: true; value: T } | { ok: false; message: string }): T => {
  if (!p.ok) throw new Error(`expected a value, got: ${p.message}`);
  return p.value;
};
const message = (p: { ok: boolean; message?: string }): string => {
  if (p.ok) throw new Error('expected an error');
  return p.message!;
};

describe('parseRateText(text, mode) reads rates exactly', () => {
  it('parseRateText("3.25%") is the double nearest 0.0325 (ECMA-262 literal rounding), not 3.25 / 100', () => {
    expect(value(parseRateText('3.25%', 'percent', 'rate'))).toBe(0.0325);
    expect(value(parseRateText('1.1%', 'percent', 'rate'))).toBe(0.011); // 1.1 / 100 = 0.011000000000000001 in float64
    expect(1.1 / 100).not.toBe(0.011);
  });

  it('a bare number is read in the chosen unit: percent, decimal or basis points', () => {
    expect(value(parseRateText('3.25', 'percent', 'rate'))).toBe(0.0325);
    expect(value(parseRateText('0.0325', 'decimal', 'rate'))).toBe(0.0325);
    expect(value(parseRateText('325', 'bp', 'rate'))).toBe(0.0325);
  });

  it('"325bp", "325 bps" and "3.25 %" carry their own unit whatever the mode', () => {
    expect(value(parseRateText('325bp', 'decimal', 'rate'))).toBe(0.0325);
    expect(value(parseRateText('325 bps', 'percent', 'rate'))).toBe(0.0325);
    expect(value(parseRateText('3.25 %', 'bp', 'rate'))).toBe(0.0325);
    expect(value(parseRateText('0.1bp', 'percent', 'rate'))).toBe(0.00001);
  });

  it('the Unicode minus (U+2212) and an en dash read as a minus sign', () => {
    expect(value(parseRateText('\u22120.25%', 'percent', 'rate'))).toBe(-0.0025);
    expect(value(parseRateText('\u201350bp', 'percent', 'rate'))).toBe(-0.005);
  });

  it('a bare value above 1 in decimal mode asks "did you mean %?" and suggests both valid forms', () => {
    const m = message(parseRateText('3.25', 'decimal', 'rate'));
    expect(m).toContain('did you mean 3.25%?');
    expect(m).toContain('0.0325');
  });

  it('text that is not a number says what a rate looks like', () => {
    expect(message(parseRateText('abc', 'percent', 'rate'))).toMatch(/not a number; type a rate such as 3.25%, 325bp or 3.25/);
    expect(message(parseRateText('3.2.5', 'percent', 'rate'))).toMatch(/not a number/);
    expect(message(parseRateText('', 'percent', 'swap rate'))).toMatch(/swap rate is required/);
  });

  it('rates outside the engine range -10% to 100% are refused with the range in percent', () => {
    expect(message(parseRateText('150', 'percent', 'rate'))).toBe(
      'rate 150% is out of range; a rate must be from -10% to 100%. 150 in % mode is 150%: did you mean 1.5%? If so type 1.5, or 150bp, or switch the unit to bp',
    );
    expect(message(parseRateText('150%', 'percent', 'rate'))).toBe('rate 150% is out of range; a rate must be from -10% to 100%');
    expect(message(parseRateText('-11%', 'percent', 'rate'))).toMatch(/from -10% to 100%/);
  });

  it('readRate keeps the exact decimal typed and whether it was bare', () => {
    const r = value(readRate('4.125', 'percent'));
    expect(r.typed.toFixed()).toBe('4.125');
    expect(r.bare).toBe(true);
    expect(value(readRate('4.125%', 'bp')).bare).toBe(false);
  });
});

describe('parseCouponText', () => {
  it('reads coupons like rates, within 0% to 50%', () => {
    expect(value(parseCouponText('3.875', 'percent'))).toBe(0.03875);
    expect(message(parseCouponText('-1', 'percent'))).toMatch(/coupon -1% is out of range; a coupon must be from 0% to 50%/);
  });
});

describe('parsePriceText', () => {
  it('reads decimal prices per 100 exactly', () => {
    expect(value(parsePriceText('99.875'))).toBe(99.875);
    expect(value(parsePriceText('100.28'))).toBe(100.28);
  });

  it('reads points and 32nds (common practice for US Treasury prices): 99-16 is 99.5, 99-16+ is 99.515625, 99-162 is 99.5078125', () => {
    expect(value(parsePriceText('99-16'))).toBe(99.5);
    expect(value(parsePriceText('99-16+'))).toBe(99 + 16.5 / 32);
    expect(value(parsePriceText('99-162'))).toBe(99 + 16.25 / 32);
    expect(parsePriceText('99-32').ok).toBe(false);
  });

  it('refuses prices that are not above 0 and at most 1000', () => {
    expect(message(parsePriceText('0'))).toMatch(/above 0 and at most 1000/);
    expect(message(parsePriceText('par'))).toMatch(/not a price; type a price per 100 face such as 99.875/);
  });
});

describe('parseMaturityText', () => {
  it('reads tenors (any case) and calendar dates', () => {
    expect(value(parseMaturityText('10y'))).toEqual({ tenor: '10Y' });
    expect(value(parseMaturityText(' 3M '))).toEqual({ tenor: '3M' });
    expect(value(parseMaturityText('2031-11-15'))).toEqual({ maturity: '2031-11-15' });
  });
  it('refuses impossible dates and other text, saying what is valid', () => {
    expect(message(parseMaturityText('2031-02-30'))).toMatch(/that date does not exist/);
    expect(message(parseMaturityText('15/11/2031'))).toMatch(/type a tenor such as 6M, 2Y or 30Y, or a date YYYY-MM-DD/);
  });
});

describe('kind, frequency and day count cells', () => {
  it('parseKindText is case-insensitive', () => {
    expect(value(parseKindText('BOND'))).toBe('bond');
    expect(value(parseKindText('Deposit'))).toBe('deposit');
    expect(message(parseKindText('swaption'))).toMatch(/type one of deposit, bill, zero, bond, swap/);
  });
  it('parseFrequencyText takes 1, 2, 4, 12 and the words for them', () => {
    expect(value(parseFrequencyText('2'))).toBe(2);
    expect(value(parseFrequencyText('Semiannual'))).toBe(2);
    expect(value(parseFrequencyText('quarterly'))).toBe(4);
    expect(message(parseFrequencyText('3'))).toMatch(/1, 2, 4 or 12/);
  });
  it('parseDayCountText matches ISDA names case-insensitively and refuses the ambiguous ACT/ACT', () => {
    expect(value(parseDayCountText('act/360'))).toBe('ACT/360');
    expect(value(parseDayCountText('ACT/365 Fixed'))).toBe('ACT/365F');
    expect(value(parseDayCountText('30/360'))).toBe('30/360');
    expect(message(parseDayCountText('ACT/ACT'))).toMatch(/ambiguous: say ACT\/ACT-ISDA or ACT\/ACT-ICMA/);
  });
});

describe('rewriteBareRate(text, from, to) keeps the value when the unit switches', () => {
  it('3.25 in percent is 0.0325 in decimal and 325 in bp, exactly', () => {
    expect(rewriteBareRate('3.25', 'percent', 'decimal')).toBe('0.0325');
    expect(rewriteBareRate('3.25', 'percent', 'bp')).toBe('325');
    expect(rewriteBareRate('0.0325', 'decimal', 'percent')).toBe('3.25');
  });
  it('leaves text with its own unit, and text that is not a number, as typed', () => {
    expect(rewriteBareRate('3.25%', 'percent', 'bp')).toBe('3.25%');
    expect(rewriteBareRate('abc', 'percent', 'bp')).toBe('abc');
  });
});

// Plausibility hints in both directions. The thresholds are the project's own judgement (see
// rateUnitHint); the arithmetic of each suggestion is exact (decimal.js).
describe('rateUnitHint: a bare number implausible for its unit', () => {
  it('0.0315 in percent mode keeps 0.0315% and asks "did you mean 3.15%?"', () => {
    const p = parseRateText('0.0315', 'percent', 'rate');
    expect(value(p)).toBe(0.000315);
    expect(p.ok && p.warning).toMatch(/^0\.0315 in % mode is a rate of 0\.0315%: did you mean 3\.15%\?/);
  });
  it('345 in percent mode is refused as out of range and asks "did you mean 3.45%?"', () => {
    expect(message(parseRateText('345', 'percent', 'rate'))).toMatch(/345 in % mode is 345%: did you mean 3\.45%\? If so type 3\.45, or 345bp/);
  });
  it('0.0325 in bp mode asks "did you mean 3.25%?"; plausible values and values with a suffix get no hint', () => {
    const p = parseRateText('0.0325', 'bp', 'rate');
    expect(p.ok && p.warning).toMatch(/did you mean 3\.25%\? If so type 325/);
    for (const [text, mode] of [['3.15', 'percent'], ['0.0315', 'decimal'], ['315', 'bp'], ['0.05%', 'percent'], ['0', 'percent']] as const) {
      const r = parseRateText(text, mode, 'rate');
      expect(r.ok && r.warning, `${text} in ${mode}`).toBeUndefined();
    }
  });
});

