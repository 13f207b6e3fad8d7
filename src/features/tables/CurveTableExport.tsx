import { useId } from 'react';
import { CURVE_TABLE_GRIDS, curveTableCsv, curveTablePoints, isIsoDate, parseTenor, type Curve, type CurveTableGrid } from '../../core/index.ts';
import { download, safeFileName } from '../../components/download.ts';
import { useAppStore } from '../../state/store.ts';
import { setViewValues, viewText } from '../../state/viewValues.ts';
import { tableConventionsFromDisplay } from '../../core/index.ts';
import { EditLock } from '../../components/EditLock.tsx';

const GRID_LABEL: Readonly<Record<CurveTableGrid, string>> = {
  pillars: 'Pillars',
  monthly: 'Every month',
  quarterly: 'Every quarter',
  yearly: 'Every year',
  dates: 'Your points',
};
const isGrid = (x: string): x is CurveTableGrid => (CURVE_TABLE_GRIDS as readonly string[]).includes(x);

const isPoint = (p: string): boolean => parseTenor(p) !== null || isIsoDate(p);

/** Reads "1Y, 2030-06-30 5y" as points: each a tenor from settlement or an ISO date. */
export function readOwnPoints(text: string): { points: string[]; error: string | null } {
  const parts = text.split(/[\s,;]+/).filter((p) => p !== '');
  const points = parts.map((p) => (parseTenor(p.toUpperCase()) ? p.toUpperCase() : p));
  const bad = points.find((p) => !isPoint(p));
  if (points.length === 0) return { points, error: 'Type at least one tenor (5Y) or date (YYYY-MM-DD).' };
  if (bad !== undefined) return { points, error: `"${bad.slice(0, 20)}" is neither a tenor such as 5Y nor a date YYYY-MM-DD.` };
  return { points, error: null };
}

/**
 * Writes the curve table as CSV on a grid the user picks: the pillars, every month, quarter or
 * year, or their own tenors and dates. Rates in the display conventions (named in the header), a
 * flag on points past the last pillar, and a file name carrying the settlement date and the grid.
 * The choice is kept in the document's view.
 */
export function CurveTableExport({ curve }: { curve: Curve }) {
  const doc = useAppStore((s) => s.workspace);
  const id = useId();
  const gridText = viewText(doc, 'curveTableGrid', 'pillars');
  const grid: CurveTableGrid = isGrid(gridText) ? gridText : 'pillars';
  const ownText = viewText(doc, 'curveTablePoints', '1Y, 2Y, 5Y, 10Y');
  const own = readOwnPoints(ownText);
  const blocked = grid === 'dates' && own.error !== null;
  const save = () => {
    const points = curveTablePoints(curve, grid, own.points);
    download(`tenorscope-curve-${safeFileName(curve.settlement)}-${grid}.csv`, 'text/csv', curveTableCsv(curve, tableConventionsFromDisplay(doc.display), points));
  };
  return (
    <div className="curve-export">
      <EditLock>
      <label>
        Export grid
        <select value={grid} onChange={(e) => setViewValues({ curveTableGrid: e.target.value }, 'curve table grid')}>
          {CURVE_TABLE_GRIDS.map((g) => (
            <option key={g} value={g}>
              {GRID_LABEL[g]}
            </option>
          ))}
        </select>
      </label>
      {grid === 'dates' ? (
        <label>
          Points (tenors from settlement or dates)
          <input value={ownText} size={28} spellCheck={false} aria-invalid={own.error ? true : undefined} aria-describedby={own.error ? `${id}-err` : undefined} onChange={(e) => setViewValues({ curveTablePoints: e.target.value.slice(0, 400) }, 'curve table points', 'curve-table-points')} onBlur={() => useAppStore.getState().endEdit()} />
        </label>
      ) : null}
      </EditLock>
      <button type="button" onClick={save} disabled={blocked}>
        Export this table on the grid (CSV)
      </button>
      {blocked ? (
        <span id={`${id}-err`} className="field-error" role="alert">
          {own.error}
        </span>
      ) : (
        <span className="muted small">Rates in the display conventions, named in the header; points past the last pillar are flagged.</span>
      )}
    </div>
  );
}
