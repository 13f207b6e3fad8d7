// Snapshots (frozen inputs, rebuilt, hashed) and reference curves imported from CSV.
import { readFileSync } from 'node:fs';
import { addTenor, buildCurve, parseTenor, zeroOn, type Curve } from '../../../src/core/index.ts';
import { compareCurves, curveHash, parseReferenceCsv, rebuildSnapshot, referenceDifferences, takeSnapshot } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

const fixture = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const curveOf = (doc: Record<string, unknown>): Curve => {
  const b = buildCurve(doc);
  if (!b.curve) throw new Error(b.errors.map((e) => e.message).join('; '));
  return b.curve;
};

describe('takeSnapshot / rebuildSnapshot', () => {
  it('stores inputs only and rebuilds the same curve with the same hash', () => {
    const snap = takeSnapshot(fixture, 'Month-end close', '2026-11-30T17:30:00-05:00');
    expect(Object.keys(snap).sort()).toEqual(['curve', 'curveHash', 'name', 'quotes', 'settlement', 'takenAt']);
    expect(snap.quotes).toEqual(fixture.quotes);
    expect(snap.quotes).not.toBe(fixture.quotes);
    const again = rebuildSnapshot(snap);
    expect(again.hash).toBe(snap.curveHash);
    expect(again.changed).toBe(false);
    expect(again.build.curve!.pillars.map((p) => p.discount)).toEqual(curveOf(fixture).pillars.map((p) => p.discount));
  });

  it('flags a snapshot whose stored hash this build does not reproduce', () => {
    const snap = { ...takeSnapshot(fixture, 'old', '2026-11-01T12:00:00Z'), curveHash: '000000000000' };
    expect(rebuildSnapshot(snap).changed).toBe(true);
  });

  it('curveHash changes with the method and ignores nothing of the pillars', () => {
    const a = curveHash(curveOf(fixture));
    const b = curveHash(curveOf({ ...fixture, curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount', extrapolation: 'flat-forward' } }));
    expect(a).toMatch(/^[0-9a-f]{12}$/);
    expect(b).not.toBe(a);
  });
});

describe('compareCurves(current, other, tenors, by)', () => {
  // Zero rates quoted by whole-year tenors (continuous, ACT/365F) a week apart: each tenor spans the
  // same number of days from either settlement (both spans hold 29 Feb 2028), so by time to
  // maturity the two curves agree exactly; by calendar date they do not.
  const zeros = (settlement: string) => ({
    format: 'tenorscope-workspace',
    version: 1,
    settlement,
    curve: { dayCount: 'ACT/365F', interpolation: 'linear-zero' },
    quotes: ['1Y', '2Y', '5Y', '10Y'].map((tenor, i) => ({ kind: 'zero', tenor, rate: 0.03 + 0.004 * i, compounding: 'continuous', dayCount: 'ACT/365F' })),
  });
  const later = curveOf(zeros('2026-12-07'));
  const earlier = curveOf(zeros('2026-11-30'));

  it('by time to maturity: the same tenor quotes a week apart differ by 0 bp', () => {
    for (const row of compareCurves(later, earlier, ['1Y', '5Y', '10Y'], 'time', 'continuous', 'ACT/365F')) {
      expect(row.otherDate < row.date).toBe(true);
      expectClose(row.differenceBp!, 0, 1e-9, `same quotes, same day span (hand count of days), ${row.tenor}`);
    }
  });

  it('by calendar date: reads both curves on the current date, where the rising curve differs', () => {
    const [row] = compareCurves(later, earlier, ['5Y'], 'date', 'continuous', 'ACT/365F');
    expect(row!.otherDate).toBe(row!.date);
    const z = zeroOn(earlier, row!.date, 'continuous', 'ACT/365F');
    if (!z.ok) throw new Error('zero');
    expectClose(row!.otherZero!, z.value.zero, 0, 'the other curve read on the same date');
    expect(row!.differenceBp!).toBeLessThan(0);
  });
});

describe('parseReferenceCsv / referenceDifferences', () => {
  const curve = curveOf(fixture);
  const dates = ['1Y', '2Y', '5Y', '10Y'].map((t) => addTenor(curve.settlement, parseTenor(t)!));

  it('a reference built from our own discount factors differs by 0 bp', () => {
    const csv = 'date,discount\r\n' + dates.map((d) => `${d},${Math.exp(curve.lnDiscountAt(curve.time(d)))}`).join('\r\n');
    const { reference, errors } = parseReferenceCsv(csv, 'continuous', 'ACT/365F');
    expect(errors).toEqual([]);
    for (const row of referenceDifferences(curve, reference!)) expectClose(row.differenceBp!, 0, 1e-9, `own discount factor round trip ${row.date}`);
  });

  it('zero rates 1 bp above ours show -1 bp', () => {
    const lines = dates.map((d) => {
      const z = zeroOn(curve, d, 'annual', 'ACT/360');
      if (!z.ok) throw new Error('zero');
      return `${d},${z.value.zero + 0.0001}`;
    });
    const { reference } = parseReferenceCsv(`Date,Zero\n${lines.join('\n')}\n`, 'annual', 'ACT/360');
    for (const row of referenceDifferences(curve, reference!)) expectClose(row.differenceBp!, -1, 1e-9, `ours minus (ours + 1 bp), ${row.date}`);
  });

  it('names the row and column of a bad value and what would be valid', () => {
    const { reference, errors } = parseReferenceCsv('date,discount\n2027-01-04,0.99\n2027-13-01,0.98\n2028-01-04,abc\n2028-01-04,0.9\n', 'continuous', 'ACT/365F');
    expect(reference).toBeNull();
    expect(errors.map((e) => e.path)).toEqual(['csv.row 3.date', 'csv.row 4.discount']);
    expect(errors[1]!.message).toContain('must be a number such as 0.9731');
    expect(parseReferenceCsv('when,value\n', 'continuous', 'ACT/365F').errors[0]!.message).toContain('"date" column');
  });
});

// The reference import reads zero rates with the sheet's unit rules (readRate: a % or bp suffix
// carries its unit; a bare number is read in the mode) and flags values implausible for their
// column (bounds in scenarioReference.ts, the project's judgement).
describe('parseReferenceCsv units', () => {
  it('accepts 3.05% and 305bp in any mode, and a bare 3.05 in % mode, all as 0.0305', () => {
    for (const [cell, mode] of [['3.05%', 'decimal'], ['305bp', 'percent'], ['3.05', 'percent'], ['0.0305', 'decimal']] as const) {
      const { reference, errors, warnings } = parseReferenceCsv(`date,zero\n2030-01-02,${cell}\n`, 'continuous', 'ACT/365F', mode);
      expect(errors, `${cell} in ${mode}`).toEqual([]);
      expect(warnings).toEqual([]);
      expect(reference!.points[0]!.value).toBe(0.0305);
    }
  });
  it('refuses a bare 3.05 read as a decimal (305%) with "did you mean 3.05%?", as the sheet does', () => {
    const { reference, errors } = parseReferenceCsv('date,zero\n2030-01-02,3.05\n', 'continuous', 'ACT/365F', 'decimal');
    expect(reference).toBeNull();
    expect(errors[0]!.message).toBe('row 2, zero: 3.05 as a decimal is 305%: did you mean 3.05%? Type 3.05% or 0.0305, or read bare numbers in %');
  });
  it('warns when values are implausible for their column: 0.0305 in % mode, 30.5%, a discount factor of 97.31', () => {
    expect(parseReferenceCsv('date,zero\n2030-01-02,0.0305\n', 'continuous', 'ACT/365F', 'percent').warnings[0]).toMatch(/row 2, zero: 0\.0305 in % mode .* did you mean 3\.05%\?/);
    expect(parseReferenceCsv('date,zero\n2030-01-02,30.5%\n', 'continuous', 'ACT/365F', 'percent').warnings[0]).toBe('row 2, zero: 30.5% is implausible for a zero rate (about -5% to 25%)');
    expect(parseReferenceCsv('date,discount\n2030-01-02,97.31\n', 'continuous', 'ACT/365F').warnings[0]).toMatch(/row 2, discount: 97\.31 is implausible for a discount factor .*did you mean 0\.9731\?/);
  });
});
