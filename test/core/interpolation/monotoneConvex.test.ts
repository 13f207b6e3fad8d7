import { describe, expect, it } from 'vitest';
import { buildCurve, discountOn, forwardOn, type Curve } from '../../../src/core/index.ts';
import { interpolatorMonotoneConvex } from '../../../src/core/interpolation/monotoneConvex.ts';
import { expectClose } from '../../helpers/asserts.ts';

// P. S. Hagan and G. West, "Interpolation Methods for Curve Construction", Applied Mathematical
// Finance 13(2), 2006: the example curve used throughout the paper, terms 0.1, 1, 4, 9, 20, 30
// years with continuously compounded zero rates 8.1 %, 7 %, 4.4 %, 7 %, 4 %, 3 % (cited from
// memory). Built here from zero-coupon inputs on a 30/360 axis from 2027-01-01 so that the terms
// are exact: 0.1 years = 36 days of 30/360 (to 2027-02-07), the others whole years.
const HW = 'Hagan and West (2006) example curve (from memory)';
const terms = [0.1, 1, 4, 9, 20, 30];
const rates = [0.081, 0.07, 0.044, 0.07, 0.04, 0.03];
const dates = ['2027-02-07', '2028-01-01', '2031-01-01', '2036-01-01', '2047-01-01', '2057-01-01'];
const doc = (interpolation: string) => ({
  format: 'tenorscope-workspace',
  version: 1,
  settlement: '2027-01-01',
  curve: { dayCount: '30/360', interpolation },
  quotes: dates.map((maturity, i) => ({ kind: 'zero', maturity, rate: rates[i], compounding: 'continuous', dayCount: '30/360' })),
});

// Hand calculation from the paper's definitions (issue section 5): discrete forwards
// d_i = (r_i t_i - r_(i-1) t_(i-1)) / (t_i - t_(i-1)), node forwards by the weighted average,
// ends f_0 = d_1 - (f_1 - d_1)/2 and f_n = d_n - (f_(n-1) - d_n)/2.
const t = [0, ...terms];
const rt = [0, ...terms.map((x, i) => x * rates[i]!)];
const d = [NaN, ...terms.map((_, i) => (rt[i + 1]! - rt[i]!) / (t[i + 1]! - t[i]!))];
const n = terms.length;
const f: number[] = new Array(n + 1).fill(0);
for (let i = 1; i < n; i++) f[i] = ((t[i]! - t[i - 1]!) * d[i + 1]! + (t[i + 1]! - t[i]!) * d[i]!) / (t[i + 1]! - t[i - 1]!);
f[0] = d[1]! - 0.5 * (f[1]! - d[1]!);
f[n] = d[n]! - 0.5 * (f[n - 1]! - d[n]!);
const HAND = 'hand calculation from the Hagan-West definitions (issue section 5)';

function build(interpolation: string): Curve {
  const b = buildCurve(doc(interpolation));
  expect(b.errors).toEqual([]);
  return b.curve!;
}

/** Composite Simpson integral of the instantaneous forward over [a, b]. */
function integrateForward(curve: Curve, a: number, b: number, steps = 4000): number {
  const h = (b - a) / steps;
  let s = curve.forwardAt(a) + curve.forwardAt(b - 1e-15 * b);
  for (let k = 1; k < steps; k++) s += (k % 2 ? 4 : 2) * curve.forwardAt(a + k * h);
  return (s * h) / 3;
}

describe('Hagan-West example curve, monotone-convex', () => {
  const curve = build('monotone-convex');

  it('the discrete forwards of the example are as the hand calculation (and all positive)', () => {
    // d = 8.1 %, 6.8778 %, 3.5333 %, 9.08 %, 1.5455 %, 1 %: the bumpy forward curve of the paper.
    expectClose(d[2]!, 0.0619 / 0.9, 1e-16, HAND);
    expectClose(d[4]!, 0.0908, 1e-15, HAND);
    for (let i = 1; i <= n; i++) expect(d[i]!).toBeGreaterThan(0);
  });

  it('node discount factors are exactly exp(-r t)', () => {
    dates.forEach((date, i) => {
      const r = discountOn(curve, date);
      if (!r.ok) throw new Error('query failed');
      expectClose(r.value.t, terms[i]!, 0, '30/360 year fractions of the chosen dates');
      expectClose(r.value.discount, Math.exp(-rates[i]! * terms[i]!), 2e-16, HW);
    });
  });

  it('every discrete forward is reproduced between consecutive pillars', () => {
    let start = '2027-01-01';
    dates.forEach((end, i) => {
      const r = forwardOn(curve, start, end, 'continuous', '30/360');
      if (!r.ok) throw new Error('query failed');
      expectClose(r.value.rate, d[i + 1]!, 2e-15, HAND);
      start = end;
    });
  });

  it('the instantaneous forward at each node is the node forward f_i of the method', () => {
    for (let i = 0; i <= n; i++) expectClose(curve.forwardAt(t[i]!), f[i]!, 1e-15, HAND);
  });

  it('f is continuous: equal from the left and from the right at every node, no jump on a fine grid', () => {
    for (let i = 1; i < n; i++) {
      expectClose(curve.forwardAt(t[i]! - 1e-10), curve.forwardAt(t[i]!), 1e-8, 'continuity of the monotone-convex forward (Hagan-West)');
    }
    let maxJump = 0;
    const step = 1e-4;
    for (let x = 0; x < 30; x += step) maxJump = Math.max(maxJump, Math.abs(curve.forwardAt(x + step) - curve.forwardAt(x)));
    // The steepest part of this curve rises about 0.6 per year: 6e-5 per step of 1e-4 years.
    expect(maxJump).toBeLessThan(2e-4);
  });

  it('the forward integrates to each segment\'s discrete forward (Simpson, 4000 steps)', () => {
    for (let i = 1; i <= n; i++) {
      const h = t[i]! - t[i - 1]!;
      expectClose(integrateForward(curve, t[i - 1]!, t[i]!), d[i]! * h, 1e-9, 'integral of g over a segment is zero (Hagan-West construction)');
    }
  });

  it('ln DF inside a segment is minus the integral of f from 0 (g and its integral G agree)', () => {
    for (const x of [0.05, 0.7, 2.5, 7, 13, 26]) {
      let integral = 0;
      let a = 0;
      for (const node of [...t.slice(1).filter((ti) => ti < x), x]) {
        integral += integrateForward(curve, a, node);
        a = node;
      }
      expectClose(curve.lnDiscountAt(x), -integral, 1e-9, 'f = -d lnDF/dt (definition of the instantaneous forward)');
    }
  });

  it('the interpolation alone (no bootstrap) agrees: a direct build on the same nodes', () => {
    const interp = interpolatorMonotoneConvex(Float64Array.from(t), Float64Array.from(rt, (x) => -x));
    for (const x of [0.05, 0.5, 2, 6.5, 15, 25]) {
      expectClose(interp.lnDiscount(x), curve.lnDiscountAt(x), 1e-15, 'same nodes, same interpolation');
      expectClose(interp.forward(x), curve.forwardAt(x), 1e-15, 'same nodes, same interpolation');
    }
  });
});

describe('Hagan-West example curve, monotone-convex-positive', () => {
  const curve = build('monotone-convex-positive');
  it('f(t) >= 0 everywhere on a grid of 1e-3 years, and node DFs are still exact', () => {
    let min = Infinity;
    for (let x = 0; x <= 30; x += 1e-3) min = Math.min(min, curve.forwardAt(x));
    expect(min).toBeGreaterThanOrEqual(0);
    dates.forEach((date, i) => {
      const r = discountOn(curve, date);
      if (!r.ok) throw new Error('query failed');
      expectClose(r.value.discount, Math.exp(-rates[i]! * terms[i]!), 2e-16, HW);
    });
  });
  it('node forwards lie in the collar [0, 2 min(d_i, d_(i+1))] (Hagan-West positivity)', () => {
    for (let i = 1; i < n; i++) {
      const fi = curve.forwardAt(t[i]!);
      expect(fi).toBeGreaterThanOrEqual(0);
      expect(fi).toBeLessThanOrEqual(2 * Math.min(d[i]!, d[i + 1]!) + 1e-16);
    }
  });
});
