import { rollWords } from './rollWords.ts';
import { useCallback, useMemo } from 'react';
import { applyScenario } from '../../core/analysis/scenarios.ts';
import { analyseRollVsTerm, rollSentence, validateStrategy, type StrategyInputs } from '../../core/analysis/rollVsTerm.ts';
import type { Curve } from '../../core/index.ts';
import { validateScenarios } from '../../core/export/exports.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { RollPanel } from './RollPanel.tsx';

const readStrategy = (s: { workspace: unknown }): unknown => (s.workspace as { strategy?: unknown }).strategy;
const readScenarios = (s: { workspace: unknown }): unknown => (s.workspace as { scenarios?: unknown }).scenarios;

/** The document's scenarios applied to today's curve, as named curves for the roll panel's views. */
function useScenarioCurves(result: WorkbenchBuild): { name: string; curve: Curve }[] {
  const raw = useAppStore(readScenarios);
  const base = result.build.curve;
  const workspace = result.build.workspace;
  return useMemo(() => {
    if (!base || !workspace) return [];
    const out: { name: string; curve: Curve }[] = [];
    validateScenarios(raw).scenarios.forEach((s, i) => {
      const r = applyScenario(s, workspace, base, { skipInvalid: true }, `scenarios[${i}]`);
      if (r.ok) out.push({ name: s.name, curve: r.value.curve });
    });
    return out;
  }, [raw, base, workspace]);
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
  return <RollPanel curve={result.build.curve} strategy={validated.strategy} onStrategyChange={onStrategyChange} scenarioViews={scenarios} documentErrors={validated.errors} />;
}

/**
 * The result sentence alone, for the printed summary (`rollResult` of the print tab): which
 * strategy ends ahead under the chosen view, by how much, and the break-even roll rate.
 */
export function RollResultLine({ result }: { result: WorkbenchBuild }) {
  const raw = useAppStore(readStrategy);
  const strategy = useMemo(() => validateStrategy(raw).strategy, [raw]);
  const scenarios = useScenarioCurves(result);
  const curve = result.build.curve;
  const text = useMemo(() => {
    if (!curve) return null;
    const r = analyseRollVsTerm(curve, strategy, scenarios);
    if (!r.ok) return `No comparison: ${r.errors[0] ? rollWords(r.errors[0].message) : 'the inputs do not fit the curve'}`;
    const a = r.value;
    return rollSentence({ view: a.views[a.chosen]!, strategies: a.strategies, breakEvens: a.breakEvens, horizon: a.horizon, rollTenor: a.rollTenor, rollDayCount: a.rollDayCount, legCount: a.legs.length, moneyUnit: a.moneyUnit });
  }, [curve, strategy, scenarios]);
  return text === null ? null : <span className="roll-result-line">{text}</span>;
}
