// The charts' samples on an edit: a value edit keeps the pillar list (the same object, so the
// pillar ticks are not rendered again) while every sampled line equals a fresh curveSeries; a
// maturity edit gives a new pillar list. The reference is curveSeries run on its own; the
// workspace is the invented demo.
import { DEFAULT_DISPLAY } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { baseCurveSeries, curveSeries } from '../../src/hooks/useCurveSeries.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';

let n = 0;
const demo = demoWorkspace(() => `s${n++}`);
const display = { ...DEFAULT_DISPLAY, ...demo.display, showPar: true };
const edit = (row: number, patch: Record<string, string>) => ({ ...demo, quotes: demo.quotes.map((q, i) => (i === row ? { ...q, ...patch } : q)) });
const series = (ws: typeof demo) => {
  const b = deriveBuild(ws).build;
  return { made: baseCurveSeries(b.curve!, display, b.repricing), fresh: curveSeries(b.curve!, display, b.repricing) };
};

describe('baseCurveSeries after an edit', () => {
  it('a value edit keeps the very pillar list, and every line equals a fresh curveSeries', () => {
    const before = series(demo).made;
    const { made, fresh } = series(edit(4, { rate: '4.61' }));
    expect(made.pillars).toBe(before.pillars);
    expect(made).toEqual(fresh);
    expect(made.zero).not.toEqual(before.zero);
  });

  it('a maturity edit gives a new pillar list', () => {
    const before = series(demo).made;
    const { made, fresh } = series(edit(2, { maturity: '10W' }));
    expect(made.pillars).not.toBe(before.pillars);
    expect(made).toEqual(fresh);
  });
});
