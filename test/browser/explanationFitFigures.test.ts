// The smooth fit's parameters, RMS and chart point explained, in Debian's Chromium on the built app
// (demo workspace, invented data): b0 opens below the parameters table, the fit chart's readout
// button opens the fitted zero rate; each panel ends in the figure shown (to its shown digits here;
// to all digits in test/ui/explanationFitFigures.test.tsx). axe-core finds no serious or critical
// violation in the section with a panel open. Screenshots at 1280 px wide.
import type { Page } from 'playwright-core';
import { seriousAxeFindings } from './axe.ts';
import { diagnostics, openWorkbench, screenshot, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1280, height: 900 } });
  page = app.page;
});

afterAll(async () => {
  await app?.close();
});

describe("the smooth fit's parameters and chart explained", () => {
  it('b0 opens below the parameters table with its objective and checks; axe finds nothing serious', async () => {
    await page.getByRole('tab', { name: 'Smooth fit' }).click();
    const fit = page.getByRole('region', { name: 'Smooth fit' });
    await fit.waitFor({ timeout: 20_000 });
    await fit.getByRole('combobox', { name: 'Model' }).selectOption('nelson-siegel');
    const params = fit.getByRole('table', { name: 'Fitted parameters' });
    await params.waitFor({ timeout: 20_000 });
    const button = params.getByRole('button', { name: /explain the fitted b0$/ });
    const shown = (await button.textContent())!.trim().replace('%', '');
    await button.click();
    const panel = page.getByRole('complementary', { name: 'Fitted b0' });
    await panel.waitFor({ timeout: 20_000 });
    const value = Number((await panel.locator('[data-field="value"]').textContent())!);
    const decimals = shown.split('.')[1]?.length ?? 0;
    expect(Math.abs(Number(shown) - value * 100)).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
    const text = (await panel.textContent())!;
    expect(text).toContain('b0 = argmin S');
    expect(text).toContain('y(0+) = b0 + b1');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-fit-parameter-1280');
    expect(await seriousAxeFindings(page, ['.fit-panel'])).toEqual([]);
    await panel.getByRole('button', { name: /Close/ }).click();
  });

  it("the fit chart's readout opens the fitted zero rate at the point read", async () => {
    const fit = page.getByRole('region', { name: 'Smooth fit' });
    const chart = fit.getByRole('img', { name: /^Zero curve, Nelson-Siegel fit/ });
    await chart.focus();
    await page.keyboard.press('Home');
    for (let i = 0; i < 30; i++) await page.keyboard.press('ArrowRight');
    const button = fit.getByRole('button', { name: /^Explain the (Nelson-Siegel|Svensson) fit zero rate at [\d.]+y \(\d{4}-\d{2}-\d{2}\)$/ });
    const date = /\((\d{4}-\d{2}-\d{2})\)/.exec((await button.textContent())!)![1]!;
    await button.click();
    const panel = page.getByRole('complementary', { name: `Fitted zero rate on ${date}` });
    await panel.waitFor({ timeout: 20_000 });
    expect(await panel.textContent()).toContain('rate = -lnP / tau');
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'explanation-fit-zero-1280');
    expect(await seriousAxeFindings(page, ['.fit-panel'])).toEqual([]);
    expect(diagnostics(page).pageErrors).toEqual([]);
  });
});
