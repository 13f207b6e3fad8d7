// Benchmark (not a test): a one-cell edit of a 40-quote workspace, from the input event to the
// next paint, in Debian's Chromium on the built app. Target (issue 16, raised from 16 ms): median <= 12 ms, p95
// reported. Run: npx vite build && TZ=America/Los_Angeles npx tsx test/browser/workbenchFrame.bench.ts
// The 40 quotes are invented benchmark data.
import { profileSummary, traceSummary, type ProfileNode } from './diagnostics.ts';
import { launchBrowser, newPage, serveDist } from './harness.ts';
import { openRecord, putRecord } from './savedWorkspaces.ts';

const TARGET_MEDIAN_MS = 12;
const EDITS = 80;
/** Interpolation of the measured workspace (monotone convex, the default and a global method, unless METHOD is set). */
const METHOD = process.env.METHOD ?? 'monotone-convex';

function fortyQuotes(): Record<string, unknown>[] {
  const rows: Record<string, unknown>[] = [];
  let id = 0;
  const add = (kind: string, maturity: string, rate: string, extra: Record<string, string> = {}) =>
    rows.push({ id: `b${id++}`, enabled: true, kind, maturity, rate, price: '', coupon: '', frequency: '', dayCount: '', ...extra });
  const r = (t: number): string => (4.0 - 0.5 * Math.exp(-t / 2) + 0.35 * (1 - Math.exp(-t / 8))).toFixed(3);
  for (const [m, t] of [['1W', 0.02], ['2W', 0.04], ['1M', 0.08], ['2M', 0.17], ['3M', 0.25]] as const) add('deposit', m, r(t));
  for (const [m, t] of [['4M', 0.33], ['6M', 0.5], ['9M', 0.75], ['1Y', 1]] as const) add('bill', m, r(t));
  for (let y = 2; y <= 12; y++) add('swap', `${y}Y`, r(y));
  for (const y of [14, 15, 17, 20, 22, 25, 27, 30]) add('swap', `${y}Y`, r(y));
  for (let y = 2028; y <= 2039; y++) add('bond', `${y}-06-15`, r(y - 2026.5), { coupon: '4', frequency: '2' });
  return rows;
}

const quantile = (xs: number[], q: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))]!;
};

const server = await serveDist();
const browser = await launchBrowser();
try {
  const page = await newPage(browser, { viewport: { width: 1600, height: 1000 } });
  await page.goto(server.url);
  const quotes = fortyQuotes();
  await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
  // One edit so the demo is saved, then its saved record gets the 40 quotes (src/state/persistence.ts).
  await page.getByRole('checkbox', { name: 'Row 1 in the curve' }).click();
  await page.getByRole('checkbox', { name: 'Row 1 in the curve' }).click();
  await page.waitForTimeout(400);
  const saved = await openRecord(page);
  if (!saved?.workspace) throw new Error('no saved workspace to start from');
  const planted = { ...saved, stamp: 'bench:1', writer: 'bench', workspace: { ...saved.workspace, quotes, curve: { ...saved.workspace.curve, interpolation: METHOD } } };
  await putRecord(page, `entry:${saved.id}`, planted);
  await page.reload();
  await page.getByText('40 quotes in the curve').waitFor({ timeout: 20_000 });
  await page.evaluate(() => {
    const w = window as unknown as { __frames: number[]; __work: number[] };
    w.__frames = [];
    w.__work = [];
    document.addEventListener(
      'input',
      (e) => {
        const t0 = e.timeStamp;
        // After the event's own task (React renders and commits discrete input synchronously).
        const done = new MessageChannel();
        done.port1.onmessage = () => w.__work.push(performance.now() - t0);
        done.port2.postMessage(0);
        requestAnimationFrame(() => {
          const ch = new MessageChannel();
          ch.port1.onmessage = () => w.__frames.push(performance.now() - t0);
          ch.port2.postMessage(0);
        });
      },
      true,
    );
  });
  // Diagnostics only: HIDE=".charts" measures the page with those parts not rendered.
  if (process.env.HIDE) await page.evaluate((sel) => document.querySelectorAll<HTMLElement>(sel).forEach((el) => el.style.setProperty('display', 'none', 'important')), process.env.HIDE);
  const profile = process.env.PROFILE === '1';
  const cdp = profile ? await page.context().newCDPSession(page) : null;
  if (cdp) {
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: 100 });
    await cdp.send('Profiler.start');
  }
  // Diagnostics only: TRACE=1 sums the renderer's main-thread work by trace event over the edits.
  const trace = process.env.TRACE === '1';
  if (trace) await browser.browser.startTracing(page, { categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline'] });
  // Diagnostics only: PLAIN=1 types into a plain input outside React instead (the page's floor).
  if (process.env.PLAIN === '1') await page.evaluate(() => { const el = document.createElement('input'); el.id = 'plain'; el.setAttribute('aria-label', 'Row 20 Rate / yield'); document.body.prepend(el); document.querySelector<HTMLElement>('[role=grid]')!.querySelectorAll('input').forEach((i) => i.removeAttribute('aria-label')); });
  const cell = page.getByRole('textbox', { name: 'Row 20 Rate / yield' });
  await cell.click();
  await page.keyboard.press('End');
  for (let i = 0; i < EDITS; i++) {
    await page.keyboard.press(i % 2 === 0 ? '5' : 'Backspace');
    await page.waitForTimeout(30);
  }
  await page.waitForTimeout(200);
  if (trace) console.log(traceSummary(await browser.browser.stopTracing(), EDITS, 'edit'));
  if (cdp) {
    const { profile: p } = (await cdp.send('Profiler.stop')) as { profile: { nodes: ProfileNode[] } };
    console.log(profileSummary(p.nodes, 40));
  }

  const { frames, work } = await page.evaluate(() => {
    const w = window as unknown as { __frames: number[]; __work: number[] };
    return { frames: w.__frames, work: w.__work };
  });
  // Floor: the same measurement for an input event that changes nothing (an unbound input).
  const floor = await page.evaluate(async () => {
    const el = document.createElement('input');
    document.body.appendChild(el);
    const out: number[] = [];
    for (let i = 0; i < 40; i++) {
      await new Promise<void>((resolve) => {
        const t0 = performance.now();
        el.dispatchEvent(new Event('change'));
        requestAnimationFrame(() => {
          const ch = new MessageChannel();
          ch.port1.onmessage = () => {
            out.push(performance.now() - t0);
            setTimeout(resolve, 7 + (i % 5) * 3);
          };
          ch.port2.postMessage(0);
        });
      });
    }
    el.remove();
    return out;
  });
  const warm = frames.slice(5);
  const median = quantile(warm, 0.5);
  const p95 = quantile(warm, 0.95);
  console.log(`one-cell edit, 40 quotes, ${METHOD}: input event to next paint over ${warm.length} edits (first 5 dropped as warm-up)`);
  console.log(`  script and React commit (input event to end of its task): median ${quantile(work.slice(5), 0.5).toFixed(2)} ms, p95 ${quantile(work.slice(5), 0.95).toFixed(2)} ms`);
  console.log(`  floor (a no-op event to the next paint, i.e. waiting for the frame): median ${quantile(floor, 0.5).toFixed(2)} ms, p95 ${quantile(floor, 0.95).toFixed(2)} ms`);
  console.log(`  median ${median.toFixed(2)} ms, p95 ${p95.toFixed(2)} ms, max ${Math.max(...warm).toFixed(2)} ms; target median <= ${TARGET_MEDIAN_MS} ms: ${median <= TARGET_MEDIAN_MS ? 'met' : 'NOT MET'}`);
  await page.close();
} finally {
  await browser.close();
  await server.close();
}
