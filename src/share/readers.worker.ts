/**
 * The page's reading worker (a module worker; the CSP's `worker-src 'self'` allows it): the part of
 * reading a big paste or a big list file that grows with its size, off the page's thread.
 * - `split`: splits a pasted block (d3-dsv, splitTable) and sends back at most `keep` rows and the
 *   count, so a huge paste costs the page a message of at most the cap's rows;
 * - `list`: parses a list file and cuts it into its entries' texts (splitListFile).
 * Everything that knows quotes and documents runs on the page, on the bounded result.
 */
import { splitListFile, splitTable } from '../core/index.ts';
import type { ReaderReply, ReaderRequest } from './readerRequests.ts';

const scope = self as unknown as { onmessage: ((e: MessageEvent<ReaderRequest>) => void) | null; postMessage(message: ReaderReply): void };

scope.onmessage = (e) => {
  const request = e.data;
  if (request.type === 'list') {
    scope.postMessage({ type: 'list', list: splitListFile(request.text, request.fileName) });
    return;
  }
  const table = splitTable(request.text);
  scope.postMessage({ type: 'split', table: { cells: table.cells.slice(0, request.keep), separator: table.separator }, rows: table.cells.length });
};
