// A small source scanner for the architecture rules in test/architecture.test.ts.
// It works on text, not on a syntax tree: comments are removed, the insides of string, template
// and regular-expression literals are blanked (so prose in an error message is not code), and
// what is left is searched. Import specifiers are read back from the literals.
import path from 'node:path';

export interface Literal {
  /** Index of the opening quote in the source. */
  readonly start: number;
  /** Raw text between the quotes; null for a template literal with `${...}` parts. */
  readonly value: string | null;
}

export interface Lexed {
  /** Same length as the source: comments and literal contents replaced by spaces, newlines kept. */
  readonly code: string;
  /** String and template literals keyed by the index of their opening quote. */
  readonly literals: ReadonlyMap<number, Literal>;
}

const IDENT = /[\w$]/;
// After one of these characters (or at the start) a `/` begins a regular expression, not a division.
const REGEX_AFTER = new Set(['', '(', ',', '=', ':', '[', '!', '&', '|', '?', '{', '}', ';', '+', '-', '*', '%', '<', '>', '~', '^']);
const REGEX_AFTER_WORDS = new Set(['return', 'typeof', 'instanceof', 'in', 'of', 'new', 'delete', 'void', 'throw', 'case', 'do', 'else', 'yield', 'await']);

/** Removes comments and blanks literal contents; see {@link Lexed}. */
export function lex(source: string): Lexed {
  const out = source.split('');
  const literals = new Map<number, Literal>();
  const blank = (from: number, to: number) => {
    for (let k = from; k < to; k++) if (out[k] !== '\n' && out[k] !== '\r') out[k] = ' ';
  };
  // One entry per open template literal whose `${` we are inside: the brace depth at which it resumes.
  const templateStack: number[] = [];
  let braceDepth = 0;
  let i = 0;
  const n = source.length;

  const previousSignificant = (): string => {
    let k = i - 1;
    while (k >= 0 && /\s/.test(out[k] ?? '')) k--;
    if (k < 0) return '';
    const ch = out[k] ?? '';
    if (!IDENT.test(ch)) return ch;
    let s = k;
    while (s > 0 && IDENT.test(out[s - 1] ?? '')) s--;
    const word = out.slice(s, k + 1).join('');
    return REGEX_AFTER_WORDS.has(word) ? '' : word;
  };

  // Scans template text from i (just after a backtick or a closing `}` of `${`).
  // Returns true when it stopped at `${`, false at the closing backtick or end of input.
  const templateText = (quoteStart: number): boolean => {
    const textStart = i;
    let hasExpr = false;
    while (i < n) {
      const ch = source[i];
      if (ch === '\\') { i += 2; continue; }
      if (ch === '`') {
        blank(textStart, i);
        if (!hasExpr && quoteStart >= 0) literals.set(quoteStart, { start: quoteStart, value: source.slice(textStart, i) });
        i++;
        return false;
      }
      if (ch === '$' && source[i + 1] === '{') {
        hasExpr = true;
        blank(textStart, i);
        if (quoteStart >= 0) literals.set(quoteStart, { start: quoteStart, value: null });
        i += 2;
        return true;
      }
      i++;
    }
    blank(textStart, n);
    return false;
  };

  while (i < n) {
    const ch = source[i];
    const next = source[i + 1];
    if (ch === '/' && next === '/') {
      const end = source.indexOf('\n', i);
      const stop = end < 0 ? n : end;
      blank(i, stop);
      i = stop;
    } else if (ch === '/' && next === '*') {
      const end = source.indexOf('*/', i + 2);
      const stop = end < 0 ? n : end + 2;
      blank(i, stop);
      i = stop;
    } else if (ch === '"' || ch === "'") {
      const start = i;
      i++;
      while (i < n && source[i] !== ch && source[i] !== '\n') i += source[i] === '\\' ? 2 : 1;
      literals.set(start, { start, value: source.slice(start + 1, i) });
      blank(start + 1, i);
      i++;
    } else if (ch === '`') {
      const start = i;
      i++;
      if (templateText(start)) templateStack.push(braceDepth);
    } else if (ch === '/' && REGEX_AFTER.has(previousSignificant())) {
      const start = i;
      i++;
      let inClass = false;
      while (i < n && source[i] !== '\n') {
        const c = source[i];
        if (c === '\\') { i += 2; continue; }
        if (c === '[') inClass = true;
        else if (c === ']') inClass = false;
        else if (c === '/' && !inClass) break;
        i++;
      }
      blank(start + 1, i);
      i++;
    } else if (ch === '{') {
      braceDepth++;
      i++;
    } else if (ch === '}') {
      if (templateStack.length > 0 && templateStack[templateStack.length - 1] === braceDepth) {
        templateStack.pop();
        i++;
        if (templateText(-1)) templateStack.push(braceDepth);
      } else {
        braceDepth--;
        i++;
      }
    } else {
      i++;
    }
  }
  return { code: out.join(''), literals };
}

export interface Finding {
  readonly file: string;
  readonly line: number;
  /** Offset in the file, for ordering findings on one line. */
  readonly index: number;
  readonly rule: string;
  readonly detail: string;
}

export interface ImportRef {
  readonly specifier: string | null;
  readonly index: number;
}

const IMPORT_FORMS: readonly RegExp[] = [
  // import x from '...', import { a } from '...', import type T from '...', export * from '...'
  /(?<![\w$.])(?:import|export)(?![\w$])[^;'"`]*?(?<![\w$])from\s*(['"])/g,
  // import '...'
  /(?<![\w$.])import\s*(['"])/g,
  // import('...'), require('...'), import x = require('...')
  /(?<![\w$.])(?:import|require)\s*\(\s*(['"`]?)/g,
];

/** Every module specifier the file refers to; null where it is not a plain literal. */
export function importsOf(lexed: Lexed): ImportRef[] {
  const refs = new Map<number, ImportRef>();
  for (const form of IMPORT_FORMS) {
    for (const m of lexed.code.matchAll(form)) {
      const quote = m[1] ?? '';
      const quoteIndex = (m.index ?? 0) + m[0].length - quote.length;
      if (quote === '') {
        refs.set(m.index ?? 0, { specifier: null, index: m.index ?? 0 });
        continue;
      }
      const literal = lexed.literals.get(quoteIndex);
      refs.set(quoteIndex, { specifier: literal?.value ?? null, index: quoteIndex });
    }
  }
  return [...refs.values()].sort((a, b) => a.index - b.index);
}

/** Packages the calculation core may never use: UI and state libraries. */
export const UI_PACKAGES: readonly RegExp[] = [/^react(?:\/|$)/, /^react-dom(?:\/|$)/, /^zustand(?:\/|$)/, /^d3(?:-[^/]+)?(?:\/|$)/];

/**
 * Globals the calculation core may not touch: the DOM and browser storage, and the clock,
 * randomness and timers that would make a result depend on when or where it was computed.
 */
export const FORBIDDEN_GLOBALS: readonly { readonly name: string; readonly pattern: RegExp }[] = [
  { name: 'window', pattern: /(?<![\w$])window(?![\w$])/g },
  { name: 'document', pattern: /(?<![\w$])document(?![\w$])/g },
  { name: 'localStorage', pattern: /(?<![\w$])localStorage(?![\w$])/g },
  { name: 'Date.now', pattern: /(?<![\w$])Date\s*\??\.\s*now(?![\w$])/g },
  { name: 'new Date', pattern: /(?<![\w$])new\s+Date(?![\w$])/g },
  { name: 'Math.random', pattern: /(?<![\w$])Math\s*\??\.\s*random(?![\w$])/g },
  { name: 'performance.', pattern: /(?<![\w$])performance\s*\??\./g },
];

const lineAt = (text: string, index: number): number => {
  let line = 1;
  for (let k = 0; k < index && k < text.length; k++) if (text[k] === '\n') line++;
  return line;
};

/**
 * True where an identifier at `index` is not a use of the global: a property of some other
 * object (`quote.document`) or a property name being declared (`{ window: 3 }`, `window?: number`).
 */
function isPropertyName(code: string, index: number, length: number): boolean {
  const before = code.slice(0, index);
  const member = /(?:^|[^\w$])([\w$]+)\s*\??\.\s*$/.exec(before);
  if (/\.\s*$/.test(before)) {
    // A member of the global object is still the global.
    return !(member && ['globalThis', 'self', 'global'].includes(member[1] ?? ''));
  }
  const after = code.slice(index + length);
  const declaring = /(?:^|[{,;]|\n)\s*(?:(?:readonly|public|private|protected|static|declare|abstract|override)\s+)*$/;
  return /^\s*\??\s*:/.test(after) && declaring.test(before);
}

export interface CoreRules {
  /** Absolute path of the directory whose files may import one another. */
  readonly root: string;
  /** Bare specifiers the core may import after all, exactly as written (checked before the UI package families). */
  readonly allowedPackages?: readonly string[];
}

/** Every rule the file at `file` breaks. */
export function checkCoreFile(file: string, source: string, rules: CoreRules): Finding[] {
  const lexed = lex(source);
  const findings: Finding[] = [];
  const report = (index: number, rule: string, detail: string) =>
    findings.push({ file, line: lineAt(source, index), index, rule, detail });

  for (const ref of importsOf(lexed)) {
    const spec = ref.specifier;
    if (spec === null) {
      report(ref.index, 'import', 'import or require whose module is not a string literal (cannot be checked)');
    } else if ((rules.allowedPackages ?? []).includes(spec)) {
      // An exact package the rules allow (decided in the architecture test), even from a family listed below.
    } else if (UI_PACKAGES.some((p) => p.test(spec))) {
      report(ref.index, 'import', `imports UI/state package '${spec}'`);
    } else if (spec.startsWith('./') || spec.startsWith('../')) {
      const target = path.resolve(path.dirname(file), spec);
      const rel = path.relative(rules.root, target);
      if (rel === '' || rel.startsWith('..') || path.isAbsolute(rel)) {
        report(ref.index, 'import', `imports '${spec}', which resolves outside ${rules.root}`);
      }
    } else if (!(rules.allowedPackages ?? []).includes(spec)) {
      report(ref.index, 'import', `imports '${spec}' from outside ${rules.root}`);
    }
  }

  for (const { name, pattern } of FORBIDDEN_GLOBALS) {
    for (const m of lexed.code.matchAll(pattern)) {
      const index = m.index ?? 0;
      if (/^[\w$]+$/.test(name) && isPropertyName(lexed.code, index, name.length)) continue;
      report(index, 'global', `uses ${name}`);
    }
  }
  return findings.sort((a, b) => a.index - b.index);
}
