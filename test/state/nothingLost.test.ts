import { MemoryStorage } from '../helpers/memoryStorage.ts';
import { IDBFactory } from 'fake-indexeddb';
import { LIMITS, unknownSettings, type WorkbenchDocument } from '../../src/core/index.ts';
import { entryKey, flushSave, LEGACY_KEY, startPersistence, type PersistenceDeps } from '../../src/state/persistence.ts';
import { useAppStore } from '../../src/state/store.ts';
// The paste reader registers the functions the store confirms pastes with (state/pasteTools.ts), as its first load does in the app.
import '../../src/features/quotes/pasteReader.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';
import { indexedDbBackend } from '../../src/state/workspaceBackend.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';

const initial = useAppStore.getInitialState();
const initialList = useWorkspaceList.getInitialState();
const s = () => useAppStore.getState();

let stop: (() => void) | null = null;
/** Starts persistence on a fresh in-memory database, with an earlier build's saved entry under its localStorage key (moved into the list on start). */
const start = async (legacyEntry: string | null): Promise<void> => {
  const storage = new MemoryStorage();
  if (legacyEntry !== null) storage.setItem(LEGACY_KEY, legacyEntry);
  const deps: PersistenceDeps = {
    indexedDb: true,
    storage,
    openChannel: null,
    target: null,
    now: () => 1_000,
    tabId: 'tabA',
    idle: (save) => {
      const h = setTimeout(save, 0);
      return () => clearTimeout(h);
    },
    retryMs: 60_000,
  };
  const p = startPersistence(deps);
  stop = p.stop;
  await p.ready;
};
const entry = (workspace: unknown, stamp = 'old:7'): string => JSON.stringify({ app: 'tenorscope', stamp, writer: 'old', savedAt: 5, workspace });
/** The record kept aside under the key the banner names. */
const keptRecord = async (): Promise<Record<string, unknown>> => (await indexedDbBackend().get(s().storage.keptCopyKey!)) as Record<string, unknown>;
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeEach(() => {
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(initialList, true);
});
afterEach(() => {
  stop?.();
  stop = null;
});

/** A tab-separated block with a header and `n` swap rows. */
const block = (n: number): string => ['Kind\tTenor\tRate', ...Array.from({ length: n }, (_, i) => `swap\t${1 + (i % 30)}Y\t${(3 + i / 1000).toFixed(3)}`)].join('\n');

describe('one row cap for every way in', () => {
  it('a 600-row paste with a header keeps the first 500 rows and says 100 were left out', () => {
    s().pasteText(block(600), null);
    expect(s().workspace.quotes).toHaveLength(LIMITS.quotes);
    expect(s().workspace.quotes[499]!.maturity).toBe(`${1 + (499 % 30)}Y`);
    expect(s().pasteNotice).toMatchObject({ mode: 'replaced', rows: 500, leftOut: 100 });
    // "Append instead" respects the cap too: the sheet before (19 demo rows) plus the first 481 of the 600 (119 left out).
    s().appendInstead();
    expect(s().workspace.quotes).toHaveLength(LIMITS.quotes);
    expect(s().pasteNotice).toMatchObject({ mode: 'appended', rows: 481, leftOut: 119 });
  });

  it('a block without a header fills from the focused cell up to the cap and counts the rest', () => {
    s().pasteText(block(600), null);
    const rows = Array.from({ length: 30 }, (_, i) => `bond\t2031-06-15\t\t99.5\t${i}`).join('\n');
    s().pasteText(rows, { row: 480, column: 'kind' });
    expect(s().workspace.quotes).toHaveLength(LIMITS.quotes);
    expect(s().workspace.quotes[499]!.kind).toBe('bond');
    expect(s().pasteNotice).toMatchObject({ mode: 'filled', rows: 20, leftOut: 10 });
  });

  it('a full sheet adds no row; a typed or pasted cell stops at the cell cap', () => {
    s().pasteText(block(500), null);
    const before = s().workspace;
    expect(s().addRow(null)).toBe('');
    expect(s().workspace).toBe(before);
    const id = s().workspace.quotes[0]!.id;
    s().setCell(id, 'rate', '1'.repeat(LIMITS.cell + 10));
    expect(s().workspace.quotes[0]!.rate).toHaveLength(LIMITS.cell);
    s().pasteText(`${'x'.repeat(100)}\t5Y`, { row: 1, column: 'kind' });
    expect(s().workspace.quotes[1]!.kind).toHaveLength(LIMITS.cell);
    expect(s().pasteNotice).toMatchObject({ clippedCells: 1 });
  });
});

describe('a document with settings this build does not know', () => {
  const foreign = (): WorkbenchDocument => {
    const d = demoWorkspace(() => `f${Math.random()}`) as unknown as Record<string, unknown>;
    return { ...d, curve: { ...(d.curve as object), interpolation: 'cubic-tension' } } as unknown as WorkbenchDocument;
  };

  it('is shown as it is, read-only: no edit, no undo, no save; an editable copy takes the shown choice and is one undo step', async () => {
    await start(null);
    const id0 = s().workspace.quotes[0]!.id;
    s().setCell(id0, 'rate', '4.01');
    await wait(50);
    await flushSave();
    const mineKey = entryKey(useWorkspaceList.getState().currentId!);
    const mine = await indexedDbBackend().get(mineKey);
    expect(((mine as Record<string, unknown>).workspace as WorkbenchDocument).quotes[0]!.rate).toBe('4.01');
    const myWorkspace = s().workspace;
    const doc = foreign();
    s().openReadOnly(doc, unknownSettings(doc), 'link');
    expect(s().readOnly?.unknowns.map((u) => u.path)).toEqual(['curve.interpolation']);
    expect(s().workspace.curve.interpolation).toBe('cubic-tension');
    const shown = s().workspace;
    s().setCell(shown.quotes[0]!.id, 'rate', '9.99');
    s().setCurve({ interpolation: 'linear-zero' });
    s().pasteText(block(3), null);
    s().addRow(null);
    s().setReserved('note', 'changed');
    s().undo();
    s().resetToDemo();
    expect(s().workspace).toBe(shown);
    await wait(50);
    await flushSave();
    expect(await indexedDbBackend().get(mineKey)).toEqual(mine); // nothing written over the user's own workspace
    s().makeEditableCopy({ 'curve.interpolation': 'log-linear-discount' });
    expect(s().readOnly).toBeNull();
    expect(s().workspace.curve.interpolation).toBe('log-linear-discount');
    expect(s().workspace.quotes.map((q) => q.rate)).toEqual(shown.quotes.map((q) => q.rate));
    s().undo();
    expect(s().workspace).toBe(myWorkspace);
  });

  it('can be closed, bringing back the workspace and history from before', () => {
    const id0 = s().workspace.quotes[0]!.id;
    s().setCell(id0, 'rate', '4.02');
    const mine = s().workspace;
    const doc = foreign();
    s().openReadOnly(doc, unknownSettings(doc), 'file');
    s().closeReadOnly();
    expect(s().workspace).toBe(mine);
    expect(s().past).toHaveLength(1);
  });
});

describe('restoring the saved entry', () => {
  it('entries of the quote list that are not rows are counted and placed, and the entry is kept whole', async () => {
    const ws = demoWorkspace((() => { let n = 0; return () => `d${n++}`; })()) as unknown as Record<string, unknown>;
    const quotes = [...(ws.quotes as unknown[])];
    quotes.splice(2, 0, 'swap 5Y 3.1');
    quotes.splice(5, 0, null);
    const raw = entry({ ...ws, quotes });
    await start(raw);
    expect(s().workspace.quotes).toHaveLength(19);
    expect(s().storage.restoreNotes).toEqual(['2 entries of the saved quote list are not a row and were left out (entry 3 and 6 of 21)']);
    expect(s().storage.keptCopyKey).toMatch(/^kept:.+:old:7$/);
    expect((await keptRecord()).workspace).toEqual(JSON.parse(raw).workspace);
  });

  it('a 600-row workspace saved by an older build opens with its first 500 rows, says so, and keeps the entry whole', async () => {
    const ws = demoWorkspace(() => 'x') as unknown as Record<string, unknown>;
    const rows = Array.from({ length: 600 }, (_, i) => ({ id: `r${i}`, enabled: true, kind: 'swap', maturity: `${1 + (i % 30)}Y`, rate: '3.1', price: '', coupon: '', frequency: '', dayCount: '' }));
    const raw = entry({ ...ws, quotes: rows });
    await start(raw);
    expect(s().workspace.quotes).toHaveLength(500);
    expect(s().workspace.quotes[499]!.id).toBe('r499');
    expect(s().storage.restoreNotes[0]).toBe('the saved workspace has 600 quotes, more than the 500 a workspace may hold: the first 500 are open and 100 were left out');
    expect(((await keptRecord()).workspace as { quotes: unknown[] }).quotes).toHaveLength(600);
  });

  it('a saved entry naming an interpolation this build does not know opens read-only and is not overwritten', async () => {
    const ws = demoWorkspace(() => 'y') as unknown as Record<string, unknown>;
    const raw = entry({ ...ws, curve: { ...(ws.curve as object), interpolation: 'cubic-tension' } });
    await start(raw);
    expect(s().readOnly).toMatchObject({ source: 'saved' });
    expect(s().workspace.curve.interpolation).toBe('cubic-tension');
    const id = useWorkspaceList.getState().currentId!;
    const before = await indexedDbBackend().get(entryKey(id));
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '1');
    await wait(50);
    await flushSave();
    expect(await indexedDbBackend().get(entryKey(id))).toEqual(before);
    expect(((before as Record<string, unknown>).workspace as { curve: { interpolation: string } }).curve.interpolation).toBe('cubic-tension');
  });

  it('a saved undo history with a step that cannot be read: the workspace opens, and the lost history is said and kept', async () => {
    const ws = demoWorkspace(() => 'h');
    const raw = JSON.stringify({ app: 'tenorscope', stamp: 'old:9', writer: 'old', savedAt: 5, workspace: ws, history: { past: [ws, { nonsense: true }], future: [] } });
    await start(raw);
    expect(s().workspace.quotes).toHaveLength(19);
    expect(s().past).toHaveLength(0);
    expect(s().storage.restoreNotes).toEqual(['a step of the saved undo history could not be read, so undo starts afresh']);
    expect((await keptRecord()).history).toEqual(JSON.parse(raw).history);
  });
});

describe('the record kept aside', () => {
  it('goes out with the export of every workspace', async () => {
    const ws = demoWorkspace(() => 'z') as unknown as Record<string, unknown>;
    const rows = Array.from({ length: 501 }, (_, i) => ({ id: `r${i}`, enabled: true, kind: 'swap', maturity: `${1 + (i % 30)}Y`, rate: '3.1', price: '', coupon: '', frequency: '', dayCount: '' }));
    await start(entry({ ...ws, quotes: rows }));
    const { exportAll } = await import('../../src/features/workspaces/WorkspacesPanel.tsx');
    const file = JSON.parse(await exportAll()) as { workspaces: { name: string; unreadable?: string }[] };
    const kept = file.workspaces.find((w) => /as saved before it was restored with changes/.test(w.name));
    expect(kept).toBeDefined();
    expect((JSON.parse(kept!.unreadable!) as { workspace: { quotes: unknown[] } }).workspace.quotes).toHaveLength(501);
  });
});
