// A tiny page for the roll panel's browser test: today's curve from a demo market of our own
// invention, the strategy held in React state as the workbench holds it in the document.
import { StrictMode, useState } from 'react';
import { createRoot } from 'react-dom/client';
import { buildCurve } from '../../../src/core/index.ts';
import { DEFAULT_STRATEGY, type StrategyInputs } from '../../../src/core/analysis/rollVsTerm.ts';
import { RollPanel } from '../../../src/features/roll/RollPanel.tsx';
import '../../../src/styles/base.css';

const curve = buildCurve(
  {
    format: 'tenorscope-workspace',
    version: 1,
    settlement: '2026-12-01',
    curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none' },
    quotes: [
      { kind: 'deposit', tenor: '1M', rate: 0.031 },
      { kind: 'deposit', tenor: '3M', rate: 0.032 },
      { kind: 'deposit', tenor: '6M', rate: 0.0335 },
      { kind: 'swap', tenor: '1Y', rate: 0.034 },
      { kind: 'swap', tenor: '2Y', rate: 0.036 },
      { kind: 'swap', tenor: '3Y', rate: 0.0375 },
      { kind: 'swap', tenor: '5Y', rate: 0.039 },
      { kind: 'swap', tenor: '10Y', rate: 0.042 },
    ],
  },
  {},
).curve;

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
