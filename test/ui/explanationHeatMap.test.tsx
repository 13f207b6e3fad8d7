// @vitest-environment jsdom
// A cell of the forward-sensitivity heat map opens its explanation beside the map (issue 19):
// chosen by keyboard, the panel's value and last step are the cell's figure to all digits
// (sensitivityMapFor, the map's own source; test/core/analytics/explainSensitivity.test.ts holds
// the explanation to the map bit for bit and recomputes every step), the node-partials chain is
// listed, the cell's quote comes first among the quotes as a link to its sheet row, each method's
// figure is the map built with that method, Escape gives the focus back, and axe-core (WCAG 2 A
// and AA) finds nothing serious with the panel open.
import axe from 'axe-core';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fullText, sensitivityMapFor } from '../../src/core/index.ts';
import { SensitivityHeatMap } from '../../src/features/risk/SensitivityHeatMap.tsx';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

describe('explanations in the heat map', () => {
  it('a cell opens its explanation beside the map, ending in the shown figure, with the node partials and its quote first', async () => {
    const user = userEvent.setup({ delay: null });
    const result = deriveBuild(useAppStore.getState().workspace); // the workbench's starting (invented demo) market
    const ws = result.build.workspace!;
    render(<SensitivityHeatMap workspace={ws} rowOfQuote={result.conversion.rowOfQuote} result={result} />);
    const map = sensitivityMapFor(ws, { interpolation: ws.curve.interpolation, tenor: { n: 3, unit: 'M' }, step: { n: 1, unit: 'Y' }, compounding: 'simple' });
    if (!map.ok) throw new Error(map.errors[0]!.message);
    const { rows, columns, values } = map.value.map;
    const i = 2;
    const k = columns.length - 2;
    const figure = values[i * columns.length + k]!;
    const sheetRow = result.conversion.rowOfQuote[columns[k]!.index]! + 1;
    const table = screen.getByRole('table', { name: 'Forward sensitivities' });
    const button = within(table).getByRole('button', { name: new RegExp(`explain the ${rows[i]!.start} forward's sensitivity to row ${sheetRow}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Sensitivity of the forward ${rows[i]!.start} to ${rows[i]!.end} to row ${sheetRow}`) });
    expect(panel).toHaveFocus();
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent!);
    expect(steps.at(-1)).toMatch(new RegExp(`^dF/dq = g\\d+ m\\d+( \\+ g\\d+ m\\d+)* = ${fullText(figure).replace(/[.+-]/g, '\\$&')} \\(bp of forward per bp of quote\\)$`));
    expect(steps.some((s) => /^dE\d+ = d ln DF\(end\) \/ d x\d+ \(ln DF at node \d+, \d{4}-\d\d-\d\d\)/.test(s))).toBe(true);
    expect(steps.some((s) => /^m\d+ = d x\d+ \/ d q: the quote's column of \(dq\/dx\)\^-1/.test(s))).toBe(true);
    // The cell's quote first, a link to its sheet row.
    const quotes = within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ });
    expect(quotes[0]).toHaveAccessibleName(new RegExp(`^Row ${sheetRow}:`));
    // Under each method: the map built with it.
    const model = explainKeyCell(result, useAppStore.getState().workspace.display, { sensitivity: { workspace: ws, interpolation: ws.curve.interpolation, tenor: '3M', step: '1Y', start: rows[i]!.start, quote: columns[k]!.index } });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    expect(model.value.methods.length).toBe(5); // every method, so the loop below checks each
    for (const m of model.value.methods) {
      const again = sensitivityMapFor(ws, { interpolation: m.method, tenor: { n: 3, unit: 'M' }, step: { n: 1, unit: 'Y' }, compounding: 'simple' });
      if (!again.ok) throw new Error(m.method);
      const a = again.value.map;
      expect(m.value, m.method).toBe(a.values[a.rows.findIndex((r) => r.start === rows[i]!.start) * a.columns.length + a.columns.findIndex((c) => c.index === columns[k]!.index)]);
    }
    expect(new Set(model.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
    const found = await axe.run(document.body, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(found.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.impact}): ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });
  it("a forward's rate opens its explanation: forwardOn on the map's curve, the map's figure to all digits, its row's largest sensitivities as quotes", async () => {
    const user = userEvent.setup({ delay: null });
    const result = deriveBuild(useAppStore.getState().workspace);
    const ws = result.build.workspace!;
    render(<SensitivityHeatMap workspace={ws} rowOfQuote={result.conversion.rowOfQuote} result={result} />);
    const map = sensitivityMapFor(ws, { interpolation: ws.curve.interpolation, tenor: { n: 3, unit: 'M' }, step: { n: 1, unit: 'Y' }, compounding: 'simple' });
    if (!map.ok) throw new Error(map.errors[0]!.message);
    const { rows, columns, values } = map.value.map;
    const i = 3;
    const row = rows[i]!;
    await user.click(within(screen.getByRole('table', { name: 'Forward sensitivities' })).getByRole('button', { name: new RegExp(`explain the forward ${row.start} to ${row.end}$`) }));
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Forward ${row.start} to ${row.end} of the sensitivity map`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(row.rate));
    // Recomputed from the explanation's own inputs: the simple forward (DF(start)/DF(end) - 1) / tau (its definition, common practice), from the ln DFs the panel lists (expm1 keeps the digits a ratio near 1 loses).
    const e = explainKeyCell(result, useAppStore.getState().workspace.display, { sensitivity: { workspace: ws, interpolation: ws.curve.interpolation, tenor: '3M', step: '1Y', start: row.start, quote: -1 } });
    if (!e.ok) throw new Error(e.errors[0]!.message);
    const x = e.value.explanation;
    const ln = (name: string) => x.reads.find((r) => r.name === name)!.lnDiscount;
    const tau = x.yearFractions.at(-1)!.value;
    expect(tau).toBe(row.tau);
    expect(Math.abs(Math.expm1(ln('DF(start)') - ln('DF(end)')) / tau - row.rate) / row.rate).toBeLessThan(1e-15);
    // The quotes: the row's five largest sensitivities, largest first.
    const largest = columns.map((c, k) => ({ c, v: values[i * columns.length + k]! })).sort((a, b) => Math.abs(b.v) - Math.abs(a.v)).slice(0, 5);
    expect(e.value.quotes.map((q) => q.bpPerBp)).toEqual(largest.map((l) => l.v));
    expect(e.value.methods.length).toBe(5); // every method, so the loop below checks each
    for (const m of e.value.methods) {
      const again = sensitivityMapFor(ws, { interpolation: m.method, tenor: { n: 3, unit: 'M' }, step: { n: 1, unit: 'Y' }, compounding: 'simple' });
      if (!again.ok) throw new Error(m.method);
      expect(m.value, m.method).toBe(again.value.map.rows.find((r) => r.start === row.start)!.rate);
    }
  });
});
