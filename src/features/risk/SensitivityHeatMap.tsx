import { useMemo, useState } from 'react';
import { INTERPOLATIONS, INTERPOLATORS, parseTenor, type InterpolationId, type Workspace, formatPercent, nearZero, rateTag } from '../../core/index.ts';
import { rowNumber } from '../../components/format.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import { heatMapFor, type SensitivityCell } from './explainSensitivityCell.ts';
import { loadedOvernightKit } from '../../hooks/overnightKit.ts';

export interface SensitivityHeatMapProps {
  /** The validated workspace whose enabled quotes build the curve (null: nothing yet). */
  readonly workspace: Workspace | null;
  /** Starting interpolation (default the workspace's); the user can switch it here. */
  readonly interpolation?: InterpolationId;
  /** Forward tenor and the step between forward starts (defaults 3M and 1Y). */
  readonly tenor?: string;
  readonly step?: string;
  /** Sheet row of each engine quote (rowOfQuote[i] for quotes[i]), so columns are numbered as the sheet numbers rows (from 1). */
  readonly rowOfQuote?: readonly number[];
  /** Called when the user changes the interpolation, tenor or step (to keep the choice in the workspace view). */
  readonly onSettingsChange?: (settings: { interpolation: InterpolationId; tenor: string; step: string }) => void;
  /** The workbench's build: with it, each cell is a button that opens its explanation beside the map. */
  readonly result?: WorkbenchBuild;
}

const TENORS = ['1M', '3M', '6M', '1Y'];
const STEPS = ['3M', '6M', '1Y', '2Y'];

/**
 * Diverging colour for a sensitivity in bp per bp: blue for positive, orange for negative, white at
 * 0. The strongest shade stops at 65 % of the hue, so the cell's dark figures keep a contrast of
 * at least 4.5:1 (WCAG AA) on every shade (at 85 % the darkest blues fell to 4.45:1).
 */
function cellColour(v: number, scale: number): string {
  const a = Math.min(1, Math.abs(v) / (scale || 1));
  const [r, g, b] = v >= 0 ? [49, 110, 180] : [214, 120, 40];
  const mix = (c: number): number => Math.round(255 + (c - 255) * a * 0.65);
  return `rgb(${mix(r)}, ${mix(g)}, ${mix(b)})`;
}

/**
 * Which quote drives each forward: rows are forwards of one tenor starting every step, columns the
 * quotes in maturity order, each cell the forward's move in bp per bp of the quote's own yield
 * (computed from the bootstrap). Switching the interpolation shows which methods keep a quote's
 * influence local.
 */
export function SensitivityHeatMap({ workspace, interpolation, tenor = '3M', step = '1Y', rowOfQuote, onSettingsChange, result }: SensitivityHeatMapProps) {
  const [method, setMethodState] = useState<InterpolationId>(interpolation ?? workspace?.curve.interpolation ?? 'monotone-convex');
  const [fwdTenor, setTenorState] = useState(tenor);
  const [fwdStep, setStepState] = useState(step);
  const report = (next: { interpolation: InterpolationId; tenor: string; step: string }): void => onSettingsChange?.(next);
  const setMethod = (m: InterpolationId): void => {
    setMethodState(m);
    report({ interpolation: m, tenor: fwdTenor, step: fwdStep });
  };
  const setFwdTenor = (t: string): void => {
    setTenorState(t);
    report({ interpolation: method, tenor: t, step: fwdStep });
  };
  const setFwdStep = (t: string): void => {
    setStepState(t);
    report({ interpolation: method, tenor: fwdTenor, step: t });
  };
  const kit = loadedOvernightKit();
  const out = useMemo(() => {
    if (!workspace) return null;
    const t = parseTenor(fwdTenor);
    const s = parseTenor(fwdStep);
    if (!t || !s) return null;
    // Built as the workbench builds it: the turns (solved spreads too) and meeting steps with their code.
    return heatMapFor(workspace, method, t, s);
  }, [workspace, method, fwdTenor, fwdStep, kit]);
  const scale = useMemo(() => {
    if (!out || !out.ok) return 1;
    let m = 0;
    for (const v of out.value.map.values) m = Math.max(m, Math.abs(v));
    return m;
  }, [out]);

  // A cell opens its explanation; the open one follows the workspace, and closes when the map's settings change.
  const display = useAppStore((st) => st.workspace.display);
  const explain = useExplainOpener<SensitivityCell>((a, b) => a.sensitivity.start === b.sensitivity.start && a.sensitivity.quote === b.sensitivity.quote);
  const open = explain.open?.sensitivity;
  const cellAt = (start: string, quote: number): SensitivityCell | null => (workspace ? { sensitivity: { workspace, interpolation: method, tenor: fwdTenor, step: fwdStep, start, quote } } : null);
  const openCell = useMemo(
    () => (open && workspace && open.interpolation === method && open.tenor === fwdTenor && open.step === fwdStep ? { sensitivity: { ...open, workspace } } : null),
    [open, workspace, method, fwdTenor, fwdStep],
  );
  return (
    <section className="panel sensitivity-panel" aria-label="Which quote drives each forward">
      <h2>Which quote drives each forward</h2>
      <div className="controls">
        <label>
          Interpolation{' '}
          <select value={method} onChange={(e) => setMethod(e.target.value as InterpolationId)}>
            {INTERPOLATIONS.map((id) => <option key={id} value={id}>{INTERPOLATORS[id].label}</option>)}
          </select>
        </label>{' '}
        <label>
          Forward tenor{' '}
          <select value={fwdTenor} onChange={(e) => setFwdTenor(e.target.value)}>
            {TENORS.map((t) => <option key={t} value={t}>{t}</option>)}
          </select>
        </label>{' '}
        <label>
          Starts every{' '}
          <select value={fwdStep} onChange={(e) => setFwdStep(e.target.value)}>
            {STEPS.map((t) => <option key={t} value={t}>{t}</option>)}
          </select>
        </label>
      </div>
      {!workspace && <p role="status">No valid workspace yet.</p>}
      {out && !out.ok && <p role="alert" className="error">{out.errors.map((e) => e.message).join('; ')}</p>}
      {out && out.ok && (
        <p className="muted small">
          How far each forward moves when one quote moves 1 bp (a price quote moved through its own yield), computed from the bootstrap, turns and meeting steps included. Blue: the forward
          rises with the quote; orange: it falls. Figures below 0.005 bp per bp show as 0.00; the exact figure is in each cell&rsquo;s tooltip.
        </p>
      )}
      {out && out.ok && (
        <div className="heatmap-scroll" tabIndex={0} role="region" aria-label="Forward sensitivities (scrolls)">
          <table className="data heatmap" aria-label="Forward sensitivities">
            <caption>
              In bp of forward per bp of quote; forwards <span className="tag">{rateTag(out.value.map.compounding, out.value.map.dayCount)}</span>
            </caption>
            <thead>
              <tr>
                <th scope="col">Forward</th>
                <th scope="col">Rate <span className="tag">{rateTag(out.value.map.compounding, out.value.map.dayCount)}</span></th>
                {out.value.map.columns.map((c) => (
                  <th key={c.index} scope="col" title={`Row ${rowNumber(rowOfQuote, c.index)}: ${c.kind} ${c.maturity}, moved through its ${c.yieldLabel}`}>
                    <span className="muted">Row {rowNumber(rowOfQuote, c.index)}</span> {c.kind} {c.maturity}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {out.value.map.rows.map((r, i) => (
                <tr key={r.start} data-start={r.start}>
                  <th scope="row">{r.start} → {r.end}</th>
                  <td className="n" data-field="rate">{result && cellAt(r.start, -1) ? explain.button(cellAt(r.start, -1)!, formatPercent(r.rate), `the forward ${r.start} to ${r.end}`, openCell !== null) : formatPercent(r.rate)}</td>
                  {out.value.map.columns.map((c, k) => {
                    const v = out.value.map.values[i * out.value.map.columns.length + k]!;
                    const shown = nearZero(v, 2, 'bp per bp');
                    return (
                      <td
                        key={c.index}
                        className="n cell"
                        style={{ background: cellColour(v, scale) }}
                        data-quote={c.index}
                        title={shown.title}
                        aria-label={`${r.start} forward to row ${rowNumber(rowOfQuote, c.index)}: ${nearZero(v, 3, 'bp per bp').text} bp per bp`}
                      >
                        {result && cellAt(r.start, c.index) ? (
                          explain.button(cellAt(r.start, c.index)!, shown.text, `the ${r.start} forward's sensitivity to row ${rowNumber(rowOfQuote, c.index)}`, openCell !== null)
                        ) : (
                          shown.text
                        )}
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {result && <OpenExplanation result={result} display={display} cell={openCell} onClose={explain.close} />}
    </section>
  );
}
