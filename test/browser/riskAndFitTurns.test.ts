// The risk section and the smooth fit on a workspace with a year-end turn solved from a quote and
// meeting steps off, in Chromium on the built app: the heat map (1M forwards every 3M) and the DV01
// to each quote render from the workbench's own build with no page error, the fit says it carries
// the turn, and the Overnight section offers the row a turn is solved from to no other turn.
// The figures themselves are held to bump-and-rebuild of the document in
// test/core/analytics/turnStepRisk.test.ts and test/ui/riskTurnsAndSteps.test.tsx. Screenshots:
// test/artifacts/screenshots/risk-turns.png, fit-turns.png, overnight-two-turns.png. Invented rates.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { engineDocumentLink, launchBrowser, SCREENSHOT_DIR, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';
import { INVENTED_2022_SOLVED_TURN } from '../helpers/markets.ts';

let browser: TestBrowser | undefined;
let server: StaticServer | undefined;
let link = '';

// The market of test/helpers/markets.ts with a second, typed turn a year later.
const ENGINE = { ...INVENTED_2022_SOLVED_TURN, turns: [...INVENTED_2022_SOLVED_TURN.turns, { name: 'year end 2023', from: '2023-12-29', to: '2023-12-29', spreadBp: 5 }] };

beforeAll(async () => {
  server = await serveDist();
  browser = await launchBrowser();
  link = await engineDocumentLink(server.url, ENGINE);
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('risk and fit with turns in Chromium', { timeout: 120_000 }, () => {
  it('shows the heat map, the DV01 to each quote and the fit with the turns, and the picker leaves a taken row out', async () => {
    const context = await browser!.browser.newContext({ viewport: { width: 1280, height: 900 }, locale: 'en-US', timezoneId: 'America/Los_Angeles', reducedMotion: 'reduce' });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(link, { waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    await mkdir(SCREENSHOT_DIR, { recursive: true });

    await page.getByRole('tab', { name: 'Bond and sensitivities' }).click();
    const heat = page.getByRole('region', { name: 'Which quote drives each forward' });
    await heat.waitFor({ timeout: 20_000 });
    await heat.getByRole('combobox', { name: 'Forward tenor' }).selectOption('1M');
    await heat.getByRole('combobox', { name: 'Starts every' }).selectOption('3M');
    await page.getByRole('textbox', { name: 'Maturity (date or tenor)' }).fill('2024-03-01');
    await page.getByRole('table', { name: 'DV01 to each quote' }).waitFor({ timeout: 20_000 });
    expect(await heat.getByText(/turns and meeting steps included/).count()).toBe(1);
    expect(await heat.getByLabel(/^2022-12-01 forward to row 4:/).count()).toBe(1);
    await page.locator('.sensitivity-panel').screenshot({ path: path.join(SCREENSHOT_DIR, 'risk-turns.png') });

    await page.getByRole('tab', { name: 'Smooth fit' }).click();
    const fit = page.getByRole('region', { name: 'Smooth fit' });
    await fit.waitFor({ timeout: 20_000 });
    await fit.getByRole('combobox', { name: 'Model' }).selectOption('nelson-siegel');
    await fit.getByRole('table', { name: 'Fit residuals' }).waitFor({ timeout: 20_000 });
    expect(await fit.getByText(/A smooth form has no jump/).textContent()).toMatch(/year end 2022 .* bp, year end 2023 5\.00 bp; overnight, simple ACT\/360/);
    await fit.screenshot({ path: path.join(SCREENSHOT_DIR, 'fit-turns.png') });

    await page.getByRole('tab', { name: 'Overnight curve' }).click();
    const other = page.getByRole('combobox', { name: 'Spread of the turn year end 2023 set by' });
    await other.waitFor({ timeout: 20_000 });
    const options = await other.locator('option').allTextContents();
    expect(options).not.toContain('row 4 (ois 2023-01-17)');
    expect(options).toContain('row 5 (ois 1Y)');
    await page.getByRole('region', { name: 'Turns' }).screenshot({ path: path.join(SCREENSHOT_DIR, 'overnight-two-turns.png') });
    expect(errors).toEqual([]);
    await context.close();
  });
});
