import { create } from 'zustand';
import type { WorkbenchDocument } from '../core/index.ts';

/** One saved workspace as the list shows it (the document is its input; previews are derived from it). */
export interface WorkspaceListItem {
  readonly id: string;
  readonly name: string;
  /** When it was last saved (ms since 1970); null for a workspace not saved yet. */
  readonly savedAt: number | null;
  /** The saved document; null when the entry could not be read. */
  readonly workspace: WorkbenchDocument | null;
  /** Why the entry could not be read, in words; null when it was read. */
  readonly problem: string | null;
}

/** A deleted entry, kept in memory until the next delete so Undo can write it back. */
export interface DeletedEntry {
  readonly name: string;
  readonly id: string;
  readonly record: unknown;
}

export interface WorkspaceListState {
  readonly items: readonly WorkspaceListItem[];
  /** The entry this tab shows and saves. */
  readonly currentId: string | null;
  readonly deleted: DeletedEntry | null;
  /** What the last list command did or why it failed (plain text), or null. */
  readonly notice: string | null;
  /** The Workspaces panel is shown. */
  readonly panelOpen: boolean;
}

/**
 * The saved workspaces of this browser, kept apart from the workbench store: persistence.ts
 * fills it from the database and the Workspaces panel reads it. Holds inputs only.
 */
export const useWorkspaceList = create<WorkspaceListState>()(() => ({ items: [], currentId: null, deleted: null, notice: null, panelOpen: false }));
