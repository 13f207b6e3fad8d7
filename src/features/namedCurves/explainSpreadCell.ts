import {
  coreError,
  fail,
  curveSpreadAt,
  explainCurveSpread,
  marketDate,
  parseTenor,
  topQuoteInfluencesAcrossCurves,
  type CurveWithQuotes,
  type QuoteInfluence,
  valueUnderEachMethod,
  type Curve,
  type DisplaySettings,
  type Instrument,
  type Result,
  type SpreadMeasure,
  type WorkbenchCurveInputs,
  type WorkbenchCurves,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { cellOf, curvesUnder, type CellExplanation, type Influences } from '../tables/explainCell.ts';
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
    /** One curve's rate beside the spread (the table's `of` or `over` column) instead of the spread. */
    readonly side?: 'of' | 'over';
  };
}

const label = (name: string): string => (name === '' ? DEFAULT_NAME : name);

/**
 * The explanation of one spread figure: explainCurveSpread (the table's curveSpreadAt on that date,
 * each curve's query traced), the quotes it depends on most (each rate against its own curve's
 * quotes, the second's with the sign turned; a default-curve quote links to its sheet row, a named
 * curve's quote is named by its curve and position), and the spread (curveSpreadAt) with every
 * curve built under each method.
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
  const at = parseTenor(cell.tenor);
  if (!a.curve || !b.curve || !at) return fail(coreError('schema', 'spread', `no spread at ${cell.tenor}: a curve did not build`));
  const date = marketDate(a.curve.settlement, at);
  const end = marketDate(date, tenor);
  const names = { of: label(cell.of), over: label(cell.over) };
  const c = display.compounding;
  const dc = display.dayCount;
  const r = explainCurveSpread(a.curve, b.curve, names, measure, date, c, dc, tenor, { date: cell.tenor, start: cell.tenor, end: `${display.forwardTenor} after the start` });
  if (!r.ok) return r;
  const side = cell.side;
  const explanation = side ? r.value[side] : r.value.explanation;
  // The quotes behind the spread: each rate against every quote of every curve it reads
  // (topQuoteInfluencesAcrossCurves: a projection curve's rates also move with its discounting
  // curve's quotes), the second's subtracted; a quote both rates read counts once, net.
  const set: CurveWithQuotes[] = [{ name: DEFAULT_NAME, curve: result.build.curve!, instruments: result.build.instruments }];
  for (const n of named.curves) if (n.build.curve && n.build.errors.length === 0) set.push({ name: n.name, curve: n.build.curve, instruments: n.build.instruments });
  const net = new Map<string, QuoteInfluence & { curve: string }>();
  let influences: Influences = { ok: true, value: [] };
  for (const [name, part, sign] of ([[names.of, a, 1], [names.over, b, -1]] as const).filter((_, k) => !side || k === (side === 'of' ? 0 : 1))) {
    const inf = topQuoteInfluencesAcrossCurves(set, name, measure === 'zero' ? part.curve!.settlement : date, measure === 'zero' ? date : end, c, dc, Infinity);
    if (!inf.ok) influences = inf;
    else for (const q of inf.value) {
      const key = `${q.curve} ${q.index}`;
      net.set(key, { ...q, bpPerBp: (net.get(key)?.bpPerBp ?? 0) + (side ? 1 : sign) * q.bpPerBp });
    }
  }
  const quotes = [...net.values()].filter((q) => q.bpPerBp !== 0).sort((x, y) => Math.abs(y.bpPerBp) - Math.abs(x.bpPerBp)).slice(0, 5);
  if (influences.ok) influences = { ok: true, value: quotes };
  const note = side ? `of the ${names[side]} rate, against the quotes of every curve it reads` : `spread = ${names.of} - ${names.over}: each rate against the quotes of every curve it reads, the ${names.over} rate's sign turned`;
  // Every curve built under each method: the default curve as the workbench builds it, the named curves after it;
  // the method's first curve is read with its second beside it.
  const pairs = new Map<Curve, Curve>();
  const methods = valueUnderEachMethod(
    a.curve.interpolation,
    (method) => {
      const { base, named: all } = curvesUnder(result, inputs, method);
      const pick = (name: string) => (name === '' ? base.curve : all.curves.find((x) => x.name === name)?.build.curve ?? null);
      const [ca, cb] = [pick(cell.of), pick(cell.over)];
      if (ca && cb) pairs.set(ca, cb);
      return { curve: cb && ca, errors: [] };
    },
    (on) => {
      const s = curveSpreadAt(on, pairs.get(on)!, measure, [date], c, dc, tenor)[0];
      return s ? { ok: true, value: side ? s[side === 'of' ? 'a' : 'b'] : s.bp } : fail(coreError('beyond-curve', 'date', `no spread on ${date}`));
    },
  );
  const what = `${measure === 'zero' ? 'zero rate' : `${display.forwardTenor} forward`} at ${cell.tenor} (${date})`;
  const title = side ? `${names[side]} ${what}` : `Spread of ${names.of} over ${names.over}, ${what}`;
  return cellOf(result, title, explanation, influences, note, methods, DEFAULT_NAME);
}
