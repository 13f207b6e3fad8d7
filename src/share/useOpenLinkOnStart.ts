import { useEffect, useState } from 'react';
import { readWorkbenchDocument, WORKBENCH_FORMAT, type WorkbenchDocument } from '../core/index.ts';
import { makeRowId } from '../state/ids.ts';
import { useAppStore } from '../state/store.ts';
import { decodeWorkspaceLink } from './linkCodec.ts';

/**
 * Opens a workspace link in the address (#ws1...) once, after the saved workspace was restored:
 * a good link replaces the workspace as one undoable step (with a notice when it comes from
 * another build); a bad one leaves everything as it was and returns the message to show. The
 * fragment is removed from the address afterwards, so a reload does not open it again.
 */
export function useOpenLinkOnStart(): { message: string | null; dismiss: () => void } {
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => {
    const hash = window.location.hash;
    if (!hash.startsWith('#ws')) return;
    let live = true;
    void decodeWorkspaceLink(hash).then((outcome) => {
      if (!live) return;
      window.history.replaceState(null, '', window.location.pathname + window.location.search);
      if (!outcome.ok) {
        setMessage(outcome.message);
        return;
      }
      if (outcome.checked.document.format !== WORKBENCH_FORMAT) {
        setMessage('This link holds an engine workspace document, which the workbench does not open. Your saved workspace has not been changed.');
        return;
      }
      const read = readWorkbenchDocument(outcome.checked.document, makeRowId);
      if (!read.doc) {
        setMessage(`This link could not be opened: ${read.problem ?? 'not a workspace'}. Your saved workspace has not been changed.`);
        return;
      }
      useAppStore.getState().replaceWorkspace(read.doc as WorkbenchDocument, 'open link');
      const tab = outcome.checked.view.tab;
      if (typeof tab === 'string') useAppStore.getState().setActiveTab(tab);
      setMessage(outcome.notice);
    });
    return () => {
      live = false;
    };
  }, []);
  return { message, dismiss: () => setMessage(null) };
}
