import { coreError, fail, ok, type CoreError, type Result } from '../result.ts';
import { compareIso, type IsoDate } from '../time/date.ts';
import { curveTime, type CurveDayCount } from '../time/dayCount.ts';
import { resolveMarketDate } from '../time/dateConventions.ts';

/**
 * A scenario's shape: a shift Delta(t) in basis points (1 bp = 0.0001 in decimal rate) given at
 * maturities (tenors such as "2Y" counted from settlement, or dates YYYY-MM-DD), linear in t on
 * the curve's time axis between them and flat outside.
 */
export type ScenarioShape =
  /** Delta(t) = bp for every t. */
  | { readonly kind: 'parallel'; readonly bp: number }
  /**
   * Steepener (bp > 0) or flattener (bp < 0): short S, long L, pivot P, spread change s = bp:
   *   Delta(S) = -s (P - S)/(L - S),  Delta(L) = s (L - P)/(L - S),
   * so Delta(L) - Delta(S) = s and Delta(P) = 0 (P between S and L, times in years).
   */
  | { readonly kind: 'twist'; readonly short: string; readonly pivot: string; readonly long: string; readonly bp: number }
  /** Butterfly: the wings S and L move by wingsBp, the belly B by bellyBp. */
  | { readonly kind: 'butterfly'; readonly short: string; readonly belly: string; readonly long: string; readonly wingsBp: number; readonly bellyBp: number }
  /** Key-rate bumps: bp at chosen maturities. */
  | { readonly kind: 'key-rate'; readonly points: readonly { readonly at: string; readonly bp: number }[] };

export const SCENARIO_KINDS = ['parallel', 'twist', 'butterfly', 'key-rate'] as const;
export type ScenarioKind = ScenarioShape['kind'];

/** What a scenario moves: the zero curve directly, or the quotes (then the curve is bootstrapped again). */
export const SCENARIO_SPACES = ['zero', 'quotes'] as const;
export type ScenarioSpace = (typeof SCENARIO_SPACES)[number];

/** A named scenario as stored in the workspace document's `scenarios` array. */
export interface Scenario {
  readonly id: string;
  readonly name: string;
  readonly space: ScenarioSpace;
  readonly shape: ScenarioShape;
}

/** A node of a resolved shift: Delta = bp basis points at t years on the curve's axis. */
export interface ShiftNode {
  readonly t: number;
  readonly bp: number;
  /** The maturity as given ("2Y" or a date), or "all" for a parallel shift. */
  readonly label: string;
  /** Role in the shape: short, pivot, long, belly, key, all. */
  readonly role: 'short' | 'pivot' | 'long' | 'belly' | 'key' | 'all';
}

/** A shift resolved on a curve's time axis: nodes sorted by t (strictly increasing), plus the pivot for a twist. */
export interface ResolvedShift {
  readonly nodes: readonly ShiftNode[];
  /** Zero-shift points to mark on a chart (the pivot of a twist). */
  readonly marks: readonly ShiftNode[];
}

/** Years on the curve's axis from settlement to a maturity given as a tenor or a date; null when it is neither or not after settlement. */
export function maturityTime(at: string, settlement: IsoDate, dayCount: CurveDayCount): number | null {
  // No white space around a maturity here (a date never has any; a tenor with some is refused too).
  const resolved = at === at.trim() ? resolveMarketDate(settlement, at) : null;
  const date = resolved !== null && resolved.ok ? resolved.value : null;
  if (date === null || compareIso(date, settlement) <= 0) return null;
  return curveTime(dayCount, settlement, date);
}

const badMaturity = (path: string, at: string): CoreError =>
  coreError('schema', path, `${path}: "${at.slice(0, 40)}" must be a tenor such as "5Y" or a date YYYY-MM-DD after settlement`);

/**
 * Resolves a shape's maturities to times on the curve's axis (t in years under `dayCount` from
 * `settlement`) and computes its node shifts in bp by the formulas on {@link ScenarioShape}.
 * `path` prefixes error paths (for example `scenarios[2].shape`).
 */
export function resolveShift(shape: ScenarioShape, settlement: IsoDate, dayCount: CurveDayCount, path = 'shape'): Result<ResolvedShift> {
  const time = (at: string, field: string): Result<number> => {
    const t = maturityTime(at, settlement, dayCount);
    return t === null ? fail(badMaturity(`${path}.${field}`, at)) : ok(t);
  };
  switch (shape.kind) {
    case 'parallel':
      return ok({ nodes: [{ t: 0, bp: shape.bp, label: 'all', role: 'all' }], marks: [] });
    case 'twist': {
      const s = time(shape.short, 'short');
      const p = time(shape.pivot, 'pivot');
      const l = time(shape.long, 'long');
      const errors = [s, p, l].flatMap((r) => (r.ok ? [] : r.errors));
      if (!s.ok || !p.ok || !l.ok) return fail(...errors);
      const S = s.value;
      const P = p.value;
      const L = l.value;
      if (!(S < L)) return fail(coreError('range', `${path}.long`, `${path}: the long maturity ${shape.long} must be later than the short ${shape.short}`));
      if (P < S || P > L) return fail(coreError('range', `${path}.pivot`, `${path}: the pivot ${shape.pivot} must lie from ${shape.short} to ${shape.long}`));
      const dS = (-shape.bp * (P - S)) / (L - S);
      const dL = (shape.bp * (L - P)) / (L - S);
      return ok({
        nodes: [
          { t: S, bp: dS, label: shape.short, role: 'short' },
          { t: L, bp: dL, label: shape.long, role: 'long' },
        ],
        marks: [{ t: P, bp: 0, label: shape.pivot, role: 'pivot' }],
      });
    }
    case 'butterfly': {
      const s = time(shape.short, 'short');
      const b = time(shape.belly, 'belly');
      const l = time(shape.long, 'long');
      const errors = [s, b, l].flatMap((r) => (r.ok ? [] : r.errors));
      if (!s.ok || !b.ok || !l.ok) return fail(...errors);
      if (!(s.value < b.value && b.value < l.value)) {
        return fail(coreError('range', `${path}.belly`, `${path}: maturities must run short < belly < long (${shape.short}, ${shape.belly}, ${shape.long})`));
      }
      return ok({
        nodes: [
          { t: s.value, bp: shape.wingsBp, label: shape.short, role: 'short' },
          { t: b.value, bp: shape.bellyBp, label: shape.belly, role: 'belly' },
          { t: l.value, bp: shape.wingsBp, label: shape.long, role: 'long' },
        ],
        marks: [],
      });
    }
    case 'key-rate': {
      if (shape.points.length === 0) return fail(coreError('schema', `${path}.points`, `${path}.points: give at least one maturity with its bp, such as {"at": "5Y", "bp": 10}`));
      const nodes: ShiftNode[] = [];
      const errors: CoreError[] = [];
      shape.points.forEach((pt, i) => {
        const t = time(pt.at, `points[${i}].at`);
        if (t.ok) nodes.push({ t: t.value, bp: pt.bp, label: pt.at, role: 'key' });
        else errors.push(...t.errors);
      });
      if (errors.length > 0) return fail(...errors);
      nodes.sort((a, b) => a.t - b.t);
      for (let i = 1; i < nodes.length; i++) {
        if (nodes[i]!.t === nodes[i - 1]!.t) {
          return fail(coreError('duplicate-pillar', `${path}.points`, `${path}.points: ${nodes[i - 1]!.label} and ${nodes[i]!.label} are the same maturity; keep one`));
        }
      }
      return ok({ nodes, marks: [] });
    }
  }
}

/**
 * Delta(t) in bp: linear in t between the nodes, flat (the end node's value) outside them.
 * @param t years on the curve's axis
 */
export function shiftAt(shift: ResolvedShift, t: number): number {
  const n = shift.nodes;
  const first = n[0];
  if (!first) return 0;
  if (t <= first.t) return first.bp;
  for (let i = 1; i < n.length; i++) {
    const b = n[i]!;
    if (t <= b.t) {
      const a = n[i - 1]!;
      return a.bp + ((b.bp - a.bp) * (t - a.t)) / (b.t - a.t);
    }
  }
  return n[n.length - 1]!.bp;
}

/** dDelta/dt in bp per year, right-continuous (the slope of the segment starting at t); 0 outside the nodes. */
export function shiftSlopeAt(shift: ResolvedShift, t: number): number {
  const n = shift.nodes;
  for (let i = 1; i < n.length; i++) {
    const a = n[i - 1]!;
    const b = n[i]!;
    if (t >= a.t && t < b.t) return (b.bp - a.bp) / (b.t - a.t);
  }
  return 0;
}
