// The roll panel's figures explain themselves (issue 19), in Debian's Chromium on the built app
// (demo workspace, invented data): the break-even roll rate against the par bond opens its
// explanation beside its table, ending in the table's figure to all digits; a money value opens
// with its exact decimal text, and so do the value after a leg beside the legs table and the riding split's carry beside its table; axe-core (WCAG 2.x A/AA plus best practices) finds no serious or
// critical violation in the roll panel with the explanation open. Screenshots at 1280 and 760 px
// wide. The numbers themselves are the core's (test/core/roll/explainRoll.test.ts).
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { diagnostics, openWorkbench, REPO_ROOT, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

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

const roll = () => page.getByRole('region', { name: /Roll versus term/ });

describe('explanations in the roll panel', () => {
  it('the break-even roll rate against the par bond opens beside its table, ending in the shown rate to all digits', async () => {
    const button = roll().getByRole('button', { name: /explain the break-even roll rate against Par bond to horizon/ });
    await button.waitFor({ timeout: 30_000 });
    const shown = (await button.textContent())!.trim();
    await button.scrollIntoViewIfNeeded();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Break-even roll rate r\* against the par bond/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    // The table shows the rate in % to 4 decimals; the panel the same double in full.
    expect(`${(Number(value) * 100).toFixed(4)}%`).toBe(shown);
    const steps = await panel.locator('section[aria-label="Steps"] li').allTextContents();
    expect(steps.at(-1)).toBe(`r* = r = ${value} (decimal per year, simple, ACT/360)`);
    expect(await panel.getByRole('button', { name: /^Row \d+:/ }).count()).toBeGreaterThan(0);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'roll-explanation-1280');
    await page.locator('.roll-side').screenshot({ path: path.join(SCREENSHOT_DIR, 'roll-explanation-1280-area.png') });
  });

  it('the value after leg 2 opens beside the legs table with its exact decimal text', async () => {
    const button = roll().getByRole('button', { name: /explain the value after leg 2$/ });
    const shown = (await button.textContent())!.trim();
    await button.scrollIntoViewIfNeeded();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Value after leg 2 under/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    // The table shows the money rounded to cents with grouped digits; the panel the exact decimal.
    expect(shown.replace(/[^\d.]/g, '')).toBe(Number(value).toFixed(2));
    expect(await panel.evaluate((el) => el.closest('.roll-explain-host')?.querySelector('table.roll-legs') !== null)).toBe(true);
    await panel.scrollIntoViewIfNeeded();
    await page.locator('.roll-side').screenshot({ path: path.join(SCREENSHOT_DIR, 'roll-leg-value-1280-area.png') });
  });

  it("the riding split's carry opens beside the split table with its exact decimal text in the strategy's money", async () => {
    const button = roll().getByRole('button', { name: /explain the riding split's carry$/ });
    const shown = (await button.textContent())!.trim();
    await button.scrollIntoViewIfNeeded();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Riding the .* bond: carry under/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    expect(shown.replace(/[^\d.]/g, '')).toBe(Math.abs(Number(value)).toFixed(2));
    expect(await panel.evaluate((el) => el.closest('.roll-explain-host')?.querySelector('table.roll-split') !== null)).toBe(true);
    const steps = await panel.locator('section[aria-label="Steps"] li').allTextContents();
    expect(steps.at(-1)).toMatch(/^carry = A x \(C \+ P_y\) \/ 100 - A, decimal = -?[\d.]+ \(\S+ over the horizon\)$/);
    await panel.scrollIntoViewIfNeeded();
    await page.locator('.roll-side').screenshot({ path: path.join(SCREENSHOT_DIR, 'roll-split-explanation-1280-area.png') });
  });

  it('axe-core finds no serious or critical violation in the roll panel with the explanation open', async () => {
    await page.evaluate(AXE_SOURCE);
    const found = await page.evaluate(async () => {
      const axe = (window as unknown as { axe: { run(ctx: Document, o: object): Promise<{ violations: { id: string; impact: string | null; nodes: { target: unknown[] }[] }[] }> } }).axe;
      const r = await axe.run({ include: [['.roll-panel']] } as unknown as Document, { resultTypes: ['violations'] });
      return r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.impact} ${v.id}: ${JSON.stringify(v.nodes.slice(0, 3).map((n) => n.target))}`);
    });
    expect(found).toEqual([]);
  });

  it('at 760 px a money value opens under its table with its exact decimal text', async () => {
    await page.setViewportSize({ width: 760, height: 900 });
    const button = roll().locator('table.roll-results td.chosen button').first();
    await button.scrollIntoViewIfNeeded();
    const shown = (await button.textContent())!.trim();
    await button.click();
    const panel = page.getByRole('complementary', { name: /Money at the horizon of rolling/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = (await panel.locator('[data-field="value"]').textContent())!;
    // The table rounds to cents (half away from zero); the panel shows every decimal.
    expect(shown.replace(/[^\d.]/g, '')).toBe(Number(value).toFixed(2));
    expect(value).toMatch(/^\d+\.\d{3,}$/);
    const box = (await panel.boundingBox())!;
    expect(box.width).toBeGreaterThan(300);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'roll-explanation-760');
    await page.locator('.roll-main').screenshot({ path: path.join(SCREENSHOT_DIR, 'roll-explanation-760-area.png') });
    expect(diagnostics(page).pageErrors).toEqual([]);
    expect(diagnostics(page).consoleErrors).toEqual([]);
  });
});
