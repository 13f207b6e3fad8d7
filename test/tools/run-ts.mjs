// Runs a TypeScript script of this repository bundled by esbuild (see src/cli/bundle.mjs), the
// way the `curve` command runs: `node test/tools/run-ts.mjs test/bench/engine.bench.ts [args]`.
// The benchmarks use it so that they time the engine as it ships, not under a development loader.
import { dirname, relative, resolve } from 'node:path';
import { repoRoot, runBundled } from '../../src/cli/bundle.mjs';

const entry = process.argv[2];
if (!entry) {
  console.error('usage: node test/tools/run-ts.mjs FILE.ts [ARGS...]');
  process.exit(2);
}
process.argv.splice(2, 1); // the script sees its own arguments only
const path = relative(repoRoot, resolve(entry));
await runBundled(path, ['src', dirname(path)]);
