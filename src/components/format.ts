/**
 * Words on screen that are not figures. Every figure (rates with their tags, bp, percent, prices,
 * money, dates) is formatted by the core's format module (src/core/format, through core/index.ts).
 */

/** The sheet's row number (from 1) of the engine document's quotes[quote]; without a map, quote + 1. */
export const rowNumber = (rowOfQuote: readonly number[] | undefined, quote: number): number => (rowOfQuote?.[quote] ?? quote) + 1;
