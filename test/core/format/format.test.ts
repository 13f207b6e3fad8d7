// The formatting module's rules, each at its edges. Sources: the rounding rule "half away from zero"
// is decimal.js's ROUND_HALF_UP ("rounds towards nearest neighbour; if equidistant, rounds away from
// zero", decimal.js documentation); a double's shortest round-trip text is ECMAScript's
// Number::toString (ECMA-262, Number.prototype.toString); U+2212 MINUS SIGN is the Unicode Standard's
// minus (Mathematical Operators block); 1 bp = 0.01 % (common market usage); day serials count days
// from 1970-01-01, so 2000-01-01 is 946684800 s / 86400 s = 10957 (POSIX time, from memory).
import Decimal from 'decimal.js';
import {
  bpFigure,
  COMPOUNDINGS,
  conventionTag,
  couponTag,
  DAY_COUNTS,
  figure,
  formatAmount,
  formatAxisPercent,
  formatBp,
  formatBpChange,
  formatBpSetting,
  formatCount,
  formatCoupon,
  formatDate,
  formatMoney,
  formatMoneySigned,
  formatNumber,
  formatPercent,
  formatPrice,
  formatQuotePrice,
  formatQuoteRate,
  formatRate,
  formatRateShort,
  MINUS,
  NO_VALUE,
  percentFigure,
  QUANTITY_DECIMALS,
  rateTag,
  RETURN_TAG,
  roundedDigitsOf,
  yieldTag,
  zeroForwardTag,
  type Compounding,
} from '../../../src/core/index.ts';

const M = '\u2212';

/** The oracle: decimal.js with room for any double's digits, scaled exactly, then ROUND_HALF_UP. */
const ShownDecimal = Decimal.clone({ precision: 1000, rounding: Decimal.ROUND_HALF_UP, toExpNeg: -9e15, toExpPos: 9e15 });
const roundedDigitsByDecimal = (x: number, dp: number, scale = 0): string =>
  new ShownDecimal(x).times(new ShownDecimal(10).pow(scale)).toDecimalPlaces(dp, Decimal.ROUND_HALF_UP).abs().toFixed(dp);

describe('the one rounding rule', () => {
  it('figure(x, dp) rounds half away from zero on the shortest decimal text (decimal.js ROUND_HALF_UP)', () => {
    // 1.005 is the double 1.00499999999999989...; its shortest text is "1.005", a tie at 2 decimals.
    expect((1.005).toFixed(2)).toBe('1.00'); // what Number#toFixed does on the binary value
    expect(figure(1.005, 2)).toBe('1.01');
    expect(figure(-1.005, 2)).toBe(`${M}1.01`);
    expect(figure(0.125, 2)).toBe('0.13');
    expect(figure(-0.125, 2)).toBe(`${M}0.13`);
    expect(figure(2.5, 0)).toBe('3');
    expect(figure(-2.5, 0)).toBe(`${M}3`);
    expect(figure(0.1244999, 2)).toBe('0.12');
  });

  it('the string rounding equals decimal.js (scale exactly, ROUND_HALF_UP) on 20,000 seeded doubles, ties among them', () => {
    // decimal.js is the oracle: its documented ROUND_HALF_UP on the double's shortest text.
    let seed = 20261202;
    const rand = (): number => {
      seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0;
      return seed / 2 ** 32;
    };
    const cases: number[] = [0, -0, 5e-324, 1e21, 1.5e21, 123456789012345680000, 0.5, 2.5, 9.995, 99.9999995, 0.0000125];
    for (let i = 0; i < 10000; i++) cases.push((rand() - 0.5) * 10 ** Math.floor(rand() * 30 - 15));
    for (let i = 0; i < 10000; i++) cases.push(Number(`${rand() < 0.5 ? '-' : ''}${Math.floor(rand() * 1e6)}5e-${Math.floor(rand() * 12)}`)); // ties at some decimal
    let ties = 0;
    for (const x of cases) {
      for (const [dp, scale] of [[0, 0], [2, 0], [4, 2], [6, 2], [2, 4], [3, 2], [8, 0]] as const) {
        const mine = roundedDigitsOf(x, dp, scale);
        const oracle = roundedDigitsByDecimal(x, dp, scale);
        if (mine !== oracle) expect({ x, dp, scale, mine }).toEqual({ x, dp, scale, mine: oracle });
        if (/5$/.test(String(Math.abs(x)).split('e')[0]!)) ties++;
      }
    }
    expect(ties).toBeGreaterThan(10000);
  });

  it('a value that rounds to zero prints as an unsigned zero; -0 too', () => {
    expect(figure(-0, 2)).toBe('0.00');
    expect(figure(-0.004999, 2)).toBe('0.00');
    expect(figure(-0.005, 2)).toBe(`${M}0.01`);
    expect(formatPercent(-1e-9)).toBe('0.0000%');
    expect(formatBpChange(-0.004)).toBe('0.00 bp');
    expect(formatBpChange(0.004)).toBe('0.00 bp');
    expect(formatBpChange(0.005)).toBe('+0.01 bp');
    expect(formatMoneySigned(new Decimal('-0.004'))).toBe('0.00');
    expect(formatMoney('-0')).toBe('0.00');
  });

  it('missing, NaN and infinite values show as an em dash in every quantity', () => {
    expect(NO_VALUE).toBe('\u2014');
    for (const x of [Number.NaN, Infinity, -Infinity, null, undefined]) {
      for (const f of [formatPercent, formatQuoteRate, formatCoupon, formatRateShort, formatBp, formatBpChange, bpFigure, formatPrice, formatQuotePrice, formatCount, (v: number | null | undefined) => formatNumber(v, 3), (v: number | null | undefined) => formatRate(v, 'cont, ACT/365F'), (v: number | null | undefined) => percentFigure(v)]) {
        expect(f(x)).toBe(NO_VALUE);
      }
    }
    expect(formatAxisPercent(Number.NaN, 2)).toBe(NO_VALUE);
    expect(formatMoney('NaN')).toBe(NO_VALUE);
    expect(formatMoney('Infinity')).toBe(NO_VALUE);
  });

  it('large values print every digit, never an exponent', () => {
    expect((1e21).toFixed(0)).toBe('1e+21'); // what Number#toFixed does from 1e21 on
    expect(formatNumber(1e21, 0)).toBe('1000000000000000000000');
    expect(formatPercent(1e20)).toBe('10000000000000000000000.0000%');
    expect(formatMoney(new Decimal('1e15'))).toBe('1,000,000,000,000,000.00');
    expect(formatCount(1234567)).toBe('1,234,567');
    expect(formatBp(-123456.785)).toBe(`${M}123456.79 bp`);
    expect(formatNumber(5e-324, 2)).toBe('0.00');
  });

  it('every negative carries one U+2212 minus and never a hyphen-minus', () => {
    expect(MINUS).toBe('\u2212');
    const shown = [formatPercent(-0.0425), formatRate(-0.0425, rateTag('continuous', 'ACT/365F')), formatQuoteRate(-0.01), formatCoupon(-0.01), formatRateShort(-0.01), formatBp(-3), formatBpChange(-3), bpFigure(-3), formatPrice(-1), formatQuotePrice(-1), formatMoney('-12'), formatMoneySigned('-12'), formatNumber(-1, 2), formatAxisPercent(-0.0025, 2, 1), percentFigure(-0.01)];
    for (const t of shown) {
      expect(t.split(M)).toHaveLength(2);
      expect(t.startsWith(M)).toBe(true);
      expect(t.replace(/\([^)]*\)/g, '')).not.toContain('-'); // a day count in a tag (ACT/ACT-ICMA) may hold a hyphen
    }
  });
});

describe('counts without decimal arithmetic', () => {
  it('formatCount (format/marks.ts, no decimal.js) equals figure(n, 0, { group: true }) on 20,000 seeded doubles: halves, negatives, beyond 2^53, specials', () => {
    // Oracle: figure(), whose rounding test/core/format/format.test.ts holds to decimal.js above.
    let seed = 7;
    const next = (): number => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const cases: (number | null | undefined)[] = [null, undefined, NaN, Infinity, -Infinity, 0, -0, 0.5, -0.5, 1.5, -2.5, 2 ** 53, -(2 ** 53) - 2, 1e21, -1e22, 123456.4999999, 0.49999999999999994];
    for (let i = 0; i < 20_000; i++) {
      const mag = 10 ** Math.floor(next() * 24 - 3);
      const x = (next() - 0.5) * 2 * mag;
      cases.push(i % 5 === 0 ? Math.round(x * 2) / 2 : x);
    }
    for (const x of cases) expect(formatCount(x), String(x)).toBe(figure(x, 0, { group: true }));
  });
});

describe('each quantity', () => {
  it('states its decimals in one table', () => {
    expect(QUANTITY_DECIMALS).toEqual({ rate: 4, quoteRate: 6, coupon: 3, rateShort: 2, bp: 2, price: 4, quotePrice: 6, money: 2 });
  });

  it('rates in percent: 4 decimals, half cases at the fifth', () => {
    expect(formatPercent(0.0425)).toBe('4.2500%');
    expect(formatPercent(0.0000125)).toBe('0.0013%'); // 0.00125 %, a tie
    expect(formatPercent(-0.0000125)).toBe(`${M}0.0013%`);
    expect(formatPercent(0.04123449)).toBe('4.1234%');
    expect(formatQuoteRate(0.0425)).toBe('4.250000%');
    expect(formatQuoteRate(0.000000005)).toBe('0.000001%'); // 0.0000005 %, a tie at 6 decimals
    expect(formatCoupon(0.04125)).toBe('4.125%');
    expect(formatCoupon(0.0412345)).toBe('4.123%');
    expect(formatRateShort(0.04125)).toBe('4.13%');
    expect(percentFigure(0.04125)).toBe('4.1250');
    expect(percentFigure(0.04125, 'rateShort')).toBe('4.13');
  });

  it('basis points: 2 decimals; a change carries its sign', () => {
    expect(formatBp(12.345)).toBe('12.35 bp');
    expect(formatBpChange(12.345)).toBe('+12.35 bp');
    expect(formatBpChange(-3)).toBe(`${M}3.00 bp`);
    expect(bpFigure(0.125)).toBe('0.13');
  });

  it('a bp setting echoes the value given, signed, unrounded, without an exponent', () => {
    expect(formatBpSetting(25)).toBe('+25 bp');
    expect(formatBpSetting(-12.5)).toBe(`${M}12.5 bp`);
    expect(formatBpSetting(0)).toBe('0 bp');
    expect(formatBpSetting(-0)).toBe('0 bp');
    expect(formatBpSetting(0.0000001)).toBe('+0.0000001 bp');
    expect(formatBpSetting(Number.NaN)).toBe(NO_VALUE);
  });

  it('prices per 100 face: 4 decimals, quoted prices 6', () => {
    expect(formatPrice(101.25)).toBe('101.2500');
    expect(formatPrice(99.99995)).toBe('100.0000');
    expect(formatQuotePrice(99.9999995)).toBe('100.000000');
  });

  it('money: cents from the exact decimal value, thousands grouped, with its ISO 4217 unit', () => {
    expect(formatMoney(new Decimal('1234567.005'))).toBe('1,234,567.01');
    expect(formatMoney(new Decimal('-1234.565'))).toBe(`${M}1,234.57`);
    expect(formatMoney('999.995')).toBe('1,000.00');
    expect(formatMoneySigned('12')).toBe('+12.00');
    expect(formatAmount(new Decimal('1000000'), 'USD')).toBe('USD 1,000,000.00');
    expect(formatAmount('-5', 'EUR')).toBe(`EUR ${M}5.00`);
  });

  it('dates: ISO 8601 from ISO text or a day serial; anything else a dash', () => {
    expect(formatDate('2026-12-02')).toBe('2026-12-02');
    expect(formatDate(0)).toBe('1970-01-01');
    expect(formatDate(10957)).toBe('2000-01-01');
    expect(formatDate('2026-02-30')).toBe(NO_VALUE);
    expect(formatDate(1.5)).toBe(NO_VALUE);
    expect(formatDate(null)).toBe(NO_VALUE);
  });

  it('counts and axis ticks', () => {
    expect(formatCount(0)).toBe('0');
    expect(formatCount(999)).toBe('999');
    expect(formatCount(1000)).toBe('1,000');
    expect(formatAxisPercent(0.045, 2, 1)).toBe('4.5%');
    expect(formatAxisPercent(0.04, 2, 1)).toBe('4.0%');
    expect(formatAxisPercent(0.0425, 2, 1)).toBe('4.25%');
    expect(formatAxisPercent(-0.0025, 2, 1)).toBe(`${M}0.25%`);
    expect(formatAxisPercent(0.04, 0)).toBe('4%');
    expect(formatAxisPercent(-0.00001, 2, 1)).toBe('0.0%');
  });
});

describe('convention tags', () => {
  // The short words of the house style, written out here independently of the module.
  const WORD: Record<Compounding, string> = { simple: 'simple', annual: 'ann', semiannual: 's.a.', quarterly: 'qtr', monthly: 'mthly', continuous: 'cont' };

  it('rateTag and formatRate for every compounding and every day count', () => {
    expect(COMPOUNDINGS).toHaveLength(6);
    expect(DAY_COUNTS.length).toBeGreaterThanOrEqual(8);
    for (const c of COMPOUNDINGS) {
      for (const dc of DAY_COUNTS) {
        expect(rateTag(c, dc)).toBe(`${WORD[c]}, ${dc}`);
        expect(formatRate(0.05, rateTag(c, dc))).toBe(`5.0000% (${WORD[c]}, ${dc})`);
        expect(conventionTag({ unit: 'rate', compounding: c, dayCount: dc })).toBe(`${WORD[c]}, ${dc}`);
      }
    }
  });

  it('couponTag for every coupon frequency, and a plain count for any other', () => {
    expect([1, 2, 4, 12].map((f) => couponTag(f, '30/360'))).toEqual(['ann, 30/360', 's.a., 30/360', 'qtr, 30/360', 'mthly, 30/360']);
    expect(couponTag(3, 'ACT/360')).toBe('3/yr, ACT/360');
    expect(yieldTag(2)).toBe('s.a., ACT/ACT-ICMA');
    expect(RETURN_TAG).toBe('ann, ACT/365F');
  });

  it('conventionTag formats a quote convention value of every unit', () => {
    expect(conventionTag({ unit: 'rate', compounding: 'simple', dayCount: 'ACT/360' })).toBe('simple, ACT/360');
    expect(conventionTag({ unit: 'rate', compounding: 2, dayCount: '30/360' })).toBe('s.a., 30/360');
    expect(conventionTag({ unit: 'price' })).toBe('per 100 face');
    expect(conventionTag({ unit: 'price', compounding: 2, dayCount: 'ACT/ACT-ICMA' })).toBe('per 100 face; yield s.a., ACT/ACT-ICMA');
    expect(conventionTag({ unit: 'discount yield', dayCount: 'ACT/360' })).toBe('discount yield; ACT/360');
    expect(conventionTag({ unit: 'rate', compounding: null, dayCount: null })).toBe('');
  });

  it('zeroForwardTag names both lines', () => {
    expect(zeroForwardTag({ zeroCompounding: 'continuous', zeroDayCount: 'ACT/365F', forwardTenor: '3M', forwardCompounding: 'simple', forwardDayCount: 'ACT/360' })).toBe('zero cont, ACT/365F; forward 3M simple, ACT/360');
  });
});
