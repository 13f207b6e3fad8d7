import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// `npm run curve` runs src/cli/launch.mjs, which bundles src/cli/curve.ts with esbuild into a
// cache directory and runs the bundle. These tests run the launcher as a user's shell would,
// with a fresh cache directory, so the bundling step itself is exercised.
const cache = mkdtempSync(join(tmpdir(), 'tenorscope-cli-'));
afterAll(() => rmSync(cache, { recursive: true, force: true }));

const run = (args: string[], input: string) =>
  spawnSync(process.execPath, ['src/cli/launch.mjs', ...args], { input, encoding: 'utf8', env: { ...process.env, TENORSCOPE_CACHE: cache } });

// An invented two-quote market (test data, not a real market).
const doc = JSON.stringify({
  format: 'tenorscope-workspace',
  version: 1,
  settlement: '2027-03-10',
  quotes: [
    { kind: 'deposit', tenor: '3M', rate: 0.031 },
    { kind: 'swap', tenor: '2Y', rate: 0.033 },
  ],
});

describe('src/cli/launch.mjs (the `curve` command as npm runs it)', () => {
  it('bundles into an empty cache, prints one JSON line and exits 0', () => {
    const r = run(['-'], doc);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines).toHaveLength(1);
    const out = JSON.parse(lines[0]!) as { quotes: { repricingError: number }[]; points: unknown[] };
    expect(out.quotes).toHaveLength(2);
    expect(out.points).toHaveLength(2);
    expect(readdirSync(cache).filter((f) => /^curve-[0-9a-f]{16}\.mjs$/.test(f))).toHaveLength(1);
  });

  it('runs the cached bundle the second time, and passes exit status 2 for a usage error', () => {
    const r = run(['-', '--no-such-option'], doc);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^curve: /);
    expect(readdirSync(cache).filter((f) => f.endsWith('.mjs'))).toHaveLength(1);
  });
});
