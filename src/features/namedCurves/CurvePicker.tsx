import { useId, useState } from 'react';
import { discountedOnOf, NO_VALUE, isPlainObject, namedQuoteRow, namedQuoteValueField, removeNamedQuote, setNamedQuoteValue, quoteConvention, quoteConventionTag, type NamedCurveBuild, type WorkbenchCurves } from '../../core/index.ts';
import { setViewValues } from '../../state/viewValues.ts';
import { useAppStore } from '../../state/store.ts';
import { curveChoice, DEFAULT_NAME, VIEW_KEYS } from './curveChoice.ts';
import { CurveForm, RemoveCurve, removeShown } from './CurveForm.tsx';
import { NamedQuoteEditor } from './NamedQuoteEditor.tsx';

/** Errors listed before "and N more". */
const ERRORS_SHOWN = 8;

const roleText = (c: Pick<NamedCurveBuild, 'role' | 'index' | 'discountCurve'>): string =>
  c.role === 'projection' ? `projection, ${c.index ?? '?'} index, discounted on ${c.discountCurve ?? '?'}` : c.role === 'government' ? 'government bonds' : 'discounting';

/**
 * The curve picker: which curve the charts and tables show (the default curve, which the sheet
 * edits, or a named curve of the workspace), the named curves' errors, each naming the curve and
 * field to change, and the chosen named curve's quotes with the curve each builds and the curve
 * that discounted it. Curves are added, changed and removed here (CurveForm.tsx), and a named
 * curve's quotes edited row by row (NamedQuoteEditor.tsx); every change is one undo step.
 * `adding` opens the form for a new curve (the workbench's button for a workspace of one curve).
 */
export function CurvePicker({ named, adding = false, onAdding }: { named: WorkbenchCurves; adding?: boolean; onAdding?: (open: boolean) => void }) {
  const id = useId();
  const view = useAppStore((s) => s.workspace.view);
  const raw = useAppStore((s) => s.workspace.curves);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const [form, setForm] = useState<'' | 'add' | 'change'>(adding ? 'add' : '');
  // The curve whose removal waits on its dependents, named when Remove was pressed (the picker may move on meanwhile).
  const [removing, setRemoving] = useState<{ readonly name: string; readonly dependents: readonly string[] } | null>(null);
  const close = () => {
    setForm('');
    setRemoving(null);
    onAdding?.(false);
  };
  // Every curve the document names, built or not (a curve refused by the reader can still be changed or removed).
  const allNames = (raw ?? []).flatMap((c) => (isPlainObject(c) && typeof c.name === 'string' ? [c.name] : []));
  const choice = curveChoice(view, allNames);
  const shown = named.curves.find((c) => c.name === choice.shown) ?? null;
  const errors = [...named.errors, ...named.curves.flatMap((c) => c.build.errors)];
  const count = raw?.length ?? 0;
  return (
    <section className="panel named-curves" aria-label="Curves of this workspace">
      <div className="panel-head">
        <label htmlFor={`${id}-pick`}>
          <strong>Curve shown</strong>
        </label>
        <select id={`${id}-pick`} value={choice.shown} disabled={readOnly} onChange={(e) => setViewValues({ [VIEW_KEYS.shown]: e.target.value }, 'Show another curve')}>
          <option value="">{DEFAULT_NAME}: the sheet's quotes (discounting)</option>
          {allNames.map((n, i) => {
            const c = named.curves.find((x) => x.name === n);
            return (
              <option key={`${i}:${n}`} value={n}>
                {n}: {c ? roleText(c) : 'not read'}
                {c?.build.curve ? '' : ' (not built)'}
              </option>
            );
          })}
        </select>
        <button type="button" disabled={readOnly} aria-expanded={form === 'add'} onClick={() => setForm('add')}>
          Add a curve
        </button>
        {choice.shown !== '' && (
          <>
            <button type="button" disabled={readOnly} onClick={() => setForm('change')}>
              Change {choice.shown}
            </button>
            <button type="button" disabled={readOnly} onClick={() => {
              const dependents = removeShown(choice.shown, false);
              setRemoving(dependents.length > 0 ? { name: choice.shown, dependents } : null);
            }}>
              Remove {choice.shown}
            </button>
          </>
        )}
      </div>
      {form === 'add' && <CurveForm key="add" editing={null} names={allNames} onDone={close} />}
      {form === 'change' && choice.shown !== '' && <CurveForm key={choice.shown} editing={choice.shown} names={allNames} onDone={close} />}
      {removing && <RemoveCurve name={removing.name} dependents={removing.dependents} onDone={close} />}
      <p className="muted small">
        This workspace holds {count} named {count === 1 ? 'curve' : 'curves'} besides the default one. The sheet's quotes build the curve "{DEFAULT_NAME}" and are discounted on it; the charts and tables show the curve chosen
        here.
      </p>
      {errors.length > 0 && (
        <div className="field-error" role="alert">
          <p>
            {errors.length === 1 ? 'A named curve has a problem' : `The named curves have ${errors.length} problems`} (the workspace keeps them as they are; change the curve or its quotes here, or correct the file and open it again):
          </p>
          <ul>
            {errors.slice(0, ERRORS_SHOWN).map((e, i) => (
              <li key={i}>{e.message}</li>
            ))}
          </ul>
          {errors.length > ERRORS_SHOWN && <p>and {errors.length - ERRORS_SHOWN} more</p>}
        </div>
      )}
      {shown && <NamedQuotes curve={shown} raw={raw} named={named} names={allNames} />}
    </section>
  );
}

/** Which curve the charts and tables show, said above them when it is a named curve (the scenarios, the roll and the print follow it too). */
export function ShownCurveNote({ named }: { named: WorkbenchCurves }) {
  const view = useAppStore((s) => s.workspace.view);
  const shown = curveChoice(view, named.curves.map((c) => c.name)).shown;
  if (shown === '') return null;
  return (
    <p className="banner shown-curve" role="status">
      The charts and tables show the curve <strong>{shown}</strong> (chosen above the sheet); so do the scenarios, roll versus term and the print.
    </p>
  );
}

/**
 * A named curve's quotes as the file gives them, with the curve each builds and the curve that
 * discounted it: each value typed in place, each row edited whole (Edit), removed (Delete), or a
 * quote added.
 */
function NamedQuotes({ curve, raw, named, names }: { curve: NamedCurveBuild; raw: readonly unknown[] | undefined; named: WorkbenchCurves; names: readonly string[] }) {
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const [editing, setEditing] = useState<number | null>(null);
  const position = (raw ?? []).findIndex((c) => isPlainObject(c) && c.name === curve.name);
  const entry = raw?.[position];
  const quotes: readonly unknown[] = isPlainObject(entry) && Array.isArray(entry.quotes) ? entry.quotes : [];
  const prefix = `curves[${position}].quotes[`;
  const errorOf = (k: number): string | undefined => [...named.errors, ...curve.build.errors].find((e) => e.path.startsWith(`${prefix}${k}]`))?.message;
  return (
    <>
      <p className="small">
        Quotes of <strong>{curve.name}</strong> ({quotes.length}), as the file writes them (a rate as a decimal, 0.0263 for 2.63%; a price per 100; ISO dates): type a value in place, or Edit a
        row. The sheet below edits the curve "{DEFAULT_NAME}".
      </p>
      <div className="table-scroll" tabIndex={0} role="region" aria-label={`Quotes of ${curve.name} (scrolls sideways)`}>
        <table className="data named-quotes" aria-label={`Quotes of the curve ${curve.name}`}>
          <thead>
            <tr>
              <th scope="col">No.</th>
              <th scope="col">Kind</th>
              <th scope="col">Maturity</th>
              <th scope="col">Quote (decimal or per 100)</th>
              <th scope="col">Builds</th>
              <th scope="col">Discounted on</th>
              <th scope="col">Change</th>
            </tr>
          </thead>
          <tbody>
            {quotes.map((rawQuote, k) => {
              const q = curve.build.workspace?.quotes.find((x) => x.index === k);
              const ins = curve.build.instruments.find((x) => x.index === k);
              const r = curve.build.repricing.find((x) => x.index === k);
              const error = errorOf(k);
              // Whether the sheet's row can hold it whole (else only its value is typed), read once per row.
              const sheetRow = namedQuoteRow(rawQuote) !== null;
              const kind = isPlainObject(rawQuote) && typeof rawQuote.kind === 'string' ? rawQuote.kind.slice(0, 20) : '?';
              const on = ins ? discountedOnOf(ins) : null;
              return (
                <tr key={k}>
                  <td>{k + 1}</td>
                  <td>{kind}</td>
                  <td>{q?.maturity ?? (isPlainObject(rawQuote) && typeof rawQuote.tenor === 'string' ? rawQuote.tenor.slice(0, 20) : '')}</td>
                  <td>
                    <ValueCell curve={curve.name} k={k} raw={rawQuote} />
                    {r && q ? <span className="tag">{quoteConventionTag(quoteConvention(q))}</span> : null}
                  </td>
                  {error ? (
                    <td colSpan={2} className="field-error">
                      not in the curve: {error}
                    </td>
                  ) : (
                    <>
                      <td>{ins ? curve.name : NO_VALUE}</td>
                      <td title={on === null && ins && curve.role === 'projection' ? `It fixes a ratio of ${curve.name}'s own discount factors, so it reads no other curve` : undefined}>
                        {!ins ? NO_VALUE : on ?? (curve.role === 'projection' ? 'none (own DF ratio)' : curve.name)}
                      </td>
                    </>
                  )}
                  <td>
                    <button type="button" disabled={readOnly || !sheetRow} title={sheetRow ? undefined : 'It has fields the sheet has no cell for: type its value only'} onClick={() => setEditing(k)} aria-label={`Edit ${curve.name} quote ${k + 1}`}>
                      Edit
                    </button>{' '}
                    <button
                      type="button"
                      disabled={readOnly}
                      aria-label={`Delete ${curve.name} quote ${k + 1}`}
                      onClick={() => {
                        const s = useAppStore.getState();
                        setEditing(null);
                        s.commit({ ...s.workspace, curves: removeNamedQuote(s.workspace.curves ?? [], curve.name, k) }, `Delete ${curve.name} quote ${k + 1}`);
                      }}
                    >
                      Delete
                    </button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {editing === null ? (
        <button type="button" disabled={readOnly} onClick={() => setEditing(quotes.length)}>
          Add a quote to {curve.name}
        </button>
      ) : (
        <NamedQuoteEditor key={`${curve.name}:${editing}`} curve={curve.name} role={curve.role} k={editing} names={names} onDone={() => setEditing(null)} />
      )}
    </>
  );
}

/** A named curve's quote value as typed (the file's unit), committed on each keystroke as one undo step per stretch of typing. */
function ValueCell({ curve, k, raw }: { curve: string; k: number; raw: unknown }) {
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const [draft, setDraft] = useState<string | null>(null);
  const field = namedQuoteValueField(raw);
  if (field === null || !isPlainObject(raw)) return <span>{NO_VALUE} </span>;
  const v = raw[field];
  const text = draft ?? (typeof v === 'string' || typeof v === 'number' ? String(v) : '');
  const key = `named-quote:${curve}:${k}`;
  return (
    <input
      className="named-value"
      aria-label={`${curve} quote ${k + 1} ${field}`}
      value={text}
      size={9}
      maxLength={40}
      disabled={readOnly}
      onChange={(e) => {
        setDraft(e.target.value);
        const s = useAppStore.getState();
        s.commit({ ...s.workspace, curves: setNamedQuoteValue(s.workspace.curves ?? [], curve, k, e.target.value) }, `Edit ${curve} quote ${k + 1}`, key);
      }}
      onBlur={() => {
        setDraft(null);
        useAppStore.getState().endEdit();
      }}
      onKeyDown={(e) => {
        if (e.key !== 'Escape') return;
        setDraft(null);
        useAppStore.getState().cancelEdit(key);
      }}
    />
  );
}
