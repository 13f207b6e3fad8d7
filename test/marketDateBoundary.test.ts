// One place makes market dates (DEVELOPERS.md, The conventions layer): a date counted from another
// by a tenor, months or days is made by src/core/time/dateConventions.ts (resolveMarketDate,
// marketDate, marketDateCivil), so a calendar, a business-day rule or a spot lag set there reaches
// every tenor in the product. The date-arithmetic primitives live in src/core/time and only code
// there may call them. This file enforces that by scanning the source text.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { lex } from './helpers/source-scan.ts';

const repo = fileURLToPath(new URL('..', import.meta.url));
const srcRoot = path.join(repo, 'src');
const timeRoot = path.join(srcRoot, 'core', 'time');
const SOURCE = /\.(?:[cm]?[jt]sx?)$/;

/** The primitives that add a tenor, months or days to a date (src/core/time/tenor.ts and date.ts). */
const PRIMITIVES = /(?<![\w$])(addTenor|addTenorCivil|addMonths|addMonthsCivil|addDays)(?![\w$])/g;
/** A date made from a day serial plus or minus a count: civilFromSerial(s + n), isoFromSerial(s - n). */
const SERIAL_CALL = /(?<![\w$])(?:civilFromSerial|isoFromSerial)\s*\(/g;

/** The text of a call's arguments: from just after its opening parenthesis to the matching one. */
function argumentsAt(code: string, open: number): string {
  let depth = 1;
  let i = open;
  for (; i < code.length && depth > 0; i++) depth += code[i] === '(' ? 1 : code[i] === ')' ? -1 : 0;
  return code.slice(open, i - 1);
}

/**
 * Uses outside src/core/time that make no market date, each counted and with its reason. A new
 * use in one of these files is still caught: the count must match exactly.
 */
const ALLOWED: Readonly<Record<string, Readonly<Record<string, { readonly count: number; readonly why: string }>>>> = {
  'src/core/curve/query.ts': {
    addDays: { count: 2, why: 'clockRatio: the first days after settlement, to compare two day-count clocks (import and call)' },
  },
  'src/core/roll/horizonCurve.ts': {
    addDays: { count: 2, why: 'the horizon curve relabels its pillars by the days from today to the horizon; their times do not move (import and call)' },
  },
  'src/hooks/useCurveSeries.ts': {
    addDays: { count: 2, why: "chartEndDate: how far the charts' drawn range runs past the last pillar (import and call)" },
  },
  'src/core/curve/sampling.ts': {
    serialShift: { count: 2, why: 'chart sample points spread by days over the drawn range (the zero grid and the short par bonds)' },
  },
};

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile() && SOURCE.test(e.name) && !e.name.endsWith('.d.ts'))
    .map((e) => path.join(e.parentPath, e.name))
    .sort();
}

/** Uses of date-arithmetic primitives in a file's code (comments and literal text ignored), by name. */
function primitiveUses(source: string): Map<string, number[]> {
  const { code } = lex(source);
  const lineOf = (index: number): number => code.slice(0, index).split('\n').length;
  const uses = new Map<string, number[]>();
  const add = (name: string, index: number) => uses.set(name, [...(uses.get(name) ?? []), lineOf(index)]);
  for (const m of code.matchAll(PRIMITIVES)) add(m[1]!, m.index);
  for (const m of code.matchAll(SERIAL_CALL)) if (/[+-]/.test(argumentsAt(code, m.index + m[0].length))) add('serialShift', m.index);
  return uses;
}

/** Findings for one file (path relative to the repository); none for files under src/core/time. */
function boundaryFindings(rel: string, source: string): string[] {
  if (rel.startsWith(`src${path.sep}core${path.sep}time${path.sep}`)) return [];
  const allowed = ALLOWED[rel.split(path.sep).join('/')] ?? {};
  const out: string[] = [];
  for (const [name, lines] of primitiveUses(source)) {
    const permit = allowed[name];
    if (permit !== undefined && permit.count === lines.length) continue;
    const what = name === 'serialShift' ? 'makes a date from a day serial plus a count' : `uses ${name}`;
    out.push(`${rel}:${lines.join(',')}: ${what}; make market dates with resolveMarketDate / marketDate (src/core/time/dateConventions.ts)`);
  }
  return out;
}

describe('market dates are made in one place (the conventions layer)', () => {
  const files = sourceFiles(srcRoot);

  it('has files to check, including the conventions module', () => {
    expect(files.length).toBeGreaterThan(100);
    expect(files).toContain(path.join(timeRoot, 'dateConventions.ts'));
  });

  it('no file outside src/core/time adds a tenor, months or days to a date', () => {
    const findings = files.flatMap((f) => boundaryFindings(path.relative(repo, f), readFileSync(f, 'utf8')));
    expect(findings, findings.join('\n')).toEqual([]);
  });

  it('every allowed use is still there (an allowance is removed when its use goes)', () => {
    for (const [rel, names] of Object.entries(ALLOWED)) {
      const uses = primitiveUses(readFileSync(path.join(repo, rel), 'utf8'));
      for (const [name, { count }] of Object.entries(names)) expect(uses.get(name)?.length ?? 0, `${rel} ${name}`).toBe(count);
    }
  });

  it('the scan catches a planted call in a panel, in the core and in an allowed file, and ignores comments, text and src/core/time', () => {
    const panel = path.join('src', 'features', 'tables', 'Sample.tsx');
    expect(boundaryFindings(panel, "import { addTenor } from '../../core/index.ts';\nconst d = addTenor(s, t);")).toEqual([
      `${panel}:1,2: uses addTenor; make market dates with resolveMarketDate / marketDate (src/core/time/dateConventions.ts)`,
    ]);
    const core = path.join('src', 'core', 'roll', 'sample.ts');
    expect(boundaryFindings(core, 'const e = addMonthsCivil(c, 6);\nconst f = isoFromSerial(serialFromIso(d) + 2);\nconst g = isoFromSerial(s);')).toEqual([
      `${core}:1: uses addMonthsCivil; make market dates with resolveMarketDate / marketDate (src/core/time/dateConventions.ts)`,
      `${core}:2: makes a date from a day serial plus a count; make market dates with resolveMarketDate / marketDate (src/core/time/dateConventions.ts)`,
    ]);
    const query = path.join('src', 'core', 'curve', 'query.ts');
    const planted = `${readFileSync(path.join(repo, query), 'utf8')}\nexport const spot = (d: string) => addDays(d, 2);\n`;
    expect(boundaryFindings(query, planted)).toHaveLength(1);
    expect(boundaryFindings(core, '// addTenor(x, y) in a comment\nconst m = "addDays(d, 1)";\nconst addTenorLabel = 1;')).toEqual([]);
    expect(boundaryFindings(path.join('src', 'core', 'time', 'sample.ts'), 'const d = addTenor(s, t);')).toEqual([]);
  });
});
