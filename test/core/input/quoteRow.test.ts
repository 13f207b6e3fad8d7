// Sheet rows to the engine's quote objects (field names from src/core/workspace/types.ts).
import { buildCurve } from '../../../src/core/index.ts';
import { parseRow, rowIssuesFromEngine, toEngineDocument, type QuoteRow } from '../../../src/core/index.ts';

const row = (p: Partial<QuoteRow>): QuoteRow => ({ id: 'r', enabled: true, kind: '', maturity: '', rate: '', price: '', coupon: '', frequency: '', dayCount: '', ...p });

describe('parseRow', () => {
  it('a deposit row gives {kind, tenor, rate} with the rate as a decimal', () => {
    expect(parseRow(row({ kind: 'deposit', maturity: '3M', rate: '4.40' }), 'percent')).toEqual({ quote: { kind: 'deposit', tenor: '3M', rate: 0.044 }, issues: {}, blank: false });
  });
  it('a bond by price gives cleanPrice and coupon; by yield gives yield', () => {
    expect(parseRow(row({ kind: 'bond', maturity: '2031-11-15', price: '99.20', coupon: '3.625', frequency: '2' }), 'percent').quote).toEqual({
      kind: 'bond', maturity: '2031-11-15', cleanPrice: 99.2, coupon: 0.03625, frequency: 2,
    });
    expect(parseRow(row({ kind: 'bond', maturity: '5Y', rate: '3.8', coupon: '3.5' }), 'percent').quote).toMatchObject({ yield: 0.038, coupon: 0.035 });
  });
  it('a bill rate is its discount yield', () => {
    expect(parseRow(row({ kind: 'bill', maturity: '6M', rate: '4.34' }), 'percent').quote).toEqual({ kind: 'bill', tenor: '6M', discountYield: 0.0434 });
  });
  it('a switched-off row carries enabled: false', () => {
    expect(parseRow(row({ kind: 'swap', maturity: '10Y', rate: '4', enabled: false }), 'percent').quote).toMatchObject({ enabled: false });
  });
  it('marks each wrong cell with what would be valid, and gives no quote', () => {
    const p = parseRow(row({ kind: 'swap', maturity: '10Q', rate: '4', price: '99', coupon: '3' }), 'percent');
    expect(p.quote).toBeNull();
    expect(p.issues.maturity?.message).toMatch(/not a maturity/);
    expect(p.issues.price?.message).toBe('a swap takes no price; clear this cell');
    expect(p.issues.coupon?.message).toBe('a swap takes no coupon; clear this cell');
  });
  it('a rate and a price on one bond row is refused on both cells', () => {
    const p = parseRow(row({ kind: 'bond', maturity: '5Y', rate: '4', price: '99', coupon: '3' }), 'percent');
    expect(p.issues.rate?.message).toMatch(/either the yield or the price, not both/);
    expect(p.issues.price?.message).toMatch(/not both/);
  });
  it('a blank row is neither a quote nor an error', () => {
    expect(parseRow(row({}), 'percent')).toEqual({ quote: null, issues: {}, blank: true });
  });
});

describe('toEngineDocument and rowIssuesFromEngine', () => {
  const doc = {
    settlement: '2026-12-15',
    curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount', extrapolation: 'none' } as const,
    quoteUnit: 'percent' as const,
    quotes: [
      row({ id: 'a', kind: 'deposit', maturity: '3M', rate: '4.4' }),
      row({ id: 'b', kind: 'swap', maturity: 'x', rate: '4' }),
      row({ id: 'c', kind: 'swap', maturity: '2Y', rate: '4.1' }),
      row({ id: 'd', kind: 'swap', maturity: '2Y', rate: '4.2' }),
    ],
  };
  it('keeps only rows that parse, and maps engine quote indices back to sheet rows', () => {
    const conv = toEngineDocument(doc);
    expect(conv.rowOfQuote).toEqual([0, 2, 3]);
    expect(conv.invalidRows).toBe(1);
  });
  it('an engine error on quotes[2] (a duplicate pillar) lands on sheet row 4, worded with row numbers', () => {
    const conv = toEngineDocument(doc);
    const build = buildCurve(conv.doc, { skipInvalid: true });
    expect(build.curve).not.toBeNull();
    const skipped = build.warnings.filter((w) => w.code === 'skipped');
    const issues = rowIssuesFromEngine(skipped, conv.rowOfQuote);
    expect([...issues.keys()]).toEqual([3]);
    expect(issues.get(3)?.maturity?.message).toMatch(/row 4 \(swap 2028-12-15\) and row 3/);
  });
});
