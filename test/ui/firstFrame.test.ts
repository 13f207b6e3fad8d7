// The start-up steps (src/hooks/firstFrame.ts) make the base build and the charts' samples before
// the first render; the hooks must then show exactly what a fresh derivation gives (the same
// pillars, discount factors and drawn samples), reuse only while the inputs are the same objects,
// and derive afresh after any edit. The reference is deriveBuild / curveSeries run on their own.
import { FIRST_FRAME_STEPS } from '../../src/hooks/firstFrame.ts';
import { baseBuildOf, deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { baseCurveSeries, curveSeries } from '../../src/hooks/useCurveSeries.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';
import { useAppStore } from '../../src/state/store.ts';

let n = 0;
const demo = demoWorkspace(() => `f${n++}`);

describe('FIRST_FRAME_STEPS', () => {
  it('leave the base build and the samples the first render reads, equal to a fresh derivation', () => {
    useAppStore.setState({ workspace: demo });
    for (const step of FIRST_FRAME_STEPS) step();
    const ws = useAppStore.getState().workspace;
    const made = baseBuildOf(ws);
    // Reused by identity: what the steps made is what useCurveBuild's first render returns.
    expect(baseBuildOf({ ...ws })).toBe(made);
    const fresh = deriveBuild(ws);
    expect(made.build.curve!.pillars).toEqual(fresh.build.curve!.pillars);
    for (const t of [0.1, 1.7, 9.3, 29.9]) expect(made.build.curve!.lnDiscountAt(t)).toBe(fresh.build.curve!.lnDiscountAt(t));
    expect(made.rowIssues).toEqual(fresh.rowIssues);
    const series = baseCurveSeries(made.build.curve!, ws.display, made.build.repricing);
    expect(baseCurveSeries(made.build.curve!, ws.display, made.build.repricing)).toBe(series);
    expect(series).toEqual(curveSeries(fresh.build.curve!, ws.display, fresh.build.repricing));
  });

  it('an edit after the steps is derived afresh (a new rate moves the curve)', () => {
    useAppStore.setState({ workspace: demo });
    for (const step of FIRST_FRAME_STEPS) step();
    const before = baseBuildOf(demo);
    const edited = { ...demo, quotes: demo.quotes.map((q, i) => (i === 3 ? { ...q, rate: '4.91' } : q)) };
    const after = baseBuildOf(edited);
    expect(after).not.toBe(before);
    expect(after.build.curve!.lnDiscountAt(1.7)).toBe(deriveBuild(edited).build.curve!.lnDiscountAt(1.7));
    expect(after.build.curve!.lnDiscountAt(1.7)).not.toBe(before.build.curve!.lnDiscountAt(1.7));
    const display = { ...demo.display };
    expect(baseCurveSeries(after.build.curve!, display, after.build.repricing)).not.toBe(baseCurveSeries(after.build.curve!, demo.display, after.build.repricing));
  });
});
