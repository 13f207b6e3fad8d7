import { lazy, startTransition, Suspense, useEffect, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { CurveTableExport } from '../features/tables/CurveTableExport.tsx';
import { KeyMaturitiesTable } from '../features/tables/KeyMaturitiesTable.tsx';
import type { WorkbenchBuild } from '../hooks/useCurveBuild.ts';
import { useAppStore } from '../state/store.ts';
import type { WorkbenchTab } from './extensions.tsx';

type TabDef = WorkbenchTab;

/** The forward strip's, the forward grid's, the forward calculator's and the quote check's code is fetched the first time their tab opens (their own chunks), so the first load carries less. */
const ForwardStripTable = lazy(() => import('../features/tables/lazyTables.ts').then((m) => ({ default: m.ForwardStripTable })));
const ForwardGridTable = lazy(() => import('../features/tables/lazyTables.ts').then((m) => ({ default: m.ForwardGridTable })));
const ForwardCalculator = lazy(() => import('../features/tables/lazyTables.ts').then((m) => ({ default: m.ForwardCalculator })));
/** The quote check (with the schedules and their exact money rounding) loads on first use too. */
const QuoteCheckTable = lazy(() => import('../features/tables/lazyTables.ts').then((m) => ({ default: m.QuoteCheckTable })));

const needCurve = (f: (r: WorkbenchBuild) => ReactNode) => ({ result }: { result: WorkbenchBuild }) =>
  result.build.curve ? f(result) : <p className="empty">No curve: {result.fatal}</p>;

const BASE_TABS: readonly TabDef[] = [
  {
    id: 'key-maturities',
    label: 'Key maturities',
    render: needCurve((r) => (
      <>
        <KeyMaturitiesTable curve={r.build.curve!} result={r} />
        <CurveTableExport curve={r.build.curve!} />
      </>
    )),
  },
  {
    id: 'forward-strip',
    label: 'Forward strip',
    render: needCurve((r) => (
      <Suspense fallback={<p className="muted small" role="status">Loading the forward strip…</p>}>
        <ForwardStripTable curve={r.build.curve!} result={r} />
      </Suspense>
    )),
  },
  {
    id: 'forward-grid',
    label: 'Forward grid',
    render: needCurve((r) => (
      <Suspense fallback={<p className="muted small" role="status">Loading the forward grid…</p>}>
        <ForwardGridTable curve={r.build.curve!} workspace={r.build.workspace} result={r} />
      </Suspense>
    )),
  },
  {
    id: 'forward-calculator',
    label: 'Forward calculator',
    render: needCurve((r) => (
      <Suspense fallback={<p className="muted small" role="status">Loading the forward calculator…</p>}>
        <ForwardCalculator curve={r.build.curve!} result={r} />
      </Suspense>
    )),
  },
  {
    id: 'quote-check',
    label: 'Quote check',
    render: ({ result }) => (
      <Suspense fallback={<p className="muted small" role="status">Loading the quote check…</p>}>
        <QuoteCheckTable result={result} />
      </Suspense>
    ),
  },
];

/** Tables under the charts, as tabs; other features' sections (EXTENSIONS.tabs) get the deferred build. */
export function TablesPanel({ result, deferredResult = result, extraTabs }: { result: WorkbenchBuild; deferredResult?: WorkbenchBuild; extraTabs: readonly TabDef[] }) {
  const active = useAppStore((s) => s.activeTab);
  // The open section's content is first rendered right after the app's first render, in a
  // transition of its own started once the first render is committed, so opening the app or a
  // link draws the sheet and the charts without waiting for the tables. Every later render shows
  // the content at once (the flag stays true from then on).
  const [contentReady, setContentReady] = useState(false);
  useEffect(() => startTransition(() => setContentReady(true)), []);
  const setActiveTab = useAppStore((s) => s.setActiveTab);
  const tabs = [...BASE_TABS, ...extraTabs];
  const current = tabs.find((t) => t.id === active) ?? tabs[0]!;
  const listRef = useRef<HTMLDivElement>(null);
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>): void => {
    const i = tabs.findIndex((t) => t.id === current.id);
    // Arrow keys move to the next or previous tab (wrapping), Home and End to the first and last
    // (the WAI-ARIA Authoring Practices tabs pattern).
    const next =
      e.key === 'ArrowRight' ? (i + 1) % tabs.length
      : e.key === 'ArrowLeft' ? (i - 1 + tabs.length) % tabs.length
      : e.key === 'Home' ? 0
      : e.key === 'End' ? tabs.length - 1
      : -1;
    if (next < 0) return;
    e.preventDefault();
    setActiveTab(tabs[next]!.id);
    listRef.current?.querySelectorAll<HTMLButtonElement>('[role="tab"]')[next]?.focus();
  };
  return (
    <section className="panel tables" aria-label="Tables">
      <div role="tablist" aria-label="Tables" ref={listRef} onKeyDown={onKeyDown}>
        {tabs.map((t) => (
          <button
            key={t.id}
            type="button"
            role="tab"
            id={`tab-${t.id}`}
            aria-selected={t.id === current.id}
            aria-controls={`tabpanel-${t.id}`}
            tabIndex={t.id === current.id ? 0 : -1}
            onClick={() => setActiveTab(t.id)}
          >
            {t.label}
          </button>
        ))}
        <span className="tab-slot muted small" data-slot="feature-tabs">
          {extraTabs.length === 0 ? 'More sections (scenarios, fits, risk, print) plug in here.' : ''}
        </span>
      </div>
      <div role="tabpanel" id={`tabpanel-${current.id}`} aria-labelledby={`tab-${current.id}`} className="tabpanel">
        {contentReady ? current.render({ result: BASE_TABS.includes(current) ? result : deferredResult }) : <p className="muted small">Preparing the tables…</p>}
      </div>
    </section>
  );
}
