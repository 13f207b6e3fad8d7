// Helpers for the browser tests (test/browser/*.test.ts): Debian's Chromium driven by
// playwright-core, against the built app (dist/) served from loopback.
//
// Only /usr/bin/chromium is used; nothing is downloaded. Install it, as root, with
//   apt-get update && apt-get install -y chromium poppler-utils
// (test/tools/ensure-chromium.mjs does that for `npm test`).
import { existsSync } from 'node:fs';
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { serveDirectory, type StaticServer } from './static-server.ts';

export const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
export const DIST_DIR = path.join(REPO_ROOT, 'dist');
export const SCREENSHOT_DIR = path.join(REPO_ROOT, 'test', 'artifacts', 'screenshots');

export const CHROMIUM_PATH = '/usr/bin/chromium';
export const CHROMIUM_INSTALL = 'apt-get update && apt-get install -y chromium poppler-utils';
/** The machine has no network but the package registries: keep Chromium from dialling out. */
export const CHROMIUM_ARGS: readonly string[] = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface TestBrowser {
  /** The browser process; each newPage() gets its own context (cookies, storage) in it. */
  readonly browser: Browser;
  /** The default context on the fresh profile in userDataDir. */
  readonly context: BrowserContext;
  /** The fresh, empty --user-data-dir made for this launch; removed by close(). */
  readonly userDataDir: string;
  close(): Promise<void>;
}

export class BrowserLaunchError extends Error {
  override name = 'BrowserLaunchError';
}

const firstLines = (text: string, count: number): string => text.split('\n').slice(0, count).join('\n    ');

/** Starts headless Chromium on a new empty profile. Throws BrowserLaunchError saying why and how to fix it. */
export async function launchBrowser(): Promise<TestBrowser> {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new BrowserLaunchError(
      `Chromium is not installed at ${CHROMIUM_PATH}, so the browser tests cannot run.\n` +
        `  Install it as root with: ${CHROMIUM_INSTALL}\n` +
        '  (or run: node test/tools/ensure-chromium.mjs). Browsers are never downloaded by the tests.',
    );
  }
  const userDataDir = await mkdtemp(path.join(tmpdir(), 'tenorscope-chromium-'));
  let context: BrowserContext;
  try {
    // playwright manages --user-data-dir itself: a persistent context on our fresh directory
    // is how the profile is chosen. It adds --remote-debugging-pipe; our args add the rest.
    context = await chromium.launchPersistentContext(userDataDir, {
      executablePath: CHROMIUM_PATH,
      headless: true,
      args: [...CHROMIUM_ARGS],
      timeout: 60_000,
    });
  } catch (error) {
    await rm(userDataDir, { recursive: true, force: true });
    const cause = error instanceof Error ? error.message : String(error);
    throw new BrowserLaunchError(
      `Chromium at ${CHROMIUM_PATH} failed to start.\n` +
        `  Check that \`${CHROMIUM_PATH} --headless --no-sandbox --dump-dom about:blank\` works; ` +
        `reinstall as root with: ${CHROMIUM_INSTALL}\n` +
        `  args: ${CHROMIUM_ARGS.join(' ')} --user-data-dir=${userDataDir}\n` +
        `  cause: ${firstLines(cause, 12)}`,
      { cause: error },
    );
  }
  const browser = context.browser();
  if (browser === null) {
    await context.close();
    await rm(userDataDir, { recursive: true, force: true });
    throw new BrowserLaunchError('playwright-core returned a persistent context without a browser handle');
  }
  return {
    browser,
    context,
    userDataDir,
    async close() {
      try {
        await context.close();
      } finally {
        await rm(userDataDir, { recursive: true, force: true });
      }
    },
  };
}

/** Serves the built app (dist/) on a free loopback port. Build first: `npm run test:browser` does. */
export async function serveDist(): Promise<StaticServer> {
  if (!existsSync(path.join(DIST_DIR, 'index.html'))) {
    throw new Error(`${path.join(DIST_DIR, 'index.html')} is missing: run \`npx vite build\` first (npm run test:browser does).`);
  }
  return serveDirectory(DIST_DIR);
}

export interface BuiltApp {
  readonly server: StaticServer;
  readonly browser: TestBrowser;
  /** The page opened on the app with newPage(), after its load event. */
  readonly page: Page;
  /** Closes the page, the browser and the server, in that order. */
  close(): Promise<void>;
}

export interface OpenAppOptions extends NewPageOptions {
  /** Runs on the new page before it loads the app (permissions, init scripts); url is the server's. */
  readonly beforeLoad?: (page: Page, url: string) => Promise<unknown>;
}

/**
 * Serves the built app (serveDist), launches Chromium (launchBrowser), opens a newPage() and loads
 * the app in it (waitUntil 'load'). If any step fails, what was opened is closed and the error rethrown.
 */
export async function openBuiltApp(options: OpenAppOptions = {}): Promise<BuiltApp> {
  const server = await serveDist();
  let browser: TestBrowser | undefined;
  let page: Page | undefined;
  const close = async (): Promise<void> => {
    await page?.close();
    await browser?.close();
    await server.close();
  };
  try {
    browser = await launchBrowser();
    page = await newPage(browser, options);
    await options.beforeLoad?.(page, server.url);
    await page.goto(server.url, { waitUntil: 'load' });
  } catch (error) {
    await close().catch(() => undefined);
    throw error;
  }
  return { server, browser, page, close };
}

/** openBuiltApp(), then waits (up to 20 s) for the workbench's quote sheet: the app has mounted. */
export async function openWorkbench(options: OpenAppOptions = {}): Promise<BuiltApp> {
  const app = await openBuiltApp(options);
  try {
    await app.page.getByRole('grid', { name: /Quotes/ }).waitFor({ timeout: 20_000 });
  } catch (error) {
    await app.close().catch(() => undefined);
    throw error;
  }
  return app;
}

export interface PageDiagnostics {
  /** Uncaught exceptions in the page. */
  readonly pageErrors: string[];
  /** console.error messages. */
  readonly consoleErrors: string[];
  /** Requests that failed, or answered 4xx/5xx. */
  readonly failedRequests: string[];
  /** Requests to anywhere but loopback, which are refused. */
  readonly blockedRequests: string[];
}

const diagnosticsOf = new WeakMap<Page, PageDiagnostics>();

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '[::1]']);

export interface NewPageOptions {
  readonly viewport?: { readonly width: number; readonly height: number };
}

/**
 * Opens a page in a new, isolated context: fixed viewport, locale en-US, time zone
 * America/Los_Angeles, reduced motion. Requests off loopback are refused and recorded,
 * as are page errors, console errors and failed requests (see diagnostics()).
 * Closing the page closes its context.
 */
export async function newPage(browser: TestBrowser, options: NewPageOptions = {}): Promise<Page> {
  const context = await browser.browser.newContext({
    viewport: options.viewport ?? { width: 1280, height: 800 },
    deviceScaleFactor: 1,
    locale: 'en-US',
    timezoneId: 'America/Los_Angeles',
    colorScheme: 'light',
    reducedMotion: 'reduce',
  });
  const found: PageDiagnostics = { pageErrors: [], consoleErrors: [], failedRequests: [], blockedRequests: [] };
  await context.route('**/*', async (route) => {
    const url = new URL(route.request().url());
    if ((url.protocol === 'http:' || url.protocol === 'https:' || url.protocol === 'ws:' || url.protocol === 'wss:') && !LOOPBACK.has(url.hostname)) {
      found.blockedRequests.push(url.href);
      await route.abort('blockedbyclient');
      return;
    }
    await route.continue();
  });
  const page = await context.newPage();
  diagnosticsOf.set(page, found);
  page.on('pageerror', (error) => found.pageErrors.push(error.stack ?? error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') found.consoleErrors.push(message.text());
  });
  page.on('requestfailed', (request) => found.failedRequests.push(`${request.url()}: ${request.failure()?.errorText ?? 'failed'}`));
  page.on('response', (response) => {
    if (response.status() >= 400) found.failedRequests.push(`${response.url()}: HTTP ${response.status()}`);
  });
  page.on('close', () => {
    void context.close().catch(() => undefined);
  });
  return page;
}

/** What went wrong in a page opened with newPage(). */
export function diagnostics(page: Page): PageDiagnostics {
  const found = diagnosticsOf.get(page);
  if (!found) throw new Error('diagnostics(): this page was not opened with newPage()');
  return found;
}

/** Saves a full-page PNG as test/artifacts/screenshots/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  const safe = name.replace(/\.png$/i, '').replace(/[^\w.-]+/g, '-').replace(/^[-.]+|-+$/g, '');
  if (safe === '') throw new Error(`screenshot(): name ${JSON.stringify(name)} has no usable characters`);
  await mkdir(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${safe}.png`);
  await page.screenshot({ path: file, fullPage: true, animations: 'disabled' });
  return file;
}

/**
 * A link (on `serverUrl`) that opens an engine document in the workbench, as its "Copy link" would
 * make it: the document read as the workbench reads a file (row ids r0, r1, ...), then encoded.
 */
export async function engineDocumentLink(serverUrl: string, engine: unknown): Promise<string> {
  const { workbenchFromEngine } = await import('../../src/core/index.ts');
  const { encodeWorkspaceLink } = await import('../../src/share/linkCodec.ts');
  let n = 0;
  const doc = workbenchFromEngine(engine, () => `r${n++}`);
  if (!doc.ok) throw new Error(doc.errors[0]!.message);
  return `${serverUrl}#${await encodeWorkspaceLink(doc.value as unknown as Record<string, unknown>)}`;
}
