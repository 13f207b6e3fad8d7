import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  BUILT_IN_CALENDARS,
  BUSINESS_DAY_RULES,
  CURVE_DAY_COUNTS,
  fitCurve,
  bumpedForwardSensitivities,
  forwardRows,
  forwardSensitivities,
  luFactor,
  luInverse,
  modelYieldNodeJacobian,
  quoteNodeJacobian,
  quoteSchedule,
  bootstrapInstruments,
  buildCurve,
  compileMarket,
  INTERPOLATORS,
  builtInHolidays,
  businessCalendar,
  civilFromIso,
  compileQuote,
  compoundOvernight,
  INTERPOLATIONS,
  isoFromSerial,
  serialFromIso,
  validateWorkspace,
  type Curve,
  type OisQuote,
  type Quote,
} from '../../../src/core/index.ts';
import { oisDates } from '../../../src/core/instruments/ois.ts';
import { isoDates } from '../../../src/core/time/swapSchedule.ts';
import { expectClose } from '../../helpers/asserts.ts';
import { workspaceDoc, type Quote as RawQuote } from '../../helpers/markets.ts';

// The overnight-index swap (kind `ois`). Sources, named at each check:
// - MARKET-CONVENTIONS.md section d (the project's notes of published conventions): the
//   single-curve par rate K = sum (DF(S_i)/DF(E_i) - 1) DF(P_i) / sum tau_i DF(P_i), the
//   telescoping of the compounded coupon (QuantLib overnightindexedcouponpricer.cpp "telescopic
//   property"), the pillar at the last payment date (QuantLib#618, PR#2231), SOFR's T+2 spot lag
//   and 2-day payment lag on US government securities days (OpenGamma Strata
//   StandardFixedOvernightSwapConventions USD_FIXED_1Y_SOFR_OIS).
// - 2006 ISDA Definitions 4.12 (business-day conventions, as quoted in section b of the same notes).
// - SIFMA's closes for Good Friday (section a.1): us-gov-securities closes it every year; the
//   dates of Easter (2027-03-28, 2028-04-16) are from memory [M] and checked below against the
//   calendar module's own holiday list, itself tested against the date-easter package.
// - The engine contract: every rate quote reprices within 1e-14 (test/core/bootstrap/properties.test.ts).
// Rates in the markets below are invented test data.

const SETTLEMENT = '2026-04-10'; // a Friday; spot T+2 on us-gov-securities is Tuesday 2026-04-14

/** A SOFR-style OIS ladder, 1M to 30Y: spot lag 2, payment lag 2, us-gov-securities (invented rates). */
const LADDER: readonly (readonly [string, number])[] = [
  ['1M', 0.0431], ['3M', 0.0428], ['6M', 0.0419], ['9M', 0.0408], ['1Y', 0.0397], ['18M', 0.0381],
  ['2Y', 0.0369], ['3Y', 0.0356], ['4Y', 0.0351], ['5Y', 0.0350], ['7Y', 0.0356], ['10Y', 0.0366],
  ['12Y', 0.0372], ['15Y', 0.0379], ['20Y', 0.0383], ['25Y', 0.0378], ['30Y', 0.0371],
];
const SOFR_LIKE = { calendar: 'us-gov-securities', spotLag: 2, paymentLag: 2 };
const ladderQuotes = LADDER.map(([tenor, rate]) => ({ kind: 'ois', tenor, rate, ...SOFR_LIKE }));

const validatedOne = (raw: RawQuote, settlement = SETTLEMENT): Quote => {
  const v = validateWorkspace(workspaceDoc([raw], { settlement }));
  expect(v.errors).toEqual([]);
  return v.workspace!.quotes[0]!;
};
const errorsOf = (raw: RawQuote, settlement = SETTLEMENT) => validateWorkspace(workspaceDoc([raw], { settlement })).errors;
const datesOf = (raw: RawQuote, settlement = SETTLEMENT) => {
  const r = oisDates(validatedOne(raw, settlement) as OisQuote, civilFromIso(settlement));
  if (!r.ok) throw new Error(r.errors[0]!.message);
  return { starts: isoDates(r.value.starts), ends: isoDates(r.value.ends), payments: isoDates(r.value.payments) };
};
const df = (curve: Curve, date: string): number => Math.exp(curve.lnDiscountAt(curve.time(date)));

describe('an OIS curve from SOFR-style quotes (spot lag 2, payment lag 2, us-gov-securities)', () => {
  it('has real holidays in its schedules: Good Friday 2028 rolls the 2Y end, a payment lag skips Good Friday 2027', () => {
    // SIFMA closes Good Friday (MARKET-CONVENTIONS.md a.1); Easter 2027-03-28 and 2028-04-16 [M].
    expect(builtInHolidays('us-gov-securities', 2027)).toContain('2027-03-26');
    expect(builtInHolidays('us-gov-securities', 2028)).toContain('2028-04-14');
    const two = datesOf({ kind: 'ois', tenor: '2Y', rate: 0.0369, ...SOFR_LIKE });
    expect(two.starts[0]).toBe('2026-04-14'); // T+2 from Friday 2026-04-10 (section c)
    expect(two.ends).toEqual(['2027-04-14', '2028-04-17']); // 2028-04-14 is Good Friday: modified following to Monday
    expect(two.payments).toEqual(['2027-04-16', '2028-04-19']);
  });

  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: every quote reprices within 1e-14 in rate, each pillar at its last payment date`, () => {
      const build = buildCurve(workspaceDoc(ladderQuotes, { settlement: SETTLEMENT, interpolation }));
      expect(build.errors).toEqual([]);
      expect(build.repricing).toHaveLength(LADDER.length);
      for (const r of build.repricing) {
        // The engine contract for rate quotes (test/core/bootstrap/properties.test.ts): 1e-14.
        expect(Math.abs(r.repricingError), `quotes[${r.index}] ${LADDER[r.index]![0]} under ${interpolation}`).toBeLessThanOrEqual(1e-14);
      }
      // The pillar is the last payment date (MARKET-CONVENTIONS.md d; QuantLib#618).
      const pillar2y = build.curve!.pillars.find((p) => p.quote === 6)!;
      expect(pillar2y.date).toBe('2028-04-19');
      // The par rate read off the built curve by the section d formula, independently of the instrument.
      const c = build.curve!;
      for (const [i, [tenor, rate]] of LADDER.entries()) {
        const d = datesOf({ kind: 'ois', tenor, rate, ...SOFR_LIKE });
        let float = 0;
        let annuity = 0;
        for (let j = 0; j < d.ends.length; j++) {
          const p = df(c, d.payments[j]!);
          float += (df(c, d.starts[j]!) / df(c, d.ends[j]!) - 1) * p;
          annuity += ((serialFromIso(d.ends[j]!) - serialFromIso(d.starts[j]!)) / 360) * p;
        }
        expectClose(float / annuity, rate, 2e-14, `MARKET-CONVENTIONS.md d: K = sum (DF(S)/DF(E) - 1) DF(P) / sum tau DF(P), quotes[${i}] ${tenor} (2e-14: the formula in another order)`);
      }
    });
  }
});

describe('the three node solvers solve the OIS with its target on the curve alike', () => {
  // As test/core/bootstrap/bootstrap.test.ts does for fixed-flow kinds: with a method's segmentLn
  // and affine flags taken away the bootstrap falls back to the affine two-build solve and to the
  // rebuild solve; each has its own branch for a target read off the curve (nodeSolvers.ts). The
  // same equation, so the same nodes (1e-13 relative in ln DF, that test's bound) and every quote
  // within 1e-14 (the engine contract).
  it('log-linear-discount, cubic-zero and monotone-convex give one curve with every solver they can use', () => {
    const ws = validateWorkspace(workspaceDoc(ladderQuotes, { settlement: SETTLEMENT })).workspace!;
    const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
    const registry = INTERPOLATORS as Record<string, (typeof INTERPOLATORS)['monotone-convex']>;
    const variants = { 'log-linear-discount': [['segmentLn'], ['segmentLn', 'affine']], 'cubic-zero': [['affine']], 'monotone-convex': [['segmentLn']] } as const;
    for (const [id, drops] of Object.entries(variants) as [keyof typeof variants, readonly (readonly ('segmentLn' | 'affine')[])[]][]) {
      const settings = { settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation: id, extrapolation: 'none' as const };
      const reference = bootstrapInstruments(settings, market.instruments);
      expect(reference.errors).toEqual([]);
      for (const drop of drops) {
        const spec = registry[id]!;
        const reduced: Record<string, unknown> = { ...spec };
        for (const key of drop) delete reduced[key];
        registry[id] = reduced as unknown as typeof spec;
        let other;
        try {
          other = bootstrapInstruments(settings, market.instruments);
        } finally {
          registry[id] = spec;
        }
        expect(other.errors, `${id} without ${drop.join(', ')}`).toEqual([]);
        for (const r of other.repricing) expect(Math.abs(r.model - r.market), `${id} without ${drop.join(', ')}: quotes[${r.index}]`).toBeLessThanOrEqual(1e-14);
        for (const p of reference.curve!.pillars) {
          const want = reference.curve!.lnDiscountAt(p.t);
          expectClose(other.curve!.lnDiscountAt(p.t), want, 1e-13 * Math.max(1, Math.abs(want)), `${id} without ${drop.join(', ')}: ln DF at ${p.date}, same root as the method's own solver`);
        }
      }
    }
  });
});

describe('the repricing reported for an OIS is the built curve\'s own, bit for bit', () => {
  // As test/core/bootstrap/properties.test.ts holds for the fixed-flow kinds: the local methods
  // reprice from the flow table their pass left; for a lagged OIS the table must hold the curve's
  // values at every S_i, E_i and P_i. Checked with toBe.
  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: every model quote equals modelQuote(curve.lnDiscountAt)`, () => {
      const ws = validateWorkspace(workspaceDoc(ladderQuotes, { settlement: SETTLEMENT, interpolation })).workspace!;
      const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
      const out = bootstrapInstruments({ settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation, extrapolation: 'none' }, market.instruments);
      expect(out.errors).toEqual([]);
      market.instruments.forEach((ins, i) => {
        expect(out.repricing[i]!.model, `quotes[${ins.index}]`).toBe(ins.modelQuote(out.curve!.lnDiscountAt));
      });
    });
  }
});

describe('the OIS without lags equals the single-curve swap of today', () => {
  it('same fixed leg (annual, ACT/360), unadjusted dates on a weekends calendar, start at settlement: model rates within 1e-15, same curve', () => {
    // MARKET-CONVENTIONS.md d: with P_i = E_i and S_0 = settlement, K telescopes to
    // (1 - DF(E_n)) / sum tau_i DF(E_i), the engine's swap formula (instruments/swap.ts).
    const settlement = '2027-03-10';
    const tenors = ['2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y'];
    const rates = [0.031, 0.0322, 0.0335, 0.0341, 0.0352, 0.0366, 0.0359];
    const swaps = tenors.map((tenor, i) => ({ kind: 'swap', tenor, rate: rates[i]!, dayCount: 'ACT/360' }));
    const oiss = tenors.map((tenor, i) => ({ kind: 'ois', tenor, rate: rates[i]!, businessDay: 'unadjusted' }));
    const depo = { kind: 'deposit', tenor: '6M', rate: 0.0295 };
    const a = buildCurve(workspaceDoc([depo, ...swaps], { settlement }));
    const b = buildCurve(workspaceDoc([depo, ...oiss], { settlement }));
    expect(a.errors).toEqual([]);
    expect(b.errors).toEqual([]);
    for (let k = 0; k < a.curve!.pillars.length; k++) {
      expect(b.curve!.pillars[k]!.date).toBe(a.curve!.pillars[k]!.date);
      expectClose(b.curve!.pillars[k]!.discount, a.curve!.pillars[k]!.discount, 1e-15, 'the swap curve of the same quotes (MARKET-CONVENTIONS.md d: the same formula)');
    }
    // Each OIS priced on the swap curve gives the swap's own model rate.
    const ws = validateWorkspace(workspaceDoc([...swaps, ...oiss], { settlement })).workspace!;
    for (let i = 0; i < tenors.length; i++) {
      const swap = compileQuote(ws.quotes[i]!, settlement, 'ACT/365F');
      const ois = compileQuote(ws.quotes[tenors.length + i]!, settlement, 'ACT/365F');
      expect(ois.targetFromFlows).toBeUndefined();
      expectClose(ois.modelQuote(a.curve!.lnDiscountAt), swap.modelQuote(a.curve!.lnDiscountAt), 1e-15, `swap ${tenors[i]} on the same curve (MARKET-CONVENTIONS.md d)`);
    }
  });
});

describe('the floating leg telescopes: DF(S)/DF(E) is daily compounding of the curve\'s own one-day forwards', () => {
  it('over a 3M period with Good Friday and weekends inside, on us-gov-securities, ACT/360', () => {
    const build = buildCurve(workspaceDoc(ladderQuotes, { settlement: SETTLEMENT, interpolation: 'monotone-convex' }));
    const curve = build.curve!;
    const cal = businessCalendar('us-gov-securities');
    if (!cal.ok) throw new Error(cal.message);
    const calendar = cal.calendar;
    // A period from Thursday 2027-01-14 to Wednesday 2027-04-14: MLK Day, Presidents' Day and Good Friday inside.
    const start = serialFromIso('2027-01-14');
    const end = serialFromIso('2027-04-14');
    // f_i: the simple ACT/360 forward on the curve from business day i to the next (section d's r_i, n_i, D = 360).
    const fixings = new Map<number, number>();
    let product = 1;
    for (let day = start; day < end; ) {
      let next = day + 1;
      while (next < end && !calendar.isBusinessDay(next)) next++;
      const n = next - day;
      const f = (df(curve, isoFromSerial(day)) / df(curve, isoFromSerial(next)) - 1) * (360 / n);
      fixings.set(day, f);
      product *= 1 + (f * n) / 360;
      day = next;
    }
    const ratio = df(curve, isoFromSerial(start)) / df(curve, isoFromSerial(end));
    // QuantLib overnightindexedcouponpricer.cpp, "telescopic property" (MARKET-CONVENTIONS.md d).
    expectClose(product, ratio, 1e-14, 'DF(S)/DF(E) on the same curve (the telescoping identity; 1e-14: ~60 rounded factors)');
    const compounded = compoundOvernight(fixings, start, end, calendar, 360);
    if (!compounded.ok) throw new Error(compounded.errors[0]!.message);
    // compoundOvernight is the published SOFR averages' arithmetic (test/core/rates/overnightCompounding.test.ts).
    expect(compounded.value.factor).toBe(product);
    expectClose(compounded.value.rate, ((ratio - 1) * 360) / (end - start), 1e-14, 'section d: R = (I_E / I_S - 1) D / d with the curve as the index');
  });
});

describe('OIS schedules on calendars (2006 ISDA Definitions 4.12; MARKET-CONVENTIONS.md b-d)', () => {
  it('an end on a Saturday at a month end rolls back by modified following, forward by following', () => {
    // 2027-07-31 is a Saturday: following gives Monday 2027-08-02 (next month), so modified following gives Friday 2027-07-30.
    const mf = datesOf({ kind: 'ois', maturity: '2027-07-31', rate: 0.04, calendar: 'us-gov-securities' });
    expect(mf.ends.at(-1)).toBe('2027-07-30');
    const f = datesOf({ kind: 'ois', maturity: '2027-07-31', rate: 0.04, calendar: 'us-gov-securities', businessDay: 'following' });
    expect(f.ends.at(-1)).toBe('2027-08-02');
  });

  it('a payment lag counts business days: two after Thursday 2027-03-25 skip Good Friday and the weekend', () => {
    const d = datesOf({ kind: 'ois', maturity: '2027-03-25', rate: 0.04, calendar: 'us-gov-securities', paymentLag: 2 });
    expect(d.ends).toEqual(['2027-03-25']); // one period: a year or shorter (section d, "TERM")
    expect(d.payments).toEqual(['2027-03-30']); // Mon 29 and Tue 30; Good Friday 2027-03-26 closed (SIFMA, a.1)
    const weekendsOnly = datesOf({ kind: 'ois', maturity: '2027-03-25', rate: 0.04, paymentLag: 2 });
    expect(weekendsOnly.payments).toEqual(['2027-03-29']); // on the weekends calendar Good Friday is a business day
  });

  it('periods are generated backward from the end with a short front stub, each date adjusted and none chained', () => {
    const d = datesOf({ kind: 'ois', maturity: '2028-10-15', rate: 0.04, calendar: 'us-gov-securities' });
    expect(d.starts).toEqual(['2026-04-10', '2026-10-15', '2027-10-15']); // first period: a short stub of about 6 months
    expect(d.ends).toEqual(['2026-10-15', '2027-10-15', '2028-10-16']); // 2028-10-15 is a Sunday: modified following
    expect(d.payments).toEqual(d.ends);
  });

  it('a swap of a year or less has one period; a longer one annual periods from the end', () => {
    expect(datesOf({ kind: 'ois', tenor: '1Y', rate: 0.04, ...SOFR_LIKE }).ends).toEqual(['2027-04-14']);
    expect(datesOf({ kind: 'ois', tenor: '9M', rate: 0.04, ...SOFR_LIKE }).ends).toEqual(['2027-01-14']);
    expect(datesOf({ kind: 'ois', tenor: '18M', rate: 0.04, ...SOFR_LIKE }).ends).toEqual(['2026-10-14', '2027-10-14']);
  });
});

describe('OIS input errors name the quote and the field and say what would be valid', () => {
  const at = (raw: RawQuote) => {
    const errors = errorsOf(raw);
    expect(errors).toHaveLength(1);
    return errors[0]!;
  };
  it('an unknown calendar lists the valid names', () => {
    const e = at({ kind: 'ois', tenor: '2Y', rate: 0.04, calendar: 'us-gov' });
    expect(e.path).toBe('quotes[0].calendar');
    expect(e.quote).toBe(0);
    expect(e.message).toMatch(/^quotes\[0\]\.calendar: .*"us-gov" is not known; use one of weekends, us-gov-securities, us-federal-reserve, target, england-wales/);
  });
  it('a negative lag, a lag that is not whole, an unknown business-day rule or overnight basis', () => {
    expect(at({ kind: 'ois', tenor: '2Y', rate: 0.04, spotLag: -1 }).message).toBe('quotes[0].spotLag: must be a whole number of business days from 0 to 30, not -1');
    expect(at({ kind: 'ois', tenor: '2Y', rate: 0.04, paymentLag: 1.5 }).path).toBe('quotes[0].paymentLag');
    expect(at({ kind: 'ois', tenor: '2Y', rate: 0.04, businessDay: 'modified following' }).message).toMatch(/^quotes\[0\]\.businessDay: must be one of following, modified-following, preceding, modified-preceding, unadjusted/);
    expect(at({ kind: 'ois', tenor: '2Y', rate: 0.04, floatDayCount: '30/360' }).message).toMatch(/^quotes\[0\]\.floatDayCount: must be one of ACT\/360, ACT\/365F/);
  });
  it('a maturity after settlement but not after the start (spot lag 2)', () => {
    const e = at({ kind: 'ois', maturity: '2026-04-13', rate: 0.04, ...SOFR_LIKE });
    expect(e.path).toBe('quotes[0].maturity');
    expect(e.message).toMatch(/^quotes\[0\]\.maturity: 2026-04-13 is not after the swap's start 2026-04-14/);
  });
});

describe('risk on an OIS curve reads the floating leg\'s slopes (targetSlopes)', () => {
  // As test/core/analytics/forwardSensitivity.test.ts does for the fixed-flow kinds: for an exact
  // bootstrap (dq/dx from the model-quote formulas) x (dq/dx from the pricing equations)^-1 = I,
  // and analytic forward sensitivities match bumped rebuilds (central 1 bp and 0.5 bp, Richardson)
  // to 1e-6 bp per bp. The pricing equation of a lagged OIS has the floating leg as its target, so
  // both fail if its slopes are wrong.
  const ws = validateWorkspace(workspaceDoc(ladderQuotes, { settlement: SETTLEMENT, interpolation: 'log-linear-discount' })).workspace!;
  const instruments = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false).instruments;
  const settings = { settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation: 'log-linear-discount' as const, extrapolation: 'none' as const };
  const maxAbsDiff = (a: ArrayLike<number>, b: ArrayLike<number>): number => {
    let m = 0;
    for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]! - b[i]!));
    return m;
  };
  it('the two Jacobians of the quotes to the nodes are inverse to 1e-8', () => {
    const curve = bootstrapInstruments(settings, instruments).curve!;
    const n = instruments.length;
    const direct = modelYieldNodeJacobian(curve, instruments);
    const inv = luInverse(luFactor(quoteNodeJacobian(curve, instruments).jacobian, n)!);
    const prod = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) for (let j = 0; j < n; j++) prod[i * n + k] = prod[i * n + k]! + direct[i * n + j]! * inv[j * n + k]!;
    const identity = Float64Array.from({ length: n * n }, (_, k) => (Math.floor(k / n) === k % n ? 1 : 0));
    expect(maxAbsDiff(prod, identity)).toBeLessThanOrEqual(1e-8);
  });
  it('forward sensitivities match bumped rebuilds to 1e-6 bp per bp', () => {
    const curve = bootstrapInstruments(settings, instruments).curve!;
    const rows = forwardRows(curve, { n: 3, unit: 'M' }, { n: 1, unit: 'Y' }, 'simple', 'ACT/365F');
    if (!rows.ok) throw new Error(rows.errors[0]!.message);
    const map = forwardSensitivities(curve, instruments, rows.value, 'simple', 'ACT/365F');
    if (!map.ok) throw new Error(map.errors[0]!.message);
    const b1 = bumpedForwardSensitivities(settings, instruments, rows.value, 'simple', 1);
    const bh = bumpedForwardSensitivities(settings, instruments, rows.value, 'simple', 0.5);
    if (!b1.ok || !bh.ok) throw new Error('bumped rebuild failed');
    const rich = Float64Array.from(b1.value, (v, i) => (4 * bh.value[i]! - v) / 3);
    expect(maxAbsDiff(map.value.values, rich)).toBeLessThanOrEqual(1e-6);
  });
});

describe('the quote check shows an OIS\'s fixed leg with its adjusted dates', () => {
  it('period starts, payment dates two business days after each accrual end, coupons 100 K tau on ACT/360', () => {
    // MARKET-CONVENTIONS.md a.0: show every instrument's dates after adjustment and the calendar used.
    const q = validatedOne({ kind: 'ois', tenor: '2Y', rate: 0.0369, ...SOFR_LIKE });
    const s = quoteSchedule(q, SETTLEMENT, null)!;
    expect(s.rows.map((r) => [r.start, r.end])).toEqual([
      ['2026-04-14', '2027-04-16'],
      ['2027-04-14', '2028-04-19'],
    ]);
    expectClose(s.rows[1]!.yearFraction, 369 / 360, 1e-15, 'ACT/360 from 2027-04-14 to 2028-04-17: 369 days (2028 a leap year)');
    expectClose(s.rows[1]!.cashFlow, 100 * 0.0369 * (369 / 360), 1e-10, '100 K tau per 100 notional');
    expect(s.note).toMatch(/us-gov-securities/);
    expect(s.note).toMatch(/2 business days after its accrual end/);
    expect(s.note).toMatch(/spot, 2 business days after the valuation date; accrual ends moved by modified-following/);
    // Each accrual end before and after the rule: 2028-04-14 is Good Friday (closed for settlement,
    // SIFMA), so modified following moves it to Monday 2028-04-17, still April.
    expect(s.rows.map((r) => [r.unadjustedAccrualEnd, r.accrualEnd])).toEqual([
      ['2027-04-14', '2027-04-14'],
      ['2028-04-14', '2028-04-17'],
    ]);
  });
});

describe('random OIS markets reprice within 1e-14 under every interpolation (the repricing property)', () => {
  // The property of test/core/bootstrap/properties.test.ts (every rate quote within 1e-14, every
  // interpolation) on random OIS ladders: any built-in calendar, spot and payment lags 0 to 2, any
  // business-day rule, fixed leg annual or quarterly on ACT/360 or ACT/365F, any curve day count,
  // settlements 2020-2035, a smooth random curve plus noise (invented test data). Fixed seed.
  const SEED = 20261203;
  const arb = fc.record({
    serial: fc.integer({ min: serialFromIso('2020-01-01'), max: serialFromIso('2035-12-31') }),
    curveDayCount: fc.constantFrom(...CURVE_DAY_COUNTS),
    calendar: fc.constantFrom(...BUILT_IN_CALENDARS, 'us-gov-securities+england-wales'),
    businessDay: fc.constantFrom(...BUSINESS_DAY_RULES),
    spotLag: fc.integer({ min: 0, max: 2 }),
    paymentLag: fc.integer({ min: 0, max: 2 }),
    frequency: fc.constantFrom(1, 4),
    dayCount: fc.constantFrom('ACT/360', 'ACT/365F'),
    eom: fc.boolean(),
    level: fc.double({ min: -0.005, max: 0.07, noNaN: true }),
    slope: fc.double({ min: -0.02, max: 0.03, noNaN: true }),
    tenors: fc.subarray(['1W', '1M', '3M', '6M', '9M', '1Y', '18M', '2Y', '3Y', '5Y', '7Y', '10Y', '15Y', '20Y', '30Y'], { minLength: 1 }),
    noise: fc.array(fc.double({ min: -0.0005, max: 0.0005, noNaN: true }), { minLength: 15, maxLength: 15 }),
  });
  const years = (tenor: string): number => Number.parseInt(tenor, 10) / (tenor.endsWith('Y') ? 1 : tenor.endsWith('M') ? 12 : 52);
  for (const interpolation of INTERPOLATIONS) {
    it(interpolation, () => {
      fc.assert(
        fc.property(arb, (g) => {
          const { level, slope, tenors, noise, curveDayCount, serial, ...conventions } = g;
          const quotes = tenors.map((tenor, i) => ({ kind: 'ois', tenor, rate: level + slope * (1 - Math.exp(-years(tenor) / 3)) + noise[i]!, ...conventions }));
          const build = buildCurve(workspaceDoc(quotes, { settlement: isoFromSerial(serial), dayCount: curveDayCount, interpolation }));
          // monotone-convex-positive refuses a market with a negative discrete forward (by contract).
          if (interpolation === 'monotone-convex-positive' && build.errors.length > 0 && build.errors.every((e) => /needs positive forwards/.test(e.message))) return;
          expect(build.errors).toEqual([]);
          for (const r of build.repricing) expect(Math.abs(r.repricingError), `quotes[${r.index}] ${tenors[r.index]}`).toBeLessThanOrEqual(1e-14);
        }),
        { seed: SEED, numRuns: interpolation === 'cubic-zero' || interpolation.startsWith('monotone') ? 30 : 60, endOnFailure: true },
      );
    }, 120_000);
  }
});

describe('the smooth fit weighs an OIS against its floating leg on the fitted curve', () => {
  it('price errors: the market price reported is 100 x the floating leg on the fitted curve, the model price 100 x the fixed leg', () => {
    // MARKET-CONVENTIONS.md d: the fixed leg sum K tau_i DF(P_i) against the floating leg sum (DF(S_i)/DF(E_i) - 1) DF(P_i).
    const ws = validateWorkspace(workspaceDoc(ladderQuotes, { settlement: SETTLEMENT })).workspace!;
    const fit = fitCurve(ws, { model: 'nelson-siegel', errors: 'price' });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const c = fit.value.curve;
    for (const r of fit.value.residuals) {
      const [tenor, rate] = LADDER[r.index]!;
      const d = datesOf({ kind: 'ois', tenor, rate, ...SOFR_LIKE });
      let float = 0;
      let fixed = 0;
      for (let j = 0; j < d.ends.length; j++) {
        const p = df(c, d.payments[j]!);
        float += (df(c, d.starts[j]!) / df(c, d.ends[j]!) - 1) * p;
        fixed += rate * ((serialFromIso(d.ends[j]!) - serialFromIso(d.starts[j]!)) / 360) * p;
      }
      expectClose(r.marketPrice, 100 * float, 1e-12, `floating leg per 100 on the fitted curve, ${tenor}`);
      expectClose(r.modelPrice, 100 * fixed, 1e-12, `fixed leg per 100 on the fitted curve, ${tenor}`);
      expect(Math.abs(r.residualBp), tenor).toBeLessThan(25);
    }
  });
});
