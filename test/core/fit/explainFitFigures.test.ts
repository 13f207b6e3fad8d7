// The smooth fit's other figures explained: a quote's residual per 100 face, each fitted parameter,
// the weighted RMS error and the fit line's zero rate at a date. Each explanation's value is the
// figure shown (the residual table, the parameters table, the chart's sampled point) bit for bit,
// and its steps are recomputed here from the shown inputs to 1e-15 relative by the published forms:
// Nelson-Siegel zero y(t) = b0 + b1 L1(t/tau1) + b2 L2(t/tau1), L1(x) = (1 - e^-x)/x,
// L2(x) = L1(x) - e^-x, and forward f(t) = b0 + b1 e^-x + b2 x e^-x (C. R. Nelson and A. F. Siegel,
// "Parsimonious Modeling of Yield Curves", Journal of Business 60(4), 1987); Svensson's fourth term
// b3 L2(t/tau2) and b3 x2 e^-x2 (L. E. O. Svensson, NBER Working Paper 4871, 1994); the weighted RMS
// sqrt(sum w r^2 / sum w) from the residual table's own columns; a continuously compounded zero
// -ln DF / tau and a periodic one m ((1/DF)^(1/(m tau)) - 1). The market is invented; the longest
// quote is left out and two weighted, so the fit's line runs past its last fitted maturity (flat
// forward there, as every curve; the left-out quote's residual reads the form itself, as fitCurve's
// residuals do) and the weights enter the objective.
import { buildCurve, explainFitFigure, fitCurve, forwardSamples, HUMP_PEAK, marketDate, OVERNIGHT_KIT, sampleGrid, zeroOn, zeroSamples, type Explanation, type FitErrors, type FitModel, type FitSink } from '../../../src/core/index.ts';
import { INVENTED_2026_FIT, workspaceDoc } from '../../helpers/markets.ts';
import { rel } from '../../helpers/quoteCheckRecompute.ts';

const VALUATION = '2026-12-02';
const MARKET = [...INVENTED_2026_FIT,
  { kind: 'swap', tenor: '15Y', rate: 0.0392 },
];
// Extrapolated flat-forward, so the charts draw the fit past its last fitted maturity.
const ws = buildCurve(workspaceDoc(MARKET, { settlement: VALUATION, extrapolation: 'flat-forward' })).workspace!;
const LONGEST = ws.quotes.length - 1;

const L1 = (x: number): number => -Math.expm1(-x) / x;
const L2 = (x: number): number => L1(x) - Math.exp(-x);
const val = (e: Explanation, n: string): number => {
  const s = e.steps.find((x) => x.name === n);
  if (!s) throw new Error(`no step ${n}`);
  return s.value;
};
const has = (e: Explanation, n: string): boolean => e.steps.some((s) => s.name === n);
/** Nelson-Siegel (1987) / Svensson (1994) zero and forward from the explanation's shown parameters. */
function form(e: Explanation) {
  const b = (n: string): number => val(e, n);
  const sv = has(e, 'tau2');
  return {
    zero: (t: number): number => b('b0') + b('b1') * L1(t / b('tau1')) + b('b2') * L2(t / b('tau1')) + (sv ? b('b3') * L2(t / b('tau2')) : 0),
    forward: (t: number): number => {
      const x = t / b('tau1');
      return b('b0') + b('b1') * Math.exp(-x) + b('b2') * x * Math.exp(-x) + (sv ? b('b3') * (t / b('tau2')) * Math.exp(-t / b('tau2')) : 0);
    },
  };
}
/** Each read's ln DF from the shown steps: -y(t) t, or past T: ln DF(T) - f(T) (t - T). */
function checkReads(e: Explanation, T: number, where: string, flat = false): number {
  const f = form(e);
  let past = 0;
  for (const read of e.reads) {
    if (flat && read.t > T) {
      past++;
      expect(rel(f.zero(T), val(e, 'y(T)')), where).toBeLessThanOrEqual(1e-15);
      expect(rel(f.forward(T), val(e, 'f(T)')), where).toBeLessThanOrEqual(1e-15);
      expect(rel(-val(e, 'y(T)') * T - val(e, 'f(T)') * (read.t - T), read.lnDiscount), where).toBeLessThanOrEqual(1e-15);
    } else {
      const y = val(e, `y(${read.name.slice(3, -1)})`);
      expect(rel(f.zero(read.t), y), where).toBeLessThanOrEqual(1e-15);
      expect(rel(-y * read.t, read.lnDiscount), where).toBeLessThanOrEqual(1e-15);
    }
  }
  return past;
}

const CASES: [FitModel, FitErrors][] = [
  ['nelson-siegel', 'yield'],
  ['nelson-siegel', 'price'],
  ['svensson', 'yield'],
  ['svensson', 'price'],
];

describe('explainFitFigure: residual per 100 face, parameters, RMS and the fit line', () => {
  for (const [model, errors] of CASES) {
    const options = { model, errors, exclude: [LONGEST], weights: { 2: 0.5, 6: 2 } };
    const sink: FitSink = {};
    const made = fitCurve(ws, options, sink);
    if (!made.ok) throw new Error(made.errors[0]!.message);
    const fit = made.value;
    const trace = sink.trace!;
    const T = fit.curve.lastT;

    it(`${model}, ${errors} errors: each residual per 100 face is the table's bit for bit; flows, model price, target and the difference recomputed to 1e-15`, () => {
      let pastQuotes = 0;
      for (const row of fit.residuals) {
        const where = `${row.kind} ${row.maturity}`;
        const o = trace.observations.find((x) => x.ins.index === row.index)!;
        const r = explainFitFigure(fit, trace, row.index, 'price');
        if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
        const e = r.value;
        expect(Object.is(e.value, row.residualPrice), where).toBe(true);
        expect(Object.is(e.steps.at(-1)!.value, e.value), where).toBe(true);
        checkReads(e, T, where);
        if (e.reads.some((read) => read.t > T)) pastQuotes++;
        let pv = 0;
        e.reads.forEach((read, j) => (pv += val(e, `CF${j}`) * Math.exp(read.lnDiscount)));
        expect(rel(pv, val(e, 'model price')), where).toBeLessThanOrEqual(1e-15);
        const target = has(e, 'market price') ? val(e, 'market price') : has(e, 'dirty') ? val(e, 'dirty') : val(e, 'target');
        // The table's market price is the target per 100 face (fitCurve), so the shown target is it.
        expect(rel(target * o.per100, row.marketPrice), where).toBeLessThanOrEqual(1e-15);
        expect(rel((val(e, 'model price') - target) * o.per100, e.value), where).toBeLessThanOrEqual(1e-15);
      }
      // The quote left out lies past the last fitted maturity: its residual reads the form itself there (fitCurve's lnFit).
      expect(pastQuotes).toBeGreaterThan(0);
    });

    it(`${model}, ${errors} errors: the weighted RMS error is the table's bit for bit and recomputed from the residual table`, () => {
      const r = explainFitFigure(fit, trace, -1, 'rms');
      if (!r.ok) throw new Error(r.errors[0]!.message);
      const e = r.value;
      expect(Object.is(e.value, fit.rmsBp)).toBe(true);
      expect(Object.is(e.steps.at(-1)!.value, fit.rmsBp)).toBe(true);
      let S = 0;
      let W = 0;
      const included = fit.residuals.filter((x) => x.included);
      expect(included.length).toBe(fit.residuals.length - 1);
      for (const row of included) {
        // The fitted residual from the table's own columns: model - market yield, or for price errors
        // (market - model price) / (dollar duration), the duration -dP/dy at the market yield.
        const o = trace.observations.find((x) => x.ins.index === row.index)!;
        const res = errors === 'yield' ? row.modelYield - row.marketYield : -(row.residualPrice / o.per100) / o.dollarDuration;
        const k = `${row.index}`;
        expect(rel(val(e, `r(${k})`), res), k).toBeLessThanOrEqual(1e-15);
        expect(val(e, `w(${k})`)).toBe(row.weight);
        S += row.weight * res * res;
        W += row.weight;
      }
      expect(rel(val(e, 'S'), S)).toBeLessThanOrEqual(1e-15);
      expect(rel(val(e, 'W'), W)).toBeLessThanOrEqual(1e-15);
      expect(rel(Math.sqrt(S / W) * 1e4, fit.rmsBp)).toBeLessThanOrEqual(1e-15);
      // Against the shown steps alone, summed as written: sum (sqrt(w) r)^2.
      let shown = 0;
      for (const row of included) shown += (Math.sqrt(val(e, `w(${row.index})`)) * val(e, `r(${row.index})`)) ** 2;
      expect(Object.is(Math.sqrt(shown / val(e, 'W')) * 1e4, e.value)).toBe(true);
    });

    it(`${model}, ${errors} errors: each parameter is the table's, with the objective, iterations and its checks recomputed`, () => {
      const names = model === 'svensson' ? (['b0', 'b1', 'b2', 'b3', 'tau1', 'tau2'] as const) : (['b0', 'b1', 'b2', 'tau1'] as const);
      const rms = explainFitFigure(fit, trace, -1, 'rms');
      if (!rms.ok) throw new Error('no rms');
      for (const name of names) {
        const r = explainFitFigure(fit, trace, -1, name);
        if (!r.ok) throw new Error(`${name}: ${r.errors[0]!.message}`);
        const e = r.value;
        expect(Object.is(e.value, fit.params[name]), name).toBe(true);
        expect(e.steps.at(-1)!.name).toBe(name);
        expect(e.steps.at(-1)!.formula).toContain(`argmin S (${fit.iterations} iterations, ${fit.stopReason}`);
        // The objective is the RMS explanation's, and every parameter of the fit is listed.
        expect(Object.is(val(e, 'S'), val(rms.value, 'S')), name).toBe(true);
        for (const other of names) expect(Object.is(val(e, other), fit.params[other])).toBe(true);
        // The checks: y at the longest fitted maturity by the form, y(0+) = b0 + b1 (L1(0) = 1, L2(0) = 0).
        expect(T).toBe(Math.max(...fit.residuals.filter((x) => x.included).map((x) => x.t)));
        expect(rel(form(e).zero(T), val(e, 'y(T)')), name).toBeLessThanOrEqual(1e-15);
        expect(rel(fit.params.b0 + fit.params.b1, val(e, 'y(0+)')), name).toBeLessThanOrEqual(1e-15);
        expect(e.formula).toContain(`T = ${T}`);
      }
      // What the parameters mean, from the form itself: y(t) -> b0 far out, y(0+) = b0 + b1, and
      // L2 largest at x* = HUMP_PEAK, the root of e^-x (1 + x + x^2) = 1 (d L2 / dx = 0).
      const b0 = explainFitFigure(fit, trace, -1, 'b0');
      if (!b0.ok) throw new Error('no b0');
      const f = form(b0.value);
      expect(Math.abs(f.zero(1e9) - fit.params.b0)).toBeLessThan(1e-8);
      expect(Math.abs(f.zero(1e-9) - (fit.params.b0 + fit.params.b1))).toBeLessThan(1e-8);
      expect(Math.abs(Math.exp(-HUMP_PEAK) * (1 + HUMP_PEAK + HUMP_PEAK ** 2) - 1)).toBeLessThan(1e-15);
      expect(L2(HUMP_PEAK)).toBeGreaterThan(L2(HUMP_PEAK * (1 + 1e-4)));
      expect(L2(HUMP_PEAK)).toBeGreaterThan(L2(HUMP_PEAK * (1 - 1e-4)));
    });

    it(`${model}, ${errors} errors: the fit line's zero at each sampled date is the chart's point bit for bit, in the fit chart's and another convention`, () => {
      // The fit chart's grid (FitPanel's FitChart): to the later of the fit's and the bootstrap's last pillar.
      const end = buildCurve(workspaceDoc(MARKET, { settlement: VALUATION })).curve!.pillars.at(-1)!.date;
      let past = 0;
      for (const [c, dc] of [
        ['continuous', fit.curve.dayCount],
        ['semiannual', 'ACT/360'],
      ] as const) {
        const grid = sampleGrid(fit.curve.settlement, end, 40, fit.curve.dayCount, dc, { n: 3, unit: 'M' });
        const s = zeroSamples(fit.curve, grid, c);
        expect(s.dates.length).toBeGreaterThan(20);
        s.dates.forEach((date, i) => {
          const r = explainFitFigure(fit, trace, -1, 'zero', { date, compounding: c, dayCount: dc });
          if (!r.ok) throw new Error(`${date}: ${r.errors[0]!.message}`);
          const e = r.value;
          expect(Object.is(e.value, s.y[i]), `${c} ${date}`).toBe(true);
          expect(Object.is(e.steps.at(-1)!.value, e.value)).toBe(true);
          past += checkReads(e, T, date, true);
          const ln = e.reads[0]!.lnDiscount;
          const tau = e.yearFractions.find((y) => y.name === 'tau')!.value;
          const rate = c === 'continuous' ? -ln / tau : 2 * (Math.pow(Math.exp(ln), -1 / (2 * tau)) - 1);
          expect(rel(rate, e.value), `${c} ${date}`).toBeLessThanOrEqual(c === 'continuous' ? 1e-15 : 1e-12);
          if (c !== 'continuous') expect(rel(2 * Math.expm1(-ln / (2 * tau)), e.value)).toBeLessThanOrEqual(1e-15);
        });
      }
      expect(past).toBeGreaterThan(0);
    });

    it(`${model}, ${errors} errors: the fit line's forward (date to end) is the charts' forwardSamples bit for bit; recomputed from its two ln DF to 1e-15`, () => {
      const end = buildCurve(workspaceDoc(MARKET, { settlement: VALUATION })).curve!.pillars.at(-1)!.date;
      const grid = sampleGrid(fit.curve.settlement, end, 40, fit.curve.dayCount, 'ACT/360', { n: 3, unit: 'M' });
      const s = forwardSamples(fit.curve, grid, 'simple');
      expect(s.dates.length).toBeGreaterThan(20);
      s.dates.forEach((date, i) => {
        const r = explainFitFigure(fit, trace, -1, 'zero', { date, end: marketDate(date, { n: 3, unit: 'M' }), compounding: 'simple', dayCount: 'ACT/360' });
        if (!r.ok) throw new Error(`${date}: ${r.errors[0]!.message}`);
        const e = r.value;
        expect(Object.is(e.value, s.y[i]), date).toBe(true);
        // A simple forward: (DF(start) / DF(end) - 1) / tau (its definition, common practice), from the ln DF shown.
        const ln = (name: string) => e.reads.find((x) => x.name === name)?.lnDiscount ?? 0;
        const tau = e.yearFractions.find((y) => y.name === 'tau')!.value;
        expect(rel(Math.expm1(ln('DF(start)') - ln('DF(end)')) / tau, e.value), date).toBeLessThanOrEqual(1e-15);
      });
    });
  }
});

// With a year-end turn (the market of fitTurns.test.ts: deposits made from a Nelson-Siegel form
// times a 25 bp turn over 2027-12-31 to 2028-01-03, ACT/360 money market; invented), the fit line's
// zero carries the turn's jump: ln DF = -y(t) t - s d(t) / 360, d(t) the turn's days before the
// date (DF = DF_smooth exp(-s d / 360), Ametrano and Bianchetti 2013, section 4.8, as the project's
// conventions notes state it), the jump written out here by hand.
describe("explainFitFigure: the fit line's zero across a turn", () => {
  it('is zeroOn on the fitted curve bit for bit, its ln DF the form plus the hand-made jump to 1e-15', () => {
    const VAL = '2027-06-15';
    const DAY = 86_400_000;
    const days = (a: string, b: string) => (Date.parse(b) - Date.parse(a)) / DAY;
    const maturities = ['2027-07-15', '2027-09-15', '2027-12-15', '2028-01-18', '2028-03-15', '2028-06-15', '2029-06-15', '2030-06-15', '2032-06-15', '2035-06-15'];
    const quotes = maturities.map((m, i) => ({ kind: 'deposit', maturity: m, rate: 0.035 + 0.001 * Math.sqrt(i) }));
    const doc = { format: 'tenorscope-workspace', version: 2, valuationDate: VAL, curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes, turns: [{ name: 'year end 2027', from: '2027-12-31', to: '2027-12-31', calendar: 'weekends', spreadBp: 25 }] };
    const b = buildCurve(doc, { overnight: OVERNIGHT_KIT });
    expect(b.errors).toEqual([]);
    const sink: FitSink = {};
    const made = fitCurve(b.workspace!, { model: 'nelson-siegel', turns: b.overnight!.turns }, sink);
    if (!made.ok) throw new Error(made.errors[0]!.message);
    const c = made.value.curve;
    for (const date of ['2027-12-31', '2028-01-01', '2028-01-03', '2028-02-01', '2031-06-15']) {
      const r = explainFitFigure(made.value, sink.trace!, -1, 'zero', { date, compounding: 'continuous', dayCount: 'ACT/365F' });
      if (!r.ok) throw new Error(`${date}: ${r.errors[0]!.message}`);
      const e = r.value;
      const z = zeroOn(c, date, 'continuous', 'ACT/365F');
      if (!z.ok) throw new Error('zero');
      expect(Object.is(e.value, z.value.zero), date).toBe(true);
      const t = e.reads[0]!.t;
      const turnDays = Math.min(3, Math.max(0, days('2027-12-31', date)));
      const ln = -form(e).zero(t) * t - (25e-4 * turnDays) / 360;
      expect(rel(ln, e.reads[0]!.lnDiscount), date).toBeLessThanOrEqual(1e-15);
      expect(rel(-ln / t, e.value), date).toBeLessThanOrEqual(1e-15);
    }
  });
});
