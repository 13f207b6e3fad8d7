import type { Curve } from '../curve/curve.ts';
import type { ExplanationSink } from '../curve/explain.ts';
import { zeroOn } from '../curve/query.ts';
import { parseCsv } from '../export/csv.ts';
import { rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { rateTag } from '../format/conventionTag.ts';
import { coreError, type CoreError } from '../result.ts';
import { compareIso, isIsoDate, type IsoDate } from '../time/date.ts';
import { queryYearFraction, type CurveDayCount } from '../time/dayCount.ts';
import { exactDecimal, normaliseNumberText } from '../input/decimalText.ts';
import { rateUnitHint, readRate, type QuoteUnitMode } from '../input/quoteText.ts';

/**
 * Where reference values stop looking like what their column says: zero rates from -5 % to 25 %,
 * discount factors from 0.01 to 1.5 (a 30-year discount factor at 15 % is about 0.011; one above
 * 1 needs a negative rate). Outside, the value is kept and a warning asks to check the unit.
 * The bounds are the project's judgement, not a standard.
 */
const PLAUSIBLE_ZERO = { min: -0.05, max: 0.25 } as const;
const PLAUSIBLE_DISCOUNT = { min: 0.01, max: 1.5 } as const;

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
 * (YYYY-MM-DD). Zero rates are read with the sheet's unit rules (`readRate`): `3.05%`, `305bp`, or
 * a bare number in `mode` (decimal unless given: 0.0312), in the declared compounding and day
 * count; in decimal mode a bare value above 1 is refused with "did you mean %?", as on the sheet.
 * Errors name the row and column and say what would be valid. Warnings (values kept) name
 * values implausible for their column and what they would be in another unit.
 */
export function parseReferenceCsv(
  text: string,
  compounding: Compounding,
  dayCount: CurveDayCount,
  mode: QuoteUnitMode = 'decimal',
): { reference: ReferenceCurve | null; errors: CoreError[]; warnings: string[] } {
  const warnings: string[] = [];
  const { rows, error } = parseCsv(text);
  if (error) return { reference: null, errors: [coreError('schema', 'csv', error)], warnings };
  const header = rows[0]?.map((h) => h.trim().toLowerCase()) ?? [];
  const dateCol = header.indexOf('date');
  const dfCol = header.findIndex((h) => h === 'discount' || h === 'discount factor' || h === 'df');
  const zeroCol = header.findIndex((h) => h === 'zero' || h === 'zero rate');
  if (dateCol < 0 || (dfCol < 0) === (zeroCol < 0)) {
    return { reference: null, errors: [coreError('schema', 'csv.header', 'the first row must name a "date" column and exactly one of "discount" or "zero", for example: date,discount')], warnings };
  }
  if (rows.length - 1 > REFERENCE_MAX_ROWS) {
    return { reference: null, errors: [coreError('range', 'csv', `the file has ${rows.length - 1} rows; at most ${REFERENCE_MAX_ROWS} are read`)], warnings };
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
    const read = readValue(kind, raw, mode, where);
    if (!isIsoDate(date)) errors.push(coreError('schema', `csv.${where}.date`, `${where}, date: "${String(date).slice(0, 20)}" must be a date YYYY-MM-DD`));
    else if (seen.has(date)) errors.push(coreError('duplicate-pillar', `csv.${where}.date`, `${where}, date: ${date} appears twice; keep one row per date`));
    else if ('error' in read) errors.push(coreError('schema', `csv.${where}.${kind}`, read.error));
    else if (kind === 'discount' && !(read.value > 0)) errors.push(coreError('non-positive-discount', `csv.${where}.discount`, `${where}, discount: ${read.value} must be above 0`));
    else {
      if (read.warning) warnings.push(read.warning);
      seen.add(date);
      points.push({ date, value: read.value });
    }
  });
  if (points.length === 0 && errors.length === 0) errors.push(coreError('schema', 'csv', 'the file has a header but no rows; add one row per date'));
  points.sort((a, b) => compareIso(a.date, b.date));
  return { reference: errors.length > 0 ? null : { kind, compounding, dayCount, points }, errors, warnings };
}

/** One reference value: a discount factor (a plain number) or a zero rate (the sheet's unit rules), with a plausibility warning. */
function readValue(kind: 'discount' | 'zero', raw: string, mode: QuoteUnitMode, where: string): { value: number; warning: string | null } | { error: string } {
  const example = kind === 'discount' ? '0.9731' : mode === 'decimal' ? '0.0312 (decimal), 3.12% or 312bp' : mode === 'bp' ? '312 (bp), 3.12% or 0.0312 in decimal' : '3.12 (%), 312bp or 0.0312 in decimal';
  const notNumber = { error: `${where}, ${kind}: "${raw.slice(0, 20)}" must be a number such as ${example}` };
  if (kind === 'discount') {
    const d = exactDecimal(normaliseNumberText(raw));
    if (!d) return notNumber;
    const value = d.toNumber();
    if (value > 0 && (value < PLAUSIBLE_DISCOUNT.min || value > PLAUSIBLE_DISCOUNT.max)) {
      const scaled = value > 1.5 && value <= 100 ? `; did you mean ${d.shifted(-2).toFixed()}?` : '';
      return { value, warning: `${where}, discount: ${d.toFixed()} is implausible for a discount factor (about ${PLAUSIBLE_DISCOUNT.min} to ${PLAUSIBLE_DISCOUNT.max}: 1 today, falling with maturity)${scaled}` };
    }
    return { value, warning: null };
  }
  const r = readRate(raw, mode);
  if (!r.ok) return notNumber;
  const { rate, typed, bare } = r.value;
  if (mode === 'decimal' && bare && typed.compareSizeToPowerOfTen(0) > 0) {
    return { error: `${where}, zero: ${typed.toFixed()} as a decimal is ${typed.shifted(2).toFixed()}%: did you mean ${typed.toFixed()}%? Type ${typed.toFixed()}% or ${typed.shifted(-2).toFixed()}, or read bare numbers in %` };
  }
  const hint = bare ? rateUnitHint(typed, mode, 'zero rate') : null;
  const pct = (x: number): string => `${+(x * 100).toPrecision(12)}%`;
  const out = rate < PLAUSIBLE_ZERO.min || rate > PLAUSIBLE_ZERO.max ? `${pct(rate)} is implausible for a zero rate (about ${pct(PLAUSIBLE_ZERO.min)} to ${pct(PLAUSIBLE_ZERO.max)})` : null;
  const warning = hint ?? out;
  return { value: rate, warning: warning ? `${where}, zero: ${warning}` : null };
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
export const referenceConvention = (r: ReferenceCurve): string => rateTag(r.compounding, r.dayCount);

/**
 * Differences by date of our curve's zero rate from the reference's, both in the reference's
 * compounding and day count; a discount factor D at tau = yearFraction(dayCount, settlement, date)
 * becomes the zero rate with ln D over tau (rateFromLnDiscount).
 */
export function referenceDifferences(curve: Curve, ref: ReferenceCurve): ReferenceRow[] {
  return ref.points.map((point) => referenceRow(curve, ref, point));
}

/** What one row hands to explainReferenceDifference: a sink for our zero rate, and the reference's tau and ln D when it gives a discount factor. */
export interface ReferenceTrace {
  readonly ours: ExplanationSink;
  tau?: number;
  lnDiscount?: number;
}

/** One row of referenceDifferences; with `trace`, our zero rate and the reference's conversion hand it their own values. */
export function referenceRow(curve: Curve, ref: ReferenceCurve, { date, value }: ReferenceCurve['points'][number], trace?: ReferenceTrace): ReferenceRow {
  if (compareIso(date, curve.settlement) <= 0) {
    return { date, referenceZero: null, zero: null, differenceBp: null, note: `on or before settlement ${curve.settlement}` };
  }
  const tau = queryYearFraction(ref.dayCount, curve.settlement, date);
  let referenceZero: number | null = value;
  if (ref.kind === 'discount') {
    const ln = Math.log(value);
    if (trace) Object.assign(trace, { tau, lnDiscount: ln });
    referenceZero = tau > 0 ? rateFromLnDiscount(ln, ref.compounding, tau) : null;
  }
  const z = zeroOn(curve, date, ref.compounding, ref.dayCount, 'date', trace?.ours);
  const zero = z.ok ? z.value.zero : null;
  const note = z.ok ? null : (z.errors[0]?.message ?? 'not on the curve');
  return { date, referenceZero, zero, differenceBp: zero === null || referenceZero === null ? null : (zero - referenceZero) * 1e4, note };
}
