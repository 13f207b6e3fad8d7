// Finds display formatting outside the core's format module (src/core/format): number-to-text calls
// that choose decimals or a locale (`x.toFixed(n)`, `toLocaleString(`, `Intl.NumberFormat`) and
// convention tags built by hand from COMPOUNDING_LABEL. Works on lexed text (test/helpers/source-scan.ts):
// comments and the prose inside string literals are not code, so they are not findings.
import path from 'node:path';
import { lex } from '../../helpers/source-scan.ts';

export interface DisplayFinding {
  readonly file: string;
  readonly line: number;
  readonly text: string;
}

/** A call allowed in one file, with the reason it does not format a rate, bp or money for display. */
export interface DisplayException {
  /** Path relative to the repository, with forward slashes. */
  readonly file: string;
  /** The allowed call, matched on the lexed code (literal contents blanked). */
  readonly pattern: RegExp;
  readonly reason: string;
}

// `.toFixed()` without an argument is decimal.js's exact text of a Decimal (typed input echoed back,
// CSV values); it chooses no decimals, so only calls with an argument are display formatting.
const FORBIDDEN: readonly { re: RegExp; what: string }[] = [
  { re: /\.toFixed\(\s*[^)\s]/g, what: 'toFixed with decimals' },
  { re: /\.toLocaleString\(/g, what: 'toLocaleString' },
  { re: /\bIntl\s*\.\s*NumberFormat\b/g, what: 'Intl.NumberFormat' },
  { re: /\bCOMPOUNDING_LABEL\b/g, what: 'a convention tag built from COMPOUNDING_LABEL' },
];

/** The findings in one file's source; `file` is relative to the repository root. */
export function displayFindings(file: string, source: string, exceptions: readonly DisplayException[]): DisplayFinding[] {
  const rel = file.split(path.sep).join('/');
  if (rel.startsWith('src/core/format/')) return [];
  let code = lex(source).code;
  for (const e of exceptions) {
    if (e.file !== rel) continue;
    code = code.replace(new RegExp(e.pattern.source, e.pattern.flags.includes('g') ? e.pattern.flags : `${e.pattern.flags}g`), (m) => m.replace(/[^\n]/g, ' '));
  }
  const out: DisplayFinding[] = [];
  for (const { re, what } of FORBIDDEN) {
    for (const m of code.matchAll(re)) {
      const line = code.slice(0, m.index).split('\n').length;
      out.push({ file: rel, line, text: `${what}: ${source.split('\n')[line - 1]!.trim().slice(0, 120)}` });
    }
  }
  return out;
}
