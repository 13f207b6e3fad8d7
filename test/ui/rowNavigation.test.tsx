// @vitest-environment jsdom
// What a person sees when they follow a row: the row number opens its repricing and schedule,
// and the "rows left out" count takes them to the first bad row. Demo data are invented.
import { fireEvent, render, screen, within } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { useAppStore } from '../../src/state/store.ts';

vi.setConfig({ testTimeout: 30_000 });

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

const cell = (row: number, column: string) => screen.getByRole('textbox', { name: `Row ${row} ${column}` });

describe('row navigation on the demo workspace', () => {
  it("the row number's button opens Quote check with that row's schedule, whichever section was open", async () => {
    render(<App />);
    fireEvent.click(screen.getByRole('tab', { name: 'Forward strip' }));
    expect(screen.getByRole('tab', { name: 'Quote check' })).toHaveAttribute('aria-selected', 'false');
    fireEvent.click(screen.getByRole('button', { name: 'Row 8: show its repricing and schedule' }));
    expect(screen.getByRole('tab', { name: 'Quote check' })).toHaveAttribute('aria-selected', 'true');
    // Row 8 of the demo is a bond: its schedule is shown, numbered as the sheet numbers it.
    expect(await screen.findByRole('table', { name: 'Schedule of row 8' })).toBeInTheDocument(); // the quote check loads on first use
  });

  it('the "rows left out" count is a button that focuses the first wrong cell of the first row left out', () => {
    render(<App />);
    fireEvent.change(cell(12, 'Maturity'), { target: { value: 'soon' } });
    fireEvent.change(cell(5, 'Rate / yield'), { target: { value: 'abc' } });
    const status = screen.getByText(/quotes in the curve/);
    fireEvent.click(within(status).getByRole('button', { name: /2 rows left out with errors/ }));
    expect(document.activeElement).toBe(cell(5, 'Rate / yield'));
  });
});

describe('the section tabs from the keyboard (WAI-ARIA Authoring Practices, tabs pattern)', () => {
  it('Home and End select and focus the first and the last tab', () => {
    render(<App />);
    const tabs = screen.getAllByRole('tab');
    tabs[1]!.focus();
    fireEvent.keyDown(tabs[1]!, { key: 'End' });
    const last = screen.getAllByRole('tab').at(-1)!;
    expect(last).toHaveAttribute('aria-selected', 'true');
    expect(document.activeElement).toBe(last);
    fireEvent.keyDown(last, { key: 'Home' });
    expect(screen.getAllByRole('tab')[0]).toHaveAttribute('aria-selected', 'true');
    expect(document.activeElement).toBe(screen.getAllByRole('tab')[0]);
  });
});
