import type { Curve } from '../curve/curve.ts';
import type { ExplanationSink } from '../curve/explain.ts';
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

/** (a - b) x 10,000: the change in bp of a rate from b to a; null when either is missing. */
export const diffBp = (a: number | null, b: number | null): number | null => (a === null || b === null ? null : (a - b) * 1e4);

/** Which rate of a key maturity a change is of. */
export type EffectField = 'zero' | 'forward';

/**
 * The date of a key maturity (`2Y`) on a curve's settlement, and the forward's end; null when the
 * label is not a tenor (the forward's end is null when the forward tenor is not one).
 */
export function effectDates(settlement: IsoDate, label: string, conv: EffectConventions): { date: IsoDate; end: IsoDate | null } | null {
  const tenor = parseTenor(label);
  if (!tenor) return null;
  const date = marketDate(settlement, tenor);
  const fwdTenor = parseTenor(conv.forwardTenor);
  return { date, end: fwdTenor ? marketDate(date, fwdTenor) : null };
}

/**
 * The rate a change compares at one key maturity on one curve: the zero rate on `date`, or the
 * forward from `date` to `end`, in the given conventions; null where the curve does not reach.
 * With a sink the query records its explanation (the same query, see curve/explain.ts).
 */
export function effectRate(c: Curve, field: EffectField, dates: { date: IsoDate; end: IsoDate | null }, conv: EffectConventions, sink?: ExplanationSink): number | null {
  if (field === 'zero') {
    const r = zeroOn(c, dates.date, conv.zeroCompounding, conv.zeroDayCount, 'date', sink);
    return r.ok ? r.value.zero : null;
  }
  if (dates.end === null) return null;
  const r = forwardOn(c, dates.date, dates.end, conv.forwardCompounding, conv.forwardDayCount, 'forward', sink);
  return r.ok ? r.value.rate : null;
}

/**
 * Changes in bp of zero rates and forwards at key maturities between a moved curve and its base,
 * both on the same settlement: (moved - base) x 10,000 for each rate in the given conventions.
 * Points a curve cannot reach (beyond its last pillar without extrapolation) are null.
 */
export function scenarioEffects(base: Curve, moved: Curve, tenors: readonly string[], conv: EffectConventions): EffectRow[] {
  return tenors.flatMap((label) => {
    const dates = effectDates(base.settlement, label, conv);
    if (!dates) return [];
    const change = (field: EffectField): number | null => diffBp(effectRate(moved, field, dates, conv), effectRate(base, field, dates, conv));
    return [{ tenor: label, date: dates.date, zeroBp: change('zero'), forwardBp: change('forward') }];
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
