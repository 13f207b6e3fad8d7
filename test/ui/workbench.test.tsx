// @vitest-environment jsdom
// The workbench end to end in a DOM: paste with and without a header, bad rows marked in place,
// the unit switch, switching rows off, settings re-expressing every rate, undo and redo from the
// keyboard, autosave and restore, and the warning when another tab saves the same workspace.
// Expected numbers are the core's own (src/core through its public entry), formatted as shown.
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { addTenor, buildCurve, parseTenor, zeroOn, type Compounding } from '../../src/core/index.ts';
import { toEngineDocument } from '../../src/core/index.ts';
import { IDBFactory } from 'fake-indexeddb';
import { CHANNEL_NAME, entryKey, flushSave, startPersistence } from '../../src/state/persistence.ts';
import { indexedDbBackend } from '../../src/state/workspaceBackend.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';
import { useAppStore } from '../../src/state/store.ts';

// A limit for a hung render, not a speed check: the whole App renders slowly in jsdom under a parallel suite.
vi.setConfig({ testTimeout: 30_000 });

const initial = useAppStore.getInitialState();
let stopPersistence: (() => void) | null = null;
beforeEach(() => {
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(useWorkspaceList.getInitialState(), true);
  localStorage.clear();
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
});
afterEach(() => {
  stopPersistence?.();
  stopPersistence = null;
});

const grid = () => screen.getByRole('grid', { name: /Quotes/ });
const cell = (row: number, column: string) => screen.getByRole('textbox', { name: `Row ${row} ${column}` });
const zeroPath = () => document.querySelector('svg[aria-label^="Zero curve"] [data-series="zero"] path')!.getAttribute('d');
const fwdPath = () => document.querySelector('svg[aria-label^="Forward curve"] [data-series="forward"] path')!.getAttribute('d');
const keyCell = (tenor: string, field: string) =>
  within(screen.getByRole('table', { name: 'Key maturities' })).getByText((_, el) => el?.getAttribute('data-field') === field && el.closest('tr')?.getAttribute('data-tenor') === tenor);
/** Pastes text on a cell; the paste reader (and the preview) load on the first paste, so this waits for them. */
const paste = async (el: Element, text: string): Promise<void> => {
  fireEvent.paste(el, { clipboardData: { getData: () => text } });
  await act(async () => {
    await import('../../src/features/quotes/pasteReader.ts');
    await import('../../src/features/quotes/PastePreview.tsx');
  });
};
/** A header paste shows its column-mapping preview first; this confirms it as "Replace the sheet". */
const replaceSheet = async () => fireEvent.click(await screen.findByRole('button', { name: 'Replace the sheet' }));

/** The core's zero rate at a tenor for the store's current workspace, formatted as the table shows it. */
function coreZero(tenor: string, c: Compounding, dc: 'ACT/365F' | 'ACT/360'): string {
  const ws = useAppStore.getState().workspace;
  const curve = buildCurve(toEngineDocument(ws).doc, { skipInvalid: true }).curve!;
  const z = zeroOn(curve, addTenor(curve.settlement, parseTenor(tenor)!), c, dc);
  if (!z.ok) throw new Error(z.errors[0]!.message);
  return `${(100 * z.value.zero).toFixed(4)}%`;
}

describe('<App /> on the demo workspace', () => {
  it('shows the quote grid, both charts and the caution', () => {
    render(<App />);
    expect(grid()).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /Zero curve/ })).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /Forward curve/ })).toBeInTheDocument();
    expect(screen.getAllByText(/not investment advice/).length).toBeGreaterThan(0);
    expect(screen.getAllByText(/not forecasts/).length).toBeGreaterThan(0);
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('19 quotes in the curve');
  });

  it('the key-maturity table shows the core\u2019s zero rates with their tag', () => {
    render(<App />);
    expect(keyCell('5Y', 'zero')).toHaveTextContent(coreZero('5Y', 'continuous', 'ACT/365F'));
    expect(screen.getByRole('table', { name: 'Key maturities' })).toHaveTextContent('cont, ACT/365F');
  });
});

describe('paste', () => {
  it('a block with a header replaces the sheet, the charts change, and "Append instead" appends', async () => {
    render(<App />);
    const before = zeroPath();
    await paste(cell(3, 'Rate / yield'), 'Type\tTenor\tRate\nDeposit\t3M\t4.0\nSWAP\t2Y\t3.5\nswap\t5Y\t3.6\nswap\t10Y\t3.9\n');
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('19 quotes in the curve'); // the preview changes nothing
    await replaceSheet();
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('4 quotes in the curve');
    expect(cell(2, 'Kind')).toHaveValue('SWAP');
    expect(zeroPath()).not.toBe(before);
    fireEvent.click(screen.getByRole('button', { name: 'Append instead' }));
    // The demo already has a 3M deposit and a 10Y swap: the appended copies fall on the same pillars.
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('21 quotes in the curve · 2 rows left out with errors');
    expect(cell(20, 'Maturity')).toHaveAccessibleDescription(/row 20 .* and row 4 .*same point of the curve/);
  });

  it('CSV with a header is read the same way', async () => {
    render(<App />);
    await paste(grid(), 'kind,maturity,yield,coupon,clean price,frequency,day count\nbond,2031-11-15,,3.625,99.2,2,ACT/ACT-ICMA\ndeposit,6M,4.1,,,,ACT/360');
    await replaceSheet();
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('2 quotes in the curve');
    expect(cell(1, 'Price')).toHaveValue('99.2');
  });

  it('a block without a header fills from the focused cell in column order', async () => {
    render(<App />);
    await paste(cell(1, 'Rate / yield'), '4.11\n4.22');
    expect(cell(1, 'Rate / yield')).toHaveValue('4.11');
    expect(cell(2, 'Rate / yield')).toHaveValue('4.22');
    expect(cell(3, 'Rate / yield')).toHaveValue('4.360');
  });
});

describe('bad rows', () => {
  it('a wrong cell is marked in place with what would be valid, and the row is counted as left out', () => {
    render(<App />);
    fireEvent.change(cell(2, 'Rate / yield'), { target: { value: '4.3x' } });
    const input = cell(2, 'Rate / yield');
    expect(input).toHaveAttribute('aria-invalid', 'true');
    expect(input).toHaveAccessibleDescription(/not a number; type a rate such as 3.25%, 325bp or 3.25/);
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('18 quotes in the curve · 1 row left out with errors');
  });

  it('an engine error (duplicate pillar) is shown on the row it concerns', () => {
    render(<App />);
    fireEvent.change(cell(2, 'Maturity'), { target: { value: '2M' } });
    expect(cell(3, 'Maturity')).toHaveAccessibleDescription(/row 3 .* and row 2 .*same point of the curve/);
  });
});

describe('units', () => {
  it('switching to decimal re-writes bare numbers; a bare 3.25 then asks "did you mean %?"', () => {
    render(<App />);
    fireEvent.click(screen.getByRole('radio', { name: 'decimal' }));
    expect(cell(1, 'Rate / yield')).toHaveValue('0.04455');
    fireEvent.change(cell(1, 'Rate / yield'), { target: { value: '3.25' } });
    expect(cell(1, 'Rate / yield')).toHaveAccessibleDescription(/did you mean 3.25%\?/);
    fireEvent.change(cell(1, 'Rate / yield'), { target: { value: '325bp' } });
    expect(cell(1, 'Rate / yield')).not.toHaveAttribute('aria-invalid');
  });
});

describe('switching rows off', () => {
  it('unticking a row leaves it in the sheet but out of the curve', () => {
    render(<App />);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Row 5 in the curve' }));
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('18 quotes in the curve · 1 switched off');
    expect(cell(5, 'Kind')).toHaveValue('bill');
    expect(useAppStore.getState().workspace.quotes[4]!.enabled).toBe(false);
  });
});

describe('settings', () => {
  it('one compounding setting re-expresses the tables and charts, with the new tag', () => {
    render(<App />);
    const fwd = fwdPath();
    fireEvent.change(screen.getByRole('combobox', { name: 'Compounding' }), { target: { value: 'annual' } });
    expect(keyCell('5Y', 'zero')).toHaveTextContent(coreZero('5Y', 'annual', 'ACT/365F'));
    expect(screen.getByRole('table', { name: 'Key maturities' })).toHaveTextContent('ann, ACT/365F');
    expect(screen.getByRole('img', { name: /Zero curve, ann, ACT\/365F/ })).toBeInTheDocument();
    expect(fwdPath()).not.toBe(fwd);
  });

  it('the forward tenor, interpolation and maturity axis change the charts', () => {
    render(<App />);
    const fwd = fwdPath();
    fireEvent.change(screen.getByRole('combobox', { name: 'Forward tenor' }), { target: { value: '6M' } });
    expect(screen.getByRole('img', { name: /6M forwards/ })).toBeInTheDocument();
    const six = fwdPath();
    expect(six).not.toBe(fwd);
    fireEvent.change(screen.getByRole('combobox', { name: 'Interpolation' }), { target: { value: 'linear-zero' } });
    expect(fwdPath()).not.toBe(six);
    const z = zeroPath();
    fireEvent.change(screen.getByRole('combobox', { name: 'Maturity axis' }), { target: { value: 'sqrt' } });
    expect(zeroPath()).not.toBe(z);
  });

  it('a settlement that is not a date says what is valid and draws no curve', () => {
    render(<App />);
    act(() => useAppStore.getState().setSettlement(''));
    expect(screen.getByText(/Settlement must be a calendar date/)).toBeInTheDocument();
    expect(screen.queryByRole('img', { name: /Zero curve/ })).toBeNull();
  });
});

describe('undo and redo', () => {
  it('Ctrl+Z undoes an edit, Ctrl+Shift+Z and Ctrl+Y redo it, inside a cell too', () => {
    render(<App />);
    const input = cell(1, 'Rate / yield');
    fireEvent.change(input, { target: { value: '5.5' } });
    fireEvent.blur(input);
    fireEvent.keyDown(input, { key: 'z', ctrlKey: true });
    expect(cell(1, 'Rate / yield')).toHaveValue('4.455');
    fireEvent.keyDown(input, { key: 'Z', ctrlKey: true, shiftKey: true });
    expect(cell(1, 'Rate / yield')).toHaveValue('5.5');
    fireEvent.keyDown(input, { key: 'z', metaKey: true });
    expect(cell(1, 'Rate / yield')).toHaveValue('4.455');
    fireEvent.keyDown(document.body, { key: 'y', ctrlKey: true });
    expect(cell(1, 'Rate / yield')).toHaveValue('5.5');
  });

  it('the Undo button undoes a paste', async () => {
    render(<App />);
    await paste(grid(), 'kind\ttenor\trate\ndeposit\t3M\t4');
    await replaceSheet();
    fireEvent.click(screen.getByRole('button', { name: 'Undo' }));
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('19 quotes in the curve');
  });
});

describe('autosave and restore', () => {
  it('an edit is in the browser’s database at the next idle moment; a new start restores it', async () => {
    stopPersistence = startPersistence().stop;
    await flushSave();
    const view = render(<App />);
    fireEvent.change(cell(4, 'Rate / yield'), { target: { value: '4.77' } });
    await screen.findByText('Saved in this browser', undefined, { timeout: 10_000 });
    const id = useWorkspaceList.getState().currentId!;
    expect(JSON.stringify(await indexedDbBackend().get(entryKey(id)))).toContain('4.77');
    view.unmount();
    stopPersistence();
    useAppStore.setState(initial, true);
    const again = startPersistence();
    stopPersistence = again.stop;
    await again.ready;
    render(<App />);
    expect(cell(4, 'Rate / yield')).toHaveValue('4.77');
  });

  it('Reset to demo brings the demo back, undoably', () => {
    render(<App />);
    fireEvent.click(screen.getByRole('button', { name: 'Delete row 1' }));
    expect(cell(1, 'Maturity')).toHaveValue('1M');
    fireEvent.click(screen.getByRole('button', { name: 'Reset to demo' }));
    expect(cell(1, 'Maturity')).toHaveValue('1W');
    fireEvent.click(screen.getByRole('button', { name: 'Undo' }));
    expect(cell(1, 'Maturity')).toHaveValue('1M');
  });
});

describe('the notice after Reset to demo', () => {
  it('says the user’s own workspace is one Undo away, and its Undo brings it back', () => {
    render(<App />);
    fireEvent.click(screen.getByRole('button', { name: 'Delete row 1' }));
    fireEvent.click(screen.getByRole('button', { name: 'Reset to demo' }));
    expect(screen.getByText('Replaced the workspace with the demo; your own is one Undo away.')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Undo the reset' }));
    expect(cell(1, 'Maturity')).toHaveValue('1M');
    expect(screen.queryByText(/your own is one Undo away/)).toBeNull();
  });
});

describe('two tabs', () => {
  it('another tab saving the same workspace is warned about, and nothing is overwritten until the user chooses', async () => {
    const p = startPersistence();
    stopPersistence = p.stop;
    await p.ready;
    render(<App />);
    fireEvent.change(cell(1, 'Rate / yield'), { target: { value: '4.3' } });
    await screen.findByText('Saved in this browser', undefined, { timeout: 10_000 });
    const id = useWorkspaceList.getState().currentId!;
    // The other tab writes its version and tells the others, as persistence.ts does.
    const other = { app: 'tenorscope', id, name: 'x', stamp: 'other:1', writer: 'other', savedAt: 1, workspace: { ...useAppStore.getState().workspace, note: 'from the other tab' } };
    await indexedDbBackend().set(entryKey(id), other);
    const channel = new BroadcastChannel(CHANNEL_NAME);
    channel.postMessage({ type: 'saved', tab: 'other', id, stamp: 'other:1' });
    channel.close();
    await screen.findByText(/Another tab saved a different version of this workspace/, undefined, { timeout: 10_000 });
    fireEvent.change(cell(1, 'Rate / yield'), { target: { value: '4.4' } });
    await flushSave();
    expect(await indexedDbBackend().get(entryKey(id))).toEqual(other);
    fireEvent.click(screen.getByRole('button', { name: /Load the other tab/ }));
    await waitFor(() => expect(useAppStore.getState().workspace.note).toBe('from the other tab'));
  });
});
