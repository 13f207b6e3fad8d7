// Loads the built app in Chromium: the page has its title and React rendered into #root.
import type { Page } from 'playwright-core';
import { diagnostics, openBuiltApp, screenshot, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openBuiltApp();
  page = app.page;
  // React renders after the module script runs; wait for #root to get content.
  await page.waitForFunction(() => (document.querySelector('#root')?.childElementCount ?? 0) > 0, undefined, {
    timeout: 20_000,
  }).catch(() => undefined); // the assertions below report what is missing
  await screenshot(page, 'smoke-home');
});

afterAll(async () => {
  await app?.close();
});

describe('built app smoke test', () => {
  it('has the title Tenorscope', async () => {
    expect(await page.title()).toBe('Tenorscope');
  });

  it('renders content into #root', async () => {
    const root = page.locator('#root');
    expect(await root.count(), 'index.html has one #root').toBe(1);
    expect(await root.evaluate((el) => el.childElementCount), '#root has rendered elements').toBeGreaterThan(0);
    expect((await root.innerText()).trim(), '#root shows text').not.toBe('');
  });

  it('loads without page errors, console errors, failed or off-machine requests', () => {
    expect(diagnostics(page)).toEqual({ pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] });
  });
});
