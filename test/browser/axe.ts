// axe-core (WCAG 2 A/AA rules and best practices, as axe runs them by default) on part of a page in
// Chromium: the serious and critical violations, each as "impact id: targets", so a test can expect
// none. The script is handed in through the DevTools protocol, which the page's CSP does not govern.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { REPO_ROOT } from './harness.ts';

const AXE_SOURCE = readFileSync(path.join(REPO_ROOT, 'node_modules', 'axe-core', 'axe.min.js'), 'utf8');

/** Serious and critical axe violations within the elements the CSS selectors name. */
export async function seriousAxeFindings(page: Page, selectors: readonly string[]): Promise<string[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(AXE_SOURCE);
  return page.evaluate(async (include) => {
    const axe = (window as unknown as { axe: { run(ctx: unknown, o: object): Promise<{ violations: { id: string; impact: string | null; nodes: { target: unknown[] }[] }[] }> } }).axe;
    const r = await axe.run({ include: include.map((s) => [s]) }, { resultTypes: ['violations'] });
    return r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.impact} ${v.id}: ${JSON.stringify(v.nodes.slice(0, 3).map((n) => n.target))}`);
  }, [...selectors]);
}
