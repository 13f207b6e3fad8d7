// Benchmark (not a test): moving between cells with the arrow keys on a 360-row quote sheet (the
// sheet is windowed above 30 rows), in Debian's Chromium on the built app. Each move is timed on
// the page with performance marks (see below); the target (issue "Desk-ready", item 25: a move
// should cost a few milliseconds, not about 60) is on the main-thread work of a move, the key's
// handling plus the frame it causes. Medians over many moves, printed; nothing is asserted.
// TRACE=1 adds the main thread's work per move by trace event, PROFILE=1 a CPU profile.
// Run: npx vite build && TZ=America/Los_Angeles npx tsx test/browser/sheetKeys.bench.ts
// DIST=/some/dist serves another build (to alternate an old build and a new one in one session).
// The 360 quotes are invented benchmark data.
import { profileSummary, traceSummary, type ProfileNode } from './diagnostics.ts';
import path from 'node:path';
import { DIST_DIR, launchBrowser, newPage } from './harness.ts';
import { serveDirectory } from './static-server.ts';

const TARGET_WORK_MEDIAN_MS = 5;
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
  // Per move, on the page (performance marks): the key's own handling (keydown on the window,
  // capture to bubble: React's handler, the focus move, its scroll), the frame after it (from its
  // first animation-frame callback to a message posted there, which runs once that frame's style,
  // layout and paint are done: the row window's re-render, if any, happens there too), and the
  // latency from the event's time stamp to that point.
  await page.evaluate(() => {
    const w = window as unknown as { __sync: number[]; __frame: number[]; __latency: number[] };
    w.__sync = [];
    w.__frame = [];
    w.__latency = [];
    let n = 0;
    window.addEventListener(
      'keydown',
      (e) => {
        if (!e.key.startsWith('Arrow')) return;
        const id = n++;
        performance.mark(`move-${id}`);
        performance.mark(`move-event-${id}`, { startTime: e.timeStamp });
        requestAnimationFrame(() => {
          performance.mark(`move-frame-${id}`);
          const ch = new MessageChannel();
          ch.port1.onmessage = () => {
            w.__frame.push(performance.measure(`move-frame-work-${id}`, `move-frame-${id}`).duration);
            w.__latency.push(performance.measure(`move-latency-${id}`, `move-event-${id}`).duration);
          };
          ch.port2.postMessage(0);
        });
      },
      true,
    );
    window.addEventListener('keydown', (e) => {
      if (e.key.startsWith('Arrow')) w.__sync.push(performance.measure(`move-key-${n - 1}`, `move-${n - 1}`).duration);
    });
  });
  // Diagnostics only: STYLE="css" adds a style sheet to the page (to try a rendering change without a build).
  if (process.env.STYLE) {
    await page.evaluate((css) => {
      const sheet = new CSSStyleSheet(); // a constructed sheet: the page's CSP refuses inline style
      sheet.replaceSync(css);
      document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];
    }, process.env.STYLE);
  }
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
  // Diagnostics only: ACROSS=1 moves Right and Left along row 1 instead (moves that never scroll).
  const across = process.env.ACROSS === '1';
  for (let i = 0; i < ROWS - 1; i++) {
    await page.keyboard.press(across ? (i % 2 === 0 ? 'ArrowRight' : 'ArrowLeft') : 'ArrowDown');
    await page.waitForTimeout(20);
  }
  const bottom = await label();
  for (let i = 0; i < 120; i++) {
    await page.keyboard.press(across ? (i % 2 === 0 ? 'ArrowRight' : 'ArrowLeft') : 'ArrowUp');
    await page.waitForTimeout(20);
  }
  await page.waitForTimeout(200);
  if (trace) {
    const buf = await browser.browser.stopTracing();
    if (process.env.TRACE_FILE) (await import('node:fs')).writeFileSync(process.env.TRACE_FILE, buf);
    console.log(traceSummary(buf, ROWS - 1 + 120, 'move'));
  }
  if (cdp) {
    const { profile: p } = (await cdp.send('Profiler.stop')) as { profile: { nodes: ProfileNode[] } };
    console.log(profileSummary(p.nodes, 45, true));
  }

  const { sync, frame, latency } = await page.evaluate(() => {
    const w = window as unknown as { __sync: number[]; __frame: number[]; __latency: number[] };
    return { sync: w.__sync.slice(10), frame: w.__frame.slice(10), latency: w.__latency.slice(10) };
  });
  const work = sync.map((x, i) => x + (frame[i] ?? 0));
  const med = (xs: number[]): string => quantile(xs, 0.5).toFixed(2);
  const p95 = (xs: number[]): string => quantile(xs, 0.95).toFixed(2);
  console.log(`arrow moves on a ${ROWS}-row sheet: ${sync.length + 10} moves (first 10 dropped as warm-up); going down, the focus reached "${bottom}"`);
  console.log(`  the key's handling (keydown, capture to bubble): median ${med(sync)} ms, p95 ${p95(sync)} ms`);
  console.log(`  the frame after it (animation-frame callbacks, style, layout, paint): median ${med(frame)} ms, p95 ${p95(frame)} ms`);
  console.log(`  keydown time stamp to the end of that frame (includes waiting for it): median ${med(latency)} ms, p95 ${p95(latency)} ms`);
  const m = quantile(work, 0.5);
  const mean = work.reduce((a, b) => a + b, 0) / work.length;
  console.log(`  work per move (handling + frame): median ${m.toFixed(2)} ms, mean ${mean.toFixed(2)} ms, p95 ${p95(work)} ms; target median <= ${TARGET_WORK_MEDIAN_MS} ms: ${m <= TARGET_WORK_MEDIAN_MS ? 'met' : 'NOT MET'}`);
  await page.close();
} finally {
  await browser.close();
  await server.close();
}
