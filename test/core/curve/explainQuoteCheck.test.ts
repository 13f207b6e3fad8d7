// The quote check explained: each quote's model value re-priced off the curve, traced through the
// instrument's own quoteFromFlows (quoteOnCurve with a trace), equals the quote check's figure (the
// build's repricing row, read from the bootstrap's flow table) bit for bit, and each kind's steps
// recomputed here from the inputs the explanation shows (discount factors read, year fractions,
// flows, convexity adjustment) give the figure to 1e-15 relative. The formulas checked against:
// deposit and FRA, DF(S)/DF(E) = 1 + r tau (money-market convention; QuantLib's DepositRateHelper
// and FraRateHelper); single-curve par swap S = (1 - DF(T_n)) / sum tau_i DF(T_i) (Hull, Options,
// Futures, and Other Derivatives, the valuation of swaps); OIS with a payment lag, floating leg
// sum (DF(S_i)/DF(E_i) - 1) DF(P_i) (the compounded overnight coupon telescoping per period);
// bond dirty price sum CF_i DF(T_i), clean = dirty - accrued (ICMA Rule 251 for the accrual);
// SOFR futures price 100 x (1 - R - CA) (CME SOFR futures contract specifications). Market data
// invented for the test.
import { bondDirtyFromYield, buildCurve, explainQuoteCheck } from '../../../src/core/index.ts';
import { quoteOnCurve } from '../../../src/core/instruments/instrument.ts';
import { recompute, rel } from '../../helpers/quoteCheckRecompute.ts';
import { workspaceDoc } from '../../helpers/markets.ts';

const VALUATION = '2026-12-02';
const MARKET = [
  { kind: 'deposit', tenor: 'ON', rate: 0.0381 },
  { kind: 'deposit', tenor: 'T/N', rate: 0.0382 },
  { kind: 'deposit', tenor: '1M', rate: 0.0383 },
  { kind: 'future', contract: '1M', month: '2027-01', price: 96.2 },
  { kind: 'bill', maturity: '2027-04-08', discountYield: 0.0375 },
  { kind: 'bill', maturity: '2027-05-06', price: 98.7, calendar: 'us-gov-securities', spotLag: 1 },
  { kind: 'fra', period: '2x5', rate: 0.0372 },
  { kind: 'future', month: '2027-03', price: 96.38 },
  { kind: 'future', month: '2027-06', price: 96.52 },
  { kind: 'future', month: '2027-09', price: 96.6, convexity: 1.5 },
  { kind: 'ois', tenor: '18M', rate: 0.0341, calendar: 'us-gov-securities', spotLag: 2, paymentLag: 2, businessDay: 'following' },
  { kind: 'ois', tenor: '2Y', rate: 0.0345 },
  { kind: 'zero', tenor: '1Y', rate: 0.0352, compounding: 'semiannual', dayCount: 'ACT/365F' },
  { kind: 'zero', tenor: '30M', price: 91.8 },
  { kind: 'swap', tenor: '3Y', rate: 0.0349 },
  { kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, frequency: 2, yield: 0.0351 },
  { kind: 'bond', maturity: '2033-05-15', coupon: 0.04, frequency: 2, cleanPrice: 101.2 },
];

const doc = workspaceDoc(MARKET, { settlement: VALUATION, interpolation: 'monotone-convex' }) as unknown as { curve: Record<string, unknown> };
doc.curve.futuresConvexity = { model: 'hull-white', volatility: 0.01, meanReversion: 0.03 };
const build = buildCurve(doc);
const curve = build.curve!;

describe('explainQuoteCheck', () => {
  it('builds the invented market with every explained kind', () => {
    expect(build.errors).toEqual([]);
    // A bill settled at spot (two flows) and an OIS with a payment lag (its floating leg on the curve) are among them.
    expect(build.instruments.some((i) => i.kind === 'bill' && i.times.length === 2)).toBe(true);
    expect(build.instruments.filter((i) => i.kind === 'ois').length).toBe(2);
    expect(new Set(build.instruments.map((i) => i.kind))).toEqual(new Set(['deposit', 'bill', 'zero', 'fra', 'future', 'ois', 'swap', 'bond']));
  });

  it("ends in the quote check's model figure bit for bit; the steps recomputed from the shown inputs give it to 1e-15", () => {
    for (const ins of build.instruments) {
      const row = build.repricing.find((r) => r.index === ins.index)!;
      const where = `${ins.kind} ${ins.maturity}`;
      const r = explainQuoteCheck(curve, ins, curve.settlement);
      if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
      const e = r.value;
      expect(Object.is(e.value, row.model), where).toBe(true);
      expect(Object.is(e.steps.at(-1)!.value, row.model), where).toBe(true);
      expect(e.quantity).toBe('quote-model');
      expect(e.reads.length, where).toBe(ins.times.length);
      e.reads.forEach((x, j) => expect(x.t, where).toBe(ins.times[j]));
      expect(rel(recompute(ins, e), row.model), where).toBeLessThanOrEqual(1e-15);
      // Every step's inputs are names the explanation shows.
      const names = new Set([...e.reads.map((x) => x.name), ...e.yearFractions.map((y) => y.name), ...e.steps.map((s) => s.name), 'DF(settlement)']);
      for (const s of e.steps) for (const i of s.inputs) expect(names.has(i), `${where}: ${s.name} reads ${i}`).toBe(true);
    }
  });

  it('a yield-quoted bond: the ICMA price at the model yield is the model dirty price', () => {
    const ins = build.instruments.find((i) => i.kind === 'bond' && i.unit === 'rate')!;
    const e = explainQuoteCheck(curve, ins, curve.settlement);
    if (!e.ok) throw new Error(e.errors[0]!.message);
    const s = (ins as unknown as { schedule: Parameters<typeof bondDirtyFromYield>[0] }).schedule;
    const dirty = e.value.steps.find((x) => x.name === 'dirty')!.value;
    expect(rel(bondDirtyFromYield(s, e.value.value).price, dirty)).toBeLessThanOrEqual(1e-14);
  });

  it('the difference is the table\'s repricing error: bp for a rate, per 100 for a price, bit for bit', () => {
    for (const ins of build.instruments) {
      const row = build.repricing.find((r) => r.index === ins.index)!;
      const r = explainQuoteCheck(curve, ins, curve.settlement, 'error');
      if (!r.ok) throw new Error(r.errors[0]!.message);
      expect(r.value.quantity).toBe('quote-error');
      expect(Object.is(r.value.value, row.unit === 'price' ? row.repricingError : row.repricingError * 1e4), `${ins.kind} ${ins.maturity}`).toBe(true);
      expect(r.value.unit).toBe(row.unit === 'price' ? 'per 100 face' : 'bp (1 bp = 0.0001 of the rate)');
    }
  });

  it('tracing changes nothing: the model quote with and without a trace is the same bit for bit', () => {
    for (const ins of build.instruments) {
      const plain = quoteOnCurve(ins, curve.lnDiscountAt);
      const names: string[] = [];
      const traced = quoteOnCurve(ins, curve.lnDiscountAt, (n) => names.push(n));
      expect(Object.is(plain, traced)).toBe(true);
      expect(names.length).toBeGreaterThan(0);
    }
  });

  it('government par yields, all three regimes: the figure bit for bit, the steps recomputed to 1e-15, traced equals untraced', () => {
    // Par bonds above one year (one maturity off the coupon cycle, so a > 0), a zero's bond-equivalent
    // yield at one year or less on a basis that is not the Treasury's (frequency 1), and bills on the
    // US Treasury basis (frequency 2, ACT/ACT-ICMA) both under and over half a year. Yields invented.
    const b = buildCurve(
      workspaceDoc(
        [
          { kind: 'par-yield', tenor: '3M', yield: 0.0392 },
          { kind: 'par-yield', tenor: '9M', yield: 0.0385 },
          { kind: 'par-yield', tenor: '1Y', yield: 0.0378, frequency: 1, dayCount: 'ACT/365F' },
          { kind: 'par-yield', tenor: '2Y', yield: 0.0361 },
          { kind: 'par-yield', maturity: '2031-08-15', yield: 0.0372 },
          { kind: 'par-yield', tenor: '10Y', yield: 0.0412 },
        ],
        { settlement: VALUATION, interpolation: 'monotone-convex' },
      ),
    );
    expect(b.errors).toEqual([]);
    const seen = new Set<string>();
    for (const ins of b.instruments) {
      const row = b.repricing.find((r) => r.index === ins.index)!;
      const where = `${ins.kind} ${ins.maturity}`;
      for (const figure of ['model', 'error'] as const) {
        const r = explainQuoteCheck(b.curve!, ins, VALUATION, figure);
        if (!r.ok) throw new Error(`${where}: ${r.errors[0]!.message}`);
        const e = r.value;
        expect(Object.is(e.value, figure === 'model' ? row.model : row.repricingError * 1e4), where).toBe(true);
        const model = e.steps.find((s) => s.name === 'model')!.value;
        expect(Object.is(model, row.model), where).toBe(true);
        expect(rel(recompute(ins, e), row.model), where).toBeLessThanOrEqual(1e-15);
        const names = new Set([...e.reads.map((x) => x.name), ...e.yearFractions.map((y) => y.name), ...e.steps.map((s) => s.name)]);
        for (const s of e.steps) for (const i of s.inputs) expect(names.has(i), `${where}: ${s.name} reads ${i}`).toBe(true);
        seen.add(e.steps.some((s) => s.name === 'sum') ? (e.steps.find((s) => s.name === 'a')!.value > 0 ? 'par off cycle' : 'par') : e.steps.some((s) => s.name === 'days') ? (e.steps.find((s) => s.name === 'a')!.value > 0.5 ? 'bill long' : 'bill short') : 'zero');
      }
      const plain = quoteOnCurve(ins, b.curve!.lnDiscountAt);
      expect(Object.is(quoteOnCurve(ins, b.curve!.lnDiscountAt, () => {}), plain)).toBe(true);
    }
    expect(seen).toEqual(new Set(['par', 'par off cycle', 'zero', 'bill short', 'bill long']));
  });

  it('a kind whose arithmetic is not traced says so', () => {
    const ins = build.instruments[0]!;
    const silent = { ...ins, quote: ins.quote, quoteFromFlows: (ln: ArrayLike<number>, df: ArrayLike<number>, o: number) => ins.quoteFromFlows(ln, df, o) };
    const r = explainQuoteCheck(curve, silent as typeof ins, VALUATION);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toMatch(/deposit quotes do not explain their arithmetic yet/);
  });
});
