// Runs a TypeScript entry point of this repository as one plain ES module, bundled by esbuild and
// cached under node_modules/.cache/tenorscope, keyed by a hash of the source trees it may read.
//
// Why: the command line and the engine benchmarks should run the engine as it ships (bundled,
// like the browser build), not under a development loader. A development loader costs the
// `curve` command most of a second of start-up per call, and its transform (kept function names)
// adds work to every closure the engine creates. The first call after a change bundles (tens of
// milliseconds); every later call runs the cached file.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync } from 'node:fs';
import { basename, join, relative } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** The repository's root directory (this file is src/cli/bundle.mjs). */
export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

/** A hash of every file under the given directories (paths and contents), in a fixed order. */
function treeHash(dirs) {
  const hash = createHash('sha256');
  const walk = (dir) => {
    const entries = readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
    for (const entry of entries) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (entry.isFile()) {
        hash.update(relative(repoRoot, path));
        hash.update(readFileSync(path));
      }
    }
  };
  for (const dir of dirs) walk(join(repoRoot, dir));
  return hash.digest('hex').slice(0, 16);
}

/**
 * Bundles `entry` (a path from the repository root) unless a bundle of the same sources is
 * cached, then imports it, so its top-level code runs with this process's argv, stdin and exit
 * code. `sources`: the directories whose contents the bundle depends on. The cache directory
 * can be moved with TENORSCOPE_CACHE (tests use a fresh one).
 */
export async function runBundled(entry, sources) {
  const cacheDir = process.env.TENORSCOPE_CACHE ?? join(repoRoot, 'node_modules', '.cache', 'tenorscope');
  const name = basename(entry).replace(/\.[cm]?tsx?$/, '');
  const out = join(cacheDir, `${name}-${treeHash(sources)}.mjs`);
  if (!existsSync(out)) {
    const { buildSync } = await import('esbuild');
    mkdirSync(cacheDir, { recursive: true });
    const tmp = `${out}.${process.pid}.tmp`;
    buildSync({
      entryPoints: [join(repoRoot, entry)],
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      outfile: tmp,
      logLevel: 'error',
    });
    // Older bundles of the same entry are stale: remove them, then publish the new one whole.
    for (const f of readdirSync(cacheDir)) {
      if (f.startsWith(`${name}-`) && f.endsWith('.mjs') && f !== basename(out)) rmSync(join(cacheDir, f), { force: true });
    }
    renameSync(tmp, out);
  }
  await import(pathToFileURL(out).href);
}
