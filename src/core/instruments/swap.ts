import { yearFractionCivil, type DayCount } from '../time/dayCount.ts';
import { compareCivil, isoFromCivil, civilFromIso, isMonthEnd, sameCivil, serialFromCivil, type CivilDate, type IsoDate } from '../time/date.ts';
import { backwardScheduleCivil } from '../time/schedule.ts';
import type { SwapQuote } from '../document/types.ts';
import { CompiledInstrument, DISCOUNTING_AND_PROJECTING, type Instrument, type QuoteTrace } from './instrument.ts';

/** One accrual period of a fixed leg. */
export interface FixedPeriod {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Year fraction of the period under the leg's day count. */
  readonly tau: number;
}

/**
 * Fixed-leg periods from start to end: dates backward from the end every 12/frequency months
 * (never chained), the first period from `start` to the first date (a short front stub when the
 * span is not a whole number of periods). ACT/ACT-ICMA takes the notional regular period as its
 * reference; 30E/360-ISDA takes `end` as the termination date.
 */
export function fixedLegPeriods(start: IsoDate, end: IsoDate, frequency: number, dayCount: DayCount, eom: boolean): FixedPeriod[] {
  const { dates, taus } = fixedLegCivil(civilFromIso(start), civilFromIso(end), frequency, dayCount, eom);
  return dates.map((date, i) => ({ start: i === 0 ? start : isoFromCivil(dates[i - 1]!), end: i === dates.length - 1 ? end : isoFromCivil(date), tau: taus[i]! }));
}

/**
 * The period ends and year fractions of `fixedLegPeriods` on civil dates (performance: no ISO
 * text per date). Same rules: the first period from `start`, ACT/ACT-ICMA on the notional regular
 * period, 30E/360-ISDA with `end` as the termination date.
 */
export function fixedLegCivil(start: CivilDate, end: CivilDate, frequency: number, dayCount: DayCount, eom: boolean): { dates: readonly CivilDate[]; taus: number[] } {
  const { dates, previous } = backwardScheduleCivil(start, end, frequency, eom);
  const taus = new Array<number>(dates.length);
  for (let i = 0; i < dates.length; i++) {
    const date = dates[i]!;
    const from = i === 0 ? start : dates[i - 1]!;
    const refStart = i === 0 ? previous : from;
    const refDays = dayCount === 'ACT/ACT-ICMA' ? serialFromCivil(date) - serialFromCivil(refStart) : 0;
    taus[i] = yearFractionCivil(dayCount, from, date, eom, sameCivil(date, end), refDays, frequency);
  }
  return { dates, taus };
}

/** A fixed leg as the bootstrap uses it: payment times on the curve's clock and accrual year fractions. */
interface TimedLeg {
  readonly dates: readonly CivilDate[];
  readonly times: number[];
  readonly taus: number[];
}

/** The fixed leg of a swap from settlement to maturity, timed on the curve's clock. */
function timedLeg(settlement: CivilDate, maturity: CivilDate, q: SwapQuote, time: (d: CivilDate) => number): TimedLeg {
  const { dates, taus } = fixedLegCivil(settlement, maturity, q.frequency, q.dayCount, q.eom);
  // Plain arrays of doubles (see Instrument.times).
  const times = new Array<number>(dates.length);
  for (let j = 0; j < dates.length; j++) times[j] = time(dates[j]!);
  return { dates, times, taus };
}

/**
 * The fixed legs of one market's swaps, generated once per family (performance: in a par-swap
 * ladder to 30Y each shorter swap would otherwise date and year-fraction again the first periods
 * of the longest one).
 *
 * A family is the swaps with the same frequency, day count and `eom` flag; its longest swap's leg
 * is generated as usual. A shorter swap of the family takes the longest leg's first periods when
 * its maturity M is a date of that leg and carries the same day of month as the longest maturity
 * E (and, with `eom`, is a month end exactly when E is one). Then M - k steps is
 * E - (J + k) steps for every k (addMonths depends on its anchor only through the month, the day
 * and the month-end flag), so the dates, the notional previous date and every year fraction but
 * the last coincide. The last period's year fraction is computed afresh, as the termination date
 * can change it (30E/360-ISDA). Any other swap, and a swap of one period, generates its own leg.
 */
export class SwapLegs {
  /** The families met so far (a market has one or two: a short list, no map). */
  private readonly families: Family[] = [];

  /** `swaps`: the market's swap quotes with their maturities already parsed. */
  constructor(
    private readonly settlement: CivilDate,
    private readonly time: (d: CivilDate) => number,
    swaps: readonly (readonly [SwapQuote, CivilDate])[],
  ) {
    for (const [q, maturity] of swaps) {
      const f = this.family(q);
      if (f === undefined) this.families.push({ frequency: q.frequency, dayCount: q.dayCount, eom: q.eom, longest: maturity, leg: null });
      else if (compareCivil(maturity, f.longest) > 0) f.longest = maturity;
    }
  }

  private family(q: SwapQuote): Family | undefined {
    for (const f of this.families) if (f.frequency === q.frequency && f.dayCount === q.dayCount && f.eom === q.eom) return f;
    return undefined;
  }

  /** The timed fixed leg of `q` maturing on `maturity` (fresh arrays the caller may keep). */
  leg(q: SwapQuote, maturity: CivilDate): { times: number[]; taus: number[] } {
    const f = this.family(q);
    if (f === undefined) return timedLeg(this.settlement, maturity, q, this.time);
    const e = f.longest;
    f.leg ??= timedLeg(this.settlement, e, q, this.time);
    const longest = f.leg;
    const step = 12 / q.frequency;
    const months = e.y * 12 + e.m - (maturity.y * 12 + maturity.m);
    const i = longest.dates.length - 1 - months / step;
    const shares =
      maturity.d === e.d &&
      (!q.eom || isMonthEnd(maturity) === isMonthEnd(e)) &&
      Number.isInteger(i) &&
      i >= 1 &&
      sameCivil(longest.dates[i]!, maturity);
    if (!shares) return timedLeg(this.settlement, maturity, q, this.time);
    const times = longest.times.slice(0, i + 1);
    const taus = longest.taus.slice(0, i + 1);
    // The last period, a regular one (i >= 1), with the maturity as termination date.
    const from = longest.dates[i - 1]!;
    const refDays = q.dayCount === 'ACT/ACT-ICMA' ? serialFromCivil(maturity) - serialFromCivil(from) : 0;
    taus[i] = yearFractionCivil(q.dayCount, from, maturity, q.eom, true, refDays, q.frequency);
    return { times, taus };
  }
}

interface Family {
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
  /** The family's latest maturity. */
  longest: CivilDate;
  /** The leg to that maturity, generated when first needed. */
  leg: TimedLeg | null;
}

/**
 * Single-curve par swap from settlement, the curve both discounting and projecting:
 *   S = (1 - DF(T_n)) / sum_i tau_i DF(T_i).
 * Exact for overnight-indexed swaps; an approximation for term-index swaps (README).
 * `legs`: the market's shared fixed legs (see SwapLegs); without it the leg is generated here.
 */
export function compileSwap(q: SwapQuote, settlement: CivilDate, maturity: CivilDate, t: number, time: (d: CivilDate) => number, legs?: SwapLegs): Instrument {
  const { times, taus } = legs ? legs.leg(q, maturity) : timedLeg(settlement, maturity, q, time);
  return new SwapInstrument(q, t, times, taus, q.rate);
}

/** A par swap's flows on one curve: S tau_i at each fixed-leg date and 1 more at the end (per 1 notional). */
export function fixedLegFlows(rate: number, taus: readonly number[]): number[] {
  const n = taus.length;
  const amounts = new Array<number>(n);
  for (let j = 0; j < n; j++) amounts[j] = rate * taus[j]!;
  amounts[n - 1] = amounts[n - 1]! + 1;
  return amounts;
}

/**
 * The single-curve par rate (1 - DF(T_n)) / sum tau_i DF(T_i) from ln DF and DF at the fixed-leg
 * dates (from `offset`), with 1 - DF(T_n) as -expm1(ln DF(T_n)).
 */
export function parRateFromFlows(taus: readonly number[], ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
  const n = taus.length;
  let annuity = 0;
  for (let j = 0; j < n; j++) annuity += taus[j]! * df[offset + j]!;
  const num = -Math.expm1(ln[offset + n - 1]!);
  trace?.('A', annuity);
  trace?.('num', num);
  return num / annuity;
}

/**
 * A compiled swap: S tau_i at each fixed date and 1 at the end against 1. The one curve discounts
 * and projects (the floating leg is worth 1 - DF(T_n) on it). Performance: a requote creates one
 * object and one array.
 */
class SwapInstrument extends CompiledInstrument<SwapQuote> {
  declare readonly unit: 'rate';
  declare readonly field: 'rate';
  declare readonly amounts: number[];
  declare readonly closedFormLn: null;
  /** Accrual year fractions tau_i of the fixed periods. */
  declare readonly taus: readonly number[];

  constructor(q: SwapQuote, t: number, times: readonly number[], taus: readonly number[], rate: number) {
    super(q, t, times, 'rate', 'rate', rate, fixedLegFlows(rate, taus), 1, null, DISCOUNTING_AND_PROJECTING);
    this.taus = taus;
  }

  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    return parRateFromFlows(this.taus, ln, df, offset, trace);
  }

  requote(value: number): Instrument {
    return new SwapInstrument(this.quote, this.t, this.times, this.taus, value);
  }
}
