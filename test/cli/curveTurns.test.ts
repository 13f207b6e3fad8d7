import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { buildCurve, OVERNIGHT_KIT, turnSpreads } from '../../src/core/index.ts';
import { expectClose } from '../helpers/asserts.ts';

// The command prints the spread a turn took when it is solved from a quote (issue 18, item 6), so
// a batch user can read the solved size. The market is the closed-form case of
// test/core/bootstrap/turnSolve.test.ts, invented: on a flat 4% continuous forward (ACT/365F) the
// 1M and 3M deposits (simple ACT/360) are made with 25 bp added to the overnight rate over the three
// days of year end 2022 (a Friday to the Monday); the 1M deposit, which spans them, sets the spread,
// so it comes back as 25 bp (turnSolve.test.ts holds the solve to its closed form). A document
// whose spreads are all typed prints as before: no `turns`.

const F = 0.04;
const S = 25 / 1e4;
const depositRate = (lnGrowth: number, days: number) => (Math.expm1(lnGrowth) * 360) / days;
const YEAR_END = { name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', calendar: 'weekends' };
const doc = (turn: Record<string, unknown>) => ({
  format: 'tenorscope-workspace',
  version: 2,
  valuationDate: '2022-12-15',
  curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' },
  turns: [{ ...YEAR_END, ...turn }],
  quotes: [
    { kind: 'deposit', maturity: '2022-12-22', rate: depositRate((F * 7) / 365, 7) },
    { kind: 'deposit', maturity: '2023-01-17', rate: depositRate((F * 33) / 365 + (S * 3) / 360, 33) },
    { kind: 'deposit', maturity: '2023-03-15', rate: depositRate((F * 90) / 365 + (S * 3) / 360, 90) },
  ],
});
const lineOf = async (d: unknown): Promise<Record<string, any>> => {
  const r = await runCurveCommand(['-'], () => JSON.stringify(d));
  expect(r.status, r.stderr).toBe(0);
  return JSON.parse(r.stdout.trim()) as Record<string, any>;
};

describe('curve: turns', () => {
  it('prints the spread a turn solved from a quote took, and the quote, as the core builds it', async () => {
    const d = doc({ solveFrom: 1 });
    const o = await lineOf(d);
    const spread = turnSpreads(buildCurve(d, { overnight: OVERNIGHT_KIT }))[0]!.spreadBp;
    expect(o.turns).toEqual([{ name: 'year end 2022', from: '2022-12-30', to: '2022-12-30', spreadBp: spread, solvedFrom: 1 }]);
    expectClose(o.turns[0].spreadBp, 25, 1e-9, 'the 25 bp the deposits were made with (closed form in the test)');
  });

  it('prints no turns when every spread is typed (the output is as before)', async () => {
    const o = await lineOf(doc({ spreadBp: 25 }));
    expect('turns' in o).toBe(false);
  });
});
