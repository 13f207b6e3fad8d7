// A meeting's implied step opens its explanation in Chromium on the built app (issue 19): the
// workspace of test/browser/overnightCurve.test.ts (SOFR's 2022-2023 effective dates,
// MARKET-CONVENTIONS.md section h; a year-end turn; invented quotes) opens from a link, Enter on a
// step opens the panel beside the table with the step to all digits and five quote links, with no
// page error. Screenshot: test/artifacts/screenshots/meeting-step-explanation.png.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { buildCurve, formatBpChange, fullText, meetingStepTable, OVERNIGHT_KIT, workbenchFromEngine } from '../../src/core/index.ts';
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
