import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { GOLDEN_CASES, GOLDEN_SEED, digest, goldenOutput, roundTripOutputs } from './golden.ts';
import { roundTripDocuments, roundTripTools, workbenchOutputs } from './goldenSources.ts';

// Behaviour held bit for bit through the redesign of the core (one place for each piece of market
// knowledge): the digests in test/fixtures/golden/curve-golden.json were written from the build
// before it (commit 6378f27's engine) by test/tools/golden-curve.ts --write. Reference: that
// build's own output, the project's earlier behaviour, itself checked against the published
// examples and reference libraries named in the other tests. Tolerance: none (every number's
// shortest round-trip text, every date, code, path and exit status); message wording is blanked.
// A difference names the cases; `npx tsx test/tools/golden-curve.ts --show N` prints one.
const stored = JSON.parse(readFileSync(new URL('../fixtures/golden/curve-golden.json', import.meta.url), 'utf8')) as {
  seed: number;
  cases: string[];
  roundTrips: Record<string, string>;
};

describe('golden behaviour of the curve command and the round trips', () => {
  it(`runCurveCommand on ${GOLDEN_CASES} seeded random documents gives the stored output bit for bit`, async () => {
    expect(stored.seed).toBe(GOLDEN_SEED);
    expect(stored.cases).toHaveLength(GOLDEN_CASES);
    const differ: number[] = [];
    for (let i = 0; i < GOLDEN_CASES; i++) if (digest(await goldenOutput(GOLDEN_SEED, i)) !== stored.cases[i]) differ.push(i);
    expect(differ, `cases that differ (show one with test/tools/golden-curve.ts --show N)`).toEqual([]);
  });

  it('the demo and fixtures through file and link round trips and the command, and the workbench\'s build, charted lines and roll versus term, give the stored output', async () => {
    const now: Record<string, string> = {};
    for (const [name, doc] of Object.entries(roundTripDocuments())) {
      for (const [k, text] of Object.entries(await roundTripOutputs(doc, roundTripTools))) now[`${name}/${k}`] = digest(text);
      if (doc.format === 'tenorscope-workbench') for (const [k, text] of Object.entries(workbenchOutputs(doc))) now[`${name}/workbench-${k}`] = digest(text);
    }
    expect(Object.keys(now).length).toBeGreaterThanOrEqual(28);
    expect(now).toEqual(stored.roundTrips);
  });
});
