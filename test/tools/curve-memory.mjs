// The curve command's peak memory on a large batch into a slow reader, as a user would run it:
//   node test/tools/curve-memory.mjs [DOCUMENTS=200000] [READER="gzip -9"]
// Not part of `npm test` (test/cli/boundedMemory.test.ts holds a cheaper batch to 300 MB in the
// suite). Each document is the 40-quote fixture (test/fixtures/market40, invented), one per line;
// the command's standard output goes to READER, whose output is discarded. Prints the command's
// peak resident set size (measured in its own process by test/cli/peakMemory.mjs), the output size
// and the time taken.
import { spawn } from 'node:child_process';
import { createWriteStream, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const documents = Number(process.argv[2] ?? 200_000);
const reader = process.argv[3] ?? 'gzip -9';
const tmp = mkdtempSync(join(tmpdir(), 'tenorscope-curve-memory-'));
try {
  const line = JSON.stringify(JSON.parse(readFileSync('test/fixtures/market40/market40.json', 'utf8')));
  const input = join(tmp, 'batch.ndjson');
  const file = createWriteStream(input);
  for (let i = 0; i < documents; i++) if (!file.write(`${line}\n`)) await new Promise((r) => file.once('drain', r));
  await new Promise((r) => file.end(r));

  const peakFile = join(tmp, 'peak.txt');
  const t0 = process.hrtime.bigint();
  const command = spawn(process.execPath, ['--import', './test/cli/peakMemory.mjs', 'src/cli/launch.mjs', input], {
    stdio: ['ignore', 'pipe', 'inherit'],
    env: { ...process.env, TENORSCOPE_PEAK_FILE: peakFile },
  });
  const counter = spawn('sh', ['-c', `${reader} | wc -c`], { stdio: [command.stdout, 'pipe', 'inherit'] });
  command.stdout.destroy(); // the reader holds its own copy of the pipe
  let counted = '';
  counter.stdout.setEncoding('utf8').on('data', (s) => (counted += s));
  const exited = new Promise((r) => command.on('exit', (code) => r(code)));
  const readerDone = new Promise((r) => counter.on('close', r));
  const status = await exited;
  await readerDone;
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  const peakMB = Number(readFileSync(peakFile, 'utf8')) / 1024;
  console.log(`${documents} documents into "${reader}": exit ${status}, peak ${peakMB.toFixed(0)} MB, reader's output ${counted.trim()} bytes, ${seconds.toFixed(1)} s`);
} finally {
  rmSync(tmp, { recursive: true, force: true });
}
