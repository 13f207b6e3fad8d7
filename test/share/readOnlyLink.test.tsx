// @vitest-environment jsdom
// A link from another build naming an interpolation this build does not know: it opens read-only
// with the unknown value kept (not monotone convex in its place), the notice does not claim "the
// inputs are the same", the banner names the path, the value and what this build supports, and an
// editable copy takes the value the user picked in full view. Invented documents only.
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import workbenchJson from '../fixtures/share/workbench40.json';
import { ReadOnlyBanner } from '../../src/components/ReadOnlyBanner.tsx';
import { decodeWorkspaceLink, encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { useOpenLinkOnStart } from '../../src/share/useOpenLinkOnStart.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
const foreign = { ...workbenchJson, curve: { ...workbenchJson.curve, interpolation: 'cubic-tension' } } as unknown as Record<string, unknown>;

function Probe() {
  const { message } = useOpenLinkOnStart();
  return (
    <>
      <p data-testid="message">{message ?? ''}</p>
      <ReadOnlyBanner />
    </>
  );
}
beforeEach(() => {
  useAppStore.setState(initial, true);
  window.history.replaceState(null, '', '/');
});

describe('a link with an interpolation this build does not know', () => {
  it('decodes as valid, lists the unknown value and does not say the inputs are the same', async () => {
    const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(foreign, 'other-build'), 'this-build');
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.checked.unknowns.map((u) => `${u.path}=${u.value}`)).toEqual(['curve.interpolation="cubic-tension"']);
    expect(outcome.notice).not.toMatch(/inputs are the same/);
    expect(outcome.notice).toMatch(/read-only/);
  });

  it('opens read-only with the value kept; the banner names it; an editable copy takes the shown choice', async () => {
    const before = useAppStore.getState().workspace;
    window.history.replaceState(null, '', `/#${await encodeWorkspaceLink(foreign, 'other-build')}`);
    render(<Probe />);
    await waitFor(() => expect(useAppStore.getState().readOnly).not.toBeNull());
    expect(useAppStore.getState().workspace.curve.interpolation).toBe('cubic-tension');
    const banner = screen.getByRole('region', { name: 'Read-only workspace' });
    const item = within(banner).getByText('curve.interpolation').closest('li')!;
    expect(item.textContent).toBe('curve.interpolation is "cubic-tension"; this build supports linear-zero, log-linear-discount, cubic-zero, monotone-convex, monotone-convex-positive.');
    act(() => useAppStore.getState().setCurve({ interpolation: 'linear-zero' }));
    expect(useAppStore.getState().workspace.curve.interpolation).toBe('cubic-tension');
    fireEvent.click(within(banner).getByRole('button', { name: 'Make an editable copy…' }));
    const select = within(banner).getByRole('combobox');
    expect((select as HTMLSelectElement).value).toBe('monotone-convex'); // the default, shown, not applied
    fireEvent.change(select, { target: { value: 'cubic-zero' } });
    fireEvent.click(within(banner).getByRole('button', { name: 'Make the editable copy' }));
    expect(useAppStore.getState().readOnly).toBeNull();
    expect(useAppStore.getState().workspace.curve.interpolation).toBe('cubic-zero');
    expect(useAppStore.getState().workspace.quotes).toHaveLength(40);
    act(() => useAppStore.getState().undo());
    expect(useAppStore.getState().workspace).toBe(before);
  });
});

describe('a good link while a read-only document is shown', () => {
  it('opens: the read-only document gives way, and undo goes back to the workspace from before it', async () => {
    const mine = useAppStore.getState().workspace;
    const doc = { ...(foreign as Record<string, unknown>) };
    useAppStore.getState().openReadOnly(doc as never, [{ path: 'curve.interpolation', value: '"cubic-tension"', supported: [], fallback: 'monotone-convex', unknownName: false }], 'saved');
    window.history.replaceState(null, '', `/#${await encodeWorkspaceLink(workbenchJson as unknown as Record<string, unknown>)}`);
    render(<Probe />);
    await waitFor(() => expect(useAppStore.getState().readOnly).toBeNull());
    expect(useAppStore.getState().workspace.curve.interpolation).toBe(workbenchJson.curve.interpolation);
    expect(useAppStore.getState().workspace.quotes).toHaveLength(40);
    act(() => useAppStore.getState().undo());
    expect(useAppStore.getState().workspace).toBe(mine);
  });
});
