// Shared setup for the unit/component stage (vite.config.ts `test.setupFiles`).
// Files run in the node environment by default; a component test opts in to a DOM with a
// `// @vitest-environment jsdom` comment at the top of its file.
import { afterEach } from 'vitest';
// Type-only: brings jest-dom's matcher types (toBeInTheDocument, ...) into tsc's program.
import type {} from '@testing-library/jest-dom/vitest';

const hasDom = typeof window !== 'undefined' && typeof document !== 'undefined';

// jest-dom registers its matchers through expect.extend and loads without a DOM today, but it
// is a DOM library: in a node-environment file a failure to load it must not take down tests
// that never use its matchers, so there it is reported and tolerated. With a DOM it must load.
try {
  await import('@testing-library/jest-dom/vitest');
} catch (error) {
  if (hasDom) throw error;
  console.warn('test/setup.ts: jest-dom matchers unavailable in the node environment:', error);
}

if (hasDom) {
  // Unmount whatever a test rendered so the next test starts from an empty document.
  const { cleanup, configure } = await import('@testing-library/react');
  afterEach(() => {
    cleanup();
  });
  // findBy* and waitFor wait up to 10 s (the default is 1 s): code that loads on first use (the
  // smooth fit, the workspaces panel, the forward grid) arrives by a dynamic import, which on a
  // loaded CI machine can take longer than a second. A hang guard, not a speed check.
  configure({ asyncUtilTimeout: 10_000 });
}
