import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
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

  it('a UTF-8 file starting with a byte-order mark, given by name, builds', () => {
    const file = join(cache, 'with-bom.json');
    writeFileSync(file, Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(JSON.stringify(JSON.parse(doc), null, 2))]));
    const r = run([file], '');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ index: 0, settlement: '2027-03-10' });
  });

  it('a missing file is a usage error (2) naming it; --version prints the package version (0)', () => {
    const missing = run([join(cache, 'missing.json')], '');
    expect(missing.status).toBe(2);
    expect(missing.stdout).toBe('');
    expect(missing.stderr).toMatch(/^curve: cannot read .*missing\.json: ENOENT/);
    const version = run(['--version'], '');
    expect(version.status).toBe(0);
    expect(version.stdout).toBe(`curve (Tenorscope) ${(JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version}\n`);
  });

  it('standard output closed after the first line (as by `| head -1`): stops at once, quietly, exit 0', async () => {
    // 20,000 documents, the last one failing: a command that built the whole batch would exit 1
    // and name document 19999 on standard error.
    const file = join(cache, 'batch.ndjson');
    writeFileSync(file, `${doc}\n`.repeat(19_999) + `${doc.replace('0.033', '3.3')}\n`);
    const child = spawn(process.execPath, ['src/cli/launch.mjs', file], { env: { ...process.env, TENORSCOPE_CACHE: cache } });
    let stderr = '';
    child.stderr.setEncoding('utf8').on('data', (s: string) => (stderr += s));
    let first = '';
    await new Promise<void>((resolve) => {
      child.stdout.setEncoding('utf8').on('data', (s: string) => {
        first += s;
        if (first.includes('\n')) {
          child.stdout.destroy(); // the reader goes away, as head does after one line
          resolve();
        }
      });
    });
    const status = await new Promise<number | null>((resolve) => child.on('close', (code) => resolve(code)));
    expect(JSON.parse(first.slice(0, first.indexOf('\n')))).toMatchObject({ index: 0 });
    expect(stderr).toBe(''); // no stack trace, no "Unhandled 'error' event", no EPIPE
    expect(status).toBe(0);
  });
});
