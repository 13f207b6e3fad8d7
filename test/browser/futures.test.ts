// Futures typed into the built workbench (Debian's Chromium): a 3M and a 1M SOFR future by their
// Maturity cells (the contract month, and 1M for a one-month contract) and prices. The demo values
// on Tuesday 2026-12-15 (invented market and prices). The quote check tags each price with its
// rate's convention and lists the 1M contract's days with the fixing date each carries (CME
// One-Month SOFR futures: a non-business day carries the preceding business day's rate).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openWorkbench, screenshot, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;

beforeAll(async () => {
  app = await openWorkbench();
}, 60_000);
afterAll(async () => {
  await app?.close();
});

describe('SOFR futures in the sheet', () => {
  it('a 3M and a 1M future build with the curve; the quote check tags them and shows the May 2027 days with their fixing dates', async () => {
    const page = app!.page;
    const fill = async (row: number, column: string, value: string): Promise<void> => {
      await page.getByRole('textbox', { name: `Row ${row} ${column}` }).fill(value);
      await page.getByRole('textbox', { name: `Row ${row} ${column}` }).press('Enter');
    };
    // Rows 12 and 13 of the demo are bonds: they become futures (coupon and frequency cleared).
    for (const [row, maturity, price] of [[12, '2027-05 1M', '96.2'], [13, '2027-06', '96.35']] as const) {
      await fill(row, 'Kind', 'future');
      await fill(row, 'Maturity', maturity);
      for (const column of ['Rate / yield', 'Coupon', 'Freq', 'Day count']) await fill(row, column, '');
      await fill(row, 'Price', price);
    }
    await page.getByRole('tab', { name: 'Quote check' }).click();
    const check = page.getByRole('table', { name: 'Quote check' });
    await check.waitFor({ timeout: 20_000 });
    const checkText = await check.innerText();
    expect(checkText).toContain('100 − futures rate (simple, ACT/360, averaged over the month)');
    expect(checkText).toContain('100 − futures rate (simple, ACT/360, compounded daily over the quarter)');
    await check.getByRole('button', { name: '12', exact: true }).click();
    const schedule = page.getByRole('table', { name: 'Schedule of row 12' });
    await schedule.waitFor({ timeout: 20_000 });
    expect(await schedule.locator('tbody tr').count()).toBe(31);
    const first = await schedule.locator('tbody tr').first().innerText();
    expect(first).toContain('2027-05-01');
    expect(first).toContain('2027-04-30'); // Saturday 1 May carries Friday 30 April's fixing
    await screenshot(page, 'futures-quote-check');
  });
});
