import type { Curve } from '../curve/curve.ts';
import {
  explainedConventions,
  explainedYearFraction,
  explainRead,
  type ExplainedDate,
  type ExplainedRead,
  type ExplainedStep,
  type ExplainedYearFraction,
  type Explanation,
} from '../curve/explain.ts';
import { couponTag } from '../format/conventionTag.ts';
import { bondDirtyFromYield, bondYearFraction, type BondSchedule } from '../instruments/bond.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { civilFromIso, type IsoDate } from '../time/date.ts';
import { marketDate } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import { yieldRisk, type BondAnalytics } from './bondAnalytics.ts';
import type { CheckedBond } from './bondInput.ts';
import { tentWeight, type CentralDifference, type Flow } from './keyRates.ts';
import { compoundingOfFrequency } from '../kinds/shared.ts';

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
  /** The key-rate grid (tenors) and its times on the curve's axis. */
  readonly keys: readonly string[];
  readonly keyTimes: readonly number[];
  /** shiftDuration's central differences (at h/2, then h): the parallel shift's, and each key's tent. */
  readonly shifts: { readonly parallel: readonly CentralDifference[]; readonly keys: readonly (readonly CentralDifference[])[] };
}

/** Handed to analyzeBond to receive its trace. */
export interface BondSink {
  trace?: BondTrace;
}

export const BOND_FIGURES = ['clean', 'dirty', 'accrued', 'yield', 'modifiedDuration', 'macaulayDuration', 'convexity', 'dv01', 'zSpread'] as const;
/** A figure of the bond table. */
export type BondFigure = (typeof BOND_FIGURES)[number];
/** The curve-shift durations of the bond table (on the curve only): the parallel shift's, and a key's tent. */
export type ShiftFigure = 'effectiveDuration' | 'keyRateDuration';
/** The table's column: on the curve, or at the market quote. */
export type BondSide = 'model' | 'market';

/** The figures' names, in BOND_FIGURES' order. */
export const BOND_FIGURE_WORDS = Object.fromEntries(
  BOND_FIGURES.map((k, i) => [k, ['clean price', 'dirty price', 'accrued interest', 'yield to maturity', 'modified duration', 'Macaulay duration', 'convexity', 'DV01', 'z-spread'][i]!]),
) as Readonly<Record<BondFigure, string>>;

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

const PRICE = 'per 100 face';
const esc = (x: string): string => x.replace(/[()/+.*]/g, '\\$&');

/**
 * The explanation of one figure of the bond table, from analyzeBond's trace. A shift duration
 * (`effectiveDuration`, or `keyRateDuration` of key number `key`) is shiftDuration's own central
 * differences: the bumped prices at +-h and +-h/2, each difference quotient, and their Richardson
 * combination (4 D(h/2) - D(h)) / 3, which is how analyzeBond computes it.
 */
export function explainBondFigure(trace: BondTrace, figure: BondFigure | ShiftFigure, side: BondSide, key = 0): Result<Explanation> {
  const { curve, bond, schedule: s, flows, lns } = trace;
  const m = trace.market;
  const mkt = side === 'market' && figure !== 'accrued';
  if (mkt ? !m : figure === 'zSpread') return fail(coreError('schema', 'bond.price', 'no market price or yield given'));
  const f = bond.frequency;
  const n = flows.length;
  const dc = bond.dayCount;
  const yUnit = `decimal per year, ${couponTag(f, `ICMA, accrual ${dc}`)}`;
  const dates: ExplainedDate[] = [];
  const yfs: ExplainedYearFraction[] = [];
  const reads: ExplainedRead[] = [];
  const steps: ExplainedStep[] = [];
  const have = new Set<string>();
  /** A step; its inputs are the known names its formula's right side mentions unless given. */
  const step = (name: string, formula: string, value: number, unit = PRICE, inputs?: string[]): void => {
    if (have.has(name)) return;
    const rhs = formula.slice(formula.indexOf('=') + 1);
    inputs ??= [...have].filter((k) => new RegExp(`(^|[^\\w(])${esc(k)}(?![\\w(])`).test(rhs));
    have.add(name);
    steps.push({ name, formula: `${name} = ${formula}`, inputs, value, unit });
  };
  const date = (name: string, d: IsoDate): number => dates.push({ name, given: d, unadjusted: d, adjusted: d, rule: 'unadjusted, no calendar' });
  date('settlement', curve.settlement);
  date('previous coupon', s.previous);
  s.dates.forEach((d, i) => date(`c${i + 1}`, d));
  // The bond's year fractions by bondScheduleCivil's rule (ICMA's reference period: the coupon period).
  const civil = civilFromIso;
  const yf = bondYearFraction(bond, civil(s.previous), civil(s.dates[0]!), civil(bond.maturity));
  const bondYf = (name: string, a: IsoDate, b: IsoDate): void => {
    if (have.has(name)) return;
    have.add(name);
    yfs.push(explainedYearFraction(name, dc, a, b, yf(civil(a), civil(b))));
  };
  const cf = (i: number): string => (i < n - 1 ? 'CF' : 'CF_N');
  const terms = (): void => {
    step('c', 'the coupon, given', bond.coupon, 'decimal per year');
    if (n > 1) step('CF', `100 x c / ${f}`, s.amounts[0]!);
    step('CF_N', n > 1 ? 'CF + 100' : `100 x c / ${f} + 100`, s.amounts[n - 1]!);
  };
  const accrued = (): void => {
    terms();
    bondYf('tau_acc', s.previous, curve.settlement);
    step('accrued', '100 x c x tau_acc', s.accrued);
  };
  const terms_ = (x: string): string[] => Array.from({ length: n }, (_, i) => `${x}${i + 1}`);
  const sum = (x: string): string => (n < 4 ? terms_(x).join(' + ') : `${x}1 + ${x}2 + ... + ${x}${n}`);
  /** The model dirty price: each flow times its DF read off the curve, added in order. */
  const curvePrice = (): void => {
    terms();
    flows.forEach((fl, i) => {
      const k = i + 1;
      yfs.push(explainedYearFraction(`t${k}`, curve.dayCount, curve.settlement, s.dates[i]!, fl.t));
      reads.push(explainRead(curve, `DF(c${k})`, s.dates[i]!, fl.t, lns[i]!));
      step(`pv${k}`, `${cf(i)} x DF(c${k})`, fl.amount * Math.exp(lns[i]!));
    });
    step('dirty', sum('pv'), trace.dirty, PRICE, terms_('pv'));
  };
  /** The price at yield `y` term by term and its derivatives, by bondDirtyFromYield (analyzeBond's own). */
  const atYield = (y: string, yv: number): ReturnType<typeof bondDirtyFromYield> => {
    bondYf('tau_next', curve.settlement, s.dates[0]!);
    bondYf('tau_period', s.previous, s.dates[0]!);
    step('w', 'tau_next / tau_period', s.w, 'unitless');
    const pvs: number[] = [];
    const r = bondDirtyFromYield(s, yv, pvs);
    step('lnV', `-log1p(${y} / ${f})`, -Math.log1p(yv / f), 'unitless');
    pvs.forEach((pv, i) => step(`q${i + 1}`, `${cf(i)} x exp((w + ${i}) x lnV)`, pv));
    step('P', sum('q'), r.price, PRICE, terms_('q'));
    return r;
  };
  /** The market dirty price, from the quoted clean price or the quoted yield. */
  const marketDirty = (): void => {
    if (m!.given === 'price') {
      accrued();
      step('quoted clean', 'given', bond.cleanPrice!);
      step('dirty_mkt', 'quoted clean + accrued', m!.dirty);
    } else {
      terms();
      step('y_mkt', 'given', m!.yield, yUnit);
      atYield('y_mkt', m!.yield);
      step('dirty_mkt', 'P', m!.dirty);
    }
  };
  const ICMA = `P(y) = sum_k CF_k (1 + y/${f})^-(w + k), k = 0..N-1 (ICMA, on ${dc})`;
  const CURVE = `dirty = sum_i CF_i DF(c_i), t_i on ${curve.dayCount}; CF = 100 c / ${f}, CF_N = CF + 100`;
  if (figure === 'accrued') accrued();
  else if (figure === 'zSpread') {
    curvePrice();
    marketDirty();
    const z = m!.zSpread;
    let p = 0;
    flows.forEach((fl, i) => (p += fl.amount * Math.exp(lns[i]!) * Math.exp(-z * fl.t)));
    const pvt = [...terms_('pv'), ...terms_('t')];
    step('z', 'the root of sum_i pv_i exp(-z t_i) = dirty_mkt (Newton)', z, `decimal per year, continuous on ${curve.dayCount}`, ['dirty_mkt', ...pvt]);
    step('P(z)', 'sum_i pv_i exp(-z t_i)', p, PRICE, ['z', ...pvt]);
    step('z-spread', 'z x 10,000', z * 1e4, `bp, continuous on ${curve.dayCount}`);
  } else if (figure === 'dirty' || figure === 'clean') {
    const d = mkt ? 'dirty_mkt' : 'dirty';
    if (mkt) marketDirty();
    else curvePrice();
    if (figure === 'clean') {
      accrued();
      step(mkt ? 'clean_mkt' : 'clean', `${d} - accrued`, (mkt ? m!.dirty : trace.dirty) - s.accrued);
    }
  } else if (figure === 'effectiveDuration' || figure === 'keyRateDuration') {
    curvePrice();
    const kt = trace.keyTimes;
    const tent = figure === 'keyRateDuration';
    const [half, full] = tent ? trace.shifts.keys[key]! : trace.shifts.parallel;
    const pvt = [...terms_('pv'), ...terms_('t')];
    let w = '';
    if (tent) {
      // The key and its neighbours, on the curve's clock: the tent is 1 at the key and 0 at each neighbour.
      const around: string[] = [];
      for (const j of [key - 1, key, key + 1]) {
        const tenor = trace.keys[j];
        if (tenor === undefined) continue;
        around.push(`T_${tenor}`);
        yfs.push(explainedYearFraction(`T_${tenor}`, curve.dayCount, curve.settlement, marketDate(curve.settlement, parseTenor(tenor)!), kt[j]!));
      }
      const k = trace.keys[key]!;
      const edge = key === 0 ? ', 1 before it' : key === kt.length - 1 ? ', 1 after it' : '';
      flows.forEach((fl, i) => step(`w${i + 1}`, `tent of ${k} at t${i + 1} (1 at T_${k}, straight to 0 at the neighbouring keys${edge})`, tentWeight(kt, key, fl.t), 'unitless', [`t${i + 1}`, ...around]));
      pvt.push(...terms_('w'));
      w = 'w_i ';
    }
    const zUnit = `decimal per year, continuous on ${curve.dayCount}`;
    step('h', '1 bp of the zero = 0.0001', full!.step, zUnit, []);
    step('h/2', 'h / 2', half!.step, zUnit, ['h']);
    for (const [c, x] of [[full!, 'h'], [half!, 'h/2']] as const) {
      step(`P+(${x})`, `sum_i pv_i exp(-${x} ${w}t_i)`, c.up, PRICE, [...pvt, x]);
      step(`P-(${x})`, `sum_i pv_i exp(+${x} ${w}t_i)`, c.down, PRICE, [...pvt, x]);
      step(`D(${x})`, `-(P+(${x}) - P-(${x})) / (2 ${x} dirty)`, c.duration, 'years', [`P+(${x})`, `P-(${x})`, x, 'dirty']);
    }
    step(tent ? `KRD ${trace.keys[key]}` : 'effective', '(4 D(h/2) - D(h)) / 3', (4 * half!.duration - full!.duration) / 3, 'years', ['D(h/2)', 'D(h)']);
  } else {
    // At the model yield (solved from the curve's price) or the market's (given, or solved from its price).
    let y = 'y';
    const yv = mkt ? m!.yield : trace.yield;
    if (!mkt) curvePrice();
    else if (m!.given === 'price') marketDirty();
    else {
      terms();
      step((y = 'y_mkt'), 'given', yv, yUnit);
    }
    if (y === 'y') {
      const target = mkt ? 'dirty_mkt' : 'dirty';
      step('y', `the root of P(y) = ${target} (Newton)`, yv, yUnit, [target, 'c']);
    }
    const r = atYield(y, yv);
    // The figures themselves are the table's: yieldRisk at this yield (the steps show its terms).
    const risk = yieldRisk(s, yv);
    const q = [...terms_('q'), 'w', y];
    if (figure === 'yield') step('yield', y, yv, yUnit, y === 'y' ? ['y', 'P'] : [y]);
    else if (figure === 'convexity') {
      step('d2P/dy2', `sum_k ((w + k)(w + k + 1) / ${f}^2) q_k / (1 + ${y} / ${f})^2`, r.d2Pdy2, 'per 100 face per unit of yield^2', q);
      step('convexity', '(d2P/dy2) / P', risk.convexity, 'years squared');
    } else {
      step('dP/dy', `-sum_k ((w + k) / ${f}) q_k / (1 + ${y} / ${f})`, r.dPdy, 'per 100 face per unit of yield', q);
      if (figure === 'dv01') step('DV01', '-(dP/dy) x 0.0001', risk.dv01, 'per 100 face per bp of yield');
      else step('modified', '-(dP/dy) / P', risk.modifiedDuration, 'years');
      if (figure === 'macaulayDuration') step('macaulay', `(1 + ${y} / ${f}) x modified`, risk.macaulayDuration, 'years');
    }
  }
  // The definition: the figure's own step, then what it stands on.
  const last = steps.at(-1)!;
  const defs = [last.formula];
  if (have.has('h')) defs.push(`D(s) = -(P+(s) - P-(s)) / (2 s dirty), P+-(s) = sum_i pv_i exp(-+s w(t_i) t_i): the continuously compounded zero on ${curve.dayCount} moved by +-s w(t), w ${figure === 'keyRateDuration' ? 'the key\'s tent' : '= 1 (parallel)'}`);
  if (have.has('z')) defs.push('dirty_mkt = sum_i CF_i DF(c_i) exp(-z t_i)');
  if (reads.length > 0) defs.push(CURVE);
  if (have.has('P')) defs.push(ICMA);
  if (have.has('accrued')) defs.push(`accrued = 100 c tau_acc on ${dc}`);
  return ok({
    quantity: 'bond-figure',
    formula: defs.join('; '),
    value: last.value,
    unit: last.unit,
    conventions: have.has('h') ? explainedConventions(curve, 'continuous', curve.dayCount) : explainedConventions(curve, figure === 'zSpread' ? 'continuous' : compoundingOfFrequency(f), figure === 'zSpread' ? null : dc, f),
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
export function bondLnWeights(trace: BondTrace, figure: BondFigure | ShiftFigure, side: BondSide, key = 0): { times: number[]; weights: number[]; note: string } | null {
  const { flows, lns, schedule: s } = trace;
  const times = flows.map((f) => f.t);
  const pv = flows.map((f, i) => f.amount * Math.exp(lns[i]!));
  if (figure === 'accrued') return null;
  if (figure === 'effectiveDuration' || figure === 'keyRateDuration') {
    // D = sum_i t_i w_i pv_i / P to first order in the shift, so dD/dlnDF_i = pv_i (t_i w_i - D) / P.
    const w = times.map((t) => (figure === 'effectiveDuration' ? 1 : tentWeight(trace.keyTimes, key, t)));
    let d = 0;
    pv.forEach((v, i) => (d += (times[i]! * w[i]! * v) / trace.dirty));
    return { times, weights: pv.map((v, i) => ((v * (times[i]! * w[i]! - d)) / trace.dirty) * 1e-4), note: 'years of duration per bp of the quote' };
  }
  if (side === 'market') {
    const m = trace.market;
    if (figure !== 'zSpread' || !m) return null;
    const e = pv.map((v, i) => v * Math.exp(-m.zSpread * times[i]!));
    let sum = 0;
    e.forEach((v, i) => (sum += times[i]! * v));
    return { times, weights: e.map((v) => v / sum), note: 'market price held' };
  }
  if (figure === 'clean' || figure === 'dirty') return { times, weights: pv.map((v) => v * 1e-4), note: `${figure} price per 100 face per bp` };
  const dPdy = bondDirtyFromYield(s, trace.yield).dPdy;
  return { times, weights: pv.map((v) => v / -dPdy), note: figure === 'yield' ? 'of the yield' : 'of the yield it is computed at' };
}
