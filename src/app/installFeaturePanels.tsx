import { FitPanel } from '../features/fit/FitPanel.tsx';
import { PrintTab } from '../features/print/PrintTab.tsx';
import { BondAnalyticsPanel } from '../features/risk/BondAnalyticsPanel.tsx';
import { SensitivityHeatMap } from '../features/risk/SensitivityHeatMap.tsx';
import { RollResultLine, RollSlot } from '../features/roll/RollSlot.tsx';
import { ScenariosTab } from '../features/scenarios/ScenariosTab.tsx';
import { SnapshotsTab } from '../features/snapshots/SnapshotsTab.tsx';
import { EXTENSIONS } from './extensions.tsx';

/** Puts the feature panels into the workbench's slots (once; the entry point calls it before rendering). */
export function installFeaturePanels(): void {
  if (EXTENSIONS.rollPanel !== null || EXTENSIONS.tabs.length > 0) return;
  EXTENSIONS.rollPanel = RollSlot;
  EXTENSIONS.tabs.push(
    { id: 'scenarios', label: 'Scenarios', render: ({ result }) => <ScenariosTab result={result} /> },
    { id: 'snapshots', label: 'Snapshots', render: ({ result }) => <SnapshotsTab result={result} /> },
    { id: 'fit', label: 'Smooth fit', render: ({ result }) => <FitPanel workspace={result.build.workspace} repricing={result.build.repricing} /> },
    {
      id: 'risk',
      label: 'Bond and sensitivities',
      render: ({ result }) => (
        <div className="stack">
          <BondAnalyticsPanel curve={result.build.curve} workspace={result.build.workspace} />
          <SensitivityHeatMap workspace={result.build.workspace} />
        </div>
      ),
    },
    { id: 'print', label: 'Print', render: ({ result }) => <PrintTab result={result} rollResult={<RollResultLine result={result} />} /> },
  );
}
