import { rowNumber } from '../../src/components/format.ts';
import { nearZero } from '../../src/core/index.ts';

describe('nearZero (figures a desk reads)', () => {
  it('nearZero(x, dp, unit) shows anything that rounds to zero as an unsigned zero, the computed value in the tooltip', () => {
    expect(nearZero(-0.000004, 5, 'per 100 face per bp')).toEqual({ text: '0.00000', title: 'Zero within 5 \u00d7 10^\u22126 per 100 face per bp (computed: \u22124.0 \u00d7 10^\u22126 per 100 face per bp)' });
    expect(nearZero(-0.004, 2, 'bp per bp').text).toBe('0.00');
    expect(nearZero(0, 2, 'bp').title).toBeUndefined();
  });

  it('nearZero(x, dp, unit, tolerance) treats the tolerance as zero and keeps the sign of anything larger', () => {
    const tiny = nearZero(6.9e-14, 4, 'bp', 1e-10);
    expect(tiny.text).toBe('0.0000');
    expect(tiny.title).toContain('6.9 \u00d7 10^\u221214 bp');
    expect(tiny.title).toContain('within 1 \u00d7 10^\u221210 bp');
    expect(nearZero(-0.25, 2, 'bp').text).toBe('\u22120.25');
    expect(nearZero(Number.NaN, 2, 'bp').text).toBe('\u2014');
  });

  it('rowNumber(rowOfQuote, quote) numbers rows from 1 as the sheet does', () => {
    expect(rowNumber([0, 2, 5], 2)).toBe(6);
    expect(rowNumber(undefined, 0)).toBe(1);
  });
});
