// @vitest-environment jsdom
// The charts' readout opens the explanation of the point it reads (issue 19): with the keyboard
// cursor on the zero chart (arrow keys), "Explain the zero rate at ..." opens the panel of that
// point's zero rate; on the forward chart, of the forward of the display tenor starting there. The
// panel's value is the core's own query for that date, to all digits (zeroOn, forwardOn: the
// definitions tested against the textbook formulas in test/core/curve/explain.test.ts); Escape
// closes it and gives the focus back to the button.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { forwardOn, fullText, marketDate, parseTenor, zeroOn } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { hoverStore } from '../../src/charts/hover.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
  hoverStore.set(null);
});

describe('explaining a point of the charts', () => {
  it('the zero chart: keyboard cursor, then Explain opens the zero rate of that date; Escape returns the focus', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const explainButtons = screen.getAllByRole('button', { name: /^Explain a zero rate: read a point first/ });
    expect(explainButtons[0]).toBeDisabled();
    const chart = screen.getByRole('img', { name: /^Zero curve/ });
    chart.focus();
    await user.keyboard('{Home}');
    for (let i = 0; i < 40; i++) await user.keyboard('{ArrowRight}');
    // The focus leaves the chart (the cursor goes), the button keeps the point last read.
    await user.tab();
    const button = screen.getByRole('button', { name: /^Explain the zero rate at [\d.]+y \(\d{4}-\d{2}-\d{2}\)$/ });
    expect(button).toHaveFocus();
    const date = /\((\d{4}-\d{2}-\d{2})\)/.exec(button.textContent!)![1]!;
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Zero rate on ${date}`) });
    expect(panel).toHaveFocus();
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const z = zeroOn(curve, date, doc.display.compounding, doc.display.dayCount);
    if (!z.ok) throw new Error('zero');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(z.value.zero));
    const steps = within(panel).getByRole('region', { name: 'Steps' });
    expect(within(steps).getAllByRole('listitem').at(-1)!.textContent).toContain(`= ${fullText(z.value.zero)}`);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary', { name: /Zero rate on/ })).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it('the forward chart: Explain opens the forward of the display tenor starting at the point', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const chart = screen.getByRole('img', { name: /^Forward curve/ });
    chart.focus();
    await user.keyboard('{End}');
    for (let i = 0; i < 25; i++) await user.keyboard('{ArrowLeft}');
    const doc = useAppStore.getState().workspace;
    const button = screen.getByRole('button', { name: new RegExp(`^Explain the ${doc.display.forwardTenor} forward at`) });
    const start = /\((\d{4}-\d{2}-\d{2})\)/.exec(button.textContent!)![1]!;
    await user.click(button);
    const curve = deriveBuild(doc).build.curve!;
    const end = marketDate(start, parseTenor(doc.display.forwardTenor)!);
    const panel = await screen.findByRole('complementary', { name: new RegExp(`forward rate starting ${start} \\(${start} to ${end}\\)`) });
    const f = forwardOn(curve, start, end, doc.display.compounding, doc.display.dayCount);
    if (!f.ok) throw new Error('forward');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(f.value.rate));
  });
});
