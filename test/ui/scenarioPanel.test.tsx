// @vitest-environment jsdom
// The scenario panel: adding scenarios through the form, the table of changes, errors as text.
import fixtureJson from '../fixtures/share/workspace40.json';
import { useState } from 'react';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { buildCurve } from '../../src/core/index.ts';
import type { Scenario } from '../../src/core/index.ts';
import { ScenarioPanel } from '../../src/features/scenarios/ScenarioPanel.tsx';

const fixture = fixtureJson as unknown as Record<string, unknown>;
const build = buildCurve(fixture);
const conventions = { zeroCompounding: 'continuous', zeroDayCount: 'ACT/365F', forwardTenor: '3M', forwardCompounding: 'simple', forwardDayCount: 'ACT/360' } as const;

function Harness({ initial, onChange }: { initial: unknown; onChange?: (s: Scenario[]) => void }) {
  const [value, setValue] = useState<unknown>(initial);
  return (
    <ScenarioPanel
      value={value}
      onChange={(next) => {
        setValue(next);
        onChange?.(next);
      }}
      workspace={build.workspace}
      base={build.curve}
      conventions={conventions}
      tenors={['2Y', '5Y', '10Y']}
    />
  );
}

describe('ScenarioPanel', () => {
  it('adds a parallel scenario and shows +25.00 bp zero changes at every key maturity', async () => {
    const user = userEvent.setup({ delay: null });
    const changes: Scenario[][] = [];
    render(<Harness initial={undefined} onChange={(s) => changes.push(s)} />);
    await user.type(screen.getByLabelText('Name'), 'Up 25');
    await user.click(screen.getByRole('button', { name: 'Add scenario' }));
    expect(changes.at(-1)).toEqual([{ id: 's1', name: 'Up 25', space: 'zero', shape: { kind: 'parallel', bp: 25 } }]);
    const table = screen.getByRole('table', { name: 'Scenario changes at key maturities' });
    for (const t of ['2Y', '5Y', '10Y']) expect(within(table).getByText((_, el) => el?.getAttribute('data-cell') === `s1:${t}:zero`).textContent).toBe('+25.00 bp');
    expect(table.textContent).toContain('zero cont, ACT/365F; forward 3M simple, ACT/360');
    expect(screen.getByRole('img', { name: /Up 25: shift in bp/ })).toBeInTheDocument();
  });

  it('adds a steepener in quote space with a fresh id and its pivot on the chart', async () => {
    const user = userEvent.setup({ delay: null });
    const changes: Scenario[][] = [];
    render(<Harness initial={[{ id: 's1', name: 'A', space: 'zero', shape: { kind: 'parallel', bp: 1 } }]} onChange={(s) => changes.push(s)} />);
    await user.selectOptions(screen.getByLabelText('Shape'), 'twist');
    await user.selectOptions(screen.getByLabelText('Moves'), 'quotes');
    const spread = screen.getByLabelText('Spread change (bp)');
    await user.clear(spread);
    await user.type(spread, '-20');
    await user.click(screen.getByRole('button', { name: 'Add scenario' }));
    expect(changes.at(-1)?.[1]).toEqual({ id: 's2', name: 'Scenario', space: 'quotes', shape: { kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: -20 } });
    expect(screen.getByText(/flattener 2Y–10Y spread −20 bp, pivot 5Y; moves the quotes, re-bootstrapped/)).toBeInTheDocument();
  });

  it('says what is wrong with a typed shift instead of adding it', async () => {
    const user = userEvent.setup({ delay: null });
    const changes: Scenario[][] = [];
    render(<Harness initial={[]} onChange={(s) => changes.push(s)} />);
    const bp = screen.getByLabelText('Shift (bp)');
    await user.clear(bp);
    await user.type(bp, 'ten');
    await user.click(screen.getByRole('button', { name: 'Add scenario' }));
    expect(changes).toEqual([]);
    expect(screen.getByRole('alert').textContent).toContain('must be a number of basis points');
  });

  it('shows saved scenarios it cannot read as a message, as text only', () => {
    render(<Harness initial={[{ id: 'x', name: '<img src=x onerror=alert(1)>', space: 'zero', shape: { kind: 'parallel', bp: 1 } }, { id: 'y', name: 'bad', space: 'moon', shape: { kind: 'parallel', bp: 1 } }]} />);
    expect(screen.getByRole('alert').textContent).toContain('scenarios[1].space');
    expect(document.querySelector('img')).toBeNull();
    expect(screen.getAllByText('<img src=x onerror=alert(1)>').length).toBeGreaterThan(0);
  });

  it('removes a scenario', async () => {
    const user = userEvent.setup({ delay: null });
    const changes: Scenario[][] = [];
    render(<Harness initial={[{ id: 's1', name: 'A', space: 'zero', shape: { kind: 'parallel', bp: 1 } }]} onChange={(s) => changes.push(s)} />);
    await user.click(screen.getByRole('button', { name: 'Remove scenario A' }));
    expect(changes.at(-1)).toEqual([]);
  });
});
