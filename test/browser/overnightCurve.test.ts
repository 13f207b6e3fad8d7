// The Overnight curve section in Chromium on the built app: a workspace with SOFR's 2022-2023
// effective dates (MARKET-CONVENTIONS.md section h) and steps on, and a year-end turn, opens from a
// link; the section shows the meeting-step table and the step chart with every effective date
// marked and the turn shaded, at 1280 and 760 px, with no page error. Screenshots go to
// test/artifacts/screenshots/overnight-*. The quotes are invented.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { engineDocumentLink, launchBrowser, SCREENSHOT_DIR, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';
import { INVENTED_2022_SOFR_STEPS } from '../helpers/markets.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;
let link = '';

const ENGINE = INVENTED_2022_SOFR_STEPS;

beforeAll(async () => {
  server = await serveDist();
  browser = await launchBrowser();
  link = await engineDocumentLink(server.url, ENGINE);
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('the Overnight curve section in Chromium', () => {
  for (const width of [1280, 760]) {
    it(`shows the step table and the step chart with meetings and the turn marked at ${width} px`, async () => {
      const context = await browser!.browser.newContext({ viewport: { width, height: 900 }, locale: 'en-US', timezoneId: 'America/Los_Angeles', reducedMotion: 'reduce' });
      const page = await context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(e.message));
      await page.goto(link, { waitUntil: 'load' });
      await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
      await page.getByRole('tab', { name: 'Overnight curve' }).click();
      const table = page.getByRole('table', { name: 'Implied step at each meeting' });
      await table.waitFor({ timeout: 20_000 });
      expect(await table.getByRole('row').count()).toBe(5);
      const chart = page.locator('.overnight-chart');
      await chart.locator('path[data-series="overnight"]').waitFor({ timeout: 20_000 });
      expect(await chart.locator('[data-meeting]').count()).toBe(4);
      expect(await chart.locator('[data-turn="year end 2022"]').count()).toBe(1);
      await mkdir(SCREENSHOT_DIR, { recursive: true });
      const section = page.locator('.overnight');
      await section.screenshot({ path: path.join(SCREENSHOT_DIR, `overnight-${width}.png`) });
      expect(errors).toEqual([]);
      await context.close();
    });
  }
});
