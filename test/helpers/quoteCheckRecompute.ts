// The model value of a quote check explanation recomputed from what it shows (its reads, year
// fractions, flows and earlier steps) by each kind's published formula; shared by the quote check's
// and the smooth fit's explanation tests. Sources beside each case.
import { expect } from 'vitest';
import { modelConvexityBp, type Explanation, type FutureQuote, type Instrument } from '../../src/core/index.ts';

export const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

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
export function recompute(ins: Instrument, e: Explanation): number {
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
    case 'par-yield': {
      const f = (ins.quote as { frequency: number }).frequency;
      if (e.steps.some((s) => s.name === 'sum')) {
        // Par bond above one year (Federal Reserve GSW 2006 par yield, with the accrued fraction a for a
        // maturity off the cycle): c = (1 - DF(T_N)) / ((1/f) sum_k DF(T_k) - a).
        let annuity = 0;
        for (const r of e.reads) annuity += r.discount;
        expect(rel(annuity, step('sum').value)).toBeLessThanOrEqual(1e-15);
        return (1 - e.reads.at(-1)!.discount) / (annuity / f - step('a').value);
      }
      const lnP = read('DF(M)').ln;
      expect(Object.is(lnP, step('lnP').value)).toBe(true);
      if (e.steps.some((s) => s.name === 'days')) {
        // US Treasury bill bond-equivalent yield (SIA, Fixed Income Securities Formulas; Treasury): a = d / T;
        // d <= T/2: y = (1/P - 1) / a; beyond: (a/2 - 1/4) y^2 + a y - (1/P - 1) = 0, taken by its positive root
        // written as 2g / (a + sqrt(a^2 + (2a - 1) g)) (the quadratic's root times its conjugate over itself).
        const a = step('days').value / step('T').value;
        const g = Math.expm1(-lnP);
        if (step('days').value <= step('T').value / 2) return g / a;
        const y = (2 * g) / (a + Math.sqrt(a * a + (2 * a - 1) * g));
        // Treasury's quadratic as published, y = (-2a + 2 sqrt(a^2 - (2a - 1)(1 - 1/P))) / (2a - 1), loses digits to cancellation: 1e-12.
        const P = Math.exp(lnP);
        expect(rel((-2 * a + 2 * Math.sqrt(a * a - (2 * a - 1) * (1 - 1 / P))) / (2 * a - 1), y)).toBeLessThanOrEqual(1e-12);
        return y;
      }
      // A zero's bond-equivalent yield over n coupon periods: DF = (1 + y/f)^(-n), y = f (DF^(-1/n) - 1), in ln space.
      return f * Math.expm1(-lnP / step('n').value);
    }
    default:
      throw new Error(`no recomputation for ${ins.kind}`);
  }
}

