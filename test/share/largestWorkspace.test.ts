// The largest workspace the caps allow (src/core/export/limits.ts: 500 quotes, 50 key-rate
// scenarios of 30 points with 80-character names, a 2,000-character note, 20 snapshots, a strategy
// with 400 typed legs, a view) goes out through the app's own ways out and comes back in: as a link
// (Copy link) and as a workspace file. With realistic cell text it fits a link; with every cell at
// its 64-character cap it does not, and the link encoder says so before making a link the app
// would refuse. Invented data.
import { LIMITS, parseDocumentText, serialiseDocument, linkDocument, type DocumentOutcome } from '../../src/core/index.ts';
import { DEFAULT_STRATEGY, validateStrategy } from '../../src/core/roll/strategyInputs.ts';
import { WORKBENCH_FORMAT, DEFAULT_DISPLAY } from '../../src/core/index.ts';
import { decodeWorkspaceLink, encodeWorkspaceLinkChecked, MAX_FRAGMENT_CHARS } from '../../src/share/linkCodec.ts';

/** A small deterministic generator (the test must not depend on Math.random). */
function lcg(seed: number): () => number {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return x / 2 ** 32;
  };
}

const KINDS = ['deposit', 'bill', 'zero', 'bond', 'swap'] as const;
const DAY_COUNTS = ['ACT/360', 'ACT/365F', '30/360', 'ACT/ACT-ICMA', '30E/360'];

/** A realistic row: every cell a value a desk would type, long forms where there are any (dates, many decimals). */
function realisticRow(i: number, r: () => number): Record<string, unknown> {
  const kind = KINDS[i % KINDS.length]!;
  const y = 2027 + Math.floor(i / 12) % 30;
  const m = String(1 + (i % 12)).padStart(2, '0');
  const d = String(1 + Math.floor(r() * 28)).padStart(2, '0');
  const pct = (lo: number, hi: number, dp: number): string => (lo + r() * (hi - lo)).toFixed(dp);
  return {
    id: `q7k2m${i.toString(36)}`,
    enabled: r() > 0.05,
    kind,
    maturity: `${y}-${m}-${d}`,
    rate: kind === 'bond' || kind === 'zero' ? '' : `${pct(2.5, 5.5, 6)}%`,
    price: kind === 'bond' || kind === 'zero' ? pct(85, 105, 6) : '',
    coupon: kind === 'bond' ? `${pct(0.5, 6, 4)}%` : '',
    frequency: kind === 'bond' || kind === 'swap' ? String([1, 2, 4, 12][i % 4]) : '',
    dayCount: DAY_COUNTS[i % DAY_COUNTS.length]!,
  };
}

/** A row with every text cell at the cell cap: 64 characters that compress badly. */
function fullRow(i: number, r: () => number): Record<string, unknown> {
  const cell = (): string => Array.from({ length: LIMITS.cell }, () => '0123456789.%-+ ,abcdefXYZ'[Math.floor(r() * 25)]).join('');
  return { id: `q${String(i).padStart(LIMITS.cell - 1, '0')}`, enabled: true, kind: cell(), maturity: cell(), rate: cell(), price: cell(), coupon: cell(), frequency: cell(), dayCount: cell() };
}

function largest(row: (i: number, r: () => number) => Record<string, unknown>): Record<string, unknown> {
  const r = lcg(20261215);
  const name = (i: number): string => `Scenario ${i}: key-rate moves across the curve, a long descriptive name that runs on`.padEnd(LIMITS.name, '.').slice(0, LIMITS.name);
  const tenors = Array.from({ length: LIMITS.keyRatePoints }, (_, k) => `${k + 1}Y`);
  const quotes = Array.from({ length: LIMITS.quotes }, (_, i) => row(i, r));
  const engineQuotes = Array.from({ length: LIMITS.quotes }, (_, i) => ({ kind: 'swap', tenor: `${1 + (i % 30)}Y`, rate: 0.03 + i * 1e-5 }));
  return {
    format: WORKBENCH_FORMAT,
    version: 1,
    settlement: '2026-12-15',
    curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'flat-forward' },
    quoteUnit: 'percent',
    quotes,
    display: { ...DEFAULT_DISPLAY },
    scenarios: Array.from({ length: LIMITS.scenarios }, (_, i) => ({
      id: `s${i}`.padEnd(LIMITS.id, 'x'),
      name: name(i),
      space: i % 2 ? 'zero' : 'quotes',
      shape: { kind: 'key-rate', points: tenors.map((at) => ({ at, bp: Math.round((r() - 0.5) * 2 * LIMITS.bp * 100) / 100 })) },
    })),
    snapshots: Array.from({ length: LIMITS.snapshots }, (_, i) => ({
      name: name(i),
      takenAt: '2026-12-15T17:00:00.000Z',
      settlement: '2026-12-15',
      curve: { dayCount: 'ACT/365F', interpolation: 'monotone-convex', extrapolation: 'none' },
      quotes: engineQuotes,
      curveHash: 'abcdef0123456789',
    })),
    strategy: { ...DEFAULT_STRATEGY, path: { ...DEFAULT_STRATEGY.path, fill: 'typed', legs: Array.from({ length: 400 }, () => Math.round((0.02 + r() * 0.04) * 1e6) / 1e6) } },
    view: { tab: 'scenarios', chosen: Array.from({ length: LIMITS.viewList }, (_, i) => name(i)) },
    note: Array.from({ length: 40 }, (_, i) => `Desk note ${i}: the curve was built from the morning's quotes, checked against the close.`).join(' ').slice(0, LIMITS.note),
  };
}

const expectOk = (out: DocumentOutcome | { ok: boolean }): void => {
  if (!out.ok) throw new Error(`refused: ${JSON.stringify(out).slice(0, 300)}`);
};

describe('the largest workspace the caps allow', () => {
  it('with realistic cell text: every cap is at its maximum and it is a valid document', () => {
    const doc = largest(realisticRow);
    expect((doc.quotes as unknown[]).length).toBe(LIMITS.quotes);
    expect((doc.scenarios as unknown[]).length).toBe(LIMITS.scenarios);
    expect((doc.snapshots as unknown[]).length).toBe(LIMITS.snapshots);
    expect((doc.note as string).length).toBe(LIMITS.note);
    expect(JSON.stringify(doc.strategy).length).toBeLessThanOrEqual(LIMITS.strategyJson);
    expect(validateStrategy(doc.strategy).errors).toEqual([]);
    expectOk(parseDocumentText(serialiseDocument(doc)));
  });

  it('with realistic cell text: round-trips through its own link and its own file', async () => {
    const doc = largest(realisticRow);
    const link = await encodeWorkspaceLinkChecked(doc);
    expectOk(link);
    const fragment = link.ok ? link.fragment : '';
    console.info(`largest realistic workspace: link fragment ${fragment.length} characters (cap ${MAX_FRAGMENT_CHARS}), file ${serialiseDocument(doc).length} characters`);
    expect(fragment.length).toBeLessThanOrEqual(MAX_FRAGMENT_CHARS);
    const back = await decodeWorkspaceLink(fragment);
    expectOk(back);
    expect(back.ok && back.checked.document).toEqual(linkDocument(doc));
    const file = parseDocumentText(serialiseDocument(doc));
    expectOk(file);
    expect(file.ok && file.value.document).toEqual(doc);
  });

  it('with every cell at its 64-character cap: the file round-trips; the link encoder says it does not fit instead of making a link the app refuses', async () => {
    const doc = largest(fullRow);
    const file = parseDocumentText(serialiseDocument(doc));
    expectOk(file);
    expect(file.ok && file.value.document).toEqual(doc);
    const link = await encodeWorkspaceLinkChecked(doc);
    expect(link.ok).toBe(false);
    expect(!link.ok && link.message).toMatch(/more than the 65,536 a link may have; save a workspace file instead$/);
  });
});
