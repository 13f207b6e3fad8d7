// Writes or checks the golden digests of test/fixtures/golden/curve-golden.json (see test/cli/golden.ts).
//   npx tsx test/tools/golden-curve.ts            compare this build with the stored digests, list differences
//   npx tsx test/tools/golden-curve.ts --write    store this build's digests (only on a commit whose behaviour is the reference)
//   npx tsx test/tools/golden-curve.ts --show N   print case N's input, options and invariant output
import { readFileSync, writeFileSync } from 'node:fs';
import { GOLDEN_CASES, GOLDEN_SEED, digest, goldenCase, goldenOutput, roundTripOutputs } from '../cli/golden.ts';
import { roundTripDocuments, roundTripTools, workbenchOutputs } from '../cli/goldenSources.ts';

const FILE = new URL('../fixtures/golden/curve-golden.json', import.meta.url);
const arg = process.argv[2];

if (arg === '--show') {
  const i = Number(process.argv[3]);
  const c = goldenCase(GOLDEN_SEED, i);
  console.log(JSON.stringify(c.args), '\n' + c.input);
  console.log(await goldenOutput(GOLDEN_SEED, i));
} else {
  const cases: string[] = [];
  for (let i = 0; i < GOLDEN_CASES; i++) cases.push(digest(await goldenOutput(GOLDEN_SEED, i)));
  const roundTrips: Record<string, string> = {};
  for (const [name, doc] of Object.entries(roundTripDocuments())) {
    for (const [k, text] of Object.entries(await roundTripOutputs(doc, roundTripTools))) roundTrips[`${name}/${k}`] = digest(text);
    if (doc.format === 'tenorscope-workbench') for (const [k, text] of Object.entries(workbenchOutputs(doc))) roundTrips[`${name}/workbench-${k}`] = digest(text);
  }
  if (arg === '--write') {
    writeFileSync(FILE, JSON.stringify({ seed: GOLDEN_SEED, cases, roundTrips }, null, 1) + '\n');
    console.log(`wrote ${cases.length} case digests and ${Object.keys(roundTrips).length} round-trip digests`);
  } else {
    const stored = JSON.parse(readFileSync(FILE, 'utf8')) as { cases: string[]; roundTrips: Record<string, string> };
    const diff = cases.flatMap((d, i) => (d === stored.cases[i] ? [] : [i]));
    const rt = Object.keys(stored.roundTrips).filter((k) => stored.roundTrips[k] !== roundTrips[k]);
    console.log(`${diff.length} case(s) differ${diff.length ? ': ' + diff.slice(0, 40).join(', ') : ''}; ${rt.length} round trip(s) differ${rt.length ? ': ' + rt.join(', ') : ''}`);
    process.exitCode = diff.length + rt.length > 0 ? 1 : 0;
  }
}
