import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  curveTime,
  INTERPOLATIONS,
  meetingStepTable,
  OVERNIGHT_KIT,
  oneDayForward,
  overnightForwards,
  turnLn,
  validateWorkspace,
  type CurveBuild,
} from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Policy-meeting steps and turns on the overnight curve. Sources, named at each check:
// - MARKET-CONVENTIONS.md section h (the project's notes of published sources): piecewise-flat
//   overnight forwards between policy EFFECTIVE dates, log-linear discount factors with a node on
//   each (Ametrano, Bertocchi & Mazzocchi, "Advanced EONIA curve calibration", SSRN 2881445,
//   abstract); SOFR fixings stepped on 2022-03-17, 2022-11-03, 2022-12-15 and 2023-07-27 (the
//   SOFR record, checked there), the days after the announcements; the announcement dates
//   (2022-03-16, ...) are from memory [M]. The 2024-11 Federal Register notice quoted there
//   gives the rule: "announced on November 7, 2024, with an effective date of November 8, 2024".
// - The turn model: DF(t) = DF_smooth(t) x prod exp(-s d / 360) over the turn's days (Ametrano &
//   Bianchetti 2013, section 4.8, as quoted in section h): every forward period containing a turn
//   day rises by the spread's share, no other moves.
// - SIFMA's US government securities calendar (section a.1): 2023-01-02 (New Year's Day observed,
//   the 1st a Sunday) is closed; the project's calendar module is tested against the list.
// - ACT/360 simple one-day rates: the SOFR and fed funds convention (section d).
// - The engine contract: every rate quote reprices within 1e-14 (test/core/bootstrap/properties.test.ts).
// Rates in the markets below are invented test data.

const VALUATION = '2022-03-01';
const SOFR_EFFECTIVE = ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'];
const OIS = { calendar: 'us-gov-securities', spotLag: 0, paymentLag: 0 };

/** One quote per meeting period, then OIS after the last effective date (invented rates). */
const STEP_QUOTES = [
  { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
  { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
  { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
  { kind: 'deposit', maturity: '2023-03-01', rate: 0.025 },
  { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
  { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
];
/** A denser ladder for turns under every method (no steps), spanning year end 2022 (invented rates). */
const TURN_QUOTES = [
  { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
  { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
  { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
  { kind: 'ois', maturity: '2023-01-17', rate: 0.019, ...OIS },
  { kind: 'deposit', maturity: '2023-02-01', rate: 0.0195 },
  { kind: 'ois', tenor: '1Y', rate: 0.021, ...OIS },
  { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
  { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
  { kind: 'ois', tenor: '5Y', rate: 0.03, ...OIS },
];
const YEAR_END = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 };

function doc(quotes: readonly object[], extra: Record<string, unknown> = {}, interpolation = 'monotone-convex'): Record<string, unknown> {
  return { format: 'tenorscope-workspace', version: 2, valuationDate: VALUATION, curve: { dayCount: 'ACT/365F', interpolation }, quotes, ...extra };
}

/** The build as the curve command makes it: with the code of turns and steps (OVERNIGHT_KIT). */
const build = (d: unknown): CurveBuild => buildCurve(d, { overnight: OVERNIGHT_KIT });

function built(d: unknown): CurveBuild {
  const b = build(d);
  expect(b.errors).toEqual([]);
  expect(b.curve).not.toBeNull();
  return b;
}

/** Every quote repriced on the built (turned) curve by its own instrument, independently of the bootstrap's table. */
function expectReprices(b: CurveBuild, source: string): void {
  for (const ins of b.instruments) {
    expect(ins.unit).toBe('rate');
    expectClose(ins.modelQuote(b.curve!.lnDiscountAt), ins.market, 1e-14, `${source}: quotes[${ins.index}] (${ins.kind} ${ins.maturity}) reprices on the built curve`);
  }
  for (const r of b.repricing) expectClose(r.repricingError, 0, 1e-14, `${source}: the bootstrap's own repricing of quotes[${r.index}]`);
}

const steps = { meetingSteps: { on: true, effectiveDates: SOFR_EFFECTIVE } };

describe('meeting steps', () => {
  it('buildCurve with meetingSteps on: the instantaneous overnight forward is one level per meeting period, stepping on the effective dates', () => {
    const b = built(doc(STEP_QUOTES, steps));
    const c = b.curve!;
    expect(c.interpolation).toBe('log-linear-discount'); // the rule: a step curve is log-linear in DF
    const bounds = [VALUATION, ...SOFR_EFFECTIVE];
    for (let i = 0; i + 1 < bounds.length; i++) {
      const level = c.forwardAt(c.time(bounds[i]!));
      const days = overnightForwards(c, bounds[i]!, bounds[i + 1]!);
      for (const p of days) {
        // Section h: flat overnight forwards between effective dates (Ametrano et al.).
        expectClose(c.forwardAt(c.time(p.date)), level, 1e-15 * Math.abs(level), `section h: flat forward from ${bounds[i]} to ${bounds[i + 1]}, at ${p.date}`);
      }
    }
  });

  it('one-day forwards (simple ACT/360) are constant between effective dates to 1e-15 relative', () => {
    const c = built(doc(STEP_QUOTES, steps)).curve!;
    const bounds = [VALUATION, ...SOFR_EFFECTIVE];
    for (let i = 0; i + 1 < bounds.length; i++) {
      const days = overnightForwards(c, bounds[i]!, bounds[i + 1]!);
      const first = days[0]!.rate;
      // The figure: a step curve's day lies inside one log-linear segment, and its rate is
      // read as the segment's forward times the day's length (overnightView.ts), so rounding stays
      // at the double's own size.
      for (const p of days) expectClose(p.rate, first, 1e-15 * Math.abs(first), `section h: one level per period from ${bounds[i]}, on ${p.date}`);
      // And the same rate as the ratio of discount factors (DF(d) / DF(d + 1) - 1) x 360, to that ratio's rounding.
      for (const p of days) expectClose(p.rate, Math.expm1(c.lnDiscountAt(c.time(p.date)) - c.lnDiscountAt(c.time(p.date) + 1 / 365)) * 360, 2e-13 * Math.abs(first), `DF ratio on ${p.date}`);
    }
  });

  it('steps fall on the effective date (SOFR record 2022-03-17), not the announcement date 2022-03-16 [M]', () => {
    const b = built(doc(STEP_QUOTES, steps));
    const c = b.curve!;
    const onAnnouncement = oneDayForward(c, '2022-03-16');
    const dayBeforeThat = oneDayForward(c, '2022-03-15');
    const onEffective = oneDayForward(c, '2022-03-17');
    expectClose(onAnnouncement, dayBeforeThat, 1e-16, 'section h: the announcement day still carries the old level');
    expect(Math.abs(onEffective - onAnnouncement)).toBeGreaterThan(1e-4); // section h: SOFR stepped on the 17th
    const table = meetingStepTable(b);
    expect(table.map((r) => r.date)).toEqual(SOFR_EFFECTIVE);
    expectClose(table[0]!.before, onAnnouncement, 0, 'the table reads the day before the effective date');
    expectClose(table[0]!.after, onEffective, 0, 'the table reads the effective date');
    expectClose(table[0]!.stepBp, (onEffective - onAnnouncement) * 1e4, 1e-12, 'step = after minus before, in bp');
  });

  it('the first period level is the deposit to 2022-03-10 spread evenly over its days (hand calculation)', () => {
    const c = built(doc(STEP_QUOTES, steps)).curve!;
    // Flat overnight forward over the deposit's 9 days: (1 + r 9/360)^(1/9) - 1 per day, times 360 (hand calculation).
    const r = 0.0008;
    const level = (Math.pow(1 + (r * 9) / 360, 1 / 9) - 1) * 360;
    expectClose(oneDayForward(c, '2022-03-12'), level, 1e-15, 'hand calculation: flat forward through the 9-day deposit');
    expectClose(oneDayForward(c, '2022-03-16'), level, 1e-15, 'hand calculation: the same level runs on to the effective date');
  });

  it('every quote reprices to 1e-14 in rate with steps on, and with steps and a year-end turn on', () => {
    expectReprices(built(doc(STEP_QUOTES, steps)), 'steps');
    expectReprices(built(doc(STEP_QUOTES, { ...steps, turns: [YEAR_END] })), 'steps and turn');
  });

  it('meetingSteps off, or on with no dates inside, leaves the method as chosen; off builds today\'s curve bit for bit', () => {
    const plain = built(doc(STEP_QUOTES));
    const off = built(doc(STEP_QUOTES, { meetingSteps: { on: false, effectiveDates: SOFR_EFFECTIVE }, turns: [] }));
    expect(off.curve!.interpolation).toBe('monotone-convex');
    for (const t of [0.01, 0.2, 0.7, 1.3, 2.9]) expect(off.curve!.lnDiscountAt(t)).toBe(plain.curve!.lnDiscountAt(t));
    expect(off.repricing).toEqual(plain.repricing);
    expect(off.overnight).toBeUndefined();
  });

  it('without the code of turns and steps (OVERNIGHT_KIT) a document that needs it builds no curve and says so; steps off need none', () => {
    const b = buildCurve(doc(STEP_QUOTES, steps));
    expect(b.curve).toBeNull();
    expect(b.errors[0]!.message).toContain('the turns and meeting steps are still loading');
    const off = buildCurve(doc(STEP_QUOTES, { meetingSteps: { on: false, effectiveDates: SOFR_EFFECTIVE }, turns: [] }));
    expect(off.errors).toEqual([]);
  });

  it('an effective date outside the curve is an error naming it', () => {
    for (const [date, code] of [['2022-02-15', 'before-settlement'], ['2026-01-15', 'beyond-curve']] as const) {
      const b = build(doc(STEP_QUOTES, { meetingSteps: { on: true, effectiveDates: [date, ...SOFR_EFFECTIVE].sort() } }));
      expect(b.curve).toBeNull();
      expect(b.errors.map((e) => e.code)).toContain(code);
      expect(b.errors.find((e) => e.code === code)!.message).toContain(date);
      expect(b.errors.find((e) => e.code === code)!.path).toMatch(/^meetingSteps\.effectiveDates\[\d\]$/);
    }
  });

  it('two quotes in one meeting period, or a period no quote reaches, is an error naming the quotes and dates', () => {
    const two = build(doc([...STEP_QUOTES, { kind: 'deposit', maturity: '2022-09-01', rate: 0.01 }], steps));
    expect(two.curve).toBeNull();
    expect(two.errors[0]!.message).toContain('quotes[1] (deposit 2022-06-01) and quotes[6] (deposit 2022-09-01)');
    expect(two.errors[0]!.message).toContain('from 2022-03-17 to 2022-11-03');
    const none = build(doc(STEP_QUOTES.filter((_, i) => i !== 2), steps));
    expect(none.curve).toBeNull();
    expect(none.errors[0]!.code).toBe('empty-period');
    expect(none.errors[0]!.message).toContain('from 2022-11-03 to 2022-12-15');
    expect(none.errors[0]!.message).toContain('2022-12-15');
  });
});

describe('turns', () => {
  const withTurn = (interpolation = 'monotone-convex') => built(doc(TURN_QUOTES, { turns: [YEAR_END] }, interpolation));

  it('a year-end turn covers Friday 2022-12-30 to Tuesday 2023-01-03 on us-gov-securities (2023-01-02 closed): four days, each up by the spread', () => {
    const b = withTurn();
    const c = b.curve!;
    const span = b.overnight!.turns[0]!;
    // SIFMA (section a.1): 2023-01-02 closed, so Friday's overnight period runs to Tuesday.
    expect([span.start, span.end, span.days]).toEqual(['2022-12-30', '2023-01-03', 4]);
    const smoothLn = (t: number) => c.lnDiscountAt(t) - turnLn(b.overnight!.turns, t);
    const s = 10 / 1e4; // 10 bp
    for (const p of overnightForwards(c, '2022-12-20', '2023-01-12')) {
      const t0 = c.time(p.date);
      const t1 = t0 + 1 / 365;
      const smooth = Math.expm1(smoothLn(t0) - smoothLn(t1)) * 360;
      const inTurn = p.date >= '2022-12-30' && p.date < '2023-01-03';
      // Ametrano & Bianchetti 4.8: DF = DF_smooth x exp(-s d/360), so a turn day's one-day rate is
      // (1 + F_smooth/360) exp(s/360) - 1 times 360, and every other day's is F_smooth.
      const expected = inTurn ? (Math.exp(Math.log1p(smooth / 360) + s / 360) - 1) * 360 : smooth;
      expectClose(p.rate, expected, 1e-13, `section h turn model, one-day rate on ${p.date}`);
    }
    // After the turn the whole jump exp(-s 4/360) sits on every discount factor (section h).
    expectClose(turnLn(b.overnight!.turns, c.time('2023-06-01')), (-s * 4) / 360, 1e-18, 'section h: J = exp(-s d/360), d = 4');
  });

  for (const method of INTERPOLATIONS) {
    it(`every quote reprices to 1e-14 in rate with a year-end turn on (${method})`, () => {
      expectReprices(withTurn(method), `turn, ${method}`);
    });
  }

  it('the turn moves the smooth curve only through the quotes that span it: a curve before the turn is unchanged', () => {
    const plain = built(doc(TURN_QUOTES));
    const b = withTurn('log-linear-discount');
    const p = built(doc(TURN_QUOTES, {}, 'log-linear-discount'));
    void plain;
    // Pillars before the turn (to 2022-12-01) see no turn day: their nodes are the same.
    for (const d of ['2022-03-10', '2022-06-01', '2022-12-01']) {
      const t = curveTime('ACT/365F', VALUATION, d);
      expectClose(b.curve!.lnDiscountAt(t), p.curve!.lnDiscountAt(t), 1e-17, `turn model: DF before the turn (${d}) does not move`);
    }
  });

  it('a turn with no business day, one past the curve, or one before the valuation date is an error naming the turn', () => {
    const noDay = build(doc(TURN_QUOTES, { turns: [{ name: 'new year weekend', from: '2022-12-31', to: '2023-01-02', spreadBp: 5 }] }));
    expect(noDay.curve).toBeNull();
    expect(noDay.errors[0]!.code).toBe('empty-period');
    expect(noDay.errors[0]!.message).toContain('turn "new year weekend" (turns[0]');
    expect(noDay.errors[0]!.message).toContain('no business day of the calendar us-gov-securities');
    const past = build(doc(TURN_QUOTES, { turns: [{ name: 'far', from: '2030-12-31', to: '2030-12-31', spreadBp: 5 }] }));
    expect(past.errors[0]!.code).toBe('beyond-curve');
    expect(past.errors[0]!.path).toBe('turns[0].to');
    const early = build(doc(TURN_QUOTES, { turns: [{ name: 'gone', from: '2021-12-31', to: '2021-12-31', spreadBp: 5 }] }));
    expect(early.errors[0]!.code).toBe('before-settlement');
  });

  it('validateWorkspace refuses a malformed turn or step section with a path-named error, and a version 1 document saying turns', () => {
    const bad = validateWorkspace(doc(TURN_QUOTES, { turns: [{ name: '', from: '2022-12-30', to: '2022-12-29', spreadBp: 'ten' }], meetingSteps: { on: 'yes', effectiveDates: ['2022-11-03', '2022-03-17'] } }));
    expect(bad.workspace).toBeNull();
    expect(bad.errors.map((e) => e.path)).toEqual(['turns[0].name', 'turns[0].to', 'turns[0].spreadBp', 'meetingSteps.on', 'meetingSteps.effectiveDates[1]']);
    const v1 = validateWorkspace({ format: 'tenorscope-workspace', version: 1, settlement: VALUATION, quotes: [], turns: [] });
    expect(v1.errors[0]!.message).toContain('"turns" is a field of version 2 documents');
  });
});
