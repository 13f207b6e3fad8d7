// Security and bundle gates on the production build (issue: quality gates).
// - a strict Content-Security-Policy meta tag: no inline script, no eval, connect-src 'none';
// - the app runs under it with no violation and no console error;
// - the JavaScript of the first load <= 175 KB gzip, all JavaScript in dist/ <= 250 KB gzip;
// - no test-only package (axe-core, fast-check, playwright-core) in the production bundle.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { DIST_DIR, REPO_ROOT, diagnostics, openBuiltApp, type BuiltApp } from './harness.ts';

const html = readFileSync(path.join(DIST_DIR, 'index.html'), 'utf8');
const jsFiles = readdirSync(path.join(DIST_DIR, 'assets')).filter((f) => f.endsWith('.js'));
const gzipKb = (file: string): number => gzipSync(readFileSync(path.join(DIST_DIR, 'assets', file))).length / 1024;

describe('Content-Security-Policy of the production index.html', () => {
  const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(html)?.[1] ?? '';
  it('is present and strict', () => {
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).toMatch(/connect-src 'none'/);
    expect(csp).toMatch(/object-src 'none'/);
    expect(csp).not.toMatch(/unsafe-inline|unsafe-eval|\*/);
  });
  it('leaves no inline script in the page', () => {
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, body] of scripts) {
      expect(attrs).toMatch(/\bsrc=/);
      expect(body!.trim()).toBe('');
    }
  });
});

describe('the app under its policy in Chromium', () => {
  let app: BuiltApp | undefined;
  let page: Page;
  beforeAll(async () => {
    app = await openBuiltApp({
      // Records every policy violation from the first script on.
      beforeLoad: (p) =>
        p.addInitScript(() => {
          (window as unknown as { __violations: string[] }).__violations = [];
          document.addEventListener('securitypolicyviolation', (e) =>
            (window as unknown as { __violations: string[] }).__violations.push(`${e.violatedDirective} ${e.blockedURI}`),
          );
        }),
    });
    page = app.page;
    await page.waitForSelector('svg[role="img"]', { timeout: 30_000 });
    await page.waitForTimeout(500);
  });
  afterAll(async () => {
    await app?.close();
  });
  it('draws the charts with no policy violation and no console error', async () => {
    expect(await page.evaluate(() => (window as unknown as { __violations: string[] }).__violations)).toEqual([]);
    expect(diagnostics(page).consoleErrors).toEqual([]);
    expect(diagnostics(page).pageErrors).toEqual([]);
  });
});

describe('bundle size and contents', () => {
  const firstLoad = [...html.matchAll(/(?:src|href)="\/assets\/([^"]+\.js)"/g)].map((m) => m[1]!);
  it('the JavaScript of the first load is at most 175 KB gzip', () => {
    expect(firstLoad.length).toBeGreaterThan(0);
    const kb = firstLoad.reduce((s, f) => s + gzipKb(f), 0);
    console.log(`first-load JavaScript: ${kb.toFixed(1)} KB gzip (target 175)`);
    expect(kb).toBeLessThanOrEqual(175);
  });
  it('all JavaScript in dist/ is at most 250 KB gzip', () => {
    const kb = jsFiles.reduce((s, f) => s + gzipKb(f), 0);
    console.log(`all JavaScript: ${kb.toFixed(1)} KB gzip in ${jsFiles.length} files (target 250)`);
    expect(kb).toBeLessThanOrEqual(250);
  });

  // Each marker is a string the package's own shipped code contains (checked first, so the test
  // can fail), and that the app's code has no reason to contain.
  const markers: [pkg: string, file: string, marker: string][] = [
    ['axe-core', 'node_modules/axe-core/axe.min.js', 'axe.run'],
    ['fast-check', 'node_modules/fast-check/lib/fast-check.js', 'Property failed after'],
    ['playwright-core', 'node_modules/playwright-core/lib/coreBundle.js', 'Browser.getVersion'],
  ];
  it.each(markers)('%s is not in the production bundle', (pkg, file, marker) => {
    expect(readFileSync(path.join(REPO_ROOT, file), 'utf8'), `${pkg}'s own code holds the marker`).toContain(marker);
    for (const f of jsFiles) expect(readFileSync(path.join(DIST_DIR, 'assets', f), 'utf8').includes(marker), `${f} holds ${pkg}`).toBe(false);
  });
});
