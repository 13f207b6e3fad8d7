import type { previewPaste, readPastedBlock } from '../core/index.ts';

/**
 * The paste reader's functions the store calls when a paste is confirmed (the preview is worked
 * out again on the sheet as it is then). They live in the paste reader's chunk, fetched on the
 * first paste (features/quotes/pasteReader.ts registers them when it loads), so the first load
 * carries no table reader. A paste can only reach the store through that reader, so they are
 * there whenever the store needs them.
 */
export interface PasteTools {
  readonly readPastedBlock: typeof readPastedBlock;
  readonly previewPaste: typeof previewPaste;
}

let tools: PasteTools | null = null;

export function registerPasteTools(t: PasteTools): void {
  tools = t;
}

export function pasteTools(): PasteTools {
  if (tools === null) throw new Error('the paste reader is not loaded yet (import features/quotes/pasteReader.ts first)');
  return tools;
}
