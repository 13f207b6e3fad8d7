import type { StateCreator } from 'zustand';
import type { WorkbenchDocument } from '../../core/index.ts';
import type { AppState } from '../appState.ts';

/** Undo history is capped at this many steps. */
export const HISTORY_CAP = 200;

export interface HistorySlice {
  /** Earlier documents, oldest first (at most HISTORY_CAP). */
  past: readonly WorkbenchDocument[];
  /** Documents undone, the next redo last. */
  future: readonly WorkbenchDocument[];
  /** Edits with the same key in a row (typing in one cell) merge into one undo step. */
  lastEditKey: string | null;
  /** A short description of the last edit, for the undo button's label. */
  lastEditLabel: string | null;
  /** Replaces the document as one undoable step (merged with the previous step when `mergeKey` matches); refused while read-only. */
  commit(next: WorkbenchDocument, label: string, mergeKey?: string | null): void;
  /** Ends a run of merged edits (a cell lost focus). */
  endEdit(): void;
  /**
   * Takes back the run of merged edits with key `mergeKey` if it is the last step (Escape in a
   * cell being edited): the document goes back to before the run, with no step left behind and
   * nothing to redo. Does nothing otherwise.
   */
  cancelEdit(mergeKey: string): void;
  undo(): void;
  redo(): void;
}

export const createHistorySlice: StateCreator<AppState, [], [], HistorySlice> = (set, get) => ({
  past: [],
  future: [],
  lastEditKey: null,
  lastEditLabel: null,
  commit(next, label, mergeKey = null) {
    const s = get();
    // A read-only document (settings this build does not know) takes no edit of any kind.
    if (next === s.workspace || s.readOnly) return;
    // Any edit ends the paste notice: its "Undo paste" and "Append instead" act on the paste only
    // while the paste is the last step (a paste sets its notice after its own commit).
    if (mergeKey !== null && mergeKey === s.lastEditKey && s.past.length > 0) {
      set({ workspace: next, future: [], lastEditLabel: label, pasteNotice: null });
      return;
    }
    const past = s.past.length >= HISTORY_CAP ? [...s.past.slice(s.past.length - HISTORY_CAP + 1), s.workspace] : [...s.past, s.workspace];
    set({ workspace: next, past, future: [], lastEditKey: mergeKey, lastEditLabel: label, pasteNotice: null });
  },
  endEdit() {
    if (get().lastEditKey !== null) set({ lastEditKey: null });
  },
  cancelEdit(mergeKey) {
    const s = get();
    const prev = s.past[s.past.length - 1];
    if (s.readOnly || s.lastEditKey !== mergeKey || !prev) return;
    set({ workspace: prev, past: s.past.slice(0, -1), lastEditKey: null, lastEditLabel: null, pasteNotice: null });
  },
  undo() {
    const s = get();
    if (s.readOnly) return;
    const prev = s.past[s.past.length - 1];
    if (!prev) return;
    set({ workspace: prev, past: s.past.slice(0, -1), future: [...s.future, s.workspace], lastEditKey: null, lastEditLabel: null, pasteNotice: null });
  },
  redo() {
    const s = get();
    if (s.readOnly) return;
    const next = s.future[s.future.length - 1];
    if (!next) return;
    set({ workspace: next, past: [...s.past, s.workspace], future: s.future.slice(0, -1), lastEditKey: null, lastEditLabel: null, pasteNotice: null });
  },
});
