// @vitest-environment jsdom
// The Overnight curve section: effective dates pasted as a list (lines not taken named by number),
// the steps switch, turns added as lines, the meeting-step table and the overnight forward chart.
// Every figure shown must be the core's own (meetingStepTable, overnightForwardView).
// Sources: SOFR's 2022-2023 effective dates (MARKET-CONVENTIONS.md section h: SOFR stepped on
// 2022-03-17, 2022-11-03, 2022-12-15, 2023-07-27). The sheet's OIS rows carry the default
// calendar (weekends only), which the turns then read. The quotes are invented (test/helpers/markets.ts).
import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { OvernightTab } from '../../src/features/overnight/OvernightTab.tsx';
import { useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { useAppStore } from '../../src/state/store.ts';
import { formatBpChange, meetingStepTable } from '../../src/core/index.ts';
import { INVENTED_2022_OVERNIGHT } from '../helpers/markets.ts';
import { openEngineDocument } from '../helpers/engineWorkspace.ts';

const s = () => useAppStore.getState();
const ENGINE = INVENTED_2022_OVERNIGHT;

function Live() {
  const result = useCurveBuild();
  return <OvernightTab result={result} />;
}

// The code of turns and steps is fetched on first use in the app; here it is loaded before the tests.
beforeAll(() => loadOvernightKit());

beforeEach(() => {
  useAppStore.setState(useAppStore.getInitialState(), true);
  openEngineDocument(ENGINE);
});

describe('OvernightTab', () => {
  it('saves pasted effective dates, names a line not taken, and steps the curve when switched on: the table is the core\'s', () => {
    render(<Live />);
    fireEvent.click(screen.getByText('Add effective dates'));
    fireEvent.change(screen.getByLabelText(/Effective dates, one per line/), { target: { value: '2022-03-17\n2022-11-03\nsoon\n2022-12-15\n2023-07-27' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save these dates' }));
    expect(s().workspace.meetingSteps).toEqual({ on: false, effectiveDates: ['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27'] });
    expect(screen.getByRole('status')).toHaveTextContent('Saved 4 effective dates; not taken: line 3 (soon)');
    expect(screen.queryByRole('table', { name: 'Implied step at each meeting' })).toBeNull();
    fireEvent.click(screen.getByRole('checkbox', { name: /Step the overnight curve/ }));
    const table = screen.getByRole('table', { name: 'Implied step at each meeting' });
    expect(within(table).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Effective date', 'Level before, % (simple, ACT/360)', 'Level after, % (simple, ACT/360)', 'Step (bp)']);
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => r.firstChild!.textContent)).toEqual(['2022-03-17', '2022-11-03', '2022-12-15', '2023-07-27']);
    const { build } = useCurveBuildOnce();
    const core = meetingStepTable(build);
    rows.forEach((r, i) => expect(r.lastChild!.textContent).toBe(formatBpChange(core[i]!.stepBp)));
    expect(document.querySelectorAll('[data-meeting]')).toHaveLength(4);
    act(() => s().undo());
    expect(s().workspace.meetingSteps?.on).toBe(false);
  });

  it('adds turns from lines, shades them on the chart, names a bad line, and Remove is undoable', () => {
    render(<Live />);
    fireEvent.change(screen.getByLabelText(/One turn per line/), { target: { value: '2022-12-30, 2022-12-30, 10, year end 2022\n2022-06-30; June 31; 5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add these turns' }));
    expect(s().workspace.turns).toEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: 10 }]);
    expect(screen.getByRole('status')).toHaveTextContent(/Added 1 turn; not taken: line 2 \(2022-06-30; June 31; 5\): the last day "June 31" is not a date/);
    expect(document.querySelector('[data-turn="year end 2022"]')).not.toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Remove the turn year end 2022' }));
    expect(s().workspace.turns).toBeUndefined();
    act(() => s().undo());
    expect(s().workspace.turns).toHaveLength(1);
  });

  it('a turn over days with no business day shows the engine\'s error naming it, and nothing typed is lost', () => {
    render(<Live />);
    fireEvent.change(screen.getByLabelText(/One turn per line/), { target: { value: '2022-12-31, 2023-01-01, 5, new year weekend' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add these turns' }));
    expect(screen.getByRole('alert')).toHaveTextContent('turn "new year weekend" (turns[0], 2022-12-31 to 2023-01-01): it holds no business day of the calendar weekends');
    expect(s().workspace.turns).toHaveLength(1);
    expect(s().workspace.quotes).toHaveLength(6);
  });

  it('two quotes in one meeting period: the section says no curve and names both rows and the period', () => {
    render(<Live />);
    act(() => s().setMeetingSteps({ on: true, effectiveDates: ['2022-03-17', '2022-12-15', '2023-07-27'] }));
    // 2022-06-01 and 2022-12-01 both end between 2022-03-17 and 2022-12-15 (rows 2 and 3).
    expect(screen.getByRole('alert')).toHaveTextContent('No curve: row 2 (deposit 2022-06-01) and row 3 (deposit 2022-12-01) both end in the meeting period from 2022-03-17 to 2022-12-15');
  });
});

/** The build the tab was given, read the way the workbench reads it (outside React, same memo). */
function useCurveBuildOnce() {
  let out: ReturnType<typeof useCurveBuild> | null = null;
  function Probe() {
    out = useCurveBuild();
    return null;
  }
  render(<Probe />);
  return out!;
}
