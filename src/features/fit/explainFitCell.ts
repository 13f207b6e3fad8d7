import { explainFitFigure, fitCurve, fitQuotes, type Compounding, type CurveDayCount, type FitFigure, type FitOptions, type FitSink, type FitZeroAt, type Result } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, noCurve, type CellExplanation } from '../tables/explainCell.ts';

/**
 * A figure of the smooth fit under the panel's fit options: quote `index`'s model yield, residual
 * (bp or per 100 face) or richness; a parameter or the weighted RMS error (`index` -1); or the fit
 * line's zero rate on `date` (`index` -1), in `compounding` on `dayCount` (default: continuous on
 * the curve's day count, as the fit's own chart draws it).
 */
export interface FitCell {
  readonly fit: {
    readonly options: FitOptions;
    readonly index: number;
    readonly figure: FitFigure;
    /** The table it was opened from (the panel opens beside it): the rich/cheap list's, or the parameters' and chart's ('fit'); else the residuals'. */
    readonly table?: 'rich-cheap' | 'fit';
    readonly date?: string;
    /** With `date`: the fit line's forward from `date` to `end` instead of its zero rate. */
    readonly end?: string;
    readonly compounding?: Compounding;
    readonly dayCount?: CurveDayCount;
  };
}

/** Each figure's name (the panel's title; lower case in the table buttons' names); a parameter's is `Fitted <name>`. */
export const TITLE: Partial<Record<FitFigure, string>> = { yield: 'Fitted model yield', residual: 'Fit residual', richness: 'Market minus model price', price: 'Fit residual per 100 face', zero: 'Fitted zero rate', rms: 'Weighted RMS error' };

/**
 * The explanation of a fit figure: the fit made again as the panel makes it (same workspace and
 * options; deterministic) with a sink, then explainFitFigure. No quote sensitivities (a parameter
 * moves with every quote through the whole fit; for a parameter or the RMS the note names the
 * quotes with the largest shares of the objective) and no values under other methods.
 */
export function explainFitCell(result: WorkbenchBuild, cell: FitCell['fit']): Result<CellExplanation> {
  const ws = result.build.workspace;
  if (!ws) return noCurve(result);
  const sink: FitSink = {};
  const fit = fitCurve(ws, cell.options, sink);
  if (!fit.ok) return fit;
  const rows = result.conversion.rowOfQuote;
  const rowOf = (i: number): string => `row ${(rows[i] ?? i) + 1}`;
  const f = cell.figure;
  const at = cell.date === undefined ? undefined : ({ compounding: 'continuous', dayCount: fit.value.curve.dayCount, ...cell } as FitZeroAt);
  const r = explainFitFigure(fit.value, sink.trace!, cell.index, f, at, rowOf);
  if (!r.ok) return r;
  const title = at?.end ? `Fitted forward rate ${at.date} to ${at.end}` : `${TITLE[f] ?? `Fitted ${f}`}${cell.index >= 0 ? ` of ${rowOf(cell.index)}` : at ? ` on ${at.date}` : ''}`;
  // A b parameter, a model yield or a residual: its quotes through the fit's normal equations (fitQuotes); the other figures list none.
  const by = f[0] === 'b' ? f : cell.index >= 0 && (f === 'yield' || f === 'residual') ? cell.index : null;
  const quotes = by === null ? { ok: true as const, value: [] } : fitQuotes(fit.value, sink.trace!, by, f === 'residual');
  const note = `${by === null ? 'none: see the steps' : 'through the fit (its normal equations at the fitted parameters)'}; no value under other interpolation methods: a parametric form interpolates nothing`;
  return cellOf(result, title, r.value, quotes, note, []);
}
