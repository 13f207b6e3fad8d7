import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import type { IsoDate } from '../time/date.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { Tenor } from '../time/tenor.ts';
import type { Curve } from './curve.ts';
import { curveSpreadAt, type SpreadMeasure } from './curveSpread.ts';
import { explanationSink, type Explanation } from './explain.ts';
import { joinedDifference } from './explainChange.ts';

/** The spread explained with its two parts. */
export interface SpreadExplanation {
  /** Both parts in one: the first curve's reads and steps named `<of> ...`, the second's `<over> ...`, then the spread. */
  readonly explanation: Explanation;
  /** The first curve's rate, as zeroOn / forwardOn explain it. */
  readonly of: Explanation;
  /** The second curve's rate, as zeroOn / forwardOn explain it. */
  readonly over: Explanation;
}

/** The curve's name on each of its nodes, so a quote behind a node is told by curve. */
const tagged = (e: Explanation, curve: string): Explanation => ({ ...e, reads: e.reads.map((r) => ({ ...r, nodes: r.nodes.map((n) => ({ ...n, curve })) })) });

/**
 * Explains the spread of curve `a` (named `names.of`) over curve `b` (`names.over`) on `date`, as
 * the spread table computes it: curveSpreadAt run on that one date with a sink for each curve, so
 * each rate is explained by its own traced query (zeroOn, or forwardOn from `date` to `date` +
 * `tenor`) and the last step, spread = (rate of - rate over) x 10,000 bp, is the table's figure bit
 * for bit. Each node carries its curve's name (`curve`). An error value when either curve has no
 * rate there (before settlement, beyond a curve that does not extrapolate).
 */
export function explainCurveSpread(
  a: Curve,
  b: Curve,
  names: { readonly of: string; readonly over: string },
  measure: SpreadMeasure,
  date: IsoDate,
  c: Compounding,
  dc: CurveDayCount,
  tenor: Tenor,
  given?: Readonly<Record<string, string>>,
): Result<SpreadExplanation> {
  const sinks = { a: explanationSink(given), b: explanationSink(given) };
  const point = curveSpreadAt(a, b, measure, [date], c, dc, tenor, sinks)[0];
  if (!point || !sinks.a.explanation || !sinks.b.explanation) {
    return fail(coreError('schema', 'date', `no spread on ${date}: ${names.of} or ${names.over} has no ${measure === 'zero' ? 'zero rate' : 'forward'} there (before its valuation date, or past its last pillar without extrapolation)`));
  }
  // Two parts need two names, even for one curve against itself.
  const over = names.over === names.of ? `${names.over} (second)` : names.over;
  const ea = tagged(sinks.a.explanation, names.of);
  const eb = tagged(sinks.b.explanation, names.over);
  const explanation: Explanation = {
    ...joinedDifference('curve-spread', `spread = (${names.of} rate - ${over} rate) x 10,000, each rate: ${ea.formula} (${ea.unit})`, 'spread', [eb, over, `curve ${over}`], [ea, names.of, `curve ${names.of}`], point.bp),
    // Both rates are read on the same dates: the first curve's dates only.
    dates: ea.dates,
  };
  return ok({ explanation, of: ea, over: eb });
}
