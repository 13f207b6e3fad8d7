import { useEffect, useState, type ReactNode } from 'react';
import { createPortal, flushSync } from 'react-dom';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { WorkbenchPrintSummary } from './PrintTab.tsx';
import './printSummary.css';

/** True when the Print section's own summary is mounted (it then prints, with the title typed there). */
const printSectionOpen = (): boolean => document.querySelector('.print-tab') !== null;

/**
 * Makes any print of the workbench (the browser's Print command, Ctrl+P or Cmd+P, window.print())
 * give the one-page summary. The summary is rendered only while printing: `beforeprint` renders it
 * synchronously (flushSync) into a print root at the end of <body>, and the print stylesheet
 * (printSummary.css) then hides everything else; `afterprint` removes it. So no edit pays for it.
 * While the Print section is open its own summary (with its title) is the one printed.
 */
export function PrintOnDemand({ result, rollResult = null }: { result: WorkbenchBuild; rollResult?: ReactNode | null }) {
  const [host, setHost] = useState<HTMLElement | null>(null);
  const [printing, setPrinting] = useState(false);
  useEffect(() => {
    const el = document.createElement('div');
    el.className = 'print-root print-on-demand';
    document.body.appendChild(el);
    setHost(el);
    const before = (): void => {
      if (!printSectionOpen()) flushSync(() => setPrinting(true));
    };
    const after = (): void => setPrinting(false);
    // Some browsers signal printing only through the print media query.
    const media = typeof window.matchMedia === 'function' ? window.matchMedia('print') : null;
    const onMedia = (e: MediaQueryListEvent): void => (e.matches ? before() : after());
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    media?.addEventListener?.('change', onMedia);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
      media?.removeEventListener?.('change', onMedia);
      el.remove();
    };
  }, []);
  if (!host || !printing) return null;
  return createPortal(<WorkbenchPrintSummary result={result} rollResult={rollResult} />, host);
}
