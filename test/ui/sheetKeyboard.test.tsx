// @vitest-environment jsdom
// The quote sheet's keyboard model (README, Quotes: keyboard), on the demo workspace (invented
// data): the arrow keys move between cells, Enter and typing start an edit, Escape takes the
// edit back leaving no undo step. The model follows the common spreadsheet convention (cell
// focus versus cell edit); the browser test (test/browser/keyboard.test.ts) drives real keys.
import { fireEvent, render, screen } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { useAppStore } from '../../src/state/store.ts';

vi.setConfig({ testTimeout: 30_000 });

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

const cell = (row: number, column: string) => screen.getByRole('textbox', { name: `Row ${row} ${column}` }) as HTMLInputElement;
const isEditing = (el: HTMLElement): boolean => el.dataset.editing === 'true';

describe('QuoteSheet keyboard model', () => {
  it('ArrowRight, ArrowLeft, ArrowDown, Home and End move the focus between cells of the sheet', () => {
    render(<App />);
    cell(1, 'Kind').focus();
    fireEvent.keyDown(document.activeElement!, { key: 'ArrowRight' });
    expect(document.activeElement).toBe(cell(1, 'Maturity'));
    fireEvent.keyDown(document.activeElement!, { key: 'ArrowDown' });
    expect(document.activeElement).toBe(cell(2, 'Maturity'));
    fireEvent.keyDown(document.activeElement!, { key: 'ArrowLeft' });
    expect(document.activeElement).toBe(cell(2, 'Kind'));
    fireEvent.keyDown(document.activeElement!, { key: 'ArrowLeft' }); // the first column: stays
    expect(document.activeElement).toBe(cell(2, 'Kind'));
    fireEvent.keyDown(document.activeElement!, { key: 'End' });
    expect(document.activeElement).toBe(cell(2, 'Conventions')); // the last column
    fireEvent.keyDown(document.activeElement!, { key: 'ArrowLeft' });
    expect(document.activeElement).toBe(cell(2, 'Day count'));
    fireEvent.keyDown(document.activeElement!, { key: 'Home', ctrlKey: true });
    expect(document.activeElement).toBe(cell(1, 'Day count'));
  });

  it('Enter starts an edit in place; Escape puts the text back and leaves no undo step', () => {
    render(<App />);
    const rate = cell(3, 'Rate / yield');
    const before = rate.value;
    const steps = useAppStore.getState().past.length;
    rate.focus();
    fireEvent.keyDown(rate, { key: 'Enter' });
    expect(document.activeElement).toBe(rate);
    expect(isEditing(rate)).toBe(true);
    fireEvent.change(rate, { target: { value: '7.25' } });
    expect(useAppStore.getState().past.length).toBe(steps + 1);
    fireEvent.keyDown(rate, { key: 'Escape' });
    expect(cell(3, 'Rate / yield').value).toBe(before);
    expect(isEditing(rate)).toBe(false);
    expect(useAppStore.getState().past.length).toBe(steps);
    expect(useAppStore.getState().future.length).toBe(0);
  });

  it('Enter while editing commits and moves down; while editing, ArrowLeft stays in the cell', () => {
    render(<App />);
    const rate = cell(2, 'Rate / yield');
    rate.focus();
    fireEvent.keyDown(rate, { key: '5' }); // typing starts the edit (the browser then types the 5)
    expect(isEditing(rate)).toBe(true);
    fireEvent.change(rate, { target: { value: '5' } });
    fireEvent.keyDown(rate, { key: 'ArrowLeft' });
    expect(document.activeElement).toBe(rate);
    fireEvent.keyDown(rate, { key: 'Enter' });
    expect(document.activeElement).toBe(cell(3, 'Rate / yield'));
    expect(cell(2, 'Rate / yield').value).toBe('5');
    expect(isEditing(rate)).toBe(false);
  });

  it('the skip link moves the focus to the charts and tables', () => {
    render(<App />);
    fireEvent.click(screen.getByRole('link', { name: /Skip the quote sheet/ }));
    expect(document.activeElement).toBe(screen.getByRole('region', { name: 'Charts and tables' }));
  });
});

describe('historySlice.cancelEdit', () => {
  it('takes back only the run of edits with its key, and only while it is the last step', () => {
    const s = useAppStore.getState();
    const row = s.workspace.quotes[0]!;
    const original = row.rate;
    s.setCell(row.id, 'rate', '1');
    s.setCell(row.id, 'rate', '12');
    useAppStore.getState().cancelEdit(`cell:${row.id}:maturity`); // another cell's key: nothing
    expect(useAppStore.getState().workspace.quotes[0]!.rate).toBe('12');
    useAppStore.getState().cancelEdit(`cell:${row.id}:rate`);
    expect(useAppStore.getState().workspace.quotes[0]!.rate).toBe(original);
    expect(useAppStore.getState().past.length).toBe(0);
  });
});
