// @vitest-environment jsdom
// Opening a link in the workbench: a good one replaces the workspace undoably; a bad one changes nothing.
import { act, render, screen, waitFor } from '@testing-library/react';
import workbenchJson from '../fixtures/share/workbench40.json';
import { encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { useOpenLinkOnStart } from '../../src/share/useOpenLinkOnStart.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
function Probe() {
  const { message } = useOpenLinkOnStart();
  return <p data-testid="message">{message ?? ''}</p>;
}
beforeEach(() => {
  useAppStore.setState(initial, true);
  window.history.replaceState(null, '', '/');
});

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
});
