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
import { bondDirtyFromYield, buildCurve, explainQuoteCheck, modelConvexityBp, type Explanation, type FutureQuote, type Instrument } from '../../../src/core/index.ts';
import { quoteOnCurve } from '../../../src/core/instruments/instrument.ts';
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
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

/** The shown inputs by name: reads (DF and ln DF), year fractions, earlier steps. */
function shown(e: Explanation) {
  const read = (name: string) => {
    if (name === 'DF(settlement)') return { ln: 0, df: 1 };
    const r = e.reads.find((x) => x.name === name);
    if (!r) throw new Error(`no read ${name}`);
    return { ln: r.lnDiscount, df: r.discount };
  };
  const yf = (name: string) => e.yearFractions.find((y) => y.name === name)!.value;
  const step = (name: string) => e.steps.find((s) => s.name === name)!;
  const value = (name: string): number => (name.startsWith('DF(') ? read(name).df : name.startsWith('tau') ? yf(name) : step(name).value);
  /** sum of a x b over the step's inputs taken in pairs. */
  const pairs = (name: string): number => {
    const ins = step(name).inputs;
    let s = 0;
    for (let i = 0; i < ins.length; i += 2) s += value(ins[i]!) * value(ins[i + 1]!);
    return s;
  };
  return { read, yf, step, value, pairs };
}

/** The model value again from what the explanation shows, by the kind's published formula. */
function recompute(ins: Instrument, e: Explanation): number {
  const { read, yf, step, value, pairs } = shown(e);
  const price = (R: number, ca: number): number => 100 * (1 - (R + ca / 1e4));
  switch (ins.kind) {
    case 'deposit':
    case 'fra': {
      // DF(S)/DF(E) = 1 + r tau: r = (DF(S)/DF(E) - 1) / tau, in ln space for precision.
      const lnS = e.reads.length === 1 ? 0 : read('DF(S)').ln;
      return Math.expm1(lnS - read('DF(E)').ln) / yf('tau');
    }
    case 'swap':
    case 'ois': {
      const A = pairs('A');
      expect(rel(A, step('A').value)).toBeLessThanOrEqual(1e-15);
      if (e.steps.some((s) => s.name === 'float')) {
        const ins3 = step('float').inputs;
        let float = 0;
        for (let i = 0; i < ins3.length; i += 3) float += Math.expm1(read(ins3[i]!).ln - read(ins3[i + 1]!).ln) * read(ins3[i + 2]!).df;
        expect(rel(float, step('float').value)).toBeLessThanOrEqual(1e-15);
        return float / A;
      }
      const last = e.reads.at(-1)!;
      return -Math.expm1(last.lnDiscount) / A;
    }
    case 'bond': {
      const spot = e.steps.some((s) => s.name === 'pv');
      const dirty = spot ? pairs('pv') / read('DF(settle)').df : pairs('dirty');
      expect(rel(dirty, step('dirty').value)).toBeLessThanOrEqual(1e-15);
      if (ins.unit === 'price') return dirty - step('accrued').value;
      // A yield: the ICMA price at the shown yield gives back the dirty price (bondDirtyFromYield's own definition).
      return step('model').value;
    }
    case 'future': {
      const q = ins.quote as FutureQuote;
      const ca = step('CA').value;
      // The adjustment is the quote's own: typed, or filled by the model at the futures rate (convexity.ts, Kirikos-Novak / Hull).
      expect(Object.is(ca, q.convexity)).toBe(true);
      if (q.convexityFill) expect(Object.is(ca, modelConvexityBp(q.convexityFill, (100 - q.price) / 100, q.contract === '3M' ? 91 : 31, q.convexityFill.t1, q.convexityFill.t2))).toBe(true);
      if (q.contract === '3M') {
        const g = e.steps.some((s) => s.name === 'lnStart')
          ? Math.expm1(Math.log1p(step('w').value * Math.expm1(read('DF(b0)').ln - read('DF(b1)').ln)) + read('DF(b1)').ln - read('DF(E)').ln)
          : Math.expm1((e.steps.some((s) => s.name === 'ln known') ? step('ln known').value : 0) + e.reads[0]!.lnDiscount - read('DF(E)').ln);
        return price(g / yf('tau'), ca);
      }
      // One-month: r_i = (DF(b_i)/DF(b_i+1) - 1) x 360 / n_i, R = sum w_i r_i / N (CME one-month SOFR: the month's arithmetic average).
      const n = e.reads.length - 1;
      let sum = e.steps.some((s) => s.name === 'known') ? step('known').value : 0;
      for (let i = 0; i < n; i++) {
        const r = (Math.expm1(e.reads[i]!.lnDiscount - e.reads[i + 1]!.lnDiscount) * 360) / value(`n${i + 1}`);
        expect(rel(r, step(`r${i + 1}`).value)).toBeLessThanOrEqual(1e-15);
        sum += value(`w${i + 1}`) * r;
      }
      const days = Number(/N = (\d+)/.exec(e.formula)![1]);
      return price(sum / days, ca);
    }
    case 'bill':
    case 'zero': {
      // 100 at M: P = DF(M) (or DF(M) / DF(S) from a settle date S); price 100 P; bank discount (1 - P) 360 / days
      // (US Treasury bill discount yield); a zero rate by its compounding's definition.
      const lnP = e.reads.length === 2 ? read('DF(M)').ln - read('DF(S)').ln : read('DF(M)').ln;
      expect(Object.is(lnP, step('lnP').value)).toBe(true);
      if (ins.unit === 'price') return 100 * Math.exp(lnP);
      if (ins.kind === 'bill') return (-Math.expm1(lnP) * 360) / step('days').value;
      const tau = yf('tau');
      const m = (ins.quote as { compounding: string }).compounding === 'semiannual' ? 2 : NaN;
      return m * Math.expm1(-lnP / (m * tau)); // P = (1 + z/m)^(-m tau)
    }
    default:
      throw new Error(`no recomputation for ${ins.kind}`);
  }
}

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

  it('a kind whose arithmetic is not traced says so', () => {
    const b = buildCurve(workspaceDoc([{ kind: 'par-yield', tenor: '10Y', yield: 0.0412 }], { settlement: VALUATION }));
    const r = explainQuoteCheck(b.curve!, b.instruments[0]!, VALUATION);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.message).toMatch(/par-yield quotes do not explain their arithmetic yet/);
  });
});
