import { useId, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { fullText, type DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { explainKeyCell, type ExplainCell } from './explainCell.ts';
import './explanation.css';

interface Props {
  readonly result: WorkbenchBuild;
  readonly display: DisplaySettings;
  readonly cell: ExplainCell;
  readonly onClose: () => void;
  /** Writes to the clipboard; default navigator.clipboard.writeText. */
  readonly writeText?: (text: string) => Promise<void>;
}

/**
 * The explanation of one number (a key maturity, a forward of the strip or grid, a chart's point),
 * beside its table or chart (a panel, not a modal): its
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
  // Opening a number (or another one) moves the focus to the panel, so a screen reader reads it; in
  // the commit that shows it (a layout effect), so no key pressed meanwhile goes to the page behind.
  useLayoutEffect(() => {
    const el = panelRef.current;
    if (el) {
      el.scrollTop = 0; // another number reads from its top
      el.focus({ preventScroll: true });
    }
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
      <aside className="explain-panel" ref={panelRef} tabIndex={-1} aria-label="No explanation" onKeyDown={onKeyDown}>
        <p>{model.errors[0]!.message}</p>
        <button type="button" onClick={onClose}>
          Close
        </button>
      </aside>
    );
  }
  const { title, explanation: e, sections, quotes, text } = model.value;
  const copy = async (): Promise<void> => {
    try {
      await (writeText ?? ((t: string) => navigator.clipboard.writeText(t)))(text);
      setStatus({ text: 'Copied the explanation as plain text.', error: false });
    } catch {
      setStatus({ text: 'The browser refused the clipboard; select the text of the panel and copy it.', error: true });
    }
  };
  return (
    <aside className="explain-panel" ref={panelRef} tabIndex={-1} aria-labelledby={headingId} onKeyDown={onKeyDown}>
      <div className="explain-head">
        <h3 id={headingId}>{title}</h3>
        <button type="button" onClick={onClose} aria-label="Close the explanation">
          Close
        </button>
      </div>
      <p className="explain-value">
        <span className="mono" data-field="value">
          {e.valueText ?? fullText(e.value)}
        </span>{' '}
        <span className="tag">{e.unit}</span>
      </p>
      {sections.map((section, n) =>
        // Section 4 is the quotes behind the number: each a link to its sheet row.
        n === 3 ? (
          <section key={n} aria-label="Quotes it depends on most">
            <h4>{section.heading}</h4>
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
                    <span className="mono">{fullText(q.bpPerBp)}</span> <span className="muted small">(through its {q.yieldLabel})</span>
                  </li>
                );
              })}
            </ol>
          </section>
        ) : (
          <section key={n} aria-label={section.heading}>
            <h4>{section.heading}</h4>
            <ul className="explain-list">
              {section.lines.map((line, k) => (
                <li key={k}>{line}</li>
              ))}
            </ul>
          </section>
        ),
      )}
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
