// @vitest-environment jsdom
// A difference in the Snapshots table or the reference curve table opens the explanation panel (issue 19): chosen by keyboard,
// the panel's value and last step are the table's figure to all digits (compareCurves, the table's
// own source; test/core/curve/explainCurveDifference.test.ts holds its two parts to the untraced
// zeroOn bit for bit), both curves' steps are listed, the quotes are the current curve's, the
// difference is given under each method (both curves built under it), and Escape gives the focus back.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { buildCurve, compareCurves, fullText, parseReferenceCsv, referenceDifferences, snapshotDocument, takeSnapshot, type Snapshot } from '../../src/core/index.ts';
import { useReferenceInput } from '../../src/features/compare/referenceInput.ts';
import { ReferenceCurvePanel } from '../../src/features/snapshots/ReferenceCurvePanel.tsx';
import { explainKeyCell } from '../../src/features/tables/explainCell.ts';
import { SnapshotPanel } from '../../src/features/snapshots/SnapshotPanel.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

// The explanation panel's code loads on first use; loaded here first (a loaded machine's transform
// does not count against the wait for the panel).
beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

const initial = useAppStore.getInitialState();
beforeEach(() => useAppStore.setState(initial, true));

describe('explanations in the Snapshots table', () => {
  it('a difference opens its explanation, ending in the shown figure to all digits', async () => {
    const user = userEvent.setup({ delay: null });
    const display = useAppStore.getState().workspace.display;
    const result = deriveBuild(useAppStore.getState().workspace);
    const current = result.build.curve!;
    // The demo a week earlier and 10 bp lower (invented), taken as a snapshot.
    const doc = result.conversion.doc as Record<string, unknown> & { quotes: Record<string, unknown>[] };
    const earlier = { ...doc, valuationDate: '2026-11-24', settlement: undefined, quotes: doc.quotes.map((q) => (typeof q.rate === 'number' ? { ...q, rate: q.rate - 0.001 } : q)) };
    const snapshot: Snapshot = takeSnapshot(earlier, 'Last week', '2026-11-24T17:00:00+00:00');
    expect(snapshot.curveHash).not.toBeNull();
    render(<SnapshotPanel value={[snapshot]} onChange={() => {}} currentDocument={doc} current={current} now={() => ''} compounding={display.compounding} dayCount={display.dayCount} tenors={['2Y', '10Y']} explainFrom={{ result, display }} />);
    const other = buildCurve(snapshotDocument(snapshot)).curve!;
    const figure = compareCurves(current, other, ['10Y'], 'time', display.compounding, display.dayCount)[0]!.differenceBp!;
    const table = screen.getByRole('table', { name: 'Current curve against the snapshot' });
    const button = within(table).getByRole('button', { name: /explain the difference of the 10Y zero rate from Last week/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Difference of the 10Y zero rate from Last week/ });
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel).toHaveFocus();
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`difference = (current rate - snapshot rate) x 10,000 bp = ${fullText(figure)} (bp (1 bp = 0.0001 of the rate))`);
    expect(steps.some((s) => s!.startsWith('current curve: '))).toBe(true);
    expect(steps.some((s) => s!.startsWith('snapshot curve: '))).toBe(true);
    const links = within(within(panel).getByRole('region', { name: 'Quotes it depends on most' })).getAllByRole('button', { name: /^Row \d+:/ });
    expect(links.length).toBe(5);
    const model = explainKeyCell(result, display, { difference: { snapshot, tenor: '10Y', by: 'time', compounding: display.compounding, dayCount: display.dayCount } });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    expect(model.value.methods.length).toBe(5);
    for (const m of model.value.methods) {
      // Recomputed here as the table would read it with both curves built under that method.
      const now = buildCurve(result.conversion.doc, { skipInvalid: true, interpolation: m.method }).curve!;
      const then = buildCurve(snapshotDocument(snapshot), { interpolation: m.method }).curve!;
      expect(m.value).toBe(compareCurves(now, then, ['10Y'], 'time', display.compounding, display.dayCount)[0]!.differenceBp);
      if (m.current) expect(m.value).toBe(figure);
    }
    expect(new Set(model.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('complementary')).not.toBeInTheDocument();
    expect(button).toHaveFocus();
  });

  it("a reference curve's difference opens its explanation, ending in the shown figure to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const display = useAppStore.getState().workspace.display;
    const result = deriveBuild(useAppStore.getState().workspace);
    const curve = result.build.curve!;
    // Discount factors from another source (invented values), read continuous ACT/365F.
    const csv = 'date,discount\n2027-12-01,0.9655\n2031-12-01,0.8412';
    useReferenceInput.getState().set({ text: csv, compounding: 'continuous', dayCount: 'ACT/365F' });
    render(<ReferenceCurvePanel curve={curve} explainFrom={{ result, display }} />);
    const ref = parseReferenceCsv(csv, 'continuous', 'ACT/365F').reference!;
    const figure = referenceDifferences(curve, ref)[1]!.differenceBp!;
    const table = screen.getByRole('table', { name: 'Difference from the reference curve' });
    const button = within(table).getByRole('button', { name: /explain the difference from the reference on 2031-12-01/ });
    button.focus();
    await user.keyboard('{Enter}');
    const panel = await screen.findByRole('complementary', { name: /Difference of our zero rate on 2031-12-01 from the reference/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
    const steps = within(within(panel).getByRole('region', { name: 'Steps' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(steps.at(-1)).toBe(`difference = (ours rate - reference rate) x 10,000 bp = ${fullText(figure)} (bp (1 bp = 0.0001 of the rate))`);
    expect(steps.some((s) => s!.startsWith('reference curve: lnP = ln D, D = 0.8412'))).toBe(true);
    const model = explainKeyCell(result, display, { reference: { curve: ref, date: '2031-12-01' } });
    if (!model.ok) throw new Error(model.errors[0]!.message);
    for (const m of model.value.methods) {
      const now = buildCurve(result.conversion.doc, { skipInvalid: true, interpolation: m.method }).curve!;
      expect(m.value).toBe(referenceDifferences(now, ref)[1]!.differenceBp);
    }
    expect(new Set(model.value.methods.map((m) => m.value)).size).toBeGreaterThan(1);
    await user.keyboard('{Escape}');
    expect(button).toHaveFocus();
    useReferenceInput.getState().set({ text: '' });
  });
});

describe('the rates beside the differences', () => {
  it("the Snapshots table's current and snapshot zero rates, and the reference table's own, open their explanations, each the figure shown to all digits", async () => {
    const user = userEvent.setup({ delay: null });
    const display = useAppStore.getState().workspace.display;
    const result = deriveBuild(useAppStore.getState().workspace);
    const current = result.build.curve!;
    const doc = result.conversion.doc as Record<string, unknown> & { quotes: Record<string, unknown>[] };
    const earlier = { ...doc, valuationDate: '2026-11-24', settlement: undefined, quotes: doc.quotes.map((q) => (typeof q.rate === 'number' ? { ...q, rate: q.rate - 0.001 } : q)) };
    const snapshot: Snapshot = takeSnapshot(earlier, 'Last week', '2026-11-24T17:00:00+00:00');
    const { unmount } = render(<SnapshotPanel value={[snapshot]} onChange={() => {}} currentDocument={doc} current={current} now={() => ''} compounding={display.compounding} dayCount={display.dayCount} tenors={['2Y', '10Y']} explainFrom={{ result, display }} />);
    const row = compareCurves(current, buildCurve(snapshotDocument(snapshot)).curve!, ['10Y'], 'time', display.compounding, display.dayCount)[0]!;
    const table = screen.getByRole('table', { name: 'Current curve against the snapshot' });
    for (const [name, title, figure] of [[`current zero rate on ${row.date}`, `Zero rate on ${row.date}`, row.zero!], [`Last week zero rate on ${row.otherDate}`, `Zero rate on ${row.otherDate} on snapshot Last week`, row.otherZero!]] as const) {
      const button = within(table).getByRole('button', { name: new RegExp(`explain the ${name}$`) });
      await user.click(button);
      const panel = await screen.findByRole('complementary', { name: new RegExp(title) });
      expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(figure));
      await user.click(button);
    }
    unmount();
    // Our zero rate in the reference's convention (annual, ACT/360 here, not the display's).
    const csv = 'date,discount\n2027-12-01,0.9655\n2031-12-01,0.8412';
    useReferenceInput.getState().set({ text: csv, compounding: 'annual', dayCount: 'ACT/360' });
    render(<ReferenceCurvePanel curve={current} explainFrom={{ result, display }} />);
    const ref = parseReferenceCsv(csv, 'annual', 'ACT/360').reference!;
    const ours = referenceDifferences(current, ref)[1]!.zero!;
    await user.click(within(screen.getByRole('table', { name: 'Difference from the reference curve' })).getByRole('button', { name: /explain our zero rate on 2031-12-01$/ }));
    const panel = await screen.findByRole('complementary', { name: /Zero rate on 2031-12-01/ });
    expect(panel.querySelector('[data-field="value"]')!.textContent).toBe(fullText(ours));
    expect(panel.textContent).toContain('ACT/360');
  });
});
