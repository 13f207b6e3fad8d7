import { useEffect } from 'react';
import { create } from 'zustand';
import { readWorkbenchDocument, WORKBENCH_FORMAT, type WorkbenchDocument } from '../core/index.ts';
import { makeRowId } from '../state/ids.ts';
import { openAsNewWorkspace, switchWorkspace } from '../state/persistence.ts';
import { useAppStore } from '../state/store.ts';
import type { LinkOutcome } from './linkCodec.ts';

/** The link codec is fetched only when there is a link to open (its own chunk). */
const decodeWorkspaceLink = (hash: string) => import('./linkCodec.ts').then((m) => m.decodeWorkspaceLink(hash));
import { showOpenedNotice } from './OpenedNotice.tsx';

/** Why the last link was not opened (null: none), for every component showing it. */
const useLinkMessage = create<{ message: string | null }>(() => ({ message: null }));
/** The fragment being opened now: a second listener or hook seeing it leaves it to the first. */
let inFlight: string | null = null;

const hasLink = (hash: string): boolean => hash.startsWith('#ws');

/** The name a workspace opened from a link gets in the list (the user can rename it). */
function linkName(): string {
  const when = new Date().toLocaleString('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
  return `From a link, ${when}`;
}

/**
 * Applies a decoded link: a good link opens as a new workspace in the list (the one shown before
 * is saved and kept), with a notice offering the way back; a bad one changes nothing. Either way
 * the fragment leaves the address, so a reload does not open it again. Returns why a link was not
 * opened (null when it was: the opened notice, OpenedNotice.tsx, says what happened).
 */
async function applyLinkOutcome(outcome: LinkOutcome): Promise<string | null> {
  window.history.replaceState(null, '', window.location.pathname + window.location.search);
  if (!outcome.ok) return outcome.message;
  if (outcome.checked.document.format !== WORKBENCH_FORMAT) {
    return 'This link holds an engine workspace document, which the workbench does not open. Your saved workspace has not been changed.';
  }
  const unknowns = outcome.checked.unknowns;
  const read = readWorkbenchDocument(outcome.checked.document, makeRowId, { keepUnknown: unknowns.length > 0 });
  if (!read.doc) return `This link could not be opened: ${read.problem ?? 'not a workspace'}. Your saved workspace has not been changed.`;
  // Settings this build does not know: shown as they are, read-only, never replaced by defaults
  // (nothing is saved, so no entry is added to the list).
  if (unknowns.length > 0) {
    useAppStore.getState().openReadOnly(read.doc, unknowns, 'link');
    return outcome.notice;
  }
  // A read-only document on screen (the saved one, from another build) gives way to the link.
  useAppStore.getState().closeReadOnly();
  const doc = read.doc as WorkbenchDocument;
  const name = linkName();
  const back = await openAsNewWorkspace(doc, name);
  const tab = outcome.checked.view.tab;
  if (typeof tab === 'string') useAppStore.getState().setActiveTab(tab);
  const extra = outcome.notice ? ` ${outcome.notice}` : '';
  if (back.previousId !== null) {
    const previousId = back.previousId;
    const text = `Opened a shared workspace as a new entry, “${name}”; your own, “${back.previousName ?? 'workspace'}”, is kept unchanged in the list of workspaces.${extra}`;
    showOpenedNotice({ text, action: { label: `Back to “${back.previousName ?? 'workspace'}”`, run: () => void switchWorkspace(previousId) } });
    return null;
  }
  if (back.mode === 'entry') {
    // What was shown before was the demo, never edited: nothing of the user's to go back to.
    showOpenedNotice({ text: `Opened a shared workspace as a new entry, “${name}”, in the list of workspaces.${extra}`, action: null });
    return null;
  }
  const text = `Opened a shared workspace; your own is one Undo away.${extra}`;
  showOpenedNotice({ text, action: { label: 'Undo', ariaLabel: 'Undo opening the link', run: () => useAppStore.getState().undo() } });
  return null;
}

/**
 * For the entry point, after the saved workspace was restored and before the first render: when
 * the address holds a workspace link, decodes and opens it now, so the first chart drawn is the
 * link's. The message (if any) is kept for useOpenLinkOnStart() to show. Never rejects.
 */
export async function openLinkBeforeRender(): Promise<void> {
  const hash = window.location.hash;
  if (!hasLink(hash)) return;
  await openFragment(hash);
}

/** Decodes and applies one fragment, once however many listeners see it. */
async function openFragment(hash: string): Promise<void> {
  if (!hasLink(hash) || inFlight === hash) return;
  inFlight = hash;
  try {
    const message = await applyLinkOutcome(await decodeWorkspaceLink(hash)).catch(() => 'This link could not be opened. Your saved workspace has not been changed.');
    useLinkMessage.setState({ message });
  } finally {
    inFlight = null;
  }
}

/**
 * Opens a workspace link in the address (#ws...): once after the saved workspace was restored,
 * and again whenever the fragment changes while the page is open (a link pasted into the address
 * bar of a tab already showing the workbench). A good link opens as a new workspace in the list;
 * a bad one leaves everything as it was and returns the message to show. When the entry point
 * already opened the link (openLinkBeforeRender), this only shows its message.
 */
export function useOpenLinkOnStart(): { message: string | null; dismiss: () => void } {
  const message = useLinkMessage((st) => st.message);
  useEffect(() => {
    const follow = (): void => void openFragment(window.location.hash);
    follow();
    window.addEventListener('hashchange', follow);
    return () => window.removeEventListener('hashchange', follow);
  }, []);
  return { message, dismiss: () => useLinkMessage.setState({ message: null }) };
}
