import { parseDocumentText as parseText, readNamedCurves, workbenchFromEngine as fromEngine, type DocumentOutcome, type Result, type WorkbenchDocument } from '../core/index.ts';

/**
 * Opening a workspace file: the document checks (caps, schema, scenarios, snapshots, view, named
 * curves) and the engine document's conversion to the sheet, fetched when a file is first opened,
 * so the first load carries none of it (WorkspaceFiles.tsx, ShareBar.tsx). Both read named curves
 * (`readNamedCurves`), which the workbench keeps as given.
 */
export const parseDocumentText = (text: string): DocumentOutcome => parseText(text, readNamedCurves);
export const workbenchFromEngine = (raw: unknown, makeId: () => string): Result<WorkbenchDocument> => fromEngine(raw, makeId, readNamedCurves);
