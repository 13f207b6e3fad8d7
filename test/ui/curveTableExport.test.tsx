// @vitest-environment jsdom
// The curve table export on a chosen grid: the CSV written is the core's curveTableCsv on the
// core's grid (tested in test/core/export/csv.test.ts), the file name carries the settlement date
// and the grid, and a wrong point blocks the export with a message instead of being dropped.
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { curveTableCsv, curveTablePoints } from '../../src/core/index.ts';
import { tableConventionsFromDisplay } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
let saved: { name: string; text: Promise<string> }[] = [];
beforeEach(() => {
  useAppStore.setState(initial, true);
  localStorage.clear();
  saved = [];
  let blob: Blob | null = null;
  URL.createObjectURL = (b: Blob) => {
    blob = b;
    return 'blob:test';
  };
  URL.revokeObjectURL = () => {};
  HTMLAnchorElement.prototype.click = function (this: HTMLAnchorElement) {
    saved.push({ name: this.download, text: blob!.text() });
  };
});

describe('Curve table export', { timeout: 30_000 }, () => {
  it('writes the yearly grid with the settlement date and grid in the file name', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Export grid' }), 'yearly');
    await user.click(screen.getByRole('button', { name: 'Export this table on the grid (CSV)' }));
    const doc = useAppStore.getState().workspace;
    const curve = deriveBuild(doc).build.curve!;
    expect(saved[0]!.name).toBe(`tenorscope-curve-${doc.settlement}-yearly.csv`);
    expect(await saved[0]!.text).toBe(curveTableCsv(curve, tableConventionsFromDisplay(doc.display), curveTablePoints(curve, 'yearly')));
    expect((doc.view as Record<string, unknown>).curveTableGrid).toBe('yearly');
  });

  it('blocks the export of the user\'s points while one is wrong, saying which', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Export grid' }), 'dates');
    const points = screen.getByRole('textbox', { name: /Points/ });
    await user.clear(points);
    await user.type(points, '2Y, soon');
    expect(screen.getByRole('alert')).toHaveTextContent('"soon" is neither a tenor such as 5Y nor a date YYYY-MM-DD.');
    expect(screen.getByRole('button', { name: 'Export this table on the grid (CSV)' })).toBeDisabled();
    await user.clear(points);
    await user.type(points, '2y 2031-06-30');
    await user.click(screen.getByRole('button', { name: 'Export this table on the grid (CSV)' }));
    const text = await saved[0]!.text;
    expect(text.trim().split('\n')).toHaveLength(4);
    expect(text).toContain('\n2031-06-30,');
  });
});
