// A turn solved from a quote in Chromium on the built app: a workspace whose year-end turn is
// solved from its 1M deposit opens from a link; the Overnight curve section shows the picker set to
// that row and the solved spread (25.00 bp, the spread the invented quotes were made with: a flat 4%
// forward plus 25 bp over the turn's 3 days, the hand calculation of
// test/core/bootstrap/turnSolve.test.ts), with no page error. Screenshot:
// test/artifacts/screenshots/overnight-turn-solve.png. The solved spread then opens its explanation
// beside the table (value to all digits, the spanning deposit first among its quotes), with no
// serious or critical axe finding in the section; screenshot overnight-turn-explanation.png.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { seriousAxeFindings } from './axe.ts';
import { engineDocumentLink, launchBrowser, SCREENSHOT_DIR, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';
import { INVENTED_2022_YEAR_END_DEPOSITS } from '../helpers/markets.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;
let link = '';

const ENGINE = { ...INVENTED_2022_YEAR_END_DEPOSITS, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends', solveFrom: 1 }] };

beforeAll(async () => {
  server = await serveDist();
  browser = await launchBrowser();
  link = await engineDocumentLink(server.url, ENGINE);
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('a turn solved from a quote in Chromium', () => {
  it('shows the row it is solved from and the solved spread', async () => {
    const context = await browser!.browser.newContext({ viewport: { width: 1280, height: 900 }, locale: 'en-US', timezoneId: 'America/Los_Angeles', reducedMotion: 'reduce' });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(link, { waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    await page.getByRole('tab', { name: 'Overnight curve' }).click();
    const cell = page.locator('[data-turn-spread="year end 2022"]');
    await cell.waitFor({ timeout: 20_000 });
    await page.locator('.overnight-chart path[data-series="overnight"]').waitFor({ timeout: 20_000 });
    expect(await cell.textContent()).toBe('25.00 bp (solved)');
    const picker = page.getByRole('combobox', { name: 'Spread of the turn year end 2022 set by' });
    expect(await picker.inputValue()).toBe('r1');
    await mkdir(SCREENSHOT_DIR, { recursive: true });
    await page.locator('.overnight').screenshot({ path: path.join(SCREENSHOT_DIR, 'overnight-turn-solve.png') });
    await cell.getByRole('button').click();
    const panel = page.getByRole('complementary', { name: /Spread of the turn year end 2022, solved from row 2/ });
    await panel.waitFor({ timeout: 20_000 });
    const value = Number(await panel.locator('[data-field="value"]').textContent());
    expect(Math.abs(value - 25)).toBeLessThan(1e-9); // the 25 bp the quotes were made with (hand calculation above)
    expect(await panel.getByRole('button', { name: /^Row \d+:/ }).first().textContent()).toMatch(/^Row 2:/);
    expect(await seriousAxeFindings(page, ['.overnight'])).toEqual([]);
    await panel.scrollIntoViewIfNeeded();
    await page.locator('.overnight').screenshot({ path: path.join(SCREENSHOT_DIR, 'overnight-turn-explanation.png') });
    expect(errors).toEqual([]);
    await context.close();
  });
});
