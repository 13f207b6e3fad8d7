import type { HistorySlice } from './slices/historySlice.ts';
import type { ReadOnlySlice } from './slices/readOnlySlice.ts';
import type { UiSlice } from './slices/uiSlice.ts';
import type { WorkspaceSlice } from './slices/workspaceSlice.ts';

/** The one store: the serialisable workspace (quote text as typed), its history and UI state. */
export type AppState = WorkspaceSlice & HistorySlice & UiSlice & ReadOnlySlice;
