// @vitest-environment jsdom
// The roll panel's figures open their explanation (issue 19): a break-even rate and riding's
// break-even rise chosen by keyboard
// and a money value clicked open the panel beside their table, whose value and last step are the
// table's figure to all digits (analyseRollVsTerm, the panel's own source; the core test
// test/core/roll/explainRoll.test.ts holds the traced figures to the untraced ones bit for bit and
// recomputes their steps), a quote link brings its sheet row forward (the store's showRow), Copy
// as text writes the core's text, Escape gives the focus back, and axe-core finds no violation.
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import axe from 'axe-core';
import { analyseRollVsTerm, formatBpChange, fullText, validateStrategy } from '../../src/core/index.ts';
import { RollSlot } from '../../src/features/roll/RollSlot.tsx';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { useDrafts } from '../../src/state/drafts.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  useDrafts.setState({ drafts: {} });
});

function setUp() {
  const doc = useAppStore.getState().workspace;
  const result = deriveBuild(doc);
  const strategy = validateStrategy((doc as { strategy?: unknown }).strategy).strategy;
  const analysis = analyseRollVsTerm(result.build.curve!, strategy);
  if (!analysis.ok) throw new Error('analysis');
  const view = render(<RollSlot result={result} />);
  return { ...view, result, strategy, analysis: analysis.value };
}

describe('explanations in the roll panel', () => {
  it('a break-even rate opens by keyboard, ends in the shown figure to all digits, links its quotes to the sheet and gives the focus back', async () => {
    const user = userEvent.setup({ delay: null });
    const { analysis } = setUp();
    const shown = analysis.breakEvens.rollRate.bond!;
    const button = await screen.findByRole('button', { name: /explain the break-even roll rate against Par bond to horizon/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Break-even roll rate r\* against the par bond to the horizon/ });
    expect(panel).toHaveFocus();
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(shown));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`r* = r = ${fullText(shown)} (decimal per year, simple, ACT/360)`);
    expect(steps.some((s) => s!.startsWith('residual = G_roll - G_bond'))).toBe(true);
    // The quotes behind the bond's coupon, each a link to its sheet row.
    const links = within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ });
    expect(links.length).toBeGreaterThan(0);
    expect(links.length).toBeLessThanOrEqual(5);
    const n = Number(/^Row (\d+):/.exec(links[0]!.textContent!)![1]);
    await user.click(links[0]!);
    expect(useAppStore.getState().selectedRowId).toBe(useAppStore.getState().workspace.quotes[n - 1]!.id);
    // Under each interpolation method.
    expect(within(panel).getByRole('region', { name: /Under each interpolation method/ })).toHaveTextContent(/\(this curve\)/);
    panel.focus();
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it("riding's break-even rise against the zero opens by keyboard and ends in the shown figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const { analysis } = setUp();
    const shown = analysis.breakEvens.ridingRiseBp.zero!;
    const button = await screen.findByRole('button', { name: /explain the break-even rise against Zero to horizon$/ });
    expect(button).toHaveTextContent(formatBpChange(shown));
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Break-even rise of riding against the zero to the horizon/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(shown));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`s* = s = ${fullText(shown)} (bp, a parallel rise of the horizon curve's zero rates (cont, ${analysis.curveDayCount}))`);
    expect(steps.some((s) => s!.startsWith('residual = G_riding - G_zero'))).toBe(true);
    expect(steps.some((s) => s!.startsWith('G_zero = 1 / DF(horizon)'))).toBe(true);
  });

  it('a value after a leg opens by keyboard beside the legs table with its exact decimal text', async () => {
    const user = userEvent.setup({ delay: null });
    const { analysis } = setUp();
    const shown = analysis.rollValues[1]!;
    const button = await screen.findByRole('button', { name: /explain the value after leg 2$/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Value after leg 2 under/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(shown.toFixed());
    expect(panel.closest('.roll-explain-host')!.querySelector('table.roll-legs')).not.toBeNull();
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`V2 = V1 x g2, decimal, 40 digits = ${shown.toFixed()} (${analysis.moneyUnit} after leg 2)`);
  });

  it("the chosen view's rate of a leg opens by keyboard and ends in the shown figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const { analysis } = setUp();
    const view = analysis.views[analysis.chosen]!;
    const shown = view.legRates[2]!;
    const button = await screen.findByRole('button', { name: new RegExp(`explain the rate of leg 3 under ${view.label}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Rate of leg 3 under ${view.label}`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(shown));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toMatch(new RegExp(`^r3 = .* = ${fullText(shown).replace('.', '\\.')} \\(decimal per year, simple, `));
  });

  it('a money value opens with its exact decimal text, and Copy as text writes the core explanation', async () => {
    const user = userEvent.setup({ delay: null });
    const written: string[] = [];
    Object.defineProperty(navigator, 'clipboard', { value: { writeText: async (t: string) => void written.push(t) }, configurable: true });
    const { analysis, result, strategy } = setUp();
    const view = analysis.views[analysis.chosen]!;
    const riding = view.strategies.find((s) => s.id === 'riding')!;
    const label = analysis.strategies.find((s) => s.id === 'riding')!.phrase;
    await user.click(await screen.findByRole('button', { name: new RegExp(`explain the money at the horizon of ${label} under ${view.label}$`) }));
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Money at the horizon of ${label} under ${view.label}`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(riding.terminal.toFixed());
    expect(panel.querySelector('.explain-value .tag')!.textContent).toBe(`${analysis.moneyUnit} at the horizon, unrounded`);
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toContain(`= ${riding.terminal.toFixed()} (${analysis.moneyUnit} at the horizon)`);
    await user.click(within(panel).getByRole('button', { name: 'Copy as text' }));
    await waitFor(() => expect(within(panel).getByRole('status')).toHaveTextContent('Copied'));
    const model = explainKeyCell(result, useAppStore.getState().workspace.display, { roll: { figure: { kind: 'terminal', view: view.id, strategy: 'riding' }, strategy, scenarios: [] } });
    if (!model.ok) throw new Error('model');
    expect(written).toEqual([model.value.text]);
    expect(written[0]).toContain(`Value: ${riding.terminal.toFixed()}`);
    expect(written[0]).toContain('not investment advice');
  });

  it('a leg forward opens beside the legs table, and the open panel has no axe-core violations', async () => {
    const user = userEvent.setup({ delay: null });
    const { analysis, container } = setUp();
    const leg = analysis.legs[1]!;
    await user.click(await screen.findByRole('button', { name: /explain the today's forward of leg 2$/ }));
    const panel = await screen.findByRole('complementary', { name: /Today's forward of roll leg 2/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(leg.forward));
    expect(panel.closest('.roll-explain-host')!.querySelector('table.roll-legs')).not.toBeNull();
    const a11y = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(a11y.violations.map((v) => `${v.id}: ${v.nodes.length} nodes, e.g. ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });

  it('a break-even curve rise, a part of the riding split and a figure against rolling open by keyboard, each ending in the shown figure to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    const { analysis } = setUp();
    const view = analysis.views[analysis.chosen]!;
    const open = async (button: RegExp, panelName: RegExp, host: string) => {
      const b = await screen.findByRole('button', { name: button });
      b.focus();
      await user.keyboard('{Enter}');
      const panel = await screen.findByRole('complementary', { name: panelName });
      expect(panel.closest('.roll-explain-host, .roll-breakevens')!.querySelector(host)).not.toBeNull();
      const value = panel.querySelector('[data-field="value"]')!.textContent;
      const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
      panel.focus();
      await user.keyboard('{Escape}');
      expect(b).toHaveFocus();
      return { value, steps };
    };
    // The break-even curve: the first point with a rise.
    const point = analysis.breakEvens.curve.find((p) => p.riseBp !== null)!;
    const c = await open(new RegExp(`explain the break-even rise of ${point.tenor}$`), new RegExp(`Break-even rise of the ${point.tenor} yield`), 'table');
    expect(c.value).toBe(fullText(point.riseBp!));
    expect(c.steps.at(-1)).toMatch(/^d\* = d x 10000 = .* \(bp of the yield, /);
    // Its yield today: the par coupon's steps, then the yield at 100, the figure to all digits.
    const y = await open(new RegExp(`explain the yield today of ${point.tenor}$`), new RegExp(`Yield today of the ${point.tenor} bond`), 'table');
    expect(y.value).toBe(fullText(point.yield));
    expect(y.steps.at(-1)).toMatch(new RegExp(`^y0 = the yield at which .* = ${fullText(point.yield).replace('.', '\\.')} \\(decimal per year, `));
    // The riding split's carry, in money with its currency.
    const carry = await open(/explain the riding split's carry$/, /Riding the .* bond: carry under/, 'table.roll-split');
    expect(carry.value).toBe(view.riding.carry.toFixed());
    expect(carry.steps.at(-1)).toBe(`carry = A x (C + P_y) / 100 - A, decimal = ${view.riding.carry.toFixed()} (${analysis.moneyUnit} over the horizon)`);
    // The par bond against rolling under the chosen view, money and bp a year.
    const bond = view.strategies.find((s) => s.id === 'bond')!;
    const phrase = analysis.strategies.find((s) => s.id === 'bond')!.phrase;
    const vs = await open(new RegExp(`explain the ${phrase} against rolling under ${view.label}$`), new RegExp(`against rolling under ${view.label}$`, 'i'), 'table.roll-results');
    expect(vs.value).toBe(bond.vsRoll.toFixed());
    const bp = await open(new RegExp(`explain the ${phrase} against rolling under ${view.label}, bp a year$`), new RegExp(`against rolling under ${view.label}, bp a year`, 'i'), 'table.roll-results');
    expect(bp.value).toBe(fullText(bond.vsRollBp));
    expect(bp.steps.at(-1)).toBe(`vs roll = (return_bond - return_roll) x 10000 = ${fullText(bond.vsRollBp)} (bp a year (ann, ACT/365F))`);
  });
});
