import { useMemo, useState, type ReactNode } from 'react';
import {
  FIT_MODEL_LABEL,
  fitCurve,
  TAU_MAX,
  TAU_MIN,
  TAU_RATIO_MIN,
  type FitErrors,
  type FitModel,
  type FitOptions,
  type Repricing,
  type Workspace,
  formatNumber,
  bpFigure,
  formatPrice,
  formatPercent,
  nearZero,
} from '../../core/index.ts';
import { rowNumber } from '../../components/format.ts';
import { NO_VALUE, PRICE_ACCEPTANCE, rateTag, RATE_ACCEPTANCE, sampleGrid, zeroSamples } from '../../core/index.ts';
import { RateChart, type ChartLine, type RateChartProps } from '../../charts/RateChart.tsx';
import { BASE_STYLES } from '../../charts/palette.ts';
import { points, type SamplePoint } from '../../hooks/useCurveSeries.ts';
import type { Curve } from '../../core/index.ts';
import { RichCheapTable } from './RichCheapTable.tsx';
import type { DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import { TITLE, type FitCell } from './explainFitCell.ts';
import type { QuoteCheckCell } from '../tables/explainQuoteCell.ts';

const sameFitCell = (a: FitCell, b: FitCell): boolean => a.fit.index === b.fit.index && a.fit.figure === b.fit.figure && a.fit.table === b.fit.table && a.fit.date === b.fit.date;


export interface FitPanelProps {
  /** The validated workspace whose enabled quotes are fitted (null: nothing to fit yet). */
  readonly workspace: Workspace | null;
  /** Sheet row of each engine quote (rowOfQuote[i] for quotes[i]), so rows are numbered as the sheet numbers them (from 1). */
  readonly rowOfQuote?: readonly number[];
  /** The exact bootstrap's repricing, shown beside the fit's residuals (optional). */
  readonly repricing?: readonly Repricing[];
  /** The exact bootstrap's curve, drawn with the fit on one zero chart (optional). */
  readonly bootstrap?: Curve | null;
  /** `curve.fit`: the parametric model, or 'none' for no fit. Controlled when onModelChange is given. */
  readonly model?: FitModel | 'none';
  readonly onModelChange?: (model: FitModel | 'none') => void;
  /** Quote indices left out of the fit, and per-quote weights (controlled when their callbacks are given). */
  readonly exclude?: readonly number[];
  readonly onExcludeChange?: (exclude: number[]) => void;
  readonly weights?: Readonly<Record<number, number>>;
  readonly onWeightsChange?: (weights: Record<number, number>) => void;
  /** What the fit minimises (controlled when onErrorsChange is given). */
  readonly errors?: FitErrors;
  readonly onErrorsChange?: (errors: FitErrors) => void;
  /** The shown build's turns (spreads as built; `FitOptions.turns`) and whether it has meeting steps: the fit carries the turns and says what it leaves out. */
  readonly turns?: FitOptions['turns'];
  /** The build's instruments (`FitOptions.instruments`): a named curve's swaps fitted as they price, on the curves they read. */
  readonly instruments?: FitOptions['instruments'];
  readonly steps?: boolean;
  /** The build and display the explanation panel reads (the model yields and residuals open their explanation when given). */
  readonly explainFrom?: { readonly result: WorkbenchBuild; readonly display: DisplaySettings };
}

/** Controlled when `set` is given, else local state seeded from the prop. */
function useMaybeControlled<T>(value: T | undefined, set: ((v: T) => void) | undefined, fallback: T): [T, (v: T) => void] {
  const [local, setLocal] = useState<T>(value ?? fallback);
  if (set) return [value ?? fallback, set];
  return [local, setLocal];
}

/**
 * The smooth fit beside the exact bootstrap: choose Nelson-Siegel or Svensson and yield or price
 * errors, switch quotes in or out and weight them; shows the parameters with their units, the
 * convergence report, every quote's residual in bp and per 100 face, and the rich/cheap list.
 */
export function FitPanel(props: FitPanelProps) {
  const [model, setModel] = useMaybeControlled<FitModel | 'none'>(props.model, props.onModelChange, 'nelson-siegel');
  const [exclude, setExclude] = useMaybeControlled<readonly number[]>(props.exclude, props.onExcludeChange as ((v: readonly number[]) => void) | undefined, []);
  const [weights, setWeights] = useMaybeControlled<Readonly<Record<number, number>>>(props.weights, props.onWeightsChange as ((v: Readonly<Record<number, number>>) => void) | undefined, {});
  const [errors, setErrors] = useMaybeControlled<FitErrors>(props.errors, props.onErrorsChange, 'yield');
  const [weightText, setWeightText] = useState<Record<number, string>>({});
  const ws = props.workspace;
  const turns = props.turns;
  const held = props.instruments;
  const options = useMemo(() => (model === 'none' ? null : { model, errors, exclude, weights, ...(turns ? { turns } : {}), ...(held ? { instruments: held } : {}) }), [model, errors, exclude, weights, turns, held]);
  const result = useMemo(() => (ws && options ? fitCurve(ws, options) : null), [ws, options]);
  const explain = useExplainOpener<FitCell>(sameFitCell);
  // The exact bootstrap's repricing error beside a residual: the quote check's own figure and explanation.
  const check = useExplainOpener<QuoteCheckCell>((a, b) => a.quoteCheck.index === b.quoteCheck.index);
  // The open figure follows the panel's options, closed when its quote leaves the residuals.
  const open = explain.open && options && result?.ok && (explain.open.fit.index < 0 || result.value.residuals.some((r) => r.index === explain.open!.fit.index)) ? { fit: { ...explain.open.fit, options } } : null;
  const figure = (index: number, which: FitCell['fit']['figure'], text: string, table?: FitCell['fit']['table']) => {
    if (!props.explainFrom || !options) return text;
    const cell: FitCell = { fit: { options, index, figure: which, ...(table ? { table } : {}) } };
    return (
      <button type="button" className="cell-explain" data-field={which === 'residual' ? 'residual-bp' : undefined} aria-label={`${text}: explain the ${index < 0 ? TITLE[which] ?? `fitted ${which}` : `${TITLE[which]!.toLowerCase()} of row ${rowNumber(props.rowOfQuote, index)}`}`} aria-expanded={explain.isOpen(cell)} onClick={(e) => explain.toggle(e, cell)}>
        {text}
      </button>
    );
  };
  // The explanation beside the table it was opened from.
  const panel = (table?: FitCell['fit']['table']) => props.explainFrom && <OpenExplanation result={props.explainFrom.result} display={props.explainFrom.display} cell={open?.fit.table === table ? open : null} onClose={explain.close} />;
  const par = (which: FitCell['fit']['figure'], text: string) => figure(-1, which, text, 'fit');
  // The fit chart's readout opens the fitted zero rate at its point (continuous on the curve's day count, as drawn).
  const zeroExplain = useMemo(
    () => (props.explainFrom && options ? { words: `${FIT_MODEL_LABEL[options.model]} fit zero rate`, open: (cell: unknown, b: HTMLElement) => explain.toggleAt(b, cell as FitCell), cell: (p: SamplePoint): FitCell => ({ fit: { options, index: -1, figure: 'zero', date: p.date, table: 'fit' } }) } : undefined),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [options, !props.explainFrom],
  );
  const zeroTag = ws ? rateTag('continuous', ws.curve.dayCount) : 'cont';
  const repricingByIndex = new Map((props.repricing ?? []).map((r) => [r.index, r]));

  const toggle = (index: number, included: boolean): void => setExclude(included ? exclude.filter((i) => i !== index) : [...exclude, index]);
  const typeWeight = (index: number, text: string): void => {
    setWeightText({ ...weightText, [index]: text });
    const w = Number(text);
    if (text.trim() !== '' && Number.isFinite(w) && w >= 0) setWeights({ ...weights, [index]: w });
  };
  const weightError = (index: number): string | null => {
    const text = weightText[index];
    if (text === undefined) return null;
    const w = Number(text);
    return text.trim() === '' || !Number.isFinite(w) || w < 0 ? `Row ${rowNumber(props.rowOfQuote, index)} weight: type a number 0 or above (0 leaves the quote out); "${text}" is kept but not used` : null;
  };

  return (
    <section className="panel fit-panel" aria-label="Smooth fit">
      <h2>Smooth fit</h2>
      <div className="controls">
        <label>
          Model{' '}
          <select value={model} onChange={(e) => setModel(e.target.value as FitModel | 'none')}>
            <option value="none">None (exact bootstrap only)</option>
            <option value="nelson-siegel">Nelson-Siegel</option>
            <option value="svensson">Svensson</option>
          </select>
        </label>{' '}
        <label>
          Errors{' '}
          <select value={errors} onChange={(e) => setErrors(e.target.value as FitErrors)}>
            <option value="yield">Yield errors</option>
            <option value="price">Price errors scaled to yield (ΔP / (modified duration × dirty price))</option>
          </select>
        </label>
      </div>
      <p className="muted">
        Zero rate y(t) <span className="tag">{zeroTag}</span>, DF = e^(−y t); bounds {TAU_MIN} ≤ τ ≤ {TAU_MAX} years
        {model === 'svensson' ? `, τ2 ≥ ${TAU_RATIO_MIN} × τ1` : ''}; b0 may be negative.
      </p>
      {(turns?.length || props.steps) && (
        <p className="muted small">
          {turns?.length ? `A smooth form has no jump: it is fitted with the turns of the curve shown taken out, at their spreads as built (${turns.map((t) => `${t.name} ${bpFigure(t.spread * 1e4)} bp`).join(', ')}; overnight, simple ACT/360). ` : ''}
          {props.steps ? 'Meeting steps are not in the fit.' : ''}
        </p>
      )}
      {!ws && <p role="status">No valid workspace to fit yet.</p>}
      {ws && model === 'none' && <p role="status">No fit chosen: the exact bootstrap is the curve.</p>}
      {result && !result.ok && (
        <p role="alert" className="error">
          {result.errors.map((e) => rowWords(e.message, props.rowOfQuote)).join('; ')}
        </p>
      )}
      {result && result.ok && (
        <>
          <p role="status" className={result.value.converged ? undefined : 'warning'}>
            {rowWords(result.value.report, props.rowOfQuote)}
          </p>
          <FitChart fit={result.value.curve} bootstrap={props.bootstrap ?? null} label={FIT_MODEL_LABEL[result.value.model]} {...(zeroExplain ? { explain: zeroExplain } : {})} />
          <table className="data" aria-label="Fitted parameters">
            <caption>{FIT_MODEL_LABEL[result.value.model]} parameters</caption>
            <tbody>
              {(['b0, level', 'b1, slope', 'b2, curvature', ...(result.value.params.tau2 !== null ? ['b3, second hump'] : [])]).map((h) => (
                <tr key={h}><th scope="row">{h} <span className="tag">{zeroTag}</span></th><td className="n">{par(h.slice(0, 2) as 'b0', formatPercent(result.value.params[h.slice(0, 2) as 'b0']))}</td></tr>
              ))}
              {[result.value.params.tau1, result.value.params.tau2].map((v, i) => v !== null && (
                <tr key={i}><th scope="row">τ{i + 1} (years)</th><td className="n">{par(i ? 'tau2' : 'tau1', formatNumber(v, 4))}</td></tr>
              ))}
              <tr><th scope="row">Weighted RMS error (bp)</th><td className="n">{par('rms', bpFigure(result.value.rmsBp))}</td></tr>
            </tbody>
          </table>
          {panel('fit')}
          <div className="table-scroll" tabIndex={0} role="region" aria-label="Fit residuals (scrolls sideways)">
          <table className="data" aria-label="Fit residuals">
            <caption>Each quote against the fit (residual = model minus market); the exact bootstrap's repricing error beside it</caption>
            <thead>
              <tr>
                <th scope="col">Quote</th>
                <th scope="col">In fit</th>
                <th scope="col">Weight</th>
                <th scope="col">Maturity</th>
                <th scope="col">Yield measured</th>
                <th scope="col">Market yield (%)</th>
                <th scope="col">Model yield (%)</th>
                <th scope="col">Residual (bp)</th>
                <th scope="col">Residual (per 100 face)</th>
                <th scope="col">Bootstrap repricing error</th>
              </tr>
            </thead>
            <tbody>
              {result.value.residuals.map((r) => {
                const rep = repricingByIndex.get(r.index);
                const err = weightError(r.index);
                return (
                  <tr key={r.index} data-quote={r.index}>
                    <th scope="row">Row {rowNumber(props.rowOfQuote, r.index)} {r.kind}</th>
                    <td>
                      <input type="checkbox" aria-label={`include row ${rowNumber(props.rowOfQuote, r.index)} in the fit`} checked={!exclude.includes(r.index)} onChange={(e) => toggle(r.index, e.target.checked)} />
                    </td>
                    <td>
                      <input
                        type="text"
                        inputMode="decimal"
                        size={4}
                        aria-label={`weight of row ${rowNumber(props.rowOfQuote, r.index)}`}
                        aria-invalid={err ? true : undefined}
                        title={err ?? undefined}
                        value={weightText[r.index] ?? String(weights[r.index] ?? 1)}
                        onChange={(e) => typeWeight(r.index, e.target.value)}
                      />
                    </td>
                    <td>{r.maturity}</td>
                    <td>{r.yieldLabel}</td>
                    <td className="n">{formatPercent(r.marketYield)}</td>
                    <td className="n">{figure(r.index, 'yield', formatPercent(r.modelYield))}</td>
                    <td className="n" data-field="residual-bp">{figure(r.index, 'residual', bpFigure(r.residualBp))}</td>
                    <td className="n" data-field="residual-price">{figure(r.index, 'price', formatPrice(r.residualPrice))}</td>
                    <RepricingCell rep={rep} wrap={props.explainFrom && ((text) => check.button({ quoteCheck: { index: r.index, figure: 'error' } }, text, `the repricing error of row ${rowNumber(props.rowOfQuote, r.index)}`))} />
                  </tr>
                );
              })}
            </tbody>
          </table>
          </div>
          {panel(undefined)}
          {props.explainFrom && <OpenExplanation result={props.explainFrom.result} display={props.explainFrom.display} cell={check.open} onClose={check.close} />}
          {Object.keys(weightText).map((k) => weightError(Number(k))).filter((m): m is string => m !== null).map((m) => (
            <p key={m} role="alert" className="error">{m}</p>
          ))}
          <RichCheapTable rowOfQuote={props.rowOfQuote} entries={result.value.richCheap} yieldTag="ICMA yield at each bond's coupon frequency" figure={(index, which, text) => figure(index, which, text, 'rich-cheap')} />
          {panel('rich-cheap')}
        </>
      )}
    </section>
  );
}

const zeroPoints = (curve: Curve, grid: ReturnType<typeof sampleGrid>): SamplePoint[] => points(zeroSamples(curve, grid, 'continuous'));

/** The fitted zero curve and, when given, the bootstrap's, continuously compounded on the curve's day count. */
function FitChart({ fit, bootstrap, label, explain }: { fit: Curve; bootstrap: Curve | null; label: string; explain?: NonNullable<RateChartProps['explain']> & { readonly cell: (p: SamplePoint) => unknown } }) {
  const chart = useMemo(() => {
    const last = [fit.pillars[fit.pillars.length - 1], bootstrap?.pillars[bootstrap.pillars.length - 1]].filter((p) => p !== undefined).sort((a, b) => b!.t - a!.t)[0];
    if (!last) return null;
    const grid = sampleGrid(fit.settlement, last.date, 160, fit.dayCount, fit.dayCount, { n: 3, unit: 'M' });
    const tag = rateTag('continuous', fit.dayCount);
    const lines: ChartLine[] = [{ id: 'fit', label: `${label} fit`, tag, ...BASE_STYLES.forward, points: zeroPoints(fit, grid), ...(explain ? { explain: explain.cell } : {}) }];
    if (bootstrap) lines.push({ id: 'bootstrap', label: 'Exact bootstrap', tag, ...BASE_STYLES.zero, dash: '6 3', points: zeroPoints(bootstrap, grid) });
    return { lines, xMax: last.t, lastT: Math.max(fit.lastT, bootstrap?.lastT ?? 0), tag };
  }, [fit, bootstrap, label, explain]);
  if (!chart) return null;
  return (
    <div className="chart-box">
      <h3>
        Zero curve: {label} fit{bootstrap ? ' and the exact bootstrap' : ''} <span className="tag">{chart.tag}</span>
      </h3>
      <RateChart
        name={`Zero curve, ${label} fit${bootstrap ? ' and exact bootstrap' : ''}, ${chart.tag}`}
        description={`Fitted zero rates${bootstrap ? ' (solid) against the exact bootstrap (dashed)' : ''} by maturity.`}
        lines={chart.lines}
        xMax={chart.xMax}
        lastT={chart.lastT}
        axis="linear"
        xLabel={`Maturity (years from settlement, ${fit.dayCount})`}
        yLabel={`Zero rate (%, ${chart.tag})`}
        {...(explain ? { explain } : {})}
      />
    </div>
  );
}

/**
 * The exact bootstrap's repricing error beside a residual: bp for a rate quote, per 100 face for a
 * price quote; inside the bootstrap's acceptance it is an exact reprice, shown as zero with the
 * computed value and the tolerance in the tooltip.
 */
function RepricingCell({ rep, wrap = (t) => t }: { rep: Repricing | undefined; wrap?: ((text: string) => ReactNode) | undefined }) {
  if (!rep) return <td className="n">{NO_VALUE}</td>;
  const e = rep.unit === 'price' ? nearZero(rep.repricingError, 6, 'per 100 face', PRICE_ACCEPTANCE) : nearZero(rep.repricingError * 1e4, 4, 'bp', RATE_ACCEPTANCE * 1e4);
  return (
    <td className="n" title={e.title}>
      {wrap(`${e.text} ${rep.unit === 'price' ? 'per 100' : 'bp'}`)}
    </td>
  );
}

/** The core's `quotes[i]` as the sheet's row number ("row 19"), so every table and message counts rows from 1. */
function rowWords(text: string, rowOfQuote: readonly number[] | undefined): string {
  return text.replace(/quotes\[(\d+)\]/g, (_, q: string) => `row ${rowNumber(rowOfQuote, Number(q))}`);
}
