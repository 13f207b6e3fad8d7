import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { analyzeBond, buildCurve } from '../../src/core/index.ts';
import { expectClose } from '../helpers/asserts.ts';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';

// `--bond MATURITY,COUPON,FREQUENCY,DAYCOUNT[,price=P|yield=Y]` (repeatable) adds a `bonds` array:
// the figures must be the core's analyzeBond, and a mistake must be a usage error or a document
// error a user can act on. Documents are invented test data.
const { depo3M, bond2029, swap10Y, swap30Y } = INVENTED_2027; // test/helpers/markets.ts
const doc = workspaceDoc([depo3M, bond2029, swap10Y, swap30Y], { interpolation: 'monotone-convex' });
const run = (...args: string[]) => runCurveCommand(['-', ...args], () => JSON.stringify(doc));

describe('curve --bond', () => {
  it('adds one bonds[] entry per --bond with the model figures, key rates by tenor and the market fields', async () => {
    const r = await run('--bond', '2034-05-15,0.04,2,ACT/ACT-ICMA,price=101.25', '--bond', '10Y,0.035,1,30/360,yield=0.036', '--bond', '2032-01-31,0.02,4,ACT/360');
    expect(r.status).toBe(0);
    const o = JSON.parse(r.stdout) as { bonds: Record<string, any>[] };
    expect(o.bonds).toHaveLength(3);
    const curve = buildCurve(doc).curve!;
    const a = analyzeBond(curve, { maturity: '2034-05-15', coupon: 0.04, frequency: 2, dayCount: 'ACT/ACT-ICMA', cleanPrice: 101.25 });
    if (!a.ok) throw new Error('analytics');
    const [b0, b1, b2] = o.bonds as [Record<string, any>, Record<string, any>, Record<string, any>];
    for (const k of ['modelCleanPrice', 'modelDirtyPrice', 'accrued', 'yield', 'macaulayDuration', 'modifiedDuration', 'convexity', 'dv01'] as const) {
      expectClose(b0[k], a.value[k], 0, `analyzeBond ${k}`);
    }
    expect(Object.keys(b0.keyRateDurations)).toEqual(['3M', '6M', '1Y', '2Y', '3Y', '5Y', '7Y', '10Y', '20Y', '30Y']);
    expectClose(b0.zSpread, a.value.market!.zSpread, 0, 'analyzeBond market.zSpread');
    expectClose(b0.yieldFromPrice, a.value.market!.yield, 0, 'yield from the clean price');
    expectClose(b0.marketModifiedDuration, a.value.market!.modifiedDuration, 0, 'duration at the market yield');
    expect(b1.maturity).toBe('2037-03-10'); // the tenor resolved from settlement
    expect(typeof b1.priceFromYield).toBe('number');
    expect(b1.yieldFromPrice).toBeUndefined();
    expect(b2.zSpread).toBeUndefined();
    expect(b0.yieldConvention).toBe('ICMA, compounded 2/yr, accrual ACT/ACT-ICMA');
    expect(b0.zSpreadConvention).toBe('cont, ACT/365F');
  });
  it('leaves the output without bonds when no --bond is given', async () => {
    const o = JSON.parse((await run()).stdout) as Record<string, unknown>;
    expect('bonds' in o).toBe(false);
  });
  it('refuses malformed --bond text as a usage error (exit 2, nothing on standard output)', async () => {
    for (const bad of ['2034-05-15,0.04,2', '2034-05-15,4%,2,ACT/ACT-ICMA', '2034-05-15,0.04,2,ACT/ACT', '2034-05-15,0.04,2,ACT/ACT-ICMA,clean=101']) {
      const r = await run('--bond', bad);
      expect(r.status, bad).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(/--bond/);
    }
  });
  it('reports a bond the curve cannot value as a document error naming --bond[i] (exit 1)', async () => {
    const r = await run('--bond', '2034-05-15,0.04,2,ACT/ACT-ICMA', '--bond', '2070-01-01,0.04,2,ACT/ACT-ICMA');
    expect(r.status).toBe(1);
    const o = JSON.parse(r.stdout) as { errors: { path: string; code: string }[] };
    expect(o.errors[0]).toMatchObject({ path: '--bond[1].maturity', code: 'beyond-curve' });
  });
  it('with --explain each bond explains every printed figure, its value the printed number and its last step that number, and the rest of the line is unchanged', async () => {
    const args = ['--bond', '2034-05-15,0.04,2,ACT/ACT-ICMA,price=101.25', '--bond', '2036-11-20,0.035,1,30/360,yield=0.036']; // the second accrues: clean and dirty differ
    const plain = await run(...args);
    const r = await run(...args, '--explain');
    expect(r.status).toBe(0);
    const o = JSON.parse(r.stdout) as { bonds: Record<string, any>[]; points: Record<string, unknown>[] };
    for (const b of o.bonds) {
      const explained = Object.keys(b.explain);
      expect(explained.length).toBeGreaterThanOrEqual(13);
      for (const k of explained) {
        expect(b.explain[k].value, k).toBe(b[k]); // JSON numbers: the same double
        expect(b.explain[k].steps.at(-1).value, k).toBe(b[k]);
      }
      // A model figure reads the curve: the quotes behind it and its value under each method.
      expect(b.explain.modelDirtyPrice.reads.length).toBeGreaterThan(0);
      expect(b.explain.modelDirtyPrice.topQuotes.length).toBeGreaterThan(0);
      expect(b.explain.modelDirtyPrice.methods.find((m: any) => m.current).value).toBe(b.modelDirtyPrice);
      delete b.explain;
    }
    for (const p of o.points) delete p.explain;
    expect(JSON.stringify(o)).toBe(plain.stdout.trim());
  });
});
