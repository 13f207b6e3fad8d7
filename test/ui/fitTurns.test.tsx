// @vitest-environment jsdom
// The Smooth fit section on a workspace with a year-end turn and meeting steps: the fit carries the
// shown curve's turn (the form times its jump, FitOptions.turns) and says on screen what it does
// with the turn and that the meeting steps are not in it. Expected figures are the core's fitCurve
// with the build's turns, which test/core/fit/fitTurns.test.ts holds to a Nelson-Siegel form made
// by hand (Nelson & Siegel 1987) times the turn's jump; the figures without the turn must differ.
// Invented rates.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { installFeaturePanels } from '../../src/app/installFeaturePanels.tsx';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { bpFigure, buildCurve, fitCurve, OVERNIGHT_KIT } from '../../src/core/index.ts';
import { withEngineWorkspace } from '../helpers/engineWorkspace.ts';

const VALUATION = '2027-06-15';
const rate = (m: string, z: number) => {
  const d = (Date.parse(m) - Date.parse(VALUATION)) / 86_400_000;
  return (Math.expm1((z * d) / 365) * 360) / d;
};
const ENGINE = {
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: VALUATION,
  curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' },
  quotes: (
    [
      ['2027-07-15', 0.03],
      ['2027-09-15', 0.031],
      ['2027-12-15', 0.032],
      ['2028-01-18', 0.0328],
      ['2028-06-15', 0.034],
      ['2030-06-15', 0.036],
      ['2035-06-15', 0.038],
    ] as const
  ).map(([m, z]) => ({ kind: 'deposit', maturity: m, rate: rate(m, z) })),
  turns: [{ name: 'year end 2027', from: '2027-12-31', to: '2027-12-31', calendar: 'weekends', spreadBp: 25 }],
  meetingSteps: { on: true, effectiveDates: ['2027-07-29', '2027-09-16'] },
};

withEngineWorkspace(ENGINE, async () => {
  await loadOvernightKit();
  await installFeaturePanels();
});

describe('Smooth fit with a turn and meeting steps', { timeout: 30_000 }, () => {
  it('fits with the shown curve\'s turn, says so, and says the meeting steps are not in the fit', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Smooth fit' }));
    const panel = await screen.findByRole('region', { name: 'Smooth fit' }, { timeout: 10_000 });
    await user.selectOptions(within(panel).getByRole('combobox', { name: 'Model' }), 'nelson-siegel');
    const note = within(panel).getByText(/A smooth form has no jump/);
    expect(note).toHaveTextContent('year end 2027 25.00 bp; overnight, simple ACT/360');
    expect(note).toHaveTextContent('Meeting steps are not in the fit');
    const b = buildCurve(ENGINE, { overnight: OVERNIGHT_KIT, skipInvalid: true });
    expect(b.errors).toEqual([]);
    const withTurn = fitCurve(b.workspace!, { model: 'nelson-siegel', turns: b.overnight!.turns });
    const without = fitCurve(b.workspace!, { model: 'nelson-siegel' });
    if (!withTurn.ok || !without.ok) throw new Error('fit');
    // Row 4, the deposit over the turn (quotes[3]).
    const residual = (f: typeof withTurn) => (f.ok ? bpFigure(f.value.residuals.find((r) => r.index === 3)!.residualBp) : '');
    expect(residual(withTurn)).not.toBe(residual(without));
    const row = within(within(panel).getByRole('table', { name: 'Fit residuals' })).getByRole('row', { name: /^Row 4 deposit/ });
    expect(within(row).getByText(residual(withTurn), { selector: '[data-field="residual-bp"]' })).toBeTruthy();
  });
});
