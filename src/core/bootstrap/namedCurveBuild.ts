import type { Curve } from '../curve/curve.ts';
import type { SwapQuote, Workspace } from '../document/types.ts';
import { DEFAULT_CURVE_NAME, INDEX_TENORS, type WorkspaceCurve, type NamedCurveRole } from '../document/namedCurves.ts';
import { ProjectedSwap, type BasisLeg } from '../instruments/projectedSwap.ts';
import { moduleOf } from '../kinds/registry.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { coreError, type CoreError, type CoreWarning } from '../result.ts';
import { civilFromIso } from '../time/date.ts';
import { curveClock } from '../time/dayCount.ts';
import { buildValidated, compileMarket, type BuildOptions, type CompiledMarket, type CurveBuild } from './build.ts';

/** One named curve of a document, built. */
export interface NamedCurveBuild {
  readonly name: string;
  readonly role: NamedCurveRole;
  /** A projection curve's index tenor; null otherwise. */
  readonly index: string | null;
  /** A projection curve's discounting curve; null otherwise. */
  readonly discountCurve: string | null;
  /** Its build, as a document's (errors and warnings with the path `curves[i].` in front). */
  readonly build: CurveBuild;
}

/**
 * Builds a validated workspace's named curves (`ws.curves`, already in build order) after its
 * default curve `defaultCurve` (null when that did not build). A discounting or government curve
 * is built by today's engine exactly as a document of its own (its quotes, its settings, the
 * shared valuation date). A projection curve compiles as a document too, except that each swap
 * becomes a term-index swap (instruments/projectedSwap.ts) whose discount factors are read from
 * its discounting curve, built before it and held fixed; deposits, FRAs and futures fix ratios of
 * the projection curve's own discount factors, as on one curve. A projection curve whose
 * discounting curve did not build gets an error naming both. Empty for a workspace without named curves.
 */
export function buildNamedCurves(ws: Workspace, defaultCurve: Curve | null, options: BuildOptions = {}): readonly NamedCurveBuild[] {
  const out: NamedCurveBuild[] = [];
  const built = new Map<string, Curve | null>([[DEFAULT_CURVE_NAME, defaultCurve]]);
  for (const c of ws.curves ?? []) {
    let build: CurveBuild;
    if (c.discountCurve === null) build = buildValidated({ workspace: c.workspace, errors: [] }, options, compileOwn);
    else {
      const discount = built.get(c.discountCurve) ?? null;
      if (discount === null) {
        const e = coreError('no-solution', 'discountCurve', `its discounting curve "${c.discountCurve}" did not build; correct that curve first`);
        build = { curve: null, curves: {}, errors: [e], warnings: [], repricing: [], sweeps: 0, leftOut: [], workspace: c.workspace, instruments: [] };
      } else build = buildValidated({ workspace: c.workspace, errors: [] }, options, projectedMarket(c, discount, built, ws.curves!));
    }
    built.set(c.name, build.curve);
    out.push({ name: c.name, role: c.role, index: c.index, discountCurve: c.discountCurve, build: located(build, c) });
  }
  return out;
}

const compileOwn = (ws: Workspace, skip: boolean): CompiledMarket => compileMarket(ws.settlement, ws.curve.dayCount, ws.quotes, skip);

/** A projection curve's market: today's compile, each swap then priced against its discounting curve. */
function projectedMarket(c: WorkspaceCurve, discount: Curve, built: ReadonlyMap<string, Curve | null>, curves: readonly WorkspaceCurve[]) {
  return (ws: Workspace, skip: boolean): CompiledMarket => {
    const market = compileOwn(ws, skip);
    const s = civilFromIso(ws.settlement);
    const time = curveClock(ws.curve.dayCount, s);
    const perYear = INDEX_TENORS[c.index!]!;
    const errors: CoreError[] = [...market.errors];
    const instruments: Instrument[] = [];
    for (const ins of market.instruments) {
      if (moduleOf(ins.quote).onProjection?.(ins.quote) !== 'index-swap') {
        instruments.push(ins);
        continue;
      }
      // A basis swap's other leg: the curve it names (built before it), over that curve's index periods (a discounting curve's overnight leg over this index's).
      const against = c.basis.get(ins.index);
      let basis: BasisLeg | undefined;
      if (against !== undefined) {
        const other = built.get(against) ?? null;
        if (other === null) {
          errors.push(coreError('no-solution', `quotes[${ins.index}].against`, `quotes[${ins.index}] (basis swap ${ins.maturity}): the curve of its other leg, "${against}", did not build; correct that curve first`, ins.index));
          continue;
        }
        const index = curves.find((x) => x.name === against)?.index ?? null;
        basis = { curve: other, name: against, perYear: index === null ? perYear : INDEX_TENORS[index]! };
      }
      const p = ProjectedSwap.compile(ins.quote as SwapQuote, s, civilFromIso(ins.quote.maturity), time, discount, c.discountCurve!, perYear, basis);
      if ('beyond' in p) {
        const role = p.curve === c.discountCurve && against !== p.curve ? 'its discounting curve' : 'the curve of its other leg';
        errors.push(coreError('beyond-curve', `quotes[${ins.index}].maturity`, `quotes[${ins.index}] (swap ${ins.maturity}) pays on ${p.beyond}, after the last pillar of ${role} "${p.curve}" (which does not extrapolate); add a longer quote to that curve or a shorter swap here`, ins.index));
      } else instruments.push(p);
    }
    return { ...market, instruments, errors };
  };
}

/** A named curve's build with its errors and warnings located: path `curves[i].` in front, the curve named in the message. */
function located(build: CurveBuild, c: WorkspaceCurve): CurveBuild {
  const base = `curves[${c.position}]`;
  const label = `${base} "${c.name}": `;
  const at = <T extends CoreError | CoreWarning>(e: T): T => ({ ...e, path: `${base}.${e.path}`, message: `${label}${e.message}` });
  return { ...build, errors: build.errors.map(at), warnings: build.warnings.map(at) };
}

/**
 * The curve a named curve's instrument was discounted on: a term-index or basis swap's discounting
 * curve, or null for a quote that fixes its own curve's discount-factor ratio (a deposit, FRA or
 * future) and so reads no other curve.
 */
export const discountedOnOf = (ins: Instrument): string | null => (ins instanceof ProjectedSwap ? ins.discountedOn : null);
