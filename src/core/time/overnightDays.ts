/** The calendar days of the overnight forward view (curve/overnightView.ts). */
import { isoFromSerial, serialFromIso, type IsoDate } from './date.ts';

/** Every calendar day from `from` (inclusive) to `to` (exclusive), as dates. */
export function calendarDays(from: IsoDate, to: IsoDate): IsoDate[] {
  const a = serialFromIso(from);
  const b = serialFromIso(to);
  const out: IsoDate[] = [];
  for (let s = a; s < b; s++) out.push(isoFromSerial(s));
  return out;
}

/** The calendar day after `date` (the end of its one-day period). */
export const dayAfter = (date: IsoDate): IsoDate => isoFromSerial(serialFromIso(date) + 1);
/** The calendar day before `date`. */
export const dayBefore = (date: IsoDate): IsoDate => isoFromSerial(serialFromIso(date) - 1);
