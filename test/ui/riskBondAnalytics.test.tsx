// @vitest-environment jsdom
// The bond panel: every figure with its unit, the key-rate grid and bump stated, z-spread at a
// market price, the DV01 to each quote, and a typing mistake kept with a message.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import axe from 'axe-core';
import { analyzeBond, buildCurve } from '../../src/core/index.ts';
import { bpFigure, formatNumber } from '../../src/core/index.ts';
import { BondAnalyticsPanel } from '../../src/features/risk/BondAnalyticsPanel.tsx';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';

// Invented demo market.
const { depo3M, bond2029, swap5Y, swap10Y, swap30Y } = INVENTED_2027; // test/helpers/markets.ts
const doc = workspaceDoc([depo3M, bond2029, swap5Y, swap10Y, swap30Y], { interpolation: 'monotone-convex' });
const build = buildCurve(doc);
const curve = build.curve!;

describe('BondAnalyticsPanel', () => {
  it('shows the core figures with units, the key-rate grid and its bump, and the DV01 per quote', () => {
    render(<BondAnalyticsPanel curve={curve} build={build} initial={{ maturity: '2034-05-15', coupon: '4', quoteKind: 'price', quote: '101.25' }} />);
    const table = screen.getByRole('table', { name: 'Bond analytics' });
    const expected = analyzeBond(curve, { maturity: '2034-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 101.25 });
    if (!expected.ok) throw new Error('analytics');
    const row = (label: RegExp) => within(table).getByRole('row', { name: label });
    expect(row(/^Modified duration/)).toHaveTextContent(formatNumber(expected.value.modifiedDuration, 4));
    expect(row(/^Modified duration/)).toHaveTextContent('years');
    expect(row(/^Convexity/)).toHaveTextContent('years²');
    expect(row(/^DV01/)).toHaveTextContent('per 100 face per bp of yield');
    expect(row(/^Z-spread/)).toHaveTextContent(bpFigure(expected.value.market!.zSpread * 1e4));
    expect(row(/^Z-spread/)).toHaveTextContent('bp, cont, ACT/365F');
    expect(row(/^Yield to maturity/)).toHaveTextContent('s.a., ICMA, accrual ACT/ACT-ICMA');
    const krd = screen.getByRole('table', { name: 'Key-rate durations' });
    expect(krd).toHaveTextContent('3M, 6M, 1Y, 2Y, 3Y, 5Y, 7Y, 10Y, 20Y, 30Y');
    expect(krd).toHaveTextContent('±1 bp');
    const dv = screen.getByRole('table', { name: 'DV01 to each quote' });
    expect(within(dv).getAllByRole('row')).toHaveLength(1 + doc.quotes.length);
  });

  it('keeps a bad coupon as typed, says what to type, and hands every edit to onFormChange', async () => {
    const user = userEvent.setup();
    const seen: string[] = [];
    render(<BondAnalyticsPanel curve={curve} onFormChange={(f) => seen.push(f.coupon)} />);
    const coupon = screen.getByRole('textbox', { name: 'Coupon (% per year)' });
    await user.clear(coupon);
    await user.type(coupon, '4,5');
    expect(coupon).toHaveValue('4,5');
    expect(screen.getByRole('alert')).toHaveTextContent('Coupon: type a percent per year such as 4.25, not "4,5"');
    expect(seen[seen.length - 1]).toBe('4,5');
  });

  it('refuses a bond beyond the curve with the core\'s message', async () => {
    const user = userEvent.setup();
    render(<BondAnalyticsPanel curve={curve} />);
    const maturity = screen.getByRole('textbox', { name: 'Maturity (date or tenor)' });
    await user.clear(maturity);
    await user.type(maturity, '40Y');
    expect(screen.getByRole('alert')).toHaveTextContent(/beyond the curve's last pillar/);
  });
  it('has no accessibility violations found by axe-core (WCAG 2 A and AA rules; colour contrast needs a real renderer)', async () => {
    const { container } = render(<BondAnalyticsPanel curve={curve} build={build} initial={{ quoteKind: 'yield', quote: '4.1' }} />);
    const result = await axe.run(container, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa'] }, rules: { 'color-contrast': { enabled: false } } });
    expect(result.violations.map((v) => `${v.id}: ${v.nodes.length} nodes, e.g. ${v.nodes[0]?.html.slice(0, 120)}`)).toEqual([]);
  });
});

describe('BondAnalyticsPanel market price', () => {
  // 32nds: points and 32nds of a point (102-05 is 102 5/32), common practice for US Treasury prices;
  // the sheet reads the same text with parsePriceText.
  it('takes a clean price in 32nds (102-05 = 102.15625) as the sheet does', () => {
    render(<BondAnalyticsPanel curve={curve} build={build} initial={{ maturity: '2034-05-15', coupon: '4', quoteKind: 'price', quote: '102-05' }} />);
    const expected = analyzeBond(curve, { maturity: '2034-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 102.15625 });
    if (!expected.ok) throw new Error('analytics');
    expect(screen.queryByRole('alert')).toBeNull();
    const table = screen.getByRole('table', { name: 'Bond analytics' });
    expect(within(table).getByRole('row', { name: /^Z-spread/ })).toHaveTextContent(bpFigure(expected.value.market!.zSpread * 1e4));
  });
});
