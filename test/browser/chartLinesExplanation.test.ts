// Each line of the charts explains its point, in Debian's Chromium on the built app (demo workspace,
// invented data): a scenario is added in the Scenarios section, a point of the zero chart read with
// the keyboard, and the scenario line's button under the readout opens its explanation (the zero
// rate on the scenario curve, ending in the number to all digits); axe-core (WCAG 2.x A/AA plus best
// practices) finds no serious or critical violation in the Charts section with the panel open.
// Screenshots at 1280 and 760 px wide. The numbers are the core's, held to the plotted samples bit
// for bit in test/charts/lineExplanations.test.ts.
import path from 'node:path';
import type { Page } from 'playwright-core';
import { seriousAxeFindings } from './axe.ts';
import { diagnostics, openWorkbench, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1280, height: 900 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

const charts = () => page.getByRole('region', { name: 'Charts', exact: true });

describe("a chart line's point explained in Chromium", () => {
  it("a scenario line's zero rate, read by keyboard, opens beside the charts ending in its number", async () => {
    const d = diagnostics(page);
    await page.getByRole('tab', { name: 'Scenarios' }).click();
    await page.getByLabel('Name', { exact: true }).fill('Up fifty');
    await page.getByLabel(/^Shift \(bp\)/).fill('50');
    await page.getByRole('button', { name: 'Add scenario' }).click();
    await charts().locator('.legend li', { hasText: 'Up fifty (zero)' }).first().waitFor({ timeout: 20_000 });
    const chart = page.getByRole('img', { name: /^Zero curve/ });
    await chart.scrollIntoViewIfNeeded();
    await chart.focus();
    await page.keyboard.press('Home');
    for (let i = 0; i < 150; i++) await page.keyboard.press('ArrowRight');
    // The focus leaves the chart for its row of buttons: the first is the zero line's.
    await page.keyboard.press('Tab');
    const first = await page.evaluate(() => document.activeElement?.getAttribute('aria-label'));
    expect(first).toMatch(/^Explain the zero rate at [\d.]+y \(\d{4}-\d{2}-\d{2}\)$/);
    const button = charts().getByRole('button', { name: /^Explain Up fifty \(zero\) at [\d.]+y \(\d{4}-\d{2}-\d{2}\)$/ });
    for (let i = 0; i < 6 && !(await button.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press('Tab');
    expect(await button.evaluate((el) => el === document.activeElement)).toBe(true);
    const date = /\((\d{4}-\d{2}-\d{2})\)$/.exec((await button.getAttribute('aria-label'))!)![1]!;
    await page.keyboard.press('Enter');
    const panel = page.getByRole('complementary', { name: new RegExp(`^Zero rate on ${date} under Up fifty`) });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expect(value.replace(/^0\.0*/, '').length).toBeGreaterThan(10);
    const steps = await panel.locator('section[aria-label="Steps"] li').allTextContents();
    expect(steps.at(-1)).toContain(`= ${value}`);
    expect(await panel.textContent()).toContain("of the base curve's rate");
    await panel.scrollIntoViewIfNeeded();
    await charts().screenshot({ path: path.join(SCREENSHOT_DIR, 'chart-lines-explanation-1280.png') });
    expect(d.pageErrors).toEqual([]);
    expect(d.consoleErrors).toEqual([]);
  });

  it('axe-core finds no serious or critical violation in the Charts section with the panel open', async () => {
    expect(await seriousAxeFindings(page, ['.charts-panel'])).toEqual([]);
  });

  it('at 760 px the row of buttons wraps and the panel stays readable', async () => {
    await page.setViewportSize({ width: 760, height: 900 });
    const panel = page.getByRole('complementary', { name: /under Up fifty/ });
    await panel.waitFor({ timeout: 10_000 });
    const box = (await panel.boundingBox())!;
    expect(box.width).toBeGreaterThan(300);
    expect(box.x + box.width).toBeLessThanOrEqual(760 + 1);
    const row = (await charts().locator('p.chart-explain').first().boundingBox())!;
    expect(row.x + row.width).toBeLessThanOrEqual(760 + 1);
    await charts().screenshot({ path: path.join(SCREENSHOT_DIR, 'chart-lines-explanation-760.png') });
    expect(await seriousAxeFindings(page, ['.charts-panel'])).toEqual([]);
  });
});
