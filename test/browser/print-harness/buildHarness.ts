// Builds the harness pages with vite into test/artifacts/print-harness (for the browser tests).
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { build } from 'vite';

const here = fileURLToPath(new URL('.', import.meta.url));
export const HARNESS_OUT = fileURLToPath(new URL('../../artifacts/print-harness', import.meta.url));
export const HARNESS_BUILD_ID = 'harness-build';

export async function buildHarness(): Promise<string> {
  await build({
    configFile: false,
    root: here,
    base: './',
    logLevel: 'warn',
    plugins: [react()],
    define: { __BUILD_ID__: JSON.stringify(HARNESS_BUILD_ID) },
    build: {
      outDir: HARNESS_OUT,
      emptyOutDir: true,
      target: 'es2022',
      rollupOptions: { input: { print: path.join(here, 'print.html'), share: path.join(here, 'share.html'), app: path.join(here, 'app.html') } },
    },
  });
  return HARNESS_OUT;
}
