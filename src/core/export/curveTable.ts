import type { DisplaySettings } from '../document/workbenchDocument.ts';
import type { Curve } from '../curve/curve.ts';
import { discountOn, forwardOn, parYieldOn, zeroOn } from '../curve/query.ts';
import type { Compounding } from '../rates/compounding.ts';
import { couponTag, rateTag } from '../format/conventionTag.ts';
import type { CoreError } from '../result.ts';
import type { CurveDayCount } from '../time/dayCount.ts';
import type { IsoDate } from '../time/date.ts';
import { marketDate, resolveMarketDate, UNADJUSTED } from '../time/dateConventions.ts';
import { parseTenor } from '../time/tenor.ts';
import { toCsv, type CsvCell } from './csv.ts';

export interface CurveTableConventions {
  readonly zeroCompounding: Compounding;
  readonly zeroDayCount: CurveDayCount;
  /** Par yields: coupons `parFrequency` times a year, ACT/ACT-ICMA accrual, compounded at that frequency. */
  readonly parFrequency: 1 | 2 | 4 | 12;
  /** Forwards over [date, date + forwardTenor]. */
  readonly forwardTenor: string;
  readonly forwardCompounding: Compounding;
  readonly forwardDayCount: CurveDayCount;
}

export const defaultTableConventions = (curve: Curve): CurveTableConventions => ({
  zeroCompounding: 'continuous',
  zeroDayCount: curve.dayCount,
  parFrequency: 2,
  forwardTenor: '3M',
  forwardCompounding: 'simple',
  forwardDayCount: 'ACT/360',
});

/** One row of the curve table. Rates are decimals per year in the table's conventions; null where the curve cannot answer. */
export interface CurveTableRow {
  readonly label: string;
  readonly date: IsoDate;
  /** Years from settlement on the curve's axis. */
  readonly t: number;
  readonly discount: number | null;
  readonly zero: number | null;
  readonly par: number | null;
  readonly forward: number | null;
  readonly extrapolated: boolean;
  readonly errors: readonly CoreError[];
}

/** Column headers with each rate's compounding and day count, such as "zero (cont, ACT/365F)". */
export function curveTableHeaders(curve: Curve, conv: CurveTableConventions): string[] {
  return [
    'date',
    `t (years, ${curve.dayCount})`,
    'discount factor',
    `zero (${rateTag(conv.zeroCompounding, conv.zeroDayCount)})`,
    `par (${couponTag(conv.parFrequency, 'ACT/ACT-ICMA')})`,
    `forward ${conv.forwardTenor} (${rateTag(conv.forwardCompounding, conv.forwardDayCount)})`,
    'extrapolated (past the last pillar)',
  ];
}

/** Grids the curve table can be written on. */
export const CURVE_TABLE_GRIDS = ['pillars', 'monthly', 'quarterly', 'yearly', 'dates'] as const;
export type CurveTableGrid = (typeof CURVE_TABLE_GRIDS)[number];
/** At most this many points in one table (a monthly grid of 100 years). */
export const CURVE_TABLE_MAX_POINTS = 1200;

/**
 * The points of a curve table: the pillar dates; settlement plus every whole month, quarter or
 * year up to the first such date on or after the last pillar (so the grid covers the curve; that
 * last point may be extrapolated); or the user's own tenors and dates (`dates`, kept in the order
 * given). Dates are market dates under the conventions layer (marketDate: today unadjusted, month ends clipped).
 */
export function curveTablePoints(curve: Curve, grid: CurveTableGrid, own: readonly string[] = []): string[] {
  if (grid === 'pillars') return curve.pillars.map((p) => p.date);
  if (grid === 'dates') return own.slice(0, CURVE_TABLE_MAX_POINTS);
  const last = curve.pillars[curve.pillars.length - 1]?.date ?? curve.settlement;
  const step = grid === 'monthly' ? { n: 1, unit: 'M' as const } : grid === 'quarterly' ? { n: 3, unit: 'M' as const } : { n: 1, unit: 'Y' as const };
  const out: string[] = [];
  for (let k = 1; k <= CURVE_TABLE_MAX_POINTS; k++) {
    const d = marketDate(curve.settlement, step, UNADJUSTED, k);
    out.push(d);
    if (d >= last) break;
  }
  return out;
}

/**
 * The curve table at the given points: tenors from settlement ("5Y") or dates. Defaults to the
 * curve's pillar dates. Each value is the engine's query (discountOn, zeroOn, parYieldOn, forwardOn).
 */
export function curveTable(curve: Curve, conv: CurveTableConventions, points?: readonly string[]): CurveTableRow[] {
  const wanted = points ?? curve.pillars.map((p) => p.date);
  return wanted.flatMap((label) => {
    const at = resolveMarketDate(curve.settlement, label);
    // A date-shaped label that is no calendar date still gets its row, whose errors say so.
    if (!at.ok && !/^\d{4}-\d{2}-\d{2}$/.test(label)) return [];
    const date = at.ok ? at.value : label;
    const errors: CoreError[] = [];
    const take = <T>(r: { ok: true; value: T } | { ok: false; errors: readonly CoreError[] }): T | null => {
      if (r.ok) return r.value;
      errors.push(...r.errors);
      return null;
    };
    const df = take(discountOn(curve, date));
    const zero = take(zeroOn(curve, date, conv.zeroCompounding, conv.zeroDayCount));
    const par = take(parYieldOn(curve, date, conv.parFrequency));
    const fwdTenor = parseTenor(conv.forwardTenor);
    const fwd = fwdTenor ? take(forwardOn(curve, date, marketDate(date, fwdTenor), conv.forwardCompounding, conv.forwardDayCount)) : null;
    return [
      {
        label,
        date,
        t: curve.time(date),
        discount: df?.discount ?? null,
        zero: zero?.zero ?? null,
        par: par?.rate ?? null,
        forward: fwd?.rate ?? null,
        extrapolated: df?.extrapolated === true,
        errors,
      },
    ];
  });
}

/**
 * The curve table as CSV. First row: the conventions (settlement, curve day count, interpolation);
 * second row: column headers carrying each rate's compounding and day count; then one row per point,
 * numbers at full double precision, empty cells where the curve cannot answer, and `yes` in the
 * last column for a point past the last pillar (its values come from the extrapolation).
 */
export function curveTableCsv(curve: Curve, conv: CurveTableConventions, points?: readonly string[]): string {
  const rows: CsvCell[][] = [
    [`settlement ${curve.settlement}`, `curve day count ${curve.dayCount}`, `interpolation ${curve.interpolation}`, `extrapolation ${curve.extrapolation}`, 'rates are decimals per year'],
    curveTableHeaders(curve, conv),
  ];
  for (const r of curveTable(curve, conv, points)) rows.push([r.date, r.t, r.discount, r.zero, r.par, r.forward, r.extrapolated ? 'yes' : '']);
  return toCsv(rows);
}

/** The table conventions of the workbench's display settings: zero and forward in the display compounding and day count. */
export const tableConventionsFromDisplay = (display: DisplaySettings): CurveTableConventions => ({
  zeroCompounding: display.compounding,
  zeroDayCount: display.dayCount,
  parFrequency: ([1, 2, 4, 12] as const).find((f) => f === display.parFrequency) ?? 2,
  forwardTenor: display.forwardTenor,
  forwardCompounding: display.compounding,
  forwardDayCount: display.dayCount,
});
