import { describe, expect, it } from 'vitest';
import { buildCurve, fitCurve, OVERNIGHT_KIT, turnLn, type CurveBuild } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// The smooth fit on a curve with a year-end turn. A Nelson-Siegel form has no jump, so the fit is the
// form times the turns' jumps at the spreads of the curve shown (FitOptions.turns). Sources:
// - Nelson & Siegel (1987), "Parsimonious Modeling of Yield Curves", J. Business 60(4): the zero rate
//   y(t) = b0 + b1 (1 - e^(-t/tau)) / (t/tau) + b2 ((1 - e^(-t/tau)) / (t/tau) - e^(-t/tau)),
//   written out here by hand (not the engine's parametricForm.ts).
// - The turn model (Ametrano & Bianchetti 2013, section 4.8, as the project's market-conventions
//   notes, section h, state it): DF(t) = DF_smooth(t) x exp(-s d(t) / 360) past the turn's first day.
// - A deposit: 1 + r tau against 1, tau = days / 360 (ACT/360 money market).
// The quotes are made from a chosen form times a 25 bp turn over year end 2027 (3 days, weekends
// calendar): a fit that carries the turn must find the form again with zero residuals; one that
// ignores it cannot. Invented parameters.

const VALUATION = '2027-06-15';
const TRUE = { b0: 0.04, b1: -0.015, b2: 0.01, tau: 1.8 };
const S = 25 / 1e4;
const DAY = 86_400_000;
const days = (a: string, b: string) => (Date.parse(b) - Date.parse(a)) / DAY;
const nsZero = (t: number) => {
  const x = t / TRUE.tau;
  const l = (1 - Math.exp(-x)) / x;
  return TRUE.b0 + TRUE.b1 * l + TRUE.b2 * (l - Math.exp(-x));
};
/** ln DF at a date: the form (ACT/365F curve time) plus the turn's share (turn days before the date, ACT/360). */
const lnDf = (date: string) => {
  const t = days(VALUATION, date) / 365;
  const turnDays = Math.min(3, Math.max(0, days('2027-12-31', date)));
  return -nsZero(t) * t - (S * turnDays) / 360;
};
const MATURITIES = ['2027-07-15', '2027-09-15', '2027-12-15', '2028-01-18', '2028-03-15', '2028-06-15', '2029-06-15', '2030-06-15', '2032-06-15', '2035-06-15', '2037-06-15'];
const quotes = MATURITIES.map((m) => ({ kind: 'deposit', maturity: m, rate: (Math.expm1(-lnDf(m)) * 360) / days(VALUATION, m) }));
const TURN = { name: 'year end 2027', from: '2027-12-31', to: '2027-12-31', calendar: 'weekends', spreadBp: 25 };
const doc = { format: 'tenorscope-workspace', version: 2, valuationDate: VALUATION, curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes, turns: [TURN] };
const build = (): CurveBuild => {
  const b = buildCurve(doc, { overnight: OVERNIGHT_KIT });
  expect(b.errors).toEqual([]);
  return b;
};

describe('fitCurve with the turns of the curve shown', () => {
  it('finds the form the quotes were made from, every residual zero, and the fitted curve is the form times the jump', () => {
    const b = build();
    const turns = b.overnight!.turns;
    expect(turns[0]!.days).toBe(3); // Friday 2027-12-31 to Monday 2028-01-03
    const fit = fitCurve(b.workspace!, { model: 'nelson-siegel', turns });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const p = fit.value.params;
    expectClose(p.b0, TRUE.b0, 1e-7, 'Nelson-Siegel b0 the quotes were made from');
    expectClose(p.b1, TRUE.b1, 1e-7, 'Nelson-Siegel b1');
    expectClose(p.b2, TRUE.b2, 1e-7, 'Nelson-Siegel b2');
    expectClose(p.tau1, TRUE.tau, 1e-5, 'Nelson-Siegel tau');
    for (const r of fit.value.residuals) expectClose(r.residualBp, 0, 1e-5, `residual of quotes[${r.index}] (deposit ${r.maturity})`);
    // The fitted curve: ln DF = the form's (by hand, at the fitted parameters) + the turn's share.
    const c = fit.value.curve;
    for (const date of ['2027-12-31', '2028-01-01', '2028-01-03', '2029-06-15']) {
      const t = c.time(date);
      const x = t / p.tau1;
      const l = (1 - Math.exp(-x)) / x;
      const form = -(p.b0 + p.b1 * l + p.b2 * (l - Math.exp(-x))) * t;
      const turnDays = Math.min(3, Math.max(0, days('2027-12-31', date)));
      expectClose(c.lnDiscountAt(t), form - (S * turnDays) / 360, 1e-15, `the fitted curve at ${date}: the form times exp(-s d / 360)`);
      expectClose(c.lnDiscountAt(t) - turnLn(turns, t), form, 1e-15, `the turn's share at ${date}`);
    }
  });

  it('without the turns the same quotes leave residuals far beyond the turned fit\'s (over 0.1 bp)', () => {
    const b = build();
    const fit = fitCurve(b.workspace!, { model: 'nelson-siegel' });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const worst = Math.max(...fit.value.residuals.map((r) => Math.abs(r.residualBp)));
    // The form bends to take part of the jump (measured: 0.195 bp at worst); with the turns every residual is below 1e-5 bp.
    expect(worst).toBeGreaterThan(0.1);
  });

  it('a solved spread: the fit takes the spread the exact bootstrap solved', () => {
    const solved = { ...doc, turns: [{ ...TURN, spreadBp: undefined, solveFrom: 3 }] };
    const b = buildCurve(JSON.parse(JSON.stringify(solved)), { overnight: OVERNIGHT_KIT });
    expect(b.errors).toEqual([]);
    const turns = b.overnight!.turns;
    const fit = fitCurve(b.workspace!, { model: 'nelson-siegel', turns });
    if (!fit.ok) throw new Error(fit.errors[0]!.message);
    const t = fit.value.curve.time('2028-01-05');
    const p = fit.value.params;
    const x = t / p.tau1;
    const l = (1 - Math.exp(-x)) / x;
    expectClose(fit.value.curve.lnDiscountAt(t) + (p.b0 + p.b1 * l + p.b2 * (l - Math.exp(-x))) * t, (-turns[0]!.spread * 3) / 360, 1e-15, 'the jump at the solved spread, by hand');
  });
});
