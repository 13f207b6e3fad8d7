// Nothing lost, nothing silently changed, in Debian's Chromium on the built app: a link naming an
// interpolation this build does not know opens read-only with a banner naming it (no default put in
// its place, nothing saved over the user's workspace) until the user makes an editable copy; a
// 600-row paste keeps the first 500 rows and says 100 were left out, and the workspace the app then
// saves (file and link) opens again. Invented data.
import { readFile } from 'node:fs/promises';
import { deflateRawSync } from 'node:zlib';
import { encodeBase64Url } from '../../src/share/base64url.ts';
import type { Page } from 'playwright-core';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';
import { diagnostics, newPage, screenshot } from './harness.ts';
import { useSharedApp } from './sharedApp.ts';
import { openRecord, savedRecords } from './savedWorkspaces.ts';

const app = useSharedApp();

async function open(page: Page, url: string): Promise<void> {
  await page.goto(url, { waitUntil: 'load' });
  await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
}
const rowCount = async (page: Page): Promise<number> => Number(await page.getByRole('grid', { name: /Quotes/ }).getAttribute('aria-rowcount')) - 1;

/** A spreadsheet block: a header and `n` swap rows on monthly maturities (invented rates). */
const block = (n: number): string =>
  ['Kind\tMaturity\tRate', ...Array.from({ length: n }, (_, i) => `swap\t${2027 + Math.floor(i / 12)}-${String(1 + (i % 12)).padStart(2, '0')}-15\t${(3.5 + 0.001 * (i % 97)).toFixed(3)}`)].join('\n');

describe('read-only opening and one set of caps', () => {
  it('a link with an unknown interpolation opens read-only, names it, saves nothing, and becomes editable only by an explicit copy', async () => {
    let n = 0;
    const doc = { ...demoWorkspace(() => `u${n++}`), curve: { dayCount: 'ACT/365F', interpolation: 'cubic-tension', extrapolation: 'none' } };
    const fragment = await encodeWorkspaceLink(doc as unknown as Record<string, unknown>, 'another-build');
    const page = await newPage(app.browser);
    await open(page, `${app.server.url}#${fragment}`);
    const banner = page.getByRole('region', { name: 'Read-only workspace' });
    await banner.waitFor({ timeout: 10_000 });
    const text = await banner.innerText();
    expect(text).toContain('curve.interpolation is "cubic-tension"; this build supports linear-zero, log-linear-discount, cubic-zero, monotone-convex, monotone-convex-positive.');
    expect(await page.getByRole('alert').filter({ hasText: 'inputs are the same' }).count()).toBe(0);
    // Not quietly monotone convex: the control shows the link's value, and there is no curve.
    expect(await page.getByLabel('Interpolation').inputValue()).toBe('cubic-tension');
    expect(await page.getByLabel('Interpolation').isDisabled()).toBe(true);
    const cell = page.getByRole('textbox', { name: 'Row 1 Rate / yield' });
    const before = await cell.inputValue();
    expect(await cell.getAttribute('readonly')).not.toBeNull();
    await cell.press('9');
    expect(await cell.inputValue()).toBe(before);
    await page.waitForTimeout(600);
    // Nothing saved: no workspace record in the browser's database (the demo shown before was never edited).
    expect((await savedRecords(page)).filter(([k]) => k.startsWith('entry:'))).toEqual([]);
    expect(await page.getByRole('status').filter({ hasText: 'Read-only: not saved' }).count()).toBe(1);
    await screenshot(page, 'read-only-unknown-interpolation');
    // The editable copy: the replacement is chosen in view (the default preselected, not applied).
    await banner.getByRole('button', { name: 'Make an editable copy…' }).click();
    const choice = banner.getByRole('combobox');
    expect(await choice.inputValue()).toBe('monotone-convex');
    await choice.selectOption('log-linear-discount');
    await screenshot(page, 'read-only-editable-copy-choice');
    await banner.getByRole('button', { name: 'Make the editable copy' }).click();
    await banner.waitFor({ state: 'detached' });
    expect(await page.getByLabel('Interpolation').inputValue()).toBe('log-linear-discount');
    // The copy is saved like any edited workspace.
    await expect.poll(async () => (await openRecord(page))?.workspace?.curve?.interpolation, { timeout: 5000 }).toBe('log-linear-discount');
    expect(diagnostics(page).pageErrors).toEqual([]);
    await page.close();
  });

  it('a short link whose strategy nests 3,000 deep is refused with a message; the page stays up and the print view draws', async () => {
    let n = 0;
    const doc = JSON.stringify({ b: 'another-build', d: { ...demoWorkspace(() => `d${n++}`), quotes: [], strategy: '@deep' } });
    const text = doc.replace('"@deep"', '{"a":'.repeat(3000) + '1' + '}'.repeat(3000));
    const fragment = `ws1.${encodeBase64Url(new Uint8Array(deflateRawSync(Buffer.from(text, 'utf8'))))}`;
    expect(fragment.length).toBeLessThan(1000); // a few hundred characters
    const page = await newPage(app.browser);
    await open(page, `${app.server.url}#${fragment}`);
    const alert = page.getByRole('alert').filter({ hasText: 'nests lists and objects more than 16 deep' });
    await alert.waitFor({ timeout: 10_000 });
    expect(await alert.innerText()).toContain('Your saved workspace has not been changed.');
    expect(await rowCount(page)).toBe(19);
    await page.getByRole('tab', { name: 'Print' }).click();
    await page.locator('.ps-trace dd').nth(2).waitFor({ timeout: 10_000 });
    expect(await page.locator('.ps-trace dd').nth(2).innerText()).toMatch(/^[0-9a-f]{8}$/);
    expect(diagnostics(page).pageErrors).toEqual([]);
    await page.close();
  });

  it('a 600-row paste keeps the first 500 rows and says 100 were left out; the file and the link the app then makes open again', async () => {
    const page = await newPage(app.browser, { viewport: { width: 1400, height: 900 } });
    await page.context().grantPermissions(['clipboard-read', 'clipboard-write'], { origin: app.server.url });
    await open(page, app.server.url);
    await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
    await page.evaluate((t) => {
      const dt = new DataTransfer();
      dt.setData('text/plain', t);
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    }, block(600));
    // A header paste shows how it was read first; replacing keeps the first 500 rows.
    await page.getByRole('region', { name: /Paste preview/ }).getByText(/keeps the first 500 and leaves out 100/).waitFor({ timeout: 10_000 });
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('100 rows were left out: a workspace holds at most 500 quotes, so the first rows were kept.').waitFor({ timeout: 10_000 });
    expect(await rowCount(page)).toBe(500);
    expect(await page.getByRole('button', { name: 'Add row' }).isDisabled()).toBe(true);
    await screenshot(page, 'paste-600-rows-capped');

    // The file the app saves opens again (after a reset, so the 500 rows come from the file).
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save workspace file' }).click()]);
    const saved = await readFile((await download.path())!, 'utf8');
    expect(JSON.parse(saved).quotes).toHaveLength(500);
    await page.getByRole('button', { name: 'Reset to demo' }).click();
    expect(await rowCount(page)).toBe(19);
    await page.getByLabel('Workspace file to open').setInputFiles({ name: 'capped.json', mimeType: 'application/json', buffer: Buffer.from(saved) });
    await page.waitForFunction(() => document.querySelector('[role="grid"][aria-label="Quotes"]')?.getAttribute('aria-rowcount') === '501', undefined, { timeout: 10_000 });
    expect(await page.getByText(/was not opened/).count()).toBe(0);

    // So does the link.
    await page.getByRole('button', { name: 'Copy link' }).click();
    await page.getByRole('status').filter({ hasText: 'Link copied' }).waitFor({ timeout: 10_000 });
    const link = await page.evaluate(() => navigator.clipboard.readText());
    const again = await newPage(app.browser);
    await open(again, link);
    await again.waitForFunction(() => document.querySelector('[role="grid"][aria-label="Quotes"]')?.getAttribute('aria-rowcount') === '501', undefined, { timeout: 10_000 });
    expect(await again.getByText(/not valid|not opened/).count()).toBe(0);
    expect(diagnostics(page).pageErrors).toEqual([]);
    expect(diagnostics(again).pageErrors).toEqual([]);
    await again.close();
    await page.close();
  });
});
