// @vitest-environment jsdom
// The Workspaces panel on an in-memory IndexedDB (fake-indexeddb): each entry with its name,
// saved time, settlement and a zero-curve sparkline derived from its inputs; open, rename, delete
// with undo; the whole list exported as one file and read back.
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { IDBFactory } from 'fake-indexeddb';
import { exportAll, readListFile, WorkspacesPanel } from '../../src/features/workspaces/WorkspacesPanel.tsx';
import { zeroSparkline } from '../../src/features/workspaces/sparkline.ts';
import { flushSave, openAsNewWorkspace, startPersistence } from '../../src/state/persistence.ts';
import { useAppStore } from '../../src/state/store.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';

vi.setConfig({ testTimeout: 30_000 });
const initial = useAppStore.getInitialState();
let stop: (() => void) | null = null;
const s = () => useAppStore.getState();

beforeEach(async () => {
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(useWorkspaceList.getInitialState(), true);
  const p = startPersistence();
  stop = p.stop;
  await p.ready;
  s().setCell(s().workspace.quotes[0]!.id, 'rate', '3.21');
  await flushSave();
  await openAsNewWorkspace({ ...s().workspace, settlement: '2027-01-15', note: 'shared' }, 'Colleague');
});
afterEach(() => {
  stop?.();
  stop = null;
});

describe('WorkspacesPanel', () => {
  it('lists each workspace with its saved time, settlement and a zero-curve sparkline tagged with its convention', () => {
    render(<WorkspacesPanel />);
    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(items[0]).toHaveTextContent('Colleague');
    expect(items[0]).toHaveTextContent('open here');
    expect(items[0]).toHaveTextContent('settles 2027-01-15');
    expect(items[1]).toHaveTextContent('My workspace');
    expect(items[1]).toHaveTextContent(/saved \d+ \w+ \d{4}, \d\d:\d\d · settles 2026-12-15 · 19 quotes/);
    for (const item of items) expect(within(item).getByRole('img').getAttribute('aria-label')).toMatch(/^Zero curve from −?\d+\.\d\d% to −?\d+\.\d\d% \(cont, ACT\/365F\)$/);
  });

  it('the sparkline is derived from the inputs: a moved quote gives a new line, the same inputs the same line', () => {
    const doc = s().workspace;
    const a = zeroSparkline(doc)!;
    expect(zeroSparkline({ ...doc })!.path).toBe(a.path);
    const moved = { ...doc, quotes: doc.quotes.map((q, i) => (i === doc.quotes.length - 1 ? { ...q, rate: '6.5' } : q)) };
    expect(zeroSparkline(moved)!.path).not.toBe(a.path);
    expect(zeroSparkline({ ...doc, quotes: [] })).toBeNull();
  });

  it('opens, renames, and deletes with undo; the open workspace cannot be deleted', async () => {
    render(<WorkspacesPanel />);
    expect(screen.getByRole('button', { name: 'Delete Colleague' })).toBeDisabled();
    fireEvent.click(screen.getByRole('button', { name: 'Rename My workspace' }));
    const input = screen.getByRole('textbox', { name: 'New name for My workspace' });
    fireEvent.change(input, { target: { value: 'Desk view' } });
    fireEvent.keyDown(input, { key: 'Enter' });
    await screen.findByText('Desk view');
    fireEvent.click(screen.getByRole('button', { name: 'Delete Desk view' }));
    await screen.findByText(/Deleted “Desk view”/);
    expect(screen.getAllByRole('listitem')).toHaveLength(1);
    fireEvent.click(screen.getByRole('button', { name: 'Undo delete' }));
    await waitFor(() => expect(screen.getAllByRole('listitem')).toHaveLength(2));
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Open Desk view' }));
    });
    // The colleague's copy has the same rate: wait for the switch itself (its own settlement), then check it all.
    await waitFor(() => expect(s().workspace.settlement).toBe('2026-12-15'));
    expect(s().workspace.quotes[0]!.rate).toBe('3.21');
    expect(s().workspace.note).toBeUndefined();
  });

  it('exports every workspace as one file that reads back to the same documents', async () => {
    const text = await exportAll();
    const back = readListFile(text, 'tenorscope-workspaces.json');
    expect(back.problems).toEqual([]);
    expect(back.items.map((x) => x.name).sort()).toEqual(['Colleague', 'My workspace']);
    const colleague = back.items.find((x) => x.name === 'Colleague')!.workspace;
    expect(colleague.settlement).toBe('2027-01-15');
    expect(colleague.note).toBe('shared');
    expect(readListFile('{"format":"tenorscope-workspace-list","version":1,"workspaces":[{"name":"x","workspace":{"format":"nope"}}]}', 'f.json').problems[0]).toMatch(/^“x”: /);
  });
});
