import { useAppStore } from '../state/store.ts';
import { resolveConflict } from '../state/persistence.ts';
import { useWorkspaceList } from '../state/workspaceList.ts';

/** Where the work is kept, and anything the user must decide about it. */
export function StorageBanner() {
  const storage = useAppStore((s) => s.storage);
  const setStorage = useAppStore((s) => s.setStorage);
  const openName = useWorkspaceList((l) => l.items.find((x) => x.id === l.currentId)?.name ?? 'a new workspace');
  return (
    <>
      {storage.corruptReason && (
        <div className="banner warn" role="alert">
          The saved workspace &ldquo;{storage.corruptName ?? 'unnamed'}&rdquo; could not be opened: {storage.corruptReason}. It is kept unchanged in the list of workspaces (export the list to keep a copy of it, or delete it there); &ldquo;{openName}&rdquo; is open instead.{' '}
          <button type="button" className="linklike" onClick={() => setStorage({ corruptReason: null })}>
            Dismiss
          </button>
        </div>
      )}
      {storage.restoreNotes.length > 0 && (
        <div className="banner warn" role="alert">
          The saved workspace was not restored exactly as saved: {storage.restoreNotes.join('; ')}.
          {storage.keptCopyKey && <> The whole saved entry is kept in this browser under &ldquo;{storage.keptCopyKey}&rdquo;.</>}{' '}
          <button type="button" className="linklike" onClick={() => setStorage({ restoreNotes: [] })}>
            Dismiss
          </button>
        </div>
      )}
      {storage.otherTab && storage.state !== 'paused' && (
        <div className="banner warn" role="alert">
          This workspace is also open in another tab. Edits in either tab are saved; the other tab is told and asks before it saves over them.
        </div>
      )}
      {storage.state === 'paused' && (
        <div className="banner warn" role="alert">
          Another tab saved a different version of this workspace. Saving here is paused so neither is overwritten.{' '}
          <button type="button" onClick={() => void resolveConflict('load')}>
            Load the other tab&rsquo;s version
          </button>{' '}
          <button type="button" onClick={() => void resolveConflict('keep')}>
            Keep this tab&rsquo;s version and save it
          </button>
        </div>
      )}
      {storage.state === 'memory' && (
        <div className="banner warn" role="alert">
          {storage.message ?? 'The browser would not store the workspace.'} Your work continues in this page: save a workspace file or copy a link before closing.
        </div>
      )}
      {storage.state === 'partial' && (
        <div className="banner warn" role="alert">
          {storage.message}
        </div>
      )}
    </>
  );
}

export function StorageStatusText() {
  const storage = useAppStore((s) => s.storage);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const text = readOnly
    ? 'Read-only: not saved'
    : storage.state === 'saved'
      ? storage.savedAt
        ? 'Saved in this browser'
        : 'Not edited yet'
      : storage.state === 'pending'
        ? 'Saving…'
        : storage.state === 'paused'
          ? 'Saving paused'
          : storage.state === 'partial'
            ? 'Saved without undo history'
            : 'Not saved (memory only)';
  return (
    <span className={`save-state ${storage.state}`} role="status" aria-live="polite">
      {text}
    </span>
  );
}
