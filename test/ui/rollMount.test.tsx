// @vitest-environment jsdom
// The mount described for the workbench owner: RollSlot set as EXTENSIONS.rollPanel (done here at
// run time, as src/app/extensions.tsx would), inside the real App and store. The panel's inputs
// land in the document's `strategy` key, undo takes them back, and the document's scenarios
// appear as views.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { EXTENSIONS } from '../../src/app/extensions.tsx';
import { RollResultLine, RollSlot } from '../../src/features/roll/RollSlot.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
const extensions = EXTENSIONS as { rollPanel: unknown };
let before: unknown;

beforeAll(() => {
  before = extensions.rollPanel;
  extensions.rollPanel = RollSlot;
});
afterAll(() => {
  extensions.rollPanel = before;
});
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

const rollRegion = () => screen.getAllByRole('region', { name: /Roll versus term/ }).find((r) => r.classList.contains('roll-panel'))!;

describe('roll panel mounted in the workbench', () => {
  it('shows the comparison on the demo curve and writes its inputs to the document, undoably', async () => {
    const user = userEvent.setup();
    render(<App />);
    const region = rollRegion();
    expect(within(region).getByText(/^Under an unchanged curve, /)).toBeInTheDocument();
    const horizon = within(region).getByRole('textbox', { name: /Horizon/ });
    await user.clear(horizon);
    await user.type(horizon, '3Y{Enter}');
    expect((useAppStore.getState().workspace as { strategy?: { horizon: string } }).strategy?.horizon).toBe('3Y');
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect((useAppStore.getState().workspace as { strategy?: unknown }).strategy).toBeUndefined();
    expect(within(rollRegion()).getByRole('textbox', { name: /Horizon/ })).toHaveValue('2Y');
  }, 30_000); // a limit for a hung render of the whole workbench on a loaded machine, not a speed check

  it("offers the document's scenarios as views", async () => {
    render(<App />);
    useAppStore.getState().setReserved('scenarios', [{ id: 's1', name: 'Up 50', space: 'zero', shape: { kind: 'parallel', bp: 50 } }]);
    const select = await within(rollRegion()).findByRole('combobox', { name: /Chosen view/ });
    expect(within(select).getAllByRole('option').map((o) => o.textContent)).toEqual(expect.arrayContaining(['Scenario: Up 50', 'Scenario: Up 50, its forwards']));
  });

  it('reports a saved strategy it cannot read, and uses the defaults meanwhile', () => {
    useAppStore.getState().setReserved('strategy', { horizon: 'soon', rollTenor: '3M' });
    render(<App />);
    const problems = within(rollRegion()).getByRole('alert', { name: /Problems in the saved strategy/ });
    expect(problems).toHaveTextContent(/^Horizon: must be a tenor such as "2Y"/);
    expect(problems).not.toHaveTextContent(/strategy\./);
    expect(within(rollRegion()).getByText(/^Under an unchanged curve, /)).toBeInTheDocument();
  });

  it('gives the printed summary the same result sentence as the panel', () => {
    const result = deriveBuild(useAppStore.getState().workspace);
    const { container } = render(<RollResultLine result={result} />);
    const line = container.querySelector('.roll-result-line')!;
    expect(line.textContent).toMatch(/^Under an unchanged curve, .* \(simple, ACT\/360\)\.$/);
    render(<App />);
    expect(rollRegion().querySelector('.roll-sentence')!.textContent).toBe(line.textContent);
  });
});
