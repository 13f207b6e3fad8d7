import { lazy, memo, Suspense } from 'react';
import { Caution } from '../components/Caution.tsx';
import { StorageBanner, StorageStatusText } from '../components/StorageBanner.tsx';
import { CurvesPanel } from '../features/curves/CurvesPanel.tsx';
import { QuoteSheet } from '../features/quotes/QuoteSheet.tsx';
import { SettingsBar } from '../features/settings/SettingsBar.tsx';
import { WorkspacesButton, WorkspacesSlot } from '../features/workspaces/WorkspacesEntry.tsx';
import { useCurveBuild, type WorkbenchBuild } from '../hooks/useCurveBuild.ts';
import { useNamedCurves } from '../hooks/useNamedCurves.ts';
import { useSettledValue } from '../hooks/useSettledValue.ts';
import { useUndoShortcuts } from '../hooks/useUndoShortcuts.ts';
import { useAppStore } from '../state/store.ts';
import { LinkNotice } from '../share/CopyLinkButton.tsx';
import { OpenedNotice, resetToDemoWithNotice } from '../share/OpenedNotice.tsx';
import { ShareBar } from '../share/ShareBar.tsx';
import { useOpenLinkOnStart } from '../share/useOpenLinkOnStart.ts';
import { EXTENSIONS } from './extensions.tsx';
import { TablesPanel } from './TablesPanel.tsx';

/** The read-only banner is fetched when a document opens read-only (settings this build does not know), not on every load. */
const ReadOnlyBanner = lazy(() => import('../components/ReadOnlyBanner.tsx').then((m) => ({ default: m.ReadOnlyBanner })));

/** The workbench: quotes in, zero and forward curves side by side, every number readable. */
export function App() {
  useUndoShortcuts();
  const result = useCurveBuild();
  const link = useOpenLinkOnStart();
  const readOnly = useAppStore((s) => s.readOnly);
  const canUndo = useAppStore((s) => s.past.length > 0 && s.readOnly === null);
  const canRedo = useAppStore((s) => s.future.length > 0 && s.readOnly === null);
  // A read-only document whose display settings (or quote unit) this build does not know: the
  // charts and tables are not drawn in a guessed convention.
  const undrawable = readOnly?.unknowns.filter((u) => u.path.startsWith('display.') || u.path === 'quoteUnit') ?? [];
  const { undo, redo } = useAppStore.getState();
  // Panels beyond the base curve, charts and tables follow the build once typing pauses, so a
  // keystroke paints the sheet, charts and tables first (see useSettledValue).
  const deferred = useSettledValue(result);
  // Named curves besides the default one (the document's `curves`; their code loads on first use):
  // the charts and tables, roll versus term and the print show the curve the picker chooses, the sheet edits the default curve.
  const { shown, kit, named, adding, setAdding, needed } = useNamedCurves(result);
  const shownDeferred = shown === result ? deferred : shown;
  return (
    <div className="app">
      <SkipLink />
      <header className="top">
        <h1>Tenorscope</h1>
        <span className="subtitle">yield-curve workbench</span>
        <div className="top-actions">
          <StorageStatusText />
          <WorkspacesButton />
          <ShareBar result={result} />
          <button type="button" onClick={undo} disabled={!canUndo} aria-keyshortcuts="Control+Z Meta+Z" title="Undo (Ctrl+Z)">
            Undo
          </button>
          <button type="button" onClick={redo} disabled={!canRedo} aria-keyshortcuts="Control+Shift+Z Control+Y Meta+Shift+Z" title="Redo (Ctrl+Shift+Z or Ctrl+Y)">
            Redo
          </button>
          <button type="button" onClick={resetToDemoWithNotice} disabled={readOnly !== null} title="Replace the workspace with the built-in demo (undoable)">
            Reset to demo
          </button>
        </div>
      </header>
      <Caution />
      <StorageBanner />
      <LinkNotice message={link.message} onDismiss={link.dismiss} />
      {readOnly !== null && (
        <Suspense fallback={<p className="banner warn" role="status">Read-only: this workspace uses settings this build does not know…</p>}>
          <ReadOnlyBanner />
        </Suspense>
      )}
      <OpenedNotice />
      <WorkspacesSlot />
      <SettingsBar />
      {/* The quotes beside the charts and tables (one first screen); roll versus term across both below. */}
      <main className="workbench">
        <div className="left">
          {kit && named ? (
            <kit.CurvePicker named={named} adding={adding} onAdding={setAdding} />
          ) : (
            !needed && (
              <button type="button" className="add-curve" disabled={readOnly !== null} onClick={() => setAdding(true)}>
                Add a named curve
              </button>
            )
          )}
          <QuoteSheet result={result} />
        </div>
        {undrawable.length > 0 ? (
          <div className="right" id={AFTER_SHEET_ID} tabIndex={-1} role="region" aria-label="Charts and tables">
            <p className="panel empty">
              Charts and tables are not drawn: they follow {undrawable.map((u) => `${u.path} (${u.value})`).join(', ')}, which this build does not know. Make an editable copy to choose a
              convention this build has.
            </p>
          </div>
        ) : (
          <>
            <div className="right" id={AFTER_SHEET_ID} tabIndex={-1} role="region" aria-label="Charts and tables">
              {kit && named && <kit.ShownCurveNote named={named} />}
              <CurvesPanel result={shown} deferredResult={shownDeferred} />
              {kit && named && <kit.SpreadView result={result} named={named} />}
              <TablesPanel result={shown} deferredResult={shownDeferred} extraTabs={EXTENSIONS.tabs} />
            </div>
            <section className="panel roll-slot" aria-label="Roll versus term" data-slot="roll-versus-term">
              <RollHost result={shownDeferred} />
            </section>
          </>
        )}
      </main>
      <footer className="foot">
        <Caution />
      </footer>
      <PrintHost result={shownDeferred} />
    </div>
  );
}

/** Where the skip link takes the focus: the charts and tables beside the quote sheet. */
const AFTER_SHEET_ID = 'charts-and-tables';

/**
 * The page's first stop for the Tab key, shown only while focused: it moves the focus past the
 * quote sheet (seven text cells a row) to the charts and tables. The fragment is left alone (the
 * app reads links from it), so the link's action focuses its target itself.
 */
function SkipLink() {
  return (
    <a
      className="skip-link"
      href={`#${AFTER_SHEET_ID}`}
      onClick={(e) => {
        e.preventDefault();
        document.getElementById(AFTER_SHEET_ID)?.focus(); // focusing scrolls it into view
      }}
    >
      Skip the quote sheet: go to the charts and tables
    </a>
  );
}

/** Any print of the page gives the one-page summary (EXTENSIONS.printHost; nothing on screen). */
const PrintHost = memo(function PrintHost({ result }: { result: WorkbenchBuild }) {
  const Host = EXTENSIONS.printHost;
  return Host ? <Host result={result} /> : null;
});

/** The roll-versus-term slot: re-renders only when its (deferred) build changes. */
const RollHost = memo(function RollHost({ result }: { result: WorkbenchBuild }) {
  const Roll = EXTENSIONS.rollPanel;
  return Roll ? <Roll result={result} /> : <p className="muted small">Roll versus term: panel slot (not installed in this build).</p>;
});
