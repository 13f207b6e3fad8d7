import { describe, expect, it } from 'vitest';
import {
  analyzeBond,
  bondLnWeights,
  buildCurve,
  curveFromPillars,
  DEFAULT_KEY_TENORS,
  explainBondFigure,
  INTERPOLATIONS,
  topInfluencesOfLn,
  type BondAnalytics,
  type BondInput,
  type BondSink,
  type Explanation,
  type ShiftFigure,
} from '../../../src/core/index.ts';
import { expectClose, expectRelClose } from '../../helpers/asserts.ts';
import { INVENTED_2027_EVERY_KIND, workspaceDoc } from '../../helpers/markets.ts';
import { rng } from '../../helpers/seededRandom.ts';
import { tracedRandomBond, valueOf } from '../../helpers/randomBonds.ts';

// Explanations of the bond's effective and key-rate durations (issue 19). Claims:
// 1. analyzeBond with a sink returns the same durations bit for bit, and each explanation ends in
//    the very figure the table shows (random curves and bonds, seeded, invented);
// 2. the steps recomputed here from the shown inputs reproduce the figure to 1e-15 relative: the
//    flows' present values CF_i DF(t_i), the tent weights (1 at the key, straight to 0 at the
//    neighbouring keys, the end tents flat outwards; the usual key-rate shift, e.g. Tuckman and
//    Serrat, "Fixed Income Securities", chapter on key-rate shifts, cited from memory), the bumped
//    prices sum pv_i exp(-+s w_i t_i) (a continuously compounded zero moved by s w(t)), the central
//    differences -(P+ - P-) / (2 s P) and Richardson's (4 D(h/2) - D(h)) / 3 (Press et al.,
//    "Numerical Recipes", 5.7, cited from memory);
// 3. a published example: Hull, "Options, Futures, and Other Derivatives", chapter "Interest
//    Rates", the duration table (cited from memory): a 3-year 10% semiannual bond at a 12%
//    continuously compounded yield is worth 94.213 and has duration 2.653 years, the duration
//    under a parallel move of a continuously compounded rate; on a flat 12% curve that is the
//    effective duration;
// 4. the quotes behind a duration against bump-and-rebuild.

const value = valueOf;

const shown = (a: BondAnalytics, figure: ShiftFigure, key: number): number => (figure === 'effectiveDuration' ? a.effectiveDuration : a.keyRateDurations[key]!.duration);

/** The tent of key k at t from the key times (written out here, independently of the core's tentWeight). */
function tent(keys: readonly number[], k: number, t: number): number {
  const prev = keys[k - 1];
  const next = keys[k + 1];
  const tk = keys[k]!;
  if (t <= tk) return prev === undefined ? 1 : t <= prev ? 0 : (t - prev) / (tk - prev);
  return next === undefined ? 1 : t >= next ? 0 : (next - t) / (next - tk);
}

/** Every step recomputed from the shown values of its inputs; [what, recomputed, shown]. */
function recompute(e: Explanation, keyTimes: readonly number[] | null, key: number): { what: string; got: number; want: number }[] {
  const steps = new Map(e.steps.map((s) => [s.name, s.value]));
  const at = (name: string): number => {
    const v = steps.get(name) ?? e.yearFractions.find((y) => y.name === name)?.value ?? e.reads.find((r) => r.name === name)?.discount;
    if (v === undefined) throw new Error(`no input ${name}`);
    return v;
  };
  const n = e.dates.filter((d) => /^c\d+$/.test(d.name)).length;
  const idx = Array.from({ length: n }, (_, i) => i + 1);
  const w = (i: number): number => (keyTimes === null ? 1 : at(`w${i}`));
  const out: { what: string; got: number; want: number }[] = [];
  for (const s of e.steps) {
    let got: number | null = null;
    const pv = /^pv(\d+)$/.exec(s.name);
    const wk = /^w(\d+)$/.exec(s.name);
    const bumped = /^P([+-])\((h|h\/2)\)$/.exec(s.name);
    const d = /^D\((h|h\/2)\)$/.exec(s.name);
    if (s.name === 'CF' || s.name === 'CF_N' || s.name === 'c') continue; // the bond's terms: test/core/analytics/explainBond.test.ts
    if (pv) got = at(pv[1] === String(n) ? 'CF_N' : n > 1 ? 'CF' : 'CF_N') * at(`DF(c${pv[1]})`);
    else if (s.name === 'dirty') got = idx.reduce((sum, i) => sum + at(`pv${i}`), 0);
    else if (wk) {
      // The key times shown (T_<tenor>) are the curve's times of the keys.
      const k = DEFAULT_KEY_TENORS[key]!;
      expect(at(`T_${k}`)).toBe(keyTimes![key]);
      got = tent(keyTimes!, key, at(`t${wk[1]}`));
    } else if (s.name === 'h') got = 1e-4;
    else if (s.name === 'h/2') got = at('h') / 2;
    else if (bumped) {
      const sign = bumped[1] === '+' ? -1 : 1;
      got = idx.reduce((sum, i) => sum + at(`pv${i}`) * Math.exp(sign * at(bumped[2]!) * w(i) * at(`t${i}`)), 0);
    } else if (d) got = -(at(`P+(${d[1]})`) - at(`P-(${d[1]})`)) / (2 * at(d[1]!) * at('dirty'));
    else if (s === e.steps.at(-1)) got = (4 * at('D(h/2)') - at('D(h)')) / 3;
    else throw new Error(`step ${s.name} not checked`);
    out.push({ what: `${s.name} = ${s.formula}`, got, want: s.value });
  }
  return out;
}

describe('the durations explained: traced equals untraced, and the steps recompute', () => {
  const r = rng(20261204);
  const cases = Array.from({ length: 40 }, (_, i) => ({ i, method: INTERPOLATIONS[i % INTERPOLATIONS.length]! }));
  it.each(cases)('random curve and bond $i under $method', ({ method }) => {
    const { curve, input, plain, traced, sink } = tracedRandomBond(r, method, false);
    expect(traced).toEqual(plain); // numbers compared with Object.is: bit for bit
    if (!plain.ok) return;
    const a = plain.value;
    const keyTimes = sink.trace!.keyTimes;
    const figures: [ShiftFigure, number][] = [['effectiveDuration', 0], ...DEFAULT_KEY_TENORS.map((_, k): [ShiftFigure, number] => ['keyRateDuration', k])];
    for (const [figure, key] of figures) {
      const e = value(explainBondFigure(sink.trace!, figure, 'model', key));
      const where = `${figure} ${key}`;
      expect(Object.is(e.value, shown(a, figure, key)), where).toBe(true);
      expect(Object.is(e.steps.at(-1)!.value, shown(a, figure, key)), where).toBe(true);
      expect(e.unit).toBe('years');
      for (const s of e.steps) for (const name of s.inputs) expect(e.steps.some((x) => x.name === name) || e.reads.some((x) => x.name === name) || e.yearFractions.some((x) => x.name === name), `${where}: ${s.name} names ${name}`).toBe(true);
      for (const c of recompute(e, figure === 'effectiveDuration' ? null : keyTimes, key)) expectRelClose(c.got, c.want, 1e-15, `${where}: ${c.what}`, 1e-300);
    }
  });
});

describe('a published example: Hull\'s three-year 10% bond at 12% continuously compounded', () => {
  // A flat curve at 12% continuous on 30/360, so the coupon dates (the 10th) fall at Hull's
  // 0.5, 1, ..., 3 years exactly; the bond pays 5 every half year for three years.
  const settlement = '2027-03-10';
  const curve = curveFromPillars(settlement, '30/360', 'log-linear-discount', 'flat-forward', [{ date: '2030-03-10', t: 3, discount: Math.exp(-0.12 * 3), quote: 0 }]);
  const sink: BondSink = {};
  const a = value(analyzeBond(curve, { maturity: '2030-03-10', coupon: 0.1, frequency: 2, dayCount: 'ACT/ACT-ICMA' }, DEFAULT_KEY_TENORS, 'bond', sink));
  it('its effective duration is Hull\'s 2.653 years, and its explanation bumps the price both ways by 1 bp', () => {
    expectClose(a.modelDirtyPrice, 94.213, 5e-4, 'Hull: price 94.213');
    expectClose(a.effectiveDuration, 2.653, 5e-4, 'Hull: duration 2.653 years');
    const e = value(explainBondFigure(sink.trace!, 'effectiveDuration', 'model'));
    const step = (n: string) => e.steps.find((s) => s.name === n)!.value;
    expect(step('h')).toBe(1e-4);
    expect(step('P+(h)')).toBeLessThan(step('dirty'));
    expect(step('P-(h)')).toBeGreaterThan(step('dirty'));
    expect(e.conventions.compounding).toBe('continuous');
    // The key-rate durations add up to it (the tents add up to a parallel shift).
    expectRelClose(a.keyRateDurations.reduce((s, k) => s + k.duration, 0), a.effectiveDuration, 1e-12, 'tents sum to 1');
  });
});

describe('the quotes a duration depends on most', () => {
  const doc = workspaceDoc(INVENTED_2027_EVERY_KIND, { settlement: '2027-03-10', interpolation: 'log-linear-discount' }); // invented demo market
  const built = buildCurve(doc);
  const bond: BondInput = { maturity: '2036-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA' };
  const sink: BondSink = {};
  value(analyzeBond(built.curve!, bond, DEFAULT_KEY_TENORS, 'bond', sink));
  it.each([['effectiveDuration', 0], ['keyRateDuration', 7]] as [ShiftFigure, number][])('%s (key %i): years per bp of each rate quote, against bump and rebuild', (figure, key) => {
    const w = bondLnWeights(sink.trace!, figure, 'model', key)!;
    const top = value(topInfluencesOfLn(built.curve!, built.instruments, w.times, w.weights, 100));
    const durationAfter = (k: number, h: number): number => {
      const quotes = doc.quotes.map((q, i) => (i === k ? { ...q, rate: (q as { rate: number }).rate + h } : q));
      const again = buildCurve({ ...doc, quotes });
      const a = value(analyzeBond(again.curve!, bond));
      return shown(a, figure, key);
    };
    let checked = 0;
    doc.quotes.forEach((q, k) => {
      if (typeof (q as { rate?: unknown }).rate !== 'number') return;
      const h = 1e-6;
      const fd = ((durationAfter(k, h) - durationAfter(k, -h)) / (2 * h)) * 1e-4;
      const mine = top.find((t) => t.index === k)!.bpPerBp;
      expect(Math.abs(mine - fd), `quote ${k}: ${mine} vs ${fd}`).toBeLessThan(1e-3 * Math.max(Math.abs(fd), 1e-6));
      checked++;
    });
    expect(checked).toBeGreaterThan(3);
  });
});
