import type { StateCreator } from 'zustand';
import type { QuoteRow, RowText } from '../../core/index.ts';
import type { AppState } from '../appState.ts';

/** What the last paste did, so the user can choose to append instead. */
export interface PasteNotice {
  readonly mode: 'replaced' | 'filled' | 'appended';
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

/** Where the workspace is kept and what went wrong keeping it. */
export interface StorageStatus {
  /** saved: in the browser; memory: only in this page (storage full or unavailable); paused: another tab wrote it. */
  readonly state: 'saved' | 'pending' | 'memory' | 'paused';
  readonly message: string | null;
  /** Another tab has the same workspace open. */
  readonly otherTab: boolean;
  /** The saved entry could not be read at start; its copy is kept under this storage key. */
  readonly corruptCopyKey: string | null;
  readonly corruptReason: string | null;
  readonly savedAt: number | null;
  /** What was not restored exactly as saved (rows over the cap, entries that were not rows...), each with where. */
  readonly restoreNotes: readonly string[];
  /** The full saved entry is kept in the browser under this key (when restoreNotes or a read-only opening). */
  readonly keptCopyKey: string | null;
}

export type TabId = string;

export interface UiSlice {
  activeTab: TabId;
  /** The sheet row whose schedule and repricing details are open. */
  selectedRowId: string | null;
  pasteNotice: PasteNotice | null;
  storage: StorageStatus;
  setActiveTab(tab: TabId): void;
  selectRow(id: string | null): void;
  dismissPasteNotice(): void;
  setStorage(patch: Partial<StorageStatus>): void;
}

export const INITIAL_STORAGE: StorageStatus = {
  state: 'saved',
  message: null,
  otherTab: false,
  corruptCopyKey: null,
  corruptReason: null,
  savedAt: null,
  restoreNotes: [],
  keptCopyKey: null,
};

export const createUiSlice: StateCreator<AppState, [], [], UiSlice> = (set) => ({
  activeTab: 'key-maturities',
  selectedRowId: null,
  pasteNotice: null,
  storage: INITIAL_STORAGE,
  setActiveTab: (tab) => set({ activeTab: tab }),
  selectRow: (id) => set({ selectedRowId: id }),
  dismissPasteNotice: () => set({ pasteNotice: null }),
  setStorage: (patch) => set((s) => ({ storage: { ...s.storage, ...patch } })),
});
