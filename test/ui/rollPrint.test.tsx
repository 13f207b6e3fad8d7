// @vitest-environment jsdom
// The printed roll-versus-term block: the result sentence, the strategies' table under the chosen
// view and the user's short-rate path, each figure the core's own (analyseRollVsTerm). Demo data invented.
import { render, within } from '@testing-library/react';
import { analyseRollVsTerm, DEFAULT_STRATEGY, formatMoney, percentFigure } from '../../src/core/index.ts';
import { RollResultLine } from '../../src/features/roll/RollSlot.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

describe('RollResultLine (the printed block)', () => {
  it("prints the chosen view's table of strategies and the short-rate path, leg by leg", () => {
    const result = deriveBuild(useAppStore.getState().workspace);
    const { container } = render(<RollResultLine result={result} />);
    const r = analyseRollVsTerm(result.build.curve!, DEFAULT_STRATEGY);
    if (!r.ok) throw new Error('analysis');
    const view = r.value.views[r.value.chosen]!;
    const table = within(container).getByRole('table', { name: 'Roll versus term under the chosen view' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(r.value.strategies.length);
    r.value.strategies.forEach((s, i) => {
      const o = view.strategies.find((x) => x.id === s.id)!;
      expect(rows[i]).toHaveTextContent(s.label);
      expect(rows[i]).toHaveTextContent(formatMoney(o.terminal));
    });
    const path = r.value.views.find((v) => v.id === 'path')!;
    const printed = container.querySelector('.ps-roll-path')!.textContent!;
    expect(printed).toContain('Your short-rate path');
    expect(printed).toContain(path.legRates.slice(0, 12).map((x) => percentFigure(x, 'rateShort')).join(', '));
  });
});
