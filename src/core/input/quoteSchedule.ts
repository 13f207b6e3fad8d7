import type { Curve } from '../curve/curve.ts';
import { formatBp, formatNumber } from '../format/quantities.ts';
import { convexityModelText, type ConvexityFill } from '../instruments/convexity.ts';
import { bondSchedule } from '../instruments/bond.ts';
import { fixedLegPeriods } from '../instruments/swap.ts';
import { yearFraction } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import type { BondQuote, DatedSwapQuote, DepositQuote, FraQuote, FutureQuote, ParYieldQuote, Quote, SwapQuote } from '../document/types.ts';
import { isDated } from '../kinds/swap.ts';
import { FUTURE_BASIS, futureForwardRate } from '../instruments/future.ts';
import { futureName } from '../kinds/future.ts';
import { businessCalendar } from '../time/calendars.ts';
import { serialFromIso } from '../time/date.ts';
import { averagedDays, lastDayOf } from '../time/futurePeriods.ts';
import { parYieldSchedule } from '../instruments/parYield.ts';
import { formatRate } from '../format/quantities.ts';
import { couponTag } from '../format/conventionTag.ts';
import { oisDates } from '../instruments/ois.ts';
import { civilFromIso, isoFromCivil } from '../time/date.ts';
import { yearFractionCivil } from '../time/dayCount.ts';
import Decimal from 'decimal.js';

/** One period of a bond's or swap fixed leg's schedule, for reconciling against another source. */
export interface ScheduleRow {
  readonly start: IsoDate;
  readonly end: IsoDate;
  /** Year fraction of the period under the instrument's day count. */
  readonly yearFraction: number;
  /** Cash flow per 100 face (bond: coupon, plus 100 at maturity; swap: fixed coupon, plus 100 at the end). */
  readonly cashFlow: number;
  /** Discount factor on the curve at the payment date, and the flow's present value per 100. */
  readonly discount: number | null;
  readonly presentValue: number | null;
  /** Years from settlement on the curve's axis. */
  readonly t: number | null;
  /**
   * For a period whose dates a calendar moves (an overnight-index swap): its accrual end before
   * and after the business-day rule; `end` is then the payment date (the accrual end plus the
   * payment lag).
   */
  readonly accrualEnd?: IsoDate;
  readonly unadjustedAccrualEnd?: IsoDate;
  /** For a day of an averaged future (one-month): the business day whose overnight rate the day carries; for an FRA, its index's fixing date. */
  readonly fixingDate?: IsoDate;
  /** For a period whose start a calendar moves (an FRA): its start before the business-day rule. */
  readonly unadjustedStart?: IsoDate;
}

export interface QuoteSchedule {
  readonly rows: readonly ScheduleRow[];
  /** Accrued interest per 100 face at settlement (bonds); 0 for swaps. */
  readonly accrued: number;
  readonly note: string;
  /** The year fractions' day count when the quote has no `dayCount` field of its own (a future: ACT/360). */
  readonly dayCount?: string;
  /** What `fixingDate` is: `daily` (each day of an averaged future carries a business day's rate; rows end on day ends) or `index` (an FRA's index fixing; rows end on payment dates). Default daily. */
  readonly fixing?: 'daily' | 'index';
}

const df = (curve: Curve | null, date: IsoDate): { discount: number | null; t: number | null } => {
  if (!curve) return { discount: null, t: null };
  const t = curve.time(date);
  return { discount: Math.exp(curve.lnDiscountAt(t)), t };
};

/** Cash amount per 100 face, exact to the cent's thousandth for display (decimal.js rounding, half-even). */
const money = (x: number): number => new Decimal(x).toDecimalPlaces(10, Decimal.ROUND_HALF_EVEN).toNumber();

/**
 * A bond's schedule after settlement (bondSchedule): every coupon is the regular 100 c / f; the
 * year fraction column is the period's fraction under the bond's day count (ACT/ACT-ICMA: days over
 * frequency x days of the coupon period, ICMA Rule 251), which sets accrued interest.
 */
export function bondScheduleRows(q: BondQuote, settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const s = bondSchedule(q, q.settle ?? settlement);
  let start = s.previous;
  const rows = s.dates.map((end, i) => {
    const ctx = { termination: q.maturity, eom: q.eom, refStart: start, refEnd: end, frequency: q.frequency };
    const yf = yearFraction(q.dayCount, start, end, ctx);
    const cashFlow = money(s.amounts[i]!);
    const { discount, t } = df(curve, end);
    const row: ScheduleRow = { start, end, yearFraction: yf, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t };
    start = end;
    return row;
  });
  const spot = q.settle === undefined ? '' : `settles on ${q.settle} (${q.spotLag} business day${q.spotLag === 1 ? '' : 's'} after the valuation date on the ${q.calendar} calendar), where the price is paid and the accrued interest counted; `;
  return { rows, accrued: s.accrued, note: `${spot}first period starts on the last coupon date ${s.previous}; accrued interest ${formatNumber(s.accrued, 6)} per 100 face` };
}

/**
 * A par swap's fixed leg (fixedLegPeriods): coupon 100 S tau_i per 100 notional, plus 100 at the
 * end standing for the floating leg's value in a single-curve par swap (S A + DF(T_n) = 1).
 */
export function swapScheduleRows(q: SwapQuote, settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const periods = fixedLegPeriods(settlement, q.maturity, q.frequency, q.dayCount, q.eom);
  const rows = periods.map((p, i) => {
    const cashFlow = money(100 * q.rate * p.tau + (i === periods.length - 1 ? 100 : 0));
    const { discount, t } = df(curve, p.end);
    return { start: p.start, end: p.end, yearFraction: p.tau, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t };
  });
  return { rows, accrued: 0, note: 'fixed leg per 100 notional; the final 100 stands for the floating leg (single-curve par swap)' };
}

/**
 * An overnight-index swap's fixed leg (oisDates): for period i the accrual start S_i, the payment
 * date P_i (its accrual end E_i plus the payment lag), the year fraction tau_i on [S_i, E_i) under
 * the fixed leg's day count, the coupon 100 K tau_i per 100 notional, its discount factor at P_i.
 * The floating leg (compounded overnight, worth sum (DF(S_i)/DF(E_i) - 1) DF(P_i) on the curve) is
 * not a list of fixed flows and is not shown.
 */
export function oisScheduleRows(q: DatedSwapQuote, settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const r = oisDates(q, civilFromIso(settlement));
  if (!r.ok) return { rows: [], accrued: 0, note: r.errors[0]?.message ?? 'no schedule' };
  const { starts, ends, payments, unadjustedEnds } = r.value;
  const n = ends.length;
  const rows = ends.map((end, i) => {
    const tau = yearFractionCivil(q.dayCount, starts[i]!, end, q.eom, i === n - 1, 0, q.frequency);
    const cashFlow = money(100 * q.rate * tau);
    const pay = isoFromCivil(payments[i]!);
    const { discount, t } = df(curve, pay);
    return {
      start: isoFromCivil(starts[i]!), end: pay, yearFraction: tau, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t,
      accrualEnd: isoFromCivil(end), unadjustedAccrualEnd: isoFromCivil(unadjustedEnds[i]!),
    };
  });
  const lag = q.paymentLag === 0 ? 'paid on each accrual end' : `each paid ${q.paymentLag} business day${q.paymentLag === 1 ? '' : 's'} after its accrual end`;
  const spot = q.spotLag === 0 ? 'starting on the valuation date' : `starting at spot, ${q.spotLag} business day${q.spotLag === 1 ? '' : 's'} after the valuation date`;
  return { rows, accrued: 0, note: `fixed leg per 100 notional on the ${q.calendar} calendar, ${spot}; accrual ends moved by ${q.businessDay}${q.eom ? ' (end-of-month rule)' : ''}, ${lag}; the floating leg compounds the overnight rate and is not shown` };
}

/**
 * An FRA's one period on one curve, as the forward deposit it fixes: 100 placed at the start and
 * 100 (1 + F tau) repaid at the end, tau on the index's day count; the start and end before and
 * after the business-day rule, and the index's fixing date. The note says how each date was made.
 */
export function fraScheduleRows(q: FraQuote, _settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const tau = yearFraction(q.dayCount, q.start, q.end, { termination: q.end });
  const cashFlow = money(100 * (1 + q.rate * tau));
  const { discount, t } = df(curve, q.end);
  const rows = [{ start: q.start, unadjustedStart: q.unadjustedStart, end: q.end, accrualEnd: q.end, unadjustedAccrualEnd: q.unadjustedEnd, fixingDate: q.fixing, yearFraction: tau, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t }];
  const spot = q.spotLag === 0 ? `spot is the valuation date` : `spot ${q.spot} is ${q.spotLag} business day${q.spotLag === 1 ? '' : 's'} after the valuation date`;
  const note = `FRA ${q.period} on the ${q.indexTenor} index, on the ${q.calendar} calendar: ${spot}; start = spot + ${q.startMonths} months, end = start + ${q.indexTenor}, each moved by ${q.businessDay}${q.eom ? ', end-of-month rule on' : ''}; the index fixes on ${q.fixing}, two business days before the start. On one curve the FRA fixes DF(start)/DF(end) = 1 + F tau: per 100 at the start, 100 (1 + F tau) at the end`;
  return { rows, accrued: 0, note, fixing: 'index' };
}

/**
 * A deposit's one period: from its start to its end (maturity), the year fraction on its day
 * count, and 100 (1 + r tau) paid at the end per 100 placed at the start. The note names its
 * calendar and start when it has them (ON, TN, SN, a spot lag).
 */
export function depositScheduleRows(q: DepositQuote, _settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const tau = yearFraction(q.dayCount, q.start, q.maturity, { termination: q.maturity });
  const cashFlow = money(100 * (1 + q.rate * tau));
  const { discount, t } = df(curve, q.maturity);
  const moved = q.unadjustedEnd === undefined ? {} : { accrualEnd: q.maturity, unadjustedAccrualEnd: q.unadjustedEnd };
  const rows = [{ start: q.start, end: q.maturity, yearFraction: tau, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t, ...moved }];
  const rule = q.businessDay === null ? '' : `, its end moved by ${q.businessDay}`;
  const on = q.calendar === null ? 'from settlement, dates unadjusted' : `on the ${q.calendar} calendar${q.spotLag ? `, spot ${q.spotLag} business day${q.spotLag === 1 ? '' : 's'} after settlement` : ''}${rule}`;
  return { rows, accrued: 0, note: `deposit per 100 placed on ${q.start}, repaid with interest on ${q.maturity}; ${on}` };
}

/**
 * A par yield's theoretical security (instruments/parYield.ts). Above one year the par bond:
 * coupon 100 y / f per 100 face on each coupon date back from maturity (year fraction on the day
 * count, as a bond's), plus 100 at maturity, against clean 100 plus accrued interest. At one year
 * or less one flow of 100 at maturity, its year-fraction column the coupon periods n over f, DF
 * (1 + y/f)^-n. Coupon dates between quoted maturities are read off the curve's interpolation.
 */
export function parYieldScheduleRows(q: ParYieldQuote, settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const s = parYieldSchedule(q, settlement);
  if (s.zero) {
    const { discount, t } = df(curve, q.maturity);
    const rows = [{ start: settlement, end: q.maturity, yearFraction: s.periods / q.frequency, cashFlow: 100, discount, presentValue: discount === null ? null : 100 * discount, t }];
    return { rows, accrued: 0, note: `one year or less: a zero-coupon bond-equivalent yield, DF = (1 + y/${q.frequency})^-n over n = ${formatNumber(s.periods, 6)} coupon periods on ${q.dayCount}` };
  }
  let start = s.previousIso;
  const c = (100 * q.yield) / q.frequency;
  const rows = s.isoDates.map((end, i) => {
    const ctx = { termination: q.maturity, eom: q.eom, refStart: start, refEnd: end, frequency: q.frequency };
    const yf = yearFraction(q.dayCount, start, end, ctx);
    const cashFlow = money(i === s.isoDates.length - 1 ? c + 100 : c);
    const { discount, t } = df(curve, end);
    const row: ScheduleRow = { start, end, yearFraction: yf, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t };
    start = end;
    return row;
  });
  const accrued = 100 * q.yield * s.accrualFraction;
  return { rows, accrued, note: `a par bond: coupon ${formatRate(q.yield, couponTag(q.frequency, q.dayCount))} = the par yield, clean price 100, coupon dates unadjusted back from maturity; accrued interest ${formatNumber(accrued, 6)} per 100 face; discount factors on coupon dates between quoted maturities come from the curve's interpolation` };
}

/** The model behind a filled adjustment and what it read: "Hull-White (Kirikos-Novak), σ 1.00%, a 0.03, t1 0.2877 y, t2 0.5370 y (ACT/365F from the valuation date)". */
export function convexityFillText(f: ConvexityFill): string {
  return `${convexityModelText(f)}, t1 ${formatNumber(f.t1, 4)} y and t2 ${formatNumber(f.t2, 4)} y to the period's start and end (ACT/365F from the valuation date)`;
}

/**
 * The quote check's rows. 3M: the reference quarter, its ACT/360 fraction and 100 (1 + R tau)
 * per 100 at its end at the forward rate R. 1M: one row per calendar day of the month, each with
 * the business day whose rate it carries (`fixingDate`), 1/360 and 100 R / 360 per 100.
 */
export function futureScheduleRows(q: FutureQuote, _settlement: IsoDate, curve: Curve | null): QuoteSchedule {
  const r = futureForwardRate(q.price, q.convexity);
  const s = serialFromIso(q.start);
  const e = serialFromIso(q.end);
  const at = (date: IsoDate): { discount: number | null; t: number | null } => {
    if (!curve) return { discount: null, t: null };
    const t = curve.time(date);
    return { discount: Math.exp(curve.lnDiscountAt(t)), t };
  };
  const known = q.fixings === undefined ? 0 : Object.keys(q.fixings).length;
  const ca = `${q.convexityFill ? `less a convexity adjustment of ${formatBp(q.convexity)} (${convexityFillText(q.convexityFill)})` : q.convexity === 0 ? 'no convexity adjustment' : `less a convexity adjustment of ${q.convexity} bp as typed`}${known > 0 ? `; ${known} fixing${known === 1 ? '' : 's'} before the valuation date given, the rest read off the curve` : ''}`;
  if (q.contract === '3M') {
    const tau = (e - s) / FUTURE_BASIS;
    const cashFlow = 100 * (1 + r * tau);
    const { discount, t } = at(q.end);
    return {
      rows: [{ start: q.start, end: q.end, yearFraction: tau, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t }],
      accrued: 0,
      dayCount: 'ACT/360',
      note: `${futureName(q.contract, q.month, q.start, q.end)}: the overnight rate compounded daily from ${q.start} to ${q.end} (end excluded, dates not moved for holidays), simple on ACT/360 over ${e - s} days; the futures rate 100 - price ${ca}; per 100 at the forward rate`,
    };
  }
  const outcome = businessCalendar(q.calendar, q.calendars ?? {});
  if (!outcome.ok) return { rows: [], accrued: 0, note: outcome.message };
  const rows: ScheduleRow[] = averagedDays(q.start, q.end, outcome.calendar).map(({ day, dayEnd, fixing }) => {
    const { discount, t } = at(dayEnd);
    const cashFlow = (100 * r) / FUTURE_BASIS;
    return { start: day, end: dayEnd, yearFraction: 1 / FUTURE_BASIS, cashFlow, discount, presentValue: discount === null ? null : cashFlow * discount, t, fixingDate: fixing };
  });
  return {
    rows,
    accrued: 0,
    dayCount: 'ACT/360',
    note: `${futureName(q.contract, q.month, q.start, q.end)}: the arithmetic average of the overnight rate over the ${e - s} calendar days from ${q.start} to ${lastDayOf(q.end)}, a day that is not a business day on ${q.calendar} carrying the rate of the business day before it (fixing date); the curve node is ${q.maturity}, where the last day's rate ends; the futures rate 100 - price ${ca}; per 100 at the forward rate per day`,
  };
}

/**
 * The schedule view of each kind that has one (the quote check), by kind: kept here rather than on
 * the kinds' modules so it loads with the quote check and not with the first screen. A kind with a
 * single flow (bill, zero) has none.
 */
const SCHEDULES: { readonly [K in Quote['kind']]?: (q: Extract<Quote, { kind: K }>, settlement: IsoDate, curve: Curve | null) => QuoteSchedule } = {
  deposit: depositScheduleRows,
  bond: bondScheduleRows,
  swap: (q, settlement, curve) => (isDated(q) ? oisScheduleRows(q, settlement, curve) : swapScheduleRows(q, settlement, curve)),
  ois: oisScheduleRows,
  'par-yield': parYieldScheduleRows,
  future: futureScheduleRows,
  fra: fraScheduleRows,
};

/** A quote's cash-flow schedule on a curve (bonds, swaps, deposits), or null for a kind with a single flow. */
export function quoteSchedule(q: Quote, settlement: IsoDate, curve: Curve | null): QuoteSchedule | null {
  const f = SCHEDULES[q.kind] as ((q: Quote, settlement: IsoDate, curve: Curve | null) => QuoteSchedule) | undefined;
  return f ? f(q, settlement, curve) : null;
}
