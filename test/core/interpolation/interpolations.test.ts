import { describe, expect, it } from 'vitest';
import { INTERPOLATIONS, INTERPOLATORS } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// The definitions of issue section 5, checked on hand-made nodes (invented values):
// t = 0, 0.5, 1, 2, 5, 10 with continuously compounded zeros 3 %, 3.2 %, 3.5 %, 3.4 %, 4 %.
const ts = [0, 0.5, 1, 2, 5, 10];
const zs = [NaN, 0.03, 0.032, 0.035, 0.034, 0.04];
const ys = ts.map((t, i) => (i === 0 ? 0 : -zs[i]! * t));
const DEF = 'definition in the engine issue, section 5';

describe('every interpolation passes through its nodes and has DF(0) = 1', () => {
  for (const id of INTERPOLATIONS) {
    it(id, () => {
      const interp = INTERPOLATORS[id].build(ts, ys);
      expectClose(interp.lnDiscount(0), 0, 0, 'DF(0) = 1'); // -0 is fine: exp(-0) = 1
      ts.forEach((t, i) => expectClose(interp.lnDiscount(t), ys[i]!, 1e-16, DEF));
      // f = -d lnDF/dt, checked by a central difference inside a segment.
      for (const x of [0.25, 0.75, 1.5, 3.3, 7.7]) {
        const h = 1e-6;
        expectClose(interp.forward(x), -(interp.lnDiscount(x + h) - interp.lnDiscount(x - h)) / (2 * h), 1e-8, 'f = -d lnDF/dt');
      }
    });
  }
});

describe('log-linear-discount: flat forwards equal to the discrete forwards', () => {
  it('f on each segment is -(y_i - y_(i-1)) / (t_i - t_(i-1)), right-continuous at nodes', () => {
    const interp = INTERPOLATORS['log-linear-discount'].build(ts, ys);
    for (let i = 1; i < ts.length; i++) {
      const d = -(ys[i]! - ys[i - 1]!) / (ts[i]! - ts[i - 1]!);
      expectClose(interp.forward(0.5 * (ts[i - 1]! + ts[i]!)), d, 1e-16, DEF);
      expectClose(interp.forward(ts[i - 1]!), d, 1e-16, 'right-continuous at a node');
    }
  });
});

describe('linear-zero: z linear between pillars, flat before the first', () => {
  it('z(t) at a midpoint is the average of the node zeros; z before t_1 is z_1', () => {
    const interp = INTERPOLATORS['linear-zero'].build(ts, ys);
    expectClose(-interp.lnDiscount(0.25) / 0.25, 0.03, 1e-16, DEF);
    expectClose(-interp.lnDiscount(3.5) / 3.5, 0.5 * (0.035 + 0.034), 1e-16, DEF);
    // f = z + t z' on the segment (2, 5): z' = (0.034 - 0.035) / 3.
    expectClose(interp.forward(3.5), 0.0345 + (3.5 * -0.001) / 3, 1e-16, DEF);
  });
});

describe('cubic-zero: natural cubic spline on z, knots at 0 and every pillar, z(0) = z(t_1)', () => {
  const interp = INTERPOLATORS['cubic-zero'].build(ts, ys);
  const z = (t: number): number => -interp.lnDiscount(t) / t;
  it('second derivative of z vanishes at both ends (natural spline)', () => {
    const h = 1e-4;
    const second = (t: number): number => (z(t + h) - 2 * z(t) + z(t - h)) / (h * h);
    expect(Math.abs(second(h + 1e-9))).toBeLessThan(1e-3);
    expect(Math.abs(second(10 - h))).toBeLessThan(1e-3);
  });
  it('z and its first two derivatives are continuous at an interior knot', () => {
    const h = 1e-5;
    const slope = (t: number): number => (z(t + h) - z(t - h)) / (2 * h);
    expectClose(slope(2 - 1e-3), slope(2 + 1e-3), 1e-4, 'C2 spline: slope continuous');
    expectClose(z(2 - 1e-9), z(2 + 1e-9), 1e-10, 'C2 spline: value continuous');
  });
  it('the spline is linear in its knot values (doubling every zero doubles z)', () => {
    const twice = INTERPOLATORS['cubic-zero'].build(ts, ys.map((y) => 2 * y));
    for (const x of [0.3, 1.7, 4.2, 8.8]) expectClose(twice.lnDiscount(x), 2 * interp.lnDiscount(x), 1e-16, 'linearity of spline interpolation');
  });
});
