import { useMemo } from 'react';
import { buildCurve, type CurveBuild } from '../core/index.ts';
import {
  parseRow,
  rowIssuesFromEngine,
  toEngineDocument,
  type EngineConversion,
  type QuoteRow,
  type QuoteUnitMode,
  type RowIssues,
  type RowParse,
  type WorkbenchDocument,
} from '../core/input/index.ts';
import { useAppStore } from '../state/store.ts';

/** Parse results by row object: a one-cell edit creates one new row object, so only it is re-parsed. */
const parseCache = new WeakMap<QuoteRow, { mode: QuoteUnitMode; parse: RowParse }>();
export function parseRowCached(row: QuoteRow, mode: QuoteUnitMode): RowParse {
  const hit = parseCache.get(row);
  if (hit && hit.mode === mode) return hit.parse;
  const parse = parseRow(row, mode);
  parseCache.set(row, { mode, parse });
  return parse;
}

export interface WorkbenchBuild {
  readonly conversion: EngineConversion;
  readonly build: CurveBuild;
  /** Issues per sheet row: the row's own cell errors merged with the engine's. */
  readonly rowIssues: readonly RowIssues[];
  /** Rows with a wrong cell or refused by the engine (left out of the curve). */
  readonly invalidCount: number;
  /** Rows switched off. */
  readonly disabledCount: number;
  /** A message when there is no curve at all (bad settlement, no valid quote, a failed bootstrap). */
  readonly fatal: string | null;
}

/** Builds the curve from the document's inputs (engine document, then buildCurve with skipInvalid). */
export function deriveBuild(ws: Pick<WorkbenchDocument, 'quotes' | 'quoteUnit' | 'settlement' | 'curve'>, interpolation?: WorkbenchDocument['curve']['interpolation']): WorkbenchBuild {
  const conversion = toEngineDocument(ws, parseRowCached);
  const build = buildCurve(conversion.doc, interpolation ? { skipInvalid: true, interpolation } : { skipInvalid: true });
  const fromEngine = rowIssuesFromEngine(
    [...build.errors, ...build.warnings.filter((w) => w.code === 'skipped' || w.code === 'negative-forward').map((w) => ({ ...w, message: w.message.replace(/^skipped: /, '') }))],
    conversion.rowOfQuote,
  );
  for (const w of build.warnings) {
    if (w.code !== 'negative-forward' || w.quote === null) continue;
    const row = conversion.rowOfQuote[w.quote];
    const cur = row === undefined ? undefined : fromEngine.get(row);
    if (row !== undefined && cur?.kind) fromEngine.set(row, { ...cur, kind: { severity: 'warning', message: cur.kind.message } });
  }
  const rowIssues = conversion.rows.map((p, i) => ({ ...(fromEngine.get(i) ?? {}), ...p.issues }));
  const engineInvalid = build.leftOut.filter((l) => l.reason === 'invalid').length;
  const disabledCount = ws.quotes.filter((r) => !r.enabled).length;
  let fatal: string | null = null;
  if (!build.curve) {
    const docError = build.errors.find((e) => e.quote === null);
    fatal = docError ? docError.message : build.errors[0]?.message.replace(/quotes\[(\d+)\]/g, (_, q: string) => `row ${(conversion.rowOfQuote[Number(q)] ?? 0) + 1}`) ?? 'no curve';
  }
  return { conversion, build, rowIssues, invalidCount: conversion.invalidRows + engineInvalid, disabledCount, fatal };
}

/** The base curve of the workspace, rebuilt only when its inputs change. */
export function useCurveBuild(): WorkbenchBuild {
  const quotes = useAppStore((s) => s.workspace.quotes);
  const quoteUnit = useAppStore((s) => s.workspace.quoteUnit);
  const settlement = useAppStore((s) => s.workspace.settlement);
  const curve = useAppStore((s) => s.workspace.curve);
  return useMemo(() => deriveBuild({ quotes, quoteUnit, settlement, curve }), [quotes, quoteUnit, settlement, curve]);
}
