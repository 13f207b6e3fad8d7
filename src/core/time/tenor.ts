import { addMonthsCivil, civilFromIso, civilFromSerial, isoFromCivil, serialFromCivil, type CivilDate, type IsoDate } from './date.ts';

/** A tenor `nD`, `nW`, `nM` or `nY` with a whole n >= 1. */
export interface Tenor {
  readonly n: number;
  readonly unit: 'D' | 'W' | 'M' | 'Y';
}

/** Units by character code, upper and lower case. */
const UNITS: Readonly<Record<number, Tenor['unit']>> = { 68: 'D', 87: 'W', 77: 'M', 89: 'Y', 100: 'D', 119: 'W', 109: 'M', 121: 'Y' };

/**
 * Parses a tenor: 1 to 4 digits without a leading zero, then a unit D, W, M or Y in either case,
 * surrounding white space allowed; null when the text is not one. (Performance: read character
 * by character, as it runs once per quote of every document.)
 */
export function parseTenor(text: string): Tenor | null {
  const s = text.trim();
  const last = s.length - 1;
  if (last < 1 || last > 4) return null;
  const unit = UNITS[s.charCodeAt(last)];
  if (unit === undefined) return null;
  let n = 0;
  for (let i = 0; i < last; i++) {
    const c = s.charCodeAt(i) - 48;
    if (c < 0 || c > 9 || (i === 0 && c === 0)) return null;
    n = n * 10 + c;
  }
  return { n, unit };
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
