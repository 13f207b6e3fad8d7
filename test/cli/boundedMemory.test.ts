import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runIntoHeldReader } from './slowReader.ts';

// The README promises that a batch of any size runs in bounded memory. Here the real command
// (src/cli/launch.mjs) builds 200,000 documents into a reader that takes nothing until the command
// has stopped (test/cli/slowReader.ts): a command that waits for the pipe to drain stops at once
// and holds one piece of output; one that does not builds and holds all of it (checked: with the
// writer not waiting, 1.9 GB). And an input larger than any string Node makes, read line by line
// (checked: read whole, it fails with "Cannot create a string longer than ...").
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

  it('an input of 600 MiB (more than the longest string Node 20 makes, 2^29 - 24 characters) streams through: every document built, peak at most 300 MB', async () => {
    // 600 documents, each padded with spaces (JSON whitespace) to a line of 1 MiB, written into
    // the command's standard input as it reads; reading the whole input as one string failed here.
    const lineBytes = 1 << 20;
    const padded = Buffer.alloc(lineBytes, 0x20);
    padded.write(line);
    padded[lineBytes - 1] = 0x0a;
    const peakFile = join(tmp, 'peak-large.txt');
    const child = spawn(process.execPath, ['--import', './test/cli/peakMemory.mjs', 'src/cli/launch.mjs', '-'], { env: { ...process.env, TENORSCOPE_CACHE: cache, TENORSCOPE_PEAK_FILE: peakFile } });
    let out = '';
    let err = '';
    child.stdout.setEncoding('utf8').on('data', (s: string) => (out += s));
    child.stderr.setEncoding('utf8').on('data', (s: string) => (err += s));
    const done = new Promise<number | null>((resolve) => child.on('close', (code) => resolve(code)));
    for (let i = 0; i < 600; i++) {
      if (!child.stdin.write(padded)) await new Promise((resolve) => child.stdin.once('drain', resolve));
    }
    child.stdin.end();
    const status = await done;
    expect(err).toBe('');
    expect(status).toBe(0);
    const lines = out.trim().split('\n');
    expect(lines).toHaveLength(600);
    expect(JSON.parse(lines[599]!)).toMatchObject({ index: 599, settlement: '2027-03-10' });
    const peakMB = Number(readFileSync(peakFile, 'utf8')) / 1024;
    console.log(`peak ${peakMB.toFixed(0)} MB for 600 MiB of input`);
    expect(peakMB).toBeLessThanOrEqual(300);
  });
});
