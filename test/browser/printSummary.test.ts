// The printed summary is exactly one page on A4 and on US Letter, portrait, with the longest note
// (2,000 characters, cut to 600 on the page) and three scenarios. Pages are counted with poppler's
// pdfinfo and the first page is turned into a PNG with pdftoppm (Debian poppler-utils) to look at.
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { serveDirectory, type StaticServer } from './static-server.ts';
import { diagnostics, launchBrowser, newPage, REPO_ROOT, type TestBrowser } from './harness.ts';
import { buildHarness, HARNESS_BUILD_ID } from './print-harness/buildHarness.ts';

const OUT = path.join(REPO_ROOT, 'test', 'artifacts', 'print');
let browser: TestBrowser | undefined;
let server: StaticServer | undefined;

beforeAll(async () => {
  server = await serveDirectory(await buildHarness());
  browser = await launchBrowser();
  mkdirSync(OUT, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const pagesOf = (file: string): number => {
  const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
  const m = /^Pages:\s+(\d+)/m.exec(info);
  if (!m) throw new Error(`pdfinfo gave no page count:\n${info}`);
  return Number(m[1]);
};

async function printed(query: string, format: 'A4' | 'Letter', name: string): Promise<{ page: Page; pdf: string; pages: number }> {
  const page = await newPage(browser!);
  await page.goto(`${server!.url}print.html?${query}`, { waitUntil: 'load' });
  await page.waitForFunction(() => document.body.dataset.ready === 'true', undefined, { timeout: 20_000 });
  const pdf = path.join(OUT, `${name}.pdf`);
  writeFileSync(pdf, await page.pdf({ format, printBackground: true }));
  await page.emulateMedia({ media: 'print' });
  // Nothing clipped: the page box holds its whole content.
  const fits = await page.locator('.print-summary').evaluate((el) => el.scrollHeight <= el.clientHeight && el.scrollWidth <= el.clientWidth);
  expect(fits, 'the summary overflows its page box (content would be clipped)').toBe(true);
  execFileSync('pdftoppm', ['-png', '-r', '70', '-f', '1', '-l', '1', '-singlefile', pdf, path.join(OUT, name)]);
  return { page, pdf, pages: pagesOf(pdf) };
}

describe('PrintSummary printed by Chromium (page.pdf)', () => {
  for (const format of ['A4', 'Letter'] as const) {
    it(`is exactly one page on ${format} portrait with the longest note and three scenarios`, async () => {
      const { page, pages } = await printed('scenarios=3&note=longest', format, `summary-${format}`);
      expect(pages).toBe(1);
      const text = await page.locator('.print-summary').innerText();
      expect(text).toContain('note cut at 600 characters');
      expect(text).toContain('Caution.');
      expect(text).toContain(HARNESS_BUILD_ID);
      expect(text).toMatch(/GMT-8 \(America\/Los_Angeles\)/);
      expect(text).toContain('Bear steepener 2s10s +30 bp');
      expect(text).not.toContain('more not shown');
      expect(diagnostics(page)).toEqual({ pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] });
      await page.close();
    });
  }

  for (const format of ['A4', 'Letter'] as const) {
    it(`fits the widest 600-character note (W x 600) on one ${format} page without clipping`, async () => {
      const { page, pages } = await printed('scenarios=4&note=wide', format, `summary-wide-${format}`);
      expect(pages).toBe(1);
      expect(await page.locator('.ps-cut').isVisible()).toBe(true);
      await page.close();
    });
  }

  it('prints four scenarios and counts the fifth ("and 1 more not shown"), still on one page', async () => {
    const { page, pages } = await printed('scenarios=5&note=longest', 'Letter', 'summary-five-scenarios');
    expect(pages).toBe(1);
    expect(await page.locator('.print-summary').innerText()).toContain('and 1 more not shown');
    await page.close();
  });

  for (const format of ['A4', 'Letter'] as const) {
    it(`prints one ${format} page from the workbench's Print section (summary alone, demo market, three scenarios, longest note)`, async () => {
      const page = await newPage(browser!);
      await page.goto(`${server!.url}app.html?demo=print`, { waitUntil: 'load' });
      await page.getByRole('button', { name: 'Print summary' }).waitFor();
      // A4: as the "Print summary" button does (body class); Letter: the browser's own print while the
      // Print section is open, which shows the summary alone too.
      if (format === 'A4') await page.evaluate(() => document.body.classList.add('print-summary-only'));
      const pdf = path.join(OUT, `workbench-${format}.pdf`);
      writeFileSync(pdf, await page.pdf({ format, printBackground: true }));
      execFileSync('pdftoppm', ['-png', '-r', '70', '-f', '1', '-l', '1', '-singlefile', pdf, path.join(OUT, `workbench-${format}`)]);
      expect(pagesOf(pdf)).toBe(1);
      const text = execFileSync('pdftotext', [pdf, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
      expect(text).toContain('note cut at 600 characters');
      expect(text).toContain('Caution.');
      expect(text).not.toContain('Quotes');
      expect(diagnostics(page).pageErrors).toEqual([]);
      await page.close();
    });
  }
});

