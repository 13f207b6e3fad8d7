// @vitest-environment jsdom
// The mount described for the workbench owner: the scenario, snapshot and print sections added to
// EXTENSIONS.tabs (done here at run time, as src/app/extensions.tsx would list them) work inside
// the real App and store: a scenario added in its tab lands in the document's `scenarios` key.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { EXTENSIONS } from '../../src/app/extensions.tsx';
import { PrintTab } from '../../src/features/print/PrintTab.tsx';
import { ScenariosTab } from '../../src/features/scenarios/ScenariosTab.tsx';
import { SnapshotsTab } from '../../src/features/snapshots/SnapshotsTab.tsx';
import { useAppStore } from '../../src/state/store.ts';
import { useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { SCENARIO_STYLES } from '../../src/charts/palette.ts';
import { useScenarioOverlay } from '../../src/features/scenarios/useScenarioOverlay.ts';
import { act } from '@testing-library/react';

const initial = useAppStore.getInitialState();
const tabs = EXTENSIONS.tabs as unknown as { id: string; label: string; render: (p: { result: never }) => unknown }[];

beforeAll(() => {
  tabs.push(
    { id: 'scenarios', label: 'Scenarios', render: (p) => <ScenariosTab {...p} /> },
    { id: 'snapshots', label: 'Snapshots', render: (p) => <SnapshotsTab {...p} /> },
    { id: 'print', label: 'Print', render: (p) => <PrintTab {...p} /> },
  );
});
afterAll(() => {
  tabs.splice(tabs.length - 3, 3);
});
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

// Limit for a hung render, not a speed check: the full App renders slowly under a parallel suite.
describe('scenario, snapshot and print tabs mounted in the workbench', { timeout: 30_000 }, () => {
  it('adds a scenario into the document and shows its changes', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Scenarios' }));
    await user.type(screen.getByLabelText('Name'), 'Up 10');
    await user.clear(screen.getByLabelText('Shift (bp)'));
    await user.type(screen.getByLabelText('Shift (bp)'), '10');
    await user.click(screen.getByRole('button', { name: 'Add scenario' }));
    expect(useAppStore.getState().workspace.scenarios).toEqual([{ id: 's1', name: 'Up 10', space: 'zero', shape: { kind: 'parallel', bp: 10 } }]);
    const table = screen.getByRole('table', { name: 'Scenario changes at key maturities' });
    expect(within(table).getByText((_, el) => el?.getAttribute('data-cell') === 's1:5Y:zero').textContent).toBe('+10.00 bp');
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(useAppStore.getState().workspace.scenarios).toBeUndefined();
  });

  it('takes a snapshot that rebuilds the same and differs by 0 bp', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Snapshots' }));
    await user.type(screen.getByLabelText('Snapshot name'), 'Close');
    await user.click(screen.getByRole('button', { name: 'Take snapshot' }));
    const snaps = useAppStore.getState().workspace.snapshots as { name: string; curveHash: string }[];
    expect(snaps.map((s) => s.name)).toEqual(['Close']);
    expect(screen.getByText(/rebuilds the same \(hash [0-9a-f]{12}\)/)).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Current curve against the snapshot' });
    expect(within(table).getAllByText('0.00 bp').length).toBeGreaterThan(3);
  });

  it('previews the printed summary with the caution and the build id', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Print' }));
    // The on-screen preview and the print root (hidden on screen by the print CSS, which jsdom does not apply).
    const pages = screen.getAllByRole('article', { name: 'Printed summary' });
    expect(pages).toHaveLength(2);
    const page = pages[0]!;
    expect(page.textContent).toContain('not investment advice');
    expect(page.textContent).toContain('Key maturities');
    expect(screen.getByRole('button', { name: 'Print summary' })).toBeInTheDocument();
  });

  it('useScenarioOverlay gives one dashed line per scenario for each chart, labelled with its name', () => {
    function Probe() {
      const o = useScenarioOverlay(useCurveBuild());
      return <p data-testid="overlay">{o.zero.map((l) => `${l.label}|${l.dash}|${l.points.length > 10}`).join(';')}</p>;
    }
    render(<Probe />);
    expect(screen.getByTestId('overlay').textContent).toBe('');
    act(() => useAppStore.getState().setReserved('scenarios', [{ id: 'a', name: 'Up 5', space: 'quotes', shape: { kind: 'parallel', bp: 5 } }]));
    // Dashed in the first scenario style (its own colour and dash, src/charts/palette.ts).
    expect(SCENARIO_STYLES[0]!.dash).not.toBe('');
    expect(screen.getByTestId('overlay').textContent).toBe(`Up 5 (zero)|${SCENARIO_STYLES[0]!.dash}|true`);
  });

  it('useScenarioOverlay draws the first four scenarios and counts the rest as not drawn', () => {
    function Probe() {
      const o = useScenarioOverlay(useCurveBuild());
      return <p data-testid="overlay">{`${o.zero.length} drawn, ${o.notDrawn} not drawn; ${new Set(o.zero.map((l) => `${l.colour} ${l.dash}`)).size} styles`}</p>;
    }
    render(<Probe />);
    const five = [1, 2, 3, 4, 5].map((k) => ({ id: `s${k}`, name: `Up ${k}`, space: 'quotes', shape: { kind: 'parallel', bp: k } }));
    act(() => useAppStore.getState().setReserved('scenarios', five));
    expect(screen.getByTestId('overlay').textContent).toBe('4 drawn, 1 not drawn; 4 styles');
  });
});
