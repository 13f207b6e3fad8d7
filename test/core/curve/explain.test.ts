import { describe, expect, it } from 'vitest';
import {
  addDays,
  buildCurve,
  COMPOUNDINGS,
  CURVE_DAY_COUNTS,
  curveFromPillars,
  discountOn,
  explained,
  explanationText,
  forwardOn,
  INTERPOLATIONS,
  parYieldOn,
  zeroOn,
  type Compounding,
  type Curve,
  type CurveDayCount,
  type Explanation,
  type ExplainedRead,
  type InterpolationId,
  type Pillar,
} from '../../../src/core/index.ts';
import { expectClose, expectRelClose } from '../../helpers/asserts.ts';
import { rng } from '../../helpers/seededRandom.ts';

// Explanations of curve queries (issue 19). Two claims:
// 1. the traced value is the untraced value bit for bit (same code path), over random curves
//    (invented, seeded) and random queries under every interpolation method;
// 2. the shown steps, recomputed here from the shown inputs with the textbook definitions, give
//    the number to 1e-15 relative. The definitions: year fractions per the ISDA 2006 Definitions
//    section 4.16 (ACT/360, ACT/365F, 30E/360, ACT/ACT ISDA; cited from memory); rates from
//    discount factors: simple P = 1/(1 + r tau), periodic P = (1 + r/m)^(-m tau), continuous
//    P = exp(-r tau) (Hull, "Options, Futures and Other Derivatives", chapter on interest rates;
//    cited from memory); log-linear discount and linear zero interpolation as in Hagan and West,
//    "Interpolation Methods for Curve Construction" (2006), sections on linear on the log of
//    discount factors and linear on rates (cited from memory).

const SETTLEMENT = '2026-07-15';

function randomCurve(r: () => number, method: InterpolationId): Curve {
  const dc = CURVE_DAY_COUNTS[Math.floor(r() * CURVE_DAY_COUNTS.length)]!;
  const n = 3 + Math.floor(r() * 8);
  const pillars: Pillar[] = [];
  let day = 0;
  for (let i = 0; i < n; i++) {
    day += 20 + Math.floor(r() * 1500);
    const date = addDays(SETTLEMENT, day);
    const t = day / 365;
    const z = -0.005 + r() * 0.06;
    pillars.push({ date, t: 0, discount: Math.exp(-z * t), quote: i });
  }
  // The pillar times on the curve's own clock.
  const probe = curveFromPillars(SETTLEMENT, dc, method, 'flat-forward', [{ date: pillars[0]!.date, t: 1, discount: 0.99, quote: 0 }]);
  return curveFromPillars(SETTLEMENT, dc, method, 'flat-forward', pillars.map((p) => ({ ...p, t: probe.time(p.date) })));
}

function queryDates(r: () => number, curve: Curve): string[] {
  const last = curve.pillars[curve.pillars.length - 1]!.date;
  const span = Math.round((Date.parse(last) - Date.parse(SETTLEMENT)) / 86400000);
  const out = [SETTLEMENT, ...curve.pillars.map((p) => p.date)];
  for (let i = 0; i < 8; i++) out.push(addDays(SETTLEMENT, 1 + Math.floor(r() * (span + 2000))));
  return out;
}

const value = <T>(x: { ok: true; value: T } | { ok: false; errors: readonly unknown[] }): T => {
  if (!x.ok) throw new Error(JSON.stringify(x.errors));
  return x.value;
};

/** Days between two ISO dates by the JavaScript clock (independent of the core's serials). */
const days = (a: string, b: string): number => Math.round((Date.parse(b) - Date.parse(a)) / 86400000);

/** Year fraction by the 2006 ISDA Definitions 4.16 (and SIFMA for 30/360-US), written out here; null for ACT/ACT-ICMA. */
function yearFraction(dc: string, a: string, b: string): number | null {
  if (dc === 'ACT/360') return days(a, b) / 360;
  if (dc === 'ACT/365F') return days(a, b) / 365;
  const [y1, m1, d1] = a.split('-').map(Number) as [number, number, number];
  const [y2, m2, d2] = b.split('-').map(Number) as [number, number, number];
  const thirty = (D1: number, D2: number) => (360 * (y2 - y1) + 30 * (m2 - m1) + (D2 - D1)) / 360;
  if (dc === '30E/360') return thirty(Math.min(d1, 30), Math.min(d2, 30));
  if (dc === '30/360') {
    // 4.16(f): D1 = 31 becomes 30; D2 = 31 becomes 30 when D1 is then 30.
    const D1 = Math.min(d1, 30);
    return thirty(D1, d2 === 31 && D1 === 30 ? 30 : d2);
  }
  if (dc === '30/360-US') {
    // SIFMA (Standard Securities Calculation Methods), with the end-of-February rules as curve queries use them.
    const lastFeb = (y: number, m: number, d: number) => m === 2 && d === new Date(Date.UTC(y, 2, 0)).getUTCDate();
    let D1 = d1;
    let D2 = d2;
    if (lastFeb(y1, m1, d1) && lastFeb(y2, m2, d2)) D2 = 30;
    if (lastFeb(y1, m1, d1)) D1 = 30;
    if (D2 === 31 && D1 >= 30) D2 = 30;
    if (D1 === 31) D1 = 30;
    return thirty(D1, D2);
  }
  if (dc === 'ACT/ACT-ISDA') {
    const leap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
    if (y1 === y2) return days(a, b) / (leap(y1) ? 366 : 365);
    let s = days(a, `${y1 + 1}-01-01`) / (leap(y1) ? 366 : 365) + (y2 - y1 - 1) + days(`${y2}-01-01`, b) / (leap(y2) ? 366 : 365);
    if (y2 - y1 - 1 < 0) s = NaN;
    return s;
  }
  return null;
}

/** ln DF of a read recomputed from its shown nodes by the method's definition; null when the method reads every node. */
function lnFromNodes(read: ExplainedRead): number | null {
  const [a, b] = read.nodes;
  switch (read.how) {
    case 'settlement':
      return 0;
    case 'node':
      return a!.lnDiscount;
    case 'extrapolated':
      return a!.lnDiscount - read.forward! * (read.t - a!.t);
    case 'interpolated':
      if (read.method === 'log-linear-discount') return a!.lnDiscount + ((read.t - a!.t) / (b!.t - a!.t)) * (b!.lnDiscount - a!.lnDiscount);
      if (read.method === 'linear-zero') {
        const zb = -b!.lnDiscount / b!.t;
        if (a!.t === 0) return -zb * read.t;
        const za = -a!.lnDiscount / a!.t;
        return -(za + ((read.t - a!.t) / (b!.t - a!.t)) * (zb - za)) * read.t;
      }
      return null;
    case 'derived':
      return null;
  }
}

/** The rate of a discount factor exp(lnP) over tau years in compounding c (textbook definitions). */
function rateOf(lnP: number, c: Compounding, tau: number): number {
  const m = { simple: 0, annual: 1, semiannual: 2, quarterly: 4, monthly: 12, continuous: Infinity }[c];
  if (m === Infinity) return -lnP / tau;
  if (m === 0) return Math.expm1(-lnP) / tau; // (1/P - 1) / tau
  return m * Math.expm1(-lnP / (m * tau)); // m (P^(-1/(m tau)) - 1)
}

/** The rate from the shown growth step: simple growth / tau, periodic m x growth (the steps' own chain). */
function checkGrowth(e: Explanation, lnP: number, tau: number, src: string): void {
  const c = e.conventions.compounding!;
  if (c === 'continuous') return;
  const m = { simple: 0, annual: 1, semiannual: 2, quarterly: 4, monthly: 12 }[c];
  const growth = step(e, 'growth');
  // 1/P - 1 over the period (simple) or over one compounding period (periodic).
  expectRelClose(growth, m === 0 ? Math.expm1(-lnP) : Math.expm1(-lnP / (m * tau)), 1e-15, `${src}: growth`, 1e-300);
  expectRelClose(m === 0 ? growth / tau : m * growth, e.value, 1e-15, `${src}: rate from the shown growth`, 1e-300);
}

const step = (e: Explanation, name: string): number => {
  const s = e.steps.find((x) => x.name === name);
  if (!s) throw new Error(`no step ${name} in ${e.steps.map((x) => x.name).join(', ')}`);
  return s.value;
};
const read = (e: Explanation, name: string): ExplainedRead => e.reads.find((x) => x.name === name)!;

/** Every shown input checked against its own definition, then the steps recomputed from them. */
function checkExplanation(curve: Curve, e: Explanation, src: string): void {
  expect(e.steps[e.steps.length - 1]!.value).toBe(e.value);
  for (const y of e.yearFractions) {
    expect(y.days).toBe(days(y.from, y.to));
    const yf = y.dayCount === 'ACT/ACT-ICMA' ? null : yearFraction(y.dayCount, y.from, y.to);
    if (yf !== null) expectRelClose(y.value, yf, 1e-15, `${src}: ${y.name} by ISDA 4.16 ${y.dayCount}`, 1e-300);
  }
  for (const r of e.reads) {
    expect(r.discount).toBe(Math.exp(r.lnDiscount));
    expect(r.method).toBe(curve.interpolation);
    for (const n of r.nodes) {
      if (n.quote === null) expect([n.t, n.lnDiscount]).toEqual([0, 0]);
      else expectRelClose(n.discount, curve.pillars.find((p) => p.date === n.date)!.discount, 1e-15, `${src}: node ${n.date} is the pillar's discount factor`);
    }
    const ln = lnFromNodes(r);
    if (ln !== null) expectRelClose(Math.exp(ln), r.discount, 1e-15, `${src}: ${r.name} (${r.how}, ${r.method}) from its shown nodes`);
    else expect(r.local).toBe(false);
  }
  if (e.quantity === 'discount-factor') expectRelClose(Math.exp(read(e, 'DF(date)').lnDiscount), e.value, 1e-15, `${src}: DF = exp(ln DF)`);
  if (e.quantity === 'zero-rate' && e.yearFractions.length > 0) {
    const tau = e.yearFractions.find((y) => y.name === 'tau')!.value;
    const lnP = read(e, 'DF(date)').lnDiscount;
    expect(step(e, 'lnP')).toBe(lnP);
    expectRelClose(rateOf(lnP, e.conventions.compounding!, tau), e.value, 1e-15, `${src}: zero rate by the compounding definition`, 1e-300);
    checkGrowth(e, lnP, tau, src);
  }
  if (e.quantity === 'forward-rate') {
    const tau = e.yearFractions.find((y) => y.name === 'tau')!.value;
    const lnP = read(e, 'DF(end)').lnDiscount - read(e, 'DF(start)').lnDiscount;
    expect(step(e, 'lnP')).toBe(lnP);
    expectRelClose(rateOf(lnP, e.conventions.compounding!, tau), e.value, 1e-15, `${src}: forward rate by the compounding definition`, 1e-300);
    checkGrowth(e, lnP, tau, src);
  }
  if (e.quantity === 'par-yield') {
    let annuity = 0;
    for (let i = 1; e.yearFractions.some((y) => y.name === `tau${i}`); i++) annuity += e.yearFractions.find((y) => y.name === `tau${i}`)!.value * read(e, `DF(t${i})`).discount;
    expectRelClose(step(e, 'annuity'), annuity, 1e-15, `${src}: annuity = sum tau_i DF(t_i)`);
    // DF(start) - DF(end): two doubles each within half an ulp of 1, so the difference is good to an ulp of 1 absolutely.
    expectRelClose(step(e, 'numerator'), read(e, 'DF(start)').discount - read(e, 'DF(end)').discount, 1e-15, `${src}: DF(start) - DF(end)`, 2.3e-16);
    expectRelClose(step(e, 'numerator') / annuity, e.value, 1e-15, `${src}: par rate = (DF(start) - DF(end)) / annuity`);
  }
}

describe('explanations on random curves (invented, seeded)', () => {
  for (const method of INTERPOLATIONS) {
    it(`${method}: the traced value is the untraced one bit for bit, and the shown steps give it to 1e-15`, () => {
      const r = rng(0x5eed + INTERPOLATIONS.indexOf(method));
      let checked = 0;
      for (let k = 0; k < 12; k++) {
        const curve = randomCurve(r, method);
        for (const date of queryDates(r, curve)) {
          const c = COMPOUNDINGS[Math.floor(r() * COMPOUNDINGS.length)]!;
          const dc: CurveDayCount = CURVE_DAY_COUNTS[Math.floor(r() * CURVE_DAY_COUNTS.length)]!;
          const src = `curve ${k} ${curve.dayCount}, ${date}, ${c} ${dc}`;
          const d = value(explained((s) => discountOn(curve, date, 'date', s)));
          expect(d.value).toEqual(value(discountOn(curve, date)));
          expect(Object.is(d.explanation.value, d.value.discount)).toBe(true);
          checkExplanation(curve, d.explanation, `${src} DF`);
          const plainZero = zeroOn(curve, date, c, dc);
          const z = explained((s) => zeroOn(curve, date, c, dc, 'date', s));
          expect(z.ok).toBe(plainZero.ok);
          if (z.ok && plainZero.ok) {
            expect(z.value.value).toEqual(plainZero.value);
            expect(Object.is(z.value.explanation.value, plainZero.value.zero)).toBe(true);
            checkExplanation(curve, z.value.explanation, `${src} zero`);
          }
          const end = addDays(date, 1 + Math.floor(r() * 800));
          const plainForward = forwardOn(curve, date, end, c, dc);
          const f = explained((s) => forwardOn(curve, date, end, c, dc, 'forward', s));
          expect(f.ok).toBe(plainForward.ok);
          if (f.ok && plainForward.ok) {
            expect(f.value.value).toEqual(plainForward.value);
            expect(Object.is(f.value.explanation.value, plainForward.value.rate)).toBe(true);
            checkExplanation(curve, f.value.explanation, `${src} forward to ${end}`);
          }
          if (date !== SETTLEMENT) {
            const freq = [1, 2, 4, 12][Math.floor(r() * 4)]!;
            const plainPar = parYieldOn(curve, date, freq);
            const p = value(explained((s) => parYieldOn(curve, date, freq, 'maturity', s)));
            expect(p.value).toEqual(value(plainPar));
            expect(Object.is(p.explanation.value, p.value.rate)).toBe(true);
            checkExplanation(curve, p.explanation, `${src} par ${freq}`);
          }
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(100);
    });
  }
});

describe('an explanation read by hand', () => {
  // Hand calculation on an invented two-node curve, ACT/365F: DF(2027-07-15) = 0.96, DF(2028-07-15) = 0.92.
  const curve = curveFromPillars(SETTLEMENT, 'ACT/365F', 'log-linear-discount', 'none', [
    { date: '2027-07-15', t: 365 / 365, discount: 0.96, quote: 0 },
    { date: '2028-07-15', t: 731 / 365, discount: 0.92, quote: 1 },
  ]);
  it('forwardOn with a sink: a 6M simple ACT/360 forward between the nodes names its dates, day counts, nodes and steps', () => {
    const f = value(explained((s) => forwardOn(curve, '2027-07-15', '2028-01-15', 'simple', 'ACT/360', 'forward', s), { start: '1Y', end: '6M' }));
    const e = f.explanation;
    expect(e.dates.map((d) => [d.name, d.given, d.adjusted])).toEqual([
      ['start', '1Y', '2027-07-15'],
      ['end', '6M', '2028-01-15'],
    ]);
    const tau = e.yearFractions.find((y) => y.name === 'tau')!;
    expect([tau.days, tau.value]).toEqual([184, 184 / 360]); // 2027-07-15 to 2028-01-15: 184 days (hand count)
    expect(tau.rule).toBe('ACT/360: 184 actual days / 360');
    expect(read(e, 'DF(start)').how).toBe('node');
    expect(read(e, 'DF(start)').discount).toBeCloseTo(0.96, 15);
    const end = read(e, 'DF(end)');
    expect(end.how).toBe('interpolated');
    expect(end.nodes.map((n) => n.date)).toEqual(['2027-07-15', '2028-07-15']);
    // Hand: ln DF(end) = ln 0.96 + (184/366) (ln 0.92 - ln 0.96), t from 365/365 to 549/365 of a 366-day segment.
    const lnEnd = Math.log(0.96) + (184 / 366) * (Math.log(0.92) - Math.log(0.96));
    expectRelClose(end.lnDiscount, lnEnd, 1e-14, 'hand calculation, log-linear between the two nodes');
    expectClose(e.value, ((0.96 / Math.exp(lnEnd) - 1) * 360) / 184, 1e-14, 'hand calculation: (DF(start)/DF(end) - 1) / tau');
    expect(e.conventions).toMatchObject({ compounding: 'simple', dayCount: 'ACT/360', curveDayCount: 'ACT/365F', interpolation: 'log-linear-discount', businessDay: 'unadjusted' });
    expect(e.unit).toBe('decimal per year, simple, ACT/360');
  });
  it('zeroOn with a sink past the last node without extrapolation is the same error as without', () => {
    const plain = zeroOn(curve, '2030-01-01', 'continuous', 'ACT/365F');
    const traced = explained((s) => zeroOn(curve, '2030-01-01', 'continuous', 'ACT/365F', 'date', s));
    expect(traced).toEqual(plain);
    expect(traced.ok).toBe(false);
  });
  it('a zero rate at settlement is explained as the limit of short rates', () => {
    const z = value(explained((s) => zeroOn(curve, SETTLEMENT, 'annual', 'ACT/360', 'date', s)));
    expect(z.explanation.steps.map((s) => s.name)).toEqual(['f0', 'k', 'fk', 'rate']);
    // Flat forward on the first segment: f0 = -ln 0.96 per year; k = (1/365)/(1/360) for ACT/365F against ACT/360.
    expectRelClose(step(z.explanation, 'f0'), -Math.log(0.96), 1e-15, 'hand: the flat forward of the first segment');
    expectRelClose(step(z.explanation, 'k'), 360 / 365, 1e-15, 'hand: one day on ACT/365F over one day on ACT/360');
    expectRelClose(z.explanation.value, Math.expm1((-Math.log(0.96) * 360) / 365), 1e-15, 'annual compounding of the continuous rate');
  });
});

describe('explanations on a bootstrapped curve', () => {
  // The invented market of query.test.ts: deposits, bonds and swaps.
  const market = (interpolation: string) => ({
    format: 'tenorscope-workspace',
    version: 1,
    settlement: '2027-03-10',
    curve: { dayCount: 'ACT/365F', interpolation, extrapolation: 'flat-forward' },
    quotes: [
      { kind: 'deposit', tenor: '3M', rate: 0.0287, dayCount: 'ACT/360' },
      { kind: 'deposit', tenor: '6M', rate: 0.0293, dayCount: 'ACT/360' },
      { kind: 'bond', maturity: '2029-03-10', coupon: 0.031, frequency: 2, cleanPrice: 100 },
      { kind: 'swap', tenor: '10Y', rate: 0.0352, frequency: 1, dayCount: '30/360' },
    ],
  });
  it.each(INTERPOLATIONS.map((m) => [m]))('%s: a 2Y semiannual par yield at the bond maturity is the bond coupon and its steps add up', (method) => {
    const curve = buildCurve(market(method)).curve!;
    const p = value(explained((s) => parYieldOn(curve, '2029-03-10', 2, 'maturity', s)));
    // A bond quoted at 100 clean on its coupon date reprices at par: its par yield is its coupon (definition of a par yield).
    expectClose(p.value.rate, 0.031, 1e-12, 'par bond: par yield = coupon');
    expect(p.explanation.reads.filter((r) => /^DF\(t/.test(r.name)).map((r) => r.date)).toEqual(['2027-09-10', '2028-03-10', '2028-09-10', '2029-03-10']);
    expect(read(p.explanation, 'DF(end)').how).toBe('node');
    checkExplanation(curve, p.explanation, `${method} par 2Y`);
  });
});

describe('explanationText', () => {
  // The plain text must let a colleague recompute the number: every figure in full precision
  // (ECMA-262 Number::toString, the shortest text that reads back as the same double) and ISO dates.
  const curve = curveFromPillars(SETTLEMENT, 'ACT/365F', 'linear-zero', 'flat-forward', [
    { date: '2027-01-15', t: 184 / 365, discount: 0.9812345678901234, quote: 0 },
    { date: '2028-07-15', t: 731 / 365, discount: 0.9234567890123456, quote: 1 },
  ]);
  it('explanationText of a forward: each number reads back as the same double, dates are ISO, the caution is there', () => {
    const f = value(explained((s) => forwardOn(curve, '2027-03-01', '2029-01-31', 'quarterly', 'ACT/360', 'forward', s)));
    const e = f.explanation;
    const text = explanationText(e, { title: 'test forward', quoteLabel: (i) => `row ${i + 1}`, topQuotes: [{ label: 'row 2', bpPerBp: 0.1234567890123456 }], methods: [{ label: 'Linear zero', current: true, value: e.value, error: null }] });
    const valueLine = text.split('\n').find((l) => l.startsWith('Value: '))!;
    expect(Number(valueLine.slice(7).split(' ')[0])).toBe(f.value.rate);
    for (const r of e.reads) expect(text).toContain(`DF = ${String(r.discount)}`);
    for (const s of e.steps) expect(text).toContain(`= ${String(s.value)} (`);
    expect(text).toContain('row 2: 0.1234567890123456');
    expect(text).toContain('extrapolated past the last node 2028-07-15');
    expect(text).toContain('interpolated (linear-zero) between 2027-01-15');
    expect(text).toMatch(/not investment advice/);
    expect(text).not.toMatch(/\d{1,2}\/\d{1,2}\/\d{4}/); // no locale dates
  });
});
