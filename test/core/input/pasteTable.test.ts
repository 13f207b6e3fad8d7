// The paste reader: tab-separated text as spreadsheets put it on the clipboard, and CSV as in
// RFC 4180 (quoted fields, doubled quotes).
import { headerColumn, looksLikeTable, PASTE_TEXT_MAX, pasteQuoteCap, pasteSizeRefusal, previewPaste, readPastedBlock, splitTable } from '../../../src/core/index.ts';

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

// Delimiter detection and header words for real sheets. CSV quoting is RFC 4180 (a quoted field
// may hold the delimiter); the short header forms (px, cpn, mat, yld, mid) are common practice on
// trading sheets, not a standard.
describe('splitTable: delimiter detection', () => {
  it('a tab inside a quoted CSV field leaves the block comma-separated (RFC 4180 section 2, rule 6)', () => {
    const { cells, separator } = splitTable('kind,maturity,rate,note\nswap,10Y,4.02,"desk\tA"\ndeposit,3M,4.4,"b"\n');
    expect(separator).toBe(',');
    expect(cells).toEqual([
      ['kind', 'maturity', 'rate', 'note'],
      ['swap', '10Y', '4.02', 'desk\tA'],
      ['deposit', '3M', '4.4', 'b'],
    ]);
  });
  it('a quoted field may hold a line break (RFC 4180 section 2, rule 6)', () => {
    expect(splitTable('kind,note\nswap,"two\nlines"').cells).toEqual([
      ['kind', 'note'],
      ['swap', 'two\nlines'],
    ]);
  });
  it('tab-separated rows with decimal commas stay tab-separated (the wider consistent reading wins)', () => {
    expect(splitTable('deposit\t3M\t4,4\nswap\t10Y\t4,02').separator).toBe('\t');
  });
  it('semicolon-separated CSV (where the comma is the decimal mark) is read by semicolons', () => {
    const { cells, separator } = splitTable('kind;maturity;rate\nswap;10Y;4,02\ndeposit;3M;4,4');
    expect(separator).toBe(';');
    expect(cells[1]).toEqual(['swap', '10Y', '4,02']);
  });
});

describe('readPastedBlock: header words of real sheets', () => {
  it('reads mat / px / cpn / type as maturity, price, coupon and kind, and shows how each column was read', () => {
    const block = readPastedBlock('Type\tMat\tPx\tCpn\tDesk\nbond\t2031-11-15\t99-16\t4.25\tA\n');
    expect(block.rows).toEqual([{ kind: 'bond', maturity: '2031-11-15', rate: '', price: '99-16', coupon: '4.25', frequency: '', dayCount: '' }]);
    expect(block.columns.map((c) => c.column)).toEqual(['kind', 'maturity', 'price', 'coupon', null]);
    expect(block.columns[4]!.reason).toMatch(/not a known column/);
    expect(block.columns[2]!.sample).toEqual(['99-16']);
  });
  it('"mid" is read as prices when its values look like prices per 100, as rates otherwise', () => {
    expect(readPastedBlock('instrument,tenor,mid\nbond,5Y,99.5\nbond,10Y,101-08').columns[2]!.column).toBe('price');
    expect(readPastedBlock('instrument,tenor,mid\nswap,5Y,3.9\nswap,10Y,4.02').columns[2]!.column).toBe('rate');
  });
  it('a column named twice is read from its first occurrence; the second is listed as ignored', () => {
    const block = readPastedBlock('kind,tenor,yield,rate\nswap,5Y,3.9,9.9');
    expect(block.rows[0]!.rate).toBe('3.9');
    expect(block.columns[3]!.column).toBeNull();
    expect(block.ignored).toEqual(['rate']);
  });
});

describe('previewPaste', () => {
  it('counts the rows that read as quotes and refuses a replacement that would leave no quote', () => {
    const good = previewPaste(readPastedBlock('kind,tenor,rate\nswap,5Y,3.9\nswap,xx,4'), 'percent');
    expect(good).toMatchObject({ rows: 2, quotes: 1, withErrors: 1, refusal: null });
    const none = previewPaste(readPastedBlock('kind,tenor,rate\nfoo,5Y,3.9\nbar,10Y,4'), 'percent');
    expect(none.quotes).toBe(0);
    expect(none.refusal).toMatch(/none of the 2 pasted rows reads as a quote/);
  });
  it('keeps the first rows up to the document cap on quotes and counts the rest (the paste reads the cap through pasteQuoteCap)', () => {
    const cap = pasteQuoteCap();
    const text = ['kind,tenor,rate', ...Array.from({ length: cap + 1 }, (_, i) => `swap,${i + 1}Y,4`)].join('\n');
    const p = previewPaste(readPastedBlock(text), 'percent', 10);
    expect(p.refusal).toBeNull();
    expect(p).toMatchObject({ rows: cap + 1, quotes: cap, leftOut: 1, appendLeftOut: 11 });
    const full = previewPaste(readPastedBlock('kind,tenor,rate\nswap,5Y,4'), 'percent', cap);
    expect(full.appendRefusal).toMatch(new RegExp(`already holds ${cap} rows, the most it takes`));
  });
});

describe('pasteSizeRefusal', () => {
  it('names the cause: a block above PASTE_TEXT_MAX characters, or one cell value above the cell cap', () => {
    expect(pasteSizeRefusal(5_000_000, true)).toBe(`the pasted text is 5.0 MB; a paste is read up to 1.0 MB (the sheet holds at most ${pasteQuoteCap()} quotes). Paste fewer rows`);
    expect(pasteSizeRefusal(5_000_000, false)).toBe('the pasted text is 5.0 MB; a cell holds at most 64 characters');
    expect(pasteSizeRefusal(PASTE_TEXT_MAX, true)).toBeNull();
    expect(pasteSizeRefusal(64, false)).toBeNull();
  });
  it('looksLikeTable reads only the start of a long one-line text', () => {
    expect(looksLikeTable(`swap,${'x'.repeat(3_000_000)}`)).toBe(true);
    expect(looksLikeTable('x'.repeat(3_000_000))).toBe(false);
  });
});
