import type { Curve } from '../curve/curve.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { ProjectedSwap } from '../instruments/projectedSwap.ts';
import { spotGapOf } from '../bootstrap/spotBridge.ts';
import { luFactor, luInverse } from '../numeric/luDecomposition.ts';
import type { Compounding } from '../rates/compounding.ts';
import { coreError, fail, ok, type Result } from '../result.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount } from '../time/dayCount.ts';
import type { QuoteInfluence } from './explainRisk.ts';
import { dRateDLn, quoteNodeJacobian } from './forwardSensitivity.ts';
import { nodePartials } from './nodePartials.ts';

/** One built curve of a document, by name, with the instruments it was bootstrapped from. */
export interface CurveWithQuotes {
  readonly name: string;
  readonly curve: Curve;
  /** A build's `instruments`: one per pillar, in pillar order. */
  readonly instruments: readonly Instrument[];
}

/**
 * The time of a build's spot bridge (bootstrap/spotBridge.ts), found again from its instruments
 * as the bootstrap finds it: a node of the interpolation tied to the first pillar's, which the
 * node partials must move with it (under a global method the curve differs without it).
 */
const bridgeOf = (c: CurveWithQuotes): number | undefined => spotGapOf(c.curve.settlement, c.curve.dayCount, c.instruments)?.t;

/** d(nodes of one curve) / d(quotes of one curve it depends on, itself included). */
export interface NodeQuoteBlock {
  /** The curve whose quotes these are. */
  readonly curve: string;
  readonly instruments: readonly Instrument[];
  /** Each quote's own-yield label (quoteYield.ts), in the instruments' order. */
  readonly yieldLabels: readonly string[];
  /** d x_j / d q_k, x_j = ln DF at the target curve's pillar j, q_k quote k's own yield; row-major (pillars x quotes). */
  readonly values: Float64Array;
}

/** A quote a number on a named curve depends on: the curve it belongs to, and how much. */
export interface CurveQuoteInfluence extends QuoteInfluence {
  /** The name of the curve the quote belongs to (`default` for the document's top-level curve). */
  readonly curve: string;
}

interface Memo {
  readonly blocks: Map<string, Map<string, Float64Array>>;
  readonly labels: Map<string, readonly string[]>;
  readonly visiting: Set<string>;
}

/**
 * The nodes of curve `name` differentiated with respect to every quote of every curve it depends
 * on, by the implicit-function rule through the build order. Curve c's nodes x_c solve its quotes'
 * pricing equations G_i(q_i, x_c, x_v) = 0, where x_v are the nodes of the curves c's constants
 * were read from (a term-index swap's discounting factors, a basis swap's other leg: each
 * `ProjectedSwap.upstreamSlopes`). With J = dq/dx_c (quoteNodeJacobian) and
 * E_ik = -(dG_i/dx_v,k) / (dG_i/dq_i), holding c's own quotes fixed:
 *   dx_c/dq_c = J^-1,   dx_c/dx_v = -J^-1 E,   dx_c/dq_u = sum over v of (dx_c/dx_v)(dx_v/dq_u),
 * summed over every path from c back to u (a three-month curve reads the discounting curve both
 * directly and through its six-month curve). dG/dx_v is the slope at each date read, chained
 * through the interpolation of curve v (nodePartials). Analytic but for the node partials of
 * monotone convex and the pricing slope dG/dq, as quoteNodeJacobian. `curves` holds every curve
 * the target reads (a missing or circular one is an error naming it); blocks in the order of
 * `curves`, the target's own first. Cost per curve: one n x n LU and the node partials at the
 * dates read.
 */
export function nodeSensitivitiesAcrossCurves(curves: readonly CurveWithQuotes[], name: string): Result<NodeQuoteBlock[]> {
  const byName = new Map(curves.map((c) => [c.name, c]));
  const memo: Memo = { blocks: new Map(), labels: new Map(), visiting: new Set() };
  const r = blocksOf(name, byName, memo);
  if (!r.ok) return r;
  const order = [name, ...curves.map((c) => c.name).filter((n) => n !== name)];
  return ok(order.flatMap((u) => {
    const values = r.value.get(u);
    return values === undefined ? [] : [{ curve: u, instruments: byName.get(u)!.instruments, yieldLabels: memo.labels.get(u)!, values }];
  }));
}

function blocksOf(name: string, byName: ReadonlyMap<string, CurveWithQuotes>, memo: Memo): Result<Map<string, Float64Array>> {
  const done = memo.blocks.get(name);
  if (done) return ok(done);
  const c = byName.get(name);
  if (!c) return fail(coreError('schema', 'curves', `the curve "${name}" is read by another curve but was not given (did it build?); pass every curve the number depends on`));
  if (memo.visiting.has(name)) return fail(coreError('schema', 'curves', `the curve "${name}" depends on itself through the curves it reads; break the circle`));
  const n = c.instruments.length;
  if (n !== c.curve.pillars.length) {
    return fail(coreError('schema', 'quotes', `the curve "${name}" has ${c.curve.pillars.length} pillars but ${n} quotes were given; pass the quotes it was built from`));
  }
  memo.visiting.add(name);
  // The slopes of each quote's pricing equation in the ln DF of the curves it read, grouped by curve.
  const reads = new Map<string, { times: number[]; slopes: number[]; rows: number[] }>();
  const ln = c.curve.lnDiscountAt;
  c.instruments.forEach((ins, i) => {
    if (!(ins instanceof ProjectedSwap)) return;
    for (const s of ins.upstreamSlopes(Array.from(ins.times, ln), 0)) {
      let r = reads.get(s.curve);
      if (!r) reads.set(s.curve, (r = { times: [], slopes: [], rows: [] }));
      r.times.push(s.t), r.slopes.push(s.slope), r.rows.push(i);
    }
  });
  const { jacobian, yields, pricingSlopes } = quoteNodeJacobian(c.curve, c.instruments);
  const lu = luFactor(jacobian, n);
  if (!lu) return fail(coreError('no-solution', 'quotes', `the quotes of the curve "${name}" do not determine its nodes one to one (a singular Jacobian); check for quotes that repeat the same information`));
  const inv = luInverse(lu);
  const out = new Map<string, Float64Array>([[name, inv]]);
  for (const [v, r] of reads) {
    const up = blocksOf(v, byName, memo);
    if (!up.ok) return up;
    const vc = byName.get(v)!;
    const nv = vc.curve.pillars.length;
    const partials = nodePartials(vc.curve, r.times, bridgeOf(vc));
    // E (n x nv): each quote's slope in the other curve's nodes over its own pricing slope, negated.
    const e = new Float64Array(n * nv);
    r.times.forEach((_, k) => {
      const i = r.rows[k]!;
      const w = -r.slopes[k]! / pricingSlopes[i]!;
      for (let l = 0; l < nv; l++) e[i * nv + l] = e[i * nv + l]! + w * partials[k * nv + l]!;
    });
    // dx_c/dx_v = -J^-1 E (n x nv).
    const dxdv = new Float64Array(n * nv);
    for (let j = 0; j < n; j++) {
      for (let i = 0; i < n; i++) {
        const a = inv[j * n + i]!;
        if (a === 0) continue;
        for (let l = 0; l < nv; l++) dxdv[j * nv + l] = dxdv[j * nv + l]! - a * e[i * nv + l]!;
      }
    }
    for (const [u, block] of up.value) {
      const m = block.length / nv;
      const acc = out.get(u) ?? new Float64Array(n * m);
      for (let j = 0; j < n; j++) {
        for (let l = 0; l < nv; l++) {
          const a = dxdv[j * nv + l]!;
          if (a === 0) continue;
          for (let k = 0; k < m; k++) acc[j * m + k] = acc[j * m + k]! + a * block[l * m + k]!;
        }
      }
      out.set(u, acc);
    }
  }
  memo.visiting.delete(name);
  memo.blocks.set(name, out);
  memo.labels.set(name, yields.map((y) => y.label));
  return ok(out);
}

/**
 * Sensitivity of a forward over [start, end] on curve `name` (a zero rate when start is its
 * settlement), in compounding c and day count dc, to every quote of every curve it depends on:
 * bp of the rate per bp of the quote's own yield, from `nodeSensitivitiesAcrossCurves` (a
 * discounting quote moves a projection forward through the projection curve's swaps). Curves in
 * the order of `nodeSensitivitiesAcrossCurves` (the target's own first), quotes in pillar order.
 * An empty list for an empty period.
 */
export function forwardInfluencesAcrossCurves(
  curves: readonly CurveWithQuotes[],
  name: string,
  start: IsoDate,
  end: IsoDate,
  c: Compounding,
  dc: CurveDayCount,
): Result<CurveQuoteInfluence[]> {
  if (compareIso(end, start) <= 0) return ok([]);
  const target = curves.find((x) => x.name === name);
  if (!target) return fail(coreError('schema', 'curves', `no curve is named "${name}"; use one of ${curves.map((x) => `"${x.name}"`).join(', ')}`));
  const tau = queryYearFraction(dc, start, end);
  if (!(tau > 0)) return fail(coreError('empty-period', 'end', `${start} to ${end} is an empty period on ${dc}; choose a later end`));
  const blocks = nodeSensitivitiesAcrossCurves(curves, name);
  if (!blocks.ok) return blocks;
  const curve = target.curve;
  const tS = curve.time(start);
  const tE = curve.time(end);
  const n = curve.pillars.length;
  const partials = nodePartials(curve, [tS, tE], bridgeOf(target));
  const L = curve.lnDiscountAt(tE) - (tS > 0 ? curve.lnDiscountAt(tS) : 0);
  const d = dRateDLn(L, c, tau);
  const g = Float64Array.from({ length: n }, (_, j) => d * (partials[n + j]! - partials[j]!));
  return ok(
    blocks.value.flatMap((b) => {
      const m = b.instruments.length;
      return b.instruments.map((ins, k) => {
        let v = 0;
        for (let j = 0; j < n; j++) v += g[j]! * b.values[j * m + k]!;
        return { curve: b.curve, index: ins.index, kind: ins.kind, maturity: ins.maturity, yieldLabel: b.yieldLabels[k]!, bpPerBp: v };
      });
    }),
  );
}

/**
 * The `count` quotes, of any curve, a forward or zero on curve `name` depends on most, largest
 * |bp per bp| first (ties: curve order as given, then document order). See
 * `forwardInfluencesAcrossCurves`.
 */
export function topQuoteInfluencesAcrossCurves(
  curves: readonly CurveWithQuotes[],
  name: string,
  start: IsoDate,
  end: IsoDate,
  c: Compounding,
  dc: CurveDayCount,
  count = 5,
): Result<CurveQuoteInfluence[]> {
  const all = forwardInfluencesAcrossCurves(curves, name, start, end, c, dc);
  if (!all.ok) return all;
  const rank = new Map(curves.map((x, i) => [x.name, i]));
  const sorted = [...all.value].sort((a, b) => Math.abs(b.bpPerBp) - Math.abs(a.bpPerBp) || rank.get(a.curve)! - rank.get(b.curve)! || a.index - b.index);
  return ok(sorted.slice(0, count));
}
