/**
 * The page's one reading worker (a module worker; the CSP's `worker-src 'self'` allows it): big
 * pastes (with progress), workspace files and workspace list files are read here, off the page's
 * thread. One worker module for all three, so the core it carries is shipped once.
 *
 * - `paste`: splits the text (d3-dsv through the core), maps its header and counts the rows that
 *   read as quotes, reporting progress between the steps. Over the quote cap only the first rows
 *   are sent back (the sheet keeps those, the rest are counted as left out).
 * - `document`: parseDocumentText (parse, caps, validation) of a workspace file.
 * - `list`: checkListFile of a workspace list file (every entry parsed and checked).
 */
import { checkListFile, parseDocumentText, pasteQuoteCap, previewPaste, readPastedBlock } from '../core/index.ts';
import type { ReaderRequest } from './readerRequests.ts';

const scope = self as unknown as { onmessage: ((e: MessageEvent<ReaderRequest>) => void) | null; postMessage(message: unknown): void };

scope.onmessage = (e) => {
  const request = e.data;
  if (request.type === 'document') {
    scope.postMessage(parseDocumentText(request.text));
    return;
  }
  if (request.type === 'list') {
    scope.postMessage(checkListFile(request.text, request.fileName));
    return;
  }
  const { text, mode, existing, conventions } = request;
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
