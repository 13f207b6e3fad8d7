import { expectClose, expectRelClose } from './asserts.ts';

const SRC = 'hand calculation';

describe('expectClose', () => {
  it('passes inside the tolerance, at the boundary and on exact equality', () => {
    expectClose(1.0000004, 1, 5e-7, SRC);
    expectClose(0.75, 0.5, 0.25, SRC);
    expectClose(Infinity, Infinity, 0, SRC);
    expectClose(-0, 0, 0, SRC);
  });

  it('fails outside the tolerance with actual, expected, delta, tolerance and source', () => {
    expect(() => expectClose(1.5, 1, 0.1, 'ISDA worked example 3')).toThrowError(
      'expectClose [ISDA worked example 3]: actual 1.5, expected 1, delta 0.5, tolerance 0.1',
    );
  });

  it('fails on NaN, on a mismatched infinity and on a non-number', () => {
    expect(() => expectClose(Number.NaN, 1, 1, SRC)).toThrowError(/actual NaN, expected 1, delta NaN/);
    expect(() => expectClose(1, Infinity, 1e300, SRC)).toThrowError(/expected Infinity/);
    expect(() => expectClose('1' as unknown as number, 1, 1, SRC)).toThrowError(/actual is string 1/);
  });

  it('rejects a missing source or a bad tolerance as misuse', () => {
    expect(() => expectClose(1, 1, 0, '')).toThrowError(TypeError);
    expect(() => expectClose(1, 1, -1, SRC)).toThrowError(/tolerance must be a finite number >= 0/);
    expect(() => expectClose(1, 1, Number.NaN, SRC)).toThrowError(TypeError);
  });
});

describe('expectRelClose', () => {
  it('scales the tolerance with the expected value', () => {
    expectRelClose(1_000_000.5, 1_000_000, 1e-6, SRC);
    expect(() => expectRelClose(1.5, 1, 1e-6, SRC)).toThrowError(
      'expectRelClose [hand calculation]: actual 1.5, expected 1, delta 0.5, relative error 0.5, ' +
        'tolerance 0.000001 relative, allowed |delta| 0.000001',
    );
  });

  it('uses the absolute floor near zero and names it in the message', () => {
    expectRelClose(1e-13, 0, 1e-9, SRC, 1e-12);
    expect(() => expectRelClose(1e-13, 0, 1e-9, SRC)).toThrowError(/relative error Infinity/);
    expect(() => expectRelClose(1e-11, 0, 1e-9, SRC, 1e-12)).toThrowError(/absolute floor 1e-12/);
  });

  it('never accepts a finite value against an infinite expectation', () => {
    expect(() => expectRelClose(1, Infinity, 0.5, SRC)).toThrowError(/expected Infinity/);
    expectRelClose(-Infinity, -Infinity, 0, SRC);
  });
});
