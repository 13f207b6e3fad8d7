// @vitest-environment jsdom
// A figure of the Bond on the curve table opens its explanation beside the table (issue 19): chosen
// by keyboard, the panel's value and last step are the table's figure to all digits (analyzeBond,
// the table's own call; test/core/analytics/explainBond.test.ts holds the traced figures to the
// untraced ones bit for bit and recomputes every step), each cash flow's DF read is listed, the
// quotes behind it link to their rows, Copy as text writes the core's text, Escape gives the focus
// back, and axe-core (WCAG 2 A and AA) finds nothing on the open panel.
import axe from 'axe-core';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { analyzeBond, fullText, quoteDv01s } from '../../src/core/index.ts';
import { BondAnalyticsPanel } from '../../src/features/risk/BondAnalyticsPanel.tsx';
import { buildUnder, explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

// The explanation panel's code loads on first use; loaded here first, so a loaded machine's module
// transform does not count against the wait for the panel to appear.
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

function renderPanel() {
  const doc = useAppStore.getState().workspace; // the workbench's starting (invented demo) market
  const result = deriveBuild(doc);
  const curve = result.build.curve!;
  const input = { maturity: '2034-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' as const, cleanPrice: 99.5 };
  render(
    <BondAnalyticsPanel
      curve={curve}
      build={result.build}
      rowOfQuote={result.conversion.rowOfQuote}
      result={result}
      initial={{ maturity: input.maturity, coupon: '4', quoteKind: 'price', quote: '99.5' }}
    />,
  );
  const a = analyzeBond(curve, input);
  if (!a.ok) throw new Error(a.errors[0]!.message);
  return { result, doc, input, a: a.value };
}

describe('explanations in the Bond on the curve table', () => {
  it('the model dirty price opens beside the table, ending in the shown figure to all digits, with its DF reads and quotes', async () => {
    const user = userEvent.setup({ delay: null });
    const { a } = renderPanel();
    const table = screen.getByRole('table', { name: 'Bond analytics' });
    const button = within(within(table).getByRole('row', { name: /^Dirty price/ })).getAllByRole('button')[0]!;
    expect(button).toHaveAccessibleName(/explain the dirty price$/);
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Bond .* to 2034-05-15: dirty price on the curve/ });
    expect(panel).toHaveFocus();
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(a.modelDirtyPrice));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toMatch(new RegExp(`^dirty = pv1 \\+ pv2 \\+ \\.\\.\\. \\+ pv${a.flows.length} = ${fullText(a.modelDirtyPrice).replace('.', '\\.')} \\(per 100 face\\)$`));
    const inputs = within(within(panel).getByRole('region', { name: 'Inputs' })).getAllByRole('listitem').map((li) => li.textContent!);
    expect(inputs.filter((l) => /^DF\(c\d+\) on /.test(l))).toHaveLength(a.flows.length);
    expect(inputs.some((l) => /^c1: given .* \(rule: unadjusted/.test(l))).toBe(true);
    // The quotes it depends on most, each a link to its sheet row; the number under each method.
    const quotes = within(panel).getByRole('region', { name: 'Quotes it depends on most' });
    expect(within(quotes).getAllByRole('button', { name: /^Row \d+:/ }).length).toBeGreaterThan(0);
    expect(within(panel).getByRole('region', { name: /Under each interpolation method/ })).toHaveTextContent('(this curve)');
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it('the market z-spread and the model DV01 end in their shown figures; Copy as text writes the core\'s text', async () => {
    const user = userEvent.setup({ delay: null });
    const written: string[] = [];
    Object.defineProperty(navigator, 'clipboard', { value: { writeText: async (t: string) => void written.push(t) }, configurable: true });
    const { a, result, doc, input } = renderPanel();
    const table = screen.getByRole('table', { name: 'Bond analytics' });
    await user.click(within(table).getByRole('button', { name: /explain the market z-spread/ }));
    let panel = await screen.findByRole('complementary', { name: /z-spread at the market price/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(a.market!.zSpread * 1e4));
    await user.click(within(table).getByRole('button', { name: /explain the DV01$/ }));
    panel = await screen.findByRole('complementary', { name: /DV01 on the curve/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(a.dv01));
    await user.click(within(panel).getByRole('button', { name: 'Copy as text' }));
    await waitFor(() => expect(within(panel).getByRole('status')).toHaveTextContent('Copied'));
    const model = explainKeyCell(result, doc.display, { bond: { input, figure: 'dv01', side: 'model' } });
    if (!model.ok) throw new Error('model');
    expect(written).toEqual([model.value.text]);
    expect(written[0]).toContain(`DV01 = -(dP/dy) x 0.0001 = ${fullText(a.dv01)} (per 100 face per bp of yield)`);
  });

  it('the open panel has no axe-core violations', async () => {
    const user = userEvent.setup({ delay: null });
    renderPanel();
    await user.click(within(screen.getByRole('table', { name: 'Bond analytics' })).getByRole('button', { name: /explain the yield to maturity$/ }));
    await screen.findByRole('complementary', { name: /yield to maturity on the curve/ });
    const result = await axe.run(document.body, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.impact}): ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
  it('a row of the DV01 to each quote opens below that table, ending in quoteDv01s\' figure to all digits, each method rebuilding the workspace', async () => {
    const user = userEvent.setup({ delay: null });
    const { result, doc, a } = renderPanel();
    const dv = quoteDv01s(result.build.settings!, result.build.instruments, a.flows);
    if (!dv.ok) throw new Error(dv.errors[0]!.message);
    const q = dv.value.reduce((m, x) => (Math.abs(x.dv01) > Math.abs(m.dv01) ? x : m));
    const row = result.conversion.rowOfQuote[q.index]! + 1;
    const button = within(screen.getByRole('table', { name: 'DV01 to each quote' })).getByRole('button', { name: new RegExp(`explain the DV01 to row ${row}$`) });
    await user.click(button);
    const panel = await screen.findByRole('complementary', { name: new RegExp(`DV01 to row ${row} \\(`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(q.dv01));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`DV01 = (P- - P+) / 2 = ${fullText(q.dv01)} (per 100 face per bp)`);
    // Under each method: the workspace rebuilt with it, the table's function on that build.
    const e = explainKeyCell(result, doc.display, { bond: { input: { maturity: '2034-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 99.5 }, figure: 'quoteDv01', side: 'model', key: q.index } });
    if (!e.ok) throw new Error(e.errors[0]!.message);
    for (const m of e.value.methods) {
      const b = buildUnder(result, m.method);
      const again = quoteDv01s(b.settings!, b.instruments, a.flows);
      if (!again.ok) throw new Error(m.method);
      expect(m.value, m.method).toBe(again.value.find((x) => x.index === q.index)!.dv01);
    }
    expect(new Set(e.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
  });
});
