import { coreError, explainQuoteCheck, fail, quoteOnCurve, quoteYieldLabel, valueUnderEachMethod, type Curve, type Instrument, type QuoteCheckFigure, type Result } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, curvesUnder, noCurve, underEachMethod, type CellExplanation } from './explainCell.ts';

/** A figure of the quote check: the model value of the quote with engine index `index`, or its difference from the market. */
export interface QuoteCheckCell {
  readonly quoteCheck: {
    readonly index: number;
    readonly figure: QuoteCheckFigure;
  };
}

const no = <T,>(message: string): Result<T> => fail(coreError('schema', '', message));

/**
 * The explanation of a quote check figure: the quote's instrument re-priced on the build's curve
 * with a trace (explainQuoteCheck; a named curve's term-index or basis swap, which declares the
 * curves built before it that it reads, `readsCurves`, with those reads traced too), which must
 * give the table's own figure bit for bit (else the panel says it cannot explain it rather than
 * show another number); the quote itself is the one quote it depends on, one for one, since the
 * bootstrap solves the curve to reprice it (the curves it reads move it by nothing: its curve is
 * solved again on them); and the model value on the curve built under each method (for a swap
 * reading other curves, every curve of the workspace built under that method).
 */
export function explainQuoteCell(result: WorkbenchBuild, cell: QuoteCheckCell['quoteCheck']): Result<CellExplanation> {
  const curve = result.build.curve;
  if (!curve) return noCurve(result);
  const ins = result.build.instruments.find((i) => i.index === cell.index);
  const row = result.build.repricing.find((r) => r.index === cell.index);
  if (!ins || !row) return no('this quote is not in the curve now');
  const own = result.curveName;
  const r = explainQuoteCheck(curve, ins, curve.settlement, cell.figure, undefined, own);
  if (!r.ok) return r;
  const shown = cell.figure === 'model' ? row.model : row.unit === 'price' ? row.repricingError : row.repricingError * 1e4;
  // A safety net: the explanation is the table's own call, so the two agree unless that call changes.
  if (!Object.is(r.value.value, shown)) return no("not explained: not the table's figure");
  const sheetRow = result.conversion.rowOfQuote[ins.index];
  const rowText = sheetRow === undefined ? 'this quote' : `row ${sheetRow + 1}`;
  const influences = { ok: true as const, value: [{ index: ins.index, kind: ins.kind, maturity: ins.maturity, yieldLabel: quoteYieldLabel(ins), bpPerBp: 1 }] };
  const across = ins.readsCurves;
  const note = `the curve is solved to reprice ${rowText}, so its model value moves one for one with its quote alone${across ? `; the curves it reads move it by 0 (it is solved again on them)` : ''}`;
  const read = (i: Instrument, on: Curve): Result<number> => {
    const model = quoteOnCurve(i, on.lnDiscountAt);
    const v = cell.figure === 'model' ? model : i.unit === 'price' ? model - i.market : (model - i.market) * 1e4;
    return Number.isFinite(v) ? { ok: true, value: v } : no('no value');
  };
  // A swap reading other curves: every curve built under each method, this one's swap read on its own curve.
  const whole = result.whole;
  const of = new Map<Curve, Instrument>();
  const methods =
    across && whole
      ? valueUnderEachMethod(curve.interpolation, (m) => {
          const b = curvesUnder(whole.base, whole.inputs, m).named.curves.find((c) => c.name === own)?.build;
          const i = b?.instruments.find((x) => x.index === ins.index);
          if (b?.curve && i) of.set(b.curve, i);
          return { curve: (i && b?.curve) ?? null, errors: [] };
        }, (on) => read(of.get(on)!, on))
      : underEachMethod(result, (on) => read(ins, on));
  return cellOf(result, `${cell.figure === 'model' ? `Model ${ins.field}` : 'Repricing error'} of ${rowText}: ${ins.kind} ${ins.maturity}`, r.value, influences, note, methods);
}
