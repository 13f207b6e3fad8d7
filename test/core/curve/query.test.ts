import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  addTenor,
  buildCurve,
  curveFromPillars,
  curveTime,
  daysBetween,
  COMPOUNDINGS,
  CURVE_DAY_COUNTS,
  discountOn,
  forwardOn,
  forwardParRateOn,
  forwardStrip,
  impliedDiscountOn,
  instantaneousForwardOn,
  INTERPOLATIONS,
  isoFromSerial,
  lnDiscountFromRate,
  parseTenor,
  parYieldOn,
  queryYearFraction,
  serialFromIso,
  zeroOn,
  type Curve,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Queries on a built curve (issue section 6). Markets are invented test data; the expected values
// come from the definitions in the issue (stated beside each check) applied by hand.
const settlement = '2027-03-10';
const market = (interpolation: string, extrapolation = 'none') => ({
  format: 'tenorscope-workspace',
  version: 1,
  settlement,
  curve: { dayCount: 'ACT/365F', interpolation, extrapolation },
  quotes: [
    { kind: 'deposit', tenor: '3M', rate: 0.0287, dayCount: 'ACT/360' },
    { kind: 'deposit', tenor: '6M', rate: 0.0293, dayCount: 'ACT/360' },
    { kind: 'bond', maturity: '2029-03-10', coupon: 0.031, frequency: 2, cleanPrice: 100 },
    { kind: 'bond', maturity: '2032-03-10', coupon: 0.034, frequency: 2, cleanPrice: 100 },
    { kind: 'swap', tenor: '10Y', rate: 0.0352, frequency: 1, dayCount: '30/360' },
    { kind: 'swap', tenor: '30Y', rate: 0.0368, frequency: 1, dayCount: '30/360' },
  ],
});
const build = (interpolation: string, extrapolation = 'none'): Curve => {
  const b = buildCurve(market(interpolation, extrapolation));
  expect(b.errors).toEqual([]);
  return b.curve!;
};
const value = <T>(r: { ok: true; value: T } | { ok: false; errors: readonly unknown[] }): T => {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.value;
};

describe.each(INTERPOLATIONS.map((x) => [x]))('%s', (interpolation) => {
  const curve = build(interpolation);
  it('a deposit read back as a simple ACT/360 forward from settlement is its quoted rate', () => {
    const f = value(forwardOn(curve, settlement, addTenor(settlement, parseTenor('3M')!), 'simple', 'ACT/360'));
    expectClose(f.rate, 0.0287, 1e-14, 'deposit definition DF = 1/(1 + r tau) (issue section 3)');
  });
  it('the par yield at a par bond\'s maturity is its coupon (settlement on a coupon date)', () => {
    expectClose(value(parYieldOn(curve, '2029-03-10', 2)).rate, 0.031, 1e-13, 'par yield definition: the coupon of a bond priced at 100 (issue section 6)');
    expectClose(value(parYieldOn(curve, '2032-03-10', 2)).rate, 0.034, 1e-13, 'par yield definition (issue section 6)');
  });
  it('the forward par rate from settlement on the swap convention is the quoted swap rate', () => {
    const s = value(forwardParRateOn(curve, settlement, addTenor(settlement, parseTenor('10Y')!), 1, '30/360'));
    expectClose(s.rate, 0.0352, 1e-14, 'par swap rate S = (1 - DF(T_n)) / sum tau_i DF(T_i) (issue section 3)');
  });
  it('the compounding and day count in which a rate is shown never change the discount factor', () => {
    const date = '2031-07-22';
    const df = value(discountOn(curve, date)).discount;
    for (const c of COMPOUNDINGS) {
      for (const dc of CURVE_DAY_COUNTS) {
        const z = value(zeroOn(curve, date, c, dc));
        expect(z.discount).toBe(df);
        const tau = dc === 'ACT/365F' ? z.t : undefined;
        if (tau !== undefined) expectClose(lnDiscountFromRate(z.zero, c, tau), Math.log(df), 1e-14, `zero rate definition (${c}, ${dc})`);
      }
    }
  });
  it('a forward over [s, e] solves DF(s)/DF(e) over its own year fraction', () => {
    const f = value(forwardOn(curve, '2030-01-15', '2035-06-30', 'quarterly', 'ACT/ACT-ISDA'));
    const ds = value(discountOn(curve, '2030-01-15')).discount;
    const de = value(discountOn(curve, '2035-06-30')).discount;
    expectClose(lnDiscountFromRate(f.rate, 'quarterly', f.tau), Math.log(de / ds), 1e-14, 'forward definition (issue section 2.4)');
  });
  it('the zero at settlement is the limit as t goes to 0: the instantaneous forward there', () => {
    const z0 = value(zeroOn(curve, settlement, 'continuous', 'ACT/365F')).zero;
    expectClose(z0, curve.forwardAt(0), 0, 'issue section 6: at settlement the zero is the limit');
    const oneDay = value(zeroOn(curve, '2027-03-11', 'continuous', 'ACT/365F')).zero;
    expectClose(z0, oneDay, 2e-4, 'a one-day zero is close to the limit');
    expect(value(discountOn(curve, settlement)).discount).toBe(1);
  });
  it('the curve seen from a future date: DF_H(T) = DF(T) / DF(H)', () => {
    const v = value(impliedDiscountOn(curve, '2030-03-10', '2040-03-10'));
    const expected = value(discountOn(curve, '2040-03-10')).discount / value(discountOn(curve, '2030-03-10')).discount;
    expectClose(v, expected, 1e-15, 'issue section 6');
    const early = impliedDiscountOn(curve, '2030-03-10', '2029-03-10');
    expect(early.ok).toBe(false);
  });
  it('a forward strip with a short final stub ends at the horizon', () => {
    const strip = value(forwardStrip(curve, parseTenor('1Y')!, '2030-09-10', 'annual', '30/360'));
    expect(strip.map((p) => [p.start, p.end])).toEqual([
      ['2027-03-10', '2028-03-10'],
      ['2028-03-10', '2029-03-10'],
      ['2029-03-10', '2030-03-10'],
      ['2030-03-10', '2030-09-10'],
    ]);
    expectClose(strip[3]!.tau, 0.5, 0, '30/360: six months');
  });
});

describe('extrapolation beyond the last pillar', () => {
  it('none: beyond-curve; flat-forward: the instantaneous forward stays at its last value, marked extrapolated', () => {
    const none = build('monotone-convex');
    expect(discountOn(none, '2060-01-01').ok).toBe(false);
    const flat = build('monotone-convex', 'flat-forward');
    const last = flat.lastT;
    const f = value(instantaneousForwardOn(flat, '2070-01-01'));
    expect(f.extrapolated).toBe(true);
    expectClose(f.forward, flat.forwardAt(last), 0, 'flat-forward definition (issue section 5)');
    const a = value(discountOn(flat, '2065-01-01'));
    const b = value(discountOn(flat, '2070-01-01'));
    expectClose(Math.log(b.discount / a.discount), -flat.forwardAt(last) * (b.t - a.t), 1e-13, 'ln DF falls linearly at the last forward');
    expect(value(discountOn(flat, '2057-03-10')).extrapolated).toBe(false);
  });
});

describe('par rates over short periods keep their precision', () => {
  // A flat curve: ln DF(t) = -r t (continuous r, ACT/365F clock), log-linear between two pillars.
  // A bond maturing d days out has one coupon, a stub from settlement of ACT/ACT-ICMA fraction
  // a = d / (f x days of its notional period), so its par coupon is c = (1 - DF) / (a DF) =
  // expm1(r d/365) / a in closed form (the par-yield definition above). Formed as 1 - DF, the
  // numerator would lose about 1e-16 / (1 - DF) of its value to cancellation, a few parts in
  // 1e13 for a day or two; the query keeps it to a few ulps.
  const r = 0.04;
  const far = '2037-03-10';
  const flat = curveFromPillars(settlement, 'ACT/365F', 'log-linear-discount', 'none', [
    { date: '2027-09-10', t: 184 / 365, discount: Math.exp((-r * 184) / 365), quote: 0 },
    { date: far, t: 3653 / 365, discount: Math.exp((-r * 3653) / 365), quote: 1 },
  ]);
  it.each([1, 2, 3, 7])('a %i-day semiannual par bond: expm1(r d/365) / a, to 1e-14 relative (closed form)', (d) => {
    const maturity = addTenor(settlement, parseTenor(`${d}D`)!);
    // The notional period: six months back from the maturity (ACT/ACT-ICMA reference period).
    const refDays = daysBetween(addTenor(maturity, parseTenor('6M')!, -1), maturity);
    const a = d / (2 * refDays);
    const exact = Math.expm1((r * d) / 365) / a;
    const got = value(parYieldOn(flat, maturity, 2)).rate;
    expect(Math.abs(got - exact) / exact).toBeLessThan(1e-14);
  });
});

describe('the curve clock', () => {
  // Definition (engine conventions 2.3): t = yearFraction(curve.dayCount, settlement, date), the
  // 30/360-US end-of-February rules applied. curve.time reads it from a clock made once per curve;
  // the oracle is curveTime, the definition called directly.
  it('curve.time(date) is curveTime(dayCount, settlement, date) to the last bit, and so is the query year fraction, for every curve day count', () => {
    const day = fc.integer({ min: serialFromIso('1990-01-01'), max: serialFromIso('2120-12-31') }).map(isoFromSerial);
    fc.assert(
      fc.property(day, fc.integer({ min: 0, max: 40 * 366 }), fc.constantFrom(...CURVE_DAY_COUNTS), (s, days, dc) => {
        const date = isoFromSerial(serialFromIso(s) + days);
        const pillar = isoFromSerial(serialFromIso(s) + 30);
        const curve = curveFromPillars(s, dc, 'log-linear-discount', 'flat-forward', [{ date: pillar, t: curveTime(dc, s, pillar), discount: 0.999, quote: 0 }]);
        expect(curve.time(date)).toBe(curveTime(dc, s, date));
        expect(queryYearFraction(dc, s, date)).toBe(curveTime(dc, s, date));
      }),
      { seed: 9, numRuns: 4000 },
    );
  });
});
