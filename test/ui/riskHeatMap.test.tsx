// @vitest-environment jsdom
// The forward-sensitivity heat map: rows forwards, columns quotes, the unit stated, the cells the
// core's values, and the interpolation selectable (log-linear keeps a short quote's influence local).
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import axe from 'axe-core';
import { sensitivityMapFor, validateWorkspace } from '../../src/core/index.ts';
import { SensitivityHeatMap } from '../../src/features/risk/SensitivityHeatMap.tsx';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';

// Invented demo market.
const { depo3M, zero1YRate, swap2Y, swap5Y, swap10Y } = INVENTED_2027; // test/helpers/markets.ts
const ws = validateWorkspace(workspaceDoc([depo3M, zero1YRate, swap2Y, swap5Y, swap10Y], { interpolation: 'cubic-zero' })).workspace!;

describe('SensitivityHeatMap', () => {
  it('shows forwards by quotes in bp per bp, and a log-linear curve keeps the 10Y quote out of the 1Y forward', async () => {
    const user = userEvent.setup();
    render(<SensitivityHeatMap workspace={ws} />);
    const table = screen.getByRole('table', { name: 'Forward sensitivities' });
    expect(table).toHaveTextContent('bp of forward per bp of quote');
    expect(table).toHaveTextContent('simple, ACT/365F');
    // The map is of the curve shown, turns and meeting steps included (test/ui/riskTurnsAndSteps.test.tsx): said on screen.
    expect(screen.getByText(/computed from the bootstrap, turns and meeting steps included/)).toBeTruthy();
    const rows = within(table).getAllByRole('row');
    expect(rows.length).toBe(1 + 10); // 3M forwards starting 0Y..9Y end by the 10Y pillar
    const cell = () => within(table).getByLabelText(/^2028-03-10 forward to row 5:/);
    // Cubic zero is global: the 10Y quote reaches the first forward (a small amount, checked in the
    // core's value); log-linear keeps it at exactly zero.
    const cubic = sensitivityMapFor(ws, { interpolation: 'cubic-zero' });
    if (!cubic.ok) throw new Error('map');
    expect(Math.abs(cubic.value.map.values[1 * 5 + 4]!)).toBeGreaterThan(1e-6);
    expect(cell()).toHaveAttribute('aria-label', expect.stringMatching(/bp per bp$/));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Interpolation' }), 'log-linear-discount');
    expect(cell()).toHaveTextContent('0.00');
    const loglinear = sensitivityMapFor(ws, { interpolation: 'log-linear-discount' });
    if (!loglinear.ok) throw new Error('map');
    expect(loglinear.value.map.values[1 * 5 + 4]).toBe(0);
  });
  it('lists a forward tenor too long for the curve as an error a user can act on', async () => {
    const user = userEvent.setup();
    const short = validateWorkspace({ format: 'tenorscope-workspace', version: 1, settlement: '2027-03-10', quotes: [{ kind: 'deposit', tenor: '6M', rate: 0.0287 }] }).workspace!;
    render(<SensitivityHeatMap workspace={short} />);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Forward tenor' }), '1Y');
    expect(screen.getByRole('alert')).toHaveTextContent(/choose a shorter tenor/);
  });
  it('has no accessibility violations found by axe-core (WCAG 2 A and AA rules; colour contrast needs a real renderer)', async () => {
    const { container } = render(<SensitivityHeatMap workspace={ws} />);
    const result = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.map((v) => `${v.id}: ${v.nodes.length} nodes, e.g. ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
});
