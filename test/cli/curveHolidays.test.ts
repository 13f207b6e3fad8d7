import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import ewFeed from '../fixtures/calendars/gov-uk-england-and-wales.json';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../helpers/markets.ts';

// `curve --holidays CALENDAR,FROM,TO`: one line per calendar listing the weekdays it is closed, so a
// calendar can be held against a published list. Sources: the GOV.UK bank holidays feed (England
// and Wales, 2019-2027, test/fixtures/calendars) and the days SOFR was not published (Federal
// Reserve Bank of New York via FRED, test/fixtures/sofr), as in test/core/time/calendars.test.ts.
const run = (args: string[], input = '') => runCurveCommand(args, () => input);

describe('curve --holidays', () => {
  it('prints the GOV.UK England and Wales bank holidays 2019-2027 exactly, without a FILE', async () => {
    const r = await run(['--holidays', 'england-wales,2019-01-01,2027-12-31']);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    const line = JSON.parse(r.stdout.trim()) as { calendar: string; from: string; to: string; holidays: string[] };
    expect(Object.keys(line)).toEqual(['calendar', 'from', 'to', 'holidays']);
    expect(line).toMatchObject({ calendar: 'england-wales', from: '2019-01-01', to: '2027-12-31' });
    expect(line.holidays).toEqual((ewFeed as { events: { date: string }[] }).events.map((e) => e.date).sort());
  });

  it('prints one line per request, in order; us-gov-securities in 2023 is closed exactly on the weekdays without a SOFR rate', async () => {
    const rows = readFileSync(new URL('../fixtures/sofr/SOFR.csv', import.meta.url), 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
    const unpublished = rows.filter(([d, v]) => d!.startsWith('2023-') && v === '.').map(([d]) => d);
    const r = await run(['--holidays', 'us-gov-securities,2023-01-01,2023-12-31', '--holidays=target+england-wales,2026-12-24,2027-01-04']);
    expect(r.status).toBe(0);
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l) as { calendar: string; holidays: string[] });
    expect(lines.map((l) => l.calendar)).toEqual(['us-gov-securities', 'target+england-wales']);
    expect(lines[0]!.holidays).toEqual(unpublished);
    expect(lines[1]!.holidays).toEqual(['2026-12-25', '2026-12-28', '2027-01-01']);
  });

  it('with a FILE prints the calendar lines first, then one line per document as before', async () => {
    const r = await run(['-', '--holidays', 'target,2027-03-01,2027-04-30'], JSON.stringify(workspaceDoc(INVENTED_2027_EVERY_KIND)));
    expect(r.status).toBe(0);
    const [first, second, ...rest] = r.stdout.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    expect(first).toEqual({ calendar: 'target', from: '2027-03-01', to: '2027-04-30', holidays: ['2027-03-26', '2027-03-29'] });
    expect(second!.index).toBe(0);
    expect(rest).toEqual([]);
  });

  it('refuses an unknown calendar (listing the valid ones), a bad date, FROM after TO and years outside the calendar, with exit 2', async () => {
    const cases: [string, RegExp][] = [
      ['nyc,2024-01-01,2024-12-31', /the calendar "nyc" is not known; use one of weekends, us-gov-securities, us-federal-reserve, target, england-wales, or join them with \+/],
      ['target,2024-13-01,2024-12-31', /"2024-13-01" is not a date YYYY-MM-DD/],
      ['target,2024-12-31,2024-01-01', /FROM 2024-12-31 is after TO 2024-01-01/],
      ['target,1998-01-01,1999-12-31', /1998-01-01 is outside the years the calendar target covers \(1999 to 2100\)/],
      ['target,2024-01-01', /must be CALENDAR,FROM,TO/],
    ];
    for (const [value, message] of cases) {
      const r = await run(['--holidays', value]);
      expect(r.status, value).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(message);
    }
  });
});
