/**
 * Reads a large paste off the page's thread: splits it (d3-dsv through the core), maps its
 * header and counts the rows that read as quotes, reporting progress between the steps. Over the
 * quote cap the rows are not sent back (the paste is refused whatever they hold), so a huge paste
 * costs the page one short message.
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
  if (block.header) {
    const preview = previewPaste(block, mode, existing, conventions);
    scope.postMessage({ type: 'done', block: rows > cap ? { ...block, rows: [] } : block, preview, refusal: null });
  } else {
    const refusal = rows > cap ? `the paste has ${rows} rows; the sheet holds at most ${cap} quotes. Paste fewer rows` : null;
    scope.postMessage({ type: 'done', block: refusal ? { ...block, cells: [] } : block, preview: null, refusal });
  }
};
