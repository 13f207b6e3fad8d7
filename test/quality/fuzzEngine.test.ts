// Fuzz of the engine's untrusted-input fronts (workspace validator, bootstrap, curve command):
// no uncaught exception, no NaN or Infinity in any output without an error naming its cause,
// echoed input cut short. fast-check with fixed seeds, a few thousand runs each.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildCurve, validateWorkspace, zeroOn } from '../../src/core/index.ts';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { workspaceDoc } from '../helpers/markets.ts';

// The valid starting document: invented test quotes, settlement 2027-03-10, ACT/365F, monotone-convex.
const base = workspaceDoc(
  [
    { kind: 'deposit', tenor: '3M', rate: 0.031 },
    { kind: 'bill', maturity: '2027-09-09', discountYield: 0.03 },
    { kind: 'zero', tenor: '1Y', price: 96.9 },
    { kind: 'bond', maturity: '2031-06-15', coupon: 0.04, frequency: 2, cleanPrice: 101.25 },
    { kind: 'swap', tenor: '10Y', rate: 0.0375 },
  ],
  { settlement: '2027-03-10', interpolation: 'monotone-convex' },
);

/** Every number reachable in a value. */
function numbers(v: unknown, out: number[] = []): number[] {
  if (typeof v === 'number') out.push(v);
  else if (Array.isArray(v)) v.forEach((x) => numbers(x, out));
  else if (v && typeof v === 'object') Object.values(v).forEach((x) => numbers(x, out));
  return out;
}

const FIELDS = ['kind', 'tenor', 'maturity', 'rate', 'price', 'cleanPrice', 'yield', 'coupon', 'frequency', 'dayCount', 'discountYield', 'compounding', 'eom', 'enabled'];
const TOP = ['format', 'version', 'settlement', 'curve', 'quotes', 'note', 'extra'];
const wild = fc.oneof(
  fc.jsonValue({ maxDepth: 2 }),
  fc.double(),
  fc.constantFrom(0, -0, 1e308, -1e308, 5e-324, 0.5, 100, 1000, 1001, '3M', '0M', '2027-02-29', '2028-02-29', 'ACT/360', '30E/360-ISDA', 'ACT/ACT-ICMA', 'x'.repeat(5000)),
);

/** A valid document with a few random fields replaced by random values. */
const mutated = fc
  .array(fc.tuple(fc.oneof(fc.constant('top'), fc.nat(base.quotes.length - 1)), fc.constantFrom(...FIELDS, ...TOP), wild), { minLength: 1, maxLength: 4 })
  .map((edits) => {
    const doc = structuredClone(base) as Record<string, unknown> & { quotes: Record<string, unknown>[] };
    for (const [where, field, value] of edits) {
      if (where === 'top') (doc as Record<string, unknown>)[field] = value;
      else if (Array.isArray(doc.quotes) && typeof doc.quotes[where] === 'object' && doc.quotes[where] !== null) doc.quotes[where]![field] = value;
    }
    return doc;
  });

describe('fuzz: the validator and the bootstrap never throw and never leak NaN', () => {
  it('buildCurve(random JSON) returns errors or a curve, never throws', () => {
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 4 }), (doc) => {
        const b = buildCurve(doc);
        expect(b.curve === null ? b.errors.length > 0 : true).toBe(true);
      }),
      { seed: 20261201, numRuns: 2000 },
    );
  });

  it('buildCurve(mutated document) gives finite repricing and zero rates, or errors naming a path', () => {
    fc.assert(
      fc.property(mutated, fc.boolean(), (doc, skipInvalid) => {
        const b = buildCurve(doc, { skipInvalid });
        if (!b.curve) {
          expect(b.errors.length).toBeGreaterThan(0);
          for (const e of b.errors) {
            expect(typeof e.path).toBe('string');
            expect(e.message.length).toBeLessThan(600); // echoed input is cut short
          }
          return;
        }
        expect(numbers(b.repricing).every(Number.isFinite)).toBe(true);
        for (const p of b.curve.pillars) {
          const z = zeroOn(b.curve, p.date, 'annual', 'ACT/360');
          expect(z.ok && Number.isFinite(z.value.zero)).toBe(true);
        }
      }),
      { seed: 42, numRuns: 2000 },
    );
  });

  it('validateWorkspace never echoes a long input in full', () => {
    const long = 'x'.repeat(5000);
    const v = validateWorkspace({ ...base, settlement: long, quotes: [{ kind: long }] });
    for (const e of v.errors) expect(e.message.length).toBeLessThan(600);
  });
});

describe('fuzz: the curve command', () => {
  const text = fc.oneof(
    fc.string({ maxLength: 200 }),
    mutated.map((d) => JSON.stringify(d)),
    fc.array(mutated.map((d) => JSON.stringify(d)), { maxLength: 3 }).map((ls) => ls.join('\n')),
  );
  const arg = fc.oneof(
    fc.constantFrom('--at', '--forward', '--compounding', '--day-count', '--extrapolate', '--skip-invalid', '--bogus', '-'),
    fc.constantFrom('3M', '2Y,2070-01-01', '1Y:2Y', '2Y:1Y', '2027-03-10', 'continuous', 'ACT/360', 'flat-forward', '30/360-US', 'x:y'),
    fc.string({ maxLength: 12 }),
  );
  it('runCurveCommand(random input, random args) exits 0, 1 or 2 with finite JSON numbers', async () => {
    await fc.assert(
      fc.asyncProperty(text, fc.array(arg, { maxLength: 5 }), async (input, args) => {
        const r = await runCurveCommand(['-', ...args], () => input);
        expect([0, 1, 2]).toContain(r.status);
        if (r.status === 2) {
          expect(r.stdout).toBe('');
          return;
        }
        for (const line of r.stdout.split('\n').filter(Boolean)) {
          const o = JSON.parse(line) as Record<string, unknown>;
          if ('errors' in o) {
            expect((o.errors as unknown[]).length).toBeGreaterThan(0);
            continue;
          }
          // A built document: every number finite (JSON.stringify would have written null for NaN).
          expect(line).not.toMatch(/:null[,}]/);
          expect(numbers(o).every(Number.isFinite)).toBe(true);
        }
      }),
      { seed: 7, numRuns: 1500 },
    );
  });
});
