// @vitest-environment jsdom
// An FRA typed in the sheet (Kind "fra", Maturity the period "4x7", Rate the FRA rate) on the
// euro EURIBOR 3M market conventions shows, in the quote check, its start before and after the
// business-day rule and its index fixing date. Rules (MARKET-CONVENTIONS.md f, QuantLib's FRA
// dates since its PR #1600): spot = valuation + 2 TARGET days, start = spot + 4 months, end =
// start + 3 months, modified following, fixing two TARGET days before the start. The dates are
// worked by hand for the demo's valuation date 2026-12-15 (spot Thursday 2026-12-17; 2027-04-17 a
// Saturday, so the start is Monday 2027-04-19 and the fixing Thursday 2027-04-15). The demo
// workspace and the rate are invented.
import { fireEvent, render, screen, within } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { DEMO_SETTLEMENT } from '../../src/state/demoWorkspace.ts';
import { useAppStore } from '../../src/state/store.ts';

vi.setConfig({ testTimeout: 30_000 });

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

const cell = (row: number, column: string) => screen.getByRole('textbox', { name: `Row ${row} ${column}` });

describe('an FRA typed in the sheet', () => {
  it('4x7 on EURIBOR 3M: the quote check shows the start 2027-04-17 moved to 2027-04-19, the end 2027-07-19 and the fixing 2027-04-15', async () => {
    render(<App />);
    expect(DEMO_SETTLEMENT).toBe('2026-12-15');
    // Row 5 of the demo is a 6M bill: it becomes an FRA (Kind, Maturity, Rate; the price cleared).
    fireEvent.change(cell(5, 'Kind'), { target: { value: 'FRA' } });
    fireEvent.change(cell(5, 'Maturity'), { target: { value: '4×7' } });
    fireEvent.change(cell(5, 'Price'), { target: { value: '' } });
    fireEvent.change(cell(5, 'Rate / yield'), { target: { value: '4.05' } });
    fireEvent.change(screen.getByRole('combobox', { name: /Market conventions/ }), { target: { value: 'eur-euribor-3m' } });
    expect(screen.getByRole('option', { name: 'Euro EURIBOR 3M' })).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Row 5: show its repricing and schedule' }));
    const table = await screen.findByRole('table', { name: 'Schedule of row 5' });
    for (const header of ['Period start, unadjusted', 'Period start, adjusted', 'Accrual end, unadjusted', 'Accrual end, adjusted', 'Payment date', 'Index fixing date', 'Year fraction (ACT/360)']) {
      expect(within(table).getByRole('columnheader', { name: header })).toBeInTheDocument();
    }
    const cells = within(within(table).getAllByRole('row')[1]!).getAllByRole('cell').map((c) => c.textContent);
    expect(cells.slice(0, 6)).toEqual(['2027-04-17', '2027-04-19', '2027-07-19', '2027-07-19', '2027-07-19', '2027-04-15']);
    // 91 days on ACT/360 (2006 ISDA Definitions 4.16(e)).
    expect(cells[6]).toBe('0.25277778');
    expect(table.querySelector('caption')?.textContent).toContain('FRA 4x7 on the 3M index, on the target calendar: spot 2026-12-17 is 2 business days after the valuation date');
    // The row's Maturity cell keeps the text as typed.
    expect(cell(5, 'Maturity')).toHaveValue('4×7');
  });

  it('a period that is not after its start is marked on the row, and the row is kept as typed', async () => {
    render(<App />);
    fireEvent.change(cell(5, 'Kind'), { target: { value: 'fra' } });
    fireEvent.change(cell(5, 'Maturity'), { target: { value: '3x2' } });
    fireEvent.change(cell(5, 'Price'), { target: { value: '' } });
    fireEvent.change(cell(5, 'Rate / yield'), { target: { value: '4.05' } });
    const maturity = cell(5, 'Maturity');
    await vi.waitFor(() => expect(maturity).toHaveAttribute('aria-invalid', 'true'));
    expect(maturity).toHaveValue('3x2');
    expect(cell(5, 'Kind')).toHaveValue('fra');
  });
});
