import { explainFitFigure, fitCurve, type FitFigure, type FitOptions, type FitSink, type Result } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, type CellExplanation } from '../tables/explainCell.ts';

/** A figure of the smooth fit's residual table or rich/cheap list: quote `index`'s model yield, residual or richness, under the panel's fit options. */
export interface FitCell {
  readonly fit: {
    readonly options: FitOptions;
    readonly index: number;
    readonly figure: FitFigure;
    /** The table it was opened from (the panel opens beside it): the residuals' or the rich/cheap list's. */
    readonly table?: 'rich-cheap';
  };
}

const TITLE: Record<FitFigure, string> = { yield: 'Fitted model yield', residual: 'Fit residual', richness: 'Market minus model price' };

/**
 * The explanation of a fit figure: the fit made again as the panel makes it (same workspace and
 * options; deterministic) with a sink, then explainFitFigure. No quote sensitivities and no values
 * under other methods, and the panel says why.
 */
export function explainFitCell(result: WorkbenchBuild, cell: FitCell['fit']): Result<CellExplanation> {
  const ws = result.build.workspace;
  if (!ws) return { ok: false, errors: [{ path: '', quote: null, code: 'schema', message: result.fatal ?? 'no workspace' }] };
  const sink: FitSink = {};
  const fit = fitCurve(ws, cell.options, sink);
  if (!fit.ok) return fit;
  const r = explainFitFigure(fit.value, sink.trace!, cell.index, cell.figure);
  if (!r.ok) return r;
  const row = result.conversion.rowOfQuote[cell.index];
  const title = `${TITLE[cell.figure]} of ${row === undefined ? 'a quote' : `row ${row + 1}`}`;
  const note = 'none: a fit is not exact; no value under other interpolation methods: a parametric form interpolates nothing';
  return cellOf(result, title, r.value, { ok: true, value: [] }, note, []);
}
