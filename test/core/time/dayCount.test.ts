import { describe, expect, it } from 'vitest';
import { CURVE_DAY_COUNTS, DAY_COUNTS, validateWorkspace, yearFraction, type DayCount } from '../../../src/core/index.ts';
import { expectClose } from '../../helpers/asserts.ts';

// ACT/ACT worked periods of the ISDA paper "EMU and Market Conventions: Recent Developments"
// (ISDA, 1998; the ACT/ACT section), values quoted to 12 decimals there; cited from memory and
// re-derived by hand below each case from the rule definitions (2006 ISDA Definitions 4.16(b) for
// ACT/ACT-ISDA, ICMA Rule 251 for ACT/ACT-ICMA). The paper also gives AFB results; this engine has
// no AFB day count, so those are not checked.
const ISDA_PAPER = 'ISDA 1998 "EMU and Market Conventions" ACT/ACT examples (from memory, re-derived by hand)';
const TOL = 5e-13; // the paper prints 12 decimals

describe('ACT/ACT-ISDA (2006 ISDA Definitions 4.16(b))', () => {
  const cases: [string, string, number, number, string][] = [
    // [d1, d2, paper value (from memory), hand derivation, how]
    ['2003-11-01', '2004-05-01', 0.497724380567, 61 / 365 + 121 / 366, '61/365 + 121/366'],
    ['1999-02-01', '1999-07-01', 0.41095890411, 150 / 365, '150/365'],
    ['1999-07-01', '2000-07-01', 1.00137734860, 184 / 365 + 182 / 366, '184/365 + 182/366'],
    ['2002-08-15', '2003-07-15', 0.915068493151, 334 / 365, '334/365'],
    ['2003-07-15', '2004-01-15', 0.504004790778, 170 / 365 + 14 / 366, '170/365 + 14/366'],
    ['1999-07-30', '2000-01-30', 0.503892506924, 155 / 365 + 29 / 366, '155/365 + 29/366'],
    ['2000-01-30', '2000-06-30', 0.415300546448, 152 / 366, '152/366'],
  ];
  for (const [d1, d2, paper, hand, how] of cases) {
    it(`${d1} to ${d2} = ${how}`, () => {
      const yf = yearFraction('ACT/ACT-ISDA', d1, d2);
      expectClose(yf, hand, 2e-16, `hand calculation ${how} from 4.16(b)`);
      // The remembered figures are trusted to 10 decimals only.
      expectClose(yf, paper, 5e-11, ISDA_PAPER);
    });
  }
  it('spans several years: whole years plus the stubs in each year (rule 4.16(b))', () => {
    // 2001-06-01 .. 2005-03-01: 214/365 (2001) + 3 whole years (2002, 2003, 2004) + 59/365 (2005).
    expectClose(yearFraction('ACT/ACT-ISDA', '2001-06-01', '2005-03-01'), 214 / 365 + 3 + 59 / 365, 1e-15, 'hand calculation from 4.16(b)');
  });
});

describe('ACT/ACT-ICMA (ICMA Rule 251), reference period the coupon period', () => {
  it('regular semiannual period 2003-11-01 to 2004-05-01 is exactly one half', () => {
    const yf = yearFraction('ACT/ACT-ICMA', '2003-11-01', '2004-05-01', { refStart: '2003-11-01', refEnd: '2004-05-01', frequency: 2 });
    expectClose(yf, 0.5, 0, ISDA_PAPER);
  });
  it('short first period, annual: 1999-02-01 to 1999-07-01 in the notional period 1998-07-01..1999-07-01', () => {
    const yf = yearFraction('ACT/ACT-ICMA', '1999-02-01', '1999-07-01', { refStart: '1998-07-01', refEnd: '1999-07-01', frequency: 1 });
    expectClose(yf, 0.41095890411, TOL, ISDA_PAPER);
  });
  it('long first period, semiannual: 2002-08-15 to 2003-07-15 split over two notional periods = 0.915760869565', () => {
    // Rule 251 for a long period: the sum over the notional periods it spans.
    const first = yearFraction('ACT/ACT-ICMA', '2002-08-15', '2003-01-15', { refStart: '2002-07-15', refEnd: '2003-01-15', frequency: 2 });
    const second = yearFraction('ACT/ACT-ICMA', '2003-01-15', '2003-07-15', { refStart: '2003-01-15', refEnd: '2003-07-15', frequency: 2 });
    expectClose(first, 153 / (2 * 184), 1e-16, 'hand calculation: 153 days of a 184-day half-year');
    expectClose(first + second, 0.915760869565, TOL, ISDA_PAPER);
  });
  it('short final period 2000-01-30 to 2000-06-30, notional period to 2000-07-30 = 0.417582417582', () => {
    const yf = yearFraction('ACT/ACT-ICMA', '2000-01-30', '2000-06-30', { refStart: '2000-01-30', refEnd: '2000-07-30', frequency: 2 });
    expectClose(yf, 0.417582417582, TOL, ISDA_PAPER);
  });
  it('without a reference period it refuses (a caller error, never a silent value)', () => {
    expect(() => yearFraction('ACT/ACT-ICMA', '2000-01-30', '2000-06-30')).toThrow(/reference period/);
  });
});

// 30/360 family: expected day counts computed by hand from the published rule texts:
//   30/360      2006 ISDA Definitions 4.16(f) (Bond Basis)
//   30E/360     2006 ISDA Definitions 4.16(g) (Eurobond Basis)
//   30E/360-ISDA 2006 ISDA Definitions 4.16(h), with and without the date being the termination date
//   30/360-US   the securities industry's standard (SIFMA) rules 1-4 as restated in the engine
//               issue, section 2; rules 1 and 2 (end of February) only with eom.
// Each entry is the day count numerator (years x 360 + months x 30 + days after adjustment).
const RULES = 'hand calculation from the published rule definitions (ISDA 2006 4.16(f)-(h); SIFMA 30/360 rules 1-4)';
type Row = { d1: string; d2: string; bond: number; e: number; eIsda: number; eIsdaTerm: number; usEom: number; usNoEom: number; note: string };
const rows: Row[] = [
  { d1: '2007-01-15', d2: '2007-01-30', bond: 15, e: 15, eIsda: 15, eIsdaTerm: 15, usEom: 15, usNoEom: 15, note: 'plain days' },
  { d1: '2007-01-15', d2: '2007-07-15', bond: 180, e: 180, eIsda: 180, eIsdaTerm: 180, usEom: 180, usNoEom: 180, note: 'six months' },
  { d1: '2007-01-15', d2: '2007-01-31', bond: 16, e: 15, eIsda: 15, eIsdaTerm: 15, usEom: 16, usNoEom: 16, note: 'D2 = 31 with D1 < 30 stays 31 on Bond Basis and US' },
  { d1: '2007-09-30', d2: '2008-03-31', bond: 180, e: 180, eIsda: 180, eIsdaTerm: 180, usEom: 180, usNoEom: 180, note: 'D1 = 30, D2 = 31 -> 30' },
  { d1: '2007-08-31', d2: '2007-10-31', bond: 60, e: 60, eIsda: 60, eIsdaTerm: 60, usEom: 60, usNoEom: 60, note: 'both 31st' },
  { d1: '2007-01-31', d2: '2007-02-28', bond: 28, e: 28, eIsda: 30, eIsdaTerm: 28, usEom: 28, usNoEom: 28, note: 'to the last of February' },
  { d1: '2007-02-28', d2: '2007-08-31', bond: 183, e: 182, eIsda: 180, eIsdaTerm: 180, usEom: 180, usNoEom: 183, note: 'from the last of February to a 31st' },
  { d1: '2008-02-29', d2: '2008-08-31', bond: 182, e: 181, eIsda: 180, eIsdaTerm: 180, usEom: 180, usNoEom: 182, note: 'leap-year end of February to a 31st' },
  { d1: '2007-02-28', d2: '2008-02-29', bond: 361, e: 361, eIsda: 360, eIsdaTerm: 359, usEom: 360, usNoEom: 361, note: 'last of February to last of February' },
  { d1: '2008-02-29', d2: '2009-02-28', bond: 359, e: 359, eIsda: 360, eIsdaTerm: 358, usEom: 360, usNoEom: 359, note: 'last of February to last of February' },
  { d1: '2008-02-28', d2: '2008-02-29', bond: 1, e: 1, eIsda: 2, eIsdaTerm: 1, usEom: 1, usNoEom: 1, note: '28 Feb of a leap year is not the month end' },
  { d1: '2008-02-29', d2: '2008-03-31', bond: 32, e: 31, eIsda: 30, eIsdaTerm: 30, usEom: 30, usNoEom: 32, note: 'month end to month end' },
  { d1: '2007-08-31', d2: '2008-02-29', bond: 179, e: 179, eIsda: 180, eIsdaTerm: 179, usEom: 179, usNoEom: 179, note: 'a 31st to the last of February' },
  { d1: '2006-08-31', d2: '2007-02-28', bond: 178, e: 178, eIsda: 180, eIsdaTerm: 178, usEom: 178, usNoEom: 178, note: 'a 31st to the last of February' },
];

describe('30/360 variants with end-of-February cases', () => {
  for (const r of rows) {
    describe(`${r.d1} to ${r.d2} (${r.note})`, () => {
      const check = (dc: DayCount, days: number, ctx: Parameters<typeof yearFraction>[3], what: string) =>
        it(`${what}: ${days}/360`, () => expectClose(yearFraction(dc, r.d1, r.d2, ctx), days / 360, 1e-16, RULES));
      check('30/360', r.bond, {}, '30/360 Bond Basis');
      check('30E/360', r.e, {}, '30E/360');
      check('30E/360-ISDA', r.eIsda, { termination: '2099-12-31' }, '30E/360-ISDA, D2 not the termination date');
      check('30E/360-ISDA', r.eIsdaTerm, { termination: r.d2 }, '30E/360-ISDA, D2 the termination date');
      check('30/360-US', r.usEom, { eom: true }, '30/360-US with eom');
      check('30/360-US', r.usNoEom, { eom: false }, '30/360-US without eom');
    });
  }
  it('30E/360-ISDA without a termination date refuses (a caller error)', () => {
    expect(() => yearFraction('30E/360-ISDA', '2007-02-28', '2007-08-31')).toThrow(/termination/);
  });
});

describe('ACT/360 and ACT/365F (2006 ISDA Definitions 4.16(e), 4.16(d))', () => {
  it('counts actual days over 360 and over 365, across a leap day', () => {
    // 2008-02-01 .. 2008-03-01 is 29 actual days.
    expectClose(yearFraction('ACT/360', '2008-02-01', '2008-03-01'), 29 / 360, 0, 'hand count of days, 4.16(e)');
    expectClose(yearFraction('ACT/365F', '2008-02-01', '2008-03-01'), 29 / 365, 0, 'hand count of days, 4.16(d)');
    expectClose(yearFraction('ACT/365F', '2008-03-01', '2008-02-01'), -29 / 365, 0, 'reversed dates give the negative');
  });
});

describe('an unknown day count identifier lists the valid ones (through validateWorkspace)', () => {
  const doc = (dayCount: unknown, curveDayCount: unknown = 'ACT/365F') => ({
    format: 'tenorscope-workspace',
    version: 1,
    settlement: '2027-03-10',
    curve: { dayCount: curveDayCount },
    quotes: [{ kind: 'deposit', tenor: '3M', rate: 0.03, dayCount }],
  });
  it('a quote day count "ACT/365" (not an identifier) is refused at its path, listing all eight', () => {
    const v = validateWorkspace(doc('ACT/365'));
    const e = v.errors.find((x) => x.path === 'quotes[0].dayCount');
    expect(e?.code).toBe('unknown-identifier');
    for (const dc of DAY_COUNTS) expect(e?.message).toContain(dc);
  });
  it('identifiers are case-sensitive: "act/360" is refused', () => {
    expect(validateWorkspace(doc('act/360')).errors[0]?.code).toBe('unknown-identifier');
  });
  it('ACT/ACT-ICMA as the curve day count is refused with the reason and the curve day counts listed', () => {
    const v = validateWorkspace(doc('ACT/360', 'ACT/ACT-ICMA'));
    const e = v.errors.find((x) => x.path === 'curve.dayCount');
    expect(e?.code).toBe('unknown-identifier');
    expect(e?.message).toMatch(/needs an instrument/);
    for (const dc of CURVE_DAY_COUNTS) expect(e?.message).toContain(dc);
    expect(v.workspace).toBeNull();
  });
});
