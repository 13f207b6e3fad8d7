// @vitest-environment jsdom
// A published par curve pasted into the sheet as it is laid out (a header of tenors, a row of
// yields in percent): the preview reads it as par yields, says the date sets nothing, and the
// sheet then holds one par-yield quote per tenor. The row is US Treasury's Daily Treasury Par
// Yield Curve Rates of 2023-09-01 (home.treasury.gov TextView, September 2023 page, first row; the
// date from the page's date order, the yields as published).
import { fireEvent, render, screen, within } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { DEFAULT_CONVENTIONS, pasteQuoteCap, readSplitBlock } from '../../src/core/index.ts';
import { readSplit } from '../../src/features/quotes/pasteReader.ts';
import { useAppStore } from '../../src/state/store.ts';
import { useWorkspaceList } from '../../src/state/workspaceList.ts';

// A limit for a hung render, not a speed check: the whole App renders slowly in jsdom under a parallel suite.
vi.setConfig({ testTimeout: 30_000 });

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  useWorkspaceList.setState(useWorkspaceList.getInitialState(), true);
  localStorage.clear();
});

const TREASURY_2023_09_01 = [
  'Date\t1 Mo\t2 Mo\t3 Mo\t4 Mo\t6 Mo\t1 Yr\t2 Yr\t3 Yr\t5 Yr\t7 Yr\t10 Yr\t20 Yr\t30 Yr',
  '09/01/2023\t5.51\t5.55\t5.53\t5.58\t5.47\t5.36\t4.87\t4.57\t4.29\t4.27\t4.18\t4.48\t4.29',
].join('\n');

describe('pasting a par curve laid out by tenor', () => {
  it('previews it as par yields, reports the date as setting nothing, and replaces the sheet with 13 par-yield quotes', async () => {
    render(<App />);
    const grid = screen.getByRole('grid', { name: /Quotes/ });
    fireEvent.paste(grid, { clipboardData: { getData: () => TREASURY_2023_09_01 } });
    const preview = await screen.findByRole('region', { name: /Paste preview/ }); // the paste reader loads on the first paste
    expect(preview).toHaveTextContent('13 read as quotes');
    const mapping = within(preview).getByRole('table');
    const first = within(mapping).getByText('1 Mo').closest('tr')!;
    expect(first).toHaveTextContent('par yield 1M');
    expect(first).toHaveTextContent('5.51');
    expect(within(mapping).getByText('Date').closest('tr')).toHaveTextContent('date (reported only)');
    const notes = within(preview).getByRole('list', { name: 'What the paste read' });
    expect(notes).toHaveTextContent("Date 09/01/2023: the curve's date as pasted, reported only; it sets nothing");
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('19 quotes in the curve'); // the preview changes nothing
    fireEvent.click(screen.getByRole('button', { name: 'Replace the sheet' }));
    expect(screen.getByText(/quotes in the curve/)).toHaveTextContent('13 quotes in the curve');
    expect(screen.getByRole('textbox', { name: 'Row 1 Kind' })).toHaveValue('par-yield');
    expect(screen.getByRole('textbox', { name: 'Row 13 Maturity' })).toHaveValue('30Y');
    expect(screen.getByRole('textbox', { name: 'Row 13 Rate / yield' })).toHaveValue('4.29%');
  });
});

describe('a par curve by tenor pasted big enough for the reading worker', () => {
  it('says that the row used is the last of the rows read, not the paste\'s last', () => {
    const [head, row] = TREASURY_2023_09_01.split('\n').map((l) => l.split('\t'));
    // The worker keeps the header and the first pasteQuoteCap() rows of a paste of 700 rows.
    const cells = [head!, ...Array.from({ length: pasteQuoteCap() }, () => [...row!])];
    const done = readSplit(readSplitBlock({ cells, separator: '\t' }), 701, { text: '', mode: 'percent', existing: 0, conventions: DEFAULT_CONVENTIONS });
    expect(done.preview!.rows).toBe(13);
    expect(done.block.notes!.at(-1)).toBe(`The paste has 700 rows under the header and only the first ${pasteQuoteCap()} were read: the row used is the last of those, not the paste's last row. Paste fewer rows to use another.`);
  });
});
