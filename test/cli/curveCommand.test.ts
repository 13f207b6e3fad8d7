import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { OUTPUT_CHUNK_CHARS, runCurveCommand } from '../../src/cli/curveCommand.ts';
import { buildCurve, discountOn, forwardOn, zeroOn } from '../../src/core/index.ts';
import { expectClose } from '../helpers/asserts.ts';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';

// The command-line contract of the engine issue, section 8. Documents are invented test data.
// Quotes of the invented 2027 market (test/helpers/markets.ts) and an invented 5Y swap.
const { depo3M, bill6M, bond2029 } = INVENTED_2027;
const doc = workspaceDoc([depo3M, bill6M, bond2029, { kind: 'swap', tenor: '5Y', rate: 0.0342 }], { settlement: '2027-03-10', interpolation: 'monotone-convex' });
const bad = { ...doc, quotes: [...doc.quotes, { kind: 'swap', tenor: '7Y', rate: 3.5 }] };
const run = (input: string, ...args: string[]) => runCurveCommand(['-', ...args], () => input);
const parseLines = (s: string) => s.trim().split('\n').map((l) => JSON.parse(l) as Record<string, any>);

describe('one document', () => {
  it('prints one compact line with the contract fields, exit 0, nothing on standard error', async () => {
    const r = await run(JSON.stringify(doc, null, 2)); // a whole pretty-printed document is one document
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout.endsWith('\n')).toBe(true);
    const [o] = parseLines(r.stdout);
    expect(r.stdout.trim().split('\n')).toHaveLength(1);
    expect(Object.keys(o!)).toEqual(['index', 'settlement', 'valuationDate', 'interpolation', 'curveDayCount', 'compounding', 'rateDayCount', 'extrapolation', 'quotes', 'points', 'forwards', 'warnings']);
    expect(o).toMatchObject({ index: 0, settlement: '2027-03-10', valuationDate: '2027-03-10', interpolation: 'monotone-convex', curveDayCount: 'ACT/365F', compounding: 'continuous', rateDayCount: 'ACT/365F', extrapolation: 'none', forwards: [], warnings: [] });
    expect(o!.quotes.map((q: any) => q.index)).toEqual([0, 1, 2, 3]);
    for (const q of o!.quotes) expect(Math.abs(q.repricingError)).toBeLessThanOrEqual(q.unit === 'price' ? 1e-11 : 1e-14);
    // Without --at: one point per pillar, in date order.
    expect(o!.points.map((p: any) => p.date)).toEqual(['2027-06-10', '2027-09-09', '2029-03-10', '2032-03-10']);
  });
  it('numbers are full float64: the printed discount factor is the core value to the last bit', async () => {
    const [o] = parseLines((await run(JSON.stringify(doc), '--at', '2028-01-31')).stdout);
    const curve = buildCurve(doc).curve!;
    const df = discountOn(curve, '2028-01-31');
    const z = zeroOn(curve, '2028-01-31', 'continuous', 'ACT/365F');
    if (!df.ok || !z.ok) throw new Error('query failed');
    expect(o!.points[0].discount).toBe(df.value.discount);
    expect(o!.points[0].zero).toBe(z.value.zero);
  });
  it('--at and --forward take tenors from settlement and echo resolved ISO dates, in the order asked', async () => {
    const r = await run(JSON.stringify(doc), '--at', '2Y,2027-06-10,6M', '--forward', '1Y:2Y,2028-03-10:2030-03-10', '--compounding', 'semiannual', '--day-count', '30/360');
    expect(r.status).toBe(0);
    const [o] = parseLines(r.stdout);
    expect(o!.points.map((p: any) => p.date)).toEqual(['2029-03-10', '2027-06-10', '2027-09-10']);
    expect(o!.forwards.map((f: any) => [f.start, f.end])).toEqual([
      ['2028-03-10', '2029-03-10'],
      ['2028-03-10', '2030-03-10'],
    ]);
    expect(o).toMatchObject({ compounding: 'semiannual', rateDayCount: '30/360' });
    const curve = buildCurve(doc).curve!;
    const f = forwardOn(curve, '2028-03-10', '2029-03-10', 'semiannual', '30/360');
    if (!f.ok) throw new Error('query failed');
    expect(o!.forwards[0].rate).toBe(f.value.rate);
    expectClose(o!.forwards[0].tau, 1, 0, '30/360 year from the 10th to the 10th');
  });
  it('a date beyond the curve fails the document with beyond-curve at its --at path (exit 1)', async () => {
    const r = await run(JSON.stringify(doc), '--at', '40Y');
    expect(r.status).toBe(1);
    const [o] = parseLines(r.stdout);
    expect(o!.errors[0]).toMatchObject({ path: '--at[0]', code: 'beyond-curve' });
    // One human line per error, prefixed "document N:" (the contract fixes only the prefix).
    expect(r.stderr).toMatch(/^document 0: .*--at\[0\].*beyond-curve/);
  });
  it('--extrapolate flat-forward lets it through, marked extrapolated', async () => {
    const r = await run(JSON.stringify(doc), '--at', '40Y', '--extrapolate', 'flat-forward');
    expect(r.status).toBe(0);
    const [o] = parseLines(r.stdout);
    expect(o!.extrapolation).toBe('flat-forward');
    expect(o!.points[0]).toMatchObject({ date: '2067-03-10', extrapolated: true });
  });
});

describe('NDJSON batch', () => {
  it('one output line per input line, in input order; a failing document does not stop the others; exit 1', async () => {
    const input = [JSON.stringify(doc), '', JSON.stringify(bad), '{"format":', JSON.stringify({ ...doc, settlement: '2027-04-01' })].join('\n') + '\n';
    const r = await run(input);
    expect(r.status).toBe(1);
    const lines = parseLines(r.stdout);
    expect(lines.map((l) => l.index)).toEqual([0, 1, 2, 3]); // the blank line is not a document
    expect(lines[0]!.errors).toBeUndefined();
    expect(lines[1]!.errors[0]).toMatchObject({ path: 'quotes[4].rate', quote: 4, code: 'range' });
    expect(lines[2]!.errors[0]).toMatchObject({ code: 'invalid-json' });
    expect(lines[3]!.settlement).toBe('2027-04-01');
    const err = r.stderr.trim().split('\n');
    expect(err[0]).toMatch(/^document 1: .*quotes\[4\]\.rate.*rates are decimals/);
    expect(err[0]).toMatch(/range/);
    expect(err[1]).toMatch(/^document 2: .*invalid-json/);
  });
  it('every document built: exit 0', async () => {
    const r = await run(`${JSON.stringify(doc)}\n${JSON.stringify(doc)}\n`);
    expect(r.status).toBe(0);
    expect(parseLines(r.stdout).map((l) => l.index)).toEqual([0, 1]);
  });
});

describe('streamed standard output', () => {
  it('a batch handed to a writer comes out in order, in pieces of at least OUTPUT_CHUNK_CHARS (the last may be shorter), byte for byte the collected output; stdout is then empty', async () => {
    const lines = Array.from({ length: 400 }, (_, i) => JSON.stringify(i === 7 ? bad : doc));
    const input = lines.join('\n') + '\n';
    const collected = await run(input);
    const pieces: string[] = [];
    const streamed = await runCurveCommand(['-'], () => input, (text) => pieces.push(text));
    expect(streamed.stdout).toBe('');
    expect(streamed.stderr).toBe(collected.stderr);
    expect(streamed.status).toBe(1);
    expect(pieces.join('')).toBe(collected.stdout);
    expect(collected.stdout.length).toBeGreaterThan(3 * OUTPUT_CHUNK_CHARS);
    expect(pieces.length).toBeGreaterThan(2);
    for (const p of pieces.slice(0, -1)) expect(p.length).toBeGreaterThanOrEqual(OUTPUT_CHUNK_CHARS);
    expect(pieces.at(-1)!.length).toBeLessThanOrEqual(OUTPUT_CHUNK_CHARS + 20_000);
    for (const p of pieces) expect(p.endsWith('\n')).toBe(true); // whole lines only
  });
  it('a usage error writes nothing', async () => {
    const pieces: string[] = [];
    const r = await runCurveCommand(['--nope'], () => '', (text) => pieces.push(text));
    expect(r.status).toBe(2);
    expect(pieces).toEqual([]);
  });
});

describe('output text', () => {
  // The built documents' lines are written field by field (src/cli/documentLine.ts, tested on its
  // own against JSON.stringify in documentLine.test.ts). Here, end to end: each line is the
  // platform's canonical JSON text of its own value (shortest numbers, no spaces, escaped strings).
  const tenor = fc.oneof(
    fc.integer({ min: 1, max: 6 }).map((n) => `${n}Y`),
    fc.integer({ min: 1, max: 66 }).map((n) => `${n}M`),
    fc.integer({ min: 1, max: 60 }).map((n) => `${n}D`),
  );
  const options = fc.record({
    at: fc.array(tenor, { maxLength: 4 }),
    forward: fc.array(fc.tuple(fc.integer({ min: 1, max: 48 }), fc.integer({ min: 1, max: 24 })).map(([a, b]) => [`${a}M`, `${a + b}M`] as const), { maxLength: 3 }),
    compounding: fc.constantFrom('continuous', 'simple', 'annual', 'semiannual', 'quarterly', 'monthly'),
    dayCount: fc.constantFrom('ACT/360', 'ACT/365F', '30/360', '30E/360', '30/360-US', 'ACT/ACT-ISDA'),
    extrapolate: fc.constantFrom('none', 'flat-forward'),
    bond: fc.boolean(),
  });
  it('every line of a built document is exactly JSON.stringify of its parsed value (random shifts, dates, forwards, extrapolation, bonds, skipped quotes)', async () => {
    const seen = { built: 0, extrapolatedPoints: 0, extrapolatedForwards: 0, bonds: 0, warnings: 0 };
    await fc.assert(
      fc.asyncProperty(fc.double({ min: -0.02, max: 0.02, noNaN: true }), fc.boolean(), options, async (shift, skip, o) => {
        const market = { ...(skip ? bad : doc), quotes: (skip ? bad : doc).quotes.map((q: any) => ('rate' in q && q.rate < 1 ? { ...q, rate: q.rate + shift } : q)) };
        const args = ['--compounding', o.compounding, '--day-count', o.dayCount, '--extrapolate', o.extrapolate];
        if (o.at.length > 0) args.push('--at', o.at.join(','));
        if (o.forward.length > 0) args.push('--forward', o.forward.map(([a, b]) => `${a}:${b}`).join(','));
        if (o.bond) args.push('--bond', '2030-06-15,0.035,2,ACT/ACT-ICMA,price=99.5');
        if (skip) args.push('--skip-invalid');
        const r = await run(JSON.stringify(market), ...args);
        for (const line of r.stdout.trim().split('\n')) {
          const value = JSON.parse(line) as Record<string, unknown>;
          if (!('errors' in value)) {
            seen.built++;
            if ((value.points as { extrapolated?: true }[]).some((p) => p.extrapolated)) seen.extrapolatedPoints++;
            if ((value.forwards as { extrapolated?: true }[]).some((f) => f.extrapolated)) seen.extrapolatedForwards++;
            if ('bonds' in value) seen.bonds++;
            if ((value.warnings as unknown[]).length > 0) seen.warnings++;
          }
          expect(line).toBe(JSON.stringify(value));
        }
      }),
      { seed: 11, numRuns: 300 },
    );
    // Most runs build, and every optional part of a line is exercised, so the check is not only of error lines.
    expect(seen.built).toBeGreaterThan(150);
    for (const part of ['extrapolatedPoints', 'extrapolatedForwards', 'bonds', 'warnings'] as const) expect(seen[part], part).toBeGreaterThan(10);
  });
});

describe('--skip-invalid', () => {
  it('strict by default; with the flag the valid quotes build and the skipped one is listed under warnings', async () => {
    expect((await run(JSON.stringify(bad))).status).toBe(1);
    const r = await run(JSON.stringify(bad), '--skip-invalid');
    expect(r.status).toBe(0);
    const [o] = parseLines(r.stdout);
    expect(o!.quotes.map((q: any) => q.index)).toEqual([0, 1, 2, 3]);
    expect(o!.warnings).toEqual([expect.objectContaining({ path: 'quotes[4].rate', quote: 4, code: 'skipped' })]);
  });
});

describe('usage errors: exit 2 with nothing on standard output', () => {
  const cases: [string, string[]][] = [
    ['an unknown option', ['-', '--colour']],
    ['a bad compounding', ['-', '--compounding', 'weekly']],
    ['a day count that needs an instrument', ['-', '--day-count', 'ACT/ACT-ICMA']],
    ['a bad --at value', ['-', '--at', 'tomorrow']],
    ['a bad --forward pair', ['-', '--forward', '1Y-2Y']],
    ['no file', []],
    ['two files', ['a.json', 'b.json']],
  ];
  for (const [what, args] of cases) {
    it(what, async () => {
      const r = await runCurveCommand(args, () => JSON.stringify(doc));
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(/usage:/);
    });
  }
  it('an unreadable file', async () => {
    const r = await runCurveCommand(['missing.json'], () => {
      throw new Error('ENOENT: no such file');
    });
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/cannot read missing\.json/);
  });
});
