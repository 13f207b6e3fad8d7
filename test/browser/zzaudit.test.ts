import { readFileSync, writeFileSync } from 'node:fs';
import { engineDocumentLink, launchBrowser, serveDist } from './harness.ts';
import { INVENTED_2022_SOFR_STEPS } from '../helpers/markets.ts';
import { readNamedCurves, workbenchFromEngine } from '../../src/core/index.ts';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
it('audit', async () => {
  const server = await serveDist();
  const browser = await launchBrowser();
  const out: string[] = [];
  const docs: [string, unknown][] = [['overnight', INVENTED_2022_SOFR_STEPS], ['named', JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8'))]];
  for (const [label, doc] of docs) {
    let link: string;
    if (label === 'overnight') link = await engineDocumentLink(server.url, doc);
    else {
      let n = 0;
      const wb = workbenchFromEngine(doc as never, () => `r${n++}`, readNamedCurves);
      if (!wb.ok) throw new Error('wb');
      link = `${server.url}#${await encodeWorkspaceLink({ ...wb.value, view: { shownCurve: 'euribor6m' } } as unknown as Record<string, unknown>)}`;
    }
    const context = await browser.browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await page.goto(link, { waitUntil: 'load' });
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    const pickers = label === 'named' ? await page.locator('.named-curves select').count() : 0;
    out.push(`# ${label} (pickers ${pickers})`);
    const tabs = page.locator('[role="tab"]');
    const n = await tabs.count();
    for (let i = 0; i < n; i++) {
      const name = await tabs.nth(i).textContent();
      await tabs.nth(i).click();
      await page.waitForTimeout(2500);
      await page.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
      await page.waitForTimeout(1000);
      const found = await page.evaluate(() => {
        const res: string[] = [];
        for (const td of document.querySelectorAll('td, dd')) {
          const t = (td.textContent ?? '').trim();
          if (!/\d/.test(t) || td.querySelector('button, input, select, textarea')) continue;
          if (td.closest('[aria-label="Quote sheet"], aside, [aria-label="Printed summary"]')) continue;
          const tb = td.closest('table');
          const table = (tb?.getAttribute('aria-label') ?? tb?.querySelector('caption')?.textContent?.slice(0, 50) ?? '') + ' @' + (td.closest('[aria-label]')?.getAttribute('aria-label') ?? '?');
          const idx = (td as HTMLTableCellElement).cellIndex;
          const ths = tb?.querySelectorAll('thead tr:last-child th');
          const col = (ths && idx >= 0 ? ths[idx]?.textContent?.slice(0, 40) : '') ?? '';
          res.push(`${table} | ${col} | ${t.slice(0, 40)}`);
        }
        return res;
      });
      const uniq = new Map<string, number>();
      for (const f of found) { const k = f.replace(/\|[^|]*$/, ''); uniq.set(k, (uniq.get(k) ?? 0) + 1); }
      out.push(`## ${name}`);
      for (const [k, c] of uniq) out.push(`${c}x ${k} e.g. ${found.find((f) => f.startsWith(k))!.split('|').at(-1)}`);
    }
    await context.close();
  }
  writeFileSync('/tmp/audit/out2.txt', out.join('\n'));
  await browser.close();
  await server.close();
}, 400_000);
