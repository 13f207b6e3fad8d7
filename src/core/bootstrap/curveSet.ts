import type { Curve } from '../curve/curve.ts';
import { DISCOUNT_CURVE, type CurveId, type Instrument } from '../instruments/instrument.ts';
import { kindModule } from '../kinds/registry.ts';
import { coreError, type CoreError } from '../result.ts';
import { bootstrapInstruments, type BootstrapOutcome, type BootstrapSettings } from './bootstrap.ts';

/**
 * A build's curves by name. Today a build solves one curve, `discount` (DISCOUNT_CURVE), which
 * every instrument reads in every role (it discounts, and it projects a swap's floating leg); a
 * build without a curve has none. `CurveBuild.curve` is `curves.discount`.
 */
export type CurveSet = Readonly<Record<CurveId, Curve>>;

/** The set holding one curve as `discount`, or no curve. */
export const curveSetOf = (curve: Curve | null): CurveSet => (curve === null ? {} : { [DISCOUNT_CURVE]: curve });

/** The instruments whose pillars are the nodes of one curve, in pillar order. */
export interface NodeGroup {
  readonly curve: CurveId;
  readonly instruments: readonly Instrument[];
}

/** The curve an instrument's pillar is a node of: the curve it reads in its kind's node role. */
export function nodeCurve(ins: Instrument): CurveId {
  return ins.curves[kindModule(ins.kind).nodeRole] ?? ins.curves.discount;
}

/**
 * Groups instruments (sorted by pillar time) by the curve their nodes belong to, keeping the
 * order within each group. Performance: with one curve (every market today) the given array is
 * the one group, not a copy.
 */
export function nodeGroups(instruments: readonly Instrument[]): readonly NodeGroup[] {
  const groups: { curve: CurveId; instruments: Instrument[] }[] = [];
  let single = true;
  const first = instruments.length > 0 ? nodeCurve(instruments[0]!) : DISCOUNT_CURVE;
  for (const ins of instruments) if (nodeCurve(ins) !== first) single = false;
  if (single) return [{ curve: first, instruments }];
  for (const ins of instruments) {
    const id = nodeCurve(ins);
    let g = groups.find((x) => x.curve === id);
    if (!g) groups.push((g = { curve: id, instruments: [] }));
    g.instruments.push(ins);
  }
  return groups;
}

/** A bootstrap of every curve of a market: the curves by name and the combined outcome. */
export interface CurveSetOutcome extends BootstrapOutcome {
  readonly curves: CurveSet;
}

/**
 * Solves the market's curves, one node group at a time. Each group is solved alone, which is
 * right only when its instruments read no other curve: an instrument that reads a curve other
 * than its node's (a swap discounted on one curve and projecting another) needs the curves solved
 * together, which the engine does not do yet, and is refused with an error naming it. Today every
 * instrument reads the one curve `discount`, so this is a single bootstrap and its outcome as is.
 */
export function bootstrapCurveSet(settings: BootstrapSettings, instruments: readonly Instrument[]): CurveSetOutcome {
  const errors: CoreError[] = [];
  for (const ins of instruments) {
    const own = nodeCurve(ins);
    const other = ins.curves.projection !== undefined && ins.curves.projection !== own ? ins.curves.projection : ins.curves.discount !== own ? ins.curves.discount : null;
    if (other !== null) {
      errors.push(
        coreError('no-solution', `quotes[${ins.index}]`, `quotes[${ins.index}] (${ins.kind} ${ins.maturity}) reads the curve "${other}" besides its own "${own}"; solving curves together is not supported yet, so use single-curve quotes`, ins.index),
      );
    }
  }
  if (errors.length > 0) return { curve: null, curves: {}, errors, warnings: [], repricing: [], sweeps: 0 };
  const groups = nodeGroups(instruments);
  if (groups.length === 1) {
    const o = bootstrapInstruments(settings, groups[0]!.instruments);
    const curves = o.curve === null ? {} : { [groups[0]!.curve]: o.curve };
    const out = { curve: o.curve, curves, errors: o.errors, warnings: o.warnings, repricing: o.repricing, sweeps: o.sweeps, ...(o.spotGap === undefined ? {} : { spotGap: o.spotGap }) };
    return o.overnight === undefined ? out : { ...out, overnight: o.overnight };
  }
  const curves: Record<CurveId, Curve> = {};
  const outcomes = groups.map((g) => {
    const o = bootstrapInstruments(settings, g.instruments);
    if (o.curve) curves[g.curve] = o.curve;
    return o;
  });
  const failed = outcomes.some((o) => o.curve === null);
  const gap = outcomes.find((o) => o.spotGap !== undefined)?.spotGap;
  return {
    curve: failed ? null : (curves[DISCOUNT_CURVE] ?? null),
    curves: failed ? {} : curves,
    errors: outcomes.flatMap((o) => o.errors),
    warnings: outcomes.flatMap((o) => o.warnings),
    repricing: failed ? [] : outcomes.flatMap((o) => o.repricing),
    sweeps: Math.max(...outcomes.map((o) => o.sweeps)),
    ...(gap === undefined ? {} : { spotGap: gap }),
  };
}
