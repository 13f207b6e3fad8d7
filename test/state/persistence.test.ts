// The saved workspaces against an in-memory IndexedDB (fake-indexeddb, which implements the W3C
// Indexed Database API) and a localStorage double: saved at the next idle moment after an edit
// and on page hide, restored on start, kept as a list (a link opens as a new entry), moved from
// the earlier single localStorage entry, a full quota reported exactly (document saved, history
// not) and retried, an unreadable entry left unchanged and described by its cause, and another
// tab's save never silently overwritten.
import { MemoryStorage } from '../helpers/memoryStorage.ts';
import { IDBFactory } from 'fake-indexeddb';
import {
  DEFAULT_NAME,
  deleteWorkspace,
  entryKey,
  flushSave,
  LEGACY_COPY_PREFIX,
  LEGACY_KEY,
  openAsNewWorkspace,
  OPEN_KEY,
  renameWorkspace,
  resolveConflict,
  SAVE_DELAY_MS,
  SAVED_HISTORY_CAP,
  startPersistence,
  switchWorkspace,
  undoDelete,
  type PersistenceDeps,
} from '../../src/state/persistence.ts';
import { setFieldDraft, useDrafts } from '../../src/state/drafts.ts';
import { useAppStore } from '../../src/state/store.ts';
import { indexedDbBackend, KEEP, LOCAL_PREFIX, type WorkspaceBackend } from '../../src/state/workspaceBackend.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';

const initial = useAppStore.getInitialState();
const initialList = useWorkspaceList.getInitialState();


class EventTargetDouble {
  listeners = new Map<string, Set<(e: Event) => void>>();
  addEventListener(type: string, l: (e: Event) => void): void {
    if (!this.listeners.has(type)) this.listeners.set(type, new Set());
    this.listeners.get(type)!.add(l);
  }
  removeEventListener(type: string, l: (e: Event) => void): void {
    this.listeners.get(type)?.delete(l);
  }
  dispatch(type: string, e: object): void {
    for (const l of this.listeners.get(type) ?? []) l(e as Event);
  }
}

/** A quota: writes whose JSON is longer than `limit` characters fail as the browser fails them. */
const quota = { limit: Infinity };
const quotaError = (): DOMException => new DOMException('The quota has been exceeded.', 'QuotaExceededError');
const limited = (b: WorkspaceBackend): WorkspaceBackend => ({
  ...b,
  set: async (k, v) => {
    if (JSON.stringify(v).length > quota.limit) throw quotaError();
    return b.set(k, v);
  },
  update: async (k, change) => {
    const next = change(await b.get(k));
    if (next === KEEP) return;
    if (JSON.stringify(next).length > quota.limit) throw quotaError();
    await b.set(k, next);
  },
});

let stop: (() => void) | null = null;
const start = async (opts: { storage?: MemoryStorage; target?: EventTargetDouble; tabId?: string; indexedDb?: boolean; retryMs?: number } = {}): Promise<EventTargetDouble> => {
  const target = opts.target ?? new EventTargetDouble();
  const deps: PersistenceDeps = {
    indexedDb: opts.indexedDb ?? true,
    storage: opts.storage ?? new MemoryStorage(),
    openChannel: null,
    target: target as unknown as Window,
    now: () => 1_000,
    tabId: opts.tabId ?? 'tabA',
    idle: (save) => {
      const h = setTimeout(save, 0);
      return () => clearTimeout(h);
    },
    retryMs: opts.retryMs ?? 60_000,
    wrapBackend: limited,
  };
  const p = startPersistence(deps);
  stop = p.stop;
  await p.ready;
  return target;
};
/** Ends this "tab" and starts from a fresh store, as a reload does. */
const reload = async (opts: Parameters<typeof start>[0] = {}): Promise<EventTargetDouble> => {
  await flushSave();
  stop?.();
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(initialList, true);
  useDrafts.setState({ drafts: {} });
  return start({ tabId: 'tabB', ...opts });
};
const s = () => useAppStore.getState();
const db = () => indexedDbBackend();
const currentRecord = async (): Promise<Record<string, unknown>> => (await db().get(entryKey(useWorkspaceList.getState().currentId!))) as Record<string, unknown>;
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeEach(() => {
  // A new, empty database for every test.
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
  quota.limit = Infinity;
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(initialList, true);
});
afterEach(() => {
  stop?.();
  stop = null;
});

describe('startPersistence: saving and restoring', () => {
  it('saves within SAVE_DELAY_MS of an edit, with its undo step, and a fresh start restores both', async () => {
    await start();
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.99');
    await wait(SAVE_DELAY_MS);
    const saved = await currentRecord();
    expect((saved.workspace as { quotes: { rate: string }[] }).quotes[0]!.rate).toBe('4.99');
    expect(s().storage.state).toBe('saved');
    expect(s().storage.backend).toBe('indexeddb');
    await reload();
    expect(s().workspace.quotes[0]!.rate).toBe('4.99');
    expect(s().past).toHaveLength(1);
    s().undo();
    expect(s().workspace.quotes[0]!.rate).not.toBe('4.99');
    s().redo();
    expect(s().workspace.quotes[0]!.rate).toBe('4.99');
  });

  it('keeps at most SAVED_HISTORY_CAP undo steps, and drops a damaged history but not the workspace', async () => {
    await start();
    for (let i = 0; i < SAVED_HISTORY_CAP + 10; i++) {
      s().setCell(s().workspace.quotes[0]!.id, 'rate', `4.${i}`);
      s().endEdit();
    }
    await flushSave();
    const saved = await currentRecord();
    const history = saved.history as { past: unknown[] };
    expect(history.past).toHaveLength(SAVED_HISTORY_CAP);
    history.past[3] = { nonsense: true };
    await db().set(entryKey(saved.id as string), saved);
    await reload();
    expect(s().workspace.quotes[0]!.rate).toBe(`4.${SAVED_HISTORY_CAP + 9}`);
    expect(s().past).toHaveLength(0);
  });

  it('text typed into a field but not committed (a draft) is saved at the next idle moment and restored', async () => {
    await start();
    setFieldDraft('roll:Amount', '2500000');
    await wait(SAVE_DELAY_MS);
    expect((await currentRecord()).drafts).toEqual({ 'roll:Amount': '2500000' });
    await reload();
    expect(useDrafts.getState().drafts).toEqual({ 'roll:Amount': '2500000' });
  });

  it('saves at once on pagehide', async () => {
    const target = await start();
    s().setRowEnabled(s().workspace.quotes[1]!.id, false);
    target.dispatch('pagehide', {});
    await flushSave();
    expect(((await currentRecord()).workspace as { quotes: { enabled: boolean }[] }).quotes[1]!.enabled).toBe(false);
  });

  it('falls back to localStorage when the browser has no IndexedDB', async () => {
    const storage = new MemoryStorage();
    await start({ storage, indexedDb: false });
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.44');
    await flushSave();
    expect(s().storage.backend).toBe('localStorage');
    const id = useWorkspaceList.getState().currentId!;
    expect(storage.getItem(LOCAL_PREFIX + entryKey(id))).toContain('4.44');
    await reload({ storage, indexedDb: false });
    expect(s().workspace.quotes[0]!.rate).toBe('4.44');
  });
});

describe('startPersistence: the list of workspaces', () => {
  it('a link opened as a new workspace keeps the user’s own, which one switch brings back', async () => {
    await start();
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '3.33');
    await flushSave();
    const ownId = useWorkspaceList.getState().currentId!;
    const shared = { ...s().workspace, note: 'from a colleague' };
    const back = await openAsNewWorkspace(shared, 'Shared workspace');
    expect(back).toEqual({ mode: 'entry', previousId: ownId, previousName: DEFAULT_NAME });
    expect(s().workspace.note).toBe('from a colleague');
    expect(s().past).toHaveLength(0);
    // Both are saved; the user's own is unchanged.
    const own = (await db().get(entryKey(ownId))) as { workspace: { quotes: { rate: string }[]; note?: string } };
    expect(own.workspace.quotes[0]!.rate).toBe('3.33');
    expect(own.workspace.note).toBeUndefined();
    expect(useWorkspaceList.getState().items.map((x) => x.name).sort()).toEqual([DEFAULT_NAME, 'Shared workspace']);
    // A reload opens the one opened last; switching brings the own one back with its history.
    await reload();
    expect(s().workspace.note).toBe('from a colleague');
    expect(await switchWorkspace(ownId)).toBe(true);
    expect(s().workspace.quotes[0]!.rate).toBe('3.33');
    expect(s().past).toHaveLength(1);
  });

  it('a switch is recorded as the one to reopen before the screen shows it (a reload straight after opens it)', async () => {
    // The localStorage form of the list, read synchronously at the moment the document changes.
    const storage = new MemoryStorage();
    await start({ storage, indexedDb: false });
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '3.21');
    await flushSave();
    const ownId = useWorkspaceList.getState().currentId!;
    await openAsNewWorkspace({ ...s().workspace, note: 'shared' }, 'Shared workspace');
    const seen: unknown[] = [];
    const unsubscribe = useAppStore.subscribe((state, prev) => {
      if (state.workspace !== prev.workspace) seen.push(JSON.parse(storage.getItem(LOCAL_PREFIX + OPEN_KEY) ?? 'null'));
    });
    expect(await switchWorkspace(ownId)).toBe(true);
    unsubscribe();
    expect(seen).toEqual([ownId]);
  });

  it('a link opened over the untouched demo (never saved) leaves nothing behind to go back to', async () => {
    await start();
    expect(useWorkspaceList.getState().items.map((x) => x.savedAt)).toEqual([null]); // listed before its first save
    const back = await openAsNewWorkspace({ ...s().workspace, note: 'shared' }, 'Shared workspace');
    expect(back).toEqual({ mode: 'entry', previousId: null, previousName: null });
    expect(useWorkspaceList.getState().items.map((x) => x.name)).toEqual(['Shared workspace']);
    expect((await db().all()).filter(([k]) => k.startsWith('entry:'))).toHaveLength(1);
  });

  it('renames, deletes with undo, and never deletes the open workspace', async () => {
    await start();
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '3.1');
    await flushSave();
    const firstId = useWorkspaceList.getState().currentId!;
    await openAsNewWorkspace({ ...s().workspace }, 'Second');
    await renameWorkspace(firstId, 'Desk view');
    expect(((await db().get(entryKey(firstId))) as { name: string }).name).toBe('Desk view');
    await deleteWorkspace(useWorkspaceList.getState().currentId!);
    expect(useWorkspaceList.getState().items).toHaveLength(2);
    await deleteWorkspace(firstId);
    expect(await db().get(entryKey(firstId))).toBeUndefined();
    expect(useWorkspaceList.getState().items.map((x) => x.name)).toEqual(['Second']);
    await undoDelete();
    expect(((await db().get(entryKey(firstId))) as { name: string }).name).toBe('Desk view');
    expect(useWorkspaceList.getState().items.map((x) => x.name).sort()).toEqual(['Desk view', 'Second']);
  });
});

describe('startPersistence: moving the earlier saved workspace into the list', () => {
  it('the workspace and its history saved by an earlier build open as the first entry; the old key is freed', async () => {
    const storage = new MemoryStorage();
    const doc = { ...s().workspace, note: 'kept from before' };
    const past = [{ ...s().workspace, note: 'one step back' }];
    storage.setItem(LEGACY_KEY, JSON.stringify({ app: 'tenorscope', stamp: 'old:3', writer: 'old', savedAt: 500, workspace: doc, history: { past, future: [] } }));
    await start({ storage });
    expect(s().workspace.note).toBe('kept from before');
    expect(s().past).toHaveLength(1);
    expect(useWorkspaceList.getState().items).toHaveLength(1);
    expect(storage.getItem(LEGACY_KEY)).toBeNull();
    expect(await db().get(OPEN_KEY)).toBe(useWorkspaceList.getState().currentId);
    // Only once: a second start does not move anything again.
    await reload({ storage });
    expect(useWorkspaceList.getState().items).toHaveLength(1);
  });

  it('copies of a damaged entry piled up by an earlier build are kept once each, in the database', async () => {
    const storage = new MemoryStorage();
    const bad = '{"app":"tenorscope","stamp":"x:1","workspace":{"quotes":[{"kind":"swap"';
    storage.setItem(LEGACY_KEY, bad);
    for (const t of [1, 2, 3]) storage.setItem(`${LEGACY_COPY_PREFIX}${t}`, bad);
    await start({ storage });
    expect([...storage.map.keys()].filter((k) => k.startsWith('tenorscope.workspace'))).toEqual([]);
    const items = useWorkspaceList.getState().items;
    const unreadable = items.filter((x) => x.problem !== null);
    expect(unreadable).toHaveLength(1);
    expect(unreadable[0]!.problem).toMatch(/not valid JSON/);
    expect(((await db().get(entryKey(unreadable[0]!.id))) as { unreadable: string }).unreadable).toBe(bad);
    expect(s().storage.corruptReason).toMatch(/not valid JSON/);
  });
});

describe('startPersistence: a full quota', () => {
  it('saves the workspace without its history, says exactly that, and never says "saved"; retried on a timer', async () => {
    await start({ retryMs: 100 });
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.1');
    await flushSave();
    const bareSize = JSON.stringify(await currentRecord()).length;
    quota.limit = bareSize + 200; // room for the document, not for its undo steps
    for (let i = 0; i < 5; i++) {
      s().setCell(s().workspace.quotes[0]!.id, 'rate', `4.2${i}`);
      s().endEdit();
    }
    await flushSave();
    expect(s().storage.state).toBe('partial');
    expect(s().storage.message).toMatch(/saved at .*, but not its undo history \(5 steps\): browser storage is full/);
    const saved = await currentRecord();
    expect((saved.workspace as { quotes: { rate: string }[] }).quotes[0]!.rate).toBe('4.24');
    expect(saved.history).toBeUndefined();
    // Space is freed: the timer saves the history without another edit.
    quota.limit = Infinity;
    await vi.waitFor(async () => expect(((await currentRecord()).history as { past: unknown[] } | undefined)?.past).toHaveLength(5), { timeout: 2000 });
    await vi.waitFor(() => expect(s().storage.state).toBe('saved'));
  });

  it('nothing fits: reports that the edits are only in this page, keeps them, and saves on the next edit once there is room', async () => {
    await start({ retryMs: 60_000 });
    quota.limit = 10;
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.5');
    await flushSave();
    expect(s().storage.state).toBe('memory');
    expect(s().storage.message).toMatch(/Not saved: browser storage is full \(quota exceeded\)/);
    expect(s().workspace.quotes[0]!.rate).toBe('4.5');
    quota.limit = Infinity;
    s().setCell(s().workspace.quotes[1]!.id, 'rate', '4.6');
    await flushSave();
    expect(s().storage.state).toBe('saved');
    expect((((await currentRecord()).workspace) as { quotes: { rate: string }[] }).quotes[0]!.rate).toBe('4.5');
  });
});

describe('startPersistence: unreadable entries', () => {
  const damagedCases: [string, unknown, RegExp][] = [
    ['a newer version', { format: 'tenorscope-workbench', version: 2, quotes: [] }, /newer version of Tenorscope \(workspace version 2; this one reads version 1\)/],
    ['an empty shape', {}, /it is empty/],
  ];
  it.each(damagedCases)('an entry of %s: says so (not "another tab"), opens a new workspace, and never writes over it', async (_, workspace, reason) => {
    const record = { app: 'tenorscope', id: 'dmg', name: 'Old desk', stamp: 'other:9', writer: 'other', savedAt: 5, workspace };
    await db().set(entryKey('dmg'), record);
    await db().set(OPEN_KEY, 'dmg');
    await start();
    expect(s().storage.corruptName).toBe('Old desk');
    expect(s().storage.corruptReason).toMatch(reason);
    expect(s().workspace.quotes.length).toBeGreaterThan(10); // the demo
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.3');
    await flushSave();
    expect(s().storage.state).toBe('saved');
    expect(await db().get(entryKey('dmg'))).toEqual(record);
    expect(useWorkspaceList.getState().currentId).not.toBe('dmg');
  });

  it('a damaged entry of 3 million characters is left whole after edits (no copy is needed)', async () => {
    const big = `{"app":"tenorscope","note":"${'x'.repeat(3_000_000)}`; // cut short
    const storage = new MemoryStorage();
    storage.setItem(LEGACY_KEY, big);
    await start({ storage });
    const id = useWorkspaceList.getState().items.find((x) => x.problem)!.id;
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.4');
    await flushSave();
    await reload({ storage });
    expect(((await db().get(entryKey(id))) as { unreadable: string }).unreadable).toBe(big);
    const all = await db().all();
    expect(all.filter(([k]) => k.startsWith('entry:'))).toHaveLength(2);
  });
});

describe('startPersistence: two tabs', () => {
  it('another tab’s save of the same workspace pauses saving here instead of overwriting it; the user then chooses', async () => {
    const storage = new MemoryStorage();
    const target = await start({ storage, indexedDb: false });
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.1');
    await flushSave();
    const key = LOCAL_PREFIX + entryKey(useWorkspaceList.getState().currentId!);
    const theirs = JSON.parse(storage.getItem(key)!);
    theirs.stamp = 'tabZ:7';
    theirs.writer = 'tabZ';
    theirs.workspace.quotes[0].rate = '9.9';
    const theirText = JSON.stringify(theirs);
    storage.setItem(key, theirText);
    target.dispatch('storage', { key, newValue: theirText });
    expect(s().storage.state).toBe('paused');
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.2');
    await flushSave();
    expect(storage.getItem(key)).toBe(theirText);
    await resolveConflict('load');
    expect(s().workspace.quotes[0]!.rate).toBe('9.9');
    expect(s().storage.state).toBe('saved');
    s().undo();
    expect(s().workspace.quotes[0]!.rate).toBe('4.2');
  });

  it('a save by another tab found at write time (no message seen) also pauses; "keep" then saves this one', async () => {
    await start();
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.2');
    await flushSave();
    const id = useWorkspaceList.getState().currentId!;
    await db().set(entryKey(id), { app: 'tenorscope', id, name: 'x', stamp: 'tabQ:1', writer: 'tabQ', savedAt: 5, workspace: s().workspace });
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.3');
    await flushSave();
    expect(s().storage.state).toBe('paused');
    expect(((await db().get(entryKey(id))) as { writer: string }).writer).toBe('tabQ');
    await resolveConflict('keep');
    expect((((await db().get(entryKey(id))) as { workspace: { quotes: { rate: string }[] } }).workspace.quotes[0]!.rate)).toBe('4.3');
  });
});
