// CSV writing and reading, formula-injection escaping and the curve table export.
import { readFileSync } from 'node:fs';
import { addTenor, buildCurve } from '../../../src/core/index.ts';
import { csvCell, curveTableCsv, curveTablePoints, defaultTableConventions, parseCsv, toCsv, type CurveTableGrid } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

describe('csvCell(cell): formula injection (OWASP "CSV Injection", cited from memory)', () => {
  it('prefixes text starting with = + - @ tab or CR with an apostrophe', () => {
    expect(csvCell('=HYPERLINK("http://x")')).toBe(`"'=HYPERLINK(""http://x"")"`);
    expect(csvCell('+1+2')).toBe("'+1+2");
    expect(csvCell('-2+3')).toBe("'-2+3");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('\tcmd')).toBe("'\tcmd");
  });
  it('does not mangle negative numbers, as numbers or as plain numeric text', () => {
    expect(csvCell(-0.0025)).toBe('-0.0025');
    expect(csvCell('-12.5')).toBe('-12.5');
    expect(csvCell('-1e-5')).toBe('-1e-5');
    expect(csvCell('+3')).toBe('+3');
  });
  it('quotes commas, quotes and line breaks (RFC 4180) and refuses NaN', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "x"')).toBe('"say ""x"""');
    expect(csvCell(null)).toBe('');
    expect(() => csvCell(Number.NaN)).toThrow(RangeError);
  });
  it('parseCsv reads back what toCsv writes (apostrophe kept, as a spreadsheet shows it)', () => {
    const rows = [['a,b', 'line\nbreak', '"q"'], ['=1', '-2', '']];
    const { rows: back, error } = parseCsv(toCsv(rows));
    expect(error).toBeNull();
    expect(back).toEqual([['a,b', 'line\nbreak', '"q"'], ["'=1", '-2', '']]);
    expect(parseCsv('"open\n').error).toContain('not closed');
  });
});

describe('curveTableCsv(curve, conventions)', () => {
  const doc = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
  const curve = buildCurve(doc).curve!;
  const csv = curveTableCsv(curve, defaultTableConventions(curve), ['1Y', '5Y', '2099-01-01']);
  const { rows } = parseCsv(csv);

  it('carries the compounding and day count of every rate in the header', () => {
    expect(rows[1]).toEqual(['date', 't (years, ACT/365F)', 'discount factor', 'zero (cont, ACT/365F)', 'par (s.a., ACT/ACT-ICMA)', 'forward 3M (simple, ACT/360)', 'extrapolated (past the last pillar)']);
    expect(rows[0]![0]).toBe('settlement 2026-11-30');
  });
  it('writes full-precision numbers that read back to the curve values', () => {
    const row = rows[3]!;
    expect(row[0]).toBe('2031-11-30');
    expectClose(Number(row[2]), Math.exp(curve.lnDiscountAt(curve.time('2031-11-30'))), 0, 'discount factor written with the shortest round-trip digits');
    expectClose(Number(row[3]), -curve.lnDiscountAt(curve.time('2031-11-30')) / curve.time('2031-11-30'), 1e-15, 'continuous zero on the curve axis = -ln DF / t');
  });
  it('extrapolates flat-forward when the workspace says so', () => {
    expect(rows[4]![0]).toBe('2099-01-01');
    expect(rows[4]![3]).not.toBe('');
  });
  it('flags the points past the last pillar, and only those', () => {
    expect(rows.slice(2).map((r) => r[6])).toEqual(['', '', 'yes']);
  });
});

describe('curveTablePoints(curve, grid)', () => {
  const doc = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
  const curve = buildCurve(doc).curve!;
  const last = curve.pillars[curve.pillars.length - 1]!.date;
  it('pillars: the pillar dates', () => {
    expect(curvePointsOf('pillars')).toEqual(curve.pillars.map((p) => p.date));
  });
  it.each([['monthly', 1], ['quarterly', 3], ['yearly', 12]] as const)('%s: settlement plus whole steps counted from settlement, up to the first on or after the last pillar', (grid, months) => {
    const pts = curvePointsOf(grid);
    pts.forEach((d, k) => expect(d).toBe(addTenor(curve.settlement, { n: months, unit: 'M' }, k + 1)));
    expect(pts[pts.length - 1]! >= last).toBe(true);
    expect(pts[pts.length - 2]! < last).toBe(true);
  });
  it('dates: the user\'s own points in their order', () => {
    expect(curvePointsOf('dates', ['10Y', '2030-01-31', '1M'])).toEqual(['10Y', '2030-01-31', '1M']);
  });
  function curvePointsOf(grid: CurveTableGrid, own?: string[]) {
    return curveTablePoints(curve, grid, own);
  }
});
