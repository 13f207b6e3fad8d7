import { createStore, promisifyRequest, type UseStore } from 'idb-keyval';

/**
 * Where the workspace list is kept: one key per record (`entry:<id>`, `meta:<name>`). IndexedDB
 * (through idb-keyval) is the first choice: its quota is a share of the disk, where localStorage
 * gives about 5 MB for everything. localStorage is the fallback when the browser offers no
 * IndexedDB (some private modes); then values are JSON text under LOCAL_PREFIX + key.
 */
export interface WorkspaceBackend {
  readonly kind: 'indexeddb' | 'localStorage';
  /** Every record, in no particular order. */
  all(): Promise<[string, unknown][]>;
  get(key: string): Promise<unknown>;
  set(key: string, value: unknown): Promise<void>;
  del(key: string): Promise<void>;
  /**
   * Reads and writes one record in one transaction (no other tab can write between): `change`
   * gets the stored value (undefined when none) and returns the new one, or KEEP to leave it.
   * Resolves once the write is durable; rejects with the browser's error (a full quota).
   */
  update(key: string, change: (current: unknown) => unknown): Promise<void>;
}

/** Returned by an update's `change` to leave the record as it is. */
export const KEEP: unique symbol = Symbol('keep');

export const DB_NAME = 'tenorscope';
export const DB_STORE = 'workspaces';
/** localStorage keys of the fallback: this prefix plus the record key. */
export const LOCAL_PREFIX = 'tenorscope.list.';

/**
 * The IndexedDB backend: database DB_NAME, object store DB_STORE, opened (by idb-keyval) through
 * the page's `indexedDB` on first use; tests install fake-indexeddb there.
 */
export function indexedDbBackend(): WorkspaceBackend {
  const store: UseStore = createStore(DB_NAME, DB_STORE);
  return {
    kind: 'indexeddb',
    all: () =>
      store('readonly', async (s) => {
        const [ks, vs] = await Promise.all([promisifyRequest(s.getAllKeys()), promisifyRequest(s.getAll())]);
        return ks.map((k, i) => [String(k), vs[i]] as [string, unknown]);
      }),
    get: (key) => store('readonly', (s) => promisifyRequest(s.get(key))),
    set: (key, value) =>
      store('readwrite', (s) => {
        s.put(value, key);
        return promisifyRequest(s.transaction);
      }),
    del: (key) =>
      store('readwrite', (s) => {
        s.delete(key);
        return promisifyRequest(s.transaction);
      }),
    update: (key, change) =>
      store('readwrite', (s) => {
        const req = s.get(key);
        req.onsuccess = () => {
          const next = change(req.result);
          if (next !== KEEP) s.put(next, key);
        };
        return promisifyRequest(s.transaction);
      }),
  };
}

/** The localStorage fallback (values as JSON text). Its writes are synchronous, so update is one step too. */
export function localStorageBackend(storage: Storage): WorkspaceBackend {
  const read = (key: string): unknown => {
    const raw = storage.getItem(LOCAL_PREFIX + key);
    if (raw === null) return undefined;
    try {
      return JSON.parse(raw) as unknown;
    } catch {
      // Kept as text: the reader reports it as damaged, nothing overwrites it silently.
      return raw;
    }
  };
  const write = (key: string, value: unknown): void => storage.setItem(LOCAL_PREFIX + key, JSON.stringify(value));
  return {
    kind: 'localStorage',
    all: async () => {
      const out: [string, unknown][] = [];
      for (let i = 0; i < storage.length; i++) {
        const k = storage.key(i);
        if (k !== null && k.startsWith(LOCAL_PREFIX)) out.push([k.slice(LOCAL_PREFIX.length), read(k.slice(LOCAL_PREFIX.length))]);
      }
      return out;
    },
    get: async (key) => read(key),
    set: async (key, value) => write(key, value),
    del: async (key) => storage.removeItem(LOCAL_PREFIX + key),
    update: async (key, change) => {
      const next = change(read(key));
      if (next !== KEEP) write(key, next);
    },
  };
}

/**
 * Opens IndexedDB when the browser has it and it works (an open and a read), else localStorage,
 * else null (nothing can be kept: the work stays in the page). `storage` is asked for only when
 * IndexedDB fails.
 */
export async function openBackend(hasIndexedDb: boolean, storage: () => Storage | null): Promise<WorkspaceBackend | null> {
  if (hasIndexedDb) {
    try {
      const backend = indexedDbBackend();
      await backend.get('meta:open');
      return backend;
    } catch {
      // fall through to localStorage
    }
  }
  const ls = storage();
  return ls ? localStorageBackend(ls) : null;
}
