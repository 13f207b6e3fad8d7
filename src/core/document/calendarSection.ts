import { coreError, type CoreError } from '../result.ts';
import { BUILT_IN_CALENDARS, businessCalendar, CALENDAR_FIRST_YEAR, CALENDAR_LAST_YEAR, isBuiltInCalendar, type CalendarContext, type CalendarEdits, type CustomCalendar } from '../time/calendars.ts';
import { parseIsoDate, type IsoDate } from '../time/date.ts';
import { listOf, typeName } from '../kinds/fields.ts';
import { LIMITS } from './limits.ts';
import { isPlainObject } from './plainObject.ts';

/**
 * The calendar sections of a version 2 workspace document:
 *   "calendars": {"<built-in id>": {"add": [dates], "remove": [dates]}, ...}   edits of built-in calendars
 *   "customCalendars": {"<name>": {"holidays": [dates]}, ...}                  calendars from pasted lists
 * Dates are ISO YYYY-MM-DD within the calendars' years (CALENDAR_FIRST_YEAR to CALENDAR_LAST_YEAR).
 * A custom calendar's weekends are Saturday and Sunday. Every error names its path (the list and
 * the entry, counted from 0, and the line of a pasted list, counted from 1) and says what is valid.
 */

/** A custom calendar's name: a lower-case letter, then letters, digits and hyphens (no `+`, which joins calendars). */
const CUSTOM_NAME = /^[a-z][a-z0-9-]*$/;

/** Why `name` cannot name a calendar of the workspace's own (the form, a built-in id), or null. */
export function customCalendarNameProblem(name: string): string | null {
  if (!CUSTOM_NAME.test(name) || name.length > LIMITS.id) return `a calendar's name is a lower-case letter followed by letters, digits and hyphens, at most ${LIMITS.id} characters (such as "desk-holidays")`;
  if (isBuiltInCalendar(name)) return `"${name}" is a built-in calendar; give your own calendar another name`;
  return null;
}

function readDates(v: unknown, path: string, errors: CoreError[]): IsoDate[] | null {
  if (!Array.isArray(v)) {
    errors.push(coreError('schema', path, `${path} must be a list of dates YYYY-MM-DD, not ${typeName(v)}`));
    return null;
  }
  if (v.length > LIMITS.calendarDates) {
    errors.push(coreError('range', path, `${path} has ${v.length} dates; a calendar list holds at most ${LIMITS.calendarDates}`));
    return null;
  }
  const out: IsoDate[] = [];
  const before = errors.length;
  v.forEach((d, i) => {
    const at = `${path}[${i}]`;
    const civil = typeof d === 'string' ? parseIsoDate(d) : null;
    if (civil === null) errors.push(coreError('schema', at, `${at} (line ${i + 1} of the list): ${typeName(d)} is not a date YYYY-MM-DD (for example 2027-12-24)`));
    else if (civil.y < CALENDAR_FIRST_YEAR || civil.y > CALENDAR_LAST_YEAR) errors.push(coreError('range', at, `${at} (line ${i + 1} of the list): ${d as string} is outside the calendars' years, ${CALENDAR_FIRST_YEAR} to ${CALENDAR_LAST_YEAR}`));
    else out.push(d as IsoDate);
  });
  return errors.length > before ? null : out;
}

function readEdits(v: unknown, path: string, errors: CoreError[]): CalendarEdits | null {
  if (!isPlainObject(v)) {
    errors.push(coreError('schema', path, `${path} must be an object such as {"add": ["2027-12-24"], "remove": []}, not ${typeName(v)}`));
    return null;
  }
  const before = errors.length;
  for (const key of Object.keys(v)) if (key !== 'add' && key !== 'remove') errors.push(coreError('schema', `${path}.${key}`, `unknown field "${path}.${key}"; a calendar's edits have add, remove`));
  const add = v.add === undefined ? [] : readDates(v.add, `${path}.add`, errors);
  const remove = v.remove === undefined ? [] : readDates(v.remove, `${path}.remove`, errors);
  if (errors.length > before || add === null || remove === null) return null;
  return { add, remove };
}

/**
 * Reads `calendars` and `customCalendars` (either may be absent) into the context the quotes'
 * dates are made with. Errors are pushed with their paths; the context holds what did read.
 */
export function readCalendarSections(calendars: unknown, customCalendars: unknown, errors: CoreError[]): CalendarContext {
  const edits: Record<string, CalendarEdits> = {};
  const custom: Record<string, CustomCalendar> = {};
  if (calendars !== undefined) {
    if (!isPlainObject(calendars)) errors.push(coreError('schema', 'calendars', `calendars must be an object of edits by calendar, such as {"target": {"add": ["2027-12-24"]}}, not ${typeName(calendars)}`));
    else
      for (const [id, v] of Object.entries(calendars)) {
        if (!isBuiltInCalendar(id)) {
          errors.push(coreError('unknown-identifier', `calendars.${id}`, `calendars.${id.slice(0, 40)}: only a built-in calendar is edited here, one of ${listOf(BUILT_IN_CALENDARS)}; a calendar of your own goes under customCalendars`));
          continue;
        }
        const e = readEdits(v, `calendars.${id}`, errors);
        if (e) edits[id] = e;
      }
  }
  if (customCalendars !== undefined) {
    if (!isPlainObject(customCalendars)) errors.push(coreError('schema', 'customCalendars', `customCalendars must be an object of calendars by name, such as {"desk-holidays": {"holidays": ["2027-12-24"]}}, not ${typeName(customCalendars)}`));
    else
      for (const [name, v] of Object.entries(customCalendars)) {
        const path = `customCalendars.${name.slice(0, 40)}`;
        if (!CUSTOM_NAME.test(name) || name.length > LIMITS.id) {
          errors.push(coreError('schema', path, `${path}: a calendar's name is a lower-case letter followed by letters, digits and hyphens, at most ${LIMITS.id} characters (such as "desk-holidays")`));
          continue;
        }
        if (isBuiltInCalendar(name)) {
          errors.push(coreError('schema', path, `${path}: "${name}" is a built-in calendar; edit it under calendars, or give your own calendar another name`));
          continue;
        }
        if (!isPlainObject(v)) {
          errors.push(coreError('schema', path, `${path} must be an object such as {"holidays": ["2027-12-24"]}, not ${typeName(v)}`));
          continue;
        }
        const before = errors.length;
        for (const key of Object.keys(v)) if (key !== 'holidays') errors.push(coreError('schema', `${path}.${key}`, `unknown field "${path}.${key}"; a custom calendar has holidays`));
        const holidays = readDates(v.holidays, `${path}.holidays`, errors);
        if (errors.length > before || holidays === null) continue;
        custom[name] = { holidays };
        // A list that closes months on end is refused here, with the calendar's own words.
        const made = businessCalendar(name, { custom });
        if (!made.ok) {
          errors.push(coreError('range', `${path}.holidays`, `${path}.holidays: ${made.message}`));
          delete custom[name];
        }
      }
  }
  return {
    ...(Object.keys(edits).length > 0 ? { edits } : {}),
    ...(Object.keys(custom).length > 0 ? { custom } : {}),
  };
}

/** Whether a context changes nothing (no edits, no custom calendars). */
export const isEmptyCalendarContext = (c: CalendarContext): boolean => c.edits === undefined && c.custom === undefined;
