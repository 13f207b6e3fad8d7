import { useState } from 'react';
import { isPlainObject, readWorkbenchDocument, WORKBENCH_FORMAT, type WorkbenchDocument } from '../core/index.ts';
import { tableConventionsFromDisplay } from '../core/index.ts';
import type { WorkbenchBuild } from '../hooks/useCurveBuild.ts';
import { makeRowId } from '../state/ids.ts';
import { useAppStore } from '../state/store.ts';
import { openAsNewWorkspace, switchWorkspace } from '../state/persistence.ts';
import { CopyLinkButton, LinkNotice } from './CopyLinkButton.tsx';
import { showOpenedNotice } from './OpenedNotice.tsx';
import { WorkspaceFiles } from './WorkspaceFiles.tsx';
import { safeFileName } from '../components/download.ts';

/** Opens a workspace file as a new entry in the list (the open one is saved and kept), with the way back. */
async function openFileAsWorkspace(doc: WorkbenchDocument): Promise<void> {
  const name = `From a file, ${new Date().toLocaleString('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' })}`;
  const back = await openAsNewWorkspace(doc, name);
  if (back.previousId === null && back.mode === 'entry') {
    showOpenedNotice({ text: `Opened the workspace file as a new entry, “${name}”, in the list of workspaces.`, action: null });
    return;
  }
  if (back.previousId === null) {
    showOpenedNotice({ text: 'Opened the workspace file; your own is one Undo away.', action: { label: 'Undo', ariaLabel: 'Undo opening the file', run: () => useAppStore.getState().undo() } });
    return;
  }
  const previousId = back.previousId;
  const previous = back.previousName ?? 'workspace';
  showOpenedNotice({ text: `Opened the workspace file as a new entry, “${name}”; your own, “${previous}”, is kept unchanged in the list of workspaces.`, action: { label: `Back to “${previous}”`, run: () => void switchWorkspace(previousId) } });
}

/** Copy link, save/open the workspace file and export the curve CSV, wired to the workbench store. */
export function ShareBar({ result }: { result: WorkbenchBuild }) {
  const doc = useAppStore((s) => s.workspace) as unknown as Record<string, unknown>;
  const activeTab = useAppStore((s) => s.activeTab);
  // The link also says which section is open (the document's `view`), so the colleague sees the same.
  const view = isPlainObject(doc.view) ? doc.view : {};
  const linked = { ...doc, view: { ...view, tab: activeTab } };
  const [message, setMessage] = useState<string | null>(null);
  const curve = result.build.curve;
  return (
    <div className="share-bar">
      <CopyLinkButton document={linked} />
      <WorkspaceFiles
        document={doc}
        fileName={`tenorscope-workspace-${safeFileName(String(doc.settlement ?? ''))}`}
        curve={curve}
        conventions={curve ? tableConventionsFromDisplay((doc as unknown as WorkbenchDocument).display) : null}
        onOpen={(checked) => {
          if (checked.document.format !== WORKBENCH_FORMAT) {
            // An engine document (the curve command's input): its quotes become sheet rows, exactly, or it is refused with the reason.
            void import('./documentReader.ts').then(({ workbenchFromEngine }) => {
              const wb = workbenchFromEngine(checked.document, makeRowId);
              if (!wb.ok) setMessage(`The file was not opened: ${wb.errors.slice(0, 3).map((e) => e.message).join(' ')}${wb.errors.length > 3 ? ` (and ${wb.errors.length - 3} more)` : ''} Your workspace has not been changed.`);
              else {
                useAppStore.getState().closeReadOnly();
                setMessage('Opened an engine workspace file: its rates are shown as decimals (switch the unit to percent to see them in %).');
                void openFileAsWorkspace(wb.value);
              }
            });
            return;
          }
          const unknowns = checked.unknowns;
          const read = readWorkbenchDocument(checked.document, makeRowId, { keepUnknown: unknowns.length > 0 });
          if (!read.doc) setMessage(`The file was not opened: ${read.problem ?? 'not a workspace'}. Your workspace has not been changed.`);
          else if (unknowns.length > 0) {
            // Settings this build does not know: shown as they are, read-only (see ReadOnlyBanner).
            useAppStore.getState().openReadOnly(read.doc, unknowns, 'file');
            setMessage(null);
          } else {
            useAppStore.getState().closeReadOnly(); // a read-only document on screen gives way to the file
            setMessage(null);
            void openFileAsWorkspace(read.doc as WorkbenchDocument);
          }
        }}
      />
      <LinkNotice message={message} onDismiss={() => setMessage(null)} />
    </div>
  );
}
