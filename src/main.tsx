// The only startup code that touches the page: restore the saved workspace, keep saving it,
// open a workspace link in the address (before the first render, so the first chart drawn is
// the link's), render.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/App.tsx';
import { FIRST_FRAME_STEPS } from './hooks/firstFrame.ts';
import { installFeaturePanels, preloadFeaturePanels } from './app/installFeaturePanels.tsx';
import { openLinkBeforeRender } from './share/useOpenLinkOnStart.ts';
import { startPersistence } from './state/persistence.ts';
import { loadOvernightKit, needsOvernightKit } from './hooks/overnightKit.ts';
import { useAppStore } from './state/store.ts';
import './styles/base.css';
import './styles/workbench.css';

const container = document.getElementById('root');
if (!container) throw new Error('Tenorscope: index.html has no #root element');

// The feature panels' code is fetched when a panel first shows, or once the first chart is up.
void installFeaturePanels({ preload: false });
// The saved workspace is read from the browser's database first (a few milliseconds), so the first
// chart drawn is the user's, or the link's.
const persistence = startPersistence();

const render = (): void => {
  createRoot(container).render(
    <StrictMode>
      <App />
    </StrictMode>,
  );
  // After the first chart: fetch the other panels' code while the user reads it.
  setTimeout(() => void preloadFeaturePanels().catch(() => undefined), 500);
};

// Start-up work in tasks of their own, each short (a long task delays any input): the restore,
// the base build, the charts' samples, then the first render, which finds them made.
const nextTask = (): Promise<void> => new Promise((resolve) => setTimeout(resolve, 0));
const prepare = async (): Promise<void> => {
  for (const step of FIRST_FRAME_STEPS) {
    await nextTask();
    step();
  }
  await nextTask();
};
// A workspace with turns or meeting steps fetches their code first (its own chunk), so its first
// chart is its curve, not a note that they are loading.
const overnightIfNeeded = (): Promise<unknown> => (needsOvernightKit(useAppStore.getState().workspace) ? loadOvernightKit().catch(() => undefined) : Promise.resolve());
void persistence.ready.then(openLinkBeforeRender).then(overnightIfNeeded).then(prepare).then(render, render);
