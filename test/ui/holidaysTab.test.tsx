// @vitest-environment jsdom
// The Holidays section: closing and opening days of a built-in calendar writes the workspace's
// `calendars` edits (one undo step each), and every deposit and OIS quote on that calendar moves.
// Sources: TARGET's 2027 closing days (ECB; held in test/core/time/calendars.test.ts): Good Friday
// 26 March and Easter Monday 29 March. The euro €STR conventions (T+2 on TARGET) are
// MARKET-CONVENTIONS.md section d's. The demo's quotes are invented.
import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { HolidaysTab } from '../../src/features/calendars/HolidaysTab.tsx';
import { useAppStore } from '../../src/state/store.ts';
import { buildCurve, toEngineDocument } from '../../src/core/index.ts';

const s = () => useAppStore.getState();

beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  act(() => s().setCurve({ conventions: 'eur-estr' }));
  act(() => s().setSettlement('2027-03-24'));
});

describe('HolidaysTab', () => {
  it('shows the market conventions\' calendar for the valuation year with its published closings', () => {
    render(<HolidaysTab />);
    expect(screen.getByRole('combobox', { name: 'Calendar' })).toHaveValue('target');
    const table = screen.getByRole('table', { name: 'Closed weekdays of target in 2027' });
    expect(within(table).getAllByRole('row').slice(1).map((r) => r.textContent)).toEqual([
      '2027-01-01Fridaythe calendar’s rulesOpen',
      '2027-03-26Fridaythe calendar’s rulesOpen',
      '2027-03-29Mondaythe calendar’s rulesOpen',
    ]);
  });

  it('opening Easter Monday moves spot of the €STR deposits and swaps from 30 to 29 March; Undo brings it back', () => {
    render(<HolidaysTab />);
    const spot = () => {
      const b = buildCurve(toEngineDocument(s().workspace).doc, { skipInvalid: true });
      return (b.workspace!.quotes.find((q) => q.kind === 'deposit') as { start: string }).start;
    };
    expect(spot()).toBe('2027-03-30');
    fireEvent.click(screen.getByRole('button', { name: 'Open 2027-03-29' }));
    expect(s().workspace.calendars).toEqual({ target: { add: [], remove: ['2027-03-29'] } });
    expect(spot()).toBe('2027-03-29');
    expect(screen.getByRole('button', { name: 'Close 2027-03-29 again' })).toBeInTheDocument();
    act(() => s().undo());
    expect(s().workspace.calendars).toBeUndefined();
    expect(spot()).toBe('2027-03-30');
  });

  it('closes a typed day and a pasted list, and says which lines were not taken', () => {
    render(<HolidaysTab />);
    fireEvent.change(screen.getByLabelText('Close a day'), { target: { value: '2027-03-25' } });
    fireEvent.click(screen.getByRole('button', { name: 'Close this day' }));
    expect(s().workspace.calendars?.target?.add).toEqual(['2027-03-25']);
    fireEvent.change(screen.getByLabelText(/Dates, one per line/), { target: { value: '2027-08-16\n2027-03-26\nsoon' } });
    fireEvent.click(screen.getByRole('button', { name: 'Close these days on target' }));
    expect(s().workspace.calendars?.target?.add).toEqual(['2027-03-25', '2027-08-16']);
    expect(screen.getByRole('status')).toHaveTextContent(/1 day closed on target; not taken: line 3 \(soon\): not a date \(use YYYY-MM-DD, such as 2027-12-24\); 2027-03-26: 2027-03-26 is closed on target already/);
  });

  it('a weekend day is refused with the reason and nothing changes', () => {
    render(<HolidaysTab />);
    fireEvent.change(screen.getByLabelText('Close a day'), { target: { value: '2027-03-27' } });
    fireEvent.click(screen.getByRole('button', { name: 'Close this day' }));
    expect(screen.getByRole('status')).toHaveTextContent('2027-03-27 is a Saturday, closed on every calendar already');
    expect(s().workspace.calendars).toBeUndefined();
  });
});
