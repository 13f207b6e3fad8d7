// Several curves in Chromium on the built app (issue 18 item 10): the command line's test document
// with named curves (test/fixtures/namedCurves) opened as a workspace file, the curve picker, a
// named curve's read-only quotes with the curve each builds and the curve that discounted it, the
// spread table and its chart; and the same workspace from a link. Screenshots at 1280 and 760 px go to
// test/artifacts/screenshots/named-curves-* (the spread view alone: named-curves-spread-*). A curve
// added in the workbench to a workspace of one curve, its quotes typed row by row, shown by the
// picker and in the spread view: named-curves-added-* (the forms open: named-curves-forms-*).
import { readFileSync } from 'node:fs';
import { REPO_ROOT } from './harness.ts';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { readNamedCurves, workbenchFromEngine } from '../../src/core/index.ts';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { launchBrowser, SCREENSHOT_DIR, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';

const FILE = 'test/fixtures/namedCurves/two-curves.json';
const AXE_SOURCE = readFileSync(path.join(REPO_ROOT, 'node_modules', 'axe-core', 'axe.min.js'), 'utf8');
/** axe-core's serious and critical findings in the picker and the spread view (the rules engine test/browser/accessibility.test.ts runs on the whole page). */
async function serious(p: Page): Promise<string[]> {
  await p.evaluate(AXE_SOURCE);
  return p.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: Document, o: object): Promise<{ violations: { id: string; impact: string | null }[] }> } }).axe;
    const r = await axe.run({ include: [['.named-curves'], ['.spread-panel']] } as unknown as Document, { resultTypes: ['violations'] });
    return r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} ${JSON.stringify((v as unknown as { nodes: { target: unknown }[] }).nodes.map((x) => x.target))}`);
  });
}
const FIXTURE = JSON.parse(readFileSync(FILE, 'utf8')) as Record<string, unknown>;
let browser: TestBrowser | undefined;
let server: StaticServer | undefined;

beforeAll(async () => {
  server = await serveDist();
  browser = await launchBrowser();
  await mkdir(SCREENSHOT_DIR, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function page(width: number, hash = ''): Promise<Page> {
  const context = await browser!.browser.newContext({ viewport: { width, height: 1000 }, locale: 'en-US', timezoneId: 'America/Los_Angeles', reducedMotion: 'reduce' });
  const p = await context.newPage();
  await p.goto(`${server!.url}${hash}`, { waitUntil: 'load' });
  await p.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
  return p;
}

/** The d attribute of the zero chart's first drawn line (it changes with the curve drawn). */
const zeroPath = (p: Page): Promise<string | null> => p.evaluate(() => document.querySelector('.charts-panel svg[role="img"] path[stroke]')?.getAttribute('d') ?? null);

describe('named curves in Chromium', () => {
  it.each([1280, 760])('a workspace file with named curves opens; the picker shows a named curve, its quotes and the spread (%i px)', async (width) => {
    const errors: string[] = [];
    const p = await page(width);
    p.on('pageerror', (e) => errors.push(e.message));
    await p.getByLabel('Workspace file to open').setInputFiles(path.resolve(FILE));
    const picker = p.getByRole('combobox', { name: 'Curve shown' });
    await picker.waitFor({ timeout: 20_000 });
    await p.getByRole('table', { name: /^Spread of euribor6m over default, zero rates/ }).waitFor();
    // The spread chart: a drawn line of bp over maturity, its axis labelled in bp with the convention.
    const spreadChart = p.getByRole('img', { name: 'Spread of euribor6m over default, zero rates' });
    await spreadChart.waitFor();
    expect((await spreadChart.locator('[data-series="spread"] path').first().getAttribute('d'))?.length ?? 0).toBeGreaterThan(1000);
    expect(await spreadChart.textContent()).toContain('Spread (bp, zero rates, cont, ACT/365F)');
    await p.locator('.spread-panel').screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-spread-${width}.png`) });
    const before = await zeroPath(p);
    await p.screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-default-${width}.png`), fullPage: true });
    await picker.selectOption('euribor6m');
    const quotes = p.getByRole('table', { name: 'Quotes of the curve euribor6m' });
    await quotes.waitFor();
    expect(await quotes.getByRole('row').count()).toBe(4);
    await expect.poll(() => zeroPath(p)).not.toBe(before);
    expect(await quotes.getByRole('row').nth(2).textContent()).toContain('default');
    await p.screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-euribor6m-${width}.png`), fullPage: true });
    // Roll versus term follows the curve shown and names it.
    const roll = p.getByRole('region', { name: 'Roll versus term on the curve "euribor6m"' });
    await roll.waitFor({ timeout: 20_000 });
    await roll.screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-roll-euribor6m-${width}.png`) });
    // Forwards instead of zero rates: the spread table says so in its name and headers.
    await p.getByRole('combobox', { name: 'Spread of zero rates or forwards' }).selectOption('forward');
    await p.getByRole('table', { name: /^Spread of euribor6m over default, 3M forwards/ }).waitFor();
    expect(await serious(p)).toEqual([]);
    expect(errors).toEqual([]);
  });

  it.each([1280, 760])('adds a projection curve to a workspace of one curve, types its quotes, and shows it in the picker and the spread (%i px)', async (width) => {
    const errors: string[] = [];
    const p = await page(width);
    p.on('pageerror', (e) => errors.push(e.message));
    await p.getByRole('button', { name: 'Add a named curve' }).click();
    const form = p.getByRole('form', { name: 'Add a named curve' });
    await form.waitFor({ timeout: 20_000 });
    await form.getByRole('textbox', { name: 'Name' }).fill('euribor3m');
    await form.getByRole('combobox', { name: 'Role' }).selectOption('projection');
    await form.getByRole('combobox', { name: 'Index tenor' }).selectOption('3M');
    await form.getByRole('combobox', { name: 'Discounted on' }).selectOption('');
    await form.getByRole('button', { name: 'Add the curve' }).click();
    // Refused on its field, naming what to change.
    await form.getByText('A projection curve needs a discounting curve: choose one').waitFor();
    await p.locator('.named-curves').screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-forms-add-${width}.png`) });
    expect(await serious(p)).toEqual([]);
    await form.getByRole('combobox', { name: 'Discounted on' }).selectOption('default');
    await form.getByRole('button', { name: 'Add the curve' }).click();
    const picker = p.getByRole('combobox', { name: 'Curve shown' });
    expect(await picker.inputValue()).toBe('euribor3m');
    // Its quotes typed row by row: a deposit, an FRA (start x end) and two swaps, in the file's unit.
    for (const [kind, maturity, rate] of [
      ['deposit', '3M', '0.0441'],
      ['fra', '3x6', '0.0436'],
      ['swap', '2Y', '0.0425'],
      ['swap', '5Y', '0.0419'],
    ]) {
      await p.getByRole('button', { name: 'Add a quote to euribor3m' }).click();
      const q = p.getByRole('form', { name: 'New quote of euribor3m' });
      await q.getByRole('textbox', { name: 'Kind' }).fill(kind!);
      await q.getByRole('textbox', { name: 'Maturity' }).fill(maturity!);
      await q.getByRole('textbox', { name: 'Rate / yield' }).fill(rate!);
      if (kind === 'fra') await p.locator('.named-curves').screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-forms-quote-${width}.png`) });
      await q.getByRole('button', { name: 'Add the quote' }).click();
    }
    const quotes = p.getByRole('table', { name: 'Quotes of the curve euribor3m' });
    expect(await quotes.getByRole('row').count()).toBe(5);
    // Each quote builds euribor3m; the swaps are discounted on the default curve, the deposit and FRA on none (own ratio).
    const cells = await quotes.getByRole('row').evaluateAll((rows) => rows.slice(1).map((r) => [...r.querySelectorAll('td')].map((c) => c.textContent)));
    expect(cells.map((r) => [r[1], r[4], r[5]])).toEqual([
      ['deposit', 'euribor3m', 'none (own DF ratio)'],
      ['fra', 'euribor3m', 'none (own DF ratio)'],
      ['swap', 'euribor3m', 'default'],
      ['swap', 'euribor3m', 'default'],
    ]);
    expect(await picker.locator('option', { hasText: 'euribor3m' }).textContent()).toBe('euribor3m: projection, 3M index, discounted on default');
    // The spread of the new curve over the default curve.
    await p.getByRole('table', { name: /^Spread of euribor3m over default, zero rates/ }).waitFor();
    const spreadChart = p.getByRole('img', { name: 'Spread of euribor3m over default, zero rates' });
    expect((await spreadChart.locator('[data-series="spread"] path').first().getAttribute('d'))?.length ?? 0).toBeGreaterThan(1000);
    await p.screenshot({ path: path.join(SCREENSHOT_DIR, `named-curves-added-${width}.png`), fullPage: true });
    expect(await serious(p)).toEqual([]);
    // Undo takes the quotes and the curve back, one step each.
    for (let i = 0; i < 5; i++) await p.getByRole('button', { name: 'Undo' }).click();
    await p.getByRole('button', { name: 'Add a named curve' }).waitFor();
    expect(errors).toEqual([]);
  });

  it('opens from a link with its named curves and the chosen curve', async () => {
    let n = 0;
    const wb = workbenchFromEngine(FIXTURE, () => `r${n++}`, readNamedCurves);
    if (!wb.ok) throw new Error(wb.errors[0]!.message);
    const hash = `#${await encodeWorkspaceLink({ ...wb.value, view: { shownCurve: 'govt' } } as unknown as Record<string, unknown>)}`;
    const p = await page(1280, hash);
    await p.getByRole('table', { name: 'Quotes of the curve govt' }).waitFor({ timeout: 20_000 });
    expect(await p.getByRole('combobox', { name: 'Curve shown' }).inputValue()).toBe('govt');
  });
});
