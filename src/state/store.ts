import { create } from 'zustand';
import type { AppState } from './appState.ts';
import { createHistorySlice } from './slices/historySlice.ts';
import { createReadOnlySlice } from './slices/readOnlySlice.ts';
import { createUiSlice } from './slices/uiSlice.ts';
import { createWorkspaceSlice } from './slices/workspaceSlice.ts';

/**
 * The workbench's single store, composed from slices. It holds inputs only: curves, tables and
 * chart series are derived in hooks (src/hooks) and never stored; the pointer position lives
 * outside it (src/charts/hover.ts).
 */
export const useAppStore = create<AppState>()((...a) => ({
  ...createWorkspaceSlice(...a),
  ...createHistorySlice(...a),
  ...createUiSlice(...a),
  ...createReadOnlySlice(...a),
}));

export type { AppState };
