// The Overnight curve section in Chromium on the built app: a workspace with SOFR's 2022-2023
// effective dates (MARKET-CONVENTIONS.md section h) and steps on, and a year-end turn, opens from a
// link; the section shows the meeting-step table and the step chart with every effective date
// marked and the turn shaded, at 1280 and 760 px, with no page error. Screenshots go to
// test/artifacts/screenshots/overnight-*. The quotes are invented.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { workbenchFromEngine } from '../../src/core/index.ts';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { launchBrowser, SCREENSHOT_DIR, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;
let link = '';

const ENGINE = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-03-01',
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 }],
  meetingSteps: { on: true, effectiveDates: ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'] },
  quotes: [
    { kind: 'deposit', maturity: '2022-03-10', rate: 0.0005 },
    { kind: 'deposit', maturity: '2022-06-01', rate: 0.0125 },
    { kind: 'deposit', maturity: '2022-12-01', rate: 0.0165 },
    { kind: 'deposit', maturity: '2023-03-01', rate: 0.02325 },
    { kind: 'ois', tenor: '2Y', rate: 0.032 },
    { kind: 'ois', tenor: '3Y', rate: 0.034 },
    { kind: 'ois', tenor: '5Y', rate: 0.033 },
  ],
};

beforeAll(async () => {
  server = await serveDist();
  browser = await launchBrowser();
  let n = 0;
  const doc = workbenchFromEngine(ENGINE, () => `r${n++}`);
  if (!doc.ok) throw new Error(doc.errors[0]!.message);
  link = `${server.url}#${await encodeWorkspaceLink(doc.value as unknown as Record<string, unknown>)}`;
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
