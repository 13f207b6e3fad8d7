/**
 * Quote input: exact reading of typed and pasted quote text (decimal.js); typed dates and the input
 * conventions (date order, decimal mark); paste tables. Pure, like the rest of the core.
 */
export * from './decimalText.ts';
export * from './quoteText.ts';
export * from './quoteRow.ts';
export { parseTermsText, rowSetOf, rowTermsOf, termsText, TERM_FIELDS, type RowTerms, type TermField } from './termsText.ts';
export { rowConventions, type RowConventions } from './termsNote.ts';
export * from './splitTable.ts';
export * from './pasteTable.ts';
export * from './quoteSchedule.ts';
export * from './dateText.ts';
export * from './conventions.ts';
export * from './tenorColumns.ts';
export * from './fixingList.ts';
