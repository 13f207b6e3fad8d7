// The paste reader: tab-separated text as spreadsheets put it on the clipboard, and CSV as in
// RFC 4180 (quoted fields, doubled quotes).
import { headerColumn, looksLikeTable, readPastedBlock, splitTable } from '../../../src/core/input/index.ts';

describe('splitTable', () => {
  it('splits tab-separated rows, dropping blank lines and trailing newlines', () => {
    expect(splitTable('a\tb\r\nc\td\n\n').cells).toEqual([
      ['a', 'b'],
      ['c', 'd'],
    ]);
  });
  it('reads RFC 4180 CSV: quoted commas and doubled quotes', () => {
    expect(splitTable('kind,"day count"\nbond,"ACT/ACT-ICMA"\n"a,b","say ""hi"""').cells).toEqual([
      ['kind', 'day count'],
      ['bond', 'ACT/ACT-ICMA'],
      ['a,b', 'say "hi"'],
    ]);
  });
});

describe('readPastedBlock', () => {
  it('maps header words case-insensitively: type, tenor, yield, clean price, freq, day count', () => {
    const block = readPastedBlock('Type\tTenor\tYield\tClean Price\tCoupon\tFrequency\tDay Count\nBOND\t5Y\t\t99.5\t3.5\t2\tACT/ACT-ICMA\n');
    expect(block.header).toBe(true);
    expect(block.rows).toEqual([{ kind: 'BOND', maturity: '5Y', rate: '', price: '99.5', coupon: '3.5', frequency: '2', dayCount: 'ACT/ACT-ICMA' }]);
  });
  it('maps instrument / term / rate / price and lists unknown header columns as ignored', () => {
    const block = readPastedBlock('instrument,term,rate,price,source\nswap,10Y,4.02,,desk');
    expect(block.rows[0]).toMatchObject({ kind: 'swap', maturity: '10Y', rate: '4.02' });
    expect(block.ignored).toEqual(['source']);
  });
  it('a first row with numbers is data, not a header', () => {
    const block = readPastedBlock('deposit\t3M\t4.4\nswap\t10Y\t4.02');
    expect(block.header).toBe(false);
    expect(block.cells).toEqual([
      ['deposit', '3M', '4.4'],
      ['swap', '10Y', '4.02'],
    ]);
  });
  it('headerColumn knows each documented header word', () => {
    for (const [word, col] of [
      ['kind', 'kind'], ['type', 'kind'], ['instrument', 'kind'], ['maturity', 'maturity'], ['tenor', 'maturity'], ['term', 'maturity'],
      ['rate', 'rate'], ['yield', 'rate'], ['coupon', 'coupon'], ['price', 'price'], ['clean price', 'price'], ['frequency', 'frequency'], ['day count', 'dayCount'],
    ] as const) expect(headerColumn(word), word).toBe(col);
  });
});

describe('looksLikeTable', () => {
  it('is true for tabs or several lines, false for one value (a European 3,25 stays a cell value)', () => {
    expect(looksLikeTable('a\tb')).toBe(true);
    expect(looksLikeTable('3.1\n3.2')).toBe(true);
    expect(looksLikeTable('3.25')).toBe(false);
    expect(looksLikeTable('3,25')).toBe(false);
    expect(looksLikeTable('swap,10Y,4.02')).toBe(true);
  });
});
