import { useId, useMemo, type ReactNode } from 'react';
import type { Curve } from '../../core/index.ts';
import {
  analyseRollOnCurve,
  analyseRollVsTerm,
  BASE_VIEWS,
  formatNumber,
  formatPercent,
  rateTag,
  RETURN_TAG,
  rollTablesCsv,
  rollSentence,
  type DisplaySettings,
  type NamedCurve,
  type Result,
  type RollAnalysis,
  type RollFigure,
  type StrategyInputs,
  type StrategyViewId,
} from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { OpenExplanation, useExplainOpener } from '../tables/explainOpener.tsx';
import type { RollCell } from './explainRollCell.ts';
import { download, safeFileName } from '../../components/download.ts';
import { RollGrowthChart } from './RollGrowthChart.tsx';
import { RollInputs } from './RollInputs.tsx';
import { inFieldWords } from './fieldWords.ts';
import { BreakEvenTables, RidingSplitTable, RollLegsTable, RollResultsTable } from './RollTables.tsx';
import './roll.css';
import { EditLock } from '../../components/EditLock.tsx';

export interface RollPanelProps {
  /** Today's curve (null while there is none: the panel says so and keeps its inputs). */
  readonly curve: Curve | null;
  /** The validated `strategy` of the workspace document (validateStrategy(doc.strategy).strategy). */
  readonly strategy: StrategyInputs;
  /** Called with the whole next strategy when the user changes an input (write it back to the document). */
  readonly onStrategyChange: (next: StrategyInputs) => void;
  /** Named scenario curves offered as views (the curve moves to each today, then stays unchanged). */
  readonly scenarioViews?: readonly { readonly name: string; readonly curve: Curve }[];
  /** Errors from validating the document's `strategy` (shown above the inputs). */
  readonly documentErrors?: readonly { readonly path: string; readonly message: string }[];
  /** Overrides the heading's convention note; by default the panel states its own conventions. */
  readonly rateTag?: string;
  /** The curve read, said in the heading when the workspace has named curves (" on the curve \"default\""). */
  readonly on?: string | undefined;
  /** The named curve `curve` is (absent: the default curve): the analysis is analyseRollOnCurve's, naming it. */
  readonly curveName?: string | undefined;
  /** With it, the figures are buttons that open their explanation (the build `curve` comes from). */
  readonly explainFrom?: { readonly result: WorkbenchBuild; readonly display: DisplaySettings };
}

/**
 * Roll versus term on the curve a build shows: on a named curve analyseRollOnCurve (naming the
 * curve in its messages), else analyseRollVsTerm on the default curve, as before.
 */
export function rollOnShown(curve: Curve, curveName: string | undefined, strategy: StrategyInputs, scenarios: readonly NamedCurve[]): Result<RollAnalysis> {
  return curveName ? analyseRollOnCurve({ [curveName]: curve }, curveName, strategy, scenarios) : analyseRollVsTerm(curve, strategy, scenarios);
}

/** Where a figure's explanation opens: beside the table it is in. */
export type RollFigureGroup = 'results' | 'breakevens' | 'legs' | 'curve' | 'split';

/** The tables' way to make a figure a button that opens its explanation, and the panel beside each table. */
export interface RollExplain {
  figure(figure: RollFigure, text: string, words: string): ReactNode;
  panel(group: RollFigureGroup): ReactNode;
}

const groupOf = (f: RollFigure): RollFigureGroup => (f.kind === 'curve-rise' || f.kind === 'curve-yield' ? 'curve' : f.kind === 'riding-split' ? 'split' : 'against' in f ? 'breakevens' : 'leg' in f ? 'legs' : 'results');
const sameFigure = (a: RollCell, b: RollCell): boolean => JSON.stringify(a.roll.figure) === JSON.stringify(b.roll.figure);

const BASE_LABEL: Record<(typeof BASE_VIEWS)[number], string> = {
  forwards: 'Forwards realised',
  unchanged: 'Curve unchanged',
  path: 'Your path',
  shift: 'Parallel shift of the forwards',
};

const CAUTION = 'An analysis aid, not investment advice. Forwards are what today\u2019s prices imply, not forecasts. Verify against official sources and your own policies.';

/**
 * Roll versus term: rolling a money-market instrument against locking in term to the horizon, under
 * the forwards and the user's views. Everything shown is computed by the core
 * (analyseRollVsTerm); the panel only lays it out.
 */
const NO_SCENARIOS: RollPanelProps['scenarioViews'] = [];
const NO_ERRORS: RollPanelProps['documentErrors'] = [];

export function RollPanel({ curve, strategy, onStrategyChange, scenarioViews = NO_SCENARIOS!, documentErrors = NO_ERRORS!, rateTag: tagOverride, explainFrom, on, curveName }: RollPanelProps) {
  const headingId = useId();
  const result = useMemo(() => (curve ? rollOnShown(curve, curveName, strategy, scenarioViews) : null), [curve, curveName, strategy, scenarioViews]);
  const opener = useExplainOpener<RollCell>(sameFigure);
  // The open figure under the strategy and views shown now (an input changed since it opened is followed).
  const openCell = useMemo(() => (opener.open ? { roll: { ...opener.open.roll, strategy, scenarios: scenarioViews } } : null), [opener.open, strategy, scenarioViews]);
  const explain: RollExplain | undefined = explainFrom
    ? {
        figure: (figure, text, words) => {
          const cell: RollCell = { roll: { figure, strategy, scenarios: scenarioViews } };
          return opener.button(cell, text, `the ${words}`);
        },
        panel: (group) => (openCell && groupOf(openCell.roll.figure) === group ? <OpenExplanation result={explainFrom.result} display={explainFrom.display} cell={openCell} onClose={opener.close} /> : null),
      }
    : undefined;
  const views: { id: StrategyViewId; label: string }[] = [
    ...BASE_VIEWS.map((id) => ({ id, label: id === 'shift' ? `Forwards ${strategy.shiftBp >= 0 ? '+' : ''}${strategy.shiftBp} bp` : BASE_LABEL[id] })),
    ...scenarioViews.flatMap((s) => [
      { id: `scenario:${s.name}` as StrategyViewId, label: `Scenario: ${s.name}` },
      { id: `scenario-fwd:${s.name}` as StrategyViewId, label: `Scenario: ${s.name}, its forwards` },
    ]),
  ];
  const fieldErrors: Record<string, string> = {};
  // Messages name fields by their labels ("Horizon: ..."), never by document paths (strategy.horizon).
  if (result && !result.ok) for (const e of result.errors) fieldErrors[e.path] ??= inFieldWords(e.message);
  const analysis = result && result.ok ? result.value : null;
  const conventions = tagOverride ?? `roll legs ${rateTag('simple', strategy.rollDayCount)}; returns ${RETURN_TAG}`;
  return (
    <section className="roll-panel" aria-labelledby={headingId}>
      <header className="roll-head">
        <h2 id={headingId}>Roll versus term{on}</h2>
        <span className="muted small">{conventions}</span>
      </header>
      <p className="roll-caution" role="note">
        <strong>Caution.</strong> {CAUTION}
      </p>
      {documentErrors.length > 0 ? (
        <ul className="roll-errors" role="alert" aria-label="Problems in the saved strategy">
          {documentErrors.map((e) => (
            <li key={e.path + e.message}>{inFieldWords(e.message)} (the default is used until it is corrected)</li>
          ))}
        </ul>
      ) : null}
      <EditLock>
        <RollInputs strategy={strategy} onChange={onStrategyChange} views={views} errors={fieldErrors} {...(analysis ? { shownView: analysis.views[analysis.chosen]!.id } : {})} />
      </EditLock>
      {!curve ? (
        <p className="roll-empty" role="status">
          No curve yet: enter valid quotes and the comparison appears here. Your inputs are kept.
        </p>
      ) : null}
      {result && !result.ok ? (
        <ul className="roll-errors" role="alert" aria-label="Why there is no comparison">
          {result.errors.map((e) => (
            <li key={e.path + e.message}>{inFieldWords(e.message)}</li>
          ))}
        </ul>
      ) : null}
      {analysis ? (
        <>
          <p className="roll-sentence" role="status" aria-live="polite">
            {rollSentence({
              view: analysis.views[analysis.chosen]!,
              strategies: analysis.strategies,
              breakEvens: analysis.breakEvens,
              horizon: analysis.horizon,
              rollTenor: analysis.rollTenor,
              rollDayCount: analysis.rollDayCount,
              legCount: analysis.legs.length,
              moneyUnit: analysis.moneyUnit,
            })}
          </p>
          <p className="muted small roll-facts">
            Settlement {analysis.settlement}, horizon {analysis.horizon} ({formatNumber(analysis.years, 4)} years, ACT/365F). Today&rsquo;s {analysis.rollTenor} spot {formatPercent(analysis.spotRollRate)}{' '}
            <span className="tag">{rateTag('simple', analysis.rollDayCount)}</span>. Under forwards realised every strategy ends equal: that is what forward rates mean, and it is the baseline.
          </p>
          {analysis.warnings.length > 0 ? (
            <ul className="roll-warnings" aria-label="Notes">
              {analysis.warnings.map((w) => (
                <li key={w.path + w.message}>{inFieldWords(w.message)}</li>
              ))}
            </ul>
          ) : null}
          <p className="roll-export">
            <button type="button" onClick={() => download(`tenorscope-roll-${safeFileName(analysis.settlement)}-to-${safeFileName(analysis.horizon)}.csv`, 'text/csv', rollTablesCsv(analysis, analysis.moneyUnit))}>
              Export these tables (CSV)
            </button>
          </p>
          {/* Two columns when the panel is wide: the growth and the results; how riding splits, the break-evens and the legs. */}
          <div className="roll-body">
            <div className="roll-main">
              <RollGrowthChart unit={analysis.moneyUnit} series={analysis.growth} strategies={analysis.strategies} viewLabel={analysis.views[analysis.chosen]!.label} horizon={analysis.horizon} />
              <RollResultsTable analysis={analysis} explain={explain} />
            </div>
            <div className="roll-side">
              <RidingSplitTable analysis={analysis} explain={explain} />
              <BreakEvenTables analysis={analysis} explain={explain} />
              <RollLegsTable analysis={analysis} strategy={strategy} onStrategyChange={onStrategyChange} explain={explain} />
            </div>
          </div>
        </>
      ) : null}
    </section>
  );
}
