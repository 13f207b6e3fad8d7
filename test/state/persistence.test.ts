// Autosave and restore against a storage double: saved within 300 ms of an edit and on page
// hide, restored on start, a full quota reported with the work kept in memory, an unreadable
// entry copied aside, and another tab's save never silently overwritten.
import { flushSave, resolveConflict, SAVED_HISTORY_CAP, startPersistence, STORAGE_KEY, UNREADABLE_PREFIX, type PersistenceDeps } from '../../src/state/persistence.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();

class MemoryStorage {
  map = new Map<string, string>();
  full = false;
  getItem(k: string): string | null {
    return this.map.get(k) ?? null;
  }
  setItem(k: string, v: string): void {
    if (this.full) {
      const e = new Error('The quota has been exceeded.');
      e.name = 'QuotaExceededError';
      throw e;
    }
    this.map.set(k, v);
  }
}

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

let stop: (() => void) | null = null;
const start = (storage: MemoryStorage, target = new EventTargetDouble(), tabId = 'tabA'): EventTargetDouble => {
  const deps: PersistenceDeps = { storage, openChannel: null, target: target as unknown as Window, now: () => 1_000, tabId };
  stop = startPersistence(deps);
  return target;
};
const s = () => useAppStore.getState();

beforeEach(() => {
  vi.useFakeTimers();
  useAppStore.setState(initial, true);
});
afterEach(() => {
  stop?.();
  stop = null;
  vi.useRealTimers();
});

describe('startPersistence', () => {
  it('saves within 300 ms of an edit, and a fresh start restores it', () => {
    const storage = new MemoryStorage();
    start(storage);
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.99');
    expect(storage.getItem(STORAGE_KEY)).toBeNull();
    vi.advanceTimersByTime(300);
    expect(JSON.parse(storage.getItem(STORAGE_KEY)!).workspace.quotes[0].rate).toBe('4.99');
    expect(s().storage.state).toBe('saved');
    stop!();
    useAppStore.setState(initial, true);
    expect(s().workspace.quotes[0]!.rate).not.toBe('4.99');
    start(storage, undefined, 'tabB');
    expect(s().workspace.quotes[0]!.rate).toBe('4.99');
    // The undo step was saved with it (issue 7: undo and redo survive a reload).
    expect(s().past).toHaveLength(1);
    s().undo();
    expect(s().workspace.quotes[0]!.rate).not.toBe('4.99');
    s().redo();
    expect(s().workspace.quotes[0]!.rate).toBe('4.99');
  });

  it('keeps at most SAVED_HISTORY_CAP undo steps, and drops a damaged history but not the workspace', () => {
    const storage = new MemoryStorage();
    start(storage);
    for (let i = 0; i < SAVED_HISTORY_CAP + 10; i++) {
      s().setCell(s().workspace.quotes[0]!.id, 'rate', `4.${i}`);
      s().endEdit();
    }
    vi.advanceTimersByTime(300);
    const saved = JSON.parse(storage.getItem(STORAGE_KEY)!);
    expect(saved.history.past).toHaveLength(SAVED_HISTORY_CAP);
    stop!();
    useAppStore.setState(initial, true);
    saved.history.past[3] = { nonsense: true };
    storage.setItem(STORAGE_KEY, JSON.stringify(saved));
    start(storage, undefined, 'tabB');
    expect(s().workspace.quotes[0]!.rate).toBe(`4.${SAVED_HISTORY_CAP + 9}`);
    expect(s().past).toHaveLength(0);
  });

  it('saves at once on pagehide', () => {
    const storage = new MemoryStorage();
    const target = start(storage);
    s().setRowEnabled(s().workspace.quotes[1]!.id, false);
    target.dispatch('pagehide', {});
    expect(JSON.parse(storage.getItem(STORAGE_KEY)!).workspace.quotes[1].enabled).toBe(false);
  });

  it('reports a full quota and keeps working in memory', () => {
    const storage = new MemoryStorage();
    storage.full = true;
    start(storage);
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.5');
    vi.advanceTimersByTime(300);
    expect(s().storage.state).toBe('memory');
    expect(s().storage.message).toMatch(/quota/i);
    expect(s().workspace.quotes[0]!.rate).toBe('4.5');
    storage.full = false;
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.6');
    vi.advanceTimersByTime(300);
    expect(s().storage.state).toBe('saved');
  });

  it('an unreadable saved entry: starts on the demo, says why, and keeps a copy of the entry', () => {
    const storage = new MemoryStorage();
    storage.map.set(STORAGE_KEY, '{"app":"tenorscope", "stamp": "x", "workspace": {"format": "nope"');
    start(storage);
    expect(s().workspace.quotes.length).toBeGreaterThan(10);
    expect(s().storage.corruptReason).toBe('it is not valid JSON');
    const copy = s().storage.corruptCopyKey!;
    expect(copy.startsWith(UNREADABLE_PREFIX)).toBe(true);
    expect(storage.getItem(copy)).toBe('{"app":"tenorscope", "stamp": "x", "workspace": {"format": "nope"');
  });

  it('another tab\u2019s save pauses saving here instead of overwriting it; the user then chooses', () => {
    const storage = new MemoryStorage();
    const target = start(storage);
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.1');
    vi.advanceTimersByTime(300);
    // Another tab writes its own version.
    const theirs = JSON.parse(storage.getItem(STORAGE_KEY)!);
    theirs.stamp = 'tabZ:7';
    theirs.writer = 'tabZ';
    theirs.workspace.quotes[0].rate = '9.9';
    const theirText = JSON.stringify(theirs);
    storage.map.set(STORAGE_KEY, theirText);
    target.dispatch('storage', { key: STORAGE_KEY, newValue: theirText });
    expect(s().storage.state).toBe('paused');
    expect(s().storage.otherTab).toBe(true);
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.2');
    vi.advanceTimersByTime(300);
    flushSave();
    expect(storage.getItem(STORAGE_KEY)).toBe(theirText);
    resolveConflict('load');
    expect(s().workspace.quotes[0]!.rate).toBe('9.9');
    expect(s().storage.state).toBe('saved');
    s().undo();
    expect(s().workspace.quotes[0]!.rate).toBe('4.2');
  });

  it('a save by another tab found at write time (no event seen) also pauses', () => {
    const storage = new MemoryStorage();
    start(storage);
    storage.map.set(STORAGE_KEY, JSON.stringify({ app: 'tenorscope', stamp: 'tabQ:1', writer: 'tabQ', savedAt: 5, workspace: s().workspace }));
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.3');
    vi.advanceTimersByTime(300);
    expect(s().storage.state).toBe('paused');
    expect(JSON.parse(storage.getItem(STORAGE_KEY)!).writer).toBe('tabQ');
    resolveConflict('keep');
    expect(JSON.parse(storage.getItem(STORAGE_KEY)!).workspace.quotes[0].rate).toBe('4.3');
  });
});
