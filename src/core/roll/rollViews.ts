import type { Curve } from '../curve/curve.ts';
import { forwardOn } from '../curve/query.ts';
import { coreError, fail, ok, type CoreWarning, type Result } from '../result.ts';
import { compareIso, daysBetween, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount } from '../time/dayCount.ts';
import { marketDate, UNADJUSTED } from '../time/dateConventions.ts';
import type { Tenor } from '../time/tenor.ts';
import { curveSeenAtHorizon, impliedCurveAtHorizon, shiftedCurve } from './horizonCurve.ts';
import type { RatePath, StrategyViewId } from './strategyInputs.ts';
import { recordLegs, type HorizonGrowthParts, type RollTrace } from './rollTrace.ts';

/**
 * Roll legs and views of the future for the roll-versus-term analysis.
 *
 * A roll leg k runs from settlement + (k-1) x tenor to settlement + k x tenor (counted from
 * settlement, never chained), the last cut short at the horizon. A leg earns a simple
 * money-market rate r on the roll day count: growth 1 + r tau, tau = yearFraction(rollDayCount).
 *
 * A view is a complete rule for what money placed after today earns until the horizon, and for
 * the curve at the horizon:
 *   - `stubGrowth(k, from, to)`: growth of 1 placed at `from` until `to`, both inside leg k
 *     (0-based); it gives the rate of each roll leg after the first (from = leg start) and the
 *     reinvestment of a coupon paid inside a leg (a partial leg);
 *   - `horizonCurve`: the curve on the horizon date, settlement H, used to price what is still
 *     held there.
 * Leg 1 (k = 0) is bought today: it earns today's spot rate for its period in every view.
 */

export interface RollLeg {
  /** 1-based leg number. */
  readonly index: number;
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Actual days in the leg. */
  readonly days: number;
  /** Year fraction on the roll day count. */
  readonly tau: number;
  /** True for a final leg cut short at the horizon (or a single leg shorter than the tenor). */
  readonly short: boolean;
  /** Today's forward for the leg's period, decimal, simple on the roll day count (leg 1: today's spot). */
  readonly forward: number;
}

/** The roll schedule from settlement to the horizon with today's forwards (simple, roll day count). */
export function rollLegs(curve: Curve, tenor: Tenor, horizon: IsoDate, dayCount: CurveDayCount): Result<RollLeg[]> {
  const legs: RollLeg[] = [];
  let start = curve.settlement;
  for (let k = 1; compareIso(start, horizon) < 0; k++) {
    if (k > 2000) return fail(coreError('range', 'strategy.horizon', 'strategy.horizon: more than 2000 roll legs; choose a shorter horizon or a longer roll tenor'));
    const full = marketDate(curve.settlement, tenor, UNADJUSTED, k);
    const end = compareIso(full, horizon) > 0 ? horizon : full;
    const f = forwardOn(curve, start, end, 'simple', dayCount, `strategy.horizon`);
    if (!f.ok) return f;
    legs.push({ index: k, start, end, days: daysBetween(start, end), tau: f.value.tau, short: end !== full, forward: f.value.rate });
    start = end;
  }
  return ok(legs);
}

export interface ViewSpec {
  readonly id: StrategyViewId;
  /** Short name for tables ("Forwards realised"). */
  readonly label: string;
  /** The view inside a sentence ("under an unchanged curve"). */
  readonly phrase: string;
  /** One sentence saying what the view assumes. */
  readonly description: string;
  /** Growth of 1 placed at `from` until `to` inside leg k (0-based), from after today. */
  readonly stubGrowth: (k: number, from: IsoDate, to: IsoDate, tau: number) => number;
  readonly horizonCurve: Curve;
  /** The rates of legs 2..n when the view sets them directly (index k for leg k+1; index 0 unused), reported as given instead of (growth - 1)/tau. */
  readonly exactRates?: readonly number[];
  /** Where the rates of legs 2..n come from, in words for an explanation (saying when a view of the user's sets them). */
  readonly legRate?: string;
}

/** A view applied to a roll schedule: the rates of every leg and the money-market growth to the horizon. */
export interface RollView {
  readonly id: StrategyViewId;
  readonly label: string;
  readonly description: string;
  /** Rate of each leg, decimal, simple on the roll day count; legRates[0] is today's spot. */
  readonly legRates: readonly number[];
  /** Growth of 1 over each leg: 1 + legRates[k] tau_k. */
  readonly legGrowth: readonly number[];
  /** Growth of rolling 1 from today to the horizon: the product of legGrowth. */
  readonly rollGrowth: number;
  /**
   * Growth of 1 placed at `from` (settlement <= from <= horizon) until the horizon in the view's
   * money market; `parts`, when given, is told the leg and the part of it the growth was made of.
   */
  growthToHorizon(from: IsoDate, parts?: HorizonGrowthParts): number;
  readonly horizonCurve: Curve;
  readonly spec: ViewSpec;
}

/**
 * ln DF of a curve at a date, memoised per curve object (curves are immutable, so the memo changes
 * no result; it spares re-reading the same leg dates in every solver step).
 */
const lnMemo = new WeakMap<Curve, Map<IsoDate, number>>();
function lnDf(curve: Curve, date: IsoDate): number {
  let memo = lnMemo.get(curve);
  if (!memo) {
    memo = new Map();
    lnMemo.set(curve, memo);
  }
  let v = memo.get(date);
  if (v === undefined) {
    v = date === curve.settlement ? 0 : curve.lnDiscountAt(curve.time(date));
    memo.set(date, v);
  }
  return v;
}

/** Applies a view to the legs. Leg 1 grows at today's spot, DF(S)/DF(e_1) = 1 + r_1 tau_1. With `trace`, the legs' rates and growths are recorded (rollTrace.ts). */
export function applyView(curve: Curve, legs: readonly RollLeg[], dayCount: CurveDayCount, spec: ViewSpec, trace?: RollTrace): RollView {
  const n = legs.length;
  const legGrowth = legs.map((leg, k) => (k === 0 ? Math.exp(-lnDf(curve, leg.end)) : spec.stubGrowth(k, leg.start, leg.end, leg.tau)));
  const exact = spec.exactRates;
  const legRates = legs.map((leg, k) => (k === 0 ? leg.forward : exact?.[k] !== undefined ? exact[k]! : leg.tau > 0 ? (legGrowth[k]! - 1) / leg.tau : 0));
  // suffix[k] = product of legGrowth[k..n-1]
  const suffix = new Float64Array(n + 1);
  suffix[n] = 1;
  for (let k = n - 1; k >= 0; k--) suffix[k] = suffix[k + 1]! * legGrowth[k]!;
  const horizon = legs[n - 1]?.end ?? curve.settlement;
  const growthToHorizon = (from: IsoDate, parts?: HorizonGrowthParts): number => {
    if (parts) parts.leg = -1;
    if (compareIso(from, horizon) >= 0) return 1;
    if (parts) parts.leg = 0;
    if (compareIso(from, curve.settlement) <= 0) return suffix[0]!;
    // the leg holding `from`: start <= from < end
    let k = 0;
    while (k < n - 1 && compareIso(legs[k]!.end, from) <= 0) k++;
    const leg = legs[k]!;
    if (parts) parts.leg = k;
    if (from === leg.start) return suffix[k]!;
    const tau = queryYearFraction(dayCount, from, leg.end);
    const stub = spec.stubGrowth(k, from, leg.end, tau);
    if (parts) (parts.stub = stub), (parts.tau = tau);
    return stub * suffix[k + 1]!;
  };
  if (trace) recordLegs(trace, curve, legs, dayCount, spec, legRates, legGrowth, suffix[0]!);
  return { id: spec.id, label: spec.label, description: spec.description, legRates, legGrowth, rollGrowth: suffix[0]!, growthToHorizon, horizonCurve: spec.horizonCurve, spec };
}

/** Forward-based growth over [from, to] on a curve: DF(from)/DF(to), plus s tau for a shift s (decimal). */
const forwardGrowth = (curve: Curve, s: number) => (_k: number, from: IsoDate, to: IsoDate, tau: number): number =>
  Math.exp(lnDf(curve, from) - lnDf(curve, to)) + s * tau;

/**
 * Forwards realised: money placed at any date earns today's forward to its end date,
 * growth DF(from)/DF(to); the horizon curve is the implied future curve DF(T)/DF(H).
 * Under it every strategy ends equal (the forwards-realised identity).
 */
export function forwardsView(curve: Curve, horizon: IsoDate): ViewSpec {
  return {
    id: 'forwards',
    label: 'Forwards realised',
    phrase: 'forwards realised',
    description: "Each leg earns today's forward for its period; the horizon curve is the implied future curve.",
    legRate: "today's forward (the curve)",
    stubGrowth: forwardGrowth(curve, 0),
    horizonCurve: impliedCurveAtHorizon(curve, horizon),
  };
}

/**
 * A parallel shift of the forward path by shiftBp: every rate set after today is today's forward
 * plus s (s = shiftBp/10000, added to the simple roll-day-count rate: growth DF(from)/DF(to) + s tau),
 * and the horizon curve is the implied future curve with zero rates up by s (continuous, curve clock).
 */
export function shiftView(curve: Curve, horizon: IsoDate, shiftBp: number): ViewSpec {
  return {
    id: 'shift',
    label: `Forwards ${shiftBp >= 0 ? '+' : ''}${shiftBp} bp`,
    phrase: `forwards ${shiftBp >= 0 ? '+' : ''}${shiftBp} bp`,
    description: `Each leg after the first earns today's forward ${shiftBp >= 0 ? 'plus' : 'minus'} ${Math.abs(shiftBp)} bp; the horizon curve is the implied curve moved in parallel by the same.`,
    legRate: `today's forward + ${shiftBp} bp (your view)`,
    stubGrowth: forwardGrowth(curve, shiftBp / 10000),
    horizonCurve: shiftedCurve(impliedCurveAtHorizon(curve, horizon), shiftBp),
  };
}

/** Today's spot rate for the roll tenor, simple on the roll day count, on a curve. */
export function spotRollRate(curve: Curve, tenor: Tenor, dayCount: CurveDayCount, path = 'strategy.rollTenor'): Result<number> {
  const f = forwardOn(curve, curve.settlement, marketDate(curve.settlement, tenor), 'simple', dayCount, path);
  return f.ok ? ok(f.value.rate) : f;
}

/**
 * Curve unchanged: every leg earns today's spot rate for the roll tenor r (simple, roll day count),
 * a partial leg pro rata (growth 1 + r tau); the horizon curve is today's curve by time to maturity.
 */
export function unchangedView(curve: Curve, horizon: IsoDate, spot: number, tenorText: string, dayCount: CurveDayCount): ViewSpec {
  return {
    id: 'unchanged',
    label: 'Curve unchanged',
    phrase: 'an unchanged curve',
    description: `Each leg earns today's ${tenorText} rate; the horizon curve is today's curve by time to maturity (carry and roll-down).`,
    legRate: `today's ${tenorText} spot (your view: the curve unchanged)`,
    stubGrowth: (_k, _from, _to, tau) => 1 + spot * tau,
    horizonCurve: curveSeenAtHorizon(curve, horizon),
  };
}

/**
 * The rates of legs 2..n of the user's path (decimals, simple on the roll day count), from its fill.
 * Returns pathRates[k] for k = 1..n-1 (pathRates[0] is unused and set to leg 1's spot).
 */
export function pathRates(legs: readonly RollLeg[], path: RatePath, warnings: CoreWarning[]): number[] {
  const n = legs.length;
  const out = legs.map((leg) => leg.forward);
  const m = n - 1; // legs after the first
  for (let k = 1; k < n; k++) {
    switch (path.fill) {
      case 'forwards':
        break;
      case 'constant':
        out[k] = path.constant;
        break;
      case 'ramp':
        out[k] = m <= 1 ? path.rampFrom : path.rampFrom + ((path.rampTo - path.rampFrom) * (k - 1)) / (m - 1);
        break;
      case 'typed': {
        const v = path.legs[k - 1];
        if (v !== undefined) out[k] = v;
        break;
      }
    }
  }
  if (path.fill === 'typed') {
    if (path.legs.length < m) {
      warnings.push({ path: 'strategy.path.legs', quote: null, code: 'skipped', message: `strategy.path.legs: ${path.legs.length} rates typed for ${m} legs after the first; legs ${path.legs.length + 2} to ${n} earn today's forwards` });
    } else if (path.legs.length > m) {
      warnings.push({ path: 'strategy.path.legs', quote: null, code: 'skipped', message: `strategy.path.legs: ${path.legs.length} rates typed but the horizon has ${m} legs after the first; the last ${path.legs.length - m} are not used` });
    }
  }
  return out;
}

/**
 * The user's path: leg k (k >= 2) earns rates[k-1] (simple, roll day count); money placed inside
 * leg 1 after today earns leg 1's spot pro rata. The horizon curve is the implied future curve
 * moved in parallel (continuous zero rates) by the last leg's departure from its forward,
 * rates[n-1] - forward[n-1], so the curve ends where the path's short rate ends.
 */
export function pathView(curve: Curve, horizon: IsoDate, legs: readonly RollLeg[], rates: readonly number[]): ViewSpec {
  const n = legs.length;
  const lastMove = n >= 2 ? rates[n - 1]! - legs[n - 1]!.forward : 0;
  return {
    id: 'path',
    label: 'Your path',
    phrase: 'your path',
    description: 'Each leg after the first earns the rate of your path; the horizon curve is the implied curve moved by as much as your last rate differs from its forward.',
    stubGrowth: (k, _from, _to, tau) => 1 + (k === 0 ? legs[0]!.forward : rates[k]!) * tau,
    horizonCurve: shiftedCurve(impliedCurveAtHorizon(curve, horizon), lastMove * 10000),
    exactRates: rates,
    legRate: 'your path (your view)',
  };
}

/**
 * A scenario curve as a view: the curve moves to the scenario curve just after today's purchases
 * and then stays unchanged by time to maturity. Every rate set after today is the scenario's spot
 * rate for the roll tenor (simple, roll day count, partial legs pro rata); the horizon curve is the
 * scenario curve by time to maturity. The scenario curve must share today's settlement date.
 */
export function scenarioView(name: string, scenario: Curve, horizon: IsoDate, tenor: Tenor, dayCount: CurveDayCount): Result<ViewSpec> {
  const path = `scenario:${name}`;
  const spot = spotRollRate(scenario, tenor, dayCount, path);
  if (!spot.ok) return spot;
  const r = spot.value;
  return ok({
    id: `scenario:${name}`,
    label: name,
    phrase: `the scenario "${name}"`,
    description: `The curve moves to the scenario "${name}" today and then stays unchanged by time to maturity.`,
    legRate: `the scenario's spot (your scenario)`,
    stubGrowth: (_k, _from, _to, tau) => 1 + r * tau,
    horizonCurve: curveSeenAtHorizon(scenario, horizon),
  });
}

/**
 * A scenario's forwards as the alternative reading of a scenario: the curve moves to the scenario
 * curve just after today's purchases, and then the scenario's own forwards are realised: money
 * placed at any date after today earns the scenario's forward to its end (growth DF_s(from)/DF_s(to)),
 * and the horizon curve is the scenario's implied curve DF_s(T)/DF_s(H).
 */
export function scenarioForwardsView(name: string, scenario: Curve, horizon: IsoDate): ViewSpec {
  return {
    id: `scenario-fwd:${name}`,
    label: `${name} (its forwards)`,
    phrase: `the forwards of the scenario "${name}"`,
    description: `The curve moves to the scenario "${name}" today and its forwards are then realised.`,
    legRate: `the scenario's forward (your scenario)`,
    stubGrowth: forwardGrowth(scenario, 0),
    horizonCurve: impliedCurveAtHorizon(scenario, horizon),
  };
}

/**
 * A view moved in parallel by shiftBp: every rate set after today up by s = shiftBp/10000
 * (growth + s tau, simple on the roll day count) and the horizon curve's zero rates up by s
 * (continuous, curve clock). shiftedSpec(forwardsView, s) is shiftView(s).
 */
export function shiftedSpec(spec: ViewSpec, shiftBp: number): ViewSpec {
  const s = shiftBp / 10000;
  const { exactRates: _unused, ...rest } = spec;
  return { ...rest, stubGrowth: (k, from, to, tau) => spec.stubGrowth(k, from, to, tau) + s * tau, horizonCurve: shiftedCurve(spec.horizonCurve, shiftBp), legRate: `${spec.legRate} + s (s = ${shiftBp} bp)` };
}

/** A constant roll rate r (decimal, simple, roll day count) for every rate set after today; the horizon curve kept from `spec`. */
export function constantRateSpec(spec: ViewSpec, r: number): ViewSpec {
  const { exactRates: _unused, ...rest } = spec;
  return { ...rest, stubGrowth: (_k, _from, _to, tau) => 1 + r * tau, legRate: 'r' };
}

