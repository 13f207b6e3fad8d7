import type { StateCreator } from 'zustand';
import type { PastedBlock, PastePreview, QuoteRow, RowText } from '../../core/index.ts';
import type { AppState } from '../appState.ts';

/** What the last paste did, so the user can choose to append instead. */
export interface PasteNotice {
  /** refused: a header paste that would have left no quote (or too many rows) did nothing; `message` says why. */
  readonly mode: 'replaced' | 'filled' | 'appended' | 'refused';
  readonly message?: string;
  readonly rows: number;
  readonly ignoredColumns: readonly string[];
  /** For a replace: the quotes before it and the pasted rows, to append instead. */
  readonly before?: readonly QuoteRow[];
  readonly pasted?: readonly RowText[];
  /** Rows of the paste left out at the quote cap (LIMITS.quotes): the first rows were kept. */
  readonly leftOut?: number;
  /** Pasted cells longer than LIMITS.cell characters, cut to that length. */
  readonly clippedCells?: number;
}

/** A header paste waiting for the user's choice, with how each column was read. */
export interface PendingPaste {
  readonly block: PastedBlock;
  readonly preview: PastePreview & { readonly appendRefusal: string | null };
  /** Rows beyond the quote cap the paste reader did not send (counted as left out). */
  readonly dropped?: number;
}

/** Where the workspace is kept and what went wrong keeping it. */
export interface StorageStatus {
  /**
   * saved: all of it (document and undo history) is in the browser; pending: an edit is waiting
   * for its save; partial: the document was saved but not its undo history; memory: the last
   * edits are only in this page (storage full or unavailable); paused: another tab saved this
   * workspace since this tab loaded it.
   */
  readonly state: 'saved' | 'pending' | 'partial' | 'memory' | 'paused';
  /** What was and was not saved, and why, when not everything was. */
  readonly message: string | null;
  /** Another tab has the same workspace open. */
  readonly otherTab: boolean;
  /** A saved workspace could not be opened: its name and why (it is kept unchanged in the list). */
  readonly corruptName: string | null;
  readonly corruptReason: string | null;
  /** When the document was last saved (ms since 1970), null before the first save. */
  readonly savedAt: number | null;
  /** What was not restored exactly as saved (rows over the cap, entries that were not rows...), each with where. */
  readonly restoreNotes: readonly string[];
  /** The full saved entry is kept in the browser under this key (when restoreNotes or a read-only opening). */
  readonly keptCopyKey: string | null;
  /** Where saves go: the browser's database, localStorage (fallback), or nowhere. */
  readonly backend: 'indexeddb' | 'localStorage' | null;
}

export type TabId = string;

export interface UiSlice {
  activeTab: TabId;
  /** The sheet row whose schedule and repricing details are open. */
  selectedRowId: string | null;
  /** A request to bring a sheet row into view and focus it (from a link elsewhere); `n` tells repeated requests apart. */
  rowRequest: { readonly id: string; readonly n: number } | null;
  pasteNotice: PasteNotice | null;
  /** A header paste shown as a column-mapping preview; nothing is replaced until the user confirms. */
  pendingPaste: PendingPaste | null;
  /** A large paste being read in a worker: its size and, once split, its rows. */
  pasteProgress: { readonly chars: number; readonly rows: number | null } | null;
  storage: StorageStatus;
  setActiveTab(tab: TabId): void;
  selectRow(id: string | null): void;
  /** Selects a sheet row and asks the sheet to bring it into view and focus its first cell. */
  showRow(id: string): void;
  dismissPasteNotice(): void;
  cancelPaste(): void;
  setPasteProgress(progress: UiSlice['pasteProgress']): void;
  setStorage(patch: Partial<StorageStatus>): void;
}

export const INITIAL_STORAGE: StorageStatus = {
  state: 'saved',
  message: null,
  otherTab: false,
  corruptName: null,
  corruptReason: null,
  savedAt: null,
  restoreNotes: [],
  keptCopyKey: null,
  backend: null,
};

export const createUiSlice: StateCreator<AppState, [], [], UiSlice> = (set) => ({
  activeTab: 'key-maturities',
  selectedRowId: null,
  rowRequest: null,
  pasteNotice: null,
  pendingPaste: null,
  pasteProgress: null,
  storage: INITIAL_STORAGE,
  setActiveTab: (tab) => set({ activeTab: tab }),
  selectRow: (id) => set({ selectedRowId: id }),
  showRow: (id) => set((s) => ({ selectedRowId: id, rowRequest: { id, n: (s.rowRequest?.n ?? 0) + 1 } })),
  dismissPasteNotice: () => set({ pasteNotice: null }),
  cancelPaste: () => set({ pendingPaste: null, pasteProgress: null }),
  setPasteProgress: (progress) => set({ pasteProgress: progress }),
  setStorage: (patch) => set((s) => ({ storage: { ...s.storage, ...patch } })),
});
