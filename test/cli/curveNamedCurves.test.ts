import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { buildCurve, buildNamedCurves, readNamedCurves } from '../../src/core/index.ts';

// The `curve` command on a document with named curves: every curve built and printed under its
// name, the default curve's output where it was. The references are the engine's own builds
// (buildCurve, buildNamedCurves; test/core/bootstrap/namedCurves.test.ts checks those against a
// hand calculation); the market is invented test data.

const run = (input: string, ...args: string[]) => runCurveCommand(['-', ...args], () => input);

// The invented two-curve market of the workbench's tests: its OIS and its six-month index quotes.
const MARKET = JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8')) as { quotes: { rate: number }[]; curves: { quotes: object[] }[] };
const OIS = MARKET.quotes;
const INDEX = MARKET.curves[0]!.quotes;
const single = { format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10', curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex' }, quotes: OIS };
const doc = { ...single, curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', quotes: INDEX }, { name: 'govt', role: 'government', quotes: [{ kind: 'zero', tenor: '1Y', rate: 0.02 }, { kind: 'zero', tenor: '5Y', rate: 0.024 }] }] };

describe('curve on a document with named curves', () => {
  it('prints the default curve as before and each named curve under its name, with its role, settings, quotes, points and forwards', async () => {
    const args = ['--forward', '1Y:2Y', '--compounding', 'annual'];
    const before = await run(JSON.stringify(single), ...args);
    const r = await run(JSON.stringify(doc), ...args);
    expect(r.status).toBe(0);
    const line = r.stdout.trim();
    // The field order and text are JSON.stringify's (the line writer's contract, test/cli/documentLine.test.ts).
    expect(JSON.stringify(JSON.parse(line))).toBe(line);
    const o = JSON.parse(line) as Record<string, any>;
    const { curves, ...rest } = o;
    expect(JSON.stringify(rest)).toBe(before.stdout.trim());
    expect(Object.keys(curves)).toEqual(['euribor6m', 'govt']);
    const p = curves.euribor6m;
    expect(p).toMatchObject({ role: 'projection', index: '6M', discountCurve: 'default', interpolation: 'monotone-convex', curveDayCount: 'ACT/365F', compounding: 'annual', rateDayCount: 'ACT/365F' });
    expect(curves.govt.role).toBe('government');
    expect(curves.govt.index).toBeUndefined();
    // The numbers are the engine's named build, to the bit.
    const main = buildCurve(doc, { readCurves: readNamedCurves });
    const [named] = buildNamedCurves(main.workspace!, main.curve);
    const c = named!.build.curve!;
    expect(p.points.map((x: { discount: number }) => x.discount)).toEqual(c.pillars.map((x) => x.discount));
    expect(p.quotes.map((q: { repricingError: number }) => q.repricingError)).toEqual(named!.build.repricing.map((x) => x.repricingError));
    for (const q of p.quotes) expect(Math.abs(q.repricingError)).toBeLessThanOrEqual(1e-14);
    // Which curve discounted each quote: the term-index swaps the discounting curve; the deposit, which
    // fixes its own curve's DF ratio, none; the government curve's zeros none.
    expect(p.quotes.map((q: { kind: string; discountedOn: string | null }) => [q.kind, q.discountedOn])).toEqual([['deposit', null], ['swap', 'default'], ['swap', 'default']]);
    expect(curves.govt.quotes.map((q: { discountedOn: string | null }) => q.discountedOn)).toEqual([null, null]);
    expect(p.forwards).toHaveLength(1);
    expect(p.forwards[0].rate).not.toBe(o.forwards[0].rate);
  });

  it('fails the document with an error naming the curve when a named curve is wrong', async () => {
    const bad = { ...doc, curves: [{ ...doc.curves[0], discountCurve: 'estr' }] };
    const r = await run(JSON.stringify(bad));
    expect(r.status).not.toBe(0);
    const o = JSON.parse(r.stdout.trim()) as { errors: { path: string; message: string }[] };
    expect(o.errors.map((e) => e.path)).toEqual(['curves[0].discountCurve']);
    expect(o.errors[0]!.message).toMatch(/"estr" names no curve/);
  });

  it('fails the document when a named curve does not build, naming its quote in its curve', async () => {
    const bad = { ...doc, curves: [{ ...doc.curves[0], quotes: [...INDEX, { kind: 'swap', tenor: '20Y', rate: 0.03 }] }] };
    const r = await run(JSON.stringify(bad));
    expect(r.status).not.toBe(0);
    const o = JSON.parse(r.stdout.trim()) as { errors: { path: string; message: string }[] };
    expect(o.errors.map((e) => e.path)).toEqual(['curves[0].quotes[3].maturity']);
    expect(o.errors[0]!.message).toMatch(/^curves\[0\] "euribor6m": quotes\[3\] \(swap 2047-03-10\) pays on 2047-03-10, after the last pillar of its discounting curve "default"/);
  });
});
