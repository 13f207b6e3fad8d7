import type { InputConventions, QuoteUnitMode } from '../core/index.ts';

/** What the reading worker (readers.worker.ts) is asked to read. */
export type ReaderRequest =
  | { readonly type: 'paste'; readonly text: string; readonly mode: QuoteUnitMode; readonly existing: number; readonly conventions: InputConventions }
  | { readonly type: 'document'; readonly text: string }
  | { readonly type: 'list'; readonly text: string; readonly fileName: string };

/** Starts the reading worker (one module for pastes, workspace files and list files). */
export const startReader = (): Worker => new Worker(new URL('./readers.worker.ts', import.meta.url), { type: 'module' });
