// A meeting's implied step explained (issue 19): the explanation is the meeting-step table's own
// computation run with a trace, so its value and its two one-day forwards are the table's, bit for
// bit; every step recomputed here from the inputs the explanation shows gives the next to 1e-15
// relative; the quotes it names move the step as a rebuild with the quote bumped does.
// Sources: the one-day forward F(d) = (DF(d) / DF(d + 1) - 1) x 360, simple ACT/360 (SOFR's
// convention, MARKET-CONVENTIONS.md section d); SOFR stepped on 2022-03-17, 2022-11-03, 2022-12-15
// and 2023-07-27 (section h, the SOFR record); 1 bp = 0.0001. Quotes are invented test data.
import { buildCurve, explainMeetingStep, meetingStepTable, OVERNIGHT_KIT, type CurveBuild, type Explanation } from '../../../src/core/index.ts';
import { expectClose, expectRelClose } from '../../helpers/asserts.ts';

const SOFR_EFFECTIVE = ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'];
const OIS = { calendar: 'us-gov-securities', spotLag: 0, paymentLag: 0 };
const QUOTES = [
  { kind: 'deposit', maturity: '2022-03-10', rate: 0.0008 },
  { kind: 'deposit', maturity: '2022-06-01', rate: 0.004 },
  { kind: 'deposit', maturity: '2022-12-01', rate: 0.015 },
  { kind: 'deposit', maturity: '2023-03-01', rate: 0.025 },
  { kind: 'ois', tenor: '2Y', rate: 0.028, ...OIS },
  { kind: 'ois', tenor: '3Y', rate: 0.029, ...OIS },
];
const YEAR_END = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 };

const doc = (dayCount: string, extra: Record<string, unknown> = {}, quotes: readonly Record<string, unknown>[] = QUOTES) => ({
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-03-01',
  curve: { dayCount, interpolation: 'monotone-convex' },
  quotes,
  meetingSteps: { on: true, effectiveDates: SOFR_EFFECTIVE },
  ...extra,
});
const built = (d: unknown): CurveBuild => {
  const b = buildCurve(d, { overnight: OVERNIGHT_KIT });
  expect(b.errors).toEqual([]);
  return b;
};

const step = (e: Explanation, name: string) => e.steps.find((s) => s.name === name)!;
const read = (e: Explanation, name: string) => e.reads.find((r) => r.name === name)!;

/** One side (a one-day forward) recomputed from what it shows; `fast`: read as the segment's flat forward. */
function checkSide(e: Explanation, fast: boolean, where: string): void {
  const s = read(e, 'DF(start)');
  const end = read(e, 'DF(end)');
  const tau = e.yearFractions.find((y) => y.name === 'tau')!;
  // ACT/360 over one calendar day (ISDA 2006 4.16(e)).
  expect(tau.days, where).toBe(1);
  expect(tau.value, where).toBe(1 / 360);
  let lnP: number;
  if (fast) {
    // The flat forward of the segment from its two nodes (log-linear in DF between them).
    // The segment: the start's two nodes, or when the start is a node (the effective date), the end's.
    const [n1, n2] = s.how === 'interpolated' ? s.nodes : end.how === 'interpolated' ? end.nodes : [s.nodes[0], end.nodes[0]];
    expect(step(e, 'lnP').inputs).toEqual(['DF(start)', 'DF(end)']);
    const f = -(n2!.lnDiscount - n1!.lnDiscount) / (n2!.t - n1!.t);
    const basis = e.conventions.curveDayCount === 'ACT/360' ? 360 : 365;
    lnP = step(e, 'lnP').value;
    expectRelClose(-f / basis, lnP, 1e-15, `${where}: lnP = -f / basis, f the flat forward from the nodes shown`);
    // The reads agree with it: ln DF(end) - ln DF(start) rounds to about 1e-13 of lnP (why the fast path).
    expectRelClose(end.lnDiscount - s.lnDiscount, lnP, 1e-11, `${where}: the reads' difference`);
  } else {
    lnP = step(e, 'lnP').value;
    expect(end.lnDiscount - s.lnDiscount, `${where}: lnP from the reads shown`).toBe(lnP);
  }
  const growth = step(e, 'growth').value;
  expect(growth, `${where}: growth = expm1(-lnP)`).toBe(Math.expm1(-lnP));
  expectRelClose(growth / tau.value, e.value, 1e-15, `${where}: rate = growth / tau`);
}

function checkAll(b: CurveBuild, fast: boolean, label: string): void {
  const plain = meetingStepTable(b);
  expect(plain.length).toBe(SOFR_EFFECTIVE.length);
  // The table with every row traced is the table untraced, bit for bit.
  const traced = meetingStepTable(b, () => () => {});
  plain.forEach((row, i) => {
    for (const k of ['before', 'after', 'stepBp'] as const) expect(Object.is(traced[i]![k], row[k]), `${label} ${row.date} ${k}`).toBe(true);
    const r = explainMeetingStep(b, row.date);
    if (!r.ok) throw new Error(r.errors[0]!.message);
    const { explanation: e, before, after } = r.value;
    const where = `${label} ${row.date}`;
    expect(Object.is(e.value, row.stepBp), where).toBe(true);
    expect(Object.is(e.steps.at(-1)!.value, row.stepBp), where).toBe(true);
    expect(Object.is(before.value, row.before), `${where} before`).toBe(true);
    expect(Object.is(after.value, row.after), `${where} after`).toBe(true);
    expect(e.quantity).toBe('meeting-step');
    // The dates: the day before the effective date and the effective date, each to the next day.
    expect(before.dates.map((d) => d.adjusted)).toEqual([new Date(Date.parse(row.date) - 864e5).toISOString().slice(0, 10), row.date]);
    expect(after.dates[0]!.adjusted).toBe(row.date);
    checkSide(before, fast, `${where} before`);
    checkSide(after, fast, `${where} after`);
    // step = (after - before) x 10,000 bp from the two rates shown.
    expect(e.steps.at(-1)!.inputs).toEqual(['after rate', 'before rate']);
    expect((after.value - before.value) * 1e4).toBe(e.value);
    expect(e.steps.length).toBe(before.steps.length + after.steps.length + 1);
    expect(e.reads.map((x) => x.name)).toEqual(['before DF(start)', 'before DF(end)', 'after DF(start)', 'after DF(end)']);
  });
}

describe('explainMeetingStep', () => {
  it('ACT/365F (the flat-forward read): value, parts and steps are the table\'s', () => checkAll(built(doc('ACT/365F')), true, 'ACT/365F'));
  it('ACT/360 (the flat-forward read)', () => checkAll(built(doc('ACT/360')), true, 'ACT/360'));
  it('with a turn (turns left out: the read as a difference of ln DF)', () => checkAll(built(doc('ACT/365F', { turns: [YEAR_END] })), false, 'turn'));
  it('ACT/ACT-ISDA (no day basis: the read as a difference of ln DF)', () => checkAll(built(doc('ACT/ACT-ISDA')), false, 'ACT/ACT-ISDA'));

  it('names the quotes each level (before, after) moves with, as a rebuild with each quote bumped moves that level', () => {
    const b = built(doc('ACT/365F'));
    const date = '2022-11-03';
    const r = explainMeetingStep(b, date);
    if (!r.ok) throw new Error('step');
    const row = meetingStepTable(b).find((x) => x.date === date)!;
    for (const [k, level] of [[0, 'before'], [1, 'after']] as const) {
      const q = r.value.levelQuotes(k);
      if (!q.ok) throw new Error(level);
      expect(q.value.length).toBe(5);
      for (const x of q.value) {
        const bumped = QUOTES.map((y, i) => (i === x.index ? { ...y, rate: (y.rate as number) + 1e-6 } : y));
        const moved = meetingStepTable(built(doc('ACT/365F', {}, bumped))).find((y) => y.date === date)![level];
        // bp of the level per bp of the quote: a 0.01 bp bump moves the level by bpPerBp x 0.01 bp.
        expectClose(((moved - row[level]) * 1e4) / 0.01, x.bpPerBp, 1e-4 * Math.max(1, Math.abs(x.bpPerBp)), `${level}: bump-and-rebuild of quote ${x.index}`);
      }
    }
  });

  it('names the quotes the step moves with, as a rebuild with each quote bumped 1 bp moves it', () => {
    const b = built(doc('ACT/365F'));
    const date = '2022-11-03';
    const r = explainMeetingStep(b, date);
    if (!r.ok || !r.value.quotes.ok) throw new Error('quotes');
    const top = r.value.quotes.value;
    expect(top.length).toBe(5);
    const base = meetingStepTable(b).find((x) => x.date === date)!.stepBp;
    for (const q of top) {
      const bumped = QUOTES.map((x, i) => (i === q.index ? { ...x, rate: (x.rate as number) + 1e-6 } : x));
      const moved = meetingStepTable(built(doc('ACT/365F', {}, bumped))).find((x) => x.date === date)!.stepBp;
      // bp of the step per bp of the quote: a 0.01 bp bump, so the step moves by bpPerBp x 0.01 bp.
      expectClose((moved - base) / 0.01, q.bpPerBp, 1e-4 * Math.max(1, Math.abs(q.bpPerBp)), `bump-and-rebuild of quote ${q.index}`);
    }
    expect(Math.abs(top[0]!.bpPerBp)).toBeGreaterThan(0.1);
  });

  it('says when there is no such meeting', () => {
    const r = explainMeetingStep(built(doc('ACT/365F')), '2022-03-18');
    expect(r.ok).toBe(false);
  });
});
