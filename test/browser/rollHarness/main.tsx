// A tiny page for the roll panel's browser test: today's curve from a demo market of our own
// invention, the strategy held in React state as the workbench holds it in the document.
import { StrictMode, useState } from 'react';
import { createRoot } from 'react-dom/client';
import { DEFAULT_STRATEGY, type StrategyInputs } from '../../../src/core/index.ts';
import { RollPanel } from '../../../src/features/roll/RollPanel.tsx';
import { rollMarketCurve } from '../../helpers/rollMarket.ts';
import '../../../src/styles/base.css';

// The invented roll test market (test/helpers/rollMarket.ts), all eight quotes.
const curve = rollMarketCurve();

function Page() {
  const [strategy, setStrategy] = useState<StrategyInputs>(DEFAULT_STRATEGY);
  return (
    <main style={{ maxWidth: 980, margin: '12px auto', background: '#fff', padding: 10 }}>
      <RollPanel curve={curve} strategy={strategy} onStrategyChange={setStrategy} />
      <pre data-testid="strategy-json" hidden>{JSON.stringify(strategy)}</pre>
    </main>
  );
}

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <Page />
  </StrictMode>,
);
