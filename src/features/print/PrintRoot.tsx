import { useEffect, useState, type ReactNode } from 'react';
import { createPortal } from 'react-dom';

/**
 * Renders the printed summary into its own element at the end of <body>, hidden on screen, so
 * that printing with `printSummaryOnly()` shows it alone whatever the workbench's layout is.
 */
export function PrintRoot({ children }: { children: ReactNode }) {
  const [host, setHost] = useState<HTMLElement | null>(null);
  useEffect(() => {
    const el = document.createElement('div');
    el.className = 'print-root';
    document.body.appendChild(el);
    setHost(el);
    return () => el.remove();
  }, []);
  return host ? createPortal(children, host) : null;
}

/** Prints the summary alone: marks <body>, opens the print dialog, unmarks it afterwards. */
export function printSummaryOnly(): void {
  document.body.classList.add('print-summary-only');
  const done = (): void => {
    document.body.classList.remove('print-summary-only');
    window.removeEventListener('afterprint', done);
  };
  window.addEventListener('afterprint', done);
  window.print();
}

/** The button that prints the one-page summary. */
export function PrintSummaryButton() {
  return (
    <button type="button" onClick={printSummaryOnly} title="Print a one-page summary (A4 or US Letter, portrait)">
      Print summary
    </button>
  );
}
