// @vitest-environment jsdom
// A number opened right after an edit explains the number its table shows now, not the build
// before the edit: the panel follows the build once typing pauses (useSettledValue), but the first
// read of a newly opened number is the build the table was drawn from. The Snapshots table keeps
// its panel mounted while closed, so its settled build would lag the edit. The demo workspace a
// week earlier as the snapshot (invented); the figure is compareCurves' (held to zeroOn in
// test/core/curve/explainCurveDifference.test.ts).
import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { compareCurves, buildCurve, snapshotDocument, takeSnapshot } from '../../src/core/index.ts';
import { SnapshotPanel } from '../../src/features/snapshots/SnapshotPanel.tsx';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';

beforeAll(() => import('../../src/features/tables/lazyTables.ts'));

vi.setConfig({ testTimeout: 60_000 }); // a limit for a hung run, not a speed check

describe('a number opened right after an edit', () => {
  it('reads the build its table shows: a snapshot difference opened just after a quote moved', async () => {
    const s = useAppStore.getState();
    const display = s.workspace.display;
    const before = deriveBuild(s.workspace);
    const doc = before.conversion.doc as Record<string, unknown> & { quotes: Record<string, unknown>[] };
    const snapshot = takeSnapshot({ ...doc, valuationDate: '2026-11-24', settlement: undefined }, 'Last week', '2026-11-24T17:00:00+00:00');
    const row = s.workspace.quotes.find((r) => r.kind === 'swap')!;
    const panel = (result: typeof before) => <SnapshotPanel value={[snapshot]} onChange={() => {}} currentDocument={doc} current={result.build.curve} now={() => ''} compounding={display.compounding} dayCount={display.dayCount} tenors={['10Y']} explainFrom={{ result, display }} />;
    // The panel's code loaded once (React.lazy), so the next opening renders at once.
    const warm = render(panel(before));
    fireEvent.click(within(screen.getByRole('table', { name: 'Current curve against the snapshot' })).getByRole('button', { name: /explain the difference of the 10Y zero rate/ }));
    await screen.findByRole('complementary', { name: /Difference of the 10Y zero rate/ });
    warm.unmount();
    // The settle timer does not run in this test: the build settled before the edit is all the panel has, but for the one its table was drawn from.
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'requestIdleCallback', 'cancelIdleCallback'] });
    const { rerender } = render(panel(before));
    // A swap quote moved by 25 bp: the table redraws from the new build at once.
    s.setCell(row.id, 'rate', String(Number(row.rate.replace('%', '')) + 0.25));
    const after = deriveBuild(useAppStore.getState().workspace);
    rerender(panel(after));
    const figure = compareCurves(after.build.curve!, buildCurve(snapshotDocument(snapshot)).curve!, ['10Y'], 'time', display.compounding, display.dayCount)[0]!.differenceBp!;
    act(() => fireEvent.click(within(screen.getByRole('table', { name: 'Current curve against the snapshot' })).getByRole('button', { name: /explain the difference of the 10Y zero rate/ })));
    const open = screen.getByRole('complementary', { name: /Difference of the 10Y zero rate/ });
    vi.useRealTimers();
    const beforeFigure = compareCurves(before.build.curve!, buildCurve(snapshotDocument(snapshot)).curve!, ['10Y'], 'time', display.compounding, display.dayCount)[0]!.differenceBp!;
    expect(Math.abs(figure - beforeFigure)).toBeGreaterThan(0.1);
    expect(Number(open.querySelector('[data-field="value"]')!.textContent)).toBe(figure);
  });
});
