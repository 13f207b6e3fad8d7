// @vitest-environment jsdom
// The bond's effective duration and each key-rate duration open their explanations (issue 19):
// chosen by keyboard, the panel's value and last step are the table's figure to all digits
// (analyzeBond, the table's own call; test/core/analytics/explainBondDurations.test.ts holds the
// traced durations to the untraced ones bit for bit and recomputes every step), the bumped prices
// and the bump size are listed, a key-rate panel opens beside the key-rate table and lists each
// flow's tent weight, the quotes behind it link to their rows, Escape gives the focus back, and
// axe-core (WCAG 2 A and AA) finds nothing serious on the open panel.
import axe from 'axe-core';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { analyzeBond, fullText } from '../../src/core/index.ts';
import { BondAnalyticsPanel } from '../../src/features/risk/BondAnalyticsPanel.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

function renderPanel() {
  const result = deriveBuild(useAppStore.getState().workspace); // the workbench's starting (invented demo) market
  const curve = result.build.curve!;
  const input = { maturity: '2034-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' as const };
  render(<BondAnalyticsPanel curve={curve} build={result.build} rowOfQuote={result.conversion.rowOfQuote} result={result} initial={{ maturity: input.maturity, coupon: '4' }} />);
  const a = analyzeBond(curve, input);
  if (!a.ok) throw new Error(a.errors[0]!.message);
  return a.value;
}

const stepsOf = (panel: HTMLElement) => within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent!);

describe('explanations of the bond’s shift durations', () => {
  it('the effective duration opens beside the table with the bumped prices, ending in the shown figure', async () => {
    const user = userEvent.setup({ delay: null });
    const a = renderPanel();
    const table = screen.getByRole('table', { name: 'Bond analytics' });
    const button = within(table).getByRole('button', { name: /explain the effective duration$/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Bond .* to 2034-05-15: effective duration on the curve/ });
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(a.effectiveDuration));
    const steps = stepsOf(panel);
    expect(steps.at(-1)).toBe(`effective = (4 D(h/2) - D(h)) / 3 = ${fullText(a.effectiveDuration)} (years)`);
    expect(steps.some((s) => s.startsWith('h = 1 bp of the zero = 0.0001 = 0.0001'))).toBe(true);
    expect(steps.some((s) => s.startsWith('P+(h) = sum_i pv_i exp(-h t_i) = '))).toBe(true);
    expect(steps.some((s) => s.startsWith('P-(h/2) = sum_i pv_i exp(+h/2 t_i) = '))).toBe(true);
    expect(within(panel).getByRole('region', { name: 'Definition' }).textContent).toContain('Compounding continuous');
    const quotes = within(panel).getByRole('region', { name: 'Quotes it depends on most' });
    expect(within(quotes).getAllByRole('button', { name: /^Row \d+:/ }).length).toBeGreaterThan(0);
    expect(within(panel).getByRole('region', { name: /Under each interpolation method/ })).toHaveTextContent('(this curve)');
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it('a key-rate duration opens beside the key-rate table with each flow’s tent weight; no axe-core violations', async () => {
    const user = userEvent.setup({ delay: null });
    const a = renderPanel();
    const krd = screen.getByRole('table', { name: 'Key-rate durations' });
    const k = a.keyRateDurations.findIndex((x) => x.tenor === '7Y');
    await user.click(within(krd).getByRole('button', { name: /explain the 7Y key-rate duration$/ }));
    const panel = await screen.findByRole('complementary', { name: /7Y key-rate duration on the curve/ });
    // Beside the key-rate table: the panel follows it.
    expect(krd.compareDocumentPosition(panel) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(a.keyRateDurations[k]!.duration));
    const steps = stepsOf(panel);
    expect(steps.at(-1)).toBe(`KRD 7Y = (4 D(h/2) - D(h)) / 3 = ${fullText(a.keyRateDurations[k]!.duration)} (years)`);
    expect(steps.filter((s) => /^w\d+ = tent of 7Y at t\d+/.test(s))).toHaveLength(a.flows.length);
    const inputs = within(within(panel).getByRole('region', { name: 'Inputs' })).getAllByRole('listitem').map((li) => li.textContent!);
    expect(inputs.filter((s) => /^T_(5Y|7Y|10Y) = /.test(s))).toHaveLength(3);
    const result = await axe.run(document.body, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.impact}): ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
});
