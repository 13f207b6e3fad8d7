import { describe, expect, it } from 'vitest';
// forwardBetween: the forward calculator's reading of start and end as typed, on a curve whose
// forwards are published. Reference: J. C. Hull, "Options, Futures, and Other Derivatives",
// chapter "Interest Rates", the table of forward rates from zero rates (cited from memory):
// continuously compounded zero rates 3.0 %, 4.0 %, 4.6 %, 5.0 %, 5.3 % for years 1 to 5 give
// forwards of 5.0 %, 5.8 %, 6.2 %, 6.5 % for years 2 to 5 (R_F = (R2 T2 - R1 T1) / (T2 - T1)).
// The curve's axis is 30/360 from the 15th, so every year is exactly 1.0 and the book's formula
// holds to rounding of doubles.
import { buildCurve, forwardBetween, zeroOn } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

const HULL = 'Hull, Options, Futures, and Other Derivatives, forward rate table (from memory; exact by its formula)';
const settlement = '2027-01-15';
const zeros = [0.03, 0.04, 0.046, 0.05, 0.053];
const curve = (() => {
  const b = buildCurve({
    format: 'tenorscope-workspace',
    version: 1,
    settlement,
    curve: { dayCount: '30/360', interpolation: 'log-linear-discount' },
    quotes: zeros.map((rate, i) => ({ kind: 'zero', maturity: `${2028 + i}-01-15`, rate, compounding: 'continuous', dayCount: '30/360' })),
  });
  if (!b.curve) throw new Error(JSON.stringify(b.errors));
  return b.curve;
})();

describe('forwardBetween(curve, start, end, c, dc)', () => {
  it('reads "nY" starts from settlement and "1Y" ends from the start: the book\'s forwards for years 2 to 5', () => {
    const book = [0.05, 0.058, 0.062, 0.065];
    book.forEach((f, i) => {
      const r = forwardBetween(curve, `${i + 1}Y`, '1Y', 'continuous', '30/360');
      if (!r.ok) throw new Error(JSON.stringify(r.errors));
      expect(r.value.start).toBe(`${2028 + i}-01-15`);
      expect(r.value.end).toBe(`${2029 + i}-01-15`);
      expectClose(r.value.tau, 1, 0, '30/360 year from the 15th');
      expectClose(r.value.rate, f, 1e-14, HULL);
      expectClose(r.value.forwardDiscount, r.value.dfEnd / r.value.dfStart, 0, 'forward DF is the ratio of the two DFs');
    });
  });

  it('takes dates for both ends, and an empty start as the settlement date (the zero rate)', () => {
    const r = forwardBetween(curve, '2029-01-15', '2032-01-15', 'continuous', '30/360');
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    // (5.3 % x 5 - 4.0 % x 2) / 3, the book's formula over three years.
    expectClose(r.value.rate, (0.053 * 5 - 0.04 * 2) / 3, 1e-14, HULL);
    const spot = forwardBetween(curve, '', '3Y', 'continuous', '30/360');
    const z = zeroOn(curve, '2030-01-15', 'continuous', '30/360');
    if (!spot.ok || !z.ok) throw new Error('query');
    expect(spot.value.start).toBe(settlement);
    expect(spot.value.dfStart).toBe(1);
    expectClose(spot.value.rate, z.value.zero, 1e-15, 'a forward from settlement is the zero rate');
  });

  it('says which end is wrong and what would be valid', () => {
    const bad = (s: string, e: string) => {
      const r = forwardBetween(curve, s, e, 'continuous', '30/360');
      if (r.ok) throw new Error('expected an error');
      return r.errors[0]!;
    };
    expect(bad('soon', '1Y')).toMatchObject({ path: 'start' });
    expect(bad('soon', '1Y').message).toMatch(/tenor from settlement such as "1Y".*date YYYY-MM-DD/);
    expect(bad('1Y', 'x')).toMatchObject({ path: 'end' });
    expect(bad('2029-01-15', '2028-01-15').message).toMatch(/must come after the start 2029-01-15/);
    expect(bad('2026-01-15', '1Y').message).toMatch(/before the settlement date/);
    // Past the last pillar with no extrapolation: the curve's own refusal, naming the end.
    expect(bad('4Y', '2Y').path).toMatch(/^end/);
  });
});
