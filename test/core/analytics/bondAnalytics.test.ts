import { describe, it, expect } from 'vitest';
import * as formula from '@formulajs/formulajs';
import {
  analyzeBond,
  billPriceFromDiscountYield,
  bondDirtyFromYield,
  bondSchedule,
  bondYieldFromDirty,
  buildCurve,
  curveFromPillars,
  yieldRisk,
  zSpread,
  type Curve,
} from '../../../src/core/index.ts';
import { expectClose, expectRelClose } from '../../helpers/asserts.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';

const SETTLEMENT = '2027-03-10';
/** A flat continuously compounded curve at r0 on ACT/365F (log-linear nodes reproduce -r0 t exactly). */
function flatCurve(r0: number): Curve {
  const pillars = [0.5, 1, 2, 5, 10, 20, 30, 41].map((years, i) => {
    const t = years;
    return { date: `20${27 + Math.round(years)}-03-10`, t, discount: Math.exp(-r0 * t), quote: i };
  });
  return curveFromPillars(SETTLEMENT, 'ACT/365F', 'log-linear-discount', 'flat-forward', pillars);
}
// An invented market (demo data) for the curve-shape checks.
const market = workspaceDoc(INVENTED_2027_EVERY_KIND, { settlement: SETTLEMENT, interpolation: 'monotone-convex' }); // test/helpers/markets.ts

describe('yield-based price, duration and convexity against a textbook worked example', () => {
  // F. J. Fabozzi, "Bond Markets, Analysis, and Strategies", chapter on price volatility: a 9%
  // 20-year bond (semiannual) priced to yield 6% is 134.6722; at 5.8% and 6.2% it is 137.5888 and
  // 131.8439; the approximate duration (P- - P+)/(2 P0 dy) is 10.66 and the convexity measure
  // (P+ + P- - 2 P0)/(2 P0 dy^2) is 81.96 (values cited from memory; the book's convexity measure
  // is half of the convexity (1/P) d2P/dy2 used here).
  const s = bondSchedule({ maturity: '2047-03-10', coupon: 0.09, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false }, SETTLEMENT);
  const p = (y: number): number => bondDirtyFromYield(s, y).price;
  it('bondDirtyFromYield prices the bond at 6%, 5.8% and 6.2% as in the book (4 decimals)', () => {
    expectClose(p(0.06), 134.6722, 5e-5, 'Fabozzi, 9% 20-year at 6%: 134.6722');
    expectClose(p(0.058), 137.5888, 5e-5, 'Fabozzi, same bond at 5.8%: 137.5888');
    expectClose(p(0.062), 131.8439, 5e-5, 'Fabozzi, same bond at 6.2%: 131.8439');
  });
  it('the analytic modified duration and convexity agree with the book\'s 20 bp approximations to their truncation', () => {
    const r = yieldRisk(s, 0.06);
    const approxD = (137.5888 - 131.8439) / (2 * 134.6722 * 0.002);
    const approxC = (137.5888 + 131.8439 - 2 * 134.6722) / (2 * 134.6722 * 0.002 ** 2);
    expectClose(approxD, 10.66, 0.005, 'Fabozzi approximate duration 10.66');
    expectClose(approxC, 81.96, 0.005, 'Fabozzi convexity measure 81.96');
    expectClose(r.modifiedDuration, 10.66, 0.005, 'Fabozzi approximate duration 10.66 (20 bp shifts)');
    // The 20 bp second difference carries O(dy^2) truncation and the book's 4-decimal rounding.
    expectClose(r.convexity, 2 * 81.96, 0.3, 'twice Fabozzi convexity measure 81.96');
    expectClose(r.macaulayDuration, 1.03 * r.modifiedDuration, 1e-12, 'Macaulay = (1 + y/f) x modified');
  });
});

describe('duration and convexity by finite differences', () => {
  const cases = [
    { maturity: '2036-05-15', coupon: 0.04, frequency: 2, y: 0.038 },
    { maturity: '2031-11-30', coupon: 0.0625, frequency: 4, y: 0.051 },
    { maturity: '2045-07-01', coupon: 0.02, frequency: 1, y: 0.043 },
  ];
  it.each(cases)('yieldRisk for the $coupon coupon to $maturity matches central differences of the ICMA price', (c) => {
    const s = bondSchedule({ ...c, dayCount: 'ACT/ACT-ICMA', eom: false }, SETTLEMENT);
    const p = (y: number): number => bondDirtyFromYield(s, y).price;
    const r = yieldRisk(s, c.y);
    const h = 1e-5;
    expectRelClose(r.modifiedDuration, -(p(c.y + h) - p(c.y - h)) / (2 * h * p(c.y)), 1e-8, 'central difference of P, h = 1e-5');
    const h2 = 1e-4;
    expectRelClose(r.convexity, (p(c.y + h2) + p(c.y - h2) - 2 * p(c.y)) / (h2 * h2 * p(c.y)), 1e-5, 'second central difference of P, h = 1e-4');
    expectRelClose(r.dv01, r.modifiedDuration * p(c.y) * 1e-4, 1e-14, 'DV01 = D_mod x P_dirty x 1e-4');
    expect(r.dv01).toBeGreaterThan(0);
  });
  it('a zero-coupon bond on its schedule has Macaulay duration = maturity and convexity n(n+1)/(f^2 (1 + y/f)^2)', () => {
    const s = bondSchedule({ maturity: '2037-03-10', coupon: 0, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false }, SETTLEMENT);
    const r = yieldRisk(s, 0.05);
    expectClose(r.macaulayDuration, 10, 1e-12, 'Macaulay duration of a zero is its maturity (definition)');
    expectClose(r.convexity, (20 * 21) / (4 * 1.025 ** 2), 1e-10, 'convexity of a zero, n = 20 half-years (textbook closed form)');
  });
});

describe('outside oracle: @formulajs/formulajs (spreadsheet PV, RATE, XNPV, XIRR)', () => {
  // First the oracle against published examples: Z. Bodie, A. Kane and A. J. Marcus, "Investments",
  // duration chapter: an 8% semiannual 3-year bond at a 10% yield costs 949.243 per 1000 (from
  // memory); Microsoft's documentation of XNPV and XIRR: the five-flow example from 2008-01-01
  // gives XNPV(9%) = 2086.65 and XIRR = 0.373362535. (This package's TBILLPRICE counts bill days
  // 30/360 - 98.475 for Microsoft's 98.45 example - so it is not used for bills.)
  const dates = ['2008-01-01', '2008-03-01', '2008-10-30', '2009-02-15', '2009-04-01'].map((d) => new Date(`${d}T00:00:00Z`));
  const flows = [-10000, 2750, 4250, 3250, 2750];
  it('the oracle reproduces its published examples first', () => {
    expectClose(-(formula.PV(0.05, 6, 40, 1000) as number), 949.243, 5e-4, 'Bodie-Kane-Marcus 8% 3-year at 10%: 949.243');
    expectClose(formula.XNPV(0.09, flows, dates) as number, 2086.65, 5e-3, 'Microsoft XNPV example: 2086.65');
    expectClose(formula.XIRR(flows, dates, 0.1) as number, 0.373362535, 5e-9, 'Microsoft XIRR example: 0.373362535');
  });
  it('is not used for bills: its TBILLPRICE counts 30/360 days where the published formula counts actual days', () => {
    // Microsoft's TBILLPRICE example: settlement 2008-03-31, maturity 2008-06-01 (62 actual days),
    // discount 9%: 98.45 = 100 (1 - 0.09 x 62 / 360). The package gives 98.475 (61 days, 30/360).
    const settle = new Date(2008, 2, 31); // local dates: the package reads local calendar fields
    const maturity = new Date(2008, 5, 1);
    expectClose(billPriceFromDiscountYield(0.09, 62), 98.45, 5e-3, 'Microsoft TBILLPRICE example: 98.45');
    expectClose(formula.TBILLPRICE(settle, maturity, 0.09) as number, 100 * (1 - (0.09 * 61) / 360), 1e-9, 'the package counts DAYS360 = 61 days');
  });
  it.each([
    { coupon: 0.08, years: 3, frequency: 2, y: 0.1 },
    { coupon: 0.045, years: 12, frequency: 2, y: 0.0371 },
    { coupon: 0.03, years: 7, frequency: 1, y: 0.052 },
    { coupon: 0.055, years: 5, frequency: 4, y: 0.049 },
  ])('on a coupon date, bond price and yield match -PV(y/f, n, 100c/f, 100) and RATE (coupon $coupon, $years years)', (c) => {
    const maturity = `${2027 + c.years}-03-10`;
    const s = bondSchedule({ maturity, coupon: c.coupon, frequency: c.frequency, dayCount: 'ACT/ACT-ICMA', eom: false }, SETTLEMENT);
    const n = c.years * c.frequency;
    const pv = -(formula.PV(c.y / c.frequency, n, (100 * c.coupon) / c.frequency, 100) as number);
    expectClose(bondDirtyFromYield(s, c.y).price, pv, 1e-9, 'formulajs PV');
    const rate = (formula.RATE(n, (100 * c.coupon) / c.frequency, -pv, 100) as number) * c.frequency;
    expectClose(bondYieldFromDirty(s, pv)!, rate, 1e-9, 'formulajs RATE x frequency');
  });
  it('on a flat curve, the model dirty price is XNPV at the annual rate and the z-spread comes from XIRR', () => {
    const r0 = 0.034;
    const curve = flatCurve(r0);
    const a = analyzeBond(curve, { maturity: '2036-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 99.1 });
    expect(a.ok).toBe(true);
    if (!a.ok) return;
    const v = a.value;
    const ds = [new Date(`${SETTLEMENT}T00:00:00Z`), ...v.schedule.dates.map((d) => new Date(`${d}T00:00:00Z`))];
    expectClose(formula.XNPV(Math.expm1(r0), [0, ...v.schedule.amounts], ds) as number, v.modelDirtyPrice, 1e-9, 'formulajs XNPV on ACT/365 at (1 + r) = e^r0');
    const irr = formula.XIRR([-v.market!.dirtyPrice, ...v.schedule.amounts], ds, 0.05) as number;
    expectClose(v.market!.zSpread, Math.log1p(irr) - r0, 1e-8, 'formulajs XIRR: z = ln(1 + irr) - r0');
  });
});

describe('key-rate durations and the z-spread', () => {
  const built = buildCurve(market);
  const curve = built.curve!;
  it('the key-rate durations of a 30-year bond sum to its parallel effective duration to 1e-8 relative', () => {
    for (const maturity of ['2056-11-15', '2036-05-15', '2029-09-01']) {
      const a = analyzeBond(curve, { maturity, coupon: 0.045, frequency: 2, dayCount: 'ACT/ACT-ICMA' });
      expect(a.ok).toBe(true);
      if (!a.ok) return;
      const sum = a.value.keyRateDurations.reduce((s, k) => s + k.duration, 0);
      expectRelClose(sum, a.value.effectiveDuration, 1e-8, 'tents sum to a parallel shift (key-rate sum rule)');
    }
  });
  it('on a flat curve the parallel duration is the flows\' continuous-yield Macaulay duration sum t PV / P', () => {
    const flat = flatCurve(0.03);
    const a = analyzeBond(flat, { maturity: '2041-08-15', coupon: 0.05, frequency: 2, dayCount: 'ACT/ACT-ICMA' });
    if (!a.ok) throw new Error(a.errors[0]!.message);
    const pv = a.value.flows.map((f) => f.amount * Math.exp(-0.03 * f.t));
    const p = pv.reduce((s, x) => s + x, 0);
    const d = a.value.flows.reduce((s, f, i) => s + f.t * pv[i]!, 0) / p;
    expectRelClose(a.value.effectiveDuration, d, 1e-10, '-(1/P) dP/dz = sum t CF e^(-z t) / P (definition)');
  });
  it('a zero-coupon bond maturing at the 5Y key has key-rate duration t at 5Y and 0 elsewhere', () => {
    const a = analyzeBond(curve, { maturity: '2032-03-10', coupon: 0, frequency: 1, dayCount: 'ACT/ACT-ICMA' });
    if (!a.ok) throw new Error(a.errors[0]!.message);
    for (const k of a.value.keyRateDurations) expectClose(k.duration, k.tenor === '5Y' ? curve.time('2032-03-10') : 0, 1e-10, `tent at ${k.tenor}: d(-ln DF)/dz = t`);
  });
  it('z-spread at the model price is 0 to 1e-12, and at a market price it reprices the market dirty price', () => {
    const a = analyzeBond(curve, { maturity: '2036-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 101 });
    if (!a.ok) throw new Error(a.errors[0]!.message);
    const v = a.value;
    expectClose(zSpread(v.flows, curve.lnDiscountAt, v.modelDirtyPrice)!, 0, 1e-12, 'z at the model price is zero by definition');
    const z = v.market!.zSpread;
    const repriced = v.flows.reduce((s, f) => s + f.amount * Math.exp(curve.lnDiscountAt(f.t) - z * f.t), 0);
    expectClose(repriced, v.market!.dirtyPrice, 1e-10, 'P_dirty = sum CF DF(t) e^(-z t)');
    expectClose(v.market!.cleanPrice, 101, 1e-12, 'the market clean price as given');
    expectClose(v.modelCleanPrice, v.modelDirtyPrice - v.accrued, 1e-12, 'clean = dirty - accrued');
  });
  it('with a market yield it prices from the yield and reports the risk at that yield', () => {
    const a = analyzeBond(curve, { maturity: '2036-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', yield: 0.041 });
    if (!a.ok) throw new Error(a.errors[0]!.message);
    const m = a.value.market!;
    expect(m.given).toBe('yield');
    expectClose(m.dirtyPrice, bondDirtyFromYield(a.value.schedule, 0.041).price, 1e-12, 'dirty price from the ICMA yield');
    expectClose(m.yield, 0.041, 0, 'the market yield as given');
  });
});

describe('analyzeBond refuses bad input with values a user can act on', () => {
  const curve = buildCurve(market).curve!;
  it('names a coupon given in percent', () => {
    const a = analyzeBond(curve, { maturity: '2036-05-15', coupon: 4, frequency: 2, dayCount: 'ACT/ACT-ICMA' });
    expect(a.ok).toBe(false);
    if (a.ok) return;
    expect(a.errors[0]!.path).toBe('bond.coupon');
    expect(a.errors[0]!.message).toMatch(/decimals: 0.05 = 5%/);
  });
  it('refuses a bond past the curve without extrapolation, saying what to change', () => {
    const a = analyzeBond(curve, { maturity: '2066-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' });
    expect(a.ok).toBe(false);
    if (a.ok) return;
    expect(a.errors[0]!.code).toBe('beyond-curve');
    expect(a.errors[0]!.message).toMatch(/flat-forward/);
  });
  it('refuses both a price and a yield, and a frequency that is not 1, 2, 4 or 12', () => {
    const a = analyzeBond(curve, { maturity: '2036-05-15', coupon: 0.04, frequency: 3, dayCount: 'ACT/ACT-ICMA', cleanPrice: 100, yield: 0.04 });
    expect(a.ok).toBe(false);
    if (a.ok) return;
    expect(a.errors.map((e) => e.path).sort()).toEqual(['bond', 'bond.frequency']);
  });
});
