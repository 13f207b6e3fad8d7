import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { COMMAND_VERSION, MAX_DOCUMENT_CHARS, MAX_ERROR_LINES, OUTPUT_CHUNK_CHARS, runCurveCommand, type InputText } from '../../src/cli/curveCommand.ts';
import { INVENTED_2027, workspaceDoc } from '../helpers/markets.ts';

// How the curve command reads its input (in pieces, line by line, a byte-order mark skipped), how
// it stops on a closed output and waits for a slow one, and its option rules (--help, --version,
// no silent repeats). Documents are invented test data (test/helpers/markets.ts).
const { depo3M, bill6M, bond2029 } = INVENTED_2027;
const doc = workspaceDoc([depo3M, bill6M, bond2029, { kind: 'swap', tenor: '5Y', rate: 0.0342 }], { settlement: '2027-03-10' });
const bad = { ...doc, quotes: [...doc.quotes, { kind: 'swap', tenor: '7Y', rate: 3.5 }] };
const run = (input: InputText, ...args: string[]) => runCurveCommand(['-', ...args], () => input);
const indices = (stdout: string) => stdout.trim().split('\n').map((l) => (JSON.parse(l) as { index: number }).index);

/** The text cut into pieces at the given offsets. */
const pieces = (text: string, cuts: readonly number[]): string[] => {
  const at = [...new Set(cuts.map((c) => c % (text.length + 1)))].sort((a, b) => a - b);
  return [0, ...at].map((start, i) => text.slice(start, at[i] ?? text.length));
};

describe('input read in pieces', () => {
  const ndjson = [JSON.stringify(doc), '', JSON.stringify(bad), '{"format":', JSON.stringify({ ...doc, settlement: '2027-04-01' })].join('\r\n') + '\n';
  const pretty = JSON.stringify(doc, null, 2);
  it('any cutting of the input (inside lines, between CR and LF, inside a pretty-printed document) gives the output of the whole text', async () => {
    const wholeNd = await run(ndjson);
    const wholePretty = await run(pretty);
    expect(indices(wholeNd.stdout)).toEqual([0, 1, 2, 3]);
    expect(indices(wholePretty.stdout)).toEqual([0]);
    await fc.assert(
      fc.asyncProperty(fc.boolean(), fc.array(fc.nat(), { maxLength: 8 }), async (nd, cuts) => {
        const text = nd ? ndjson : pretty;
        const whole = nd ? wholeNd : wholePretty;
        const r = await run(pieces(text, cuts));
        expect(r).toEqual(whole);
      }),
      { seed: 5, numRuns: 200 },
    );
  });
  it('pieces may come asynchronously (a stream)', async () => {
    async function* slowly() {
      for (const p of pieces(ndjson, [3, 100, 101, 2000])) {
        await new Promise((r) => setTimeout(r, 1));
        yield p;
      }
    }
    expect(await run(slowly())).toEqual(await run(ndjson));
  });
  it('a first line that is not JSON, followed by documents, is NDJSON: an invalid-json document, then the others', async () => {
    const r = await run(`{"format":\n${JSON.stringify(doc)}\n${JSON.stringify(doc)}\n`);
    expect(r.status).toBe(1);
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l) as Record<string, any>);
    expect(lines.map((l) => l.index)).toEqual([0, 1, 2]);
    expect(lines[0]!.errors[0]).toMatchObject({ code: 'invalid-json' });
    expect(lines[1]!.points).toHaveLength(4);
    expect(r.stderr).toMatch(/^document 0: not valid JSON/);
  });
  it('a pretty-printed document followed by more text is NDJSON, as before: each of its lines is a document', async () => {
    const r = await run(`${pretty}\n${JSON.stringify(doc)}\n`);
    const lines = r.stdout.trim().split('\n');
    expect(lines).toHaveLength(pretty.split('\n').length + 1);
    expect(JSON.parse(lines.at(-1)!)).toMatchObject({ index: pretty.split('\n').length, settlement: '2027-03-10' });
  });
  it('an empty or blank input fails as one invalid-json document (exit 1)', async () => {
    for (const input of ['', '\n \r\n', []]) {
      const r = await run(input);
      expect(r.status).toBe(1);
      expect(JSON.parse(r.stdout)).toMatchObject({ index: 0, errors: [{ code: 'invalid-json', message: expect.stringMatching(/empty/) }] });
    }
  });
  it('a line longer than MAX_DOCUMENT_CHARS is a range error for its document, unread; the next still builds', async () => {
    function* huge() {
      yield `${JSON.stringify(doc)}\n{"note":"`;
      for (let i = 0; i < 17; i++) yield 'x'.repeat(1 << 20);
      yield `"}\n${JSON.stringify(doc)}\n`;
    }
    const r = await run(huge());
    expect(r.status).toBe(1);
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l) as Record<string, any>);
    expect(lines.map((l) => l.index)).toEqual([0, 1, 2]);
    expect(lines[1]!.errors[0]).toMatchObject({ code: 'range', message: expect.stringContaining(`${9 + 17 * (1 << 20) + 2} characters long, more than the ${MAX_DOCUMENT_CHARS}`) });
    expect(lines[2]!.points).toHaveLength(4);
  });
  it('a reading failure part-way: status 2, the reason on standard error after the lines already made', async () => {
    function* failing() {
      yield `${JSON.stringify(doc)}\n`;
      throw new Error('EIO: i/o error, read');
    }
    const r = await runCurveCommand(['data.ndjson'], () => failing());
    expect(r.status).toBe(2);
    expect(indices(r.stdout)).toEqual([0]);
    expect(r.stderr).toBe('curve: cannot read data.ndjson: EIO: i/o error, read\n');
  });
});

describe('standard error of a long failing batch', () => {
  it(`keeps the first MAX_ERROR_LINES error lines and counts the rest; standard output still has every document's errors`, async () => {
    const n = MAX_ERROR_LINES + 25;
    const r = await run('{"format":\n'.repeat(n));
    expect(r.status).toBe(1);
    const err = r.stderr.trim().split('\n');
    expect(err).toHaveLength(MAX_ERROR_LINES + 1);
    expect(err[MAX_ERROR_LINES - 1]).toMatch(new RegExp(`^document ${MAX_ERROR_LINES - 1}: not valid JSON`));
    expect(err[MAX_ERROR_LINES]).toBe(`curve: 25 more error lines not shown here (${MAX_ERROR_LINES} shown); each failed document's errors are on its line of standard output`);
    const out = r.stdout.trim().split('\n');
    expect(out).toHaveLength(n);
    expect(JSON.parse(out.at(-1)!)).toMatchObject({ index: n - 1, errors: [{ code: 'invalid-json' }] });
  });
});

describe('byte-order mark', () => {
  // Unicode 15, section 23.8: U+FEFF at the start of a text is a byte-order mark, not content;
  // RFC 8259 section 8.1: JSON text has none, but a parser may ignore one.
  it('a document starting with U+FEFF (as a UTF-8 file with a BOM decodes) builds; as whole text, or in pieces', async () => {
    const plain = await run(JSON.stringify(doc, null, 2));
    expect(await run(`\uFEFF${JSON.stringify(doc, null, 2)}`)).toEqual(plain);
    expect(await run(['', '\uFEFF', JSON.stringify(doc, null, 2)])).toEqual(plain);
    const nd = await run(`\uFEFF${JSON.stringify(doc)}\n${JSON.stringify(doc)}\n`);
    expect(nd.status).toBe(0);
    expect(indices(nd.stdout)).toEqual([0, 1]);
  });
  it('only at the very start: U+FEFF starting a later line is invalid JSON for that document', async () => {
    const r = await run(`${JSON.stringify(doc)}\n\uFEFF${JSON.stringify(doc)}\n`);
    expect(r.status).toBe(1);
    expect(r.stdout.trim().split('\n')[1]).toMatch(/invalid-json/);
  });
});

describe('the writer: back-pressure and a closed output', () => {
  const batch = (n: number) => Array.from({ length: n }, (_, i) => JSON.stringify(i === 1 ? bad : doc)).join('\n') + '\n';
  it('each piece is awaited: no document is built while the writer has not finished', async () => {
    let busy = false;
    let overlapped = false;
    let written = 0;
    let calls = 0;
    const r = await runCurveCommand(['-'], () => batch(300), async (text) => {
      if (busy) overlapped = true;
      busy = true;
      calls++;
      await new Promise((resolve) => setTimeout(resolve, 2));
      written += text.length;
      busy = false;
    });
    expect(calls).toBeGreaterThan(3);
    expect(overlapped).toBe(false);
    expect(written).toBe((await run(batch(300))).stdout.length);
    expect(r.status).toBe(1);
  });
  it('a writer returning false stops the command at once: no further write, no further document; the status covers the documents run', async () => {
    const calls: string[] = [];
    const r = await runCurveCommand(['-'], () => batch(1000), (text) => {
      calls.push(text);
      return false;
    });
    expect(calls).toHaveLength(1);
    expect(calls[0]!.length).toBeGreaterThanOrEqual(OUTPUT_CHUNK_CHARS);
    const last = indices(calls[0]!).at(-1)!;
    expect(last).toBeLessThan(100); // about 60 lines of 1.1 KB fill a piece; not 1000
    expect(r).toMatchObject({ stdout: '', status: 1, outputClosed: true }); // document 1 failed before the close
    expect(r.stderr.trim().split('\n').every((l) => l.startsWith('document 1:'))).toBe(true);
    const quiet = await runCurveCommand(['-'], () => batch(1000).split('\n').slice(2).join('\n'), () => Promise.resolve(false));
    expect(quiet).toEqual({ stdout: '', stderr: '', status: 0, outputClosed: true });
  });
});

describe('a writer that throws', () => {
  it('stops the command: status 2, the reason on standard error, no exception escapes', async () => {
    const r = await runCurveCommand(['-'], () => Array.from({ length: 300 }, () => JSON.stringify(doc)).join('\n'), () => {
      throw new Error('ENOSPC: no space left on device, write');
    });
    expect(r).toEqual({ stdout: '', stderr: 'curve: cannot write standard output: ENOSPC: no space left on device, write\n', status: 2, outputClosed: true });
  });
});

describe('options', () => {
  it('--help and -h print the help on standard output, exit 0, even beside other arguments', async () => {
    for (const args of [['--help'], ['-h'], ['-', '--at', '2Y', '--help']]) {
      const r = await runCurveCommand(args, () => {
        throw new Error('help reads nothing');
      });
      expect(r.status).toBe(0);
      expect(r.stderr).toBe('');
      expect(r.stdout).toMatch(/^curve: /);
      for (const option of ['--at', '--forward', '--compounding', '--day-count', '--extrapolate', '--skip-invalid', '--bond', '--version', 'Exit status']) expect(r.stdout).toContain(option);
    }
  });
  it('--version prints the package version (package.json), through the writer when there is one', async () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(COMMAND_VERSION).toBe(pkg.version);
    const written: string[] = [];
    const r = await runCurveCommand(['--version'], () => '', (t) => written.push(t));
    expect(r).toEqual({ stdout: '', stderr: '', status: 0, outputClosed: false });
    expect(written).toEqual([`curve (Tenorscope) ${pkg.version}\n`]);
  });
  const repeats: [string, string[]][] = [
    ['--compounding', ['--compounding', 'annual', '--compounding', 'simple']],
    ['--day-count', ['--day-count', 'ACT/360', '--day-count=30/360']],
    ['--extrapolate', ['--extrapolate', 'none', '--extrapolate', 'flat-forward']],
    ['--skip-invalid', ['--skip-invalid', '--skip-invalid']],
  ];
  for (const [name, args] of repeats) {
    it(`${name} given twice is a usage error naming it (exit 2, nothing on standard output)`, async () => {
      const r = await run(JSON.stringify(doc), ...args);
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(new RegExp(`^curve: ${name} is given twice`));
    });
  }
  it('--at, --forward and --bond may repeat and add up', async () => {
    const r = await run(JSON.stringify(doc), '--at', '1Y', '--at', '2Y,3Y', '--forward', '1Y:2Y', '--forward', '2Y:3Y', '--bond', '2030-06-15,0.035,2,ACT/ACT-ICMA', '--bond', '3Y,0.03,1,30/360');
    expect(r.status).toBe(0);
    const o = JSON.parse(r.stdout) as Record<string, any[]>;
    expect(o.points!.map((p) => p.date)).toEqual(['2028-03-10', '2029-03-10', '2030-03-10']);
    expect(o.forwards).toHaveLength(2);
    expect(o.bonds).toHaveLength(2);
  });
  it('--help=x and --version=x are usage errors', async () => {
    expect((await runCurveCommand(['--help=x'], () => '')).status).toBe(2);
    expect((await runCurveCommand(['--version=x'], () => '')).status).toBe(2);
  });
});
