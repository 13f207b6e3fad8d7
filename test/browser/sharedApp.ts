// One Chromium and one static server of the built app for a whole test file: started before its
// first test, closed after its last (a test file's usual set-up, written once).
import { afterAll, beforeAll } from 'vitest';
import { launchBrowser, serveDist, type TestBrowser } from './harness.ts';
import type { StaticServer } from './static-server.ts';

export interface SharedApp {
  /** Set once the file's tests start (read it inside a test, not at the top level). */
  browser: TestBrowser;
  server: StaticServer;
}

/** Registers the file's beforeAll and afterAll; the returned object is filled before the first test. */
export function useSharedApp(): SharedApp {
  const app = {} as Partial<SharedApp>;
  beforeAll(async () => {
    app.server = await serveDist();
    app.browser = await launchBrowser();
  });
  afterAll(async () => {
    await app.browser?.close();
    await app.server?.close();
  });
  return app as SharedApp;
}
