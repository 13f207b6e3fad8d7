// The calculation core (src/core) is pure: it imports nothing but itself, knows nothing of the
// page, and never reads the clock or a random source, so the same inputs give the same curve in
// the browser, the CLI and the tests. This file enforces that by scanning the source text.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { checkCoreFile, lex, importsOf, type Finding } from './helpers/source-scan.ts';

const repo = fileURLToPath(new URL('..', import.meta.url));
const coreRoot = path.join(repo, 'src', 'core');
const SOURCE = /\.(?:[cm]?[jt]sx?)$/;
/**
 * The packages the core may import: decimal.js, for exact decimal reading of typed quotes, and
 * d3-dsv, for splitting pasted CSV and tab-separated text (RFC 4180 quoting). Both are plain
 * computation on their arguments (no I/O, no page, no clock). Any other package needs a decision here.
 */
const CORE_RULES = { root: coreRoot, allowedPackages: ['decimal.js', 'd3-dsv'] } as const;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && SOURCE.test(e.name) && !e.name.endsWith('.d.ts'))
    .map((e) => path.join(e.parentPath, e.name))
    .sort();
}

const describeFindings = (findings: readonly Finding[]): string =>
  findings.map((f) => `${path.relative(repo, f.file)}:${f.line}: ${f.detail}`).join('\n');

/** Checks a sample as if it were the file src/core/curve/sample.ts. */
const check = (sample: string): Finding[] =>
  checkCoreFile(path.join(coreRoot, 'curve', 'sample.ts'), sample, CORE_RULES);
const rulesBroken = (sample: string): string[] => check(sample).map((f) => f.detail);

describe('src/core stays a pure calculation core', () => {
  const files = sourceFiles(coreRoot);

  it('has source files to check', () => {
    expect(files.length).toBeGreaterThan(0);
  });

  it('imports nothing outside src/core and touches no page, clock or random source', () => {
    const findings = files.flatMap((file) => checkCoreFile(file, readFileSync(file, 'utf8'), CORE_RULES));
    expect(findings, `forbidden use in src/core:\n${describeFindings(findings)}`).toEqual([]);
  });
});

/**
 * The UI's boundaries (DEVELOPERS.md, Layers): outside src/core, code reaches the core only through
 * src/core/index.ts, and src/share (links and files) imports no feature panel.
 */
function boundaryFindings(file: string, source: string): string[] {
  const rel = path.relative(repo, file);
  const out: string[] = [];
  for (const imp of importsOf(lex(source))) {
    if (imp.specifier === null || !imp.specifier.startsWith('.')) continue;
    const target = path.relative(repo, path.resolve(path.dirname(file), imp.specifier));
    if (target.startsWith(`src${path.sep}core${path.sep}`) && target !== path.join('src', 'core', 'index.ts')) out.push(`${rel}: imports ${imp.specifier}; import the core through src/core/index.ts`);
    if (rel.startsWith(`src${path.sep}share${path.sep}`) && target.startsWith(`src${path.sep}features${path.sep}`)) out.push(`${rel}: imports the feature module ${imp.specifier}; share/ imports no feature`);
  }
  return out;
}

describe('the UI reaches the core through its index, and share/ imports no feature', () => {
  const uiFiles = sourceFiles(path.join(repo, 'src')).filter((f) => !f.startsWith(coreRoot + path.sep));

  it('has UI files to check', () => {
    expect(uiFiles.length).toBeGreaterThan(50);
  });

  it('no file outside src/core imports a core module other than src/core/index.ts; none in src/share imports a feature', () => {
    const findings = uiFiles.flatMap((f) => boundaryFindings(f, readFileSync(f, 'utf8')));
    expect(findings, findings.join('\n')).toEqual([]);
  });

  it('the boundary check sees a deep core import and a feature import from share', () => {
    const fake = path.join(repo, 'src', 'share', 'Sample.tsx');
    expect(boundaryFindings(fake, "import { a } from '../core/roll/rollVsTerm.ts';\nimport { b } from '../core/index.ts';\nimport '../features/x/y.css';")).toEqual([
      'src/share/Sample.tsx: imports ../core/roll/rollVsTerm.ts; import the core through src/core/index.ts',
      'src/share/Sample.tsx: imports the feature module ../features/x/y.css; share/ imports no feature',
    ]);
  });
});

describe('source scanner self-check', () => {
  it('detects a forbidden import in a sample string', () => {
    expect(rulesBroken("import { useState } from 'react';")).toEqual(["imports UI/state package 'react'"]);
  });

  it('detects every forbidden package and every import form', () => {
    const sample = [
      "import { createRoot } from 'react-dom/client';",
      "import type { StoreApi } from 'zustand';",
      "export { scaleLinear } from 'd3-scale';",
      "import 'd3-shape';",
      "const lib = await import('some-package');",
      "const fs = require('node:fs');",
      "import { x } from '../../cli/curveCommand.ts';",
      'const dynamic = await import(name);',
    ].join('\n');
    expect(check(sample).map((f) => `${f.line}: ${f.detail}`)).toEqual([
      "1: imports UI/state package 'react-dom/client'",
      "2: imports UI/state package 'zustand'",
      "3: imports UI/state package 'd3-scale'",
      "4: imports UI/state package 'd3-shape'",
      `5: imports 'some-package' from outside ${coreRoot}`,
      `6: imports 'node:fs' from outside ${coreRoot}`,
      `7: imports '../../cli/curveCommand.ts', which resolves outside ${coreRoot}`,
      '8: import or require whose module is not a string literal (cannot be checked)',
    ]);
  });

  it('accepts imports that stay inside src/core, and the allowed package exactly', () => {
    expect(rulesBroken("import { a } from './a.ts';\nimport type { B } from '../time/date.ts';")).toEqual([]);
    expect(rulesBroken("export * from '../index.ts';")).toEqual([]);
    expect(rulesBroken("import Decimal from 'decimal.js';")).toEqual([]);
    expect(rulesBroken("import { dsvFormat } from 'd3-dsv';")).toEqual([]);
    expect(rulesBroken("import { csvParse } from 'd3-dsv/src/csv.js';")).toEqual(["imports UI/state package 'd3-dsv/src/csv.js'"]);
    expect(rulesBroken("import Decimal from 'decimal.js/decimal.mjs';")).toEqual([
      `imports 'decimal.js/decimal.mjs' from outside ${coreRoot}`,
    ]);
  });

  it('detects each forbidden global', () => {
    const sample = [
      'const w = window.innerWidth;',
      'document.title = "x";',
      "localStorage.setItem('k', 'v');",
      'const t = Date.now();',
      'const d = new Date(2024, 0, 1);',
      'const r = Math.random();',
      'const p = performance.now();',
      'const g = globalThis.window;',
      'const { document } = saved;',
    ].join('\n');
    expect(rulesBroken(sample)).toEqual([
      'uses window',
      'uses document',
      'uses localStorage',
      'uses Date.now',
      'uses new Date',
      'uses Math.random',
      'uses performance.',
      'uses window',
      'uses document',
    ]);
  });

  it('ignores comments, prose in strings and regular expressions, and unrelated property names', () => {
    const sample = [
      "// import React from 'react'; new Date()",
      '/* window.document; Math.random() */',
      "const message = 'open the document in a new window';",
      'const t = `the document ${count} of the window`;',
      "const re = /window|document|import x from 'react'/;",
      'const source = quote.document;',
      'interface Options {',
      '  window?: number;',
      '  readonly document: Record<string, unknown>;',
      '}',
      'const o = { document: 1, window: 2 };',
      'const url = "http://example.invalid/x"; const y = 1;',
    ].join('\n');
    expect(rulesBroken(sample)).toEqual([]);
  });

  it('still scans the code inside template literal expressions', () => {
    expect(rulesBroken('const s = `now ${Date.now()} and ${`${window.name}`}`;')).toEqual(['uses Date.now', 'uses window']);
  });

  it('keeps line numbers and lengths when it strips comments and blanks literals', () => {
    const source = "/* a\nb */ import x from './x.ts'; // c\nconst s = 'q';";
    const lexed = lex(source);
    expect(lexed.code).toHaveLength(source.length);
    expect(lexed.code.split('\n')).toHaveLength(3);
    expect(importsOf(lexed).map((r) => r.specifier)).toEqual(['./x.ts']);
    expect(check("\n\nimport React from 'react';")[0]?.line).toBe(3);
  });
});
