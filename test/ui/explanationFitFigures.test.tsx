// @vitest-environment jsdom
// The smooth fit's remaining figures open the explanation panel: a residual per 100 face, each
// fitted parameter, the weighted RMS error, and the fit chart's readout point. Opened by keyboard,
// each panel has its title and the figure shown to all digits (the table's own source, fitCurve;
// the chart's own sampling, zeroSamples on the fitted curve); test/core/fit/explainFitFigures.test.ts
// recomputes their steps from the shown inputs (Nelson and Siegel 1987; Svensson 1994). The demo
// workspace (invented).
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { bpFigure, fitCurve, formatNumber, formatPercent, formatPrice, fullText, sampleGrid, zeroSamples } from '../../src/core/index.ts';
import { FitPanel } from '../../src/features/fit/FitPanel.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

function setUp() {
  const display = useAppStore.getState().workspace.display;
  const result = deriveBuild(useAppStore.getState().workspace);
  const ws = result.build.workspace!;
  render(<FitPanel workspace={ws} model="svensson" onModelChange={() => {}} bootstrap={result.build.curve} repricing={result.build.repricing} rowOfQuote={result.conversion.rowOfQuote} explainFrom={{ result, display }} />);
  const fit = fitCurve(ws, { model: 'svensson', errors: 'yield', exclude: [], weights: {} });
  if (!fit.ok) throw new Error(fit.errors[0]!.message);
  return { result, fit: fit.value };
}

async function open(user: ReturnType<typeof userEvent.setup>, button: HTMLElement, title: string | RegExp) {
  button.focus();
  await user.keyboard('{Enter}');
  const panel = await screen.findByRole('complementary', { name: title });
  expect(panel).toHaveFocus();
  return panel;
}

describe('the smooth fit: residual per 100 face, parameters, RMS and the chart', () => {
  it('a residual per 100 face, a parameter and the RMS open their explanations with the shown figures to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    const { result, fit } = setUp();
    const r = fit.residuals.find((x) => x.kind === 'bond')!;
    const row = result.conversion.rowOfQuote[r.index]! + 1;
    const residuals = screen.getByRole('table', { name: 'Fit residuals' });
    const price = within(residuals).getByRole('button', { name: new RegExp(`explain the fit residual per 100 face of row ${row}$`) });
    // The button shows the table's figure, the panel all its digits.
    expect(price.textContent).toBe(formatPrice(r.residualPrice));
    let panel = await open(user, price, `Fit residual per 100 face of row ${row}`);
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(r.residualPrice));
    await user.keyboard('{Escape}');
    expect(price).toHaveFocus();

    const params = screen.getByRole('table', { name: 'Fitted parameters' });
    for (const name of ['b0', 'tau2'] as const) {
      const button = within(params).getByRole('button', { name: new RegExp(`explain the fitted ${name}$`) });
      expect(button.textContent).toBe(name === 'b0' ? formatPercent(fit.params.b0) : formatNumber(fit.params.tau2!, 4));
      panel = await open(user, button, `Fitted ${name}`);
      expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(fit.params[name]!));
      const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
      expect(steps.at(-1)).toMatch(new RegExp(`^${name} = argmin S \\(${fit.iterations} iterations, ${fit.stopReason}\\)`));
      expect(steps.some((s) => s!.startsWith('S = sum (sqrt(w) r)^2'))).toBe(true);
      // A b parameter lists the quotes it moves with through the fit (fitQuotes); a tau, none (see its steps).
      const quotes = within(panel).getByRole('region', { name: 'Quotes it depends on most' });
      if (name === 'b0') expect(within(quotes).getAllByRole('button', { name: /^Row \d+:/ }).length).toBe(5);
      else expect(quotes.textContent).toMatch(/none: see the steps/);
      await user.keyboard('{Escape}');
      expect(button).toHaveFocus();
    }
    const rms = within(params).getByRole('button', { name: /explain the Weighted RMS error$/ });
    expect(rms.textContent).toBe(bpFigure(fit.rmsBp));
    panel = await open(user, rms, 'Weighted RMS error');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(fit.rmsBp));
  });

  it("the fit chart's readout opens the fitted zero rate at the point read, the plotted value to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const { result, fit } = setUp();
    const chart = screen.getByRole('img', { name: /^Zero curve, Svensson fit/ });
    chart.focus();
    await user.keyboard('{Home}');
    for (let i = 0; i < 30; i++) await user.keyboard('{ArrowRight}');
    await user.tab();
    const button = screen.getByRole('button', { name: /^Explain the (Nelson-Siegel|Svensson) fit zero rate at [\d.]+y \(\d{4}-\d{2}-\d{2}\)$/ });
    expect(button).toHaveFocus();
    const date = /\((\d{4}-\d{2}-\d{2})\)/.exec(button.textContent!)![1]!;
    const panel = await open(user, button, `Fitted zero rate on ${date}`);
    // The plotted point: FitChart's grid (to the later last pillar of the fit and the bootstrap), continuous on the curve's day count.
    const c = fit.curve;
    const last = [c.pillars.at(-1)!, result.build.curve!.pillars.at(-1)!].sort((a, b) => b.t - a.t)[0]!;
    const s = zeroSamples(c, sampleGrid(c.settlement, last.date, 160, c.dayCount, c.dayCount, { n: 3, unit: 'M' }), 'continuous');
    const y = s.y[s.dates.indexOf(date)]!;
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(y));
    await user.keyboard('{Escape}');
    expect(button).toHaveFocus();
  });
  it("the exact bootstrap's repricing error beside a residual opens the quote check's explanation of it, the same figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const { result } = setUp();
    const rep = result.build.repricing.find((x) => x.unit === 'rate')!;
    const row = result.conversion.rowOfQuote[rep.index]! + 1;
    const button = within(screen.getByRole('table', { name: 'Fit residuals' })).getByRole('button', { name: new RegExp(`explain the repricing error of row ${row}$`) });
    const panel = await open(user, button, new RegExp(`Repricing error of row ${row}`));
    // The quote check's figure: model minus market, in bp for a rate quote (explainQuoteCell).
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(rep.repricingError * 1e4));
    await user.keyboard('{Escape}');
    expect(button).toHaveFocus();
  });
});
