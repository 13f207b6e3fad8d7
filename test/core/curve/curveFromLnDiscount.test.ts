// Every curve the engine makes comes from one constructor, curveFromLnDiscount, which takes ln DF
// and its derivative together. This checks the one identity that constructor exists to keep:
// the instantaneous forward is f(t) = -d ln DF(t)/dt (definition of the instantaneous forward
// rate, e.g. Hull, "Options, Futures, and Other Derivatives", chapter on interest rates; cited
// from memory), on curves from every maker: the bootstrap (every method), the fits
// (Nelson-Siegel, Svensson), the zero-space scenario, and the three horizon curves.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildCurve, curveFromLnDiscount, fitCurve, INTERPOLATIONS, resolveShift, shiftZeroCurve, validateWorkspace, type Curve } from '../../../src/core/index.ts';
import { curveSeenAtHorizon, impliedCurveAtHorizon, shiftedCurve } from '../../../src/core/roll/horizonCurve.ts';
import { expectClose } from '../../helpers/asserts.ts';

const doc = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;

/**
 * Central difference of ln DF with step h = 1e-5 years: truncation error h^2/6 |f''| (below 1e-10
 * for these curves' forwards) plus rounding about eps |ln DF| / h (about 1e-10 at 30 years), so
 * 1e-7 per year leaves room and still catches any forward that misses a term (a 1 bp term is 1e-4).
 */
const H = 1e-5;
const TOL = 1e-7;
const fdForward = (c: Curve, t: number): number => -(c.lnDiscountAt(t + H) - c.lnDiscountAt(t - H)) / (2 * H);

/** Times away from every pillar (the forward of a spline or of log-linear DF jumps at pillars). */
function probeTimes(c: Curve): number[] {
  const out: number[] = [];
  const knots = [0, ...c.pillars.map((p) => p.t)];
  for (let i = 1; i < knots.length; i++) {
    const a = knots[i - 1]!;
    const b = knots[i]!;
    if (b - a > 10 * H) out.push(a + 0.37 * (b - a), a + 0.81 * (b - a));
  }
  out.push(c.lastT + 0.5, c.lastT + 7.25); // past the last pillar
  return out;
}

function expectForwardIsSlope(c: Curve, what: string): void {
  const times = probeTimes(c);
  expect(times.length).toBeGreaterThanOrEqual(4);
  for (const t of times) expectClose(c.forwardAt(t), fdForward(c, t), TOL, `${what}: f(t) = -d lnDF/dt at t = ${t} (central difference)`);
}

const base = (interpolation: (typeof INTERPOLATIONS)[number]): Curve => {
  const b = buildCurve(doc, { interpolation });
  if (!b.curve) throw new Error(`${interpolation}: ${JSON.stringify(b.errors)}`);
  return b.curve;
};

describe('curveFromLnDiscount: forwardAt is -d lnDiscountAt/dt on every curve made through it', () => {
  for (const m of INTERPOLATIONS) it(`the bootstrap, ${m}`, () => expectForwardIsSlope(base(m), m));

  for (const model of ['nelson-siegel', 'svensson'] as const) {
    it(`a fit, ${model}`, () => {
      const ws = validateWorkspace(doc).workspace!;
      const r = fitCurve(ws, { model });
      if (!r.ok) throw new Error(JSON.stringify(r.errors));
      expectForwardIsSlope(r.value.curve, model);
    });
  }

  it('a zero-space scenario (twist 2Y/5Y/10Y +25 bp and butterfly 2Y/5Y/10Y on monotone convex)', () => {
    const c = base('monotone-convex');
    for (const shape of [
      { kind: 'twist', short: '2Y', pivot: '5Y', long: '10Y', bp: 25 },
      { kind: 'butterfly', short: '2Y', belly: '5Y', long: '10Y', wingsBp: -5, bellyBp: 15 },
    ] as const) {
      const shift = resolveShift(shape, c.settlement, c.dayCount);
      if (!shift.ok) throw new Error(JSON.stringify(shift.errors));
      expectForwardIsSlope(shiftZeroCurve(c, shift.value), `scenario ${shape.kind}`);
    }
  });

  it('the horizon curves: seen at the horizon, implied at the horizon, shifted by 40 bp', () => {
    const c = base('cubic-zero');
    const horizon = '2027-06-15';
    expectForwardIsSlope(curveSeenAtHorizon(c, horizon), 'curve seen at the horizon');
    expectForwardIsSlope(impliedCurveAtHorizon(c, horizon), 'implied curve at the horizon');
    expectForwardIsSlope(shiftedCurve(c, 40), 'shifted curve');
  });

  it('flat-forward past the last pillar: ln DF linear at the forward of the last pillar', () => {
    // ln DF = -0.03 t - 0.001 t^2 (hand-made function, derivative by hand: f = 0.03 + 0.002 t).
    const c = curveFromLnDiscount(
      { settlement: '2026-01-02', dayCount: 'ACT/365F', interpolation: 'cubic-zero', extrapolation: 'flat-forward', pillars: [{ date: '2031-01-02', t: 5, discount: Math.exp(-0.175), quote: 0 }] },
      { lnDiscount: (t) => -0.03 * t - 0.001 * t * t, forward: (t) => 0.03 + 0.002 * t },
      'flat-forward',
    );
    expectClose(c.forwardAt(4), 0.038, 1e-15, 'hand calculation: 0.03 + 0.002 x 4');
    expectClose(c.forwardAt(9), 0.04, 1e-15, 'hand calculation: the forward at t = 5 carried on');
    expectClose(c.lnDiscountAt(9), -0.175 - 0.04 * 4, 1e-15, 'hand calculation: -0.175 - 0.04 x (9 - 5)');
    expectForwardIsSlope(c, 'hand-made function');
  });
});
