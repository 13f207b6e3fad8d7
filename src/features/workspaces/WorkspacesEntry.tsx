import { lazy, Suspense } from 'react';
import { useWorkspaceList } from '../../state/workspaceList.ts';

/** The panel's code is fetched the first time it opens (its own chunk), so the first load carries less. */
const WorkspacesPanel = lazy(() => import('./WorkspacesPanel.tsx').then((m) => ({ default: m.WorkspacesPanel })));

/** The top bar's button that opens and closes the Workspaces panel. */
export function WorkspacesButton() {
  const open = useWorkspaceList((s) => s.panelOpen);
  const count = useWorkspaceList((s) => s.items.length);
  return (
    <button type="button" aria-expanded={open} onClick={() => useWorkspaceList.setState({ panelOpen: !open })} title="Saved workspaces: open, rename, delete, export or import">
      Workspaces{count > 1 ? ` (${count})` : ''}
    </button>
  );
}

/** Where the panel shows when open. */
export function WorkspacesSlot() {
  const open = useWorkspaceList((s) => s.panelOpen);
  if (!open) return null;
  return (
    <Suspense fallback={<p className="muted small" role="status">Loading the workspaces…</p>}>
      <WorkspacesPanel onClose={() => useWorkspaceList.setState({ panelOpen: false })} />
    </Suspense>
  );
}
