import { useEffect, useRef } from 'react';
import { formatCount, pasteQuoteCap, QUOTE_COLUMN_LABEL } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';

const SEPARATOR_TEXT: Readonly<Record<string, string>> = { '\t': 'tabs', ',': 'commas', ';': 'semicolons' };

/**
 * A header paste before it is applied: each pasted column, the sheet column it fills (or that it
 * is ignored) and why, a few of its values, and how many rows read as quotes. Replacing the sheet
 * is refused when no row would give a quote.
 */
export function PastePreview() {
  const pending = useAppStore((s) => s.pendingPaste);
  const { confirmPaste, cancelPaste } = useAppStore.getState();
  const ref = useRef<HTMLElement>(null);
  // The choice is the next step: focus its first enabled button (Enter replaces, Escape cancels).
  useEffect(() => {
    ref.current?.querySelector<HTMLButtonElement>('.paste-actions button:not(:disabled)')?.focus();
  }, [pending]);
  if (!pending) return null;
  const { block, preview } = pending;
  return (
    <section
      ref={ref}
      className="notice paste-preview"
      role="region"
      aria-labelledby="paste-preview-title"
      onKeyDown={(e) => {
        if (e.key === 'Escape') cancelPaste();
      }}
    >
      <h3 id="paste-preview-title" className="paste-preview-title">
        Paste preview: {preview.rows} {preview.rows === 1 ? 'row' : 'rows'} split on {SEPARATOR_TEXT[block.separator]}; {preview.quotes} read as quotes
        {preview.withErrors > 0 && <>, {preview.withErrors} with cells to fix</>}. Nothing has changed yet.
      </h3>
      <table className="mapping">
        <caption className="sr-only">How each pasted column is read</caption>
        <thead>
          <tr>
            <th scope="col">Pasted column</th>
            <th scope="col">Read as</th>
            <th scope="col">Why</th>
            <th scope="col">First values</th>
          </tr>
        </thead>
        <tbody>
          {block.columns.map((c, i) => (
            <tr key={i} className={c.column || c.readAs ? '' : 'ignored'}>
              <td>{c.header === '' ? <em>(no header)</em> : c.header}</td>
              <td>{c.readAs ?? (c.column ? QUOTE_COLUMN_LABEL[c.column] : 'ignored')}</td>
              <td>{c.reason}</td>
              <td className="sample">{c.sample.join(' · ')}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {block.notes && block.notes.length > 0 ? (
        <ul className="paste-notes" aria-label="What the paste read">
          {block.notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      ) : null}
      {preview.leftOut > 0 && !preview.refusal ? (
        <p className="left-out" role="note">
          The paste has {formatCount(preview.rows)} rows and a workspace holds at most {pasteQuoteCap()} quotes: replacing keeps the first {formatCount(preview.rows - preview.leftOut)} and leaves out {formatCount(preview.leftOut)}
          {preview.appendLeftOut > preview.leftOut ? `; appending leaves out ${formatCount(preview.appendLeftOut)}` : ''}.
        </p>
      ) : null}
      {preview.refusal && (
        <p className="refusal" role="alert">
          The sheet cannot be replaced: {preview.refusal}.
        </p>
      )}
      <div className="paste-actions">
        <button type="button" disabled={preview.refusal !== null} onClick={() => confirmPaste('replace')}>
          Replace the sheet
        </button>{' '}
        <button type="button" disabled={preview.appendRefusal !== null} title={preview.appendRefusal ?? undefined} onClick={() => confirmPaste('append')}>
          Append to the sheet
        </button>{' '}
        <button type="button" className="linklike" onClick={cancelPaste}>
          Cancel
        </button>
      </div>
    </section>
  );
}
