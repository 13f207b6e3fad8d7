// @vitest-environment jsdom
// The copy-link button and the link notice.
import fixtureJson from '../fixtures/share/workspace40.json';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { CopyLinkButton, LinkNotice } from '../../src/share/CopyLinkButton.tsx';
import { decodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { migrateDocument } from '../../src/core/index.ts';

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
    expect(outcome.ok && outcome.checked.document).toEqual(migrateDocument(fixture)); // version 1 read as version 2
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

describe('CopyLinkButton on a workspace too large for a link', () => {
  /** 500 rows of 64-character cells that compress badly (a small deterministic generator, invented text). */
  const huge = (): Record<string, unknown> => {
    let x = 12345;
    const next = (): number => (x = (Math.imul(x, 1664525) + 1013904223) >>> 0) / 2 ** 32;
    const cell = (): string => Array.from({ length: 64 }, () => '0123456789.%-+ ,abcdefXYZ'[Math.floor(next() * 25)]).join('');
    return { ...fixture, quotes: Array.from({ length: 500 }, () => ({ kind: cell(), tenor: cell(), rate: cell() })) };
  };

  it('says so before the user asks, and the button then makes no link', async () => {
    const user = userEvent.setup();
    const written: string[] = [];
    render(<CopyLinkButton document={huge()} baseUrl="https://example.invalid/" writeText={async (t) => void written.push(t)} />);
    const said = await screen.findByText(/^Too large for a link: this workspace needs a link of [\d,]+ characters, more than the 65,536 a link may have; save a workspace file instead\.$/, undefined, { timeout: 5000 });
    expect(said).toHaveAttribute('role', 'status');
    await user.click(screen.getByRole('button', { name: 'Copy link' }));
    expect(await screen.findByText(/^No link: this workspace needs a link of/)).toBeInTheDocument();
    expect(written).toEqual([]);
  });

  it('a workspace that fits says nothing up front', async () => {
    render(<CopyLinkButton document={fixture} baseUrl="https://example.invalid/" writeText={async () => undefined} />);
    await new Promise((r) => setTimeout(r, 600));
    expect(screen.getByRole('status').textContent).toBe('');
  });
});
