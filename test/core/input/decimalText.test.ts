// The exact reader of typed numbers against decimal.js as the oracle (a general-purpose arbitrary
// precision decimal library, used here at 1,000 significant digits so that it is exact for every
// text below) and ECMAScript's string-to-number conversion (ECMA-262, StringToNumber: the result is
// the double nearest the decimal value, ties to even), which both sides use for the last rounding.
import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { ExactDecimal, exactDecimal, nearestDouble, parsePriceText, readRate } from '../../../src/core/index.ts';

const Exact = Decimal.clone({ precision: 1000, toExpNeg: -9e15, toExpPos: 9e15 });

let seed = 20261203;
const rand = (): number => {
  seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0;
  return seed / 2 ** 32;
};
/** The next double above a positive finite x (IEEE 754 nextUp). */
function nextUp(x: number): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  view.setBigUint64(0, view.getBigUint64(0) + 1n);
  return view.getFloat64(0);
}
/** The exact value of a positive normal double (its binary significand times a power of two), not its shortest text. */
function exactBinary(x: number): Decimal {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const exponent = Number((bits >> 52n) & 0x7ffn) - 1075;
  const significand = (bits & ((1n << 52n) - 1n)) | (1n << 52n);
  return new Exact(significand.toString()).times(new Exact(2).pow(exponent));
}
const digits = (n: number): string => Array.from({ length: n }, () => String(Math.floor(rand() * 10))).join('');

/** Texts a person or a spreadsheet may type: signs, leading and trailing zeros, exponents, long digit runs. */
function randomText(): string {
  const sign = ['', '-', '+'][Math.floor(rand() * 3)]!;
  const whole = rand() < 0.2 ? '' : digits(Math.floor(rand() * 6));
  const fraction = rand() < 0.3 ? '' : `.${digits(Math.floor(rand() * 40))}`;
  const body = whole === '' && (fraction === '' || fraction === '.') ? '0' : whole + fraction;
  const exponent = rand() < 0.2 ? `e${Math.floor(rand() * 60 - 30)}` : '';
  return sign + body + exponent;
}

describe('ExactDecimal (typed numbers, exact)', () => {
  it('reads, shifts, compares and converts 20,000 seeded texts exactly as decimal.js at 1,000 digits', () => {
    for (let i = 0; i < 20000; i++) {
      const text = randomText();
      const mine = exactDecimal(text);
      expect(mine, text).not.toBeNull();
      const oracle = new Exact(text);
      expect(mine!.toFixed(), text).toBe(oracle.toFixed());
      for (const power of [-4, -2, 2, 4]) {
        expect(mine!.shifted(power).toFixed(), `${text} shifted ${power}`).toBe(oracle.times(new Exact(10).pow(power)).toFixed());
        expect(Object.is(nearestDouble(mine!, power), oracle.div(new Exact(10).pow(power)).toNumber()), `${text} / 10^${power}`).toBe(true);
      }
      for (const power of [-1, 0, 2]) {
        const expected = oracle.abs().cmp(new Exact(10).pow(power));
        expect(oracle.isZero() ? -1 : expected, `${text} vs 10^${power}`).toBe(mine!.compareSizeToPowerOfTen(power));
      }
    }
  });

  it('is exact beyond 20 significant digits, where decimal.js at its default precision rounds twice', () => {
    // Texts just above and just below the midpoints between neighbouring doubles near 0.0325, typed in
    // percent (about 60 digits): the exact quotient rounds to the nearer double. A quotient rounded to 20
    // digits first lands on whichever side the midpoint's 21st digit sends it, the wrong double about half
    // the time; those cases show the check can tell the two apart.
    const Default = Decimal.clone({ precision: 20 });
    let differing = 0;
    let cases = 0;
    let lo = 0.0325;
    for (let k = 0; k < 200; k++) {
      const hi = nextUp(lo);
      const midpointPercent = exactBinary(lo).plus(exactBinary(hi)).div(2).times(100);
      for (const [text, expected] of [[midpointPercent.plus('1e-45').toFixed(), hi], [midpointPercent.minus('1e-45').toFixed(), lo]] as const) {
        cases++;
        expect(nearestDouble(exactDecimal(text)!, 2), text).toBe(expected);
        if (new Default(text).div(100).toNumber() !== expected) differing++;
      }
      lo = hi;
    }
    console.log(`20-digit quotients off the exact double: ${differing} of ${cases}`);
    expect(differing).toBeGreaterThan(cases / 10);
  });

  it('refuses what is not a plain number, and exponents far past any double', () => {
    for (const t of ['', '.', '-', '+.', 'e5', '1e', '1.2.3', '1,5', '0x10', 'Infinity', 'NaN', '1e1001', '1e-1001', '3.25%']) expect(exactDecimal(t), t).toBeNull();
    expect(exactDecimal('1e1000')!.toNumber()).toBe(Infinity);
    expect(Object.is(exactDecimal('-0')!.toNumber(), -0)).toBe(true);
    expect(exactDecimal('-0.000')!.toFixed()).toBe('0');
    expect(ExactDecimal.fromNumber(-0.0425)!.shifted(2).toFixed()).toBe('-4.25');
    expect(ExactDecimal.fromNumber(Number.NaN)).toBeNull();
  });

  it('rates and prices typed in a cell read as before: 3.25% is the double nearest 0.0325, 99-28+ is 99 28.5/32', () => {
    // 32nds of a point: US Treasury price quotation (common practice); 99-283 adds 3/8 of a 32nd.
    const r = readRate('3.25%', 'percent');
    expect(r.ok && r.value.rate).toBe(0.0325);
    expect(r.ok && readRate('325bp', 'percent').ok && (readRate('325bp', 'percent') as { value: { rate: number } }).value.rate).toBe(0.0325);
    expect(parsePriceText('99-28+')).toEqual({ ok: true, value: 99 + 28.5 / 32 });
    expect(parsePriceText('99-283')).toEqual({ ok: true, value: 99 + (28 + 3 / 8) / 32 });
    expect(parsePriceText('101-00')).toEqual({ ok: true, value: 101 });
  });
});
