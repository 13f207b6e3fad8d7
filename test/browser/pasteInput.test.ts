// Typing and pasting, in Debian's Chromium on the built app: the settlement date typed digit by
// digit as in a plain date input, the column-mapping preview of a header paste (common sheet
// header words mid, px, cpn, mat), a CSV whose quoted field holds a tab, and the paste notice
// ending once another edit follows. The quotes are invented test data.
import type { Page } from 'playwright-core';
import path from 'node:path';
import { diagnostics, openWorkbench, screenshot, SCREENSHOT_DIR, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1400, height: 1000 } });
  page = app.page;
});
afterAll(async () => {
  await app?.close();
});

/** Delivers a paste of `text` to the sheet's first Kind cell, as a spreadsheet's Ctrl+V would. */
async function paste(text: string): Promise<void> {
  await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
  await page.evaluate((t) => {
    const dt = new DataTransfer();
    dt.setData('text/plain', t);
    document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, text);
}

const settlementAlert = () => page.getByRole('alert').filter({ hasText: 'Settlement must be a calendar date' });

describe('typing and pasting in Chromium', () => {
  it('typing 03102027 digit by digit into the settlement date gives 2027-03-10, with no error and no empty curve in between', async () => {
    const field = page.getByLabel('Settlement', { exact: true });
    await field.focus(); // the month part of the en-US date input (mm/dd/yyyy)
    for (const digit of '03102027') {
      await page.keyboard.press(digit);
      expect(await settlementAlert().count(), `after typing ${digit}`).toBe(0);
      expect(await page.getByText(/quotes in the curve/).innerText(), `after typing ${digit}`).not.toMatch(/^0 quotes/);
    }
    expect(await field.inputValue()).toBe('2027-03-10');
    expect(await page.evaluate(() => document.querySelector<HTMLInputElement>('input[type="date"]')!.value)).toBe('2027-03-10');
    expect(diagnostics(page).pageErrors).toEqual([]);
  });

  it('a header paste with mid / px / cpn / mat shows how each column is read before anything is replaced', async () => {
    const sheetBefore = await page.getByRole('grid', { name: /Quotes/ }).innerText();
    await paste(['instrument\tmat\tmid\tpx\tcpn\tdesk', 'swap\t5Y\t3.60\t\t\tA', 'swap\t10Y\t3.80\t\t\tA', 'bond\t2031-11-15\t\t99-16\t4.25\tB'].join('\n'));
    const preview = page.getByRole('region', { name: /Paste preview/ });
    await preview.waitFor();
    const mapping = await preview.locator('table.mapping tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].slice(0, 2).map((td) => td.textContent)));
    expect(mapping).toEqual([
      ['instrument', 'Kind'],
      ['mat', 'Maturity'],
      ['mid', 'Rate / yield'],
      ['px', 'Price'],
      ['cpn', 'Coupon'],
      ['desk', 'ignored'],
    ]);
    expect(await preview.innerText()).toContain('3 read as quotes');
    expect(await page.getByRole('grid', { name: /Quotes/ }).innerText()).toBe(sheetBefore); // nothing replaced yet
    await screenshot(page, 'paste-mapping-preview');
    await preview.screenshot({ path: path.join(SCREENSHOT_DIR, 'paste-mapping-preview-close.png') });
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('3 quotes in the curve').waitFor();
    expect(await page.getByRole('textbox', { name: 'Row 3 Price' }).inputValue()).toBe('99-16');
  });

  it('"Undo paste" goes away once the unit is switched, so it cannot undo the unit switch', async () => {
    await expect(page.getByRole('button', { name: 'Undo paste' }).count()).resolves.toBe(1);
    await page.getByText('bp', { exact: true }).click();
    await page.getByRole('textbox', { name: 'Row 1 Rate / yield' }).waitFor();
    expect(await page.getByRole('textbox', { name: 'Row 1 Rate / yield' }).inputValue()).toBe('360');
    expect(await page.getByRole('button', { name: 'Undo paste' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Append instead' }).count()).toBe(0);
    await page.getByText('%', { exact: true }).click();
  });

  it('a CSV whose quoted field holds a tab is read as comma-separated (RFC 4180), kinds intact', async () => {
    await paste('kind,maturity,rate,note\nswap,2Y,3.80,"desk\tA"\nswap,5Y,3.60,"desk\tB"\n');
    const preview = page.getByRole('region', { name: /Paste preview/ });
    await preview.waitFor();
    expect(await preview.innerText()).toContain('split on commas');
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('2 quotes in the curve').waitFor();
    expect(await page.getByRole('textbox', { name: 'Row 1 Kind' }).inputValue()).toBe('swap');
    expect(await page.getByRole('textbox', { name: 'Row 2 Maturity' }).inputValue()).toBe('5Y');
  });

  it('a header paste that would leave no quote cannot replace the sheet', async () => {
    await paste('kind,maturity,rate\nfuture,2Y,abc\n');
    const preview = page.getByRole('region', { name: /Paste preview/ });
    await preview.waitFor();
    expect(await page.getByRole('button', { name: 'Replace the sheet' }).isDisabled()).toBe(true);
    expect(await preview.getByRole('alert').innerText()).toMatch(/none of the 1 pasted rows reads as a quote/);
    await page.getByRole('button', { name: 'Cancel' }).click();
    expect(await page.getByText(/quotes in the curve/).innerText()).toContain('2 quotes in the curve');
    expect(diagnostics(page).pageErrors).toEqual([]);
  });

  it('a 5 MB one-line paste is refused at once with its cause (the size of the text), nothing changed', async () => {
    const sheetBefore = await page.getByRole('grid', { name: /Quotes/ }).innerText();
    await paste('x'.repeat(5_000_000));
    const notice = page.getByRole('status').filter({ hasText: 'Nothing was pasted' });
    await notice.waitFor();
    expect(await notice.innerText()).toContain('the pasted text is 5.0 MB; a cell holds at most 64 characters');
    expect(await page.getByRole('grid', { name: /Quotes/ }).innerText()).toBe(sheetBefore);
    await paste(`kind,tenor,rate\n${'swap,5Y,4\n'.repeat(150_000)}`);
    await page.getByRole('status').filter({ hasText: 'a paste is read up to 1.0 MB' }).waitFor();
    expect(await page.getByRole('grid', { name: /Quotes/ }).innerText()).toBe(sheetBefore);
  });

  it('a large paste is read in a worker with progress shown, then previewed; beyond the quote cap the first rows are kept and the rest counted', async () => {
    // 20,000 rows (about 300 KB): over the 500-quote cap, under the text cap.
    const rows = Array.from({ length: 20_000 }, (_, i) => `swap,${(i % 50) + 1}Y,4.${i % 10}`);
    await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
    await page.evaluate((t) => {
      // Records every progress line shown while the worker reads (they may come and go within frames).
      const seen: string[] = [];
      (window as unknown as { __progress: string[] }).__progress = seen;
      new MutationObserver(() => {
        const line = [...document.querySelectorAll('.notice[role="status"]')].map((n) => n.textContent ?? '').find((x) => x.startsWith('Reading the pasted text'));
        if (line && seen[seen.length - 1] !== line) seen.push(line);
      }).observe(document.body, { subtree: true, childList: true, characterData: true });
      const dt = new DataTransfer();
      dt.setData('text/plain', t);
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    }, `kind,tenor,rate\n${rows.join('\n')}`);
    const preview = page.getByRole('region', { name: /Paste preview/ });
    await preview.waitFor({ timeout: 20_000 });
    const progress = await page.evaluate(() => (window as unknown as { __progress: string[] }).__progress);
    expect(progress[0]).toMatch(/^Reading the pasted text \(\d+ KB\)…/);
    expect(progress).toContainEqual(expect.stringMatching(/: 20000 rows, checking them…/));
    expect(await preview.getByRole('note').innerText()).toMatch(/The paste has 20,000 rows and a workspace holds at most 500 quotes: replacing keeps the first 500 and leaves out 19,500/);
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('19,500 rows were left out: a workspace holds at most 500 quotes, so the first rows were kept.').waitFor({ timeout: 20_000 });
    // 500 rows padded with a wide ignored column (about 100 KB) go through the worker and replace the sheet.
    const wide = Array.from({ length: 500 }, (_, i) => `swap,${i + 1}M,4.${i % 10},${'n'.repeat(180)}`);
    await paste(`kind,tenor,rate,note\n${wide.join('\n')}`);
    await preview.waitFor({ timeout: 20_000 });
    expect(await preview.innerText()).toContain('500 read as quotes');
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('500 quotes in the curve').waitFor({ timeout: 20_000 });
    expect(diagnostics(page).pageErrors).toEqual([]);
    expect(diagnostics(page).consoleErrors).toEqual([]);
  });
});
