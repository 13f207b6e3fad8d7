import {
  buildCurve,
  explainCurveDifference,
  explainReferenceDifference,
  snapshotDocument,
  topQuoteInfluences,
  type CompareBy,
  type Compounding,
  type CurveDayCount,
  type InterpolationId,
  type ReferenceCurve,
  type Result,
  type Snapshot,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, noCurve, underEachMethod, type CellExplanation } from '../tables/explainCell.ts';

/** A difference in the Snapshots table: the current zero rate at `tenor` minus the snapshot's, lined up `by`, in the table's convention. */
export interface DifferenceCell {
  readonly difference: {
    readonly snapshot: Snapshot;
    readonly tenor: string;
    readonly by: CompareBy;
    readonly compounding: Compounding;
    readonly dayCount: CurveDayCount;
  };
}

/** A difference in the reference curve's table: ours minus the reference's zero rate on `date`, in the reference's convention. */
export interface ReferenceCell {
  readonly reference: {
    readonly curve: ReferenceCurve;
    readonly date: string;
  };
}

/**
 * The explanation of one difference: the row compareCurves shows, read again with a trace
 * (explainCurveDifference) on the build's curve and the snapshot rebuilt from its inputs, as the
 * table rebuilds it; the quotes behind the current rate (the snapshot's are frozen, not on the
 * sheet); and the difference under each method, both curves built under it.
 */
export function explainDifferenceCell(result: WorkbenchBuild, cell: DifferenceCell['difference']): Result<CellExplanation> {
  const current = result.build.curve;
  if (!current) return noCurve(result);
  const { snapshot, tenor, by, compounding: c, dayCount: dc } = cell;
  const snapshotUnder = (method?: InterpolationId) => buildCurve(snapshotDocument(snapshot), method ? { interpolation: method } : {});
  const other = snapshotUnder().curve;
  if (!other) return { ok: false, errors: [{ path: 'snapshots', quote: null, code: 'schema', message: `the snapshot ${snapshot.name} does not build a curve now` }] };
  const r = explainCurveDifference(current, other, tenor, by, c, dc);
  if (!r.ok) return r;
  const explanation = r.value;
  const date = explanation.dates.find((d) => d.name === 'current date')!.adjusted;
  const influences = topQuoteInfluences(current, result.build.instruments, current.settlement, date, c, dc);
  const quotesNote = `of the current ${tenor} zero rate: the snapshot's quotes are frozen with it, not on the sheet`;
  const methods = underEachMethod(result, (on) => {
      const then = snapshotUnder(on.interpolation).curve;
      if (!then) return { ok: false, errors: [{ path: 'snapshots', quote: null, code: 'schema', message: `the snapshot does not build under ${on.interpolation}` }] };
      const v = explainCurveDifference(on, then, tenor, by, c, dc);
      return v.ok ? { ok: true, value: v.value.value } : v;
    },
  );
  const lineUp = by === 'time' ? 'same time to maturity' : 'same calendar date';
  return cellOf(result, `Difference of the ${tenor} zero rate from ${snapshot.name} (${lineUp})`, explanation, influences, quotesNote, methods);
}

/**
 * The explanation of one row of the reference curve's table: referenceRow read again with a trace
 * (explainReferenceDifference), the quotes behind our zero rate, and the difference with our curve
 * built under each method (the reference stays as its file gives it).
 */
export function explainReferenceCell(result: WorkbenchBuild, cell: ReferenceCell['reference']): Result<CellExplanation> {
  const curve = result.build.curve;
  if (!curve) return noCurve(result);
  const { curve: ref, date } = cell;
  const r = explainReferenceDifference(curve, ref, date);
  if (!r.ok) return r;
  const influences = topQuoteInfluences(curve, result.build.instruments, curve.settlement, date, ref.compounding, ref.dayCount);
  const methods = underEachMethod(result, (on) => {
      const v = explainReferenceDifference(on, ref, date);
      return v.ok ? { ok: true, value: v.value.value } : v;
    },
  );
  return cellOf(result, `Difference of our zero rate on ${date} from the reference`, r.value, influences, `of our zero rate on ${date}: the reference is as its file gives it`, methods);
}
