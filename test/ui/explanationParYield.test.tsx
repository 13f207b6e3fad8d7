// @vitest-environment jsdom
// Government par yields explain themselves (issue 19): in the quote check, chosen by keyboard, a
// bill-basis yield's model value and a par bond's repricing error open the panel, whose value and
// last step are the table's figure to all digits (the build's repricing row;
// test/core/curve/explainQuoteCheck.test.ts recomputes each regime from the shown inputs by the
// Federal Reserve GSW 2006 par-yield definition and the SIA / Treasury bill bond-equivalent yield);
// and a par yield's residual in the smooth fit opens the same steps on the fitted curve. Yields invented.
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fitCurve, fullText, workbenchFromEngine } from '../../src/core/index.ts';
import { FitPanel } from '../../src/features/fit/FitPanel.tsx';
import { QuoteCheckTable } from '../../src/features/tables/QuoteCheckTable.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { workspaceDoc } from '../helpers/markets.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const PAR = [
  { kind: 'par-yield', tenor: '3M', yield: 0.0392 },
  { kind: 'par-yield', tenor: '9M', yield: 0.0385 },
  { kind: 'par-yield', tenor: '2Y', yield: 0.0361 },
  { kind: 'par-yield', tenor: '5Y', yield: 0.0372 },
  { kind: 'par-yield', tenor: '10Y', yield: 0.0412 },
];

beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  let n = 0;
  const doc = workbenchFromEngine(workspaceDoc(PAR, { settlement: '2026-12-02', interpolation: 'log-linear-discount' }), () => `p${n++}`);
  if (!doc.ok) throw new Error(doc.errors[0]!.message);
  act(() => useAppStore.getState().replaceWorkspace(doc.value, 'par yields'));
});

const stepsOf = (panel: HTMLElement) => within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent!);

describe('par yields explained', () => {
  it("in the quote check: a bill-basis yield's model value and a par bond's repricing error, to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const result = deriveBuild(useAppStore.getState().workspace);
    render(<QuoteCheckTable result={result} />);
    const reps = result.build.repricing;
    const bill = reps.find((r) => r.maturity === '2027-09-02')!;
    const row = result.conversion.rowOfQuote[bill.index]! + 1;
    const button = screen.getByRole('button', { name: new RegExp(`explain the model yield of row ${row}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Model yield of row ${row}: par-yield`) });
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(bill.model));
    const steps = stepsOf(panel);
    expect(steps.at(-1)).toMatch(new RegExp(`^model = 2 g / \\(a \\+ sqrt\\(a\\^2 \\+ \\(2a - 1\\) g\\)\\) = ${fullText(bill.model).replace('.', '\\.')} `));
    expect(steps.some((s) => s.startsWith('T = days in the year after settlement'))).toBe(true);
    await user.keyboard('{Escape}');
    expect(button).toHaveFocus();

    const par = reps.find((r) => r.maturity === '2031-12-02')!;
    const parRow = result.conversion.rowOfQuote[par.index]! + 1;
    const err = screen.getByRole('button', { name: new RegExp(`explain the repricing error of row ${parRow}$`) });
    err.focus();
    await user.keyboard('{Enter}');
    const errPanel = await screen.findByRole('complementary', { name: new RegExp(`Repricing error of row ${parRow}: par-yield`) });
    expect(errPanel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(par.repricingError * 1e4));
    const errSteps = stepsOf(errPanel);
    expect(errSteps.some((s) => s.startsWith(`model = num / den = ${fullText(par.model)}`))).toBe(true);
    expect(errSteps.some((s) => s.startsWith('sum = DF(T1) + DF(T2) + ... + DF(T10)'))).toBe(true);
    expect(errSteps.at(-1)).toMatch(/^difference = \(model - market\) x 10,000 = /);
  });

  it("in the smooth fit: a par yield's residual opens its explanation, ending in the table's figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const display = useAppStore.getState().workspace.display;
    const result = deriveBuild(useAppStore.getState().workspace);
    const ws = result.build.workspace!;
    render(<FitPanel workspace={ws} model="nelson-siegel" onModelChange={() => {}} rowOfQuote={result.conversion.rowOfQuote} explainFrom={{ result, display }} />);
    const fit = fitCurve(ws, { model: 'nelson-siegel', errors: 'yield', exclude: [], weights: {} });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const r = fit.value.residuals.find((x) => x.maturity === '2036-12-02')!;
    const row = result.conversion.rowOfQuote[r.index]! + 1;
    const button = within(screen.getByRole('table', { name: 'Fit residuals' })).getByRole('button', { name: new RegExp(`explain the fit residual of row ${row}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: `Fit residual of row ${row}` });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(r.residualBp));
    const steps = stepsOf(panel);
    expect(steps.some((s) => s.startsWith('den = sum / 2 - a'))).toBe(true);
    expect(steps.at(-1)).toBe(`residual = (model yield - market yield) x 10,000 = ${fullText(r.residualBp)} (bp)`);
  });
});
