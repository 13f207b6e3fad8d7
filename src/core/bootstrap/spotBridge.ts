import { DISCOUNTING, type Instrument } from '../instruments/instrument.ts';
import { moduleOf, quoteDates } from '../kinds/registry.ts';
import { SPOT_BRIDGE_MAX_STEPS, SPOT_BRIDGE_ROUNDING_ULPS, SPOT_BRIDGE_TOLERANCE } from '../numeric/tolerance.ts';
import { civilFromIso, compareIso, type IsoDate } from '../time/date.ts';
import { curveClock, type CurveDayCount } from '../time/dayCount.ts';
import type { Quote } from '../document/types.ts';

/**
 * A gap between the valuation date (t = 0, DF 1) and the earliest start of a quote that begins
 * after it but before the curve's first pillar (a deposit or OIS from spot with no ON or TN deposit
 * ending by then). `index` is that quote's; `t` and `tFirst` are on the curve's axis.
 */
export interface SpotGap {
  readonly index: number;
  readonly quote: Quote;
  /** The earliest such start (spot, for quotes settled at spot). */
  readonly start: IsoDate;
  readonly t: number;
  /** The first pillar's date (its instrument's maturity) and node time. */
  readonly first: IsoDate;
  readonly tFirst: number;
}

/**
 * The market's spot gap, or null when every quote starts on the valuation date or at or after the
 * first pillar. `instruments` are sorted by pillar time (the first is the first pillar). Only a kind
 * with dates of its own (`dates` on its module) can start after the valuation date.
 */
export function spotGapOf(settlement: IsoDate, dayCount: CurveDayCount, instruments: readonly Instrument[]): SpotGap | null {
  if (instruments.length === 0) return null;
  const firstIns = instruments[0]!;
  let found: { quote: Quote; start: IsoDate } | null = null;
  for (const ins of instruments) {
    const q = ins.quote;
    // Performance: no object for a kind without dates of its own.
    if (moduleOf(q).dates === undefined) continue;
    const start = quoteDates(q, settlement).start;
    if (compareIso(start, settlement) > 0 && (found === null || compareIso(start, found.start) < 0)) found = { quote: q, start };
  }
  if (found === null) return null;
  const t = curveClock(dayCount, civilFromIso(settlement))(civilFromIso(found.start));
  if (!(t > 0 && t < firstIns.t)) return null;
  return { index: found.quote.index, quote: found.quote, start: found.start, t, first: firstIns.maturity, tFirst: firstIns.t };
}

/**
 * The bridge's node: one flow at t_spot whose ln DF is the given value, set in closed form. It is
 * not a quote: the bootstrap leaves it out of the pillars and the repricing (`solveNodes`, bridged).
 * `quote` and `index` are the gap's quote, so a message about the node (a negative forward from the
 * valuation date to spot) names the quote that starts there.
 */
class SpotBridgeNode implements Instrument {
  readonly quote: Quote;
  readonly index: number;
  readonly kind: Quote['kind'];
  readonly maturity: IsoDate;
  readonly t: number;
  readonly unit = 'rate' as const;
  readonly field = 'spot bridge';
  readonly market: number;
  readonly times: readonly number[];
  readonly amounts: readonly number[] = [1];
  readonly target: number;
  readonly curves = DISCOUNTING;
  readonly closedFormLn: number;

  constructor(gap: SpotGap, lnDf: number) {
    this.quote = gap.quote;
    this.index = gap.index;
    this.kind = gap.quote.kind;
    this.maturity = gap.start;
    this.t = gap.t;
    this.times = [gap.t];
    this.market = lnDf;
    this.target = Math.exp(lnDf);
    this.closedFormLn = lnDf;
    this.gap = gap;
  }

  private readonly gap: SpotGap;

  /** Its "quote" is ln DF at t_spot itself. */
  modelQuote(lnDiscountAt: (t: number) => number): number {
    return lnDiscountAt(this.t);
  }

  quoteFromFlows(ln: ArrayLike<number>, _df: ArrayLike<number>, offset: number): number {
    return ln[offset]!;
  }

  requote(value: number): Instrument {
    return new SpotBridgeNode(this.gap, value);
  }
}

/** A bootstrap with or without the bridge node first, and its node values (ys[0] = 0 at t = 0). */
export interface NodeRun<T> {
  readonly outcome: T;
  /** Node values, or null when the bootstrap failed. */
  readonly ys: readonly number[] | null;
}

/**
 * The curve across a spot gap, by one stated rule for every interpolation method: a node at t_s,
 * the earliest start, whose value is tied to the first pillar's,
 *
 *   ln DF(t_s) = (t_s / t_1) ln DF(t_1),
 *
 * so the average continuously compounded forward over [valuation, spot] equals that over
 * [spot, first pillar] (both -ln DF(t_1) / t_1). Under log-linear discount this is the curve's own
 * first segment (no change); under any method it holds exactly at the node, and a method that is
 * flat between two nodes of equal zero rate is flat over the whole gap.
 *
 * The node's value a is the root of f(a) = a - (t_s / t_1) y_1(a), y_1(a) the first pillar's node
 * bootstrapped with the bridge at a: affine in a for a quote starting at spot on a local method
 * (its node moves one for one with a), so a Newton step on that slope from the unbridged curve's
 * value settles in two bootstraps, secants after it for the rest; at most SPOT_BRIDGE_MAX_STEPS,
 * stopping when |f(a)| is at most SPOT_BRIDGE_TOLERANCE or SPOT_BRIDGE_ROUNDING_ULPS units in the
 * last place of a. `run(withBridge)` bootstraps the market with
 * the bridge node inserted first (the caller drops it from pillars and repricing); `plain` is the
 * unbridged bootstrap's first node (null when it failed), the starting point.
 */
export function bridgeSpotGap<T>(gap: SpotGap, instruments: readonly Instrument[], plainFirst: number | null, run: (withBridge: readonly Instrument[]) => NodeRun<T>): T {
  const ratio = gap.t / gap.tFirst;
  const at = (a: number): { run: NodeRun<T>; f: number } => {
    const r = run([new SpotBridgeNode(gap, a), ...instruments]);
    // ys[1] is the bridge, ys[2] the first pillar.
    return { run: r, f: r.ys === null ? NaN : a - ratio * r.ys[2]! };
  };
  const settled = (a: number, f: number): boolean => Math.abs(f) <= Math.max(SPOT_BRIDGE_TOLERANCE, SPOT_BRIDGE_ROUNDING_ULPS * Number.EPSILON * Math.abs(a));
  let a0 = plainFirst === null ? 0 : ratio * plainFirst;
  let p0 = at(a0);
  if (!Number.isFinite(p0.f) || settled(a0, p0.f)) return p0.run.outcome;
  // The first step on the slope 1 - t_s / t_1 (the first pillar moving one for one with a, as a
  // quote starting at spot makes it on a local method: then this step is the root), then secants.
  let a1 = a0 - p0.f / (1 - ratio);
  let p1 = at(a1);
  for (let step = 2; step < SPOT_BRIDGE_MAX_STEPS; step++) {
    if (!Number.isFinite(p1.f) || settled(a1, p1.f) || a1 === a0) break;
    const slope = (p1.f - p0.f) / (a1 - a0);
    const a2 = slope !== 0 && Number.isFinite(slope) ? a1 - p1.f / slope : a1 - p1.f / (1 - ratio);
    a0 = a1;
    p0 = p1;
    a1 = a2;
    p1 = at(a1);
  }
  return p1.run.outcome;
}
