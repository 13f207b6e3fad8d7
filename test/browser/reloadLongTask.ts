// The reload measure of browser.bench.ts (issue 9, "keep every task under 100 ms for inputs up to
// the caps"): a workspace of 500 quotes (the cap) saved in the browser, then reloaded; each reload's
// figure is the longest main-thread task Chromium reports (PerformanceObserver, 'longtask') from
// navigation until the page has settled (the panels' code fetched, the deferred panels drawn).
// The browser reports tasks of 50 ms or more only, so a reload without one counts as 50 ms.
// The quotes are invented benchmark data.
import type { Page } from 'playwright-core';
import { savedRecords } from './savedWorkspaces.ts';

/** Floor of the figure: the shortest task the browser reports as long. */
export const LONG_TASK_MIN_MS = 50;
/** Wait after the sheet is back before reading the tasks: covers the panel preload (0.5 s) and the settled panels. */
const SETTLE_MS = 2500;

/** Installs the observer on every document the page loads (run before the first navigation). */
export async function observeLongTasks(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: number[] };
    w.__longTasks = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__longTasks.push(e.duration);
    }).observe({ type: 'longtask', buffered: true });
  });
}

/**
 * Replaces the open sheet with `table` (a paste with a header row, confirmed in the preview) and
 * waits until the browser's saved record holds `rows` quotes.
 */
export async function saveWorkspaceOf(page: Page, table: string, rows: number): Promise<void> {
  await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
  await page.evaluate((text) => {
    const dt = new DataTransfer();
    dt.setData('text/plain', text);
    document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, table);
  await page.getByRole('button', { name: 'Replace the sheet' }).click();
  for (let i = 0; i < 100; i++) {
    const records = await savedRecords(page);
    const held = records.some(([k, v]) => k.startsWith('entry:') && ((v as { workspace?: { quotes?: unknown[] } }).workspace?.quotes?.length ?? 0) === rows);
    if (held) return;
    await page.waitForTimeout(100);
  }
  throw new Error(`the workspace of ${rows} quotes was not saved within 10 s`);
}

/** Reloads the page once and returns its longest task in ms (LONG_TASK_MIN_MS when none was reported); checks the sheet came back with `rows` rows. */
export async function reloadLongestTask(page: Page, rows: number): Promise<number> {
  await page.reload();
  const grid = page.getByRole('grid', { name: /Quotes/ });
  await grid.waitFor({ timeout: 20_000 });
  await page.waitForTimeout(SETTLE_MS);
  // aria-rowcount counts the header row too.
  const count = await grid.getAttribute('aria-rowcount');
  if (count !== String(rows + 1)) throw new Error(`the reload showed ${count === null ? 'no' : Number(count) - 1} rows, not the ${rows} saved`);
  const tasks = await page.evaluate(() => (window as unknown as { __longTasks: number[] }).__longTasks);
  return Math.max(LONG_TASK_MIN_MS, ...tasks);
}
