// The one set of caps (src/core/export/limits.ts) and the checks that use it: the row cap at
// paste, nesting depth of untrusted documents (a link whose `strategy` nests 3,000 deep once blanked
// the print view by overflowing the stack in the workspace hash), the curve command, and settings
// this build does not know (reported, never replaced by defaults). Invented documents only.
import { readFileSync } from 'node:fs';
import {
  canonicalJson,
  capRows,
  documentCapErrors,
  LIMITS,
  nestingDepth,
  rowsLeftOutMessage,
  validateDocument,
  workspaceHash,
} from '../../../src/core/index.ts';
import { readWorkbenchDocument, replaceUnknownSettings, unknownSettings } from '../../../src/core/index.ts';
import { runCurveCommand } from '../../../src/cli/curveCommand.ts';

const workbench = JSON.parse(readFileSync(new URL('../../fixtures/share/workbench40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const engine = JSON.parse(readFileSync(new URL('../../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;

/** A value nested `n` deep: {"a": {"a": ... 1}}. */
const nested = (n: number): unknown => {
  let v: unknown = 1;
  for (let i = 0; i < n; i++) v = { a: v };
  return v;
};

/** The obvious recursive canonical JSON (sorted keys), as an independent reference for shallow values. */
const reference = (v: unknown): string =>
  JSON.stringify(v, (_k, x: unknown) =>
    x !== null && typeof x === 'object' && !Array.isArray(x) ? Object.fromEntries(Object.keys(x as object).sort().map((k) => [k, (x as Record<string, unknown>)[k]])) : x,
  );

describe('the row cap', () => {
  it('keeps the first rows and counts those left out, beside the rows already there', () => {
    const rows = Array.from({ length: 600 }, (_, i) => i);
    const all = capRows(rows);
    expect(all.rows).toHaveLength(LIMITS.quotes);
    expect(all.rows[0]).toBe(0);
    expect(all.rows[LIMITS.quotes - 1]).toBe(LIMITS.quotes - 1);
    expect(all.leftOut).toBe(100);
    expect(capRows(rows.slice(0, 30), 480)).toEqual({ rows: rows.slice(0, 20), leftOut: 10 });
    expect(capRows(rows.slice(0, 3), 700)).toEqual({ rows: [], leftOut: 3 });
    expect(capRows(rows.slice(0, 3))).toEqual({ rows: [0, 1, 2], leftOut: 0 });
    expect(rowsLeftOutMessage(100)).toBe('100 rows were left out: a workspace holds at most 500 quotes, so the first rows were kept.');
    expect(rowsLeftOutMessage(0)).toBeNull();
  });
});

describe('nesting depth', () => {
  it('is counted without recursion, even 200,000 deep', () => {
    expect(nestingDepth(1)).toBe(0);
    expect(nestingDepth({})).toBe(1);
    expect(nestingDepth({ a: [1, { b: [] }] })).toBe(4);
    expect(nestingDepth(nested(200_000), Infinity)).toBe(200_000);
    expect(nestingDepth(nested(200_000))).toBe(LIMITS.depth + 1); // stops once past the cap
  });

  it('a link or file document whose strategy nests 3,000 deep is refused with a message, not accepted', () => {
    const out = validateDocument({ ...workbench, strategy: nested(3000) });
    expect(out.ok).toBe(false);
    expect(!out.ok && out.errors[0]!.message).toMatch(/nests lists and objects more than 16 deep/);
    // The deepest part the workbench itself writes (a key-rate scenario's point) is well inside the cap.
    expect(validateDocument(workbench).ok).toBe(true);
  });

  it('the workspace hash of a structure 3,000 (and 100,000) deep is computed, not a stack overflow', () => {
    expect(workspaceHash({ ...workbench, strategy: nested(3000) })).toMatch(/^[0-9a-f]{8}$/);
    expect(() => canonicalJson(nested(100_000))).not.toThrow();
    expect(canonicalJson(nested(3))).toBe('{"a":{"a":{"a":1}}}');
  });

  it('the iterative canonical JSON equals sorted-key JSON.stringify on real documents', () => {
    for (const doc of [workbench, engine, { z: [1, undefined, 'x', null, { b: undefined, a: [] }], y: { c: true } }]) expect(canonicalJson(doc)).toBe(reference(doc));
  });

  it('the curve command refuses a document nested too deep or over the quote cap, as the app does', async () => {
    const deep = JSON.stringify({ ...engine, strategy: nested(3000) });
    const r = await runCurveCommand(['doc.json'], () => deep);
    expect(r.status).toBe(1);
    expect(JSON.parse(r.stdout.trim()).errors[0]).toMatchObject({ code: 'range', path: '' });
    const quotes = engine.quotes as unknown[];
    const many = JSON.stringify({ ...engine, quotes: Array.from({ length: LIMITS.quotes + 1 }, (_, i) => quotes[i % quotes.length]) });
    const m = await runCurveCommand(['doc.json'], () => many);
    expect(m.status).toBe(1);
    expect(JSON.parse(m.stdout.trim()).errors[0].message).toBe('501 quotes is more than the 500 a workspace may hold');
    expect(documentCapErrors(engine)).toEqual([]);
  });
});

describe('settings this build does not know', () => {
  const foreign = {
    ...workbench,
    curve: { dayCount: 'ACT/364', interpolation: 'cubic-tension', extrapolation: 'linear', smoothing: 0.3 },
    quoteUnit: 'permille',
    display: { ...(workbench.display as object), compounding: 'weekly' },
  };

  it('are each named with their path, their value and what this build supports', () => {
    const u = unknownSettings(foreign);
    expect(u.map((x) => x.path)).toEqual(['quoteUnit', 'curve.dayCount', 'curve.interpolation', 'curve.extrapolation', 'curve.smoothing', 'display.compounding']);
    const interp = u.find((x) => x.path === 'curve.interpolation')!;
    expect(interp.value).toBe('"cubic-tension"');
    expect(interp.supported).toEqual(['linear-zero', 'log-linear-discount', 'cubic-zero', 'monotone-convex', 'monotone-convex-positive']);
    expect(u.find((x) => x.path === 'curve.smoothing')).toMatchObject({ unknownName: true, supported: ['dayCount', 'interpolation', 'extrapolation', 'conventions'] });
    expect(unknownSettings(workbench)).toEqual([]);
  });

  it('a valid document that holds them comes back with them listed, and unchanged', () => {
    const out = validateDocument(foreign);
    expect(out.ok).toBe(true);
    expect(out.ok && out.value.unknowns.map((x) => x.path)).toContain('curve.interpolation');
    expect(out.ok && out.value.document).toEqual(foreign);
  });

  it('are kept as they are when read for a read-only opening, and only a copy takes the explicit choices', () => {
    let n = 0;
    const kept = readWorkbenchDocument(foreign, () => `r${n++}`, { keepUnknown: true }).doc!;
    expect(kept.curve).toEqual(foreign.curve);
    expect(kept.quoteUnit).toBe('permille');
    expect(kept.display.compounding).toBe('weekly');
    const copy = replaceUnknownSettings(foreign, { 'curve.interpolation': 'linear-zero', 'curve.dayCount': 'ACT/360' });
    expect(copy.curve).toEqual({ dayCount: 'ACT/360', interpolation: 'linear-zero', extrapolation: 'none' });
    expect(copy.quoteUnit).toBe('percent');
    expect(unknownSettings(copy)).toEqual([]);
    expect(foreign.curve.interpolation).toBe('cubic-tension'); // the original is not touched
  });
});

describe('rows of a saved quote list that are not rows', () => {
  it('are counted and placed, with cells that are not text and flags that are not true or false', () => {
    const rows = (workbench.quotes as Record<string, unknown>[]).slice(0, 3);
    const raw = { ...workbench, quotes: [rows[0], 42, rows[1], 'swap 5Y', null, { ...rows[2], rate: { value: 3 }, enabled: 'yes' }] };
    let n = 0;
    const read = readWorkbenchDocument(raw, () => `r${n++}`);
    expect(read.doc!.quotes).toHaveLength(3);
    expect(read.changes).toEqual([
      '3 entries of the saved quote list are not a row and were left out (entry 2, 4 and 5 of 6)',
      '1 cell is not text and was read as empty: quotes[5].rate (an object)',
      'the on/off flag of saved row 6 is not true or false and was read as on',
    ]);
    expect(readWorkbenchDocument(workbench, () => `r${n++}`).changes).toEqual([]);
  });
});
