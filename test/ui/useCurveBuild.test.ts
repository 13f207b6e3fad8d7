// The workbench's build: buildCurve's compiled instruments, the workbench builder (one CurveBuilder,
// whose paths test/core/bootstrap/curveBuilder.test.ts holds to fresh builds) on value edits, and
// the row issues deriveBuild places.
import { buildCurve } from '../../src/core/index.ts';
import { toEngineDocument } from '../../src/core/index.ts';
import { deriveBuild, workbenchBuilder } from '../../src/hooks/useCurveBuild.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';

let n = 0;
const demo = demoWorkspace(() => `u${n++}`);
const withRate = (row: number, rate: string) => ({ ...demo, quotes: demo.quotes.map((q, i) => (i === row ? { ...q, rate } : q)) });

describe('deriveBuild through the workbench builder', () => {
  it.each(['monotone-convex', 'log-linear-discount', 'cubic-zero'] as const)('a value edit re-quotes and equals a full buildCurve (%s)', (interpolation) => {
    const base = { ...demo, curve: { ...demo.curve, interpolation } };
    deriveBuild(base); // the builder now holds this market
    for (const [row, rate] of [[3, '4.55'], [15, '4.31'], [0, '\u22120.10']] as const) {
      const edited = { ...withRate(row, rate), curve: base.curve };
      const fast = deriveBuild(edited).build;
      expect(workbenchBuilder.lastPath).toBe('requoted');
      const full = buildCurve(toEngineDocument(edited).doc, { skipInvalid: true });
      expect(fast.errors).toEqual(full.errors);
      expect(fast.curve!.pillars).toEqual(full.curve!.pillars);
      expect(fast.repricing).toEqual(full.repricing);
      expect(fast.leftOut).toEqual(full.leftOut);
      expect(fast.workspace!.quotes).toEqual(full.workspace!.quotes);
      for (const t of [0.1, 1.7, 9.3, 29.9, 33]) expect(fast.curve!.lnDiscountAt(t)).toBe(full.curve!.lnDiscountAt(t));
    }
  });

  it("reuses buildCurve's own compiled instruments: one per pillar, in pillar order, with duplicates and switched-off rows left out", () => {
    const dup = { ...demo, quotes: [...demo.quotes, { ...demo.quotes[3]!, id: 'dup' }].map((q, i) => (i === 5 ? { ...q, enabled: false } : q)) };
    const full = buildCurve(toEngineDocument(dup).doc, { skipInvalid: true });
    expect(full.curve).not.toBeNull();
    expect(full.instruments.map((ins) => ins.index)).toEqual(full.curve!.pillars.map((p) => p.quote));
    expect(full.instruments.map((ins) => ins.t)).toEqual(full.curve!.pillars.map((p) => p.t));
    expect(full.leftOut.map((l) => l.index)).toEqual([5, demo.quotes.length]); // the switched-off row and the duplicate
    // A failed build carries none.
    expect(buildCurve({ ...toEngineDocument(demo).doc, settlement: 'soon' }).instruments).toEqual([]);
  });

  it('a change of maturity takes the full build', () => {
    deriveBuild(demo);
    const moved = { ...demo, quotes: demo.quotes.map((q, i) => (i === 2 ? { ...q, maturity: '10W' } : q)) };
    const built = deriveBuild(moved).build;
    expect(workbenchBuilder.lastPath).toBe('compiled');
    expect(built.curve!.pillars).toEqual(buildCurve(toEngineDocument(moved).doc, { skipInvalid: true }).curve!.pillars);
  });
});

describe('deriveBuild row issues', () => {
  it('puts a negative-forward warning on the rate cell that causes it, not on the kind cell', () => {
    // Invented demo edit: the 3M deposit at 0.5% under a 2M deposit at 4.36% makes the 2M-3M
    // forward negative (DF(3M) > DF(2M) for simple ACT/360 deposits).
    const doc = withRate(3, '0.5');
    const built = deriveBuild(doc);
    expect(built.build.warnings.some((w) => w.code === 'negative-forward')).toBe(true);
    const warned = built.rowIssues.flatMap((issues, row) => Object.entries(issues).filter(([, v]) => v?.severity === 'warning').map(([cell]) => ({ row, cell })));
    expect(warned.length).toBeGreaterThan(0);
    for (const w of warned) expect(w.cell, `row ${w.row + 1}`).toBe('rate');
    expect(built.rowIssues.some((issues) => issues.kind !== undefined)).toBe(false);
  });
});

describe('the spot gap in the sheet', () => {
  it('a TN deposit with no ON before it is warned about on its maturity cell (it starts the day after valuation, before any pillar); with ON the warning goes', () => {
    // The demo values on Tuesday 2026-12-15 (invented market); TN on the weekends calendar runs 16 -> 17 December.
    const tn = { ...demo, quotes: demo.quotes.map((q, i) => (i === 0 ? { ...q, maturity: 'TN' } : q)) };
    const r = deriveBuild(tn);
    expect(r.build.curve).not.toBeNull();
    expect(r.rowIssues[0]!.maturity).toEqual({ severity: 'warning', message: expect.stringMatching(/^row 1 starts on 2026-12-16, after the valuation date 2026-12-15 and before the curve's first pillar 2026-12-17/) });
    expect(r.rowIssues[0]!.kind).toBeUndefined();
    const withOn = { ...tn, quotes: [{ ...demo.quotes[0]!, id: 'on', maturity: 'ON' }, ...tn.quotes] };
    expect(deriveBuild(withOn).rowIssues.some((x) => x.maturity !== undefined)).toBe(false);
  });
});
