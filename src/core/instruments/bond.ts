import { yearFractionCivil, type DayCount } from '../time/dayCount.ts';
import { isoFromCivil, civilFromIso, sameCivil, serialFromCivil, type CivilDate, type IsoDate } from '../time/date.ts';
import { backwardScheduleCivil } from '../time/schedule.ts';
import type { BondQuote } from '../document/types.ts';
import { CompiledInstrument, DISCOUNTING, type Instrument, type QuoteTrace } from './instrument.ts';

/**
 * A fixed-coupon bond's cash flows after settlement, per 100 face.
 *
 * Schedule backward from maturity every 12/frequency months (eom as flagged); the period holding
 * settlement is regular, its start the last coupon date on or before settlement (a coupon paid on
 * the settlement date is excluded). Every coupon is the regular 100 c / f whatever the day count;
 * the day count sets accrued interest = 100 c x yearFraction(dayCount, previous, settlement), with
 * ACT/ACT-ICMA's reference period the coupon period (ICMA Rule 251).
 */
export interface BondSchedule {
  readonly previous: IsoDate;
  readonly dates: readonly IsoDate[];
  /** Cash flow per 100 face at each date (coupon, plus 100 at maturity). */
  readonly amounts: readonly number[];
  /** Accrued interest per 100 face at settlement. */
  readonly accrued: number;
  /** Fraction of the current coupon period from settlement to the next coupon, in (0, 1]. */
  readonly w: number;
  readonly frequency: number;
  readonly coupon: number;
}

export interface BondTerms {
  readonly maturity: IsoDate;
  readonly coupon: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly eom: boolean;
}

export function bondSchedule(terms: BondTerms, settlement: IsoDate): BondSchedule {
  const c = bondScheduleCivil(terms, civilFromIso(settlement), civilFromIso(terms.maturity));
  const last = c.dates.length - 1;
  const dates = c.dates.map((d, i) => (i === last ? terms.maturity : isoFromCivil(d)));
  return { previous: isoFromCivil(c.previous), dates, amounts: c.amounts, accrued: c.accrued, w: c.w, frequency: c.frequency, coupon: c.coupon };
}

/** What pricing from a yield needs of a schedule (bondDirtyFromYield, bondYieldFromDirty). */
export type YieldSchedule = Pick<BondSchedule, 'amounts' | 'w' | 'frequency' | 'coupon'>;

/**
 * The bond's year fraction from a to b (years, on its own day count): ICMA's reference period is the
 * coupon period from `previous` to `next`; 30E/360-ISDA's termination date is the maturity.
 */
export function bondYearFraction(terms: Pick<BondTerms, 'dayCount' | 'eom' | 'frequency'>, previous: CivilDate, next: CivilDate, maturity: CivilDate): (a: CivilDate, b: CivilDate) => number {
  const refDays = serialFromCivil(next) - serialFromCivil(previous);
  return (a, b) => yearFractionCivil(terms.dayCount, a, b, terms.eom, sameCivil(b, maturity), refDays, terms.frequency);
}

/** `bondSchedule` on civil dates (performance: no ISO text per coupon date); same rules and units. */
export function bondScheduleCivil(
  terms: BondTerms,
  settlement: CivilDate,
  maturity: CivilDate,
): YieldSchedule & { readonly dates: readonly CivilDate[]; readonly previous: CivilDate; readonly accrued: number } {
  const { coupon, frequency, eom } = terms;
  const { dates, previous } = backwardScheduleCivil(settlement, maturity, frequency, eom);
  const next = dates[0]!;
  const yf = bondYearFraction(terms, previous, next, maturity);
  const accrued = 100 * coupon * yf(previous, settlement);
  // w: the ICMA exponent of the first flow, the fraction of the coupon period still to run.
  const w = yf(settlement, next) / yf(previous, next);
  const c = (100 * coupon) / frequency;
  const amounts = dates.map((_, i) => (i === dates.length - 1 ? c + 100 : c));
  return { previous, dates, amounts, accrued, w, frequency, coupon };
}

/**
 * Dirty price per 100 from a yield y (decimal, compounded f times a year) by the ICMA convention:
 *   P = sum_k CF_k (1 + y/f)^-(w + k),  k = 0, 1, ..., N-1.
 * Returns the price and dP/dy. `pvs`, when given, receives each term CF_k (1 + y/f)^-(w + k) in
 * order (the bond explanation's trace; nothing else changes).
 */
export function bondDirtyFromYield(s: YieldSchedule, y: number, pvs?: number[]): { price: number; dPdy: number; d2Pdy2: number } {
  const f = s.frequency;
  const lnV = -Math.log1p(y / f);
  let price = 0;
  let dPdy = 0;
  let d2 = 0;
  for (let k = 0; k < s.amounts.length; k++) {
    const e = s.w + k;
    const pv = s.amounts[k]! * Math.exp(e * lnV);
    pvs?.push(pv);
    price += pv;
    dPdy -= (e / f) * pv / (1 + y / f);
    d2 += ((e * (e + 1)) / (f * f)) * pv / ((1 + y / f) * (1 + y / f));
  }
  return { price, dPdy, d2Pdy2: d2 };
}

/**
 * The ICMA yield (decimal, compounded f times a year) whose dirty price equals `dirty` per 100:
 * Newton from the coupon rate, safeguarded by bisection on (-f, 10); null when none exists
 * (the price is not positive, or not reachable with a yield above -f).
 */
export function bondYieldFromDirty(s: YieldSchedule, dirty: number): number | null {
  if (!(dirty > 0) || !Number.isFinite(dirty)) return null;
  let lo = -s.frequency * (1 - 1e-9);
  let hi = 10;
  if (bondDirtyFromYield(s, hi).price > dirty) return null;
  let y = s.coupon;
  for (let iter = 0; iter < 200; iter++) {
    const { price, dPdy } = bondDirtyFromYield(s, y);
    const r = price - dirty;
    if (r === 0) return y;
    if (r > 0) lo = y;
    else hi = y;
    let next = y - r / dPdy;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - y) <= 1e-17 + 1e-16 * Math.abs(y)) return next;
    y = next;
  }
  return y;
}

export function compileBond(q: BondQuote, settlement: CivilDate, maturity: CivilDate, t: number, time: (d: CivilDate) => number): Instrument {
  if (q.settle !== undefined && q.settle !== isoFromCivil(settlement)) return compileSpotBond(q, civilFromIso(q.settle), maturity, t, time);
  const s = bondScheduleCivil(q, settlement, maturity);
  const times = new Array<number>(s.dates.length); // plain doubles (see Instrument.times)
  const amounts = new Array<number>(s.dates.length);
  for (let j = 0; j < times.length; j++) {
    times[j] = time(s.dates[j]!);
    amounts[j] = s.amounts[j]!;
  }
  const accrued = s.accrued;
  const yieldSchedule: YieldSchedule = { amounts: s.amounts, w: s.w, frequency: s.frequency, coupon: s.coupon };
  return new BondInstrument(q, t, times, amounts, yieldSchedule, accrued, q.yield !== null ? q.yield : q.cleanPrice!);
}

/** A compiled bond: coupons and 100 at their dates against the dirty price, discounted on the one curve. */
class BondInstrument extends CompiledInstrument<BondQuote> {
  declare readonly unit: 'rate' | 'price';
  declare readonly field: 'yield' | 'cleanPrice';
  declare readonly amounts: number[];
  declare readonly closedFormLn: null;
  /** The schedule's yield terms and the accrued interest per 100 face at settlement. */
  declare readonly schedule: YieldSchedule;
  declare readonly accrued: number;

  constructor(q: BondQuote, t: number, times: readonly number[], amounts: number[], schedule: YieldSchedule, accrued: number, value: number) {
    const byYield = q.yield !== null;
    super(q, t, times, byYield ? 'rate' : 'price', byYield ? 'yield' : 'cleanPrice', value, amounts, byYield ? bondDirtyFromYield(schedule, value).price : value + accrued, null, DISCOUNTING);
    this.schedule = schedule;
    this.accrued = accrued;
  }

  /** The clean price (dirty sum CF DF minus accrued, per 100 face), or the ICMA yield of the dirty price. */
  quoteFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const { amounts } = this;
    let dirty = 0;
    for (let j = 0; j < amounts.length; j++) dirty += amounts[j]! * df[offset + j]!;
    trace?.('dirty', dirty);
    return this.unit === 'rate' ? (bondYieldFromDirty(this.schedule, dirty) ?? Number.NaN) : dirty - this.accrued;
  }

  requote(value: number): Instrument {
    return new BondInstrument(this.quote, this.t, this.times, this.amounts, this.schedule, this.accrued, value);
  }
}

/**
 * A bond settled at spot S (its `settle`: Treasuries T+1, Bunds T+2): the schedule, the accrued
 * interest and the ICMA yield are all at S, and the dirty price D is paid at S, so
 *   sum_k CF_k DF(T_k) = D DF(S)
 * (a coupon paid on S itself is the seller's, as a coupon on the settlement date is excluded).
 * Flows: 0 at t_S, then the coupons and 100 at their dates, against D DF(S) read off the curve
 * (`targetFromFlows`, as a deposit starting at spot); `target` is D, the residual's scale.
 */
function compileSpotBond(q: BondQuote, settle: CivilDate, maturity: CivilDate, t: number, time: (d: CivilDate) => number): Instrument {
  const s = bondScheduleCivil(q, settle, maturity);
  const n = s.dates.length;
  const times = new Array<number>(n + 1);
  const amounts = new Array<number>(n + 1);
  times[0] = time(settle);
  amounts[0] = 0;
  for (let j = 0; j < n; j++) {
    times[j + 1] = time(s.dates[j]!);
    amounts[j + 1] = s.amounts[j]!;
  }
  const yieldSchedule: YieldSchedule = { amounts: s.amounts, w: s.w, frequency: s.frequency, coupon: s.coupon };
  return new SpotBondInstrument(q, t, times, amounts, yieldSchedule, s.accrued, q.yield !== null ? q.yield : q.cleanPrice!);
}

/** The same terms as BondInstrument, its flows led by a zero at the settlement; what changes is what they are met against. */
class SpotBondInstrument extends BondInstrument {
  /** D DF(S): what the coupons and principal must be worth today. */
  targetFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number): number {
    return this.target * df[offset]!;
  }

  /** d(D DF(S)) / d ln DF: D DF(S) at S, nothing at the coupon dates. */
  targetSlopes(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, out: number[]): void {
    out[0] = this.target * df[offset]!;
    for (let j = 1; j < this.amounts.length; j++) out[j] = 0;
  }

  /** The clean price at S, sum CF DF / DF(S) - accrued, or the ICMA yield at S of that dirty price. */
  override quoteFromFlows(_ln: ArrayLike<number>, df: ArrayLike<number>, offset: number, trace?: QuoteTrace): number {
    const { amounts } = this;
    let pv = 0;
    for (let j = 1; j < amounts.length; j++) pv += amounts[j]! * df[offset + j]!;
    const dirty = pv / df[offset]!;
    trace?.('pv', pv);
    trace?.('dirty', dirty);
    return this.unit === 'rate' ? (bondYieldFromDirty(this.schedule, dirty) ?? Number.NaN) : dirty - this.accrued;
  }

  override requote(value: number): Instrument {
    return new SpotBondInstrument(this.quote, this.t, this.times, this.amounts, this.schedule, this.accrued, value);
  }
}
