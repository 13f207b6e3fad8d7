// A pasted list of overnight fixings. The layout is the one central banks' and data pages' daily
// series use: a date and a rate per line (for example the SOFR series on FRED, date and percent,
// test/fixtures/sofr/SOURCE.md); the values below are the first SOFR fixings of March 2024 from that
// fixture (5.32%, 5.33%, 5.33% on 2024-03-01, -04, -05).
import { describe, expect, it } from 'vitest';
import { readFixingList } from '../../../src/core/index.ts';

describe('readFixingList', () => {
  it('reads dates and percent rates separated by tabs, commas or spaces, skipping a header; rates exact as typed', () => {
    const r = readFixingList('DATE,SOFR\n2024-03-01,5.32\n2024-03-04\t5.33\n05-Mar-2024  5.33%\n\n', 'percent', 'mdy');
    expect(r.problems).toEqual([]);
    expect(r.fixings).toEqual({ '2024-03-01': 0.0532, '2024-03-04': 0.0533, '2024-03-05': 0.0533 });
  });

  it('reads a bare rate in the sheet\'s unit and numeric dates in its order', () => {
    expect(readFixingList('01/03/2024 0.0532', 'decimal', 'dmy').fixings).toEqual({ '2024-03-01': 0.0532 });
    expect(readFixingList('03/01/2024 532', 'bp', 'mdy').fixings).toEqual({ '2024-03-01': 0.0532 });
  });

  it('names each line not taken: no date, no rate, two rates, a rate out of range; a date twice keeps the later line and says so', () => {
    const r = readFixingList('2024-03-01 5.32\nMarch first 5.32\n2024-03-04\n2024-03-05 5.33 5.34\n2024-03-06 500\n2024-03-01 5.31', 'percent', 'mdy');
    expect(r.problems.map((p) => p.line)).toEqual([2, 3, 4, 5, 6]);
    expect(r.problems[0]!.message).toMatch(/does not start with a date/);
    expect(r.problems[1]!.message).toMatch(/needs a date and one rate/);
    expect(r.problems[2]!.message).toMatch(/needs a date and one rate/);
    expect(r.problems[3]!.message).toMatch(/outside \u221210% to 100%/);
    expect(r.problems[4]!.message).toMatch(/2024-03-01 is listed again/);
    expect(r.fixings).toEqual({ '2024-03-01': 0.0531 });
  });
});
