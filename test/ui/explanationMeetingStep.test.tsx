// @vitest-environment jsdom
// A meeting's implied step in the Overnight curve section opens the explanation panel (issue 19):
// chosen by keyboard, the panel's value and last step are the table's figure to all digits
// (meetingStepTable, the table's own source; test/core/curve/explainMeetingStep.test.ts holds the
// parts to the untraced table bit for bit and recomputes the steps), both one-day forwards' steps
// are listed, a quote link brings its sheet row forward (the store's showRow), Escape gives the
// focus back. SOFR's effective dates 2022-03-17, 2022-11-03, 2022-12-15, 2023-07-27 (the SOFR
// record, MARKET-CONVENTIONS.md section h); the quotes are invented (test/helpers/markets.ts).
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { formatBpChange, fullText, meetingStepTable, workbenchFromEngine } from '../../src/core/index.ts';
import { OvernightTab } from '../../src/features/overnight/OvernightTab.tsx';
import { deriveBuild, useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { useAppStore } from '../../src/state/store.ts';
import { INVENTED_2022_OVERNIGHT } from '../helpers/markets.ts';

beforeAll(async () => {
  await loadOvernightKit();
  await import('../../src/features/tables/lazyTables.ts');
});

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

function Live() {
  return <OvernightTab result={useCurveBuild()} />;
}

beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  let n = 0;
  const doc = workbenchFromEngine(INVENTED_2022_OVERNIGHT, () => `r${n++}`);
  if (!doc.ok) throw new Error(doc.errors[0]!.message);
  act(() => useAppStore.getState().replaceWorkspace(doc.value, 'test market'));
  act(() => useAppStore.getState().setMeetingSteps({ on: true, effectiveDates: ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'] }));
});

describe('explanations in the meeting-step table', () => {
  it('a step opens its explanation by keyboard, ending in the shown figure to all digits; a quote link shows its row', async () => {
    const user = userEvent.setup({ delay: null });
    render(<Live />);
    const row = meetingStepTable(deriveBuild(useAppStore.getState().workspace).build).find((r) => r.date === '2022-11-03')!;
    const table = screen.getByRole('table', { name: 'Implied step at each meeting' });
    const button = within(table).getByRole('button', { name: /explain the step on 2022-11-03/ });
    expect(button.textContent).toBe(formatBpChange(row.stepBp));
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Implied step on 2022-11-03/ });
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(row.stepBp));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`step = (after rate - before rate) x 10,000 bp = ${fullText(row.stepBp)} (bp (1 bp = 0.0001 of the rate))`);
    expect(steps.some((s) => s!.startsWith('before: rate = growth / tau') && s!.includes(fullText(row.before)))).toBe(true);
    expect(steps.some((s) => s!.startsWith('after: rate = growth / tau') && s!.includes(fullText(row.after)))).toBe(true);
    const links = within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ });
    expect(links.length).toBe(5);
    const n = Number(/^Row (\d+):/.exec(links[0]!.textContent!)![1]);
    await user.click(links[0]!);
    expect(useAppStore.getState().selectedRowId).toBe(useAppStore.getState().workspace.quotes[n - 1]!.id);
    panel.focus();
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });
  it('the level before and the level after open their own one-day forward, ending in the shown level to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    render(<Live />);
    const row = meetingStepTable(deriveBuild(useAppStore.getState().workspace).build).find((r) => r.date === '2022-12-15')!;
    const table = screen.getByRole('table', { name: 'Implied step at each meeting' });
    for (const level of ['before', 'after'] as const) {
      const button = within(table).getByRole('button', { name: new RegExp(`explain the level ${level} the step on 2022-12-15$`) });
      await user.click(button);
      const panel = await screen.findByRole('complementary', { name: new RegExp(`Overnight level ${level} the step on 2022-12-15`) });
      expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(row[level]));
      const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
      expect(steps.at(-1)).toMatch(new RegExp(`^rate = growth / tau = ${fullText(row[level]).replace('.', '\\.')} `));
      expect(within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ }).length).toBe(5);
      await user.click(button); // a second press closes it
      expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    }
  });
});
