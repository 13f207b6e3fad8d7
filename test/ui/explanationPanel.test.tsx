// @vitest-environment jsdom
// The explanation panel of the key-maturity table (issue 19): a number opens, beside the table, its
// explanation from the core; the steps end in the shown number to all digits; a quote link selects
// and focuses its sheet row; Copy as text writes the core's plain text. The figures are the core's
// (their definitions are tested against the textbook formulas in test/core/curve/explain.test.ts
// and test/core/analytics/explainRisk.test.ts); here the panel must show them. axe-core (WCAG 2 A
// and AA) checks the open panel.
import axe from 'axe-core';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { explained, forwardOn, fullText, marketDate, parseTenor, zeroOn } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

describe('explanation panel', () => {
  it('Enter on the 2Y forward opens its explanation beside the table, ending in the core forward to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const table = screen.getByRole('table', { name: 'Key maturities' });
    const row = table.querySelector('tr[data-tenor="2Y"]')!;
    const cell = within(row as HTMLElement).getByRole('button', { name: /explain the 3M forward rate starting 2Y/ });
    cell.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /3M forward rate starting 2Y/ });
    expect(cell).toHaveAttribute('aria-expanded', 'true');
    // Not a modal: the table stays in the page and usable.
    expect(screen.getByRole('table', { name: 'Key maturities' })).toBeVisible();
    expect(panel).toHaveFocus();
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const start = marketDate(curve.settlement, parseTenor('2Y')!);
    const end = marketDate(start, parseTenor(doc.display.forwardTenor)!);
    const f = forwardOn(curve, start, end, doc.display.compounding, doc.display.dayCount);
    if (!f.ok) throw new Error('forward');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(f.value.rate));
    const steps = within(panel).getByRole('region', { name: 'Steps' });
    expect(within(steps).getAllByRole('listitem').at(-1)!.textContent).toContain(`= ${fullText(f.value.rate)}`);
    expect(panel.textContent).toContain(`${start}`);
    expect(panel.textContent).toContain(doc.display.dayCount);
    // Escape closes it and gives the focus back to the number.
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary', { name: /forward rate/ })).not.toBeInTheDocument();
    expect(cell).toHaveFocus();
  });

  it('a quote link selects its sheet row and focuses its first cell', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const row = screen.getByRole('table', { name: 'Key maturities' }).querySelector('tr[data-tenor="5Y"]')!;
    await user.click(within(row as HTMLElement).getByRole('button', { name: /explain the 5Y zero rate/ }));
    const panel = await screen.findByRole('complementary', { name: /5Y zero rate/ });
    const links = within(panel).getAllByRole('button', { name: /^Row \d+:/ });
    expect(links.length).toBeGreaterThan(0);
    expect(links.length).toBeLessThanOrEqual(5);
    const n = Number(/^Row (\d+):/.exec(links[0]!.textContent!)![1]);
    await user.click(links[0]!);
    const rows = useAppStore.getState().workspace.quotes;
    expect(useAppStore.getState().selectedRowId).toBe(rows[n - 1]!.id);
    await waitFor(() => expect(document.activeElement).toBe(screen.getByRole('textbox', { name: `Row ${n} Kind` })));
  });

  it('Copy as text writes the core explanation text, with full-precision numbers and ISO dates', async () => {
    const user = userEvent.setup({ delay: null });
    const written: string[] = [];
    Object.defineProperty(navigator, 'clipboard', { value: { writeText: async (t: string) => void written.push(t) }, configurable: true });
    render(<App />);
    const row = screen.getByRole('table', { name: 'Key maturities' }).querySelector('tr[data-tenor="1Y"]')!;
    await user.click(within(row as HTMLElement).getByRole('button', { name: /explain the 1Y zero rate/ }));
    const panel = await screen.findByRole('complementary', { name: /1Y zero rate/ });
    await user.click(within(panel).getByRole('button', { name: 'Copy as text' }));
    await waitFor(() => expect(within(panel).getByRole('status')).toHaveTextContent('Copied'));
    const state = useAppStore.getState().workspace;
    const model = explainKeyCell(deriveBuild(state), state.display, { tenor: '1Y', field: 'zero' });
    if (!model.ok) throw new Error('model');
    expect(written).toEqual([model.value.text]);
    const curve = deriveBuild(state).build.curve!;
    const date = marketDate(curve.settlement, parseTenor('1Y')!);
    const z = explained((s) => zeroOn(curve, date, state.display.compounding, state.display.dayCount, 'date', s));
    if (!z.ok) throw new Error('zero');
    expect(written[0]).toContain(`Value: ${fullText(z.value.value.zero)}`);
    expect(written[0]).toContain(`DF = ${fullText(z.value.value.discount)}`);
    expect(written[0]).toMatch(new RegExp(`unadjusted ${date}`));
    expect(written[0]).toContain('not investment advice');
  });

  it('an open explanation follows an edit of the sheet once typing pauses', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const row = screen.getByRole('table', { name: 'Key maturities' }).querySelector('tr[data-tenor="10Y"]')!;
    await user.click(within(row as HTMLElement).getByRole('button', { name: /explain the 10Y zero rate/ }));
    const panel = await screen.findByRole('complementary', { name: /10Y zero rate/ });
    const before = panel.querySelector('[data-field="value"]')!.textContent;
    const rate = screen.getByRole('textbox', { name: 'Row 16 Rate / yield' });
    fireEvent.change(rate, { target: { value: '5.5' } });
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const z = zeroOn(curve, marketDate(curve.settlement, parseTenor('10Y')!), doc.display.compounding, doc.display.dayCount);
    if (!z.ok) throw new Error('zero');
    await waitFor(() => expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(z.value.zero)), { timeout: 5000 });
    expect(fullText(z.value.zero)).not.toBe(before);
  });

  it('the open panel has no axe-core violations', async () => {
    const user = userEvent.setup({ delay: null });
    const { container } = render(<App />);
    const row = screen.getByRole('table', { name: 'Key maturities' }).querySelector('tr[data-tenor="3Y"]')!;
    await user.click(within(row as HTMLElement).getByRole('button', { name: /explain the 3Y par yield/ }));
    await screen.findByRole('complementary', { name: /3Y par yield/ });
    const result = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.map((v) => `${v.id} (${v.impact}): ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
});
