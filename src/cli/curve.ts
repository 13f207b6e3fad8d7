/**
 * `npm run --silent curve -- FILE [--at D,...] [--forward S:E,...] [--compounding C]
 *   [--day-count DC] [--extrapolate none|flat-forward] [--skip-invalid] [--bond ...]`
 *
 * Reads one workspace document, or NDJSON (one per non-blank line), line by line, and prints one
 * compact JSON object per document, in input order (see runCurveCommand).
 * Exit status: 0 every document built; 1 any failed; 2 usage error, unreadable input or unwritable
 * output. A closed standard output (a reader such as `head` has what it wants) ends the command
 * quietly with the status of the documents run so far.
 */
import { createReadStream, openSync } from 'node:fs';
import { runCurveCommand } from './curveCommand.ts';

/** The input in pieces of 64 KB, decoded as UTF-8 (a character split between pieces is kept whole). */
function readInput(file: string): AsyncIterable<string> {
  if (file === '-') return process.stdin.setEncoding('utf8');
  // Opened here, at once, so a missing file is a usage error before anything is written.
  return createReadStream('', { fd: openSync(file, 'r'), encoding: 'utf8', highWaterMark: 1 << 16 });
}

// A closed or failing standard output is an 'error' event on process.stdout; without a listener
// Node prints a stack trace and exits 1. The writer reports it to the command as a closed output.
const output: { error: NodeJS.ErrnoException | null } = { error: null };
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  output.error ??= e;
});
process.stderr.on('error', () => {
  // Standard error closed too: nothing more can be said.
});

/**
 * Writes one piece of standard output and resolves when Node has handed it to the system (its
 * write callback): back-pressure, so a slow reader holds the command at one piece in flight
 * instead of letting the output pile up in memory. Resolves false once the output is closed.
 */
const writeOutput = (text: string): Promise<boolean> =>
  output.error
    ? Promise.resolve(false)
    : new Promise((resolve) => {
        process.stdout.write(text, (e) => resolve(!e && !output.error));
      });

const result = await runCurveCommand(process.argv.slice(2), readInput, writeOutput);
let status: number = result.status;
if (output.error && output.error.code !== 'EPIPE') {
  process.stderr.write(`curve: cannot write standard output: ${output.error.message}\n`);
  status = 2;
}
if (result.stderr) process.stderr.write(result.stderr);
process.exitCode = status;
