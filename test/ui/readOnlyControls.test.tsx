// @vitest-environment jsdom
// A workspace open read-only (settings this build does not know) refuses every edit in the store;
// its controls must say so too: every control that would change the workspace (roll inputs,
// scenarios, snapshots, comparison choices, the forward calculator and grid axes, the curve table's
// grid, the print title and the note) is disabled, while exports stay usable, and all come back
// when the read-only document is closed. Invented data (the demo workspace).
import { act, render, screen, within } from '@testing-library/react';
import type { ReactNode } from 'react';
import { ComparisonControls } from '../../src/features/compare/ComparisonControls.tsx';
import { PrintTab } from '../../src/features/print/PrintTab.tsx';
import { RollSlot } from '../../src/features/roll/RollSlot.tsx';
import { ScenariosTab } from '../../src/features/scenarios/ScenariosTab.tsx';
import { SnapshotsTab } from '../../src/features/snapshots/SnapshotsTab.tsx';
import { CurveTableExport } from '../../src/features/tables/CurveTableExport.tsx';
import { ForwardCalculator } from '../../src/features/tables/ForwardCalculator.tsx';
import { ForwardGridTable } from '../../src/features/tables/ForwardGridTable.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { takeSnapshot } from '../../src/core/index.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
});

function Panels(): ReactNode {
  const ws = useAppStore((s) => s.workspace);
  const result = deriveBuild(ws);
  const curve = result.build.curve!;
  return (
    <>
      <div data-testid="roll"><RollSlot result={result} /></div>
      <div data-testid="scenarios"><ScenariosTab result={result} /></div>
      <div data-testid="snapshots"><SnapshotsTab result={result} /></div>
      <div data-testid="compare"><ComparisonControls drawn={0} /></div>
      <div data-testid="calculator"><ForwardCalculator curve={curve} result={result} /></div>
      <div data-testid="grid"><ForwardGridTable curve={curve} workspace={result.build.workspace} /></div>
      <div data-testid="table"><CurveTableExport curve={curve} /></div>
      <div data-testid="print"><PrintTab result={result} /></div>
    </>
  );
}

/**
 * The editing controls of one panel: inputs, selects, text areas and buttons, less exports and
 * print, less the reference curve's import (kept in the page only, never in the workspace), and
 * less the figures that open their explanation (reading; checked below to stay usable).
 */
function editingControls(testId: string): HTMLElement[] {
  const box = screen.getByTestId(testId);
  return [...box.querySelectorAll<HTMLElement>('input, select, textarea, button')].filter((el) => !/Export|Print|CSV/i.test(el.textContent ?? '') && !el.closest('.reference-panel') && !el.matches('button.cell-explain'));
}

describe('controls of a read-only workspace', () => {
  it('every control that changes the workspace is disabled while read-only, exports stay usable, and all come back on close', () => {
    render(<Panels />);
    const panels = ['roll', 'scenarios', 'snapshots', 'compare', 'calculator', 'grid', 'table', 'print'];
    const counts = panels.map((p) => editingControls(p).length);
    expect(counts.every((n) => n > 0), `editing controls per panel: ${counts.join(', ')}`).toBe(true);
    act(() => useAppStore.getState().openReadOnly(useAppStore.getState().workspace, [{ path: 'display.theme', value: '"dusk"', supported: [] } as never], 'link'));
    for (const p of panels) {
      const enabled = editingControls(p).filter((el) => !(el as HTMLInputElement).disabled && !el.matches(':disabled'));
      expect(enabled.map((el) => `${p}: ${el.outerHTML.slice(0, 80)}`)).toEqual([]);
    }
    // Exports are reading, not editing: they stay usable.
    expect(within(screen.getByTestId('roll')).getByRole('button', { name: /Export these tables/ })).not.toBeDisabled();
    expect(within(screen.getByTestId('table')).getByRole('button', { name: /Export this table/ })).not.toBeDisabled();
    // So are the figures that explain themselves (the roll panel's results, break-evens and legs).
    const explainers = [...screen.getByTestId('roll').querySelectorAll<HTMLButtonElement>('button.cell-explain')];
    expect(explainers.length).toBeGreaterThan(20);
    expect(explainers.filter((el) => el.matches(':disabled')).map((el) => el.getAttribute('aria-label'))).toEqual([]);
    // So are the print preview's numbers that open their explanation.
    const printed = screen.getByTestId('print').querySelectorAll('button.cell-explain');
    expect(printed.length).toBeGreaterThan(0);
    for (const b of printed) expect(b).not.toBeDisabled();
    act(() => useAppStore.getState().closeReadOnly());
    for (const p of panels) expect(editingControls(p).some((el) => !el.matches(':disabled')), p).toBe(true);
  }, 30_000); // a limit for a hung render on a loaded machine, not a speed check
  it('with a scenario and a snapshot: their editing controls are locked while read-only, and every figure that explains itself stays usable', () => {
    const ws = useAppStore.getState().workspace;
    act(() => useAppStore.getState().setReserved('scenarios', [{ id: 'a', name: 'Up 5', space: 'quotes', shape: { kind: 'parallel', bp: 5 } }]));
    act(() => useAppStore.getState().setReserved('snapshots', [takeSnapshot(deriveBuild(ws).conversion.doc as unknown as Record<string, unknown>, 'Close', '2026-11-01T12:00:00Z')]));
    render(<Panels />);
    const explainersIn = (p: string) => [...screen.getByTestId(p).querySelectorAll<HTMLButtonElement>('button.cell-explain')];
    for (const p of ['scenarios', 'snapshots', 'calculator']) expect(explainersIn(p).length, p).toBeGreaterThan(0);
    act(() => useAppStore.getState().openReadOnly(useAppStore.getState().workspace, [], 'link'));
    for (const p of ['scenarios', 'snapshots', 'calculator']) {
      expect(editingControls(p).filter((el) => !el.matches(':disabled')).map((el) => `${p}: ${el.outerHTML.slice(0, 80)}`)).toEqual([]);
      expect(explainersIn(p).filter((el) => el.matches(':disabled')).map((el) => el.getAttribute('aria-label'))).toEqual([]);
    }
    expect(screen.getByRole('button', { name: 'Remove scenario Up 5' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Remove snapshot Close' })).toBeDisabled();
  }, 30_000); // a limit for a hung render on a loaded machine, not a speed check
});
