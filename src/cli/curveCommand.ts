import {
  analyzeBond,
  buildCurve,
  documentCapErrors,
  DAY_COUNTS,
  isDayCount,
  type BondInput,
  type DayCount,
  COMPOUNDINGS,
  CURVE_DAY_COUNTS,
  EXTRAPOLATIONS,
  forwardOn,
  isCompounding,
  isCurveDayCount,
  isExtrapolation,
  isIsoDate,
  addTenor,
  atInputRows,
  engineFromAnyDocument,
  parseTenor,
  zeroOn,
  type Compounding,
  type CoreError,
  type CoreWarning,
  type CurveDayCount,
  type Extrapolation,
} from '../core/index.ts';
import { builtDocumentLine, type ForwardOut, type PointOut, type QuoteOut } from './documentLine.ts';

export interface CommandResult {
  readonly stdout: string;
  readonly stderr: string;
  readonly status: 0 | 1 | 2;
}

interface Options {
  file: string;
  at: string[] | null;
  forward: [string, string][];
  compounding: Compounding;
  dayCount: CurveDayCount | null;
  extrapolate: Extrapolation | null;
  skipInvalid: boolean;
  bonds: BondSpec[];
}

/** One `--bond MATURITY,COUPON,FREQUENCY,DAYCOUNT[,price=P|yield=Y]`, maturity still a date or tenor. */
interface BondSpec {
  readonly maturity: string;
  readonly coupon: number;
  readonly frequency: number;
  readonly dayCount: DayCount;
  readonly cleanPrice?: number;
  readonly yield?: number;
}

const USAGE =
  'usage: npm run --silent curve -- FILE [--at D,...] [--forward S:E,...] [--compounding C] [--day-count DC] [--extrapolate none|flat-forward] [--skip-invalid] [--bond MATURITY,COUPON,FREQUENCY,DAYCOUNT[,price=P|yield=Y]]...\n' +
  '  FILE is a workspace JSON document or NDJSON, or - for standard input; dates are YYYY-MM-DD or tenors (3M, 2Y) from settlement\n' +
  '  --bond (repeatable) adds bond analytics off the curve: coupon and yield are decimals, price=P is clean per 100 face\n';

const usage = (message: string): CommandResult => ({ stdout: '', stderr: `curve: ${message}\n${USAGE}`, status: 2 });

const isPoint = (s: string): boolean => isIsoDate(s) || parseTenor(s) !== null;

function parseArgs(args: readonly string[]): Options | string {
  const opts: Options = { file: '', at: null, forward: [], compounding: 'continuous', dayCount: null, extrapolate: null, skipInvalid: false, bonds: [] };
  const files: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const arg = args[i]!;
    const eq = arg.startsWith('--') ? arg.indexOf('=') : -1;
    const name = eq > 0 ? arg.slice(0, eq) : arg;
    const takesValue = ['--at', '--forward', '--compounding', '--day-count', '--extrapolate', '--bond'].includes(name);
    let value: string | undefined;
    if (takesValue) {
      value = eq > 0 ? arg.slice(eq + 1) : args[++i];
      if (value === undefined) return `${name} needs a value`;
    }
    switch (name) {
      case '--at': {
        const items = value!.split(',').map((s) => s.trim());
        const bad = items.find((s) => !isPoint(s));
        if (bad !== undefined) return `--at: "${bad}" is neither a date YYYY-MM-DD nor a tenor such as 3M or 2Y`;
        opts.at = [...(opts.at ?? []), ...items];
        break;
      }
      case '--forward': {
        for (const pair of value!.split(',')) {
          const parts = pair.split(':').map((s) => s.trim());
          if (parts.length !== 2 || !isPoint(parts[0]!) || !isPoint(parts[1]!)) {
            return `--forward: "${pair}" must be START:END, each a date YYYY-MM-DD or a tenor (1Y:2Y)`;
          }
          opts.forward.push([parts[0]!, parts[1]!]);
        }
        break;
      }
      case '--compounding':
        if (!isCompounding(value)) return `--compounding must be one of ${COMPOUNDINGS.join(', ')}, not "${value}"`;
        opts.compounding = value;
        break;
      case '--day-count':
        if (!isCurveDayCount(value)) {
          const why = value === 'ACT/ACT-ICMA' || value === '30E/360-ISDA' ? `${value} needs an instrument and cannot serve a query; ` : '';
          return `--day-count: ${why}must be one of ${CURVE_DAY_COUNTS.join(', ')}, not "${value}"`;
        }
        opts.dayCount = value;
        break;
      case '--extrapolate':
        if (!isExtrapolation(value)) return `--extrapolate must be one of ${EXTRAPOLATIONS.join(', ')}, not "${value}"`;
        opts.extrapolate = value;
        break;
      case '--bond': {
        const spec = parseBond(value!);
        if (typeof spec === 'string') return `--bond "${value}": ${spec}`;
        opts.bonds.push(spec);
        break;
      }
      case '--skip-invalid':
        if (eq > 0) return '--skip-invalid takes no value';
        opts.skipInvalid = true;
        break;
      default:
        if (arg.startsWith('--') || (arg.startsWith('-') && arg !== '-')) return `unknown option ${arg}`;
        files.push(arg);
    }
  }
  if (files.length !== 1) return files.length === 0 ? 'give one FILE (or - for standard input)' : `give one FILE, not ${files.length}`;
  opts.file = files[0]!;
  return opts;
}

const NUMBER_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Parses MATURITY,COUPON,FREQUENCY,DAYCOUNT[,price=P|yield=Y]; a message on bad syntax. */
function parseBond(text: string): BondSpec | string {
  const parts = text.split(',').map((s) => s.trim());
  if (parts.length < 4 || parts.length > 5) return 'must be MATURITY,COUPON,FREQUENCY,DAYCOUNT with an optional ,price=P or ,yield=Y (for example 2034-05-15,0.04,2,ACT/ACT-ICMA,price=101.25)';
  const [maturity, coupon, frequency, dayCount, quote] = parts as [string, string, string, string, string | undefined];
  if (!isPoint(maturity)) return `maturity "${maturity}" is neither a date YYYY-MM-DD nor a tenor such as 10Y`;
  if (!NUMBER_RE.test(coupon)) return `coupon "${coupon}" must be a decimal number (0.04 = 4%)`;
  if (!/^\d+$/.test(frequency)) return `frequency "${frequency}" must be a whole number of payments a year (1, 2, 4 or 12)`;
  if (!isDayCount(dayCount)) return `day count "${dayCount}" must be one of ${DAY_COUNTS.join(', ')}`;
  const spec = { maturity, coupon: Number(coupon), frequency: Number(frequency), dayCount };
  if (quote === undefined) return spec;
  const m = /^(price|yield)=(.*)$/.exec(quote);
  if (!m || !NUMBER_RE.test(m[2]!)) return `"${quote}" must be price=P (clean, per 100 face) or yield=Y (a decimal)`;
  return m[1] === 'price' ? { ...spec, cleanPrice: Number(m[2]) } : { ...spec, yield: Number(m[2]) };
}

type Entry = { doc: unknown } | { error: string };

/**
 * Splits input into documents: one JSON value, or NDJSON lines (each parsed only when its turn
 * comes, so a long batch never holds every parsed document at once). Each entry is parsed or an
 * error text.
 */
function splitDocuments(text: string): { readonly count: number; readonly entry: (i: number) => Entry } {
  try {
    const doc: unknown = JSON.parse(text);
    return { count: 1, entry: () => ({ doc }) };
  } catch {
    // not a single value: NDJSON
  }
  const lines = text.split(/\r?\n/).filter((line) => line.trim() !== '');
  if (lines.length === 0) return { count: 1, entry: () => ({ error: 'the input is empty; give a workspace JSON document' }) };
  return {
    count: lines.length,
    entry: (i) => {
      const line = lines[i]!;
      try {
        return { doc: JSON.parse(line) };
      } catch (e) {
        const shown = line.length > 80 ? `${line.slice(0, 80)}...` : line;
        return { error: `not valid JSON (${(e as Error).message}): ${shown}` };
      }
    },
  };
}

/** Resolves a date or tenor against a settlement date. */
const resolve = (point: string, settlement: string): string => {
  const tenor = parseTenor(point);
  return tenor ? addTenor(settlement, tenor) : point;
};

/** The output line of a document that failed (without its newline). */
const failedLine = (index: number, errors: readonly CoreError[]): string => JSON.stringify({ index, errors });

/** A wrong row of a workbench document, left out under --skip-invalid, as the engine words a skipped quote. */
const skippedRow = (e: CoreError): CoreWarning => ({ path: e.path, quote: e.quote, code: 'skipped', message: `${e.message}; left out` });

/** Runs one document; returns its output line (without the newline) and its errors (none when it built). */
function runDocument(index: number, input: unknown, opts: Options): { line: string; errors: readonly CoreError[] } {
  const capped = documentCapErrors(input);
  if (capped.length > 0) return { line: failedLine(index, capped), errors: capped };
  // A workbench document (quote cells as typed) is read as the workbench reads it; engine
  // positions in messages are re-pointed at its rows.
  const read = engineFromAnyDocument(input);
  const failed = (errors: readonly CoreError[]) => ({ line: failedLine(index, errors), errors });
  if (read.errors.length > 0 && !opts.skipInvalid) return failed(read.errors);
  const built = buildCurve(read.doc, { skipInvalid: opts.skipInvalid, ...(opts.extrapolate ? { extrapolation: opts.extrapolate } : {}) });
  const build = read.rowOfQuote === null ? built : { ...built, errors: atInputRows(built.errors, read.rowOfQuote), warnings: [...read.errors.map(skippedRow), ...atInputRows(built.warnings, read.rowOfQuote)] };
  if (!build.curve || build.errors.length > 0) return failed(build.errors);
  const curve = build.curve;
  const settlement = curve.settlement;
  const dc = opts.dayCount ?? curve.dayCount;
  const errors: CoreError[] = [];
  // Performance: plain loops, not flatMap and spreads (measured: they cost more than the
  // bootstrap itself in a batch).
  let finite = true;
  const dates = opts.at ? opts.at.map((p) => resolve(p, settlement)) : curve.pillars.map((p) => p.date);
  const points: PointOut[] = [];
  for (let i = 0; i < dates.length; i++) {
    const date = dates[i]!;
    const z = zeroOn(curve, date, opts.compounding, dc, opts.at ? `--at[${i}]` : `quotes[${curve.pillars[i]!.quote}]`);
    if (!z.ok) {
      errors.push(...z.errors);
      continue;
    }
    const v = z.value;
    finite &&= Number.isFinite(v.t) && Number.isFinite(v.discount) && Number.isFinite(v.zero);
    points.push(v.extrapolated ? { date, t: v.t, discount: v.discount, zero: v.zero, extrapolated: true } : { date, t: v.t, discount: v.discount, zero: v.zero });
  }
  const forwards: ForwardOut[] = [];
  for (let i = 0; i < opts.forward.length; i++) {
    const [s, e] = opts.forward[i]!;
    const f = forwardOn(curve, resolve(s, settlement), resolve(e, settlement), opts.compounding, dc, `--forward[${i}]`);
    if (!f.ok) {
      errors.push(...f.errors);
      continue;
    }
    const v = f.value;
    finite &&= Number.isFinite(v.tau) && Number.isFinite(v.rate);
    forwards.push(v.extrapolated ? { start: v.start, end: v.end, tau: v.tau, rate: v.rate, extrapolated: true } : { start: v.start, end: v.end, tau: v.tau, rate: v.rate });
  }
  const bonds = opts.bonds.flatMap((b, i) => {
    const input: BondInput = { ...b, maturity: resolve(b.maturity, settlement) };
    const a = analyzeBond(curve, input, undefined, `--bond[${i}]`);
    if (!a.ok) {
      errors.push(...a.errors);
      return [];
    }
    const v = a.value;
    const m = v.market;
    return [
      {
        maturity: v.bond.maturity,
        coupon: v.bond.coupon,
        frequency: v.bond.frequency,
        dayCount: v.bond.dayCount,
        yieldConvention: `ICMA, compounded ${v.bond.frequency}/yr, accrual ${v.bond.dayCount}`,
        modelCleanPrice: v.modelCleanPrice,
        modelDirtyPrice: v.modelDirtyPrice,
        accrued: v.accrued,
        yield: v.yield,
        macaulayDuration: v.macaulayDuration,
        modifiedDuration: v.modifiedDuration,
        convexity: v.convexity,
        dv01: v.dv01,
        effectiveDuration: v.effectiveDuration,
        keyRateDurations: Object.fromEntries(v.keyRateDurations.map((k) => [k.tenor, k.duration])),
        keyRateShift: `tent shifts of the cont zero (${curve.dayCount}) at the keys, central differences at +-${v.keyRateBumpBp} bp and +-${v.keyRateBumpBp / 2} bp, Richardson-combined`,
        ...(m
          ? {
              zSpread: m.zSpread,
              zSpreadConvention: `cont, ${curve.dayCount}`,
              ...(m.given === 'price' ? { yieldFromPrice: m.yield } : { priceFromYield: m.cleanPrice }),
              marketDirtyPrice: m.dirtyPrice,
              marketMacaulayDuration: m.macaulayDuration,
              marketModifiedDuration: m.modifiedDuration,
              marketConvexity: m.convexity,
              marketDv01: m.dv01,
            }
          : {}),
      },
    ];
  });
  for (const b of bonds) {
    for (const x of Object.values(b)) {
      if (typeof x === 'number') finite &&= Number.isFinite(x);
      else if (typeof x === 'object') finite &&= Object.values(x as Record<string, number>).every(Number.isFinite);
    }
  }
  const quotes = build.repricing.map((r): QuoteOut => {
    finite &&= Number.isFinite(r.t) && Number.isFinite(r.repricingError);
    return { index: read.rowOfQuote === null ? r.index : (read.rowOfQuote[r.index] ?? r.index), kind: r.kind, maturity: r.maturity, t: r.t, unit: r.unit, repricingError: r.repricingError };
  });
  if (!finite) {
    errors.push({ path: '', quote: null, code: 'no-solution', message: 'a result is not a finite number; check the quotes and the dates asked for' });
  }
  if (errors.length > 0) return failed(errors);
  return {
    line: builtDocumentLine({
      index,
      settlement,
      interpolation: curve.interpolation,
      curveDayCount: curve.dayCount,
      compounding: opts.compounding,
      rateDayCount: dc,
      extrapolation: curve.extrapolation,
      quotes,
      points,
      forwards,
      ...(opts.bonds.length > 0 ? { bonds } : {}),
      warnings: build.warnings,
    }),
    errors: [],
  };
}

/** Standard output is handed to `write` in pieces of about this many characters (see runCurveCommand). */
export const OUTPUT_CHUNK_CHARS = 1 << 16;

/**
 * The whole command, pure apart from reading the input through `read` and, when given, writing
 * standard output through `write`. Without `write` the output is returned in `stdout`; with it, the
 * output lines go to `write` in order, in pieces of about OUTPUT_CHUNK_CHARS as the documents are
 * built, and `stdout` is empty: a large batch never holds all of its output in memory.
 */
export function runCurveCommand(args: readonly string[], read: (file: string) => string, write?: (text: string) => void): CommandResult {
  const opts = parseArgs(args);
  if (typeof opts === 'string') return usage(opts);
  let text: string;
  try {
    text = read(opts.file);
  } catch (e) {
    return usage(`cannot read ${opts.file}: ${(e as Error).message}`);
  }
  let stdout = '';
  let stderr = '';
  let anyFailed = false;
  const documents = splitDocuments(text);
  for (let index = 0; index < documents.count; index++) {
    const entry = documents.entry(index);
    let line: string;
    let errors: readonly CoreError[];
    if ('error' in entry) {
      errors = [{ path: '', quote: null, code: 'invalid-json', message: entry.error }];
      line = failedLine(index, errors);
    } else {
      ({ line, errors } = runDocument(index, entry.doc, opts));
    }
    stdout += line + '\n';
    if (write && stdout.length >= OUTPUT_CHUNK_CHARS) {
      write(stdout);
      stdout = '';
    }
    if (errors.length > 0) {
      anyFailed = true;
      for (const e of errors) {
        const where = e.path && !e.message.startsWith(e.path) ? `${e.path}: ` : '';
        stderr += `document ${index}: ${where}${e.message} [${e.code}]\n`;
      }
    }
  }
  if (write && stdout !== '') {
    write(stdout);
    stdout = '';
  }
  return { stdout, stderr, status: anyFailed ? 1 : 0 };
}
