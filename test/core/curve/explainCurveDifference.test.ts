// A snapshot comparison's difference explained: its two parts are the untraced zero queries on the
// current and the snapshot curve, read where the table reads them, and its last step is the
// Snapshots table's figure (compareCurves), all bit for bit; each part's rate is recomputed here
// from the discount factor and year fraction the explanation shows, by the compounding definitions.
import fixtureJson from '../../fixtures/share/workspace40.json';
import { buildCurve, compareCurves, COMPARISON_TENORS, explainCurveDifference, explainReferenceDifference, referenceDifferences, zeroOn, type Compounding, type Curve, type CurveDayCount, type Explanation, type ReferenceCurve } from '../../../src/core/index.ts';

const fixture = fixtureJson as unknown as Record<string, unknown> & { quotes: Record<string, unknown>[] };
const curveOf = (doc: Record<string, unknown>): Curve => {
  const b = buildCurve(doc);
  if (!b.curve) throw new Error(b.errors[0]?.message ?? 'no curve');
  return b.curve;
};
const current = curveOf(fixture);
// The "snapshot": the same desk a week earlier, 7 bp lower and on another interpolation (invented).
const snapshot = curveOf({
  ...fixture,
  settlement: '2026-11-23',
  curve: { ...(fixture.curve as object), interpolation: 'log-linear-discount' },
  quotes: fixture.quotes.map((q) => (typeof q.rate === 'number' ? { ...q, rate: q.rate - 0.0007 } : q)),
});

const CONVENTIONS: readonly (readonly [Compounding, CurveDayCount])[] = [
  ['continuous', 'ACT/365F'],
  ['annual', 'ACT/360'],
  ['semiannual', '30/360'],
  ['simple', 'ACT/365F'],
];

/** The zero rate from ln DF and tau by its definition (continuous: -lnDF/tau; m a year: m((1/DF)^(1/(m tau)) - 1); simple: (1/DF - 1)/tau). */
function zeroFromShown(e: Explanation, part: string, c: Compounding): number {
  const read = e.reads.find((r) => r.name === `${part} DF(date)`)!;
  const tau = e.yearFractions.find((y) => y.name === `${part} tau`)!.value;
  if (c === 'continuous') return -read.lnDiscount / tau;
  if (c === 'simple') return Math.expm1(-read.lnDiscount) / tau;
  const m = c === 'annual' ? 1 : c === 'semiannual' ? 2 : c === 'quarterly' ? 4 : 12;
  return m * Math.expm1(-read.lnDiscount / (m * tau));
}

describe('explainCurveDifference', () => {
  it('ends in the Snapshots table figure; its parts are the untraced zero queries, bit for bit', () => {
    let checked = 0;
    for (const by of ['time', 'date'] as const) {
      for (const [c, dc] of CONVENTIONS) {
        for (const row of compareCurves(current, snapshot, COMPARISON_TENORS, by, c, dc)) {
          const r = explainCurveDifference(current, snapshot, row.tenor, by, c, dc);
          const where = `${row.tenor} by ${by}, ${c} ${dc}`;
          if (row.differenceBp === null) {
            expect(r.ok, where).toBe(false);
            continue;
          }
          if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
          const e = r.value;
          expect(Object.is(e.value, row.differenceBp), where).toBe(true);
          expect(Object.is(e.steps.at(-1)!.value, row.differenceBp), where).toBe(true);
          expect(e.quantity).toBe('zero-difference');
          // The parts: untraced zeroOn on each curve, at the dates the row reads.
          const untraced = (on: Curve, date: string): number => {
            const q = zeroOn(on, date, c, dc);
            if (!q.ok) throw new Error(q.errors[0]!.message);
            return q.value.zero;
          };
          const cur = e.steps.find((s) => s.name === 'current rate')!;
          const snap = e.steps.find((s) => s.name === 'snapshot rate')!;
          expect(Object.is(cur.value, untraced(current, row.date)), `${where}: current`).toBe(true);
          expect(Object.is(snap.value, untraced(snapshot, row.otherDate)), `${where}: snapshot`).toBe(true);
          expect(e.dates.find((d) => d.name === 'current date')!.adjusted).toBe(row.date);
          expect(e.dates.find((d) => d.name === 'snapshot date')!.adjusted).toBe(row.otherDate);
          // Recomputed from what is shown: each rate from its DF read and tau (1e-15 relative, and
          // 1e-17 absolute for rates near zero), then the difference, 1 bp = 0.0001.
          for (const [step, part] of [[cur, 'current'], [snap, 'snapshot']] as const) {
            const again = zeroFromShown(e, part, c);
            expect(Math.abs(again - step.value), `${where}: ${part} recomputed`).toBeLessThanOrEqual(1e-15 * Math.abs(step.value) + 1e-17);
          }
          expect(Math.abs((cur.value - snap.value) * 1e4 - e.value)).toBeLessThanOrEqual(1e-15 * Math.abs(e.value) + 1e-13);
          expect(e.steps.at(-1)!.inputs).toEqual(['current rate', 'snapshot rate']);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(60);
  });

  it('says which tenor is wrong, and which curve has no rate, instead of explaining nothing', () => {
    const bad = explainCurveDifference(current, snapshot, 'soon', 'time', 'continuous', 'ACT/365F');
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]!.message).toBe('"soon" is not a tenor');
    // A curve ending at 2Y cannot give a 10Y zero without extrapolation.
    const short = curveOf({ ...fixture, curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount', extrapolation: 'none' }, quotes: fixture.quotes.slice(0, 6) });
    const r = explainCurveDifference(current, short, '30Y', 'time', 'continuous', 'ACT/365F');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toMatch(/^no zero rate at 30Y on the snapshot curve/);
  });
});

describe('explainReferenceDifference', () => {
  // A reference of invented values at dates spread over the curve, once as discount factors, once as zero rates.
  const dates = ['2027-02-26', '2027-11-30', '2029-05-31', '2033-11-30', '2046-11-30'];
  const references: ReferenceCurve[] = [
    { kind: 'discount', compounding: 'continuous', dayCount: 'ACT/365F', points: dates.map((date, i) => ({ date, value: Math.exp(-0.031 * (i + 1) * 0.9) })) },
    { kind: 'discount', compounding: 'semiannual', dayCount: 'ACT/360', points: dates.map((date, i) => ({ date, value: 0.99 - 0.1 * i })) },
    { kind: 'zero', compounding: 'annual', dayCount: '30/360', points: dates.map((date, i) => ({ date, value: 0.03 + 0.002 * i })) },
  ];

  it('ends in the reference table figure; our part is untraced zeroOn, the reference part the table conversion, bit for bit', () => {
    let checked = 0;
    for (const ref of references) {
      for (const row of referenceDifferences(current, ref)) {
        const where = `${ref.kind} ${ref.compounding} ${row.date}`;
        const r = explainReferenceDifference(current, ref, row.date);
        if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
        const e = r.value;
        expect(Object.is(e.value, row.differenceBp), where).toBe(true);
        const ours = e.steps.find((s) => s.name === 'ours rate')!;
        const theirs = e.steps.find((s) => s.name === 'reference rate')!;
        const z = zeroOn(current, row.date, ref.compounding, ref.dayCount);
        if (!z.ok) throw new Error(where);
        expect(Object.is(ours.value, z.value.zero), where).toBe(true);
        expect(Object.is(theirs.value, row.referenceZero), where).toBe(true);
        // Recomputed from what is shown: our rate from its DF and tau; the reference's from the
        // file's value (a zero rate as given; a discount factor through ln D and the shown tau).
        expect(Math.abs(zeroFromShown(e, 'ours', ref.compounding) - ours.value)).toBeLessThanOrEqual(1e-15 * Math.abs(ours.value) + 1e-17);
        const point = ref.points.find((p) => p.date === row.date)!;
        if (ref.kind === 'zero') expect(theirs.value).toBe(point.value);
        else {
          const tau = e.yearFractions.find((y) => y.name === 'reference tau')!;
          expect(tau.dayCount).toBe(ref.dayCount);
          expect(tau.from).toBe(current.settlement);
          const ln = Math.log(point.value);
          const m = ref.compounding === 'continuous' ? Infinity : 2;
          const again = m === Infinity ? -ln / tau.value : m * Math.expm1(-ln / (m * tau.value));
          expect(Math.abs(again - theirs.value)).toBeLessThanOrEqual(1e-15 * Math.abs(theirs.value));
        }
        expect(e.steps.at(-1)!.inputs).toEqual(['ours rate', 'reference rate']);
        checked++;
      }
    }
    expect(checked).toBe(15);
  });

  it('names the date it has no row for, or why there is no difference', () => {
    const r = explainReferenceDifference(current, references[0]!, '2030-01-01');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toBe('the reference curve has no row dated 2030-01-01');
    const early = { ...references[2]!, points: [{ date: '2026-11-01', value: 0.03 }] };
    const e = explainReferenceDifference(current, early, '2026-11-01');
    expect(e.ok).toBe(false);
    if (!e.ok) expect(e.errors[0]!.message).toBe(`no difference on 2026-11-01: on or before settlement ${current.settlement}`);
  });
});
