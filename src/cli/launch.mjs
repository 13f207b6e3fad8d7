// `npm run curve`: runs src/cli/curve.ts as a bundled ES module (see bundle.mjs), so each call
// starts in about a tenth of a second and runs the engine as it ships.
import { runBundled } from './bundle.mjs';

await runBundled('src/cli/curve.ts', ['src']);
