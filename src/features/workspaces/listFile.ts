import { formatCount, parseDocumentText, readWorkbenchDocument, WORKBENCH_FORMAT, type WorkbenchDocument } from '../../core/index.ts';
import { makeRowId } from '../../state/ids.ts';

/** The file holding every saved workspace ("Export all"). */
export const LIST_FORMAT = 'tenorscope-workspace-list';
export const LIST_VERSION = 1;
/** A list file is refused above this many characters (before it is parsed). */
export const MAX_LIST_CHARS = 50_000_000;


/** A list file's entries that read as workbench documents (checked, not yet given row ids), and what was left out. */
export interface CheckedListFile {
  readonly entries: readonly { readonly name: string; readonly document: Record<string, unknown> }[];
  readonly problems: readonly string[];
}

/**
 * Parses and checks a list file (or a single workspace file): the heavy part of an import, which
 * the page runs in a worker for a large file (listFile.worker.ts). Never throws.
 */
export function checkListFile(text: string, fileName: string): CheckedListFile {
  const problems: string[] = [];
  const entries: { name: string; document: Record<string, unknown> }[] = [];
  if (text.length > MAX_LIST_CHARS) return { entries, problems: [`${fileName} has ${formatCount(text.length)} characters; a list file is at most ${formatCount(MAX_LIST_CHARS)}`] };
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return { entries, problems: [`${fileName} is not valid JSON`] };
  }
  const one = (raw: unknown, name: string, where: string): void => {
    const checked = parseDocumentText(JSON.stringify(raw));
    if (!checked.ok) {
      problems.push(`${where}: ${checked.errors[0]?.message ?? 'not a workspace'}`);
      return;
    }
    if (checked.value.document.format !== WORKBENCH_FORMAT) {
      problems.push(`${where}: an engine workspace document, which the workbench does not open`);
      return;
    }
    entries.push({ name, document: checked.value.document });
  };
  const obj = json as { format?: unknown; workspaces?: unknown };
  if (obj && obj.format === LIST_FORMAT && Array.isArray(obj.workspaces)) {
    obj.workspaces.forEach((w: unknown, i: number) => {
      const e = (w ?? {}) as { name?: unknown; workspace?: unknown; unreadable?: unknown };
      const name = typeof e.name === 'string' ? e.name : `Imported workspace ${i + 1}`;
      if (e.workspace === undefined) problems.push(`“${name}” was unreadable when it was exported; it is left out`);
      else one(e.workspace, name, `“${name}”`);
    });
  } else one(json, fileName.replace(/\.json$/i, ''), fileName);
  return { entries, problems };
}

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
