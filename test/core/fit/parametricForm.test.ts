import { describe, it } from 'vitest';
import { parametricForward, parametricLnDiscount, parametricZero, projectParams, TAU_MAX, TAU_MIN, type ParametricParams } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// Published Svensson curve: Board of Governors of the Federal Reserve System, "The U.S. Treasury
// Yield Curve: 1961 to the Present" (R. S. Gurkaynak, B. Sack and J. H. Wright, 2007), daily data
// file feds200628, the row for 2026-03-06: parameters BETA0..BETA3 (percent), TAU1, TAU2 (years),
// zero-coupon yields SVENY01..SVENY30 and instantaneous forwards SVENF01..SVENF30 (percent,
// continuously compounded), as published to 4 decimals (transcribed from a public copy of the file).
const GSW_2026_03_06: ParametricParams = {
  model: 'svensson',
  b0: 0.000118558051341 / 100,
  b1: 3.65507972187386 / 100,
  b2: -3.657398577533 / 100,
  b3: 16.4827863321283 / 100,
  tau1: 5.33457685733225,
  tau2: 14.4318194852304,
};
const SVENY = [
  3.5756, 3.554, 3.5758, 3.6294, 3.7053, 3.7961, 3.8958, 4.0, 4.1049, 4.2079, 4.3069, 4.4005, 4.4874, 4.5672, 4.6392, 4.7034, 4.7596, 4.8079, 4.8486, 4.882,
  4.9082, 4.9278, 4.941, 4.9482, 4.9499, 4.9464, 4.9382, 4.9256, 4.9089, 4.8885,
];
const SVENF = [
  3.5277, 3.5586, 3.6942, 3.8939, 4.1275, 4.3729, 4.6143, 4.8405, 5.0442, 5.2209, 5.3682, 5.4852, 5.5722, 5.6302, 5.6609, 5.6661, 5.648, 5.6089, 5.5511, 5.4766,
  5.3878, 5.2865, 5.1747, 5.0541, 4.9262, 4.7926, 4.6546, 4.5133, 4.3698, 4.225,
];
// Published to 4 decimals of a percent: half a unit in the last place is 0.00005% = 5e-7.
const ROUNDING = 0.5e-4 / 100 + 1e-12;

describe('Svensson form against the Federal Reserve GSW curve of 2026-03-06', () => {
  it('parametricZero(p, n) reproduces SVENY01..SVENY30 to the published rounding', () => {
    SVENY.forEach((pct, i) => expectClose(parametricZero(GSW_2026_03_06, i + 1), pct / 100, ROUNDING, `feds200628 2026-03-06 SVENY${String(i + 1).padStart(2, '0')}`));
  });
  it('parametricForward(p, n) reproduces the instantaneous forwards SVENF01..SVENF30 to the published rounding', () => {
    SVENF.forEach((pct, i) => expectClose(parametricForward(GSW_2026_03_06, i + 1), pct / 100, ROUNDING, `feds200628 2026-03-06 SVENF${String(i + 1).padStart(2, '0')}`));
  });
});

describe('Nelson-Siegel form', () => {
  const ns: ParametricParams = { model: 'nelson-siegel', b0: 0.045, b1: -0.02, b2: 0.015, b3: 0, tau1: 2.2, tau2: null };
  it('is the Svensson form with b3 = 0 (Svensson 1994 extends Nelson-Siegel 1987 by one term)', () => {
    const sv: ParametricParams = { ...ns, model: 'svensson', b3: 0, tau2: 9 };
    for (const t of [0.01, 0.5, 1, 3, 7, 15, 30]) expectClose(parametricZero(ns, t), parametricZero(sv, t), 1e-17, 'Svensson (1994) with b3 = 0');
  });
  it('has y(0+) = b0 + b1 and y -> b0 far out (Nelson and Siegel 1987, limits of the form)', () => {
    expectClose(parametricZero(ns, 1e-9), ns.b0 + ns.b1, 1e-10, 'limit t -> 0: b0 + b1 (slope of y at 0 is O(1e-2) per year)');
    expectClose(parametricZero(ns, 0), ns.b0 + ns.b1, 1e-17, 'L1(0) = 1, L2(0) = 0');
    expectClose(parametricZero(ns, 1e5), ns.b0, 1e-6, 'limit t -> infinity: b0');
  });
  it('has forward f(t) = d/dt [y(t) t] (instantaneous forward from the zero), checked by central differences', () => {
    for (const t of [0.25, 1, 2.2, 5, 12, 29]) {
      const h = 1e-5;
      const fd = (parametricLnDiscount(ns, t - h) - parametricLnDiscount(ns, t + h)) / (2 * h);
      expectClose(parametricForward(ns, t), fd, 1e-10, 'f = -d lnDF/dt, central difference h = 1e-5');
    }
  });
});

describe('projectParams keeps the fit inside its bounds', () => {
  it('clamps taus to [0.05, 30] and keeps tau2 >= 1.5 tau1', () => {
    const v = Float64Array.from([0.03, -0.01, 0.01, 0.02, 4, 5]);
    projectParams('svensson', v);
    expectClose(v[5]! / v[4]!, 1.5, 1e-12, 'ratio bound tau2 / tau1 = 1.5');
    expectClose(v[4]!, (4 + 1.5 * 5) / (1 + 1.5 * 1.5), 1e-12, 'Euclidean projection onto tau2 = 1.5 tau1: tau1 = (a + 1.5 b) / (1 + 1.5^2)');
    const w = Float64Array.from([-0.02, 0, 0, 0.01]);
    projectParams('nelson-siegel', w);
    expectClose(w[3]!, TAU_MIN, 0, 'tau below 0.05 is set to 0.05');
    expectClose(w[0]!, -0.02, 0, 'b0 may be negative');
    const x = Float64Array.from([0.03, 0, 0, 99]);
    projectParams('nelson-siegel', x);
    expectClose(x[3]!, TAU_MAX, 0, 'tau above 30 is set to 30');
  });
});
