// The whole workbench with the roll panel in its slot, mounted as src/app/extensions.tsx would
// (EXTENSIONS.rollPanel = RollSlot), for the browser test of the flow inside the app.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from '../../../src/app/App.tsx';
import { EXTENSIONS } from '../../../src/app/extensions.tsx';
import { RollSlot } from '../../../src/features/roll/RollSlot.tsx';
import '../../../src/styles/base.css';
import '../../../src/styles/workbench.css';

(EXTENSIONS as { rollPanel: unknown }).rollPanel = RollSlot;

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
