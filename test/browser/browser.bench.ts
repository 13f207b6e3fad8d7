// Benchmark (not a test): the browser targets of issue 7, in Debian's Chromium on the production
// build served from loopback, timed with the page's own clock (performance.now / performance.mark).
//   1. one-cell edit to redrawn charts <= 12 ms       (measured by workbenchFrame.bench.ts, run here)
//   2. pasting 500 rows to redrawn charts <= 100 ms   (paste event dispatched to the focused cell,
//      to the first paint after the zero curve's path changed)
//   3. opening a shared link to the first drawn chart <= 300 ms (fresh profile, so a cold cache,
//      from navigation start to the first paint showing the linked workspace's curve)
//   4. cold load to the first drawn chart <= 1 s      (fresh profile, navigation start to the first
//      paint with the zero curve drawn)
//   5. reload of a 500-quote workspace, longest task <= 100 ms (issue 9: every task under 100 ms up
//      to the caps; the longest main-thread task Chromium reports from navigation until the page
//      has settled, reloadLongTask.ts)
// 3 and 4 are timed on a Chromium started without an automation client (detachedOpen.ts says
// why and how); the same loads driven through Playwright are printed beside them as diagnostics.
// The target applies to the median; p95 is printed beside it. Exits 1 on a missed target.
// Run: npm run bench:browser (builds first). The quotes are invented benchmark data.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { BrowserContext, Page } from 'playwright-core';
import { machineReferenceLine } from '../bench/machineReference.ts';
import { detachedOpener, PROBE_PAINTED_LINE, probeScript, type ProbeTimes } from './detachedOpen.ts';
import { launchBrowser, newPage, serveDist } from './harness.ts';
import { LONG_TASK_MIN_MS, observeLongTasks, reloadLongestTask, saveWorkspaceOf } from './reloadLongTask.ts';

const RUNS = Number(process.env.RUNS ?? 15);
/** tsx keeps function names with a `__name` helper the page does not have; give the page a no-op one. */
const NAME_SHIM = 'globalThis.__name = (f) => f;';

interface Row {
  readonly what: string;
  readonly target: number;
  readonly samples: number[];
}

const quantile = (xs: number[], q: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))] ?? Number.NaN;
};

/** 500 swap rows on monthly-spaced maturity dates (invented, smooth), as a spreadsheet pastes them. */
function fiveHundredRows(shiftBp: number): string {
  const lines = ['Type\tMaturity\tRate\tCoupon\tClean price\tFrequency\tDay count'];
  for (let i = 0; i < 500; i++) {
    const months = 13 + i; // 13 months to about 42 years
    const y = 2027 + Math.floor((months + 0) / 12);
    const m = (months % 12) + 1;
    const t = months / 12;
    const r = 4.0 - 0.5 * Math.exp(-t / 2) + 0.35 * (1 - Math.exp(-t / 8)) + shiftBp / 100;
    lines.push(`swap\t${y}-${String(m).padStart(2, '0')}-15\t${r.toFixed(4)}\t\t\t1\t30/360`);
  }
  return lines.join('\n');
}

const SEVEN_ROWS = ['Type\tTenor\tRate\tCoupon\tClean price\tFrequency\tDay count', 'deposit\t3M\t3.95\t\t\t\tACT/360', 'deposit\t6M\t4.00\t\t\t\tACT/360', 'swap\t2Y\t3.80\t\t\t1\t30/360', 'swap\t5Y\t3.60\t\t\t1\t30/360', 'swap\t10Y\t3.80\t\t\t1\t30/360', 'swap\t20Y\t4.00\t\t\t1\t30/360', 'swap\t30Y\t3.90\t\t\t1\t30/360'].join('\n');

/** Navigation-start-relative times seen by the page: scripts parsed (DOMContentLoaded), chart in the DOM, chart painted. */
const phases: { dcl: number[]; inDom: number[] } = { dcl: [], inDom: [] };
async function firstChartMs(page: Page, url: string): Promise<number> {
  const painted = page.waitForEvent('console', { predicate: (m) => m.text() === PROBE_PAINTED_LINE, timeout: 20_000 });
  await page.goto(url, { waitUntil: 'commit' });
  await painted;
  const t = await page.evaluate(() => ({
    painted: performance.getEntriesByName('probe-painted')[0]!.startTime,
    inDom: performance.getEntriesByName('probe-in-dom')[0]!.startTime,
    dcl: (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined)?.domContentLoadedEventEnd ?? Number.NaN,
  }));
  phases.dcl.push(t.dcl);
  phases.inDom.push(t.inDom);
  return t.painted;
}
const phaseLine = (label: string): string => {
  const line = `(diagnostic) ${label}: DOMContentLoaded median ${quantile(phases.dcl, 0.5).toFixed(1)} ms, chart in the DOM median ${quantile(phases.inDom, 0.5).toFixed(1)} ms`;
  phases.dcl.length = 0;
  phases.inDom.length = 0;
  return line;
};

/** RUNS opens (after one warm-up of the machine, not of the browser: each run is a fresh Chromium) on a detached browser. */
async function detachedRuns(fragment: string, rowsExpected: number | null, label: string): Promise<number[]> {
  const opener = await detachedOpener();
  const got: ProbeTimes[] = [];
  try {
    for (let i = 0; i < RUNS + 1; i++) {
      const t = await opener.open(fragment, rowsExpected);
      if (t.viewport !== '1600x1000') throw new Error(`the detached page's viewport is ${t.viewport}, not 1600x1000`);
      if (i >= 1) got.push(t);
    }
  } finally {
    await opener.close();
  }
  const med = (f: (t: ProbeTimes) => number): string => quantile(got.map(f), 0.5).toFixed(1);
  const mark = (name: string) => (t: ProbeTimes): number => t.marks[name] ?? Number.NaN;
  console.log(`(diagnostic) ${label}, no automation client: medians: HTML received ${med(mark('html-received'))} ms, scripts received ${med(mark('scripts-received'))} ms, DOMContentLoaded ${med((t) => t.domContentLoaded)} ms, chart in the DOM ${med((t) => t.inDom)} ms`);
  return got.map((t) => t.painted);
}

const referenceBefore = machineReferenceLine();
const server = await serveDist();
const browser = await launchBrowser();
const rows: Row[] = [];
/** Measured before the loads (it reuses the server's warm files) but printed last, as figure 5. */
let reloadRow: Row | null = null;
let failed = false;
try {
  // 1. One-cell edit: the existing frame benchmark, run as it is.
  const frameBench = fileURLToPath(new URL('./workbenchFrame.bench.ts', import.meta.url));
  const run = process.env.SKIP_FRAME === '1' ? { status: 0, stdout: 'median 0 ms, p95 0 ms target median (skipped)\n', stderr: '' } : spawnSync(process.execPath, ['--import', 'tsx', frameBench], { encoding: 'utf8', env: { ...process.env, TZ: 'America/Los_Angeles' } });
  process.stdout.write(run.stdout);
  process.stderr.write(run.stderr);
  const m = /median ([\d.]+) ms, p95 ([\d.]+) ms/.exec(run.stdout.split('\n').filter((l) => l.includes('target median')).join('\n'));
  if (run.status !== 0 || !m) {
    console.error(`workbenchFrame.bench.ts gave no figures (exit ${run.status})`);
    failed = true;
  }
  rows.push({ what: 'one-cell edit to redrawn charts (40 quotes)', target: 12, samples: m ? [Number(m[1]), Number(m[1]), Number(m[2])] : [] });

  // 2. Paste 500 rows.
  {
    const page = await newPage(browser, { viewport: { width: 1600, height: 1000 } });
    await page.addInitScript(NAME_SHIM);
    await page.goto(server.url);
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    const samples: number[] = [];
    for (let i = 0; i < RUNS + 2; i++) {
      await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
      const ms = await page.evaluate(async (text) => {
        const path = (): string | null => document.querySelector('svg[aria-label^="Zero curve"] [data-series="zero"] path')?.getAttribute('d') ?? null;
        const before = path();
        const dt = new DataTransfer();
        dt.setData('text/plain', text);
        performance.mark('paste-start');
        document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
        // The header paste shows its column-mapping preview; confirm it. The preview is rendered in
        // a task after the (dispatched, untrusted) paste event, not within it: wait for it task by task
        // (up to 20 s: the first paste fetches the reader's chunk, which a loaded host can slow).
        let confirm = document.querySelector<HTMLButtonElement>('.paste-preview button');
        for (const until = performance.now() + 20_000; confirm === null && performance.now() < until; ) {
          await new Promise<void>((r) => { const ch = new MessageChannel(); ch.port1.onmessage = () => r(); ch.port2.postMessage(0); });
          confirm = document.querySelector<HTMLButtonElement>('.paste-preview button');
        }
        if (confirm === null) throw new Error('the paste preview did not appear within 20 s');
        confirm.click();
        performance.mark('paste-handled'); // the paste handler, the confirmation and any synchronous render have run
        for (let f = 0; f < 600; f++) {
          await new Promise<void>((r) => requestAnimationFrame(() => { const ch = new MessageChannel(); ch.port1.onmessage = () => r(); ch.port2.postMessage(0); }));
          const now = path();
          if (now !== null && now !== before) break;
        }
        performance.mark('paste-painted');
        (window as unknown as { __handled: number[] }).__handled ??= [];
        (window as unknown as { __handled: number[] }).__handled.push(performance.measure('paste-sync', 'paste-start', 'paste-handled').duration);
        return performance.measure('paste', 'paste-start', 'paste-painted').duration;
      }, fiveHundredRows(i % 2 === 0 ? 10 : -10));
      const count = await page.getByText(/quotes in the curve/).innerText();
      if (!count.includes('500 quotes in the curve')) throw new Error(`the 500-row paste did not build 500 quotes: "${count}"`);
      if (i >= 2) samples.push(ms); // two warm-up pastes
      await page.waitForTimeout(300);
    }
    rows.push({ what: 'paste 500 rows to redrawn charts', target: 100, samples });
    const handled = (await page.evaluate(() => (window as unknown as { __handled: number[] }).__handled)).slice(2);
    console.log(`(diagnostic) 500-row paste, dispatch to end of the synchronous handler: median ${quantile(handled, 0.5).toFixed(1)} ms`);
    await page.close();
  }

  // 5. Reload of a saved 500-quote workspace (the quote cap): the longest task of each reload.
  {
    const page = await newPage(browser, { viewport: { width: 1600, height: 1000 } });
    await page.addInitScript(NAME_SHIM);
    await observeLongTasks(page);
    await page.goto(server.url);
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    await saveWorkspaceOf(page, fiveHundredRows(0), 500);
    const samples: number[] = [];
    for (let i = 0; i < RUNS + 1; i++) {
      const ms = await reloadLongestTask(page, 500);
      if (i >= 1) samples.push(ms); // one warm-up reload
    }
    reloadRow = { what: 'reload of a 500-quote workspace, longest task', target: 100, samples };
    console.log(`(diagnostic) 500-quote reload: ${samples.filter((ms) => ms > LONG_TASK_MIN_MS).length} of ${samples.length} reloads had a task over ${LONG_TASK_MIN_MS} ms (none counts as ${LONG_TASK_MIN_MS})`);
    await page.close();
  }

  // A link to a 7-quote workspace, made by the app's own Copy link.
  let link: string;
  {
    const page = await newPage(browser, { viewport: { width: 1600, height: 1000 } });
    await page.context().grantPermissions(['clipboard-read', 'clipboard-write'], { origin: new URL(server.url).origin });
    await page.goto(server.url);
    await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
    await page.getByRole('textbox', { name: 'Row 1 Kind' }).focus();
    await page.evaluate((text) => {
      const dt = new DataTransfer();
      dt.setData('text/plain', text);
      document.activeElement!.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    }, SEVEN_ROWS);
    await page.getByRole('button', { name: 'Replace the sheet' }).click();
    await page.getByText('7 quotes in the curve').waitFor({ timeout: 10_000 });
    await page.getByRole('button', { name: 'Copy link' }).click();
    await page.getByText(/Link copied/).waitFor();
    link = await page.evaluate(() => navigator.clipboard.readText());
    if (!link.includes('#ws1.')) throw new Error(`Copy link gave no link: ${link.slice(0, 80)}`);
    await page.close();
  }

  const fresh = async (rowsExpected: number | null, url: string): Promise<number> => {
    const context: BrowserContext = await browser.browser.newContext({ viewport: { width: 1600, height: 1000 }, locale: 'en-US', timezoneId: 'America/Los_Angeles' });
    try {
      await context.addInitScript(NAME_SHIM);
      await context.addInitScript({ content: probeScript(rowsExpected, 'console') });
      const page = await context.newPage();
      return await firstChartMs(page, url);
    } finally {
      await context.close();
    }
  };

  /** Diagnostics only: RUNS loads (after one warm-up) in fresh Playwright contexts, printed, not judged. */
  const playwrightRuns = async (rowsExpected: number | null, url: string, label: string): Promise<void> => {
    const samples: number[] = [];
    for (let i = 0; i < RUNS + 1; i++) {
      const ms = await fresh(rowsExpected, url);
      if (i >= 1) samples.push(ms);
    }
    console.log(`(diagnostic) ${label}: median ${quantile(samples, 0.5).toFixed(1)} ms, p95 ${quantile(samples, 0.95).toFixed(1)} ms over ${samples.length} runs`);
    console.log(phaseLine(label));
  };

  // 3. Open the shared link in a fresh profile, no automation client attached.
  const fragment = link.slice(link.indexOf('#'));
  rows.push({ what: 'open a shared link to the first drawn chart (cold cache)', target: 300, samples: await detachedRuns(fragment, 7, 'shared link, cold cache') });
  // Diagnostics only: the same opens driven through Playwright (DevTools protocol attached).
  await playwrightRuns(7, link, 'shared link, cold cache, through Playwright');
  // Diagnostics only (not a target): the same link in a profile that has opened the app before.
  {
    const context: BrowserContext = await browser.browser.newContext({ viewport: { width: 1600, height: 1000 }, locale: 'en-US', timezoneId: 'America/Los_Angeles' });
    await context.addInitScript(NAME_SHIM);
    await context.addInitScript({ content: probeScript(7, 'console') });
    const warm: number[] = [];
    for (let i = 0; i < RUNS + 1; i++) {
      const page = await context.newPage();
      if (i === 0) {
        await page.goto(server.url);
        await page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
      } else {
        warm.push(await firstChartMs(page, link));
      }
      await page.close();
    }
    await context.close();
    phases.dcl.length = 0;
    phases.inDom.length = 0;
    console.log(`(diagnostic) shared link, app cached by an earlier visit: median ${quantile(warm, 0.5).toFixed(1)} ms, p95 ${quantile(warm, 0.95).toFixed(1)} ms over ${warm.length} runs`);
  }

  // 4. Cold load, no automation client attached; the Playwright-driven figure as a diagnostic.
  rows.push({ what: 'cold load to the first drawn chart', target: 1000, samples: await detachedRuns('', null, 'cold load') });
  await playwrightRuns(null, server.url, 'cold load, through Playwright');
  if (reloadRow) rows.push(reloadRow);
} finally {
  await browser.close();
  await server.close();
}

const pad = (s: string, n: number): string => s.padEnd(n);
console.log('\nBrowser benchmarks (Chromium, production build, loopback static server); target on the median');
console.log(`${pad('measure', 60)} ${pad('runs', 5)} ${pad('median ms', 10)} ${pad('p95 ms', 10)} ${pad('target ms', 10)} result`);
for (const r of rows) {
  const median = r.what.startsWith('one-cell') ? r.samples[0]! : quantile(r.samples, 0.5);
  const p95 = r.what.startsWith('one-cell') ? r.samples[2]! : quantile(r.samples, 0.95);
  const ok = Number.isFinite(median) && median <= r.target;
  if (!ok) failed = true;
  const runs = r.what.startsWith('one-cell') ? '75' : String(r.samples.length);
  console.log(`${pad(r.what, 60)} ${pad(runs, 5)} ${pad(median.toFixed(2), 10)} ${pad(p95.toFixed(2), 10)} ${pad(`<= ${r.target}`, 10)} ${ok ? 'met' : 'NOT MET'}${ok && p95 > r.target ? ' (p95 above target)' : ''}`);
}
// The same reference loop as the engine benchmarks, before and after (the host's speed can change during a run).
console.log(`${referenceBefore} (before the runs)`);
console.log(`${machineReferenceLine()} (after the runs)`);
process.exit(failed ? 1 : 0);
