// @vitest-environment jsdom
// A row's convention set and its overrides in the sheet's Conventions cell: set, shown, in the
// engine document, undone. Sources: the dollar SOFR set's deposit terms (T+2 on the US government
// securities calendar, ACT/360; MARKET-CONVENTIONS.md sections c and d, the values of
// src/core/kinds/conventionSets.ts); SIFMA's 2026 recommendations close no day between 15 and 18
// December 2026 (held in test/core/time/calendars.test.ts), so from Tuesday 2026-12-15 spot is
// Thursday the 17th at T+2 and Wednesday the 16th at T+1. The demo's quotes are invented.
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { DEMO_SETTLEMENT } from '../../src/state/demoWorkspace.ts';
import { useAppStore } from '../../src/state/store.ts';
import { buildCurve, toEngineDocument } from '../../src/core/index.ts';

vi.setConfig({ testTimeout: 30_000 });

const s = () => useAppStore.getState();
const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

const cell = (row: number, column: string) => screen.getByRole('textbox', { name: `Row ${row} ${column}` });
/** Row 1 of the demo (the 1W deposit) as the engine reads it: its set, spot lag and start. */
const firstDeposit = () => {
  const conv = toEngineDocument(s().workspace);
  const b = buildCurve(conv.doc, { skipInvalid: true });
  const q = b.workspace!.quotes[0] as { conventions?: string; start?: string; spotLag?: number; dayCount: string };
  return { engine: (conv.doc.quotes as Record<string, unknown>[])[0]!, start: q.start ?? DEMO_SETTLEMENT, dayCount: q.dayCount };
};
/** Types into a cell and leaves it (one undo step). */
const type = (row: number, column: string, value: string) => {
  fireEvent.change(cell(row, column), { target: { value } });
  act(() => s().endEdit());
};

describe("the sheet's Conventions cell", () => {
  it('sets a row\'s set, overrides its spot lag, shows both (the set, the override and the set\'s own value), and undoes step by step', async () => {
    render(<App />);
    expect(DEMO_SETTLEMENT).toBe('2026-12-15');
    expect(cell(1, 'Kind')).toHaveValue('deposit');
    expect(firstDeposit().start).toBe('2026-12-15');

    type(1, 'Conventions', 'usd-sofr');
    expect(cell(1, 'Conventions')).toHaveValue('usd-sofr');
    // The note's code is fetched when a set is first named (its own chunk).
    await waitFor(() => expect(cell(1, 'Conventions')).toHaveAccessibleDescription(/Convention set usd-sofr: US dollar SOFR/));
    // The set's day count shows faintly in the row's empty Day count cell.
    expect(cell(1, 'Day count')).toHaveAttribute('placeholder', 'ACT/360');
    expect(firstDeposit().engine).toMatchObject({ conventions: 'usd-sofr' });
    expect(firstDeposit().start).toBe('2026-12-17');

    type(1, 'Conventions', 'usd-sofr, spot lag 1');
    expect(cell(1, 'Conventions')).toHaveValue('usd-sofr, spot lag 1');
    expect(cell(1, 'Conventions')).toHaveAccessibleDescription(/usd-sofr.*this row overrides spot lag 1 \(the set’s 2\)/);
    expect(cell(1, 'Conventions').closest('td')).toHaveClass('overrides');
    expect(firstDeposit().engine).toMatchObject({ conventions: 'usd-sofr', spotLag: 1 });
    expect(firstDeposit().start).toBe('2026-12-16');

    // A field of the set overridden in its own column is listed too.
    type(1, 'Day count', 'ACT/365F');
    expect(cell(1, 'Conventions')).toHaveAccessibleDescription(/overrides spot lag 1 \(the set’s 2\), day count ACT\/365F \(the set’s ACT\/360\)/);
    expect(firstDeposit().dayCount).toBe('ACT/365F');

    act(() => s().undo());
    expect(cell(1, 'Day count')).toHaveValue('');
    act(() => s().undo());
    expect(cell(1, 'Conventions')).toHaveValue('usd-sofr');
    expect(cell(1, 'Conventions').closest('td')).not.toHaveClass('overrides');
    expect(firstDeposit().start).toBe('2026-12-17');
    act(() => s().undo());
    expect(cell(1, 'Conventions')).toHaveValue('');
    expect(firstDeposit().engine).not.toHaveProperty('conventions');
    expect(firstDeposit().start).toBe('2026-12-15');
  });

  it("a row taking the workspace's market conventions shows that set faintly, and before the fields it types itself", async () => {
    render(<App />);
    act(() => s().setCurve({ conventions: 'usd-sofr' }));
    expect(cell(2, 'Conventions')).toHaveAttribute('placeholder', 'usd-sofr');
    await waitFor(() => expect(cell(2, 'Conventions')).toHaveAccessibleDescription(/Convention set usd-sofr \(the workspace’s market conventions\)/));
    type(1, 'Conventions', 'spot lag 1');
    const td = cell(1, 'Conventions').closest('td')!;
    expect(td.querySelector('.terms-set')).toHaveTextContent('usd-sofr ·');
    expect(td).toHaveClass('overrides');
    expect(firstDeposit().engine).toMatchObject({ conventions: 'usd-sofr', spotLag: 1 });
    expect(firstDeposit().start).toBe('2026-12-16');
    // A bond row is not filled by the set: no placeholder, no note.
    const bondRow = s().workspace.quotes.findIndex((r) => r.kind === 'bond') + 1;
    expect(cell(bondRow, 'Conventions')).not.toHaveAttribute('placeholder');
  });

  it('a set or field the cell does not know is an error on the cell listing the valid ones, and the row is left out', () => {
    render(<App />);
    type(1, 'Conventions', 'usd-libor');
    expect(cell(1, 'Conventions')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText(/"usd-libor" is not a convention set or a field; the sets are usd-sofr, eur-estr, gbp-sonia, us-treasury, euro-govt, uk-gilt/)).toBeInTheDocument();
    type(1, 'Conventions', 'usd-sofr, payment lag 2');
    // A deposit takes no payment lag: the engine's error names the field, on the same cell.
    expect(cell(1, 'Conventions')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText(/paymentLag/)).toBeInTheDocument();
  });

  it('the sheet says when a joined calendar changes nothing (no market conventions) and clears it on request', () => {
    render(<App />);
    act(() => s().setCustomCalendar('desk-days', ['2026-12-16']));
    act(() => s().setJoinCalendar('desk-days'));
    expect(screen.getByText(/The calendar "desk-days" is set to close the deposit and OIS rows' calendar, but no market conventions are chosen/)).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Clear the joined calendar' }));
    expect(s().workspace.curve.joinCalendar).toBeUndefined();
    expect(screen.queryByText(/The calendar "desk-days" is set to close/)).toBeNull();
  });
});
