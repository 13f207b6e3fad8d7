// @vitest-environment jsdom
// The note typed in the Print section lives in the document: one undo step per stretch of typing,
// capped at 2,000 characters, and the printed preview shows it (cut at 600).
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { installFeaturePanels } from '../../src/app/installFeaturePanels.tsx';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
beforeAll(() => installFeaturePanels());
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

// Limit for a hung render, not a speed check.
describe('Print section note', { timeout: 30_000 }, () => {
  it('types the note into the document as one undo step and previews it', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Print' }));
    const box = screen.getByRole('textbox', { name: 'Note' });
    await user.type(box, 'Desk review');
    await user.tab();
    expect(useAppStore.getState().workspace.note).toBe('Desk review');
    expect(screen.getAllByLabelText('Note').some((el) => el.tagName === 'SECTION' && el.textContent === 'Desk review')).toBe(true);
    expect(screen.getByText('11 / 2,000 characters')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(useAppStore.getState().workspace.note).toBeUndefined();
  });

  it('caps the note at 2,000 characters and says that 600 are printed', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Print' }));
    const box = screen.getByRole('textbox', { name: 'Note' });
    await user.click(box);
    await user.paste('y'.repeat(2100));
    expect((useAppStore.getState().workspace.note as string).length).toBe(2000);
    expect(screen.getByText(/2,000 \/ 2,000 characters; the printed page shows the first 600/)).toBeInTheDocument();
  });
});

describe('Print section title', { timeout: 30_000 }, () => {
  it('keeps the typed title in the document view, one undo step, and in the encoded link', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Print' }));
    const box = screen.getByRole('textbox', { name: 'Title' });
    await user.clear(box);
    await user.type(box, 'Committee, March');
    await user.tab();
    const view = useAppStore.getState().workspace.view as Record<string, unknown>;
    expect(view.printTitle).toBe('Committee, March');
    expect(screen.getAllByRole('heading', { name: 'Committee, March' }).length).toBeGreaterThan(0);
    // The link and the file carry the whole document, view included: decode what the link writes.
    const { encodeWorkspaceLink, decodeWorkspaceLink } = await import('../../src/share/linkCodec.ts');
    const link = await encodeWorkspaceLink(useAppStore.getState().workspace as unknown as Record<string, unknown>);
    const back = await decodeWorkspaceLink(link);
    expect(back.ok && back.checked.view.printTitle).toBe('Committee, March');
    // Clearing and typing is one stretch of typing: one Undo brings back the default title.
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect((useAppStore.getState().workspace.view as Record<string, unknown> | undefined)?.printTitle).toBeUndefined();
    expect((screen.getByRole('textbox', { name: 'Title' }) as HTMLInputElement).value).toBe('Yield-curve summary');
  });
});
