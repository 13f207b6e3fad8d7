// @vitest-environment jsdom
// The roll-versus-term panel: its accessible name, inputs that keep what is typed and commit only
// valid values, the result sentence with conventions, the tables and the growth chart. The
// figures themselves are the core's (tested in test/core/analysis); here the panel must show them.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import axe from 'axe-core';
import { useState } from 'react';
import type { Curve } from '../../src/core/index.ts';
import { analyseRollVsTerm, DEFAULT_STRATEGY, formatMoney, type StrategyInputs } from '../../src/core/index.ts';
import { RollPanel } from '../../src/features/roll/RollPanel.tsx';
import { useDrafts } from '../../src/state/drafts.ts';
import { rollMarketCurve } from '../helpers/rollMarket.ts';

// The invented roll test market (test/helpers/rollMarket.ts), all eight quotes.
const curve: Curve = rollMarketCurve();

const NONE: { name: string; curve: Curve }[] = [];

function Harness({ initial, onChange, withCurve = true, scenarios = NONE }: { initial: StrategyInputs; onChange?: (s: StrategyInputs) => void; withCurve?: boolean; scenarios?: { name: string; curve: Curve }[] }) {
  const [strategy, setStrategy] = useState(initial);
  return (
    <RollPanel
      curve={withCurve ? curve : null}
      strategy={strategy}
      scenarioViews={scenarios}
      onStrategyChange={(next) => {
        onChange?.(next);
        setStrategy(next);
      }}
    />
  );
}

// Text typed but not committed is kept across renders (and reloads) as a draft: each test starts without any.
beforeEach(() => useDrafts.setState({ drafts: {} }));

describe('RollPanel', () => {
  it('is a region named "Roll versus term" with the result sentence, conventions and the caution', () => {
    render(<Harness initial={DEFAULT_STRATEGY} />);
    const panel = screen.getByRole('region', { name: /Roll versus term/ });
    const sentence = within(panel).getByRole('status', { name: '' });
    expect(sentence).toHaveTextContent(/^Under an unchanged curve, riding the 5Y bond ends ahead at ¤ [\d,]+\.\d\d on 2028-12-01/);
    expect(sentence).toHaveTextContent(/ann, ACT\/365F/);
    expect(sentence).toHaveTextContent(/\(simple, ACT\/360\)/);
    expect(within(panel).getByRole('note')).toHaveTextContent(/not investment advice/);
  });

  it('shows the core\'s terminal values in the results table of strategies by views', () => {
    render(<Harness initial={DEFAULT_STRATEGY} />);
    const table = screen.getByRole('table', { name: /Strategies by views/ });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(5); // header + 4 strategies
    expect(within(rows[0]!).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Strategy', 'Forwards realised', 'Curve unchanged (chosen)', 'Your path', 'Forwards +100 bp']);
    const r = analyseRollVsTerm(curve, DEFAULT_STRATEGY);
    if (!r.ok) throw new Error('analysis');
    const unchangedRiding = r.value.views[1]!.strategies.find((s) => s.id === 'riding')!;
    expect(within(rows[4]!).getAllByRole('cell')[1]).toHaveTextContent(formatMoney(unchangedRiding.terminal));
    // under forwards every strategy shows the same money
    const forwardsCells = rows.slice(1).map((row) => within(row).getAllByRole('cell')[0]!.querySelector('.roll-value')!.textContent);
    expect(new Set(forwardsCells).size).toBe(1);
  });

  it('draws one line per strategy in the growth chart and a roll leg table row per leg', () => {
    render(<Harness initial={DEFAULT_STRATEGY} />);
    const chart = screen.getByRole('img', { name: /Growth of the amount to 2028-12-01 under Curve unchanged/ });
    expect(chart.querySelectorAll('path[data-strategy]')).toHaveLength(4);
    const legs = screen.getByRole('table', { name: /Roll legs of 3M/ });
    expect(within(legs).getAllByRole('row')).toHaveLength(1 + 8);
  });

  it('commits a valid horizon on Enter and recomputes', async () => {
    const user = userEvent.setup();
    const onChange = vi.fn();
    render(<Harness initial={DEFAULT_STRATEGY} onChange={onChange} />);
    const horizon = screen.getByRole('textbox', { name: /Horizon/ });
    await user.clear(horizon);
    await user.type(horizon, '3y{Enter}');
    expect(onChange).toHaveBeenCalledTimes(1);
    expect(onChange.mock.calls[0]![0].horizon).toBe('3Y');
    expect(screen.getByRole('table', { name: /Roll legs of 3M to 2029-12-01/ })).toBeInTheDocument();
  });

  it('keeps an invalid amount as typed, says what is valid, and does not commit it', async () => {
    const user = userEvent.setup();
    const onChange = vi.fn();
    render(<Harness initial={DEFAULT_STRATEGY} onChange={onChange} />);
    const amount = screen.getByRole('textbox', { name: /Amount/ });
    await user.clear(amount);
    await user.type(amount, '1,000,00');
    await user.tab();
    expect(onChange).not.toHaveBeenCalled();
    expect(amount).toHaveValue('1,000,00');
    expect(amount).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent(/a comma groups thousands in threes/);
  });

  it('turns a typed leg rate into a typed path under the "Your path" view', async () => {
    const user = userEvent.setup();
    const onChange = vi.fn();
    render(<Harness initial={{ ...DEFAULT_STRATEGY, view: 'path' }} onChange={onChange} />);
    const leg3 = screen.getByRole('textbox', { name: 'Leg 3 rate' });
    await user.clear(leg3);
    await user.type(leg3, '5.5{Enter}');
    const next = onChange.mock.calls[0]![0] as StrategyInputs;
    expect(next.path.fill).toBe('typed');
    expect(next.path.legs).toHaveLength(7);
    expect(next.path.legs[1]).toBe(0.055);
  });

  it('shows the forwards baseline as every strategy ending equal, and hides the shift break-even there', async () => {
    const user = userEvent.setup();
    render(<Harness initial={DEFAULT_STRATEGY} />);
    await user.selectOptions(screen.getByRole('combobox', { name: /Chosen view/ }), 'forwards');
    expect(screen.getByText(/every strategy ends at ¤/)).toBeInTheDocument();
    expect(screen.queryByRole('columnheader', { name: /Parallel shift of the view/ })).not.toBeInTheDocument();
  });

  it('says why there is no comparison when the horizon is beyond the curve, keeping the inputs', async () => {
    const user = userEvent.setup();
    render(<Harness initial={{ ...DEFAULT_STRATEGY, horizon: '12Y', ridingMaturity: '15Y' }} />);
    const alert = screen.getByRole('alert', { name: /Why there is no comparison/ });
    expect(alert).toHaveTextContent(/Horizon: .*beyond the curve's last pillar/);
    expect(screen.getByRole('textbox', { name: /Horizon/ })).toHaveValue('12Y');
    await user.clear(screen.getByRole('textbox', { name: /Horizon/ }));
    await user.type(screen.getByRole('textbox', { name: /Horizon/ }), '2Y{Enter}');
    await user.clear(screen.getByRole('textbox', { name: /Riding bond maturity/ }));
    await user.type(screen.getByRole('textbox', { name: /Riding bond maturity/ }), '7Y{Enter}');
    expect(screen.queryByRole('alert', { name: /Why there is no comparison/ })).not.toBeInTheDocument();
  });

  it('offers scenario curves as views, in both readings, and shows their columns', async () => {
    const user = userEvent.setup();
    render(<Harness initial={DEFAULT_STRATEGY} scenarios={[{ name: 'Same as today', curve }]} />);
    const select = screen.getByRole('combobox', { name: /Chosen view/ });
    expect(within(select).getAllByRole('option').map((o) => o.textContent)).toContain('Scenario: Same as today, its forwards');
    const table = screen.getByRole('table', { name: /Strategies by views/ });
    expect(within(table).getByRole('columnheader', { name: /^Same as today$/ })).toBeInTheDocument();
    expect(within(table).getByRole('columnheader', { name: /Same as today \(its forwards\)/ })).toBeInTheDocument();
    await user.selectOptions(select, 'scenario-fwd:Same as today');
    expect(screen.getByText(/every strategy ends at ¤/)).toBeInTheDocument();
  });

  it('keeps its inputs and says so when there is no curve', () => {
    render(<Harness initial={DEFAULT_STRATEGY} withCurve={false} />);
    expect(screen.getByText(/No curve yet/)).toBeInTheDocument();
    expect(screen.getByRole('textbox', { name: /Amount/ })).toHaveValue('1000000');
  });

  it('has no accessibility violations found by axe-core (WCAG 2 A and AA rules; colour contrast needs a real renderer)', async () => {
    const { container } = render(<Harness initial={{ ...DEFAULT_STRATEGY, view: 'path' }} />);
    const result = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.map((v) => `${v.id}: ${v.nodes.length} nodes, e.g. ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
});

describe('RollField drafts', () => {
  it('an amount typed without Enter or Tab is there again after the panel is mounted afresh (a reload), marked as not applied', async () => {
    const user = userEvent.setup();
    const onChange = vi.fn();
    const first = render(<Harness initial={DEFAULT_STRATEGY} onChange={onChange} />);
    const amount = screen.getByRole('textbox', { name: /Amount/ });
    await user.clear(amount);
    await user.type(amount, '2500000');
    expect(onChange).not.toHaveBeenCalled();
    first.unmount();
    render(<Harness initial={DEFAULT_STRATEGY} onChange={onChange} />);
    expect(screen.getByRole('textbox', { name: /Amount/ })).toHaveValue('2500000');
    expect(screen.getByText(/typed, not applied yet: press Enter to apply/)).toBeInTheDocument();
    await user.type(screen.getByRole('textbox', { name: /Amount/ }), '{Enter}');
    expect(onChange).toHaveBeenCalledTimes(1);
    expect(useDrafts.getState().drafts).toEqual({});
  });
});
