import {
  capRows,
  depthProblem,
  LIMITS,
  readWorkbenchDocument,
  unknownSettings,
  type QuoteRow,
  type UnknownSetting,
  type WorkbenchDocument,
  formatCount,
} from '../core/index.ts';
import { makeRowId } from './ids.ts';

/** A saved workspace as the browser's entry holds it, checked against the caps every way in shares. */
export interface RestoreCheck {
  /** The workspace to show; null when the entry cannot be read (`problem` says why). */
  readonly doc: WorkbenchDocument | null;
  readonly problem: string | null;
  /** Settings this build does not know: the workspace opens read-only, their values kept. */
  readonly unknowns: readonly UnknownSetting[];
  /** What was not restored as saved, each with where it was (the caller keeps the full entry aside). */
  readonly notes: readonly string[];
}

/**
 * Checks a saved workspace read back from the browser: nesting depth (LIMITS.depth), settings this
 * build does not know (kept, for a read-only opening), entries of the quote list that are not rows,
 * and the caps (LIMITS.quotes rows, LIMITS.cell characters a cell, LIMITS.setting the settlement):
 * an entry saved by an older build beyond them opens with its first rows and cut cells, and every
 * such change is listed in `notes`.
 */
export function checkRestoredWorkspace(raw: unknown): RestoreCheck {
  const deep = depthProblem(raw, 'the saved entry');
  if (deep) return { doc: null, problem: deep, unknowns: [], notes: [] };
  const unknowns = unknownSettings(raw);
  const read = readWorkbenchDocument(raw, makeRowId, { keepUnknown: unknowns.length > 0 });
  if (!read.doc) return { doc: null, problem: read.problem, unknowns: [], notes: [] };
  const notes = [...read.changes];
  let doc = read.doc;
  const { rows, leftOut } = capRows(doc.quotes);
  if (leftOut > 0) {
    notes.push(`the saved workspace has ${formatCount(doc.quotes.length)} quotes, more than the ${LIMITS.quotes} a workspace may hold: the first ${LIMITS.quotes} are open and ${formatCount(leftOut)} were left out`);
  }
  let cut = 0;
  const quotes = rows.map((r): QuoteRow => {
    let out: Record<string, unknown> | null = null;
    for (const [k, v] of Object.entries(r)) {
      if (typeof v === 'string' && v.length > LIMITS.cell) {
        out ??= { ...r };
        out[k] = v.slice(0, LIMITS.cell);
        cut++;
      }
    }
    return (out ?? r) as unknown as QuoteRow;
  });
  if (cut > 0) notes.push(`${cut} ${cut === 1 ? 'cell was' : 'cells were'} longer than ${LIMITS.cell} characters and cut to that length`);
  if (leftOut > 0 || cut > 0) doc = { ...doc, quotes };
  if (doc.settlement.length > LIMITS.setting) {
    notes.push(`the settlement text was longer than ${LIMITS.setting} characters and was cut`);
    doc = { ...doc, settlement: doc.settlement.slice(0, LIMITS.setting) };
  }
  return { doc, problem: null, unknowns, notes };
}
