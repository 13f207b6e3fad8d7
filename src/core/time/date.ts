/**
 * Calendar dates as ISO `YYYY-MM-DD` strings with no time zone, and day serials (days since
 * 1970-01-01 in the proleptic Gregorian calendar). No `Date` object is used anywhere, so local
 * time zones and daylight saving cannot move a date.
 *
 * Civil-from-days and days-from-civil follow H. Hinnant, "chrono-Compatible Low-Level Date
 * Algorithms" (public domain algorithms, exact for all dates in range).
 */
export type IsoDate = string;

export interface CivilDate {
  readonly y: number;
  readonly m: number; // 1..12
  readonly d: number; // 1..31
}

export const isLeapYear = (y: number): boolean => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
export const daysInMonth = (y: number, m: number): number => (m === 2 && isLeapYear(y) ? 29 : MONTH_DAYS[m - 1]!);

/** The number written by the characters [from, to) of text, or -1 when one is not a digit. */
function digits(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i) - 48;
    if (c < 0 || c > 9) return -1;
    n = n * 10 + c;
  }
  return n;
}

/** Parses `YYYY-MM-DD` (years 1900..2999); null when the text is not a real calendar date. */
export function parseIsoDate(text: string): CivilDate | null {
  if (typeof text !== 'string' || text.length !== 10 || text.charCodeAt(4) !== 45 || text.charCodeAt(7) !== 45) return null;
  const y = digits(text, 0, 4);
  const m = digits(text, 5, 7);
  const d = digits(text, 8, 10);
  if (y < 1900 || y > 2999 || m < 1 || m > 12 || d < 1 || d > daysInMonth(y, m)) return null;
  return { y, m, d };
}

export const isIsoDate = (text: unknown): text is IsoDate => typeof text === 'string' && parseIsoDate(text) !== null;

/** Days since 1970-01-01 of a civil date. */
export function serialFromCivil({ y, m, d }: CivilDate): number {
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/** Civil date of a day serial. */
export function civilFromSerial(serial: number): CivilDate {
  const z = serial + 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const d = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const m = mp < 10 ? mp + 3 : mp - 9;
  return { y: yoe + era * 400 + (m <= 2 ? 1 : 0), m, d };
}

const pad = (n: number, w: number): string => String(n).padStart(w, '0');
/** Two digits for a month or day (performance: no padStart on the common path). */
const two = (n: number): string => (n < 10 ? `0${n}` : `${n}`);
export const isoFromCivil = ({ y, m, d }: CivilDate): IsoDate => `${y >= 1000 && y <= 9999 ? y : pad(y, 4)}-${two(m)}-${two(d)}`;

/** The civil date of a valid ISO date (callers validate first with parseIsoDate or isIsoDate). */
export function civilFromIso(date: IsoDate): CivilDate {
  const c = parseIsoDate(date);
  if (!c) throw new RangeError(`not an ISO date: ${date}`); // programming error: inputs are validated at the boundary
  return c;
}

/** Serial of a valid ISO date (callers validate first with parseIsoDate or isIsoDate). */
export const serialFromIso = (date: IsoDate): number => serialFromCivil(civilFromIso(date));
export const isoFromSerial = (serial: number): IsoDate => isoFromCivil(civilFromSerial(serial));

/** Actual days from d1 to d2 (negative when d2 is earlier). */
export const daysBetween = (d1: IsoDate, d2: IsoDate): number => serialFromIso(d2) - serialFromIso(d1);

export const addDays = (date: IsoDate, days: number): IsoDate => isoFromSerial(serialFromIso(date) + days);

export const isMonthEnd = (c: CivilDate): boolean => c.d === daysInMonth(c.y, c.m);
export const isLastOfFebruary = (c: CivilDate): boolean => c.m === 2 && isMonthEnd(c);

/**
 * Adds whole months counted from the anchor. The day is clipped to the month's last day
 * (31 Jan + 1M = 28/29 Feb); with `eom` and a month-end anchor the result is the month end.
 */
export function addMonthsCivil(anchor: CivilDate, months: number, eom = false): CivilDate {
  const index = anchor.y * 12 + (anchor.m - 1) + months;
  const y = Math.floor(index / 12);
  const m = index - y * 12 + 1;
  const last = daysInMonth(y, m);
  const d = eom && isMonthEnd(anchor) ? last : Math.min(anchor.d, last);
  return { y, m, d };
}

export const addMonths = (date: IsoDate, months: number, eom = false): IsoDate => isoFromCivil(addMonthsCivil(civilFromIso(date), months, eom));

/** Day order of two civil dates: negative, zero or positive as a is before, on or after b. */
export const compareCivil = (a: CivilDate, b: CivilDate): number => a.y - b.y || a.m - b.m || a.d - b.d;

/** True when two civil dates are the same day. */
export const sameCivil = (a: CivilDate, b: CivilDate): boolean => a.y === b.y && a.m === b.m && a.d === b.d;

export const compareIso = (a: IsoDate, b: IsoDate): number => (a < b ? -1 : a > b ? 1 : 0);
