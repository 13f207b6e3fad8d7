import { useMemo, useState } from 'react';
import { setViewValues, viewText } from '../../state/viewValues.ts';
import { fixedLegConvention, forwardOn, forwardParRateOn, marketDate, parseTenor, type Curve, type FixedLegConvention, type Workspace, couponTag, formatPercent, rateTag } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';
import { EditLock } from '../../components/EditLock.tsx';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import type { DatedCell } from './explainCell.ts';
import { OpenExplanation, useExplainOpener } from './explainOpener.tsx';

const DEFAULT_STARTS = ['1Y', '2Y', '5Y', '10Y'];
const DEFAULT_TENORS = ['1Y', '2Y', '5Y', '10Y'];
/** At most this many starts and tenors (a grid of 12 by 12 forwards). */
export const GRID_AXIS_MAX = 12;

/** Reads a typed axis ("1Y, 2Y 5y") as tenors: each must be a tenor such as 6M or 2Y, at most GRID_AXIS_MAX. */
export function readGridAxis(text: string, name: string): { tenors: string[]; error: string | null } {
  const parts = text.split(/[\s,;]+/).filter((p) => p !== '').map((p) => p.toUpperCase());
  const bad = parts.filter((p) => parseTenor(p) === null);
  if (parts.length === 0) return { tenors: [], error: `${name}: type at least one tenor such as 1Y` };
  if (bad.length > 0) return { tenors: [], error: `${name}: "${bad[0]!.slice(0, 12)}" is not a tenor; use forms such as 1M, 6M, 2Y, separated by commas or spaces` };
  if (parts.length > GRID_AXIS_MAX) return { tenors: [], error: `${name}: at most ${GRID_AXIS_MAX} tenors, not ${parts.length}` };
  return { tenors: parts, error: null };
}

/** The swap fixed-leg convention of the workspace: its first swap quote's, else annual 30/360 (common practice; the core's fixedLegConvention). */
export function swapConvention(ws: Workspace | null): FixedLegConvention {
  return fixedLegConvention(ws?.quotes ?? []);
}

/** Forward-starting par swap rates (start x tenor, as desks read 1y1y, 5y5y), or forward zero rates; with the build, each rate opens its explanation. */
export function ForwardGridTable({ curve, workspace, result }: { curve: Curve; workspace: Workspace | null; result?: WorkbenchBuild }) {
  const doc = useAppStore((s) => s.workspace);
  const display = doc.display;
  const [mode, setMode] = useState<'par' | 'zero'>('par');
  // The axes as typed, kept in the document's view (saved, undone, shared); the last valid reading is drawn.
  const startsText = viewText(doc, 'gridStarts', DEFAULT_STARTS.join(', '));
  const tenorsText = viewText(doc, 'gridTenors', DEFAULT_TENORS.join(', '));
  const startsRead = readGridAxis(startsText, 'Starts');
  const tenorsRead = readGridAxis(tenorsText, 'Tenors');
  const STARTS = startsRead.error === null ? startsRead.tenors : DEFAULT_STARTS;
  const TENORS = tenorsRead.error === null ? tenorsRead.tenors : DEFAULT_TENORS;
  const axisKey = `${STARTS.join()}|${TENORS.join()}`;
  const conv = swapConvention(workspace);
  const grid = useMemo(
    () =>
      STARTS.map((s) => {
        const start = marketDate(curve.settlement, parseTenor(s)!);
        return TENORS.map((t) => {
          const end = marketDate(start, parseTenor(t)!);
          const cell: DatedCell = {
            field: mode === 'par' ? 'forwardPar' : 'forward',
            start,
            end,
            ...(mode === 'par' ? { leg: conv } : {}),
            title: `${s} into ${t} ${mode === 'par' ? 'forward par swap rate' : 'forward rate'} (${start} to ${end})`,
          };
          const r = mode === 'par' ? forwardParRateOn(curve, start, end, conv.frequency, conv.dayCount, conv.eom) : forwardOn(curve, start, end, display.compounding, display.dayCount);
          return r.ok ? { rate: r.value.rate, extrapolated: r.value.extrapolated, note: null, cell } : { rate: null, extrapolated: false, note: r.errors[0]?.message ?? '', cell };
        });
      }),
    [curve, mode, conv.frequency, conv.dayCount, conv.eom, display, axisKey],
  );
  const explain = useExplainOpener<DatedCell>((a, b) => a.field === b.field && a.start === b.start && a.end === b.end);
  const tag = mode === 'par' ? couponTag(conv.frequency, conv.dayCount) : rateTag(display.compounding, display.dayCount);
  return (
    <div>
      <EditLock>
      <fieldset className="segmented">
        <legend>Forward grid shows</legend>
        <label className={mode === 'par' ? 'on' : ''}>
          <input type="radio" name="grid-mode" checked={mode === 'par'} onChange={() => setMode('par')} />
          Forward par swap rates
        </label>
        <label className={mode === 'zero' ? 'on' : ''}>
          <input type="radio" name="grid-mode" checked={mode === 'zero'} onChange={() => setMode('zero')} />
          Forward zero rates
        </label>
      </fieldset>
      <div className="grid-axes">
        <label>
          Starts (from settlement)
          <input value={startsText} size={22} spellCheck={false} aria-invalid={startsRead.error ? true : undefined} onChange={(e) => setViewValues({ gridStarts: e.target.value.slice(0, 120) }, 'forward grid starts', 'grid-starts')} onBlur={() => useAppStore.getState().endEdit()} />
        </label>
        <label>
          Tenors
          <input value={tenorsText} size={22} spellCheck={false} aria-invalid={tenorsRead.error ? true : undefined} onChange={(e) => setViewValues({ gridTenors: e.target.value.slice(0, 120) }, 'forward grid tenors', 'grid-tenors')} onBlur={() => useAppStore.getState().endEdit()} />
        </label>
        {[startsRead.error, tenorsRead.error].filter((m) => m !== null).map((m) => (
          <span key={m} className="field-error" role="alert">
            {m} (the grid keeps the standard axes until then)
          </span>
        ))}
      </div>
      </EditLock>
      <div className="scroll-x" tabIndex={0} role="region" aria-label="Forward grid (scrolls sideways)">
      <table className="data grid4" aria-label="Forward grid">
        <caption>
          {mode === 'par' ? 'Forward par rates on the swap fixed-leg convention' : 'Forward zero rates'} <span className="tag">{tag}</span>; rows start, columns tenor
        </caption>
        <thead>
          <tr>
            <th scope="col">Start \ tenor</th>
            {TENORS.map((t) => (
              <th scope="col" key={t}>
                {t}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {grid.map((row, i) => (
            <tr key={STARTS[i]}>
              <th scope="row">{STARTS[i]}</th>
              {row.map((c, j) => (
                <td key={TENORS[j]} className="n" title={c.note ?? `${STARTS[i]!.toLowerCase()}${TENORS[j]!.toLowerCase()}`} data-cell={`${STARTS[i]}x${TENORS[j]}`}>
                  {result && c.rate !== null ? (
                    explain.button(c.cell, formatPercent(c.rate), `the ${c.cell.title}`)
                  ) : (
                    formatPercent(c.rate)
                  )}
                  {c.extrapolated ? '*' : ''}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      </div>
      {result && <OpenExplanation result={result} display={display} cell={explain.open} onClose={explain.close} />}
    </div>
  );
}
