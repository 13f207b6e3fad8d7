import {
  OVERNIGHT_KIT,
  turnSpreads,
  quoteDates,
  moduleOf,
  analyzeBond,
  bondYieldConvention,
  rateTag,
  CurveBuilder,
  documentCapErrors,
  DAY_COUNTS,
  isDayCount,
  type BondInput,
  type Quote,
  type DayCount,
  COMPOUNDINGS,
  CURVE_DAY_COUNTS,
  EXTRAPOLATIONS,
  forwardOn,
  isCompounding,
  isCurveDayCount,
  isExtrapolation,
  isIsoDate,
  atInputRows,
  engineFromAnyDocument,
  parseTenor,
  resolveMarketDate,
  businessCalendar,
  closedWeekdays,
  compareIso,
  outsideCalendar,
  serialFromIso,
  type BusinessCalendar,
  BUILT_IN_CALENDARS,
  zeroOn,
  buildNamedCurves,
  discountedOnOf,
  readNamedCurves,
  DEFAULT_CURVE_NAME,
  type Curve,
  type CurveBuild,
  type Workspace,
  explained,
  explainBondFigure,
  bondFigureValue,
  bondLnWeights,
  topInfluencesOfLn,
  type BondFigure,
  type BondSide,
  type BondSink,
  type BondTrace,
  bootstrapInstruments,
  topQuoteInfluences,
  topQuoteInfluencesAcrossCurves,
  valueUnderEachMethod,
  type CurveWithQuotes,
  type BootstrapOutcome,
  type InterpolationId,
  type Result,
  type Explanation,
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
  /** The writer reported standard output closed (a reader such as `head` stopped): the command stopped there. */
  readonly outputClosed: boolean;
}

/**
 * The input: the whole text, or its text in pieces (any split, for example a file read 64 KB at a
 * time); lines are cut from the pieces as they come, so the input is never held whole.
 */
export type InputText = string | Iterable<string> | AsyncIterable<string>;

/**
 * Takes a piece of standard output. What it returns is awaited before the command goes on (how a
 * stream's back-pressure reaches the command); `false` (or a promise of it) says the output is
 * closed, and the command then stops at once and writes nothing more. Anything else goes on.
 */
export type OutputWriter = (text: string) => unknown;

/** The command's version: the package's (a test holds the two equal). */
export const COMMAND_VERSION = '0.1.0';

interface Options {
  file: string;
  at: string[] | null;
  forward: [string, string][];
  compounding: Compounding;
  dayCount: CurveDayCount | null;
  extrapolate: Extrapolation | null;
  skipInvalid: boolean;
  explain: boolean;
  bonds: BondSpec[];
  holidays: HolidayRequest[];
}

/** One `--holidays CALENDAR,FROM,TO`: the calendar read and the dates checked. */
interface HolidayRequest {
  readonly calendar: BusinessCalendar;
  readonly from: string;
  readonly to: string;
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
  'usage: npm run --silent curve -- FILE [--at D,...] [--forward S:E,...] [--compounding C] [--day-count DC] [--extrapolate none|flat-forward] [--skip-invalid] [--explain] [--bond MATURITY,COUPON,FREQUENCY,DAYCOUNT[,price=P|yield=Y]]...\n' +
  '       npm run --silent curve -- --holidays CALENDAR,FROM,TO [--holidays ...] [FILE]\n' +
  '       npm run --silent curve -- --help | --version\n' +
  '  FILE is a workspace JSON document or NDJSON, or - for standard input; dates are YYYY-MM-DD or tenors (3M, 2Y) from settlement\n' +
  '  --bond (repeatable) adds bond analytics off the curve: coupon and yield are decimals, price=P is clean per 100 face\n';

const HELP =
  'curve: builds a discount curve from each workspace document and prints one JSON line per document.\n' +
  USAGE +
  '  --at D,...            points to report (default: one per pillar); --at and --forward may be repeated and add up\n' +
  '  --forward S:E,...     forward rates from S to E\n' +
  `  --compounding C       ${COMPOUNDINGS.join(', ')} (default continuous)\n` +
  `  --day-count DC        ${CURVE_DAY_COUNTS.join(', ')} (default the curve's)\n` +
  `  --extrapolate E       ${EXTRAPOLATIONS.join(', ')} (default the document's)\n` +
  '  --skip-invalid        build from the valid quotes and list the others under warnings\n' +
  '  --explain             each point and forward carries an explain object: dates, year fractions, discount\n' +
  '                        factors read (node or interpolated, between which nodes), the steps, the five quotes\n' +
  '                        it depends on most (bp per bp) and its value under each interpolation method; on a\n' +
  '                        named curve the quotes may be of any curve it reads, each naming its curve\n' +
  '  --holidays C,FROM,TO  (repeatable; no FILE needed) one line per calendar with the weekdays from FROM to TO\n' +
  `                        it is closed: ${BUILT_IN_CALENDARS.join(', ')}, joined with + (a holiday in any)\n` +
  '  --help, -h            this text;  --version  the version\n' +
  '  Input: one JSON document (pretty-printed or not) or NDJSON (one document per line), read line by line;\n' +
  '  a leading byte-order mark is skipped. Options other than --at, --forward and --bond may be given once.\n' +
  '  Exit status: 0 every document built; 1 any failed (the others still print); 2 usage error, unreadable input\n' +
  '  or unwritable output. A closed standard output (such as `| head -1`) stops the command quietly: 0, or 1 when a\n' +
  '  document run before it failed.\n' +
  'An analysis aid, not investment advice: verify figures against official sources.\n';

const usage = (message: string): CommandResult => ({ stdout: '', stderr: `curve: ${message}\n${USAGE}`, status: 2, outputClosed: false });

const isPoint = (s: string): boolean => isIsoDate(s) || parseTenor(s) !== null;

/** Options that may be given once: a second one is refused rather than silently replacing the first. */
const SINGLE = ['--compounding', '--day-count', '--extrapolate', '--skip-invalid', '--explain'];

function parseArgs(args: readonly string[]): Options | { readonly show: 'help' | 'version' } | string {
  const opts: Options = { file: '', at: null, forward: [], compounding: 'continuous', dayCount: null, extrapolate: null, skipInvalid: false, explain: false, bonds: [], holidays: [] };
  const files: string[] = [];
  const given = new Set<string>();
  for (let i = 0; i < args.length; i++) {
    const arg = args[i]!;
    const eq = arg.startsWith('--') ? arg.indexOf('=') : -1;
    const name = eq > 0 ? arg.slice(0, eq) : arg;
    const takesValue = ['--at', '--forward', '--compounding', '--day-count', '--extrapolate', '--bond', '--holidays'].includes(name);
    let value: string | undefined;
    if (takesValue) {
      value = eq > 0 ? arg.slice(eq + 1) : args[++i];
      if (value === undefined) return `${name} needs a value`;
    }
    if (SINGLE.includes(name)) {
      if (given.has(name)) return `${name} is given twice; give it once (only --at, --forward and --bond add up)`;
      given.add(name);
    }
    switch (name) {
      case '--help':
      case '-h':
      case '--version':
        if (eq > 0) return `${name} takes no value`;
        return { show: name === '--version' ? 'version' : 'help' };
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
      case '--holidays': {
        const request = parseHolidays(value!);
        if (typeof request === 'string') return `--holidays "${value!.slice(0, 80)}": ${request}`;
        opts.holidays.push(request);
        break;
      }
      case '--skip-invalid':
        if (eq > 0) return '--skip-invalid takes no value';
        opts.skipInvalid = true;
        break;
      case '--explain':
        if (eq > 0) return '--explain takes no value';
        opts.explain = true;
        break;
      default:
        if (arg.startsWith('--') || (arg.startsWith('-') && arg !== '-')) return `unknown option ${arg}`;
        files.push(arg);
    }
  }
  if (files.length === 0 && opts.holidays.length > 0) return opts;
  if (files.length !== 1) return files.length === 0 ? 'give one FILE (or - for standard input)' : `give one FILE, not ${files.length}`;
  opts.file = files[0]!;
  return opts;
}

/** Parses CALENDAR,FROM,TO for --holidays; a message naming what is wrong and what would be valid. */
function parseHolidays(text: string): HolidayRequest | string {
  const parts = text.split(',').map((s) => s.trim());
  if (parts.length !== 3) return 'must be CALENDAR,FROM,TO, for example target,2026-01-01,2026-12-31';
  const [id, from, to] = parts as [string, string, string];
  const cal = businessCalendar(id);
  if (!cal.ok) return cal.message;
  for (const d of [from, to]) if (!isIsoDate(d)) return `"${String(d).slice(0, 20)}" is not a date YYYY-MM-DD`;
  if (compareIso(from, to) > 0) return `FROM ${from} is after TO ${to}`;
  const outside = outsideCalendar(cal.calendar, serialFromIso(from)) ?? outsideCalendar(cal.calendar, serialFromIso(to));
  if (outside !== null) return outside;
  return { calendar: cal.calendar, from, to };
}

/** The --holidays lines: one JSON object per request, `{"calendar", "from", "to", "holidays": [ISO dates]}`. */
const holidayLines = (requests: readonly HolidayRequest[]): string =>
  requests.map((r) => JSON.stringify({ calendar: r.calendar.id, from: r.from, to: r.to, holidays: closedWeekdays(r.calendar, r.from, r.to) }) + '\n').join('');

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

/**
 * Error lines kept for standard error (they are written at the end); past this many, the rest are
 * counted, not kept, so a batch of failing documents also runs in bounded memory. Every failed
 * document's errors are on its own standard output line in any case.
 */
export const MAX_ERROR_LINES = 10_000;

/** The longest document (one NDJSON line, or one pretty-printed document) read, in characters: 16 Mi. */
export const MAX_DOCUMENT_CHARS = 1 << 24;

/** A line longer than MAX_DOCUMENT_CHARS: only its length is kept. */
interface LongLine {
  readonly longChars: number;
}

/**
 * The input's lines, without their line ends (LF or CRLF), cut from the pieces as they come; a
 * byte-order mark at the very start is skipped (JSON text has none, editors often write one). A
 * line longer than MAX_DOCUMENT_CHARS is not kept: it comes as its length, so any input runs in
 * bounded memory.
 */
async function* inputLines(input: InputText): AsyncGenerator<string | LongLine> {
  let partial = '';
  let long = -1; // the length so far of an over-long line being skipped, -1 when none
  let atStart = true;
  const cut = (piece: string): string | LongLine => {
    if (long >= 0) {
      const longChars = long + piece.length;
      long = -1;
      return { longChars };
    }
    const line = partial === '' ? piece : partial + piece;
    partial = '';
    return line.endsWith('\r') ? line.slice(0, -1) : line;
  };
  for await (let chunk of typeof input === 'string' ? [input] : input) {
    if (atStart && chunk !== '') {
      atStart = false;
      if (chunk.charCodeAt(0) === 0xfeff) chunk = chunk.slice(1);
    }
    let start = 0;
    for (let nl = chunk.indexOf('\n'); nl >= 0; nl = chunk.indexOf('\n', start)) {
      if (long < 0 && partial.length + nl - start > MAX_DOCUMENT_CHARS) {
        long = partial.length;
        partial = '';
      }
      yield cut(chunk.slice(start, nl));
      start = nl + 1;
    }
    const rest = chunk.length - start;
    if (long >= 0) long += rest;
    else if (partial.length + rest > MAX_DOCUMENT_CHARS) {
      long = partial.length + rest;
      partial = '';
    } else if (rest > 0) partial += chunk.slice(start);
  }
  if (long >= 0 || partial !== '') yield cut('');
}

const isBlank = (line: string): boolean => line.trim() === '';

const shorten = (line: string): string => (line.length > 80 ? `${line.slice(0, 80)}...` : line);

const tooLong = (chars: number): string =>
  `the document is ${chars} characters long, more than the ${MAX_DOCUMENT_CHARS} read; a workspace document is far shorter: check that the input is JSON, one document per line (NDJSON) or a single document`;

/** Resolves a date or tenor against a settlement date (points were checked when the options were read). */
const resolve = (point: string, settlement: string): string => {
  const at = resolveMarketDate(settlement, point);
  return at.ok ? at.value : point;
};

/** The output line of a document that failed (without its newline). */
const failedLine = (index: number, errors: readonly CoreError[]): string => JSON.stringify({ index, errors });

/** A wrong row of a workbench document, left out under --skip-invalid, as the engine words a skipped quote. */
const skippedRow = (e: CoreError): CoreWarning => ({ path: e.path, quote: e.quote, code: 'skipped', message: `${e.message}; left out` });

/** A point's or forward's `explain` object: the core's explanation, the quotes behind it, the value under each method. */
export interface ExplainOut extends Explanation {
  /** A named curve's also name their curve (`curve`, first). */
  readonly topQuotes: readonly { curve?: string; index: number; kind: string; maturity: string; yieldLabel: string; bpPerBp: number }[];
  readonly methods: readonly { method: string; current: boolean; value: number | null; error: string | null }[];
}

/** Quote indices of an explanation re-pointed at the input's rows (a workbench document). */
const atRow = (rowOf: readonly number[] | null, index: number): number => (rowOf === null ? index : (rowOf[index] ?? index));

/** What every explanation of one document shares: its build, input rows and its curves under each method (built once, on first use). */
interface ExplainContext {
  readonly build: CurveBuild;
  readonly curve: Curve;
  readonly rowOf: readonly number[] | null;
  readonly curveFor: (method: InterpolationId) => BootstrapOutcome;
  /** A named curve's: every curve of the document built (its quotes may be any curve's), its name, and the default curve's input rows. */
  readonly across?: { readonly set: readonly CurveWithQuotes[]; readonly name: string; readonly rowOf: readonly number[] | null };
}

function explainContext(build: CurveBuild, curve: Curve, rowOf: readonly number[] | null): ExplainContext {
  const settings = { settlement: curve.settlement, dayCount: curve.dayCount, interpolation: curve.interpolation, extrapolation: curve.extrapolation };
  const byMethod = new Map<InterpolationId, BootstrapOutcome>();
  const curveFor = (method: InterpolationId): BootstrapOutcome => {
    let b = byMethod.get(method);
    if (!b) byMethod.set(method, (b = bootstrapInstruments({ ...settings, interpolation: method }, build.instruments)));
    return b;
  };
  return { build, curve, rowOf, curveFor };
}

/** The explanation of a rate over [start, end] with the quotes and methods behind it. */
function explainRate(x: ExplainContext, e: Explanation, start: string, end: string, c: Compounding, dc: CurveDayCount, read: (curve: Curve) => Result<number>): ExplainOut {
  const methods = valueUnderEachMethod(x.curve.interpolation, x.curveFor, read);
  return {
    ...e,
    reads: e.reads.map((r) => ({ ...r, nodes: r.nodes.map((n) => (n.quote === null ? n : { ...n, quote: atRow(x.rowOf, n.quote) })) })),
    topQuotes: x.across ? topAcross(x.across, start, end, c, dc) : topOwn(x, start, end, c, dc),
    methods: methods.map((m) => ({ method: m.method, current: m.current, value: m.value, error: m.error })),
  };
}

/** The default curve's top quotes: its own (it reads no other curve). */
function topOwn(x: ExplainContext, start: string, end: string, c: Compounding, dc: CurveDayCount): ExplainOut['topQuotes'] {
  const top = topQuoteInfluences(x.curve, x.build.instruments, start, end, c, dc);
  return top.ok ? top.value.map((q) => ({ ...q, index: atRow(x.rowOf, q.index) })) : [];
}

/** A named curve's top quotes across every curve it reads, each naming its curve (a default-curve quote by its input row). */
function topAcross(a: NonNullable<ExplainContext['across']>, start: string, end: string, c: Compounding, dc: CurveDayCount): ExplainOut['topQuotes'] {
  const top = topQuoteInfluencesAcrossCurves(a.set, a.name, start, end, c, dc);
  return top.ok ? top.value.map((q) => ({ ...q, index: q.curve === DEFAULT_CURVE_NAME ? atRow(a.rowOf, q.index) : q.index })) : [];
}

/** `explain` of a point: its zero rate (whose read is the discount factor) explained. */
function explainPoint(x: ExplainContext, date: string, given: string, c: Compounding, dc: CurveDayCount): ExplainOut | null {
  const z = explained((sink) => zeroOn(x.curve, date, c, dc, 'date', sink), { date: given });
  if (!z.ok) return null; // not reached: the same query has just succeeded
  return explainRate(x, z.value.explanation, x.curve.settlement, date, c, dc, (other) => {
    const r = zeroOn(other, date, c, dc);
    return r.ok ? { ok: true, value: r.value.zero } : r;
  });
}

/** `explain` of a forward. */
function explainForward(x: ExplainContext, start: string, end: string, givenStart: string, givenEnd: string, c: Compounding, dc: CurveDayCount): ExplainOut | null {
  const f = explained((sink) => forwardOn(x.curve, start, end, c, dc, 'forward', sink), { start: givenStart, end: givenEnd });
  if (!f.ok) return null; // not reached: the same query has just succeeded
  return explainRate(x, f.value.explanation, start, end, c, dc, (other) => {
    const r = forwardOn(other, start, end, c, dc);
    return r.ok ? { ok: true, value: r.value.rate } : r;
  });
}

/** The bond output's fields that --explain explains, with the figure and column of the bond table each is. */
const BOND_EXPLAINED: readonly (readonly [string, BondFigure, BondSide])[] = [
  ['modelCleanPrice', 'clean', 'model'],
  ['modelDirtyPrice', 'dirty', 'model'],
  ['accrued', 'accrued', 'model'],
  ['yield', 'yield', 'model'],
  ['macaulayDuration', 'macaulayDuration', 'model'],
  ['modifiedDuration', 'modifiedDuration', 'model'],
  ['convexity', 'convexity', 'model'],
  ['dv01', 'dv01', 'model'],
  ['priceFromYield', 'clean', 'market'],
  ['marketDirtyPrice', 'dirty', 'market'],
  ['yieldFromPrice', 'yield', 'market'],
  ['marketMacaulayDuration', 'macaulayDuration', 'market'],
  ['marketModifiedDuration', 'modifiedDuration', 'market'],
  ['marketConvexity', 'convexity', 'market'],
  ['marketDv01', 'dv01', 'market'],
];

/**
 * A bond's `explain` object: each printed figure's explanation (from analyzeBond's own trace), the
 * quotes it depends on most (per bp of each quote's own yield; `topQuotesOf` says of what) and its
 * value under each method. The z-spread (printed as a decimal) is explained in the workbench, in bp.
 */
function explainBond(x: ExplainContext, trace: BondTrace, input: BondInput, out: Readonly<Record<string, unknown>>): Record<string, ExplainOut> {
  const r: Record<string, ExplainOut> = {};
  for (const [key, figure, side] of BOND_EXPLAINED) {
    const e = typeof out[key] === 'number' ? explainBondFigure(trace, figure, side) : null;
    if (!e?.ok) continue;
    const w = bondLnWeights(trace, figure, side);
    const top = w ? topInfluencesOfLn(x.curve, x.build.instruments, w.times, w.weights) : null;
    const methods = w
      ? valueUnderEachMethod(x.curve.interpolation, x.curveFor, (c) => {
          const a = analyzeBond(c, input);
          return a.ok ? { ok: true, value: bondFigureValue(a.value, figure, side)! } : a;
        })
      : [];
    r[key] = {
      ...e.value,
      reads: e.value.reads.map((rd) => ({ ...rd, nodes: rd.nodes.map((n) => (n.quote === null ? n : { ...n, quote: atRow(x.rowOf, n.quote) })) })),
      topQuotes: top?.ok ? top.value.map((q) => ({ ...q, index: atRow(x.rowOf, q.index) })) : [],
      ...(w ? { topQuotesOf: w.note } : {}),
      methods: methods.map((m) => ({ method: m.method, current: m.current, value: m.value, error: m.error })),
    };
  }
  return r;
}

/** Runs one document; returns its output line (without the newline) and its errors (none when it built). */
function runDocument(index: number, input: unknown, opts: Options, builder: CurveBuilder): { line: string; errors: readonly CoreError[] } {
  const capped = documentCapErrors(input);
  if (capped.length > 0) return { line: failedLine(index, capped), errors: capped };
  // A workbench document (quote cells as typed) is read as the workbench reads it; engine
  // positions in messages are re-pointed at its rows.
  const read = engineFromAnyDocument(input);
  const failed = (errors: readonly CoreError[]) => ({ line: failedLine(index, errors), errors });
  if (read.errors.length > 0 && !opts.skipInvalid) return failed(read.errors);
  const built = builder.build(read.doc, { skipInvalid: opts.skipInvalid, overnight: OVERNIGHT_KIT, ...(opts.extrapolate ? { extrapolation: opts.extrapolate } : {}), readCurves: readNamedCurves });
  const build = read.rowOfQuote === null ? built : { ...built, errors: atInputRows(built.errors, read.rowOfQuote), warnings: [...(read.warnings ?? []), ...read.errors.map(skippedRow), ...atInputRows(built.warnings, read.rowOfQuote)] };
  if (!build.curve || build.errors.length > 0) return failed(build.errors);
  const curve = build.curve;
  const settlement = curve.settlement;
  const dc = opts.dayCount ?? curve.dayCount;
  const errors: CoreError[] = [];
  // Performance: plain loops, not flatMap and spreads (measured: they cost more than the
  // bootstrap itself in a batch).
  let finite = true;
  const at = opts.at;
  const pillars = curve.pillars;
  const count = at ? at.length : pillars.length;
  const points: PointOut[] = [];
  const x = opts.explain ? explainContext(build, curve, read.rowOfQuote) : null;
  for (let i = 0; i < count; i++) {
    const date = at ? resolve(at[i]!, settlement) : pillars[i]!.date;
    // Performance: the query's path names it only in an error, so it is spelled out only then.
    let z = zeroOn(curve, date, opts.compounding, dc, '');
    if (!z.ok) z = zeroOn(curve, date, opts.compounding, dc, at ? `--at[${i}]` : `quotes[${pillars[i]!.quote}]`);
    if (!z.ok) {
      errors.push(...z.errors);
      continue;
    }
    const v = z.value;
    finite &&= Number.isFinite(v.t) && Number.isFinite(v.discount) && Number.isFinite(v.zero);
    const point: PointOut = v.extrapolated ? { date, t: v.t, discount: v.discount, zero: v.zero, extrapolated: true } : { date, t: v.t, discount: v.discount, zero: v.zero };
    const explain = x ? explainPoint(x, date, at ? at[i]! : date, opts.compounding, dc) : null;
    points.push(explain ? { ...point, explain } : point);
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
    const forward: ForwardOut = v.extrapolated ? { start: v.start, end: v.end, tau: v.tau, rate: v.rate, extrapolated: true } : { start: v.start, end: v.end, tau: v.tau, rate: v.rate };
    const explain = x ? explainForward(x, v.start, v.end, s, e, opts.compounding, dc) : null;
    forwards.push(explain ? { ...forward, explain } : forward);
  }
  const bondExplains: { trace: BondTrace; input: BondInput }[] = [];
  const bonds = opts.bonds.flatMap((b, i) => {
    const input: BondInput = { ...b, maturity: resolve(b.maturity, settlement) };
    const sink: BondSink = {};
    const a = analyzeBond(curve, input, undefined, `--bond[${i}]`, x ? sink : undefined);
    if (sink.trace) bondExplains.push({ trace: sink.trace, input });
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
        yieldConvention: bondYieldConvention(v.bond.frequency, v.bond.dayCount),
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
              zSpreadConvention: rateTag('continuous', curve.dayCount),
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
  // With --explain, each bond explains its figures (after the finiteness check, which reads numbers only).
  const bondsOut = x ? bonds.map((b, i) => ({ ...b, explain: explainBond(x, bondExplains[i]!.trace, bondExplains[i]!.input, b) })) : bonds;
  const repricing = build.repricing;
  const rowOf = read.rowOfQuote;
  const quotes: QuoteOut[] = [];
  // The validated quotes by index (plain array: a Map per document cost measurably in a batch).
  const quoteAt: Quote[] = [];
  for (const q of build.workspace?.quotes ?? []) quoteAt[q.index] = q;
  for (let i = 0; i < repricing.length; i++) {
    const r = repricing[i]!;
    finite &&= Number.isFinite(r.t) && Number.isFinite(r.repricingError);
    const q = quoteAt[r.index];
    // Performance: a kind without dates of its own starts on the valuation date and ends at its maturity (no object made).
    const d = q && moduleOf(q).dates !== undefined ? quoteDates(q, settlement) : null;
    const out: QuoteOut = {
      index: rowOf === null ? r.index : (rowOf[r.index] ?? r.index), kind: r.kind, maturity: r.maturity, t: r.t, unit: r.unit, repricingError: r.repricingError,
      start: d ? d.start : settlement, end: d ? d.end : (q?.maturity ?? r.maturity), pillar: r.maturity, payment: d ? d.payment : null,
    };
    quotes.push(d?.fixing === undefined ? out : { ...out, fixing: d.fixing });
  }
  if (!finite) {
    errors.push({ path: '', quote: null, code: 'no-solution', message: 'a result is not a finite number; check the quotes and the dates asked for' });
  }
  if (errors.length > 0) return failed(errors);
  const named = build.workspace?.curves === undefined ? null : namedCurveOutput(build.workspace, build, read.rowOfQuote, opts);
  if (named !== null && !named.ok) return failed(named.errors);
  return {
    line: builtDocumentLine({
      index,
      settlement,
      valuationDate: settlement,
      interpolation: curve.interpolation,
      curveDayCount: curve.dayCount,
      compounding: opts.compounding,
      rateDayCount: dc,
      extrapolation: curve.extrapolation,
      quotes,
      points,
      forwards,
      ...(opts.bonds.length > 0 ? { bonds: bondsOut } : {}),
      ...turnsOutput(build, read.rowOfQuote),
      warnings: build.warnings,
      ...(named !== null ? { curves: named.value } : {}),
    }),
    errors: [],
  };
}

/**
 * The document's turns with the spread each took on the built curve, printed when one of them is
 * solved from a quote (`solveFrom`), so a batch user can read the solved size: each turn's name,
 * dates, `spreadBp` (bp, simple ACT/360, added to each of its days' overnight rate) and, when
 * solved, `solvedFrom`, the quote's index (as the quotes' own `index`). Absent otherwise, so a
 * document with set spreads prints as before.
 */
function turnsOutput(build: CurveBuild, rowOf: readonly number[] | null): { turns?: readonly object[] } {
  const turns = build.workspace?.turns;
  if (!turns?.some((t) => typeof t.solveFrom === 'number')) return {};
  const spreads = new Map(turnSpreads(build).map((s) => [s.index, s.spreadBp]));
  return {
    turns: turns.map((t, i) => ({
      name: t.name,
      from: t.from,
      to: t.to,
      spreadBp: spreads.get(i) ?? t.spreadBp ?? null,
      ...(typeof t.solveFrom === 'number' ? { solvedFrom: atRow(rowOf, t.solveFrom) } : {}),
    })),
  };
}

/**
 * The named curves of a document (`curves`), built after its default curve, each printed under its
 * name: its role (and a projection curve's index and discounting curve), its settings, its quotes
 * repriced, its points (the `--at` dates, or its pillars) and `--forward` rates in the asked
 * compounding and day count, its warnings. `--bond` is priced on the default curve only. An error
 * of any curve fails the document, its path and message naming the curve.
 */
function namedCurveOutput(ws: Workspace, defaultBuild: CurveBuild, rowOf: readonly number[] | null, opts: Options): { ok: true; value: Record<string, object> } | { ok: false; errors: readonly CoreError[] } {
  const value: Record<string, object> = {};
  const errors: CoreError[] = [];
  const builds = buildNamedCurves(ws, defaultBuild.curve, opts.extrapolate ? { skipInvalid: opts.skipInvalid, extrapolation: opts.extrapolate } : { skipInvalid: opts.skipInvalid });
  // Every curve built, by name, for the quotes behind a named curve's numbers (--explain): they may be any curve's.
  const set: CurveWithQuotes[] = [{ name: DEFAULT_CURVE_NAME, curve: defaultBuild.curve!, instruments: defaultBuild.instruments }];
  for (const n of builds) if (n.build.curve && n.build.errors.length === 0) set.push({ name: n.name, curve: n.build.curve, instruments: n.build.instruments });
  for (const n of [...builds].sort((a, b) => position(ws, a.name) - position(ws, b.name))) {
    const b: CurveBuild = n.build;
    if (!b.curve || b.errors.length > 0) {
      errors.push(...b.errors);
      continue;
    }
    const curve = b.curve;
    const where = `curves[${position(ws, n.name)}]`;
    const dc = opts.dayCount ?? curve.dayCount;
    const located = (es: readonly CoreError[]) => es.map((e) => ({ ...e, path: `${where}.${e.path}`, message: `${where} "${n.name}": ${e.message}` }));
    const x = opts.explain ? { ...explainContext(b, curve, null), across: { set, name: n.name, rowOf } } : null;
    const points: PointOut[] = [];
    const count = opts.at ? opts.at.length : curve.pillars.length;
    for (let i = 0; i < count; i++) {
      const date = opts.at ? resolve(opts.at[i]!, ws.settlement) : curve.pillars[i]!.date;
      const z = zeroOn(curve, date, opts.compounding, dc, opts.at ? `--at[${i}]` : `quotes[${curve.pillars[i]!.quote}]`);
      if (!z.ok) errors.push(...located(z.errors));
      else {
        const point: PointOut = z.value.extrapolated ? { date, t: z.value.t, discount: z.value.discount, zero: z.value.zero, extrapolated: true } : { date, t: z.value.t, discount: z.value.discount, zero: z.value.zero };
        const explain = x ? explainPoint(x, date, opts.at ? opts.at[i]! : date, opts.compounding, dc) : null;
        points.push(explain ? { ...point, explain } : point);
      }
    }
    const forwards: ForwardOut[] = [];
    for (let i = 0; i < opts.forward.length; i++) {
      const [s, e] = opts.forward[i]!;
      const f = forwardOn(curve, resolve(s, ws.settlement), resolve(e, ws.settlement), opts.compounding, dc, `--forward[${i}]`);
      if (!f.ok) errors.push(...located(f.errors));
      else {
        const forward: ForwardOut = f.value.extrapolated ? { start: f.value.start, end: f.value.end, tau: f.value.tau, rate: f.value.rate, extrapolated: true } : { start: f.value.start, end: f.value.end, tau: f.value.tau, rate: f.value.rate };
        const explain = x ? explainForward(x, f.value.start, f.value.end, s, e, opts.compounding, dc) : null;
        forwards.push(explain ? { ...forward, explain } : forward);
      }
    }
    const quoteAt: Quote[] = [];
    for (const q of b.workspace?.quotes ?? []) quoteAt[q.index] = q;
    // Which curve discounted each quote (a swap's discounting curve; null for a quote fixing its own curve's ratio).
    const discountedOn: (string | null)[] = [];
    for (const ins of b.instruments) discountedOn[ins.index] = discountedOnOf(ins);
    const quotes: (QuoteOut & { discountedOn: string | null })[] = b.repricing.map((r) => {
      const q = quoteAt[r.index];
      const d = q && moduleOf(q).dates !== undefined ? quoteDates(q, ws.settlement) : null;
      return { index: r.index, kind: r.kind, maturity: r.maturity, t: r.t, unit: r.unit, repricingError: r.repricingError, start: d ? d.start : ws.settlement, end: d ? d.end : (q?.maturity ?? r.maturity), pillar: r.maturity, payment: d ? d.payment : null, discountedOn: discountedOn[r.index] ?? null };
    });
    const numbers = [...points.flatMap((p) => [p.t, p.discount, p.zero]), ...forwards.flatMap((f) => [f.tau, f.rate]), ...quotes.flatMap((q) => [q.t, q.repricingError])];
    if (!numbers.every(Number.isFinite)) errors.push({ path: where, quote: null, code: 'no-solution', message: `${where} "${n.name}": a result is not a finite number; check its quotes and the dates asked for` });
    value[n.name] = {
      role: n.role,
      ...(n.index !== null ? { index: n.index, discountCurve: n.discountCurve } : {}),
      interpolation: curve.interpolation,
      curveDayCount: curve.dayCount,
      compounding: opts.compounding,
      rateDayCount: dc,
      extrapolation: curve.extrapolation,
      quotes: quotes.map(({ payment, ...q }) => (payment === null ? q : { ...q, payment })),
      points,
      forwards,
      warnings: b.warnings,
    };
  }
  return errors.length > 0 ? { ok: false, errors } : { ok: true, value };
}

/** A named curve's position in the document's `curves` array. */
const position = (ws: Workspace, name: string): number => ws.curves!.find((c) => c.name === name)!.position;

/** Standard output is handed to `write` in pieces of about this many characters (see runCurveCommand). */
export const OUTPUT_CHUNK_CHARS = 1 << 16;

/**
 * The whole command, pure apart from reading the input through `read` and, when given, writing
 * standard output through `write`.
 *
 * Input: `read(FILE)` gives the text whole or in pieces; it is read line by line as the documents
 * are built. A single JSON document may span lines (pretty-printed): when the first non-blank line
 * is not JSON on its own, lines are gathered (up to MAX_DOCUMENT_CHARS) and, when the input ends
 * there and they parse together, they are that one document; otherwise every non-blank line is a
 * document (NDJSON), as before.
 *
 * Output: without `write` it is returned in `stdout`; with it, the output lines go to `write` in
 * order, in pieces of about OUTPUT_CHUNK_CHARS as the documents are built, each awaited before the
 * next document (so a slow reader slows the command instead of filling memory), and `stdout` is
 * empty. When `write` reports the output closed, the command stops there: nothing more is built or
 * written; the status covers the documents run so far.
 */
export async function runCurveCommand(args: readonly string[], read: (file: string) => InputText, write?: OutputWriter): Promise<CommandResult> {
  const opts = parseArgs(args);
  if (typeof opts === 'string') return usage(opts);
  if ('show' in opts) {
    const text = opts.show === 'help' ? HELP : `curve (Tenorscope) ${COMMAND_VERSION}\n`;
    if (!write) return { stdout: text, stderr: '', status: 0, outputClosed: false };
    try {
      return { stdout: '', stderr: '', status: 0, outputClosed: (await write(text)) === false };
    } catch (e) {
      return { stdout: '', stderr: `curve: cannot write standard output: ${(e as Error).message}\n`, status: 2, outputClosed: true };
    }
  }
  if (opts.holidays.length > 0) {
    const lines = holidayLines(opts.holidays);
    if (opts.file === '') {
      if (!write) return { stdout: lines, stderr: '', status: 0, outputClosed: false };
      try {
        return { stdout: '', stderr: '', status: 0, outputClosed: (await write(lines)) === false };
      } catch (e) {
        return { stdout: '', stderr: `curve: cannot write standard output: ${(e as Error).message}\n`, status: 2, outputClosed: true };
      }
    }
  }
  let input: InputText;
  try {
    input = read(opts.file);
  } catch (e) {
    return usage(`cannot read ${opts.file}: ${(e as Error).message}`);
  }
  // One builder for the run: documents of one market at other quotes (a batch of days or
  // scenarios) re-quote its compiled instruments instead of compiling them again.
  const builder = new CurveBuilder();
  let stdout = '';
  let stderr = '';
  let errorLines = 0;
  let anyFailed = false;
  let index = 0;
  let closed = false;
  let writeFailure: unknown = null;
  // --holidays lines come before the documents' lines (the documents' pieces follow them).
  if (opts.holidays.length > 0) stdout = holidayLines(opts.holidays);
  /** Hands a piece to the writer; a writer that throws counts as an output that cannot be written. */
  const put = async (text: string): Promise<void> => {
    try {
      if ((await write!(text)) === false) closed = true;
    } catch (e) {
      writeFailure = e;
      closed = true;
    }
  };

  /** Runs one document (parsed, or the error that stands for it) and queues its line; false once the output is closed. */
  const emit = async (entry: { readonly doc: unknown } | { readonly error: string; readonly code: CoreError['code'] }): Promise<boolean> => {
    let line: string;
    let errors: readonly CoreError[];
    if ('error' in entry) {
      errors = [{ path: '', quote: null, code: entry.code, message: entry.error }];
      line = failedLine(index, errors);
    } else {
      ({ line, errors } = runDocument(index, entry.doc, opts, builder));
    }
    stdout += line + '\n';
    if (errors.length > 0) {
      anyFailed = true;
      for (const e of errors) {
        if (++errorLines > MAX_ERROR_LINES) continue;
        const where = e.path && !e.message.startsWith(e.path) ? `${e.path}: ` : '';
        stderr += `document ${index}: ${where}${e.message} [${e.code}]\n`;
      }
    }
    index++;
    if (write && stdout.length >= OUTPUT_CHUNK_CHARS) {
      const piece = stdout;
      stdout = '';
      await put(piece);
    }
    return !closed;
  };
  /** One NDJSON line: its document, or invalid-json / an over-long line. */
  const emitLine = (line: string | LongLine): Promise<boolean> => {
    if (typeof line !== 'string') return emit({ error: tooLong(line.longChars), code: 'range' });
    let doc: unknown;
    try {
      doc = JSON.parse(line);
    } catch (e) {
      return emit({ error: `not valid JSON (${(e as Error).message}): ${shorten(line)}`, code: 'invalid-json' });
    }
    return emit({ doc });
  };
  /** The gathered lines of what may be one pretty-printed document, while it may still be one. */
  let gathered: string[] | null = null;
  let gatheredChars = 0;
  const emitGathered = async (): Promise<boolean> => {
    const lines = gathered ?? [];
    gathered = null;
    for (const line of lines) if (!isBlank(line) && !(await emitLine(line))) return false;
    return true;
  };
  let first = true;
  // The lines are pulled by hand so that only a failure to read is reported as one (an exception
  // from building a document is a bug and is not dressed up as a reading error).
  const lines = inputLines(input);
  try {
    for (;;) {
      let next: IteratorResult<string | LongLine>;
      try {
        next = await lines.next();
      } catch (e) {
        if (write && stdout !== '' && !closed) await put(stdout);
        return { stdout: write ? '' : stdout, stderr: `${stderr}curve: cannot read ${opts.file}: ${(e as Error).message}\n`, status: 2, outputClosed: closed };
      }
      if (next.done) break;
      const line = next.value;
      if (typeof line === 'string' && isBlank(line)) {
        if (gathered) {
          gathered.push(line);
          gatheredChars += line.length + 1;
          if (gatheredChars > MAX_DOCUMENT_CHARS && !(await emitGathered())) break;
        }
        continue;
      }
      if (first) {
        first = false;
        if (typeof line === 'string') {
          let doc: unknown;
          let parsed = true;
          try {
            doc = JSON.parse(line);
          } catch {
            parsed = false;
          }
          if (!parsed) {
            gathered = [line];
            gatheredChars = line.length;
            continue;
          }
          if (!(await emit({ doc }))) break;
          continue;
        }
      }
      if (gathered) {
        if (typeof line === 'string' && gatheredChars + line.length + 1 <= MAX_DOCUMENT_CHARS) {
          gathered.push(line);
          gatheredChars += line.length + 1;
          continue;
        }
        if (!(await emitGathered())) break; // too long for one document: the lines are NDJSON
      }
      if (!(await emitLine(line))) break;
    }
  } finally {
    if (closed) await lines.return(undefined).catch(() => undefined); // stopped early: let the source close
  }
  if (!closed && gathered) {
    let doc: unknown;
    let parsed = true;
    try {
      doc = JSON.parse((gathered as string[]).join('\n'));
    } catch {
      parsed = false;
    }
    if (parsed) {
      gathered = null;
      await emit({ doc });
    } else await emitGathered();
  }
  if (!closed && index === 0) await emit({ error: 'the input is empty; give a workspace JSON document', code: 'invalid-json' });
  if (write && stdout !== '' && !closed) {
    await put(stdout);
    stdout = '';
  }
  if (errorLines > MAX_ERROR_LINES) {
    stderr += `curve: ${errorLines - MAX_ERROR_LINES} more error lines not shown here (${MAX_ERROR_LINES} shown); each failed document's errors are on its line of standard output\n`;
  }
  if (writeFailure !== null) {
    const why = writeFailure instanceof Error ? writeFailure.message : String(writeFailure);
    return { stdout: '', stderr: `${stderr}curve: cannot write standard output: ${why}\n`, status: 2, outputClosed: true };
  }
  return { stdout: closed ? '' : stdout, stderr, status: anyFailed ? 1 : 0, outputClosed: closed };
}
