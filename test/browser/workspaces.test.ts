// Saved workspaces in Debian's Chromium on the built app: a colleague's link opens as a new entry
// and the user's own stays saved in the list; a link pasted into an already open tab is followed
// without a reload; an amount typed into the roll panel without Enter or Tab survives a reload;
// an earlier build's localStorage save moves into the list. Screenshots of the Workspaces panel
// at 1280 and 390 px wide land in test/artifacts/screenshots/.
import type { Page } from 'playwright-core';
import path from 'node:path';
import { diagnostics, newPage, screenshot, SCREENSHOT_DIR } from './harness.ts';
import { useSharedApp } from './sharedApp.ts';
import { seriousAxeFindings } from './axe.ts';
import { openRecord, savedRecords } from './savedWorkspaces.ts';

const app = useSharedApp();

const rateCell = (page: Page, row: number) => page.getByRole('textbox', { name: `Row ${row} Rate / yield` });
async function open(page: Page, url = app.server.url): Promise<void> {
  await page.goto(url, { waitUntil: 'load' });
  await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
}
async function edit(page: Page, row: number, value: string): Promise<void> {
  await rateCell(page, row).fill(value);
  await rateCell(page, row).press('Tab');
}
const savedRate = async (page: Page): Promise<string | undefined> => (await openRecord(page))?.workspace?.quotes[0]?.rate;

/** A colleague (own browser context) edits row 1 and copies a link; returns its fragment. */
async function colleagueLink(rate: string): Promise<string> {
  const page = await newPage(app.browser);
  await page.context().grantPermissions(['clipboard-read', 'clipboard-write'], { origin: app.server.url });
  await open(page);
  await edit(page, 1, rate);
  await page.getByRole('button', { name: 'Copy link' }).click();
  await page.getByRole('status').filter({ hasText: 'Link copied' }).waitFor();
  const link = await page.evaluate(() => navigator.clipboard.readText());
  await page.close();
  return link.slice(link.indexOf('#'));
}

describe('saved workspaces', () => {
  let fragment = '';
  beforeAll(async () => {
    fragment = await colleagueLink('4.56');
  });

  it('opening a link keeps the user’s own workspace, saved and unchanged, in the list; the notice goes back to it', async () => {
    const page = await newPage(app.browser);
    await open(page);
    await edit(page, 1, '3.21');
    await page.waitForFunction(() => document.querySelector('.save-state')?.textContent === 'Saved in this browser');
    expect(await savedRate(page)).toBe('3.21');
    // The same page at the link's address: a same-document navigation, so the link opens on its
    // hashchange (the codec loads, the link decodes) a moment after the grid is there.
    await open(page, `${app.server.url}${fragment}`);
    await page.waitForFunction(() => (document.querySelector('[aria-label="Row 1 Rate / yield"]') as HTMLInputElement | null)?.value === '4.56', undefined, { timeout: 10_000 });
    const notice = page.getByRole('alert').filter({ hasText: 'Opened a shared workspace as a new entry' });
    await notice.waitFor();
    expect(await notice.innerText()).toContain('your own, “My workspace”, is kept unchanged');
    // Both are in the database; the user's own still holds 3.21 after the link's first save.
    await page.waitForTimeout(400);
    const records = (await savedRecords(page)).filter(([k]) => k.startsWith('entry:')).map(([, v]) => v as { name: string; workspace: { quotes: { rate: string }[] } });
    expect(records).toHaveLength(2);
    expect(records.find((r) => r.name === 'My workspace')!.workspace.quotes[0]!.rate).toBe('3.21');
    await page.getByRole('button', { name: /^Workspaces/ }).click();
    const panel = page.getByRole('region', { name: 'Workspaces' });
    await panel.getByText('My workspace', { exact: true }).waitFor();
    expect(await panel.locator('svg.ws-spark').count()).toBe(2);
    await notice.getByRole('button', { name: 'Back to “My workspace”' }).click();
    await page.waitForFunction(() => (document.querySelector('[aria-label="Row 1 Rate / yield"]') as HTMLInputElement | null)?.value === '3.21');
    await page.reload({ waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor();
    expect(await rateCell(page, 1).inputValue()).toBe('3.21');
    expect(diagnostics(page).pageErrors).toEqual([]);
    await page.close();
  });

  it('a link pasted into the address of a tab already showing the workbench is followed without a reload', async () => {
    const page = await newPage(app.browser);
    await open(page);
    await page.evaluate(() => ((window as unknown as { sameDocument: boolean }).sameDocument = true));
    const before = await rateCell(page, 1).inputValue();
    expect(before).not.toBe('4.56');
    await page.evaluate((h) => (window.location.hash = h), fragment);
    await page.waitForFunction(() => (document.querySelector('[aria-label="Row 1 Rate / yield"]') as HTMLInputElement | null)?.value === '4.56', undefined, { timeout: 10_000 });
    expect(await page.evaluate(() => (window as unknown as { sameDocument?: boolean }).sameDocument)).toBe(true);
    expect(await page.evaluate(() => window.location.hash)).toBe('');
    await page.getByRole('alert').filter({ hasText: 'Opened a shared workspace' }).waitFor();
    await page.close();
  });

  it('an amount typed into the roll panel without Enter or Tab is there after a reload', async () => {
    const page = await newPage(app.browser);
    await open(page);
    const amount = page.getByRole('textbox', { name: /^Amount/ });
    await amount.waitFor({ timeout: 20_000 });
    await amount.fill('2500000'); // no Enter, no Tab: the field keeps focus
    await page.waitForTimeout(300);
    await page.reload({ waitUntil: 'load' });
    const again = page.getByRole('textbox', { name: /^Amount/ });
    await again.waitFor({ timeout: 20_000 });
    expect(await again.inputValue()).toBe('2500000');
    await page.getByText(/typed, not applied yet/).waitFor();
    expect((await openRecord(page))?.drafts).toEqual({ 'roll:Amount': '2500000' });
    await page.close();
  });

  it('the workspace an earlier build kept in localStorage opens and joins the list; the old key is freed', async () => {
    const page = await newPage(app.browser);
    await page.goto(app.server.url, { waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    const page2 = await newPage(app.browser);
    // A fresh context: plant the earlier build's entry before the app's first start.
    const legacy = await page.evaluate(() => ({ app: 'tenorscope', stamp: 'old:1', writer: 'old', savedAt: 1, workspace: { format: 'tenorscope-workbench', version: 1, settlement: '2026-12-15', quotes: [{ kind: 'deposit', maturity: '3M', rate: '4.01' }] } }));
    await page2.addInitScript((text) => {
      if (!sessionStorage.getItem('planted')) {
        localStorage.setItem('tenorscope.workspace', text);
        sessionStorage.setItem('planted', '1');
      }
    }, JSON.stringify(legacy));
    await open(page2);
    expect(await rateCell(page2, 1).inputValue()).toBe('4.01');
    expect(await page2.evaluate(() => localStorage.getItem('tenorscope.workspace'))).toBeNull();
    expect(await savedRate(page2)).toBe('4.01');
    await page.close();
    await page2.close();
  });

  it('screenshots of the Workspaces panel at 1280 and 390 px wide', async () => {
    for (const width of [1280, 390]) {
      const page = await newPage(app.browser, { viewport: { width, height: 900 } });
      await open(page);
      await edit(page, 1, '3.21');
      await open(page, `${app.server.url}${fragment}`);
      await page.getByRole('alert').filter({ hasText: 'Opened a shared workspace' }).waitFor();
      await page.getByRole('button', { name: /^Workspaces/ }).click();
      await page.getByRole('region', { name: 'Workspaces' }).locator('svg.ws-spark').nth(1).waitFor();
      await screenshot(page, `workspaces-${width}`);
      await page.getByRole('region', { name: 'Workspaces' }).screenshot({ path: path.join(SCREENSHOT_DIR, `workspaces-panel-${width}.png`) });
      // axe-core (WCAG 2 A/AA rules) on the open panel: no serious or critical violation.
      expect(await seriousAxeFindings(page, ['section[aria-label="Workspaces"]'])).toEqual([]);
      await page.close();
    }
  });
});
