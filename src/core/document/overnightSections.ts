/**
 * The workspace's overnight-curve sections (document version 2, both optional): `turns`, a list of
 * turns `{name, from, to, spreadBp, calendar?}` (or `solveFrom`, a quote's position, in place of
 * `spreadBp`), and `meetingSteps`, `{on, effectiveDates}`. Absent, the curve is built exactly as before. Each error names its path and says what would be valid.
 */
import { coreError, type CoreError } from '../result.ts';
import { compareIso, parseIsoDate, type IsoDate } from '../time/date.ts';
import { typeName } from '../kinds/fields.ts';
import { isPlainObject } from './plainObject.ts';
import { LIMITS } from './limits.ts';
import type { MeetingSteps, Turn } from './types.ts';

/** At most this many turns, and this many effective dates. */
export const MAX_TURNS = 60;
export const MAX_EFFECTIVE_DATES = 400;
/** A turn's spread in bp lies within plus or minus this. */
export const TURN_SPREAD_MAX_BP = 1000;
const TURN_KEYS = ['name', 'from', 'to', 'spreadBp', 'solveFrom', 'calendar'];
const STEP_KEYS = ['on', 'effectiveDates'];

const isDate = (v: unknown): v is IsoDate => typeof v === 'string' && parseIsoDate(v) !== null;

/** Reads `turns`; undefined when absent. Errors are pushed with paths `turns[i].field`. */
export function readTurns(raw: unknown, errors: CoreError[]): readonly Turn[] | undefined {
  if (raw === undefined) return undefined;
  if (!Array.isArray(raw)) {
    errors.push(coreError('schema', 'turns', `turns must be a list of turns such as [{"name": "year end", "from": "2027-12-31", "to": "2027-12-31", "spreadBp": 10}], not ${typeName(raw)}`));
    return undefined;
  }
  if (raw.length > MAX_TURNS) {
    errors.push(coreError('range', 'turns', `turns has ${raw.length} entries; a workspace holds at most ${MAX_TURNS}`));
    return undefined;
  }
  const out: Turn[] = [];
  const names = new Set<string>();
  raw.forEach((v, i) => {
    const path = `turns[${i}]`;
    if (!isPlainObject(v)) {
      errors.push(coreError('schema', path, `${path} must be an object {"name", "from", "to", "spreadBp"}, not ${typeName(v)}`));
      return;
    }
    const before = errors.length;
    for (const key of Object.keys(v)) {
      if (!TURN_KEYS.includes(key)) errors.push(coreError('schema', `${path}.${key.slice(0, 40)}`, `${path}: unknown field "${key.slice(0, 40)}"; a turn has name, from, to, spreadBp or solveFrom, and optionally calendar`));
    }
    const name = typeof v.name === 'string' ? v.name.trim() : '';
    if (name === '' || name.length > LIMITS.setting) errors.push(coreError('schema', `${path}.name`, `${path}.name must be a text of 1 to ${LIMITS.setting} characters (such as "year end 2027"), not ${typeName(v.name)}`));
    else if (names.has(name)) errors.push(coreError('schema', `${path}.name`, `${path}.name: "${name}" names another turn too; give each turn its own name`));
    for (const key of ['from', 'to'] as const) {
      if (!isDate(v[key])) errors.push(coreError('schema', `${path}.${key}`, `${path}.${key} must be a date YYYY-MM-DD (the ${key === 'from' ? 'first' : 'last'} day whose overnight period carries the turn), not ${typeName(v[key])}`));
    }
    if (isDate(v.from) && isDate(v.to) && compareIso(v.to, v.from) < 0) {
      errors.push(coreError('range', `${path}.to`, `${path} (${name || 'turn'}): to ${v.to} is before from ${v.from}; give the last day on or after the first`));
    }
    const s = v.spreadBp;
    const q = v.solveFrom;
    if (q !== undefined) {
      // The spread solved from a quote (bootstrap/turnSolve.ts): its position, never both.
      if (s !== undefined) errors.push(coreError('schema', `${path}.spreadBp`, `${path} gives both spreadBp and solveFrom; keep one`));
      else if (q !== null && (typeof q !== 'number' || !Number.isInteger(q) || q < 0)) {
        errors.push(coreError('schema', `${path}.solveFrom`, `${path}.solveFrom (${name}) must be a quote's position in quotes (0 for the first), not ${typeName(q)}`));
      } else if (q !== null) {
        const other = raw.findIndex((t, j) => j < i && isPlainObject(t) && t.solveFrom === q);
        if (other >= 0) errors.push(coreError('schema', `${path}.solveFrom`, `${path} (${name}) and turns[${other}] are both solved from quotes[${q}]; one quote sets one spread`));
      }
    } else if (typeof s !== 'number' || !Number.isFinite(s) || Math.abs(s) > TURN_SPREAD_MAX_BP) {
      errors.push(coreError('range', `${path}.spreadBp`, `${path}.spreadBp must be a number of basis points from -${TURN_SPREAD_MAX_BP} to ${TURN_SPREAD_MAX_BP} (such as 10), not ${typeName(s)}`));
    }
    if (v.calendar !== undefined && (typeof v.calendar !== 'string' || v.calendar === '' || v.calendar.length > LIMITS.setting)) {
      errors.push(coreError('schema', `${path}.calendar`, `${path}.calendar must be a calendar id such as "us-gov-securities", not ${typeName(v.calendar)}`));
    }
    if (errors.length > before) return;
    names.add(name);
    const turn: Turn = q === undefined ? { name, from: v.from as IsoDate, to: v.to as IsoDate, spreadBp: s as number } : { name, from: v.from as IsoDate, to: v.to as IsoDate, solveFrom: q as number | null };
    out.push(v.calendar === undefined ? turn : { ...turn, calendar: v.calendar as string });
  });
  return out;
}

/** Reads `meetingSteps`; undefined when absent. */
export function readMeetingSteps(raw: unknown, errors: CoreError[]): MeetingSteps | undefined {
  if (raw === undefined) return undefined;
  if (!isPlainObject(raw)) {
    errors.push(coreError('schema', 'meetingSteps', `meetingSteps must be an object such as {"on": true, "effectiveDates": ["2027-01-28"]}, not ${typeName(raw)}`));
    return undefined;
  }
  const before = errors.length;
  for (const key of Object.keys(raw)) {
    if (!STEP_KEYS.includes(key)) errors.push(coreError('schema', `meetingSteps.${key.slice(0, 40)}`, `meetingSteps: unknown field "${key.slice(0, 40)}"; it has on and effectiveDates`));
  }
  if (typeof raw.on !== 'boolean') errors.push(coreError('schema', 'meetingSteps.on', `meetingSteps.on must be true or false, not ${typeName(raw.on)}`));
  const list = raw.effectiveDates;
  const dates: IsoDate[] = [];
  if (!Array.isArray(list)) errors.push(coreError('schema', 'meetingSteps.effectiveDates', `meetingSteps.effectiveDates must be a list of dates YYYY-MM-DD, not ${typeName(list)}`));
  else if (list.length > MAX_EFFECTIVE_DATES) errors.push(coreError('range', 'meetingSteps.effectiveDates', `meetingSteps.effectiveDates has ${list.length} dates; at most ${MAX_EFFECTIVE_DATES}`));
  else
    list.forEach((d, i) => {
      const path = `meetingSteps.effectiveDates[${i}]`;
      if (!isDate(d)) errors.push(coreError('schema', path, `${path} must be a date YYYY-MM-DD (the day the new policy rate applies), not ${typeName(d)}`));
      else if (dates.length > 0 && compareIso(d, dates[dates.length - 1]!) <= 0) errors.push(coreError('range', path, `${path}: ${d} is not after the date before it, ${dates[dates.length - 1]}; list each effective date once, in order`));
      else dates.push(d);
    });
  if (errors.length > before) return undefined;
  return { on: raw.on as boolean, effectiveDates: dates };
}
