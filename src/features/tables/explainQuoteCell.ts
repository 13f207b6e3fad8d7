import { coreError, explainQuoteCheck, fail, quoteOnCurve, quoteYieldLabel, type QuoteCheckFigure, type Result } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, noCurve, underEachMethod, type CellExplanation } from './explainCell.ts';

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
 * with a trace (explainQuoteCheck), which must give the table's own figure bit for bit (else the
 * panel says it cannot explain it rather than show another number); the quote itself is the one
 * quote it depends on, one for one, since the bootstrap solves the curve to reprice it; and the
 * model value on the curve built under each method.
 */
export function explainQuoteCell(result: WorkbenchBuild, cell: QuoteCheckCell['quoteCheck']): Result<CellExplanation> {
  const curve = result.build.curve;
  if (!curve) return noCurve(result);
  const ins = result.build.instruments.find((i) => i.index === cell.index);
  const row = result.build.repricing.find((r) => r.index === cell.index);
  if (!ins || !row) return no('this quote is not in the curve now');
  const r = explainQuoteCheck(curve, ins, curve.settlement, cell.figure);
  if (!r.ok) return r;
  const shown = cell.figure === 'model' ? row.model : row.unit === 'price' ? row.repricingError : row.repricingError * 1e4;
  if (!Object.is(r.value.value, shown)) return no('not explained yet: it reads more than this curve');
  const sheetRow = result.conversion.rowOfQuote[ins.index];
  const rowText = sheetRow === undefined ? 'this quote' : `row ${sheetRow + 1}`;
  const influences = { ok: true as const, value: [{ index: ins.index, kind: ins.kind, maturity: ins.maturity, yieldLabel: quoteYieldLabel(ins), bpPerBp: 1 }] };
  const note = `the curve is solved to reprice ${rowText}, so its model value moves one for one with its quote alone`;
  const methods = underEachMethod(result, (on) => {
      const model = quoteOnCurve(ins, on.lnDiscountAt);
      const v = cell.figure === 'model' ? model : ins.unit === 'price' ? model - ins.market : (model - ins.market) * 1e4;
      return Number.isFinite(v) ? { ok: true, value: v } : no('no value');
    },
  );
  return cellOf(result, `${cell.figure === 'model' ? `Model ${ins.field}` : 'Repricing error'} of ${rowText}: ${ins.kind} ${ins.maturity}`, r.value, influences, note, methods);
}
