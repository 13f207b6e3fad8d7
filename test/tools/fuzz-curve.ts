// The curve command's document fuzzer, a longer run than the test suite's (test/cli/documentFuzz.test.ts
// runs 10,000 cases at one seed). Not part of `npm test`. Run from the repository root:
//   npx tsx test/tools/fuzz-curve.ts [CASES=100000] [SEED=1]
// Prints how many cases were tried, survived and failed (the first few failures in full), how many
// documents built or failed, and the peak memory; exits 1 when any case failed.
import fc from 'fast-check';
import { checkCase, commandArgs, inputText } from '../cli/documentFuzz.ts';

const cases = Number(process.argv[2] ?? 100_000);
const seed = Number(process.argv[3] ?? 1);
if (!Number.isInteger(cases) || cases < 1 || !Number.isInteger(seed)) {
  console.error('usage: npx tsx test/tools/fuzz-curve.ts [CASES] [SEED]');
  process.exit(2);
}

const tally = { tried: 0, survived: 0, failed: 0, exit0: 0, exit1: 0, exit2: 0, documentsBuilt: 0, documentsFailed: 0 };
const failures: string[] = [];
const cuts = fc.oneof({ weight: 3, arbitrary: fc.constant([] as number[]) }, { weight: 1, arbitrary: fc.array(fc.nat(), { minLength: 1, maxLength: 6 }) });
const t0 = process.hrtime.bigint();

// Every case runs to the end: a failure is counted and kept, not shrunk, so one run tallies them all.
await fc.assert(
  fc.asyncProperty(inputText, commandArgs, cuts, async (input, args, at) => {
    tally.tried++;
    try {
      const o = await checkCase(input, args, at);
      tally.survived++;
      tally[`exit${o.status}`]++;
      tally.documentsBuilt += o.built;
      tally.documentsFailed += o.failed;
    } catch (e) {
      tally.failed++;
      if (failures.length < 5) failures.push(`${(e as Error).message}\n  input ${JSON.stringify(input).slice(0, 600)}\n  args ${JSON.stringify(args)}`);
    }
    if (tally.tried % 10_000 === 0) console.error(`  ${tally.tried} cases...`);
  }),
  { seed, numRuns: cases },
);

const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
for (const f of failures) console.log(`FAILED ${f}\n`);
console.log(`seed ${seed}: ${tally.tried} cases tried, ${tally.survived} survived, ${tally.failed} failed`);
console.log(`  exit status 0: ${tally.exit0}, 1: ${tally.exit1}, 2: ${tally.exit2}; documents built ${tally.documentsBuilt}, failed ${tally.documentsFailed}`);
console.log(`  ${seconds.toFixed(1)} s, peak memory ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
process.exitCode = tally.failed > 0 ? 1 : 0;
