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

describe('calendars of your own', () => {
  it('a pasted list becomes a calendar of the workspace; joined to TARGET it closes the €STR rows\' calendar on its days too (spot moves); deleting it ends the join; each step undoes', () => {
    render(<HolidaysTab />);
    const spot = () => (buildCurve(toEngineDocument(s().workspace).doc, { skipInvalid: true }).workspace!.quotes.find((q) => q.kind === 'deposit') as { start: string }).start;
    expect(spot()).toBe('2027-03-30'); // Wednesday 2027-03-24 + 2 TARGET days over Easter
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'desk-days' } });
    fireEvent.change(screen.getByLabelText('Its holidays, one per line'), { target: { value: '2027-03-30\nsoon' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save this calendar' }));
    expect(s().workspace.customCalendars).toEqual({ 'desk-days': { holidays: ['2027-03-30'] } });
    expect(within(screen.getByRole('region', { name: 'Calendars of your own' })).getByRole('status')).toHaveTextContent('Saved “desk-days” with 1 day; not taken: line 2 (soon)');
    expect(spot()).toBe('2027-03-30'); // saved, not yet joined
    fireEvent.change(screen.getByRole('combobox', { name: /Also close the deposit and OIS rows/ }), { target: { value: 'desk-days' } });
    expect(s().workspace.curve.joinCalendar).toBe('desk-days');
    expect(spot()).toBe('2027-03-31'); // 30 March closed on the joined calendar too
    fireEvent.click(screen.getByRole('button', { name: 'Delete the calendar desk-days' }));
    expect(s().workspace.customCalendars).toBeUndefined();
    expect(s().workspace.curve.joinCalendar).toBeUndefined();
    expect(spot()).toBe('2027-03-30');
    act(() => s().undo());
    expect(s().workspace.curve.joinCalendar).toBe('desk-days');
    expect(spot()).toBe('2027-03-31');
  });

  it('a name that is a built-in calendar, or not of the stated form, is refused with the reason', () => {
    render(<HolidaysTab />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'target' } });
    fireEvent.change(screen.getByLabelText('Its holidays, one per line'), { target: { value: '2027-03-30' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save this calendar' }));
    expect(within(screen.getByRole('region', { name: 'Calendars of your own' })).getByRole('status')).toHaveTextContent('Not saved: "target" is a built-in calendar');
    expect(s().workspace.customCalendars).toBeUndefined();
  });

  it('a joined calendar left while no market conventions are chosen says it changes nothing and offers to clear it (one undo step)', () => {
    act(() => s().setCustomCalendar('desk-days', ['2027-03-25']));
    act(() => s().setJoinCalendar('desk-days'));
    act(() => s().setCurve({ conventions: 'none' }));
    render(<HolidaysTab />);
    const own = within(screen.getByRole('region', { name: 'Calendars of your own' }));
    expect(own.getByRole('status')).toHaveTextContent('“desk-days” is chosen to close the deposit and OIS rows’ calendar, but no Market conventions are chosen, so it changes nothing');
    // The engine document says the same (a warning, not silence).
    expect(toEngineDocument(s().workspace).notes.map((n) => n.code)).toEqual(['not-applied']);
    fireEvent.click(own.getByRole('button', { name: 'clear the joined calendar' }));
    expect(s().workspace.curve.joinCalendar).toBeUndefined();
    expect(toEngineDocument(s().workspace).notes).toEqual([]);
    act(() => s().undo());
    expect(s().workspace.curve.joinCalendar).toBe('desk-days');
  });
});
