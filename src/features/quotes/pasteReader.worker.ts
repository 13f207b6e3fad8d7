/**
 * Reads a large paste off the page's thread: splits it (d3-dsv through the core), maps its
 * header and counts the rows that read as quotes, reporting progress between the steps. Over the
 * quote cap only the first rows are sent back (the sheet keeps those, the rest are counted as
 * left out), so a huge paste costs the page a message of at most the cap's rows.
 */
import { pasteQuoteCap, previewPaste, readPastedBlock, type InputConventions, type QuoteUnitMode } from '../../core/index.ts';
import type { PasteReaderReply, PasteReaderRequest } from './pasteReader.ts';

const scope = self as unknown as { onmessage: ((e: MessageEvent<PasteReaderRequest>) => void) | null; postMessage(message: PasteReaderReply): void };

scope.onmessage = (e) => {
  const { text, mode, existing, conventions } = e.data as { text: string; mode: QuoteUnitMode; existing: number; conventions: InputConventions };
  const block = readPastedBlock(text);
  const rows = block.header ? block.rows.length : block.cells.length;
  scope.postMessage({ type: 'progress', rows });
  const cap = pasteQuoteCap();
  const dropped = Math.max(0, rows - cap);
  if (block.header) {
    const preview = previewPaste(block, mode, existing, conventions);
    scope.postMessage({ type: 'done', block: dropped > 0 ? { ...block, rows: block.rows.slice(0, cap) } : block, preview, refusal: null, dropped });
  } else {
    scope.postMessage({ type: 'done', block: dropped > 0 ? { ...block, cells: block.cells.slice(0, cap) } : block, preview: null, refusal: null, dropped });
  }
};
