// @vitest-environment jsdom
// One row sets one turn: the Overnight curve section's "Spread set by" picker offers a turn only the
// rows no other turn is solved from, and a document that names one row for two turns (a file written
// by hand) shows the clash on each turn, naming the row and the other turn, with both turns kept (the
// engine refuses two turns on one quote: readTurns, test/core/document/overnightSections.test.ts).
// A workspace file whose turn gives the engine's solveFrom at no row is refused naming the turn, and
// the workspace shown is unchanged. Market: the three deposits of test/ui/overnightTurnSolve.test.tsx
// (a flat 4% forward and a 25 bp year-end turn, invented rates).
import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { OvernightTab } from '../../src/features/overnight/OvernightTab.tsx';
import { ShareBar } from '../../src/share/ShareBar.tsx';
import { deriveBuild, useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { useAppStore } from '../../src/state/store.ts';
import { serialiseDocument } from '../../src/core/index.ts';
import { openEngineDocument } from '../helpers/engineWorkspace.ts';
import { INVENTED_2022_YEAR_END_DEPOSITS } from '../helpers/markets.ts';

const s = () => useAppStore.getState();
const YEAR_END = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10, calendar: 'weekends' };
const QUARTER = { name: 'quarter end', from: '2023-03-10', to: '2023-03-10', spreadBp: 5, calendar: 'weekends' };
const ENGINE = { ...INVENTED_2022_YEAR_END_DEPOSITS, turns: [YEAR_END, QUARTER] };

function Live() {
  const result = useCurveBuild();
  return <OvernightTab result={result} />;
}

beforeAll(() => loadOvernightKit());
beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  openEngineDocument(ENGINE);
});

const picker = (name: string) => screen.getByRole('combobox', { name: `Spread of the turn ${name} set by` });
const offered = (name: string) => within(picker(name)).getAllByRole('option').map((o) => o.textContent);

describe('Overnight curve section: one row sets one turn', () => {
  it('a row chosen for one turn is no longer offered for the other; choosing "you" frees it again', () => {
    render(<Live />);
    expect(offered('quarter end')).toEqual(['you', 'row 1 (deposit 2022-12-22)', 'row 2 (deposit 2023-01-17)', 'row 3 (deposit 2023-03-15)']);
    fireEvent.change(picker('year end 2022'), { target: { value: 'r1' } });
    expect(offered('quarter end')).toEqual(['you', 'row 1 (deposit 2022-12-22)', 'row 3 (deposit 2023-03-15)']);
    // The turn's own row stays in its own picker.
    expect(offered('year end 2022')).toContain('row 2 (deposit 2023-01-17)');
    fireEvent.change(picker('year end 2022'), { target: { value: 'given' } });
    expect(offered('quarter end')).toContain('row 2 (deposit 2023-01-17)');
  });

  it('two turns on one row (as a file may give them): each turn says so, naming the row and the other turn; both are kept', () => {
    act(() => s().setTurns([{ ...YEAR_END, solveFromRow: 'r2' }, { ...QUARTER, solveFromRow: 'r2' }]));
    render(<Live />);
    const alerts = screen.getAllByRole('alert').map((a) => a.textContent);
    expect(alerts).toContain('Row 3 also sets the turn quarter end: one row sets one turn.');
    expect(alerts).toContain('Row 3 also sets the turn year end 2022: one row sets one turn.');
    expect(s().workspace.turns).toEqual([{ ...YEAR_END, solveFromRow: 'r2' }, { ...QUARTER, solveFromRow: 'r2' }]);
    // Choosing "you" for one ends the clash.
    fireEvent.change(picker('quarter end'), { target: { value: 'given' } });
    expect(screen.queryByText(/also sets the turn/)).toBeNull();
  });
});

describe('Open workspace file: a turn with solveFrom at no row', () => {
  it('is refused naming the turn and what to write; the workspace shown is unchanged', async () => {
    const before = s().workspace;
    const bad = { ...before, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', solveFrom: 7 }] };
    render(<ShareBar result={deriveBuild(before)} />);
    fireEvent.change(screen.getByLabelText('Workspace file to open'), { target: { files: [new File([serialiseDocument(bad as unknown as Record<string, unknown>)], 'desk.json', { type: 'application/json' })] } });
    const alert = await screen.findByRole('alert', {}, { timeout: 10_000 });
    expect(alert).toHaveTextContent('desk.json was not opened: turns[0] (year end 2022) solveFrom 7 is no row of quotes (3 rows, from 0): write solveFromRow, the id of the row whose quote sets the spread, or spreadBp. Your workspace has not been changed.');
    expect(s().workspace).toBe(before);
  });
});
