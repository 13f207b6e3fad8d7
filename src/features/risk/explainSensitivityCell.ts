import { coreError, explainForwardSensitivity, fail, parseTenor, sensitivityMapFor, valueUnderEachMethod, type Curve, type InterpolationId, type Result, type SensitivityMapBuild, type Workspace } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, type CellExplanation } from '../tables/explainCell.ts';

/**
 * A cell of the forward-sensitivity heat map: the map's settings (the workspace it builds, its
 * method, the forwards' tenor and step), the forward's start and the quote's index in the document.
 */
export interface SensitivityCell {
  readonly sensitivity: {
    readonly workspace: Workspace;
    readonly interpolation: InterpolationId;
    /** The forwards' tenor and the step between their starts, as the map's choices read (3M, 1Y). */
    readonly tenor: string;
    readonly step: string;
    readonly start: string;
    readonly quote: number;
  };
}

/**
 * The explanation of one heat-map cell: the map made again as the heat map makes it
 * (sensitivityMapFor), its row and column found, and explainForwardSensitivity (forwardSensitivities
 * on that row with a trace) ending in the cell's figure; the quotes listed are the cell's own, then
 * the four others of the forward's row that move it most; the cell under each method is the map
 * built with that method.
 */
export function explainSensitivityCell(result: WorkbenchBuild, cell: SensitivityCell['sensitivity']): Result<CellExplanation> {
  const { workspace, tenor, step, start, quote } = cell;
  const mapOf = (interpolation: InterpolationId) => sensitivityMapFor(workspace, { interpolation, tenor: parseTenor(tenor) ?? { n: 3, unit: 'M' }, step: parseTenor(step) ?? { n: 1, unit: 'Y' }, compounding: 'simple' });
  const figureOf = (m: SensitivityMapBuild): Result<{ i: number; k: number }> => {
    const i = m.map.rows.findIndex((r) => r.start === start);
    const k = m.map.columns.findIndex((c) => c.index === quote);
    return i < 0 || k < 0 ? fail(coreError('schema', 'start', `no forward from ${start} against this quote on this curve`)) : { ok: true, value: { i, k } };
  };
  const built = mapOf(cell.interpolation);
  if (!built.ok) return built;
  const at = figureOf(built.value);
  if (!at.ok) return at;
  const { map, curve, instruments } = built.value;
  const { i, k } = at.value;
  const row = map.rows[i]!;
  const e = explainForwardSensitivity(curve, instruments, row, k, map.compounding, map.dayCount);
  if (!e.ok) return e;
  const n = map.columns.length;
  const inRow = map.columns.map((c, kk) => ({ index: c.index, kind: c.kind, maturity: c.maturity, yieldLabel: c.yieldLabel, bpPerBp: map.values[i * n + kk]! }));
  // The cell's own quote first, then the forward's largest others.
  const own = inRow.splice(k, 1);
  inRow.sort((a, b) => Math.abs(b.bpPerBp) - Math.abs(a.bpPerBp));
  const maps = new Map<Curve, SensitivityMapBuild>();
  const methods = valueUnderEachMethod(
    cell.interpolation,
    (method) => {
      const m = mapOf(method);
      if (m.ok) maps.set(m.value.curve, m.value);
      return m.ok ? { curve: m.value.curve, errors: [] } : { curve: null, errors: m.errors };
    },
    (on) => {
      const m = maps.get(on)!;
      const f = figureOf(m);
      return f.ok ? { ok: true, value: m.map.values[f.value.i * m.map.columns.length + f.value.k]! } : f;
    },
  );
  const rowOf = result.conversion.rowOfQuote[quote];
  const c = map.columns[k]!;
  const title = `Sensitivity of the forward ${row.start} to ${row.end} to row ${rowOf === undefined ? '?' : rowOf + 1} (${c.kind} ${c.maturity})`;
  return cellOf(result, title, e.value, { ok: true, value: [...own, ...inRow.slice(0, 4)] }, `this cell's quote first, then the forward's largest others in its row of the map`, methods);
}
