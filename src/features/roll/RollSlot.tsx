import { useCallback, useMemo } from 'react';
import { validateStrategy, type StrategyInputs } from '../../core/analysis/rollVsTerm.ts';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { RollPanel } from './RollPanel.tsx';

/**
 * The roll panel wired to the workbench store, in the shape of `EXTENSIONS.rollPanel`: it reads the
 * document's `strategy` (validated, defaults for what is missing) and writes every change back with
 * `setReserved('strategy', next)`, so inputs are saved, undone and shared with the rest.
 */
export function RollSlot({ result }: { result: WorkbenchBuild }) {
  const raw = useAppStore((s) => (s.workspace as { strategy?: unknown }).strategy);
  const validated = useMemo(() => validateStrategy(raw), [raw]);
  const onStrategyChange = useCallback((next: StrategyInputs) => useAppStore.getState().setReserved('strategy', next), []);
  return <RollPanel curve={result.build.curve} strategy={validated.strategy} onStrategyChange={onStrategyChange} documentErrors={validated.errors} />;
}
