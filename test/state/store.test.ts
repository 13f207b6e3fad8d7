// The store's actions: every edit undoable, typing in one cell is one step, the history capped at
// HISTORY_CAP, paste replacing (or appending) and filling, unit switches keeping values.
import { useAppStore } from '../../src/state/store.ts';
// The paste reader registers the functions the store confirms pastes with (state/pasteTools.ts), as its first load does in the app.
import '../../src/features/quotes/pasteReader.ts';
import { HISTORY_CAP } from '../../src/state/slices/historySlice.ts';

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));
const s = () => useAppStore.getState();

describe('history', () => {
  it('setCell then undo and redo restores each state', () => {
    const id = s().workspace.quotes[0]!.id;
    const before = s().workspace;
    s().setCell(id, 'rate', '4.5');
    expect(s().workspace.quotes[0]!.rate).toBe('4.5');
    s().undo();
    expect(s().workspace).toBe(before);
    s().redo();
    expect(s().workspace.quotes[0]!.rate).toBe('4.5');
  });

  it('keystrokes in one cell merge into one undo step until the cell loses focus', () => {
    const id = s().workspace.quotes[0]!.id;
    s().setCell(id, 'rate', '4');
    s().setCell(id, 'rate', '4.');
    s().setCell(id, 'rate', '4.5');
    expect(s().past).toHaveLength(1);
    s().endEdit();
    s().setCell(id, 'rate', '4.55');
    expect(s().past).toHaveLength(2);
  });

  it(`keeps at most ${HISTORY_CAP} steps`, () => {
    const id = s().workspace.quotes[0]!.id;
    for (let i = 0; i < HISTORY_CAP + 25; i++) s().setRowEnabled(id, i % 2 === 0 ? false : true);
    expect(s().past).toHaveLength(HISTORY_CAP);
  });

  it('a new edit after undo clears redo', () => {
    const id = s().workspace.quotes[0]!.id;
    s().setRowEnabled(id, false);
    s().undo();
    expect(s().future).toHaveLength(1);
    s().addRow(null);
    expect(s().future).toHaveLength(0);
  });
});

describe('rows', () => {
  it('addRow, deleteRow and setRowEnabled change the sheet', () => {
    const n = s().workspace.quotes.length;
    const id = s().addRow(s().workspace.quotes[0]!.id);
    expect(s().workspace.quotes[1]!.id).toBe(id);
    s().deleteRow(id);
    expect(s().workspace.quotes).toHaveLength(n);
    s().setRowEnabled(s().workspace.quotes[2]!.id, false);
    expect(s().workspace.quotes[2]!.enabled).toBe(false);
  });

  it('sortByMaturity orders tenors and dates by their dates, unreadable maturities last', () => {
    const q = s().workspace.quotes;
    s().setCell(q[0]!.id, 'maturity', '40Y');
    s().setCell(q[1]!.id, 'maturity', 'soon');
    s().sortByMaturity();
    const sorted = s().workspace.quotes.map((r) => r.maturity);
    expect(sorted[sorted.length - 1]).toBe('soon');
    expect(sorted[sorted.length - 2]).toBe('40Y');
    expect(sorted[0]).toBe('2M'); // rows 1W and 1M were re-typed above
  });
});

describe('paste', () => {
  it('a block with a header replaces the sheet; appendInstead appends it to the old sheet as one step', () => {
    const old = s().workspace.quotes;
    s().pasteText('kind\ttenor\trate\ndeposit\t3M\t4.1\nswap\t5Y\t3.9', null);
    expect(s().workspace.quotes.map((r) => [r.kind, r.maturity, r.rate])).toEqual([
      ['deposit', '3M', '4.1'],
      ['swap', '5Y', '3.9'],
    ]);
    expect(s().pasteNotice?.mode).toBe('replaced');
    s().appendInstead();
    expect(s().workspace.quotes).toHaveLength(old.length + 2);
    expect(s().workspace.quotes.slice(0, old.length)).toEqual(old);
    s().undo();
    expect(s().workspace.quotes).toBe(old);
  });

  it('a block without a header fills from the target cell in column order, adding rows past the end', () => {
    const n = s().workspace.quotes.length;
    s().pasteText(`4.5\t\n4.6`, { row: n - 1, column: 'rate' });
    expect(s().workspace.quotes[n - 1]!.rate).toBe('4.5');
    expect(s().workspace.quotes[n]!.rate).toBe('4.6');
    expect(s().workspace.quotes[n]!.kind).toBe('');
  });
});

describe('paste notice acts on the paste only', () => {
  it('a unit switch after a paste ends the notice, so "Undo paste" cannot undo the unit switch', () => {
    s().pasteText('kind\ttenor\trate\ndeposit\t3M\t4.1\nswap\t5Y\t3.9', null);
    expect(s().pasteNotice?.mode).toBe('replaced');
    s().setQuoteUnit('bp');
    expect(s().pasteNotice).toBeNull();
  });
  it('editing a pasted cell ends the notice, so "Append instead" cannot bring the pasted value back', () => {
    s().pasteText('kind\ttenor\trate\ndeposit\t3M\t4.1', null);
    s().setCell(s().workspace.quotes[0]!.id, 'rate', '4.2');
    expect(s().pasteNotice).toBeNull();
    s().appendInstead();
    expect(s().workspace.quotes.map((r) => r.rate)).toEqual(['4.2']);
  });
});

describe('paste preview', () => {
  it('a header paste from the sheet changes nothing until confirmed, then replaces the sheet as one step', () => {
    const before = s().workspace;
    s().previewPasteText('instrument,mat,mid\nswap,5Y,3.9\nswap,10Y,4.02', null);
    expect(s().workspace).toBe(before);
    expect(s().pendingPaste?.block.columns.map((c) => c.column)).toEqual(['kind', 'maturity', 'rate']);
    s().confirmPaste('replace');
    expect(s().workspace.quotes.map((r) => r.maturity)).toEqual(['5Y', '10Y']);
    expect(s().pendingPaste).toBeNull();
    s().undo();
    expect(s().workspace).toBe(before);
  });
  it('a header paste that would leave no quote never replaces the sheet', () => {
    const before = s().workspace;
    s().pasteText('kind,tenor,rate\nfoo,5Y,abc', null);
    expect(s().workspace).toBe(before);
    expect(s().pasteNotice).toMatchObject({ mode: 'refused' });
    s().previewPasteText('kind,tenor,rate\nfoo,5Y,abc', null);
    s().confirmPaste('replace');
    expect(s().workspace).toBe(before);
  });
});

describe('setQuoteUnit', () => {
  it('switching percent to bp re-writes bare numbers so values stay the same, and is undoable', () => {
    const id = s().workspace.quotes[0]!.id;
    s().setCell(id, 'rate', '4.28');
    s().endEdit();
    s().setQuoteUnit('bp');
    expect(s().workspace.quotes[0]!.rate).toBe('428');
    expect(s().workspace.quoteUnit).toBe('bp');
    s().undo();
    expect(s().workspace.quotes[0]!.rate).toBe('4.28');
  });
});

describe('setConventions', () => {
  it('switching the date order re-writes numeric dates so each keeps its date, undoably', () => {
    const id = s().workspace.quotes[0]!.id;
    s().setCell(id, 'maturity', '11/12/2027');
    s().endEdit();
    s().setConventions({ dateOrder: 'dmy' });
    expect(s().workspace.display.dateOrder).toBe('dmy');
    expect(s().workspace.quotes[0]!.maturity).toBe('12/11/2027');
    s().undo();
    expect(s().workspace.quotes[0]!.maturity).toBe('11/12/2027');
  });
  it('a unit switch with the decimal comma keeps values and the comma: 4,28 % is 428 bp, 0,0428 decimal', () => {
    const id = s().workspace.quotes[0]!.id;
    s().setConventions({ decimalMark: ',' });
    s().setCell(id, 'rate', '4,28');
    s().endEdit();
    s().setQuoteUnit('decimal');
    expect(s().workspace.quotes[0]!.rate).toBe('0,0428');
    s().setQuoteUnit('bp');
    expect(s().workspace.quotes[0]!.rate).toBe('428');
  });
});

describe('setReserved', () => {
  it('stores other panels\u2019 keys in the document, undoably', () => {
    s().setReserved('note', 'committee draft');
    expect(s().workspace.note).toBe('committee draft');
    s().undo();
    expect(s().workspace.note).toBeUndefined();
  });
});
