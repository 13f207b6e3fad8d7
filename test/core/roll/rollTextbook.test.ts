// Published worked examples of horizon return, reinvestment, break-even and roll-down arithmetic,
// each named beside its check. Values marked "from memory" are as remembered from the book and
// carry a tolerance wide enough for the book's rounding, stated with each check.
import { addDays, buildCurve, discountOn, type Curve } from '../../../src/core/index.ts';
import {
  analyseRollVsTerm,
  annualisedReturn,
  applyView,
  bondPriceFromYieldOn,
  constantRateSpec,
  couponBond,
  curveSeenAtHorizon,
  DEFAULT_STRATEGY,
  forwardsView,
  rollLegs,
  type StrategyInputs,
} from '../../../src/core/index.ts';
import { rateFromLnDiscount } from '../../../src/core/rates/compounding.ts';
import Decimal from 'decimal.js';
import { expectClose } from '../../helpers/asserts.ts';

const FABOZZI = 'Fabozzi, "Bond Markets, Analysis and Strategies", total return example (values from memory)';
const HULL = 'Hull, "Options, Futures, and Other Derivatives", Table 4.5 forward rates from continuous zero rates 3.0/4.0/4.6/5.0/5.3 % (values from memory)';
const TUCKMAN = 'Tuckman and Serrat, "Fixed Income Securities": carry and roll-down under an unchanged term structure (method from memory; numbers by hand on Hull Table 4.5)';

function build(doc: object): Curve {
  const b = buildCurve({ format: 'tenorscope-workspace', version: 1, curve: { dayCount: 'ACT/365F', interpolation: 'linear-zero', extrapolation: 'none' }, ...doc }, {});
  if (!b.curve) throw new Error(JSON.stringify(b.errors));
  return b.curve;
}

describe('Fabozzi: total return of a bond over a 3-year horizon with coupons reinvested', () => {
  // 20-year 8 % coupon bond (semiannual) bought at 828.40 per 1000 (a 10 % yield); horizon 3 years;
  // coupons reinvested at 6 % a year (3 % per six months); at the horizon the 17-year bond yields 7 %.
  // Book: coupons plus interest on interest 258.74; horizon price 1,098.51; total 1,357.25;
  // semiannual return 8.58 %, bond-equivalent 17.16 %, effective annual 17.90 %.
  const S = '2026-01-15';
  const H = '2029-01-15';
  const bond = couponBond(S, '2046-01-15', 0.08, 2);
  // Any curve will do for the roll schedule: the coupons are paid on leg ends, so they are
  // reinvested only at the constant rate set after today (6 % simple, 30/360, 6M legs: 3 % each).
  const curve = build({ settlement: S, quotes: [{ kind: 'zero', tenor: '5Y', rate: 0.05 }] });
  const legs = rollLegs(curve, { n: 6, unit: 'M' }, H, '30/360');
  if (!legs.ok) throw new Error('legs');
  const view = applyView(curve, legs.value, '30/360', constantRateSpec(forwardsView(curve, H), 0.06));

  it('prices the bond at 828.40 per 1000 from a 10 % yield (semiannual, ICMA)', () => {
    expectClose(bondPriceFromYieldOn(bond, S, 0.1) * 10, 828.4, 0.02, `${FABOZZI}: purchase price, book rounds to the cent`);
  });

  it('accumulates coupons plus interest on interest to 258.74 per 1000', () => {
    let fv = 0;
    for (const f of bond.flows) if (f.date <= H) fv += f.amount * view.growthToHorizon(f.date);
    expectClose(fv * 10, 258.74, 0.005, `${FABOZZI}: 40 x ((1.03^6 - 1)/0.03)`);
  });

  it('prices the 17-year bond at 1,098.51 per 1000 from a 7 % yield at the horizon', () => {
    expectClose(bondPriceFromYieldOn(bond, H, 0.07) * 10, 1098.51, 0.01, `${FABOZZI}: horizon price; exact 1,098.503, the book's rounded factors give the cent above`);
  });

  it('gives a semiannual return of 8.58 %, 17.16 % bond-equivalent, 17.90 % effective annual', () => {
    let fv = 0;
    for (const f of bond.flows) if (f.date <= H) fv += f.amount * view.growthToHorizon(f.date);
    const total = (fv + bondPriceFromYieldOn(bond, H, 0.07)) * 10;
    expectClose(total, 1357.25, 0.015, `${FABOZZI}: total future dollars, the sum of the two rounded figures`);
    const ratio = total / 828.4;
    // semiannual return: semiannual compounding over 3 years, halved; the book's bond-equivalent
    // 17.16 % is twice its rounded 8.58 %
    const semiannual = rateFromLnDiscount(-Math.log(ratio), 'semiannual', 3) / 2;
    expectClose(semiannual, 0.0858, 0.00005, `${FABOZZI}: semiannual total return, book rounds to 0.01 %`);
    expectClose(2 * Math.round(semiannual * 1e4) / 1e4, 0.1716, 1e-12, `${FABOZZI}: bond-equivalent return = 2 x the rounded semiannual return`);
    // the panel's convention: annual compounding over the horizon's years (3 years here)
    expectClose(annualisedReturn(ratio, 3), 0.179, 0.00015, `${FABOZZI}: effective annual return (1.0858^2 - 1), book rounds the semiannual rate first`);
  });
});

describe('Hull Table 4.5: forward rates, and the break-even roll rate they imply', () => {
  // Continuous zero rates 1Y 3.0 %, 2Y 4.0 %, 3Y 4.6 %, 4Y 5.0 %, 5Y 5.3 % give one-year forwards
  // 5.0 %, 5.8 %, 6.2 %, 6.5 % (continuous). Settlement 2025-01-01: the first three years are
  // 365 days each, so 1Y legs have tau = 1 on ACT/365F.
  const S = '2025-01-01';
  const curve = build({
    settlement: S,
    quotes: [0.03, 0.04, 0.046, 0.05, 0.053].map((rate, i) => ({ kind: 'zero', maturity: addDays(S, 365 * (i + 1)), rate, compounding: 'continuous', dayCount: 'ACT/365F' })),
  });
  const strategy = (over: Partial<StrategyInputs>): StrategyInputs => ({ ...DEFAULT_STRATEGY, rollTenor: '1Y', rollDayCount: 'ACT/365F', ridingFrequency: 1, bondFrequency: 1, ...over });

  it('reads the forwards 5.0 % and 5.8 % (continuous) off the roll legs', () => {
    const legs = rollLegs(curve, { n: 1, unit: 'Y' }, '2028-01-01', 'ACT/365F');
    if (!legs.ok) throw new Error('legs');
    expectClose(Math.log1p(legs.value[1]!.forward), 0.05, 1e-12, `${HULL}: forward for year 2`);
    expectClose(Math.log1p(legs.value[2]!.forward), 0.058, 1e-12, `${HULL}: forward for year 3`);
  });

  it('puts the break-even rate for year 2 of a 2-year roll at the forward, e^0.05 - 1 simple', () => {
    const r = analyseRollVsTerm(curve, strategy({ horizon: '2Y', ridingMaturity: '4Y', view: 'unchanged' }));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expectClose(r.value.breakEvens.rollRate.zero!, Math.expm1(0.05), 1e-12, `${HULL}: 5.0 % continuous = 5.1271 % simple over one year`);
  });

  it('puts the constant break-even rate for years 2 and 3 of a 3-year roll at e^0.054 - 1 (the mean forward 5.4 %)', () => {
    const r = analyseRollVsTerm(curve, strategy({ horizon: '3Y', ridingMaturity: '2029-12-31', view: 'unchanged' }));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expectClose(r.value.breakEvens.rollRate.zero!, Math.expm1(0.054), 1e-12, `${HULL}: (5.0 + 5.8)/2 % continuous, (1 + r)^2 = e^(3 x 0.046 - 0.03)`);
  });

  it('breaks the 2Y par bond held one year even at a yield rise to its forward yield', () => {
    const r = analyseRollVsTerm(curve, strategy({ horizon: '1Y', ridingMaturity: '3Y', view: 'unchanged' }));
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const point = r.value.breakEvens.curve.find((p) => p.tenor === '2Y')!;
    // 2Y annual par coupon from the two discount factors (hand calculation)
    const c2 = (1 - Math.exp(-0.08)) / (Math.exp(-0.03) + Math.exp(-0.08));
    expectClose(point.yield, c2, 1e-12, `${HULL}: 2Y annual par yield (1 - e^-0.08)/(e^-0.03 + e^-0.08)`);
    expectClose(point.riseBp!, (Math.expm1(0.05) - c2) * 1e4, 1e-8, `${TUCKMAN}: break-even rise = forward yield e^0.05 - 1 minus today's yield`);
  });
});

describe('Tuckman and Serrat: carry and roll-down of a bond under an unchanged curve', () => {
  const S = '2025-01-01';
  const curve = build({
    settlement: S,
    quotes: [0.03, 0.04, 0.046, 0.05, 0.053].map((rate, i) => ({ kind: 'zero', maturity: addDays(S, 365 * (i + 1)), rate, compounding: 'continuous', dayCount: 'ACT/365F' })),
  });

  it('sells a 3Y zero after one year on the unchanged curve at the 2Y discount factor e^-0.08', () => {
    const seen = curveSeenAtHorizon(curve, '2026-01-01');
    const d = discountOn(seen, '2028-01-01');
    if (!d.ok) throw new Error('discount');
    expectClose(d.value.discount, Math.exp(-0.08), 1e-15, `${TUCKMAN}: an unchanged curve by time to maturity`);
  });

  it('splits the 3Y annual par bond held one year into carry, roll-down and no curve change', () => {
    const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, amount: '100', horizon: '1Y', rollTenor: '1Y', rollDayCount: 'ACT/365F', ridingMaturity: '3Y', ridingFrequency: 1, view: 'unchanged' });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const d1 = Math.exp(-0.03);
    const d2 = Math.exp(-0.08);
    const d3 = Math.exp(-0.138);
    const c = (1 - d3) / (d1 + d2 + d3); // annual par coupon, full periods: yield = coupon
    // carry: coupon + price at the unchanged 3Y yield c with two years left - 100 = c (a par bond at its own yield stays at par)
    const carry = 100 * c;
    // roll-down: price on today's curve two years out minus par
    const rollDown = 100 * (c * d1 + (1 + c) * d2) - 100;
    const split = r.value.views.find((v) => v.id === 'unchanged')!.riding;
    expectClose(split.carry.toNumber(), carry, 1e-9, `${TUCKMAN}: carry of a par bond = its coupon`);
    expectClose(split.rollDown.toNumber(), rollDown, 1e-9, `${TUCKMAN}: roll-down = price on the unchanged curve - price at the unchanged yield`);
    expectClose(split.curveChange.toNumber(), 0, 1e-9, `${TUCKMAN}: an unchanged curve has no curve change`);
    const riding = r.value.views.find((v) => v.id === 'unchanged')!.strategies.find((s) => s.id === 'riding')!;
    expectClose(riding.terminal.toNumber(), 100 + carry + rollDown, 1e-9, `${TUCKMAN}: total = amount + carry + roll-down`);
  });
});

describe('money-market break-even: rolling 3M into 3M against a 6M deposit (common practice, decimal.js as oracle)', () => {
  // The rate the second 3M deposit must earn for two 3M deposits to match one 6M deposit, all
  // simple ACT/360: r* = ((1 + r6 d6/360) / (1 + r3 d3/360) - 1) x 360 / (d6 - d3). Money-market
  // forward arithmetic (common practice); the expected value is computed here in decimal.js, apart
  // from the engine, from the two quoted rates and the day counts.
  const S = '2026-03-16';
  const curve = buildCurve(
    {
      format: 'tenorscope-workspace',
      version: 1,
      settlement: S,
      curve: { dayCount: 'ACT/360', interpolation: 'linear-zero', extrapolation: 'none' },
      quotes: [
        { kind: 'deposit', tenor: '3M', rate: 0.0425 },
        { kind: 'deposit', tenor: '6M', rate: 0.0445 },
        { kind: 'deposit', tenor: '1Y', rate: 0.046 },
      ],
    },
    {},
  ).curve!;

  it('matches ((1 + r6 d6/360)/(1 + r3 d3/360) - 1) 360/(d6 - d3)', () => {
    const r = analyseRollVsTerm(curve, { ...DEFAULT_STRATEGY, horizon: '6M', rollTenor: '3M', rollDayCount: 'ACT/360', ridingMaturity: '1Y', view: 'unchanged' });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const d3 = 92; // 2026-03-16 to 2026-06-16
    const d6 = 184; // 2026-03-16 to 2026-09-16
    expect(r.value.legs.map((l) => l.days)).toEqual([d3, d6 - d3]);
    const D = Decimal.clone({ precision: 40 });
    const g6 = new D(1).plus(new D('0.0445').times(d6).div(360));
    const g3 = new D(1).plus(new D('0.0425').times(d3).div(360));
    const expected = g6.div(g3).minus(1).times(360).div(d6 - d3).toNumber();
    expectClose(r.value.breakEvens.rollRate.zero!, expected, 1e-13, 'money-market forward, common practice; decimal.js oracle');
    // leg 1 earns the 3M deposit rate itself
    expectClose(r.value.legs[0]!.forward, 0.0425, 1e-15, 'leg 1 at the quoted 3M deposit rate (simple ACT/360)');
  });
});
