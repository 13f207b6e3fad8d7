// @vitest-environment jsdom
// The smooth-fit panel: model choice, the convergence report, residuals in bp and per 100 face,
// include/exclude and weights, the rich/cheap table. The figures are the core's (test/core/fit);
// here the panel must show them with their units and keep what the user types.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import axe from 'axe-core';
import { buildFromWorkspace, fitCurve, validateWorkspace } from '../../src/core/index.ts';
import { FitPanel } from '../../src/features/fit/FitPanel.tsx';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';

// Invented demo market.
const { depo3M, depo6M, bond2029, bond2031Price, bond2034, swap10Y, swap30Y } = INVENTED_2027; // test/helpers/markets.ts
const ws = validateWorkspace(workspaceDoc([depo3M, depo6M, bond2029, bond2031Price, bond2034, swap10Y, swap30Y], { interpolation: 'monotone-convex' })).workspace!;

describe('FitPanel', () => {
  it('shows a Nelson-Siegel fit: report, parameters with units, residuals in bp and per 100 face, bonds ranked rich to cheap', () => {
    render(<FitPanel workspace={ws} />);
    const panel = screen.getByRole('region', { name: 'Smooth fit' });
    expect(within(panel).getByRole('status')).toHaveTextContent(/Nelson-Siegel fit converged/);
    // No turns or meeting steps in this workspace: no note on them (test/ui/fitTurns.test.tsx shows it with both).
    expect(panel).not.toHaveTextContent('A smooth form has no jump');
    expect(panel).not.toHaveTextContent('Meeting steps are not in the fit');
    const params = within(panel).getByRole('table', { name: 'Fitted parameters' });
    expect(params).toHaveTextContent('τ1 (years)');
    expect(params).toHaveTextContent('cont, ACT/365F');
    const residuals = within(panel).getByRole('table', { name: 'Fit residuals' });
    expect(within(residuals).getAllByRole('row')).toHaveLength(1 + ws.quotes.length);
    expect(residuals).toHaveTextContent('Residual (bp)');
    expect(residuals).toHaveTextContent('Residual (per 100 face)');
    const expected = fitCurve(ws, { model: 'nelson-siegel' });
    if (!expected.ok) throw new Error('fit');
    const rc = within(panel).getByRole('table', { name: 'Rich and cheap bonds' });
    const order = within(rc).getAllByRole('row').slice(1).map((r) => r.getAttribute('data-quote'));
    expect(order).toEqual(expected.value.richCheap.map((e) => String(e.index)));
  });

  it('excludes a quote when its box is cleared, and keeps a bad weight as typed with a message', async () => {
    const user = userEvent.setup();
    render(<FitPanel workspace={ws} />);
    await user.click(screen.getByRole('checkbox', { name: 'include row 5 in the fit' }));
    expect(screen.getByRole('checkbox', { name: 'include row 5 in the fit' })).not.toBeChecked();
    expect(within(screen.getByRole('table', { name: 'Rich and cheap bonds' })).getByText(/left out of the fit/)).toBeInTheDocument();
    const weight = screen.getByRole('textbox', { name: 'weight of row 3' });
    await user.clear(weight);
    await user.type(weight, 'abc');
    expect(weight).toHaveValue('abc');
    expect(screen.getByRole('alert')).toHaveTextContent('Row 3 weight: type a number 0 or above');
  });

  it('draws the fitted zero curve with the exact bootstrap on one chart, each line with its tag', () => {
    const boot = buildFromWorkspace(ws);
    render(<FitPanel workspace={ws} bootstrap={boot.curve} repricing={boot.repricing} />);
    expect(screen.getByRole('img', { name: 'Zero curve, Nelson-Siegel fit and exact bootstrap, cont, ACT/365F' })).toBeInTheDocument();
    const residuals = screen.getByRole('table', { name: 'Fit residuals' });
    // The exact bootstrap reprices every quote within its acceptance (src/core/numeric/tolerance.ts):
    // shown as zero in the quote's unit, bp for a rate quote and per 100 for a price quote, never as 1e-14 noise.
    expect(residuals).toHaveTextContent('0.0000 bp');
    expect(residuals).toHaveTextContent('0.000000 per 100');
    expect(residuals.textContent).not.toMatch(/e[-+]\d/);
  });

  it('switches to Svensson and to no fit', async () => {
    const user = userEvent.setup();
    render(<FitPanel workspace={ws} />);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Model' }), 'svensson');
    expect(screen.getByRole('status')).toHaveTextContent(/Svensson fit/);
    expect(screen.getByRole('table', { name: 'Fitted parameters' })).toHaveTextContent('τ2 (years)');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Model' }), 'none');
    expect(screen.getByRole('status')).toHaveTextContent('No fit chosen');
  });
  it('has no accessibility violations found by axe-core (WCAG 2 A and AA rules; colour contrast needs a real renderer)', async () => {
    const { container } = render(<FitPanel workspace={ws} />);
    const result = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.map((v) => `${v.id}: ${v.nodes.length} nodes, e.g. ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
});
