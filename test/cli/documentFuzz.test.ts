import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkCase, commandArgs, inputText } from './documentFuzz.ts';

// The document fuzzer (test/cli/documentFuzz.ts) at a fixed seed: 10,000 random and mutated
// documents, written out in random ways with random options. For every case: no exception
// escapes runCurveCommand; a usage error (2) prints nothing on standard output; otherwise one
// valid JSON line per document (as many as the whole-text rule counts), in order, every number
// finite, each failed document named on standard error, exit 0 exactly when every document built
// and 1 otherwise (README, Command line); the input cut into pieces gives the same result.
// Longer runs: node test/tools/run-ts.mjs test/tools/fuzz-curve.ts [cases] [seed].
describe('document fuzzer', () => {
  it('10,000 random and mutated documents through runCurveCommand keep the command promises', async () => {
    const tally = { cases: 0, exit0: 0, exit1: 0, exit2: 0, built: 0, failed: 0 };
    const t0 = performance.now();
    await fc.assert(
      fc.asyncProperty(inputText, commandArgs, fc.oneof({ weight: 7, arbitrary: fc.constant([] as number[]) }, { weight: 1, arbitrary: fc.array(fc.nat(), { minLength: 1, maxLength: 3 }) }), async (input, args, cuts) => {
        const o = await checkCase(input, args, cuts);
        tally.cases++;
        tally[`exit${o.status}`]++;
        tally.built += o.built;
        tally.failed += o.failed;
      }),
      { seed: 20261202, numRuns: 10_000 },
    );
    console.log(JSON.stringify(tally), `${((performance.now() - t0) / 1000).toFixed(1)} s`);
    // The cases reach every outcome, so the checks are not only of error lines.
    expect(tally.cases).toBe(10_000);
    expect(tally.exit0).toBeGreaterThan(1000);
    expect(tally.exit1).toBeGreaterThan(1000);
    expect(tally.exit2).toBeGreaterThan(100);
    expect(tally.built).toBeGreaterThan(5000);
  });
});
