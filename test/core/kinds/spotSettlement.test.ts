// Bonds and bills settled at spot (`calendar`, `spotLag`, or a convention set such as us-treasury).
// Sources, named at each check:
// - MARKET-CONVENTIONS.md section c: US Treasury bills, notes and bonds settle T+1 on the US
//   government securities calendar (quantlib-old#231); German Bunds T+2 on TARGET (common practice).
// - SIFMA's 2027 holiday recommendation (held in test/core/time/calendars.test.ts): the market is
//   closed Friday 2027-12-24.
// - The US Treasury's bill formula, price = 100 (1 - d days / 360), days counted from settlement
//   (TreasuryDirect); ICMA Rule 251 for ACT/ACT-ICMA accrued interest: 100 c / f times the days
//   from the last coupon to settlement over the days of the coupon period.
// The quotes are invented test data.
import { describe, expect, it } from 'vitest';
import { buildCurve, INTERPOLATIONS, validateWorkspace, type Curve } from '../../../src/core/index.ts';
import { runCurveCommand } from '../../../src/cli/curveCommand.ts';
import { expectClose } from '../../helpers/asserts.ts';

const doc = (valuationDate: string, quotes: unknown[], interpolation = 'monotone-convex') => ({ format: 'tenorscope-workspace', version: 2, valuationDate, curve: { interpolation }, quotes });
const day = (iso: string): number => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10))) / 86_400_000;
const df = (c: Curve, iso: string): number => Math.exp(c.lnDiscountAt(c.time(iso)));

/** A Treasury ladder valued on Thursday 2027-12-23: T+1 skips Friday 2027-12-24 (closed), so every trade settles on Monday 2027-12-27. */
const LADDER = [
  { kind: 'deposit', tenor: 'ON', rate: 0.0431, conventions: 'usd-sofr' },
  { kind: 'bill', maturity: '2028-03-23', discountYield: 0.0418, conventions: 'us-treasury' },
  { kind: 'bill', maturity: '2028-06-22', price: 97.95, conventions: 'us-treasury' },
  { kind: 'bond', maturity: '2029-11-30', coupon: 0.04125, cleanPrice: 100.17, conventions: 'us-treasury' },
  { kind: 'bond', maturity: '2032-11-15', coupon: 0.0425, yield: 0.0409, conventions: 'us-treasury' },
  { kind: 'bond', maturity: '2037-11-15', coupon: 0.045, cleanPrice: 102.4, conventions: 'us-treasury' },
];

describe('settlement at spot', () => {
  it('T+1 on the US government securities calendar from Thursday 2027-12-23 is Monday 2027-12-27; the command prints it as each quote\'s start', async () => {
    const r = await runCurveCommand(['-'], () => JSON.stringify(doc('2027-12-23', LADDER)) + '\n');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { quotes: { kind: string; start: string }[] };
    expect(out.quotes.map((q) => q.start)).toEqual(['2027-12-23', '2027-12-27', '2027-12-27', '2027-12-27', '2027-12-27', '2027-12-27']);
  });

  it('every quote reprices under every interpolation method (prices to 1e-11 per 100, rates to 1e-14)', () => {
    for (const interpolation of INTERPOLATIONS) {
      const b = buildCurve(doc('2027-12-23', LADDER, interpolation));
      expect(b.errors, interpolation).toEqual([]);
      for (const row of b.repricing) expect(Math.abs(row.repricingError), `${interpolation} ${row.kind} ${row.maturity}`).toBeLessThanOrEqual(row.unit === 'price' ? 1e-11 : 1e-14);
    }
  });

  it('a bill: DF(maturity) / DF(settlement) = 1 - d days / 360, days from the settlement (US Treasury bill formula)', () => {
    const c = buildCurve(doc('2027-12-23', LADDER)).curve!;
    const days = day('2028-03-23') - day('2027-12-27');
    expectClose(df(c, '2028-03-23') / df(c, '2027-12-27'), 1 - (0.0418 * days) / 360, 1e-15, 'Treasury bill price at settlement, 87 days');
    expectClose(df(c, '2028-06-22') / df(c, '2027-12-27'), 0.9795, 1e-15, 'the bill quoted at 97.95 per 100, paid at settlement');
  });

  it('a bond: its clean price is sum CF DF / DF(settlement) minus the accrued interest to settlement (ICMA Rule 251), recomputed here', () => {
    const c = buildCurve(doc('2027-12-23', LADDER)).curve!;
    // 4 1/8% of 2029-11-30, semiannual: coupons every 30 May / 30 November (month ends: 31 May; the
    // ICMA schedule keeps the maturity's end of month), last coupon 2027-11-30, next 2028-05-31.
    const dates = ['2028-05-31', '2028-11-30', '2029-05-31', '2029-11-30'];
    const pv = dates.reduce((sum, d, i) => sum + (100 * 0.04125) / 2 * df(c, d) + (i === dates.length - 1 ? 100 * df(c, d) : 0), 0);
    const accrued = ((100 * 0.04125) / 2) * ((day('2027-12-27') - day('2027-11-30')) / (day('2028-05-31') - day('2027-11-30')));
    expectClose(pv / df(c, '2027-12-27') - accrued, 100.17, 1e-11, 'clean price paid at T+1, ICMA Rule 251 accrued to settlement');
  });

  it('a zero-coupon bond at spot: by price DF(M)/DF(S) = P/100; by an annual ACT/365F rate (1 + r)^(-tau(S, M)) (compounding from settlement)', () => {
    const quotes = [...LADDER, { kind: 'zero', maturity: '2042-11-15', price: 52.5, calendar: 'us-gov-securities', spotLag: 1 }, { kind: 'zero', maturity: '2047-11-15', rate: 0.0452, calendar: 'us-gov-securities', spotLag: 1 }];
    const b = buildCurve(doc('2027-12-23', quotes));
    expect(b.errors).toEqual([]);
    for (const row of b.repricing) expect(Math.abs(row.repricingError)).toBeLessThanOrEqual(row.unit === 'price' ? 1e-11 : 1e-14);
    const c = b.curve!;
    expectClose(df(c, '2042-11-15') / df(c, '2027-12-27'), 0.525, 1e-14, 'zero bought at 52.5 per 100 at T+1');
    const tau = (day('2047-11-15') - day('2027-12-27')) / 365;
    expectClose(df(c, '2047-11-15') / df(c, '2027-12-27'), Math.pow(1.0452, -tau), 1e-14, 'annual compounding on ACT/365F from settlement');
  });

  it('spot lag 0 with the weekends calendar on a business day reads and builds exactly as a bond without these fields', () => {
    const plain = [{ kind: 'bond', maturity: '2031-05-15', coupon: 0.04, cleanPrice: 101.25 }, { kind: 'bill', maturity: '2028-03-23', discountYield: 0.04 }];
    const lagged = plain.map((q) => ({ ...q, calendar: 'weekends', spotLag: 0 }));
    const a = buildCurve(doc('2027-12-22', plain));
    const b = buildCurve(doc('2027-12-22', lagged));
    expect(b.curve!.pillars).toEqual(a.curve!.pillars);
    expect(b.repricing).toEqual(a.repricing);
  });

  it('a maturity on or before settlement is an error naming the settlement; an unknown calendar lists the valid ones', () => {
    const e1 = validateWorkspace(doc('2027-12-23', [{ kind: 'bill', maturity: '2027-12-27', discountYield: 0.04, conventions: 'us-treasury' }])).errors;
    expect(e1).toContainEqual(expect.objectContaining({ code: 'before-settlement', path: 'quotes[0].maturity', message: expect.stringContaining("not after the trade's settlement 2027-12-27") }));
    const e2 = validateWorkspace(doc('2027-12-23', [{ kind: 'bond', maturity: '2030-01-15', coupon: 0.04, cleanPrice: 100, calendar: 'nyse', spotLag: 1 }])).errors;
    expect(e2).toContainEqual(expect.objectContaining({ code: 'unknown-identifier', path: 'quotes[0].calendar', message: expect.stringContaining('us-gov-securities') }));
  });
});
