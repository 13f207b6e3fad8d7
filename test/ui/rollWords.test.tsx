// @vitest-environment jsdom
// The roll panel's messages: they follow the inputs (no stale error after the horizon changes),
// suggest a maturity the user has not typed, and speak in the panel's own field names rather
// than document paths.
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { DEFAULT_STRATEGY, type StrategyInputs } from '../../src/core/index.ts';
import { RollPanel } from '../../src/features/roll/RollPanel.tsx';
import { rollMarketCurve } from '../helpers/rollMarket.ts';

const curve = rollMarketCurve();

function Harness({ initial }: { initial: StrategyInputs }) {
  const [strategy, setStrategy] = useState(initial);
  return <RollPanel curve={curve} strategy={strategy} onStrategyChange={setStrategy} />;
}

describe('RollPanel messages', () => {
  it('drops the riding-bond error once the horizon moves before its maturity, and never suggests the maturity typed', async () => {
    const user = userEvent.setup();
    render(<Harness initial={{ ...DEFAULT_STRATEGY, horizon: '5Y', ridingMaturity: '5Y' }} />);
    const panel = screen.getByRole('region', { name: /Roll versus term/ });
    expect(panel).toHaveTextContent(/must mature after the horizon/);
    expect(panel).not.toHaveTextContent(/such as "5Y"/);
    expect(panel).not.toHaveTextContent(/strategy\./);
    const horizon = screen.getByRole('textbox', { name: /Horizon/ });
    await user.clear(horizon);
    await user.type(horizon, '2Y{Enter}');
    expect(panel).not.toHaveTextContent(/must mature after the horizon/);
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('names fields as the panel labels them in every message', async () => {
    const user = userEvent.setup();
    render(<Harness initial={{ ...DEFAULT_STRATEGY, horizon: '12Y', ridingMaturity: '15Y' }} />);
    const alert = screen.getByRole('alert', { name: /Why there is no comparison/ });
    expect(alert).toHaveTextContent(/Horizon: .*beyond the curve's last pillar/);
    expect(alert).not.toHaveTextContent(/strategy\./);
    const amount = screen.getByRole('textbox', { name: /Amount/ });
    await user.clear(amount);
    await user.type(amount, 'lots{Enter}');
    expect(screen.getByRole('region', { name: /Roll versus term/ })).not.toHaveTextContent(/strategy\./);
  });
});

describe('RollPanel currency', () => {
  it('shows the typed ISO 4217 code with every amount instead of the generic sign, and refuses a malformed one', async () => {
    const user = userEvent.setup();
    render(<Harness initial={DEFAULT_STRATEGY} />);
    const panel = screen.getByRole('region', { name: /Roll versus term/ });
    expect(panel).toHaveTextContent('¤');
    const currency = screen.getByRole('textbox', { name: /Currency/ });
    await user.type(currency, 'eur{Enter}');
    expect(currency).toHaveValue('EUR');
    expect(panel).not.toHaveTextContent('¤');
    expect(screen.getByRole('status', { name: '' })).toHaveTextContent(/ends ahead at EUR [\d,]+\.\d\d on /);
    expect(screen.getByRole('table', { name: /Strategies by views/ })).toHaveTextContent('value in EUR');
    expect(screen.getByRole('textbox', { name: /Amount/ }).closest('label')).toHaveTextContent('(EUR)');
    await user.clear(currency);
    await user.type(currency, 'EURO{Enter}');
    expect(screen.getByRole('alert')).toHaveTextContent(/three letters such as USD/);
  });
});
