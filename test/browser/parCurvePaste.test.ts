// A published par curve pasted as laid out, in Debian's Chromium on the built app: the US
// Treasury Daily Treasury Par Yield Curve Rates row of 2023-09-01 (home.treasury.gov TextView,
// September 2023 page, first row; the date from the page's date order) previews as par yields,
// the date reported as setting nothing, and the sheet then builds from 13 par-yield quotes.
import type { Page } from 'playwright-core';
import { diagnostics, openWorkbench, screenshot, type BuiltApp } from './harness.ts';

let app: BuiltApp | undefined;
let page: Page;

beforeAll(async () => {
  app = await openWorkbench({ viewport: { width: 1400, height: 1000 } });
  page = app.page;
});
afterAll(async () => {
  await app?.close();
});

const ROWS = [
  'Date\t1 Mo\t2 Mo\t3 Mo\t4 Mo\t6 Mo\t1 Yr\t2 Yr\t3 Yr\t5 Yr\t7 Yr\t10 Yr\t20 Yr\t30 Yr',
  '09/01/2023\t5.51\t5.55\t5.53\t5.58\t5.47\t5.36\t4.87\t4.57\t4.29\t4.27\t4.18\t4.48\t4.29',
].join('\n');

describe('a par curve pasted by tenor in Chromium', () => {
  it('previews 13 par yields with the date reported only, then builds the curve from them', async () => {
    await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
    await page.evaluate((t) => {
      const dt = new DataTransfer();
      dt.setData('text/plain', t);
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    }, ROWS);
    const preview = page.getByRole('region', { name: /Paste preview/ });
    await preview.waitFor();
    const text = await preview.innerText();
    expect(text).toContain('13 read as quotes');
    expect(text).toContain('par yield 30Y');
    expect(text).toContain("Date 09/01/2023: the curve's date as pasted, reported only; it sets nothing");
    await screenshot(page, 'par-curve-paste-preview');
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('13 quotes in the curve').waitFor();
    await screenshot(page, 'par-curve-pasted');
    // The quote check tags each par yield with its convention and shows the par bond's schedule.
    await page.getByRole('tab', { name: 'Quote check' }).click();
    const check = await page.getByRole('tabpanel').filter({ hasText: 'par-yield' }).first().innerText();
    expect(check).toContain('s.a., ACT/ACT-ICMA');
    // Row 9 (5Y): the par bond's ten coupons of 2.145 per 100 and 100 at maturity.
    await page.getByRole('tabpanel').getByRole('button', { name: '9', exact: true }).or(page.getByRole('tabpanel').getByRole('link', { name: '9', exact: true })).first().click();
    await page.getByText(/a par bond: coupon 4\.2900% \(s\.a\., ACT\/ACT-ICMA\) = the par yield/).waitFor();
    await screenshot(page, 'par-curve-quote-check');
    expect(diagnostics(page).pageErrors).toEqual([]);
  });
});
