// The link codec: round trips, size of the committed fixture's link, and untrusted input.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { encodeBase64Url, decodeBase64Url } from '../../src/share/base64url.ts';
import { BUILD_ID } from '../../src/share/buildId.ts';
import { deflateRaw } from '../../src/share/compression.ts';
import { decodeWorkspaceLink, encodeWorkspaceLink, MAX_FRAGMENT_CHARS, openLink } from '../../src/share/linkCodec.ts';
import { migrateDocument } from '../../src/core/index.ts';

const fixture = JSON.parse(readFileSync(new URL('../fixtures/share/workspace40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const packed = async (text: string): Promise<string> => `ws1.${encodeBase64Url(await deflateRaw(new TextEncoder().encode(text)))}`;

describe('encodeWorkspaceLink / decodeWorkspaceLink', () => {
  it('the 40-quote fixture (three scenarios, a 200-character note) makes a fragment of at most 2,000 characters', async () => {
    const fragment = await encodeWorkspaceLink(fixture);
    console.info(`link fragment of test/fixtures/share/workspace40.json: ${fragment.length} characters (build id "${BUILD_ID}", ${JSON.stringify(fixture).length} characters of JSON)`);
    expect((fixture.quotes as unknown[]).length).toBe(40);
    expect((fixture.scenarios as unknown[]).length).toBe(3);
    expect((fixture.note as string).length).toBe(200);
    expect(fragment.length).toBeLessThanOrEqual(2000);
    expect(fragment).toMatch(/^ws1\.[A-Za-z0-9_-]+$/);
  });

  it('the same market as the workbench saves it (cells as typed) also fits in 2,000 characters', async () => {
    const workbench = JSON.parse(readFileSync(new URL('../fixtures/share/workbench40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
    const fragment = await encodeWorkspaceLink(workbench);
    console.info(`link fragment of test/fixtures/share/workbench40.json: ${fragment.length} characters`);
    expect(fragment.length).toBeLessThanOrEqual(2000);
    const outcome = await decodeWorkspaceLink(fragment);
    expect(outcome.ok && outcome.checked.document).toEqual(workbench);
    expect(outcome.ok && outcome.checked.workspace?.quotes.length).toBe(40);
  });

  it('a workbench document with a futures convexity model and overnight fixings goes through a link unchanged and builds', async () => {
    // Invented fixings and prices; the model and field names are the workspace document's (README).
    const workbench = JSON.parse(readFileSync(new URL('../fixtures/share/workbench40.json', import.meta.url), 'utf8')) as Record<string, unknown>;
    const doc = {
      ...workbench,
      curve: { ...(workbench.curve as object), futuresConvexity: { model: 'hull-white', volatility: 0.011, meanReversion: 0.04 } },
      fixings: { '2024-01-02': 0.0531, '2024-01-03': 0.0532 },
    };
    const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(doc));
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.checked.document).toEqual(doc);
    expect(outcome.checked.workspace?.curve.futuresConvexity).toEqual({ model: 'hull-white', volatility: 0.011, meanReversion: 0.04 });
    expect(outcome.checked.workspace?.fixings).toEqual({ '2024-01-02': 0.0531, '2024-01-03': 0.0532 });
  });

  it('decodes the fixture to the identical document, from this build without a notice', async () => {
    const outcome = await decodeWorkspaceLink('#' + (await encodeWorkspaceLink(fixture)));
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.checked.document).toEqual(migrateDocument(fixture)); // version 1 read as version 2 (settlement renamed valuationDate)
    expect(outcome.sameBuild).toBe(true);
    expect(outcome.notice).toBeNull();
  });

  it('leaves snapshots out of the link', async () => {
    const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink({ ...fixture, snapshots: [] }));
    expect(outcome.ok && 'snapshots' in outcome.checked.document).toBe(false);
  });

  it('opens a link from another build with a notice naming both builds', async () => {
    const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(fixture, 'older-build-7'), 'this-build-9');
    expect(outcome.ok).toBe(true);
    if (outcome.ok) expect(outcome.notice).toContain('older-build-7');
  });

  it('refuses a link from a newer link format with a clear message', async () => {
    const fragment = (await encodeWorkspaceLink(fixture)).replace(/^ws1\./, 'ws2.');
    const outcome = await decodeWorkspaceLink(fragment);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) {
      expect(outcome.failure).toBe('newer-version');
      expect(outcome.message).toContain('saved workspace has not been changed');
    }
  });

  it('migrates an older document version through the migration steps it is given', async () => {
    const old = { ...fixture, version: 0 };
    const fragment = await packed(JSON.stringify({ b: BUILD_ID, d: old }));
    expect((await decodeWorkspaceLink(fragment)).ok).toBe(false);
    const outcome = await decodeWorkspaceLink(fragment, BUILD_ID, [{ from: 0, migrate: (d) => ({ ...d, version: 1 }) }]);
    expect(outcome.ok && outcome.checked.document.version).toBe(1);
  });
});

describe('base64url', () => {
  it('round-trips any bytes and refuses characters outside the URL-safe alphabet (RFC 4648 section 5)', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 300 }), (bytes) => {
        expect(decodeBase64Url(encodeBase64Url(bytes))).toEqual(bytes);
      }),
    );
    expect(encodeBase64Url(new TextEncoder().encode('foobar'))).toBe('Zm9vYmFy');
    expect(encodeBase64Url(new TextEncoder().encode('fo'))).toBe('Zm8');
    expect(encodeBase64Url(Uint8Array.of(0xfb, 0xff))).toBe('-_8');
    expect(decodeBase64Url('Zm9v+mFy')).toBeNull();
    expect(decodeBase64Url('Z')).toBeNull();
  });
});

// ----- random workspaces --------------------------------------------------------------------
const noNegZero = (x: number): number => (Object.is(x, -0) ? 0 : x);
const rate = fc.double({ min: -0.1, max: 1, noNaN: true }).map(noNegZero);
const price = fc.double({ min: 0.01, max: 1000, noNaN: true });
const tenor = fc.constantFrom('1W', '1M', '3M', '6M', '1Y', '2Y', '5Y', '7Y', '10Y', '30Y');
const dayCount = fc.constantFrom('ACT/360', 'ACT/365F', '30/360', 'ACT/ACT-ISDA');
const quote = fc.oneof(
  fc.record({ kind: fc.constant('deposit'), tenor, rate, dayCount }, { requiredKeys: ['kind', 'tenor', 'rate'] }),
  fc.record({ kind: fc.constant('swap'), tenor, rate, frequency: fc.constantFrom(1, 2, 4), enabled: fc.boolean() }, { requiredKeys: ['kind', 'tenor', 'rate'] }),
  fc.record({ kind: fc.constant('bill'), tenor: fc.constantFrom('1M', '3M', '6M'), price }),
  fc.record({ kind: fc.constant('zero'), tenor, rate, compounding: fc.constantFrom('annual', 'continuous', 'semiannual') }, { requiredKeys: ['kind', 'tenor', 'rate'] }),
  fc.record({ kind: fc.constant('bond'), tenor: fc.constantFrom('2Y', '5Y', '10Y'), coupon: fc.double({ min: 0, max: 0.5, noNaN: true }).map(noNegZero), cleanPrice: price }),
);
const bp = fc.double({ min: -5000, max: 5000, noNaN: true }).map(noNegZero);
const shape = fc.oneof(
  fc.record({ kind: fc.constant('parallel'), bp }),
  fc.record({ kind: fc.constant('twist'), short: tenor, pivot: tenor, long: tenor, bp }),
  fc.record({ kind: fc.constant('butterfly'), short: tenor, belly: tenor, long: tenor, wingsBp: bp, bellyBp: bp }),
  fc.record({ kind: fc.constant('key-rate'), points: fc.array(fc.record({ at: tenor, bp }), { minLength: 1, maxLength: 30 }) }),
);
const scenario = fc.record({ id: fc.string({ minLength: 1, maxLength: 40 }).filter((s) => s.trim() !== ''), name: fc.string({ minLength: 1, maxLength: 80 }).filter((s) => s.trim() !== ''), space: fc.constantFrom('zero', 'quotes'), shape });
const workspace = fc
  .record(
    {
      format: fc.constant('tenorscope-workspace'),
      version: fc.constant(1),
      settlement: fc.date({ min: new Date('2000-01-01T00:00:00Z'), max: new Date('2090-12-31T00:00:00Z'), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10)),
      curve: fc.record({ dayCount: fc.constantFrom('ACT/365F', 'ACT/360', '30/360'), interpolation: fc.constantFrom('monotone-convex', 'linear-zero', 'log-linear-discount'), extrapolation: fc.constantFrom('none', 'flat-forward') }),
      quotes: fc.array(quote, { maxLength: 60 }),
      scenarios: fc.uniqueArray(scenario, { maxLength: 8, selector: (s) => s.id }),
      note: fc.string({ unit: 'binary', maxLength: 1000 }).filter((s) => s.length <= 2000),
      view: fc.dictionary(fc.stringMatching(/^[A-Za-z][A-Za-z0-9]{0,12}$/), fc.oneof(fc.string({ maxLength: 50 }), fc.boolean(), fc.integer(), fc.constant(null), fc.array(fc.string({ maxLength: 20 }), { maxLength: 5 })), { maxKeys: 6 }),
    },
    { requiredKeys: ['format', 'version', 'settlement', 'quotes'] },
  )
  .map((d) => d as Record<string, unknown>);

const cell = fc.string({ maxLength: 64 });
const row = fc.record({ id: fc.string({ minLength: 1, maxLength: 20 }), enabled: fc.boolean(), kind: cell, maturity: cell, rate: cell, price: cell, coupon: cell, frequency: cell, dayCount: cell });
const workbenchDoc = fc
  .record(
    {
      format: fc.constant('tenorscope-workbench'),
      version: fc.constant(1),
      settlement: fc.string({ maxLength: 40 }),
      curve: fc.record({ dayCount: fc.string({ maxLength: 12 }), interpolation: fc.constantFrom('monotone-convex', 'linear-zero'), extrapolation: fc.constantFrom('none', 'flat-forward') }),
      quoteUnit: fc.constantFrom('percent', 'decimal'),
      quotes: fc.array(row, { maxLength: 40 }),
      display: fc.record({ compounding: fc.constantFrom('continuous', 'annual'), showPar: fc.boolean(), parFrequency: fc.constantFrom(1, 2) }),
      scenarios: fc.uniqueArray(scenario, { maxLength: 4, selector: (s) => s.id }),
      note: fc.string({ maxLength: 300 }),
    },
    { requiredKeys: ['format', 'version', 'settlement', 'curve', 'quoteUnit', 'quotes', 'display'] },
  )
  .map((d) => d as Record<string, unknown>);

describe('property: random workspaces encode to a link and decode to the identical document (fast-check)', () => {
  it('round-trips', async () => {
    await fc.assert(
      fc.asyncProperty(workspace, async (doc) => {
        const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(doc));
        if (!outcome.ok) throw new Error(outcome.message);
        // Version 1 documents come back as version 2 (settlement renamed valuationDate, in its place).
        expect(outcome.checked.document).toEqual(migrateDocument(doc));
        expect(JSON.stringify(outcome.checked.document)).toBe(JSON.stringify(migrateDocument(doc)));
      }),
      { numRuns: 150 },
    );
  });
  it('round-trips workbench documents with arbitrary typed cells', async () => {
    await fc.assert(
      fc.asyncProperty(workbenchDoc, async (doc) => {
        const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(doc));
        if (!outcome.ok) throw new Error(outcome.message);
        expect(outcome.checked.document).toEqual(doc);
      }),
      { numRuns: 100 },
    );
  });
});

// ----- fuzz: untrusted fragments ------------------------------------------------------------
const saved = { format: 'tenorscope-workspace', version: 1, settlement: '2026-11-30', quotes: [{ kind: 'swap', tenor: '5Y', rate: 0.031 }], note: 'mine' };
const savedCopy = structuredClone(saved);

async function expectSafe(fragment: string): Promise<void> {
  const opened = await openLink(fragment, saved);
  expect(opened.saved).toBe(saved);
  expect(saved).toEqual(savedCopy);
  if (!opened.fromLink) expect(opened.current).toBe(saved);
  else {
    const again = await decodeWorkspaceLink(fragment);
    expect(again.ok).toBe(true);
  }
}

describe('fuzz: bad fragments never throw and never change the saved workspace', () => {
  it('random text', async () => {
    await fc.assert(fc.asyncProperty(fc.string({ unit: 'binary', maxLength: 400 }), async (s) => expectSafe(s)), { numRuns: 300 });
    await fc.assert(fc.asyncProperty(fc.stringMatching(/^#?ws1\.[A-Za-z0-9_-]{0,300}$/), async (s) => expectSafe(s)), { numRuns: 300 });
  });

  it('mutated fixture links: flipped, dropped, inserted characters and truncations', async () => {
    const good = await encodeWorkspaceLink(fixture);
    const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_.%#';
    const mutation = fc.record({ at: fc.nat({ max: good.length - 1 }), op: fc.constantFrom('flip', 'drop', 'insert', 'cut'), ch: fc.constantFrom(...alphabet) });
    await fc.assert(
      fc.asyncProperty(fc.array(mutation, { minLength: 1, maxLength: 4 }), async (ms) => {
        let s = good;
        for (const m of ms) {
          const at = Math.min(m.at, s.length);
          if (m.op === 'flip') s = s.slice(0, at) + m.ch + s.slice(at + 1);
          else if (m.op === 'drop') s = s.slice(0, at) + s.slice(at + 1);
          else if (m.op === 'insert') s = s.slice(0, at) + m.ch + s.slice(at);
          else s = s.slice(0, at);
        }
        await expectSafe(s);
      }),
      { numRuns: 300 },
    );
  });

  it('valid compression around content that is not a workspace', async () => {
    const json = fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v));
    await fc.assert(fc.asyncProperty(json, async (text) => expectSafe(await packed(text))), { numRuns: 150 });
    await fc.assert(fc.asyncProperty(fc.jsonValue({ maxDepth: 3 }), async (d) => expectSafe(await packed(JSON.stringify({ b: 'x', d })))), { numRuns: 150 });
    await expectSafe(await packed('not json'));
    await expectSafe(`ws1.${encodeBase64Url(await deflateRaw(Uint8Array.of(0xff, 0xfe, 0x80)))}`);
  });

  it('oversized fragments are refused before any work', async () => {
    const long = 'ws1.' + 'A'.repeat(MAX_FRAGMENT_CHARS);
    const outcome = await decodeWorkspaceLink(long);
    expect(!outcome.ok && outcome.failure).toBe('too-long');
    await expectSafe(long);
  });

  it('an inflating link (a few KB that expand past 1 MB) is stopped by the byte counter', async () => {
    const bomb = await packed(`{"b":"x","d":"${' '.repeat(20 * 1024 * 1024)}"}`);
    expect(bomb.length).toBeLessThan(MAX_FRAGMENT_CHARS);
    const outcome = await decodeWorkspaceLink(bomb);
    expect(!outcome.ok && outcome.failure).toBe('too-large');
    await expectSafe(bomb);
  });

  it('documents over the caps inside a valid link are refused with the cap named', async () => {
    const many = { ...fixture, quotes: Array.from({ length: 501 }, () => ({ kind: 'swap', tenor: '5Y', rate: 0.03 })) };
    const outcome = await decodeWorkspaceLink(await encodeWorkspaceLink(many));
    expect(!outcome.ok && outcome.message).toContain('500');
    await expectSafe(await encodeWorkspaceLink({ ...fixture, note: 'n'.repeat(2001) }));
  });
});
