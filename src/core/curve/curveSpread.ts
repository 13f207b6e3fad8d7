import type { Curve } from './curve.ts';
import type { ExplanationSink } from './explain.ts';
import { forwardOn, zeroOn } from './query.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { IsoDate } from '../time/date.ts';
import { marketDate } from '../time/dateConventions.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { Tenor } from '../time/tenor.ts';

/** What a spread compares: zero rates to each date, or forwards of a tenor starting on each date. */
export type SpreadMeasure = 'zero' | 'forward';
export const SPREAD_MEASURES: readonly SpreadMeasure[] = ['zero', 'forward'];

/** One point of a spread line: the date, its years on the first curve's axis, both rates and their difference. */
export interface SpreadPoint {
  readonly date: IsoDate;
  /** Years from settlement on curve a's clock (the charts' maturity axis). */
  readonly x: number;
  /** Curve a's and curve b's rate (decimals per year in the stated compounding and day count). */
  readonly a: number;
  readonly b: number;
  /** (a - b) x 10,000, in basis points. */
  readonly bp: number;
}

/**
 * The spread of curve a over curve b at each date, in basis points:
 *   zero     s(T) = 10^4 (z_a(T) - z_b(T)),  z = zeroOn(curve, T, c, dc): the rate whose DF over (S, T) is DF(T)
 *   forward  s(T) = 10^4 (F_a(T, T + tenor) - F_b(T, T + tenor)),  F = forwardOn(curve, T, T + tenor, c, dc)
 * with both rates in compounding c and day count dc (so the spread is stated in them), T + tenor by
 * marketDate (unadjusted). The curves share the valuation date (named curves of one document do);
 * a date either curve cannot read (before settlement, beyond a curve that does not extrapolate) is
 * left out. Units: rates are decimals per year, the spread bp.
 * `sinks` (explanations, curve/explainSpread.ts): each curve's query is handed its sink, so after
 * the call they hold the last date's two explanations; without them nothing is recorded.
 */
export function curveSpreadAt(
  a: Curve,
  b: Curve,
  measure: SpreadMeasure,
  dates: readonly IsoDate[],
  c: Compounding,
  dc: CurveDayCount,
  tenor: Tenor,
  sinks?: { readonly a: ExplanationSink; readonly b: ExplanationSink },
): SpreadPoint[] {
  const out: SpreadPoint[] = [];
  for (const date of dates) {
    let ra: number;
    let rb: number;
    if (measure === 'zero') {
      const za = zeroOn(a, date, c, dc, 'date', sinks?.a);
      const zb = zeroOn(b, date, c, dc, 'date', sinks?.b);
      if (!za.ok || !zb.ok) continue;
      ra = za.value.zero;
      rb = zb.value.zero;
    } else {
      const end = marketDate(date, tenor);
      const fa = forwardOn(a, date, end, c, dc, 'forward', sinks?.a);
      const fb = forwardOn(b, date, end, c, dc, 'forward', sinks?.b);
      if (!fa.ok || !fb.ok) continue;
      ra = fa.value.rate;
      rb = fb.value.rate;
    }
    out.push({ date, x: a.time(date), a: ra, b: rb, bp: (ra - rb) * 1e4 });
  }
  return out;
}
