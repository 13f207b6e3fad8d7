import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { buildCurve, buildNamedCurves, readNamedCurves, topQuoteInfluencesAcrossCurves } from '../../src/core/index.ts';
import { expectClose } from '../helpers/asserts.ts';

// `curve --explain` on a document with named curves: each named curve's points and forwards carry
// their explanation, the top quotes across every curve (each naming its curve). References: the
// core's own topQuoteInfluencesAcrossCurves on the engine's builds (test/core/analytics/
// crossCurveSensitivity.test.ts holds it to bump-and-rebuild and a hand calculation), and the
// command itself run again with one discounting quote moved (bump-and-rebuild end to end). The
// market is invented test data (test/cli/curveNamedCurves.test.ts's).

const run = (input: string, ...args: string[]) => runCurveCommand(['-', ...args], () => input);

// The invented two-curve market of the workbench's tests: its OIS and its six-month index quotes.
const MARKET = JSON.parse(readFileSync('test/fixtures/namedCurves/two-curves.json', 'utf8')) as { quotes: { rate: number }[]; curves: { quotes: object[] }[] };
const OIS = MARKET.quotes;
const INDEX = MARKET.curves[0]!.quotes;
const single = { format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-10', curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' }, quotes: OIS };
const docWith = (ois = OIS) => ({ ...single, quotes: ois, curves: [{ name: 'euribor6m', role: 'projection', index: '6M', discountCurve: 'default', curve: { dayCount: 'ACT/365F', interpolation: 'log-linear-discount' }, quotes: INDEX }] });
const ARGS = ['--at', '3Y', '--forward', '5Y:6Y', '--compounding', 'simple', '--day-count', 'ACT/360'];

interface Top { curve?: string; index: number; kind: string; bpPerBp: number }
type Line = Record<string, any>;
const lineOf = async (doc: unknown, ...args: string[]): Promise<Line> => {
  const r = await run(JSON.stringify(doc), ...args);
  expect(r.status, r.stderr).toBe(0);
  return JSON.parse(r.stdout.trim()) as Line;
};

describe('curve --explain with named curves', () => {
  it('the default curve prints as without named curves, bit for bit; each named point and forward explains itself with its top quotes across curves', async () => {
    const before = await run(JSON.stringify(single), ...ARGS, '--explain');
    const o = await lineOf(docWith(), ...ARGS, '--explain');
    const { curves, ...rest } = o;
    expect(JSON.stringify(rest)).toBe(before.stdout.trim());
    const p = curves.euribor6m;
    // The reference: the core on the engine's own builds.
    const main = buildCurve(docWith(), { readCurves: readNamedCurves });
    const [named] = buildNamedCurves(main.workspace!, main.curve);
    const set = [{ name: 'default', curve: main.curve!, instruments: main.instruments }, { name: 'euribor6m', curve: named!.build.curve!, instruments: named!.build.instruments }];
    const cases: [Line, string, string][] = [[p.points[0], '2027-03-10', p.points[0].date], [p.forwards[0], p.forwards[0].start, p.forwards[0].end]];
    for (const [row, start, end] of cases) {
      const e = row.explain;
      expect(e.value).toBe(row.zero ?? row.rate);
      const want = topQuoteInfluencesAcrossCurves(set, 'euribor6m', start, end, 'simple', 'ACT/360');
      if (!want.ok) throw new Error(want.errors[0]!.message);
      expect(e.topQuotes).toEqual(want.value);
      expect(e.topQuotes).toHaveLength(5);
      // Each names its curve first; a discounting quote is among them.
      for (const q of e.topQuotes as Top[]) expect(Object.keys(q)[0]).toBe('curve');
      expect((e.topQuotes as Top[]).some((q) => q.curve === 'default')).toBe(true);
      expect(e.methods.find((m: { current: boolean }) => m.current).value).toBe(e.value);
    }
    // The default curve's own top quotes carry no curve name (its output is unchanged).
    for (const q of o.forwards[0].explain.topQuotes as Top[]) expect(q.curve).toBeUndefined();
  });

  it('a discounting quote\'s bp per bp on the projection forward matches the command run again with that quote moved +-1e-6', async () => {
    const o = await lineOf(docWith(), ...ARGS, '--explain');
    const h = 1e-6;
    const moved = async (k: number, dy: number) => (await lineOf(docWith(OIS.map((q, i) => (i === k ? { ...q, rate: q.rate + dy } : q))), ...ARGS)).curves.euribor6m.forwards[0].rate as number;
    let checked = 0;
    for (const q of o.curves.euribor6m.forwards[0].explain.topQuotes as Top[]) {
      if (q.curve !== 'default') continue;
      const fd = ((await moved(q.index, h)) - (await moved(q.index, -h))) / (2 * h);
      expectClose(q.bpPerBp, fd, 1e-8, `the command's own forward, OIS quotes[${q.index}] +-1e-6, central difference`);
      checked++;
    }
    expect(checked).toBeGreaterThan(0);
  });
});
