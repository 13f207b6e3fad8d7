// Reads the workbench's saved workspaces from the page's IndexedDB (database "tenorscope",
// object store "workspaces", as src/state/workspaceBackend.ts keeps them) for the browser tests.
import type { Page } from 'playwright-core';

/** Every record (key and value); an empty list when the app has not created its database yet. */
export function savedRecords(page: Page): Promise<[string, unknown][]> {
  return page.evaluate(
    () =>
      new Promise<[string, unknown][]>((resolve, reject) => {
        const req = indexedDB.open('tenorscope');
        // Never create the database here: that would leave it without the app's object store.
        req.onupgradeneeded = () => req.transaction?.abort();
        req.onerror = () => resolve([]);
        req.onsuccess = () => {
          const db = req.result;
          if (!db.objectStoreNames.contains('workspaces')) {
            db.close();
            resolve([]);
            return;
          }
          const store = db.transaction('workspaces', 'readonly').objectStore('workspaces');
          const keys = store.getAllKeys();
          const values = store.getAll();
          values.onsuccess = () => {
            resolve(keys.result.map((k, i) => [String(k), values.result[i]] as [string, unknown]));
            db.close();
          };
          values.onerror = () => reject(values.error);
        };
      }),
  );
}

export interface SavedRecord {
  readonly id: string;
  readonly name: string;
  readonly stamp: string;
  readonly writer: string;
  readonly workspace?: { quotes: { rate: string }[]; note?: string; curve?: { interpolation?: string }; scenarios?: { name: string }[] };
  readonly drafts?: Record<string, string>;
}

/** The record of the workspace opened last (the one a reload opens), or null. */
export async function openRecord(page: Page): Promise<SavedRecord | null> {
  const records = await savedRecords(page);
  const open = records.find(([k]) => k === 'meta:open')?.[1];
  return (records.find(([k]) => k === `entry:${String(open)}`)?.[1] as SavedRecord | undefined) ?? null;
}

/** Writes one record (to plant a damaged entry). */
export function putRecord(page: Page, key: string, value: unknown): Promise<void> {
  return page.evaluate(
    ([k, v]) =>
      new Promise<void>((resolve, reject) => {
        const req = indexedDB.open('tenorscope');
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          const tx = db.transaction('workspaces', 'readwrite');
          tx.objectStore('workspaces').put(v, k);
          tx.oncomplete = () => {
            db.close();
            resolve();
          };
          tx.onerror = () => reject(tx.error);
        };
      }),
    [key, value] as const,
  );
}
