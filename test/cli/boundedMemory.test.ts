import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runIntoHeldReader } from './slowReader.ts';

// The README promises that a batch of any size runs in bounded memory. Here the real command
// (src/cli/launch.mjs) builds 200,000 documents into a reader that takes nothing until the command
// has stopped (test/cli/slowReader.ts): a command that waits for the pipe to drain stops at once
// and holds one piece of output; one that does not builds and holds all of it (about 350 MB here).
const tmp = mkdtempSync(join(tmpdir(), 'tenorscope-memory-'));
const cache = join(tmp, 'cache');
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

// A cheap invented one-quote document, repeated; 12 extrapolated points make each output line
// about 1.8 KB, so the batch's output (about 350 MB) is larger than the bound.
const line = JSON.stringify({ format: 'tenorscope-workspace', version: 1, settlement: '2027-03-10', quotes: [{ kind: 'deposit', tenor: '3M', rate: 0.031 }] });
const DOCUMENTS = 200_000;
const input = join(tmp, 'batch.ndjson');
writeFileSync(input, `${line}\n`.repeat(DOCUMENTS));
const at = Array.from({ length: 12 }, (_, i) => `${i + 1}M`).join(',');

describe('the curve command into a slow reader', () => {
  it('200,000 documents: peak memory at most 300 MB, every byte delivered, exit 0', async () => {
    const r = await runIntoHeldReader([input, '--extrapolate', 'flat-forward', '--at', at], { TENORSCOPE_CACHE: cache }, tmp);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.bytesRead).toBeGreaterThan(300 * 2 ** 20); // the output is larger than the bound
    console.log(`peak ${r.peakMB.toFixed(0)} MB for ${(r.bytesRead / 2 ** 20).toFixed(0)} MB of output`);
    expect(r.peakMB).toBeLessThanOrEqual(300);
  });
});
