// Explanations of the bond figures and of the print preview's numbers (issue 19), in Debian's
// Chromium on the built app (demo workspace, invented data): the model dirty price of the Bond on
// the curve table opens beside the table, ending in the shown figure to all digits; a zero rate of
// the print preview opens beside the preview; with the panel open, the page in print media is the
// same picture as with it closed (the printed copy has no buttons, the panel does not print), and
// no button is visible in print. axe-core finds no serious or critical violation with the panels
// open. A key-rate duration and a heat-map cell open theirs beside their tables, ending in the
// shown figure. Screenshots at 1280 and 760 px wide and in print media. The numbers themselves are the
// core's (test/core/analytics/explainBond.test.ts, test/core/curve/explain.test.ts).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { openWorkbench, REPO_ROOT, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

const AXE_SOURCE = readFileSync(path.join(REPO_ROOT, 'node_modules', 'axe-core', 'axe.min.js'), 'utf8');

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1280, height: 900 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

async function axeFindings(selector: string): Promise<string[]> {
  await page.evaluate(AXE_SOURCE);
  return page.evaluate(async (sel) => {
    const axe = (window as unknown as { axe: { run(ctx: unknown, o: object): Promise<{ violations: { id: string; impact: string | null; nodes: { target: unknown[] }[] }[] }> } }).axe;
    const r = await axe.run({ include: [[sel]] }, { resultTypes: ['violations'] });
    return r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.impact} ${v.id}: ${JSON.stringify(v.nodes.slice(0, 3).map((n) => n.target))}`);
  }, selector);
}

describe('explanations of bond figures and of the print preview', () => {
  it('the model dirty price opens beside the bond table, ending in the shown figure', async () => {
    await page.getByRole('tab', { name: 'Bond and sensitivities', exact: true }).click();
    const table = page.getByRole('table', { name: 'Bond analytics' });
    await table.waitFor({ timeout: 20_000 });
    const button = table.getByRole('button', { name: /explain the dirty price$/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /dirty price on the curve/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    // The table shows the price to 4 decimals; the panel the same double in full.
    expect(Number(value).toFixed(4)).toBe(shown);
    const steps = await panel.locator('section[aria-label="Steps"] li').allTextContents();
    expect(steps.at(-1)).toContain(`= ${value}`);
    const t = (await table.boundingBox())!;
    const box = (await panel.boundingBox())!;
    expect(box.x >= t.x + t.width || box.y >= t.y + t.height).toBe(true);
    expect(await axeFindings('.bond-panel')).toEqual([]);
    await screenshot(page, 'bond-explanation-1280');
    await page.locator('.bond-panel .key-maturities').screenshot({ path: path.join(SCREENSHOT_DIR, 'bond-explanation-1280-area.png') });
    await page.setViewportSize({ width: 760, height: 900 });
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'bond-explanation-760');
    await page.locator('.bond-panel .key-maturities').screenshot({ path: path.join(SCREENSHOT_DIR, 'bond-explanation-760-area.png') });
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it('a key-rate duration opens beside the key-rate table, a heat-map cell beside the map, each ending in the shown figure', async () => {
    await page.getByRole('tab', { name: 'Bond and sensitivities', exact: true }).click();
    const krd = page.getByRole('table', { name: 'Key-rate durations' });
    await krd.waitFor({ timeout: 20_000 });
    const button = krd.getByRole('button', { name: /explain the 10Y key-rate duration$/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /10Y key-rate duration on the curve/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expect(Number(value).toFixed(4)).toBe(shown);
    const steps = await panel.locator('section[aria-label="Steps"] li').allTextContents();
    expect(steps.at(-1)).toBe(`KRD 10Y = (4 D(h/2) - D(h)) / 3 = ${value} (years)`);
    const t = (await krd.boundingBox())!;
    expect((await panel.boundingBox())!.y).toBeGreaterThanOrEqual(t.y + t.height);
    expect(await axeFindings('.bond-panel')).toEqual([]);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'krd-explanation-1280');
    await page.locator('.bond-panel').screenshot({ path: path.join(SCREENSHOT_DIR, 'krd-explanation-1280-area.png') });
    await panel.getByRole('button', { name: 'Close the explanation' }).click();
    // A heat-map cell.
    const map = page.getByRole('table', { name: 'Forward sensitivities' });
    const cell = map.getByRole('button', { name: /explain the .* forward's sensitivity to row \d+$/ }).nth(3);
    const figure = (await cell.textContent())!.trim().replace('\u2212', '-'); // the shown minus is U+2212
    await cell.click();
    const heat = page.getByRole('complementary', { name: /^Sensitivity of the forward/ });
    await heat.waitFor({ timeout: 20_000 });
    const v = (await heat.locator('[data-field="value"]').textContent())!;
    expect(Math.abs(Number(v) - Number(figure))).toBeLessThanOrEqual(0.005);
    expect((await heat.locator('section[aria-label="Steps"] li').allTextContents()).at(-1)).toContain(`= ${v} (bp of forward per bp of quote)`);
    expect(await axeFindings('.sensitivity-panel')).toEqual([]);
    await heat.scrollIntoViewIfNeeded();
    await screenshot(page, 'heatmap-explanation-1280');
    await page.locator('.sensitivity-panel').screenshot({ path: path.join(SCREENSHOT_DIR, 'heatmap-explanation-1280-area.png') });
    await heat.getByRole('button', { name: 'Close the explanation' }).click();
  });

  it('a print-preview zero rate opens beside the preview; the print-media page is the same with it open', async () => {
    await page.getByRole('tab', { name: 'Print', exact: true }).click();
    const preview = page.locator('.print-preview');
    await preview.locator('.print-summary').waitFor({ timeout: 20_000 });
    // The print-media picture before any explanation is open (the produced-at time masked).
    await page.emulateMedia({ media: 'print' });
    const mask = [page.locator('.ps-trace')];
    const closed = await page.screenshot({ fullPage: true, mask });
    await page.emulateMedia({ media: 'screen' });
    const button = preview.getByRole('button', { name: /explain the zero rate at 5Y$/ });
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /^5Y zero rate/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expect(`${(Number(value) * 100).toFixed(4)}%`).toBe(shown);
    const p = (await preview.boundingBox())!;
    const box = (await panel.boundingBox())!;
    expect(box.x >= p.x + p.width || box.y >= p.y + p.height).toBe(true);
    expect(await axeFindings('.print-preview-row')).toEqual([]);
    await screenshot(page, 'print-explanation-1280');
    await page.locator('.print-preview-row').screenshot({ path: path.join(SCREENSHOT_DIR, 'print-explanation-1280-area.png') });
    await page.setViewportSize({ width: 760, height: 900 });
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'print-explanation-760');
    await page.locator('.print-preview-row').screenshot({ path: path.join(SCREENSHOT_DIR, 'print-explanation-760-area.png') });
    await page.setViewportSize({ width: 1280, height: 900 });
    // In print media, with the panel open and its button pressed: nothing of it shows.
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('button:visible').count()).toBe(0);
    expect(await page.locator('.explain-panel:visible').count()).toBe(0);
    const open = await page.screenshot({ fullPage: true, mask });
    await page.screenshot({ fullPage: true, path: path.join(SCREENSHOT_DIR, 'print-explanation-print-media.png') });
    await page.emulateMedia({ media: 'screen' });
    expect(open.equals(closed)).toBe(true);
  });
});
