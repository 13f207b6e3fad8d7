import { depthProblem, isPlainObject, readWorkbenchDocument, WORKBENCH_VERSION, type WorkbenchDocument } from '../core/index.ts';
import { demoWorkspace } from './demoWorkspace.ts';
import { readDrafts, useDrafts } from './drafts.ts';
import { makeRowId } from './ids.ts';
import { checkRestoredWorkspace } from './restoreCheck.ts';
import { useAppStore } from './store.ts';
import { KEEP, openBackend, type WorkspaceBackend } from './workspaceBackend.ts';
import { useWorkspaceList, type WorkspaceListItem } from './workspaceList.ts';

/** Undo and redo steps kept with each saved workspace (each way), so both survive a reload. */
export const SAVED_HISTORY_CAP = 50;

/** Where earlier builds kept the one workspace (localStorage); moved into the list on first start. */
export const LEGACY_KEY = 'tenorscope.workspace';
/** Earlier builds' copies of an unreadable entry (localStorage); moved into the list too. */
export const LEGACY_COPY_PREFIX = 'tenorscope.workspace.unreadable.';
export const CHANNEL_NAME = 'tenorscope.workspaces';
/** A save waits at most this long for an idle moment after an edit. */
export const SAVE_DELAY_MS = 200;
/** After a failed or partial save, it is tried again this often (and on every edit). */
export const RETRY_MS = 10_000;
export const DEFAULT_NAME = 'My workspace';

/** Record keys. */
export const entryKey = (id: string): string => `entry:${id}`;
export const OPEN_KEY = 'meta:open';
export const MIGRATED_KEY = 'meta:migrated';

/** One saved workspace (the value under `entry:<id>`). */
export interface SavedEntry {
  readonly app: 'tenorscope';
  readonly id: string;
  readonly name: string;
  /** Who wrote it and which save it was: `tabId:n`. */
  readonly stamp: string;
  readonly writer: string;
  readonly savedAt: number;
  readonly workspace?: unknown;
  /** The newest undo steps (oldest first) and redo steps (next redo last), at most SAVED_HISTORY_CAP each. */
  readonly history?: { readonly past: readonly unknown[]; readonly future: readonly unknown[] };
  /** The text of an entry earlier builds could not read, kept as it was. */
  readonly unreadable?: string;
  /** Text typed into fields that commit on Enter but not committed yet (src/state/drafts.ts). */
  readonly drafts?: Readonly<Record<string, string>>;
}

type Message =
  | { type: 'hello' | 'here' | 'open'; tab: string; id: string | null }
  | { type: 'bye'; tab: string }
  | { type: 'saved'; tab: string; id: string; stamp: string }
  | { type: 'list'; tab: string };

interface ChannelLike {
  postMessage(m: Message): void;
  close(): void;
  onmessage: ((e: { data: Message }) => void) | null;
}

export interface PersistenceDeps {
  /** Whether to try IndexedDB (the page's `indexedDB`). */
  readonly indexedDb: boolean;
  /** localStorage: the fallback, and where earlier builds' saves are found (read only when needed). */
  readonly storage: Storage | null;
  readonly openChannel: (() => ChannelLike) | null;
  /** The page, for `pagehide` and `storage` events. */
  readonly target: Pick<Window, 'addEventListener' | 'removeEventListener'> | null;
  readonly now: () => number;
  readonly tabId: string;
  /** Runs `save` at the next idle moment (at most SAVE_DELAY_MS away); returns a cancel function. */
  readonly idle: (save: () => void) => () => void;
  readonly retryMs: number;
  /** Tests: wraps the opened backend (to simulate a full quota). */
  readonly wrapBackend?: (backend: WorkspaceBackend) => WorkspaceBackend;
}

const randomId = (): string => Math.floor(Math.random() * 36 ** 8).toString(36).padStart(8, '0');

export function browserDeps(): PersistenceDeps {
  let storage: Storage | null | undefined;
  const BC = (globalThis as { BroadcastChannel?: new (name: string) => ChannelLike }).BroadcastChannel;
  const ric = (globalThis as { requestIdleCallback?: (cb: () => void, o: { timeout: number }) => number }).requestIdleCallback;
  const cic = (globalThis as { cancelIdleCallback?: (h: number) => void }).cancelIdleCallback;
  return {
    indexedDb: typeof indexedDB !== 'undefined',
    // Read on first use: the first touch of localStorage waits for the browser to load it (25-40 ms
    // of the start-up task on a busy machine), and a page with IndexedDB whose earlier saves were
    // moved in never needs it.
    get storage(): Storage | null {
      if (storage === undefined) {
        try {
          storage = window.localStorage;
        } catch {
          storage = null;
        }
      }
      return storage;
    },
    openChannel: BC ? () => new BC(CHANNEL_NAME) : null,
    target: window,
    now: () => Date.now(),
    tabId: `t${randomId()}`,
    idle: (save) => {
      if (ric && cic) {
        const h = ric(save, { timeout: SAVE_DELAY_MS });
        return () => cic(h);
      }
      const h = setTimeout(save, 0);
      return () => clearTimeout(h);
    },
    retryMs: RETRY_MS,
  };
}

const isQuotaError = (e: unknown): boolean =>
  typeof e === 'object' && e !== null && 'name' in e && (/quota/i.test(String((e as { name: unknown }).name)) || /quota/i.test(String((e as { message?: unknown }).message ?? '')));
const errorText = (e: unknown): string => (isQuotaError(e) ? 'browser storage is full (quota exceeded)' : `the browser refused to store it (${e instanceof Error ? e.message : String(e)})`);
/** A clock time for messages (the page's local time; only for reading, never stored). */
const clock = (ms: number): string => new Date(ms).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit' });

/** Why a saved document cannot be read, in words that fit the cause. */
function describeDocProblem(raw: unknown, problem: string): string {
  if (raw === undefined || raw === null || (isPlainObject(raw) && Object.keys(raw).length === 0)) return 'it is empty (no workspace in it)';
  if (isPlainObject(raw) && typeof raw.version === 'number' && raw.version > WORKBENCH_VERSION) {
    return `it was saved by a newer version of Tenorscope (workspace version ${raw.version}; this one reads version ${WORKBENCH_VERSION}). Open it there, or export it from the list`;
  }
  return problem;
}

/** Reads an earlier build's text: a readable entry, or why not. */
function parseLegacyText(raw: string): { entry: Record<string, unknown> | null; problem: string | null } {
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    return { entry: null, problem: 'it is not valid JSON (cut short or damaged)' };
  }
  if (!isPlainObject(json) || json.app !== 'tenorscope') return { entry: null, problem: 'it is not a Tenorscope save' };
  return { entry: json, problem: null };
}

interface ReadEntry {
  readonly item: WorkspaceListItem;
  readonly stamp: string | null;
  /** `lost` when a saved undo step could not be read (the workspace opens, undo starts afresh). */
  readonly history: { past: WorkbenchDocument[]; future: WorkbenchDocument[]; lost?: true };
  readonly drafts?: Record<string, string>;
}

/** The saved undo/redo steps, or none if any step is unreadable (the workspace itself still loads; `lost` says so). */
function readHistory(h: SavedEntry['history']): { past: WorkbenchDocument[]; future: WorkbenchDocument[]; lost?: true } {
  if (!h) return { past: [], future: [] };
  if (!Array.isArray(h.past) || !Array.isArray(h.future)) return { past: [], future: [], lost: true };
  const read = (list: readonly unknown[]): WorkbenchDocument[] | null => {
    const out: WorkbenchDocument[] = [];
    for (const item of list.slice(-SAVED_HISTORY_CAP)) {
      if (depthProblem(item)) return null; // the caps every way in shares (LIMITS.depth)
      const { doc } = readWorkbenchDocument(item, makeRowId);
      if (!doc) return null;
      out.push(doc);
    }
    return out;
  };
  const past = read(h.past);
  const future = read(h.future);
  return past && future ? { past, future } : { past: [], future: [], lost: true };
}

/**
 * Reads one record into a list item (never throws; an unreadable one carries its reason). The undo
 * history is read only when asked for (the workspace being opened), not for every listed entry.
 */
export function readEntry(id: string, value: unknown, withHistory = false): ReadEntry {
  const none = { past: [], future: [] };
  if (!isPlainObject(value)) {
    const problem = typeof value === 'string' ? (parseLegacyText(value).problem ?? 'it is not a Tenorscope save') : 'it is empty (no workspace in it)';
    return { item: { id, name: 'Unreadable workspace', savedAt: null, workspace: null, problem }, stamp: null, history: none };
  }
  const name = typeof value.name === 'string' && value.name.trim() !== '' ? value.name : 'Unnamed workspace';
  const savedAt = typeof value.savedAt === 'number' ? value.savedAt : null;
  const stamp = typeof value.stamp === 'string' ? value.stamp : null;
  if (typeof value.unreadable === 'string') {
    const legacy = parseLegacyText(value.unreadable);
    const problem = legacy.entry ? describeDocProblem(legacy.entry.workspace, readWorkbenchDocument(legacy.entry.workspace, makeRowId).problem ?? 'it could not be read') : legacy.problem!;
    return { item: { id, name, savedAt, workspace: null, problem }, stamp, history: none };
  }
  if (value.app !== 'tenorscope') return { item: { id, name, savedAt, workspace: null, problem: 'it is not a Tenorscope save' }, stamp, history: none };
  const { doc, problem } = readWorkbenchDocument(value.workspace, makeRowId);
  if (!doc) return { item: { id, name, savedAt, workspace: null, problem: describeDocProblem(value.workspace, problem ?? 'it could not be read') }, stamp, history: none };
  return { item: { id, name, savedAt, workspace: doc, problem: null }, stamp, history: withHistory ? readHistory(value.history as SavedEntry['history']) : none, drafts: readDrafts(value.drafts) };
}

export interface Persistence {
  /** Settles once the saved workspace is restored (or found missing); never rejects. */
  readonly ready: Promise<void>;
  stop(): void;
}

interface Controller {
  resolve(choice: 'load' | 'keep'): Promise<void>;
  flush(): Promise<void>;
  switchTo(id: string): Promise<boolean>;
  create(doc: WorkbenchDocument, name: string): Promise<OpenedAsNew>;
  rename(id: string, name: string): Promise<void>;
  remove(id: string): Promise<void>;
  undoRemove(): Promise<void>;
  records(): Promise<[string, unknown][]>;
  add(items: readonly { name: string; workspace: WorkbenchDocument }[]): Promise<number>;
  stop(): void;
}
let active: Controller | null = null;

/** The user's answer when another tab saved a different version: load it, or keep this one and save it. */
export function resolveConflict(choice: 'load' | 'keep'): Promise<void> {
  return active?.resolve(choice) ?? Promise.resolve();
}
/** Saves now if an edit is waiting; settles when the save is done (tests and page hide). */
export function flushSave(): Promise<void> {
  return active?.flush() ?? Promise.resolve();
}
/** Opens another saved workspace in this tab (the current one is saved first). False when it cannot be opened. */
export function switchWorkspace(id: string): Promise<boolean> {
  return active?.switchTo(id) ?? Promise.resolve(false);
}
/**
 * How a document was opened: `entry` as a new entry in the list (`previousId` is the saved
 * workspace shown before, null when that was the untouched demo, never saved); `replaced` in place
 * of the document as one undoable step (no storage, or the open workspace could not be saved).
 */
export interface OpenedAsNew {
  readonly mode: 'entry' | 'replaced';
  readonly previousId: string | null;
  readonly previousName: string | null;
}

/**
 * Adds `doc` as a new workspace and opens it (a shared link, an imported file); the workspace
 * shown before is saved and stays in the list. Without persistence (tests of components) it
 * replaces the document as one undoable step.
 */
export async function openAsNewWorkspace(doc: WorkbenchDocument, name: string): Promise<OpenedAsNew> {
  if (active) return active.create(doc, name);
  useAppStore.getState().replaceWorkspace(doc, name);
  return { mode: 'replaced', previousId: null, previousName: null };
}
export function renameWorkspace(id: string, name: string): Promise<void> {
  return active?.rename(id, name) ?? Promise.resolve();
}
/** Deletes a saved workspace other than the open one; undoDelete() writes it back. */
export function deleteWorkspace(id: string): Promise<void> {
  return active?.remove(id) ?? Promise.resolve();
}
export function undoDelete(): Promise<void> {
  return active?.undoRemove() ?? Promise.resolve();
}
/** Adds workspaces to the list without opening them (an imported list file); resolves to how many were saved. */
export function addWorkspaces(items: readonly { name: string; workspace: WorkbenchDocument }[]): Promise<number> {
  return active?.add(items) ?? Promise.resolve(0);
}
/** Every saved record with the open workspace as it is now (for the export of the whole list). */
export function allRecords(): Promise<[string, unknown][]> {
  return active?.records() ?? Promise.resolve([]);
}

/**
 * Keeps the browser's saved workspaces: restores the last one opened, saves the open one at the
 * next idle moment after an edit and on page hide, and keeps the list for the Workspaces panel.
 * Records live in IndexedDB, else localStorage. Never overwrites another tab's save silently: a
 * save of the same workspace by someone else since this tab last loaded or saved it pauses saving
 * until the user chooses. What was and was not saved is reported; a failed or partial save is
 * tried again on the next edit and every `retryMs`. An entry that cannot be read is left as it is
 * (listed with its reason) and another workspace opens.
 */
export function startPersistence(deps: PersistenceDeps = browserDeps()): Persistence {
  active?.stop();
  const { now, tabId } = deps;
  const store = useAppStore;
  const list = useWorkspaceList;
  const setStorage = (patch: Parameters<ReturnType<typeof store.getState>['setStorage']>[0]): void => store.getState().setStorage(patch);
  let backend: WorkspaceBackend | null = null;
  let stopped = false;
  let revision = 0;
  let currentId: string = randomId();
  let currentName = DEFAULT_NAME;
  /** The stamp of the open workspace's record as this tab last loaded or wrote it. */
  let lastSeen: string | null = null;
  let paused = false;
  /** An edit has not been saved (in full) yet. */
  let dirty = false;
  /** Set while this module itself replaces the document (a load), so no save is scheduled. */
  let loading = false;
  let cancelIdle: (() => void) | null = null;
  let retryTimer: ReturnType<typeof setTimeout> | null = null;
  let queue: Promise<void> = Promise.resolve();
  const peers = new Map<string, string | null>();

  const updateItem = (item: WorkspaceListItem): void => {
    const items = list.getState().items;
    const at = items.findIndex((x) => x.id === item.id);
    list.setState({ items: at < 0 ? [...items, item] : items.map((x, i) => (i === at ? item : x)) });
  };
  const otherTabOpen = (): boolean => [...peers.values()].includes(currentId);
  const post = (m: Message): void => {
    try {
      channel?.postMessage(m);
    } catch {
      // a closed channel: nothing to tell
    }
  };

  const loadIntoStore = (doc: WorkbenchDocument, history: { past: WorkbenchDocument[]; future: WorkbenchDocument[] }, drafts: Record<string, string> = {}): void => {
    loading = true;
    try {
      useDrafts.setState({ drafts });
      store.setState({ workspace: doc, past: history.past, future: history.future, lastEditKey: null, lastEditLabel: null, selectedRowId: null, pasteNotice: null });
    } finally {
      loading = false;
    }
  };

  /**
   * Opens a saved record checked against the caps every way in shares (restoreCheck.ts): settings
   * this build does not know open read-only, with nothing put in their place; anything not
   * restored exactly as saved (rows over the cap, entries that are not rows, an unreadable undo
   * step) is listed for the user, and the record as saved is kept aside first under
   * `kept:<id>:<stamp>` (never listed, never written over; it goes out with "Export all").
   */
  const loadChecked = async (r: ReadEntry, value: unknown): Promise<void> => {
    const check = checkRestoredWorkspace(isPlainObject(value) ? value.workspace : undefined);
    const doc = check.doc ?? r.item.workspace!;
    const notes = [...check.notes, ...(r.history.lost ? ['a step of the saved undo history could not be read, so undo starts afresh'] : [])];
    if (check.unknowns.length === 0 && notes.length === 0) {
      loadIntoStore(doc, r.history, r.drafts);
      return;
    }
    let kept: string | null = `kept:${r.item.id}:${r.stamp ?? 'unstamped'}`;
    try {
      if ((await backend!.get(kept)) === undefined) await backend!.set(kept, value);
    } catch {
      kept = null;
    }
    loading = true;
    try {
      if (check.unknowns.length > 0) store.getState().openReadOnly(doc, check.unknowns, 'saved', demoWorkspace(makeRowId));
      else loadIntoStore(doc, check.notes.length === 0 ? r.history : { past: [], future: [] }, r.drafts);
    } finally {
      loading = false;
    }
    if (notes.length > 0) setStorage({ restoreNotes: notes, keptCopyKey: kept });
  };

  // Saving.
  const record = (withHistory: boolean): SavedEntry => {
    const state = store.getState();
    const drafts = useDrafts.getState().drafts;
    const base = { app: 'tenorscope' as const, id: currentId, name: currentName, stamp: `${tabId}:${++revision}`, writer: tabId, savedAt: now(), workspace: state.workspace, ...(Object.keys(drafts).length > 0 ? { drafts } : {}) };
    return withHistory ? { ...base, history: { past: state.past.slice(-SAVED_HISTORY_CAP), future: state.future.slice(-SAVED_HISTORY_CAP) } } : base;
  };
  /** Someone else saved this workspace since this tab loaded or saved it. */
  const isForeign = (cur: unknown): boolean => isPlainObject(cur) && typeof cur.stamp === 'string' && cur.stamp !== lastSeen && cur.writer !== tabId;
  const pause = (): void => {
    paused = true;
    setStorage({ state: 'paused', otherTab: true });
  };
  const armRetry = (): void => {
    if (retryTimer !== null || stopped) return;
    retryTimer = setTimeout(() => {
      retryTimer = null;
      if (dirty && !paused) void enqueue();
    }, deps.retryMs);
  };
  const save = async (): Promise<void> => {
    // A read-only document (settings this build does not know) is never written over the saved one.
    if (!backend || paused || !dirty || store.getState().readOnly) return;
    dirty = false;
    const id = currentId;
    let conflict = false;
    const write = async (entry: SavedEntry): Promise<void> =>
      backend!.update(entryKey(id), (cur) => {
        if (isForeign(cur)) {
          conflict = true;
          return KEEP;
        }
        return entry;
      });
    const full = record(true);
    const steps = (full.history?.past.length ?? 0) + (full.history?.future.length ?? 0);
    let saved: SavedEntry | null = null;
    let partialReason: string | null = null;
    try {
      await write(full);
      saved = full;
    } catch (e) {
      if (isQuotaError(e) && steps > 0) {
        // The document comes first: try it without the undo history, and say so.
        const bare = record(false);
        try {
          await write(bare);
          saved = bare;
          partialReason = errorText(e);
        } catch (e2) {
          partialReason = errorText(e2);
        }
      } else partialReason = errorText(e);
    }
    if (id !== currentId) return; // switched meanwhile: the switch saved again
    if (conflict) {
      dirty = true;
      pause();
      return;
    }
    if (!saved) {
      dirty = true;
      const last = store.getState().storage.savedAt;
      setStorage({
        state: 'memory',
        message: `Not saved: ${partialReason}. ${last ? `The last save was at ${clock(last)}; edits since then` : 'Your edits'} are only in this page. Saving is tried again on your next edit and every ${deps.retryMs / 1000} seconds.`,
      });
      armRetry();
      return;
    }
    lastSeen = saved.stamp;
    if (!list.getState().items.some((x) => x.id === id && x.savedAt !== null)) void backend.set(OPEN_KEY, id).catch(() => undefined);
    updateItem({ id, name: currentName, savedAt: saved.savedAt, workspace: saved.workspace as WorkbenchDocument, problem: null });
    post({ type: 'saved', tab: tabId, id, stamp: saved.stamp });
    if (saved.history || steps === 0) {
      setStorage({ state: dirty ? 'pending' : 'saved', message: null, savedAt: saved.savedAt });
    } else {
      dirty = true; // the history still waits for room
      setStorage({
        state: 'partial',
        savedAt: saved.savedAt,
        message: `The workspace was saved at ${clock(saved.savedAt)}, but not its undo history (${steps} steps): ${partialReason}. After a reload Undo starts afresh. Saving it is tried again on your next edit and every ${deps.retryMs / 1000} seconds.`,
      });
      armRetry();
    }
  };
  const enqueue = (): Promise<void> => {
    queue = queue.then(save, save);
    return queue;
  };
  const schedule = (): void => {
    dirty = true;
    if (!backend) return;
    const st = store.getState().storage.state;
    if (!paused && st === 'saved') setStorage({ state: 'pending' });
    if (cancelIdle) return;
    cancelIdle = deps.idle(() => {
      cancelIdle = null;
      void enqueue();
    });
  };
  const flush = (): Promise<void> => {
    if (cancelIdle) {
      cancelIdle();
      cancelIdle = null;
    }
    return enqueue();
  };
  const unsubscribeStore = store.subscribe((s, prev) => {
    if (s.workspace !== prev.workspace && !loading) schedule();
  });
  const unsubscribeDrafts = useDrafts.subscribe((s, prev) => {
    if (s.drafts !== prev.drafts && !loading) schedule();
  });
  const unsubscribe = (): void => {
    unsubscribeStore();
    unsubscribeDrafts();
  };

  // Earlier builds kept one workspace in localStorage: move it (and any copies of a damaged one) into the list.
  const migrateLegacy = async (): Promise<string | null> => {
    if (!backend || (await backend.get(MIGRATED_KEY)) === true) return null;
    const ls = deps.storage;
    if (!ls) return null;
    let raw: string | null = null;
    const copies: string[] = [];
    try {
      raw = ls.getItem(LEGACY_KEY);
      for (let i = 0; i < ls.length; i++) {
        const k = ls.key(i);
        if (k !== null && k.startsWith(LEGACY_COPY_PREFIX)) copies.push(k);
      }
    } catch {
      return null;
    }
    let openId: string | null = null;
    const records: [string, unknown][] = [];
    if (raw !== null) {
      const id = randomId();
      const { entry } = parseLegacyText(raw);
      const doc = entry ? readWorkbenchDocument(entry.workspace, makeRowId).doc : null;
      if (entry && doc) {
        records.push([entryKey(id), { ...entry, id, name: DEFAULT_NAME } satisfies Record<string, unknown>]);
        openId = id;
      } else records.push([entryKey(id), { app: 'tenorscope', id, name: 'Saved workspace (unreadable)', stamp: `legacy:${id}`, writer: 'legacy', savedAt: now(), unreadable: raw }]);
    }
    const seen = new Set(raw === null ? [] : [raw]);
    for (const k of copies) {
      const text = ls.getItem(k);
      if (text === null || seen.has(text)) continue; // identical copies are kept once
      seen.add(text);
      const id = randomId();
      const at = Number(k.slice(LEGACY_COPY_PREFIX.length));
      records.push([entryKey(id), { app: 'tenorscope', id, name: 'Unreadable copy (earlier version)', stamp: `legacy:${id}`, writer: 'legacy', savedAt: Number.isFinite(at) ? at : now(), unreadable: text }]);
    }
    try {
      for (const [k, v] of records) await backend.set(k, v);
      if (openId) await backend.set(OPEN_KEY, openId);
      await backend.set(MIGRATED_KEY, true);
    } catch {
      return null; // left where it was; tried again on the next start
    }
    try {
      ls.removeItem(LEGACY_KEY);
      for (const k of copies) ls.removeItem(k);
    } catch {
      // the copies stay behind; the list already has them
    }
    return raw !== null && openId === null ? records[0]![0].slice('entry:'.length) : null;
  };

  const readAll = async (): Promise<{ reads: ReadEntry[]; openId: string | null; raw: Map<string, unknown> }> => {
    const all = await backend!.all();
    const reads = all.filter(([k]) => k.startsWith('entry:')).map(([k, v]) => readEntry(k.slice('entry:'.length), v));
    const open = all.find(([k]) => k === OPEN_KEY)?.[1];
    return { reads, openId: typeof open === 'string' ? open : null, raw: new Map(all) };
  };
  const publishList = (reads: readonly ReadEntry[]): void => {
    const items = reads.map((r) => r.item);
    // The open workspace is listed even before its first save.
    const cur = list.getState().items.find((x) => x.id === currentId) ?? { id: currentId, name: currentName, savedAt: null, workspace: store.getState().workspace, problem: null };
    if (!items.some((x) => x.id === currentId)) items.push(cur);
    list.setState({ items: items.map((x) => (x.id === currentId ? { ...x, workspace: store.getState().workspace, name: currentName } : x)), currentId });
  };
  const refreshList = async (): Promise<void> => {
    if (!backend) return;
    try {
      publishList((await readAll()).reads);
    } catch {
      // the list stays as it was
    }
  };

  // 1. Restore.
  const restore = async (): Promise<void> => {
    const opened = await openBackend(deps.indexedDb, () => deps.storage);
    backend = opened && deps.wrapBackend ? deps.wrapBackend(opened) : opened;
    if (stopped) return;
    if (!backend) {
      setStorage({ state: 'memory', message: 'This browser gives the page no storage, so nothing can be saved.', backend: null });
      list.setState({ items: [{ id: currentId, name: currentName, savedAt: null, workspace: store.getState().workspace, problem: null }], currentId });
      return;
    }
    setStorage({ backend: backend.kind });
    const damagedLegacy = await migrateLegacy();
    const { reads, openId, raw } = await readAll();
    const readable = reads.filter((r) => r.item.workspace !== null).sort((a, b) => (b.item.savedAt ?? 0) - (a.item.savedAt ?? 0));
    const target = reads.find((r) => r.item.id === openId);
    const damaged = target && !target.item.workspace ? target : reads.find((r) => r.item.id === damagedLegacy);
    const pick = target?.item.workspace ? target : readable[0];
    const chosen = pick ? readEntry(pick.item.id, raw.get(entryKey(pick.item.id)), true) : undefined;
    if (damaged) setStorage({ corruptName: damaged.item.name, corruptReason: damaged.item.problem });
    if (chosen) {
      currentId = chosen.item.id;
      currentName = chosen.item.name;
      lastSeen = chosen.stamp;
      await loadChecked(chosen, raw.get(entryKey(chosen.item.id)));
      setStorage({ state: 'saved', savedAt: chosen.item.savedAt });
    } else {
      // A new workspace (the demo): saved on its first edit.
      currentName = reads.some((r) => r.item.name === DEFAULT_NAME) ? `${DEFAULT_NAME} (new)` : DEFAULT_NAME;
    }
    if (dirty) schedule(); // edits made while restoring
    publishList(reads);
    post({ type: 'hello', tab: tabId, id: currentId });
  };
  const ready = restore().catch((e: unknown) => {
    setStorage({ state: 'memory', message: `The saved workspaces could not be read (${e instanceof Error ? e.message : String(e)}); nothing is saved in this page.` });
  });

  // 2. Other tabs.
  const foreignSave = (stamp: string | null, writer: string | null): void => {
    if (writer === tabId || stamp === null || stamp === lastSeen) return;
    pause();
  };
  let channel: ChannelLike | null = null;
  try {
    channel = deps.openChannel?.() ?? null;
  } catch {
    channel = null;
  }
  if (channel) {
    channel.onmessage = (e) => {
      const m = e.data;
      if (!m || m.tab === tabId) return;
      if (m.type === 'hello' || m.type === 'here' || m.type === 'open') {
        peers.set(m.tab, m.id);
        if (m.type === 'hello') post({ type: 'here', tab: tabId, id: currentId });
      } else if (m.type === 'bye') peers.delete(m.tab);
      else if (m.type === 'saved') {
        if (m.id === currentId) foreignSave(m.stamp, m.tab);
        else void refreshList();
      } else if (m.type === 'list') void refreshList();
      if (store.getState().storage.otherTab !== otherTabOpen() || m.type === 'saved') setStorage({ otherTab: otherTabOpen() || paused });
    };
  }
  const onStorage = (e: Event): void => {
    // The localStorage fallback: another tab wrote this workspace's record.
    const se = e as StorageEvent;
    if (backend?.kind !== 'localStorage' || typeof se.key !== 'string' || !se.key.endsWith(entryKey(currentId))) return;
    let value: unknown = null;
    try {
      value = JSON.parse(se.newValue ?? 'null');
    } catch {
      value = null;
    }
    if (isPlainObject(value)) foreignSave(typeof value.stamp === 'string' ? value.stamp : null, typeof value.writer === 'string' ? value.writer : null);
  };
  const onPageHide = (): void => {
    void flush();
    post({ type: 'bye', tab: tabId });
  };
  deps.target?.addEventListener('storage', onStorage);
  deps.target?.addEventListener('pagehide', onPageHide);


  const controller: Controller = {
    async resolve(choice) {
      await ready;
      if (!backend) return;
      const r = readEntry(currentId, await backend.get(entryKey(currentId)));
      paused = false;
      if (choice === 'load' && r.item.workspace) {
        lastSeen = r.stamp;
        dirty = false;
        loading = true;
        try {
          store.getState().replaceWorkspace(r.item.workspace, 'load the other tab’s version');
        } finally {
          loading = false;
        }
        setStorage({ state: 'saved', message: null, savedAt: r.item.savedAt });
        updateItem({ ...r.item, name: currentName });
      } else {
        lastSeen = r.stamp ?? lastSeen;
        dirty = true;
        await enqueue();
      }
    },
    flush,
    async switchTo(id) {
      await ready;
      if (!backend || id === currentId) return id === currentId;
      if (paused) {
        list.setState({ notice: 'Saving is paused (another tab saved this workspace): choose which version to keep before opening another.' });
        return false;
      }
      await flush();
      if (store.getState().storage.state === 'memory') {
        list.setState({ notice: 'The open workspace could not be saved, so it stays open: export it or free some storage first.' });
        return false;
      }
      const value = await backend.get(entryKey(id));
      const r = readEntry(id, value, true);
      if (!r.item.workspace) {
        list.setState({ notice: 'That workspace could not be opened.' });
        return false;
      }
      // Which workspace a reload opens is written before the screen shows the switch, so a reload
      // straight after it opens what the user sees.
      await backend.set(OPEN_KEY, id).catch(() => undefined);
      currentId = id;
      currentName = r.item.name;
      lastSeen = r.stamp;
      dirty = false;
      await loadChecked(r, value);
      setStorage({ state: 'saved', message: null, savedAt: r.item.savedAt, otherTab: false });
      list.setState({ currentId: id, notice: null });
      updateItem({ ...r.item });
      post({ type: 'open', tab: tabId, id });
      setStorage({ otherTab: otherTabOpen() });
      return true;
    },
    async create(doc, name) {
      await ready;
      const previousId = currentId;
      const previousName = currentName;
      if (backend && !paused) await flush();
      const wasSaved = lastSeen !== null;
      const keepPrevious = backend !== null && !paused && store.getState().storage.state !== 'memory';
      if (!keepPrevious) {
        // The open workspace is not safely saved: open the new one in its place, one Undo away.
        store.getState().replaceWorkspace(doc, name);
        return { mode: 'replaced', previousId: null, previousName: null };
      }
      currentId = randomId();
      currentName = name;
      lastSeen = null;
      loadIntoStore(doc, { past: [], future: [] });
      list.setState({ currentId, notice: null, items: wasSaved ? list.getState().items : list.getState().items.filter((x) => x.id !== previousId) });
      updateItem({ id: currentId, name, savedAt: null, workspace: doc, problem: null });
      setStorage({ otherTab: false });
      post({ type: 'open', tab: tabId, id: currentId });
      dirty = true;
      await enqueue();
      await backend!.set(OPEN_KEY, currentId).catch(() => undefined);
      post({ type: 'list', tab: tabId });
      // Nothing to go back to when the workspace shown before was the demo, never edited or saved.
      return { mode: 'entry', previousId: wasSaved ? previousId : null, previousName: wasSaved ? previousName : null };
    },
    async rename(id, name) {
      await ready;
      const clean = name.trim().slice(0, 120);
      if (!backend || clean === '') return;
      if (id === currentId) {
        currentName = clean;
        const item = list.getState().items.find((x) => x.id === id);
        if (item) updateItem({ ...item, name: clean });
        schedule();
        return;
      }
      try {
        await backend.update(entryKey(id), (cur) => (isPlainObject(cur) ? { ...cur, name: clean } : KEEP));
      } catch (e) {
        list.setState({ notice: `The new name was not saved: ${errorText(e)}.` });
        return;
      }
      await refreshList();
      post({ type: 'list', tab: tabId });
    },
    async remove(id) {
      await ready;
      if (!backend || id === currentId) return;
      const value = await backend.get(entryKey(id));
      const name = list.getState().items.find((x) => x.id === id)?.name ?? 'workspace';
      await backend.del(entryKey(id));
      // The entry leaves the list in the same step that says it was deleted (never "deleted" beside it).
      list.setState({ deleted: { id, name, record: value }, notice: null, items: list.getState().items.filter((x) => x.id !== id) });
      await refreshList();
      post({ type: 'list', tab: tabId });
    },
    async undoRemove() {
      await ready;
      const d = list.getState().deleted;
      if (!backend || !d) return;
      try {
        await backend.set(entryKey(d.id), d.record);
      } catch (e) {
        list.setState({ notice: `“${d.name}” could not be put back: ${errorText(e)}.` });
        return;
      }
      await refreshList();
      list.setState({ deleted: null });
      post({ type: 'list', tab: tabId });
    },
    async records() {
      await ready;
      // Saved workspaces, and the records kept aside as they were saved (restored with changes).
      const out = backend ? (await backend.all()).filter(([k]) => k.startsWith('entry:') || k.startsWith('kept:')) : [];
      const current: [string, unknown] = [entryKey(currentId), { ...record(true), savedAt: store.getState().storage.savedAt ?? now() }];
      return [...out.filter(([k]) => k !== current[0]), current];
    },
    async add(items) {
      await ready;
      if (!backend) return 0;
      let n = 0;
      for (const it of items) {
        const id = randomId();
        const entry: SavedEntry = { app: 'tenorscope', id, name: it.name.trim().slice(0, 120) || 'Imported workspace', stamp: `${tabId}:${++revision}`, writer: tabId, savedAt: now(), workspace: it.workspace };
        try {
          await backend.set(entryKey(id), entry);
          n++;
        } catch (e) {
          list.setState({ notice: `Imported ${n} of ${items.length} workspaces; the rest were not saved: ${errorText(e)}.` });
          break;
        }
      }
      await refreshList();
      post({ type: 'list', tab: tabId });
      return n;
    },
    stop() {
      void flush();
      stopped = true;
      if (retryTimer !== null) clearTimeout(retryTimer);
      unsubscribe();
      deps.target?.removeEventListener('storage', onStorage);
      deps.target?.removeEventListener('pagehide', onPageHide);
      post({ type: 'bye', tab: tabId });
      channel?.close();
      if (active === controller) active = null;
    },
  };
  active = controller;
  return { ready, stop: () => controller.stop() };
}
