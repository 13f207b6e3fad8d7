import { dsvFormat } from 'd3-dsv';

/** The delimiters a pasted block or a dropped file may use: tab (spreadsheets), comma (CSV), semicolon (CSV where the comma is the decimal mark). */
export const PASTE_DELIMITERS = ['\t', ',', ';'] as const;
export type PasteDelimiter = (typeof PASTE_DELIMITERS)[number];

/** A pasted block split into rows of trimmed cells, and the delimiter that split it. */
export interface SplitTable {
  readonly cells: string[][];
  readonly separator: PasteDelimiter;
}

const PARSERS = Object.fromEntries(PASTE_DELIMITERS.map((d) => [d, dsvFormat(d)])) as Record<PasteDelimiter, ReturnType<typeof dsvFormat>>;

const trimRows = (rows: string[][]): string[][] => rows.map((r) => r.map((c) => c.trim())).filter((r) => r.some((c) => c !== ''));

/** How well a delimiter explains the block: rows sharing the commonest field count, and that count. */
function delimiterFit(rows: readonly (readonly string[])[]): { columns: number; agreeing: number } {
  const counts = new Map<number, number>();
  for (const r of rows) counts.set(r.length, (counts.get(r.length) ?? 0) + 1);
  let columns = 1;
  let agreeing = 0;
  for (const [n, k] of counts) if (k > agreeing || (k === agreeing && n > columns)) [columns, agreeing] = [n, k];
  return { columns, agreeing };
}

/**
 * Text copied from a spreadsheet (tab-separated) or CSV, split into rows of trimmed cells by
 * d3-dsv (RFC 4180 quoting: a quoted field may hold the delimiter, a line break or a doubled
 * quote). The delimiter is the one of tab, comma and semicolon under which the most rows have
 * the same number of fields (more than one), ties going to the wider reading and then to tab,
 * comma, semicolon in that order; so a tab inside a quoted CSV field no longer turns the block
 * into tab-separated text. Blank lines are dropped.
 */
export function splitTable(text: string): SplitTable {
  const body = text.replace(/^\uFEFF/, '');
  let best: { cells: string[][]; separator: PasteDelimiter; columns: number; agreeing: number } | null = null;
  for (const d of PASTE_DELIMITERS) {
    if (!body.includes(d)) continue;
    const cells = trimRows(PARSERS[d].parseRows(body));
    const fit = delimiterFit(cells);
    if (fit.columns < 2) continue;
    if (!best || fit.agreeing > best.agreeing || (fit.agreeing === best.agreeing && fit.columns > best.columns)) best = { cells, separator: d, ...fit };
  }
  if (best) return { cells: best.cells, separator: best.separator };
  return { cells: trimRows(PARSERS[','].parseRows(body)), separator: ',' };
}

