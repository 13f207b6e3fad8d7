/**
 * Opening a workspace file: the document checks (caps, schema, scenarios, snapshots, view) and the
 * engine document's conversion to the sheet, fetched when a file is first opened, so the first
 * load carries none of it (WorkspaceFiles.tsx, ShareBar.tsx).
 */
export { parseDocumentText, workbenchFromEngine } from '../core/index.ts';
