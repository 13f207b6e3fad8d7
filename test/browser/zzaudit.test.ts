import { openWorkbench, type BuiltApp } from './harness.ts';
let app: BuiltApp | undefined;
afterAll(async () => { await app?.close(); });
it('audit', async () => {
  app = await openWorkbench({ viewport: { width: 1400, height: 1000 } });
  const page = app.page;
  const tabs = page.locator('[role="tab"]');
  const n = await tabs.count();
  const out: string[] = [];
  for (let i = 0; i < n; i++) {
    const name = await tabs.nth(i).textContent();
    await tabs.nth(i).click();
    await page.waitForTimeout(2500);
    await page.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
    await page.waitForTimeout(1500);
    const found = await page.evaluate(() => {
      const res: string[] = [];
      for (const td of document.querySelectorAll('td, th[scope="row"] ~ td, dd')) {
        const t = (td.textContent ?? '').trim();
        if (!/\d/.test(t) || td.querySelector('button, input, select, textarea')) continue;
        if (td.closest('[aria-label="Quote sheet"], .quote-sheet, aside')) continue;
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
  require('node:fs').writeFileSync('/tmp/audit/out.txt', out.join('\n'));
}, 300_000);
