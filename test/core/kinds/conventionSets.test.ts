// Named convention sets (`"conventions": "<set id>"` on a quote; src/core/kinds/conventionSets.ts).
// Sources, named at each check:
// - MARKET-CONVENTIONS.md sections c and d (the project's notes of published conventions, each
//   checked there against its source): SOFR OIS T+2 on the US government securities calendar,
//   annual ACT/360 both legs, modified following, payment lag 2 (Strata USD_FIXED_1Y_SOFR_OIS);
//   €STR T+2 on TARGET, ACT/360, payment lag 1 (muRisQ, Strata); SONIA T+0 on England and Wales
//   days, ACT/365F both legs, no payment lag (Strata GBP_FIXED_1Y_SONIA_OIS); euro deposits T+2
//   ACT/360 (QuantLib euribor.cpp). Dollar and sterling deposit spot lags are common practice,
//   stated from memory.
// - SIFMA's holiday recommendation for 2027 (held by test/core/time/calendars.test.ts): Christmas
//   falls on a Saturday, so the US government securities market closes Friday 2027-12-24.
// The quotes are invented test data.
import { describe, expect, it } from 'vitest';
import { buildCurve, CONVENTION_SETS, conventionSet, INTERPOLATIONS, validateWorkspace } from '../../../src/core/index.ts';
import { runCurveCommand } from '../../../src/cli/curveCommand.ts';

/** A quote of `kind` with its value field (invented values). */
const head = (kind: string, tenor: string, fields: Readonly<Record<string, unknown>> = {}): Record<string, unknown> =>
  // An FRA is dated by its period, six months from spot on the set's index.
  kind === 'fra' ? { kind, period: `6x${6 + Number.parseInt(String(fields.index ?? '6M'), 10)}`, rate: 0.03 } : kind === 'bond' ? { kind, maturity: '2031-05-15', coupon: 0.04, cleanPrice: 101 } : kind === 'bill' ? { kind, tenor, discountYield: 0.03 } : kind === 'par-yield' ? { kind, tenor, yield: 0.03 } : { kind, tenor, rate: 0.03 };
const doc = (quotes: unknown[], extra: Record<string, unknown> = {}) => ({ format: 'tenorscope-workspace', version: 2, valuationDate: '2027-12-22', ...extra, quotes });

describe('the sets hold the published conventions', () => {
  it('the overnight-swap sets fill exactly the table of MARKET-CONVENTIONS.md section d', () => {
    expect(conventionSet('usd-sofr')!.fields.ois).toEqual({ calendar: 'us-gov-securities', spotLag: 2, businessDay: 'modified-following', paymentLag: 2, frequency: 1, dayCount: 'ACT/360', floatDayCount: 'ACT/360' });
    expect(conventionSet('eur-estr')!.fields.ois).toEqual({ calendar: 'target', spotLag: 2, businessDay: 'modified-following', paymentLag: 1, frequency: 1, dayCount: 'ACT/360', floatDayCount: 'ACT/360' });
    expect(conventionSet('gbp-sonia')!.fields.ois).toEqual({ calendar: 'england-wales', spotLag: 0, businessDay: 'modified-following', paymentLag: 0, frequency: 1, dayCount: 'ACT/365F', floatDayCount: 'ACT/365F' });
  });
  it('the government bond sets settle as section c states: Treasuries T+1 on US government securities days (bills too), Bunds T+2 on TARGET, gilts T+1 on England and Wales days', () => {
    expect(conventionSet('us-treasury')!.fields.bond).toEqual({ frequency: 2, dayCount: 'ACT/ACT-ICMA', calendar: 'us-gov-securities', spotLag: 1 });
    expect(conventionSet('us-treasury')!.fields.bill).toEqual({ calendar: 'us-gov-securities', spotLag: 1 });
    expect(conventionSet('euro-govt')!.fields.bond).toEqual({ frequency: 1, dayCount: 'ACT/ACT-ICMA', calendar: 'target', spotLag: 2 });
    expect(conventionSet('uk-gilt')!.fields.bond).toEqual({ frequency: 2, dayCount: 'ACT/ACT-ICMA', calendar: 'england-wales', spotLag: 1 });
  });
  it('every field a set fills is one its kind takes, with a value the kind accepts (a quote with only the set validates)', () => {
    for (const set of CONVENTION_SETS) {
      for (const kind of Object.keys(set.fields)) {
        const q = { ...head(kind, '1Y', set.fields[kind as keyof typeof set.fields]), conventions: set.id };
        const v = validateWorkspace(doc([q]));
        expect(v.errors, `${set.id} on a ${kind}`).toEqual([]);
      }
    }
  });
});

describe('a quote naming a set', () => {
  it('reads exactly as the same quote with the set\'s fields written out', () => {
    for (const set of CONVENTION_SETS) {
      for (const [kind, fields] of Object.entries(set.fields)) {
        const named = validateWorkspace(doc([{ ...head(kind, '18M', fields), conventions: set.id }])).workspace!.quotes[0];
        const spelt = validateWorkspace(doc([{ ...head(kind, '18M', fields), ...fields }])).workspace!.quotes[0];
        expect(named, `${set.id} on a ${kind}`).toEqual(spelt);
      }
    }
  });

  it('a field the quote gives itself overrides the set\'s', () => {
    const q = validateWorkspace(doc([{ kind: 'ois', tenor: '2Y', rate: 0.03, conventions: 'usd-sofr', paymentLag: 0 }])).workspace!.quotes[0]!;
    expect(q).toMatchObject({ paymentLag: 0, spotLag: 2, calendar: 'us-gov-securities' });
  });

  it('a dollar ladder over Christmas 2027: TN runs 2027-12-23 to 2027-12-27 (the 24th closed), spot is 2027-12-27, the 1Y swap pays 2028-12-29', async () => {
    const quotes = [
      { kind: 'deposit', tenor: 'ON', rate: 0.0431, conventions: 'usd-sofr' },
      { kind: 'deposit', tenor: 'TN', rate: 0.0432, conventions: 'usd-sofr' },
      { kind: 'ois', tenor: '1Y', rate: 0.041, conventions: 'usd-sofr' },
      { kind: 'ois', tenor: '2Y', rate: 0.0395, conventions: 'usd-sofr' },
      { kind: 'ois', tenor: '5Y', rate: 0.0375, conventions: 'usd-sofr' },
    ];
    const r = await runCurveCommand(['-'], () => JSON.stringify(doc(quotes)) + '\n');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { quotes: Record<string, unknown>[] };
    expect(out.quotes[1]).toMatchObject({ start: '2027-12-23', end: '2027-12-27' });
    // End 2028-12-27 (a Wednesday, open); paid two business days later, Friday 2028-12-29, its pillar.
    expect(out.quotes[2]).toMatchObject({ start: '2027-12-27', end: '2028-12-27', payment: '2028-12-29', pillar: '2028-12-29' });
    // Every quote reprices under every interpolation method (rates to 1e-14).
    for (const interpolation of INTERPOLATIONS) {
      const b = buildCurve(doc(quotes, { curve: { interpolation } }));
      expect(b.errors, interpolation).toEqual([]);
      for (const row of b.repricing) expect(Math.abs(row.repricingError), `${interpolation} ${row.kind} ${row.maturity}`).toBeLessThanOrEqual(1e-14);
    }
  });
});

describe('bad set names are errors that list what is valid', () => {
  it('an unknown set lists every set', () => {
    const e = validateWorkspace(doc([{ kind: 'ois', tenor: '1Y', rate: 0.03, conventions: 'sofr' }])).errors;
    expect(e).toContainEqual(expect.objectContaining({ code: 'unknown-identifier', path: 'quotes[0].conventions', message: expect.stringContaining('usd-sofr, eur-estr, gbp-sonia, us-treasury, euro-govt, uk-gilt') }));
  });
  it('a set for other kinds names the kinds it fills and the sets for this one', () => {
    const e = validateWorkspace(doc([{ kind: 'bond', maturity: '2031-05-15', coupon: 0.04, cleanPrice: 101, conventions: 'usd-sofr' }])).errors;
    expect(e).toContainEqual(expect.objectContaining({ path: 'quotes[0].conventions', message: expect.stringMatching(/fills ois, deposit quotes, not a bond; the sets for a bond are us-treasury, euro-govt, uk-gilt/) }));
  });
});
