// The chart sampler against the core's own queries (zeroOn, forwardOn, parYieldOn,
// instantaneousForwardOn) as the oracle: at every sample the same value to within a few ulps.
import { addTenor, buildCurve, curveTime, queryYearFraction, forwardOn, instantaneousForwardOn, parseTenor, parYieldOn, zeroOn, type Compounding } from '../../../src/core/index.ts';
import { forwardSamples, instantaneousSamples, parBondsGrid, parGrid, parSamples, sampleDays, sampleGrid, toEngineDocument, zeroSamples , readWorkbenchDocument, FORWARD_TENORS } from '../../../src/core/index.ts';
import { demoWorkspace } from '../../../src/state/demoWorkspace.ts';
import { expectClose } from '../../helpers/asserts.ts';

let n = 0;
const demo = demoWorkspace(() => `s${n++}`);
const ORACLE = 'the core query at the same date (src/core/curve/query.ts)';

// The grids work on civil dates and day serials; the queries parse ISO text: the curve clocks
// 30/360-US (month-end rules) and ACT/ACT-ISDA (leap years) check the two paths agree.
describe.each([
  ['none', 'ACT/365F'],
  ['flat-forward', 'ACT/365F'],
  ['flat-forward', '30/360-US'],
  ['none', 'ACT/ACT-ISDA'],
] as const)('samplers on the demo curve, extrapolation %s, curve day count %s', (extrapolation, dayCount) => {
  const curve = buildCurve(toEngineDocument({ ...demo, curve: { ...demo.curve, extrapolation, dayCount } }).doc).curve!;
  const end = '2060-06-15';
  const grid = sampleGrid(curve.settlement, end, 120, curve.dayCount, 'ACT/360', parseTenor('6M')!);

  it('puts each grid date on the curve clock as curveTime does, and the display fractions as queryYearFraction', () => {
    expect(curve.dayCount).toBe(dayCount);
    grid.dates.forEach((d, i) => {
      expect(grid.t[i]).toBe(curveTime(dayCount, curve.settlement, d));
      expect(grid.tauZero[i]).toBe(queryYearFraction('ACT/360', curve.settlement, d));
      const e = addTenor(d, parseTenor('6M')!);
      expect(grid.endT[i]).toBe(curveTime(dayCount, curve.settlement, e));
      expect(grid.tauForward[i]).toBe(queryYearFraction('ACT/360', d, e));
    });
  });

  it.each(['continuous', 'annual', 'simple'] as Compounding[])('zeroSamples agrees with zeroOn (%s, ACT/360)', (c) => {
    const s = zeroSamples(curve, grid, c);
    expect(s.dates.length).toBeGreaterThan(50);
    s.dates.forEach((d, i) => {
      const z = zeroOn(curve, d, c, 'ACT/360');
      expect(z.ok, d).toBe(true);
      if (z.ok) {
        expectClose(s.y[i]!, z.value.zero, 1e-15, ORACLE);
        expect(s.extrapolated[i]).toBe(z.value.extrapolated);
      }
    });
    // Every grid date the query refuses is left out, none that it accepts.
    const accepted = grid.dates.filter((d) => d !== curve.settlement && zeroOn(curve, d, c, 'ACT/360').ok);
    expect(s.dates).toEqual(accepted);
  });

  it('forwardSamples agrees with forwardOn over 6M periods', () => {
    const s = forwardSamples(curve, grid, 'quarterly');
    s.dates.forEach((d, i) => {
      const f = forwardOn(curve, d, addTenor(d, parseTenor('6M')!), 'quarterly', 'ACT/360');
      expect(f.ok, d).toBe(true);
      if (f.ok) expectClose(s.y[i]!, f.value.rate, 1e-15, ORACLE);
    });
  });

  it.each([1, 2, 4, 12])('parSamples on the monthly ladder agrees with parYieldOn (%i coupons a year)', (frequency) => {
    const pg = parGrid(curve.settlement, end, curve.dayCount, frequency);
    const s = parSamples(curve, pg);
    expect(s.dates.length).toBeGreaterThan(20);
    s.dates.forEach((d, i) => {
      const p = parYieldOn(curve, d, frequency);
      expect(p.ok, d).toBe(true);
      if (p.ok) expectClose(s.y[i]!, p.value.rate, 1e-15, ORACLE);
    });
  });

  it('parBondsGrid (the quote markers) agrees with parYieldOn at arbitrary maturities', () => {
    const mats = ['2027-03-17', '2031-02-28', '2044-12-31', '2056-07-09'];
    const s = parSamples(curve, parBondsGrid(curve.settlement, mats, curve.dayCount, 2));
    expect(s.dates).toEqual(mats.filter((d) => parYieldOn(curve, d, 2).ok));
    s.dates.forEach((d, i) => {
      const p = parYieldOn(curve, d, 2);
      if (p.ok) expectClose(s.y[i]!, p.value.rate, 1e-15, ORACLE);
    });
  });

  it('instantaneousSamples agrees with instantaneousForwardOn', () => {
    const s = instantaneousSamples(curve, grid);
    s.dates.forEach((d, i) => {
      const f = instantaneousForwardOn(curve, d);
      if (f.ok) expect(s.y[i]).toBe(f.value.forward);
    });
  });
});

describe('sampleDays', () => {
  it('is ascending, distinct, from 0 to the end, and densest at the short end', () => {
    const d = sampleDays(11000, 400);
    expect(d[0]).toBe(0);
    expect(d[d.length - 1]).toBe(11000);
    for (let i = 1; i < d.length; i++) expect(d[i]!).toBeGreaterThan(d[i - 1]!);
    expect(d[1]!).toBeLessThanOrEqual(14);
  });
});

// The par ladder shares coupon dates between bonds; from a settlement on the 29th to the 31st a
// maturity in a shorter month is clipped and counts its coupons back from the clipped day, so it
// is left out. Every bond drawn must still be exactly the bond parYieldOn prices.
describe.each(['2026-12-29', '2026-12-30', '2027-01-31', '2027-08-31'])('par ladder from a settlement on %s', (settlement) => {
  const curve = buildCurve(toEngineDocument({ ...demo, settlement }).doc).curve!;
  const end = addTenor(settlement, parseTenor('30Y')!);
  const grid = parGrid(settlement, end, curve.dayCount, 2);
  const s = parSamples(curve, grid);

  it('draws each whole month whose day is the settlement day, a few bonds shorter than a month, and the end date', () => {
    const day = Number(settlement.slice(8));
    const months: string[] = [];
    for (let m = 1; m <= 360; m++) {
      const d = addTenor(settlement, parseTenor('1M')!, m);
      if (Number(d.slice(8)) === day && d <= end) months.push(d);
    }
    const firstMonth = addTenor(settlement, parseTenor('1M')!);
    const short = s.dates.filter((d) => d < firstMonth);
    expect(short.length).toBeGreaterThanOrEqual(3);
    expect(short.length).toBeLessThanOrEqual(8);
    expect(s.dates.slice(short.length)).toEqual(months.at(-1) === end ? months : [...months, end]);
    expect([...s.dates].sort()).toEqual(s.dates); // ascending
    expect(new Set(s.dates).size).toBe(s.dates.length);
    expect(s.dates.length).toBeGreaterThan(day === 31 ? 200 : 300);
  });

  it('agrees with parYieldOn at every bond drawn', () => {
    s.dates.forEach((d, i) => {
      const p = parYieldOn(curve, d, 2);
      expect(p.ok, d).toBe(true);
      if (p.ok) expectClose(s.y[i]!, p.value.rate, 1e-15, ORACLE);
    });
  });
});

// The forward tenors the workbench offers run from one day to ten years: the chart's forward
// samples for the shortest and the longest agree with the query, and the document keeps them.
describe.each(['1D', '10Y'] as const)('forward samples for the %s tenor on the demo curve', (tenorText) => {
  const curve = buildCurve(toEngineDocument({ ...demo, curve: { ...demo.curve, extrapolation: 'flat-forward' } }).doc).curve!;
  const tenor = parseTenor(tenorText)!;
  const grid = sampleGrid(curve.settlement, '2056-12-15', 120, curve.dayCount, 'ACT/365F', tenor);
  it('forwardSamples agrees with forwardOn over the tenor', () => {
    const s = forwardSamples(curve, grid, 'continuous');
    expect(s.dates.length).toBeGreaterThan(100);
    s.dates.forEach((d, i) => {
      const f = forwardOn(curve, d, addTenor(d, tenor), 'continuous', 'ACT/365F');
      expect(f.ok, d).toBe(true);
      if (f.ok) expectClose(s.y[i]!, f.value.rate, 1e-15, ORACLE);
    });
  });
  it('is one of the forward tenors a saved document keeps', () => {
    const back = readWorkbenchDocument({ ...demo, display: { ...demo.display, forwardTenor: tenorText } }, () => 'r');
    expect(back.doc?.display.forwardTenor).toBe(tenorText);
    expect(FORWARD_TENORS).toContain(tenorText);
  });
});
