import { pasteQuoteCap, readPastedBlock, readSplitBlock, previewPaste, type InputConventions, type PastedBlock, type PastePreview, type QuoteUnitMode } from '../../core/index.ts';
import { startReader, type ReaderReply, type ReaderRequest } from '../../share/readerRequests.ts';
import { registerPasteTools } from '../../state/pasteTools.ts';

// The store confirms pastes with these (state/pasteTools.ts); this module is the paste reader's chunk.
registerPasteTools({ readPastedBlock, previewPaste });

/** Pastes from this many characters are read in a worker (a 500-row sheet pastes as about 20,000): share/offThread.ts. */
import { WORKER_FROM_CHARS } from '../../share/offThread.ts';
export { WORKER_FROM_CHARS };

export interface PasteReaderRequest {
  readonly text: string;
  readonly mode: QuoteUnitMode;
  readonly existing: number;
  readonly conventions: InputConventions;
}

export interface PasteReaderDone {
  readonly block: PastedBlock;
  /** For a header paste: what it would do (computed on the block as kept). */
  readonly preview: (PastePreview & { readonly appendRefusal: string | null }) | null;
  /** Why the paste is refused before it reaches the sheet, or null. */
  readonly refusal: string | null;
  /** Rows beyond the quote cap not kept (the sheet keeps the first rows and counts these as left out). */
  readonly dropped: number;
}

/** The page's part of a big paste: the preview of the kept rows, and how many rows were not kept (of `count` in the block, header included). */
export function readSplit(block: PastedBlock, count: number, request: PasteReaderRequest): PasteReaderDone {
  // A par curve by tenor gives one row per tenor of the row it uses (tenorColumns.ts), whatever the paste's length.
  const total = block.byTenor ? block.rows.length : block.header ? count - 1 : count;
  const kept = block.header ? block.rows.length : block.cells.length;
  const dropped = Math.max(0, total - kept);
  if (block.byTenor && count > pasteQuoteCap() + 1) {
    // The worker keeps the first rows only: the row used is the last of those, not the paste's last.
    const notes = [...(block.notes ?? []), `The paste has ${count - 1} rows under the header and only the first ${pasteQuoteCap()} were read: the row used is the last of those, not the paste's last row. Paste fewer rows to use another.`];
    block = { ...block, notes };
  }
  return { block, preview: block.header ? previewPaste(block, request.mode, request.existing, request.conventions, total) : null, refusal: null, dropped };
}

/**
 * Reads pasted text: from WORKER_FROM_CHARS characters the reading worker splits it (so the page
 * never freezes on a big paste) and the page reads at most the cap's rows of it; below that, or
 * where workers are missing or fail, all on the page. `onProgress` hears the number of rows once
 * the text is split. Returns a function that cancels the reading.
 */
export function readPaste(request: PasteReaderRequest, onDone: (done: PasteReaderDone) => void, onProgress: (rows: number) => void): () => void {
  const onPage = (): void => {
    const block = readPastedBlock(request.text);
    onDone({ block, preview: block.header ? previewPaste(block, request.mode, request.existing, request.conventions) : null, refusal: null, dropped: 0 });
  };
  if (request.text.length < WORKER_FROM_CHARS || typeof Worker === 'undefined') {
    onPage();
    return () => undefined;
  }
  let worker: Worker;
  try {
    worker = startReader();
  } catch {
    onPage();
    return () => undefined;
  }
  let finished = false;
  const finish = (then: () => void): void => {
    if (finished) return;
    finished = true;
    worker.terminate();
    then();
  };
  worker.onmessage = (e: MessageEvent<ReaderReply>) => {
    const reply = e.data;
    if (reply.type !== 'split') return;
    const block = readSplitBlock(reply.table);
    onProgress(block.header ? reply.rows - 1 : reply.rows);
    // The page previews the kept rows after the progress has painted (a task of its own).
    setTimeout(() => finish(() => onDone(readSplit(block, reply.rows, request))), 0);
  };
  // A worker that cannot start or fails (an old browser, a blocked script): read on the page instead.
  worker.onerror = () => finish(onPage);
  worker.onmessageerror = () => finish(onPage);
  const message: ReaderRequest = { type: 'split', text: request.text, keep: pasteQuoteCap() + 1 };
  worker.postMessage(message);
  return () => {
    finished = true;
    worker.terminate();
  };
}
