// @vitest-environment jsdom
// A fitted model yield and a fit residual open the explanation panel (issue 19): chosen by
// keyboard, the panel's value and last step are the residual table's figure to all digits (fitCurve's
// residuals, the table's own source; test/core/fit/explainFit.test.ts recomputes the form and the
// quote from the shown inputs), the parameters are listed as fitted, the panel says why it lists no
// quotes and no other methods, and Escape gives the focus back. The demo workspace (invented).
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fitCurve, fullText } from '../../src/core/index.ts';
import { FitPanel } from '../../src/features/fit/FitPanel.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

describe('explanations in the smooth fit', () => {
  it('a model yield and a residual open their explanations, ending in the shown figures to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    const display = useAppStore.getState().workspace.display;
    const result = deriveBuild(useAppStore.getState().workspace);
    const ws = result.build.workspace!;
    render(<FitPanel workspace={ws} model="svensson" onModelChange={() => {}} rowOfQuote={result.conversion.rowOfQuote} explainFrom={{ result, display }} />);
    const fit = fitCurve(ws, { model: 'svensson', errors: 'yield', exclude: [], weights: {} });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const r = fit.value.residuals.find((x) => x.kind === 'bond')!;
    const row = result.conversion.rowOfQuote[r.index]! + 1;
    const table = screen.getByRole('table', { name: 'Fit residuals' });
    const button = within(table).getByRole('button', { name: new RegExp(`explain the fit residual of row ${row}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: `Fit residual of row ${row}` });
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(r.residualBp));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`residual = (model yield - market yield) x 10,000 = ${fullText(r.residualBp)} (bp)`);
    expect(steps[0]).toBe(`b0 = fitted = ${fullText(fit.value.params.b0)} (decimal per year (continuous))`);
    expect(steps.some((s) => s!.startsWith('tau2 = fitted'))).toBe(true);
    // The quotes it moves with through the fit (fitQuotes, held to bump and refit in test/core/fit/fitQuotes.test.ts), each a link to its row.
    const quotes = within(panel).getByRole('region', { name: 'Quotes it depends on most' });
    expect(quotes.textContent).toMatch(/through the fit.*no value under other interpolation methods/);
    expect(within(quotes).getAllByRole('button', { name: /^Row \d+:/ }).length).toBe(5);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();

    const yieldButton = within(table).getByRole('button', { name: new RegExp(`explain the fitted model yield of row ${row}$`) });
    yieldButton.focus();
    await user.keyboard('{Enter}');
    const yieldPanel = await screen.findByRole('complementary', { name: `Fitted model yield of row ${row}` });
    expect(yieldPanel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(r.modelYield));
  });
  it("the rich/cheap list: the yield column opens the residual's explanation, the price column its own, each the shown figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const display = useAppStore.getState().workspace.display;
    const result = deriveBuild(useAppStore.getState().workspace);
    const ws = result.build.workspace!;
    render(<FitPanel workspace={ws} model="nelson-siegel" onModelChange={() => {}} rowOfQuote={result.conversion.rowOfQuote} explainFrom={{ result, display }} />);
    const fit = fitCurve(ws, { model: 'nelson-siegel', errors: 'yield', exclude: [], weights: {} });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const entry = fit.value.richCheap[0]!;
    // The list's yield figure is the residual table's residual (fitCurve: richCheap's residualBp is the residual's), bit for bit.
    expect(Object.is(entry.residualBp, fit.value.residuals.find((x) => x.index === entry.index)!.residualBp)).toBe(true);
    const row = result.conversion.rowOfQuote[entry.index]! + 1;
    const table = screen.getByRole('table', { name: 'Rich and cheap bonds' });
    const bp = within(table).getByRole('button', { name: new RegExp(`explain the fit residual of row ${row}$`) });
    bp.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: `Fit residual of row ${row}` });
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(entry.residualBp));
    expect(bp.textContent).toBe(within(screen.getByRole('table', { name: 'Fit residuals' })).getByRole('button', { name: new RegExp(`explain the fit residual of row ${row}$`) }).textContent);
    await user.keyboard('{Escape}');
    expect(bp).toHaveFocus();

    const price = within(table).getByRole('button', { name: new RegExp(`explain the market minus model price of row ${row}$`) });
    price.focus();
    await user.keyboard('{Enter}');
    const pricePanel = await screen.findByRole('complementary', { name: `Market minus model price of row ${row}` });
    expect(pricePanel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(entry.richnessPrice));
    const steps = within(within(pricePanel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toMatch(new RegExp(`^richness = -\\(model price - (dirty|market price)\\) = ${fullText(entry.richnessPrice).replace('.', '\\.')} \\(per 100 face\\)$`));
    expect(steps.some((s) => s!.startsWith('model price = CF'))).toBe(true);
    // The panel opens after the rich/cheap list, not after the residual table.
    expect(table.compareDocumentPosition(pricePanel) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    await user.keyboard('{Escape}');
    expect(price).toHaveFocus();
  });
});
