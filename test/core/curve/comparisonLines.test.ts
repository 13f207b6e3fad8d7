// Comparison lines for the charts: a reference curve in the display convention, forwards that follow
// exactly from it, and another curve's samples lined up by calendar date.
import { readFileSync } from 'node:fs';
import { addTenor, buildCurve, parseTenor, zeroOn, type Curve } from '../../../src/core/index.ts';
import { parseReferenceCsv, referenceDifferences, referenceForwardSamples, referenceZeroSamples, samplesByDate, type ReferenceCurve } from '../../../src/core/index.ts';
import { sampleGrid, zeroSamples } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

const fixture = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const curveOf = (doc: Record<string, unknown>): Curve => {
  const b = buildCurve(doc);
  if (!b.curve) throw new Error(b.errors.map((e) => e.message).join('; '));
  return b.curve;
};
const curve = curveOf(fixture);
const S = curve.settlement;
const Y = parseTenor('1Y')!;
const ref = (kind: 'zero' | 'discount', compounding: ReferenceCurve['compounding'], dayCount: ReferenceCurve['dayCount'], values: number[], tenor = Y): ReferenceCurve => ({
  kind,
  compounding,
  dayCount,
  points: values.map((value, i) => ({ date: addTenor(S, tenor, i + 1), value })),
});

describe('referenceZeroSamples', () => {
  it('turns an annual zero into the continuous one over a whole year (Hull, Options, Futures, and Other Derivatives, ch. 4: 10% annual is 9.531% continuous, ln 1.1)', () => {
    // On 30/360 each year after settlement is exactly 1, so the conversion is R_c = ln(1 + R_a).
    const s = referenceZeroSamples(ref('zero', 'annual', '30/360', [0.1]), curve, 'continuous', '30/360');
    expect(s.dates).toEqual([addTenor(S, Y)]);
    expectClose(s.y[0]!, 0.0953101798043249, 1e-15, 'Hull ch. 4: 10% with annual compounding = 9.5310% continuous (ln 1.1, value from memory)');
    expectClose(s.x[0]!, curve.time(addTenor(S, Y)), 0, 'x is the date on the curve axis');
  });

  it('reads a discount factor as its continuous zero -ln(D)/tau and agrees with the reference table at every date', () => {
    const r = parseReferenceCsv(`date,discount\n${addTenor(S, Y)},0.95\n${addTenor(S, Y, 2)},0.9\n${S},1`, 'continuous', 'ACT/365F').reference!;
    const s = referenceZeroSamples(r, curve, 'continuous', 'ACT/365F');
    expect(s.dates.length).toBe(2); // settlement itself has no period
    const tau = (Date.parse(addTenor(S, Y)) - Date.parse(S)) / 86_400_000 / 365;
    expectClose(s.y[0]!, -Math.log(0.95) / tau, 1e-15, 'continuous zero = -ln(DF)/tau (definition, Hull ch. 4)');
    const table = referenceDifferences(curve, r).filter((row) => row.referenceZero !== null);
    table.forEach((row, i) => expectClose(s.y[i]!, row.referenceZero!, 1e-15, 'the snapshot section table (referenceDifferences) at the same date'));
  });
});

describe('referenceForwardSamples', () => {
  it("gives the one-year forwards of Hull's forward-rate table exactly (zeros 3, 4, 4.6, 5, 5.3% continuous: forwards 5.0, 5.8, 6.2, 6.5%)", () => {
    const r = ref('zero', 'continuous', '30/360', [0.03, 0.04, 0.046, 0.05, 0.053]);
    const f = referenceForwardSamples(r, curve, Y, 'continuous', '30/360');
    expect(f.exact).toBe(true);
    // Starts: settlement (the first year's forward is the 1-year zero), then years 1 to 4.
    const expected = [0.03, 0.05, 0.058, 0.062, 0.065];
    expect(f.samples.dates).toEqual([S, ...[1, 2, 3, 4].map((k) => addTenor(S, Y, k))]);
    expected.forEach((e, i) => expectClose(f.samples.y[i]!, e, 1e-14, "Hull, Options, Futures, and Other Derivatives, ch. 4, forward rate table (from memory)"));
  });

  it('draws no forward line when no two reference dates are the forward tenor apart', () => {
    const r = ref('zero', 'continuous', 'ACT/365F', [0.03, 0.04, 0.046]);
    const f = referenceForwardSamples(r, curve, parseTenor('3M')!, 'continuous', 'ACT/365F');
    expect(f.exact).toBe(false);
    expect(f.samples.dates).toEqual([]);
  });
});

describe('samplesByDate', () => {
  it("keeps each sample's value and date, puts it at the date's years on the current axis, and leaves out dates on or before the current settlement", () => {
    // An earlier settlement: one month before, built from the same quotes.
    const s0 = addTenor(S, { ...parseTenor('1M')!, n: -1 });
    const other = curveOf({ ...fixture, settlement: s0 });
    const grid = sampleGrid(other.settlement, addTenor(other.settlement, parseTenor('5Y')!), 50, other.dayCount, 'ACT/365F', Y);
    const samples = zeroSamples(other, grid, 'continuous');
    const moved = samplesByDate(samples, curve);
    expect(moved.dates.every((d) => d > S)).toBe(true);
    expect(moved.dates.length).toBeLessThan(samples.dates.length);
    moved.dates.forEach((d, i) => {
      expect(moved.x[i]).toBe(curve.time(d));
      const z = zeroOn(other, d, 'continuous', 'ACT/365F');
      expectClose(moved.y[i]!, z.ok ? z.value.zero : NaN, 1e-14, "zeroOn on the other curve at the same date (compareCurves' 'date' reading)");
    });
  });
});
