// A large sheet in Debian's Chromium, on the built app: a 500-row paste renders only the rows in
// view (the sheet is windowed above 30 rows) while the curve is built from all 500; scrolling,
// arrow keys and typing reach any row; the focused row stays while the view scrolls away; the
// grid keeps announcing its full size (aria-rowcount) and each row its place (aria-rowindex).
import type { Page } from 'playwright-core';
import { diagnostics, openWorkbench, screenshot, type BuiltApp } from './harness.ts';

/** 500 invented swap quotes on monthly maturities (test data), with a header, as a spreadsheet pastes them. */
const maturityOf = (i: number): string => {
  const months = 13 + i;
  return `${2027 + Math.floor(months / 12)}-${String((months % 12) + 1).padStart(2, '0')}-15`;
};
function fiveHundredRows(): string {
  const lines = ['Type\tMaturity\tRate\tCoupon\tClean price\tFrequency\tDay count'];
  for (let i = 0; i < 500; i++) {
    const t = (13 + i) / 12;
    const r = 4.0 - 0.5 * Math.exp(-t / 2) + 0.35 * (1 - Math.exp(-t / 8));
    lines.push(`swap\t${maturityOf(i)}\t${r.toFixed(4)}\t\t\t1\t30/360`);
  }
  return lines.join('\n');
}

let app: BuiltApp | undefined;
let page: Page;

const renderedRows = (): Promise<number[]> =>
  page.evaluate(() => [...document.querySelectorAll<HTMLElement>('table[aria-label="Quotes"] tr[data-row-index]')].map((tr) => Number(tr.dataset.rowIndex)));

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1600, height: 1000 } });
  page = app.page;
  await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
  await page.evaluate((text) => {
    const dt = new DataTransfer();
    dt.setData('text/plain', text);
    document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, fiveHundredRows());
  await page.getByRole('button', { name: 'Replace the sheet' }).click();
  await page.getByText('500 quotes in the curve').waitFor({ timeout: 20_000 });
});

afterAll(async () => {
  await app?.close();
});

describe('a 500-row sheet in Chromium', () => {
  it('renders only the rows in view (with a margin), builds the curve from all 500 and announces 501 grid rows', async () => {
    const shown = await renderedRows();
    expect(shown.length).toBeGreaterThan(10);
    expect(shown.length).toBeLessThan(120);
    expect(shown[0]).toBe(0);
    expect(await page.getByRole('grid', { name: /Quotes/ }).getAttribute('aria-rowcount')).toBe('501');
    const scrollHeight = await page.evaluate(() => document.querySelector('.sheet-scroll')!.scrollHeight);
    expect(scrollHeight).toBeGreaterThan(500 * 20); // the spacers keep the full height scrollable
    await screenshot(page, 'large-sheet-top');
  });

  it('scrolling to the bottom renders the last row, with its place in the grid', async () => {
    await page.evaluate(() => {
      const el = document.querySelector('.sheet-scroll')!;
      el.scrollTop = el.scrollHeight;
    });
    const last = page.getByRole('textbox', { name: 'Row 500 Maturity' });
    await last.waitFor({ timeout: 5_000 });
    expect(await last.inputValue()).toBe(maturityOf(499));
    expect(await page.locator('tr[data-row-index="499"]').getAttribute('aria-rowindex')).toBe('501');
    expect((await renderedRows()).includes(0)).toBe(false);
    await screenshot(page, 'large-sheet-bottom');
  });

  it('arrow keys walk past the rendered rows, and typing into a far row edits that quote', async () => {
    await page.evaluate(() => (document.querySelector('.sheet-scroll')!.scrollTop = 0));
    const first = page.getByRole('textbox', { name: 'Row 1 Rate / yield' });
    await first.waitFor();
    await first.focus();
    for (let i = 0; i < 120; i++) await page.keyboard.press('ArrowDown');
    const focused = await page.evaluate(() => document.activeElement?.getAttribute('aria-label'));
    expect(focused).toBe('Row 121 Rate / yield');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('9.5');
    await page.keyboard.press('Tab');
    expect(await page.getByRole('textbox', { name: 'Row 121 Rate / yield' }).inputValue()).toBe('9.5');
    expect(await page.getByText(/quotes in the curve/).innerText()).toContain('500 quotes in the curve');
  });

  it('the row being typed in stays rendered when the view scrolls far away', async () => {
    const cell = page.getByRole('textbox', { name: 'Row 121 Kind' });
    await cell.focus();
    await page.evaluate(() => {
      const el = document.querySelector('.sheet-scroll')!;
      el.scrollTop = el.scrollHeight;
    });
    await page.getByRole('textbox', { name: 'Row 500 Kind' }).waitFor();
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Row 121 Kind');
    expect(await renderedRows()).toContain(120);
  });

  it('Tab walks from cell to cell past the rendered rows (the view follows the focus)', async () => {
    await page.evaluate(() => (document.querySelector('.sheet-scroll')!.scrollTop = 0));
    const start = page.getByRole('textbox', { name: 'Row 1 Kind' });
    await start.waitFor();
    await start.focus();
    const before = await renderedRows();
    expect(before).not.toContain(59); // row 60 is outside the first window
    let label: string | null | undefined = null;
    for (let i = 0; i < 1500 && label !== 'Row 60 Kind'; i++) {
      await page.keyboard.press('Tab');
      label = await page.evaluate(() => document.activeElement?.getAttribute('aria-label'));
      // Only the sheet's own cells and row controls come up on the way down.
      expect(label ?? '', `tab stop ${i}`).toMatch(/\brow \d+\b/i);
    }
    expect(label).toBe('Row 60 Kind');
  });

  it('leaves the console free of errors', () => {
    const d = diagnostics(page);
    expect(d.pageErrors).toEqual([]);
    expect(d.consoleErrors).toEqual([]);
  });
});
