import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  buildNamedCurves,
  buildWorkbenchCurves,
  dependentsOf,
  namedQuoteRow,
  parseRow,
  readNamedCurves,
  removeCurve,
  removeNamedQuote,
  saveCurve,
  setNamedQuote,
  toEngineDocument,
  workbenchFromEngine,
  type CurveSpec,
  type WorkbenchDocument,
} from '../../../src/core/index.ts';

// Edits of a workspace's named curves in the workbench (issue 18 items 8 and 10): adding, changing
// and removing curves, and a named curve's quotes edited as sheet rows. The rules checked are the
// document's own (README "Several curves": a plain name used once, not "default"; a projection
// curve names its index tenor and a discounting curve; no circle of curves). The fixture is the
// command line's invented test document (test/fixtures/namedCurves/SOURCE.md); the reference for
// every build is the `curve` command's own path (buildCurve with readNamedCurves, then
// buildNamedCurves, as src/cli/curveCommand.ts does), held to the bit.

const FIXTURE = JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8')) as Record<string, unknown> & { curves: Record<string, unknown>[] };
const spec = (over: Partial<CurveSpec>): CurveSpec => ({ name: 'ois2', role: 'discounting', index: '3M', discountCurve: 'default', interpolation: 'monotone-convex', ...over });
const curvesOf = (r: ReturnType<typeof saveCurve>): readonly unknown[] | undefined => {
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.curves;
};
const errorsOf = (r: ReturnType<typeof saveCurve>) => (r.ok ? {} : r.errors);

describe('saveCurve', () => {
  it('adds a curve at the end, every other entry the very same object', () => {
    const next = curvesOf(saveCurve(FIXTURE.curves, null, spec({ name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default' })))!;
    expect(next).toHaveLength(3);
    expect(next[0]).toBe(FIXTURE.curves[0]);
    expect(next[1]).toBe(FIXTURE.curves[1]);
    expect(next[2]).toEqual({ name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default', curve: { interpolation: 'monotone-convex' }, quotes: [] });
    // The first curve of a workspace of one curve.
    expect(curvesOf(saveCurve(undefined, null, spec({ name: 'govt2', role: 'government' })))).toEqual([{ name: 'govt2', role: 'government', curve: { interpolation: 'monotone-convex' }, quotes: [] }]);
  });

  it('refuses, on the field and naming what to change, an empty or malformed name, a name used twice or the default curve\'s, a projection curve without a discounting curve, one discounted on itself or on no curve', () => {
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ name: '  ' })))).toEqual({ name: 'Give the curve a name, such as "euribor3m"' });
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ name: 'govt' })))).toEqual({ name: '"govt" is used by another curve; choose another name' });
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ name: 'default' })))).toEqual({ name: '"default" is used by the sheet\'s curve; choose another name' });
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ name: '3m curve' }))).name).toMatch(/^Start with a letter, then up to 31 letters, digits, - or _/);
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ role: 'projection', discountCurve: '' })))).toEqual({ discountCurve: 'A projection curve needs a discounting curve: choose one' });
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ role: 'projection', discountCurve: 'ois2' })))).toEqual({ discountCurve: 'A curve cannot be discounted on itself; choose another' });
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ role: 'projection', discountCurve: 'estr' })))).toEqual({ discountCurve: 'No curve is named "estr"; choose one listed' });
    expect(errorsOf(saveCurve(FIXTURE.curves, null, spec({ role: 'projection', index: '2M' }))).index).toBe("Choose the term index's tenor: one of 1M, 3M, 6M, 12M");
    // The engine's reader refuses the same documents (so the form never lets through what the file would refuse).
    const refused = (curves: unknown[]) => buildWorkbenchCurves({ settlement: '2027-03-10', curves }, null).errors.length > 0;
    expect(refused([...FIXTURE.curves, { name: 'govt', role: 'government', quotes: [] }])).toBe(true);
    expect(refused([...FIXTURE.curves, { name: 'x', role: 'projection', index: '3M', quotes: [] }])).toBe(true);
  });

  it('refuses a discounting curve that closes a circle, naming the curves in it, and changes nothing', () => {
    const two = curvesOf(saveCurve(FIXTURE.curves, null, spec({ name: 'euribor3m', role: 'projection', discountCurve: 'euribor6m' })))!;
    const before = JSON.stringify(two);
    const r = saveCurve(two, 'euribor6m', spec({ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'euribor3m' }));
    expect(errorsOf(r)).toEqual({ discountCurve: 'The curves "euribor6m" -> "euribor3m" -> "euribor6m" would need each other in a circle; discount "euribor6m" on "default" or a curve not built on it' });
    expect(JSON.stringify(two)).toBe(before);
    // The reader names the same circle in the document the edit would have made.
    const circle = two.map((c) => ((c as { name: string }).name === 'euribor6m' ? { ...(c as object), discountCurve: 'euribor3m' } : c));
    expect(buildWorkbenchCurves({ settlement: '2027-03-10', curves: circle }, null).errors.map((e) => e.message).join('\n')).toMatch(/"euribor6m" -> "euribor3m" -> "euribor6m"/);
  });

  it('renames a curve: the curves discounted on it, the basis swaps against it follow, its quotes and settings are kept', () => {
    const withBasis = curvesOf(saveCurve(FIXTURE.curves, null, spec({ name: 'euribor3m', role: 'projection', discountCurve: 'euribor6m' })))!;
    const basis = setNamedQuote(withBasis, 'euribor3m', 0, { enabled: true, kind: 'swap', maturity: '5Y', rate: '0.0012', price: '', coupon: '', frequency: '', dayCount: '', terms: '' }, 'euribor6m');
    if (!basis.ok) throw new Error('basis');
    const renamed = curvesOf(saveCurve(basis.curves, 'euribor6m', spec({ name: 'ibor6m', role: 'projection', index: '6M', discountCurve: 'default' })))! as Record<string, unknown>[];
    expect(renamed[0]).toEqual({ ...FIXTURE.curves[0], name: 'ibor6m', curve: { interpolation: 'monotone-convex' } });
    expect(renamed[1]).toBe(basis.curves[1]);
    expect(renamed[2]).toMatchObject({ name: 'euribor3m', discountCurve: 'ibor6m', quotes: [{ kind: 'swap', tenor: '5Y', rate: 0.0012, against: 'ibor6m' }] });
    expect(dependentsOf(renamed, 'ibor6m')).toEqual(['euribor3m']);
    expect(buildWorkbenchCurves({ settlement: '2027-03-10', curves: renamed }, null).errors.filter((e) => !/did not build|no curve/.test(e.message)).map((e) => e.path)).not.toContain('curves[2].discountCurve');
  });
});

describe('removeCurve', () => {
  it('names the curves that need a curve (directly or through another) and removes them only when asked; the last curve removed leaves no curves', () => {
    const three = curvesOf(saveCurve(FIXTURE.curves, null, spec({ name: 'euribor3m', role: 'projection', discountCurve: 'euribor6m' })))!;
    const ois = curvesOf(saveCurve(three, null, spec({ name: 'estr' })))!;
    const chained = curvesOf(saveCurve(ois, 'euribor6m', spec({ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'estr' })))!;
    expect(removeCurve(chained, 'estr', false)).toEqual({ ok: false, dependents: ['euribor6m', 'euribor3m'] });
    const all = removeCurve(chained, 'estr', true);
    expect(all.ok && all.curves!.map((c) => (c as { name: string }).name)).toEqual(['govt']);
    const alone = removeCurve(chained, 'govt', false);
    expect(alone.ok && alone.curves!.map((c) => (c as { name: string }).name)).toEqual(['euribor6m', 'euribor3m', 'estr']);
    expect(removeCurve([FIXTURE.curves[1]], 'govt', false)).toEqual({ ok: true, curves: undefined });
  });
});

describe('named quotes as sheet rows', () => {
  it('namedQuoteRow writes each fixture quote as the cells the sheet reads back to the same quote; a field with no cell gives null', () => {
    for (const c of FIXTURE.curves) {
      for (const q of c.quotes as Record<string, unknown>[]) {
        const row = namedQuoteRow(q);
        expect(row).not.toBeNull();
        expect(parseRow({ id: '', ...row! }, 'decimal').quote).toEqual(q);
      }
    }
    expect(namedQuoteRow({ kind: 'future', contract: '1M', month: '2027-03', price: 97.5, fixings: { '2027-03-01': 0.0241 } })).toBeNull();
    expect(namedQuoteRow({ kind: 'swap', tenor: '5Y', rate: 0.001, against: 'default' })).toEqual({ enabled: true, kind: 'swap', maturity: '5Y', rate: '0.001', price: '', coupon: '', frequency: '', dayCount: '', terms: '' });
  });

  it("setNamedQuote reads a row with the sheet's parseRow (an FRA's start x end, a kind changed), adds past the end, and refuses a wrong cell with the sheet's own message", () => {
    const row = { enabled: true, kind: 'fra', maturity: '3x9', rate: '0.025', price: '', coupon: '', frequency: '', dayCount: '', terms: '' };
    const r = setNamedQuote(FIXTURE.curves, 'euribor6m', 0, row, '');
    if (!r.ok) throw new Error(JSON.stringify(r.issues));
    const sheet = parseRow({ id: 'x', ...row }, 'decimal').quote;
    expect((r.curves[0] as { quotes: unknown[] }).quotes[0]).toEqual(sheet);
    expect((r.curves[0] as { quotes: unknown[] }).quotes.slice(1)).toEqual((FIXTURE.curves[0]!.quotes as unknown[]).slice(1));
    expect(r.curves[1]).toBe(FIXTURE.curves[1]);
    const added = setNamedQuote(FIXTURE.curves, 'govt', 2, { ...row, kind: 'zero', maturity: '10Y', rate: '0.027' }, '');
    expect(added.ok && (added.curves[1] as { quotes: unknown[] }).quotes[2]).toEqual({ kind: 'zero', tenor: '10Y', rate: 0.027 });
    const wrong = setNamedQuote(FIXTURE.curves, 'govt', 0, { ...row, kind: 'zero', maturity: '10 years' }, '');
    expect(wrong.ok).toBe(false);
    expect(!wrong.ok && wrong.issues.maturity?.message).toBe(parseRow({ id: 'x', ...row, kind: 'zero', maturity: '10 years' }, 'decimal').issues.maturity?.message);
    expect(removeNamedQuote(FIXTURE.curves, 'govt', 0)[1]).toEqual({ ...FIXTURE.curves[1], quotes: [(FIXTURE.curves[1]!.quotes as unknown[])[1]] });
  });

  it('after curves and quotes are edited, the workbench builds every named curve as the curve command builds the saved document, to the bit', () => {
    let n = 0;
    const wb = workbenchFromEngine(FIXTURE, () => `r${n++}`, readNamedCurves);
    if (!wb.ok) throw new Error('open');
    let curves = curvesOf(saveCurve(wb.value.curves, null, spec({ name: 'euribor3m', role: 'projection', index: '3M', discountCurve: 'default', interpolation: 'log-linear-discount' })))!;
    const cell = { enabled: true, price: '', coupon: '', frequency: '', dayCount: '', terms: '' };
    for (const [k, kind, maturity, rate] of [
      [0, 'deposit', '3M', '0.0231'],
      [1, 'fra', '3x6', '0.0238'],
      [2, 'swap', '2Y', '0.0249'],
      [3, 'swap', '5Y', '0.0262'],
    ] as const) {
      const r = setNamedQuote(curves, 'euribor3m', k, { ...cell, kind, maturity, rate }, '');
      if (!r.ok) throw new Error(JSON.stringify(r.issues));
      curves = r.curves;
    }
    const doc: WorkbenchDocument = { ...wb.value, curves };
    const engine = toEngineDocument(doc).doc;
    const main = buildCurve(JSON.parse(JSON.stringify(engine)), { readCurves: readNamedCurves, skipInvalid: true });
    const command = buildNamedCurves(main.workspace!, main.curve, { skipInvalid: true });
    const built = buildWorkbenchCurves(doc, main.curve);
    expect(built.errors).toEqual([]);
    expect(built.curves.map((c) => c.name)).toEqual(['euribor6m', 'govt', 'euribor3m']);
    for (const c of built.curves) {
      const ref = command.find((x) => x.name === c.name)!;
      expect(c.build.curve!.pillars.map((p) => p.discount)).toEqual(ref.build.curve!.pillars.map((p) => p.discount));
      expect(c.build.repricing.map((r) => r.repricingError)).toEqual(ref.build.repricing.map((r) => r.repricingError));
    }
    expect(built.curves[2]!.build.curve!.pillars).toHaveLength(4);
  });
});
