import { useId, useState } from 'react';
import { DEFAULT_CURVE_NAME, EMPTY_ROW_TEXT, QUOTE_COLUMN_LABEL, QUOTE_COLUMNS, namedQuoteRow, setNamedQuote, isPlainObject, type QuoteRow, type RowIssues } from '../../core/index.ts';
import { useAppStore } from '../../state/store.ts';

/**
 * One quote of a named curve edited as a sheet row: every sheet column (kind, maturity or an FRA's
 * start x end, rate or price, coupon, frequency, day count, conventions), on or off, and on a
 * projection curve the other leg of a basis swap. The row is read by the sheet's own parseRow
 * (setNamedQuote in the core); a wrong cell keeps the form open with the error on that cell and the
 * document unchanged; a row that reads is one undo step. `k` past the curve's last quote adds one.
 */
export function NamedQuoteEditor({ curve, role, k, names, onDone }: { curve: string; role: string; k: number; names: readonly string[]; onDone: () => void }) {
  const id = useId();
  const [given] = useState((): unknown => {
    const entry = (useAppStore.getState().workspace.curves ?? []).find((c) => isPlainObject(c) && c.name === curve);
    return isPlainObject(entry) && Array.isArray(entry.quotes) ? entry.quotes[k] : undefined;
  });
  const adding = given === undefined;
  const [row, setRow] = useState<Omit<QuoteRow, 'id'>>(() => (adding ? null : namedQuoteRow(given)) ?? { enabled: true, ...EMPTY_ROW_TEXT });
  const [against, setAgainst] = useState(isPlainObject(given) && typeof given.against === 'string' ? given.against : '');
  const [issues, setIssues] = useState<RowIssues>({});
  const what = adding ? `New quote of ${curve}` : `Quote ${k + 1} of ${curve}`;
  const apply = () => {
    const s = useAppStore.getState();
    const r = setNamedQuote(s.workspace.curves ?? [], curve, k, row, against);
    if (!r.ok) return setIssues(r.issues);
    s.commit({ ...s.workspace, curves: r.curves }, adding ? `Add a quote to ${curve}` : `Edit ${curve} quote ${k + 1}`);
    onDone();
  };
  return (
    <form
      className="curve-form quote-form"
      aria-label={what}
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      <strong>{what}</strong>
      {QUOTE_COLUMNS.map((c) => {
        const issue = issues[c];
        const errorId = `${id}-${c}-error`;
        const attrs = issue?.severity === 'error' ? { 'aria-invalid': true, 'aria-describedby': errorId } : {};
        return (
          <label key={c}>
            {QUOTE_COLUMN_LABEL[c]}
            <input value={row[c] ?? ''} size={8} maxLength={200} autoFocus={c === 'kind'} onChange={(e) => setRow({ ...row, [c]: e.target.value })} {...attrs} />
            {issue && (
              <span className={issue.severity === 'error' ? 'field-error' : 'muted small'} id={errorId}>
                {issue.message}
              </span>
            )}
          </label>
        );
      })}
      <label>
        <input type="checkbox" checked={row.enabled} onChange={(e) => setRow({ ...row, enabled: e.target.checked })} /> In the curve
      </label>
      {role === 'projection' && (
        <label>
          Basis swap against
          <select value={against} onChange={(e) => setAgainst(e.target.value)}>
            <option value="">none (a swap on this index)</option>
            {[DEFAULT_CURVE_NAME, ...names.filter((n) => n !== curve)].map((n) => (
              <option key={n}>{n}</option>
            ))}
          </select>
        </label>
      )}
      <button type="submit">{adding ? 'Add the quote' : 'Apply'}</button>
      <button type="button" onClick={onDone}>
        Cancel
      </button>
    </form>
  );
}
