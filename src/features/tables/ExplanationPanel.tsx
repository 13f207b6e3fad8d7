import { useEffect, useId, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { fullText, readHowText, type DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { explainKeyCell, type KeyCell } from './explainCell.ts';
import './explanation.css';

interface Props {
  readonly result: WorkbenchBuild;
  readonly display: DisplaySettings;
  readonly cell: KeyCell;
  readonly onClose: () => void;
  /** Writes to the clipboard; default navigator.clipboard.writeText. */
  readonly writeText?: (text: string) => Promise<void>;
}

/**
 * The explanation of one key-maturity number, beside the table (a panel, not a modal): its
 * definition with the conventions filled in, the inputs, the steps ending in the number to all
 * digits, the quotes it depends on most (each a link to its sheet row), its value under each
 * method, and Copy as text. Every figure comes from the core (explainKeyCell); loaded on first use.
 */
export function ExplanationPanel({ result, display, cell, onClose, writeText }: Props) {
  const rows = useAppStore((s) => s.workspace.quotes);
  const showRow = useAppStore((s) => s.showRow);
  const model = useMemo(() => explainKeyCell(result, display, cell), [result, display, cell]);
  const [status, setStatus] = useState<{ text: string; error: boolean } | null>(null);
  const headingId = useId();
  const panelRef = useRef<HTMLElement>(null);
  // Opening a number (or another one) moves the focus to the panel, so a screen reader reads it.
  useEffect(() => {
    panelRef.current?.focus({ preventScroll: true });
    setStatus(null);
  }, [cell]);
  const onKeyDown = (e: KeyboardEvent<HTMLElement>): void => {
    if (e.key === 'Escape') {
      e.preventDefault();
      onClose();
    }
  };
  if (!model.ok) {
    return (
      <aside className="explain-panel" ref={panelRef} tabIndex={-1} aria-labelledby={headingId} onKeyDown={onKeyDown}>
        <div className="explain-head">
          <h3 id={headingId}>No explanation</h3>
          <button type="button" onClick={onClose}>
            Close
          </button>
        </div>
        <p>{model.errors[0]!.message}</p>
      </aside>
    );
  }
  const { title, explanation: e, quotes, quotesNote, methods, text } = model.value;
  const c = e.conventions;
  const rowOfQuote = (index: number | null): string => {
    if (index === null) return 'the valuation date';
    const row = result.conversion.rowOfQuote[index];
    return row === undefined ? `quote ${index}` : `row ${row + 1}`;
  };
  const copy = async (): Promise<void> => {
    try {
      await (writeText ?? ((t: string) => navigator.clipboard.writeText(t)))(text);
      setStatus({ text: 'Copied the explanation as plain text.', error: false });
    } catch {
      setStatus({ text: 'The browser refused the clipboard; select the text of the panel and copy it.', error: true });
    }
  };
  return (
    <aside className="explain-panel" ref={panelRef} tabIndex={-1} aria-labelledby={headingId} onKeyDown={onKeyDown} data-testid="explanation">
      <div className="explain-head">
        <h3 id={headingId}>{title}</h3>
        <button type="button" onClick={onClose} aria-label="Close the explanation">
          Close
        </button>
      </div>
      <p className="explain-value">
        <span className="mono" data-field="value">
          {fullText(e.value)}
        </span>{' '}
        <span className="tag">{e.unit}</span>
      </p>
      <h4>Definition</h4>
      <p>{e.formula}</p>
      <p className="small muted">
        Compounding {c.compounding ?? 'none (a discount factor)'}; day count {c.dayCount ?? 'none'}
        {c.frequency === undefined ? '' : `; ${c.frequency} payments a year`}; curve day count {c.curveDayCount}; interpolation {c.interpolation}; extrapolation {c.extrapolation}; business-day
        rule {c.businessDay}; calendar {c.calendar}.
      </p>
      <h4>Inputs</h4>
      <ul className="explain-list">
        {e.dates.map((d) => (
          <li key={d.name}>
            <span className="mono">{d.name}</span>: given {d.given}, unadjusted {d.unadjusted}, adjusted {d.adjusted} <span className="muted">({d.rule})</span>
          </li>
        ))}
        {e.yearFractions.map((y) => (
          <li key={y.name}>
            <span className="mono">{y.name}</span> = <span className="mono">{fullText(y.value)}</span> years from {y.from} to {y.to}; {y.rule}
          </li>
        ))}
        {e.reads.map((r) => (
          <li key={r.name}>
            <span className="mono">{r.name}</span> on {r.date}: DF = <span className="mono">{fullText(r.discount)}</span>, ln DF = <span className="mono">{fullText(r.lnDiscount)}</span>;{' '}
            {readHowText(r, (i) => rowOfQuote(i))}
            {r.how === 'interpolated' || r.how === 'extrapolated' ? <div className="small muted">{r.formula}</div> : null}
          </li>
        ))}
      </ul>
      <h4>Steps</h4>
      <ol className="explain-list">
        {e.steps.map((s) => (
          <li key={s.name}>
            <code>{s.formula}</code> = <span className="mono">{fullText(s.value)}</span> <span className="muted small">({s.unit})</span>
          </li>
        ))}
      </ol>
      <h4>Quotes it depends on most</h4>
      {quotesNote && <p className="small muted">Sensitivities {quotesNote}.</p>}
      {quotes.length > 0 && (
        <ol className="explain-list">
          {quotes.map((q, k) => {
            const row = q.row === null ? undefined : rows[q.row];
            return (
              <li key={k}>
                {row ? (
                  <button type="button" className="linklike" onClick={() => showRow(row.id)}>
                    Row {q.row! + 1}: {q.kind} {q.maturity}
                  </button>
                ) : (
                  `${q.kind} ${q.maturity}`
                )}{' '}
                <span className="mono">{fullText(q.bpPerBp)}</span> bp per bp <span className="muted small">(through its {q.yieldLabel})</span>
              </li>
            );
          })}
        </ol>
      )}
      <h4>Under each interpolation method</h4>
      <table className="data explain-methods" aria-label="The number under each interpolation method">
        <thead>
          <tr>
            <th scope="col">Method</th>
            <th scope="col">
              Value <span className="tag">{e.unit}</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {methods.map((m) => (
            <tr key={m.method} className={m.current ? 'selected' : ''}>
              <th scope="row">
                {m.label}
                {m.current ? ' (this curve)' : ''}
              </th>
              <td className="n">{m.value === null ? `not available: ${m.error ?? ''}` : fullText(m.value)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="explain-actions">
        <button type="button" onClick={() => void copy()}>
          Copy as text
        </button>
        <span role="status" className={status?.error ? 'explain-error small' : 'muted small'}>
          {status?.text ?? ''}
        </span>
      </div>
      <p className="small muted">An analysis aid, not investment advice: verify figures against official sources.</p>
    </aside>
  );
}
