import { depthProblem, readWorkbenchDocument, type WorkbenchDocument } from '../core/index.ts';
import { demoWorkspace } from './demoWorkspace.ts';
import { makeRowId } from './ids.ts';
import { checkRestoredWorkspace } from './restoreCheck.ts';
import { useAppStore } from './store.ts';

/** Undo and redo steps kept with the saved workspace (each way), so both survive a reload. */
export const SAVED_HISTORY_CAP = 50;

/** Where the workspace is kept in the browser (localStorage). */
export const STORAGE_KEY = 'tenorscope.workspace';
/** Unreadable saved entries are copied under this prefix plus a time stamp before anything replaces them. */
export const UNREADABLE_PREFIX = 'tenorscope.workspace.unreadable.';
/** A saved entry not restored exactly as saved (over a cap, rows that were not rows, unknown settings) is kept whole under this prefix plus its stamp. */
export const KEPT_PREFIX = 'tenorscope.workspace.kept.';
export const CHANNEL_NAME = 'tenorscope.workspace';
/** An edit is saved this long after the last change (well within the 300 ms promised). */
export const SAVE_DELAY_MS = 200;

interface SavedEntry {
  readonly app: 'tenorscope';
  /** Who wrote it and which save it was: `tabId:n`. */
  readonly stamp: string;
  readonly writer: string;
  readonly savedAt: number;
  readonly workspace: WorkbenchDocument;
  /** The newest undo steps (oldest first) and redo steps (next redo last), at most SAVED_HISTORY_CAP each. */
  readonly history?: { readonly past: readonly unknown[]; readonly future: readonly unknown[] };
}

type Message = { type: 'hello' | 'here' | 'bye'; tab: string } | { type: 'saved'; tab: string; stamp: string };

interface ChannelLike {
  postMessage(m: Message): void;
  close(): void;
  onmessage: ((e: { data: Message }) => void) | null;
}

export interface PersistenceDeps {
  readonly storage: Pick<Storage, 'getItem' | 'setItem'> | null;
  readonly openChannel: (() => ChannelLike) | null;
  /** The page, for `pagehide` and `storage` events. */
  readonly target: Pick<Window, 'addEventListener' | 'removeEventListener'> | null;
  readonly now: () => number;
  readonly tabId: string;
}

export function browserDeps(): PersistenceDeps {
  let storage: Storage | null = null;
  try {
    storage = window.localStorage;
  } catch {
    storage = null;
  }
  const BC = (globalThis as { BroadcastChannel?: new (name: string) => ChannelLike }).BroadcastChannel;
  return {
    storage,
    openChannel: BC ? () => new BC(CHANNEL_NAME) : null,
    target: window,
    now: () => Date.now(),
    tabId: `t${Math.floor(Math.random() * 36 ** 6).toString(36)}`,
  };
}

const isQuotaError = (e: unknown): boolean =>
  e instanceof Error && (e.name === 'QuotaExceededError' || e.name === 'NS_ERROR_DOM_QUOTA_REACHED' || /quota/i.test(e.message));

interface Controller {
  resolve(choice: 'load' | 'keep'): void;
  flush(): void;
  stop(): void;
}
let active: Controller | null = null;

/** The user's answer when another tab saved a different version: load it, or keep this one and save it. */
export function resolveConflict(choice: 'load' | 'keep'): void {
  active?.resolve(choice);
}
/** Saves now if a save is waiting (tests and page hide). */
export function flushSave(): void {
  active?.flush();
}

/**
 * Restores the saved workspace and keeps saving it: within SAVE_DELAY_MS of an edit and on page
 * hide. Never overwrites another tab's save silently: a save by someone else since this tab last
 * loaded or saved pauses saving until the user chooses. A full quota is reported and the work
 * stays in memory. An unreadable entry is copied aside, reported, and the demo opens.
 */
export function startPersistence(deps: PersistenceDeps = browserDeps()): () => void {
  active?.stop();
  const { storage, now, tabId } = deps;
  const store = useAppStore;
  const setStorage = (patch: Parameters<ReturnType<typeof store.getState>['setStorage']>[0]): void => store.getState().setStorage(patch);
  let revision = 0;
  /** The stamp of the saved entry this tab last loaded or wrote. */
  let lastSeen: string | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let paused = false;

  const readRaw = (): string | null => {
    try {
      return storage?.getItem(STORAGE_KEY) ?? null;
    } catch {
      return null;
    }
  };
  const parseEntry = (raw: string | null): { entry: SavedEntry | null; doc: WorkbenchDocument | null; problem: string | null } => {
    if (raw === null) return { entry: null, doc: null, problem: null };
    let json: unknown;
    try {
      json = JSON.parse(raw);
    } catch {
      return { entry: null, doc: null, problem: 'it is not valid JSON' };
    }
    const entry = json as Partial<SavedEntry> | null;
    if (!entry || typeof entry !== 'object' || entry.app !== 'tenorscope' || typeof entry.stamp !== 'string') {
      return { entry: null, doc: null, problem: 'it is not a Tenorscope save' };
    }
    const { doc, problem } = readWorkbenchDocument(entry.workspace, makeRowId);
    return { entry: entry as SavedEntry, doc, problem };
  };

  /** The saved undo/redo steps, or none if any step is unreadable (the workspace itself still loads; `lost` says so). */
  const readHistory = (entry: SavedEntry): { past: WorkbenchDocument[]; future: WorkbenchDocument[]; lost?: true } => {
    const h = entry.history;
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
  };

  // 1. Restore (checked against the caps every way in shares; see restoreCheck.ts).
  const raw = readRaw();
  const first = parseEntry(raw);
  const check = first.entry ? checkRestoredWorkspace(first.entry.workspace) : null;
  if (first.entry && check?.doc) {
    const history = readHistory(first.entry);
    const notes = history.lost ? [...check.notes, 'a step of the saved undo history could not be read, so undo starts afresh'] : check.notes;
    if (check.unknowns.length === 0 && notes.length === 0) {
      store.setState({ workspace: check.doc, past: history.past, future: history.future, lastEditKey: null });
    } else {
      // Not restored exactly as saved: the whole entry is kept aside first, and the user is told.
      const keptKey = `${KEPT_PREFIX}${first.entry.stamp}`;
      let kept: string | null = keptKey;
      try {
        if (storage?.getItem(keptKey) !== raw) storage?.setItem(keptKey, raw!);
      } catch {
        kept = null;
      }
      if (check.unknowns.length > 0) store.getState().openReadOnly(check.doc, check.unknowns, 'saved', demoWorkspace(makeRowId));
      else store.setState({ workspace: check.doc, past: check.notes.length === 0 ? history.past : [], future: check.notes.length === 0 ? history.future : [], lastEditKey: null });
      setStorage({ restoreNotes: notes, keptCopyKey: kept });
    }
    lastSeen = first.entry.stamp;
    setStorage({ state: 'saved', savedAt: first.entry.savedAt });
  } else if (raw !== null) {
    const copyKey = `${UNREADABLE_PREFIX}${now()}`;
    let kept: string | null = copyKey;
    try {
      storage?.setItem(copyKey, raw);
    } catch {
      kept = null;
    }
    setStorage({ corruptReason: first.problem ?? check?.problem ?? 'unknown problem', corruptCopyKey: kept });
  }
  if (!storage) setStorage({ state: 'memory', message: 'This browser gives the page no storage.' });

  // 2. Save.
  const save = (): void => {
    timer = null;
    // A read-only document (settings this build does not know) is never written over the saved one.
    if (!storage || paused || store.getState().readOnly) return;
    const current = parseEntry(readRaw()).entry;
    if (current && current.writer !== tabId && current.stamp !== lastSeen) {
      paused = true;
      setStorage({ state: 'paused', otherTab: true });
      return;
    }
    const stamp = `${tabId}:${++revision}`;
    const savedAt = now();
    const state = store.getState();
    const history = { past: state.past.slice(-SAVED_HISTORY_CAP), future: state.future.slice(-SAVED_HISTORY_CAP) };
    const entry: SavedEntry = { app: 'tenorscope', stamp, writer: tabId, savedAt, workspace: state.workspace, history };
    try {
      try {
        storage.setItem(STORAGE_KEY, JSON.stringify(entry));
      } catch (e) {
        // Storage too full for the history: the workspace itself comes first.
        if (!isQuotaError(e)) throw e;
        const { history: _dropped, ...bare } = entry;
        storage.setItem(STORAGE_KEY, JSON.stringify(bare));
      }
    } catch (e) {
      const message = isQuotaError(e) ? 'Browser storage is full (quota exceeded).' : `The browser refused to store the workspace (${e instanceof Error ? e.message : String(e)}).`;
      setStorage({ state: 'memory', message });
      return;
    }
    lastSeen = stamp;
    setStorage({ state: 'saved', message: null, savedAt });
    channel?.postMessage({ type: 'saved', tab: tabId, stamp });
  };
  const schedule = (): void => {
    if (timer !== null) clearTimeout(timer);
    if (!paused && store.getState().storage.state !== 'pending') setStorage({ state: storage ? (store.getState().storage.state === 'memory' ? 'memory' : 'pending') : 'memory' });
    timer = setTimeout(save, SAVE_DELAY_MS);
  };
  const unsubscribe = store.subscribe((s, prev) => {
    if (s.workspace !== prev.workspace) schedule();
  });
  const flush = (): void => {
    if (timer !== null) {
      clearTimeout(timer);
      save();
    }
  };

  // 3. Other tabs.
  const foreignSave = (stamp: string | null, writer: string | null): void => {
    if (writer === tabId || stamp === null || stamp === lastSeen) return;
    paused = true;
    setStorage({ state: 'paused', otherTab: true });
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
      if (m.type === 'hello') {
        setStorage({ otherTab: true });
        channel?.postMessage({ type: 'here', tab: tabId });
      } else if (m.type === 'here') setStorage({ otherTab: true });
      else if (m.type === 'bye') setStorage({ otherTab: false });
      else if (m.type === 'saved') foreignSave(m.stamp, m.tab);
    };
    channel.postMessage({ type: 'hello', tab: tabId });
  }
  const onStorage = (e: Event): void => {
    const se = e as StorageEvent;
    if (se.key !== STORAGE_KEY) return;
    const entry = parseEntry(se.newValue).entry;
    setStorage({ otherTab: true });
    foreignSave(entry?.stamp ?? null, entry?.writer ?? null);
  };
  const onPageHide = (): void => {
    flush();
    channel?.postMessage({ type: 'bye', tab: tabId });
  };
  deps.target?.addEventListener('storage', onStorage);
  deps.target?.addEventListener('pagehide', onPageHide);

  const controller: Controller = {
    resolve(choice) {
      const { entry, doc } = parseEntry(readRaw());
      paused = false;
      if (choice === 'load' && entry && doc) {
        lastSeen = entry.stamp;
        if (timer !== null) clearTimeout(timer);
        store.getState().replaceWorkspace(doc, 'load the other tab’s version');
        if (timer !== null) clearTimeout(timer);
        timer = null;
        setStorage({ state: 'saved', savedAt: entry.savedAt });
      } else {
        lastSeen = entry?.stamp ?? lastSeen;
        save();
      }
    },
    flush,
    stop() {
      flush();
      unsubscribe();
      deps.target?.removeEventListener('storage', onStorage);
      deps.target?.removeEventListener('pagehide', onPageHide);
      channel?.close();
      if (active === controller) active = null;
    },
  };
  active = controller;
  return () => controller.stop();
}
