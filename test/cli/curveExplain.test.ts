import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { buildCurve, forwardOn, topQuoteInfluences, zeroOn } from '../../src/core/index.ts';
import { expectRelClose } from '../helpers/asserts.ts';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';

// `curve --explain` (issue 19): every point and forward carries an `explain` object; the output
// otherwise is the run without it, field for field. Documents are invented test data. The
// recomputations use the textbook definitions: simple rate (1/P - 1)/tau, continuous -ln P / tau
// (Hull, "Options, Futures and Other Derivatives", chapter on interest rates; cited from memory),
// ACT/360 as actual days / 360 (2006 ISDA Definitions 4.16(e); cited from memory).
const { depo3M, bill6M, bond2029 } = INVENTED_2027;
const doc = workspaceDoc([depo3M, bill6M, bond2029, { kind: 'swap', tenor: '5Y', rate: 0.0342 }], { interpolation: 'linear-zero' });
const run = (input: string, ...args: string[]) => runCurveCommand(['-', ...args], () => input);
const parse = (s: string) => JSON.parse(s.trim()) as Record<string, any>;
const args = ['--at', '2Y,2027-06-10,7Y', '--forward', '1Y:2Y,2027-03-10:3M', '--compounding', 'simple', '--day-count', 'ACT/360', '--extrapolate', 'flat-forward'];

describe('curve --explain', () => {
  it('only adds an explain object to each point and forward: without them the line is the plain run, digit for digit', async () => {
    const plain = await run(JSON.stringify(doc), ...args);
    const explained = await run(JSON.stringify(doc), ...args, '--explain');
    expect(explained.status).toBe(0);
    const o = parse(explained.stdout);
    expect(o.points.every((p: any) => typeof p.explain === 'object')).toBe(true);
    expect(o.forwards.every((f: any) => typeof f.explain === 'object')).toBe(true);
    for (const p of o.points) delete p.explain;
    for (const f of o.forwards) delete f.explain;
    expect(JSON.stringify(o)).toBe(plain.stdout.trim());
  });

  it('a point explains its zero rate: the value is the printed zero, the steps recompute it from the shown discount factor and day count', async () => {
    const o = parse((await run(JSON.stringify(doc), ...args, '--explain')).stdout);
    const p = o.points[0];
    const e = p.explain;
    expect(e.quantity).toBe('zero-rate');
    expect(e.value).toBe(p.zero);
    expect(e.dates[0]).toEqual({ name: 'date', given: '2Y', unadjusted: '2029-03-10', adjusted: '2029-03-10', rule: expect.stringContaining('read as given') });
    const tau = e.yearFractions.find((y: any) => y.name === 'tau');
    expect(tau).toMatchObject({ dayCount: 'ACT/360', days: 731, value: 731 / 360 }); // 2027-03-10 to 2029-03-10: 731 days (2028 is a leap year)
    const read = e.reads[0];
    expect(read.discount).toBe(p.discount);
    expect(read.how).toBe('node'); // the 2029 bond's maturity is a pillar
    expect(read.nodes[0].quote).toBe(2);
    expectRelClose(Math.expm1(-read.lnDiscount) / tau.value, p.zero, 1e-15, 'simple rate (1/P - 1) / tau');
    expect(e.conventions).toMatchObject({ compounding: 'simple', dayCount: 'ACT/360', curveDayCount: 'ACT/365F', interpolation: 'linear-zero' });
    // The 7Y point lies past the last pillar (5Y): extrapolated flat from the last node.
    expect(o.points[2].explain.reads[0]).toMatchObject({ how: 'extrapolated', nodes: [{ quote: 3 }] });
  });

  it('a forward explains its rate; its quotes and methods are the core functions on the same build', async () => {
    const o = parse((await run(JSON.stringify(doc), ...args, '--explain')).stdout);
    const f = o.forwards[0];
    const e = f.explain;
    expect(e.value).toBe(f.rate);
    expect(e.dates.map((d: any) => [d.name, d.given, d.adjusted])).toEqual([
      ['start', '1Y', '2028-03-10'],
      ['end', '2Y', '2029-03-10'],
    ]);
    const lnP = e.reads[1].lnDiscount - e.reads[0].lnDiscount;
    expectRelClose(Math.expm1(-lnP) / e.yearFractions.find((y: any) => y.name === 'tau').value, f.rate, 1e-15, 'simple forward (DF(start)/DF(end) - 1) / tau');
    const curve = buildCurve({ ...doc, curve: { ...doc.curve, extrapolation: 'flat-forward' } });
    const top = topQuoteInfluences(curve.curve!, curve.instruments, '2028-03-10', '2029-03-10', 'simple', 'ACT/360');
    if (!top.ok) throw new Error('top');
    expect(e.topQuotes).toEqual(top.value);
    expect(e.methods.map((m: any) => m.method)).toEqual(['linear-zero', 'log-linear-discount', 'cubic-zero', 'monotone-convex', 'monotone-convex-positive']);
    expect(e.methods.find((m: any) => m.current).value).toBe(f.rate);
    const other = buildCurve({ ...doc, curve: { ...doc.curve, interpolation: 'cubic-zero', extrapolation: 'flat-forward' } }).curve!;
    const cubic = forwardOn(other, '2028-03-10', '2029-03-10', 'simple', 'ACT/360');
    if (!cubic.ok) throw new Error('cubic');
    expect(e.methods.find((m: any) => m.method === 'cubic-zero').value).toBe(cubic.value.rate);
  });

  it('the default points (one per pillar) are explained too, each read at its node', async () => {
    const o = parse((await run(JSON.stringify(doc), '--explain')).stdout);
    o.points.forEach((p: any, i: number) => {
      expect(p.explain.reads[0]).toMatchObject({ how: 'node', nodes: [{ quote: i }] });
      const z = zeroOn(buildCurve(doc).curve!, p.date, 'continuous', 'ACT/365F');
      expect(z.ok && z.value.zero).toBe(p.explain.value);
    });
  });

  it('--explain takes no value and is given once', async () => {
    expect((await run(JSON.stringify(doc), '--explain=yes')).stderr).toContain('--explain takes no value');
    expect((await run(JSON.stringify(doc), '--explain', '--explain')).stderr).toContain('--explain is given twice');
  });
});

describe('curve --explain on a workbench file', () => {
  it('names quotes by the file\'s rows: with row 5 left out, no explanation points at it and later rows keep their numbers', async () => {
    // The demo workspace (invented data) with row 5 made wrong and left out (--skip-invalid): the
    // engine's quote indices then differ from the file's rows after row 5. Oracle: the output's own
    // `quotes` list, whose indices are the file's rows (curveWorkbench.test.ts).
    let n = 0;
    const demo = demoWorkspace(() => `c${n++}`);
    const quotes = demo.quotes.map((q, i) => (i === 4 ? { ...q, rate: '4.x' } : q));
    const r = await run(JSON.stringify({ ...demo, quotes }), '--skip-invalid', '--explain', '--forward', '5Y:7Y');
    expect(r.status).toBe(0);
    const o = parse(r.stdout);
    const rows = new Set(o.quotes.map((q: any) => q.index));
    expect(rows.has(4)).toBe(false);
    const f = o.forwards[0].explain;
    expect(f.topQuotes.length).toBe(5);
    for (const q of f.topQuotes) expect(rows.has(q.index)).toBe(true);
    for (const read of f.reads) for (const node of read.nodes) if (node.quote !== null) expect(rows.has(node.quote)).toBe(true);
    // Each node's quote is the row whose pillar is that node's date.
    const pillarOf = new Map(o.quotes.map((q: any) => [q.index, q.pillar]));
    for (const read of f.reads) for (const node of read.nodes) if (node.quote !== null) expect(pillarOf.get(node.quote)).toBe(node.date);
  });
});
