// Benchmark (not a test): moving between cells with the arrow keys on a 360-row quote sheet (the
// sheet is windowed above 30 rows), in Debian's Chromium on the built app. Each move is timed on
// the page with performance marks, from the keydown event to the next paint (a requestAnimationFrame
// and a message after it) and to the end of the key's own task (script, React commit, focus,
// scrolling). Target (issue "Desk-ready", item 25): median move <= 8 ms to the next paint's start
// of work, i.e. a few ms of work. Medians over many moves; nothing here is asserted.
// Run: npx vite build && TZ=America/Los_Angeles npx tsx test/browser/sheetKeys.bench.ts
// DIST=/some/dist serves another build (to alternate an old build and a new one in one session).
// The 360 quotes are invented benchmark data.
import path from 'node:path';
import { DIST_DIR, launchBrowser, newPage } from './harness.ts';
import { serveDirectory } from './static-server.ts';

const TARGET_WORK_MEDIAN_MS = 4;
const ROWS = 360;

function quotes(): string {
  const lines = ['Type\tMaturity\tRate\tCoupon\tClean price\tFrequency\tDay count'];
  for (let i = 0; i < ROWS; i++) {
    const months = 13 + i;
    const t = months / 12;
    const r = 4.0 - 0.5 * Math.exp(-t / 2) + 0.35 * (1 - Math.exp(-t / 8));
    lines.push(`swap\t${2027 + Math.floor(months / 12)}-${String((months % 12) + 1).padStart(2, '0')}-15\t${r.toFixed(4)}\t\t\t1\t30/360`);
  }
  return lines.join('\n');
}

const quantile = (xs: number[], q: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))]!;
};

const server = await serveDirectory(path.resolve(process.env.DIST ?? DIST_DIR));
const browser = await launchBrowser();
try {
  const page = await newPage(browser, { viewport: { width: 1600, height: 1000 } });
  await page.goto(server.url);
  await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
  await page.evaluate((text) => {
    const dt = new DataTransfer();
    dt.setData('text/plain', text);
    document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, quotes());
  await page.getByRole('button', { name: 'Replace the sheet' }).click();
  await page.getByText(`${ROWS} quotes in the curve`).waitFor({ timeout: 30_000 });
  await page.waitForTimeout(1500); // the deferred panels settle
  await page.evaluate(() => {
    const w = window as unknown as { __frames: number[]; __work: number[] };
    w.__frames = [];
    w.__work = [];
    let n = 0;
    document.addEventListener(
      'keydown',
      (e) => {
        if (!e.key.startsWith('Arrow')) return;
        const id = n++;
        performance.mark(`move-${id}`, { startTime: e.timeStamp });
        const done = new MessageChannel();
        done.port1.onmessage = () => w.__work.push(performance.measure(`move-work-${id}`, `move-${id}`).duration);
        done.port2.postMessage(0);
        requestAnimationFrame(() => {
          const ch = new MessageChannel();
          ch.port1.onmessage = () => w.__frames.push(performance.measure(`move-paint-${id}`, `move-${id}`).duration);
          ch.port2.postMessage(0);
        });
      },
      true,
    );
  });
  const trace = process.env.TRACE === '1';
  if (trace) await browser.browser.startTracing(page, { categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline'] });
  // Diagnostics only: PROFILE=1 prints inclusive CPU samples per function over the moves.
  const cdp = process.env.PROFILE === '1' ? await page.context().newCDPSession(page) : null;
  if (cdp) {
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: 100 });
    await cdp.send('Profiler.start');
  }
  await page.getByRole('textbox', { name: 'Row 1 Rate / yield' }).focus();
  const label = (): Promise<string | null | undefined> => page.evaluate(() => document.activeElement?.getAttribute('aria-label'));
  // Down to the last row, then back up: every move waits for its paint (a person's key repeat is ~30 ms).
  for (let i = 0; i < ROWS - 1; i++) {
    await page.keyboard.press('ArrowDown');
    await page.waitForTimeout(20);
  }
  const bottom = await label();
  for (let i = 0; i < 120; i++) {
    await page.keyboard.press('ArrowUp');
    await page.waitForTimeout(20);
  }
  await page.waitForTimeout(200);
  if (trace) {
    const buf = await browser.browser.stopTracing();
    if (process.env.TRACE_FILE) (await import('node:fs')).writeFileSync(process.env.TRACE_FILE, buf);
    const events = (JSON.parse(buf.toString()) as { traceEvents: { name: string; ph: string; dur?: number; tid: number }[] }).traceEvents;
    const main = events.find((e) => e.name === 'EventDispatch')?.tid;
    const sum = new Map<string, number>();
    for (const e of events) if (e.ph === 'X' && e.dur && e.tid === main) sum.set(e.name, (sum.get(e.name) ?? 0) + e.dur);
    const moves = ROWS - 1 + 120;
    console.log([...sum].sort((a, b) => b[1] - a[1]).slice(0, 18).map(([k, v]) => `${(v / 1000 / moves).toFixed(2)} ms/move  ${k}`).join('\n'));
  }
  if (cdp) {
    type Node = { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; hitCount?: number; children?: number[] };
    const { profile: p } = (await cdp.send('Profiler.stop')) as { profile: { nodes: Node[] } };
    const byId = new Map(p.nodes.map((n) => [n.id, n]));
    const incl = new Map<string, number>();
    let total = 0;
    const walk = (n: Node, seen: Set<string>): void => {
      const name = `${n.callFrame.functionName || '(anon)'}:${n.callFrame.lineNumber}`;
      const hits = n.hitCount ?? 0;
      total += hits;
      const here = new Set(seen);
      here.add(name);
      for (const k of here) incl.set(k, (incl.get(k) ?? 0) + hits);
      for (const c of n.children ?? []) walk(byId.get(c)!, here);
    };
    walk(p.nodes[0]!, new Set());
    console.log([...incl].sort((a, b) => b[1] - a[1]).slice(0, 45).map(([k, v]) => `${((100 * v) / total).toFixed(1)}% ${k}`).join('\n'));
  }
  const { frames, work } = await page.evaluate(() => {
    const w = window as unknown as { __frames: number[]; __work: number[] };
    return { frames: w.__frames, work: w.__work };
  });
  const warmF = frames.slice(10);
  const warmW = work.slice(10);
  console.log(`arrow moves on a ${ROWS}-row sheet: ${frames.length} moves (first 10 dropped as warm-up); the focus reached "${bottom}" going down`);
  console.log(`  keydown to end of its task: median ${quantile(warmW, 0.5).toFixed(2)} ms, p95 ${quantile(warmW, 0.95).toFixed(2)} ms`);
  console.log(`  keydown to next paint: median ${quantile(warmF, 0.5).toFixed(2)} ms, p95 ${quantile(warmF, 0.95).toFixed(2)} ms, max ${Math.max(...warmF).toFixed(2)} ms`);
  const m = quantile(warmW, 0.5);
  console.log(`  target median work per move <= ${TARGET_WORK_MEDIAN_MS} ms: ${m <= TARGET_WORK_MEDIAN_MS ? 'met' : 'NOT MET'}`);
  await page.close();
} finally {
  await browser.close();
  await server.close();
}
