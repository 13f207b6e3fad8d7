import { useRef, useState, type ChangeEvent } from 'react';
import { curveTableCsv, formatNumber, MAX_FILE_CHARS, serialiseDocument, type CheckedDocument, type CurveTableConventions } from '../core/index.ts';
import type { Curve } from '../core/index.ts';
import { download } from '../components/download.ts';

export interface WorkspaceFilesProps {
  /** The workspace document as saved (snapshots included). */
  readonly document: Record<string, unknown>;
  /** The base curve for the CSV table; null disables the export. */
  readonly curve: Curve | null;
  readonly conventions: CurveTableConventions | null;
  /** Points of the CSV table (tenors or dates); default: the curve's pillar dates. */
  readonly points?: readonly string[];
  /** Called with a validated document read from a file (validated like a link). */
  readonly onOpen: (checked: CheckedDocument) => void;
  /** Base of the downloaded file names. */
  readonly fileName?: string;
}

/** Save and open the workspace as a JSON file; export the curve table as CSV. */
export function WorkspaceFiles({ document: doc, curve, conventions, points, onOpen, fileName = 'tenorscope-workspace' }: WorkspaceFilesProps) {
  const input = useRef<HTMLInputElement>(null);
  const [message, setMessage] = useState<string | null>(null);
  const open = async (e: ChangeEvent<HTMLInputElement>): Promise<void> => {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    if (file.size > 4 * MAX_FILE_CHARS) {
      setMessage(`${file.name} is ${formatNumber(file.size / 1e6, 1)} MB, far more than a workspace file; it was not opened. Your workspace has not been changed.`);
      return;
    }
    let text: string;
    try {
      text = await file.text();
    } catch {
      setMessage(`${file.name} could not be read. Your workspace has not been changed.`);
      return;
    }
    // Parsed on the page: the largest workspace the caps allow (about 1.5 million characters) takes
    // 11-18 ms, and a longer text is refused by its length before it is parsed (MAX_FILE_CHARS).
    const { parseDocumentText } = await import('./documentReader.ts');
    const r = parseDocumentText(text);
    if (!r.ok) {
      const first = r.errors.slice(0, 3).map((x) => x.message).join('; ');
      setMessage(`${file.name} was not opened: ${first}${r.errors.length > 3 ? ` (and ${r.errors.length - 3} more)` : ''}. Your workspace has not been changed.`);
      return;
    }
    setMessage(null);
    onOpen(r.value);
  };
  return (
    <div className="workspace-files">
      <button type="button" onClick={() => download(`${fileName}.json`, 'application/json', serialiseDocument(doc))}>
        Save workspace file
      </button>
      <button type="button" onClick={() => input.current?.click()}>
        Open workspace file
      </button>
      <input ref={input} type="file" accept=".json,application/json" hidden onChange={(e) => void open(e)} aria-label="Workspace file to open" />
      <button type="button" disabled={!curve || !conventions} onClick={() => curve && conventions && download(`${fileName}-curve.csv`, 'text/csv', curveTableCsv(curve, conventions, points))}>
        Export curve table (CSV)
      </button>
      {message && (
        <p className="field-error" role="alert">
          {message}
        </p>
      )}
    </div>
  );
}
