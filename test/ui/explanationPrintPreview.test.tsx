// @vitest-environment jsdom
// The print preview's numbers open their explanation beside the preview (issue 19): a key-maturity
// rate and a scenario change, chosen by keyboard or pointer, show the page's own figure to all
// digits (curveTable and scenarioEffects, the page's sources; their explanations are tested in
// test/core/curve/explain.test.ts and explainChange.test.ts), Copy as text writes the core's text,
// and the printed copy (the print root) carries no buttons and the same text as the preview, so
// the printed page is what it was. axe-core (WCAG 2 A and AA) on the open panel.
import axe from 'axe-core';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { analyseRollVsTerm, applyScenario, formatBpChange, formatMoneySigned, fullText, tableConventionsFromDisplay, validateStrategy, type Scenario } from '../../src/core/index.ts';
import { RollResultLine } from '../../src/features/roll/RollSlot.tsx';
import { PrintTab } from '../../src/features/print/PrintTab.tsx';
import { printKeyRows, printScenarios } from '../../src/features/print/printData.ts';
import { workbenchBuildOptions } from '../../src/hooks/overnightKit.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
// An invented scenario on the workbench's starting (invented demo) market.
const STEEPER: Scenario = { id: 's1', name: 'Steeper', space: 'quotes', shape: { kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: 30 } };

function renderTab() {
  useAppStore.setState(initial, true);
  const ws = useAppStore.getState().workspace;
  useAppStore.setState({ workspace: { ...ws, scenarios: [STEEPER] } });
  const doc = useAppStore.getState().workspace;
  const result = deriveBuild(doc);
  const { container } = render(<PrintTab result={result} />);
  const curve = result.build.curve!;
  const conv = tableConventionsFromDisplay(doc.display);
  return { container, result, curve, conv, doc };
}

describe('explanations in the print preview', () => {
  it('a key-maturity zero rate opens beside the preview with the page\'s figure to all digits; Escape returns the focus', async () => {
    const user = userEvent.setup({ delay: null });
    const { container, curve, conv } = renderTab();
    const row = printKeyRows(curve, conv).find((r) => r.label === '5Y')!;
    const preview = container.querySelector('.print-preview') as HTMLElement;
    const button = within(preview).getByRole('button', { name: /explain the zero rate at 5Y$/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /^5Y zero rate/ });
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(row.zero!));
    // Beside the preview, not inside the page.
    expect(preview.contains(panel)).toBe(false);
    expect(panel.parentElement).toBe(preview.parentElement);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it('a scenario change opens with the page\'s figure; Copy as text writes the explanation', async () => {
    const user = userEvent.setup({ delay: null });
    const written: string[] = [];
    Object.defineProperty(navigator, 'clipboard', { value: { writeText: async (t: string) => void written.push(t) }, configurable: true });
    const { container, result, curve, conv } = renderTab();
    const printed = printScenarios([STEEPER], result.build.workspace!, curve, conv, workbenchBuildOptions())[0]!;
    const figure = printed.rows!.find((r) => r.tenor === '10Y')!.forwardBp!;
    const preview = container.querySelector('.print-preview') as HTMLElement;
    await user.click(within(preview).getByRole('button', { name: /explain the 3M forward change at 10Y under Steeper/ }));
    const panel = await screen.findByRole('complementary', { name: /Change of the 10Y .* forward rate under Steeper/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    await user.click(within(panel).getByRole('button', { name: 'Copy as text' }));
    await waitFor(() => expect(within(panel).getByRole('status')).toHaveTextContent('Copied'));
    expect(written).toHaveLength(1);
    expect(written[0]).toContain(`change = (scenario rate - base rate) x 10,000 bp = ${fullText(figure)}`);
  });

  it('the printed copy has no buttons and reads exactly as the preview', () => {
    const { container } = renderTab();
    const preview = container.querySelector('.print-preview .print-summary') as HTMLElement;
    const printed = document.querySelector('.print-root .print-summary') as HTMLElement;
    expect(printed).not.toBeNull();
    expect(within(preview).getAllByRole('button').length).toBeGreaterThan(40);
    expect(printed.querySelectorAll('button, [tabindex]')).toHaveLength(0);
    expect(printed.textContent).toBe(preview.textContent);
  });

  it('the open panel has no serious or critical axe-core findings', async () => {
    const user = userEvent.setup({ delay: null });
    const { container } = renderTab();
    await user.click(within(container.querySelector('.print-preview') as HTMLElement).getByRole('button', { name: /explain the par yield at 2Y$/ }));
    await screen.findByRole('complementary', { name: /^2Y par yield/ });
    const r = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(r.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.impact}): ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });

  it("the roll table's money, return and against-rolling figures open with the page's figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    useAppStore.setState(initial, true);
    const ws = useAppStore.getState().workspace;
    useAppStore.setState({ workspace: { ...ws, scenarios: [STEEPER] } });
    const doc = useAppStore.getState().workspace;
    const result = deriveBuild(doc);
    const { container } = render(<PrintTab result={result} rollResult={<RollResultLine result={result} />} />);
    // The page's own source: the analysis on the workbench's curve with the scenario as a view.
    const strategy = validateStrategy((doc as { strategy?: unknown }).strategy).strategy;
    const moved = applyScenario(STEEPER, result.build.workspace!, result.build.curve!, workbenchBuildOptions());
    if (!moved.ok) throw new Error('scenario');
    const analysis = analyseRollVsTerm(result.build.curve!, strategy, [{ name: STEEPER.name, curve: moved.value.curve }]);
    if (!analysis.ok) throw new Error('analysis');
    const a = analysis.value;
    const view = a.views[a.chosen]!;
    const zero = view.strategies.find((x) => x.id === 'zero')!;
    const phrase = a.strategies.find((x) => x.id === 'zero')!.phrase;
    const preview = container.querySelector('.print-preview') as HTMLElement;
    const money = within(preview).getByRole('button', { name: new RegExp(`explain the money at the horizon of ${phrase} under ${view.label}$`) });
    money.focus();
    await user.keyboard('{Enter}');
    let panel = await screen.findByRole('complementary', { name: new RegExp(`Money at the horizon of ${phrase}`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(zero.terminal.toFixed());
    await user.keyboard('{Escape}');
    expect(money).toHaveFocus();
    await user.click(within(preview).getByRole('button', { name: new RegExp(`explain the return against rolling of ${phrase} under ${view.label}$`) }));
    panel = await screen.findByRole('complementary', { name: /against rolling/i });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(zero.vsRollBp));
    // The printed copy of the roll table has no buttons and the preview's text.
    const printedRoll = document.querySelector('.print-root .ps-roll-table') as HTMLElement;
    expect(printedRoll.querySelectorAll('button')).toHaveLength(0);
    expect(printedRoll.textContent).toBe(preview.querySelector('.ps-roll-table')!.textContent);
    expect(printedRoll.textContent).toContain(`${formatMoneySigned(zero.vsRoll)} \u00b7 ${formatBpChange(zero.vsRollBp)}`);
  });
});
