// The curve command's document fuzzer: random and mutated workspace documents, written out in
// random ways (compact, pretty-printed, CRLF, a byte-order mark, cut short, a character changed,
// several to a batch), with random options, through runCurveCommand; and the checks every run must
// pass. Used by test/cli/documentFuzz.test.ts (a fixed seed, in the test suite) and by
// test/tools/fuzz-curve.ts (longer runs, by hand). Every document is invented test data.
import fc from 'fast-check';
import { runCurveCommand, type CommandResult } from '../../src/cli/curveCommand.ts';
import { INVENTED_2027, workspaceDoc, type Quote } from '../helpers/markets.ts';

const Q = INVENTED_2027;
/** Starting markets (invented): short, mixed and long, every quote kind. */
const MARKETS: readonly (readonly Quote[])[] = [
  [Q.depo3M, Q.swap2Y],
  [Q.depo1M, Q.bill6M, Q.zero1Y, Q.swap5Y],
  [Q.depo3M, Q.zero1YRate, Q.bond2031Yield, Q.swap30Y],
  [Q.depo6M, Q.bond2029, Q.bond2034],
];
const INTERPOLATIONS = ['linear-zero', 'log-linear-discount', 'cubic-zero', 'monotone-convex', 'monotone-convex-positive'];
const DAY_COUNTS = ['ACT/360', 'ACT/365F', '30/360', '30/360-US', '30E/360', 'ACT/ACT-ISDA', 'ACT/ACT-ICMA', '30E/360-ISDA'];
const QUOTE_FIELDS = ['kind', 'tenor', 'maturity', 'rate', 'price', 'cleanPrice', 'yield', 'coupon', 'frequency', 'dayCount', 'discountYield', 'compounding', 'eom', 'enabled', 'spread'];
const TOP_FIELDS = ['format', 'version', 'settlement', 'curve', 'quotes', 'note', 'scenarios', 'view', 'extra'];
const CURVE_FIELDS = ['dayCount', 'interpolation', 'extrapolation', 'other'];

/** Values a field may be set to: plausible, edge and absurd. */
const wild: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(0, -0, 1, -1, 0.5, 0.031, -0.01, 2, 12, 100, 99.5, 150, 1e308, -1e308, 5e-324, 1e-12, 0.9999999999),
  fc.double(),
  fc.integer({ min: -5, max: 400 }),
  fc.constantFrom('3M', '0M', '1W', '50Y', '2Y6M', '12M', '-1Y', '2027-02-29', '2028-02-29', '2027-03-10', '2027-03-09', '2099-12-31', '1900-01-01', '2027-13-01', ''),
  fc.constantFrom(...INTERPOLATIONS, ...DAY_COUNTS, 'none', 'flat-forward', 'deposit', 'bill', 'zero', 'bond', 'swap', 'future', 'annual', 'continuous', 'tenorscope-workspace'),
  fc.constantFrom(null, true, false, [], {}, 'x'.repeat(3000), '\u0000', '"\\', '\uD800'),
  fc.jsonValue({ maxDepth: 2 }),
);

type Doc = Record<string, unknown>;
type Edit =
  | { readonly op: 'set-top'; readonly field: string; readonly value: unknown }
  | { readonly op: 'set-curve'; readonly field: string; readonly value: unknown }
  | { readonly op: 'set-quote'; readonly quote: number; readonly field: string; readonly value: unknown }
  | { readonly op: 'drop-quote' | 'copy-quote'; readonly quote: number }
  | { readonly op: 'delete-top'; readonly field: string };

const edit: fc.Arbitrary<Edit> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ op: fc.constant('set-quote' as const), quote: fc.nat(7), field: fc.constantFrom(...QUOTE_FIELDS), value: wild }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant('set-top' as const), field: fc.constantFrom(...TOP_FIELDS), value: wild }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant('set-curve' as const), field: fc.constantFrom(...CURVE_FIELDS), value: wild }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constantFrom('drop-quote' as const, 'copy-quote' as const), quote: fc.nat(7) }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant('delete-top' as const), field: fc.constantFrom(...TOP_FIELDS) }) },
);

function applyEdits(doc: Doc, edits: readonly Edit[]): Doc {
  for (const e of edits) {
    const quotes = doc.quotes as Doc[];
    if (e.op === 'set-top') doc[e.field] = e.value;
    else if (e.op === 'delete-top') delete doc[e.field];
    else if (e.op === 'set-curve') {
      if (doc.curve && typeof doc.curve === 'object') (doc.curve as Doc)[e.field] = e.value;
    } else if (Array.isArray(quotes) && quotes.length > 0) {
      const i = e.quote % quotes.length;
      if (e.op === 'set-quote') {
        if (quotes[i] && typeof quotes[i] === 'object') quotes[i]![e.field] = e.value;
      } else if (e.op === 'drop-quote') quotes.splice(i, 1);
      else quotes.push(structuredClone(quotes[i]!));
    }
  }
  return doc;
}

/** A workspace document: a starting market, its settings drawn, then up to four edits (none two times in three). */
export const documentValue: fc.Arbitrary<unknown> = fc.oneof(
  {
    weight: 12,
    arbitrary: fc
      .record({
        market: fc.nat(MARKETS.length - 1),
        interpolation: fc.constantFrom(...INTERPOLATIONS),
        dayCount: fc.constantFrom('ACT/365F', 'ACT/360', '30/360', 'ACT/ACT-ISDA'),
        extrapolation: fc.constantFrom(undefined, 'none', 'flat-forward'),
        shift: fc.double({ min: -0.03, max: 0.03, noNaN: true }),
        edits: fc.oneof({ weight: 2, arbitrary: fc.constant([] as Edit[]) }, { weight: 1, arbitrary: fc.array(edit, { minLength: 1, maxLength: 4 }) }),
      })
      .map(({ market, interpolation, dayCount, extrapolation, shift, edits }) => {
        const quotes = MARKETS[market]!.map((q) => (typeof q.rate === 'number' ? { ...q, rate: q.rate + shift } : q));
        const doc = workspaceDoc(quotes, { interpolation, dayCount, ...(extrapolation ? { extrapolation } : {}) }) as unknown as Doc;
        return applyEdits(structuredClone(doc), edits);
      }),
  },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
);

/** One document's text: compact, or pretty when `pretty`; sometimes damaged (cut short, a character inserted or removed). */
const documentText = (pretty: boolean): fc.Arbitrary<string> =>
  fc
  .record({
    doc: documentValue,
    pretty: pretty ? fc.constantFrom(0, 2, '\t') : fc.constant(0),
    damage: fc.oneof(
      { weight: 8, arbitrary: fc.constant(null) },
      { weight: 1, arbitrary: fc.tuple(fc.constantFrom('cut', 'insert', 'remove'), fc.nat(), fc.constantFrom('"', '{', '}', ',', ':', '\\', '\n', '\r', '\uFEFF', 'x', '0', ' ', '\u2028', '\uD83D')) },
    ),
  })
  .map(({ doc, pretty, damage }) => {
    let text = JSON.stringify(doc, null, pretty === 0 ? undefined : pretty) ?? 'null';
    if (damage) {
      const [how, where, ch] = damage;
      const at = where % (text.length + 1);
      text = how === 'cut' ? text.slice(0, at) : how === 'insert' ? text.slice(0, at) + ch + text.slice(at) : text.slice(0, at) + text.slice(at + 1);
    }
    return text;
  });

/** The command's input: one document (compact or pretty), or now and then a batch of two to four (NDJSON), with LF or CRLF, a byte-order mark now and then, blank lines. */
export const inputText: fc.Arbitrary<string> = fc
  .record({
    texts: fc.oneof({ weight: 5, arbitrary: documentText(true).map((t) => [t]) }, { weight: 1, arbitrary: fc.array(documentText(false), { minLength: 2, maxLength: 4 }) }),
    crlf: fc.boolean(),
    bom: fc.constantFrom(false, false, false, true),
    blank: fc.constantFrom(false, false, true),
    finalNewline: fc.boolean(),
  })
  .map(({ texts, crlf, bom, blank, finalNewline }) => {
    const nl = crlf ? '\r\n' : '\n';
    return (bom ? '\uFEFF' : '') + texts.join(blank ? nl + nl : nl) + (finalNewline ? nl : '');
  });

/** A point for --at: mostly on the curves above, now and then before settlement or beyond the last pillar. */
const point = fc.oneof(
  { weight: 8, arbitrary: fc.constantFrom('1M', '3M', '1Y', '2Y', '2027-06-10', '2028-02-29', '2029-02-28') },
  { weight: 1, arbitrary: fc.constantFrom('5Y', '10Y', '40Y', '2026-01-01', '2100-01-01') },
);
/** A START:END pair for --forward, the same way. */
const period = fc.oneof(
  { weight: 8, arbitrary: fc.constantFrom('1Y:2Y', '3M:6M', '2028-03-10:2029-03-10', '1D:2D') },
  { weight: 1, arbitrary: fc.constantFrom('5Y:40Y', '2026-01-01:2027-06-10', '1Y:1Y', '2Y:1Y') },
);

/** Options: mostly valid, now and then wrong or repeated (usage errors). */
export const commandArgs: fc.Arbitrary<string[]> = fc
  .record({
    at: fc.option(fc.array(point, { minLength: 1, maxLength: 4 }), { freq: 2 }),
    forward: fc.option(fc.array(period, { minLength: 1, maxLength: 3 }), { freq: 2 }),
    compounding: fc.option(fc.constantFrom('continuous', 'simple', 'annual', 'semiannual', 'quarterly', 'monthly')),
    dayCount: fc.option(fc.constantFrom('ACT/360', 'ACT/365F', '30/360', '30E/360', '30/360-US', 'ACT/ACT-ISDA')),
    extrapolate: fc.option(fc.constantFrom('none', 'flat-forward')),
    skipInvalid: fc.boolean(),
    bond: fc.option(fc.constantFrom('2030-06-15,0.035,2,ACT/ACT-ICMA,price=99.5', '5Y,0.03,1,30/360,yield=0.031', '2029-01-31,0.02,4,ACT/360', '60Y,0.05,2,ACT/ACT-ICMA'), { freq: 12 }),
    wrong: fc.oneof(
      { weight: 12, arbitrary: fc.constant([] as string[]) },
      { weight: 1, arbitrary: fc.constantFrom(['--colour'], ['--compounding', 'weekly'], ['--at'], ['--skip-invalid=yes'], ['extra.json'], ['--day-count', 'ACT/ACT-ICMA'], ['--extrapolate', 'none', '--extrapolate', 'none'], ['--bond', '1,2,3']) },
    ),
  })
  .map((o) => {
    const args = ['-'];
    if (o.at) args.push('--at', o.at.join(','));
    if (o.forward) args.push('--forward', o.forward.join(','));
    if (o.compounding) args.push('--compounding', o.compounding);
    if (o.dayCount) args.push(`--day-count=${o.dayCount}`);
    if (o.extrapolate) args.push('--extrapolate', o.extrapolate);
    if (o.skipInvalid) args.push('--skip-invalid');
    if (o.bond) args.push('--bond', o.bond);
    return [...args, ...o.wrong];
  });

/**
 * How many documents the input holds, by the rule the command had when it read its input whole:
 * one when the text (without a leading byte-order mark) parses as one JSON value, otherwise one
 * per non-blank line (one when there is none). The streaming reader must agree.
 */
export function expectedDocuments(input: string): number {
  const text = input.startsWith('\uFEFF') ? input.slice(1) : input;
  try {
    JSON.parse(text);
    return 1;
  } catch {
    return Math.max(1, text.split(/\r?\n/).filter((line) => line.trim() !== '').length);
  }
}

/** Every number reachable in a value. */
function numbers(v: unknown, out: number[] = []): number[] {
  if (typeof v === 'number') out.push(v);
  else if (Array.isArray(v)) for (const x of v) numbers(x, out);
  else if (v && typeof v === 'object') for (const x of Object.values(v)) numbers(x, out);
  return out;
}

/** What one case gave, for the tallies. */
export interface CaseOutcome {
  readonly status: 0 | 1 | 2;
  readonly built: number;
  readonly failed: number;
}

/**
 * Runs one case through runCurveCommand (the input whole, and again cut into `cuts` pieces) and
 * checks the command's promises; throws an Error naming the first one broken.
 */
export async function checkCase(input: string, args: readonly string[], cuts: readonly number[]): Promise<CaseOutcome> {
  let r: CommandResult;
  try {
    r = await runCurveCommand(args, () => input);
  } catch (e) {
    throw new Error(`an exception escaped: ${(e as Error).stack ?? String(e)}`);
  }
  const fail = (what: string): never => {
    throw new Error(`${what}\nstatus ${r.status}\nstdout ${r.stdout.slice(0, 400)}\nstderr ${r.stderr.slice(0, 400)}`);
  };
  if (r.status === 2) {
    if (r.stdout !== '') fail('a usage error printed on standard output');
    if (!r.stderr.startsWith('curve: ')) fail('a usage error without a "curve: " message');
    return { status: 2, built: 0, failed: 0 };
  }
  if (r.status !== 0 && r.status !== 1) fail('an undocumented exit status');
  if (!r.stdout.endsWith('\n')) fail('standard output does not end with a newline');
  const lines = r.stdout.slice(0, -1).split('\n');
  if (lines.length !== expectedDocuments(input)) fail(`${lines.length} output lines for ${expectedDocuments(input)} documents`);
  let failed = 0;
  lines.forEach((line, i) => {
    let o: Record<string, unknown>;
    try {
      o = JSON.parse(line) as Record<string, unknown>;
    } catch {
      return fail(`output line ${i} is not JSON`);
    }
    if (o.index !== i) fail(`output line ${i} has index ${String(o.index)}`);
    if ('errors' in o) {
      failed++;
      const errors = o.errors as { path: unknown; code: unknown; message: unknown }[];
      if (!Array.isArray(errors) || errors.length === 0) fail(`line ${i}: an empty errors list`);
      for (const e of errors) if (typeof e.path !== 'string' || typeof e.code !== 'string' || typeof e.message !== 'string' || e.message === '') fail(`line ${i}: an error without path, code and message`);
      if (!r.stderr.includes(`document ${i}: `)) fail(`document ${i} failed without a line on standard error`);
    } else {
      if (!Array.isArray(o.points) || !Array.isArray(o.quotes) || !Array.isArray(o.warnings)) fail(`line ${i}: a built document without points, quotes or warnings`);
      if (!numbers(o).every(Number.isFinite) || /:null[,}\]]/.test(line)) fail(`line ${i}: a number that is not finite`);
    }
  });
  if (r.status !== (failed > 0 ? 1 : 0)) fail(`exit status ${r.status} with ${failed} failed documents`);
  if (failed === 0 && r.stderr !== '') fail('standard error without a failed document');
  if (cuts.length > 0) {
    const at = [...new Set(cuts.map((c) => c % (input.length + 1)))].sort((a, b) => a - b);
    const pieces = [0, ...at].map((start, k) => input.slice(start, at[k] ?? input.length));
    const again = await runCurveCommand(args, () => pieces);
    if (again.stdout !== r.stdout || again.stderr !== r.stderr || again.status !== r.status) fail('the input cut into pieces gave another result');
  }
  return { status: r.status, built: lines.length - failed, failed };
}
