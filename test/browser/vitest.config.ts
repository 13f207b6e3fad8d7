// Vitest config for the browser stage (`npm run test:browser`, after `vite build`).
// Tests run in Node and drive Debian's Chromium through playwright-core (see harness.ts);
// one file at a time, since each starts its own browser on a 2-core machine.
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  root: fileURLToPath(new URL('../..', import.meta.url)),
  test: {
    globals: true,
    environment: 'node',
    include: ['test/browser/**/*.test.ts'],
    fileParallelism: false,
    // Limits for a hung browser, not speed checks: speed is measured by the benchmarks.
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
});
