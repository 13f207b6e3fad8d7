// @vitest-environment jsdom
// A figure of the quote check opens the explanation panel (issue 19): chosen by keyboard, the
// panel's value and last step are the table's own figure to all digits (the build's repricing row;
// test/core/curve/explainQuoteCheck.test.ts recomputes each kind's steps from the shown inputs and
// holds them to it), its quote is the one row it moves with, and Escape gives the focus back.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fullText } from '../../src/core/index.ts';
import { QuoteCheckTable } from '../../src/features/tables/QuoteCheckTable.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

describe('explanations in the quote check', () => {
  it("a swap's model rate opens its explanation, ending in the table's figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const result = deriveBuild(useAppStore.getState().workspace);
    render(<QuoteCheckTable result={result} />);
    const rep = result.build.repricing.find((r) => r.kind === 'swap')!;
    const row = result.conversion.rowOfQuote[rep.index]! + 1;
    const table = screen.getByRole('table', { name: 'Quote check' });
    const button = within(table).getByRole('button', { name: new RegExp(`explain the model rate of row ${row}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Model rate of row ${row}: swap`) });
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(rep.model));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toMatch(new RegExp(`^model = num / A = ${fullText(rep.model).replace('.', '\\.')} `));
    expect(steps.some((s) => s!.startsWith('A = tau1 x DF(T1)'))).toBe(true);
    const links = within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ });
    expect(links.map((l) => l.textContent)).toEqual([`Row ${row}: swap ${rep.maturity}`]);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it("a bond's repricing error opens its explanation, ending in the difference per 100 to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const result = deriveBuild(useAppStore.getState().workspace);
    render(<QuoteCheckTable result={result} />);
    const rep = result.build.repricing.find((r) => r.kind === 'bond')!;
    const row = result.conversion.rowOfQuote[rep.index]! + 1;
    const button = screen.getByRole('button', { name: new RegExp(`explain the repricing error of row ${row}$`) });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: new RegExp(`Repricing error of row ${row}: bond`) });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(rep.repricingError));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.some((s) => s!.startsWith(`model = dirty - accrued = ${fullText(rep.model)}`))).toBe(true);
    expect(steps.at(-1)).toMatch(/^difference = model - market = /);
  });
});
