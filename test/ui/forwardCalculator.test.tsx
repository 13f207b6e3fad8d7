// @vitest-environment jsdom
// The forward calculator and the forward grid's chosen axes: what is typed lives in the document's
// view (saved, undone, shared), and every figure shown is the core's (forwardBetween,
// forwardParRateOn) on the workspace's curve. The core's figures are tested against a published
// table in test/core/curve/forwardBetween.test.ts; here the panel must show them.
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { forwardBetween, fullText } from '../../src/core/index.ts';
import { formatNumber, formatPercent } from '../../src/core/index.ts';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

describe('Forward calculator', { timeout: 30_000 }, () => {
  it('shows the core forward for a typed start and end, keeps the rows in the document, and undoes them', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward calculator' }));
    const table = await screen.findByRole('table', { name: 'Forward calculator' }); // its code loads on first use
    const start = within(table).getByRole('textbox', { name: 'Start of forward 2' });
    const end = within(table).getByRole('textbox', { name: 'End of forward 2' });
    await user.clear(start);
    await user.type(start, '18M');
    await user.clear(end);
    await user.type(end, '2030-06-30');
    await user.tab();
    const doc = useAppStore.getState().workspace;
    const view = doc.view as Record<string, unknown>;
    expect(view.forwardCalcStarts).toEqual(['', '18M', '5Y']);
    expect(view.forwardCalcEnds).toEqual(['3M', '2030-06-30', '5Y']);
    const curve = deriveBuild(doc).build.curve!;
    const f = forwardBetween(curve, '18M', '2030-06-30', doc.display.compounding, doc.display.dayCount);
    if (!f.ok) throw new Error(JSON.stringify(f.errors));
    expect(table.querySelector('[data-forward="2"]')!.textContent).toBe(formatPercent(f.value.rate));
    // Two fields typed: two undo steps bring back the default row.
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect((useAppStore.getState().workspace.view as Record<string, unknown> | undefined)?.forwardCalcStarts ?? ['', '1Y', '5Y']).toEqual(['', '1Y', '5Y']);
  });

  it('says what is wrong with a start in words, and adds and removes rows', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward calculator' }));
    const table = await screen.findByRole('table', { name: 'Forward calculator' }); // its code loads on first use
    await user.type(within(table).getByRole('textbox', { name: 'Start of forward 1' }), 'soon');
    expect(within(table).getByRole('alert')).toHaveTextContent(/Start: "soon" is neither a tenor from settlement/);
    await user.click(screen.getByRole('button', { name: 'Add a forward' }));
    expect(within(table).getAllByRole('row')).toHaveLength(5);
    await user.click(screen.getByRole('button', { name: 'Remove forward 1' }));
    expect(within(table).getAllByRole('row')).toHaveLength(4);
    expect(within(table).queryByRole('alert')).not.toBeInTheDocument();
  });
});

describe('Forward grid axes', { timeout: 30_000 }, () => {
  it('draws the starts and tenors the user types, and keeps the standard axes while a typed one is wrong', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward grid' }));
    const starts = await screen.findByRole('textbox', { name: /Starts/ }); // its code loads on first use
    await user.clear(starts);
    await user.type(starts, '6m, 3Y');
    const grid = screen.getByRole('table', { name: 'Forward grid' });
    expect(within(grid).getAllByRole('rowheader').map((h) => h.textContent)).toEqual(['6M', '3Y']);
    expect((useAppStore.getState().workspace.view as Record<string, unknown>).gridStarts).toBe('6m, 3Y');
    await user.type(starts, ', x');
    expect(screen.getByRole('alert')).toHaveTextContent(/Starts: "X" is not a tenor/);
    expect(within(screen.getByRole('table', { name: 'Forward grid' })).getAllByRole('rowheader').map((h) => h.textContent)).toEqual(['1Y', '2Y', '5Y', '10Y']);
  });

  it('a forward opens its explanation beside the table, ending in the calculator\'s figure to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward calculator' }));
    const table = await screen.findByRole('table', { name: 'Forward calculator' });
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const f = forwardBetween(curve, '5Y', '5Y', doc.display.compounding, doc.display.dayCount);
    if (!f.ok) throw new Error('forward');
    const button = within(table).getByRole('button', { name: `${formatPercent(f.value.rate)}: explain forward 3 (${f.value.start} to ${f.value.end})` });
    await user.click(button);
    const panel = await screen.findByRole('complementary', { name: /Forward rate 3 of the calculator/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(f.value.rate));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem');
    expect(steps.at(-1)!.textContent).toContain(`= ${fullText(f.value.rate)}`);
    expect(panel.textContent).toContain(`DF = ${fullText(f.value.dfStart)}`);
    expect(panel.textContent).toContain(`DF = ${fullText(f.value.dfEnd)}`);
  });
  it("a discount factor opens its explanation, ending in the calculator's figure to all digits; in a read-only workspace the figures still open while the inputs are locked", async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward calculator' }));
    const table = await screen.findByRole('table', { name: 'Forward calculator' });
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const f = forwardBetween(curve, '5Y', '5Y', doc.display.compounding, doc.display.dayCount);
    if (!f.ok) throw new Error('forward');
    act(() => useAppStore.getState().openReadOnly(useAppStore.getState().workspace, [], 'link'));
    expect(within(table).getByRole('textbox', { name: 'Start of forward 3' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Add a forward' })).toBeDisabled();
    const button = within(table).getByRole('button', { name: `${formatNumber(f.value.dfEnd, 8)}: explain the discount factor at the end of forward 3 (${f.value.end})` });
    expect(button).not.toBeDisabled();
    await user.click(button);
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Discount factor at the end of forward 3 \\(${f.value.end}\\)`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(f.value.dfEnd));
    // Recomputed from the panel's own input: DF = exp(ln DF), the value today of 1 paid on the date (its definition).
    const e = explainKeyCell(deriveBuild(doc), doc.display, { field: 'discount', start: f.value.end });
    if (!e.ok) throw new Error(e.errors[0]!.message);
    expect(Math.exp(e.value.explanation.reads[0]!.lnDiscount)).toBe(f.value.dfEnd);
    expect(e.value.explanation.value).toBe(f.value.dfEnd);
  });
});
