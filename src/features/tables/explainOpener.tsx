import { lazy, Suspense, useRef, useState, type MouseEvent } from 'react';
import type { DisplaySettings } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useSettledValue } from '../../hooks/useSettledValue.ts';
import type { ExplainCell } from './explainCell.ts';

/** The explanation panel's code (and the explanation code of the core it calls) is fetched the first time a number is opened. */
const ExplanationPanel = lazy(() => import('./lazyTables.ts').then((m) => ({ default: m.ExplanationPanel })));

/**
 * Which number's explanation is open, and the button that opened it (Escape or Close gives it the
 * focus back). `same(a, b)` says whether two cells are one number (a second press closes it).
 */
export function useExplainOpener<C extends ExplainCell>(same: (a: C, b: C) => boolean) {
  const [open, setOpen] = useState<C | null>(null);
  const opener = useRef<HTMLElement | null>(null);
  const isOpen = (cell: C): boolean => open !== null && same(open, cell);
  /** Opens `cell` from `button` (which gets the focus back), or closes it when it is the one open. */
  const toggleAt = (button: HTMLElement, cell: C): void => {
    opener.current = button;
    setOpen(isOpen(cell) ? null : cell);
  };
  const toggle = (e: MouseEvent<HTMLElement>, cell: C): void => toggleAt(e.currentTarget, cell);
  return {
    open,
    isOpen,
    toggle,
    toggleAt,
    close: (): void => {
      setOpen(null);
      opener.current?.focus();
    },
    /**
     * The figure `text` as a button opening (a second press closing) the explanation of `cell`, named
     * "text: explain <what>"; `shown` false when the open one is not on show (its table moved on).
     */
    button: (cell: C, text: string, what: string, shown = true) => (
      <button type="button" className="cell-explain" aria-label={`${text}: explain ${what}`} aria-expanded={shown && isOpen(cell)} onClick={(e) => toggle(e, cell)}>
        {text}
      </button>
    ),
  };
}

/**
 * The open explanation beside its table or chart. It follows the build once typing pauses (each
 * one rebuilds the curve under every method): a keystroke in the sheet repaints the table first.
 */
export function OpenExplanation({ result, display, cell, onClose }: { result: WorkbenchBuild; display: DisplaySettings; cell: ExplainCell | null; onClose: () => void }) {
  const settled = useSettledValue(result);
  // A number opened reads the build its table shows now (the settled one may lag an edit just made); after that the panel follows the settled build.
  const openedWith = useRef(result);
  const wasOpen = useRef(false);
  if (cell && !wasOpen.current) openedWith.current = result;
  wasOpen.current = cell !== null;
  if (!cell) return null;
  return (
    <Suspense fallback={<p className="muted small" role="status">Loading the explanation…</p>}>
      <ExplanationPanel result={openedWith.current === result ? result : settled} display={display} cell={cell} onClose={onClose} />
    </Suspense>
  );
}
