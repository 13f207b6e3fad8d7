/**
 * Quote input: exact reading of typed and pasted quote text (decimal.js) and the workbench's
 * text document. Pure, like the rest of the core. (Until src/core/index.ts re-exports this
 * barrel, the UI imports it from here.)
 */
export * from './decimalText.ts';
export * from './quoteText.ts';
export * from './quoteRow.ts';
export * from './pasteTable.ts';
export * from './workbenchDocument.ts';
export * from './quoteSchedule.ts';
export * from './curveSampler.ts';
export * from './documentBridge.ts';
export * from './dateText.ts';
export * from './conventions.ts';
