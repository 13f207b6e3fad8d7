import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { defineConfig, type Plugin } from 'vitest/config';
import react from '@vitejs/plugin-react';

/**
 * The build id ties a shared link and a printed page to the code that produced them: the package
 * version and a short hash of every source file, so the same code always has the same id and a
 * changed engine never passes for the old one.
 */
function sourceHash(dir: string): string {
  const hash = createHash('sha256');
  const walk = (d: string): void => {
    for (const entry of readdirSync(d, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
      const path = join(d, entry.name);
      if (entry.isDirectory()) walk(path);
      else {
        hash.update(path);
        hash.update(readFileSync(path));
      }
    }
  };
  walk(dir);
  return hash.digest('hex').slice(0, 8);
}
const version = (JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version;
const buildId = process.env.TENORSCOPE_BUILD_ID ?? `${version}+${sourceHash('src')}`;

/**
 * A strict Content-Security-Policy for static hosting, as a meta tag in the production
 * index.html only (the dev server's hot reload needs an inline preamble). No inline script, no
 * eval, no network: the app makes no requests beyond its own files.
 */
const CSP = [
  "default-src 'none'",
  "script-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'none'",
  "worker-src 'self' blob:",
  "manifest-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
  "object-src 'none'",
].join('; ');

/**
 * Two chunks of the app's own: `first`, what the first screen runs (a module reached from the page's
 * entry by static imports), and `later`, everything that loads on first use (the panels, readers and
 * tools behind import(), which are preloaded once the first chart is drawn). The budget test counts
 * each file's gzip, and some forty small files cost about 14 KB of the all-JavaScript budget over two.
 *
 * The UI imports the core through its index, so every core module is "reached" from the entry;
 * LATER_ONLY names those the first screen never runs: money in decimal.js, the roll analysis, the
 * smooth fit, the quote check's schedules, the explanations, the scenarios' reference reader and change table, the
 * overnight view, the bond analytics and forward sensitivities (the risk section and the explanations), the workspace list file, the code of turns and steps (fetched
 * by src/hooks/overnightKit.ts), and the named curves' build (the term-index swap, the workbench's
 * named-curve build, the spread between two curves and the edits of named curves). Four small readers used only later stay in
 * `first` on purpose: the Holidays and Fixings sections' (calendarEdits, fixingList), the paste's
 * table reader and the named curves' reader; there they cost 3.3 KB of the first load and save 0.5 KB
 * of all JavaScript, the tighter budget (each file's gzip starts afresh, and `later` imports what
 * they export by name). Were one of them run on the first screen, `later` would be
 * imported by `first` and the first-load budget test (test/browser/security.test.ts) would fail; a
 * core module used only later and missing here costs first-load bytes, nothing else.
 */
const LATER_ONLY = /node_modules\/decimal\.js\/|src\/core\/roll\/|src\/core\/fit\/(?!parametricForm)|src\/core\/input\/quoteSchedule\.ts|src\/core\/curve\/explain|src\/core\/analytics\/(explainRisk|explainBond|explainDv01|crossCurveSensitivity|forwardSensitivity|nodePartials|quoteYield)\.ts|src\/core\/scenarios\/(scenarioReference|scenarioEffects|namedCurveScenario)\.ts|src\/core\/curve\/overnightView\.ts|src\/core\/analytics\/(bondInput|bondAnalytics|zSpread|quoteDv01|sensitivityMap)\.ts|src\/core\/document\/(listFile|namedCurveEdits)\.ts|src\/core\/bootstrap\/namedCurveBuild\.ts|src\/core\/instruments\/projectedSwap\.ts|src\/core\/bootstrap\/workbenchCurves\.ts|src\/core\/curve\/curveSpread\.ts|src\/core\/bootstrap\/(overnightKit|turns|turnSolve|meetingSteps)\.ts|src\/core\/time\/turnDays\.ts/;

function appChunk(id: string, ctx: { getModuleInfo(id: string): { isEntry: boolean; importers: readonly string[]; dynamicImporters: readonly string[] } | null }): string | null {
  if (LATER_ONLY.test(id)) return 'later';
  // Up the static importers from the module: first load when the entry is among them.
  const seen = new Set([id]);
  const queue = [id];
  while (queue.length > 0) {
    const info = ctx.getModuleInfo(queue.pop()!);
    if (info === null) continue;
    // The page's entry (index.html); a module loaded by import() is an entry of its own to the bundler, with importers.
    if (info.isEntry && info.importers.length === 0 && info.dynamicImporters.length === 0) return 'first';
    for (const m of info.importers) if (!seen.has(m)) seen.add(m), queue.push(m);
  }
  return 'later';
}

/**
 * d3-scale's linear scale reaches features the charts never use: d3-interpolate's generic
 * interpolator (strings, colours through d3-color, dates, arrays, objects), which the scale keeps as
 * its default, and number formats (d3-format, through `tickFormat`). The charts map numbers to
 * numbers and label ticks with the core's formatting (src/core/format), so when d3-scale imports
 * them they resolve to small stand-ins: d3-interpolate's number and round interpolators as d3 writes
 * them (a * (1 - t) + b * t, the same floating-point steps), the generic one refusing anything but
 * a number, and a d3 number format throwing, naming the module to use. About 7 KB of the gzip
 * budget (test/browser/security.test.ts) comes back; tests and the build resolve the same way, so a
 * chart that started to need any of it would fail its tests.
 */
const D3_STAND_INS: Record<string, string> = {
  'd3-interpolate': [
    'export const interpolateNumber = (a, b) => ((a = +a), (b = +b), (t) => a * (1 - t) + b * t);',
    'export const interpolateRound = (a, b) => ((a = +a), (b = +b), (t) => Math.round(a * (1 - t) + b * t));',
    "export const interpolate = (a, b) => { if (typeof b !== 'number') throw new Error('the charts interpolate numbers only (d3-interpolate is not bundled)'); return interpolateNumber(a, b); };",
    "export const piecewise = () => { throw new Error('piecewise interpolation is not bundled'); };",
  ].join('\n'),
  'd3-format': ['format', 'formatPrefix', 'formatSpecifier', 'precisionFixed', 'precisionPrefix', 'precisionRound']
    .map((n) => `export const ${n} = () => { throw new Error('d3 number formats are not bundled: format chart labels with src/core/format'); };`)
    .join('\n'),
};
const d3StandIns = (): Plugin => ({
  name: 'tenorscope-d3-stand-ins',
  enforce: 'pre',
  resolveId(id, importer) {
    if (id in D3_STAND_INS && importer !== undefined && /node_modules[\\/]d3-scale[\\/]/.test(importer)) return `\0d3-stand-in:${id}`;
    return null;
  },
  load(id) {
    return id.startsWith('\0d3-stand-in:') ? D3_STAND_INS[id.slice('\0d3-stand-in:'.length)] : null;
  },
});

/**
 * d3-shape assigns each curve's prototype at module level (`Basis.prototype = {...}`), which the
 * bundler must keep whether or not the curve is used: 8 KB of curves the charts never draw. The
 * charts import `line` with `curveLinear` and `curveStepAfter`; this transform drops the other
 * curves' prototype blocks from d3-shape's module, and from d3-path's Path the drawing methods the
 * two kept curves never call (arcs, Bézier and quadratic curves, rectangles: they move, line and
 * close), about 1.8 KB of the gzip budget. A chart that imports another curve fails the build here,
 * naming what to add to D3_CURVE_CLASSES (and check that curve's Path calls).
 */
const D3_CURVE_CLASSES: Record<string, string> = { curveLinear: 'Linear', curveStepAfter: 'Step' };
const d3ShapeCurves = (): Plugin => ({
  name: 'tenorscope-d3-shape-curves',
  enforce: 'pre',
  transform(code, id) {
    if (/node_modules[\\/]d3-path[\\/]dist[\\/]d3-path\.mjs$/.test(id)) {
      // The path the kept curves draw with: they call moveTo, lineTo and closePath only.
      return code.replace(/^ {2}(quadraticCurveTo|bezierCurveTo|arcTo|arc|rect)\([^)]*\) \{\n[\s\S]*?^ {2}\}\n/gm, '');
    }
    if (/node_modules[\\/]d3-shape[\\/]/.test(id)) {
      if (!/[\\/]d3-shape\.mjs$/.test(id)) return null;
      const keep = new Set(Object.values(D3_CURVE_CLASSES));
      return code
        .replace(/^(\w+)\.prototype = \{\n[\s\S]*?^\};\n/gm, (block, name: string) => (keep.has(name) ? block : ''))
        .replace(/^\(MonotoneY\.prototype = Object\.create\(MonotoneX\.prototype\)\)\.point = function\(x, y\) \{\n[\s\S]*?^\};\n/m, '')
        // The tunable curves are made by a call at module level, which touches nothing outside: pure.
        .replace(/^var (\w+) = (\(function custom\(|curveRadial\(curveLinear\))/gm, 'var $1 = /*@__PURE__*/ $2');
    }
    if (!/[\\/]src[\\/].*\.tsx?$/.test(id)) return null;
    for (const m of code.matchAll(/import\s*\{([^}]*)\}\s*from\s*'d3-shape'/g)) {
      for (const name of m[1]!.split(',').map((n) => n.trim().replace(/^type\s+/, '').split(/\s+as\s+/)[0]!)) {
        if (name.startsWith('curve') && !(name in D3_CURVE_CLASSES)) this.error(`${id} imports ${name} from d3-shape: add it and its class to D3_CURVE_CLASSES in vite.config.ts`);
      }
    }
    return null;
  },
});

/**
 * decimal.js attaches every method to its prototype at module level, so the bundler keeps all of
 * them: trigonometry, hyperbolic functions, logarithms, roots, base conversions... The app's exact
 * money and the quote check's rounding use a handful (construction, plus, minus, times, div,
 * comparisons, rounding, toFixed, toNumber). This transform replaces the bodies of the methods
 * listed below with one that throws, and leaves out the static shorthands (Decimal.sin(x)...), which
 * the app never calls, so the bundler drops them and the helpers only they call, random and its crypto
 * among them, and shortens pi and ln 10 (1,025 digits each, read only by the trigonometry, and by the
 * logarithms and powers: toPower is left out too, so a power of ten is written 1e<k>) to '3' and '2',
 * with which any use left would throw (about 7.5 KB of the gzip budget, 2 KB of it ln 10 and the
 * power's code); the library's arithmetic is untouched. The guard reads names
 * alone, so it cannot check toPrecision and toExponential, which numbers have too.
 */
const DECIMAL_LEFT_OUT = ['clampedTo', 'cosine', 'cubeRoot', 'dividedToIntegerBy', 'hyperbolicCosine', 'hyperbolicSine', 'hyperbolicTangent', 'inverseCosine', 'inverseHyperbolicCosine', 'inverseHyperbolicSine', 'inverseHyperbolicTangent', 'inverseSine', 'inverseTangent', 'logarithm', 'modulo', 'naturalExponential', 'naturalLogarithm', 'sine', 'squareRoot', 'tangent', 'toBinary', 'toExponential', 'toFraction', 'toHexadecimal', 'toNearest', 'toOctal', 'toPower', 'toPrecision', 'toSignificantDigits', 'precision', 'round', 'truncated', 'max', 'min'];
/** The left-out methods and their aliases, less those a number also has (toPrecision, toExponential), which the guard cannot tell apart by name. */
const DECIMAL_GUARDED = new Set([...DECIMAL_LEFT_OUT, 'clamp', 'cos', 'cbrt', 'divToInt', 'cosh', 'sinh', 'tanh', 'pow', 'acos', 'acosh', 'asinh', 'atanh', 'asin', 'atan', 'log', 'mod', 'exp', 'ln', 'sin', 'sqrt', 'tan', 'toHex', 'toSD', 'sd', 'trunc'].filter((n) => n !== 'toPrecision' && n !== 'toExponential'));
const decimalMethods = (): Plugin => ({
  name: 'tenorscope-decimal-methods',
  enforce: 'pre',
  transform(code, id) {
    if (/node_modules[\\/]decimal\.js[\\/]decimal\.mjs$/.test(id)) {
      const left = new Set(DECIMAL_LEFT_OUT);
      let dropped = 0;
      const out = code.replace(/\r\n/g, '\n').replace(/^P\.(\w+)((?: = P\.\w+)*) = function \([^)]*\) \{\n[\s\S]*?^\};\n/gm, (block, name: string, more: string) => {
        if (!left.has(name)) return block;
        dropped++;
        const names = [name, ...(more.match(/P\.\w+/g) ?? []).map((a) => a.slice(2))];
        return `${names.map((n) => `P.${n} = `).join('')}leftOut;\n`;
      });
      if (dropped !== left.size) this.error(`decimal.js: ${dropped} of the ${left.size} methods in DECIMAL_LEFT_OUT were found; check the list against this version`);
      // The static shorthands (Decimal.sin(x) for new Decimal(x).sin()...): the app calls none; with them go random (and its crypto) and atan2.
      const statics = /^ {2}Decimal\.abs = abs;\n[\s\S]*?^ {2}Decimal\.trunc = trunc;[^\n]*\n/m;
      if (!statics.test(out)) this.error('decimal.js: its static shorthands were not found where this transform expects them; check it against this version');
      // pi to 1,025 digits is read only by the trigonometry left out above; as '3' it has no digit after
      // the point, so any use of it left would throw decimal.js's precision-limit error, never round.
      const pi = /^ {2}PI = '3\.1415926535\d{1000,}',?$/m;
      if (!pi.test(out)) this.error("decimal.js: its PI constant was not found where this transform expects it; check it against this version");
      // ln 10 to 1,025 digits likewise: read only by the logarithms and powers left out above.
      const ln10 = /^ {2}LN10 = '2\.3025850929\d{1000,}',?$/m;
      if (!ln10.test(out)) this.error("decimal.js: its LN10 constant was not found where this transform expects it; check it against this version");
      return `function leftOut() { throw Error('[DecimalError] this method of decimal.js is not in the app (DECIMAL_LEFT_OUT, vite.config.ts)'); }\n${out.replace(statics, '').replace(pi, "  PI = '3',").replace(ln10, "  LN10 = '2',")}`;
    }
    if (!/[\\/]src[\\/].*\.tsx?$/.test(id)) return null;
    for (const m of code.matchAll(/\b(\w*Decimal)\.(\w+)\(/g)) {
      if (!['clone', 'set', 'config', 'isDecimal', 'fromNumber', 'of', 'parse'].includes(m[2]!)) this.error(`${id} calls ${m[1]}.${m[2]}(): decimal.js's static shorthands are left out of the app (vite.config.ts); write new ${m[1]}(x).${m[2]}() or keep the shorthands`);
    }
    for (const m of code.matchAll(/([\w)\]]+)\.(\w+)\(/g)) {
      if (DECIMAL_GUARDED.has(m[2]!) && !/^(Math|console)$/.test(m[1]!)) {
        this.error(`${id} calls .${m[2]}() on ${m[1]}: if that is a decimal.js value, take the method off DECIMAL_LEFT_OUT in vite.config.ts`);
      }
    }
    return null;
  },
});

/**
 * React's JSX runtime is a CommonJS module, so every element the app renders was bundled as a call
 * through the module object, `(0, ns.jsx)(...)`: some 1,600 of them. Our sources import it through
 * this small ES module instead, which reads the three functions once, so each call is a plain call
 * (about 0.9 KB of the gzip budget). The build only: tests run the runtime as it is.
 */
const jsxRuntimeBindings = (): Plugin => ({
  name: 'tenorscope-jsx-runtime-bindings',
  apply: 'build',
  enforce: 'pre',
  resolveId(id, importer) {
    if (id === 'react/jsx-runtime' && importer !== undefined && /[\\/]src[\\/]/.test(importer)) return '\0jsx-runtime-bindings';
    return null;
  },
  load(id) {
    return id === '\0jsx-runtime-bindings' ? "import * as runtime from 'react/jsx-runtime';\nexport const jsx = runtime.jsx, jsxs = runtime.jsxs, Fragment = runtime.Fragment;\n" : null;
  },
});

const contentSecurityPolicy = (): Plugin => ({
  name: 'tenorscope-csp',
  apply: 'build',
  transformIndexHtml: {
    order: 'post',
    handler: (html) => {
      const withCsp = html.replace(/(<meta charset="UTF-8" \/>)/i, `$1\n    <meta http-equiv="Content-Security-Policy" content="${CSP}" />`);
      // No icon request to 404 (a console error) when the page names none of its own.
      return /rel="icon"/.test(withCsp) ? withCsp : withCsp.replace('</title>', '</title>\n    <link rel="icon" href="data:," />');
    },
  },
});

export default defineConfig({
  plugins: [react(), d3StandIns(), d3ShapeCurves(), decimalMethods(), jsxRuntimeBindings(), contentSecurityPolicy()],
  define: { __BUILD_ID__: JSON.stringify(buildId) },
  server: { port: 5173, strictPort: false },
  // No modulepreload polyfill: every browser the es2022 target runs in preloads modules itself, and
  // the polyfill would fetch() them, which the policy's connect-src 'none' forbids anyway.
  build: {
    target: 'es2022',
    sourcemap: false,
    modulePreload: { polyfill: false },
    rolldownOptions: { output: { codeSplitting: { includeDependenciesRecursively: false, groups: [{ name: appChunk }] } } },
  },
  test: {
    globals: true,
    environment: 'node',
    setupFiles: ['test/setup.ts'],
    // Whole-app component tests render the workbench in jsdom; on a loaded 2-core machine they take
    // seconds. This is a hang guard, not a speed check (speed is measured by the benchmarks).
    testTimeout: 60_000,
    hookTimeout: 60_000,
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/browser/**', 'node_modules/**'],
  },
});
