// A `swap` quote on a calendar (`calendar`, `spotLag`, `businessDay`, `paymentLag`): on one curve
// its floating leg telescopes as an overnight-index swap's does (MARKET-CONVENTIONS.md section d,
// the single-curve par rate), so it prices with the OIS instrument and its fixed-leg conventions.
// Sources: euro swaps T+2 on TARGET, modified following (MARKET-CONVENTIONS.md section c, common
// practice); TARGET's 2027 closing days (ECB; held in test/core/time/calendars.test.ts). The quotes
// are invented test data.
import { describe, expect, it } from 'vitest';
import { buildCurve, INTERPOLATIONS, validateWorkspace } from '../../../src/core/index.ts';
import { runCurveCommand } from '../../../src/cli/curveCommand.ts';

const doc = (quotes: unknown[], interpolation = 'monotone-convex') => ({ format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-24', curve: { interpolation }, quotes });
const terms = { calendar: 'target', spotLag: 2, businessDay: 'modified-following', frequency: 1, dayCount: '30/360' };
const ladder = (kind: 'swap' | 'ois') => [
  { kind: 'deposit', tenor: 'ON', rate: 0.021, calendar: 'target' },
  { kind: 'deposit', tenor: 'TN', rate: 0.0211, calendar: 'target' },
  ...[['1Y', 0.0225], ['2Y', 0.0238], ['5Y', 0.0262], ['10Y', 0.0281]].map(([tenor, rate]) => ({ kind, tenor, rate, ...terms })),
];

describe('a swap on a calendar', () => {
  it('builds exactly the curve of OIS quotes with the same dates and fixed leg (bit for bit)', () => {
    const a = buildCurve(doc(ladder('swap')));
    const b = buildCurve(doc(ladder('ois')));
    expect(a.errors).toEqual([]);
    expect(a.curve!.pillars).toEqual(b.curve!.pillars);
    expect(a.repricing.map((r) => r.model)).toEqual(b.repricing.map((r) => r.model));
    expect(a.repricing.filter((r) => r.index >= 2).every((r) => r.kind === 'swap')).toBe(true);
  });

  it('starts at spot over Easter 2027 (T+2 on TARGET from Wednesday 24 March: Tuesday 30 March) and reprices under every method', async () => {
    for (const interpolation of INTERPOLATIONS) {
      const r = buildCurve(doc(ladder('swap'), interpolation));
      expect(r.errors, interpolation).toEqual([]);
      for (const row of r.repricing) expect(Math.abs(row.repricingError), `${interpolation} ${row.kind} ${row.maturity}`).toBeLessThanOrEqual(1e-14);
    }
    const out = JSON.parse((await runCurveCommand(['-'], () => JSON.stringify(doc(ladder('swap'))) + '\n')).stdout) as { quotes: { kind: string; start: string; payment?: string }[] };
    expect(out.quotes[2]).toMatchObject({ kind: 'swap', start: '2027-03-30', payment: '2028-03-30' });
  });

  it('a swap without these fields reads as before (no date terms on the quote)', () => {
    const q = validateWorkspace(doc([{ kind: 'swap', tenor: '5Y', rate: 0.03 }])).workspace!.quotes[0]!;
    expect(q).not.toHaveProperty('calendar');
    expect(q.maturity).toBe('2032-03-24');
  });

  it('an unknown calendar on a swap lists the valid ones', () => {
    const e = validateWorkspace(doc([{ kind: 'swap', tenor: '5Y', rate: 0.03, calendar: 'tokyo' }])).errors;
    expect(e).toContainEqual(expect.objectContaining({ code: 'unknown-identifier', path: 'quotes[0].calendar', message: expect.stringContaining('target') }));
  });
});
