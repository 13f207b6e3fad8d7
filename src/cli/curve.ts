/**
 * `npm run --silent curve -- FILE [--at D,...] [--forward S:E,...] [--compounding C]
 *   [--day-count DC] [--extrapolate none|flat-forward] [--skip-invalid]`
 *
 * Reads one workspace document, or NDJSON (one per non-blank line) when the whole input is not a
 * single JSON value, and prints one compact JSON object per document, in input order.
 * Exit status: 0 every document built; 1 any failed; 2 usage error (nothing on standard output).
 */
import { readFileSync } from 'node:fs';
import { runCurveCommand } from './curveCommand.ts';

function readInput(file: string): string {
  return file === '-' ? readFileSync(0, 'utf8') : readFileSync(file, 'utf8');
}

// Standard output streams as the documents are built (see runCurveCommand); errors follow at the end.
const result = runCurveCommand(process.argv.slice(2), readInput, (text) => process.stdout.write(text));
if (result.stderr) process.stderr.write(result.stderr);
process.exitCode = result.status;
