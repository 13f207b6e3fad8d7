// The explanation of a key-maturity number (issue 19), in Debian's Chromium on the built app (demo
// workspace, invented data): click the 2Y forward in the key-maturity table, read its explanation
// beside the table, follow a quote link to its sheet row, copy the text; axe-core (WCAG 2.x A/AA
// plus best practices) finds no serious or critical violation with the panel open. Screenshots at
// 1280 and 760 px wide. The numbers themselves are the core's (tested in test/core/curve/explain.test.ts).
import path from 'node:path';
import type { Page } from 'playwright-core';
import { seriousAxeFindings } from './axe.ts';
import { diagnostics, openWorkbench, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({
    viewport: { width: 1280, height: 900 },
    beforeLoad: (p, url) => p.context().grantPermissions(['clipboard-read', 'clipboard-write'], { origin: new URL(url).origin }),
  });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

describe('the explanation of a key-maturity number', () => {
  it('clicking the 2Y forward opens its explanation beside the table, ending in the number to all digits', async () => {
    const before = await page.evaluate(() => performance.getEntriesByType('resource').filter((e) => /ExplanationPanel/.test(e.name)).length);
    expect(before).toBe(0); // the panel's code is not part of the first load
    const cell = page.locator('table[aria-label="Key maturities"] tr[data-tenor="2Y"] td[data-field="forward"] button');
    const shown = (await cell.textContent())!.trim();
    await cell.click();
    const panel = page.getByRole('complementary', { name: /forward rate starting 2Y/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    // The table shows the rate in % to 4 decimals; the panel the same double in full.
    expect(`${(Number(value) * 100).toFixed(4)}%`).toBe(shown.replace(/\*$/, ''));
    expect(value.replace(/^0\.0*/, '').length).toBeGreaterThan(10);
    const steps = await panel.locator('section[aria-label="Steps"] li').allTextContents();
    expect(steps.at(-1)).toContain(`= ${value}`);
    // Beside the table, not over it: the two do not overlap.
    const table = (await page.locator('table[aria-label="Key maturities"]').boundingBox())!;
    const box = (await panel.boundingBox())!;
    expect(box.x >= table.x + table.width || box.y >= table.y + table.height).toBe(true);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-1280');
    await page.locator('.key-maturities').screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-1280-area.png') });
  });

  it('Copy as text puts the plain explanation on the clipboard', async () => {
    const panel = page.getByRole('complementary', { name: /forward rate starting 2Y/ });
    await panel.getByRole('button', { name: 'Copy as text' }).click();
    await panel.getByRole('status').filter({ hasText: 'Copied' }).waitFor({ timeout: 10_000 });
    const text = await page.evaluate(() => navigator.clipboard.readText());
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expect(text).toContain(`Value: ${value}`);
    expect(text).toMatch(/start: given 2Y; unadjusted \d{4}-\d{2}-\d{2}/);
    expect(text).toContain('Under each interpolation method');
  });

  it('axe-core finds no serious or critical violation with the panel open', async () => {
    expect(await seriousAxeFindings(page, ['.key-maturities'])).toEqual([]);
  });

  it('a quote link takes the user to its sheet row', async () => {
    const panel = page.getByRole('complementary', { name: /forward rate starting 2Y/ });
    const link = panel.getByRole('button', { name: /^Row \d+:/ }).first();
    const n = Number(/^Row (\d+):/.exec((await link.textContent())!)![1]);
    await link.click();
    const kind = page.getByRole('textbox', { name: `Row ${n} Kind` });
    await expect.poll(() => kind.evaluate((el) => el === document.activeElement), { timeout: 10_000 }).toBe(true);
    expect(await kind.isVisible()).toBe(true);
  });

  it('at 760 px the panel sits under the table and stays readable', async () => {
    await page.setViewportSize({ width: 760, height: 900 });
    const cell = page.locator('table[aria-label="Key maturities"] tr[data-tenor="5Y"] td[data-field="zero"] button');
    await cell.scrollIntoViewIfNeeded();
    await cell.click();
    const panel = page.getByRole('complementary', { name: /5Y zero rate/ });
    await panel.waitFor({ timeout: 20_000 });
    const box = await panel.boundingBox();
    expect(box!.width).toBeGreaterThan(300);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-760');
    await page.locator('.key-maturities').screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-760-area.png') });
    expect(diagnostics(page).pageErrors).toEqual([]);
    expect(diagnostics(page).consoleErrors).toEqual([]);
  });
});
