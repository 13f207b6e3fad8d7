import {
  buildWorkbenchCurves,
  curveSpreadAt,
  explainCurveSpread,
  isPlainObject,
  marketDate,
  parseTenor,
  forwardInfluencesAcrossCurves,
  type CurveQuoteInfluence,
  type CurveWithQuotes,
  valueUnderEachMethod,
  type Curve,
  type DisplaySettings,
  type Instrument,
  type InterpolationId,
  type Result,
  type SpreadMeasure,
  type WorkbenchCurveInputs,
  type WorkbenchCurves,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { buildUnder, cellOf, type CellExplanation, type Influences } from '../tables/explainCell.ts';
import { DEFAULT_NAME } from './curveChoice.ts';

/**
 * A figure of the Spread between curves table: curve `of` minus curve `over` ('' for the default
 * curve) at key maturity `tenor`, zero rates or forwards of the display's forward tenor, in the
 * display's compounding and day count. `named` and `inputs` are the named curves as built and the
 * document they were built from (the spread view's own).
 */
export interface SpreadCell {
  readonly spread: {
    readonly of: string;
    readonly over: string;
    readonly measure: SpreadMeasure;
    readonly tenor: string;
    readonly named: WorkbenchCurves;
    readonly inputs: WorkbenchCurveInputs;
  };
}

const label = (name: string): string => (name === '' ? DEFAULT_NAME : name);
const noCurve = (name: string): Result<never> => ({ ok: false, errors: [{ path: '', quote: null, code: 'schema', message: `the curve ${label(name)} did not build` }] });

/** The document's named curves with every one set to interpolate by `method`. */
function inputsUnder(inputs: WorkbenchCurveInputs, method: InterpolationId): WorkbenchCurveInputs {
  const curves = inputs.curves?.map((c) => (isPlainObject(c) ? { ...c, curve: { ...(isPlainObject(c.curve) ? c.curve : {}), interpolation: method } } : c));
  return { ...inputs, curves };
}

/**
 * The explanation of one spread figure: explainCurveSpread (the table's curveSpreadAt on that date,
 * each curve's query traced), the quotes of any curve it depends on most (the first rate's
 * sensitivities minus the second's, each across the curves it is built on,
 * forwardInfluencesAcrossCurves; a default-curve quote links to its sheet row, a named curve's
 * quote is named by its curve and position), and the spread (curveSpreadAt) with every curve built
 * under each method.
 */
export function explainSpreadCell(result: WorkbenchBuild, display: DisplaySettings, cell: SpreadCell['spread']): Result<CellExplanation> {
  const { named, inputs, measure } = cell;
  const tenor = parseTenor(display.forwardTenor) ?? { n: 3, unit: 'M' as const };
  const buildOf = (name: string): { curve: Curve | null; instruments: readonly Instrument[] } => {
    if (name === '') return { curve: result.build.curve, instruments: result.build.instruments };
    const n = named.curves.find((c) => c.name === name);
    return { curve: n?.build.curve ?? null, instruments: n?.build.instruments ?? [] };
  };
  const a = buildOf(cell.of);
  const b = buildOf(cell.over);
  if (!a.curve) return noCurve(cell.of);
  if (!b.curve) return noCurve(cell.over);
  const at = parseTenor(cell.tenor);
  if (!at) return { ok: false, errors: [{ path: 'tenor', quote: null, code: 'schema', message: `"${cell.tenor}" is not a tenor` }] };
  const date = marketDate(a.curve.settlement, at);
  const end = marketDate(date, tenor);
  const names = { of: label(cell.of), over: label(cell.over) };
  const c = display.compounding;
  const dc = display.dayCount;
  const r = explainCurveSpread(a.curve, b.curve, names, measure, date, c, dc, tenor, { date: cell.tenor, start: cell.tenor, end: `${display.forwardTenor} after the start` });
  if (!r.ok) return r;
  const explanation = r.value.explanation;
  // The quotes behind the spread, of any curve: d spread = d rate of - d rate over, each rate's
  // sensitivities across curves (a discounting quote moves a projection curve's rates too).
  const set: CurveWithQuotes[] = [{ name: DEFAULT_NAME, curve: result.build.curve!, instruments: result.build.instruments }];
  for (const x of named.curves) if (x.build.curve) set.push({ name: x.name, curve: x.build.curve, instruments: x.build.instruments });
  const [ia, ib] = [names.of, names.over].map((name) => forwardInfluencesAcrossCurves(set, name, measure === 'zero' ? a.curve!.settlement : date, measure === 'zero' ? date : end, c, dc)) as [Influences, Influences];
  let influences: Influences = !ia.ok ? ia : ib;
  if (ia.ok && ib.ok) {
    const byQuote = new Map<string, CurveQuoteInfluence>();
    for (const [list, sign] of [[ia.value, 1], [ib.value, -1]] as const) {
      for (const q of list as readonly CurveQuoteInfluence[]) {
        const key = `${q.curve} ${q.index}`;
        byQuote.set(key, { ...q, bpPerBp: (byQuote.get(key)?.bpPerBp ?? 0) + sign * q.bpPerBp });
      }
    }
    influences = { ok: true, value: [...byQuote.values()].filter((q) => q.bpPerBp !== 0).sort((x, y) => Math.abs(y.bpPerBp) - Math.abs(x.bpPerBp)).slice(0, 5) };
  }
  const note = `spread = ${names.of} - ${names.over}: the two rates' sensitivities, a ${names.over} rate's with the sign turned, across every curve it is built on`;
  // Every curve built under each method: the default curve as the workbench builds it, the named curves after it;
  // the method's first curve is read with its second beside it.
  const pairs = new Map<Curve, Curve>();
  const methods = valueUnderEachMethod(
    a.curve.interpolation,
    (method) => {
      const base = buildUnder(result, method);
      const all = buildWorkbenchCurves(inputsUnder(inputs, method), base.curve);
      const pick = (name: string) => (name === '' ? base.curve : all.curves.find((x) => x.name === name)?.build.curve ?? null);
      const [ca, cb] = [pick(cell.of), pick(cell.over)];
      if (ca && cb) pairs.set(ca, cb);
      return ca && cb ? { curve: ca, errors: [] } : { curve: null, errors: [{ path: '', quote: null, code: 'schema' as const, message: `a curve did not build under ${method}` }] };
    },
    (on) => {
      const pair = pairs.get(on);
      if (!pair) return { ok: false, errors: [{ path: '', quote: null, code: 'schema', message: 'no second curve' }] };
      const s = curveSpreadAt(on, pair, measure, [date], c, dc, tenor)[0];
      return s ? { ok: true, value: s.bp } : { ok: false, errors: [{ path: 'date', quote: null, code: 'schema', message: `no spread on ${date}` }] };
    },
  );
  const title = `Spread of ${names.of} over ${names.over}, ${measure === 'zero' ? 'zero rate' : `${display.forwardTenor} forward`} at ${cell.tenor} (${date})`;
  return cellOf(result, title, explanation, influences, note, methods, DEFAULT_NAME);
}
