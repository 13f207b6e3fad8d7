// @vitest-environment jsdom
// A future typed in the sheet (Kind "future", Maturity the month and contract, Price the price)
// shows, in the quote check, each day of its month with the fixing date it carries and ACT/360
// year fractions. The demo workspace and the price are invented; the carrying rule is CME's
// One-Month SOFR futures specification (a non-business day carries the preceding business day's rate).
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

describe('a one-month future typed in the sheet', () => {
  it("the quote check lists its days with the fixing each carries (Saturday 2027-05-01 carries Friday 2027-04-30's)", async () => {
    render(<App />);
    expect(DEMO_SETTLEMENT < '2027-04-30').toBe(true);
    fireEvent.change(cell(12, 'Kind'), { target: { value: 'future' } });
    fireEvent.change(cell(12, 'Maturity'), { target: { value: '2027-05 1M' } });
    fireEvent.change(cell(12, 'Rate / yield'), { target: { value: '' } });
    fireEvent.change(cell(12, 'Price'), { target: { value: '96.2' } });
    // Row 12 of the demo is a bond: its coupon and frequency cells are cleared (a future takes neither).
    for (const column of ['Coupon', 'Freq', 'Day count']) fireEvent.change(cell(12, column), { target: { value: '' } });
    fireEvent.click(screen.getByRole('button', { name: 'Row 12: show its repricing and schedule' }));
    const table = await screen.findByRole('table', { name: 'Schedule of row 12' });
    expect(within(table).getByRole('columnheader', { name: 'Rate of (fixing date)' })).toBeInTheDocument();
    expect(within(table).getByRole('columnheader', { name: 'Year fraction (ACT/360)' })).toBeInTheDocument();
    const first = within(table).getAllByRole('row')[1]!;
    expect(within(first).getByText('2027-05-01')).toBeInTheDocument();
    expect(within(first).getByText('2027-04-30')).toBeInTheDocument();
  });
});

describe('the futures convexity setting', () => {
  it('Hull-White with a volatility typed in % fills the row\'s adjustment, which the quote check names with its inputs; Undo takes it back', async () => {
    // Models and their sources: src/core/instruments/convexity.ts and test/core/instruments/convexity.test.ts.
    render(<App />);
    fireEvent.change(cell(12, 'Kind'), { target: { value: 'future' } });
    fireEvent.change(cell(12, 'Maturity'), { target: { value: '2028-03' } });
    fireEvent.change(cell(12, 'Rate / yield'), { target: { value: '' } });
    fireEvent.change(cell(12, 'Price'), { target: { value: '96.2' } });
    for (const column of ['Coupon', 'Freq', 'Day count']) fireEvent.change(cell(12, column), { target: { value: '' } });
    fireEvent.change(screen.getByRole('combobox', { name: 'Futures convexity' }), { target: { value: 'hull-white' } });
    fireEvent.change(screen.getByRole('textbox', { name: 'Volatility (% a year)' }), { target: { value: '1.5' } });
    expect(useAppStore.getState().workspace.curve.futuresConvexity).toEqual({ model: 'hull-white', volatility: 0.015, meanReversion: 0.03 });
    fireEvent.click(screen.getByRole('button', { name: 'Row 12: show its repricing and schedule' }));
    expect(await screen.findByText(/less a convexity adjustment of \d+\.\d\d bp \(Hull-White \(Kirikos-Novak\) model, \u03c3 1\.5000% a year, a 0\.0300 a year/)).toBeInTheDocument();
    useAppStore.getState().undo();
    expect(useAppStore.getState().workspace.curve.futuresConvexity).toEqual({ model: 'hull-white', volatility: 0.01, meanReversion: 0.03 });
    useAppStore.getState().undo();
    expect(useAppStore.getState().workspace.curve.futuresConvexity).toBeUndefined();
  });
});

describe('the futures convexity setting and the range a file is checked against', () => {
  it('a volatility above 10% a year stays in the field, marked, and is not applied (the document check would refuse it)', () => {
    // Range: CONVEXITY_VOLATILITY_MAX in src/core/instruments/convexity.ts, the engine's check of curve.futuresConvexity.
    render(<App />);
    fireEvent.change(screen.getByRole('combobox', { name: 'Futures convexity' }), { target: { value: 'ho-lee' } });
    const field = screen.getByRole('textbox', { name: 'Volatility (% a year)' });
    fireEvent.change(field, { target: { value: '12' } });
    expect(field).toHaveAttribute('aria-invalid', 'true');
    expect(useAppStore.getState().workspace.curve.futuresConvexity).toEqual({ model: 'ho-lee', volatility: 0.01 });
    fireEvent.change(field, { target: { value: '1.5' } });
    expect(field).not.toHaveAttribute('aria-invalid');
    expect(useAppStore.getState().workspace.curve.futuresConvexity).toEqual({ model: 'ho-lee', volatility: 0.015 });
  });
});
