import { workbenchBuildOptions } from '../../hooks/overnightKit.ts';
import { useMemo, type ReactNode } from 'react';
import { convexityModelText, DEFAULT_CURVE_NAME, type RollFigure, type Scenario } from '../../core/index.ts';
import { useRollStrategy, useScenarioCurves } from '../roll/RollSlot.tsx';
import { applyToShown } from '../scenarios/applyShown.ts';
import { useOnCurve } from '../../hooks/useNamedCurves.ts';
import { validateScenarios, workspaceHash } from '../../core/index.ts';
import { conventionSet, rateTag } from '../../core/index.ts';
import { curveSeries } from '../../hooks/useCurveSeries.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { setViewValues, viewText } from '../../state/viewValues.ts';
import { BUILD_ID } from '../../share/buildId.ts';
import { PrintChart, type PrintSeries } from './PrintChart.tsx';
import { printKeyRows, printScenarios, scenarioConventionsText } from './printData.ts';
import { tableConventionsFromDisplay } from '../../core/index.ts';
import { NoteEditor } from './NoteEditor.tsx';
import { PrintRoot, PrintSummaryButton } from './PrintRoot.tsx';
import { PrintSummary, type PrintFigure } from './PrintSummary.tsx';
import type { ExplainCell } from '../tables/explainCell.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import '../scenarios/scenarios.css';
import { BASE_STYLES, SCENARIO_OVERLAY_MAX, SCENARIO_STYLES } from '../../charts/palette.ts';
import { EditLock } from '../../components/EditLock.tsx';

/** The printed page's heading when the workspace names none. */
export const DEFAULT_PRINT_TITLE = 'Yield-curve summary';
export const PRINT_TITLE_CHARS = 80;

const setPrintTitle = (text: string): void =>
  // One undo step per stretch of typing (merge key 'print-title'), ended when the field loses focus.
  setViewValues({ printTitle: text.slice(0, PRINT_TITLE_CHARS) }, 'edit print title', 'print-title');


/**
 * The one-page summary of the workbench's current state (curve, key rates, the first scenarios,
 * the note, the roll-versus-term result): what the Print section previews and what any print of
 * the workbench gives (see PrintOnDemand).
 */
export function WorkbenchPrintSummary({ result, rollResult = null, figure }: { result: WorkbenchBuild; rollResult?: ReactNode | null; figure?: (what: PrintFigure, text: string) => ReactNode }) {
  const doc = useAppStore((s) => s.workspace);
  // The print title lives in the document's view: saved, undone, shared in the link and in files.
  const title = viewText(doc, 'printTitle', DEFAULT_PRINT_TITLE);
  const curve = result.build.curve;
  const ws = result.build.workspace;
  const display = doc.display;
  // With named curves, the curve printed is named (the curve shown).
  const on = useOnCurve(result.curveName);
  const props = useMemo(() => {
    if (!curve || !ws) return null;
    const conv = tableConventionsFromDisplay(display);
    const { scenarios } = validateScenarios(doc.scenarios);
    // Each scenario moves the curve shown (a named curve with the curves it reads: applyToShown).
    const apply = (s: Scenario, i: number) => applyToShown(s, result, workbenchBuildOptions(), `scenarios[${i}]`);
    const moved = scenarios.slice(0, SCENARIO_OVERLAY_MAX).flatMap((s, i) => {
      const r = apply(s, i);
      return r.ok ? [{ name: s.name, curve: r.value.curve }] : [];
    });
    const series = (kind: 'zero' | 'forward'): PrintSeries[] =>
      // The same styles as the workbench's charts: the base line solid, each scenario its own colour and dash.
      [{ name: 'Base', curve }, ...moved].map((c, i) => ({
        label: c.name,
        colour: (i === 0 ? BASE_STYLES.zero : SCENARIO_STYLES[i - 1]!).colour,
        ...(i > 0 ? { dash: SCENARIO_STYLES[i - 1]!.dash } : {}),
        points: curveSeries(c.curve, display, [])[kind].map((p) => ({ x: p.x, y: p.y })),
      }));
    const { xMax, lastT } = curveSeries(curve, display, []);
    const tag = rateTag(display.compounding, display.dayCount);
    return {
      keyRows: printKeyRows(curve, conv),
      conventions: conv,
      scenarios: printScenarios(scenarios, ws, curve, conv, apply),
      scenarioConventions: scenarioConventionsText(conv),
      zeroChart: <PrintChart title="Zero rates" tag={tag} series={series('zero')} xMax={xMax} lastT={lastT} />,
      forwardChart: <PrintChart title={`${display.forwardTenor} forwards`} tag={tag} series={series('forward')} xMax={xMax} lastT={lastT} />,
    };
  }, [curve, ws, display, doc.scenarios, result]);
  if (!props || !curve || !ws) return <p className="empty">No curve to print: {result.fatal}</p>;
  const { snapshots: _s, ...linked } = doc as unknown as Record<string, unknown>;
  return (
    <PrintSummary
      title={title}
      note={typeof doc.note === 'string' ? doc.note : ''}
      settlement={ws.settlement}
      curveDayCount={ws.curve.dayCount}
      interpolation={ws.curve.interpolation}
      extrapolation={ws.curve.extrapolation}
      {...(doc.curve.conventions && doc.curve.conventions !== 'none' ? { marketConventions: conventionSet(doc.curve.conventions)?.title.replace(/: .*/, '') ?? doc.curve.conventions } : {})}
      {...(ws.curve.futuresConvexity ? { futuresConvexity: convexityModelText(ws.curve.futuresConvexity) } : {})}
      rollResult={rollResult}
      {...(on ? { curveName: result.curveName ?? DEFAULT_CURVE_NAME } : {})}
      producedAt={new Date()}
      buildId={BUILD_ID}
      workspaceHash={workspaceHash(linked)}
      {...(figure ? { figure } : {})}
      {...props}
    />
  );
}

/**
 * The printed summary wired to the workbench: preview on screen, "Print summary" prints it alone.
 * `rollResult` is the roll-versus-term result line, when the workbench passes one.
 */
export function PrintTab({ result, rollResult = null }: { result: WorkbenchBuild; rollResult?: ReactNode | null }) {
  const doc = useAppStore((s) => s.workspace);
  const title = useAppStore((st) => viewText(st.workspace, 'printTitle', DEFAULT_PRINT_TITLE));
  const summary = <WorkbenchPrintSummary result={result} rollResult={rollResult} />;
  // On screen, each figure of the preview opens its explanation beside it; the printed copy (PrintRoot) has no buttons.
  const explain = useExplainOpener<ExplainCell>(sameCell);
  const scenarios = useMemo(() => validateScenarios(doc.scenarios).scenarios, [doc.scenarios]);
  // The roll table's figures explain themselves under the strategy and views the page shows now.
  const strategy = useRollStrategy();
  const rollViews = useScenarioCurves(result);
  const rollCell = (figure: RollFigure): ExplainCell => ({ roll: { figure, strategy, scenarios: rollViews } });
  const open = explain.open !== null && 'roll' in explain.open ? rollCell(explain.open.roll.figure) : explain.open;
  const figure = (what: PrintFigure, text: string): ReactNode => {
    let cell: ExplainCell;
    let words: string;
    if ('roll' in what) {
      cell = rollCell(what.roll);
      words = what.words;
    } else {
      const s = 'scenario' in what ? scenarios[what.scenario] : undefined;
      const conv = tableConventionsFromDisplay(doc.display);
      const { parFrequency: _p, ...conventions } = conv;
      cell = s ? { change: { scenario: s, tenor: what.tenor, field: what.field as 'zero', conventions, buildOptions: workbenchBuildOptions() } } : { tenor: what.tenor, field: what.field };
      words = `${what.field === 'forward' ? `${conv.forwardTenor} forward` : FIGURE_WORDS[what.field]} ${s ? `change at ${what.tenor} under ${s.name}` : `at ${what.tenor}`}`;
    }
    return explain.button(cell, text, `the ${words}`);
  };

  return (
    <section className="print-tab" aria-label="Print">
      <div className="settings">
        <EditLock>
        <label>
          Title
          <input value={title} onChange={(e) => setPrintTitle(e.target.value)} onBlur={() => useAppStore.getState().endEdit()} maxLength={PRINT_TITLE_CHARS} />
        </label>
        </EditLock>
        <PrintSummaryButton />
        <span className="muted small">One page, A4 or US Letter, portrait. The first four scenarios are printed.</span>
      </div>
      <EditLock>
      <NoteEditor
        value={typeof doc.note === 'string' ? doc.note : ''}
        onChange={(text) => {
          const s = useAppStore.getState();
          // One undo step per stretch of typing (merge key 'note'), ended when the field loses focus.
          s.commit({ ...s.workspace, note: text }, 'edit note', 'note');
        }}
        onDone={() => useAppStore.getState().endEdit()}
      />
      </EditLock>
      <div className="print-preview-row">
        <div className="print-preview">
          <WorkbenchPrintSummary result={result} rollResult={rollResult} figure={figure} />
        </div>
        <OpenExplanation result={result} display={doc.display} cell={open} onClose={explain.close} />
      </div>
      <PrintRoot>{summary}</PrintRoot>
    </section>
  );
}

const FIGURE_WORDS = { discount: 'discount factor', zero: 'zero rate', par: 'par yield' } as const;

/** One number of the page: the same key cell, the same scenario's change at the same tenor, or the same roll figure (whatever curves its views hold). */
const sameCell = (a: ExplainCell, b: ExplainCell): boolean => ('roll' in a && 'roll' in b ? JSON.stringify(a.roll.figure) === JSON.stringify(b.roll.figure) : JSON.stringify(a) === JSON.stringify(b));
