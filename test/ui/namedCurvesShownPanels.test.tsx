// @vitest-environment jsdom
// Roll versus term, the scenarios and the print on the curve shown (issue 18 items 10 and 11):
// with a named curve chosen in the picker, roll versus term runs on that curve
// (analyseRollOnCurve), the scenarios move it as applyScenarioOnCurve does (a projection curve's
// quotes moved and the curve built again against its discounting curve), and the print names it
// in each section; a workspace of one curve gives every figure as before, bit for bit. Oracles:
// the core's own analyseRollOnCurve and applyScenarioOnCurve, each held to outside references
// and to documents moved by hand in test/core/roll/rollOnCurve.test.ts and
// test/core/scenarios/namedCurveScenario.test.ts (the UI computes nothing financial). The fixture
// is the command line's invented two-curve document (test/fixtures/namedCurves/SOURCE.md).
import { act, render, screen, within } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { EXTENSIONS } from '../../src/app/extensions.tsx';
import {
  analyseRollOnCurve,
  analyseRollVsTerm,
  applyScenario,
  applyScenarioOnCurve,
  buildWorkbenchCurves,
  COMPARISON_TENORS,
  DEFAULT_STRATEGY,
  formatBpChange,
  formatMoney,
  formatPercent,
  scenarioEffects,
  type Curve,
  type Scenario,
} from '../../src/core/index.ts';
import { PrintTab } from '../../src/features/print/PrintTab.tsx';
import { RollResultLine, RollSlot } from '../../src/features/roll/RollSlot.tsx';
import { applyToShown } from '../../src/features/scenarios/applyShown.ts';
import { ScenariosTab } from '../../src/features/scenarios/ScenariosTab.tsx';
import { workbenchBuildOptions } from '../../src/hooks/overnightKit.ts';
import { deriveBuild, useCurveBuild, type WorkbenchBuild } from '../../src/hooks/useCurveBuild.ts';
import { useNamedCurves } from '../../src/hooks/useNamedCurves.ts';
import { useAppStore } from '../../src/state/store.ts';
import { openWorkspaceFile, TWO_CURVES } from '../helpers/engineWorkspace.ts';

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const FIXTURE = TWO_CURVES;
const initial = useAppStore.getInitialState();
const open = openWorkspaceFile;

beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

/** Quote space, so the projection curve is built again: the case where moving its own quotes alone goes wrong. */
const UP: Scenario = { id: 's1', name: 'Quotes up 25', space: 'quotes', shape: { kind: 'parallel', bp: 25 } };
/** The scenario table's conventions: the display's (ScenariosTab). */
const conv = () => {
  const d = useAppStore.getState().workspace.display;
  return { zeroCompounding: d.compounding, zeroDayCount: d.dayCount, forwardTenor: d.forwardTenor, forwardCompounding: d.compounding, forwardDayCount: d.dayCount };
};

/** The workbench's wiring: the build, the named curves and the curve shown (useNamedCurves), handed to each panel. */
let shownSeen: WorkbenchBuild | null = null;
function Workbench() {
  const { shown } = useNamedCurves(useCurveBuild());
  shownSeen = shown;
  return (
    <>
      <RollSlot result={shown} />
      <ScenariosTab result={shown} />
      <PrintTab result={shown} rollResult={<RollResultLine result={shown} />} />
    </>
  );
}

const rollPanel = () => screen.getAllByRole('region').find((r) => r.classList.contains('roll-panel'))!;
const cell = (table: HTMLElement, id: string) => within(table).getByText((_, el) => el?.getAttribute('data-cell') === id).textContent;

describe('roll versus term, scenarios and print on the curve shown', () => {
  it("the workbench hands roll versus term the curve shown (the picker's choice)", async () => {
    const slot = EXTENSIONS as { rollPanel: unknown };
    const before = slot.rollPanel;
    slot.rollPanel = RollSlot;
    try {
      open({ ...FIXTURE, view: { shownCurve: 'euribor6m' } } as unknown);
      render(<App />);
      const region = await screen.findByRole('region', { name: 'Roll versus term on the curve "euribor6m"' }, { timeout: 20_000 });
      expect(region.classList.contains('roll-panel')).toBe(true);
    } finally {
      slot.rollPanel = before;
    }
  });

  it('with euribor6m shown: the roll is analyseRollOnCurve on it, the scenarios applyScenarioOnCurve, the print names it', async () => {
    const ws = open({ ...FIXTURE, view: { shownCurve: 'euribor6m' } } as unknown);
    act(() => useAppStore.getState().setReserved('scenarios', [UP]));
    const doc = useAppStore.getState().workspace;
    const base = deriveBuild(doc);
    const named = buildWorkbenchCurves(doc, base.build.curve);
    const euribor = named.curves.find((c) => c.name === 'euribor6m')!;
    const curve = euribor.build.curve!;
    // The core's figures: the scenario on the whole document, the roll on the named curve with that scenario as a view.
    const moved = applyScenarioOnCurve(UP, { ...base.build.workspace!, curves: named.read! }, base.build.curve!, named.curves, 'euribor6m', workbenchBuildOptions());
    if (!moved.ok) throw new Error(moved.errors[0]!.message);
    const roll = analyseRollOnCurve({ euribor6m: curve }, 'euribor6m', DEFAULT_STRATEGY, [{ name: UP.name, curve: moved.value.curve }]);
    const onDefault = analyseRollVsTerm(base.build.curve!, DEFAULT_STRATEGY);
    if (!roll.ok || !onDefault.ok) throw new Error('no analysis');
    // What the old wiring gave: the projection curve's own quotes moved and built alone, as one curve.
    const alone = applyScenario(UP, euribor.build.workspace!, curve, workbenchBuildOptions());
    if (!alone.ok) throw new Error(alone.errors[0]!.message);

    render(<Workbench />);
    await within(await screen.findByRole('region', { name: 'Roll versus term on the curve "euribor6m"' }, { timeout: 20_000 })).findByText(/^Settlement /);
    expect(ws.curves).toBeDefined();
    expect(shownSeen?.curveName).toBe('euribor6m');
    // The roll's facts: today's 3M spot on euribor6m, not on the default curve.
    const facts = rollPanel().querySelector('.roll-facts')!.textContent!;
    expect(facts).toContain(`spot ${formatPercent(roll.value.spotRollRate)}`);
    expect(formatPercent(roll.value.spotRollRate)).not.toBe(formatPercent(onDefault.value.spotRollRate));
    // The results table: each strategy's money under the scenario view, as the core's analysis on the named curve gives it.
    const results = within(rollPanel()).getByRole('table', { name: /Strategies by views/ });
    const scenarioView = roll.value.views.findIndex((v) => v.id === `scenario:${UP.name}`);
    expect(scenarioView).toBeGreaterThan(0);
    for (const [words, id] of [[/^Par bond/, 'bond'], [/^Roll 3M/, 'roll']] as const) {
      const row = within(results).getByRole('rowheader', { name: words }).closest('tr')!;
      expect(row.querySelectorAll('td')[scenarioView]!.querySelector('.roll-value')!.textContent).toBe(formatMoney(roll.value.views[scenarioView]!.strategies.find((s) => s.id === id)!.terminal));
    }

    // The scenario table: the changes of euribor6m under the scenario applied to the whole document.
    const effects = scenarioEffects(curve, moved.value.curve, COMPARISON_TENORS, conv());
    const wrong = scenarioEffects(curve, alone.value.curve, COMPARISON_TENORS, conv());
    const table = screen.getByRole('table', { name: 'Scenario changes at key maturities' });
    let differ = 0;
    for (const r of effects) {
      expect(cell(table, `s1:${r.tenor}:zero`), r.tenor).toBe(formatBpChange(r.zeroBp));
      expect(cell(table, `s1:${r.tenor}:forward`), r.tenor).toBe(formatBpChange(r.forwardBp));
      if (formatBpChange(r.zeroBp) !== formatBpChange(wrong.find((w) => w.tenor === r.tenor)!.zeroBp)) differ++;
    }
    expect(differ).toBeGreaterThan(3); // the check can tell the two ways apart
    expect(screen.getByText(/^Scenarios on the curve "euribor6m", the curve shown/)).toBeTruthy();

    // The print preview: each section names the curve; its scenario changes are the same.
    const preview = screen.getAllByRole('article', { name: 'Printed summary' })[0]!;
    for (const h of ['Key maturities on the curve "euribor6m"', 'Roll versus term on the curve "euribor6m"']) expect(within(preview).getByRole('heading', { name: h })).toBeTruthy();
    expect(within(preview).getByRole('heading', { name: /^Scenarios on the curve "euribor6m"/ })).toBeTruthy();
    expect(preview.querySelector('.ps-settings')!.textContent).toMatch(/^Curve euribor6m · Settlement 2027-03-10/);
    const printed = preview.querySelector('.ps-scen')!;
    const tenYear = within(printed as HTMLElement).getByRole('rowheader', { name: '10Y' }).closest('tr')!;
    expect(tenYear.querySelectorAll('td')[0]!.textContent).toBe(formatBpChange(effects.find((r) => r.tenor === '10Y')!.zeroBp));
  });

  it('with a named discounting curve shown: its scenarios are applyScenarioOnCurve on it, and the section names the curves a move of its quotes rebuilds', async () => {
    // The fixture's curves moved onto a named discounting curve of their own (invented): euribor6m discounted on "ois2".
    const F = FIXTURE as unknown as { quotes: unknown[]; curves: Record<string, unknown>[] };
    const curves = [{ name: 'ois2', role: 'discounting', quotes: F.quotes }, { ...F.curves[0]!, discountCurve: 'ois2' }];
    open({ ...FIXTURE, curves, view: { shownCurve: 'ois2' } } as unknown);
    act(() => useAppStore.getState().setReserved('scenarios', [UP]));
    const doc = useAppStore.getState().workspace;
    const base = deriveBuild(doc);
    const named = buildWorkbenchCurves(doc, base.build.curve);
    const ois2 = named.curves.find((c) => c.name === 'ois2')!.build.curve!;
    const moved = applyScenarioOnCurve(UP, { ...base.build.workspace!, curves: named.read! }, base.build.curve!, named.curves, 'ois2', workbenchBuildOptions());
    if (!moved.ok) throw new Error(moved.errors[0]!.message);
    // The projection curve discounted on it moved with it (its swaps read the moved discount factors).
    expect(moved.value.curves.euribor6m!.lnDiscountAt(9)).not.toBe(named.curves.find((c) => c.name === 'euribor6m')!.build.curve!.lnDiscountAt(9));
    render(<Workbench />);
    expect(await screen.findByText('Scenarios on the curve "ois2", the curve shown; moving its quotes rebuilds "euribor6m" on it too.', undefined, { timeout: 20_000 })).toBeTruthy();
    const table = screen.getByRole('table', { name: 'Scenario changes at key maturities' });
    for (const r of scenarioEffects(ois2, moved.value.curve, COMPARISON_TENORS, conv())) expect(cell(table, `s1:${r.tenor}:zero`), r.tenor).toBe(formatBpChange(r.zeroBp));
  });

  it('with the default curve shown among named curves: the roll on it, the print naming it', async () => {
    open();
    const base = deriveBuild(useAppStore.getState().workspace);
    const today = analyseRollVsTerm(base.build.curve!, DEFAULT_STRATEGY);
    if (!today.ok) throw new Error('no analysis');
    render(<Workbench />);
    await within(await screen.findByRole('region', { name: 'Roll versus term on the curve "default"' }, { timeout: 20_000 })).findByText(/^Settlement /);
    expect(rollPanel().querySelector('.roll-facts')!.textContent).toContain(`spot ${formatPercent(today.value.spotRollRate)}`);
    const preview = screen.getAllByRole('article', { name: 'Printed summary' })[0]!;
    expect(within(preview).getByRole('heading', { name: 'Key maturities on the curve "default"' })).toBeTruthy();
  });

  it('a workspace of one curve: every figure as before, bit for bit, and nothing named', async () => {
    act(() => useAppStore.getState().setReserved('scenarios', [UP, { id: 's2', name: 'Zero up 10', space: 'zero', shape: { kind: 'parallel', bp: 10 } }]));
    const result = deriveBuild(useAppStore.getState().workspace);
    const curve = result.build.curve!;
    // applyToShown without named curves is applyScenario: the same curve, bit for bit.
    for (const s of [UP]) {
      const a = applyToShown(s, result, workbenchBuildOptions());
      const b = applyScenario(s, result.build.workspace!, curve, workbenchBuildOptions());
      if (!a.ok || !b.ok) throw new Error('scenario');
      for (const t of [0.1, 0.5, 1, 2, 5, 9.5, 20, 29]) expect(Object.is(a.value.curve.lnDiscountAt(t), b.value.curve.lnDiscountAt(t)), `t=${t}`).toBe(true);
    }
    const moved = applyScenario(UP, result.build.workspace!, curve, workbenchBuildOptions());
    if (!moved.ok) throw new Error('scenario');
    const views: { name: string; curve: Curve }[] = [{ name: UP.name, curve: moved.value.curve }];
    const z = applyScenario({ id: 's2', name: 'Zero up 10', space: 'zero', shape: { kind: 'parallel', bp: 10 } }, result.build.workspace!, curve);
    if (!z.ok) throw new Error('scenario');
    views.push({ name: 'Zero up 10', curve: z.value.curve });
    const today = analyseRollVsTerm(curve, DEFAULT_STRATEGY, views);
    if (!today.ok) throw new Error('no analysis');
    render(<Workbench />);
    expect(rollPanel().querySelector('h2')!.textContent).toBe('Roll versus term');
    expect(shownSeen?.onCurves).toBeUndefined();
    const results = within(rollPanel()).getByRole('table', { name: /Strategies by views/ });
    const money = [...results.querySelectorAll('.roll-value')].map((e) => e.textContent);
    expect(money).toEqual(today.value.strategies.flatMap((s) => today.value.views.map((v) => formatMoney(v.strategies.find((x) => x.id === s.id)!.terminal))));
    const table = screen.getByRole('table', { name: 'Scenario changes at key maturities' });
    for (const r of scenarioEffects(curve, moved.value.curve, COMPARISON_TENORS, conv())) expect(cell(table, `s1:${r.tenor}:zero`)).toBe(formatBpChange(r.zeroBp));
    expect(screen.queryByText(/on the curve "/)).toBeNull();
    const preview = screen.getAllByRole('article', { name: 'Printed summary' })[0]!;
    expect(within(preview).getByRole('heading', { name: 'Key maturities' })).toBeTruthy();
    expect(preview.querySelector('.ps-settings')!.textContent).toMatch(/^Settlement /);
  });
});
