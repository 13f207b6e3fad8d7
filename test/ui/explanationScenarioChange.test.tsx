// @vitest-environment jsdom
// A change in the Scenarios table opens the explanation panel (issue 19): chosen by keyboard, the
// panel's value and last step are the table's figure to all digits (scenarioEffects, the table's own
// source; the core test test/core/curve/explainChange.test.ts holds its two parts to the untraced
// zeroOn / forwardOn bit for bit), both curves' steps are listed, and Escape gives the focus back.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { applyScenario, buildCurve, fullText, scenarioEffects, type EffectConventions, type Scenario } from '../../src/core/index.ts';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { ScenarioPanel } from '../../src/features/scenarios/ScenarioPanel.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

/** The demo workspace's build and the table's conventions (the display's compounding and day count). */
function demoBuild() {
  const display = useAppStore.getState().workspace.display;
  const result = deriveBuild(useAppStore.getState().workspace);
  const conventions: EffectConventions = { zeroCompounding: display.compounding, zeroDayCount: display.dayCount, forwardTenor: display.forwardTenor, forwardCompounding: display.compounding, forwardDayCount: display.dayCount };
  return { display, result, base: result.build.curve!, conventions };
}

describe('explanations in the Scenarios table', () => {
  it('a forward change opens its explanation, ending in the shown figure to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    const { display, result, base, conventions } = demoBuild();
    const scenarios: Scenario[] = [{ id: 's1', name: 'Steeper', space: 'quotes', shape: { kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: 30 } }];
    render(<ScenarioPanel value={scenarios} onChange={() => {}} workspace={result.build.workspace} base={base} conventions={conventions} tenors={['2Y', '5Y', '10Y']} explainFrom={{ result, display }} />);
    // The table's figure, as the table computes it.
    const moved = applyScenario(scenarios[0]!, result.build.workspace!, base);
    if (!moved.ok) throw new Error('scenario');
    const figure = scenarioEffects(base, moved.value.curve, ['10Y'], conventions)[0]!.forwardBp!;
    const table = screen.getByRole('table', { name: 'Scenario changes at key maturities' });
    const button = within(table).getByRole('button', { name: /explain the change of the 10Y .* forward under Steeper/ });
    expect(button.closest('td')!.getAttribute('data-cell')).toBe('s1:10Y:forward');
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Change of the 10Y .* forward rate under Steeper/ });
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`change = (scenario rate - base rate) x 10,000 bp = ${fullText(figure)} (bp (1 bp = 0.0001 of the rate))`);
    expect(steps.some((s) => s!.startsWith('base curve: lnP = ln DF(end) - ln DF(start)'))).toBe(true);
    expect(steps.some((s) => s!.startsWith('scenario curve: lnP = ln DF(end) - ln DF(start)'))).toBe(true);
    // The quotes behind it (the base forward's, each a link to its row) and the change under each method.
    const links = within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ });
    expect(links.length).toBe(5);
    const model = explainKeyCell(result, display, { change: { scenario: scenarios[0]!, tenor: '10Y', field: 'forward', conventions, buildOptions: {} } });
    if (!model.ok) throw new Error('model');
    expect(model.value.methods.length).toBe(5);
    for (const m of model.value.methods) {
      // Recomputed here as the table would under that method: the document built with it, the scenario applied, the change read.
      const built = buildCurve(result.conversion.doc, { skipInvalid: true, interpolation: m.method });
      const movedUnder = applyScenario(scenarios[0]!, built.workspace!, built.curve!, { interpolation: m.method });
      if (!movedUnder.ok) throw new Error(m.method);
      expect(m.value).toBe(scenarioEffects(built.curve!, movedUnder.value.curve, ['10Y'], conventions)[0]!.forwardBp);
      if (m.current) expect(m.value).toBe(figure);
    }
    expect(new Set(model.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
    expect(within(panel).getByRole('region', { name: /method/i }).textContent).toContain(fullText(model.value.methods[1]!.value!));
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
    expect(button).toHaveAttribute('aria-expanded', 'false');
  });

  it('an open change follows its scenario when the scenario is edited', async () => {
    const user = userEvent.setup({ delay: null });
    const { display, result, base, conventions } = demoBuild();
    const at = (bp: number): Scenario[] => [{ id: 's1', name: 'Higher', space: 'zero', shape: { kind: 'parallel', bp } }];
    const props = { onChange: () => {}, workspace: result.build.workspace, base, conventions, tenors: ['2Y', '5Y'], explainFrom: { result, display } };
    const view = render(<ScenarioPanel value={at(25)} {...props} />);
    await user.click(within(screen.getByRole('table', { name: 'Scenario changes at key maturities' })).getByRole('button', { name: /explain the change of the 5Y zero rate under Higher/ }));
    const panel = await screen.findByRole('complementary', { name: /Change of the 5Y zero rate under Higher/ });
    const figure = (bp: number) => {
      const moved = applyScenario(at(bp)[0]!, result.build.workspace!, base);
      if (!moved.ok) throw new Error('scenario');
      return scenarioEffects(base, moved.value.curve, ['5Y'], conventions)[0]!.zeroBp!;
    };
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure(25)));
    view.rerender(<ScenarioPanel value={at(-40)} {...props} />);
    expect(screen.getByRole('complementary', { name: /Change of the 5Y zero rate under Higher/ }).querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure(-40)));
    expect(figure(-40)).not.toBe(figure(25));
  });
});
