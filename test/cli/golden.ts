// The golden check of the engine's behaviour: a fixed set of random documents (every quote kind,
// every field a kind takes, every interpolation and curve day count, both extrapolations, valid and
// damaged) run through the `curve` command with random options (--at, --forward, --compounding,
// --day-count, --extrapolate, --skip-invalid, --bond), and the workbench documents of the demo and
// the fixtures through the file and link round trips. Each case's output is reduced to what must
// never change in a redesign (every number, date, code, path and exit status; message wording may
// improve, so messages are blanked) and digested. test/fixtures/golden/curve-golden.json holds the
// digests written by `npx tsx test/tools/golden-curve.ts --write` on the commit before the redesign;
// test/cli/golden.test.ts holds every later build to them bit for bit.
//
// Every document here is invented test data drawn by a seeded generator; nothing is market data.
import { createHash } from 'node:crypto';
import { runCurveCommand } from '../../src/cli/curveCommand.ts';
import { rng } from '../helpers/seededRandom.ts';

/** Mulberry32 (public-domain algorithm), so the cases never depend on a library's version. */
export const generator = rng;

type Rand = () => number;
const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;
const chance = (r: Rand, p: number): boolean => r() < p;
const between = (r: Rand, lo: number, hi: number): number => lo + (hi - lo) * r();
/** A decimal with `places` places, as a person would type it. */
const typed = (x: number, places: number): number => Number(x.toFixed(places));

const INTERPOLATIONS = ['linear-zero', 'log-linear-discount', 'cubic-zero', 'monotone-convex', 'monotone-convex-positive'];
const CURVE_DAY_COUNTS = ['ACT/360', 'ACT/365F', '30/360', '30E/360', '30/360-US', 'ACT/ACT-ISDA'];
const DAY_COUNTS = ['ACT/360', 'ACT/365F', '30/360', '30E/360', '30E/360-ISDA', '30/360-US', 'ACT/ACT-ISDA', 'ACT/ACT-ICMA'];
const COMPOUNDINGS = ['simple', 'annual', 'semiannual', 'quarterly', 'monthly', 'continuous'];
const FREQUENCIES = [1, 2, 4, 12];
const SHORT_TENORS = ['1W', '2W', '1M', '2M', '3M', '4M', '6M', '9M', '12M'];
const LONG_TENORS = ['1Y', '18M', '2Y', '3Y', '4Y', '5Y', '6Y', '7Y', '8Y', '10Y', '12Y', '15Y', '20Y', '25Y', '30Y', '40Y', '50Y'];

const pad = (n: number): string => String(n).padStart(2, '0');
function dateText(y: number, m: number, d: number): string {
  return `${y}-${pad(m)}-${pad(d)}`;
}
/** Days in a civil month (proleptic Gregorian). */
function monthDays(y: number, m: number): number {
  return [31, (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0 ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][m - 1]!;
}
/** A settlement from 2020 to 2032, with month ends and 29 February drawn more often than chance. */
function settlementDate(r: Rand): string {
  const y = 2020 + Math.floor(r() * 13);
  const m = 1 + Math.floor(r() * 12);
  const last = monthDays(y, m);
  const d = chance(r, 0.2) ? last : chance(r, 0.1) ? last - 1 : 1 + Math.floor(r() * last);
  return dateText(y, m, d);
}
/** A date about `years` after `from` (a later month and a drawn day). */
function dateAfter(r: Rand, from: string, years: number): string {
  const [y0, m0] = from.split('-').map(Number) as [number, number];
  const months = Math.max(1, Math.round(years * 12));
  const total = y0 * 12 + (m0 - 1) + months;
  const y = Math.floor(total / 12);
  const m = (total % 12) + 1;
  const last = monthDays(y, m);
  const d = chance(r, 0.3) ? last : chance(r, 0.3) ? Number(from.slice(8)) > last ? last : Number(from.slice(8)) : 1 + Math.floor(r() * last);
  return dateText(y, m, d);
}
const yearsOf = (tenor: string): number => (tenor.endsWith('W') ? Number(tenor.slice(0, -1)) / 52 : tenor.endsWith('M') ? Number(tenor.slice(0, -1)) / 12 : Number(tenor.slice(0, -1)));

type Doc = Record<string, unknown>;
type QuoteDoc = Record<string, unknown>;

/** One quote of a kind: tenor or maturity, its value fields and, now and then, each optional field. */
function quote(r: Rand, settlement: string, level: number): QuoteDoc {
  const kind = pick(r, ['deposit', 'deposit', 'bill', 'zero', 'bond', 'bond', 'swap', 'swap', 'swap']);
  const rate = (years: number): number => typed(level + 0.004 * Math.log1p(years) + between(r, -0.002, 0.002), 5);
  if (kind === 'deposit') {
    const tenor = pick(r, SHORT_TENORS);
    const q: QuoteDoc = { kind, ...(chance(r, 0.85) ? { tenor } : { maturity: dateAfter(r, settlement, yearsOf(tenor)) }), rate: rate(yearsOf(tenor)) };
    if (chance(r, 0.3)) q.dayCount = pick(r, DAY_COUNTS.filter((d) => d !== 'ACT/ACT-ICMA'));
    return q;
  }
  if (kind === 'bill') {
    const tenor = pick(r, ['1M', '3M', '6M', '9M', '12M']);
    const q: QuoteDoc = { kind, ...(chance(r, 0.5) ? { tenor } : { maturity: dateAfter(r, settlement, yearsOf(tenor)) }) };
    if (chance(r, 0.6)) q.discountYield = rate(yearsOf(tenor));
    else q.price = typed(100 * (1 - rate(yearsOf(tenor)) * yearsOf(tenor)), 4);
    return q;
  }
  if (kind === 'zero') {
    const tenor = pick(r, [...SHORT_TENORS.slice(2), ...LONG_TENORS.slice(0, 12)]);
    const y = yearsOf(tenor);
    const q: QuoteDoc = { kind, ...(chance(r, 0.7) ? { tenor } : { maturity: dateAfter(r, settlement, y) }) };
    if (chance(r, 0.5)) q.price = typed(100 * Math.exp(-rate(y) * y), 4);
    else {
      q.rate = rate(y);
      if (chance(r, 0.6)) q.compounding = pick(r, COMPOUNDINGS);
      if (chance(r, 0.4)) q.dayCount = pick(r, DAY_COUNTS.filter((d) => d !== 'ACT/ACT-ICMA'));
    }
    return q;
  }
  if (kind === 'bond') {
    const y = between(r, 0.6, 30);
    const coupon = typed(Math.max(0, level + between(r, -0.015, 0.02)), 4);
    const q: QuoteDoc = { kind, maturity: dateAfter(r, settlement, y), coupon, frequency: pick(r, FREQUENCIES) };
    if (chance(r, 0.5)) q.cleanPrice = typed(100 + (coupon - rate(y)) * Math.min(y, 12) * 90, 3);
    else q.yield = rate(y);
    if (chance(r, 0.3)) q.dayCount = pick(r, DAY_COUNTS);
    if (chance(r, 0.2)) q.eom = chance(r, 0.5);
    return q;
  }
  const tenor = pick(r, LONG_TENORS);
  const q: QuoteDoc = { kind, ...(chance(r, 0.9) ? { tenor } : { maturity: dateAfter(r, settlement, yearsOf(tenor)) }), rate: rate(yearsOf(tenor)) };
  if (chance(r, 0.4)) q.frequency = pick(r, FREQUENCIES);
  if (chance(r, 0.3)) q.dayCount = pick(r, DAY_COUNTS.filter((d) => d !== 'ACT/ACT-ICMA'));
  if (chance(r, 0.2)) q.eom = chance(r, 0.5);
  return q;
}

/** One damage a careless user or file could do, so error codes and paths are held too. */
function damage(r: Rand, doc: Doc): void {
  const quotes = doc.quotes as QuoteDoc[];
  const q = quotes[Math.floor(r() * quotes.length)]!;
  const how = Math.floor(r() * 8);
  if (how === 0) q.rate = pick(r, [-0.5, 2, 'x', null]);
  else if (how === 1) q.maturity = pick(r, ['2019-01-01', '2027-02-30', 'soon']);
  else if (how === 2) q.frequency = pick(r, [3, 0, 'two']);
  else if (how === 3) q.dayCount = pick(r, ['ACT/366', 'ACT/ACT-ICMA']);
  else if (how === 4) q.kind = pick(r, ['swaption', 'cap', '']); // kinds the engine does not have ('future' and 'fra' were ones until each became a kind; the output is the same: messages are blanked)
  else if (how === 5) quotes.push({ ...q });
  else if (how === 6) (doc.curve as Doc).interpolation = pick(r, ['spline', 'flat']);
  else q.enabled = false;
}

/** A point for --at, a pair for --forward: tenors, dates, now and then outside the curve. */
const atPoint = (r: Rand, settlement: string): string =>
  chance(r, 0.6) ? pick(r, ['1D', '1W', '1M', '3M', '6M', '1Y', '2Y', '5Y', '10Y', '30Y', '60Y']) : dateAfter(r, settlement, between(r, -0.5, 35));
const forwardPair = (r: Rand, settlement: string): string => {
  if (chance(r, 0.6)) return pick(r, ['1M:2M', '3M:6M', '6M:1Y', '1Y:2Y', '2Y:5Y', '5Y:10Y', '10Y:30Y', '1D:2D', '2Y:1Y']);
  const a = between(r, 0, 20);
  return `${dateAfter(r, settlement, a)}:${dateAfter(r, settlement, a + between(r, 0.1, 10))}`;
};

export interface GoldenCase {
  readonly input: string;
  readonly args: readonly string[];
}

/** Case `i` of the golden set: a document (or a batch of two) and the options drawn for it. */
export function goldenCase(seed: number, i: number): GoldenCase {
  const r = generator(seed * 1_000_003 + i);
  const docs: Doc[] = [];
  const count = chance(r, 0.1) ? 2 : 1;
  for (let k = 0; k < count; k++) {
    const settlement = settlementDate(r);
    const level = between(r, -0.005, 0.07);
    const curve: Doc = { dayCount: pick(r, CURVE_DAY_COUNTS), interpolation: pick(r, INTERPOLATIONS) };
    if (chance(r, 0.6)) curve.extrapolation = pick(r, ['none', 'flat-forward']);
    const n = 1 + Math.floor(r() * 14);
    const quotes: QuoteDoc[] = [];
    const used = new Set<unknown>();
    for (let j = 0; j < n; j++) {
      // Distinct tenors and dates mostly, so most documents build (a few same-date pairs stay, for their error).
      const q = quote(r, settlement, level);
      const at = q.tenor ?? q.maturity;
      if (used.has(at) && chance(r, 0.9)) continue;
      used.add(at);
      quotes.push(q);
    }
    const doc: Doc = { format: 'tenorscope-workspace', version: 1, settlement, curve, quotes };
    if (chance(r, 0.15)) damage(r, doc);
    docs.push(doc);
  }
  const settlement = docs[0]!.settlement as string;
  const args = ['-'];
  if (chance(r, 0.4)) args.push('--at', Array.from({ length: 1 + Math.floor(r() * 5) }, () => atPoint(r, settlement)).join(','));
  if (chance(r, 0.4)) args.push('--forward', Array.from({ length: 1 + Math.floor(r() * 4) }, () => forwardPair(r, settlement)).join(','));
  if (chance(r, 0.3)) args.push('--compounding', pick(r, COMPOUNDINGS));
  if (chance(r, 0.2)) args.push('--day-count', pick(r, CURVE_DAY_COUNTS));
  if (chance(r, 0.2)) args.push('--extrapolate', pick(r, ['none', 'flat-forward']));
  if (chance(r, 0.3)) args.push('--skip-invalid');
  if (chance(r, 0.3)) {
    const bonds = 1 + Math.floor(r() * 2);
    for (let b = 0; b < bonds; b++) {
      const coupon = typed(between(r, 0, 0.07), 4);
      const value = chance(r, 0.4) ? `,price=${typed(between(r, 85, 115), 3)}` : chance(r, 0.5) ? `,yield=${typed(between(r, 0, 0.07), 5)}` : '';
      args.push('--bond', `${dateAfter(r, settlement, between(r, 0.3, 25))},${coupon},${pick(r, FREQUENCIES)},${pick(r, DAY_COUNTS)}${value}`);
    }
  }
  const pretty = chance(r, 0.2) && count === 1;
  const input = docs.map((d) => JSON.stringify(d, null, pretty ? 2 : undefined)).join('\n') + '\n';
  return { input, args };
}

/** Blanks every `message` text (its wording may improve) and keeps everything else as built. */
export function withoutMessages(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutMessages);
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = k === 'message' && typeof v === 'string' ? '' : withoutMessages(v);
    return out;
  }
  return value;
}

/**
 * The output as the build the digests were written from printed it: the fields the version 2
 * output added (a document's `valuationDate`; a quote entry's `start`, `end`, `pillar`, `payment`)
 * are left out, since the output only gains fields; every field it had is kept as printed.
 */
export function withoutAddedFields(line: Record<string, unknown>): Record<string, unknown> {
  const { valuationDate: _v, ...rest } = line;
  if (!Array.isArray(rest.quotes)) return rest;
  return { ...rest, quotes: (rest.quotes as Record<string, unknown>[]).map(({ start: _s, end: _e, pillar: _p, payment: _pay, ...q }) => q) };
}

/**
 * What must not change of a command run: the exit status, each standard-output line parsed with its
 * messages blanked (numbers compared through their shortest round-trip text, so bit for bit) and
 * the fields added since left out (withoutAddedFields), and of each standard-error line the
 * document it names and the code in brackets.
 */
export function invariantText(status: number, stdout: string, stderr: string): string {
  const lines = stdout.split('\n').filter((l) => l !== '').map((l) => JSON.stringify(withoutMessages(withoutAddedFields(JSON.parse(l) as Record<string, unknown>))));
  const errors = stderr
    .split('\n')
    .filter((l) => l !== '')
    .map((l) => `${/^document \d+/.exec(l)?.[0] ?? ''} ${[...l.matchAll(/\[([a-z-]+)\]$/g)].map((m) => m[1]).join(',')}`);
  return JSON.stringify({ status, lines, errors });
}

export const digest = (text: string): string => createHash('sha256').update(text).digest('hex').slice(0, 20);

/** The invariant text of golden case `i`. */
export async function goldenOutput(seed: number, i: number): Promise<string> {
  const c = goldenCase(seed, i);
  const result = await runCurveCommand(c.args, () => c.input);
  return invariantText(result.status, result.stdout, result.stderr);
}

export const GOLDEN_SEED = 16;
export const GOLDEN_CASES = 3000;

/** Options the workbench documents are run with through the command (each a separate run). */
const ROUND_TRIP_ARGS: readonly (readonly string[])[] = [
  ['-'],
  ['-', '--at', '1M,6M,1Y,2Y,5Y,10Y,30Y', '--forward', '1Y:2Y,5Y:10Y', '--compounding', 'annual', '--day-count', 'ACT/360'],
  ['-', '--skip-invalid', '--extrapolate', 'flat-forward', '--at', '45Y', '--bond', '2031-05-15,0.04,2,ACT/ACT-ICMA,price=101.25'],
];

/**
 * An engine document read back, written in version 1 terms: reading migrates a version 1 document
 * to version 2 by renaming `settlement` to `valuationDate` in its place (and nothing else), so the
 * rename undone must give the document the stored digests were made from, key for key. Other
 * documents are returned as they are.
 */
export function inVersion1Terms(doc: Record<string, unknown>): Record<string, unknown> {
  if (doc.format !== 'tenorscope-workspace' || doc.version !== 2 || 'calendars' in doc || 'customCalendars' in doc) return doc;
  return Object.fromEntries(Object.entries(doc).map(([k, v]) => (k === 'version' ? [k, 1] : k === 'valuationDate' ? ['settlement', v] : [k, v])));
}

/**
 * The round trips of one workbench or engine document: written as a file and read back, sent as a
 * link and opened; each result's text (rows named r0, r1, ... in order) and its build through the
 * command under each of ROUND_TRIP_ARGS. `decodeLink(encodeLink(doc))` is the app's link codec.
 */
export async function roundTripOutputs(
  doc: Record<string, unknown>,
  tools: {
    readonly serialise: (d: Record<string, unknown>) => string;
    readonly parse: (text: string) => Record<string, unknown> | null;
    readonly link: (d: Record<string, unknown>) => Promise<Record<string, unknown> | null>;
  },
): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  const fileText = tools.serialise(doc);
  const fromFile = tools.parse(fileText);
  out.file = fromFile ? JSON.stringify(inVersion1Terms(fromFile)) : 'refused';
  const fromLink = await tools.link(doc);
  out.link = fromLink ? JSON.stringify(inVersion1Terms(fromLink)) : 'refused';
  for (const [name, read] of [['file', fromFile], ['link', fromLink]] as const) {
    if (!read) continue;
    for (let k = 0; k < ROUND_TRIP_ARGS.length; k++) {
      const args = ROUND_TRIP_ARGS[k]!;
      const r = await runCurveCommand(args, () => JSON.stringify(read) + '\n');
      out[`${name}-build-${k}`] = invariantText(r.status, r.stdout, r.stderr);
    }
  }
  return out;
}
