import { FitPanel } from '../fit/FitPanel.tsx';
import type { WorkbenchBuild } from '../../hooks/useCurveBuild.ts';
import { useAppStore } from '../../state/store.ts';
import { comparisonChoice, setFitErrors, setFitModel } from './comparisonChoice.ts';
import { useFitInput } from './fitInput.ts';

/**
 * The smooth fit section wired to the document's view (model and errors) and to the page's fit
 * input (quotes left out, weights): the charts' fit line is this fit.
 */
export function FitSlot({ result }: { result: WorkbenchBuild }) {
  const model = useAppStore((s) => comparisonChoice(s.workspace).fitModel);
  const errors = useAppStore((s) => comparisonChoice(s.workspace).fitErrors);
  const { exclude, weights, set } = useFitInput();
  const display = useAppStore((s) => s.workspace.display);
  return (
    <FitPanel
      workspace={result.build.workspace}
      repricing={result.build.repricing}
      turns={result.build.overnight?.turns}
      instruments={result.build.instruments}
      steps={(result.build.overnight?.meetings.length ?? 0) > 0}
      rowOfQuote={result.conversion.rowOfQuote}
      model={model}
      onModelChange={setFitModel}
      errors={errors}
      onErrorsChange={setFitErrors}
      exclude={exclude}
      onExcludeChange={(x) => set({ exclude: x })}
      weights={weights}
      onWeightsChange={(w) => set({ weights: w })}
      explainFrom={{ result, display }}
    />
  );
}
