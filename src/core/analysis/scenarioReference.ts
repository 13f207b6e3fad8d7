import type { Curve } from '../curve/curve.ts';
import { zeroOn } from '../curve/query.ts';
import { parseCsv } from '../export/csv.ts';
import { COMPOUNDING_LABEL, rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { coreError, type CoreError } from '../result.ts';
import { compareIso, isIsoDate, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount } from '../time/dayCount.ts';

/** A reference curve imported from another source: discount factors or zero rates by date. */
export interface ReferenceCurve {
  readonly kind: 'discount' | 'zero';
  /** For zero rates: their compounding and day count as the user declares them. */
  readonly compounding: Compounding;
  readonly dayCount: CurveDayCount;
  readonly points: readonly { readonly date: IsoDate; readonly value: number }[];
}

export const REFERENCE_MAX_ROWS = 2000;

/**
 * Reads a reference curve from CSV: a header row with a `date` column and one value column named
 * `discount` (also `discount factor`, `df`) or `zero` (also `zero rate`), then one row per date
 * (YYYY-MM-DD). Zero rates are decimals (0.0312) in the declared compounding and day count.
 * Errors name the row and column and say what would be valid.
 */
export function parseReferenceCsv(text: string, compounding: Compounding, dayCount: CurveDayCount): { reference: ReferenceCurve | null; errors: CoreError[] } {
  const { rows, error } = parseCsv(text);
  if (error) return { reference: null, errors: [coreError('schema', 'csv', error)] };
  const header = rows[0]?.map((h) => h.trim().toLowerCase()) ?? [];
  const dateCol = header.indexOf('date');
  const dfCol = header.findIndex((h) => h === 'discount' || h === 'discount factor' || h === 'df');
  const zeroCol = header.findIndex((h) => h === 'zero' || h === 'zero rate');
  if (dateCol < 0 || (dfCol < 0) === (zeroCol < 0)) {
    return { reference: null, errors: [coreError('schema', 'csv.header', 'the first row must name a "date" column and exactly one of "discount" or "zero", for example: date,discount')] };
  }
  if (rows.length - 1 > REFERENCE_MAX_ROWS) {
    return { reference: null, errors: [coreError('range', 'csv', `the file has ${rows.length - 1} rows; at most ${REFERENCE_MAX_ROWS} are read`)] };
  }
  const kind = dfCol >= 0 ? 'discount' : 'zero';
  const col = dfCol >= 0 ? dfCol : zeroCol;
  const errors: CoreError[] = [];
  const points: { date: IsoDate; value: number }[] = [];
  const seen = new Set<string>();
  rows.slice(1).forEach((r, i) => {
    const where = `row ${i + 2}`;
    const date = (r[dateCol] ?? '').trim();
    const raw = (r[col] ?? '').trim();
    const value = raw === '' ? Number.NaN : Number(raw);
    if (!isIsoDate(date)) errors.push(coreError('schema', `csv.${where}.date`, `${where}, date: "${String(date).slice(0, 20)}" must be a date YYYY-MM-DD`));
    else if (seen.has(date)) errors.push(coreError('duplicate-pillar', `csv.${where}.date`, `${where}, date: ${date} appears twice; keep one row per date`));
    else if (!Number.isFinite(value)) errors.push(coreError('schema', `csv.${where}.${kind}`, `${where}, ${kind}: "${raw.slice(0, 20)}" must be a number such as ${kind === 'discount' ? '0.9731' : '0.0312 (decimal)'}`));
    else if (kind === 'discount' && !(value > 0)) errors.push(coreError('non-positive-discount', `csv.${where}.discount`, `${where}, discount: ${value} must be above 0`));
    else {
      seen.add(date);
      points.push({ date, value });
    }
  });
  if (points.length === 0 && errors.length === 0) errors.push(coreError('schema', 'csv', 'the file has a header but no rows; add one row per date'));
  points.sort((a, b) => compareIso(a.date, b.date));
  return { reference: errors.length > 0 ? null : { kind, compounding, dayCount, points }, errors };
}

export interface ReferenceRow {
  readonly date: IsoDate;
  /** The reference's zero rate at the date in the stated convention (from its discount factor if given so). */
  readonly referenceZero: number | null;
  readonly zero: number | null;
  /** (ours - reference) x 10,000, bp; null where either is missing, with `note` saying why. */
  readonly differenceBp: number | null;
  readonly note: string | null;
}

/** Label of the convention the differences are in, such as "cont, ACT/365F". */
export const referenceConvention = (r: ReferenceCurve): string => `${COMPOUNDING_LABEL[r.compounding]}, ${r.dayCount}`;

/**
 * Differences by date of our curve's zero rate from the reference's, both in the reference's
 * compounding and day count; a discount factor D at tau = yearFraction(dayCount, settlement, date)
 * becomes the zero rate with ln D over tau (rateFromLnDiscount).
 */
export function referenceDifferences(curve: Curve, ref: ReferenceCurve): ReferenceRow[] {
  return ref.points.map(({ date, value }) => {
    if (compareIso(date, curve.settlement) <= 0) {
      return { date, referenceZero: null, zero: null, differenceBp: null, note: `on or before settlement ${curve.settlement}` };
    }
    const tau = queryYearFraction(ref.dayCount, curve.settlement, date);
    const referenceZero = ref.kind === 'zero' ? value : tau > 0 ? rateFromLnDiscount(Math.log(value), ref.compounding, tau) : null;
    const z = zeroOn(curve, date, ref.compounding, ref.dayCount);
    const zero = z.ok ? z.value.zero : null;
    const note = z.ok ? null : (z.errors[0]?.message ?? 'not on the curve');
    return { date, referenceZero, zero, differenceBp: zero === null || referenceZero === null ? null : (zero - referenceZero) * 1e4, note };
  });
}
