// The sheet's Conventions column in the built workbench (Debian's Chromium), at 1280 and 760 px:
// a row naming its own set and an override, a row taking the workspace's market conventions with
// an override (the set shown before it), and the cell's description listing the overrides against
// the set's values. Sources: the dollar SOFR set (T+2 on the US government securities calendar,
// ACT/360; MARKET-CONVENTIONS.md sections c and d, as src/core/kinds/conventionSets.ts holds
// them); the demo's quotes are invented.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openWorkbench, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;

beforeAll(async () => {
  app = await openWorkbench();
}, 60_000);
afterAll(async () => {
  await app?.close();
});

describe('the Conventions column', () => {
  it('shows each row\'s set and overrides, at 1280 and 760 px without spilling out of the page', async () => {
    const page = app!.page;
    await page.getByRole('combobox', { name: 'Market conventions' }).selectOption('usd-sofr');
    const cell = (row: number) => page.getByRole('textbox', { name: `Row ${row} Conventions` });
    await cell(1).fill('spot lag 1');
    await cell(1).press('Enter');
    await cell(3).fill('eur-estr, spot lag 1');
    await cell(3).press('Enter');
    expect(await cell(1).getAttribute('aria-description')).toMatch(/usd-sofr \(the workspace’s market conventions\).*this row overrides spot lag 1 \(the set’s 2\)/);
    expect(await cell(1).locator('xpath=..').locator('.terms-set').innerText()).toBe('usd-sofr ·');
    expect(await cell(2).getAttribute('placeholder')).toBe('usd-sofr');
    expect(await cell(3).getAttribute('aria-description')).toMatch(/Convention set eur-estr: Euro €STR.*overrides spot lag 1 \(the set’s 2\)/);
    await page.setViewportSize({ width: 1280, height: 900 });
    await screenshot(page, 'row-conventions-1280');
    await page.locator('.sheet-panel').screenshot({ path: `${SCREENSHOT_DIR}/row-conventions-sheet-1280.png` });
    await page.setViewportSize({ width: 760, height: 900 });
    // The cell is on screen, or in the sheet's own box that scrolls sideways to it (the layout rule).
    const placed = await cell(1).evaluate((el) => {
      const box = el.closest('.sheet-scroll')!;
      const fits = el.getBoundingClientRect().right <= window.innerWidth;
      return fits || (box.scrollWidth > box.clientWidth && getComputedStyle(box).overflowX !== 'visible');
    });
    expect(placed).toBe(true);
    await cell(1).scrollIntoViewIfNeeded();
    await screenshot(page, 'row-conventions-760');
    await page.locator('.sheet-panel').screenshot({ path: `${SCREENSHOT_DIR}/row-conventions-sheet-760.png` });
  }, 60_000);
});
