import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../../src/cli/curveCommand.ts';
import {
  bootstrapInstruments,
  bumpedForwardSensitivities,
  compileMarket,
  forwardRows,
  forwardSensitivities,
  luFactor,
  luInverse,
  modelYieldNodeJacobian,
  quoteNodeJacobian,
  buildCurve,
  builtInHolidays,
  compileQuote,
  INTERPOLATIONS,
  isoFromSerial,
  quoteSchedule,
  serialFromIso,
  validateWorkspace,
  type Curve,
  type DepositQuote,
  type Quote,
} from '../../../src/core/index.ts';
import { parseRow } from '../../../src/core/input/quoteRow.ts';
import { readPastedBlock } from '../../../src/core/input/pasteTable.ts';
import { workbenchFromEngine } from '../../../src/core/document/documentBridge.ts';
import { expectClose } from '../../helpers/asserts.ts';
import { workspaceDoc, type Quote as RawQuote } from '../../helpers/markets.ts';

// Overnight (ON), tom-next (TN) and spot-next (SN) deposits. Sources, named at each check:
// - MARKET-CONVENTIONS.md section c (the project's notes of published conventions; glossary
//   definitions cited there): ON from the trade date to the next business day, TN from T+1 to
//   T+2, SN from spot to spot + 1 business day; "a curve whose DF = 1 at the valuation date needs
//   DF(spot) = 1 / ((1 + r_ON tau_ON)(1 + r_TN tau_TN)) from ON and TN quotes"; "over Easter, TN
//   can span 5 calendar days".
// - The calendars' holidays are src/core/time/calendars.ts's (test/core/time/calendars.test.ts
//   holds `target` to the ECB's decisions and `england-wales` to the GOV.UK feed). Easter Sunday
//   2027 is 2027-03-28 (from memory [M]; checked below against the calendar's own Good Friday and
//   Easter Monday, whose Easter date is tested against the date-easter package).
// - Money-market deposit pricing DF(S) / DF(E) = 1 + r tau(S, E) on ACT/360: common practice.
// - The engine contract: every rate quote reprices within 1e-14 (test/core/bootstrap/properties.test.ts).
// Rates are invented test data.

/** Wednesday before Easter 2027 on TARGET: ON Wed -> Thu, TN Thu -> Tue over Good Friday, the weekend and Easter Monday. */
const EASTER_WEDNESDAY = '2027-03-24';

const validatedOne = (raw: RawQuote, settlement: string): Quote => {
  const v = validateWorkspace(workspaceDoc([raw], { settlement }));
  expect(v.errors).toEqual([]);
  return v.workspace!.quotes[0]!;
};
const datesOf = (raw: RawQuote, settlement: string): [string, string] => {
  const q = validatedOne(raw, settlement) as DepositQuote;
  return [q.start, q.maturity];
};
const errorsOf = (raw: RawQuote, settlement = EASTER_WEDNESDAY) => validateWorkspace(workspaceDoc([raw], { settlement })).errors;
const df = (curve: Curve, date: string): number => Math.exp(curve.lnDiscountAt(curve.time(date)));

describe('ON, TN and SN dates (MARKET-CONVENTIONS.md section c)', () => {
  it('over a weekend on the weekends calendar: Friday settlement, ON to Monday, TN Monday to Tuesday, SN (spot lag 2) Tuesday to Wednesday', () => {
    const fri = '2027-03-12'; // a Friday (2027-03-10 is a Wednesday [M], checked by the day counts below)
    expect(datesOf({ kind: 'deposit', tenor: 'ON', rate: 0.03 }, fri)).toEqual(['2027-03-12', '2027-03-15']);
    expect(datesOf({ kind: 'deposit', tenor: 'TN', rate: 0.03 }, fri)).toEqual(['2027-03-15', '2027-03-16']);
    expect(datesOf({ kind: 'deposit', tenor: 'SN', rate: 0.03, spotLag: 2 }, fri)).toEqual(['2027-03-16', '2027-03-17']);
    // SN with the default spot lag 0 is spot = settlement: the ON dates.
    expect(datesOf({ kind: 'deposit', tenor: 's/n', rate: 0.03 }, fri)).toEqual(['2027-03-12', '2027-03-15']);
    // A settlement on a Saturday: ON still ends on the next business day (business days counted from the day itself).
    expect(datesOf({ kind: 'deposit', tenor: 'O/N', rate: 0.03 }, '2027-03-13')).toEqual(['2027-03-13', '2027-03-15']);
  });

  it('over Easter on target and england-wales: TN spans the 5 calendar days Thursday to Tuesday', () => {
    // The calendars' own lists: Good Friday 2027-03-26 and Easter Monday 2027-03-29 closed on both.
    for (const cal of ['target', 'england-wales'] as const) {
      const hol = builtInHolidays(cal, 2027);
      expect(hol, cal).toContain('2027-03-26');
      expect(hol, cal).toContain('2027-03-29');
      expect(datesOf({ kind: 'deposit', tenor: 'ON', rate: 0.03, calendar: cal }, EASTER_WEDNESDAY), cal).toEqual(['2027-03-24', '2027-03-25']);
      expect(datesOf({ kind: 'deposit', tenor: 'TN', rate: 0.03, calendar: cal }, EASTER_WEDNESDAY), cal).toEqual(['2027-03-25', '2027-03-30']);
      expect(datesOf({ kind: 'deposit', tenor: 'SN', rate: 0.03, calendar: cal, spotLag: 2 }, EASTER_WEDNESDAY), cal).toEqual(['2027-03-30', '2027-03-31']);
    }
    // On the weekends calendar the same TN is Thursday to Friday.
    expect(datesOf({ kind: 'deposit', tenor: 'TN', rate: 0.03 }, EASTER_WEDNESDAY)).toEqual(['2027-03-25', '2027-03-26']);
  });

  it('an ordinary tenor counts from spot when spotLag or calendar is given, its end by the business-day rule; without them exactly as before', () => {
    // Spot T+2 from Wednesday 2027-03-24 on target is Tuesday 2027-03-30; 1M is 2027-04-30, a Friday.
    expect(datesOf({ kind: 'deposit', tenor: '1M', rate: 0.03, calendar: 'target', spotLag: 2 }, EASTER_WEDNESDAY)).toEqual(['2027-03-30', '2027-04-30']);
    // Spot-start 2M from Thursday 2027-01-28 (T+2 = Monday 2027-02-01 on weekends): 2027-04-01, a Thursday;
    // 1W from 2027-03-13 (a Saturday, spot lag 0): 2027-03-20, a Saturday, moves by modified following to Monday 22, by preceding to Friday 19 (ISDA 2006 4.12).
    expect(datesOf({ kind: 'deposit', tenor: '1W', rate: 0.03, calendar: 'weekends' }, '2027-03-13')).toEqual(['2027-03-13', '2027-03-22']);
    expect(datesOf({ kind: 'deposit', tenor: '1W', rate: 0.03, calendar: 'weekends', businessDay: 'preceding' }, '2027-03-13')).toEqual(['2027-03-13', '2027-03-19']);
    // Without calendar fields: from settlement, unadjusted (the same Saturday end).
    const plain = validatedOne({ kind: 'deposit', tenor: '1W', rate: 0.03 }, '2027-03-13') as DepositQuote;
    expect([plain.start, plain.maturity, plain.calendar, plain.spotLag, plain.businessDay]).toEqual(['2027-03-13', '2027-03-20', null, null, null]);
  });

  it('spot from a weekend valuation date counts from the date itself: a euro deposit (eur-estr, T+2 on TARGET) valued Saturday 2026-06-20 starts Tuesday 2026-06-23, not the 24th, and its 1M ends Thursday 2026-07-23', () => {
    // The conventions notes, section b pitfall 3 (QuantLib PR#2653 fixing #753): TARGET, Saturday 2026-06-20 + 2 = 2026-06-23.
    expect(datesOf({ kind: 'deposit', tenor: '1M', rate: 0.021, conventions: 'eur-estr' }, '2026-06-20')).toEqual(['2026-06-23', '2026-07-23']);
  });
});

describe('pricing: DF(S) / DF(E) = 1 + r tau; an ON and a TN quote pin DF(spot)', () => {
  const rON = 0.0291;
  const rTN = 0.0294;
  const easterMarket = (interpolation: (typeof INTERPOLATIONS)[number]) =>
    workspaceDoc(
      [
        { kind: 'deposit', tenor: 'ON', rate: rON, calendar: 'target' },
        { kind: 'deposit', tenor: 'TN', rate: rTN, calendar: 'target' },
        { kind: 'deposit', tenor: 'SN', rate: 0.0296, calendar: 'target', spotLag: 2 },
        { kind: 'deposit', tenor: '1W', rate: 0.0298, calendar: 'target', spotLag: 2 },
        { kind: 'deposit', tenor: '1M', rate: 0.0301, calendar: 'target', spotLag: 2 },
        { kind: 'deposit', tenor: '3M', rate: 0.0305, calendar: 'target', spotLag: 2 },
        { kind: 'ois', tenor: '1Y', rate: 0.0297, calendar: 'target', spotLag: 2 },
        { kind: 'ois', tenor: '2Y', rate: 0.0288, calendar: 'target', spotLag: 2 },
      ],
      { settlement: EASTER_WEDNESDAY, interpolation },
    );

  for (const interpolation of INTERPOLATIONS) {
    it(`${interpolation}: DF(spot) = 1 / ((1 + r_ON tau_ON)(1 + r_TN tau_TN)) within 1e-15, every quote within 1e-14 in rate`, () => {
      const build = buildCurve(easterMarket(interpolation));
      expect(build.errors).toEqual([]);
      const c = build.curve!;
      // tau on ACT/360: ON Wed -> Thu 1 day, TN Thu -> Tue over Easter 5 days (section c).
      const spotDf = 1 / ((1 + rON * (1 / 360)) * (1 + rTN * (5 / 360)));
      expectClose(df(c, '2027-03-30'), spotDf, 1e-15, 'MARKET-CONVENTIONS.md c: DF(spot) from ON and TN');
      expectClose(df(c, '2027-03-25'), 1 / (1 + rON / 360), 1e-15, 'DF(ON end) = 1 / (1 + r_ON tau_ON)');
      expect(build.repricing).toHaveLength(8);
      for (const r of build.repricing) {
        expect(Math.abs(r.repricingError), `quotes[${r.index}] under ${interpolation}`).toBeLessThanOrEqual(1e-14);
      }
      // The pricing read off the curve by the formula, independently of the instrument: the 1M deposit from spot.
      expectClose((df(c, '2027-03-30') / df(c, '2027-04-30') - 1) / (31 / 360), 0.0301, 2e-14, 'DF(S)/DF(E) = 1 + r tau, 1M from spot (2e-14: the formula in another order)');
    });
  }

  it('a deposit from settlement without calendar fields is today\'s single flow: DF(E) = 1 / (1 + r tau) in closed form', () => {
    const q = validatedOne({ kind: 'deposit', tenor: '3M', rate: 0.0305 }, EASTER_WEDNESDAY);
    const ins = compileQuote(q, EASTER_WEDNESDAY, 'ACT/365F');
    expect(ins.targetFromFlows).toBeUndefined();
    expect(ins.closedFormLn).toBe(-Math.log1p(0.0305 * (92 / 360)));
  });
});

describe('refusals name the quote, the field and what is valid', () => {
  it('a swap, an OIS and a bond refuse ON/TN/SN in the document', () => {
    const e = errorsOf({ kind: 'swap', tenor: 'ON', rate: 0.03 });
    expect(e).toHaveLength(1);
    expect(e[0]!.path).toBe('quotes[0].tenor');
    expect(e[0]!.message).toBe('quotes[0].tenor: "ON" (overnight) is a tenor of deposit quotes only; a swap takes a tenor nD, nW, nM or nY with n >= 1 (such as "3M") or a maturity date');
    expect(errorsOf({ kind: 'ois', tenor: 'T/N', rate: 0.03 })[0]!.message).toMatch(/^quotes\[0\]\.tenor: "T\/N" \(tom-next\) is a tenor of deposit quotes only; a ois takes/);
    expect(errorsOf({ kind: 'zero', tenor: 'sn', rate: 0.03 })[0]!.path).toBe('quotes[0].tenor');
  });

  it('the sheet refuses ON for a swap row in its maturity cell and takes it for a deposit row', () => {
    const row = { id: 'r', enabled: true, kind: 'swap', maturity: 'O/N', rate: '3.1', price: '', coupon: '', frequency: '', dayCount: '' };
    const p = parseRow(row, 'percent');
    expect(p.quote).toBeNull();
    expect(p.issues.maturity?.message).toBe('ON (overnight) is a deposit tenor; a swap takes a tenor such as 1M or 5Y, or a date');
    const d = parseRow({ ...row, kind: 'deposit' }, 'percent');
    expect(d.issues).toEqual({});
    expect(d.quote).toEqual({ kind: 'deposit', tenor: 'ON', rate: 0.031 });
  });

  it('an unknown calendar, a business-day rule on ON, or a business-day rule without a calendar', () => {
    expect(errorsOf({ kind: 'deposit', tenor: 'ON', rate: 0.03, calendar: 'mars' })[0]!.path).toBe('quotes[0].calendar');
    expect(errorsOf({ kind: 'deposit', tenor: 'ON', rate: 0.03, calendar: 'mars' })[0]!.message).toMatch(/weekends.*target/);
    expect(errorsOf({ kind: 'deposit', tenor: 'ON', rate: 0.03, businessDay: 'following' })[0]!.message).toBe('quotes[0].businessDay: ON counts business days on the calendar, so no business-day rule applies; remove businessDay');
    expect(errorsOf({ kind: 'deposit', tenor: '3M', rate: 0.03, businessDay: 'following' })[0]!.path).toBe('quotes[0].businessDay');
    expect(errorsOf({ kind: 'deposit', tenor: 'SN', rate: 0.03, spotLag: -1 })[0]!.path).toBe('quotes[0].spotLag');
  });
});

describe('end to end: paste, quote check, command line', () => {
  it('a pasted block reads O/N, T/N and S/N in the maturity column of deposit rows', () => {
    const block = readPastedBlock('Type\tTenor\tRate\nDeposit\tO/N\t2.91\nDeposit\tT/N\t2.94\nDeposit\tS/N\t2.96\n');
    expect(block.rows.map((r) => r.maturity)).toEqual(['O/N', 'T/N', 'S/N']);
    const tenors = block.rows.map((r) => parseRow({ ...r, id: 'r', enabled: true }, 'percent').quote?.tenor);
    expect(tenors).toEqual(['ON', 'TN', 'SN']);
  });

  it('a workspace file opens in the workbench when its ON deposit is on the weekends calendar, and with "calendar target" in its Conventions cell when on TARGET', () => {
    const weekends = workbenchFromEngine(workspaceDoc([{ kind: 'deposit', tenor: 'O/N', rate: 0.03, calendar: 'weekends' }], { settlement: EASTER_WEDNESDAY }), () => 'r');
    expect(weekends.ok).toBe(true);
    if (weekends.ok) expect(weekends.value.quotes[0]!.maturity).toBe('O/N'); // the cell keeps the text as the file gave it
    const target = workbenchFromEngine(workspaceDoc([{ kind: 'deposit', tenor: 'TN', rate: 0.03, calendar: 'target' }], { settlement: EASTER_WEDNESDAY }), () => 'r');
    if (!target.ok) throw new Error(JSON.stringify(target.errors));
    expect(target.value.quotes[0]!.terms).toBe('calendar target');
  });

  it('the quote check shows a TN deposit from its start to its end, 100 (1 + r tau) at the end', () => {
    const q = validatedOne({ kind: 'deposit', tenor: 'TN', rate: 0.0294, calendar: 'target' }, EASTER_WEDNESDAY);
    const s = quoteSchedule(q, EASTER_WEDNESDAY, null)!;
    expect(s.rows).toHaveLength(1);
    expect([s.rows[0]!.start, s.rows[0]!.end]).toEqual(['2027-03-25', '2027-03-30']);
    expectClose(s.rows[0]!.yearFraction, 5 / 360, 0, 'ACT/360 over Easter');
    expectClose(s.rows[0]!.cashFlow, 100 * (1 + 0.0294 * (5 / 360)), 1e-10, 'cash flow per 100 to 1e-10 (rounded for display)');
    expect(s.note).toMatch(/2027-03-25.*2027-03-30.*target calendar/);
  });

  it('the curve command builds a document with ON/TN/SN deposits; each quote\'s maturity is its end date', async () => {
    const doc = workspaceDoc(
      [
        { kind: 'deposit', tenor: 'ON', rate: 0.0291, calendar: 'target' },
        { kind: 'deposit', tenor: 'TN', rate: 0.0294, calendar: 'target' },
        { kind: 'deposit', tenor: 'SN', rate: 0.0296, calendar: 'target', spotLag: 2 },
        { kind: 'ois', tenor: '1Y', rate: 0.0297, calendar: 'target', spotLag: 2 },
      ],
      { settlement: EASTER_WEDNESDAY },
    );
    const r = await runCurveCommand(['-'], () => JSON.stringify(doc));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const o = JSON.parse(r.stdout) as { quotes: { maturity: string; repricingError: number }[] };
    expect(o.quotes.map((q) => q.maturity).slice(0, 3)).toEqual(['2027-03-25', '2027-03-30', '2027-03-31']);
    for (const q of o.quotes) expect(Math.abs(q.repricingError)).toBeLessThanOrEqual(1e-14);
  });
});

describe('the repricing property on random ON/TN/SN markets (engine contract: 1e-14 in rate)', () => {
  // Random settlements 2020-2035 on each built-in calendar (so weekends, Easter and year ends
  // fall inside ON and TN at random), ON + TN + SN (spot lag 2) + spot-starting deposits and OIS
  // on the same calendar, invented rates. Every quote must reprice within 1e-14 under every
  // interpolation, DF(spot) must equal 1/((1 + r_ON tau_ON)(1 + r_TN tau_TN)) within 1e-15 (spot
  // lag 2 makes the TN end the spot date), and the repricing reported must be the built curve's
  // own bit for bit (modelQuote on curve.lnDiscountAt), as for every other kind.
  const CALENDARS = ['weekends', 'us-gov-securities', 'us-federal-reserve', 'target', 'england-wales'] as const;
  const marketArb = fc.record({
    serial: fc.integer({ min: serialFromIso('2020-01-01'), max: serialFromIso('2035-12-31') }),
    calendar: fc.constantFrom(...CALENDARS),
    // Rates in tenths of a basis point (no subnormal doubles, whose signed zeros the bit-for-bit check would compare).
    level: fc.integer({ min: -50, max: 800 }).map((n) => n / 10_000),
    step: fc.array(fc.integer({ min: -400, max: 400 }).map((n) => n / 100_000), { minLength: 8, maxLength: 8 }),
    longer: fc.subarray(['1W', '1M', '3M', '6M'], { minLength: 0 }),
    ois: fc.subarray(['1Y', '2Y', '5Y'], { minLength: 0 }),
  });
  type Generated = typeof marketArb extends fc.Arbitrary<infer G> ? G : never;
  const docOf = (g: Generated, interpolation: (typeof INTERPOLATIONS)[number]) => {
    const calendar: string = g.calendar;
    const r = (i: number): number => g.level + g.step[i]!;
    const quotes: RawQuote[] = [
      { kind: 'deposit', tenor: 'ON', rate: r(0), calendar },
      { kind: 'deposit', tenor: 'TN', rate: r(1), calendar },
      { kind: 'deposit', tenor: 'SN', rate: r(2), calendar, spotLag: 2 },
      ...g.longer.map((tenor, i) => ({ kind: 'deposit', tenor, rate: r(3 + i), calendar, spotLag: 2 })),
      ...g.ois.map((tenor, i) => ({ kind: 'ois', tenor, rate: r(7) + 0.001 * i, calendar, spotLag: 2 })),
    ];
    return workspaceDoc(quotes, { settlement: isoFromSerial(g.serial), interpolation });
  };

  for (const interpolation of INTERPOLATIONS) {
    it(interpolation, () => {
      fc.assert(
        fc.property(marketArb, (g) => {
          const doc = docOf(g, interpolation);
          const b = buildCurve(doc);
          // monotone-convex-positive refuses a market with a negative discrete forward (by contract).
          if (interpolation === 'monotone-convex-positive' && b.errors.length > 0 && b.errors.every((e) => /needs positive forwards/.test(e.message))) return;
          expect(b.errors).toEqual([]);
          for (const r of b.repricing) expect(Math.abs(r.repricingError), `quotes[${r.index}] ${r.kind} on ${g.calendar} from ${doc.settlement}`).toBeLessThanOrEqual(1e-14);
          const quotes = b.workspace!.quotes as DepositQuote[];
          const [on, tn] = [quotes[0]!, quotes[1]!];
          const tau = (q: DepositQuote): number => (serialFromIso(q.maturity) - serialFromIso(q.start)) / 360;
          expectClose(df(b.curve!, tn.maturity), 1 / ((1 + on.rate * tau(on)) * (1 + tn.rate * tau(tn))), 1e-15, 'MARKET-CONVENTIONS.md c: DF(spot) from ON and TN');
          b.instruments.forEach((ins, i) => expect(b.repricing[i]!.model, `quotes[${ins.index}]`).toBe(ins.modelQuote(b.curve!.lnDiscountAt)));
        }),
        { seed: 20261202, numRuns: interpolation === 'cubic-zero' || interpolation.startsWith('monotone') ? 30 : 60, endOnFailure: true },
      );
    }, 120_000);
  }
});

describe('risk on a curve with TN and SN deposits reads their target DF(S) (targetSlopes)', () => {
  // As test/core/kinds/ois.test.ts does for the lagged OIS (and forwardSensitivity.test.ts for the
  // fixed-flow kinds): (dq/dx from the model-quote formulas) x (dq/dx from the pricing equations)^-1
  // = I to 1e-8, and analytic forward sensitivities match bumped rebuilds (1 bp and 0.5 bp,
  // Richardson) to 1e-6 bp per bp. A forward deposit's pricing equation has DF(S) as its target,
  // so both fail if its slopes are wrong.
  const quotes: RawQuote[] = [
    { kind: 'deposit', tenor: 'ON', rate: 0.0291, calendar: 'target' },
    { kind: 'deposit', tenor: 'TN', rate: 0.0294, calendar: 'target' },
    { kind: 'deposit', tenor: 'SN', rate: 0.0296, calendar: 'target', spotLag: 2 },
    { kind: 'deposit', tenor: '3M', rate: 0.0305, calendar: 'target', spotLag: 2 },
    { kind: 'ois', tenor: '1Y', rate: 0.0297, calendar: 'target', spotLag: 2 },
    { kind: 'ois', tenor: '3Y', rate: 0.0288, calendar: 'target', spotLag: 2 },
  ];
  const ws = validateWorkspace(workspaceDoc(quotes, { settlement: EASTER_WEDNESDAY, interpolation: 'log-linear-discount' })).workspace!;
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

describe('a deposit tenor on a calendar shows its end before and after the rule', () => {
  it('€STR 1M from Tuesday 2027-05-25: spot Thursday 2027-05-27 (T+2 on TARGET), 1M ends Sunday 2027-06-27, modified following moves it to Monday 2027-06-28', () => {
    // Conventions: MARKET-CONVENTIONS.md c (euro deposits T+2 on TARGET); the rule: 2006 ISDA Definitions 4.12 (modified following).
    const v = validateWorkspace({ format: 'tenorscope-workspace', version: 2, valuationDate: '2027-05-25', quotes: [{ kind: 'deposit', tenor: '1M', rate: 0.021, conventions: 'eur-estr' }] });
    const q = v.workspace!.quotes[0]!;
    const s = quoteSchedule(q, '2027-05-25', null)!;
    expect(s.rows.map((r) => [r.start, r.unadjustedAccrualEnd, r.accrualEnd, r.end])).toEqual([['2027-05-27', '2027-06-27', '2027-06-28', '2027-06-28']]);
    expect(s.note).toMatch(/on the target calendar, spot 2 business days after settlement, its end moved by modified-following/);
  });
});
