// @vitest-environment jsdom
// The Bond and sensitivities section on a workspace with a solved year-end turn: the heat map and
// the DV01 to each quote are of the curve the workbench shows (turns, solved spread), read from the
// workbench's own build, not of the plain bootstrap of the same quotes. Expected figures are the
// core's (sensitivityMapFor with the turns' code, quoteDv01s with the build's settings), which
// test/core/analytics/turnStepRisk.test.ts holds to bump-and-rebuild of the document; the plain
// figures they must differ from are the same functions without the turns. Invented rates (the
// ladder of test/core/bootstrap/turnsAndSteps.test.ts).
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { installFeaturePanels } from '../../src/app/installFeaturePanels.tsx';
import { loadOvernightKit } from '../../src/hooks/overnightKit.ts';
import { INVENTED_2022_SOLVED_TURN } from '../helpers/markets.ts';
import { analyzeBond, buildCurve, fullText, nearZero, OVERNIGHT_KIT, quoteDv01s, sensitivityMapFor } from '../../src/core/index.ts';
import { withEngineWorkspace } from '../helpers/engineWorkspace.ts';

const ENGINE = INVENTED_2022_SOLVED_TURN;
const { turns: _turns, ...PLAIN } = ENGINE;

withEngineWorkspace(ENGINE, async () => {
  await loadOvernightKit();
  await installFeaturePanels();
});

describe('Bond and sensitivities with a solved turn', { timeout: 30_000 }, () => {
  it('the heat map and the DV01 to each quote are the shown curve\'s, not the plain bootstrap\'s', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Bond and sensitivities' }));
    const heat = await screen.findByRole('region', { name: 'Which quote drives each forward' }, { timeout: 10_000 });
    await user.selectOptions(within(heat).getByRole('combobox', { name: 'Forward tenor' }), '1M');
    await user.selectOptions(within(heat).getByRole('combobox', { name: 'Starts every' }), '3M');
    await user.selectOptions(within(heat).getByRole('combobox', { name: 'Interpolation' }), 'monotone-convex');
    const shown = buildCurve(ENGINE, { overnight: OVERNIGHT_KIT, skipInvalid: true });
    const plain = buildCurve(PLAIN, { skipInvalid: true });
    const opts = { tenor: { n: 1, unit: 'M' as const }, step: { n: 3, unit: 'M' as const }, compounding: 'simple' as const, interpolation: 'monotone-convex' as const };
    const withTurn = sensitivityMapFor(shown.workspace!, { ...opts, overnight: OVERNIGHT_KIT });
    const without = sensitivityMapFor(plain.workspace!, opts);
    if (!withTurn.ok || !without.ok) throw new Error('map');
    const value = (m: typeof withTurn) => {
      if (!m.ok) return NaN;
      const i = m.value.map.rows.findIndex((r) => r.start === '2022-12-01');
      const k = m.value.map.columns.findIndex((c) => c.index === 3);
      return m.value.map.values[i * m.value.map.columns.length + k]!;
    };
    // The December 1M forward holds the turn; quotes[3] is sheet row 4 and sets the turn's spread.
    const label = (v: number) => `2022-12-01 forward to row 4: ${nearZero(v, 3, 'bp per bp').text} bp per bp`;
    expect(label(value(withTurn))).not.toBe(label(value(without)));
    expect(within(heat).getByLabelText(/^2022-12-01 forward to row 4:/)).toHaveAttribute('aria-label', label(value(withTurn)));
    // Its explanations read the same map, turn included: the cell and the forward's own rate, each its figure to all digits.
    await user.click(within(heat).getByRole('button', { name: /explain the 2022-12-01 forward's sensitivity to row 4$/ }));
    const cellPanel = await screen.findByRole('complementary', { name: /Sensitivity of the forward 2022-12-01/ });
    expect(cellPanel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(value(withTurn)));
    const row1 = withTurn.value.map.rows.find((r) => r.start === '2022-12-01')!;
    await user.click(within(heat).getByRole('button', { name: new RegExp(`explain the forward 2022-12-01 to ${row1.end}$`) }));
    const ratePanel = await screen.findByRole('complementary', { name: /Forward 2022-12-01 to .* of the sensitivity map/ });
    expect(ratePanel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(row1.rate));

    // The DV01 to each quote of the bond in the form (10Y, 4 % by default: beyond the curve, so a 2-year bond).
    await user.clear(screen.getByRole('textbox', { name: 'Maturity (date or tenor)' }));
    await user.type(screen.getByRole('textbox', { name: 'Maturity (date or tenor)' }), '2024-03-01');
    const bond = { maturity: '2024-03-01', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' as const };
    const a = analyzeBond(shown.curve!, bond);
    if (!a.ok) throw new Error('bond');
    const dv = quoteDv01s(shown.settings!, shown.instruments, a.value.flows);
    const dvPlain = quoteDv01s(plain.settings!, plain.instruments, a.value.flows);
    if (!dv.ok || !dvPlain.ok) throw new Error('dv01');
    const text = (l: typeof dv) => (l.ok ? nearZero(l.value.find((q) => q.index === 3)!.dv01, 5, 'per 100 face per bp').text : '');
    expect(text(dv)).not.toBe(text(dvPlain));
    const row = within(screen.getByRole('table', { name: 'DV01 to each quote' })).getByRole('row', { name: /^Row 4 ois/ });
    expect(row).toHaveTextContent(text(dv));
  });
});
