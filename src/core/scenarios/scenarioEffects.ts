import type { Curve } from '../curve/curve.ts';
import { forwardOn, zeroOn } from '../curve/query.ts';
import type { Compounding } from '../rates/compounding.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import { marketDate } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import { shiftAt, type ResolvedShift } from './scenarioShape.ts';

/**
 * Maturities at which two curves are compared by default (tenors from settlement): scenario
 * effects, snapshot comparisons and the printed key rows. Common practice.
 */
export const COMPARISON_TENORS = ['3M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y'] as const;

export interface EffectConventions {
  /** Zero rates are compared in this compounding and day count. */
  readonly zeroCompounding: Compounding;
  readonly zeroDayCount: CurveDayCount;
  /** Forwards are over [T, T + forwardTenor] in this compounding and day count. */
  readonly forwardTenor: string;
  readonly forwardCompounding: Compounding;
  readonly forwardDayCount: CurveDayCount;
}

/** Change at one key maturity, in bp (1 bp = 0.0001); null where a curve does not reach. */
export interface EffectRow {
  readonly tenor: string;
  readonly date: IsoDate;
  readonly zeroBp: number | null;
  readonly forwardBp: number | null;
}

const diffBp = (a: number | null, b: number | null): number | null => (a === null || b === null ? null : (a - b) * 1e4);

/**
 * Changes in bp of zero rates and forwards at key maturities between a moved curve and its base,
 * both on the same settlement: (moved - base) x 10,000 for each rate in the given conventions.
 * Points a curve cannot reach (beyond its last pillar without extrapolation) are null.
 */
export function scenarioEffects(base: Curve, moved: Curve, tenors: readonly string[], conv: EffectConventions): EffectRow[] {
  const fwdTenor = parseTenor(conv.forwardTenor);
  return tenors.flatMap((label) => {
    const tenor = parseTenor(label);
    if (!tenor) return [];
    const date = marketDate(base.settlement, tenor);
    const zero = (c: Curve): number | null => {
      const r = zeroOn(c, date, conv.zeroCompounding, conv.zeroDayCount);
      return r.ok ? r.value.zero : null;
    };
    const fwd = (c: Curve): number | null => {
      if (!fwdTenor) return null;
      const r = forwardOn(c, date, marketDate(date, fwdTenor), conv.forwardCompounding, conv.forwardDayCount);
      return r.ok ? r.value.rate : null;
    };
    return [{ tenor: label, date, zeroBp: diffBp(zero(moved), zero(base)), forwardBp: diffBp(fwd(moved), fwd(base)) }];
  });
}

/** One sample of a scenario's shape beside its effect on the instantaneous forward. */
export interface ShapeSample {
  /** Years on the curve's axis. */
  readonly t: number;
  /** Delta(t), bp. */
  readonly shiftBp: number;
  /** Change of the instantaneous forward (cont, curve's clock), bp. */
  readonly forwardBp: number;
}

/**
 * Samples Delta(t) and f'(t) - f(t) at `steps` + 1 evenly spaced times from 0 to `tMax` years,
 * for charts that show a scenario's shape beside the jumps a quote-space move can cause.
 */
export function shapeSamples(shift: ResolvedShift, base: Curve, moved: Curve, tMax: number, steps = 120): ShapeSample[] {
  const out: ShapeSample[] = [];
  const n = Math.max(1, Math.floor(steps));
  for (let i = 0; i <= n; i++) {
    const t = (tMax * i) / n;
    out.push({ t, shiftBp: shiftAt(shift, t), forwardBp: (moved.forwardAt(t) - base.forwardAt(t)) * 1e4 });
  }
  return out;
}
