// A meeting's implied step opens its explanation in Chromium on the built app (issue 19): the
// workspace of test/browser/overnightCurve.test.ts (SOFR's 2022-2023 effective dates,
// MARKET-CONVENTIONS.md section h; a year-end turn; invented quotes) opens from a link, Enter on a
// step opens the panel beside the table with the step to all digits and five quote links, with no
// page error. Screenshot: test/artifacts/screenshots/meeting-step-explanation.png.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { buildCurve, formatBpChange, fullText, meetingStepTable, OVERNIGHT_KIT } from '../../src/core/index.ts';
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

describe('a meeting step explained in Chromium', () => {
  it('Enter on the step of 2022-12-15 opens its explanation beside the table, to all digits', async () => {
    // The figure as the core computes it (the engine document builds the workbench's curve bit for bit).
    const row = meetingStepTable(buildCurve(ENGINE, { overnight: OVERNIGHT_KIT })).find((r) => r.date === '2022-12-15')!;
    const context = await browser!.browser.newContext({ viewport: { width: 1280, height: 1000 }, locale: 'en-US', timezoneId: 'America/Los_Angeles', reducedMotion: 'reduce' });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(link, { waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    await page.getByRole('tab', { name: 'Overnight curve' }).click();
    const button = page.getByRole('button', { name: /explain the step on 2022-12-15/ });
    await button.waitFor({ timeout: 20_000 });
    expect(await button.textContent()).toBe(formatBpChange(row.stepBp));
    await button.focus();
    await page.keyboard.press('Enter');
    const panel = page.getByRole('complementary', { name: /Implied step on 2022-12-15/ });
    await panel.waitFor({ timeout: 20_000 });
    expect(await panel.locator('[data-field="value"]').textContent()).toBe(fullText(row.stepBp));
    expect(await panel.getByRole('button', { name: /^Row \d+:/ }).count()).toBe(5);
    await mkdir(SCREENSHOT_DIR, { recursive: true });
    await page.locator('section[aria-label="Meeting steps"]').screenshot({ path: path.join(SCREENSHOT_DIR, 'meeting-step-explanation.png') });
    expect(errors).toEqual([]);
    await context.close();
  });
});
