import { formatCount } from '../format/quantities.ts';
import { parseDocumentText } from './document.ts';
import { WORKBENCH_FORMAT } from './workbenchDocument.ts';

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
 * the page runs in its reading worker for a large file. Never throws.
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
