// The harness itself: pages report what went wrong in them, screenshots are real PNGs, and
// openBuiltApp() leaves nothing open when a step fails.
import { readFile, rm } from 'node:fs/promises';
import type { Page } from 'playwright-core';
import { diagnostics, launchBrowser, newPage, openBuiltApp, screenshot, type TestBrowser } from './harness.ts';

let browser: TestBrowser | undefined;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const open = async () => {
  if (!browser) throw new Error('browser did not start');
  return newPage(browser);
};

describe('browser harness', () => {
  it('records uncaught page errors and console errors', async () => {
    const page = await open();
    await page.setContent('<script>console.error("bad quote"); throw new Error("boom");</script>');
    await expect.poll(() => diagnostics(page).pageErrors.length).toBe(1);
    expect(diagnostics(page).pageErrors[0]).toContain('boom');
    expect(diagnostics(page).consoleErrors).toEqual(['bad quote']);
    await page.close();
  });

  it('gives each page its own storage', async () => {
    const first = await open();
    const second = await open();
    // about:blank has no storage: give both pages the same loopback origin, answered by the test.
    await first.route('http://127.0.0.1:9/', (route) => route.fulfill({ body: '<p>a</p>', contentType: 'text/html' }));
    await second.route('http://127.0.0.1:9/', (route) => route.fulfill({ body: '<p>b</p>', contentType: 'text/html' }));
    await first.goto('http://127.0.0.1:9/');
    await second.goto('http://127.0.0.1:9/');
    await first.evaluate(() => localStorage.setItem('workspace', 'first'));
    expect(await second.evaluate(() => localStorage.getItem('workspace'))).toBeNull();
    await first.close();
    await second.close();
  });

  it('saves a PNG screenshot under test/artifacts/screenshots', async () => {
    const page = await open();
    await page.setContent('<h1>screenshot check</h1>');
    const file = await screenshot(page, 'harness check/1');
    expect(file).toMatch(/test\/artifacts\/screenshots\/harness-check-1\.png$/);
    const bytes = await readFile(file);
    expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    await rm(file);
    await page.close();
  });

  it('openBuiltApp closes the page and stops the server when a step before the load fails', async () => {
    let seen: { page: Page; url: string } | undefined;
    const failing = openBuiltApp({
      beforeLoad: async (page, url) => {
        seen = { page, url };
        throw new Error('step failed');
      },
    });
    await expect(failing).rejects.toThrow('step failed');
    expect(seen?.page.isClosed()).toBe(true);
    await expect(fetch(seen!.url)).rejects.toThrow(); // nothing listens there any more
  });
});
