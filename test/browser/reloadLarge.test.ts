// Reopening a saved 500-quote workspace (the quote cap) in Debian's Chromium, on the built app:
// the sheet is windowed from its very first render (an init script counts the table rows the page
// makes while it loads), and the restored workspace is the one saved (500 rows, 500 quotes in the
// curve, the zero curve drawn). Structure only: how
// long the reload's tasks take is a benchmark figure (browser.bench.ts, figure 5), not a test.
// The quotes are invented test data.
import type { Page } from 'playwright-core';
import { diagnostics, openWorkbench, type BuiltApp } from './harness.ts';
import { saveWorkspaceOf } from './reloadLongTask.ts';

function fiveHundredRows(): string {
  const lines = ['Type\tMaturity\tRate\tCoupon\tClean price\tFrequency\tDay count'];
  for (let i = 0; i < 500; i++) {
    const months = 13 + i;
    const t = months / 12;
    const r = 4.0 - 0.5 * Math.exp(-t / 2) + 0.35 * (1 - Math.exp(-t / 8));
    lines.push(`swap\t${2027 + Math.floor(months / 12)}-${String((months % 12) + 1).padStart(2, '0')}-15\t${r.toFixed(4)}\t\t\t1\t30/360`);
  }
  return lines.join('\n');
}

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({
    viewport: { width: 1600, height: 1000 },
    beforeLoad: (p) =>
      p.addInitScript(() => {
        // Sheet rows made during the load: React makes each element with document.createElement,
        // and one render and commit run in a single task, so counting what is in the document
        // afterwards (or from a MutationObserver) would miss rows made and removed within it.
        const w = window as unknown as { __rowsMade: number };
        w.__rowsMade = 0;
        const make = Document.prototype.createElement;
        Document.prototype.createElement = function (this: Document, tag: string, options?: ElementCreationOptions) {
          if (tag.toLowerCase() === 'tr') w.__rowsMade++;
          return make.call(this, tag, options);
        } as typeof Document.prototype.createElement;
      }),
  });
  page = app.page;
  await saveWorkspaceOf(page, fiveHundredRows(), 500);
});

afterAll(async () => {
  await app?.close();
});

describe('reloading a saved 500-quote workspace in Chromium', () => {
  it('makes no more than a view of sheet rows, and restores all 500 rows into the curve', async () => {
    await page.reload();
    const grid = page.getByRole('grid', { name: /Quotes/ });
    await grid.waitFor({ timeout: 20_000 });
    await page.getByText('500 quotes in the curve').waitFor({ timeout: 20_000 });
    expect(await grid.getAttribute('aria-rowcount')).toBe('501');
    const made = await page.evaluate(() => (window as unknown as { __rowsMade: number }).__rowsMade);
    // A 640 px view plus its margins holds a few dozen rows of about 26 px (and the tables' rows);
    // rendering the whole sheet first made more than 500.
    expect(made).toBeGreaterThan(10);
    expect(made).toBeLessThan(200);
    expect(await page.locator('svg[aria-label^="Zero curve"] [data-series="zero"] path').first().getAttribute('d')).toMatch(/^M/);
    expect(diagnostics(page).pageErrors).toEqual([]);
    expect(diagnostics(page).consoleErrors).toEqual([]);
  });
});
