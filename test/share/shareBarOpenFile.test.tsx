// @vitest-environment jsdom
// Opening a workspace file from the share bar: it becomes a new entry in the list of workspaces;
// the one shown before is saved, unchanged, and the notice goes back to it.
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { IDBFactory } from 'fake-indexeddb';
import { serialiseDocument } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { OpenedNotice, showOpenedNotice } from '../../src/share/OpenedNotice.tsx';
import { ShareBar } from '../../src/share/ShareBar.tsx';
import { entryKey, flushSave, startPersistence } from '../../src/state/persistence.ts';
import { useAppStore } from '../../src/state/store.ts';
import { indexedDbBackend } from '../../src/state/workspaceBackend.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';

vi.setConfig({ testTimeout: 30_000 });
let stop: (() => void) | null = null;
afterEach(() => {
  stop?.();
  stop = null;
});

describe('ShareBar: Open workspace file', () => {
  it('opens the file as a new workspace and keeps the one shown before', async () => {
    (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
    useAppStore.setState(useAppStore.getInitialState(), true);
    useWorkspaceList.setState(useWorkspaceList.getInitialState(), true);
    showOpenedNotice(null);
    const p = startPersistence();
    stop = p.stop;
    await p.ready;
    const s = () => useAppStore.getState();
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '3.21');
    await flushSave();
    const ownId = useWorkspaceList.getState().currentId!;
    const own = await indexedDbBackend().get(entryKey(ownId));
    const file = serialiseDocument({ ...s().workspace, note: 'from a file' } as unknown as Record<string, unknown>);
    render(
      <>
        <ShareBar result={deriveBuild(s().workspace)} />
        <OpenedNotice />
      </>,
    );
    fireEvent.change(screen.getByLabelText('Workspace file to open'), { target: { files: [new File([file], 'desk.json', { type: 'application/json' })] } });
    await screen.findByRole('button', { name: 'Back to “My workspace”' }, { timeout: 10_000 });
    expect(s().workspace.note).toBe('from a file');
    expect(useWorkspaceList.getState().currentId).not.toBe(ownId);
    await flushSave();
    expect(await indexedDbBackend().get(entryKey(ownId))).toEqual(own);
    fireEvent.click(screen.getByRole('button', { name: 'Back to “My workspace”' }));
    await waitFor(() => expect(useWorkspaceList.getState().currentId).toBe(ownId));
    expect(s().workspace.note).toBeUndefined();
  });
});
