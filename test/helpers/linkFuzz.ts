// The link fuzzer shared by the normal suite (test/share/linkFuzz.test.ts, 10,000+ cases) and the
// longer run (test/tools/fuzz-links.ts): random and mutated link fragments go through the link
// decoder and its validation, then the workbench's own document path (read the document, keep or
// list unknown settings, make the editable copy, convert and build the curve, hash it for print).
// No exception may escape, and every failure must be a message a user can read.
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { deflateRawSync, inflateRawSync } from 'node:zlib';
import type { InflateOutcome } from '../../src/share/compression.ts';
import { canonicalJson, isQuoteUnitMode, readWorkbenchDocument, replaceUnknownSettings, toEngineDocument, workspaceHash } from '../../src/core/index.ts';
import { deriveBuild } from '../../src/hooks/useCurveBuild.ts';
import { encodeBase64Url } from '../../src/share/base64url.ts';
import { decodeWorkspaceLink, encodeWorkspaceLink } from '../../src/share/linkCodec.ts';

const fixture = JSON.parse(readFileSync(new URL('../fixtures/share/workbench40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
/** The fixture cut to every tenth quote (a deposit, a bill, a bond, a swap), so a case costs little and 10,000 run in seconds. */
const workbench: Record<string, unknown> = { ...fixture, quotes: (fixture.quotes as unknown[]).filter((_, i) => i % 10 === 0) };

/** A message a user can read: plain sentences, no stack trace, no "[object Object]", no empty text. */
export function readableProblem(message: unknown): string | null {
  if (typeof message !== 'string') return `not text: ${typeof message}`;
  if (message.trim().length < 10) return 'too short';
  if (message.length > 1200) return `too long (${message.length} characters)`;
  if (!/^[A-Z]/.test(message)) return 'does not start as a sentence';
  if (!/[.)]$/.test(message)) return 'does not end as a sentence';
  if (/\[object |\bat \S+ \(.*:\d+:\d+\)|\n\s+at /.test(message)) return 'holds program internals';
  return null;
}

/** Raw DEFLATE by Node's zlib (the same RFC 1951 format as the browser's CompressionStream, much faster under Node). */
const packed = (text: string): string => `ws1.${encodeBase64Url(new Uint8Array(deflateRawSync(Buffer.from(text, 'utf8'))))}`;

/**
 * inflateRawCapped's contract on Node's zlib: at most `cap` bytes out ('too-large' past it), any
 * damage 'corrupt'. `streamsEvery` cases use the app's own streaming inflater instead.
 */
export async function zlibInflateCapped(bytes: Uint8Array, cap: number): Promise<InflateOutcome> {
  try {
    return { ok: true, bytes: new Uint8Array(inflateRawSync(bytes, { maxOutputLength: cap })) };
  } catch (e) {
    return { ok: false, reason: (e as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE' ? 'too-large' : 'corrupt' };
  }
}

/** Sets `value` at a path of keys and indexes in a copy of `doc` (creating objects on the way). */
function setAt(doc: unknown, path: readonly (string | number)[], value: unknown): unknown {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  const base = (doc !== null && typeof doc === 'object' ? doc : {}) as Record<string | number, unknown>;
  const copy: Record<string | number, unknown> = Array.isArray(base) ? ([...base] as unknown as Record<number, unknown>) : { ...base };
  copy[head!] = setAt(base[head!], rest, value);
  return copy;
}

/** JSON text of a value nested `n` deep (written as text: JSON.stringify itself recurses). */
const nestedText = (n: number): string => {
  let open = '';
  let close = '';
  for (let i = 0; i < n; i++) {
    open += i % 2 ? '[' : '{"a":';
    close = (i % 2 ? ']' : '}') + close;
  }
  return `${open}1${close}`;
};
const DEEP = /"@deep:(\d+)"/g;

/** Paths into the workbench document that matter: settings, rows, cells, reserved keys. */
const pathArb: fc.Arbitrary<readonly (string | number)[]> = fc.oneof(
  fc.constantFrom(['curve', 'interpolation'], ['curve', 'dayCount'], ['curve', 'extrapolation'], ['quoteUnit'], ['display', 'compounding'], ['display', 'parFrequency'], ['settlement'], ['version'], ['format'], ['quotes'], ['strategy'], ['scenarios'], ['view'], ['note'], ['snapshots'], ['display'], ['curve']),
  fc.tuple(fc.constant('quotes'), fc.nat(5)).map((p) => [...p]),
  fc.tuple(fc.constant('quotes'), fc.nat(5), fc.constantFrom('kind', 'maturity', 'rate', 'price', 'coupon', 'frequency', 'dayCount', 'id', 'enabled', 'extra')).map((p) => [...p]),
  fc.tuple(fc.constantFrom('curve', 'display', 'strategy', 'view'), fc.string({ maxLength: 12 })).map((p) => [...p]),
);
const rowsOf = (n: number): unknown[] =>
  Array.from({ length: n }, (_, i) => ({ id: `r${i}`, enabled: true, kind: 'swap', maturity: `${1 + (i % 30)}Y`, rate: '3.1', price: '', coupon: '', frequency: '', dayCount: '' }));
const valueArb: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 12, arbitrary: fc.jsonValue({ maxDepth: 4 }) },
  { weight: 8, arbitrary: fc.constantFrom('cubic-tension', 'ACT/364', 'weekly', 'permille', 'linear', '', '5Y', '2031-02-30', 'NaN', '-0', '1e400', '__proto__', 'constructor') },
  { weight: 2, arbitrary: fc.integer({ min: 10, max: 3000 }).map((n) => `@deep:${n}`) },
  { weight: 2, arbitrary: fc.integer({ min: 0, max: 20 }).map(rowsOf) },
  // At the quote cap: each such case reads up to 500 rows, so they are kept rare.
  { weight: 1, arbitrary: fc.constantFrom(499, 500, 501, 620).map(rowsOf) },
  { weight: 2, arbitrary: fc.string({ maxLength: 80 }) },
  { weight: 1, arbitrary: fc.constantFrom(65, 2001, 20001).map((n) => 'x'.repeat(n)) },
);

/** Documents: the fixture with 1 to 4 parts replaced by odd values, in an envelope that may itself be odd. */
const documentLinkArb: fc.Arbitrary<{ kind: string; text: string }> = fc
  .tuple(fc.array(fc.tuple(pathArb, valueArb), { minLength: 1, maxLength: 4 }), fc.constantFrom('build-a', 'build-b', ''), fc.nat(9))
  .map(([edits, b, envelope]) => {
    let d: unknown = workbench;
    for (const [p, v] of edits) d = setAt(d, p, v);
    const env = envelope === 0 ? d : envelope === 1 ? { b, d, x: 1 } : { b, d };
    return { kind: 'document', text: JSON.stringify(env).replace(DEEP, (_, k: string) => nestedText(Number(k))) };
  });

export interface FuzzReport {
  readonly cases: number;
  readonly opened: number;
  readonly refused: number;
  readonly readOnly: number;
}

/**
 * Runs `runs` cases with a fixed seed; throws (with fast-check's counterexample) when an exception
 * escapes or a failure is not readable. Each case is one of: random text, a mutated valid fragment,
 * or a valid envelope around a mutated document. One case in `streamsEvery` inflates through the
 * app's own DecompressionStream; the others through Node's zlib under the same cap (the platform
 * streams cost about a millisecond a call under Node).
 */
export async function runLinkFuzz(runs: number, seed = 20261215, streamsEvery = 20, buildEvery = 10): Promise<FuzzReport> {
  const base = await encodeWorkspaceLink(workbench, 'build-a');
  const counts = { cases: 0, opened: 0, refused: 0, readOnly: 0 };
  let n = 0;
  const makeId = (): string => `z${n++}`;
  const fragmentArb: fc.Arbitrary<{ kind: string; fragment?: string; text?: string }> = fc.oneof(
    { weight: 2, arbitrary: fc.string({ maxLength: 200 }).map((s) => ({ kind: 'random', fragment: s })) },
    { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 120 }).map((s) => ({ kind: 'random-ws', fragment: `#ws1.${s}` })) },
    {
      weight: 3,
      arbitrary: fc.tuple(fc.nat(base.length), fc.nat(base.length), fc.constantFrom('flip', 'cut', 'insert', 'repeat', 'drop')).map(([i, j, op]) => {
        const [a, b] = [Math.min(i, j), Math.max(i, j)];
        const c = base[a] === 'A' ? 'B' : 'A';
        const fragment = op === 'flip' ? base.slice(0, a) + c + base.slice(a + 1) : op === 'cut' ? base.slice(0, a) : op === 'insert' ? base.slice(0, a) + '_-Zz09' + base.slice(a) : op === 'repeat' ? base + base.slice(a, b) : base.slice(0, a) + base.slice(b);
        return { kind: `mutated-${op}`, fragment };
      }),
    },
    { weight: 5, arbitrary: documentLinkArb },
  );
  await fc.assert(
    fc.asyncProperty(fragmentArb, async (c) => {
      counts.cases++;
      const fragment = c.fragment ?? packed(c.text!);
      const outcome = await decodeWorkspaceLink(fragment, 'build-a', undefined, counts.cases % streamsEvery === 0 ? undefined : zlibInflateCapped);
      if (!outcome.ok) {
        counts.refused++;
        const why = outcome.failure === 'none' ? null : readableProblem(outcome.message);
        if (why) throw new Error(`${c.kind}: unreadable failure (${why}): ${outcome.message}`);
        return;
      }
      counts.opened++;
      if (outcome.notice !== null && readableProblem(outcome.notice)) throw new Error(`${c.kind}: unreadable notice: ${outcome.notice}`);
      const doc = outcome.checked.document;
      // The print view's hash: the canonical text every case (where a deep structure once overflowed
      // the stack), the FNV digest over it (a BigInt step per byte) one opened case in `buildEvery`.
      canonicalJson(doc);
      if (counts.opened % buildEvery === 0) workspaceHash(doc);
      if (doc.format !== 'tenorscope-workbench') return;
      const unknowns = outcome.checked.unknowns;
      if (unknowns.length > 0) counts.readOnly++;
      const read = readWorkbenchDocument(doc, makeId, { keepUnknown: unknowns.length > 0 });
      if (!read.doc) {
        if (readableProblem(`This link could not be opened: ${read.problem}.`)) throw new Error(`${c.kind}: unreadable problem ${read.problem}`);
        return;
      }
      // What the workbench then shows: the sheet's rows read as the engine's document, and (one
      // opened case in `buildEvery`: a bootstrap costs milliseconds) the curve built from it.
      const show = (d: NonNullable<typeof read.doc>): void => {
        if (isQuoteUnitMode(d.quoteUnit)) toEngineDocument(d);
        if (counts.opened % buildEvery === 0) {
          const shown = deriveBuild(d);
          if (shown.fatal !== null && readableProblem(`No curve: ${shown.fatal}.`)) throw new Error(`${c.kind}: unreadable fatal message: ${shown.fatal}`);
        }
      };
      show(read.doc);
      // And the editable copy the user may ask for.
      if (unknowns.length > 0) {
        const copy = readWorkbenchDocument(replaceUnknownSettings(doc), makeId);
        if (!copy.doc) throw new Error(`${c.kind}: the editable copy could not be read: ${copy.problem}`);
        show(copy.doc);
      }
    }),
    { seed, numRuns: runs, endOnFailure: true },
  );
  return counts;
}
