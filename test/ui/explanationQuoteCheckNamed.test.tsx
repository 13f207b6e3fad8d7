// @vitest-environment jsdom
// The quote check of a named projection curve explains its term-index swaps: with euribor6m shown
// (the command line's invented two-curve document, test/fixtures/namedCurves/SOURCE.md), a swap's
// model rate opens the panel with the table's figure to all digits and steps reading both curves
// (its forwards off euribor6m, its discount factors off the default curve), never "not explained".
// Oracles: the build's own repricing row (the panel's number must be it), the core's
// explainQuoteCheck held to the two-curve par rate by hand in
// test/core/curve/explainProjectedSwap.test.ts, and each method's value against the document built
// under that method by the core (buildCurve + buildNamedCurves), as the command line builds it.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { buildCurve, buildNamedCurves, fullText, INTERPOLATIONS, readNamedCurves } from '../../src/core/index.ts';
import { QuoteCheckTable } from '../../src/features/tables/QuoteCheckTable.tsx';
import { useCurveBuild, type WorkbenchBuild } from '../../src/hooks/useCurveBuild.ts';
import { useNamedCurves } from '../../src/hooks/useNamedCurves.ts';
import { openWorkspaceFile, TWO_CURVES } from '../helpers/engineWorkspace.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

let shownSeen: WorkbenchBuild | null = null;
function Workbench() {
  const { shown } = useNamedCurves(useCurveBuild());
  shownSeen = shown;
  return <QuoteCheckTable result={shown} />;
}

describe('the quote check of a named projection curve', () => {
  it("a term-index swap's model rate opens its explanation: the table's figure, steps on both curves, each method's value as the core builds it", async () => {
    openWorkspaceFile({ ...TWO_CURVES, view: { shownCurve: 'euribor6m' } });
    const user = userEvent.setup({ delay: null });
    render(<Workbench />);
    const table = await screen.findByRole('table', { name: 'Quote check' });
    await vi.waitFor(() => expect(shownSeen?.curveName).toBe('euribor6m'), { timeout: 20_000 });
    const rep = shownSeen!.build.repricing.find((r) => r.kind === 'swap' && r.maturity === '2029-03-10')!;
    const button = await within(table).findByRole('button', { name: new RegExp(`explain the model rate of row ${rep.index + 1}$`) });
    await user.click(button);
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Model rate of row ${rep.index + 1}: swap 2029-03-10`) });
    expect(panel.textContent).not.toMatch(/not explained/);
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(rep.model));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent!);
    expect(steps.at(-1)).toMatch(new RegExp(`^model = float / A = ${fullText(rep.model).replace('.', '\\.')} `));
    expect(steps.some((s) => s.startsWith('g1 = expm1(ln P_euribor6m(T0) - ln P_euribor6m(T1))'))).toBe(true);
    expect(steps.some((s) => s.startsWith('float = g1 x P_default(T1) + g2 x P_default(T2)'))).toBe(true);
    expect(steps.some((s) => s.startsWith('A = tau1 x P_default(U1) + tau2 x P_default(U2)'))).toBe(true);
    // The default curve's reads name its quotes by curve and position.
    expect(panel.textContent).toMatch(/default quote \d/);
    // Each method: the whole document built under it by the core, the 2Y swap's model rate on euribor6m.
    const methods = within(panel).getByRole('region', { name: /^Under each interpolation method/ }).textContent!;
    for (const method of INTERPOLATIONS) {
      const doc = { ...TWO_CURVES, curve: { ...TWO_CURVES.curve, interpolation: method }, curves: TWO_CURVES.curves.map((c) => ({ ...c, curve: { ...(c.curve as object | undefined), interpolation: method } })) };
      const main = buildCurve(doc, { readCurves: readNamedCurves, skipInvalid: true });
      const six = buildNamedCurves(main.workspace!, main.curve).find((n) => n.name === 'euribor6m')!.build;
      const model = six.repricing.find((r) => r.index === rep.index)!.model;
      expect(methods).toContain(fullText(model));
    }
  });
});
