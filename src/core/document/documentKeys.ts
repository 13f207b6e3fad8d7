import { SCENARIO_KINDS, SCENARIO_SPACES, type Scenario, type ScenarioShape } from '../scenarios/scenarioShape.ts';
import type { Snapshot } from '../scenarios/scenarioSnapshots.ts';
import { coreError, type CoreError } from '../result.ts';
import { isIsoDate } from '../time/date.ts';
import { parseTenor } from '../time/tenor.ts';
import { LIMITS } from './limits.ts';
import { isPlainObject } from './plainObject.ts';

const typeName = (v: unknown): string => (v === null ? 'null' : Array.isArray(v) ? 'an array' : typeof v === 'string' ? `the text "${v.slice(0, 30)}"` : typeof v);

function exactKeys(v: Record<string, unknown>, required: readonly string[], optional: readonly string[], path: string, errors: CoreError[]): void {
  for (const k of Object.keys(v)) {
    if (!required.includes(k) && !optional.includes(k)) errors.push(coreError('schema', `${path}.${k.slice(0, 40)}`, `${path}: unknown field "${k.slice(0, 40)}"; it takes ${[...required, ...optional].join(', ')}`));
  }
  for (const k of required) if (!(k in v)) errors.push(coreError('schema', `${path}.${k}`, `${path}.${k}: required`));
}

function text(v: unknown, path: string, max: number, errors: CoreError[], allowEmpty = false): string | null {
  if (typeof v !== 'string') {
    errors.push(coreError('schema', path, `${path}: must be text, not ${typeName(v)}`));
    return null;
  }
  if ((!allowEmpty && v.trim() === '') || v.length > max) {
    errors.push(coreError('range', path, `${path}: must be ${allowEmpty ? '' : '1 to '}${max} characters${allowEmpty ? ' at most' : ''}, not ${v.length}`));
    return null;
  }
  return v;
}

function bp(v: unknown, path: string, errors: CoreError[]): number | null {
  if (typeof v !== 'number' || !Number.isFinite(v)) {
    errors.push(coreError('schema', path, `${path}: must be a number of basis points (25 = 0.25%), not ${typeName(v)}`));
    return null;
  }
  if (Math.abs(v) > LIMITS.bp) {
    errors.push(coreError('range', path, `${path}: ${v} bp is beyond the ${LIMITS.bp} bp a scenario may move`));
    return null;
  }
  return v;
}

function maturity(v: unknown, path: string, errors: CoreError[]): string | null {
  if (typeof v === 'string' && v.length <= 12 && ((parseTenor(v) !== null && v === v.trim()) || isIsoDate(v))) return v;
  errors.push(coreError('schema', path, `${path}: must be a tenor such as "5Y" or a date YYYY-MM-DD, not ${typeName(v)}`));
  return null;
}

function checkShape(v: unknown, path: string, errors: CoreError[]): ScenarioShape | null {
  if (!isPlainObject(v)) {
    errors.push(coreError('schema', path, `${path}: must be an object such as {"kind": "parallel", "bp": 25}, not ${typeName(v)}`));
    return null;
  }
  const before = errors.length;
  switch (v.kind) {
    case 'parallel': {
      exactKeys(v, ['kind', 'bp'], [], path, errors);
      const a = bp(v.bp, `${path}.bp`, errors);
      return errors.length > before || a === null ? null : { kind: 'parallel', bp: a };
    }
    case 'twist': {
      exactKeys(v, ['kind', 'short', 'pivot', 'long', 'bp'], [], path, errors);
      const short = maturity(v.short, `${path}.short`, errors);
      const pivot = maturity(v.pivot, `${path}.pivot`, errors);
      const long = maturity(v.long, `${path}.long`, errors);
      const s = bp(v.bp, `${path}.bp`, errors);
      return errors.length > before || short === null || pivot === null || long === null || s === null ? null : { kind: 'twist', short, pivot, long, bp: s };
    }
    case 'butterfly': {
      exactKeys(v, ['kind', 'short', 'belly', 'long', 'wingsBp', 'bellyBp'], [], path, errors);
      const short = maturity(v.short, `${path}.short`, errors);
      const belly = maturity(v.belly, `${path}.belly`, errors);
      const long = maturity(v.long, `${path}.long`, errors);
      const w = bp(v.wingsBp, `${path}.wingsBp`, errors);
      const b = bp(v.bellyBp, `${path}.bellyBp`, errors);
      return errors.length > before || short === null || belly === null || long === null || w === null || b === null ? null : { kind: 'butterfly', short, belly, long, wingsBp: w, bellyBp: b };
    }
    case 'key-rate': {
      exactKeys(v, ['kind', 'points'], [], path, errors);
      if (!Array.isArray(v.points) || v.points.length === 0 || v.points.length > LIMITS.keyRatePoints) {
        errors.push(coreError('schema', `${path}.points`, `${path}.points: must be a list of 1 to ${LIMITS.keyRatePoints} points such as {"at": "5Y", "bp": 10}`));
        return null;
      }
      const points: { at: string; bp: number }[] = [];
      v.points.forEach((p, i) => {
        const pp = `${path}.points[${i}]`;
        if (!isPlainObject(p)) {
          errors.push(coreError('schema', pp, `${pp}: must be an object such as {"at": "5Y", "bp": 10}`));
          return;
        }
        exactKeys(p, ['at', 'bp'], [], pp, errors);
        const at = maturity(p.at, `${pp}.at`, errors);
        const b = bp(p.bp, `${pp}.bp`, errors);
        if (at !== null && b !== null) points.push({ at, bp: b });
      });
      return errors.length > before ? null : { kind: 'key-rate', points };
    }
    default:
      errors.push(coreError('unknown-identifier', `${path}.kind`, `${path}.kind: must be one of ${SCENARIO_KINDS.join(', ')}, not ${typeName(v.kind)}`));
      return null;
  }
}

/** Validates the document's `scenarios` (absent = none): at most LIMITS.scenarios, unique ids, each shape complete. */
export function validateScenarios(v: unknown): { scenarios: Scenario[]; errors: CoreError[] } {
  const errors: CoreError[] = [];
  if (v === undefined) return { scenarios: [], errors };
  if (!Array.isArray(v)) return { scenarios: [], errors: [coreError('schema', 'scenarios', `scenarios must be a list, not ${typeName(v)}`)] };
  if (v.length > LIMITS.scenarios) return { scenarios: [], errors: [coreError('range', 'scenarios', `${v.length} scenarios is more than the ${LIMITS.scenarios} a workspace may hold; remove some`)] };
  const scenarios: Scenario[] = [];
  const ids = new Set<string>();
  v.forEach((raw, i) => {
    const path = `scenarios[${i}]`;
    if (!isPlainObject(raw)) {
      errors.push(coreError('schema', path, `${path}: must be an object with id, name, space and shape, not ${typeName(raw)}`));
      return;
    }
    const before = errors.length;
    exactKeys(raw, ['id', 'name', 'space', 'shape'], [], path, errors);
    const id = text(raw.id, `${path}.id`, LIMITS.id, errors);
    if (id !== null && ids.has(id)) errors.push(coreError('schema', `${path}.id`, `${path}.id: "${id}" is used by another scenario; ids must be unique`));
    const name = text(raw.name, `${path}.name`, LIMITS.name, errors);
    const space = raw.space;
    if (typeof space !== 'string' || !(SCENARIO_SPACES as readonly string[]).includes(space)) {
      errors.push(coreError('unknown-identifier', `${path}.space`, `${path}.space: must be one of ${SCENARIO_SPACES.join(', ')}, not ${typeName(space)}`));
    }
    const shape = checkShape(raw.shape, `${path}.shape`, errors);
    if (errors.length === before && id !== null && name !== null && shape !== null) {
      ids.add(id);
      scenarios.push({ id, name, space: space as Scenario['space'], shape });
    }
  });
  return { scenarios, errors };
}

/** Validates `note` (absent = ""): text of at most LIMITS.note characters. */
export function validateNote(v: unknown): { note: string; errors: CoreError[] } {
  if (v === undefined) return { note: '', errors: [] };
  const errors: CoreError[] = [];
  const note = text(v, 'note', LIMITS.note, errors, true);
  return { note: note ?? '', errors };
}

export type ViewValue = string | number | boolean | null | readonly string[];
const VIEW_KEY = /^[A-Za-z][A-Za-z0-9]{0,39}$/;

/**
 * Validates `view` (which panel is open and what is selected; the workbench chooses its keys):
 * a flat object of at most LIMITS.viewKeys keys (letters and digits), each value text, a finite
 * number, true/false, null or a list of texts, all capped in length.
 */
export function validateView(v: unknown): { view: Record<string, ViewValue>; errors: CoreError[] } {
  const errors: CoreError[] = [];
  if (v === undefined) return { view: {}, errors };
  if (!isPlainObject(v)) return { view: {}, errors: [coreError('schema', 'view', `view must be an object, not ${typeName(v)}`)] };
  const keys = Object.keys(v);
  if (keys.length > LIMITS.viewKeys) return { view: {}, errors: [coreError('range', 'view', `view has ${keys.length} keys; at most ${LIMITS.viewKeys}`)] };
  const view: Record<string, ViewValue> = {};
  for (const k of keys) {
    const path = `view.${k.slice(0, 40)}`;
    if (!VIEW_KEY.test(k)) {
      errors.push(coreError('schema', path, `${path}: a view key is letters and digits, starting with a letter`));
      continue;
    }
    const x = v[k];
    const okText = (s: unknown, max: number): s is string => typeof s === 'string' && s.length <= max;
    if (x === null || typeof x === 'boolean' || (typeof x === 'number' && Number.isFinite(x)) || okText(x, LIMITS.viewText)) view[k] = x as ViewValue;
    else if (Array.isArray(x) && x.length <= LIMITS.viewList && x.every((s) => okText(s, LIMITS.name))) view[k] = [...(x as string[])];
    else errors.push(coreError('schema', path, `${path}: must be text (up to ${LIMITS.viewText} characters), a number, true/false, null or a list of up to ${LIMITS.viewList} short texts`));
  }
  return { view, errors };
}

/** Validates `snapshots` (files only): at most LIMITS.snapshots, each with its frozen inputs; the inputs themselves are checked by the engine when rebuilt. */
export function validateSnapshots(v: unknown): { snapshots: Snapshot[]; errors: CoreError[] } {
  const errors: CoreError[] = [];
  if (v === undefined) return { snapshots: [], errors };
  if (!Array.isArray(v)) return { snapshots: [], errors: [coreError('schema', 'snapshots', `snapshots must be a list, not ${typeName(v)}`)] };
  if (v.length > LIMITS.snapshots) return { snapshots: [], errors: [coreError('range', 'snapshots', `${v.length} snapshots is more than the ${LIMITS.snapshots} a workspace may hold`)] };
  const snapshots: Snapshot[] = [];
  v.forEach((raw, i) => {
    const path = `snapshots[${i}]`;
    if (!isPlainObject(raw)) {
      errors.push(coreError('schema', path, `${path}: must be an object, not ${typeName(raw)}`));
      return;
    }
    const before = errors.length;
    exactKeys(raw, ['name', 'takenAt', 'settlement', 'quotes', 'curveHash'], ['curve'], path, errors);
    const name = text(raw.name, `${path}.name`, LIMITS.name, errors);
    const takenAt = text(raw.takenAt, `${path}.takenAt`, 40, errors);
    if (!isIsoDate(raw.settlement)) errors.push(coreError('schema', `${path}.settlement`, `${path}.settlement: must be a date YYYY-MM-DD`));
    if (raw.curve !== undefined && !isPlainObject(raw.curve)) errors.push(coreError('schema', `${path}.curve`, `${path}.curve: must be an object of curve settings`));
    if (!Array.isArray(raw.quotes) || raw.quotes.length > LIMITS.quotes) errors.push(coreError('schema', `${path}.quotes`, `${path}.quotes: must be a list of at most ${LIMITS.quotes} quotes`));
    const hash = raw.curveHash;
    if (hash !== null && !(typeof hash === 'string' && /^[0-9a-f]{1,32}$/.test(hash))) errors.push(coreError('schema', `${path}.curveHash`, `${path}.curveHash: must be a short hexadecimal hash or null`));
    if (errors.length === before && name !== null && takenAt !== null) {
      snapshots.push({ name, takenAt, settlement: raw.settlement as string, curve: raw.curve, quotes: raw.quotes as unknown[], curveHash: hash as string | null });
    }
  });
  return { snapshots, errors };
}
