// Convexity adjustments of rate futures filled by a stated model (instruments/convexity.ts).
// Sources, named at each check:
// - Hull's Ho-Lee adjustment, forward = futures - sigma^2 t1 t2 / 2 on continuously compounded
//   ACT/365 rates: J. Hull, Options, Futures, and Other Derivatives (the Eurodollar futures problem
//   with price 95.75 at three years and sigma 0.8%), its published solution as quoted at
//   event.pzacademy.com/qa/62980: 4.25% ACT/360 is 4.3090% ACT/ACT, 4.2860% continuous, the adjustment
//   0.5 x 0.008^2 x 3 x 3.25 = 0.000312 and the forward 4.255% (MARKET-CONVENTIONS.md section e).
// - The Hull-White bias of G. Kirikos and D. Novak, "Convexity Conundrums", Risk, March 1997, as the
//   QuantLib test suite checks it (test-suite/shortratemodels.cpp, testFuturesConvexityBias: price 94,
//   a 0.03, sigma 0.015, t 5, T 5.25, forward 0.0573037 within 1e-7).
// - MARKET-CONVENTIONS.md section e [C]: the Hull-White figure as a -> 0 is 0.0568611 on the same inputs.
import { describe, expect, it } from 'vitest';
import { buildCurve, toEngineDocument, workbenchFromEngine, readWorkbenchDocument, unknownSettings, hoLeeAdjustment, hullWhiteBias, modelConvexityBp, simpleToContinuous, continuousToSimple, validateWorkspace, quoteSchedule, type FutureQuote } from '../../../src/core/index.ts';
import { workspaceDoc, type Quote as RawQuote } from '../../helpers/markets.ts';

describe('the models against their published worked examples', () => {
  it("Ho-Lee (Hull's problem): 4.25% at three years, sigma 0.8%: 4.2860% continuous, adjustment 0.000312, forward 4.255%", () => {
    // A quarter of 91.25 days makes the conversion Hull's: x 365/360, then quarterly to continuous.
    const continuous = simpleToContinuous(0.0425, 91.25);
    expect(Math.abs(continuous - 0.04286)).toBeLessThan(5e-7); // published to 4 decimals in %
    expect(Math.abs(4 * Math.log(1 + (0.0425 * 365) / 360 / 4) - continuous)).toBeLessThan(1e-15); // the same conversion, two roundings apart
    expect(Math.abs(hoLeeAdjustment(0.008, 3, 3.25) - 0.000312)).toBeLessThan(1e-18);
    expect(Math.abs(continuous - hoLeeAdjustment(0.008, 3, 3.25) - 0.04255)).toBeLessThan(5e-6); // published to 3 decimals in %
    expect(Math.abs(continuousToSimple(continuous, 91.25) - 0.0425)).toBeLessThan(1e-15);
  });

  it('Hull-White (Kirikos and Novak, as the QuantLib test suite checks it): price 94, a 0.03, sigma 1.5%, 5 to 5.25 years: forward 0.0573037', () => {
    const forward = 0.06 - hullWhiteBias(0.06, 5, 5.25, 0.25, 0.015, 0.03);
    expect(Math.abs(forward - 0.0573037)).toBeLessThan(1e-7);
    // As a -> 0 (MARKET-CONVENTIONS.md section e, computed there): 0.0568611; continuous in a.
    expect(Math.abs(0.06 - hullWhiteBias(0.06, 5, 5.25, 0.25, 0.015, 0) - 0.0568611)).toBeLessThan(1e-7);
    // B(x) = x (1 - a x / 2 + ...): at a = 1e-12 the bias moves by about 1e-14 relative, no more.
    expect(Math.abs(hullWhiteBias(0.06, 5, 5.25, 0.25, 0.015, 1e-12) / hullWhiteBias(0.06, 5, 5.25, 0.25, 0.015, 0) - 1)).toBeLessThan(1e-11);
  });

  it('in bp on the futures rate: Ho-Lee through the continuous rate and back, zero without volatility, growing with time', () => {
    const holee = { model: 'ho-lee', volatility: 0.008, meanReversion: 0 } as const;
    // Hull's inputs on a 91.25-day quarter: 4.25% less the simple equivalent of 4.2548% continuous.
    const bp = modelConvexityBp(holee, 0.0425, 91.25, 3, 3.25);
    expect(Math.abs(bp - (0.0425 - continuousToSimple(simpleToContinuous(0.0425, 91.25) - 0.000312, 91.25)) * 1e4)).toBeLessThan(1e-12);
    expect(bp).toBeGreaterThan(3.1);
    expect(bp).toBeLessThan(3.2);
    expect(Math.abs(modelConvexityBp({ ...holee, volatility: 0 }, 0.0425, 91, 3, 3.25))).toBeLessThan(1e-12); // the round trip's rounding only
    const hw = { model: 'hull-white', volatility: 0.01, meanReversion: 0.03 } as const;
    expect(modelConvexityBp(hw, 0.04, 91, 1, 1.25)).toBeLessThan(modelConvexityBp(hw, 0.04, 91, 2, 2.25));
  });
});

// Invented prices (test data), valued 2026-12-02 as in test/core/kinds/future.test.ts.
const VALUATION = '2026-12-02';
const MARKET: readonly RawQuote[] = [
  { kind: 'deposit', tenor: '1W', rate: 0.0381 },
  { kind: 'future', month: '2027-03', price: 96.38 },
  { kind: 'future', month: '2027-06', price: 96.52 },
  { kind: 'future', month: '2027-09', price: 96.6, convexity: 1.5 },
  { kind: 'future', month: '2027-12', price: 96.63 },
  { kind: 'ois', tenor: '2Y', rate: 0.0345 },
];
const withModel = (model: unknown, quotes: readonly RawQuote[] = MARKET) => {
  const doc = workspaceDoc(quotes, { settlement: VALUATION, interpolation: 'log-linear-discount' }) as unknown as { curve: Record<string, unknown> };
  doc.curve.futuresConvexity = model;
  return doc;
};

describe('the curve setting fills the adjustment of every future without a typed one', () => {
  it('Hull-White fills each contract from its t1 and t2 (ACT/365F from the valuation date); a typed one stays; every quote reprices', () => {
    const model = { model: 'hull-white', volatility: 0.01, meanReversion: 0.03 };
    const build = buildCurve(withModel(model));
    expect(build.errors).toEqual([]);
    const futures = build.workspace!.quotes.filter((q): q is FutureQuote => q.kind === 'future');
    const march = futures[0]!;
    // March 2027: 2027-03-17 to 2027-06-16, 105 and 196 days after 2026-12-02, 91 days.
    expect(march.convexityFill).toEqual({ ...model, t1: 105 / 365, t2: 196 / 365 });
    expect(march.convexity).toBe(hullWhiteBias((100 - 96.38) / 100, 105 / 365, 196 / 365, 91 / 360, 0.01, 0.03) * 1e4);
    expect(futures[2]!.convexity).toBe(1.5);
    expect(futures[2]!.convexityFill).toBeUndefined();
    expect(futures[1]!.convexity).toBeGreaterThan(march.convexity);
    for (const r of build.repricing) expect(Math.abs(r.repricingError), `quotes[${r.index}]`).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
    // The forward over March 2027 is the futures rate less the filled adjustment, read off the curve.
    const c = build.curve!;
    const df = (d: string) => Math.exp(c.lnDiscountAt(c.time(d)));
    expect(Math.abs((df('2027-03-17') / df('2027-06-16') - 1) * (360 / 91) - (0.0362 - march.convexity / 1e4))).toBeLessThan(1e-13);
  });

  it('the quote check names the model and its inputs beside the adjusted rate', () => {
    const build = buildCurve(withModel({ model: 'ho-lee', volatility: 0.012 }));
    const march = build.workspace!.quotes.find((q) => q.kind === 'future')!;
    const text = JSON.stringify(quoteSchedule(march, VALUATION, build.curve));
    expect(text).toMatch(/Ho-Lee \(Hull\)/);
    expect(text).toMatch(/\u03c3 1\.2000% a year, t1 0\.2877 y and t2 0\.5370 y/); // 105 and 196 days over 365
  });

  it('without the setting nothing changes: the adjustment is 0 (or as typed)', () => {
    const build = buildCurve(workspaceDoc(MARKET, { settlement: VALUATION, interpolation: 'log-linear-discount' }));
    const futures = build.workspace!.quotes.filter((q): q is FutureQuote => q.kind === 'future');
    expect(futures.map((q) => q.convexity)).toEqual([0, 0, 1.5, 0]);
  });

  it('refuses an unknown model, a negative or huge volatility, a mean reversion on Ho-Lee, naming the field and what is valid', () => {
    const messages = (model: unknown) => validateWorkspace(withModel(model)).errors.map((e) => `${e.path}: ${e.message}`);
    expect(messages({ model: 'black', volatility: 0.01 }).join('\n')).toMatch(/curve\.futuresConvexity\.model.*one of ho-lee, hull-white/);
    expect(messages({ model: 'ho-lee', volatility: -0.01 }).join('\n')).toMatch(/curve\.futuresConvexity\.volatility.*from 0 to 0\.1/);
    expect(messages({ model: 'ho-lee', volatility: 1 }).join('\n')).toMatch(/curve\.futuresConvexity\.volatility/);
    expect(messages({ model: 'ho-lee', volatility: 0.01, meanReversion: 0.03 }).join('\n')).toMatch(/unknown field "curve\.futuresConvexity\.meanReversion"/);
    expect(messages({ model: 'hull-white', volatility: 0.01 }).join('\n')).toMatch(/curve\.futuresConvexity\.meanReversion must be a number/);
    expect(messages('hull-white').join('\n')).toMatch(/must be an object/);
  });
});

describe('the setting in the workbench document', () => {
  it('an engine file with a model opens in the workbench, keeps it through a save and builds the same adjustments', () => {
    for (const model of [{ model: 'ho-lee', volatility: 0.012 }, { model: 'hull-white', volatility: 0.01, meanReversion: 0.05 }]) {
      const file = withModel(model, MARKET.filter((q) => q.convexity === undefined));
      const wb = workbenchFromEngine(file, () => 'r');
      expect(wb.ok).toBe(true);
      if (!wb.ok) continue;
      expect(wb.value.curve.futuresConvexity).toEqual(model);
      expect(unknownSettings(wb.value)).toEqual([]);
      const saved = readWorkbenchDocument(JSON.parse(JSON.stringify(wb.value)), () => 'r');
      expect(saved.doc!.curve.futuresConvexity).toEqual(model);
      const engine = toEngineDocument(saved.doc!).doc as { curve: Record<string, unknown> };
      expect(engine.curve.futuresConvexity).toEqual(model);
      const a = buildCurve(file).workspace!.quotes.map((q) => (q.kind === 'future' ? q.convexity : null));
      const b = buildCurve(engine).workspace!.quotes.map((q) => (q.kind === 'future' ? q.convexity : null));
      expect(b).toEqual(a);
      expect(a.filter((x) => x !== null && x > 0)).toHaveLength(3);
    }
  });
});
