/**
 * The tables' parts that load on first use (the forward strip, grid and calculator, the quote check, the
 * explanation panel), behind one import(): one chunk for the bundler instead of a file each, which
 * the all-JavaScript budget counts file by file.
 */
export { ForwardStripTable } from './ForwardStripTable.tsx';
export { ForwardGridTable } from './ForwardGridTable.tsx';
export { ForwardCalculator } from './ForwardCalculator.tsx';
export { QuoteCheckTable } from './QuoteCheckTable.tsx';
export { ExplanationPanel } from './ExplanationPanel.tsx';
