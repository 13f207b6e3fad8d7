import { yearFractionCivil, type DayCount } from '../time/dayCount.ts';
import { isoFromCivil, civilFromIso, sameCivil, serialFromCivil, type CivilDate, type IsoDate } from '../time/date.ts';
import { backwardScheduleCivil } from '../time/schedule.ts';
import type { SwapQuote } from '../workspace/types.ts';
import { quoteOnCurve, type Instrument } from './instrument.ts';

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

/**
 * Single-curve par swap from settlement, the curve both discounting and projecting:
 *   S = (1 - DF(T_n)) / sum_i tau_i DF(T_i).
 * Exact for overnight-indexed swaps; an approximation for term-index swaps (README).
 */
export function compileSwap(q: SwapQuote, settlement: CivilDate, maturity: CivilDate, t: number, time: (d: CivilDate) => number): Instrument {
  const leg = fixedLegCivil(settlement, maturity, q.frequency, q.dayCount, q.eom);
  const n = leg.dates.length;
  // Plain arrays of doubles (see Instrument.times).
  const times = new Array<number>(n);
  const taus = new Array<number>(n);
  for (let j = 0; j < n; j++) {
    times[j] = time(leg.dates[j]!);
    taus[j] = leg.taus[j]!;
  }
  return new SwapInstrument(q, t, times, taus, q.rate);
}

/**
 * A compiled swap. Performance: a class, so that a requote creates one object and one array, with
 * no closures (the command-line runner's transform adds a name-setting call to every closure).
 */
class SwapInstrument implements Instrument {
  declare readonly quote: SwapQuote;
  declare readonly index: number;
  declare readonly kind: 'swap';
  declare readonly maturity: IsoDate;
  declare readonly t: number;
  declare readonly unit: 'rate';
  declare readonly field: 'rate';
  declare readonly market: number;
  declare readonly times: readonly number[];
  declare readonly amounts: number[];
  declare readonly target: number;
  declare readonly closedFormLn: null;
  /** Accrual year fractions tau_i of the fixed periods. */
  declare readonly taus: readonly number[];

  constructor(q: SwapQuote, t: number, times: readonly number[], taus: readonly number[], rate: number) {
    const n = taus.length;
    const amounts = new Array<number>(n);
    for (let j = 0; j < n; j++) amounts[j] = rate * taus[j]!;
    amounts[n - 1] = amounts[n - 1]! + 1;
    this.quote = q;
    this.index = q.index;
    this.kind = 'swap';
    this.maturity = q.maturity;
    this.t = t;
    this.unit = 'rate';
    this.field = 'rate';
    this.market = rate;
    this.times = times;
    this.amounts = amounts;
    this.target = 1;
    this.closedFormLn = null;
    this.taus = taus;
  }

  modelQuote(lnDiscountAt: (t: number) => number): number {
    return quoteOnCurve(this, lnDiscountAt);
  }

  /** The par rate (1 - DF(T_n)) / sum tau_i DF(T_i), with 1 - DF(T_n) as -expm1(ln DF(T_n)). */
  quoteFromFlows(ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    const { taus } = this;
    const n = taus.length;
    let annuity = 0;
    for (let j = 0; j < n; j++) annuity += taus[j]! * df[offset + j]!;
    return -Math.expm1(ln[offset + n - 1]!) / annuity;
  }

  requote(value: number): Instrument {
    return new SwapInstrument(this.quote, this.t, this.times, this.taus, value);
  }
}
