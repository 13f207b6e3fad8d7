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
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/browser/**', 'node_modules/**'],
  },
});
