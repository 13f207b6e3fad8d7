// The explanations of the Snapshots section's differences (issue 19), in Debian's Chromium on the
// built app (demo workspace, invented data): a snapshot of the demo, the settlement moved a month
// on and lined up by calendar date, then the 10Y difference opened from the snapshot table, and a reference curve's difference
// from its table; each panel ends in the table's figure (to its shown digits here; to all digits in
// test/ui/explanationCurveDifferences.test.tsx). axe-core finds no serious or critical violation in
// the section with a panel open. Screenshots at 1280 and 760 px wide.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { seriousAxeFindings } from './axe.ts';
import { diagnostics, openWorkbench, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1280, height: 900 } });
  page = app.page;
  await page.getByRole('tab', { name: 'Snapshots' }).click();
  await page.getByLabel('Snapshot name').fill('Month-end close');
  await page.getByRole('button', { name: 'Take snapshot' }).click();
  await page.getByText(/rebuilds the same/).waitFor({ timeout: 20_000 });
  const settlement = page.getByLabel('Settlement', { exact: true });
  await settlement.fill('2027-01-15');
  await settlement.press('Enter');
  // The demo's quotes are by tenor, so a month on they make the same curve by time to maturity
  // (0 bp everywhere); lined up by calendar date the two differ.
  await page.locator('.snapshot-panel').getByText('calendar date').click();
  // The table has followed both: its 10Y row reads the snapshot on the new settlement's 10Y date
  // (by time to maturity it read it on the snapshot's own, 2036-12-15).
  const row10 = page.getByRole('table', { name: 'Current curve against the snapshot' }).locator('tr', { has: page.getByRole('rowheader', { name: '10Y' }) });
  await row10.locator('td').nth(2).filter({ hasText: '2037-01-15' }).waitFor({ timeout: 20_000 });
});

afterAll(async () => {
  await app?.close();
});

/** The table's figure as shown ("+1.23 bp", "−0.5 bp") holds the panel's full value rounded to its shown decimals. */
function expectShown(shown: string, value: string): void {
  const text = shown.replace(/\s*bp$/, '').replace('−', '-');
  const decimals = text.split('.')[1]?.length ?? 0;
  expect(Math.abs(Number(text) - Number(value))).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
  expect(value.replace(/^-?\d*\.?0*/, '').length).toBeGreaterThan(8); // all digits in the panel
}

describe('the explanations of the Snapshots section', () => {
  it("a snapshot's difference opens beside its table and ends in the table's figure", async () => {
    const table = page.getByRole('table', { name: 'Current curve against the snapshot' });
    const button = table.getByRole('button', { name: /explain the difference of the 10Y zero rate from Month-end close/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Difference of the 10Y zero rate from Month-end close/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expectShown(shown, value);
    expect(await panel.textContent()).toContain('snapshot curve: ');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-snapshot-1280');
    await page.locator('.snapshot-panel').screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-snapshot-1280-area.png') });
  });

  it('axe-core finds no serious or critical violation in the section with the panel open', async () => {
    expect(await seriousAxeFindings(page, ['.snapshot-panel'])).toEqual([]);
  });

  it("at 760 px a reference curve's difference opens under its table", async () => {
    await page.setViewportSize({ width: 760, height: 900 });
    // Discount factors from another source: invented values.
    await page.getByLabel(/Reference CSV/).fill('date,discount\n2028-01-18,0.9641\n2032-01-15,0.8405');
    const button = page.getByRole('table', { name: 'Difference from the reference curve' }).getByRole('button', { name: /explain the difference from the reference on 2032-01-15/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Difference of our zero rate on 2032-01-15 from the reference/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expectShown(shown, value);
    expect(await panel.textContent()).toContain('lnP = ln D, D = 0.8405');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-reference-760');
    await page.locator('.reference-panel').screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-reference-760-area.png') });
    expect(diagnostics(page).pageErrors).toEqual([]);
    expect(diagnostics(page).consoleErrors).toEqual([]);
  });
});
