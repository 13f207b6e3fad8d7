import { checkListFile, readWorkbenchDocument, type CheckedListFile, type WorkbenchDocument } from '../../core/index.ts';
import { makeRowId } from '../../state/ids.ts';

/** The checked entries as workbench documents with this page's row ids (cheap; runs on the page). */
export function readCheckedList(checked: CheckedListFile): { items: { name: string; workspace: WorkbenchDocument }[]; problems: string[] } {
  const items: { name: string; workspace: WorkbenchDocument }[] = [];
  const problems = [...checked.problems];
  for (const e of checked.entries) {
    const read = readWorkbenchDocument(e.document, makeRowId);
    if (read.doc) items.push({ name: e.name, workspace: read.doc });
    else problems.push(`“${e.name}”: ${read.problem ?? 'not a workspace'}`);
  }
  return { items, problems };
}

/** Reads a list file (or a single workspace file) on the page; never throws. */
export const readListFile = (text: string, fileName: string): { items: { name: string; workspace: WorkbenchDocument }[]; problems: string[] } => readCheckedList(checkListFile(text, fileName));
