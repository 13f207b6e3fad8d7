import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  bootstrapInstruments,
  buildCurve,
  businessCalendar,
  compileMarket,
  CURVE_DAY_COUNTS,
  fitCurve,
  forwardRows,
  forwardSensitivities,
  bumpedForwardSensitivities,
  luFactor,
  luInverse,
  modelYieldNodeJacobian,
  parseRow,
  toEngineDocument,
  workbenchFromEngine,
  quoteNodeJacobian,
  compileQuote,
  compoundOvernight,
  INTERPOLATIONS,
  isoFromSerial,
  quoteConvention,
  quoteConventionTag,
  quoteDates,
  quoteSchedule,
  serialFromIso,
  shiftQuote,
  validateWorkspace,
  type FutureQuote,
  type Quote,
} from '../../../src/core/index.ts';
import { futurePeriod, thirdWednesday } from '../../../src/core/time/futurePeriods.ts';
import { workspaceDoc, type Quote as RawQuote } from '../../helpers/markets.ts';

// Futures on an overnight rate (kind `future`). Sources, named at each check:
// - CME Three-Month SOFR futures contract specifications (cmegroup.com, "Three-Month SOFR Futures -
//   Contract Specs"): IMM Index = 100 minus R, R the business-day compounded SOFR over the Reference
//   Quarter, from (and including) the third Wednesday of the third month preceding the delivery
//   month to (and not including) the third Wednesday of the delivery month; min final settle step
//   0.0001. CME Rulebook 46003.A's example (as quoted on elitetrader.com): delivery month March
//   2022, Reference Quarter 2021-12-15 to 2022-03-16. CME's note on the SOFR/Eurodollar spread (as
//   quoted there): SFRU0 (the contract labelled September 2020) compounds SOFR from 2020-09-16 to
//   2020-12-16: a contract is labelled by the month its quarter starts.
// - CME One-Month SOFR futures contract specifications: R = arithmetic average of SOFR during the
//   contract delivery month; min final settle step 0.001; MARKET-CONVENTIONS.md section e: every
//   calendar day counts, a non-business day carrying the preceding business day's rate (the first
//   days of a month can carry the previous month's last fixing).
// - SOFR as published by the Federal Reserve Bank of New York, via FRED (test/fixtures/sofr/SOURCE.md);
//   a weekday marked "." there is a day SOFR was not published.
// - No exchange's published final settlement prices were found with the search tool, so the
//   settlement checks compare the engine with the contract formulas recomputed here from the
//   published fixings (and, for 3M, with compoundOvernight, which reproduces every published SOFR
//   Average 2019-2024), not with settlement prices.
// - The engine contract: every price quote reprices within 1e-11 per 100
//   (test/core/bootstrap/properties.test.ts). Prices in the curve markets below are invented.

const readFixings = (): Map<number, number> => {
  const rows = readFileSync(new URL('../../fixtures/sofr/SOFR.csv', import.meta.url), 'utf8').trim().split('\n').slice(1);
  const out = new Map<number, number>();
  for (const line of rows) {
    const [date, value] = line.split(',');
    if (value !== '.') out.set(serialFromIso(date!), Number(value) / 100);
  }
  return out;
};
const SOFR = readFixings();
const GOVT = (() => {
  const o = businessCalendar('us-gov-securities');
  if (!o.ok) throw new Error(o.message);
  return o.calendar;
})();

const validated = (raw: Record<string, unknown>, settlement: string): FutureQuote => {
  const v = validateWorkspace(workspaceDoc([raw as RawQuote], { settlement }));
  expect(v.errors).toEqual([]);
  return v.workspace!.quotes[0]! as FutureQuote;
};
const errorsOf = (raw: Record<string, unknown>, settlement = '2026-12-01') => validateWorkspace(workspaceDoc([raw as RawQuote], { settlement })).errors;

/**
 * ln DF on the curve's ACT/365F axis of a curve whose overnight forwards are the published
 * fixings: DF at each business day the product of (1 + r_b n_b / 360) from the valuation date, and
 * within a span of non-business days DF(b) / (1 + r_b (d - b) / 360) (the rate of the last business day).
 */
function fixingCurve(valuation: number, until: number, fixings: ReadonlyMap<number, number> = SOFR): (t: number) => number {
  const rate = (b: number): number => {
    const r = fixings.get(b);
    if (r === undefined) throw new Error(`no fixing for ${isoFromSerial(b)}`);
    return r;
  };
  let b = valuation;
  while (!GOVT.isBusinessDay(b)) b--;
  // L: ln DF at business day b, set so that ln DF(valuation) = 0.
  let lnB = Math.log1p((rate(b) * (valuation - b)) / 360);
  const ln = new Map<number, number>();
  for (let d = valuation; d <= until; d++) {
    if (d > b && GOVT.isBusinessDay(d)) {
      lnB -= Math.log1p((rate(b) * (d - b)) / 360);
      b = d;
    }
    ln.set(d, lnB - Math.log1p((rate(b) * (d - b)) / 360));
  }
  return (t: number) => {
    const d = valuation + Math.round(t * 365);
    const v = ln.get(d);
    if (v === undefined) throw new Error(`curve read outside its days: ${isoFromSerial(d)}`);
    return v;
  };
}

describe('reference periods of real contracts (CME SOFR futures contract specifications)', () => {
  it('3M: from the third Wednesday of the contract month to the third Wednesday three months later', () => {
    // CME's note on SFRU0 (September 2020): 2020-09-16 to 2020-12-16.
    expect(futurePeriod('3M', 2020, 9)).toEqual({ start: serialFromIso('2020-09-16'), end: serialFromIso('2020-12-16') });
    // CME Rulebook 46003.A's example, delivery month March 2022: 2021-12-15 to 2022-03-16 (labelled December 2021).
    expect(futurePeriod('3M', 2021, 12)).toEqual({ start: serialFromIso('2021-12-15'), end: serialFromIso('2022-03-16') });
    // MARKET-CONVENTIONS.md section e (CME article): the contract labelled March 2025 runs 2025-03-19 to 2025-06-18.
    expect(futurePeriod('3M', 2025, 3)).toEqual({ start: serialFromIso('2025-03-19'), end: serialFromIso('2025-06-18') });
  });

  it('3M: an IMM date on a holiday is not moved (2024-06-19, Juneteenth, ends March 2024 and starts June 2024)', () => {
    // MARKET-CONVENTIONS.md section e (QuantLib#1994, #1999): the boundary stays on the holiday.
    expect(GOVT.isBusinessDay(serialFromIso('2024-06-19'))).toBe(false);
    const mar = validated({ kind: 'future', month: '2024-03', price: 94.7 }, '2024-03-01');
    expect([mar.start, mar.end, mar.maturity]).toEqual(['2024-03-20', '2024-06-19', '2024-06-19']);
    const jun = validated({ kind: 'future', month: '2024-06', price: 94.8 }, '2024-03-01');
    expect([jun.start, jun.end]).toEqual(['2024-06-19', '2024-09-18']);
    // The dates the curve command prints (kinds/types.ts QuoteDates).
    expect(quoteDates(jun, '2024-03-01')).toEqual({ start: '2024-06-19', end: '2024-09-18', payment: null });
  });

  it('third Wednesdays: the earliest (15th) and latest (21st) a month can have', () => {
    // Calendar facts: 2021-12-01 was a Wednesday (so the 15th), 2022-12-01 a Thursday (so the 21st).
    expect(isoFromSerial(thirdWednesday(2021, 12))).toBe('2021-12-15');
    expect(isoFromSerial(thirdWednesday(2022, 12))).toBe('2022-12-21');
  });

  it('1M: every calendar day of the month; the node at the business day the last day\'s rate runs to', () => {
    const apr = validated({ kind: 'future', contract: '1M', month: '2023-04', price: 95.2 }, '2023-03-01');
    expect([apr.start, apr.end]).toEqual(['2023-04-01', '2023-05-01']);
    expect(apr.maturity).toBe('2023-05-01'); // a Monday, a business day
    // June 2024 ends on Sunday 2024-06-30: the last business day is Friday 06-28, whose rate runs to Monday 07-01.
    const jun = validated({ kind: 'future', contract: '1M', month: '2024-06', price: 94.7 }, '2024-05-01');
    expect(jun.maturity).toBe('2024-07-01');
    // Typed dates instead of a month give the same contract.
    const typed = validated({ kind: 'future', contract: '1M', start: '2024-06-01', end: '2024-07-01', price: 94.7 }, '2024-05-01');
    expect({ ...typed, month: null }).toEqual({ ...jun, month: null });
  });

  it('1M: the quote check lists each day with the fixing it carries (a month starting on a Saturday carries the previous month\'s last)', () => {
    const q = validated({ kind: 'future', contract: '1M', month: '2023-04', price: 95.2 }, '2023-03-01');
    const s = quoteSchedule(q, '2023-03-01', null)!;
    expect(s.rows).toHaveLength(30);
    // 2023-04-01 was a Saturday: it and Sunday carry Friday 2023-03-31's rate.
    expect(s.rows.slice(0, 4).map((r) => [r.start, r.fixingDate])).toEqual([
      ['2023-04-01', '2023-03-31'], ['2023-04-02', '2023-03-31'], ['2023-04-03', '2023-04-03'], ['2023-04-04', '2023-04-04'],
    ]);
    // Good Friday 2023-04-07 (SIFMA close, MARKET-CONVENTIONS.md a.1) carries Thursday's rate, as does the weekend after; Monday its own.
    expect(s.rows.slice(6, 10).map((r) => r.fixingDate)).toEqual(['2023-04-06', '2023-04-06', '2023-04-06', '2023-04-10']);
    expect(s.note).toMatch(/arithmetic average/);
  });
});

describe('final settlement rates recomputed from the published SOFR fixings (formula only; see the header)', () => {
  // 3M contracts that expired within the fixture's years: compounded over the reference quarter.
  const THREE_MONTH: readonly [string, string, string][] = [
    ['2022-12', '2022-12-21', '2023-03-15'],
    ['2023-09', '2023-09-20', '2023-12-20'],
    ['2024-03', '2024-03-20', '2024-06-19'], // ends on Juneteenth: the last fixing (06-18) counts one day
  ];
  for (const [month, start, end] of THREE_MONTH) {
    it(`3M ${month}: the engine's model price on a curve of the fixings is 100 - 100 x compounded SOFR from ${start} to ${end}`, () => {
      const valuation = serialFromIso(start) - 5;
      const q = validated({ kind: 'future', month, price: 95 }, isoFromSerial(valuation));
      expect([q.start, q.end]).toEqual([start, end]);
      const r = compoundOvernight(SOFR, serialFromIso(start), serialFromIso(end), GOVT, 360);
      if (!r.ok) throw new Error(r.errors[0]!.message);
      const ins = compileQuote(q, isoFromSerial(valuation), 'ACT/365F');
      const model = ins.modelQuote(fixingCurve(valuation, serialFromIso(end) + 5));
      expect(Math.abs(model - (100 - 100 * r.value.rate))).toBeLessThanOrEqual(1e-11);
      // The settlement price as the exchange rounds it (0.0001 IMM Index points), printed for a reader to compare.
      expect(Number.isFinite(Math.round(model * 1e4) / 1e4)).toBe(true);
    });
  }

  it('3M June 2024, starting on Juneteenth (a holiday): the first day carries 2024-06-18\'s rate as the exchange compounds it (invented fixings; the fixture ends in August)', () => {
    // compoundOvernight (which reproduces the published SOFR Averages) gives the exchange's rate; the
    // engine reads b0 = 2024-06-18 and b1 = 2024-06-20 off the curve (MARKET-CONVENTIONS.md section e).
    const fixings = new Map<number, number>();
    for (let d = serialFromIso('2024-06-03'); d < serialFromIso('2024-09-30'); d++) if (GOVT.isBusinessDay(d)) fixings.set(d, 0.0531 + 0.0004 * Math.sin(d));
    const valuation = serialFromIso('2024-06-12');
    const q = validated({ kind: 'future', month: '2024-06', price: 95 }, isoFromSerial(valuation));
    const exchange = compoundOvernight(fixings, serialFromIso('2024-06-19'), serialFromIso('2024-09-18'), GOVT, 360);
    if (!exchange.ok) throw new Error(exchange.errors[0]!.message);
    const model = compileQuote(q, isoFromSerial(valuation), 'ACT/365F').modelQuote(fixingCurve(valuation, serialFromIso('2024-09-25'), fixings));
    expect(Math.abs(model - (100 - 100 * exchange.value.rate))).toBeLessThanOrEqual(1e-11);
  });

  // 1M contracts: the average over every calendar day, each carrying the last fixing published on or before it.
  const ONE_MONTH = ['2022-01', '2023-04', '2023-07', '2024-06'];
  // 2022-01-01 a Saturday (New Year's Day on a Saturday: no weekday close, so 2021-12-31's fixing);
  // 2023-04-01 a Saturday; 2023-07-01 a Saturday and 07-04 closed; 2024-06-01 a Saturday and 06-19 closed.
  for (const month of ONE_MONTH) {
    it(`1M ${month}: the engine's model price on a curve of the fixings is 100 - 100 x the calendar-day average of the published record`, () => {
      const [y, m] = month.split('-').map(Number) as [number, number];
      const { start, end } = futurePeriod('1M', y, m);
      // The average from the publication record alone: each day takes the last fixing published on or before it.
      let sum = 0;
      let firstCarried = -1;
      for (let d = start; d < end; d++) {
        let b = d;
        while (!SOFR.has(b)) b--;
        if (d === start) firstCarried = b;
        sum += SOFR.get(b)!;
      }
      const average = sum / (end - start);
      expect(firstCarried).toBeLessThan(start); // every month here starts on a day without its own fixing
      const valuation = firstCarried - 3;
      const q = validated({ kind: 'future', contract: '1M', month, price: 95 }, isoFromSerial(valuation));
      const ins = compileQuote(q, isoFromSerial(valuation), 'ACT/365F');
      const model = ins.modelQuote(fixingCurve(valuation, end + 7));
      expect(Math.abs(model - (100 - 100 * average))).toBeLessThanOrEqual(1e-11);
    });
  }
});

/** A market of futures with two deposits and three OIS (invented prices and rates), valued 2026-12-01. */
const VALUATION = '2026-12-01';
const MARKET: readonly RawQuote[] = [
  { kind: 'deposit', tenor: '1W', rate: 0.0381 },
  { kind: 'deposit', tenor: '2W', rate: 0.0382 },
  { kind: 'future', contract: '1M', month: '2026-12', price: 96.17 },
  { kind: 'future', contract: '1M', month: '2027-01', price: 96.205 },
  { kind: 'future', contract: '1M', month: '2027-02', price: 96.26 },
  { kind: 'future', month: '2027-03', price: 96.38, convexity: 0.2 },
  { kind: 'future', month: '2027-06', price: 96.52, convexity: 0.6 },
  { kind: 'future', month: '2027-09', price: 96.6, convexity: 1.1 },
  { kind: 'future', month: '2027-12', price: 96.63, convexity: 1.8 },
  { kind: 'future', month: '2028-03', price: 96.61, convexity: 2.6 },
  { kind: 'ois', tenor: '2Y', rate: 0.0345 },
  { kind: 'ois', tenor: '3Y', rate: 0.0343 },
  { kind: 'ois', tenor: '5Y', rate: 0.0351 },
];

describe('a curve of futures, deposits and OIS reprices every quote under every interpolation', () => {
  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: futures within 1e-11 per 100 in price, rates within 1e-14`, () => {
      const build = buildCurve(workspaceDoc(MARKET, { settlement: VALUATION, interpolation }));
      expect(build.errors).toEqual([]);
      expect(build.repricing).toHaveLength(MARKET.length);
      for (const r of build.repricing) {
        const bound = r.unit === 'price' ? 1e-11 : 1e-14;
        expect(Math.abs(r.repricingError), `quotes[${r.index}] ${r.kind} ${r.maturity} under ${interpolation}`).toBeLessThanOrEqual(bound);
      }
      // Independently of the instrument: the 3M March 2027 contract's forward, read off the built curve.
      const c = build.curve!;
      const df = (d: string) => Math.exp(c.lnDiscountAt(c.time(d)));
      const fwd = (df('2027-03-17') / df('2027-06-16') - 1) * (360 / 91);
      expect(Math.abs(fwd - ((100 - 96.38) / 100 - 0.2 / 1e4))).toBeLessThanOrEqual(1e-13);
      // The 1M February 2027 contract: the average of the curve's overnight forwards over the month's 28 days.
      let sum = 0;
      for (let d = serialFromIso('2027-02-01'); d < serialFromIso('2027-03-01'); d++) {
        let b = d;
        while (!GOVT.isBusinessDay(b)) b--;
        let n = b + 1;
        while (!GOVT.isBusinessDay(n)) n++;
        sum += (df(isoFromSerial(b)) / df(isoFromSerial(n)) - 1) * (360 / (n - b));
      }
      expect(Math.abs(sum / 28 - (100 - 96.26) / 100)).toBeLessThanOrEqual(1e-13);
    });
  }
});

describe('contracts around Juneteenth 2030 (a Wednesday IMM date, a US government securities holiday)', () => {
  it('reprice under every interpolation: March 2030 ends on it, June 2030 starts on it (invented prices)', () => {
    // 2030-06-19: the third Wednesday of June 2030 (June 1 a Saturday) and Juneteenth (calendar module, SIFMA).
    expect(GOVT.isBusinessDay(serialFromIso('2030-06-19'))).toBe(false);
    const quotes: RawQuote[] = [
      { kind: 'deposit', tenor: '1W', rate: 0.031 },
      { kind: 'future', month: '2030-03', price: 96.9 },
      { kind: 'future', month: '2030-06', price: 96.95, convexity: 0.3 },
      { kind: 'future', month: '2030-09', price: 96.97, convexity: 0.5 },
      { kind: 'ois', tenor: '2Y', rate: 0.0305 },
    ];
    for (const interpolation of INTERPOLATIONS) {
      const b = buildCurve(workspaceDoc(quotes, { settlement: '2030-01-15', interpolation }));
      expect(b.errors, interpolation).toEqual([]);
      for (const r of b.repricing) expect(Math.abs(r.repricingError), `${interpolation} quotes[${r.index}]`).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
      // The June contract read off the built curve by the exchange's rule: the first day carries 2030-06-18's overnight forward.
      const c = b.curve!;
      const df = (d: string) => Math.exp(c.lnDiscountAt(c.time(d)));
      const r0 = (df('2030-06-18') / df('2030-06-20') - 1) * (360 / 2);
      const growth = (1 + r0 / 360) * (df('2030-06-20') / df('2030-09-18'));
      expect(Math.abs((growth - 1) * (360 / 91) - ((100 - 96.95) / 100 - 0.3 / 1e4)), interpolation).toBeLessThanOrEqual(1e-13);
    }
    // The smooth fit weighs each contract by a positive, finite dollar duration (registry contract).
    const ws = validateWorkspace(workspaceDoc(quotes, { settlement: '2030-01-15' })).workspace!;
    const fit = fitCurve(ws, { model: 'nelson-siegel', errors: 'price' });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    for (const r of fit.value.residuals) expect(Number.isFinite(r.residualBp), `quotes[${r.index}]`).toBe(true);
  });
});

describe('convexity, shifts and errors', () => {
  it('tags a futures price with its rate convention: simple ACT/360, compounded over the quarter or averaged over the month', () => {
    // CME SOFR futures contract specifications: 3M business-day compounded, 1M arithmetic average; SOFR is ACT/360.
    const q3 = validated({ kind: 'future', month: '2027-03', price: 96.38 }, VALUATION);
    const q1 = validated({ kind: 'future', contract: '1M', month: '2027-03', price: 96.38 }, VALUATION);
    expect(quoteConventionTag(quoteConvention(q3))).toBe('100 − futures rate (simple, ACT/360, compounded daily over the quarter)');
    expect(quoteConventionTag(quoteConvention(q1))).toBe('100 − futures rate (simple, ACT/360, averaged over the month)');
    expect(quoteSchedule(q3, VALUATION, null)!.dayCount).toBe('ACT/360');
  });

  it('subtracts the convexity adjustment from the futures rate exactly: the forward is (100 - price)/100 - convexity/1e4', () => {
    // MARKET-CONVENTIONS.md section e: CA = futures rate - forward rate, subtracted from the futures rate.
    const doc = (convexity: number) => workspaceDoc([{ kind: 'deposit', tenor: '1W', rate: 0.038 }, { kind: 'future', month: '2027-03', price: 96.38, convexity }], { settlement: VALUATION, interpolation: 'linear-zero' });
    const fwdOf = (convexity: number) => {
      const c = buildCurve(doc(convexity)).curve!;
      return (Math.exp(c.lnDiscountAt(c.time('2027-03-17'))) / Math.exp(c.lnDiscountAt(c.time('2027-06-16'))) - 1) * (360 / 91);
    };
    expect(Math.abs(fwdOf(0) - 0.0362)).toBeLessThanOrEqual(1e-14);
    expect(Math.abs(fwdOf(2.5) - (0.0362 - 0.00025))).toBeLessThanOrEqual(1e-14);
  });

  it('moves the futures rate in a quote-space scenario: +10 bp is the price less 0.1', () => {
    const q = validated({ kind: 'future', month: '2027-03', price: 96.38 }, VALUATION) as Quote;
    const moved = shiftQuote(q, 0.001, VALUATION);
    expect(moved.ok && (moved.value as FutureQuote).price).toBeCloseTo(96.28, 12);
  });

  it('refuses a price above 110, a month that does not parse, both month and dates, and a tenor, naming the field and what is valid', () => {
    const e1 = errorsOf({ kind: 'future', month: '2027-03', price: 112 });
    expect(e1[0]!.path).toBe('quotes[0].price');
    expect(e1[0]!.message).toMatch(/above 0 up to 110.*100 minus the futures rate/);
    const e2 = errorsOf({ kind: 'future', month: '2027-3', price: 96 });
    expect(e2[0]!.path).toBe('quotes[0].month');
    expect(e2[0]!.message).toMatch(/YYYY-MM.*"2027-3"/);
    const e3 = errorsOf({ kind: 'future', month: '2027-13', price: 96 });
    expect(e3[0]!.path).toBe('quotes[0].month');
    const e4 = errorsOf({ kind: 'future', month: '2027-03', start: '2027-03-17', end: '2027-06-16', price: 96 });
    expect(e4[0]!.message).toMatch(/month or start and end, not both/);
    const e5 = errorsOf({ kind: 'future', tenor: '3M', price: 96 });
    expect(e5.map((e) => e.path)).toContain('quotes[0].tenor');
    const e6 = errorsOf({ kind: 'future', contract: '6M', month: '2027-03', price: 96 });
    expect(e6[0]!.message).toMatch(/contract: must be one of 3M, 1M/);
    const e7 = errorsOf({ kind: 'future', start: '2027-06-16', end: '2027-03-17', price: 96 });
    expect(e7[0]!.path).toBe('quotes[0].end');
    const e8 = errorsOf({ kind: 'future', month: '2027-03', price: 96, convexity: 900 });
    expect(e8[0]!.path).toBe('quotes[0].convexity');
  });

  it('refuses a contract already in its period without its fixings, naming it and the missing dates', () => {
    // December 2026's 3M contract started on 2026-12-16; valued 2027-01-05 it is in its period.
    const e = errorsOf({ kind: 'future', month: '2026-12', price: 96.3 }, '2027-01-05');
    expect(e[0]!.path).toBe('quotes[0].month');
    expect(e[0]!.message).toMatch(/3M future 2026-12.*began on 2026-12-16.*needs the overnight fixings so far; give them as fixings, in the workspace's list or on the quote: 2026-12-16, 2026-12-17, 2026-12-18, 2026-12-21 and \d+ more/);
    // A 1M contract whose first day carries a fixing before the valuation date: May 2027 starts on
    // Saturday 2027-05-01, carrying Friday 2027-04-30's rate.
    const e1 = errorsOf({ kind: 'future', contract: '1M', month: '2027-05', price: 96.3 }, '2027-05-01');
    expect(e1[0]!.message).toMatch(/1M future 2027-05.*2027-04-30/);
    // A fixing given for the valuation date itself is not known yet; one on a holiday is refused.
    const e2 = errorsOf({ kind: 'future', contract: '1M', month: '2027-05', price: 96.3, fixings: { '2027-04-30': 0.036, '2027-05-03': 0.036 } }, '2027-05-03');
    expect(e2[0]!.path).toBe('quotes[0].fixings.2027-05-03');
    expect(e2[0]!.message).toMatch(/not known at the valuation date/);
    const e3 = errorsOf({ kind: 'future', month: '2026-12', price: 96.3, fixings: { '2026-12-25': 0.036 } }, '2027-01-05');
    expect(e3[0]!.message).toMatch(/not a business day/);
    // A contract whose every fixing is known has nothing left on the curve.
    const e4 = errorsOf({ kind: 'future', contract: '1M', month: '2026-12', price: 96.3 }, '2027-01-02');
    expect(e4[0]!.message).toMatch(/nothing of it is left on the curve/);
  });

  /** The fixture's fixings from `from` to the day before `to`, as a quote's fixings field. */
  const fixingsBetween = (from: string, to: string): Record<string, number> => {
    const out: Record<string, number> = {};
    for (let d = serialFromIso(from); d < serialFromIso(to); d++) if (SOFR.has(d)) out[isoFromSerial(d)] = SOFR.get(d)!;
    return out;
  };

  it('prices a 3M contract in its period from its fixings so far and the curve after: the whole quarter compounded (SOFR fixings)', () => {
    // March 2024 contract (2024-03-20 to 2024-06-19) valued 2024-05-01: fixings 2024-03-20 to 2024-04-30 given.
    const v = '2024-05-01';
    const q = validated({ kind: 'future', month: '2024-03', price: 95, fixings: fixingsBetween('2024-03-20', v) }, v);
    const full = compoundOvernight(SOFR, serialFromIso('2024-03-20'), serialFromIso('2024-06-19'), GOVT, 360);
    if (!full.ok) throw new Error(full.errors[0]!.message);
    const model = compileQuote(q, v, 'ACT/365F').modelQuote(fixingCurve(serialFromIso(v), serialFromIso('2024-06-25')));
    expect(Math.abs(model - (100 - 100 * full.value.rate))).toBeLessThanOrEqual(1e-11);
  });

  it('prices a 1M contract in its period from its fixings so far (the first carried from May) and the curve after (SOFR fixings)', () => {
    // June 2024, valued Wednesday 2024-06-12: 06-01 and 06-02 carry Friday 2024-05-31's fixing.
    const v = '2024-06-12';
    const q = validated({ kind: 'future', contract: '1M', month: '2024-06', price: 95, fixings: fixingsBetween('2024-05-31', v) }, v);
    let sum = 0;
    for (let d = serialFromIso('2024-06-01'); d < serialFromIso('2024-07-01'); d++) {
      let b = d;
      while (!SOFR.has(b)) b--;
      sum += SOFR.get(b)!;
    }
    const model = compileQuote(q, v, 'ACT/365F').modelQuote(fixingCurve(serialFromIso(v), serialFromIso('2024-07-08')));
    expect(Math.abs(model - (100 - 100 * (sum / 30)))).toBeLessThanOrEqual(1e-11);
  });

  it('builds a curve whose front contracts are in their period (invented fixings) and reprices every quote under every interpolation', () => {
    const v = '2027-04-14';
    const fixings3m: Record<string, number> = {};
    const fixings1m: Record<string, number> = {};
    for (let d = serialFromIso('2027-03-17'); d < serialFromIso(v); d++) {
      if (!GOVT.isBusinessDay(d)) continue;
      fixings3m[isoFromSerial(d)] = 0.0361 + 0.00001 * (d % 7);
      if (d >= serialFromIso('2027-04-01')) fixings1m[isoFromSerial(d)] = fixings3m[isoFromSerial(d)]!;
    }
    const quotes: RawQuote[] = [
      { kind: 'deposit', tenor: '1W', rate: 0.0362 },
      { kind: 'future', contract: '1M', month: '2027-04', price: 96.37, fixings: fixings1m } as unknown as RawQuote,
      { kind: 'future', month: '2027-03', price: 96.375, fixings: fixings3m } as unknown as RawQuote,
      { kind: 'future', month: '2027-06', price: 96.45, convexity: 0.4 },
      { kind: 'ois', tenor: '2Y', rate: 0.0349 },
    ];
    for (const interpolation of INTERPOLATIONS) {
      const b = buildCurve(workspaceDoc(quotes, { settlement: v, interpolation }));
      expect(b.errors, interpolation).toEqual([]);
      for (const r of b.repricing) expect(Math.abs(r.repricingError), `${interpolation} quotes[${r.index}]`).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
    }
  });

  it('refuses two contracts on the same node (a duplicate), naming both', () => {
    const b = buildCurve(workspaceDoc([{ kind: 'future', month: '2027-03', price: 96.38 }, { kind: 'future', month: '2027-03', price: 96.4 }], { settlement: VALUATION }));
    expect(b.errors.length).toBeGreaterThan(0);
    expect(b.errors[0]!.message).toMatch(/2027-06-16/);
  });

  it('refuses overlapping contracts that end on the same node (a 3M and a 1M typed to end with it), naming the contract', () => {
    const b = buildCurve(workspaceDoc([
      { kind: 'deposit', tenor: '1W', rate: 0.038 },
      { kind: 'future', month: '2027-03', price: 96.38 },
      { kind: 'future', contract: '1M', start: '2027-05-16', end: '2027-06-16', price: 96.2 },
    ], { settlement: VALUATION }));
    expect(b.errors.length).toBeGreaterThan(0);
    expect(b.errors.map((e) => e.message).join(' ')).toMatch(/2027-06-16/);
  });
});

// The repricing property on random futures markets (invented data, fixed seed so a failure
// reproduces): deposits, a strip of 1M contracts from the first month not yet fixing, the next
// quarterly 3M contracts with a convexity each, and OIS; every quote within the engine's bounds
// (1e-11 per 100 in price, 1e-14 in rate) and every reported model quote the built curve's own.
const FUTURES_SEED = 20261203;
const futuresMarketArb = fc
  .record({
    serial: fc.integer({ min: serialFromIso('2020-01-01'), max: serialFromIso('2034-12-31') }),
    dayCount: fc.constantFrom(...CURVE_DAY_COUNTS),
    level: fc.double({ min: -0.005, max: 0.07, noNaN: true }),
    slope: fc.double({ min: -0.02, max: 0.03, noNaN: true }),
    deposits: fc.subarray(['1W', '2W', '1M'], { minLength: 1 }),
    monthly: fc.integer({ min: 0, max: 4 }),
    quarterly: fc.integer({ min: 1, max: 8 }),
    ois: fc.subarray(['2Y', '3Y', '5Y', '10Y']),
    noise: fc.array(fc.double({ min: -0.0008, max: 0.0008, noNaN: true }), { minLength: 20, maxLength: 20 }),
  })
  .map((g) => {
    const valuation = isoFromSerial(g.serial);
    const rate = (t: number): number => g.level + g.slope * (1 - Math.exp(-t / 3));
    let k = 0;
    const noise = (): number => g.noise[k++ % g.noise.length]!;
    const quotes: RawQuote[] = [];
    const pillars = new Set<string>();
    const add = (q: RawQuote): void => {
      const v = validateWorkspace(workspaceDoc([q], { settlement: valuation }));
      if (v.errors.length > 0) return; // a contract already in its period
      const m = v.workspace!.quotes[0]!.maturity;
      if (pillars.has(m)) return; // one quote per node
      pillars.add(m);
      quotes.push(q);
    };
    for (const tenor of g.deposits) add({ kind: 'deposit', tenor, rate: rate(0.05) + noise() });
    const [y0, m0] = valuation.split('-').map(Number) as [number, number];
    const monthText = (y: number, m: number) => `${y}-${String(m).padStart(2, '0')}`;
    for (let i = 1; i <= g.monthly; i++) {
      const m = ((m0 - 1 + i) % 12) + 1;
      const y = y0 + Math.floor((m0 - 1 + i) / 12);
      add({ kind: 'future', contract: '1M', month: monthText(y, m), price: 100 - 100 * (rate(i / 12) + noise()) });
    }
    let placed = 0;
    for (let i = 0; placed < g.quarterly && i < 40; i++) {
      const m = ((m0 - 1 + i) % 12) + 1;
      if (m % 3 !== 0) continue;
      const y = y0 + Math.floor((m0 - 1 + i) / 12);
      const before = quotes.length;
      add({ kind: 'future', month: monthText(y, m), price: 100 - 100 * (rate(i / 12 + 0.125) + noise()), convexity: 0.3 * placed * placed });
      if (quotes.length > before) placed++;
    }
    for (const tenor of g.ois) add({ kind: 'ois', tenor, rate: rate(Number.parseInt(tenor, 10)) + noise() });
    return { valuation, dayCount: g.dayCount, quotes };
  });

describe('random futures markets reprice under every interpolation (the repricing property)', () => {
  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: within 1e-11 per 100 (futures) and 1e-14 (rates), each model quote the curve's own bit for bit`, () => {
      fc.assert(
        fc.property(futuresMarketArb, (m) => {
          const doc = { ...workspaceDoc(m.quotes, { settlement: m.valuation, interpolation }), curve: { dayCount: m.dayCount, interpolation, extrapolation: 'none' } };
          const b = buildCurve(doc);
          // monotone-convex-positive refuses a market with a negative discrete forward (by contract).
          if (interpolation === 'monotone-convex-positive' && b.errors.length > 0 && b.errors.every((e) => /needs positive forwards/.test(e.message))) return;
          expect(b.errors).toEqual([]);
          expect(b.repricing).toHaveLength(m.quotes.length);
          for (const r of b.repricing) expect(Math.abs(r.repricingError), `quotes[${r.index}] ${r.kind} ${r.maturity}`).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
          const ws = validateWorkspace(doc).workspace!;
          const market = compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, false);
          const out = bootstrapInstruments({ settlement: ws.settlement, dayCount: ws.curve.dayCount, interpolation, extrapolation: 'none' }, market.instruments);
          if (!out.curve) return;
          market.instruments.forEach((ins, i) => expect(out.repricing[i]!.model, `quotes[${ins.index}] ${ins.kind}`).toBe(ins.modelQuote(out.curve!.lnDiscountAt)));
        }),
        { seed: FUTURES_SEED, numRuns: interpolation === 'cubic-zero' || interpolation.startsWith('monotone') ? 25 : 50, endOnFailure: true },
      );
    }, 120_000);
  }
});

describe('risk and the smooth fit on a futures curve', () => {
  // As test/core/kinds/ois.test.ts does for the lagged OIS: for an exact bootstrap the Jacobian of
  // the model quotes' own yields to the nodes and that of the pricing equations are inverse, and
  // analytic forward sensitivities match bumped rebuilds (central 1 bp and 0.5 bp, Richardson).
  // Both read the futures' targets on the curve (targetSlopes), so both fail if a slope is wrong.
  const ws = validateWorkspace(workspaceDoc(MARKET, { settlement: VALUATION, interpolation: 'log-linear-discount' })).workspace!;
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
    const rows = forwardRows(curve, { n: 1, unit: 'M' }, { n: 3, unit: 'M' }, 'simple', 'ACT/365F');
    if (!rows.ok) throw new Error(rows.errors[0]!.message);
    const map = forwardSensitivities(curve, instruments, rows.value, 'simple', 'ACT/365F');
    if (!map.ok) throw new Error(map.errors[0]!.message);
    const b1 = bumpedForwardSensitivities(settings, instruments, rows.value, 'simple', 1);
    const bh = bumpedForwardSensitivities(settings, instruments, rows.value, 'simple', 0.5);
    if (!b1.ok || !bh.ok) throw new Error('bumped rebuild failed');
    const rich = Float64Array.from(b1.value, (v, i) => (4 * bh.value[i]! - v) / 3);
    expect(maxAbsDiff(map.value.values, rich)).toBeLessThanOrEqual(1e-6);
  });
  it('fits Nelson-Siegel to the futures by yield and by price: finite residuals within 25 bp', () => {
    for (const errors of ['yield', 'price'] as const) {
      const fit = fitCurve(ws, { model: 'nelson-siegel', errors });
      if (!fit.ok) throw new Error(fit.errors[0]!.message);
      for (const r of fit.value.residuals) {
        expect(Number.isFinite(r.residualBp), `${errors} quotes[${r.index}]`).toBe(true);
        expect(Math.abs(r.residualBp), `${errors} quotes[${r.index}]`).toBeLessThan(25);
      }
    }
  });
});

describe('a future in the sheet', () => {
  it('reads the Maturity cell as the month (and 1M for a one-month contract), the Price cell as the price; refuses a rate and a tenor', () => {
    const row = (maturity: string, price: string, rate = '') => ({ id: 'r', enabled: true, kind: 'future', maturity, rate, price, coupon: '', frequency: '', dayCount: '' });
    expect(parseRow(row('2027-03', '96.38'), 'decimal').quote).toEqual({ kind: 'future', month: '2027-03', price: 96.38 });
    expect(parseRow(row('2027-04 1m', '96.4'), 'decimal').quote).toEqual({ kind: 'future', month: '2027-04', contract: '1M', price: 96.4 });
    const tenor = parseRow(row('3M', '96.38'), 'decimal');
    expect(tenor.quote).toBeNull();
    expect(tenor.issues.maturity?.message).toMatch(/contract month: type it as YYYY-MM/);
    const byRate = parseRow(row('2027-03', '', '0.0362'), 'decimal');
    expect(byRate.issues.rate?.message).toMatch(/quoted by its futures price in the Price column/);
  });

  it('opens an engine file of futures in the workbench and writes it back unchanged, a typed convexity in the row\'s Conventions cell', () => {
    const quotes: RawQuote[] = [{ kind: 'future', month: '2027-03', price: 96.38 }, { kind: 'future', contract: '1M', month: '2027-01', price: 96.2 }];
    const wb = workbenchFromEngine(workspaceDoc(quotes, { settlement: VALUATION }), () => 'r');
    expect(wb.ok).toBe(true);
    if (wb.ok) expect(wb.value.quotes.map((r) => r.maturity)).toEqual(['2027-03', '2027-01 1M']);
    const file = workspaceDoc([{ kind: 'future', month: '2027-03', price: 96.38, convexity: 0.5 }, { kind: 'ois', tenor: '2Y', rate: 0.0345 }], { settlement: VALUATION });
    const withConvexity = workbenchFromEngine(file, () => 'r');
    expect(withConvexity.ok).toBe(true);
    if (!withConvexity.ok) return;
    expect(withConvexity.value.quotes[0]!.terms).toBe('convexity 0.5bp');
    // The sheet's reading of that cell is the file's quote: the same adjustment, the same curve.
    const again = buildCurve(toEngineDocument(withConvexity.value).doc);
    expect((again.workspace!.quotes[0] as FutureQuote).convexity).toBe(0.5);
    expect(again.curve!.pillars.map((p) => p.discount)).toEqual(buildCurve(file).curve!.pillars.map((p) => p.discount));
    // A typed adjustment wins over the curve's model; on a row of another kind the engine names the cell.
    const typed = parseRow({ id: 'a', enabled: true, kind: 'future', maturity: '2027-03', rate: '', price: '96.38', coupon: '', frequency: '', dayCount: '', terms: 'convexity 1.25 bp' }, 'percent');
    expect(typed.quote).toMatchObject({ kind: 'future', convexity: 1.25 });
    const wrong = parseRow({ id: 'b', enabled: true, kind: 'future', maturity: '2027-03', rate: '', price: '96.38', coupon: '', frequency: '', dayCount: '', terms: 'convexity half' }, 'percent');
    expect(JSON.stringify(wrong.issues.terms)).toMatch(/convexity takes basis points, such as convexity 0\.5bp/);
  });
});

describe("the workspace's fixings (one list for every contract in its period)", () => {
  // SOFR as published (test/fixtures/sofr, see the header); a version 2 document carries the list at its top level.
  const fixingsFrom = (from: string, to: string): Record<string, number> => {
    const out: Record<string, number> = {};
    for (let d = serialFromIso(from); d < serialFromIso(to); d++) if (SOFR.has(d)) out[isoFromSerial(d)] = SOFR.get(d)!;
    return out;
  };
  const v2 = (quotes: readonly Record<string, unknown>[], valuationDate: string, fixings?: unknown) => ({
    format: 'tenorscope-workspace', version: 2, valuationDate, curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' },
    ...(fixings === undefined ? {} : { fixings }), quotes,
  });

  it('a 3M and a 1M contract in their period read the days they need from it, as if each carried its own (SOFR, valued 2024-06-12)', () => {
    const v = '2024-06-12';
    // March 2024 3M (2024-03-20 to 2024-06-19) and June 2024 1M (its first days carry 2024-05-31's rate); the list runs from January: extra days are ignored.
    const quotes = [{ kind: 'future', month: '2024-03', price: 94.7 }, { kind: 'future', contract: '1M', month: '2024-06', price: 94.68 }, { kind: 'ois', tenor: '1Y', rate: 0.051 }];
    const shared = buildCurve(v2(quotes, v, fixingsFrom('2024-01-02', v)));
    expect(shared.errors).toEqual([]);
    const own = buildCurve(v2([
      { ...quotes[0], fixings: fixingsFrom('2024-03-20', v) },
      { ...quotes[1], fixings: fixingsFrom('2024-05-31', v) },
      quotes[2]!,
    ], v));
    expect(own.errors).toEqual([]);
    expect(shared.curve!.pillars.map((p) => p.discount)).toEqual(own.curve!.pillars.map((p) => p.discount));
    expect(Object.keys((shared.workspace!.quotes[1] as FutureQuote).fixings!)).toEqual(Object.keys(fixingsFrom('2024-05-31', v)));
  });

  it("names the days the workspace's list lacks, warns of fixings on or after the valuation date (kept, not read), and refuses a bad key or rate and the field in a version 1 document", () => {
    const v = '2024-06-12';
    const gap = fixingsFrom('2024-03-20', v);
    delete gap['2024-04-15'];
    const missing = validateWorkspace(v2([{ kind: 'future', month: '2024-03', price: 94.7 }], v, gap)).errors.map((e) => e.message).join('\n');
    expect(missing).toMatch(/the workspace's fixings lack 2024-04-15/);
    const messages = (fixings: unknown) => validateWorkspace(v2([{ kind: 'ois', tenor: '1Y', rate: 0.05 }], v, fixings)).errors.map((e) => `${e.path}: ${e.message}`).join('\n');
    expect(messages({ '2024-06-12': 0.053, '2024-06-13': 0.053 })).toBe('');
    const later = buildCurve(v2([{ kind: 'ois', tenor: '1Y', rate: 0.05 }], v, { '2024-06-11': 0.053, '2024-06-12': 0.053, '2024-06-13': 0.053 }));
    expect(later.errors).toEqual([]);
    expect(later.warnings.map((w) => `${w.path} ${w.code}: ${w.message}`)).toEqual([
      "fixings skipped: fixings on or after the valuation date 2024-06-12 are not read (2 of them, 2024-06-12 to 2024-06-13): a day's rate is published the next business morning, so it is not known then; they stay in the workspace for a later valuation date",
    ]);
    expect(messages({ '12/06/2024': 0.053 })).toMatch(/must be a date YYYY-MM-DD/);
    expect(messages({ '2024-06-11': 5.3 })).toMatch(/fixings\.2024-06-11: must be an overnight rate as a decimal/);
    expect(messages([0.05])).toMatch(/fixings must be an object of dates/);
    const v1 = { ...workspaceDoc([{ kind: 'ois', tenor: '1Y', rate: 0.05 }], { settlement: v }), fixings: {} };
    expect(validateWorkspace(v1).errors.map((e) => e.message).join('\n')).toMatch(/"fixings" is a field of version 2 documents/);
  });
});
