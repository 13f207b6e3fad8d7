// @vitest-environment jsdom
// A figure of the Spread between curves table opens the explanation panel (issue 19): chosen by
// keyboard, the panel's value and last step are the table's figure to all digits (curveSpreadAt,
// the table's own source; test/core/curve/explainSpread.test.ts holds each part to the untraced
// zeroOn / forwardOn bit for bit and recomputes it from its shown inputs), both curves' steps and
// reads are listed, a node of the named curve is named by its curve, the quotes of both curves are
// listed (a default-curve quote as a link to its sheet row) and agree with bump-and-rebuild, the spread under each method is the
// spread of the curves built under it, and Escape gives the focus back. The fixture is the command
// line's invented two-curve document (test/fixtures/namedCurves/SOURCE.md).
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { buildWorkbenchCurves, curveSpreadAt, fullText, marketDate, parseTenor, readNamedCurves, buildCurve } from '../../src/core/index.ts';
import { SpreadView } from '../../src/features/namedCurves/SpreadView.tsx';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { openWorkspaceFile, TWO_CURVES } from '../helpers/engineWorkspace.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const FIXTURE = TWO_CURVES;
const initial = useAppStore.getInitialState();
const open = openWorkspaceFile;
beforeEach(() => useAppStore.setState(initial, true));

describe('explanations in the spread table', () => {
  it('a spread opens its explanation, ending in the shown figure to all digits, with both curves’ inputs', async () => {
    const user = userEvent.setup({ delay: null });
    const ws = open();
    const result = deriveBuild(ws);
    const named = buildWorkbenchCurves(ws, result.build.curve);
    render(<SpreadView result={result} named={named} />);
    const d = ws.display;
    const a = named.curves.find((c) => c.name === 'euribor6m')!.build.curve!;
    const b = result.build.curve!;
    const date = marketDate(a.settlement, parseTenor('5Y')!);
    const figure = curveSpreadAt(a, b, 'zero', [date], d.compounding, d.dayCount, parseTenor(d.forwardTenor)!)[0]!.bp;
    const table = screen.getByRole('table', { name: 'Spread of euribor6m over default, zero rates' });
    const button = within(table).getByRole('button', { name: /explain the spread at 5Y$/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Spread of euribor6m over default, zero rate at 5Y/ });
    expect(panel).toHaveFocus();
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`spread = (euribor6m rate - default rate) x 10,000 bp = ${fullText(figure)} (bp (1 bp = 0.0001 of the rate))`);
    expect(steps.some((s) => s!.startsWith('curve euribor6m: lnP = ln DF(date)'))).toBe(true);
    expect(steps.some((s) => s!.startsWith('curve default: lnP = ln DF(date)'))).toBe(true);
    const inputs = within(within(panel).getByRole('region', { name: 'Inputs' })).getAllByRole('listitem').map((li) => li.textContent!);
    expect(inputs.some((s) => s.startsWith('euribor6m DF(date)'))).toBe(true);
    expect(inputs.some((s) => s.startsWith('default DF(date)'))).toBe(true);
    // Nodes say whose quote set them: a euribor6m node by its curve, a default node by its sheet row.
    expect(inputs.some((s) => /euribor6m quote \d/.test(s))).toBe(true);
    expect(inputs.some((s) => /default DF\(date\).*row \d/.test(s))).toBe(true);
    // The quotes of both curves: the default curve's link to their rows; euribor6m's named by curve.
    const quotes = within(panel).getByRole('region', { name: 'Quotes it depends on most' });
    expect(within(quotes).getAllByRole('button', { name: /^Row \d+:/ }).length).toBeGreaterThan(0);
    expect(quotes.textContent).toContain('euribor6m quote');
    // Each listed sensitivity against bump and rebuild: the quote's rate moved by +-0.01 bp in the
    // file, every curve built again, the spread read again (central difference, bp per bp). The
    // government curve over the default curve: neither reads the other, so each rate moves with its
    // own curve's quotes alone; for euribor6m over default, its own quotes and the default curve's,
    // which move both its rates (through its discounting, the projection curve rebuilt on the bumped
    // default curve) and the default rate: listed net, each against bump-and-rebuild of the whole document.
    const spreadAfter = (of: string, curveIndex: number | null, quote: number, h: number): number => {
      const bump = (qs: Record<string, unknown>[]) => qs.map((q, k) => (k === quote ? { ...q, rate: (q.rate as number) + h } : q));
      const engine = curveIndex === null ? { ...FIXTURE, quotes: bump(FIXTURE.quotes as Record<string, unknown>[]) } : { ...FIXTURE, curves: FIXTURE.curves.map((c, i) => (i === curveIndex ? { ...c, quotes: bump(c.quotes as Record<string, unknown>[]) } : c)) };
      const main = buildCurve(engine, { readCurves: readNamedCurves, skipInvalid: true });
      const x = buildWorkbenchCurves({ ...ws, curves: engine.curves }, main.curve).curves.find((c) => c.name === of)!.build.curve!;
      return curveSpreadAt(x, main.curve!, 'zero', [date], d.compounding, d.dayCount, parseTenor(d.forwardTenor)!)[0]!.bp;
    };
    let bumped = 0;
    for (const [of, curveIndex] of [['govt', 1], ['euribor6m', 0]] as const) {
      const model0 = explainKeyCell(result, d, { spread: { of, over: '', measure: 'zero', tenor: '5Y', named, inputs: ws } });
      if (!model0.ok) throw new Error(model0.errors[0]!.message);
      expect(model0.value.quotes.some((q) => q.row !== null), of).toBe(true);
      for (const q of model0.value.quotes) {
        const own = new RegExp(`^${of} quote (\\d+)`).exec(q.kind);
        const index = own ? Number(own[1]) - 1 : q.row!;
        const h = 1e-6;
        const fd = (spreadAfter(of, own ? curveIndex : null, index, h) - spreadAfter(of, own ? curveIndex : null, index, -h)) / (2 * h * 1e4);
        expect(Math.abs(q.bpPerBp - fd), `${of}: ${q.kind} ${q.maturity}`).toBeLessThan(1e-4 * Math.max(1, Math.abs(fd)));
        bumped++;
      }
    }
    expect(bumped).toBeGreaterThan(4);
    // Under each method: every curve built with that method, the spread read as the table reads it.
    const model = explainKeyCell(result, d, { spread: { of: 'euribor6m', over: '', measure: 'zero', tenor: '5Y', named, inputs: ws } });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    expect(model.value.methods.length).toBe(5);
    for (const m of model.value.methods) {
      const engine = { ...FIXTURE, curve: { ...FIXTURE.curve, interpolation: m.method }, curves: FIXTURE.curves.map((c) => ({ ...c, curve: { interpolation: m.method } })) };
      const main = buildCurve(engine, { readCurves: readNamedCurves, skipInvalid: true });
      const again = buildWorkbenchCurves({ ...ws, curves: engine.curves }, main.curve).curves.find((c) => c.name === 'euribor6m')!.build.curve!;
      expect(m.value, m.method).toBe(curveSpreadAt(again, main.curve!, 'zero', [date], d.compounding, d.dayCount, parseTenor(d.forwardTenor)!)[0]!.bp);
      if (m.current) expect(m.value).toBe(figure);
    }
    expect(new Set(model.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });
});

describe('the rates beside the spread', () => {
  it("each curve's zero rate opens its own explanation, the figure shown to all digits, under each method that curve's rate", async () => {
    const user = userEvent.setup({ delay: null });
    const ws = open();
    const result = deriveBuild(ws);
    const named = buildWorkbenchCurves(ws, result.build.curve);
    render(<SpreadView result={result} named={named} />);
    const d = ws.display;
    const a = named.curves.find((c) => c.name === 'euribor6m')!.build.curve!;
    const date = marketDate(a.settlement, parseTenor('5Y')!);
    const point = curveSpreadAt(a, result.build.curve!, 'zero', [date], d.compounding, d.dayCount, parseTenor(d.forwardTenor)!)[0]!;
    const table = screen.getByRole('table', { name: 'Spread of euribor6m over default, zero rates' });
    for (const [name, figure] of [['euribor6m', point.a], ['default', point.b]] as const) {
      const button = within(table).getByRole('button', { name: new RegExp(`explain the ${name} zero rate at 5Y$`) });
      await user.click(button);
      const panel = await screen.findByRole('complementary', { name: new RegExp(`^${name} zero rate at 5Y`) });
      expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
      const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
      expect(steps.at(-1)).toContain(`= ${fullText(figure)}`);
      await user.click(button);
    }
    // Under each method: the rate of euribor6m with every curve built under it (the spread's own builder).
    const model = explainKeyCell(result, d, { spread: { of: 'euribor6m', over: '', measure: 'zero', tenor: '5Y', named, inputs: ws, side: 'of' } });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    const current = model.value.methods.find((m) => m.current)!;
    expect(current.value).toBe(point.a);
    expect(new Set(model.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
  });
});
