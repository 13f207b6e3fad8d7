import { isPlainObject, type ViewValue, type WorkbenchDocument } from '../core/index.ts';
import { useAppStore } from './store.ts';

/**
 * The document's `view` (panel choices saved, undone and shared with the workspace: the print
 * title, the forward calculator's rows, the forward grid's axes). An absent or damaged view
 * reads as empty.
 */
export function viewOf(doc: WorkbenchDocument): Readonly<Record<string, unknown>> {
  const v = doc.view;
  return isPlainObject(v) ? v : {};
}

/** A text value of the view, or the fallback when it is absent or not text. */
export const viewText = (doc: WorkbenchDocument, key: string, fallback: string): string => {
  const x = viewOf(doc)[key];
  return typeof x === 'string' ? x : fallback;
};

/** A list of texts of the view, or the fallback when it is absent or not a list of texts. */
export const viewList = (doc: WorkbenchDocument, key: string, fallback: readonly string[]): readonly string[] => {
  const x = viewOf(doc)[key];
  return Array.isArray(x) && x.every((s) => typeof s === 'string') ? (x as string[]) : fallback;
};

/**
 * Sets view keys as one undo step labelled `label`; with `mergeKey`, a stretch of typing in one
 * field is one step (ended by the store's endEdit when the field loses focus).
 */
export function setViewValues(patch: Readonly<Record<string, ViewValue>>, label: string, mergeKey?: string): void {
  const s = useAppStore.getState();
  s.commit({ ...s.workspace, view: { ...viewOf(s.workspace), ...patch } }, label, mergeKey);
}
