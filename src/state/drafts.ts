import { create } from 'zustand';

/**
 * Text typed into a field that commits on Enter or Tab (the roll panel's amount, horizon, ...)
 * but not committed yet, by field key. Saved with the workspace (not in the document: the
 * document holds committed values only), so a reload or a closed tab keeps what was typed.
 */
export const useDrafts = create<{ drafts: Readonly<Record<string, string>> }>(() => ({ drafts: {} }));

/** Records a field's uncommitted text; null when the field shows the committed value again. */
export function setFieldDraft(key: string, text: string | null): void {
  const drafts = useDrafts.getState().drafts;
  if (text === null ? !(key in drafts) : drafts[key] === text) return;
  const next = { ...drafts };
  if (text === null) delete next[key];
  else next[key] = text;
  useDrafts.setState({ drafts: next });
}

/** Reads saved drafts back: string values only, at most 100 of at most 1,000 characters each. */
export function readDrafts(raw: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return out;
  for (const [k, v] of Object.entries(raw).slice(0, 100)) if (typeof v === 'string' && v.length <= 1000) out[k] = v;
  return out;
}
