// @vitest-environment jsdom
// Opening a link in the workbench: a good one replaces the workspace undoably; a bad one changes nothing.
import { act, render, screen, waitFor } from '@testing-library/react';
import workbenchJson from '../fixtures/share/workbench40.json';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { IDBFactory } from 'fake-indexeddb';
import { OpenedNotice, showOpenedNotice } from '../../src/share/OpenedNotice.tsx';
import { useOpenLinkOnStart } from '../../src/share/useOpenLinkOnStart.ts';
import { entryKey, flushSave, startPersistence } from '../../src/state/persistence.ts';
import { useAppStore } from '../../src/state/store.ts';
import { indexedDbBackend } from '../../src/state/workspaceBackend.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';

const initial = useAppStore.getInitialState();
function Probe() {
  const { message } = useOpenLinkOnStart();
  return <p data-testid="message">{message ?? ''}</p>;
}
let stop: (() => void) | null = null;
beforeEach(() => {
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(useWorkspaceList.getInitialState(), true);
  showOpenedNotice(null);
  window.history.replaceState(null, '', '/');
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
});
afterEach(() => {
  stop?.();
  stop = null;
});
const link = async (): Promise<string> => `#${await encodeWorkspaceLink(workbenchJson as unknown as Record<string, unknown>)}`;

describe('useOpenLinkOnStart()', () => {
  it('opens a good link as one undoable step and clears the fragment', async () => {
    const before = useAppStore.getState().workspace;
    window.history.replaceState(null, '', `/#${await encodeWorkspaceLink(workbenchJson as unknown as Record<string, unknown>)}`);
    render(<Probe />);
    await waitFor(() => expect(useAppStore.getState().workspace).not.toBe(before));
    const ws = useAppStore.getState().workspace;
    expect(ws.quotes).toHaveLength(40);
    expect(ws.note).toBe(workbenchJson.note);
    expect(ws.scenarios).toEqual(workbenchJson.scenarios);
    expect(window.location.hash).toBe('');
    act(() => useAppStore.getState().undo());
    expect(useAppStore.getState().workspace).toBe(before);
  });

  it('shows why a bad link was not opened and leaves the workspace as it was', async () => {
    const before = useAppStore.getState().workspace;
    window.history.replaceState(null, '', '/#ws1.bm90LWEtbGluaw');
    render(<Probe />);
    await waitFor(() => expect(screen.getByTestId('message').textContent).toContain('Your saved workspace has not been changed.'));
    expect(useAppStore.getState().workspace).toBe(before);
    expect(useAppStore.getState().past).toHaveLength(0);
  });

  it('with saved workspaces: a link opens as a new entry, the user’s own stays saved unchanged, and the notice goes back to it', async () => {
    const p = startPersistence();
    stop = p.stop;
    await p.ready;
    const s = () => useAppStore.getState();
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '3.21');
    await flushSave();
    const ownId = useWorkspaceList.getState().currentId!;
    const own = await indexedDbBackend().get(entryKey(ownId));
    window.history.replaceState(null, '', `/${await link()}`);
    render(
      <>
        <Probe />
        <OpenedNotice />
      </>,
    );
    const back = await screen.findByRole('button', { name: /Back to “My workspace”/ }, { timeout: 10_000 });
    expect(screen.getByRole('alert').textContent).toMatch(/Opened a shared workspace as a new entry, “From a link.*”; your own, “My workspace”, is kept unchanged/);
    expect(s().workspace.quotes).toHaveLength(40);
    expect(useWorkspaceList.getState().currentId).not.toBe(ownId);
    await flushSave();
    expect(await indexedDbBackend().get(entryKey(ownId))).toEqual(own);
    expect(useWorkspaceList.getState().items).toHaveLength(2);
    act(() => back.click());
    await waitFor(() => expect(useWorkspaceList.getState().currentId).toBe(ownId));
    expect(s().workspace.quotes[0]!.rate).toBe('3.21');
  });

  it('follows a link pasted into the address of a page already open (hashchange)', async () => {
    render(<Probe />);
    const before = useAppStore.getState().workspace;
    await act(async () => {
      window.location.hash = await link();
    });
    await waitFor(() => expect(useAppStore.getState().workspace.quotes).toHaveLength(40));
    expect(useAppStore.getState().workspace).not.toBe(before);
    expect(window.location.hash).toBe('');
  });
});
