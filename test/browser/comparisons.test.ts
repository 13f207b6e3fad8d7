// The charts' comparisons in Chromium on the built app: the demo opens from a link, the user takes a
// snapshot and moves the settlement a month on, then turns on the snapshot and the smooth fit under "Compare on the charts", and
// both charts gain their lines and both legends their entries; the choice is in the document's view.
// Screenshots of the charts with comparisons on at 1280 and 390 px go to
// test/artifacts/screenshots/comparisons-*.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { FIT_STYLE, REFERENCE_STYLE, SNAPSHOT_STYLES } from '../../src/charts/palette.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { launchBrowser, SCREENSHOT_DIR, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;
let link = '';

beforeAll(async () => {
  server = await serveDist();
  browser = await launchBrowser();
  let n = 0;
  link = `${server.url}#${await encodeWorkspaceLink(demoWorkspace(() => `r${n++}`) as unknown as Record<string, unknown>)}`;
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function open(width: number, height: number): Promise<Page> {
  const context = await browser!.browser.newContext({ viewport: { width, height }, locale: 'en-US', timezoneId: 'America/Los_Angeles', reducedMotion: 'reduce' });
  const page = await context.newPage();
  await page.goto(link, { waitUntil: 'load' });
  await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
  // A snapshot of the demo (links leave snapshots out), then the settlement moves a month on.
  await page.getByRole('tab', { name: 'Snapshots' }).click();
  await page.getByLabel('Snapshot name').fill('Month-end close');
  await page.getByRole('button', { name: 'Take snapshot' }).click();
  await page.getByText(/rebuilds the same/).waitFor({ timeout: 20_000 });
  const settlement = page.getByLabel('Settlement', { exact: true });
  await settlement.fill('2027-01-15');
  await settlement.press('Enter');
  return page;
}

/** How many drawn paths each chart has in a colour (the line's own style, src/charts/palette.ts). */
const pathsIn = (page: Page, colour: string): Promise<number[]> =>
  page.evaluate((c) => [...document.querySelectorAll('.charts-panel svg[role="img"]')].map((svg) => svg.querySelectorAll(`path[stroke="${c}"]`).length), colour);

describe('comparisons on the charts in Chromium', () => {
  it('turning on a snapshot and the smooth fit adds their lines to both charts and both legends', async () => {
    const errors: string[] = [];
    const page = await open(1280, 900);
    page.on('pageerror', (e) => errors.push(e.message));
    expect(await pathsIn(page, SNAPSHOT_STYLES[0]!.colour)).toEqual([0, 0]);
    expect(await pathsIn(page, FIT_STYLE.colour)).toEqual([0, 0]);
    await page.getByText('Compare on the charts').click();
    await page.getByRole('checkbox', { name: 'Month-end close' }).check();
    await page.getByRole('checkbox', { name: 'Smooth fit' }).check();
    const charts = page.getByRole('region', { name: 'Charts', exact: true });
    await charts.getByText('Nelson-Siegel fit (zero)').first().waitFor({ timeout: 20_000 });
    for (const text of ['Snapshot Month-end close (zero)', 'Snapshot Month-end close (3M forward)', 'Nelson-Siegel fit (zero)', 'Nelson-Siegel fit (3M forward)']) {
      await expect(charts.locator('.legend li', { hasText: text }).count()).resolves.toBe(1);
    }
    // The snapshot's settlement differs: the legend says how it is lined up (the snapshot table's default).
    await expect(charts.locator('.legend li', { hasText: 'Snapshot Month-end close: settlement 2026-12-15, lined up by time to maturity' }).count()).resolves.toBe(2);
    // An invented reference curve of yearly discount factors: no two dates 3M apart, so the zero chart only.
    const rows = [1, 2, 3, 5, 7, 10, 20, 30].map((y) => `${2027 + y}-01-15,${Math.exp(-(0.041 + 0.0004 * y) * y).toFixed(6)}`);
    await page.getByLabel(/Reference CSV/).fill(`date,discount\n${rows.join('\n')}`);
    await page.getByRole('checkbox', { name: /Reference curve/ }).check();
    // The reference curve's reader loads on first use: wait for its line, then count.
    await charts.locator('.legend li', { hasText: 'Reference (zero; zero chart only)' }).first().waitFor({ timeout: 20_000 });
    await expect(charts.locator('.legend li', { hasText: 'Reference (zero; zero chart only)' }).count()).resolves.toBe(1);
    await expect(charts.locator('.legend li', { hasText: 'zero chart only: no two of its dates are 3M apart' }).count()).resolves.toBe(1);
    expect(await pathsIn(page, REFERENCE_STYLE.colour)).toEqual([1, 0]);
    expect((await pathsIn(page, SNAPSHOT_STYLES[0]!.colour)).every((k) => k >= 1)).toBe(true);
    expect((await pathsIn(page, FIT_STYLE.colour)).every((k) => k >= 1)).toBe(true);
    await mkdir(SCREENSHOT_DIR, { recursive: true });
    await charts.screenshot({ path: path.join(SCREENSHOT_DIR, 'comparisons-1280.png') });
    // Lined up by calendar date instead: one choice for the charts and the snapshot table.
    await page.getByRole('radio', { name: 'calendar date' }).first().check();
    await expect(charts.locator('.legend li', { hasText: 'lined up by calendar date' }).count()).resolves.toBe(2);
    // A reload keeps the choice (it is in the document's view, saved with the workspace).
    await page.waitForTimeout(600);
    await page.reload({ waitUntil: 'load' });
    await charts.getByText('Nelson-Siegel fit (zero)').first().waitFor({ timeout: 20_000 });
    await expect(charts.locator('.legend li', { hasText: 'Snapshot Month-end close (zero)' }).count()).resolves.toBe(1);
    await expect(charts.locator('.legend li', { hasText: 'lined up by calendar date' }).count()).resolves.toBe(2);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('at 390 px the choices and the legends fit the screen', async () => {
    const page = await open(390, 844);
    await page.getByText('Compare on the charts').click();
    await page.getByRole('checkbox', { name: 'Month-end close' }).check();
    await page.getByRole('checkbox', { name: 'Smooth fit' }).check();
    const charts = page.getByRole('region', { name: 'Charts', exact: true });
    await charts.getByText('Nelson-Siegel fit (zero)').first().waitFor({ timeout: 20_000 });
    await charts.screenshot({ path: path.join(SCREENSHOT_DIR, 'comparisons-390.png') });
    const overflow = await page.evaluate(() =>
      [...document.querySelectorAll('.comparisons input, .comparisons select, .legend li')].filter((el) => el.getBoundingClientRect().right > 390 + 0.5).map((el) => `${el.textContent} ${Math.round(el.getBoundingClientRect().right)}`),
    );
    expect(overflow).toEqual([]);
    await page.context().close();
  });
});
