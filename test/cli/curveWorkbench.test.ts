import { describe, expect, it } from 'vitest';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { toEngineDocument } from '../../src/core/index.ts';
import { demoWorkspace } from '../../src/state/demoWorkspace.ts';

// The curve command reads the workbench's saved file (format "tenorscope-workbench", quote cells as
// typed) as the workbench reads it. Oracle: the same command on the engine document that the
// workbench itself derives (toEngineDocument); output positions are the file's own rows.
let n = 0;
const demo = demoWorkspace(() => `c${n++}`);
const run = (doc: unknown, ...args: string[]) => runCurveCommand(['-', ...args], () => JSON.stringify(doc));
const lines = (s: string) => s.trim().split('\n').map((l) => JSON.parse(l) as Record<string, any>);

describe('curve FILE with a workbench file', () => {
  it('builds the demo workspace file exactly as from its engine document', async () => {
    const fromFile = await run(demo, '--at', '1Y,10Y', '--forward', '1Y:2Y');
    const fromEngine = await run(toEngineDocument(demo).doc, '--at', '1Y,10Y', '--forward', '1Y:2Y');
    expect(fromFile.status).toBe(0);
    expect(fromFile.stderr).toBe('');
    expect(fromFile.stdout).toBe(fromEngine.stdout);
  });

  it('names a wrong cell by its row (from 1) and column, and with --skip-invalid builds the rest and reports the row', async () => {
    const quotes = demo.quotes.map((q, i) => (i === 4 ? { ...q, rate: '4.x' } : q));
    const strict = await run({ ...demo, quotes });
    expect(strict.status).toBe(1);
    const [o] = lines(strict.stdout);
    expect(o!.errors[0].path).toBe('quotes[4].rate');
    expect(o!.errors[0].message).toMatch(/^row 5, Rate \/ yield: /);
    const lenient = await run({ ...demo, quotes }, '--skip-invalid');
    expect(lenient.status).toBe(0);
    const [p] = lines(lenient.stdout);
    expect(p!.warnings[0]).toMatchObject({ path: 'quotes[4].rate', quote: 4, code: 'skipped' });
    // Quote indexes in the output are the file's rows: row 5 (index 4) is missing, the others keep their place.
    const indexes = p!.quotes.map((q: any) => q.index) as number[];
    expect(indexes).not.toContain(4);
    expect(indexes).toContain(5);
  });

  it("refuses a workbench file whose sections the workbench's file and link readers refuse, naming them, even with --skip-invalid", async () => {
    // Turns as an object and fixings as a list: the shape check of the file reader (checkWorkbenchShape) refuses both.
    const bad = { ...demo, turns: { name: 'year end' }, fixings: [1, 2] };
    for (const args of [[], ['--skip-invalid']]) {
      const r = await run(bad, ...args);
      expect(r.status).toBe(1);
      const [o] = lines(r.stdout);
      expect(o!.errors.map((e: any) => e.path)).toEqual(expect.arrayContaining(['turns', 'fixings']));
    }
  });
});
