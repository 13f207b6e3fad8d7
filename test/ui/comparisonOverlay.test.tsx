// @vitest-environment jsdom
// The charts' comparisons (src/features/compare): the choice lives in the document's view (saved,
// undone), and every drawn line is the core's value at its sample date: the smooth fit against the
// fitted model's own zero rate (Nelson-Siegel 1987 form, parametricZero), a snapshot against its
// rebuilt curve (zeroOn), the reference against the reference table (referenceDifferences).
import { act, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/app/App.tsx';
import { FIT_STYLE, SNAPSHOT_OVERLAY_MAX, SNAPSHOT_STYLES } from '../../src/charts/palette.ts';
import {
  addTenor,
  fitCurve,
  parametricForward,
  parametricZero,
  parseReferenceCsv,
  parseTenor,
  rebuildSnapshot,
  referenceDifferences,
  takeSnapshot,
  zeroOn,
  forwardOn,
} from '../../src/core/index.ts';
import { comparisonChoice, setCompareBy, setDrawFit, setDrawReference, toggleSnapshot } from '../../src/features/compare/comparisonChoice.ts';
import { useReferenceInput } from '../../src/features/compare/referenceInput.ts';
import { useFitInput } from '../../src/features/compare/fitInput.ts';
import { setFitErrors, setFitModel } from '../../src/features/compare/comparisonChoice.ts';
import { useComparisonOverlay, type ComparisonOverlay } from '../../src/features/compare/useComparisonOverlay.ts';
import { useCurveBuild } from '../../src/hooks/useCurveBuild.ts';
import { useAppStore } from '../../src/state/store.ts';
import { explainKeyCell, type ExplainCell } from '../../src/features/tables/explainCell.ts';
import { SnapshotsTab } from '../../src/features/snapshots/SnapshotsTab.tsx';
import { expectClose } from '../helpers/asserts.ts';

const initial = useAppStore.getInitialState();
beforeEach(() => {
  useAppStore.setState(initial, true);
  useReferenceInput.setState({ text: '', compounding: 'continuous', dayCount: 'ACT/365F', unit: null });
  useFitInput.setState({ exclude: [], weights: {} });
  localStorage.clear();
});

let last: ComparisonOverlay | null = null;
let lastBuild: ReturnType<typeof useCurveBuild> | null = null;
function Probe() {
  const build = useCurveBuild();
  lastBuild = build;
  last = useComparisonOverlay(build);
  return null;
}
const engineDoc = (): Record<string, unknown> => lastBuild!.conversion.doc as unknown as Record<string, unknown>;

describe('comparison choice in the view', () => {
  it('saves each choice in the document view and undoes it step by step', () => {
    render(<Probe />);
    act(() => setDrawFit(true));
    act(() => toggleSnapshot([], 'Close', true));
    act(() => setCompareBy('date'));
    const doc = useAppStore.getState().workspace;
    expect(doc.view).toMatchObject({ compareFit: true, compareSnapshots: ['Close'], compareBy: 'date' });
    expect(comparisonChoice(doc)).toMatchObject({ fit: true, snapshots: ['Close'], by: 'date', reference: false });
    act(() => useAppStore.getState().undo());
    expect(comparisonChoice(useAppStore.getState().workspace).by).toBe('time');
    act(() => useAppStore.getState().undo());
    expect(comparisonChoice(useAppStore.getState().workspace).snapshots).toEqual([]);
    act(() => useAppStore.getState().undo());
    expect(comparisonChoice(useAppStore.getState().workspace).fit).toBe(false);
    act(() => useAppStore.getState().redo());
    expect(comparisonChoice(useAppStore.getState().workspace).fit).toBe(true);
  });
});

describe('one lining-up choice for the snapshot table and the charts', () => {
  it("the snapshot section's 'Line up by' writes the view's compareBy, one undo step", async () => {
    const user = userEvent.setup({ delay: null });
    function Tab() {
      return <SnapshotsTab result={useCurveBuild()} />;
    }
    render(<Tab />);
    await user.type(screen.getByLabelText('Snapshot name'), 'Close');
    await user.click(screen.getByRole('button', { name: 'Take snapshot' }));
    await user.click(screen.getByRole('radio', { name: 'calendar date' }));
    expect(comparisonChoice(useAppStore.getState().workspace).by).toBe('date');
    act(() => useAppStore.getState().undo());
    expect(comparisonChoice(useAppStore.getState().workspace).by).toBe('time');
    expect(screen.getByRole('radio', { name: 'time to maturity' })).toBeChecked();
  });
});

describe('useComparisonOverlay', () => {
  it("draws the smooth fit's zero and forward equal to the fitted Nelson-Siegel model at every sample date", async () => {
    // Continuous compounding on the curve's own day count: the drawn zero is the model's y(t) itself.
    act(() => useAppStore.getState().setDisplay({ compounding: 'continuous', dayCount: 'ACT/365F', forwardTenor: '3M' }));
    render(<Probe />);
    expect(last!.zero).toEqual([]);
    act(() => setDrawFit(true));
    // The fitting code loads on first use (useLazyFit): the line comes once it has arrived.
    await waitFor(() => expect(last!.zero.some((l) => l.id === 'fit-zero')).toBe(true));
    const fit = fitCurve(lastBuild!.build.workspace!, { model: 'nelson-siegel' });
    if (!fit.ok) throw new Error('the demo fit must converge');
    const p = fit.value.params;
    const zero = last!.zero.find((l) => l.id === 'fit-zero')!;
    expect(zero.label).toBe('Nelson-Siegel fit (zero)');
    expect({ colour: zero.colour, dash: zero.dash }).toEqual({ colour: FIT_STYLE.colour, dash: FIT_STYLE.dash });
    expect(zero.points.length).toBeGreaterThan(100);
    for (const pt of zero.points.filter((q) => !q.extrapolated)) {
      expectClose(pt.y, parametricZero(p, pt.x), 1e-13, 'Nelson and Siegel (1987) zero y(t), parametricZero of the fitted parameters');
    }
    const fwd = last!.forward.find((l) => l.id === 'fit-forward')!;
    const curve = fit.value.curve;
    for (const pt of fwd.points.slice(0, 50)) {
      const f = forwardOn(curve, pt.date, addTenor(pt.date, parseTenor('3M')!), 'continuous', 'ACT/365F');
      expectClose(pt.y, f.ok ? f.value.rate : NaN, 1e-13, "forwardOn on the fitted curve (the queries' forward)");
    }
    // The instantaneous forward at the short end tends to b0 + b1 (Nelson-Siegel 1987).
    expectClose(parametricForward(p, 0), p.b0 + p.b1, 1e-15, 'Nelson and Siegel (1987): f(0) = b0 + b1');
  });

  it("the fit lines' points explain themselves: the fitted zero rate on the date, and the forward from it, in the display's conventions, the drawn point bit for bit", async () => {
    // Annual ACT/360 (not the curve's day count nor continuous), so the cell must carry the display's conventions.
    act(() => useAppStore.getState().setDisplay({ compounding: 'annual', dayCount: 'ACT/360' }));
    render(<Probe />);
    act(() => setDrawFit(true));
    await waitFor(() => expect(last!.zero.some((l) => l.id === 'fit-zero')).toBe(true));
    const zero = last!.zero.find((l) => l.id === 'fit-zero')!;
    const display = useAppStore.getState().workspace.display;
    const picked = [zero.points[7]!, zero.points[60]!, zero.points.find((q) => q.extrapolated) ?? zero.points.at(-1)!];
    for (const pt of picked) {
      const e = explainKeyCell(lastBuild!, display, zero.explain!(pt) as ExplainCell);
      if (!e.ok) throw new Error(e.errors[0]!.message);
      expect(Object.is(e.value.explanation.value, pt.y), pt.date).toBe(true);
    }
    // So do the fit's forwards: the forward on the fitted curve from the date to one forward tenor later.
    const fwd = last!.forward.find((l) => l.id === 'fit-forward')!;
    for (const pt of [fwd.points[5]!, fwd.points[80]!, fwd.points.at(-1)!]) {
      const e = explainKeyCell(lastBuild!, display, fwd.explain!(pt) as ExplainCell);
      if (!e.ok) throw new Error(e.errors[0]!.message);
      expect(Object.is(e.value.explanation.value, pt.y), pt.date).toBe(true);
      expect(e.value.title).toMatch(/^Fitted forward rate \d{4}-\d{2}-\d{2} to \d{4}-\d{2}-\d{2}$/);
    }
  });

  it('draws the fit the smooth fit section sets: Svensson, price errors, a quote left out', async () => {
    act(() => useAppStore.getState().setDisplay({ compounding: 'continuous', dayCount: 'ACT/365F' }));
    render(<Probe />);
    act(() => setDrawFit(true));
    act(() => setFitModel('svensson'));
    act(() => setFitErrors('price'));
    act(() => useFitInput.getState().set({ exclude: [3] }));
    await waitFor(() => expect(last!.zero.find((l) => l.id === 'fit-zero')?.label).toBe('Svensson fit (zero)'));
    const fit = fitCurve(lastBuild!.build.workspace!, { model: 'svensson', errors: 'price', exclude: [3] });
    if (!fit.ok) throw new Error('the demo fit must converge');
    const zero = last!.zero.find((l) => l.id === 'fit-zero')!;
    expect(zero.label).toBe('Svensson fit (zero)');
    expect(last!.how.zero).toEqual(['Svensson fit: price errors, 1 quote left out, as set in the Smooth fit section']);
    for (const pt of zero.points.filter((q) => !q.extrapolated)) {
      expectClose(pt.y, parametricZero(fit.value.params, pt.x), 1e-13, 'Svensson (1994) zero y(t), parametricZero of the fitted parameters');
    }
    expect(useAppStore.getState().workspace.view).toMatchObject({ fitModel: 'svensson', fitErrors: 'price' });
  });

  it('draws a chosen snapshot equal to its rebuilt curve, and lines another settlement up as chosen', () => {
    act(() => useAppStore.getState().setDisplay({ compounding: 'annual', dayCount: 'ACT/360' }));
    render(<Probe />);
    const doc = engineDoc();
    const earlier = addTenor(String(doc.valuationDate), { ...parseTenor('1M')!, n: -1 });
    const snap = takeSnapshot({ ...doc, valuationDate: earlier }, 'Month ago', '2026-11-01T12:00:00Z');
    act(() => useAppStore.getState().setReserved('snapshots', [snap]));
    act(() => toggleSnapshot([], 'Month ago', true));
    const rebuilt = rebuildSnapshot(snap).build.curve!;
    const line = last!.zero.find((l) => l.id === 'snapshot-0-zero')!;
    expect(last!.how.zero).toEqual([`Snapshot Month ago: settlement ${earlier}, lined up by time to maturity (years from its own settlement)`]);
    expect(line.colour).toBe(SNAPSHOT_STYLES[0]!.colour);
    for (const pt of line.points.filter((_, i) => i % 20 === 0)) {
      const z = zeroOn(rebuilt, pt.date, 'annual', 'ACT/360');
      expectClose(pt.y, z.ok ? z.value.zero : NaN, 1e-13, 'zeroOn on the rebuilt snapshot curve');
      expect(pt.x).toBe(rebuilt.time(pt.date)); // by time to maturity: years from its own settlement
    }
    act(() => setCompareBy('date'));
    const byDate = last!.zero.find((l) => l.id === 'snapshot-0-zero')!;
    expect(last!.how.forward[0]).toContain('lined up by calendar date');
    const current = lastBuild!.build.curve!;
    for (const pt of byDate.points.filter((_, i) => i % 20 === 0)) {
      expect(pt.x).toBe(current.time(pt.date));
      const z = zeroOn(rebuilt, pt.date, 'annual', 'ACT/360');
      expectClose(pt.y, z.ok ? z.value.zero : NaN, 1e-13, "zeroOn on the rebuilt snapshot curve at the same date (the snapshot table's 'date' reading)");
    }
  });

  it(`draws at most ${SNAPSHOT_OVERLAY_MAX} snapshots and says how many more were chosen`, () => {
    render(<Probe />);
    const snaps = [1, 2, 3, 4, 5].map((k) => takeSnapshot(engineDoc(), `S${k}`, '2026-11-01T12:00:00Z'));
    act(() => useAppStore.getState().setReserved('snapshots', snaps));
    for (const s of snaps) act(() => toggleSnapshot(comparisonChoice(useAppStore.getState().workspace).snapshots, s.name, true));
    expect(last!.zero.map((l) => l.label)).toEqual(['Snapshot S1 (zero)', 'Snapshot S2 (zero)', 'Snapshot S3 (zero)']);
    expect(last!.notes).toContain('2 more snapshots chosen, not drawn (the charts show the first 3)');
  });

  it('draws the reference on the zero chart only when no forward follows exactly, and says so', async () => {
    act(() => useAppStore.getState().setDisplay({ compounding: 'continuous', dayCount: 'ACT/365F', forwardTenor: '3M' }));
    render(<Probe />);
    const s = lastBuild!.build.curve!.settlement;
    const text = `date,discount\n${addTenor(s, parseTenor('1Y')!)},0.97\n${addTenor(s, parseTenor('2Y')!)},0.935\n${addTenor(s, parseTenor('5Y')!)},0.84`;
    act(() => useReferenceInput.getState().set({ text }));
    act(() => setDrawReference(true));
    await waitFor(() => expect(last!.zero.some((l) => l.id === 'reference-zero')).toBe(true)); // the reference reader loads on first use
    const zero = last!.zero.find((l) => l.id === 'reference-zero')!;
    expect(zero.label).toBe('Reference (zero; zero chart only)');
    expect(last!.how.zero[0]).toContain('zero chart only: no two of its dates are 3M apart');
    expect(last!.forward.find((l) => l.id.startsWith('reference'))).toBeUndefined();
    const rows = referenceDifferences(lastBuild!.build.curve!, parseReferenceCsv(text, 'continuous', 'ACT/365F').reference!);
    zero.points.forEach((pt, i) => expectClose(pt.y, rows[i]!.referenceZero!, 1e-15, 'the reference table (referenceDifferences) at the same date'));
    // With 1Y forwards the reference's own dates give two exact forwards (0 to 1Y, 1Y to 2Y): drawn on both charts.
    act(() => useAppStore.getState().setDisplay({ forwardTenor: '1Y' }));
    expect(last!.forward.find((l) => l.id === 'reference-forward')!.points.length).toBe(2);
  });
});

describe('useComparisonOverlay on a deferred build', () => {
  it('rebuilds nothing when a cell is typed into while the deferred build has not moved (same lines, same objects)', async () => {
    let fixed: ReturnType<typeof useCurveBuild> | null = null;
    let out: ComparisonOverlay | null = null;
    function Deferred() {
      const live = useCurveBuild();
      fixed ??= live; // the deferred build, as the workbench hands it before typing pauses
      out = useComparisonOverlay(fixed);
      return null;
    }
    render(<Deferred />);
    const snap = takeSnapshot(fixed!.conversion.doc as unknown as Record<string, unknown>, 'Close', '2026-11-01T12:00:00Z');
    act(() => useAppStore.getState().setReserved('snapshots', [snap]));
    act(() => toggleSnapshot([], 'Close', true));
    act(() => setDrawFit(true));
    await waitFor(() => expect(out!.zero.length).toBe(2)); // the snapshot's line, and the fit's once its code has loaded
    const before = out!;
    const row = useAppStore.getState().workspace.quotes[0]!;
    act(() => useAppStore.getState().setCell(row.id, 'rate', '4.5'));
    expect(out).toBe(before);
  });
});

describe('comparisons in the workbench charts', { timeout: 30_000 }, () => {
  it('names a chosen snapshot the workspace does not hold and lets it be unticked', async () => {
    const user = userEvent.setup({ delay: null });
    act(() => toggleSnapshot([], 'Gone', true));
    render(<App />);
    const charts = screen.getByRole('region', { name: 'Charts' });
    expect(within(charts).getAllByTestId('comparisons-not-drawn')[0]!.textContent).toContain("not among this workspace's snapshots (removed, or opened from a link, which leaves snapshots out): Gone");
    await user.click(screen.getByText('Compare on the charts'));
    await user.click(screen.getByRole('checkbox', { name: /Gone/ }));
    expect(comparisonChoice(useAppStore.getState().workspace).snapshots).toEqual([]);
    expect(within(charts).queryByTestId('comparisons-not-drawn')).toBeNull();
  });

  it('turns the smooth fit on from the charts and adds its line to both legends', async () => {
    const user = userEvent.setup({ delay: null });
    render(<App />);
    await user.click(screen.getByText('Compare on the charts'));
    await user.click(screen.getByRole('checkbox', { name: 'Smooth fit' }));
    expect(useAppStore.getState().workspace.view).toMatchObject({ compareFit: true });
    const charts = screen.getByRole('region', { name: 'Charts' });
    expect((await within(charts).findAllByText('Nelson-Siegel fit (zero)')).length).toBeGreaterThan(0); // the fitting code loads on first use
    expect(within(charts).getAllByText('Nelson-Siegel fit (3M forward)').length).toBeGreaterThan(0);
  });
});
