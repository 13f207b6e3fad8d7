import { DEFAULT_KEY_TENORS, discountOn, forwardOn, marketDate, parseTenor, parYieldOn, zeroOn, type Curve } from '../../core/index.ts';
import type { DisplaySettings } from '../../core/index.ts';

export interface KeyMaturityRow {
  readonly tenor: string;
  readonly date: string;
  readonly t: number | null;
  readonly discount: number | null;
  readonly zero: number | null;
  readonly par: number | null;
  readonly forward: number | null;
  readonly extrapolated: boolean;
  /** Why a value is missing (beyond the curve without extrapolation). */
  readonly note: string | null;
}

/** The key-maturity table, every value read from the core's queries. */
export function keyMaturityRows(curve: Curve, display: DisplaySettings): KeyMaturityRow[] {
  const fwdTenor = parseTenor(display.forwardTenor)!;
  return DEFAULT_KEY_TENORS.map((tenor) => {
    const date = marketDate(curve.settlement, parseTenor(tenor)!);
    const d = discountOn(curve, date);
    const z = zeroOn(curve, date, display.compounding, display.dayCount);
    const p = parYieldOn(curve, date, display.parFrequency);
    const f = forwardOn(curve, date, marketDate(date, fwdTenor), display.compounding, display.dayCount);
    const note = !d.ok ? d.errors[0]!.message : !f.ok ? f.errors[0]!.message : null;
    return {
      tenor,
      date,
      t: d.ok ? d.value.t : null,
      discount: d.ok ? d.value.discount : null,
      zero: z.ok ? z.value.zero : null,
      par: p.ok ? p.value.rate : null,
      forward: f.ok ? f.value.rate : null,
      extrapolated: (d.ok && d.value.extrapolated) || (f.ok && f.value.extrapolated),
      note,
    };
  });
}
