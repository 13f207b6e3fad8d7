import { workbenchBuildOptions } from '../../hooks/overnightKit.ts';
import { useCallback, useMemo, type ReactNode } from 'react';
import { formatBpChange, formatMoney, formatMoneySigned, NO_VALUE, percentFigure, RETURN_TAG, rollSentence, validateStrategy, type RollAnalysis, type RollFigure, type StrategyInputs } from '../../core/index.ts';
import { usePrintFigure } from '../print/PrintSummary.tsx';
import { inFieldWords } from './fieldWords.ts';
import type { Curve, DisplaySettings } from '../../core/index.ts';
import { validateScenarios } from '../../core/index.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { RollPanel, rollOnShown } from './RollPanel.tsx';
import { useOnCurve } from '../../hooks/useNamedCurves.ts';
import { applyToShown } from '../scenarios/applyShown.ts';

const readStrategy = (s: { workspace: unknown }): unknown => (s.workspace as { strategy?: unknown }).strategy;
const readDisplay = (s: { workspace: { display: DisplaySettings } }): DisplaySettings => s.workspace.display;
const readScenarios = (s: { workspace: unknown }): unknown => (s.workspace as { scenarios?: unknown }).scenarios;

/** The document's scenarios applied to today's curve (the curve shown), as named curves for the roll panel's views. */
export function useScenarioCurves(result: WorkbenchBuild): { name: string; curve: Curve }[] {
  const raw = useAppStore(readScenarios);
  return useMemo(() => {
    const out: { name: string; curve: Curve }[] = [];
    validateScenarios(raw).scenarios.forEach((s, i) => {
      const r = applyToShown(s, result, workbenchBuildOptions(), `scenarios[${i}]`);
      if (r.ok) out.push({ name: s.name, curve: r.value.curve });
    });
    return out;
  }, [raw, result]);
}


/** The document's roll strategy as validated (defaults for what is missing). */
export function useRollStrategy(): StrategyInputs {
  const raw = useAppStore(readStrategy);
  return useMemo(() => validateStrategy(raw).strategy, [raw]);
}

/**
 * The roll panel wired to the workbench store, in the shape of `EXTENSIONS.rollPanel`: it reads the
 * document's `strategy` (validated, defaults for what is missing), offers the document's scenarios
 * as views, and writes every change back with `setReserved('strategy', next)`, so the inputs are
 * saved, undone and shared with the rest of the workspace.
 */
export function RollSlot({ result }: { result: WorkbenchBuild }) {
  const raw = useAppStore(readStrategy);
  const validated = useMemo(() => validateStrategy(raw), [raw]);
  const scenarios = useScenarioCurves(result);
  const onStrategyChange = useCallback((next: StrategyInputs) => useAppStore.getState().setReserved('strategy', next), []);
  const display = useAppStore(readDisplay);
  const explainFrom = useMemo(() => ({ result, display }), [result, display]);
  // With named curves the heading says which curve roll versus term reads: the curve shown.
  const on = useOnCurve(result.curveName);
  return <RollPanel on={on} curveName={result.curveName} curve={result.build.curve} strategy={validated.strategy} onStrategyChange={onStrategyChange} scenarioViews={scenarios} documentErrors={validated.errors} explainFrom={explainFrom} />;
}

/**
 * The result sentence alone, for the printed summary (`rollResult` of the print tab): which
 * strategy ends ahead under the chosen view, by how much, and the break-even roll rate.
 */
export function RollResultLine({ result }: { result: WorkbenchBuild }) {
  const strategy = useRollStrategy();
  const scenarios = useScenarioCurves(result);
  const curve = result.build.curve;
  const out = useMemo(() => {
    if (!curve) return null;
    const r = rollOnShown(curve, result.curveName, strategy, scenarios);
    if (!r.ok) return { text: `No comparison: ${inFieldWords(r.errors[0]?.message ?? 'the inputs do not fit the curve')}`, analysis: null };
    const a = r.value;
    return { text: rollSentence({ view: a.views[a.chosen]!, strategies: a.strategies, breakEvens: a.breakEvens, horizon: a.horizon, rollTenor: a.rollTenor, rollDayCount: a.rollDayCount, legCount: a.legs.length, moneyUnit: a.moneyUnit }), analysis: a };
  }, [curve, result.curveName, strategy, scenarios]);
  if (out === null) return null;
  return (
    <>
      <span className="roll-result-line">{out.text}</span>
      {out.analysis ? <RollPrintDetail analysis={out.analysis} /> : null}
    </>
  );
}

/** How many legs of the short-rate path the printed page lists before it says how many more there are. */
const PRINT_PATH_LEGS = 12;

/**
 * The printed page's roll-versus-term table under the chosen view (value at the horizon, return,
 * against rolling, for each strategy) and the user's short-rate path, leg by leg.
 */
function RollPrintDetail({ analysis: a }: { analysis: RollAnalysis }) {
  const view = a.views[a.chosen]!;
  const path = a.views.find((v) => v.id === 'path');
  const rates = path ? path.legRates : [];
  const shown = rates.slice(0, PRINT_PATH_LEGS).map((r) => percentFigure(r, 'rateShort'));
  // In the preview each figure opens its explanation (the print tab's wrapper); the printed copy has plain text.
  const wrap = usePrintFigure();
  const fig = (roll: RollFigure, text: string, words: string): ReactNode => (wrap ? wrap({ roll, words }, text) : text);
  return (
    <div className="ps-roll-detail">
      <table className="ps-table ps-roll-table" aria-label="Roll versus term under the chosen view">
        <thead>
          <tr>
            <th scope="col">Strategy <span className="ps-unit">{view.label}</span></th>
            <th scope="col">At {a.horizon} <span className="ps-unit">{a.moneyUnit}</span></th>
            <th scope="col">Return <span className="ps-unit">% {RETURN_TAG}</span></th>
            <th scope="col">Against rolling <span className="ps-unit">{a.moneyUnit}, bp a year</span></th>
          </tr>
        </thead>
        <tbody>
          {a.strategies.map((s) => {
            const o = view.strategies.find((x) => x.id === s.id)!;
            return (
              <tr key={s.id}>
                <th scope="row">{s.label}</th>
                <td>{fig({ kind: 'terminal', view: view.id, strategy: s.id }, formatMoney(o.terminal), `money at the horizon of ${s.phrase} under ${view.label}`)}</td>
                <td>{fig({ kind: 'return', view: view.id, strategy: s.id }, percentFigure(o.annualReturn), `annualised return of ${s.phrase} under ${view.label}`)}</td>
                <td>
                  {s.id === 'roll' ? (
                    NO_VALUE
                  ) : (
                    <>
                      {fig({ kind: 'vs-roll', view: view.id, strategy: s.id }, formatMoneySigned(o.vsRoll), `money against rolling of ${s.phrase} under ${view.label}`)}
                      {' \u00b7 '}
                      {fig({ kind: 'vs-roll-bp', view: view.id, strategy: s.id }, formatBpChange(o.vsRollBp), `return against rolling of ${s.phrase} under ${view.label}`)}
                    </>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {path ? (
        <p className="ps-roll-path">
          <strong>Your short-rate path</strong> <span className="ps-unit">({a.rollTenor} legs, % simple {a.rollDayCount}; leg 1 bought today)</span>: {shown.join(', ')}
          {rates.length > shown.length ? ` \u2026 and ${rates.length - shown.length} more legs` : ''}
        </p>
      ) : null}
    </div>
  );
}
