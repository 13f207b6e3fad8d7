// An FRA typed into the built workbench (Debian's Chromium): the demo (valued Tuesday 2026-12-15,
// invented market) on the EURIBOR 3M market conventions, its 6M bill row turned into a 4x7 FRA.
// The quote check tags it simple ACT/360 and shows its start 2027-04-17 (a Saturday) moved to
// 2027-04-19 and its index fixing 2027-04-15: spot = valuation + 2 TARGET days, start = spot + 4
// months by modified following, end = start + 3 months, fixing two TARGET days before the start
// (MARKET-CONVENTIONS.md f; QuantLib's FRA dates since its PR #1600), worked by hand.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openWorkbench, screenshot, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;

beforeAll(async () => {
  app = await openWorkbench();
}, 60_000);
afterAll(async () => {
  await app?.close();
});

describe('an FRA in the sheet', () => {
  it('4x7 on EURIBOR 3M builds with the curve; the quote check shows its adjusted start, end and fixing', async () => {
    const page = app!.page;
    const fill = async (row: number, column: string, value: string): Promise<void> => {
      await page.getByRole('textbox', { name: `Row ${row} ${column}` }).fill(value);
      await page.getByRole('textbox', { name: `Row ${row} ${column}` }).press('Enter');
    };
    await page.getByRole('combobox', { name: /Market conventions/ }).selectOption('eur-euribor-3m');
    await fill(5, 'Kind', 'FRA');
    await fill(5, 'Maturity', '4x7');
    await fill(5, 'Price', '');
    await fill(5, 'Rate / yield', '4.05');
    await page.getByRole('tab', { name: 'Quote check' }).click();
    const check = page.getByRole('table', { name: 'Quote check' });
    await check.waitFor({ timeout: 20_000 });
    expect(await check.innerText()).toContain('simple, ACT/360');
    await check.getByRole('button', { name: '5', exact: true }).click();
    const schedule = page.getByRole('table', { name: 'Schedule of row 5' });
    await schedule.waitFor({ timeout: 20_000 });
    const row = await schedule.locator('tbody tr').first().innerText();
    for (const date of ['2027-04-17', '2027-04-19', '2027-07-19', '2027-04-15']) expect(row).toContain(date);
    expect(await schedule.locator('caption').innerText()).toContain('the index fixes on 2027-04-15, two business days before the start');
    await screenshot(page, 'fra-quote-check');
  });
});
