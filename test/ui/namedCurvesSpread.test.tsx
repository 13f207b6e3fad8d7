// @vitest-environment jsdom
// Several curves in the workbench (issue 18 item 10), the spread chart and which curve each part
// reads: the spread view's chart draws the core's own curveSpreadAt values (euribor6m minus the
// default curve, zero rates in the display's convention, bp) at the zero chart's sample dates, its
// readout prints them in bp; with named curves the default sheet's rows, the scenarios and roll
// versus term say which curve they read, and a workspace of one curve says nothing new. The
// fixture is the command line's invented test document (test/fixtures/namedCurves/SOURCE.md); the
// reference values are the core's (the UI computes nothing financial).
import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { buildWorkbenchCurves, curveSpreadAt, formatBp, parseTenor } from '../../src/core/index.ts';
import { RollSlot } from '../../src/features/roll/RollSlot.tsx';
import { ScenariosTab } from '../../src/features/scenarios/ScenariosTab.tsx';
import { shownBuild } from '../../src/features/namedCurves/namedCurvesKit.ts';
import { hoverStore } from '../../src/charts/hover.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { sampleGridFor } from '../../src/hooks/useCurveSeries.ts';
import { useAppStore } from '../../src/state/store.ts';
import { openWorkspaceFile, TWO_CURVES } from '../helpers/engineWorkspace.ts';

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const FIXTURE = TWO_CURVES;
const initial = useAppStore.getInitialState();
const open = openWorkspaceFile;

beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
  hoverStore.set(null);
});

/** The vertices of an SVG path of M and L commands, in px. */
const vertices = (d: string): [number, number][] => [...d.matchAll(/[ML]([-\d.]+),([-\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);

describe('the spread chart', () => {
  it('draws the core’s curveSpreadAt values at the zero chart’s sample dates, in bp, and reads them out in bp', async () => {
    const ws = open();
    render(<App />);
    const chart = await screen.findByRole('img', { name: 'Spread of euribor6m over default, zero rates' }, { timeout: 20_000 });
    const defaultCurve = deriveBuild(ws).build.curve!;
    const euribor = buildWorkbenchCurves(ws, defaultCurve).curves.find((c) => c.name === 'euribor6m')!.build.curve!;
    const d = ws.display;
    const core = curveSpreadAt(euribor, defaultCurve, 'zero', sampleGridFor(euribor, d).dates, d.compounding, d.dayCount, parseTenor(d.forwardTenor)!);
    expect(core.length).toBeGreaterThan(100);
    // Every point drawn, once: the solid stretch and the dashed one past a last pillar share one vertex.
    const series = chart.querySelector('[data-series="spread"]')!;
    const paths = [...series.querySelectorAll('path')].map((p) => vertices(p.getAttribute('d')!));
    const drawn = paths.length === 1 ? paths[0]! : [...paths[0]!, ...paths[1]!.slice(1)];
    expect(drawn.length).toBe(core.length);
    // The vertical position is a straight-line map of the core's bp (to the path's 0.01 px), the larger spread higher.
    const lo = core.reduce((a, p, i) => (p.bp < core[a]!.bp ? i : a), 0);
    const hi = core.reduce((a, p, i) => (p.bp > core[a]!.bp ? i : a), 0);
    expect(core[hi]!.bp - core[lo]!.bp).toBeGreaterThan(1);
    const slope = (drawn[hi]![1] - drawn[lo]![1]) / (core[hi]!.bp - core[lo]!.bp);
    expect(slope).toBeLessThan(0);
    for (let i = 0; i < core.length; i++) expect(Math.abs(drawn[i]![1] - (drawn[lo]![1] + slope * (core[i]!.bp - core[lo]!.bp)))).toBeLessThan(0.02);
    // The axes say bp and the convention; the readout gives the core's figure in bp.
    expect(chart.textContent).toContain(`Spread (bp, zero rates, cont, ACT/365F)`);
    expect(d.compounding).toBe('continuous');
    fireEvent.keyDown(chart, { key: 'End' });
    const figure = chart.closest('figure')!;
    const last = core[core.length - 1]!;
    expect(within(figure).getByText((_, el) => el?.classList.contains('readout-item') ?? false).textContent).toContain(`Spread ${formatBp(last.bp)}`);
    expect(figure.textContent).toContain(`(${last.date})`);
    fireEvent.keyDown(chart, { key: 'Home' });
    expect(figure.querySelector('.readout-item')!.textContent).toContain(`Spread ${formatBp(core[0]!.bp)}`);
  });
});

describe('which curve each part reads', () => {
  const rowTitles = () => [...document.querySelectorAll('tr.sheet-row')].map((r) => r.getAttribute('title'));

  it('with named curves, the default sheet rows say they build and are discounted on "default"', async () => {
    open();
    render(<App />);
    await screen.findByRole('combobox', { name: 'Curve shown' }, { timeout: 20_000 });
    const titles = rowTitles();
    expect(titles.length).toBe(3);
    expect(titles).toEqual(Array(3).fill('Builds and is discounted on the curve "default"'));
  });

  it('a workspace of one curve has no such title on its rows', () => {
    render(<App />);
    const titles = rowTitles();
    expect(titles.length).toBeGreaterThan(3);
    expect(titles.every((t) => t === null)).toBe(true);
  });

  it('the scenarios name the curve shown, and roll versus term the default curve; one curve, neither', () => {
    const ws = open();
    const result = deriveBuild(ws);
    const named = buildWorkbenchCurves(ws, result.build.curve);
    const shown = shownBuild(result, named, ws, { shownCurve: 'euribor6m' });
    const a = render(<ScenariosTab result={shown} />);
    expect(screen.getByText('Scenarios on the curve "euribor6m", the curve shown.')).toBeTruthy();
    a.unmount();
    const b = render(<ScenariosTab result={result} />);
    expect(screen.getByText('Scenarios on the curve "default", the curve shown.')).toBeTruthy();
    b.unmount();
    const c = render(<RollSlot result={result} />);
    expect(screen.getByRole('heading', { level: 2 }).textContent).toBe('Roll versus term on the curve "default"');
    c.unmount();
    // A workspace of one curve: the headings as before.
    useAppStore.setState(initial, true);
    const single = deriveBuild(useAppStore.getState().workspace);
    render(<RollSlot result={single} />);
    expect(screen.getByRole('heading', { level: 2 }).textContent).toBe('Roll versus term');
    render(<ScenariosTab result={single} />);
    expect(screen.queryByText(/^Scenarios on the curve/)).toBeNull();
  });
});
