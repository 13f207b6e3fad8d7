import type { Curve } from '../curve/curve.ts';
import { forwardParRateOn } from '../curve/query.ts';
import { fixedLegPeriods } from '../instruments/swap.ts';
import { fail, ok, type Result } from '../result.ts';
import { compareIso, daysBetween, type IsoDate } from '../time/date.ts';
import { backwardSchedule } from '../time/schedule.ts';
import { brentRoot } from './rollSolve.ts';
import { recordHorizonPrice, recordYieldPrice, type RollTrace } from './rollTrace.ts';

/** A cash flow of a term bond, per 100 face. */
export interface BondFlow {
  readonly date: IsoDate;
  readonly amount: number;
}

/**
 * A fixed-coupon term bond bought at `settlement`: coupon dates backward from maturity every
 * 12/frequency months; a short first period pays its accrued share, coupon x ACT/ACT-ICMA
 * fraction (days / (frequency x days of the notional period)); full periods pay coupon/frequency.
 * Amounts per 100 face; the last flow includes the 100 redemption.
 */
export interface TermBond {
  readonly settlement: IsoDate;
  readonly maturity: IsoDate;
  /** Coupon, decimal per year, paid `frequency` times a year. */
  readonly coupon: number;
  readonly frequency: number;
  readonly flows: readonly BondFlow[];
}

/** The cash flows of a coupon bond from settlement (see TermBond). */
export function couponBond(settlement: IsoDate, maturity: IsoDate, coupon: number, frequency: number): TermBond {
  const periods = fixedLegPeriods(settlement, maturity, frequency, 'ACT/ACT-ICMA', false);
  const flows = periods.map((p, i) => ({ date: p.end, amount: 100 * coupon * p.tau + (i === periods.length - 1 ? 100 : 0) }));
  return { settlement, maturity, coupon, frequency, flows };
}

/**
 * The par coupon bond maturing on `maturity`: coupon c = (1 - DF(T)) / sum_i tau_i DF(t_i) with
 * tau_i the ACT/ACT-ICMA fractions of the periods (query.ts forwardParRateOn), so that
 * sum_i 100 c tau_i DF(t_i) + 100 DF(T) = 100 on today's curve.
 */
export function parBondOn(curve: Curve, maturity: IsoDate, frequency: number, path: string): Result<TermBond> {
  const r = forwardParRateOn(curve, curve.settlement, maturity, frequency, 'ACT/ACT-ICMA', false, path);
  if (!r.ok) return r;
  return ok(couponBond(curve.settlement, maturity, r.value.rate, frequency));
}

/**
 * ICMA exponent base at a date d: w = days(d, next) / days(notional previous, next), the fraction of
 * the current coupon period still to run (ICMA Rule 251 actual/actual; common practice).
 */
function icmaFraction(bond: TermBond, date: IsoDate): number {
  const { dates, previous } = backwardSchedule(date, bond.maturity, bond.frequency, false);
  const next = dates[0] ?? bond.maturity;
  return daysBetween(date, next) / daysBetween(previous, next);
}

/**
 * Dirty price per 100 face on `date` of the flows strictly after `date`, from a yield y (decimal
 * per year compounded `frequency` times a year), by the ICMA convention:
 *   P = sum_k CF_k (1 + y/f)^-(w + k),  w = icmaFraction(date), k = 0, 1, ...
 * Fabozzi, "Bond Markets, Analysis and Strategies", bond pricing between coupon dates (cited from
 * memory); common practice.
 */
export function bondPriceFromYieldOn(bond: TermBond, date: IsoDate, y: number, trace?: RollTrace): number {
  return bondPricerOn(bond, date)(y, trace);
}

/**
 * bondPriceFromYieldOn with the schedule work done once: returns y -> dirty price per 100 on
 * `date` (same formula), for solvers that price one bond at many yields; with `trace`, its terms are recorded.
 */
export function bondPricerOn(bond: TermBond, date: IsoDate): (y: number, trace?: RollTrace) => number {
  const after = bond.flows.filter((f) => compareIso(f.date, date) > 0);
  if (after.length === 0) return () => 0;
  const w = icmaFraction(bond, date);
  const amounts = Float64Array.from(after, (f) => f.amount);
  const f = bond.frequency;
  return (y, trace) => {
    const lnV = -Math.log1p(y / f);
    let price = 0;
    for (let k = 0; k < amounts.length; k++) price += amounts[k]! * Math.exp((w + k) * lnV);
    if (trace) recordYieldPrice(trace, bond.flows.length - after.length + 1, after, f, w, price);
    return price;
  };
}

/**
 * The ICMA yield (decimal per year, compounded `frequency` times a year) at which the flows after
 * `date` are worth `dirty` per 100; Brent's method on (-0.9 f, 2). Fails when there is none.
 */
export function bondYieldFromPriceOn(bond: TermBond, date: IsoDate, dirty: number, path = 'yield'): Result<number> {
  const price = bondPricerOn(bond, date);
  const root = brentRoot((y) => price(y) - dirty, -0.9 * bond.frequency, 2, 1e-15);
  if (root === null) {
    return fail({ path, quote: null, code: 'no-solution', message: `${path}: no yield between -90 % and 200 % prices the bond at ${dirty} per 100 on ${date}` });
  }
  return ok(root.x);
}

/** Value per 100 face on the curve's settlement date of the flows strictly after it, on that curve; with `trace`, each flow and its discount factor are recorded (`name`<i>, read on `on`). */
export function bondValueOnCurve(bond: TermBond, curve: Curve, trace?: RollTrace, name?: string, on?: string): number {
  let pv = 0;
  bond.flows.forEach((f, i) => {
    if (compareIso(f.date, curve.settlement) <= 0) return;
    const df = Math.exp(curve.lnDiscountAt(curve.time(f.date)));
    if (trace) recordHorizonPrice(trace, i + 1, f, df, name, on);
    pv += f.amount * df;
  });
  return pv;
}
