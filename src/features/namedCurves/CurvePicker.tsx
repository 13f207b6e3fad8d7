import { useId, useState } from 'react';
import { discountedOnOf, NO_VALUE, isPlainObject, namedQuoteValueField, setNamedQuoteValue, quoteConvention, quoteConventionTag, type NamedCurveBuild, type WorkbenchCurves } from '../../core/index.ts';
import { setViewValues } from '../../state/viewValues.ts';
import { useAppStore } from '../../state/store.ts';
import { curveChoice, DEFAULT_NAME, VIEW_KEYS } from './curveChoice.ts';

/** Errors listed before "and N more". */
const ERRORS_SHOWN = 8;

const roleText = (c: Pick<NamedCurveBuild, 'role' | 'index' | 'discountCurve'>): string =>
  c.role === 'projection' ? `projection, ${c.index ?? '?'} index, discounted on ${c.discountCurve ?? '?'}` : c.role === 'government' ? 'government bonds' : 'discounting';

/**
 * The curve picker: which curve the charts and tables show (the default curve, which the sheet
 * edits, or a named curve of the workspace), the named curves' errors, each naming the curve and
 * field to change, and the chosen named curve's quotes with the curve each builds and the curve
 * that discounted it. Named curves are read-only here: they are kept as the file gave them.
 */
export function CurvePicker({ named }: { named: WorkbenchCurves }) {
  const id = useId();
  const view = useAppStore((s) => s.workspace.view);
  const raw = useAppStore((s) => s.workspace.curves);
  const readOnly = useAppStore((s) => s.readOnly !== null);
  const names = named.curves.map((c) => c.name);
  const choice = curveChoice(view, names);
  const shown = named.curves.find((c) => c.name === choice.shown) ?? null;
  const errors = [...named.errors, ...named.curves.flatMap((c) => c.build.errors)];
  return (
    <section className="panel named-curves" aria-label="Curves of this workspace">
      <div className="panel-head">
        <label htmlFor={`${id}-pick`}>
          <strong>Curve shown</strong>
        </label>
        <select id={`${id}-pick`} value={choice.shown} disabled={readOnly} onChange={(e) => setViewValues({ [VIEW_KEYS.shown]: e.target.value }, 'Show another curve')}>
          <option value="">{DEFAULT_NAME}: the sheet's quotes (discounting)</option>
          {named.curves.map((c) => (
            <option key={c.name} value={c.name}>
              {c.name}: {roleText(c)}
              {c.build.curve ? '' : ' (not built)'}
            </option>
          ))}
        </select>
      </div>
      <p className="muted small">
        This workspace holds {raw?.length ?? 0} named {raw?.length === 1 ? 'curve' : 'curves'} besides the default one. The sheet's quotes build the curve "{DEFAULT_NAME}" and are discounted on it; the charts and tables show the curve chosen
        here.
      </p>
      {errors.length > 0 && (
        <div className="field-error" role="alert">
          <p>
            {errors.length === 1 ? 'A named curve has a problem' : `The named curves have ${errors.length} problems`} (the workspace keeps them as they are; correct them in the file and open it again):
          </p>
          <ul>
            {errors.slice(0, ERRORS_SHOWN).map((e, i) => (
              <li key={i}>{e.message}</li>
            ))}
          </ul>
          {errors.length > ERRORS_SHOWN && <p>and {errors.length - ERRORS_SHOWN} more</p>}
        </div>
      )}
      {shown && <NamedQuotes curve={shown} raw={raw} named={named} />}
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

/** A named curve's quotes as the file gives them, read-only, with the curve each builds and the curve that discounted it. */
function NamedQuotes({ curve, raw, named }: { curve: NamedCurveBuild; raw: readonly unknown[] | undefined; named: WorkbenchCurves }) {
  const position = (raw ?? []).findIndex((c) => isPlainObject(c) && c.name === curve.name);
  const entry = raw?.[position];
  const quotes: readonly unknown[] = isPlainObject(entry) && Array.isArray(entry.quotes) ? entry.quotes : [];
  const prefix = `curves[${position}].quotes[`;
  const errorOf = (k: number): string | undefined => [...named.errors, ...curve.build.errors].find((e) => e.path.startsWith(`${prefix}${k}]`))?.message;
  return (
    <>
      <p className="small">
        Quotes of <strong>{curve.name}</strong> ({quotes.length}). Each value can be typed here, as the file writes it (a rate as a decimal, 0.0263 for 2.63%; a price per 100): saved, undone and
        in the link like a cell. Kinds, maturities and terms are as the file gave them; change those in the file and open it again. The sheet below edits the curve "{DEFAULT_NAME}".
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
            </tr>
          </thead>
          <tbody>
            {quotes.map((rawQuote, k) => {
              const q = curve.build.workspace?.quotes.find((x) => x.index === k);
              const ins = curve.build.instruments.find((x) => x.index === k);
              const r = curve.build.repricing.find((x) => x.index === k);
              const error = errorOf(k);
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
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
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
