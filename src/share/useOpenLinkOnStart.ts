import { useEffect, useState } from 'react';
import { readWorkbenchDocument, WORKBENCH_FORMAT, type WorkbenchDocument } from '../core/index.ts';
import { makeRowId } from '../state/ids.ts';
import { useAppStore } from '../state/store.ts';
import { decodeWorkspaceLink, type LinkOutcome } from './linkCodec.ts';

/** The message left by openLinkBeforeRender() for the first render to show (null: none). */
let pendingMessage: string | null = null;

const hasLink = (hash: string): boolean => hash.startsWith('#ws');

/**
 * Applies a decoded link to the store: a good link replaces the workspace as one undoable step
 * (and opens its tab); a bad one changes nothing. Either way the fragment leaves the address, so a
 * reload does not open it again. Returns the message to show (null when there is none).
 */
function applyLinkOutcome(outcome: LinkOutcome): string | null {
  window.history.replaceState(null, '', window.location.pathname + window.location.search);
  if (!outcome.ok) return outcome.message;
  if (outcome.checked.document.format !== WORKBENCH_FORMAT) {
    return 'This link holds an engine workspace document, which the workbench does not open. Your saved workspace has not been changed.';
  }
  const unknowns = outcome.checked.unknowns;
  const read = readWorkbenchDocument(outcome.checked.document, makeRowId, { keepUnknown: unknowns.length > 0 });
  if (!read.doc) return `This link could not be opened: ${read.problem ?? 'not a workspace'}. Your saved workspace has not been changed.`;
  // Settings this build does not know: shown as they are, read-only, never replaced by defaults.
  if (unknowns.length > 0) useAppStore.getState().openReadOnly(read.doc, unknowns, 'link');
  else {
    // A read-only document on screen (the saved one, from another build) gives way to the link.
    useAppStore.getState().closeReadOnly();
    useAppStore.getState().replaceWorkspace(read.doc as WorkbenchDocument, 'open link');
  }
  const tab = outcome.checked.view.tab;
  if (typeof tab === 'string') useAppStore.getState().setActiveTab(tab);
  return outcome.notice;
}

/**
 * For the entry point, after the saved workspace was restored and before the first render: when
 * the address holds a workspace link, decodes and opens it now, so the first chart drawn is the
 * link's. The message (if any) is kept for useOpenLinkOnStart() to show. Never rejects.
 */
export async function openLinkBeforeRender(): Promise<void> {
  const hash = window.location.hash;
  if (!hasLink(hash)) return;
  pendingMessage = applyLinkOutcome(await decodeWorkspaceLink(hash));
}

/**
 * Opens a workspace link in the address (#ws...) once, after the saved workspace was restored:
 * a good link replaces the workspace as one undoable step (with a notice when it comes from
 * another build); a bad one leaves everything as it was and returns the message to show. The
 * fragment is removed from the address afterwards, so a reload does not open it again. When the
 * entry point already opened the link (openLinkBeforeRender), this only shows its message.
 */
export function useOpenLinkOnStart(): { message: string | null; dismiss: () => void } {
  const [message, setMessage] = useState<string | null>(() => pendingMessage);
  useEffect(() => {
    pendingMessage = null;
    const hash = window.location.hash;
    if (!hasLink(hash)) return;
    let live = true;
    void decodeWorkspaceLink(hash).then((outcome) => {
      if (!live) return;
      setMessage(applyLinkOutcome(outcome));
    });
    return () => {
      live = false;
    };
  }, []);
  return { message, dismiss: () => setMessage(null) };
}
