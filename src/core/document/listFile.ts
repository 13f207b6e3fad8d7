import { formatCount } from '../format/marks.ts';
import { parseDocumentText } from './document.ts';
import { readNamedCurves } from './namedCurves.ts';
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
 * Parses and checks a list file (or a single workspace file), on the page: splitListFile, then
 * checkListEntry for each entry. Never throws.
 */
export function checkListFile(text: string, fileName: string): CheckedListFile {
  const split = splitListFile(text, fileName);
  const entries: { name: string; document: Record<string, unknown> }[] = [];
  const problems = [...split.problems];
  for (const e of split.entries) {
    const r = checkListEntry(e);
    if (typeof r === 'string') problems.push(r);
    else entries.push(r);
  }
  return { entries, problems };
}

/** A list file cut into its entries' texts (JSON only, nothing checked): what the reading worker sends the page. */
export interface SplitListFile {
  /** Each entry's workspace as JSON text, with its name and where it is named in messages. */
  readonly entries: readonly { readonly name: string; readonly where: string; readonly text: string }[];
  readonly problems: readonly string[];
}

/**
 * Parses a list file (or a single workspace file) and cuts it into its entries' texts, checking
 * nothing else: the part of an import that costs in proportion to the file (the JSON parse), run
 * in the reading worker for a large file. Never throws.
 */
export function splitListFile(text: string, fileName: string): SplitListFile {
  if (text.length > MAX_LIST_CHARS) return { entries: [], problems: [`${fileName} has ${formatCount(text.length)} characters; a list file is at most ${formatCount(MAX_LIST_CHARS)}`] };
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return { entries: [], problems: [`${fileName} is not valid JSON`] };
  }
  const entries: { name: string; where: string; text: string }[] = [];
  const problems: string[] = [];
  const obj = json as { format?: unknown; workspaces?: unknown };
  if (obj && obj.format === LIST_FORMAT && Array.isArray(obj.workspaces)) {
    obj.workspaces.forEach((w: unknown, i: number) => {
      const e = (w ?? {}) as { name?: unknown; workspace?: unknown };
      const name = typeof e.name === 'string' ? e.name : `Imported workspace ${i + 1}`;
      if (e.workspace === undefined) problems.push(`“${name}” was unreadable when it was exported; it is left out`);
      else entries.push({ name, where: `“${name}”`, text: JSON.stringify(e.workspace) });
    });
  } else entries.push({ name: fileName.replace(/\.json$/i, ''), where: fileName, text });
  return { entries, problems };
}

/** Checks one entry of a split list file: its workbench document, or a problem naming it. */
export function checkListEntry(entry: SplitListFile['entries'][number]): { readonly name: string; readonly document: Record<string, unknown> } | string {
  const checked = parseDocumentText(entry.text, readNamedCurves);
  if (!checked.ok) return `${entry.where}: ${checked.errors[0]?.message ?? 'not a workspace'}`;
  if (checked.value.document.format !== WORKBENCH_FORMAT) return `${entry.where}: an engine workspace document, which the workbench does not open`;
  return { name: entry.name, document: checked.value.document };
}
