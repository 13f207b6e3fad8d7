// @vitest-environment jsdom
// The Overnight curve section's turn editor: a turn's spread given, or solved from a sheet row
// (the workbench names the row by id, `solveFromRow`; the engine document gets the quote's
// position, `solveFrom`). The solved size shown must be the core's own (turnSpreads of the build);
// a row that cannot carry the turn is an error naming the turn and the row, and nothing in the
// workspace is lost. The round trip through the saved entry, a link and a file keeps the turn.
// Market: three deposits made from a flat 4% forward (ACT/365F, continuous) and a 25 bp year-end
// turn over 3 days (weekends calendar), the hand calculation of test/core/bootstrap/turnSolve.test.ts
// (section h of the project's market-conventions notes: J = exp(-s d / 360)). Invented rates.
import { act, fireEvent, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { OvernightTab } from '../../src/features/overnight/OvernightTab.tsx';
import { useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { useAppStore } from '../../src/state/store.ts';
import { buildCurve, formatBp, fullText, OVERNIGHT_KIT, parseDocumentText, readWorkbenchDocument, serialiseDocument, toEngineDocument, turnSpreads, workbenchFromEngine, type WorkbenchDocument } from '../../src/core/index.ts';
import { decodeWorkspaceLink, encodeWorkspaceLink } from '../../src/share/linkCodec.ts';
import { openEngineDocument } from '../helpers/engineWorkspace.ts';
import { INVENTED_2022_YEAR_END_DEPOSITS } from '../helpers/markets.ts';

const s = () => useAppStore.getState();
const ENGINE = { ...INVENTED_2022_YEAR_END_DEPOSITS, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10, calendar: 'weekends' }] };

function Live() {
  const result = useCurveBuild();
  return <OvernightTab result={result} />;
}

// The explanation panel's code is loaded first, so a loaded machine's transform does not count against the wait for it.
beforeAll(async () => {
  await loadOvernightKit();
  await import('../../src/features/tables/lazyTables.ts');
});

beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  openEngineDocument(ENGINE);
});

const picker = () => screen.getByRole('combobox', { name: 'Spread of the turn year end 2022 set by' });

describe('OvernightTab: a turn solved from a sheet row', () => {
  it('offers every sheet row; solving from row 2 shows the core\'s solved spread, and the given spread comes back when switched back', () => {
    render(<Live />);
    const options = within(picker()).getAllByRole('option').map((o) => o.textContent);
    expect(options).toEqual(['you', 'row 1 (deposit 2022-12-22)', 'row 2 (deposit 2023-01-17)', 'row 3 (deposit 2023-03-15)']);
    const table = screen.getByRole('table', { name: 'Turns' });
    expect(within(table).getAllByRole('columnheader').map((h) => h.textContent)).toContain('Spread (bp, simple, ACT/360, on the overnight rate)');
    fireEvent.change(picker(), { target: { value: 'r1' } });
    expect(s().workspace.turns).toEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10, calendar: 'weekends', solveFromRow: 'r1' }]);
    // The core's own figure: the engine document with solveFrom 1, built with the kit.
    const solvedBuild = buildCurve({ ...ENGINE, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', solveFrom: 1, calendar: 'weekends' }] }, { overnight: OVERNIGHT_KIT });
    expect(solvedBuild.overnight!.turns[0]!.solveFrom).toBe(1);
    const core = turnSpreads(solvedBuild);
    const cell = document.querySelector('[data-turn-spread="year end 2022"]')!;
    expect(cell.textContent).toBe(`${formatBp(core[0]!.spreadBp)} (solved)`);
    expect(cell.textContent).toBe('25.00 bp (solved)'); // the 25 bp the quotes were made with
    fireEvent.change(picker(), { target: { value: 'given' } });
    expect(s().workspace.turns).toEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10, calendar: 'weekends' }]);
    act(() => s().undo());
    expect(s().workspace.turns![0]!.solveFromRow).toBe('r1');
  });

  it('the turn follows its row when a row is added above it', () => {
    render(<Live />);
    fireEvent.change(picker(), { target: { value: 'r1' } });
    act(() => {
      s().addRow(null);
    });
    // A new empty row at the end, then the rows moved: the engine document still names the 1M deposit.
    const conversion = toEngineDocument(s().workspace);
    expect((conversion.doc.turns as { solveFrom: number }[])[0]!.solveFrom).toBe(1);
    const moved: WorkbenchDocument = { ...s().workspace, quotes: [s().workspace.quotes[3]!, ...s().workspace.quotes.slice(0, 3)] };
    expect((toEngineDocument(moved).doc.turns as { solveFrom: number }[])[0]!.solveFrom).toBe(1); // the blank row gives no quote
    const filled: WorkbenchDocument = { ...moved, quotes: [{ ...moved.quotes[0]!, kind: 'deposit', maturity: '2022-12-20', rate: '0.039' }, ...moved.quotes.slice(1)] };
    expect((toEngineDocument(filled).doc.turns as { solveFrom: number }[])[0]!.solveFrom).toBe(2);
  });

  it('a row whose period does not hold the turn: the section says no curve, naming the turn and the row; nothing typed is lost', () => {
    render(<Live />);
    fireEvent.change(picker(), { target: { value: 'r0' } });
    expect(screen.getByRole('alert')).toHaveTextContent('No curve: turn "year end 2022" (turns[0]) solved from row 1 (deposit 2022-12-22): its period does not hold every day of the turn, 2022-12-30 to 2023-01-02');
    expect(document.querySelector('[data-turn-spread="year end 2022"]')!.textContent).toBe('no curve');
    expect(s().workspace.turns).toHaveLength(1);
    expect(s().workspace.quotes).toHaveLength(3);
  });

  it('a solved turn whose row is deleted: an error naming the turn, the turn kept', () => {
    render(<Live />);
    fireEvent.change(picker(), { target: { value: 'r1' } });
    act(() => s().deleteRow('r1'));
    expect(screen.getByRole('alert')).toHaveTextContent('No curve: turn "year end 2022" (turns[0]) is solved from quotes[null], no quote of the curve (past the list, left out, or a row empty or removed)');
    expect(s().workspace.turns![0]!.solveFromRow).toBe('r1');
    expect(within(picker()).getByRole('option', { name: 'a removed row' })).toBeTruthy();
  });

  it('round trip: the saved entry, a link and a workspace file keep the solved turn unchanged; the engine file names the quote by position', async () => {
    act(() => s().setTurns([{ ...s().workspace.turns![0]!, solveFromRow: 'r1' }]));
    const doc = s().workspace as unknown as Record<string, unknown>;
    const saved = readWorkbenchDocument(JSON.parse(JSON.stringify(doc)), () => 'new');
    expect(saved.doc!.turns).toEqual(s().workspace.turns);
    const linked = await decodeWorkspaceLink(await encodeWorkspaceLink(doc));
    expect(linked.ok && linked.checked.document).toEqual(doc);
    const file = parseDocumentText(serialiseDocument(doc));
    expect(file.ok && file.value.document).toEqual(doc);
    const engine = toEngineDocument(s().workspace).doc;
    expect(engine.turns).toEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends', solveFrom: 1 }]);
    let n = 0;
    const back = workbenchFromEngine(engine, () => `b${n++}`);
    expect(back.ok && back.value.turns).toStrictEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends', solveFromRow: 'b1' }]);
    // An engine file naming a position past its quotes opens with the turn kept (nothing lost); its row is none, which the build refuses naming the turn.
    const { spreadBp: _s, ...turn } = ENGINE.turns[0]!;
    const past = workbenchFromEngine({ ...ENGINE, turns: [{ ...turn, solveFrom: 7 }] }, () => `p${n++}`);
    expect(past.ok && past.value.turns).toStrictEqual([{ ...turn, solveFromRow: '' }]);
    const pastBuild = buildCurve(toEngineDocument(past.ok ? past.value : s().workspace).doc, { overnight: OVERNIGHT_KIT });
    expect(pastBuild.errors[0]!.path).toBe('turns[0].solveFrom');
  });

  it("the solved spread opens its explanation by keyboard, ending in the table's figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    render(<Live />);
    fireEvent.change(picker(), { target: { value: 'r1' } });
    const solvedBuild = buildCurve({ ...ENGINE, turns: [{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', solveFrom: 1, calendar: 'weekends' }] }, { overnight: OVERNIGHT_KIT });
    const figure = turnSpreads(solvedBuild)[0]!.spreadBp;
    const button = screen.getByRole('button', { name: /explain the spread of the turn year end 2022$/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Spread of the turn year end 2022, solved from row 2/ });
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`spread = s x 10,000 bp = ${fullText(figure)} (bp, simple ACT/360, added to each day\u2019s overnight rate)`);
    expect(steps.some((x) => x!.startsWith('g0 = model - market'))).toBe(true);
    await user.keyboard('{Escape}');
    expect(button).toHaveFocus();
  });
  it('a read-only workspace: the solved spread still opens its explanation; choosing the row, removing and adding turns are locked', async () => {
    const user = userEvent.setup({ delay: null });
    render(<Live />);
    fireEvent.change(picker(), { target: { value: 'r1' } });
    act(() => s().openReadOnly(s().workspace, [], 'link'));
    expect(picker()).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Remove the turn year end 2022' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Add these turns' })).toBeDisabled();
    const button = screen.getByRole('button', { name: /explain the spread of the turn year end 2022$/ });
    expect(button).not.toBeDisabled();
    await user.click(button);
    await screen.findByRole('complementary', { name: /Spread of the turn year end 2022, solved from row 2/ });
    act(() => s().closeReadOnly());
    expect(picker()).not.toBeDisabled();
  });
});
