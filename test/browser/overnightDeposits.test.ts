// ON and TN typed into deposit rows of the built workbench (Debian's Chromium): the rows are
// accepted, the curve keeps every quote, and the quote check shows the TN deposit's start and end
// on the weekends calendar (the sheet has no calendar column; README). The demo settles on
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
});
