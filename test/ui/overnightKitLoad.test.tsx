// @vitest-environment jsdom
// The code of turns and meeting steps is fetched on first use: a workspace that has them builds no
// curve until it arrives (saying so), then the base build is derived again and the curve is there;
// a workspace without them never asks for it. (A file of its own: the kit, once loaded, stays loaded.)
// The effective dates are SOFR's (MARKET-CONVENTIONS.md section h); the quotes are invented.
import { render, screen } from '@testing-library/react';
import { useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { loadedOvernightKit } from '../../src/hooks/overnightKit.ts';
import { useAppStore } from '../../src/state/store.ts';
import { openEngineDocument } from '../helpers/engineWorkspace.ts';

const ENGINE = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-03-01',
  meetingSteps: { on: true, effectiveDates: ['2022-03-17', '2022-11-03'] },
  quotes: [
    { kind: 'deposit', maturity: '2022-03-10', rate: 0.0005 },
    { kind: 'deposit', maturity: '2022-06-01', rate: 0.0125 },
    { kind: 'ois', tenor: '2Y', rate: 0.032 },
  ],
};

function Probe() {
  const r = useCurveBuild();
  return <p data-testid="state">{r.build.curve ? `curve ${r.build.curve.interpolation} ${r.build.curve.pillars.map((p) => p.date).join(' ')}` : `none: ${r.build.errors[0]?.message ?? ''}`}</p>;
}

it('a workspace with meeting steps on builds once the kit has arrived; before, it says the steps are loading', async () => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  expect(loadedOvernightKit()).toBeNull();
  render(<Probe />);
  expect(screen.getByTestId('state').textContent).toMatch(/^curve /); // the demo: no turns, no steps, no kit needed
  expect(loadedOvernightKit()).toBeNull();
  openEngineDocument(ENGINE, 'steps');
  expect(screen.getByTestId('state').textContent).toContain('none: the turns and meeting steps are still loading');
  await screen.findByText('curve log-linear-discount 2022-03-17 2022-11-03 2024-03-01', undefined, { timeout: 10_000 });
  expect(loadedOvernightKit()).not.toBeNull();
});
