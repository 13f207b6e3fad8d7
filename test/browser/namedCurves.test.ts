// Several curves in Chromium on the built app (issue 18 item 10): the command line's test document
// with named curves (test/fixtures/namedCurves) opened as a workspace file, the curve picker, a
// named curve's read-only quotes with the curve each builds and the curve that discounted it, the
// spread table and its chart; and the same workspace from a link. Screenshots at 1280 and 760 px go to
// test/artifacts/screenshots/named-curves-* (the spread view alone: named-curves-spread-*).
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
