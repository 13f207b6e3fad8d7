// The workbench in Debian's Chromium, on the built app: paste a block of quotes, both charts
// change, the key-maturity table shows the core's numbers (computed here in Node by the same
// core, from the pasted text), and a reload finds the workspace intact. Screenshots go to
// test/artifacts/screenshots/.
import type { Page } from 'playwright-core';
import { addTenor, buildCurve, discountOn, forwardOn, parseTenor, parYieldOn, zeroOn, type Curve } from '../../src/core/index.ts';
import { readPastedBlock, toEngineDocument, type QuoteRow } from '../../src/core/index.ts';
import { DEMO_SETTLEMENT } from '../../src/state/demoWorkspace.ts';
import { diagnostics, openWorkbench, screenshot, type BuiltApp } from './harness.ts';

/** An invented block of quotes (test data), as a spreadsheet would put it on the clipboard. */
const PASTE = [
  'Type\tTenor\tRate\tCoupon\tClean price\tFrequency\tDay count',
  'deposit\t1M\t3.90\t\t\t\tACT/360',
  'deposit\t3M\t3.95\t\t\t\tACT/360',
  'deposit\t6M\t4.00\t\t\t\tACT/360',
  'bill\t1Y\t3.85',
  'bond\t2028-12-15\t\t3.5\t99.10\t2\tACT/ACT-ICMA',
  'swap\t3Y\t3.70\t\t\t1\t30/360',
  'swap\t5Y\t3.60\t\t\t1\t30/360',
  'swap\t7Y\t3.65\t\t\t1\t30/360',
  'swap\t10Y\t3.80\t\t\t1\t30/360',
  'swap\t20Y\t4.05\t\t\t1\t30/360',
  'swap\t30Y\t3.95\t\t\t1\t30/360',
].join('\n');

let app: BuiltApp | undefined;
let page: Page;

const paths = async (): Promise<{ zero: string | null; forward: string | null }> =>
  page.evaluate(() => ({
    zero: document.querySelector('svg[aria-label^="Zero curve"] [data-series="zero"] path')?.getAttribute('d') ?? null,
    forward: document.querySelector('svg[aria-label^="Forward curve"] [data-series="forward"] path')?.getAttribute('d') ?? null,
  }));

const keyTable = async (): Promise<Record<string, Record<string, string>>> =>
  page.evaluate(() => {
    const out: Record<string, Record<string, string>> = {};
    for (const tr of document.querySelectorAll('table[aria-label="Key maturities"] tbody tr')) {
      const row: Record<string, string> = {};
      for (const td of tr.querySelectorAll('td[data-field]')) row[td.getAttribute('data-field')!] = td.textContent!.replace('*', '');
      out[tr.getAttribute('data-tenor')!] = row;
    }
    return out;
  });

/** The core's key-maturity numbers for the pasted block, in the app's default display settings. */
function expectedKeyTable(): Record<string, Record<string, string>> {
  const rows: QuoteRow[] = readPastedBlock(PASTE).rows.map((r, i) => ({ ...r, id: String(i), enabled: true }));
  const doc = toEngineDocument({ settlement: DEMO_SETTLEMENT, curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'flat-forward' }, quoteUnit: 'percent', quotes: rows }).doc;
  const b = buildCurve(doc);
  expect(b.errors).toEqual([]);
  const curve = b.curve as Curve;
  const pct = (x: number): string => `${(100 * x).toFixed(4)}%`.replace('-', '\u2212');
  const out: Record<string, Record<string, string>> = {};
  for (const tenor of ['3M', '6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y']) {
    const date = addTenor(curve.settlement, parseTenor(tenor)!);
    const d = discountOn(curve, date);
    const z = zeroOn(curve, date, 'continuous', 'ACT/365F');
    const p = parYieldOn(curve, date, 2);
    const f = forwardOn(curve, date, addTenor(date, parseTenor('3M')!), 'continuous', 'ACT/365F');
    if (!d.ok || !z.ok || !p.ok || !f.ok) throw new Error(`core query failed at ${tenor}`);
    out[tenor] = { discount: d.value.discount.toFixed(8), zero: pct(z.value.zero), par: pct(p.value.rate), forward: pct(f.value.rate) };
  }
  return out;
}

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1600, height: 1000 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

describe('the workbench in Chromium', () => {
  it('opens on the demo workspace with both charts', async () => {
    expect(await page.getByRole('img', { name: /Zero curve/ }).count()).toBe(1);
    expect(await page.getByRole('img', { name: /Forward curve/ }).count()).toBe(1);
    expect(await page.getByText(/quotes in the curve/).innerText()).toContain('19 quotes in the curve');
    await screenshot(page, 'workbench-demo');
  });

  it('a pasted block with a header replaces the sheet, and both charts change', async () => {
    const before = await paths();
    await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
    await page.evaluate((text) => {
      const dt = new DataTransfer();
      dt.setData('text/plain', text);
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    }, PASTE);
    await page.getByRole('region', { name: /Paste preview/ }).waitFor();
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('11 quotes in the curve').waitFor();
    const after = await paths();
    expect(after.zero).not.toBeNull();
    expect(after.zero).not.toBe(before.zero);
    expect(after.forward).not.toBe(before.forward);
    await screenshot(page, 'workbench-pasted');
  });

  it('the key-maturity table shows the core\u2019s numbers for the pasted quotes', async () => {
    expect(await keyTable()).toEqual(expectedKeyTable());
  });

  it('the crosshair shows values on both charts', async () => {
    const box = await page.getByRole('img', { name: /Zero curve/ }).boundingBox();
    await page.mouse.move(box!.x + box!.width * 0.35, box!.y + box!.height * 0.5);
    expect(await page.locator('.crosshair').count()).toBe(2);
    expect(await page.locator('.readout').first().innerText()).toMatch(/Zero \d\.\d{4}%/);
    await screenshot(page, 'workbench-crosshair');
    await page.mouse.move(0, 0);
  });

  it('a reload finds the pasted workspace intact', async () => {
    const sheet = await page.getByRole('grid', { name: /Quotes/ }).innerText();
    const table = await keyTable();
    await page.reload({ waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor();
    expect(await page.getByRole('textbox', { name: 'Row 5 Maturity' }).inputValue()).toBe('2028-12-15');
    expect(await page.getByRole('grid', { name: /Quotes/ }).innerText()).toBe(sheet);
    expect(await keyTable()).toEqual(table);
    expect(await page.getByText(/quotes in the curve/).innerText()).toContain('11 quotes in the curve');
  });

  it('the method overlay fills in every interpolation method', async () => {
    await page.getByRole('checkbox', { name: 'Compare methods' }).check();
    await page.waitForFunction(() => document.querySelectorAll('svg[aria-label^="Forward curve"] [data-series^="m-"]').length === 4, undefined, { timeout: 20_000 });
    await page.getByRole('combobox', { name: 'Maturity axis' }).selectOption('sqrt');
    await screenshot(page, 'workbench-methods-sqrt');
  });

  it('shows the schedule of a swap and the forward grid', async () => {
    await page.getByRole('tab', { name: 'Quote check' }).click();
    await page.getByRole('table', { name: 'Quote check' }).getByRole('button', { name: '9', exact: true }).click();
    const schedule = page.getByRole('table', { name: 'Schedule of row 9' });
    expect(await schedule.locator('tbody tr').count()).toBe(10); // a 10Y annual fixed leg
    await screenshot(page, 'workbench-quote-check');
    await page.getByRole('tab', { name: 'Forward grid' }).click();
    expect(await page.getByRole('table', { name: 'Forward grid' }).locator('td[data-cell="5Yx5Y"]').innerText()).toMatch(/^\d\.\d{4}%$/);
    await screenshot(page, 'workbench-forward-grid');
  });

  it('a second tab on the same workspace is detected and warned about in both', async () => {
    const second = await page.context().newPage();
    await second.goto(app!.server.url, { waitUntil: 'load' });
    await second.getByRole('grid', { name: /Quotes/ }).waitFor();
    await second.getByText(/also open in another tab/).waitFor({ timeout: 10_000 });
    await page.getByText(/also open in another tab/).waitFor({ timeout: 10_000 });
    // An edit in the second tab is saved; the first tab pauses instead of overwriting it.
    await second.getByRole('textbox', { name: 'Row 1 Rate / yield' }).fill('3.91');
    await page.getByText(/Another tab saved a different version/).waitFor({ timeout: 10_000 });
    await screenshot(page, 'workbench-two-tabs');
    await page.getByRole('button', { name: /Load the other tab/ }).click();
    // Loading reads the other tab's save from the browser's database: a moment, not a frame.
    await expect.poll(() => page.getByRole('textbox', { name: 'Row 1 Rate / yield' }).inputValue(), { timeout: 5000 }).toBe('3.91');
    await second.close();
  });

  it('ran without page errors, console errors or failed requests', () => {
    expect(diagnostics(page)).toEqual({ pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] });
  });
});
