import type { SplitListFile, SplitTable } from '../core/index.ts';

/**
 * What the reading worker (readers.worker.ts) is asked: the generic, size-proportional part of
 * reading a big input, with no knowledge of quotes or documents (so the worker carries d3-dsv and
 * the JSON parse, not the core). The page then reads the bounded result in short steps.
 * - `split`: a pasted block split into rows (d3-dsv), at most `keep` rows sent back with the count.
 * - `list`: a list file (or one workspace file) cut into its entries' JSON texts.
 */
export type ReaderRequest = { readonly type: 'split'; readonly text: string; readonly keep: number } | { readonly type: 'list'; readonly text: string; readonly fileName: string };

export type ReaderReply = { readonly type: 'split'; readonly table: SplitTable; readonly rows: number } | { readonly type: 'list'; readonly list: SplitListFile };

/** Starts the reading worker. */
export const startReader = (): Worker => new Worker(new URL('./readers.worker.ts', import.meta.url), { type: 'module' });
