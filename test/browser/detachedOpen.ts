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
//   - the app's own index.html is served with one extra deferred classic script ahead of its
//     module (deferred, so it does not hold up the fetch of the app's scripts; deferred and module
//     scripts run in document order, so it runs first), the probe, which marks the first paint showing the zero curve (and, for a link, the linked
//     workspace's rows) and reports the page's own clock by an image request to the server.
// Nothing else differs from a user opening the link: same build, same files, same Chromium.
import { spawn } from 'node:child_process';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { CHROMIUM_ARGS, CHROMIUM_PATH, DIST_DIR } from './harness.ts';

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

/**
 * The probe, run in the page before the app's scripts: a MutationObserver waits for the zero
 * curve's path (and, with a row count, exactly that many sheet rows); the next animation frame's
 * paint is marked after the frame (a message posted from requestAnimationFrame runs once the frame
 * has been produced), and the figures go to the server as the query of an image request.
 */
const probeScript = (rows: number | null): string => `(() => {
  const rows = ${rows === null ? 'null' : String(rows)};
  const drawn = () => {
    if (!document.querySelector('svg[aria-label^="Zero curve"] [data-series="zero"] path[d]')) return false;
    if (rows === null) return true;
    return document.querySelector('input[aria-label="Row ' + rows + ' Kind"]') !== null && document.querySelector('input[aria-label="Row ' + (rows + 1) + ' Kind"]') === null;
  };
  const observer = new MutationObserver(() => {
    if (!drawn()) return;
    observer.disconnect();
    const inDom = performance.mark('probe-in-dom').startTime;
    requestAnimationFrame(() => {
      const ch = new MessageChannel();
      ch.port1.onmessage = () => {
        const painted = performance.mark('probe-painted').startTime;
        const nav = performance.getEntriesByType('navigation')[0];
        const send = () => {
          const q = new URLSearchParams({ painted: painted.toFixed(2), inDom: inDom.toFixed(2), dcl: String(nav ? nav.domContentLoadedEventEnd : NaN), viewport: innerWidth + 'x' + innerHeight, marks: performance.getEntriesByType('mark').filter((m) => !m.name.startsWith('probe-')).map((m) => m.name + ':' + m.startTime.toFixed(2)).concat(['html-received:' + (nav ? nav.responseEnd.toFixed(2) : 'NaN'), 'scripts-received:' + Math.max(...performance.getEntriesByType('resource').filter((r) => /[.]js$/.test(r.name) && !r.name.includes('__probe')).map((r) => r.responseEnd)).toFixed(2)]).join(',') });
          new Image().src = '/__probe-report?' + q.toString();
        };
        if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', () => setTimeout(send, 0)); else setTimeout(send, 0);
      };
      ch.port2.postMessage(0);
    });
  });
  observer.observe(document, { subtree: true, childList: true, attributes: true });
})();`;

/** Headless Chromium keeps 143 px of the window for its (invisible) browser frame: this gives a 1600 x 1000 viewport, as in the Playwright runs (the bench checks it). */
const WINDOW_SIZE = '--window-size=1600,1143';

const TYPES: Record<string, string> = { '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8', '.svg': 'image/svg+xml' };

export interface DetachedOpener {
  /** Starts a fresh Chromium, opens `fragment` (e.g. "#ws1...", or "" for the plain app) and returns the probe's figures. */
  open(fragment: string, rows: number | null): Promise<ProbeTimes>;
  close(): Promise<void>;
}

export async function detachedOpener(options: { settleMs?: number; timeoutMs?: number; dir?: string } = {}): Promise<DetachedOpener> {
  const dir = options.dir ?? DIST_DIR;
  const settleMs = options.settleMs ?? 2500;
  const timeoutMs = options.timeoutMs ?? 30_000;
  let probe = probeScript(null);
  let target = '';
  let waiting: ((t: ProbeTimes) => void) | null = null;
  const send = (res: ServerResponse, status: number, type: string, body: string | Buffer): void => {
    res.writeHead(status, { 'content-type': type, 'content-length': Buffer.byteLength(body), 'cache-control': 'no-store' });
    res.end(body);
  };
  const server = createServer((req: IncomingMessage, res: ServerResponse) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    if (url.pathname === '/__probe-report') {
      const q = url.searchParams;
      waiting?.({ painted: Number(q.get('painted')), inDom: Number(q.get('inDom')), domContentLoaded: Number(q.get('dcl')), viewport: q.get('viewport') ?? '?', marks: Object.fromEntries((q.get('marks') ?? '').split(',').filter(Boolean).map((kv) => [kv.slice(0, kv.lastIndexOf(':')), Number(kv.slice(kv.lastIndexOf(':') + 1))])) });
      send(res, 204, 'text/plain', '');
      return;
    }
    if (url.pathname === '/__probe.js') return send(res, 200, TYPES['.js']!, probe);
    if (url.pathname === '/__launch') {
      const page = `<!doctype html><title>launcher</title><p>opening</p><script>setTimeout(() => { location.href = ${JSON.stringify(target)}; }, ${settleMs});</script>`;
      return send(res, 200, TYPES['.html']!, page);
    }
    const rel = url.pathname === '/' ? 'index.html' : path.normalize(decodeURIComponent(url.pathname)).replace(/^[/\\]+/, '');
    if (rel.startsWith('..')) return send(res, 404, 'text/plain', 'not found');
    readFile(path.join(dir, rel))
      .then((body) => {
        if (rel === 'index.html') {
          // dist/index.html, with the probe ahead of the app's module script.
          const html = body.toString('utf8');
          if (!html.includes('<script type="module"')) throw new Error('dist/index.html has no module script to put the probe before');
          return send(res, 200, TYPES['.html']!, html.replace('<script type="module"', '<script defer src="/__probe.js"></script>\n    <script type="module"'));
        }
        return send(res, 200, TYPES[path.extname(rel)] ?? 'application/octet-stream', body);
      })
      .catch(() => send(res, 404, 'text/plain', 'not found'));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;

  return {
    async open(fragment, rows) {
      probe = probeScript(rows);
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
        await rm(profile, { recursive: true, force: true, maxRetries: 10, retryDelay: 100 });
      }
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
