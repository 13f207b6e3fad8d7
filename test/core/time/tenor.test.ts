import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { civilFromSerial, isoFromCivil, parseIsoDate, parseTenor, serialFromCivil } from '../../../src/core/index.ts';

// Tenor form from the engine's conventions: nD, nW, nM or nY with a whole n >= 1 (up to four
// digits here), either case, white space around allowed. The oracle below is that definition
// written as a regular expression (the form the parser had before it was read by hand).
const oracle = (text: string) => {
  const m = /^([1-9]\d{0,3})([DWMY])$/.exec(text.trim().toUpperCase());
  return m ? { n: Number(m[1]), unit: m[2] } : null;
};

describe('parseTenor', () => {
  it('parseTenor reads the tenors of the conventions and refuses near misses', () => {
    expect(parseTenor('3M')).toEqual({ n: 3, unit: 'M' });
    expect(parseTenor('10y')).toEqual({ n: 10, unit: 'Y' });
    expect(parseTenor(' 2W\t')).toEqual({ n: 2, unit: 'W' });
    expect(parseTenor('9999D')).toEqual({ n: 9999, unit: 'D' });
    for (const bad of ['', 'M', '0M', '03M', '12345D', '1.5Y', '-1Y', '+1Y', '1 Y', '1Q', '1YY', '\u0661M', '1\u039C']) expect(parseTenor(bad), bad).toBeNull();
  });
  it('parseTenor(text) agrees with the regular-expression definition on random text', () => {
    const text = fc.oneof(
      fc.string({ unit: fc.constantFrom('0', '1', '2', '9', 'D', 'W', 'M', 'Y', 'd', 'w', 'm', 'y', 'Q', ' ', '\t', '.', '-', '\u00a0', '\u0661'), maxLength: 7 }),
      fc.string({ maxLength: 6 }),
    );
    fc.assert(fc.property(text, (t) => {
        expect(parseTenor(t)).toEqual(oracle(t));
      }), { seed: 3, numRuns: 20000 });
  });
});

describe('isoFromCivil', () => {
  it('isoFromCivil(civilFromSerial(s)) is the zero-padded YYYY-MM-DD that parses back to day s (1900 to 2999)', () => {
    const lo = serialFromCivil({ y: 1900, m: 1, d: 1 });
    const hi = serialFromCivil({ y: 2999, m: 12, d: 31 });
    fc.assert(
      fc.property(fc.integer({ min: lo, max: hi }), (s) => {
        const c = civilFromSerial(s);
        const iso = isoFromCivil(c);
        expect(iso).toBe(`${String(c.y).padStart(4, '0')}-${String(c.m).padStart(2, '0')}-${String(c.d).padStart(2, '0')}`);
        expect(serialFromCivil(parseIsoDate(iso)!)).toBe(s);
      }),
      { seed: 3, numRuns: 5000 },
    );
    expect(isoFromCivil({ y: 999, m: 1, d: 5 })).toBe('0999-01-05');
  });
});
