// A workspace's edits of a built-in calendar as the Holidays section shows and makes them.
// Sources: the built-in calendars' published days (held to the publishers' lists in
// calendars.test.ts): TARGET closes New Year, Good Friday, Easter Monday, 1 May and 25-26 December
// (ECB); in 2027 Good Friday is 26 March and Easter Monday 29 March; 1 May, 25 and 26 December 2027
// fall on a weekend. SIFMA's 2027 recommendation closes Friday 24 December.
import { describe, expect, it } from 'vitest';
import { calendarYear, closeDay, openDay, readDateList } from '../../../src/core/index.ts';

describe('calendarYear', () => {
  it('TARGET 2027 closes three weekdays by its rules; an added day is marked as the workspace\'s, an opened one listed', () => {
    expect(calendarYear('target', 2027)).toEqual({
      closed: [
        { date: '2027-01-01', weekday: 'Friday', source: 'published' },
        { date: '2027-03-26', weekday: 'Friday', source: 'published' },
        { date: '2027-03-29', weekday: 'Monday', source: 'published' },
      ],
      opened: [],
    });
    const v = calendarYear('target', 2027, { add: ['2027-12-24'], remove: ['2027-03-29'] });
    expect(v.closed.map((c) => [c.date, c.source])).toEqual([['2027-01-01', 'published'], ['2027-03-26', 'published'], ['2027-12-24', 'added']]);
    expect(v.opened).toEqual(['2027-03-29']);
  });
});

describe('closeDay and openDay', () => {
  it('close adds a weekday, or restores a published holiday the workspace opened; open takes an added day off, or opens a published one', () => {
    const a = closeDay('us-gov-securities', '2027-12-23');
    expect(a).toEqual({ ok: true, edits: { add: ['2027-12-23'], remove: [] } });
    expect(openDay('us-gov-securities', '2027-12-23', a.ok ? a.edits : {})).toEqual({ ok: true, edits: { add: [], remove: [] } });
    const b = openDay('us-gov-securities', '2027-12-24');
    expect(b).toEqual({ ok: true, edits: { add: [], remove: ['2027-12-24'] } });
    expect(closeDay('us-gov-securities', '2027-12-24', b.ok ? b.edits : {})).toEqual({ ok: true, edits: { add: [], remove: [] } });
  });
  it('refuses with the reason: a weekend, a day already closed or open, a date outside the years', () => {
    expect(closeDay('target', '2027-12-25')).toMatchObject({ ok: false, message: expect.stringContaining('Saturday') });
    expect(closeDay('target', '2027-03-26')).toMatchObject({ ok: false, message: expect.stringContaining('closed on target already') });
    expect(openDay('target', '2027-03-30')).toMatchObject({ ok: false, message: expect.stringContaining('open on target already') });
    expect(closeDay('target', '2101-01-03')).toMatchObject({ ok: false, message: expect.stringContaining('1990 to 2100') });
  });
});

describe('readDateList', () => {
  it('reads one date per line (ISO or as the sheet reads dates), skips blanks, and names each line that is not a date', () => {
    const r = readDateList('2027-12-24\n\n24-Dec-2027; 2028-01-03\n12/31/2027\nnot a day\n2101-01-03, 2027-08-16', 'mdy');
    expect(r.dates).toEqual(['2027-08-16', '2027-12-24', '2027-12-31', '2028-01-03']);
    expect(r.problems).toEqual([
      { line: 5, text: 'not a day', message: expect.stringContaining('not a date') },
      { line: 6, text: '2101-01-03', message: expect.stringContaining('1990 to 2100') },
    ]);
  });
});
