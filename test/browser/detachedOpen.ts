// Page-load timing with no automation client attached (for browser.bench.ts).
//
// Playwright drives Chromium over the DevTools protocol: it attaches to every new page, enables
// the Page, Runtime, Network and Log domains and adds an isolated world to each document. That
// instrumentation slows a page that does real work: on this machine kind the app opened a shared
// link in about 270-310 ms without it and 390-470 ms with it (alternated runs, same build), while
// a trivial page took about the same time either way. A colleague's browser has no such client,
// so the load targets are timed here on a Chromium started directly, without a debugging pipe:
//   - each run starts Chromium on a fresh, empty profile (cold HTTP cache, no code cache);
//   - the first page is a launcher on http://localhost, which waits for the browser to settle and
//     then navigates to the app on http://127.0.0.1 (another site, so a new renderer process);
//   - the app's own index.html is served with one extra script ahead of its module, the probe
//     (deferred, so it does not hold up the fetch of the app's scripts; deferred and module scripts
//     run in document order, so it runs first). It marks the first paint showing the zero curve
//     (and, for a link, the linked workspace's rows) and reports the page's own clock by an image
//     request to the server.
// The Playwright-driven runs of browser.bench.ts install the same probe as an init script, which
// reports on the console instead.
// Nothing else differs from a user opening the link: same build, same files, same Chromium.
import { spawn } from 'node:child_process';
import { mkdtemp, readlink, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { CHROMIUM_ARGS, CHROMIUM_PATH, DIST_DIR } from './harness.ts';
import { send, serveDirectory } from './static-server.ts';

/** What the probe reports, in ms from the page's navigation start (its own performance clock). */
export interface ProbeTimes {
  /** First paint after the zero curve (and the expected rows) are in the DOM. */
  readonly painted: number;
  readonly inDom: number;
  readonly domContentLoaded: number;
  readonly viewport: string;
  /** Any performance marks the page made itself (none in the production build; a build with marks added for profiling shows its phases). */
  readonly marks: Readonly<Record<string, number>>;
}

/** What the probe prints on the console at the first chart's paint, when it reports there. */
export const PROBE_PAINTED_LINE = 'tenorscope-bench: chart painted';

/**
 * The probe, run in the page before the app's scripts: a MutationObserver waits for the zero
 * curve's path (and, with a row count, exactly that many sheet rows) and marks `probe-in-dom`; the
 * next animation frame's paint is marked `probe-painted` (a message posted from
 * requestAnimationFrame runs once the frame has been produced). It then reports: by an image
 * request to the server carrying its figures ('beacon'), or by printing PROBE_PAINTED_LINE
 * ('console'), so a Playwright harness need not run a script in the page while it loads.
 */
export function probeScript(rows: number | null, report: 'beacon' | 'console'): string {
  return `(() => {
  const rows = ${rows === null ? 'null' : String(rows)};
  const drawn = () => {
    if (!document.querySelector('svg[aria-label^="Zero curve"] [data-series="zero"] path[d]')) return false;
    if (rows === null) return true;
    return document.querySelector('input[aria-label="Row ' + rows + ' Kind"]') !== null && document.querySelector('input[aria-label="Row ' + (rows + 1) + ' Kind"]') === null;
  };
  const beacon = () => {
    const nav = performance.getEntriesByType('navigation')[0];
    const scripts = performance.getEntriesByType('resource').filter((r) => /[.]js$/.test(r.name) && !r.name.includes('__probe'));
    const marks = Object.fromEntries(performance.getEntriesByType('mark').filter((m) => !m.name.startsWith('probe-')).map((m) => [m.name, m.startTime]));
    marks['html-received'] = nav ? nav.responseEnd : null;
    marks['scripts-received'] = Math.max(...scripts.map((r) => r.responseEnd));
    const q = new URLSearchParams({
      painted: performance.getEntriesByName('probe-painted')[0].startTime.toFixed(2),
      inDom: performance.getEntriesByName('probe-in-dom')[0].startTime.toFixed(2),
      dcl: String(nav ? nav.domContentLoadedEventEnd : NaN),
      viewport: innerWidth + 'x' + innerHeight,
      marks: JSON.stringify(marks),
    });
    new Image().src = '/__probe-report?' + q.toString();
  };
  const report = ${report === 'console' ? `() => console.log(${JSON.stringify(PROBE_PAINTED_LINE)})` : `() => (document.readyState === 'loading' ? document.addEventListener('DOMContentLoaded', () => setTimeout(beacon, 0)) : setTimeout(beacon, 0))`};
  const observer = new MutationObserver(() => {
    if (!drawn()) return;
    observer.disconnect();
    performance.mark('probe-in-dom');
    requestAnimationFrame(() => {
      const ch = new MessageChannel();
      ch.port1.onmessage = () => {
        performance.mark('probe-painted');
        report();
      };
      ch.port2.postMessage(0);
    });
  });
  observer.observe(document, { subtree: true, childList: true, attributes: true });
})();`;
}

/** Headless Chromium keeps 143 px of the window for its (invisible) browser frame: this gives a 1600 x 1000 viewport, as in the Playwright runs (the bench checks it). */
const WINDOW_SIZE = '--window-size=1600,1143';

export interface DetachedOpener {
  /** Starts a fresh Chromium, opens `fragment` (e.g. "#ws1...", or "" for the plain app) and returns the probe's figures. */
  open(fragment: string, rows: number | null): Promise<ProbeTimes>;
  close(): Promise<void>;
}

export async function detachedOpener(options: { settleMs?: number; timeoutMs?: number; dir?: string } = {}): Promise<DetachedOpener> {
  const dir = options.dir ?? DIST_DIR;
  const settleMs = options.settleMs ?? 2500;
  const timeoutMs = options.timeoutMs ?? 30_000;
  let probe = probeScript(null, 'beacon');
  let target = '';
  let waiting: ((t: ProbeTimes) => void) | null = null;
  const server = await serveDirectory(dir, {
    intercept: (url, res) => {
      if (url.pathname === '/__probe-report') {
        const q = url.searchParams;
        const marks = JSON.parse(q.get('marks') ?? '{}') as Record<string, number | null>;
        waiting?.({ painted: Number(q.get('painted')), inDom: Number(q.get('inDom')), domContentLoaded: Number(q.get('dcl')), viewport: q.get('viewport') ?? '?', marks: Object.fromEntries(Object.entries(marks).map(([k, v]) => [k, v ?? Number.NaN])) });
        send(res, 204, 'text/plain', '');
      } else if (url.pathname === '/__probe.js') {
        send(res, 200, 'text/javascript; charset=utf-8', probe);
      } else if (url.pathname === '/__launch') {
        send(res, 200, 'text/html; charset=utf-8', `<!doctype html><title>launcher</title><p>opening</p><script>setTimeout(() => { location.href = ${JSON.stringify(target)}; }, ${settleMs});</script>`);
      } else {
        return false;
      }
      return true;
    },
    rewriteHtml: (html) => {
      if (!html.includes('<script type="module"')) throw new Error('index.html has no module script to put the probe before');
      return html.replace('<script type="module"', '<script defer src="/__probe.js"></script>\n    <script type="module"');
    },
  });
  const { port } = new URL(server.url);

  return {
    async open(fragment, rows) {
      probe = probeScript(rows, 'beacon');
      target = `http://127.0.0.1:${port}/${fragment}`;
      const profile = await mkdtemp(path.join(tmpdir(), 'tenorscope-detached-'));
      let timer: ReturnType<typeof setTimeout> | undefined;
      const reported = new Promise<ProbeTimes>((resolve, reject) => {
        waiting = resolve;
        timer = setTimeout(() => reject(new Error(`the probe did not report within ${timeoutMs} ms (${target.slice(0, 60)})`)), timeoutMs);
      });
      // Only the launcher is on localhost; the app is on 127.0.0.1 (the server listens on both names' address).
      const child = spawn(CHROMIUM_PATH, [...CHROMIUM_ARGS, `--user-data-dir=${profile}`, WINDOW_SIZE, `http://localhost:${port}/__launch`], { stdio: 'ignore', detached: true });
      const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
      try {
        return await reported;
      } finally {
        clearTimeout(timer);
        waiting = null;
        // The whole process group: the browser and its renderer, GPU and utility processes.
        try {
          process.kill(-child.pid!, 'SIGKILL');
        } catch {
          child.kill('SIGKILL');
        }
        await exited;
        await removeSingletonDir(profile);
        await rm(profile, { recursive: true, force: true, maxRetries: 10, retryDelay: 100 });
      }
    },
    close: () => server.close(),
  };
}

/**
 * Chromium keeps its single-instance socket in a directory of its own under the temporary
 * directory (org.chromium.Chromium.XXXXXX), linked from the profile as SingletonSocket, and removes
 * it only on a clean exit. A browser ended by SIGKILL leaves it behind: removed here.
 */
async function removeSingletonDir(profile: string): Promise<void> {
  const socket = await readlink(path.join(profile, 'SingletonSocket')).catch(() => null);
  if (socket === null) return;
  const dir = path.dirname(socket);
  if (path.dirname(dir) === tmpdir() && path.basename(dir).startsWith('org.chromium.')) await rm(dir, { recursive: true, force: true });
}
