import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// The build id ties a shared link and a printed page to the code that produced them.
const buildId = process.env.TENORSCOPE_BUILD_ID ?? new Date().toISOString().slice(0, 10).replace(/-/g, '') + '-dev';

export default defineConfig({
  plugins: [react()],
  define: { __BUILD_ID__: JSON.stringify(buildId) },
  server: { port: 5173, strictPort: false },
  build: { target: 'es2022', sourcemap: false },
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
