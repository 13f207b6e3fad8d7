// The link fuzzer's long run (the normal suite runs 10,000 cases: test/share/linkFuzz.test.ts):
//   npx tsx test/tools/fuzz-links.ts [CASES=200000] [SEED=20261215] [STREAMS_EVERY=20] [BUILD_EVERY=10]
// Random and mutated link fragments through the link decoder, its validation and the workbench's
// document path; exits 1 with fast-check's counterexample when an exception escapes or a failure
// is not a readable message. A different seed explores different cases; a failure names its seed.
import { runLinkFuzz } from '../helpers/linkFuzz.ts';

const [cases = 200_000, seed = 20261215, streamsEvery = 20, buildEvery = 10] = process.argv.slice(2).map(Number);
const started = Date.now();
try {
  const report = await runLinkFuzz(cases, seed, streamsEvery, buildEvery);
  console.log(
    `link fuzzer, seed ${seed}: ${report.cases} cases, ${report.opened} opened (${report.readOnly} read-only), ${report.refused} refused with a readable message; ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
} catch (e) {
  console.error(`link fuzzer, seed ${seed}: FAILED\n${String(e instanceof Error ? e.message : e).slice(0, 4000)}`);
  process.exit(1);
}
