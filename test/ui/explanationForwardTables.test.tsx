// @vitest-environment jsdom
// The forward strip and the forward grid open the same explanation panel as the key-maturity table
// (issue 19): a rate, chosen by keyboard, opens its explanation from the core; the panel's value and
// the last step are the rate the core's own query gives for those dates, to all digits (forwardOn
// for a forward, forwardParRateOn for a forward par swap rate: the definitions tested against the
// textbook formulas in test/core/curve/explain.test.ts); Escape closes it and gives the focus back.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { forwardOn, forwardParRateOn, forwardStrip, fullText, marketDate, parseTenor, topParQuoteInfluences } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { swapConvention } from '../../src/features/tables/ForwardGridTable.tsx';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

/** Opens a number by focus and Enter, checks the panel's value and last step against `expected`, closes by Escape. */
async function openReadClose(user: ReturnType<typeof userEvent.setup>, button: HTMLElement, panelName: RegExp, expected: number, more?: (panel: HTMLElement) => void): Promise<void> {
  button.focus();
  await user.keyboard('{Enter}');
  const panel = await screen.findByRole('complementary', { name: panelName });
  expect(button).toHaveAttribute('aria-expanded', 'true');
  expect(panel).toHaveFocus();
  expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(expected));
  const steps = within(panel).getByRole('region', { name: 'Steps' });
  expect(within(steps).getAllByRole('listitem').at(-1)!.textContent).toContain(`= ${fullText(expected)}`);
  more?.(panel);
  await user.keyboard('{Escape}');
  expect(screen.queryByRole('complementary', { name: panelName })).not.toBeInTheDocument();
  expect(button).toHaveFocus();
}

describe('explanations in the forward tables', () => {
  it('a forward of the strip opens its explanation, ending in the core forward to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward strip' }));
    const table = await screen.findByRole('table', { name: 'Forward strip' });
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const horizon = curve.pillars.at(-1)!.date;
    const strip = forwardStrip(curve, parseTenor(doc.display.forwardTenor)!, horizon, doc.display.compounding, doc.display.dayCount);
    if (!strip.ok) throw new Error('strip');
    const f = strip.value[6]!;
    // The same forward asked of the core by its dates.
    const again = forwardOn(curve, f.start, f.end, doc.display.compounding, doc.display.dayCount);
    if (!again.ok) throw new Error('forward');
    expect(again.value.rate).toBe(f.rate);
    const button = within(table).getByRole('button', { name: new RegExp(`explain the forward rate of period 7 \\(${f.start} to ${f.end}\\)`) });
    await openReadClose(user, button, /forward rate, period 7 of the strip/, f.rate);
  });

  it('a forward par swap rate and a forward zero rate of the grid open their explanations', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Forward grid' }));
    const table = await screen.findByRole('table', { name: 'Forward grid' });
    const doc = useAppStore.getState().workspace;
    const build = deriveBuild(doc).build;
    const curve = build.curve!;
    const start = marketDate(curve.settlement, parseTenor('2Y')!);
    const end = marketDate(start, parseTenor('5Y')!);
    const conv = swapConvention(build.workspace);
    const par = forwardParRateOn(curve, start, end, conv.frequency, conv.dayCount, conv.eom);
    if (!par.ok) throw new Error('par');
    const parButton = within(table.querySelector('[data-cell="2Yx5Y"]') as HTMLElement).getByRole('button', { name: /explain the 2Y into 5Y forward par swap rate/ });
    // Its quotes: the core's par sensitivities (checked against bumped rebuilds in test/core/analytics/explainRisk.test.ts), each a link to its row.
    const top = topParQuoteInfluences(curve, build.instruments, start, end, conv.frequency, conv.dayCount, conv.eom);
    if (!top.ok) throw new Error('par quotes');
    await openReadClose(user, parButton, /2Y into 5Y forward par swap rate/, par.value.rate, (panel) => {
      const quotes = within(panel).getByRole('region', { name: 'Quotes it depends on most' });
      const items = within(quotes).getAllByRole('listitem');
      expect(items).toHaveLength(5);
      expect(items[0]!.textContent).toContain(fullText(top.value[0]!.bpPerBp));
      expect(within(items[0]!).getByRole('button', { name: /^Row \d+:/ })).toBeInTheDocument();
    });

    await user.click(screen.getByRole('radio', { name: 'Forward zero rates' }));
    const fwd = forwardOn(curve, start, end, doc.display.compounding, doc.display.dayCount);
    if (!fwd.ok) throw new Error('forward');
    const zeroButton = within(table.querySelector('[data-cell="2Yx5Y"]') as HTMLElement).getByRole('button', { name: /explain the 2Y into 5Y forward rate/ });
    await openReadClose(user, zeroButton, /2Y into 5Y forward rate/, fwd.value.rate);
  });
});
