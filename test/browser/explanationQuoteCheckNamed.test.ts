// The quote check of a named projection curve in Debian's Chromium on the built app: the command
// line's invented two-curve document (test/fixtures/namedCurves/SOURCE.md) opened as a file,
// euribor6m shown, its 2Y term-index swap's model rate opened: the panel reads both curves (its
// forwards off euribor6m, its discount factors off the default curve) and ends in the table's
// figure (to its shown digits here; to all digits in test/ui/explanationQuoteCheckNamed.test.tsx).
// axe-core finds no serious or critical violation with the panel open. Screenshots at 1280 px:
// explanation-quote-check-named-1280 (page), -area (the section), -panel and -panel-end (scrolled to its steps).
import path from 'node:path';
import type { Page } from 'playwright-core';
import { seriousAxeFindings } from './axe.ts';
import { diagnostics, openWorkbench, REPO_ROOT, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1280, height: 900 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

describe('the quote check of a named projection curve', () => {
  it("a term-index swap's model rate opens its explanation on both curves, ending in the table's figure; axe finds nothing serious", async () => {
    await page.getByLabel('Workspace file to open').setInputFiles(path.join(REPO_ROOT, 'test/fixtures/namedCurves/two-curves.json'));
    const picker = page.getByRole('combobox', { name: 'Curve shown' });
    await picker.waitFor({ timeout: 20_000 });
    await picker.selectOption('euribor6m');
    await page.getByRole('table', { name: 'Quotes of the curve euribor6m' }).waitFor();
    await page.getByRole('tab', { name: 'Quote check' }).click();
    const table = page.getByRole('table', { name: 'Quote check' });
    const button = table.getByRole('button', { name: /explain the model rate of row 2$/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Model rate of row 2: swap 2029-03-10/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    const decimals = shown.replace('%', '').split('.')[1]?.length ?? 0;
    expect(Math.abs(Number(shown.replace('%', '')) - Number(value) * 100)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
    const text = (await panel.textContent())!;
    expect(text).toContain('float = g1 x P_default(T1)');
    expect(text).toContain('P_euribor6m(T1)');
    expect(text).not.toContain('not explained');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-quote-check-named-1280');
    await page.locator('.quote-check').screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-quote-check-named-1280-area.png') });
    await panel.screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-quote-check-named-1280-panel.png') });
    await panel.evaluate((el) => el.scrollTo(0, el.scrollHeight));
    await panel.screenshot({ path: path.join(SCREENSHOT_DIR, 'explanation-quote-check-named-1280-panel-end.png') });
    expect(await seriousAxeFindings(page, ['.quote-check'])).toEqual([]);
    expect(diagnostics(page).pageErrors).toEqual([]);
  });
});
