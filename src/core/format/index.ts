/**
 * Formatting for people: every rate with its convention tag, bp, percent, prices, money, dates, one
 * minus sign and one rounding rule per quantity (the table in quantities.ts). Screens, print, CSV
 * headers and the command's messages take their text from here; CSV cells and JSON fields keep plain
 * numbers and never pass through it.
 */
export * from './numberText.ts';
export * from './conventionTag.ts';
export * from './quantities.ts';
