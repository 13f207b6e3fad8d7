// @vitest-environment jsdom
// The copy-link button and the link notice.
import fixtureJson from '../fixtures/share/workspace40.json';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { CopyLinkButton, LinkNotice } from '../../src/share/CopyLinkButton.tsx';
import { decodeWorkspaceLink } from '../../src/share/linkCodec.ts';

const fixture = fixtureJson as unknown as Record<string, unknown>;

describe('CopyLinkButton', () => {
  it('has an accessible name containing "link" and copies a link that decodes to the document', async () => {
    const user = userEvent.setup();
    const written: string[] = [];
    render(<CopyLinkButton document={fixture} baseUrl="https://example.invalid/app" writeText={async (t) => void written.push(t)} />);
    await user.click(screen.getByRole('button', { name: /link/i }));
    expect(await screen.findByText(/^Link copied \(\d[\d,]* characters\)\.$/)).toBeInTheDocument();
    const url = written[0]!;
    expect(url.startsWith('https://example.invalid/app#ws1.')).toBe(true);
    const outcome = await decodeWorkspaceLink(url.split('#')[1]!);
    expect(outcome.ok && outcome.checked.document).toEqual(fixture);
  });

  it('says so when the clipboard is refused', async () => {
    const user = userEvent.setup();
    render(<CopyLinkButton document={fixture} baseUrl="https://example.invalid/" writeText={() => Promise.reject(new Error('denied'))} />);
    await user.click(screen.getByRole('button', { name: 'Copy link' }));
    expect(await screen.findByText(/refused the clipboard/)).toBeInTheDocument();
  });
});

describe('LinkNotice', () => {
  it('shows a message as plain text, never as HTML', () => {
    render(<LinkNotice message={'<b>bold</b> link'} />);
    expect(screen.getByRole('alert').textContent).toBe('<b>bold</b> link');
    expect(document.querySelector('b')).toBeNull();
  });
});
