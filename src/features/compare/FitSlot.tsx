import { FitPanel } from '../fit/FitPanel.tsx';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { comparisonChoice, setFitModel } from './comparisonChoice.ts';

/** The smooth fit section wired to the document's view: its model is the one the charts' comparison draws. */
export function FitSlot({ result }: { result: WorkbenchBuild }) {
  const model = useAppStore((s) => comparisonChoice(s.workspace).fitModel);
  return (
    <FitPanel
      workspace={result.build.workspace}
      repricing={result.build.repricing}
      rowOfQuote={result.conversion.rowOfQuote}
      model={model}
      onModelChange={setFitModel}
    />
  );
}
