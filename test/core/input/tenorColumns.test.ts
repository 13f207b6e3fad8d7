// A published par curve pasted as it is laid out: a header of tenors and rows of yields in percent
// (input/tenorColumns.ts through readPastedBlock and previewPaste). The row is US Treasury's
// Daily Treasury Par Yield Curve Rates, first row of the September 2023 page (home.treasury.gov
// TextView, type=daily_treasury_yield_curve, month 202309); the search tool's copy of the page lost
// its Date column, so the date 09/01/2023 (the month's first business day, the page's rows running
// in date order) is from that order, the yields are the page's.
import { describe, expect, it } from 'vitest';
import { buildCurve, parseRow, previewPaste, readPastedBlock, tenorHeading, type RowText } from '../../../src/core/index.ts';
import { workspaceDoc } from '../../helpers/markets.ts';

const HEADER = ['Date', '1 Mo', '2 Mo', '3 Mo', '4 Mo', '6 Mo', '1 Yr', '2 Yr', '3 Yr', '5 Yr', '7 Yr', '10 Yr', '20 Yr', '30 Yr'];
const ROW_2023_09_01 = ['09/01/2023', '5.51', '5.55', '5.53', '5.58', '5.47', '5.36', '4.87', '4.57', '4.29', '4.27', '4.18', '4.48', '4.29'];
/** The second row of the same page (2023-09-05, the next business day after Labor Day). */
const ROW_2023_09_05 = ['09/05/2023', '5.51', '5.56', '5.55', '5.59', '5.51', '5.42', '4.94', '4.65', '4.37', '4.35', '4.27', '4.56', '4.38'];
const TENORS = ['1M', '2M', '3M', '4M', '6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y'];

const tsv = (rows: readonly (readonly string[])[]): string => rows.map((r) => r.join('\t')).join('\n');
const quotesOf = (rows: readonly RowText[]) => rows.map((r, i) => parseRow({ id: String(i), enabled: true, ...r }, 'decimal'));

describe('readPastedBlock on a par curve laid out by tenor', () => {
  it('reads the published row as one par-yield quote per tenor, in percent, and round trips to 1e-12', () => {
    const block = readPastedBlock(tsv([HEADER, ROW_2023_09_01]));
    expect(block.header).toBe(true);
    expect(block.byTenor).toBe(true);
    expect(block.rows.map((r) => r.maturity)).toEqual(TENORS);
    expect(block.rows.every((r) => r.kind === 'par-yield')).toBe(true);
    // Read in percent whatever the sheet's unit mode (here decimal): 5.51 is 5.51 %.
    const parsed = quotesOf(block.rows);
    expect(parsed.map((p) => p.issues)).toEqual(parsed.map(() => ({})));
    // Exact decimal reading: 5.51 % is the double nearest 0.0551 (Number("5.51e-2")).
    expect(parsed.map((p) => p.quote!.yield)).toEqual(ROW_2023_09_01.slice(1).map((v) => Number(`${v}e-2`)));
    expect(block.columns[0]).toMatchObject({ header: 'Date', column: null, readAs: 'date (reported only)', sample: ['09/01/2023'] });
    expect(block.columns[1]).toMatchObject({ header: '1 Mo', column: 'rate', readAs: 'par yield 1M', sample: ['5.51'] });
    expect(block.notes!.join(' ')).toMatch(/Date 09\/01\/2023: the curve's date as pasted, reported only; it sets nothing/);
    const preview = previewPaste(block, 'percent');
    expect(preview).toMatchObject({ rows: 13, quotes: 13, withErrors: 0, refusal: null });

    const build = buildCurve(workspaceDoc(parsed.map((p) => p.quote as Record<string, string | number>), { settlement: '2023-09-01' }));
    expect(build.errors).toEqual([]);
    for (const r of build.repricing) expect(Math.abs(r.repricingError), r.maturity).toBeLessThanOrEqual(1e-12);
  });

  it('reads the short forms 1M 3M 1Y without a date column, comma-separated', () => {
    const block = readPastedBlock('1M,3M,1Y,10Y\n5.51,5.53,5.36,4.18\n');
    expect(block.byTenor).toBe(true);
    expect(block.rows.map((r) => [r.maturity, r.rate])).toEqual([
      ['1M', '5.51%'],
      ['3M', '5.53%'],
      ['1Y', '5.36%'],
      ['10Y', '4.18%'],
    ]);
    expect(block.notes!.some((n) => /reported only/.test(n))).toBe(false);
  });

  it('uses the last of several dated rows and says so', () => {
    const block = readPastedBlock(tsv([HEADER, ROW_2023_09_01, ROW_2023_09_05]));
    expect(block.rows.map((r) => r.rate)).toEqual(ROW_2023_09_05.slice(1).map((v) => `${v}%`));
    expect(block.notes).toContain('2 rows of yields: the last (dated 09/05/2023) is used; the other 1 are left out.');
    expect(previewPaste(block, 'percent').rows).toBe(13);
  });

  it('skips a tenor whose cell is empty or N/A and says so', () => {
    const row = [...ROW_2023_09_01];
    row[2] = '';
    row[4] = 'N/A';
    const block = readPastedBlock(tsv([HEADER, row]));
    expect(block.rows.map((r) => r.maturity)).toEqual(TENORS.filter((t) => t !== '2M' && t !== '4M'));
    expect(block.notes).toContain('2 Mo (column 3): empty in the row used, so this column gives no 2M quote.');
    expect(block.notes).toContain('4 Mo (column 5): N/A in the row used, so this column gives no 4M quote.');
  });

  it('names a heading that is not a tenor and ignores its column', () => {
    const head = [...HEADER];
    head[3] = '13 Wk?';
    const block = readPastedBlock(tsv([head, ROW_2023_09_01]));
    expect(block.byTenor).toBe(true);
    expect(block.rows).toHaveLength(12);
    expect(block.ignored).toEqual(['13 Wk?']);
    expect(block.notes).toContain('"13 Wk?" (column 4) is not a tenor heading such as 1 Mo, 3M, 2 Yr or 10Y: its column is ignored.');
  });

  it('reads the web page table with its long-term and bill columns: N/A columns skipped, the curve read', () => {
    // The page's full header (20 YR and 30 YR long-term columns, the extrapolation factor, bank
    // discount and coupon equivalent columns) as copied from the table, the row as on the page.
    const head = ['Date', '20 YR', '30 YR', 'Extrapolation Factor', '8 WEEKS BANK DISCOUNT', 'COUPON EQUIVALENT', '17 WEEKS BANK DISCOUNT', 'COUPON EQUIVALENT', '52 WEEKS BANK DISCOUNT', 'COUPON EQUIVALENT', ...HEADER.slice(1)];
    const row = ['09/01/2023', ...Array<string>(9).fill('N/A'), ...ROW_2023_09_01.slice(1)];
    const block = readPastedBlock(tsv([head, row]));
    expect(block.rows.map((r) => r.maturity)).toEqual(TENORS);
    expect(block.rows.find((r) => r.maturity === '20Y')!.rate).toBe('4.48%');
    expect(block.ignored).toContain('Extrapolation Factor');
  });

  it('reads 1.5 Mo as six weeks and keeps ordinary sheets as before', () => {
    expect(tenorHeading('1.5 Mo')).toEqual({ tenor: '6W', note: '"1.5 Mo" read as 6W (six weeks)' });
    expect(tenorHeading('10 YR')).toEqual({ tenor: '10Y', note: null });
    expect(tenorHeading('0 Mo')).toBeNull();
    expect(tenorHeading('Rate')).toBeNull();
    const sheet = readPastedBlock('Kind\tMaturity\tRate\nswap\t5Y\t3.1\n');
    expect(sheet.byTenor).toBeUndefined();
    expect(sheet.rows).toHaveLength(1);
    // A header-less paste of numbers is still cells, not tenors.
    expect(readPastedBlock('5Y\t3.1\n7Y\t3.2\n').header).toBe(false);
  });
});
