// Dates and numbers as people type them. Sources: ISO 8601 calendar dates (YYYY-MM-DD); the
// POSIX.1-2017 strptime %y rule for two-digit years (69-99 -> 1969-1999, 00-68 -> 2000-2068);
// month/day/year is the usual numeric order in the United States and day/month/year in most of
// Europe (common practice); a decimal comma is the decimal mark of most of continental Europe
// (common practice). Calendar facts (2028 is a leap year, November has 30 days) are the
// proleptic Gregorian calendar.
import {
  parseDateText,
  parseMaturityText,
  parseRow,
  rewriteDateOrder,
  withDecimalPoint,
  type QuoteRow,
} from '../../../src/core/index.ts';

const date = (text: string, order: 'mdy' | 'dmy' = 'mdy'): string => {
  const r = parseDateText(text, order);
  if (!r?.ok) throw new Error(`expected a date from "${text}", got ${JSON.stringify(r)}`);
  return r.date;
};

describe('parseDateText', () => {
  it('reads day, month name, year: 15-Nov-2027, 15 Nov 27, 15Nov2027, 15 November 2027, 15-nov-27', () => {
    for (const t of ['15-Nov-2027', '15 Nov 27', '15Nov2027', '15 November 2027', '15-nov-27', '15 Nov. 2027', '15/Nov/2027']) expect(date(t), t).toBe('2027-11-15');
  });
  it('reads month name, day, year: Nov 15 2027 and Nov 15, 2027; Sept is September', () => {
    expect(date('Nov 15 2027')).toBe('2027-11-15');
    expect(date('Nov 15, 2027')).toBe('2027-11-15');
    expect(date('Sept 1, 2027')).toBe('2027-09-01');
  });
  it('two-digit years follow POSIX %y: 68 is 2068, 69 is 1969', () => {
    expect(date('1 Jan 68')).toBe('2068-01-01');
    expect(date('1 Jan 69')).toBe('1969-01-01');
  });
  it('numeric dates by the date order: 11/15/2027 month/day/year, 15/11/2027 day/month/year, also with . and -', () => {
    expect(date('11/15/2027', 'mdy')).toBe('2027-11-15');
    expect(date('15/11/2027', 'dmy')).toBe('2027-11-15');
    expect(date('15.11.2027', 'dmy')).toBe('2027-11-15');
    expect(date('3/4/27', 'mdy')).toBe('2027-03-04');
    expect(date('3/4/27', 'dmy')).toBe('2027-04-03');
  });
  it('a numeric date impossible in the chosen order says what it is in the other order', () => {
    const r = parseDateText('15/11/2027', 'mdy');
    expect(r).toEqual({ ok: false, message: '"15/11/2027" is not a date in month/day/year order; read as day/month/year it is 2027-11-15: switch the date order in the settings, or type 2027-11-15' });
  });
  it('refuses days that do not exist (31 Nov, 29 Feb 2027) and gives null for text that is no date', () => {
    expect(parseDateText('31-Nov-2027', 'mdy')).toMatchObject({ ok: false });
    expect(parseDateText('29 Feb 2027', 'mdy')).toMatchObject({ ok: false });
    expect(date('29 Feb 2028')).toBe('2028-02-29');
    expect(parseDateText('10Y', 'mdy')).toBeNull();
    expect(parseDateText('soon', 'mdy')).toBeNull();
  });
});

describe('parseMaturityText with typed dates and money-market terms', () => {
  it('a typed date becomes the ISO maturity the engine takes', () => {
    expect(parseMaturityText('15-Nov-2031')).toEqual({ ok: true, value: { maturity: '2031-11-15' } });
    expect(parseMaturityText('15/11/2031', 'dmy')).toEqual({ ok: true, value: { maturity: '2031-11-15' } });
  });
  it('ON, TN and SN (any case, with or without a slash) are read as the money-market tenors; other spellings are refused naming the one to type', () => {
    // Replaces the refusal of these terms before deposits had calendars (time/depositDates.ts).
    for (const [typed, tenor] of [['O/N', 'ON'], ['ON', 'ON'], ['on', 'ON'], ['T/N', 'TN'], ['tn', 'TN'], ['S/N', 'SN'], ['s/n', 'SN']] as const) {
      expect(parseMaturityText(typed), typed).toEqual({ ok: true, value: { tenor } });
    }
    const loose = parseMaturityText('o.n.');
    expect(loose.ok).toBe(false);
    expect(!loose.ok && loose.message).toBe('"o.n.": type ON (or O/N) for overnight, a deposit\'s tenor');
    expect(parseMaturityText('ONN').ok).toBe(false);
  });
});

describe('decimal comma', () => {
  it('withDecimalPoint re-writes 3,25 as 3.25 and 1.000,5 as 1000.5 with the comma mark; nothing with the point mark', () => {
    expect(withDecimalPoint('3,25', ',')).toBe('3.25');
    expect(withDecimalPoint('1.000,5', ',')).toBe('1000.5');
    expect(withDecimalPoint('3.25', ',')).toBe('3.25');
    expect(withDecimalPoint('3,25', '.')).toBe('3,25');
  });
  it('parseRow reads 3,25 and 99,5 with the comma mark exactly, and refuses them with a hint under the point mark', () => {
    const row: QuoteRow = { id: 'r', enabled: true, kind: 'bill', maturity: '15 Nov 27', rate: '', price: '99,5', coupon: '', frequency: '', dayCount: '' };
    expect(parseRow(row, 'percent', { dateOrder: 'dmy', decimalMark: ',' }).quote).toEqual({ kind: 'bill', maturity: '2027-11-15', price: 99.5 });
    const swap: QuoteRow = { ...row, kind: 'swap', maturity: '5Y', rate: '3,25', price: '' };
    expect(parseRow(swap, 'percent', { dateOrder: 'mdy', decimalMark: ',' }).quote).toEqual({ kind: 'swap', tenor: '5Y', rate: 0.0325 });
    expect(parseRow(swap, 'percent').issues.rate?.message).toMatch(/set the decimal mark to comma in the settings/);
  });
});

describe('rewriteDateOrder', () => {
  it('swaps day and month of a numeric date so it keeps its date; other text unchanged', () => {
    expect(rewriteDateOrder('11/12/2027', 'mdy', 'dmy')).toBe('12/11/2027');
    expect(rewriteDateOrder('3.4.27', 'dmy', 'mdy')).toBe('4.3.27');
    expect(rewriteDateOrder('15-Nov-2027', 'mdy', 'dmy')).toBe('15-Nov-2027');
    expect(rewriteDateOrder('2027-11-12', 'mdy', 'dmy')).toBe('2027-11-12');
    expect(rewriteDateOrder('13/13/2027', 'mdy', 'dmy')).toBe('13/13/2027');
  });
});
