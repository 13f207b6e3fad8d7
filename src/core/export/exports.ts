/** Entry to the document, CSV and hash modules (until src/core/index.ts re-exports it). */
export * from './csv.ts';
export * from './hash.ts';
export * from './limits.ts';
export * from './documentKeys.ts';
export * from './document.ts';
export * from './curveTable.ts';
