// axe-core (the open-source accessibility rules engine, WCAG 2.x A/AA rule set plus its best
// practices) run in Debian's Chromium on the built app: the workbench on load, every section of
// the tables panel, the method-comparison view, and the Print section in screen and in print
// media. Gate (issue 7): no violation of impact "serious" or "critical". The list is printed on failure.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { diagnostics, openWorkbench, REPO_ROOT, type BuiltApp } from './harness.ts';

const AXE_SOURCE = readFileSync(path.join(REPO_ROOT, 'node_modules', 'axe-core', 'axe.min.js'), 'utf8');

let app: BuiltApp | undefined;
let page: Page;

interface Finding {
  readonly id: string;
  readonly impact: string | null;
  readonly help: string;
  readonly nodes: string[];
}

/** Runs axe on the whole document and returns the serious and critical violations. */
async function seriousViolations(): Promise<Finding[]> {
  // page.evaluate goes through the DevTools protocol, which the page's CSP (no inline script) does not govern.
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(AXE_SOURCE);
  const found = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: Document, o: object): Promise<{ violations: { id: string; impact: string | null; help: string; nodes: { target: unknown[]; failureSummary?: string }[] }[] }> } }).axe;
    const r = await axe.run(document, { resultTypes: ['violations'] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 8).map((n) => `${JSON.stringify(n.target)} ${n.failureSummary ?? ''}`.replace(/\s+/g, ' ')) }));
  });
  return found.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

const report = (view: string, found: Finding[]): string =>
  found.length === 0 ? '' : `${view}: ${found.length} serious/critical axe violation(s)\n` + found.map((v) => `  [${v.impact}] ${v.id}: ${v.help}\n    ${v.nodes.join('\n    ')}`).join('\n');

async function expectClean(view: string): Promise<void> {
  const found = await seriousViolations();
  const text = report(view, found);
  if (text) console.error(text);
  expect(text).toBe('');
}

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1600, height: 1000 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

describe('axe-core in Chromium: no serious or critical violations', () => {
  it('the workbench on load (demo workspace, first section open)', async () => {
    await expectClean('workbench on load');
  });

  it('the method comparison overlay', async () => {
    await page.getByRole('checkbox', { name: 'Compare methods' }).check();
    await page.waitForFunction(() => document.querySelectorAll('svg[aria-label^="Forward curve"] [data-series^="m-"]').length > 0, undefined, { timeout: 20_000 });
    await expectClean('method comparison');
    await page.getByRole('checkbox', { name: 'Compare methods' }).uncheck();
  });

  it('every section of the tables panel', async () => {
    const names = await page.getByRole('tablist', { name: 'Tables' }).getByRole('tab').allInnerTexts();
    expect(names.length).toBeGreaterThanOrEqual(4);
    const problems: string[] = [];
    for (const name of names) {
      await page.getByRole('tab', { name: name.trim(), exact: true }).click();
      await page.waitForTimeout(600); // deferred panels follow the build once input pauses
      const text = report(`section "${name.trim()}"`, await seriousViolations());
      if (text) problems.push(text);
    }
    if (problems.length) console.error(problems.join('\n'));
    expect(problems).toEqual([]);
  });

  it('the quote check with a schedule open', async () => {
    await page.getByRole('tab', { name: 'Quote check' }).click();
    await page.getByRole('table', { name: 'Quote check' }).getByRole('button').first().click();
    await expectClean('quote check with schedule');
  });

  it('the Print section, on screen and in print media', async () => {
    await page.getByRole('tab', { name: 'Print', exact: true }).click();
    await page.waitForTimeout(600);
    await expectClean('print section (screen)');
    await page.emulateMedia({ media: 'print' });
    await expectClean('print layout (print media)');
    await page.emulateMedia({ media: 'screen' });
  });

  it('a workspace with errors in it (error messages are announced and labelled)', async () => {
    await page.getByRole('textbox', { name: 'Row 1 Rate / yield' }).fill('abc');
    await page.waitForTimeout(400);
    await expectClean('workbench with a bad quote');
  });

  it('ran without page errors or failed requests', () => {
    const d = diagnostics(page);
    expect({ pageErrors: d.pageErrors, failedRequests: d.failedRequests, blockedRequests: d.blockedRequests }).toEqual({ pageErrors: [], failedRequests: [], blockedRequests: [] });
  });
});
