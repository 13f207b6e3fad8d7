import type { Curve } from '../curve/curve.ts';
import type { IsoDate } from '../time/date.ts';
import type { Quote, QuoteKind } from '../document/types.ts';

/** The unit of a quote and of its repricing error: `price` per 100 face, or `rate` as a decimal. */
export type QuoteUnit = 'price' | 'rate';

/**
 * The roles a curve plays for an instrument: `discount` (present values of its flows) and
 * `projection` (forward rates of a floating index the instrument references).
 */
export type CurveRole = 'discount' | 'projection';
/** A curve's name in a build's set of curves (`CurveSet`). */
export type CurveId = string;
/** The curve an instrument reads in each role; a role it does not play is absent. */
export interface CurveRoles {
  readonly discount: CurveId;
  readonly projection?: CurveId;
}
/** The one curve a build solves today; it plays every role. */
export const DISCOUNT_CURVE: CurveId = 'discount';
/** Fixed flows discounted on the one curve (deposit, bill, zero, bond). */
export const DISCOUNTING: CurveRoles = { discount: DISCOUNT_CURVE };
/** A single-curve swap: the one curve discounts and projects the floating leg (see instruments/swap.ts). */
export const DISCOUNTING_AND_PROJECTING: CurveRoles = { discount: DISCOUNT_CURVE, projection: DISCOUNT_CURVE };

/**
 * A quote compiled against a settlement date and curve axis: fixed cash flows whose present value
 * on the curve must equal a target. Every kind fits this form:
 *   deposit  (1 + r tau) at T, target 1            bill, zero  100 at T, target the price
 *   bond     coupons and 100 at their dates, target the dirty price per 100
 *   swap     S tau_i at each T_i and 1 at T_n, target 1   (S A + DF(T_n) = 1)
 * `times` are on the curve's axis, ascending, the last equal to the pillar time `t`.
 */
export interface Instrument {
  readonly quote: Quote;
  readonly index: number;
  readonly kind: QuoteKind;
  readonly maturity: IsoDate;
  /** Pillar time: years from settlement to maturity on the curve's axis. */
  readonly t: number;
  readonly unit: QuoteUnit;
  /** Name of the quoted field (`rate`, `price`, `cleanPrice`, `yield`, `discountYield`). */
  readonly field: string;
  /** The market quote in `unit`. */
  readonly market: number;
  /**
   * Flow times in years on the curve's axis, ascending, the last at `t`. Performance: a plain
   * array of doubles, not a Float64Array: a typed array above 64 bytes gets a backing store
   * outside the JavaScript heap, which costs several hundred nanoseconds to allocate in Node 20
   * (see interpolation/types.ts, copyNodes), and a market compiles one or two per quote.
   */
  readonly times: readonly number[];
  /**
   * Cash flow at each time, in the instrument's unit of present value (per 100 face, or per 1 of
   * notional). A plain array of doubles in the compiled instruments, for the same reason (a
   * requote allocates one).
   */
  readonly amounts: ArrayLike<number>;
  readonly target: number;
  /** The curves the instrument reads, by role (its kind's `curves`, src/core/kinds). */
  readonly curves: CurveRoles;
  /**
   * For a single flow at the pillar (deposit, bill, zero): ln DF at the pillar in closed form,
   * computed without the rounding of forming DF first (log1p), so short tenors keep full precision
   * in rate; NaN when the quote implies DF <= 0. Null for instruments with several flows.
   */
  readonly closedFormLn: number | null;
  /** The model quote in `unit` given ln DF on the curve's axis (quoteOnCurve). */
  modelQuote(lnDiscountAt: (t: number) => number): number;
  /**
   * The model quote in `unit` from the curve's values at the instrument's own flow times:
   * ln DF at `times[j]` in `ln[offset + j]` and DF = exp of it in `df[offset + j]`. The one
   * formula of each kind; `modelQuote` reads the curve into these arrays and calls it.
   */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number;
  /** The same instrument with another market quote value (schedules are kept). */
  requote(value: number): Instrument;
  /**
   * Optional, for an instrument whose flows must meet a value on the curve rather than a constant
   * (an overnight-index swap with a payment lag or a forward start: its floating leg,
   * sum_i (DF(S_i)/DF(E_i) - 1) DF(P_i), is not a sum of fixed flows; instruments/ois.ts). The
   * target read from the curve's values at the instrument's own flow times (as in
   * `quoteFromFlows`); its residual is sum_j amounts_j DF(times[j]) - targetFromFlows, rising with
   * the pillar's discount factor. `target` then only scales (1 of notional). Absent for every
   * fixed-flow kind, whose residual stays sum_j amounts_j DF(times[j]) - target as computed before.
   */
  targetFromFlows?(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number;
  /** With `targetFromFlows`: its derivative in ln DF at each flow time, into out[0..times.length). */
  targetSlopes?(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void;
  /**
   * Optional, with `targetFromFlows`: the node solvers' residual in a form with the same root and
   * sign as sum_j amounts_j DF(times[j]) - targetFromFlows, better conditioned for a short span (a
   * forward-starting deposit over one day: ln(1 + r tau) + ln DF(E) - ln DF(S), exact in ln space,
   * where the difference of two discount factors near 1 loses the digits a 1e-14 repricing needs).
   */
  residualFromFlows?(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number;
  /**
   * Optional: the curves built before it whose values it holds as constants, by name (a term-index
   * or basis swap on a projection curve, instruments/projectedSwap.ts: its discounting curve and a
   * basis swap's other leg's curve). Absent for an instrument that reads only the curve it is solved
   * on. Explanations branch on it (curve/explainQuote.ts).
   */
  readonly readsCurves?: { readonly discount: CurveId; readonly other: CurveId | null };
  /** With `readsCurves`: the instrument compiled again, each value it reads off those curves handed to `sink`. */
  retrace?(sink: ReadSink): void;
}

/**
 * Receives each discount factor an instrument's compile reads off a curve built before it: the
 * date's role (`U` a fixed or spread leg date, `T` a floating date, `V` a basis swap's other-leg
 * date), the curve's name and the curve, the date, t on that curve's clock, ln DF there, and a
 * fixed or spread date's year fraction `tau` (from the previous date).
 */
export type ReadSink = (name: string, curveName: CurveId, curve: Curve, date: IsoDate, t: number, ln: number, tau?: number) => void;

/**
 * Receives a model quote's own intermediate values by name, in the order `quoteFromFlows` computes
 * them (the quote check's explanations, curve/explainQuote.ts, turn them into steps). Absent, an
 * instrument records nothing; a kind that hands nothing is explained by its reads alone.
 */
export type QuoteTrace = (name: string, value: number) => void;

/** ln DF and DF of a curve (ln DF on its axis) at an instrument's flow times; plain arrays of doubles, cheaper to allocate than small typed arrays. */
function curveAtFlows(instrument: Instrument, lnDiscountAt: (t: number) => number): { ln: number[]; df: number[] } {
  const { times } = instrument;
  const n = times.length;
  const ln = new Array<number>(n);
  const df = new Array<number>(n);
  for (let j = 0; j < n; j++) {
    ln[j] = lnDiscountAt(times[j]!);
    df[j] = Math.exp(ln[j]!);
  }
  return { ln, df };
}

/**
 * The target an instrument's flows must meet on a curve: `target`, or for an instrument with a
 * target on the curve (`targetFromFlows`) that value read at its flow times.
 */
export function targetOnCurve(instrument: Instrument, lnDiscountAt: (t: number) => number): number {
  if (instrument.targetFromFlows === undefined) return instrument.target;
  const { ln, df } = curveAtFlows(instrument, lnDiscountAt);
  return instrument.targetFromFlows(ln, df, 0);
}

/**
 * Present value of the flows minus the target on a curve: the pricing equation's residual, zero
 * when the instrument reprices. For a fixed-flow instrument exactly presentValue - target.
 */
export function residualOnCurve(instrument: Instrument, lnDiscountAt: (t: number) => number): number {
  if (instrument.targetFromFlows === undefined) return presentValue(instrument, lnDiscountAt) - instrument.target;
  return presentValue(instrument, lnDiscountAt) - targetOnCurve(instrument, lnDiscountAt);
}

/**
 * The model quote of an instrument on a curve given by ln DF on its axis: the curve read at the
 * instrument's flow times, then `quoteFromFlows`. Every kind's `modelQuote` is this.
 */
export function quoteOnCurve(instrument: Instrument, lnDiscountAt: (t: number) => number, trace?: QuoteTrace): number {
  const { ln, df } = curveAtFlows(instrument, lnDiscountAt);
  return instrument.quoteFromFlows(ln, df, 0, trace);
}

/** Present value of an instrument's flows on a curve. */
export function presentValue(instrument: Instrument, lnDiscountAt: (t: number) => number): number {
  let pv = 0;
  const { times, amounts } = instrument;
  for (let j = 0; j < times.length; j++) pv += amounts[j]! * Math.exp(lnDiscountAt(times[j]!));
  return pv;
}

/**
 * What every compiled instrument class shares: the fields of `Instrument`, set by one
 * constructor, and `modelQuote` through `quoteOnCurve`. Each kind adds its own figures (year
 * fractions, schedule, accrued interest), its quote formula and its requote.
 * Performance: classes, so that a requote creates one object and no closures (the command-line
 * runner's transform adds a name-setting call to every closure).
 */
export abstract class CompiledInstrument<Q extends Quote> implements Instrument {
  declare readonly quote: Q;
  declare readonly index: number;
  declare readonly kind: Q['kind'];
  declare readonly maturity: IsoDate;
  declare readonly t: number;
  declare readonly unit: QuoteUnit;
  declare readonly field: string;
  declare readonly market: number;
  declare readonly times: readonly number[];
  declare readonly amounts: readonly number[];
  declare readonly target: number;
  declare readonly closedFormLn: number | null;
  declare readonly curves: CurveRoles;

  /**
   * @param times - flow times on the curve's axis, ascending, the last at `t` (kept by requotes)
   * @param amounts - the flows, in the unit of `target` (per 1 of notional or per 100 face)
   */
  protected constructor(
    q: Q,
    t: number,
    times: readonly number[],
    unit: QuoteUnit,
    field: string,
    market: number,
    amounts: readonly number[],
    target: number,
    closedFormLn: number | null,
    curves: CurveRoles,
  ) {
    this.quote = q;
    this.index = q.index;
    this.kind = q.kind;
    this.maturity = q.maturity;
    this.t = t;
    this.unit = unit;
    this.field = field;
    this.market = market;
    this.times = times;
    this.amounts = amounts;
    this.target = target;
    this.closedFormLn = closedFormLn;
    this.curves = curves;
  }

  modelQuote(lnDiscountAt: (t: number) => number): number {
    return quoteOnCurve(this, lnDiscountAt);
  }

  abstract quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number;
  abstract requote(value: number): Instrument;
}
