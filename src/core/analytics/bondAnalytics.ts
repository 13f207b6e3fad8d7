import type { Curve } from '../curve/curve.ts';
import { bondDirtyFromYield, bondSchedule, bondYieldFromDirty, type BondSchedule } from '../instruments/bond.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { checkBondInput, type BondInput, type CheckedBond } from './bondInput.ts';
import { DEFAULT_KEY_TENORS, KEY_RATE_BUMP_BP, keyRateDurations, keyTimes, shiftDuration, type CentralDifference, type Flow } from './keyRates.ts';
import { zSpread } from './zSpread.ts';
import type { BondSink } from './explainBond.ts';

/** Yield-based risk figures of a bond at one ICMA yield. */
export interface YieldRisk {
  /** ICMA yield, decimal per year, compounded `frequency` times a year. */
  readonly yield: number;
  /** Modified duration -(1/P_dirty) dP_dirty/dy, years. */
  readonly modifiedDuration: number;
  /** Macaulay duration (1 + y/f) x modified duration, years. */
  readonly macaulayDuration: number;
  /** Convexity (1/P_dirty) d2P_dirty/dy2, years squared (not halved or scaled). */
  readonly convexity: number;
  /** DV01 = -dP_dirty/dy x 1e-4, price per 100 face per bp of yield; positive for a long bond. */
  readonly dv01: number;
}

export interface KeyRateDuration {
  readonly tenor: string;
  /** Key time on the curve's axis, years. */
  readonly t: number;
  /** -(1/P) dP/dh for the tent at this key, years. */
  readonly duration: number;
}

export interface MarketAnalytics extends YieldRisk {
  /** Which market figure was given. */
  readonly given: 'price' | 'yield';
  readonly cleanPrice: number;
  readonly dirtyPrice: number;
  /** Zero-volatility spread over the curve, decimal per year, continuously compounded on the curve's axis. */
  readonly zSpread: number;
}

export interface BondAnalytics extends YieldRisk {
  readonly bond: CheckedBond;
  /** Model prices on the curve, per 100 face. */
  readonly modelCleanPrice: number;
  readonly modelDirtyPrice: number;
  /** Accrued interest per 100 face at settlement. */
  readonly accrued: number;
  /** Duration under a parallel shift of the continuously compounded zero curve, years (shiftDuration). */
  readonly effectiveDuration: number;
  readonly keyRateDurations: readonly KeyRateDuration[];
  /** The key-rate bump in bp of the continuously compounded zero (central, see shiftDuration). */
  readonly keyRateBumpBp: number;
  readonly market: MarketAnalytics | null;
  readonly schedule: BondSchedule;
  readonly flows: readonly Flow[];
}

/** Yield-based figures at ICMA yield y: bondDirtyFromYield's price and derivatives. */
export function yieldRisk(s: BondSchedule, y: number): YieldRisk {
  const { price, dPdy, d2Pdy2 } = bondDirtyFromYield(s, y);
  const modifiedDuration = -dPdy / price;
  return {
    yield: y,
    modifiedDuration,
    macaulayDuration: (1 + y / s.frequency) * modifiedDuration,
    convexity: d2Pdy2 / price,
    dv01: -dPdy * 1e-4,
  };
}

/** The bond's cash flows after settlement on the curve's axis, per 100 face. */
export function bondFlows(curve: Curve, s: BondSchedule): Flow[] {
  return s.dates.map((d, i) => ({ t: curve.time(d), amount: s.amounts[i]! }));
}

/**
 * Analytics of a bond off a curve: model prices (sum CF DF(t), t on the curve's axis), the yield
 * and yield-based risk at the model price, effective and key-rate durations (tent shifts of the
 * continuously compounded zero at `keys`, default DEFAULT_KEY_TENORS), and, when a market clean
 * price or yield is given, the same risk at the market yield and the z-spread. With a `sink`
 * (explainBond.ts) it also hands over its own values (the ln DF of each flow, the prices, the
 * yields) for the figures' explanations; without one nothing is recorded. Errors (never
 * throws): the bond's own fields; a cash flow beyond the curve without flat-forward extrapolation.
 */
export function analyzeBond(curve: Curve, input: BondInput, keys: readonly string[] = DEFAULT_KEY_TENORS, path = 'bond', sink?: BondSink): Result<BondAnalytics> {
  const checked = checkBondInput(input, curve.settlement, path);
  if (!checked.ok) return checked;
  const bond = checked.value;
  const s = bondSchedule(bond, curve.settlement);
  const flows = bondFlows(curve, s);
  const lastT = flows[flows.length - 1]!.t;
  if (lastT > curve.lastT && curve.extrapolation === 'none') {
    const last = curve.pillars[curve.pillars.length - 1];
    return fail(
      coreError('beyond-curve', `${path}.maturity`, `${path}: its last cash flow (${bond.maturity}) is beyond the curve's last pillar ${last?.date ?? curve.settlement}; choose a shorter bond or extrapolation flat-forward`),
    );
  }
  const ln = curve.lnDiscountAt;
  let dirty = 0;
  const lns: number[] = [];
  for (const f of flows) {
    const l = ln(f.t);
    if (sink) lns.push(l);
    dirty += f.amount * Math.exp(l);
  }
  const y = bondYieldFromDirty(s, dirty);
  if (y === null) return fail(coreError('no-solution', path, `${path}: no yield reprices the model dirty price ${dirty}; check the curve`));
  const kt = keyTimes(curve, keys);
  const keyShifts: CentralDifference[][] | undefined = sink && [];
  const parallel: CentralDifference[] | undefined = sink && [];
  const krd = keyRateDurations(flows, ln, kt, keyShifts);
  const effectiveDuration = shiftDuration(flows, ln, () => 1, parallel);
  let market: MarketAnalytics | null = null;
  if (bond.cleanPrice !== null || bond.yield !== null) {
    const given = bond.cleanPrice !== null ? 'price' : 'yield';
    const my = given === 'price' ? bondYieldFromDirty(s, bond.cleanPrice! + s.accrued) : bond.yield!;
    if (my === null) return fail(coreError('no-solution', `${path}.price`, `${path}.price ${bond.cleanPrice}: no yield above -${bond.frequency} reprices it; check the price`));
    const marketDirty = given === 'price' ? bond.cleanPrice! + s.accrued : bondDirtyFromYield(s, my).price;
    const z = zSpread(flows, ln, marketDirty);
    if (z === null) return fail(coreError('no-solution', path, `${path}: no z-spread between -100% and 100% reprices the market dirty price ${marketDirty}; check the market figure`));
    market = { given, cleanPrice: marketDirty - s.accrued, dirtyPrice: marketDirty, zSpread: z, ...yieldRisk(s, my) };
  }
  // The explanation's material: this function's own values (explainBond.ts builds the steps from them).
  if (sink) sink.trace = { curve, bond, schedule: s, flows, lns, dirty, yield: y, market: market && { given: market.given, yield: market.yield, dirty: market.dirtyPrice, zSpread: market.zSpread }, keys, keyTimes: kt, shifts: { parallel: parallel!, keys: keyShifts! } };
  return ok({
    bond,
    modelCleanPrice: dirty - s.accrued,
    modelDirtyPrice: dirty,
    accrued: s.accrued,
    ...yieldRisk(s, y),
    effectiveDuration,
    keyRateDurations: keys.map((tenor, k) => ({ tenor, t: kt[k]!, duration: krd[k]! })),
    keyRateBumpBp: KEY_RATE_BUMP_BP,
    market,
    schedule: s,
    flows,
  });
}
