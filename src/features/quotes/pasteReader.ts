import { readPastedBlock, previewPaste, type InputConventions, type PastedBlock, type PastePreview, type QuoteUnitMode } from '../../core/index.ts';
import { startReader } from '../../share/readerRequests.ts';

/** Pastes from this many characters are read in a worker (a 500-row sheet pastes as about 20,000). */
export const WORKER_FROM_CHARS = 64_000;

export interface PasteReaderRequest {
  readonly type: 'paste';
  readonly text: string;
  readonly mode: QuoteUnitMode;
  readonly existing: number;
  readonly conventions: InputConventions;
}

export type PasteReaderReply =
  | { readonly type: 'progress'; readonly rows: number }
  | {
      readonly type: 'done';
      readonly block: PastedBlock;
      /** For a header paste: what it would do (computed on the full block). */
      readonly preview: (PastePreview & { readonly appendRefusal: string | null }) | null;
      /** Why the paste is refused before it reaches the sheet, or null. */
      readonly refusal: string | null;
      /** Rows beyond the quote cap not sent back (the sheet keeps the first rows and counts these as left out). */
      readonly dropped: number;
    };

export type PasteReaderDone = Extract<PasteReaderReply, { type: 'done' }>;

/**
 * Reads pasted text: in a Web Worker from WORKER_FROM_CHARS characters (so the page never
 * freezes on a big paste), synchronously below that or where workers are missing. `onProgress`
 * hears the number of rows once the text is split. Returns a function that cancels the reading.
 */
export function readPaste(request: PasteReaderRequest, onDone: (done: PasteReaderDone) => void, onProgress: (rows: number) => void): () => void {
  if (request.text.length < WORKER_FROM_CHARS || typeof Worker === 'undefined') {
    const block = readPastedBlock(request.text);
    onDone({ type: 'done', block, preview: block.header ? previewPaste(block, request.mode, request.existing, request.conventions) : null, refusal: null, dropped: 0 });
    return () => undefined;
  }
  const worker = startReader();
  let finished = false;
  worker.onmessage = (e: MessageEvent<PasteReaderReply>) => {
    if (e.data.type === 'progress') onProgress(e.data.rows);
    else {
      finished = true;
      worker.terminate();
      onDone(e.data);
    }
  };
  worker.onerror = () => {
    // A worker that cannot start (an old browser, a blocked script): read on the page instead.
    if (finished) return;
    finished = true;
    worker.terminate();
    const block = readPastedBlock(request.text);
    onDone({ type: 'done', block, preview: block.header ? previewPaste(block, request.mode, request.existing, request.conventions) : null, refusal: null, dropped: 0 });
  };
  worker.postMessage(request);
  return () => {
    finished = true;
    worker.terminate();
  };
}
