// @vitest-environment jsdom
// axe-core (WCAG 2 A and AA rule sets) on the rendered workbench, each table tab in turn. Colour
// contrast needs a real renderer and is left to the browser; everything else is checked here.
import axe from 'axe-core';
import { fireEvent, render, screen } from '@testing-library/react';
import { App } from '../../src/app/App.tsx';
import { useAppStore } from '../../src/state/store.ts';

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

async function violations(container: HTMLElement): Promise<string[]> {
  const result = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
  return result.violations.map((v) => `${v.id}: ${v.help} (${v.nodes.length} nodes, e.g. ${v.nodes[0]?.html.slice(0, 120)})`);
}

describe('workbench accessibility', () => {
  it('the check itself finds an unlabelled input (so a pass means something)', async () => {
    const { container } = render(<input type="text" />);
    expect((await violations(container)).some((v) => v.startsWith('label'))).toBe(true);
  });

  it('the workbench with the key-maturity table has no axe-core violations', async () => {
    const { container } = render(<App />);
    expect(await violations(container)).toEqual([]);
  });

  it.each(['Forward strip', 'Forward grid', 'Quote check'])('the %s tab has no axe-core violations', async (tab) => {
    const { container } = render(<App />);
    fireEvent.click(screen.getByRole('tab', { name: tab }));
    if (tab === 'Quote check') fireEvent.click(screen.getByRole('button', { name: 'Row 8: show its repricing and schedule' }));
    // The strip and the grid load on first use: check their tables, not the loading line.
    else await screen.findByRole('table', { name: tab });
    expect(await violations(container)).toEqual([]);
  });

  it('a sheet with a wrong cell and a paste notice has no axe-core violations', async () => {
    const { container } = render(<App />);
    fireEvent.change(screen.getByRole('textbox', { name: 'Row 2 Rate / yield' }), { target: { value: 'x' } });
    fireEvent.paste(screen.getByRole('grid', { name: /Quotes/ }), { clipboardData: { getData: () => '4.1\n4.2' } });
    expect(await violations(container)).toEqual([]);
  });
});
