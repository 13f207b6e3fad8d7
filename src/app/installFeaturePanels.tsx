import { useEffect, useState, type ComponentType, type ReactNode } from 'react';
import type { WorkbenchBuild } from '../hooks/useCurveBuild.ts';
import { EXTENSIONS } from './extensions.tsx';

type PanelProps = { result: WorkbenchBuild };

/** A feature panel whose code is fetched on first use (its own chunk), so the first load parses less. */
interface DeferredPanel {
  readonly Panel: (props: PanelProps) => ReactNode;
  /** Fetches the panel's code; resolves when it can render at once (rejects if it cannot be fetched). */
  readonly preload: () => Promise<void>;
}

/**
 * Runs `then` after the next frame is painted (a task posted from an animation frame callback runs
 * after that frame's paint); without animation frames (a page in the background, a test DOM) after
 * a timer. Returns a cancel function.
 */
function afterNextPaint(then: () => void): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  if (typeof requestAnimationFrame !== 'function' || document.visibilityState === 'hidden') {
    timer = setTimeout(then, 0);
    return () => clearTimeout(timer!);
  }
  const frame = requestAnimationFrame(() => {
    timer = setTimeout(then, 0);
  });
  return () => {
    cancelAnimationFrame(frame);
    if (timer !== null) clearTimeout(timer);
  };
}

function deferredPanel(name: string, load: () => Promise<ComponentType<PanelProps>>, options: { quiet?: boolean } = {}): DeferredPanel {
  let loaded: ComponentType<PanelProps> | null = null;
  let pending: Promise<void> | null = null;
  const preload = (): Promise<void> => {
    pending ??= load().then(
      (component) => {
        loaded = component;
      },
      (error: unknown) => {
        pending = null; // a later mount tries again
        throw error;
      },
    );
    return pending;
  };
  function Panel(props: PanelProps): ReactNode {
    // Renders the panel itself as soon as its code is there: placeholder -> panel once, before the
    // panel has any state of its own, so nothing typed into it is lost.
    const [component, setComponent] = useState<{ C: ComponentType<PanelProps> } | null>(() => (loaded ? { C: loaded } : null));
    const [failed, setFailed] = useState(false);
    useEffect(() => {
      if (component) return;
      let live = true;
      // Fetched once the frame that shows the placeholder is painted: a chunk and its stylesheet
      // arriving while the first frame is laid out would compete with it (the fetch began during
      // the first frame's rendering in a trace of a link being opened).
      const cancel = afterNextPaint(() =>
        preload().then(
          () => {
            if (live && loaded) setComponent({ C: loaded });
          },
          () => {
            if (live) setFailed(true);
          },
        ),
      );
      return () => {
        live = false;
        cancel();
      };
    }, [component]);
    if (component) return <component.C {...props} />;
    if (options.quiet) return null; // an invisible helper shows no placeholder
    return (
      <p className="muted small" role="status">
        {failed ? `The ${name} section could not be loaded (the connection may have dropped). Reload the page to try again; your workspace is saved.` : `Loading the ${name} section…`}
      </p>
    );
  }
  Panel.displayName = `Deferred(${name})`;
  return { Panel, preload };
}

/** The panels' one module (featurePanels.ts), fetched once for all of them. */
const panels = () => import('./featurePanels.ts');
const roll = deferredPanel('roll versus term', () => panels().then((m) => m.RollSlot));
const scenarios = deferredPanel('scenarios', () => panels().then((m) => m.ScenariosTab));
const snapshots = deferredPanel('snapshots', () => panels().then((m) => m.SnapshotsTab));
const fit = deferredPanel('smooth fit', () => panels().then((m) => m.FitSlot));
const risk = deferredPanel('bond and sensitivities', () =>
  panels().then(
    ({ BondAnalyticsPanel, SensitivityHeatMap }) =>
      ({ result }: PanelProps) => (
        <div className="stack">
          <BondAnalyticsPanel curve={result.build.curve} build={result.build} rowOfQuote={result.conversion.rowOfQuote} result={result} />
          <SensitivityHeatMap workspace={result.build.workspace} rowOfQuote={result.conversion.rowOfQuote} result={result} />
        </div>
      ),
  ),
);
const print = deferredPanel('print', () =>
  panels().then(
    ({ PrintTab, RollResultLine }) =>
      ({ result }: PanelProps) => <PrintTab result={result} rollResult={<RollResultLine result={result} />} />,
  ),
);
const printOnDemand = deferredPanel('print on demand', () =>
  panels().then(
    ({ PrintOnDemand, RollResultLine }) =>
      ({ result }: PanelProps) => <PrintOnDemand result={result} rollResult={<RollResultLine result={result} />} />,
  ),
  { quiet: true },
);
const holidays = deferredPanel('holidays', () => panels().then((m) => () => <m.HolidaysTab />));
const fixings = deferredPanel('fixings', () => panels().then((m) => () => <m.FixingsTab />));
const overnight = deferredPanel('overnight curve', () => panels().then((m) => m.OvernightTab));
const ALL = [roll, scenarios, snapshots, fit, risk, holidays, fixings, overnight, print, printOnDemand];

/** Fetches every feature panel's code; resolves when all can render at once. */
export function preloadFeaturePanels(): Promise<void> {
  return Promise.all(ALL.map((p) => p.preload())).then(() => undefined);
}

/**
 * Puts the feature panels into the workbench's slots (once; the entry point calls it before
 * rendering). Each panel's code is its own chunk, fetched when the panel first shows (with a
 * short "Loading..." status in its place) or by preloadFeaturePanels(). With `preload` (the
 * default) it starts fetching them all now and resolves when they are ready, so a test can await
 * it and see every panel at once; the entry point passes false and preloads once the first chart
 * is up.
 */
export function installFeaturePanels(options: { preload?: boolean } = {}): Promise<void> {
  if (EXTENSIONS.rollPanel === null && EXTENSIONS.tabs.length === 0 && EXTENSIONS.printHost === null) {
    EXTENSIONS.rollPanel = roll.Panel;
    EXTENSIONS.printHost = printOnDemand.Panel;
    EXTENSIONS.tabs.push(
      { id: 'scenarios', label: 'Scenarios', render: ({ result }) => <scenarios.Panel result={result} /> },
      { id: 'snapshots', label: 'Snapshots', render: ({ result }) => <snapshots.Panel result={result} /> },
      { id: 'fit', label: 'Smooth fit', render: ({ result }) => <fit.Panel result={result} /> },
      { id: 'risk', label: 'Bond and sensitivities', render: ({ result }) => <risk.Panel result={result} /> },
      { id: 'holidays', label: 'Holidays', render: ({ result }) => <holidays.Panel result={result} /> },
      { id: 'fixings', label: 'Fixings', render: ({ result }) => <fixings.Panel result={result} /> },
      { id: 'overnight', label: 'Overnight curve', render: ({ result }) => <overnight.Panel result={result} /> },
      { id: 'print', label: 'Print', render: ({ result }) => <print.Panel result={result} /> },
    );
  }
  return options.preload === false ? Promise.resolve() : preloadFeaturePanels();
}
