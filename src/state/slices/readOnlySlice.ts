import type { StateCreator } from 'zustand';
import { readWorkbenchDocument, replaceUnknownSettings, type UnknownSetting, type WorkbenchDocument } from '../../core/index.ts';
import type { AppState } from '../appState.ts';
import { makeRowId } from '../ids.ts';

/** Where a read-only document came from. */
export type ReadOnlySource = 'link' | 'file' | 'saved';

/**
 * A document this build cannot edit faithfully (it names settings this build does not know) is
 * shown as it is, read-only: edits, undo and saving are refused until the user makes an editable
 * copy (each unknown replaced by a choice shown to them) or goes back to the workspace they had.
 */
export interface ReadOnlyState {
  readonly source: ReadOnlySource;
  readonly unknowns: readonly UnknownSetting[];
  /** The workspace and history before the document was opened, restored by closeReadOnly. */
  readonly before: { readonly workspace: WorkbenchDocument; readonly past: readonly WorkbenchDocument[]; readonly future: readonly WorkbenchDocument[] };
}

export interface ReadOnlySlice {
  /** Non-null while a document with unknown settings is shown read-only. */
  readOnly: ReadOnlyState | null;
  /**
   * Shows `doc` (read with its unknown values kept) read-only. `fallback` is what goes back on
   * screen if the user closes it (default: the workspace shown now).
   */
  openReadOnly(doc: WorkbenchDocument, unknowns: readonly UnknownSetting[], source: ReadOnlySource, fallback?: WorkbenchDocument): void;
  /** Leaves the read-only document and shows the workspace from before it, with its history. */
  closeReadOnly(): void;
  /**
   * Replaces the read-only document by an editable copy: each unknown setting takes the choice
   * given for its path (the user saw and picked it; a missing one takes the setting's default) and
   * an unknown setting name is left out. One undoable step from the workspace before.
   */
  makeEditableCopy(choices: Readonly<Record<string, string | number | boolean>>): void;
}

const LABEL: Readonly<Record<ReadOnlySource, string>> = { link: 'open link (editable copy)', file: 'open workspace file (editable copy)', saved: 'saved workspace (editable copy)' };

export const createReadOnlySlice: StateCreator<AppState, [], [], ReadOnlySlice> = (set, get) => ({
  readOnly: null,
  openReadOnly(doc, unknowns, source, fallback) {
    const s = get();
    const before = s.readOnly?.before ?? { workspace: fallback ?? s.workspace, past: fallback ? [] : s.past, future: fallback ? [] : s.future };
    set({ readOnly: { source, unknowns, before }, workspace: doc, past: [], future: [], lastEditKey: null, lastEditLabel: null, selectedRowId: null, pasteNotice: null });
  },
  closeReadOnly() {
    const r = get().readOnly;
    if (!r) return;
    set({ readOnly: null, workspace: r.before.workspace, past: r.before.past, future: r.before.future, lastEditKey: null, lastEditLabel: null });
  },
  makeEditableCopy(choices) {
    const r = get().readOnly;
    if (!r) return;
    const copy = readWorkbenchDocument(replaceUnknownSettings(get().workspace as unknown as Record<string, unknown>, choices), makeRowId).doc;
    if (!copy) return;
    set({ readOnly: null, workspace: r.before.workspace, past: r.before.past, future: r.before.future, lastEditKey: null });
    get().commit(copy, LABEL[r.source]);
  },
});
