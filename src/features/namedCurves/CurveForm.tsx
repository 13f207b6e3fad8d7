import { useId, useState } from 'react';
import { CURVE_ROLES, DEFAULT_CURVE_NAME, INDEX_TENORS, INTERPOLATIONS, INTERPOLATORS, isPlainObject, removeCurve, saveCurve, type CurveField, type CurveSpec, type InterpolationId, type NamedCurveRole, type WorkbenchDocument } from '../../core/index.ts';
import { viewOf } from '../../state/viewValues.ts';
import { useAppStore } from '../../state/store.ts';
import { VIEW_KEYS } from './curveChoice.ts';

/** The document with these named curves; none (undefined) leaves a workspace of one curve, without the key. */
function withCurves(ws: WorkbenchDocument, curves: readonly unknown[] | undefined): WorkbenchDocument {
  const { curves: _old, ...rest } = ws;
  return curves === undefined ? rest : { ...rest, curves };
}

const ROLE_TEXT: Readonly<Record<NamedCurveRole, string>> = {
  discounting: 'discounting (overnight index)',
  projection: 'projection (term index)',
  government: 'government bonds',
};

/** The form's first values: the curve named `editing` as the document holds it, or a new discounting curve. */
function specOf(curves: readonly unknown[] | undefined, editing: string | null): CurveSpec {
  const c = (curves ?? []).find((x) => isPlainObject(x) && x.name === editing);
  const e = isPlainObject(c) ? c : {};
  const settings = isPlainObject(e.curve) ? e.curve : {};
  const text = (v: unknown, fallback: string): string => (typeof v === 'string' ? v : fallback);
  return {
    name: text(e.name, ''),
    role: CURVE_ROLES.includes(e.role as NamedCurveRole) ? (e.role as NamedCurveRole) : 'discounting',
    index: text(e.index, '3M'),
    discountCurve: text(e.discountCurve, DEFAULT_CURVE_NAME),
    interpolation: INTERPOLATIONS.includes(settings.interpolation as InterpolationId) ? (settings.interpolation as InterpolationId) : 'monotone-convex',
  };
}

/**
 * Adds a named curve (`editing` null) or changes the curve named `editing`: name, role, a
 * projection curve's index and discounting curve, the interpolation. saveCurve (core) checks it;
 * each error sits on its field, naming what to change, and nothing is committed until it passes.
 * A saved curve is one undo step; a renamed curve's name follows into the curves discounted on it,
 * the basis swaps against it and the view's choices.
 */
export function CurveForm({ editing, names, onDone }: { editing: string | null; names: readonly string[]; onDone: () => void }) {
  const id = useId();
  const [spec, setSpec] = useState(() => specOf(useAppStore.getState().workspace.curves, editing));
  const [errors, setErrors] = useState<Partial<Record<CurveField, string>>>({});
  const set = (patch: Partial<CurveSpec>) => setSpec((s) => ({ ...s, ...patch }));
  const others = names.filter((n) => n !== editing);
  // A labelled field: an input (no options) or a select, with its error under it.
  const field = (label: string, key: keyof CurveSpec, options?: readonly (readonly [string, string])[]) => {
    const error = errors[key as CurveField];
    const props = { value: spec[key], onChange: (e: { target: { value: string } }) => set({ [key]: e.target.value }), ...(error ? { 'aria-invalid': true, 'aria-describedby': `${id}-${key}` } : {}) };
    return (
      <label>
        {label}
        {options ? (
          <select {...props}>
            {options.map(([v, t]) => (
              <option key={v} value={v}>
                {t}
              </option>
            ))}
          </select>
        ) : (
          <input {...props} size={14} maxLength={40} autoFocus />
        )}
        {error && (
          <span className="field-error" id={`${id}-${key}`}>
            {error}
          </span>
        )}
      </label>
    );
  };
  const save = () => {
    const s = useAppStore.getState();
    const r = saveCurve(s.workspace.curves, editing, spec);
    if (!r.ok) return setErrors(r.errors);
    const name = spec.name.trim();
    const view = { ...viewOf(s.workspace) };
    if (editing === null) view[VIEW_KEYS.shown] = name;
    else for (const k of [VIEW_KEYS.shown, VIEW_KEYS.of, VIEW_KEYS.over]) if (view[k] === editing) view[k] = name;
    s.commit({ ...withCurves(s.workspace, r.curves), view }, editing === null ? `Add the curve ${name}` : `Change the curve ${editing}`);
    onDone();
  };
  return (
    <form
      className="curve-form"
      aria-label={editing === null ? 'Add a named curve' : `Change the curve ${editing}`}
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      {field('Name', 'name')}
      {field(
        'Role',
        'role',
        CURVE_ROLES.map((r) => [r, ROLE_TEXT[r]]),
      )}
      {spec.role === 'projection' && field('Index tenor', 'index', Object.keys(INDEX_TENORS).map((t) => [t, t]))}
      {spec.role === 'projection' &&
        field('Discounted on', 'discountCurve', [
          ['', '(choose a curve)'],
          [DEFAULT_CURVE_NAME, `${DEFAULT_CURVE_NAME} (the sheet's curve)`],
          ...others.map((n) => [n, n] as const),
        ])}
      {spec.role !== 'projection' && errors.discountCurve && <span className="field-error">{errors.discountCurve}</span>}
      {field(
        'Interpolation',
        'interpolation',
        INTERPOLATIONS.map((m) => [m, INTERPOLATORS[m].label]),
      )}
      <button type="submit">{editing === null ? 'Add the curve' : 'Save the curve'}</button>
      <button type="button" onClick={onDone}>
        Cancel
      </button>
    </form>
  );
}

/**
 * Removing the curve `name` when other curves need it: says which, and offers to remove them too
 * or to keep them (change their discounting curve first). A curve nothing needs is removed at once
 * by the picker (one undo step).
 */
export function RemoveCurve({ name, dependents, onDone }: { name: string; dependents: readonly string[]; onDone: () => void }) {
  const list = dependents.map((n) => `"${n}"`).join(', ');
  return (
    <div className="curve-form field-error" role="alert">
      <p>
        {list} {dependents.length === 1 ? 'needs' : 'need'} the curve "{name}" (discounted on it, or a basis swap against it): change that first, or remove them too.
      </p>
      <button type="button" onClick={() => (removeShown(name, true), onDone())}>
        Remove {name} and {list}
      </button>
      <button type="button" onClick={onDone}>
        Cancel
      </button>
    </div>
  );
}

/** Removes the curve `name` (with the curves that need it when `all`) as one undo step; else the names of the curves that need it. */
export function removeShown(name: string, all: boolean): readonly string[] {
  const s = useAppStore.getState();
  const r = removeCurve(s.workspace.curves, name, all);
  if (!r.ok) return r.dependents;
  s.commit(withCurves(s.workspace, r.curves), `Remove the curve ${name}`);
  return [];
}
