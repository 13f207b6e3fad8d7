// @vitest-environment jsdom
// Opening a workspace file validates it like a link; a bad file changes nothing and says why.
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import fixtureJson from '../fixtures/share/workspace40.json';
import { migrateDocument, type CheckedDocument } from '../../src/core/index.ts';
import { WorkspaceFiles } from '../../src/share/WorkspaceFiles.tsx';

const fixture = fixtureJson as unknown as Record<string, unknown>;
const file = (text: string, name = 'w.json') => new File([text], name, { type: 'application/json' });

describe('WorkspaceFiles', () => {
  it('opens a valid file and refuses a bad one with the reason', async () => {
    const user = userEvent.setup({ delay: null });
    const opened: CheckedDocument[] = [];
    render(<WorkspaceFiles document={fixture} curve={null} conventions={null} onOpen={(c) => opened.push(c)} />);
    const input = screen.getByLabelText('Workspace file to open');
    await user.upload(input, file(JSON.stringify(fixture)));
    // The file's reader loads on first use (share/documentReader.ts), so the opening lands after the upload resolves.
    await waitFor(() => expect(opened[0]?.document).toEqual(migrateDocument(fixture))); // version 1 read as version 2 (settlement renamed valuationDate)
    await user.upload(input, file(JSON.stringify({ ...fixture, note: 'n'.repeat(2001) }), 'long.json'));
    expect((await screen.findByRole('alert')).textContent).toContain('long.json was not opened: note: must be 2000 characters at most');
    await user.upload(input, file('{oops', 'broken.json'));
    expect((await screen.findByRole('alert')).textContent).toContain('not valid JSON');
    expect(opened).toHaveLength(1);
    expect(screen.getByRole('button', { name: 'Export curve table (CSV)' })).toBeDisabled();
  });
});
