// Placeholder entry point so the page builds and the browser smoke test has something to load.
// The workbench UI replaces this file.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';

const container = document.getElementById('root');
if (!container) throw new Error('Tenorscope: index.html has no #root element');

createRoot(container).render(
  <StrictMode>
    <main>Tenorscope workbench</main>
  </StrictMode>,
);
