// The only startup code that touches the page: restore the saved workspace, keep saving it, render.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/App.tsx';
import { installFeaturePanels } from './app/installFeaturePanels.tsx';
import { startPersistence } from './state/persistence.ts';
import './styles/base.css';
import './styles/workbench.css';

const container = document.getElementById('root');
if (!container) throw new Error('Tenorscope: index.html has no #root element');

installFeaturePanels();
startPersistence();

createRoot(container).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
