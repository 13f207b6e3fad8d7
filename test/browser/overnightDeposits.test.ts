// ON and TN typed into deposit rows of the built workbench (Debian's Chromium): the rows are
// accepted, the curve keeps every quote, and the quote check shows the TN deposit's start and end
// on the weekends calendar (a row whose Conventions cell is empty, with no Market conventions; README). The demo settles on
// Tuesday 2026-12-15 (invented market): ON runs 15 -> 16 December, TN 16 -> 17 December.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openWorkbench, screenshot, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;

beforeAll(async () => {
  app = await openWorkbench();
}, 60_000);
afterAll(async () => {
  await app?.close();
});

describe('overnight and tom-next deposits in the sheet', () => {
  it('ON and T/N in deposit rows build, and the quote check shows the TN deposit from 2026-12-16 to 2026-12-17', async () => {
    const page = app!.page;
    const count = await page.getByText(/quotes in the curve/).innerText();
    await page.getByRole('textbox', { name: 'Row 1 Maturity' }).fill('ON');
    await page.getByRole('textbox', { name: 'Row 1 Maturity' }).press('Enter');
    await page.getByRole('textbox', { name: 'Row 2 Maturity' }).fill('T/N');
    await page.getByRole('textbox', { name: 'Row 2 Maturity' }).press('Enter');
    await page.getByRole('tab', { name: 'Quote check' }).click();
    await page.getByRole('table', { name: 'Quote check' }).getByRole('button', { name: '2', exact: true }).click();
    const schedule = page.getByRole('table', { name: 'Schedule of row 2' });
    await schedule.waitFor({ timeout: 20_000 });
    expect(await schedule.locator('tbody tr').count()).toBe(1);
    const text = await schedule.locator('tbody tr').first().innerText();
    expect(text).toContain('2026-12-16');
    expect(text).toContain('2026-12-17');
    expect(await page.getByText(/quotes in the curve/).innerText()).toBe(count);
    await screenshot(page, 'overnight-deposits-quote-check');
  });

  it('an OIS row shows each accrual end before and after modified following: 2029-12-15 and 2030-12-15 fall on weekends and move to Monday', async () => {
    // Row 14 becomes a 4Y overnight-index swap on the weekends calendar (the sheet's default; the
    // demo values on Tuesday 2026-12-15): annual periods back from 2030-12-15 (a Sunday), so
    // 2029-12-15 (a Saturday) -> 2029-12-17 and 2030-12-15 -> 2030-12-16; 2027-12-15 and
    // 2028-12-15 are weekdays and stay.
    const page = app!.page;
    for (const [column, value] of [['Kind', 'ois'], ['Maturity', '4Y'], ['Rate / yield', '3.85']] as const) {
      await page.getByRole('textbox', { name: `Row 14 ${column}` }).fill(value);
      await page.getByRole('textbox', { name: `Row 14 ${column}` }).press('Enter');
    }
    await page.getByRole('tab', { name: 'Quote check' }).click();
    await page.getByRole('table', { name: 'Quote check' }).getByRole('button', { name: '14', exact: true }).click();
    const schedule = page.getByRole('table', { name: 'Schedule of row 14' });
    await schedule.waitFor({ timeout: 20_000 });
    const headers = await schedule.locator('thead th').allInnerTexts();
    expect(headers.slice(0, 4)).toEqual(['Period start', 'Accrual end, unadjusted', 'Accrual end, adjusted', 'Payment date']);
    const rows = await schedule.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => Array.from(tr.querySelectorAll('td')).slice(0, 4).map((td) => td.textContent)));
    expect(rows).toEqual([
      ['2026-12-15', '2027-12-15', '2027-12-15', '2027-12-15'],
      ['2027-12-15', '2028-12-15', '2028-12-15', '2028-12-15'],
      ['2028-12-15', '2029-12-15', '2029-12-17', '2029-12-17'],
      ['2029-12-17', '2030-12-15', '2030-12-16', '2030-12-16'],
    ]);
    expect(await schedule.locator('caption').innerText()).toMatch(/on the weekends calendar, starting on the valuation date; accrual ends moved by modified-following/);
    await screenshot(page, 'ois-schedule-adjusted-dates');
  });

  it('market conventions "US dollar SOFR" move the OIS row to spot on US government securities days; "Sterling SONIA" shows ACT/365F as the rows\' faint day count', async () => {
    // Continues from the test above (rows 1-2 ON and T/N, row 14 a 4Y OIS). SOFR: T+2 on the US
    // government securities calendar, payment lag 2 (MARKET-CONVENTIONS.md d): the 4Y swap starts
    // Thursday 2026-12-17, and its first accrual end 2027-12-17 (a Friday) pays on Tuesday 2027-12-21.
    const page = app!.page;
    await page.getByRole('combobox', { name: 'Market conventions' }).selectOption('usd-sofr');
    await page.getByRole('table', { name: 'Quote check' }).getByRole('button', { name: '14', exact: true }).click();
    const schedule = page.getByRole('table', { name: 'Schedule of row 14' });
    await page.waitForFunction(() => document.querySelector('[aria-label="Schedule of row 14"] caption')?.textContent?.includes('us-gov-securities'));
    expect(await schedule.locator('caption').innerText()).toMatch(/on the us-gov-securities calendar, starting at spot, 2 business days after the valuation date/);
    const first = await schedule.locator('tbody tr').first().locator('td').allInnerTexts();
    expect(first.slice(0, 4)).toEqual(['2026-12-17', '2027-12-17', '2027-12-17', '2027-12-21']);
    await screenshot(page, 'market-conventions-sofr');
    await page.getByRole('combobox', { name: 'Market conventions' }).selectOption('gbp-sonia');
    await page.waitForFunction(() => (document.querySelector('[aria-label="Row 14 Day count"]') as HTMLInputElement | null)?.placeholder === 'ACT/365F');
    expect(await page.getByRole('textbox', { name: 'Row 14 Day count' }).getAttribute('placeholder')).toBe('ACT/365F');
    expect(await page.getByRole('textbox', { name: 'Row 15 Day count' }).getAttribute('placeholder')).toBe('30/360'); // a plain swap: no set fills it
  });
});

