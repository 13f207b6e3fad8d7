// @vitest-environment jsdom
// Every line of the Charts section explains its point: with the keyboard cursor on a chart, the row
// "Explain at <x>y (<date>):" under the readout has a button per line (named by its label and its own
// point), and each opens the panel of that line's number at that date, its value the core's own
// query on the line's curve to all digits (parYieldOn, zeroOn on the scenario curve made by
// applyScenario, forwardOn on the curve built under another method, instantaneousForwardOn; the
// unit test test/charts/lineExplanations.test.ts holds each to the plotted sample bit for bit).
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { applyScenario, buildCurve, forwardOn, fullText, instantaneousForwardOn, marketDate, parseTenor, parYieldOn, zeroOn, type Scenario } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { hoverStore } from '../../src/charts/hover.ts';
import { workbenchBuildOptions } from '../../src/hooks/overnightKit.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const UP: Scenario = { id: 'up', name: 'Up 50', space: 'zero', shape: { kind: 'parallel', bp: 50 } };
const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
  hoverStore.set(null);
  const ws = useAppStore.getState().workspace;
  useAppStore.setState({ workspace: { ...ws, scenarios: [UP], display: { ...ws.display, showPar: true, showInstantaneous: true, showMethodOverlay: true } } });
});

const DATE = /\((\d{4}-\d{2}-\d{2})\)$/;

/** Opens a line's explanation by its button (Enter) and returns the panel's value; the panel is closed again with Escape. */
async function openByKeyboard(user: ReturnType<typeof userEvent.setup>, button: HTMLElement, title: RegExp): Promise<string> {
  act(() => button.focus()); // the chart's blur clears the cursor; the row keeps the point last read
  await user.keyboard('{Enter}');
  const panel = await screen.findByRole('complementary', { name: title });
  const value = panel.querySelector('[data-field="value"]')!.textContent!;
  await user.keyboard('{Escape}');
  expect(button).toHaveFocus();
  return value;
}

describe("explaining each line's point of the charts", () => {
  it('the zero chart: the zero line, the par-yield line and a scenario line, by keyboard', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const chart = screen.getByRole('img', { name: /^Zero curve/ });
    const figure = chart.closest('figure')!;
    expect(within(figure).getByRole('button', { name: /^Explain a zero rate: read a point first/ })).toBeDisabled();
    chart.focus();
    await user.keyboard('{Home}');
    for (let i = 0; i < 120; i++) await user.keyboard('{ArrowRight}');
    expect(figure.querySelector('p.chart-explain')!.textContent).toMatch(/^Explain at [\d.]+y \(\d{4}-\d{2}-\d{2}\):/);
    const doc = useAppStore.getState().workspace;
    const result = deriveBuild(doc);
    const curve = result.build.curve!;
    const { compounding: c, dayCount: dc } = doc.display;

    const par = within(figure).getByRole('button', { name: /^Explain Par yield at [\d.]+y \(\d{4}-\d{2}-\d{2}\)$/ });
    const parDate = DATE.exec(par.getAttribute('aria-label')!)![1]!;
    const p = parYieldOn(curve, parDate, doc.display.parFrequency);
    if (!p.ok) throw new Error('par');
    expect(await openByKeyboard(user, par, new RegExp(`^Par yield to ${parDate}`))).toBe(fullText(p.value.rate));

    const scenario = within(figure).getByRole('button', { name: /^Explain Up 50 \(zero\) at / });
    const sDate = DATE.exec(scenario.getAttribute('aria-label')!)![1]!;
    const moved = applyScenario(UP, result.build.workspace!, curve, workbenchBuildOptions());
    if (!moved.ok) throw new Error('scenario');
    const z = zeroOn(moved.value.curve, sDate, c, dc);
    if (!z.ok) throw new Error('zero');
    expect(await openByKeyboard(user, scenario, new RegExp(`^Zero rate on ${sDate} under Up 50`))).toBe(fullText(z.value.zero));

    const zero = within(figure).getByRole('button', { name: /^Explain the zero rate at / });
    const z0 = zeroOn(curve, DATE.exec(zero.getAttribute('aria-label')!)![1]!, c, dc);
    if (!z0.ok) throw new Error('zero');
    expect(await openByKeyboard(user, zero, /^Zero rate on /)).toBe(fullText(z0.value.zero));
  });

  it('the forward chart: the instantaneous line and another method\'s line', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    const chart = screen.getByRole('img', { name: /^Forward curve/ });
    const figure = chart.closest('figure')!;
    // The other methods are built in idle slots; their lines come in one by one.
    await within(figure).findByRole('button', { name: /^Explain the 3M forward: read a point first|^Explain a 3M forward/ });
    chart.focus();
    await user.keyboard('{End}');
    for (let i = 0; i < 60; i++) await user.keyboard('{ArrowLeft}');
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    const inst = within(figure).getByRole('button', { name: /^Explain Instantaneous at / });
    const iDate = DATE.exec(inst.getAttribute('aria-label')!)![1]!;
    const f = instantaneousForwardOn(curve, iDate);
    if (!f.ok) throw new Error('inst');
    expect(await openByKeyboard(user, inst, new RegExp(`^Instantaneous forward on ${iDate}`))).toBe(fullText(f.value.forward));

    const other = curve.interpolation === 'linear-zero' ? 'log-linear-discount' : 'linear-zero';
    const label = other === 'linear-zero' ? 'Linear zero' : 'Log-linear discount';
    const method = await within(figure).findByRole('button', { name: new RegExp(`^Explain ${label} at `) }, { timeout: 20_000 });
    const mDate = DATE.exec(method.getAttribute('aria-label')!)![1]!;
    const built = buildCurve(deriveBuild(doc).conversion.doc, { ...workbenchBuildOptions(), skipInvalid: true, interpolation: other }).curve!;
    const r = forwardOn(built, mDate, marketDate(mDate, parseTenor(doc.display.forwardTenor)!), doc.display.compounding, doc.display.dayCount);
    if (!r.ok) throw new Error('forward');
    expect(await openByKeyboard(user, method, new RegExp(`forward rate starting ${mDate} .*\\(${label}\\)$`))).toBe(fullText(r.value.rate));
  });
});
