// The explanations of the quote check and the smooth fit (issue 19), in Debian's Chromium on the
// built app (demo workspace, invented data): a swap's implied rate opened from the quote check, a
// bond's fit residual from the smooth fit; each panel ends in the table's figure (to its shown
// digits here; to all digits in test/ui/explanationQuoteCheck.test.tsx and explanationFit.test.tsx).
// axe-core finds no serious or critical violation in either section with its panel open.
// A bond's market minus model price from the rich/cheap list likewise. Screenshots at 1280 px wide.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { seriousAxeFindings } from './axe.ts';
import { diagnostics, openWorkbench, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1280, height: 900 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

/** The table's figure as shown holds the panel's full value rounded to its shown decimals (a rate shown in % against the panel's decimal when `percent`). */
function expectShown(shown: string, value: string, scale = 1): void {
  const text = shown.replace(/\s*(bp|per 100)$/, '').replace('−', '-').replace('%', '');
  const decimals = text.split('.')[1]?.length ?? 0;
  expect(Math.abs(Number(text) - Number(value) * scale)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
  expect(value.replace(/^-?\d*\.?0*/, '').length).toBeGreaterThan(8); // all digits in the panel
}

describe('the explanations of the quote check and the smooth fit', () => {
  it("a swap's implied rate opens beside the quote check and ends in the table's figure", async () => {
    await page.getByRole('tab', { name: 'Quote check' }).click();
    const table = page.getByRole('table', { name: 'Quote check' });
    const swapRow = table.locator('tr', { has: page.getByRole('cell', { name: 'swap', exact: true }) }).first();
    const button = swapRow.getByRole('button', { name: /explain the model rate of row \d+$/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Model rate of row \d+: swap/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expectShown(shown, value, 100);
    expect(await panel.textContent()).toContain('A = tau1 x DF(T1)');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-quote-check-1280');
    await page.locator('.quote-check').screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-quote-check-1280-area.png') });
  });

  it('axe-core finds no serious or critical violation in the quote check with the panel open', async () => {
    expect(await seriousAxeFindings(page, ['.quote-check'])).toEqual([]);
  });

  it("a bond's fit residual opens beside the residual table and ends in the table's figure; axe finds nothing serious", async () => {
    await page.getByRole('tab', { name: 'Smooth fit' }).click();
    const fit = page.getByRole('region', { name: 'Smooth fit' });
    await fit.waitFor({ timeout: 20_000 });
    await fit.getByRole('combobox', { name: 'Model' }).selectOption('nelson-siegel');
    const table = fit.getByRole('table', { name: 'Fit residuals' });
    await table.waitFor({ timeout: 20_000 });
    const bondRow = table.locator('tr', { has: page.getByRole('rowheader', { name: /bond$/ }) }).first();
    const button = bondRow.getByRole('button', { name: /explain the fit residual of row \d+$/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Fit residual of row \d+/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expectShown(shown, value);
    // The quotes it moves with through the fit, each a link to its sheet row (fitQuotes).
    expect(await panel.textContent()).toContain('through the fit');
    expect(await panel.getByRole('button', { name: /^Row \d+:/ }).count()).toBe(5);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-fit-1280');
    expect(await seriousAxeFindings(page, ['.fit-panel'])).toEqual([]);
    expect(diagnostics(page).pageErrors).toEqual([]);
  });
  it("a bond's market minus model price opens below the rich/cheap list and ends in its figure; axe finds nothing serious", async () => {
    const fit = page.getByRole('region', { name: 'Smooth fit' });
    const table = fit.getByRole('table', { name: 'Rich and cheap bonds' });
    const button = table.getByRole('button', { name: /explain the market minus model price of row \d+$/ }).first();
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Market minus model price of row \d+/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expectShown(shown, value);
    expect(await panel.textContent()).toContain('richness = -(model price');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-rich-cheap-1280');
    expect(await seriousAxeFindings(page, ['.fit-panel'])).toEqual([]);
    expect(diagnostics(page).pageErrors).toEqual([]);
  });
});
