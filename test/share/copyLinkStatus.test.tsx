// @vitest-environment jsdom
// The copy-link status is news for a moment: "Link copied" goes after a few seconds; a problem stays.
import { act, fireEvent, render, screen } from '@testing-library/react';
import { COPIED_STATUS_MS, CopyLinkButton } from '../../src/share/CopyLinkButton.tsx';

const doc = { format: 'tenorscope-workbench', note: 'invented demo' } as Record<string, unknown>;
afterEach(() => vi.useRealTimers());

describe('CopyLinkButton status', () => {
  it('"Link copied" disappears after COPIED_STATUS_MS', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true });
    render(<CopyLinkButton document={doc} baseUrl="https://example.invalid/" writeText={async () => undefined} />);
    fireEvent.click(screen.getByRole('button', { name: 'Copy link' }));
    expect(await screen.findByText(/^Link copied/)).toBeInTheDocument();
    await act(async () => undefined); // the status's effect (its timer) has run
    act(() => vi.advanceTimersByTime(COPIED_STATUS_MS - 100));
    expect(screen.getByText(/^Link copied/)).toBeInTheDocument();
    act(() => vi.advanceTimersByTime(200));
    expect(screen.queryByText(/^Link copied/)).toBeNull();
  });

  it('a refused clipboard stays said', async () => {
    vi.useFakeTimers({ shouldAdvanceTime: true });
    render(<CopyLinkButton document={doc} baseUrl="https://example.invalid/" writeText={() => Promise.reject(new Error('denied'))} />);
    fireEvent.click(screen.getByRole('button', { name: 'Copy link' }));
    expect(await screen.findByText(/refused the clipboard/)).toBeInTheDocument();
    act(() => vi.advanceTimersByTime(COPIED_STATUS_MS * 3));
    expect(screen.getByText(/refused the clipboard/)).toBeInTheDocument();
  });
});
