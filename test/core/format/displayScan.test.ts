// Every rate, bp, percent, price, money and count shown to a person is formatted by the core's
// format module (src/core/format), so there is one minus sign and one rounding rule per quantity.
// This scan fails on any other file that picks decimals or a locale itself.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { displayFindings, type DisplayException } from './displayScan.ts';

const repo = fileURLToPath(new URL('../../..', import.meta.url));

/** The short list of calls that stay outside the module, each with its reason. */
const EXCEPTIONS: readonly DisplayException[] = [
  {
    file: 'src/core/roll/rollVsTerm.ts',
    pattern: /\(x \* 100\)\.toFixed\(3\)/,
    reason: "the strategies' detail texts are part of the analysis the golden check holds bit for bit",
  },
  {
    file: 'src/features/scenarios/ScenarioShapeChart.tsx',
    pattern: /\b(?:sx|sy)\((?:[^()]|\([^()]*\))*\)\.toFixed\(1\)/,
    reason: 'SVG polyline coordinates (pixels), not text a person reads',
  },
  {
    file: 'src/features/print/PrintChart.tsx',
    pattern: /\b(?:sx|sy)\((?:[^()]|\([^()]*\))*\)\.toFixed\(1\)/,
    reason: 'SVG polyline coordinates (pixels), not text a person reads',
  },
  ...['src/share/useOpenLinkOnStart.ts', 'src/share/ShareBar.tsx', 'src/features/workspaces/WorkspacesPanel.tsx'].map((file) => ({
    file,
    pattern: /new Date\([^()]*\)\.toLocaleString\(/,
    reason: "a clock time in the user's own time zone (workspace names, saved at); the pure core has no clock",
  })),
];

const SOURCE = /\.(?:[cm]?[jt]sx?)$/;
const sourceFiles = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && SOURCE.test(e.name) && !e.name.endsWith('.d.ts'))
    .map((e) => path.relative(repo, path.join(e.parentPath, e.name)))
    .sort();

describe('display formatting lives in src/core/format', () => {
  const files = sourceFiles(path.join(repo, 'src'));

  it('finds the source files and the format module among them', () => {
    expect(files.length).toBeGreaterThan(100);
    expect(files.map((f) => f.split(path.sep).join('/'))).toContain('src/core/format/quantities.ts');
  });

  it('no file outside the module calls toFixed(n), toLocaleString or Intl.NumberFormat, or builds a tag from COMPOUNDING_LABEL', () => {
    const findings = files.flatMap((f) => displayFindings(f, readFileSync(path.join(repo, f), 'utf8'), EXCEPTIONS));
    expect(findings.map((f) => `${f.file}:${f.line}: ${f.text}`)).toEqual([]);
  });

  it('every exception still matches a call (a stale exception is removed, not kept)', () => {
    for (const e of EXCEPTIONS) {
      const source = readFileSync(path.join(repo, e.file), 'utf8');
      expect(e.pattern.test(source), `${e.file}: ${e.reason}`).toBe(true);
    }
  });

  it('fails on a planted call in a feature file, and not on prose or a decimal.js exact text', () => {
    const planted = "export const shown = (r: number) => `${(r * 100).toFixed(2)}%`;\n";
    expect(displayFindings('src/features/tables/Planted.tsx', planted, EXCEPTIONS)).toHaveLength(1);
    expect(displayFindings('src/features/tables/Planted.tsx', 'const t = n.toLocaleString("en-US");', EXCEPTIONS)).toHaveLength(1);
    expect(displayFindings('src/features/tables/Planted.tsx', 'const f = new Intl.NumberFormat("en-US");', EXCEPTIONS)).toHaveLength(1);
    expect(displayFindings('src/features/tables/Planted.tsx', 'const tag = `${COMPOUNDING_LABEL[c]}, ${dc}`;', EXCEPTIONS)).toHaveLength(1);
    // prose in a message and a comment are not code; Decimal#toFixed() without decimals is exact text
    expect(displayFindings('src/features/tables/Planted.tsx', "// x.toFixed(2)\nconst m = 'call toFixed(2)';\nconst d = typed.toFixed();", EXCEPTIONS)).toEqual([]);
    // an exception covers its own file only
    expect(displayFindings('src/features/tables/Planted.tsx', 'const p = `${sx(t).toFixed(1)}`;', EXCEPTIONS)).toHaveLength(1);
    expect(displayFindings('src/core/format/numberText.ts', planted, EXCEPTIONS)).toEqual([]);
  });
});
