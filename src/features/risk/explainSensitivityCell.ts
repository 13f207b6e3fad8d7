import { coreError, explained, explainForwardSensitivity, fail, forwardOn, parseTenor, sensitivityMapFor, valueUnderEachMethod, type Curve, type InterpolationId, type Result, type SensitivityMapBuild, type Tenor, type Workspace } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { loadedOvernightKit } from '../../hooks/overnightKit.ts';
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
    /** The quote's column, or -1 for the forward's own rate (the map's Rate column). */
    readonly quote: number;
  };
}

/** The heat map as its table builds it: simple forwards, with the turns and meeting steps' code when loaded (as the workbench builds the curve). */
export const heatMapFor = (workspace: Workspace, interpolation: InterpolationId, tenor: Tenor, step: Tenor) => {
  const kit = loadedOvernightKit();
  return sensitivityMapFor(workspace, { interpolation, tenor, step, compounding: 'simple', ...(kit ? { overnight: kit } : {}) });
};

/**
 * The explanation of one heat-map cell: the map made again as the heat map makes it
 * (sensitivityMapFor), its row and column found, and explainForwardSensitivity (forwardSensitivities
 * on that row with a trace) ending in the cell's figure; the quotes listed are the cell's own, then
 * the four others of the forward's row that move it most; the cell under each method is the map
 * built with that method. The Rate column (quote -1) is the forward itself: forwardOn on the map's
 * curve in the map's conventions, with the forward's row as its quotes.
 */
export function explainSensitivityCell(result: WorkbenchBuild, cell: SensitivityCell['sensitivity']): Result<CellExplanation> {
  const { workspace, tenor, step, start, quote } = cell;
  const mapOf = (interpolation: InterpolationId) => heatMapFor(workspace, interpolation, parseTenor(tenor) ?? { n: 3, unit: 'M' }, parseTenor(step) ?? { n: 1, unit: 'Y' });
  const own = quote < 0;
  const figureOf = (m: SensitivityMapBuild): Result<{ i: number; k: number }> => {
    const i = m.map.rows.findIndex((r) => r.start === start);
    const k = own ? -1 : m.map.columns.findIndex((c) => c.index === quote);
    return i < 0 || (k < 0 && !own) ? fail(coreError('schema', 'start', `no forward from ${start} against this quote on this curve`)) : { ok: true, value: { i, k } };
  };
  const built = mapOf(cell.interpolation);
  if (!built.ok) return built;
  const at = figureOf(built.value);
  if (!at.ok) return at;
  const { map, curve, instruments } = built.value;
  const { i, k } = at.value;
  const row = map.rows[i]!;
  const n = map.columns.length;
  // The forward's own rate: forwardOn on the map's curve, in the map's conventions (its figure bit for bit, else no explanation).
  const traced = own ? explained((sink) => forwardOn(curve, row.start, row.end, map.compounding, map.dayCount, 'forward', sink)) : explainForwardSensitivity(curve, instruments, row, k, map.compounding, map.dayCount);
  if (!traced.ok) return traced;
  const explanation = 'explanation' in traced.value ? traced.value.explanation : traced.value;
  if (own && !Object.is(explanation.value, row.rate)) return fail(coreError('schema', 'start', 'not the figure shown'));
  const inRow = map.columns.map((c, kk) => ({ index: c.index, kind: c.kind, maturity: c.maturity, yieldLabel: c.yieldLabel, bpPerBp: map.values[i * n + kk]! }));
  // The cell's own quote first (none for the rate), then the forward's largest others.
  const first = own ? [] : inRow.splice(k, 1);
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
      return f.ok ? { ok: true, value: own ? m.map.rows[f.value.i]!.rate : m.map.values[f.value.i * m.map.columns.length + f.value.k]! } : f;
    },
  );
  const list = { ok: true as const, value: [...first, ...inRow.slice(0, own ? 5 : 4)] };
  if (own) return cellOf(result, `Forward ${row.start} to ${row.end} of the sensitivity map`, explanation, list, `the forward's row of the map: its largest sensitivities`, methods);
  const rowOf = result.conversion.rowOfQuote[quote];
  const c = map.columns[k]!;
  const title = `Sensitivity of the forward ${row.start} to ${row.end} to row ${rowOf === undefined ? '?' : rowOf + 1} (${c.kind} ${c.maturity})`;
  return cellOf(result, title, explanation, list, `this cell's quote first, then the forward's largest others in its row of the map`, methods);
}
