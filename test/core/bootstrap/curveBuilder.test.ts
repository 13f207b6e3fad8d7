// CurveBuilder: which path each build takes, and that the re-quote path gives exactly what a fresh
// buildCurve gives for the same document. The oracle is the engine's own fresh build (a
// consistency property, no outside figure involved); the documents are the committed market40
// fixture (invented), the invented demo workspace and the golden check's seeded random documents.
import market40 from '../../fixtures/market40/market40.json';
import { buildCurve, CurveBuilder, INTERPOLATIONS, toEngineDocument, type BuildOptions, type CurveBuild } from '../../../src/core/index.ts';
import { demoWorkspace } from '../../../src/state/demoWorkspace.ts';
import { goldenCase, GOLDEN_SEED } from '../../cli/golden.ts';

type Doc = Record<string, unknown>;
type QuoteDoc = Record<string, unknown>;

const VALUE_FIELDS = ['rate', 'price', 'cleanPrice', 'yield', 'discountYield'];

/** The document with every quoted value that is a number moved by a small step (k-th variant). */
function moved(doc: Doc, k: number): Doc {
  const quotes = (doc.quotes as QuoteDoc[]).map((q, i) => {
    const out = { ...q };
    for (const f of VALUE_FIELDS) {
      const v = q[f];
      if (typeof v === 'number') out[f] = f === 'price' || f === 'cleanPrice' ? v + 0.0625 * (((i + k) % 3) - 1) : v + 0.00013 * (((i + k) % 5) - 2);
    }
    return out;
  });
  return { ...doc, quotes };
}

const withQuote = (doc: Doc, i: number, patch: QuoteDoc): Doc => ({ ...doc, quotes: (doc.quotes as QuoteDoc[]).map((q, j) => (j === i ? { ...q, ...patch } : q)) });

/** Every part of a build, curves read at their pillars and between them, bit for bit. */
function expectSameBuild(actual: CurveBuild, expected: CurveBuild, where: string): void {
  expect(actual.errors, where).toEqual(expected.errors);
  expect(actual.warnings, where).toEqual(expected.warnings);
  expect(actual.repricing, where).toEqual(expected.repricing);
  expect(actual.leftOut, where).toEqual(expected.leftOut);
  expect(actual.workspace, where).toEqual(expected.workspace);
  expect(actual.sweeps, where).toBe(expected.sweeps);
  const fields = (b: CurveBuild) => b.instruments.map((ins) => ({ index: ins.index, t: ins.t, market: ins.market, field: ins.field, times: ins.times, amounts: Array.from(ins.amounts), target: ins.target, closedFormLn: ins.closedFormLn }));
  expect(fields(actual), where).toEqual(fields(expected));
  expect(actual.curve === null, where).toBe(expected.curve === null);
  if (!actual.curve || !expected.curve) return;
  expect(actual.curve.pillars, where).toEqual(expected.curve.pillars);
  const ts = expected.curve.pillars.flatMap((p, i, all) => [p.t, 0.5 * (p.t + (all[i - 1]?.t ?? 0))]);
  for (const t of [...ts, 0.01, 1.3, 7.7]) {
    expect(Object.is(actual.curve.lnDiscountAt(t), expected.curve.lnDiscountAt(t)), `${where}: ln DF at ${t}`).toBe(true);
    expect(Object.is(actual.curve.forwardAt(t), expected.curve.forwardAt(t)), `${where}: forward at ${t}`).toBe(true);
  }
}

let n = 0;
const demoDoc = toEngineDocument(demoWorkspace(() => `b${n++}`)).doc as Doc;
const fixture = market40 as unknown as Doc;

describe('CurveBuilder.build', () => {
  it.each(INTERPOLATIONS)('a value-only edit re-quotes and equals a fresh buildCurve (market40, %s)', (interpolation) => {
    const base = { ...fixture, curve: { ...(fixture.curve as Doc), interpolation } };
    const builder = new CurveBuilder();
    expectSameBuild(builder.build(base), buildCurve(base), 'first build');
    expect(builder.lastPath).toBe('compiled');
    for (let k = 0; k < 4; k++) {
      const doc = moved(base, k);
      const built = builder.build(doc);
      expect(builder.lastPath).toBe('requoted');
      expectSameBuild(built, buildCurve(doc), `variant ${k}`);
    }
    // One cell typed, as in the workbench: the 2029-03-20 bond's clean price alone moves.
    const one = withQuote(base, 7, { cleanPrice: 99.87 });
    expectSameBuild(builder.build(one), buildCurve(one), 'one cell');
    expect(builder.counts).toEqual({ requoted: 5, compiled: 1, refused: 0 });
  });

  it('the demo workspace: value edits re-quote, and skipInvalid builds equal fresh ones', () => {
    const builder = new CurveBuilder();
    const options: BuildOptions = { skipInvalid: true };
    builder.build(demoDoc, options);
    for (const [row, rate] of [[3, 0.0455], [15, 0.0431], [0, -0.001]] as const) {
      const doc = withQuote(demoDoc, row, { rate });
      const built = builder.build(doc, options);
      expect(builder.lastPath).toBe('requoted');
      expectSameBuild(built, buildCurve(doc, options), `row ${row}`);
    }
  });

  it('a document built twice reuses the very instruments', () => {
    const builder = new CurveBuilder();
    const first = builder.build(fixture);
    const second = builder.build(structuredClone(fixture));
    expect(builder.lastPath).toBe('requoted');
    second.instruments.forEach((ins, i) => expect(ins).toBe(first.instruments[i]));
  });

  it('a change of maturity, kind, convention, settlement, curve day count or switch compiles afresh', () => {
    const edits: [string, Doc][] = [
      ['maturity', withQuote(fixture, 4, { tenor: '10M' })],
      ['kind', withQuote(fixture, 2, { kind: 'zero', price: 99.2, rate: undefined, dayCount: undefined })],
      ['day count', withQuote(fixture, 0, { dayCount: 'ACT/365F' })],
      ['switched off', withQuote(fixture, 5, { enabled: false })],
      ['settlement', { ...fixture, settlement: '2027-03-11' }],
      ['curve day count', { ...fixture, curve: { ...(fixture.curve as Doc), dayCount: 'ACT/360' } }],
    ];
    for (const [what, edit] of edits) {
      const builder = new CurveBuilder();
      builder.build(fixture);
      const built = builder.build(edit);
      expect(builder.lastPath, what).toBe('compiled');
      expectSameBuild(built, buildCurve(edit), what);
    }
    // A zero coupon given as -0 is another coupon for the compiled flows (amounts of -0): compiled.
    {
      const zeroCoupon = withQuote(fixture, 9, { coupon: 0 });
      const builder = new CurveBuilder();
      builder.build(zeroCoupon);
      const negative = withQuote(fixture, 9, { coupon: -0 });
      expectSameBuild(builder.build(negative), buildCurve(negative), 'coupon -0');
      expect(builder.lastPath).toBe('compiled');
    }
    // A bond switched from price to yield changes the field its instrument reads: compiled.
    const bond = (fixture.quotes as QuoteDoc[]).findIndex((q) => q.kind === 'bond');
    expect(bond).toBeGreaterThanOrEqual(0);
    const builder = new CurveBuilder();
    builder.build(fixture);
    const byYield = withQuote(fixture, bond, { cleanPrice: undefined, yield: 0.031 });
    expectSameBuild(builder.build(byYield), buildCurve(byYield), 'bond by yield');
    expect(builder.lastPath).toBe('compiled');
  });

  it('a change of interpolation or extrapolation re-quotes (neither enters the market)', () => {
    const builder = new CurveBuilder();
    builder.build(fixture);
    for (const options of [{ interpolation: 'monotone-convex' }, { extrapolation: 'flat-forward' }] as const) {
      const built = builder.build(fixture, options);
      expect(builder.lastPath).toBe('requoted');
      expectSameBuild(built, buildCurve(fixture, options), JSON.stringify(options));
    }
  });

  it('a refused document is reported as such and keeps the market for the next one', () => {
    const builder = new CurveBuilder();
    builder.build(fixture);
    const refused = builder.build({ ...fixture, settlement: 'soon' });
    expect(builder.lastPath).toBe('refused');
    expectSameBuild(refused, buildCurve({ ...fixture, settlement: 'soon' }), 'refused');
    builder.build(moved(fixture, 1));
    expect(builder.lastPath).toBe('requoted');
    expect(builder.counts).toEqual({ requoted: 1, compiled: 1, refused: 1 });
  });

  it("the golden check's seeded documents, then each with its values moved, equal fresh builds (strict and skipping)", () => {
    let requotes = 0;
    for (let i = 0; i < 400; i++) {
      const { input } = goldenCase(GOLDEN_SEED, i);
      let docs: Doc[];
      try {
        docs = [JSON.parse(input) as Doc];
      } catch {
        docs = input.trim().split('\n').map((line) => JSON.parse(line) as Doc);
      }
      for (const doc of docs) {
        if (!Array.isArray(doc.quotes)) continue;
        for (const options of [{}, { skipInvalid: true }]) {
          const builder = new CurveBuilder();
          expectSameBuild(builder.build(doc, options), buildCurve(doc, options), `case ${i}`);
          const next = moved(doc, i);
          const built = builder.build(next, options);
          if (builder.lastPath === 'requoted') requotes++;
          expectSameBuild(built, buildCurve(next, options), `case ${i} moved`);
        }
      }
    }
    expect(requotes).toBeGreaterThan(300);
  });
});
