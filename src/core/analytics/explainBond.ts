import type { Curve } from '../curve/curve.ts';
import {
  DF_UNIT,
  explainedYearFraction,
  explainRead,
  type ExplainedDate,
  type ExplainedRead,
  type ExplainedStep,
  type ExplainedYearFraction,
  type Explanation,
} from '../curve/explain.ts';
import { couponTag } from '../format/conventionTag.ts';
import { bondDirtyFromYield, type BondSchedule } from '../instruments/bond.ts';
import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { civilFromIso, sameCivil, serialFromCivil, type IsoDate } from '../time/date.ts';
import { yearFractionCivil } from '../time/dayCount.ts';
import type { BondAnalytics } from './bondAnalytics.ts';
import type { CheckedBond } from './bondInput.ts';
import type { Flow } from './keyRates.ts';

/**
 * Explanations of a bond's figures off the curve (the Bond on the curve table): the model price
 * sum CF_i DF(t_i), accrued interest, the ICMA yield, durations, convexity, DV01 and the z-spread.
 *
 * analyzeBond, handed a {@link BondSink}, leaves its own values there (the ln DF of each flow, the
 * model dirty price, the yields, the market figures): a {@link BondTrace}. The steps below are
 * built from those values and from the very functions analyzeBond calls (bondDirtyFromYield for
 * everything at a yield, with its terms handed back); the last step of each is the figure the
 * table shows, bit for bit. Without a sink analyzeBond records nothing.
 */

/** What analyzeBond hands its sink: its own values. */
export interface BondTrace {
  readonly curve: Curve;
  readonly bond: CheckedBond;
  readonly schedule: BondSchedule;
  /** The cash flows on the curve's axis (t in years on the curve's day count), per 100 face. */
  readonly flows: readonly Flow[];
  /** ln DF read off the curve at each flow's t. */
  readonly lns: readonly number[];
  /** Model dirty price per 100 face: sum of amount x exp(ln DF), in flow order. */
  readonly dirty: number;
  /** ICMA yield at the model dirty price. */
  readonly yield: number;
  readonly market: { readonly given: 'price' | 'yield'; readonly yield: number; readonly dirty: number; readonly zSpread: number } | null;
}

/** Handed to analyzeBond to receive its trace. */
export interface BondSink {
  trace?: BondTrace;
}

export const BOND_FIGURES = ['clean', 'dirty', 'accrued', 'yield', 'modifiedDuration', 'macaulayDuration', 'convexity', 'dv01', 'zSpread'] as const;
/** A figure of the bond table. */
export type BondFigure = (typeof BOND_FIGURES)[number];
/** The table's column: on the curve, or at the market quote. */
export type BondSide = 'model' | 'market';

export const BOND_FIGURE_WORDS: Readonly<Record<BondFigure, string>> = {
  clean: 'clean price',
  dirty: 'dirty price',
  accrued: 'accrued interest',
  yield: 'yield to maturity',
  modifiedDuration: 'modified duration',
  macaulayDuration: 'Macaulay duration',
  convexity: 'convexity',
  dv01: 'DV01',
  zSpread: 'z-spread',
};

/** The figure as the table shows it (z-spread in bp); null where the table shows none. */
export function bondFigureValue(a: BondAnalytics, figure: BondFigure, side: BondSide): number | null {
  if (figure === 'accrued') return a.accrued;
  if (side === 'model') {
    if (figure === 'zSpread') return null;
    return figure === 'clean' ? a.modelCleanPrice : figure === 'dirty' ? a.modelDirtyPrice : a[figure];
  }
  const m = a.market;
  if (!m) return null;
  return figure === 'clean' ? m.cleanPrice : figure === 'dirty' ? m.dirtyPrice : figure === 'zSpread' ? m.zSpread * 1e4 : m[figure];
}

const PRICE_UNIT = 'per 100 face';
const BP_UNIT = 'bp (1 bp = 0.0001)';
const COUPON_RULE = 'unadjusted: coupon dates are not moved for holidays (no calendar)';
const COMPOUNDING_OF: Readonly<Record<number, Compounding>> = { 1: 'annual', 2: 'semiannual', 4: 'quarterly', 12: 'monthly' };

/** Names a list of terms added in order: all of them when few, else the first two and the last. */
const sumText = (names: readonly string[]): string => (names.length <= 6 ? names.join(' + ') : `${names[0]} + ${names[1]} + ... + ${names.at(-1)} (${names.length} terms, added in this order)`);

/** The explanation of one figure of the bond table, from analyzeBond's trace. */
export function explainBondFigure(trace: BondTrace, figure: BondFigure, side: BondSide): Result<Explanation> {
  const { curve, bond, schedule: s, flows, lns } = trace;
  const market = trace.market;
  if (side === 'market' && !market) return fail(coreError('schema', 'bond.price', 'no market price or yield was given for this bond; give one to read its market figures'));
  if (side === 'model' && figure === 'zSpread') return fail(coreError('schema', 'bond.price', 'the z-spread at the model price is 0 by definition; give a market price or yield to read one'));
  const f = bond.frequency;
  const n = flows.length;
  const yUnit = `decimal per year, ${couponTag(f, `ICMA, accrual ${bond.dayCount}`)}`;
  const dates: ExplainedDate[] = [];
  const yfs: ExplainedYearFraction[] = [];
  const reads: ExplainedRead[] = [];
  const steps: ExplainedStep[] = [];
  const have = new Set<string>();
  const step = (name: string, formula: string, inputs: readonly string[], value: number, unit: string): void => {
    if (have.has(name)) return;
    have.add(name);
    steps.push({ name, formula, inputs, value, unit });
  };
  const date = (name: string, d: IsoDate, rule = COUPON_RULE): void => void dates.push({ name, given: d, unadjusted: d, adjusted: d, rule });
  // The schedule's dates, as bondScheduleCivil makes them.
  date('settlement', curve.settlement, 'the valuation date of the curve, as given');
  date('previous coupon', s.previous);
  s.dates.forEach((d, i) => date(`c${i + 1}`, d));
  // The bond's own year fractions (bondScheduleCivil's rule: ICMA reference period the coupon period).
  const prev = civilFromIso(s.previous);
  const next = civilFromIso(s.dates[0]!);
  const maturity = civilFromIso(bond.maturity);
  const refDays = serialFromCivil(next) - serialFromCivil(prev);
  const bondYf = (name: string, a: IsoDate, b: IsoDate): string => {
    if (!have.has(name)) {
      have.add(name);
      const cb = civilFromIso(b);
      yfs.push(explainedYearFraction(name, bond.dayCount, a, b, yearFractionCivil(bond.dayCount, civilFromIso(a), cb, bond.eom, sameCivil(cb, maturity), refDays, f)));
    }
    return name;
  };
  const cfName = (i: number): string => (i === n - 1 ? 'CF_N' : 'CF');
  const terms = (): void => {
    step('c', 'c = the coupon rate, as given', [], bond.coupon, 'decimal per year');
    if (n > 1) step('CF', `CF = 100 x c / ${f} (each coupon)`, ['c'], s.amounts[0]!, PRICE_UNIT);
    step('CF_N', n > 1 ? 'CF_N = CF + 100 (the last coupon and the face)' : `CF_N = 100 x c / ${f} + 100 (the last coupon and the face)`, n > 1 ? ['CF'] : ['c'], s.amounts[n - 1]!, PRICE_UNIT);
  };
  const accrued = (): void => {
    terms();
    bondYf('tau_acc', s.previous, curve.settlement);
    step('accrued', 'accrued = 100 x c x tau_acc', ['c', 'tau_acc'], s.accrued, PRICE_UNIT);
  };
  /** The model dirty price: each flow times its DF read off the curve, summed in order. */
  const curvePrice = (): void => {
    terms();
    const names: string[] = [];
    flows.forEach((fl, i) => {
      const k = i + 1;
      yfs.push(explainedYearFraction(`t${k}`, curve.dayCount, curve.settlement, s.dates[i]!, fl.t));
      reads.push(explainRead(curve, `DF(c${k})`, s.dates[i]!, fl.t, lns[i]!));
      step(`pv${k}`, `pv${k} = ${cfName(i)} x DF(c${k})`, [cfName(i), `DF(c${k})`], fl.amount * Math.exp(lns[i]!), PRICE_UNIT);
      names.push(`pv${k}`);
    });
    step('dirty', `dirty = ${sumText(names)}`, names, trace.dirty, PRICE_UNIT);
  };
  const wStep = (): void => {
    bondYf('tau_next', curve.settlement, s.dates[0]!);
    bondYf('tau_period', s.previous, s.dates[0]!);
    step('w', 'w = tau_next / tau_period (the part of the coupon period still to run)', ['tau_next', 'tau_period'], s.w, 'unitless');
  };
  /** The yield solved from a dirty price named `target`. */
  const solve = (target: string, y: number): void => {
    wStep();
    step('y', `y solves ${target} = sum over k = 0..${n - 1} of CF_k (1 + y/${f})^-(w + k) (ICMA); Newton from the coupon rate, safeguarded by bisection`, [target, 'w', ...(n > 1 ? ['CF'] : []), 'CF_N'], y, yUnit);
  };
  /** The price at yield `yName` term by term, with its derivatives (bondDirtyFromYield, the function analyzeBond calls). */
  const atYield = (yName: string, y: number, derivative: 0 | 1 | 2): number => {
    wStep();
    const pvs: number[] = [];
    const r = bondDirtyFromYield(s, y, pvs);
    step('lnV', `lnV = -ln(1 + ${yName}/${f}) = -log1p(${yName}/${f})`, [yName], -Math.log1p(y / f), 'unitless');
    const names = pvs.map((pv, i) => {
      step(`q${i + 1}`, `q${i + 1} = ${cfName(i)} x exp((w + ${i}) x lnV)`, [cfName(i), 'w', 'lnV'], pv, PRICE_UNIT);
      return `q${i + 1}`;
    });
    step('P', `P = ${sumText(names)} (the dirty price at ${yName})`, names, r.price, PRICE_UNIT);
    if (derivative >= 1) step('dP/dy', `dP/dy = -sum over k of ((w + k) / ${f}) x q_k / (1 + ${yName}/${f}), added in order`, [...names, 'w', yName], r.dPdy, 'per 100 face per unit of yield');
    if (derivative === 2) step('d2P/dy2', `d2P/dy2 = sum over k of ((w + k)(w + k + 1) / ${f}^2) x q_k / (1 + ${yName}/${f})^2, added in order`, [...names, 'w', yName], r.d2Pdy2, 'per 100 face per unit of yield squared');
    return r.price;
  };
  /** The market dirty price, from the quoted clean price or the quoted yield. */
  const marketDirty = (): void => {
    const m = market!;
    if (m.given === 'price') {
      accrued();
      step('quoted clean', 'quoted clean = the market clean price, as given', [], bond.cleanPrice!, PRICE_UNIT);
      step('dirty_mkt', 'dirty_mkt = quoted clean + accrued', ['quoted clean', 'accrued'], m.dirty, PRICE_UNIT);
    } else {
      terms();
      step('y_mkt', 'y_mkt = the market yield, as given', [], m.yield, yUnit);
      atYield('y_mkt', m.yield, 0);
      step('dirty_mkt', 'dirty_mkt = P (the dirty price at y_mkt)', ['P'], m.dirty, PRICE_UNIT);
    }
  };
  /** The yield a figure is read at: the model yield from the curve's price, or the market's. */
  const theYield = (): string => {
    if (side === 'model') {
      curvePrice();
      solve('dirty', trace.yield);
      return 'y';
    }
    const m = market!;
    if (m.given === 'yield') {
      terms();
      step('y_mkt', 'y_mkt = the market yield, as given', [], m.yield, yUnit);
      return 'y_mkt';
    }
    marketDirty();
    solve('dirty_mkt', m.yield);
    return 'y';
  };
  const yValue = side === 'model' ? trace.yield : market?.yield ?? NaN;
  let formula: string;
  let unit: string;
  const cfDef = `CF = 100 c / ${f} on each coupon date c_i after settlement and CF_N = CF + 100 at maturity (coupon dates unadjusted, no calendar)`;
  const priceDef = `dirty = sum_i CF_i x DF(c_i), each DF read off the curve at t_i, years on ${curve.dayCount} from settlement; ${cfDef}`;
  const yieldDef = `P(y) = sum over k = 0..N-1 of CF_k (1 + y/${f})^-(w + k) (ICMA, ${f} times a year), w = tau_next / tau_period on ${bond.dayCount}`;
  switch (figure) {
    case 'accrued':
      accrued();
      formula = `accrued = 100 x c x tau_acc, tau_acc on ${bond.dayCount} from the previous coupon date to settlement`;
      unit = `${PRICE_UNIT}, ${bond.dayCount}`;
      break;
    case 'dirty':
    case 'clean': {
      const clean = figure === 'clean';
      if (side === 'model') {
        curvePrice();
        formula = clean ? `clean = dirty - accrued; ${priceDef}; accrued = 100 c x tau_acc on ${bond.dayCount}` : priceDef;
        if (clean) {
          accrued();
          step('clean', 'clean = dirty - accrued', ['dirty', 'accrued'], trace.dirty - s.accrued, PRICE_UNIT);
        }
      } else {
        marketDirty();
        formula = market!.given === 'price' ? 'dirty_mkt = quoted clean + accrued' : `dirty_mkt = P(y_mkt), ${yieldDef}`;
        if (clean) {
          accrued();
          formula = `clean_mkt = dirty_mkt - accrued; ${formula}`;
          step('clean_mkt', 'clean_mkt = dirty_mkt - accrued', ['dirty_mkt', 'accrued'], market!.dirty - s.accrued, PRICE_UNIT);
        }
      }
      unit = PRICE_UNIT;
      break;
    }
    case 'yield': {
      const y = theYield();
      formula = side === 'market' && market!.given === 'yield' ? 'the market yield, as given' : `y such that P(y) equals the ${side === 'model' ? 'model' : 'market'} dirty price; ${yieldDef}`;
      if (y === 'y') {
        atYield('y', yValue, 0);
        step('yield', `yield = y (P at y reprices ${side === 'model' ? 'dirty' : 'dirty_mkt'})`, ['y', 'P'], yValue, yUnit);
      } else step('yield', 'yield = y_mkt', ['y_mkt'], yValue, yUnit);
      unit = yUnit;
      break;
    }
    case 'modifiedDuration':
    case 'macaulayDuration':
    case 'convexity':
    case 'dv01': {
      const y = theYield();
      atYield(y, yValue, figure === 'convexity' ? 2 : 1);
      const at = `at the ${side === 'model' ? 'model' : 'market'} yield ${y}; ${yieldDef}`;
      const md = (): number => {
        const r = bondDirtyFromYield(s, yValue);
        step('modified', 'modified = -(dP/dy) / P', ['dP/dy', 'P'], -r.dPdy / r.price, 'years');
        return -r.dPdy / r.price;
      };
      const r = bondDirtyFromYield(s, yValue);
      if (figure === 'modifiedDuration') {
        md();
        formula = `modified duration = -(1/P) dP/dy ${at}`;
        unit = 'years';
      } else if (figure === 'macaulayDuration') {
        const m = md();
        step('macaulay', `macaulay = (1 + ${y}/${f}) x modified`, [y, 'modified'], (1 + yValue / f) * m, 'years');
        formula = `Macaulay duration = (1 + y/${f}) x modified duration, modified = -(1/P) dP/dy ${at}`;
        unit = 'years';
      } else if (figure === 'convexity') {
        step('convexity', 'convexity = (d2P/dy2) / P', ['d2P/dy2', 'P'], r.d2Pdy2 / r.price, 'years squared');
        formula = `convexity = (1/P) d2P/dy2 ${at}`;
        unit = 'years squared';
      } else {
        step('DV01', 'DV01 = -(dP/dy) x 0.0001', ['dP/dy'], -r.dPdy * 1e-4, 'per 100 face per bp of yield');
        formula = `DV01 = -dP/dy x 0.0001 ${at}`;
        unit = 'per 100 face per bp of yield';
      }
      break;
    }
    case 'zSpread': {
      const m = market!;
      curvePrice();
      marketDirty();
      const names: string[] = [];
      let p = 0;
      flows.forEach((fl, i) => {
        names.push(`pv${i + 1}`, `t${i + 1}`);
        p += fl.amount * Math.exp(lns[i]!) * Math.exp(-m.zSpread * fl.t);
      });
      step('z', 'z solves dirty_mkt = sum_i pv_i x exp(-z t_i) (Newton from 0, safeguarded by bisection)', ['dirty_mkt', ...names], m.zSpread, `decimal per year, continuous on ${curve.dayCount}`);
      step('P(z)', 'P(z) = sum_i pv_i x exp(-z t_i), added in order (reprices dirty_mkt)', ['z', ...names], p, PRICE_UNIT);
      step('z-spread', 'z-spread = z x 10,000', ['z'], m.zSpread * 1e4, `${BP_UNIT}, continuous on ${curve.dayCount}`);
      formula = `z such that dirty_mkt = sum_i CF_i x DF(c_i) x exp(-z t_i), t_i years on ${curve.dayCount} (a constant added to the continuously compounded zero rates); ${cfDef}; shown in bp`;
      unit = `${BP_UNIT}, continuous on ${curve.dayCount}`;
      break;
    }
  }
  return ok({
    quantity: 'bond-figure',
    formula,
    value: steps.at(-1)!.value,
    unit,
    conventions: {
      compounding: figure === 'zSpread' ? 'continuous' : (COMPOUNDING_OF[f] ?? null),
      dayCount: figure === 'zSpread' ? null : bond.dayCount,
      frequency: f,
      curveDayCount: curve.dayCount,
      interpolation: curve.interpolation,
      extrapolation: curve.extrapolation,
      businessDay: 'unadjusted',
      calendar: 'none',
    },
    dates,
    yearFractions: yfs,
    reads,
    steps,
  });
}

/**
 * How a figure moves with ln DF at the flows' times, for the quotes it depends on most
 * (topInfluencesOfLn): `weights[i]` = d(figure)/d lnDF(t_i) in the unit the influences are read
 * in, and what they are of. Null when the figure does not read the curve (accrued interest, a
 * market figure other than the z-spread).
 *   model price:   d dirty / d lnDF_i = pv_i, times 0.0001 (per 100 face per bp of a quote);
 *   model yield:   dy / d lnDF_i = pv_i / (-dP/dy) (the yield-based risk figures move with it);
 *   z-spread:      dz / d lnDF_i = pv_i e^(-z t_i) / sum_j t_j pv_j e^(-z t_j).
 */
export function bondLnWeights(trace: BondTrace, figure: BondFigure, side: BondSide): { times: number[]; weights: number[]; note: string } | null {
  const { flows, lns, schedule: s } = trace;
  const times = flows.map((f) => f.t);
  const pv = flows.map((f, i) => f.amount * Math.exp(lns[i]!));
  if (figure === 'accrued') return null;
  if (side === 'market') {
    const m = trace.market;
    if (figure !== 'zSpread' || !m) return null;
    const e = pv.map((v, i) => v * Math.exp(-m.zSpread * times[i]!));
    let sum = 0;
    e.forEach((v, i) => (sum += times[i]! * v));
    return { times, weights: e.map((v) => v / sum), note: 'bp of z-spread per bp of the quote, the market price held' };
  }
  if (figure === 'clean' || figure === 'dirty') return { times, weights: pv.map((v) => v * 1e-4), note: `of the ${figure} price: per 100 face per bp of the quote, not bp per bp` };
  const dPdy = bondDirtyFromYield(s, trace.yield).dPdy;
  return { times, weights: pv.map((v) => v / -dPdy), note: figure === 'yield' ? 'bp of yield per bp of the quote' : 'of the yield to maturity the figure is computed at' };
}
