// Government par yields (kinds/parYield.ts, instruments/parYield.ts): a curve built from par
// yields reproduces them, checked by the engine's repricing and by recomputing each par yield in
// this file from the built curve's discount factors with the textbook identity
//   par = f (1 - D(n)) / sum_{k=1..f n} D(k/f)           (coupon dates on the cycle)
// and, at one year or less, the zero-coupon bond-equivalent yield y = f (D^(-1/n) - 1) over n coupon
// periods (the spot rate of the par-to-zero recursion; MARKET-CONVENTIONS g, Fabozzi-style texts).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDays, buildCurve, fitCurve, compileQuote, CURVE_DAY_COUNTS, DAY_COUNTS, INTERPOLATIONS, isoFromSerial, quoteConvention, quoteConventionTag, quoteSchedule, serialFromIso, shiftQuote, validateWorkspace, type Curve } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';
import { workspaceDoc } from '../../helpers/markets.ts';

/** Days since 1970-01-01 of an ISO date (the test's own calendar arithmetic, independent of the core's). */
const day = (iso: string): number => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10))) / 86_400_000;
/** An ISO date plus whole months, for a day of month that every month has (the tests settle on the 1st and 6th). */
const plusMonths = (iso: string, months: number): string => {
  const y = Number(iso.slice(0, 4));
  const m = Number(iso.slice(5, 7)) - 1 + months;
  const yy = y + Math.floor(m / 12);
  const mm = (((m % 12) + 12) % 12) + 1;
  return `${yy}-${String(mm).padStart(2, '0')}-${iso.slice(8, 10)}`;
};
const lnDf = (curve: Curve, iso: string): number => curve.lnDiscountAt(curve.time(iso));

/** Tenor in months of the published US Treasury par yield curve's columns. */
const TREASURY_MONTHS = [1, 2, 3, 4, 6, 12, 24, 36, 60, 84, 120, 240, 360];
const tenorOf = (months: number): string => (months % 12 === 0 ? `${months / 12}Y` : `${months}M`);

/**
 * US Treasury, Daily Treasury Par Yield Curve Rates, the first row of the September 2023 page
 * (home.treasury.gov TextView, type=daily_treasury_yield_curve, month 202309), in percent:
 * 1 Mo .. 30 Yr. The page's rows run in date order from the month's first business day, Friday
 * 2023-09-01; the copy read through the search tool lost the Date column, so the date is from that
 * order (the yields are the page's).
 */
const TREASURY_2023_09_01 = [5.51, 5.55, 5.53, 5.58, 5.47, 5.36, 4.87, 4.57, 4.29, 4.27, 4.18, 4.48, 4.29];
const TREASURY_SETTLEMENT = '2023-09-01';

/**
 * A Treasury bill's bond-equivalent yield from its discount factor D (price / 100), written from
 * the published formulas (SIA, Fixed Income Securities Formulas, vol. 1, on Treasury bills, as the
 * MathWorks tbilldisc2yield and IMSL Tbilleq references state them): d days to maturity, T = 366
 * when 29 February falls in the year after settlement, else 365; up to half a year (d <= T/2) simple interest,
 * BEY = (1/D - 1) T / d; beyond, Treasury's quadratic
 * BEY = (-2d/T + 2 sqrt((d/T)^2 - (2d/T - 1)(1 - 1/D))) / (2d/T - 1).
 */
function billBey(D: number, settlement: string, maturity: string): number {
  const d = day(maturity) - day(settlement);
  const y0 = Number(settlement.slice(0, 4));
  const leapDays = [y0, y0 + 1].filter((y) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0).map((y) => day(`${y}-02-29`));
  const T = leapDays.some((x) => x > day(settlement) && x <= day(plusMonths(settlement, 12))) ? 366 : 365;
  if (d <= T / 2) return ((1 / D - 1) * T) / d; // not more than a half-year
  const a = d / T;
  return (-2 * a + 2 * Math.sqrt(a * a - (2 * a - 1) * (1 - 1 / D))) / (2 * a - 1);
}

/** Par yield of the curve at a maturity on the cycle from `settlement` (months a multiple of 12/f), recomputed here. */
function parFromCurve(curve: Curve, settlement: string, months: number, f = 2): number {
  const step = 12 / f;
  if (months <= 12) {
    // At one year or less a bill: its bond-equivalent yield (the US Treasury basis).
    const m = plusMonths(settlement, months);
    return billBey(Math.exp(lnDf(curve, m)), settlement, m);
  }
  let annuity = 0;
  for (let k = step; k <= months; k += step) annuity += Math.exp(lnDf(curve, plusMonths(settlement, k)));
  return (f * (1 - Math.exp(lnDf(curve, plusMonths(settlement, months))))) / annuity;
}

describe('par-yield quotes at the US Treasury par curve tenors', () => {
  const quotes = TREASURY_MONTHS.map((mo, i) => ({ kind: 'par-yield', tenor: tenorOf(mo), yield: TREASURY_2023_09_01[i]! / 100 }));

  for (const interpolation of INTERPOLATIONS) {
    it(`build under ${interpolation} reprices every par yield to 1e-12 and the curve's own DFs give them back`, () => {
      const build = buildCurve(workspaceDoc(quotes, { settlement: TREASURY_SETTLEMENT, interpolation }));
      expect(build.errors).toEqual([]);
      const curve = build.curve!;
      expect(build.repricing).toHaveLength(13);
      for (const r of build.repricing) expect(Math.abs(r.repricingError), `${r.maturity}`).toBeLessThanOrEqual(1e-12);
      TREASURY_MONTHS.forEach((mo, i) => {
        expectClose(parFromCurve(curve, TREASURY_SETTLEMENT, mo), TREASURY_2023_09_01[i]! / 100, 1e-12, `US Treasury par yield curve 2023-09-01, ${tenorOf(mo)}, ${mo <= 12 ? 'bill bond-equivalent yield (SIA)' : 'par = 2(1 - D(n)) / sum D(k/2)'}`);
      });
    });
  }
});

/**
 * Federal Reserve Board, Gurkaynak, Sack and Wright (2006) "The U.S. Treasury Yield Curve: 1961 to
 * the Present", dataset feds200628 (csv), row 2026-02-06, as stored in the public repository
 * liny-r/MTH9877-IR-Assignment1 (feds200628.csv @701dcab3). Svensson parameters, zero yields SVENY
 * (continuously compounded, %) and par yields SVENPY (coupon-equivalent, semiannual, %), 1..30 years.
 */
const GSW_2026_02_06 = {
  beta0: 2.48148959982137,
  beta1: 1.23169757714238,
  beta2: 8.33064972598025e-5,
  beta3: 8.61660816724105,
  tau1: 1.05093501341198,
  tau2: 17.7605928411708,
  SVENPY: [
    3.5414, 3.5136, 3.5686, 3.6606, 3.7669, 3.8762, 3.9826, 4.0834, 4.1772, 4.2634, 4.3421, 4.4134, 4.4778, 4.5357, 4.5874, 4.6336, 4.6746, 4.7109, 4.7429, 4.771, 4.7956, 4.817,
    4.8356, 4.8515, 4.8651, 4.8765, 4.8862, 4.8941, 4.9005, 4.9056,
  ],
  SVENY: [
    3.5098, 3.4824, 3.5389, 3.6341, 3.7457, 3.8622, 3.9776, 4.0887, 4.194, 4.2926, 4.3843, 4.469, 4.5468, 4.618, 4.6828, 4.7416, 4.7946, 4.8421, 4.8846, 4.9222, 4.9553, 4.9841,
    5.009, 5.0302, 5.0479, 5.0624, 5.0739, 5.0826, 5.0887, 5.0924,
  ],
};
const GSW_SETTLEMENT = '2026-02-06';

/** The Svensson zero yield (continuously compounded, decimal) at maturity t years (GSW 2006, eq. 22). */
function svenssonZero(t: number): number {
  const { beta0, beta1, beta2, beta3, tau1, tau2 } = GSW_2026_02_06;
  const x1 = t / tau1;
  const x2 = t / tau2;
  const l1 = -Math.expm1(-x1) / x1;
  const l2 = -Math.expm1(-x2) / x2;
  return (beta0 + beta1 * l1 + beta2 * (l1 - Math.exp(-x1)) + beta3 * (l2 - Math.exp(-x2))) / 100;
}

describe('at one year or less a par yield is a bill\'s bond-equivalent yield (US Treasury basis)', () => {
  it('the SIA worked example: a bill at a 4.97% discount from 2002-10-01 to 2003-03-31 (181 days) yields 5.17% bond-equivalent', () => {
    // Source: SIA Fixed Income Securities Formulas vol. 1 pp. 44-45, as the MathWorks tbilldisc2yield
    // example gives it (Discount 0.0497, Settle 01-Oct-02, Maturity 31-Mar-03: BEYield 0.0517).
    const fromBill = buildCurve(workspaceDoc([{ kind: 'bill', maturity: '2003-03-31', discountYield: 0.0497 }], { settlement: '2002-10-01' })).curve!;
    const D = Math.exp(lnDf(fromBill, '2003-03-31'));
    expectClose(D, 1 - (0.0497 * 181) / 360, 1e-15, 'bank discount: price = 100 (1 - d t / 360)');
    // The par-yield quote at the published 5.17% gives the bill's price to the rounding of 5.17 (half a bp times 181/365).
    const fromPar = buildCurve(workspaceDoc([{ kind: 'par-yield', maturity: '2003-03-31', yield: 0.0517 }], { settlement: '2002-10-01' })).curve!;
    expectClose(Math.exp(lnDf(fromPar, '2003-03-31')), D, 0.00005 * (181 / 365), 'SIA / MathWorks tbilldisc2yield: BEY 0.0517 for this bill');
  });
  it('beyond 182 days Treasury\'s quadratic holds; across the switch from 182 to 183 days the one-day forward is 3.96% at a 4% yield (the rules change from simple to a half-year compounded, as the published formulas do)', () => {
    const build = (maturity: string, y: number) => buildCurve(workspaceDoc([{ kind: 'par-yield', maturity, yield: y }], { settlement: '2026-12-15' })).curve!;
    for (const [maturity, y] of [['2027-09-15', 0.0412], ['2027-12-15', 0.0397], ['2027-06-15', 0.0433]] as const) {
      const D = Math.exp(lnDf(build(maturity, y), maturity));
      expectClose(billBey(D, '2026-12-15', maturity), y, 1e-14, `SIA bill bond-equivalent yield at ${maturity}`);
    }
    const d182 = Math.exp(lnDf(build('2027-06-15', 0.04), '2027-06-15')); // 182 days: simple
    const d183 = Math.exp(lnDf(build('2027-06-16', 0.04), '2027-06-16')); // 183 days: quadratic
    // The formulas' own step: ln(1 + y/2) + ln(1 + y (183/365 - 1/2)) - ln(1 + y 182/365), times 365, is 3.9608% at y = 4%.
    expectClose((Math.log(d182) - Math.log(d183)) * 365, 0.03960782189875332, 1e-12, 'SIA bill formulas either side of 182 days');
  });
});

describe('par-yield against the Federal Reserve GSW curve (feds200628, 2026-02-06)', () => {
  it('reproduces the Svensson curve exactly at the semiannual nodes from its own par yields (1e-10)', () => {
    // Exact identity: par yields computed from the Svensson DFs at every half year, 6M..30Y, on the
    // curve's own time axis (ACT/365F years stand in for GSW's maturity in years); every coupon
    // date is then a node, so the bootstrap must return the Svensson DFs whatever the interpolation.
    const probe = buildCurve(workspaceDoc([{ kind: 'zero', tenor: '1Y', rate: 0.03 }], { settlement: GSW_SETTLEMENT })).curve!;
    const D = (k: number): number => {
      const t = probe.time(plusMonths(GSW_SETTLEMENT, 6 * k));
      return Math.exp(-svenssonZero(t) * t);
    };
    const quotes = [];
    for (let n = 1; n <= 60; n++) {
      let y: number;
      if (n <= 2) y = billBey(D(n), GSW_SETTLEMENT, plusMonths(GSW_SETTLEMENT, 6 * n)); // 6M and 1Y: bills at their bond-equivalent yield
      else {
        let a = 0;
        for (let k = 1; k <= n; k++) a += D(k);
        y = (2 * (1 - D(n))) / a;
      }
      quotes.push({ kind: 'par-yield', tenor: n % 2 === 0 ? `${n / 2}Y` : `${6 * n}M`, yield: y });
    }
    for (const interpolation of INTERPOLATIONS) {
      const build = buildCurve(workspaceDoc(quotes, { settlement: GSW_SETTLEMENT, interpolation }));
      expect(build.errors).toEqual([]);
      const curve = build.curve!;
      for (let n = 1; n <= 60; n++) {
        const iso = plusMonths(GSW_SETTLEMENT, 6 * n);
        const t = curve.time(iso);
        expectClose(-lnDf(curve, iso) / t, svenssonZero(t), 1e-10, `GSW feds200628 2026-02-06 Svensson zero at ${iso} (${interpolation})`);
      }
    }
  });

  it('a Svensson fit of the GSW curve\'s own par yields at whole years gives back the GSW zeros (0.05 bp), in yield and in price', () => {
    // The par yields of the GSW Svensson curve at 1..30 years (its own identity, on the curve's
    // ACT/365F axis); 1Y as a zero's bond-equivalent yield, the kind's rule at one year. A Svensson
    // fit of them weighs each par-yield quote by its own dollar duration (fit part of the kind).
    const probe = buildCurve(workspaceDoc([{ kind: 'zero', tenor: '1Y', rate: 0.03 }], { settlement: GSW_SETTLEMENT })).curve!;
    const D = (k: number): number => {
      const t = probe.time(plusMonths(GSW_SETTLEMENT, 6 * k));
      return Math.exp(-svenssonZero(t) * t);
    };
    const quotes = [];
    for (let n = 1; n <= 30; n++) {
      let a = 0;
      for (let k = 1; k <= 2 * n; k++) a += D(k);
      quotes.push({ kind: 'par-yield', tenor: `${n}Y`, yield: n === 1 ? 2 * (D(2) ** (-1 / 2) - 1) : (2 * (1 - D(2 * n))) / a });
    }
    const ws = validateWorkspace(workspaceDoc(quotes, { settlement: GSW_SETTLEMENT })).workspace!;
    for (const errors of ['yield', 'price'] as const) {
      const fit = fitCurve(ws, { model: 'svensson', errors });
      expect(fit.ok).toBe(true);
      if (!fit.ok) continue;
      for (const r of fit.value.residuals) expect(Math.abs(r.modelYield - r.marketYield), `${errors} quotes[${r.index}]`).toBeLessThanOrEqual(0.05e-4);
      for (let n = 1; n <= 30; n++) {
        const iso = plusMonths(GSW_SETTLEMENT, 12 * n);
        const t = fit.value.curve.time(iso);
        expectClose(-fit.value.curve.lnDiscountAt(t) / t, svenssonZero(t), 0.05e-4, `GSW feds200628 2026-02-06 Svensson zero at ${n}Y, refitted from its par yields (${errors} errors)`);
      }
    }
  });

  it('builds from the published SVENPY par yields at whole years and meets SVENY within 0.5 bp', () => {
    // Different methods: GSW fit one smooth Svensson curve; here the curve passes through the 30
    // par yields exactly and its interpolation fills the half-year coupon dates between them. The
    // published figures carry 4 decimals of a percent (0.005 bp); the 1Y par yield is taken as a
    // zero's bond-equivalent yield (kind rule at one year or less; on this curve 1Y par and 1Y
    // zero BEY differ by 0.05 bp); ACT/365F years differ from GSW's years by up to 8 leap days in
    // 30 years, on a zero curve whose slope there is under 0.5 bp a year. Measured worst over the 30
    // maturities: 0.31 bp (linear zero, cubic zero, monotone convex) and 0.34 bp (log-linear discount).
    const quotes = GSW_2026_02_06.SVENPY.map((p, i) => ({ kind: 'par-yield', tenor: `${i + 1}Y`, yield: p / 100 }));
    for (const interpolation of INTERPOLATIONS) {
      const build = buildCurve(workspaceDoc(quotes, { settlement: GSW_SETTLEMENT, interpolation }));
      expect(build.errors).toEqual([]);
      const curve = build.curve!;
      GSW_2026_02_06.SVENY.forEach((z, i) => {
        const iso = plusMonths(GSW_SETTLEMENT, 12 * (i + 1));
        const zero = -lnDf(curve, iso) / curve.time(iso);
        expectClose(zero, z / 100, 0.5e-4, `GSW feds200628 2026-02-06 SVENY${String(i + 1).padStart(2, '0')} (${interpolation})`);
      });
    }
  });
});

describe('the par-yield kind', () => {
  const SETTLEMENT = '2027-03-10';
  const validate = (q: Record<string, unknown>) => validateWorkspace(workspaceDoc([q as never], { settlement: SETTLEMENT }));

  it('reads the defaults: semiannual, ACT/ACT-ICMA, the end-of-month rule from the maturity', () => {
    const v = validate({ kind: 'par-yield', tenor: '5Y', yield: 0.0412 });
    expect(v.errors).toEqual([]);
    expect(v.workspace!.quotes[0]).toMatchObject({ kind: 'par-yield', yield: 0.0412, frequency: 2, dayCount: 'ACT/ACT-ICMA', eom: false, maturity: '2032-03-10' });
    const e = validate({ kind: 'par-yield', maturity: '2032-04-30', yield: 0.0412, dayCount: '30/360' });
    expect(e.workspace!.quotes[0]).toMatchObject({ eom: true, dayCount: '30/360' });
  });

  it('names the quote, the field, what is wrong and what would be valid', () => {
    const missing = validate({ kind: 'par-yield', tenor: '5Y' });
    expect(missing.errors[0]!.message).toBe('quotes[0].yield: required, a number from -0.1 to 1');
    const big = validate({ kind: 'par-yield', tenor: '5Y', yield: 4.12 });
    expect(big.errors[0]!.message).toMatch(/^quotes\[0\]\.yield: must be a number from -0.1 to 1, not 4.12; rates are decimals/);
    const freq = validate({ kind: 'par-yield', tenor: '5Y', yield: 0.04, frequency: 3 });
    expect(freq.errors[0]!.message).toBe('quotes[0].frequency: must be one of 1, 2, 4, 12 payments a year, not 3');
    const dc = validate({ kind: 'par-yield', tenor: '5Y', yield: 0.04, dayCount: 'ACT/ACT' });
    expect(dc.errors[0]!.path).toBe('quotes[0].dayCount');
    expect(dc.errors[0]!.message).toMatch(/must be one of .*ACT\/ACT-ICMA/);
    const extra = validate({ kind: 'par-yield', tenor: '5Y', yield: 0.04, coupon: 0.04 });
    expect(extra.errors[0]!.path).toBe('quotes[0].coupon');
    // A maturity at or before settlement is refused as for every kind.
    const bond = validate({ kind: 'bond', maturity: SETTLEMENT, coupon: 0.04, yield: 0.04 });
    const par = validate({ kind: 'par-yield', maturity: SETTLEMENT, yield: 0.04 });
    expect(par.errors.map((x) => x.path)).toEqual(bond.errors.map((x) => x.path));
    expect(par.errors.length).toBeGreaterThan(0);
  });

  it('is a zero at one year or less and a par bond beyond: its schedule for the quote check', () => {
    const at = (tenor: string) => validate({ kind: 'par-yield', tenor, yield: 0.04 }).workspace!.quotes[0]!;
    const oneYear = quoteSchedule(at('1Y'), SETTLEMENT, null)!;
    expect(oneYear.rows).toHaveLength(1);
    expect(oneYear.rows[0]!.yearFraction).toBe(1); // 2 coupon periods over f = 2
    const ins = compileQuote(at('1Y'), SETTLEMENT, 'ACT/365F');
    // DF = (1 + y/2)^-2 on the cycle: 100 / 1.02^2.
    expectClose(ins.target, 100 / 1.02 ** 2, 1e-12, 'BEY zero over 2 half-years: 100 (1 + 0.04/2)^-2');
    const twoYears = quoteSchedule(at('2Y'), SETTLEMENT, null)!;
    expect(twoYears.rows.map((r) => r.end)).toEqual(['2027-09-10', '2028-03-10', '2028-09-10', '2029-03-10']);
    expect(twoYears.rows.map((r) => r.cashFlow)).toEqual([2, 2, 2, 102]);
    expect(twoYears.accrued).toBe(0);
    expect(twoYears.note).toMatch(/4\.0000% \(s\.a\., ACT\/ACT-ICMA\)/);
  });

  it('off the cycle: a maturity date between coupon dates prices clean 100 plus accrued', () => {
    const q = validate({ kind: 'par-yield', maturity: '2030-05-15', yield: 0.05 }).workspace!.quotes[0]!;
    const s = quoteSchedule(q, SETTLEMENT, null)!;
    // ACT/ACT-ICMA accrued: 100 c/f x days(2026-11-15, 2027-03-10) / days(2026-11-15, 2027-05-15) = 2.5 x 115/181.
    expectClose(s.accrued, 2.5 * (115 / 181), 1e-12, 'ICMA Rule 251 accrued interest, actual days over the coupon period');
    const build = buildCurve(workspaceDoc([{ kind: 'par-yield', tenor: '1Y', yield: 0.045 }, { kind: 'par-yield', maturity: '2030-05-15', yield: 0.05 }], { settlement: SETTLEMENT }));
    expect(build.errors).toEqual([]);
    const curve = build.curve!;
    // Clean price of the 5 % bond on the built curve: sum CF DF - accrued = 100.
    const pv = s.rows.reduce((a, r) => a + r.cashFlow * Math.exp(lnDf(curve, r.end)), 0);
    expectClose(pv - s.accrued, 100, 1e-10, 'par bond: clean price 100 on the curve built from it');
  });

  it('shifts in quote space by the yield, and the moved quote reprices at the moved yield', () => {
    const q = validate({ kind: 'par-yield', tenor: '7Y', yield: 0.041 }).workspace!.quotes[0]!;
    const moved = shiftQuote(q, 0.0025, SETTLEMENT);
    expect(moved.ok && (moved.value as { yield: number }).yield).toBeCloseTo(0.0435, 15);
  });
});

describe('random par-yield markets reprice within 1e-14 under every interpolation (the repricing property)', () => {
  // The engine contract of test/core/bootstrap/properties.test.ts (every rate quote within 1e-14,
  // every interpolation) on random par curves: any settlement 2020-2035 (month ends and leap days
  // included), any curve day count, frequency 1, 2, 4 or 12, any bond day count, the Treasury
  // tenors or a subset, plus up to two maturities off the coupon cycle (accrued interest), on a
  // smooth random curve plus noise (invented test data). Fixed seed.
  const SEED = 20261203;
  const TENORS = ['1M', '2M', '3M', '4M', '6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y'];
  const arb = fc.record({
    serial: fc.integer({ min: serialFromIso('2020-01-01'), max: serialFromIso('2035-12-31') }),
    curveDayCount: fc.constantFrom(...CURVE_DAY_COUNTS),
    frequency: fc.constantFrom(1, 2, 4, 12),
    dayCount: fc.constantFrom(...DAY_COUNTS),
    level: fc.double({ min: -0.005, max: 0.07, noNaN: true }),
    slope: fc.double({ min: -0.02, max: 0.03, noNaN: true }),
    tenors: fc.subarray(TENORS, { minLength: 1 }),
    offCycle: fc.array(fc.integer({ min: 400, max: 9000 }), { maxLength: 2 }),
    noise: fc.array(fc.double({ min: -0.0005, max: 0.0005, noNaN: true }), { minLength: 15, maxLength: 15 }),
  });
  const years = (tenor: string): number => Number.parseInt(tenor, 10) / (tenor.endsWith('Y') ? 1 : 12);
  for (const interpolation of INTERPOLATIONS) {
    it(interpolation, () => {
      fc.assert(
        fc.property(arb, (g) => {
          const settlement = isoFromSerial(g.serial);
          const y = (t: number, i: number): number => g.level + g.slope * (1 - Math.exp(-t / 3)) + g.noise[i % 15]!;
          const quotes: Record<string, string | number>[] = g.tenors.map((tenor, i) => ({ kind: 'par-yield', tenor, yield: y(years(tenor), i), frequency: g.frequency, dayCount: g.dayCount }));
          g.offCycle.forEach((days, i) => quotes.push({ kind: 'par-yield', maturity: addDays(settlement, days), yield: y(days / 365, 13 + i), frequency: g.frequency, dayCount: g.dayCount }));
          const build = buildCurve(workspaceDoc(quotes, { settlement, dayCount: g.curveDayCount, interpolation }));
          // A maturity drawn on a tenor's date is refused as a duplicate pillar; monotone-convex-positive refuses negative forwards (by contract).
          if (build.errors.length > 0 && build.errors.every((e) => /same point of the curve|needs positive forwards/.test(e.message))) return;
          expect(build.errors).toEqual([]);
          for (const r of build.repricing) expect(Math.abs(r.repricingError), `quotes[${r.index}] ${r.maturity}`).toBeLessThanOrEqual(1e-14);
        }),
        { seed: SEED, numRuns: interpolation === 'cubic-zero' || interpolation.startsWith('monotone') ? 30 : 60, endOnFailure: true },
      );
    }, 120_000);
  }
});

describe('every par yield carries the basis it is read on', () => {
  it('at one year or less on the US Treasury basis the tag says bond-equivalent on 365 or 366 days; above, semiannual ACT/ACT-ICMA', () => {
    const ws = validateWorkspace(workspaceDoc([{ kind: 'par-yield', tenor: '3M', yield: 0.0553 }, { kind: 'par-yield', tenor: '2Y', yield: 0.0487 }], { settlement: '2023-09-01' })).workspace!;
    expect(ws.quotes.map((q) => quoteConventionTag(quoteConvention(q)))).toEqual(['bond-equivalent, ACT/365 or 366', 's.a., ACT/ACT-ICMA']);
  });
});
