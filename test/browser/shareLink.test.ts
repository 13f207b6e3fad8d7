// Build a scenario, copy the link, open it in a new browser context and find the same table
// numbers; a damaged link shows a message and leaves the saved workspace as it was.
import type { Page } from 'playwright-core';
import { serveDirectory, type StaticServer } from './static-server.ts';
import { diagnostics, launchBrowser, newPage, type TestBrowser } from './harness.ts';
import { buildHarness } from './print-harness/buildHarness.ts';
import { openRecord, savedRecords } from './savedWorkspaces.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;

beforeAll(async () => {
  server = await serveDirectory(await buildHarness());
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function open(url: string): Promise<Page> {
  const page = await newPage(browser!);
  await page.context().grantPermissions(['clipboard-read', 'clipboard-write'], { origin: server!.url });
  await page.goto(url, { waitUntil: 'load' });
  await page.waitForFunction(() => document.body.dataset.ready === 'true', undefined, { timeout: 20_000 });
  return page;
}
const cells = (page: Page): Promise<string[]> =>
  page.locator('[data-cell]').evaluateAll((els) => els.map((e) => `${e.getAttribute('data-cell')}=${e.textContent ?? ''}`));

describe('shared link in Chromium', () => {
  let link = '';
  let numbers: string[] = [];

  it('builds a scenario and copies a link (button named "Copy link")', async () => {
    const page = await open(`${server!.url}share.html`);
    await page.getByLabel('Name').fill('Bear steepener');
    await page.getByLabel('Shape').selectOption('twist');
    await page.getByLabel('Moves').selectOption('quotes');
    await page.getByLabel('Spread change (bp)').fill('30');
    await page.getByRole('button', { name: 'Add scenario' }).click();
    await page.locator('[data-cell="s1:10Y:zero"]').waitFor();
    numbers = await cells(page);
    expect(numbers.length).toBe(18);
    expect(numbers.find((c) => c.startsWith('s1:10Y:zero'))).toMatch(/^s1:10Y:zero=\+\d+\.\d\d bp$/);
    await page.getByRole('button', { name: /link/i }).click();
    await page.getByRole('status').filter({ hasText: 'Link copied' }).waitFor();
    link = await page.evaluate(() => navigator.clipboard.readText());
    expect(link).toMatch(/share\.html#ws1\.[A-Za-z0-9_-]+$/);
    expect(diagnostics(page).pageErrors).toEqual([]);
    await page.close();
  });

  it('opens the link in a new context with the same table numbers and no notice', async () => {
    const page = await open(link);
    await page.locator('[data-cell="s1:10Y:zero"]').waitFor();
    expect(await cells(page)).toEqual(numbers);
    expect(await page.getByRole('alert').count()).toBe(0);
    expect(diagnostics(page)).toEqual({ pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] });
    await page.close();
  });

  it('a damaged link shows a message and leaves the saved workspace untouched', async () => {
    const page = await open(`${server!.url}share.html`);
    const saved = await page.evaluate(() => localStorage.getItem('harness.saved'));
    const bad = link.slice(0, link.length - 40) + 'AAAA';
    await page.goto(bad, { waitUntil: 'load' });
    await page.reload({ waitUntil: 'load' });
    await page.waitForFunction(() => document.body.dataset.ready === 'true');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.innerText()).toContain('Your saved workspace has not been changed.');
    expect(await page.evaluate(() => localStorage.getItem('harness.saved'))).toBe(saved);
    expect(await page.locator('[data-cell]').count()).toBe(0);
    expect(diagnostics(page).pageErrors).toEqual([]);
    await page.close();
  });

  it('in the workbench: a scenario added in its section comes back from the copied link in a fresh context', async () => {
    const page = await open(`${server!.url}app.html`);
    await page.getByRole('tab', { name: 'Scenarios' }).click();
    await page.getByLabel('Name').fill('Bull flattener');
    await page.getByLabel('Shape').selectOption('twist');
    await page.getByLabel('Spread change (bp)').fill('-15');
    await page.getByRole('button', { name: 'Add scenario' }).click();
    await page.locator('[data-cell="s1:10Y:forward"]').waitFor();
    const before = await cells(page);
    await page.getByRole('button', { name: 'Copy link' }).click();
    await page.getByRole('status').filter({ hasText: 'Link copied' }).waitFor();
    const url = await page.evaluate(() => navigator.clipboard.readText());
    expect(url).toMatch(/app\.html#ws1\./);
    await page.close();

    const fresh = await open(url);
    // The link opens on the section that was open (the document's view), with nothing clicked.
    await fresh.locator('[data-cell="s1:10Y:forward"]').waitFor();
    expect(await cells(fresh)).toEqual(before);
    expect(await fresh.evaluate(() => window.location.hash)).toBe('');
    expect(diagnostics(fresh).pageErrors).toEqual([]);
    await fresh.close();
  });

  it('in the workbench: a damaged link leaves the autosaved workspace as it was', async () => {
    const page = await open(`${server!.url}app.html`);
    await page.getByRole('tab', { name: 'Scenarios' }).click();
    await page.getByLabel('Name').fill('Mine');
    await page.getByRole('button', { name: 'Add scenario' }).click();
    await expect.poll(async () => (await openRecord(page))?.workspace?.scenarios?.map((x) => x.name), { timeout: 10_000 }).toEqual(['Mine']);
    const saved = await savedRecords(page);
    // Same page, new fragment: the open tab follows it at once (hashchange), no reload needed.
    await page.goto(`${server!.url}app.html#ws1.AAAAAAAAAAAAAAAAAAAAAAAA`, { waitUntil: 'load' });
    await page.getByText('Your saved workspace has not been changed.').waitFor();
    await page.waitForTimeout(500);
    expect(await savedRecords(page)).toEqual(saved);
    await page.getByRole('tab', { name: 'Scenarios' }).click();
    await page.getByRole('button', { name: 'Remove scenario Mine' }).waitFor();
    await page.close();
  });
});

