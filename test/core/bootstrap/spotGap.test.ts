// A curve that reaches spot without ON and TN quotes says so (warning `spot-gap`), and under
// log-linear discount the bridge from the valuation date to spot is flat at the first forward.
// Sources: MARKET-CONVENTIONS.md section c (a curve with DF = 1 at the valuation date needs
// DF(spot) from ON and TN quotes, or must say how it bridges to spot; the pitfall of QuantLib
// issues 2002 and 2224); the flat-forward identity of log-linear discount interpolation
// (ln DF linear in t: the forward is constant on a segment; Hagan and West 2006, section 2).
// Dates: SIFMA's 2027 recommendation closes Friday 2027-12-24 (held in calendars.test.ts).
// The quotes are invented test data.
import { describe, expect, it } from 'vitest';
import { buildCurve } from '../../../src/core/index.ts';

const doc = (quotes: unknown[], interpolation = 'monotone-convex') => ({ format: 'tenorscope-workspace', version: 2, valuationDate: '2027-12-22', curve: { interpolation }, quotes });
const swaps = [
  { kind: 'ois', tenor: '1Y', rate: 0.041, conventions: 'usd-sofr' },
  { kind: 'ois', tenor: '2Y', rate: 0.0395, conventions: 'usd-sofr' },
];
const onTn = [
  { kind: 'deposit', tenor: 'ON', rate: 0.0431, conventions: 'usd-sofr' },
  { kind: 'deposit', tenor: 'TN', rate: 0.0432, conventions: 'usd-sofr' },
];

describe('the gap from the valuation date to spot', () => {
  it('T+2 swaps with no ON or TN quote: one spot-gap warning naming the first swap, its spot 2027-12-27 and the first pillar', () => {
    const b = buildCurve(doc(swaps));
    expect(b.errors).toEqual([]);
    const gaps = b.warnings.filter((w) => w.code === 'spot-gap');
    expect(gaps).toHaveLength(1);
    expect(gaps[0]).toMatchObject({ path: 'quotes[0]', quote: 0 });
    expect(gaps[0]!.message).toMatch(/starts on 2027-12-27, after the valuation date 2027-12-22 and before the curve's first pillar 2028-12-29/);
    expect(gaps[0]!.message).toMatch(/add quotes that end by then .*ON and TN deposits on the same calendar for a spot start/);
  });

  it('with ON and TN deposits on the same calendar there is no gap and no warning', () => {
    const b = buildCurve(doc([...onTn, ...swaps]));
    expect(b.errors).toEqual([]);
    expect(b.warnings.filter((w) => w.code === 'spot-gap')).toEqual([]);
  });

  it('TN alone (no ON): the deposit starting the day after valuation is the gap', () => {
    const b = buildCurve(doc([onTn[1]!, ...swaps]));
    const gaps = b.warnings.filter((w) => w.code === 'spot-gap');
    expect(gaps).toHaveLength(1);
    expect(gaps[0]!.message).toMatch(/quotes\[0\] starts on 2027-12-23/);
  });

  it('under log-linear discount the bridge is flat at the first forward: ln DF(spot) / t(spot) = ln DF(first pillar) / t(first pillar) to 1e-15', () => {
    const b = buildCurve(doc(swaps, 'log-linear-discount'));
    const c = b.curve!;
    const ts = c.time('2027-12-27');
    const t1 = c.pillars[0]!.t;
    expect(b.warnings.find((w) => w.code === 'spot-gap')!.message).toMatch(/flat at the first forward/);
    expect(Math.abs(c.lnDiscountAt(ts) / ts - c.lnDiscountAt(t1) / t1)).toBeLessThanOrEqual(1e-15);
    for (const row of b.repricing) expect(Math.abs(row.repricingError)).toBeLessThanOrEqual(1e-14);
  });

  it('quotes starting on the valuation date (no spot lag) never warn', () => {
    const b = buildCurve(doc(swaps.map((q) => ({ ...q, conventions: 'gbp-sonia' }))));
    expect(b.warnings.filter((w) => w.code === 'spot-gap')).toEqual([]);
  });
});
