// A curve that reaches spot without ON and TN quotes says so (warning `spot-gap`), and under
// log-linear discount the bridge from the valuation date to spot is flat at the first forward.
// Sources: MARKET-CONVENTIONS.md section c (a curve with DF = 1 at the valuation date needs
// DF(spot) from ON and TN quotes, or must say how it bridges to spot; the pitfall of QuantLib
// issues 2002 and 2224); the flat-forward identity of log-linear discount interpolation
// (ln DF linear in t: the forward is constant on a segment; Hagan and West 2006, section 2).
// Dates: SIFMA's 2027 recommendation closes Friday 2027-12-24 (held in calendars.test.ts).
// The quotes are invented test data.
import { describe, expect, it } from 'vitest';
import { buildCurve, INTERPOLATIONS } from '../../../src/core/index.ts';

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

  // The bridge's rule, the same for every method (bootstrap/spotBridge.ts): a node at spot with
  // ln DF(spot) = (t_spot / t_1) ln DF(t_1), t_1 the first pillar. Euro conventions (eur-estr:
  // T+2 on TARGET, MARKET-CONVENTIONS.md c and d); TARGET closes Good Friday and Easter Monday
  // (ECB, held in calendars.test.ts), Easter Sunday 2027 is 28 March, so spot from Wednesday
  // 2027-03-24 is Tuesday 2027-03-30. Rates invented.
  const euro = [
    { kind: 'deposit', tenor: '1W', rate: 0.0231, conventions: 'eur-estr' },
    { kind: 'deposit', tenor: '1M', rate: 0.0234, conventions: 'eur-estr' },
    { kind: 'ois', tenor: '3M', rate: 0.0236, conventions: 'eur-estr' },
    { kind: 'ois', tenor: '6M', rate: 0.0239, conventions: 'eur-estr' },
    { kind: 'ois', tenor: '1Y', rate: 0.0241, conventions: 'eur-estr' },
    { kind: 'ois', tenor: '2Y', rate: 0.0252, conventions: 'eur-estr' },
    { kind: 'ois', tenor: '5Y', rate: 0.0268, conventions: 'eur-estr' },
    { kind: 'ois', tenor: '10Y', rate: 0.0281, conventions: 'eur-estr' },
  ];
  const euroDoc = (interpolation: string) => ({ ...doc(euro, interpolation), valuationDate: '2027-03-24' });

  for (const method of INTERPOLATIONS) {
    it(`${method}: euro deposits and OIS at T+2 over Easter 2027 with no ON or TN: ln DF(spot) = (t_spot / t_1) ln DF(t_1) to 1e-14, and every quote reprices to 1e-14 in rate`, () => {
      const b = buildCurve(euroDoc(method));
      expect(b.errors).toEqual([]);
      const gap = b.warnings.find((w) => w.code === 'spot-gap')!;
      expect(gap.message).toMatch(/quotes\[0\] starts on 2027-03-30/);
      const c = b.curve!;
      const ts = c.time('2027-03-30');
      const t1 = c.pillars[0]!.t;
      expect(c.pillars[0]!.date).toBe('2027-04-06'); // the 1W deposit ends a week after spot; the bridge is not a pillar
      expect(Math.abs(c.lnDiscountAt(ts) - (ts / t1) * c.lnDiscountAt(t1))).toBeLessThanOrEqual(1e-14);
      expect(b.repricing).toHaveLength(euro.length);
      for (const row of b.repricing) expect(Math.abs(row.repricingError)).toBeLessThanOrEqual(1e-14);
    });
  }

  it('the same market at T+0 (gbp-sonia) has no spot gap: no warning, no bridge node, one pillar per quote', () => {
    const sonia = euro.map((q) => ({ ...q, conventions: 'gbp-sonia' }));
    const b = buildCurve({ ...doc(sonia, 'cubic-zero'), valuationDate: '2027-03-24' });
    expect(b.warnings.filter((w) => w.code === 'spot-gap')).toEqual([]);
    expect(b.curve!.pillars).toHaveLength(euro.length);
  });
});

