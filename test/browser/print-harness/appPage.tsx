// Harness page: the real workbench App with the scenario, snapshot and print sections mounted as
// src/app/extensions.tsx would list them, and (with ?demo=print) three scenarios and the longest note.
import { createRoot } from 'react-dom/client';
import { App } from '../../../src/app/App.tsx';
import { EXTENSIONS } from '../../../src/app/extensions.tsx';
import { PrintTab } from '../../../src/features/print/PrintTab.tsx';
import { ScenariosTab } from '../../../src/features/scenarios/ScenariosTab.tsx';
import { SnapshotsTab } from '../../../src/features/snapshots/SnapshotsTab.tsx';
import { useAppStore } from '../../../src/state/store.ts';
import { FIXTURE, LONGEST_NOTE } from './harnessData.ts';
import '../../../src/styles/base.css';
import '../../../src/styles/workbench.css';

const tabs = EXTENSIONS.tabs as unknown as { id: string; label: string; render: (p: { result: never }) => unknown }[];
tabs.push(
  { id: 'scenarios', label: 'Scenarios', render: (p) => <ScenariosTab {...p} /> },
  { id: 'snapshots', label: 'Snapshots', render: (p) => <SnapshotsTab {...p} /> },
  { id: 'print', label: 'Print', render: (p) => <PrintTab {...p} rollResult="Roll-versus-term line from its panel (harness text)." /> },
);
if (new URLSearchParams(window.location.search).get('demo') === 'print') {
  const s = useAppStore.getState();
  s.setReserved('scenarios', FIXTURE.scenarios);
  s.setReserved('note', LONGEST_NOTE);
  s.setActiveTab('print');
}
createRoot(document.getElementById('root')!).render(<App />);
document.body.dataset.ready = 'true';
