// The roll-versus-term panel in Chromium, whole flow: it renders with its sentence, chart and
// tables; a new horizon recomputes; the forwards view shows the baseline where every strategy
// ends equal; a bad amount is kept as typed with a message; nothing errors in the page.
// The workbench had not mounted the panel when this was written, so the test builds harness pages
// of its own (test/browser/rollHarness/) with vite and serves them from loopback: the panel alone,
// and the whole workbench with the panel mounted in its slot as src/app/extensions.tsx would.
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import react from '@vitejs/plugin-react';
import type { Page } from 'playwright-core';
import { build } from 'vite';
import { diagnostics, launchBrowser, newPage, REPO_ROOT, screenshot, type TestBrowser } from './harness.ts';
import { serveDirectory, type StaticServer } from './static-server.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;
let outDir: string | undefined;
let page: Page;

beforeAll(async () => {
  outDir = await mkdtemp(path.join(tmpdir(), 'tenorscope-roll-harness-'));
  await build({
    configFile: false,
    root: path.join(REPO_ROOT, 'test', 'browser', 'rollHarness'),
    base: './',
    plugins: [react()],
    logLevel: 'error',
    define: { __BUILD_ID__: JSON.stringify('roll-harness') },
    build: {
      outDir,
      emptyOutDir: true,
      target: 'es2022',
      rollupOptions: { input: { panel: path.join(REPO_ROOT, 'test', 'browser', 'rollHarness', 'index.html'), app: path.join(REPO_ROOT, 'test', 'browser', 'rollHarness', 'app.html') } },
    },
  });
  server = await serveDirectory(outDir);
  browser = await launchBrowser();
  page = await newPage(browser, { viewport: { width: 1100, height: 1400 } });
  await page.goto(server.url, { waitUntil: 'load' });
  await page.getByRole('region', { name: /Roll versus term/ }).waitFor({ timeout: 20_000 });
});

afterAll(async () => {
  await page?.close();
  await browser?.close();
  await server?.close();
  if (outDir) await rm(outDir, { recursive: true, force: true });
});

const sentence = () => page.locator('.roll-sentence');

describe('roll versus term in the browser', () => {
  it('shows the result sentence with its conventions, the chart and the tables', async () => {
    const panel = page.getByRole('region', { name: /Roll versus term/ });
    expect(await panel.count()).toBe(1);
    expect(await sentence().innerText()).toMatch(/^Under an unchanged curve, .* ends ahead at ¤ [\d,]+\.\d\d on 2028-12-01, .*ann, ACT\/365F.*\(simple, ACT\/360\)\.$/);
    expect(await page.locator('svg[role="img"] path[data-strategy]').count()).toBe(4);
    expect(await page.getByRole('table', { name: /Roll legs of 3M to 2028-12-01/ }).locator('tbody tr').count()).toBe(8);
    await screenshot(page, 'roll-panel');
  });

  it('recomputes for a new horizon typed and committed with Enter', async () => {
    const horizon = page.getByRole('textbox', { name: /Horizon/ });
    await horizon.fill('18M');
    await horizon.press('Enter');
    await page.getByRole('table', { name: /Roll legs of 3M to 2028-06-01/ }).waitFor();
    expect(await page.getByRole('table', { name: /Roll legs of 3M to 2028-06-01/ }).locator('tbody tr').count()).toBe(6);
    expect(await page.getByTestId('strategy-json').textContent()).toContain('"horizon":"18M"');
  });

  it('shows the forwards baseline: every strategy ends with the same money', async () => {
    await page.getByRole('combobox', { name: /Chosen view/ }).selectOption('forwards');
    expect(await sentence().innerText()).toMatch(/^Under forwards realised every strategy ends at ¤ [\d,]+\.\d\d on 2028-06-01/);
    const values = await page.locator('table.roll-results tbody tr td:first-of-type .roll-value').allInnerTexts();
    expect(values).toHaveLength(4);
    expect(new Set(values).size).toBe(1);
  });

  it('keeps a bad amount as typed, says what is valid, and keeps the last valid results', async () => {
    const amount = page.getByRole('textbox', { name: /Amount/ });
    await amount.fill('2,000,00'); // badly grouped (2,000,000 and 2m are amounts)
    await amount.press('Tab');
    expect(await amount.inputValue()).toBe('2,000,00');
    expect(await page.getByRole('alert').first().innerText()).toMatch(/a comma groups thousands in threes/);
    expect(await page.getByTestId('strategy-json').textContent()).toContain('"amount":"1000000"');
    await screenshot(page, 'roll-panel-bad-amount');
  });

  it('loads and runs without page errors, console errors, failed or off-machine requests', () => {
    expect(diagnostics(page)).toEqual({ pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] });
  });
});

describe('roll versus term inside the workbench', () => {
  let app: Page;
  beforeAll(async () => {
    app = await newPage(browser!, { viewport: { width: 1400, height: 1600 } });
    await app.goto(`${server!.url}app.html`, { waitUntil: 'load' });
    await app.locator('section.roll-panel').waitFor({ timeout: 20_000 });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('shows the comparison on the demo curve beside the charts', async () => {
    expect(await app.locator('section.roll-panel .roll-sentence').innerText()).toMatch(/^Under an unchanged curve, /);
    expect(await app.locator('[data-slot="roll-versus-term"] section.roll-panel').count()).toBe(1);
    await screenshot(app, 'roll-panel-in-workbench');
  });

  it('rolls 6M after the roll tenor changes, and undo brings back 3M', async () => {
    const panel = app.locator('section.roll-panel');
    await panel.getByRole('combobox', { name: /Roll tenor/ }).selectOption('6M');
    await panel.getByRole('table', { name: /Roll legs of 6M/ }).waitFor();
    expect(await panel.getByRole('table', { name: /Roll legs of 6M/ }).locator('tbody tr').count()).toBe(4);
    await app.getByRole('button', { name: 'Undo' }).click();
    await panel.getByRole('table', { name: /Roll legs of 3M/ }).waitFor();
    expect(await panel.getByRole('combobox', { name: /Roll tenor/ }).inputValue()).toBe('3M');
  });

  it('runs without page errors, console errors, failed or off-machine requests', () => {
    expect(diagnostics(app)).toEqual({ pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] });
  });
});
