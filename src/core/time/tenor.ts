import { addMonthsCivil, civilFromIso, civilFromSerial, isoFromCivil, serialFromCivil, type CivilDate, type IsoDate } from './date.ts';

/** A tenor `nD`, `nW`, `nM` or `nY` with a whole n >= 1. */
export interface Tenor {
  readonly n: number;
  readonly unit: 'D' | 'W' | 'M' | 'Y';
}

const TENOR_RE = /^([1-9]\d{0,3})([DWMY])$/;

/** Parses a tenor (upper or lower case unit); null when the text is not one. */
export function parseTenor(text: string): Tenor | null {
  const match = TENOR_RE.exec(text.trim().toUpperCase());
  if (!match) return null;
  return { n: Number(match[1]), unit: match[2] as Tenor['unit'] };
}

export const formatTenor = (t: Tenor): string => `${t.n}${t.unit}`;

/** Length of a tenor in months (null for day and week tenors). */
export const tenorMonths = (t: Tenor): number | null => (t.unit === 'M' ? t.n : t.unit === 'Y' ? 12 * t.n : null);

/**
 * The anchor plus k times the tenor, counted from the anchor and never chained
 * (31 Jan + 2 x 1M is 31 Mar, not 28 Mar). Month ends follow `addMonths`.
 */
export function addTenor(anchor: IsoDate, tenor: Tenor, k = 1, eom = false): IsoDate {
  return isoFromCivil(addTenorCivil(civilFromIso(anchor), tenor, k, eom));
}

/** `addTenor` on a civil date already parsed (same rules). */
export function addTenorCivil(anchor: CivilDate, tenor: Tenor, k = 1, eom = false): CivilDate {
  switch (tenor.unit) {
    case 'D':
      return civilFromSerial(serialFromCivil(anchor) + k * tenor.n);
    case 'W':
      return civilFromSerial(serialFromCivil(anchor) + 7 * k * tenor.n);
    case 'M':
      return addMonthsCivil(anchor, k * tenor.n, eom);
    case 'Y':
      return addMonthsCivil(anchor, 12 * k * tenor.n, eom);
  }
}

/** Approximate length of a tenor in years (for ordering and guesses only, never for pricing). */
export const tenorYearsApprox = (t: Tenor): number =>
  t.unit === 'D' ? t.n / 365 : t.unit === 'W' ? (7 * t.n) / 365 : t.unit === 'M' ? t.n / 12 : t.n;
