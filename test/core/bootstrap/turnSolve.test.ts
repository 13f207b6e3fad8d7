import { describe, expect, it } from 'vitest';
import { buildCurve, INTERPOLATIONS, OVERNIGHT_KIT, validateWorkspace, type CurveBuild } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// A turn whose spread is solved from a quote that spans it (turns[i].solveFrom, bootstrap/turnSolve.ts).
// Sources, named at each check:
// - The turn model of MARKET-CONVENTIONS.md section h: DF(t) = DF_smooth(t) x exp(-s d / 360) after
//   the turn, d its calendar days, "estimate s from an instrument spanning the turn (a 1M or SN
//   deposit, a futures contract or dated OIS over year end)" (Ametrano & Bianchetti 2013, section 4.8,
//   as quoted there): every forward period holding a turn day rises, no other.
// - A deposit's value: 1 + r tau against 1, tau = days / 360 (ACT/360 money market).
// - Log-linear discount factors between nodes (flat continuous forward between pillars).
// - The engine contract: every quote reprices within 1e-14 in rate, 1e-11 per 100 for a price
//   (test/core/bootstrap/properties.test.ts).
// Rates are invented test data; the hand calculations are written out below.

const VALUATION = '2022-12-15';
/** Year end 2022 on the weekends-only calendar: Friday 2022-12-30's overnight period runs to Monday 2023-01-02, 3 days. */
const TURN_DAYS = 3;
const F = 0.04; // flat continuous forward (ACT/365F)
const S_TRUE = 25 / 1e4; // the spread the quotes are made with (25 bp)

const yf = (days: number) => days / 365; // ACT/365F curve time
/** A deposit rate (simple ACT/360) from a continuously compounded ln growth over its days. */
const depositRate = (lnGrowth: number, days: number) => (Math.expm1(lnGrowth) * 360) / days;

// 1W to 2022-12-22 (7 days), 1M to 2023-01-17 (33 days, over the turn), 3M to 2023-03-15 (90 days, over the turn).
const R1W = depositRate(F * yf(7), 7);
const R1M = depositRate(F * yf(33) + (S_TRUE * TURN_DAYS) / 360, 33);
const R3M = depositRate(F * yf(90) + (S_TRUE * TURN_DAYS) / 360, 90);
const R3M_NO_TURN = depositRate(F * yf(90), 90);

const YEAR_END = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends' };

function doc(quotes: readonly object[], turns: readonly object[] | undefined, interpolation = 'log-linear-discount', extra: Record<string, unknown> = {}): Record<string, unknown> {
  return { format: 'tenorscope-workspace', version: 2, valuationDate: VALUATION, curve: { dayCount: 'ACT/365F', interpolation }, quotes, ...(turns ? { turns } : {}), ...extra };
}
const deposits = (r3m = R3M) => [
  { kind: 'deposit', maturity: '2022-12-22', rate: R1W },
  { kind: 'deposit', maturity: '2023-01-17', rate: R1M },
  { kind: 'deposit', maturity: '2023-03-15', rate: r3m },
];

const build = (d: unknown): CurveBuild => buildCurve(d, { overnight: OVERNIGHT_KIT });
function built(d: unknown): CurveBuild {
  const b = build(d);
  expect(b.errors).toEqual([]);
  expect(b.curve).not.toBeNull();
  return b;
}

/** Every quote, the spanning one too, repriced on the built curve by its own instrument and in the build's own rows. */
function expectReprices(b: CurveBuild, source: string): void {
  expect(b.repricing.map((r) => r.index)).toEqual(b.instruments.map((i) => i.index).sort((x, y) => x - y));
  for (const ins of b.instruments) {
    const tol = ins.unit === 'price' ? 1e-11 : 1e-14;
    expectClose(ins.modelQuote(b.curve!.lnDiscountAt), ins.market, tol, `${source}: quotes[${ins.index}] (${ins.kind} ${ins.maturity}) reprices on the built curve`);
  }
  for (const r of b.repricing) expectClose(r.repricingError, 0, r.unit === 'price' ? 1e-11 : 1e-14, `${source}: the build's repricing row of quotes[${r.index}]`);
}

/** Simple ACT/360 forward between two dates read off a curve. */
function forward(b: CurveBuild, from: string, to: string, days: number): number {
  const c = b.curve!;
  return (Math.expm1(c.lnDiscountAt(c.time(from)) - c.lnDiscountAt(c.time(to))) * 360) / days;
}

describe('a turn solved from a deposit that spans it (log-linear discount)', () => {
  const solved = () => built(doc(deposits(), [{ ...YEAR_END, solveFrom: 1 }]));

  it('the solved spread equals the hand calculation from the three deposits', () => {
    // Hand calculation. Nodes at 1W (t1) and 3M (t3); the 1M deposit (tM) is no node, so on the
    // smooth curve ln DF(tM) = ln DF(t1) + w (ln DF(t3) - ln DF(t1)), w = (tM - t1) / (t3 - t1) = 26/83.
    // With L = ln(1 + r tau) of each deposit and J = -s d / 360 after the turn (section h):
    //   ln DF_s(t1) = -L1,  ln DF_s(t3) = -L3 + s d/360,  ln DF_s(tM) - s d/360 = -LM
    // so s = (LM - L1 - w (L3 - L1)) x 360 / (d (1 - w)).
    const L1 = Math.log1p((R1W * 7) / 360);
    const LM = Math.log1p((R1M * 33) / 360);
    const L3 = Math.log1p((R3M * 90) / 360);
    const w = 26 / 83;
    const hand = ((LM - L1 - w * (L3 - L1)) * 360) / (TURN_DAYS * (1 - w));
    const span = solved().overnight!.turns[0]!;
    expect([span.start, span.end, span.days, span.solveFrom]).toEqual(['2022-12-30', '2023-01-02', TURN_DAYS, 1]);
    expectClose(span.spread, hand, 1e-13, 'hand calculation: the spread that makes the 1M period\'s forward meet the 1M deposit');
    // The quotes were made from a flat 4% forward and a 25 bp turn: the same spread comes back.
    expectClose(span.spread, S_TRUE, 1e-12, 'the 25 bp the invented quotes were made with');
    expectClose(span.lnJump, (-span.spread * TURN_DAYS) / 360, 1e-18, 'section h: J = exp(-s d / 360)');
  });

  it('every quote, the 1M deposit that sets the spread too, reprices to 1e-14; the 1M deposit is no pillar', () => {
    const b = solved();
    expectReprices(b, 'solved turn');
    expect(b.curve!.pillars.map((p) => p.quote)).toEqual([0, 2]);
  });

  it('forwards of periods without a turn day are those of the curve with no turn, to 1e-15; the period over the turn rises by the spread\'s share', () => {
    const b = solved();
    // The same market without the turn: 1W and 3M made from the flat 4% forward alone.
    const plain = built(doc([deposits(R3M_NO_TURN)[0]!, deposits(R3M_NO_TURN)[2]!], undefined));
    const periods: [string, string, number][] = [
      [VALUATION, '2022-12-22', 7],
      ['2022-12-22', '2022-12-29', 7],
      ['2022-12-16', '2022-12-30', 14],
      ['2023-01-02', '2023-01-17', 15],
      ['2023-01-05', '2023-03-15', 69],
      ['2023-02-01', '2023-03-01', 28],
    ];
    for (const [a, z, days] of periods) expectClose(forward(b, a, z, days), forward(plain, a, z, days), 1e-15, `section h: no turn day from ${a} to ${z}, so no rise`);
    // 2022-12-29 to 2023-01-05 (7 days) holds the 3 turn days: growth times exp(s 3/360) (section h).
    const lnPlain = Math.log1p((forward(plain, '2022-12-29', '2023-01-05', 7) * 7) / 360);
    const expected = (Math.expm1(lnPlain + (b.overnight!.turns[0]!.spread * TURN_DAYS) / 360) * 360) / 7;
    expectClose(forward(b, '2022-12-29', '2023-01-05', 7), expected, 1e-15, 'section h: the period over the turn rises by exp(s d/360)');
    expect(forward(b, '2022-12-29', '2023-01-05', 7) - forward(plain, '2022-12-29', '2023-01-05', 7)).toBeGreaterThan(1e-4);
  });

  it('is the curve of the same spread set by hand, with the 1M deposit left out, bit for bit on its nodes', () => {
    const b = solved();
    const spreadBp = b.overnight!.turns[0]!.spread * 1e4;
    const byHand = built(doc([deposits()[0]!, deposits()[2]!], [{ ...YEAR_END, spreadBp }]));
    for (const d of ['2022-12-22', '2023-01-17', '2023-02-10', '2023-03-15']) {
      const c = b.curve!;
      expectClose(c.lnDiscountAt(c.time(d)), byHand.curve!.lnDiscountAt(c.time(d)), 1e-17, `the solved curve is the hand-set one at ${d}`);
    }
  });
});

describe('repricing with a solved turn under every method', () => {
  // The spanning quote's value is made so that a 10 bp turn reprices it: the curve of the other
  // quotes with the turn set by hand at 10 bp, read by the spanning quote's own instrument. The
  // solve must then give 10 bp back, and every quote reprice.
  const OIS = { calendar: 'us-gov-securities', spotLag: 0, paymentLag: 0 };
  const TURN = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'us-gov-securities' };
  function withSpanningValue(d: Record<string, unknown>, j: number): Record<string, unknown> {
    const quotes = d.quotes as Record<string, unknown>[];
    // The spanning quote's instrument (compiled the same with or without steps; without them its
    // meeting period may hold two quotes).
    const { meetingSteps: _steps, ...plain } = d;
    const all = built({ ...plain, turns: [{ ...TURN, spreadBp: 10 }] });
    const others = built({ ...d, quotes: quotes.map((q, i) => (i === j ? { ...q, enabled: false } : q)), turns: [{ ...TURN, spreadBp: 10 }] });
    const ins = all.instruments.find((x) => x.index === j)!;
    const value = ins.modelQuote(others.curve!.lnDiscountAt);
    return { ...d, quotes: quotes.map((q, i) => (i === j ? { ...q, [ins.field]: value } : q)), turns: [{ ...TURN, solveFrom: j }] };
  }
  const market = (valuation: string, method: string, quotes: readonly object[], extra: Record<string, unknown> = {}) => ({ format: 'tenorscope-workspace', version: 2, valuationDate: valuation, curve: { dayCount: 'ACT/365F', interpolation: method }, quotes, ...extra });
  // A SOFR-style ladder over year end 2022 (invented rates), valued 2022-03-01; quotes[3] spans the turn.
  const LADDER = [
    { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
    { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
    { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
    { kind: 'ois', maturity: '2023-01-17', rate: 0.019, ...OIS },
    { kind: 'deposit', maturity: '2023-02-01', rate: 0.0195 },
    { kind: 'ois', tenor: '1Y', rate: 0.021, ...OIS },
    { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
    { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
  ];

  for (const method of INTERPOLATIONS) {
    it(`the OIS over year end sets the turn, 10 bp comes back, and every quote reprices to 1e-14 (${method})`, () => {
      const b = built(withSpanningValue(market('2022-03-01', method, LADDER), 3));
      expectReprices(b, `solved turn, ${method}`);
      const s = b.overnight!.turns[0]!;
      expect([s.start, s.end, s.days]).toEqual(['2022-12-30', '2023-01-03', 4]); // SIFMA: 2023-01-02 closed (section a.1)
      expectClose(s.spread * 1e4, 10, 1e-9, `the 10 bp the OIS quote was made with (${method})`);
    });
  }

  for (const method of ['log-linear-discount', 'monotone-convex']) {
    it(`two turns, quarter end and year end, each solved from its own quote: 5 and 10 bp come back and every quote reprices (${method})`, () => {
      // A deposit to 2022-10-14 spans quarter end 2022-09-30 (a Friday: 3 days); the OIS to 2023-01-17 spans year end.
      const quotes = [...LADDER.slice(0, 2), { kind: 'deposit', maturity: '2022-10-14', rate: 0.01 }, ...LADDER.slice(2)];
      const quarter = { name: 'quarter end', from: '2022-09-30', to: '2022-09-30', calendar: 'us-gov-securities' };
      const given = [{ ...quarter, spreadBp: 5 }, { ...TURN, spreadBp: 10 }];
      const d = market('2022-03-01', method, quotes);
      const all = built({ ...d, turns: given });
      const others = built({ ...d, quotes: quotes.map((q, i) => (i === 2 || i === 4 ? { ...q, enabled: false } : q)), turns: given });
      const valued = quotes.map((q, i) => {
        if (i !== 2 && i !== 4) return q;
        const ins = all.instruments.find((x) => x.index === i)!;
        return { ...q, [ins.field]: ins.modelQuote(others.curve!.lnDiscountAt) };
      });
      const b = built({ ...d, quotes: valued, turns: [{ ...quarter, solveFrom: 2 }, { ...TURN, solveFrom: 4 }] });
      expectReprices(b, `two solved turns, ${method}`);
      expectClose(b.overnight!.turns[0]!.spread * 1e4, 5, 1e-9, 'quarter end: the 5 bp the deposit was made with');
      expectClose(b.overnight!.turns[1]!.spread * 1e4, 10, 1e-9, 'year end: the 10 bp the OIS was made with');
    });
  }

  it('with meeting steps on too: the spanning quote is no node of its meeting period, and every quote reprices', () => {
    const steps = { meetingSteps: { on: true, effectiveDates: ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'] } };
    const quotes = [
      { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
      { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
      { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
      { kind: 'deposit', maturity: '2023-01-17', rate: 0.02 },
      { kind: 'deposit', maturity: '2023-03-01', rate: 0.025 },
      { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
      { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
    ];
    // Without the turn, 2023-01-17 and 2023-03-01 both end in the period from 2022-12-15 to 2023-07-27;
    // solved from the first, only the second is a node there.
    const b = built(withSpanningValue(market('2022-03-01', 'monotone-convex', quotes, steps), 3));
    expectReprices(b, 'solved turn with steps');
    expect(b.curve!.interpolation).toBe('log-linear-discount');
    expectClose(b.overnight!.turns[0]!.spread * 1e4, 10, 1e-9, 'the 10 bp the deposit was made with, steps on');
  });

  for (const method of INTERPOLATIONS) {
    it(`a one-month future over year end sets the spread and reprices to 1e-11 per 100 (${method})`, () => {
      const quotes = [
        { kind: 'deposit', maturity: '2022-12-08', rate: 0.0375 },
        { kind: 'future', contract: '1M', month: '2022-12', price: 96.18, calendar: 'us-gov-securities' },
        { kind: 'deposit', maturity: '2023-02-01', rate: 0.0395 },
        { kind: 'ois', tenor: '1Y', rate: 0.045, ...OIS },
      ];
      const b = built(withSpanningValue(market('2022-12-01', method, quotes), 1));
      expect(b.instruments.find((x) => x.index === 1)!.unit).toBe('price');
      expectReprices(b, `future sets the turn, ${method}`);
      expectClose(b.overnight!.turns[0]!.spread * 1e4, 10, 1e-7, `the 10 bp the future's price was made with (${method})`);
    });
  }
});

describe('a solved turn: errors naming the turn and the quote', () => {
  it('a quote whose period does not hold the turn', () => {
    const b = build(doc(deposits(), [{ ...YEAR_END, solveFrom: 0 }]));
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.path).toBe('turns[0].solveFrom');
    expect(b.errors[0]!.message).toBe('turn "year end 2022" (turns[0]) solved from quotes[0] (deposit 2022-12-22): its period does not hold every day of the turn, 2022-12-30 to 2023-01-02; pick a quote over both; or give the spread in bp');
  });

  it('a forward-starting quote that starts after the turn (an FRA 1x4 from 2023-01-19) does not hold it', () => {
    const b = build(doc([...deposits(), { kind: 'fra', period: '1x4', rate: 0.041 }], [{ ...YEAR_END, solveFrom: 3 }]));
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.message).toContain('solved from quotes[3] (fra 2023-04-17): its period does not hold every day of the turn');
  });

  it('two turns naming one quote, and both a spread and a quote, are refused when read', () => {
    const two = validateWorkspace(doc(deposits(), [{ ...YEAR_END, solveFrom: 1 }, { ...YEAR_END, name: 'again', solveFrom: 1 }]));
    expect(two.workspace).toBeNull();
    expect(two.errors.map((e) => [e.path, e.message])).toEqual([['turns[1].solveFrom', 'turns[1] (again) and turns[0] are both solved from quotes[1]; one quote sets one spread']]);
    const both = validateWorkspace(doc(deposits(), [{ ...YEAR_END, spreadBp: 5, solveFrom: 1 }]));
    expect(both.errors[0]!.path).toBe('turns[0].spreadBp');
    const negative = validateWorkspace(doc(deposits(), [{ ...YEAR_END, solveFrom: -1 }]));
    expect(negative.errors[0]!.path).toBe('turns[0].solveFrom');
    // null (a workbench row that gives no quote) is read, and refused by the build naming the turn.
    expect(validateWorkspace(doc(deposits(), [{ ...YEAR_END, solveFrom: null }])).errors).toEqual([]);
    expect(build(doc(deposits(), [{ ...YEAR_END, solveFrom: null }])).errors[0]!.message).toContain('turn "year end 2022" (turns[0]) is solved from quotes[null], no quote of the curve');
  });

  it('a position past the list, or a kind that cannot carry a turn (a zero), is an error naming the turn and quote', () => {
    const past = build(doc(deposits(), [{ ...YEAR_END, solveFrom: 3 }]));
    expect(past.curve).toBeNull();
    expect(past.errors[0]!.message).toBe('turn "year end 2022" (turns[0]) is solved from quotes[3], no quote of the curve (past the list, left out, or a row empty or removed); pick a quote over the turn, or give its spread in bp');
    const zero = build(doc([...deposits(), { kind: 'zero', maturity: '2023-06-15', rate: 0.04 }], [{ ...YEAR_END, solveFrom: 3 }]));
    expect(zero.curve).toBeNull();
    expect(zero.errors[0]!.path).toBe('turns[0].solveFrom');
    expect(zero.errors[0]!.message).toContain('is solved from quotes[3], a zero, which cannot carry a turn (a deposit, FRA, future or OIS can)');
  });

  it('a quote switched off is an error naming it; the document keeps the turn', () => {
    const quotes = deposits().map((q, i) => (i === 1 ? { ...q, enabled: false } : q));
    const d = doc(quotes, [{ ...YEAR_END, solveFrom: 1 }]);
    const b = build(d);
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.message).toContain('turn "year end 2022" (turns[0]) is solved from quotes[1], switched off');
    expect(b.workspace!.turns).toEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends', solveFrom: 1 }]);
  });

  it('no spread within +-1000 bp: when every node spans the turn the quote cannot move, and the range tried is named', () => {
    // Valued 2022-12-29, every deposit spans the turn: the smooth curve takes up any spread.
    const quotes = [
      { kind: 'deposit', maturity: '2023-01-05', rate: 0.04 },
      { kind: 'deposit', maturity: '2023-01-17', rate: 0.05 },
      { kind: 'deposit', maturity: '2023-03-15', rate: 0.04 },
    ];
    const b = build({ ...doc(quotes, [{ ...YEAR_END, solveFrom: 1 }]), valuationDate: '2022-12-29' });
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.code).toBe('no-solution');
    expect(b.errors[0]!.message).toBe('turn "year end 2022" (turns[0]) solved from quotes[1] (deposit 2023-01-17): no spread from 0 bp to 1000 bp reprices it; or give the spread in bp');
  });

  it('a turn solved from the last quote, with no quote after it, is the turn past the curve', () => {
    const b = build(doc(deposits().slice(0, 2), [{ ...YEAR_END, solveFrom: 1 }]));
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.code).toBe('beyond-curve');
  });
});

describe('documents without a solved turn', () => {
  it('a spread set by hand builds as before: the same curve as the turns test market with spreadBp', () => {
    const hand = built(doc(deposits(), [{ ...YEAR_END, spreadBp: 25 }]));
    expect(hand.overnight!.turns[0]!.solveFrom).toBeUndefined();
    expect(hand.repricing).toHaveLength(3);
  });
});
