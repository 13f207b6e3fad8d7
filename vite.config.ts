import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { defineConfig, type Plugin } from 'vitest/config';
import react from '@vitejs/plugin-react';

/**
 * The build id ties a shared link and a printed page to the code that produced them: the package
 * version and a short hash of every source file, so the same code always has the same id and a
 * changed engine never passes for the old one.
 */
function sourceHash(dir: string): string {
  const hash = createHash('sha256');
  const walk = (d: string): void => {
    for (const entry of readdirSync(d, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
      const path = join(d, entry.name);
      if (entry.isDirectory()) walk(path);
      else {
        hash.update(path);
        hash.update(readFileSync(path));
      }
    }
  };
  walk(dir);
  return hash.digest('hex').slice(0, 8);
}
const version = (JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version;
const buildId = process.env.TENORSCOPE_BUILD_ID ?? `${version}+${sourceHash('src')}`;

/**
 * A strict Content-Security-Policy for static hosting, as a meta tag in the production
 * index.html only (the dev server's hot reload needs an inline preamble). No inline script, no
 * eval, no network: the app makes no requests beyond its own files.
 */
const CSP = [
  "default-src 'none'",
  "script-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'none'",
  "worker-src 'self' blob:",
  "manifest-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
  "object-src 'none'",
].join('; ');

/**
 * Two chunks of the app's own: `first`, what the first screen runs (a module reached from the page's
 * entry by static imports), and `later`, everything that loads on first use (the panels, readers and
 * tools behind import(), which are preloaded once the first chart is drawn). The budget test counts
 * each file's gzip, and some forty small files cost about 14 KB of the all-JavaScript budget over two.
 *
 * The UI imports the core through its index, so every core module is "reached" from the entry;
 * LATER_ONLY names those the first screen never runs: money in decimal.js, the roll analysis, the
 * smooth fit, the quote check's schedules, the explanations, the scenarios' reference reader and change table, the
 * overnight view, the bond analytics, the Holidays and Fixings sections' readers, the paste's table
 * reader, the workspace list file and the code of turns and steps (fetched by src/hooks/overnightKit.ts). Were one of them run on the first screen, `later` would be
 * imported by `first` and the first-load budget test (test/browser/security.test.ts) would fail; a
 * core module used only later and missing here costs first-load bytes, nothing else.
 */
const LATER_ONLY = /node_modules\/decimal\.js\/|src\/core\/roll\/|src\/core\/fit\/(?!parametricForm)|src\/core\/input\/quoteSchedule\.ts|src\/core\/curve\/explain|src\/core\/analytics\/explainRisk\.ts|src\/core\/scenarios\/(scenarioReference|scenarioEffects)\.ts|src\/core\/curve\/overnightView\.ts|src\/core\/analytics\/(bondInput|bondAnalytics|zSpread|quoteDv01|sensitivityMap)\.ts|src\/core\/time\/calendarEdits\.ts|src\/core\/document\/listFile\.ts|src\/core\/input\/pasteTable\.ts|src\/core\/input\/fixingList\.ts|src\/core\/bootstrap\/(overnightKit|turns|turnSolve|meetingSteps)\.ts|src\/core\/time\/turnDays\.ts/;

function appChunk(id: string, ctx: { getModuleInfo(id: string): { isEntry: boolean; importers: readonly string[]; dynamicImporters: readonly string[] } | null }): string | null {
  if (LATER_ONLY.test(id)) return 'later';
  // Up the static importers from the module: first load when the entry is among them.
  const seen = new Set([id]);
  const queue = [id];
  while (queue.length > 0) {
    const info = ctx.getModuleInfo(queue.pop()!);
    if (info === null) continue;
    // The page's entry (index.html); a module loaded by import() is an entry of its own to the bundler, with importers.
    if (info.isEntry && info.importers.length === 0 && info.dynamicImporters.length === 0) return 'first';
    for (const m of info.importers) if (!seen.has(m)) seen.add(m), queue.push(m);
  }
  return 'later';
}

const contentSecurityPolicy = (): Plugin => ({
  name: 'tenorscope-csp',
  apply: 'build',
  transformIndexHtml: {
    order: 'post',
    handler: (html) => {
      const withCsp = html.replace(/(<meta charset="UTF-8" \/>)/i, `$1\n    <meta http-equiv="Content-Security-Policy" content="${CSP}" />`);
      // No icon request to 404 (a console error) when the page names none of its own.
      return /rel="icon"/.test(withCsp) ? withCsp : withCsp.replace('</title>', '</title>\n    <link rel="icon" href="data:," />');
    },
  },
});

export default defineConfig({
  plugins: [react(), contentSecurityPolicy()],
  define: { __BUILD_ID__: JSON.stringify(buildId) },
  server: { port: 5173, strictPort: false },
  // No modulepreload polyfill: every browser the es2022 target runs in preloads modules itself, and
  // the polyfill would fetch() them, which the policy's connect-src 'none' forbids anyway.
  build: {
    target: 'es2022',
    sourcemap: false,
    modulePreload: { polyfill: false },
    rolldownOptions: { output: { codeSplitting: { includeDependenciesRecursively: false, groups: [{ name: appChunk }] } } },
  },
  test: {
    globals: true,
    environment: 'node',
    setupFiles: ['test/setup.ts'],
    // Whole-app component tests render the workbench in jsdom; on a loaded 2-core machine they take
    // seconds. This is a hang guard, not a speed check (speed is measured by the benchmarks).
    testTimeout: 60_000,
    hookTimeout: 60_000,
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/browser/**', 'node_modules/**'],
  },
});
