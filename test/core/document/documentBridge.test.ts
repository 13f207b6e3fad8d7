// The workbench's document and the engine's document, each read where the other is written: the
// conversions are exact (the same curve to the last bit) or refused with the quote and field named.
// Oracle: the engine's own build of the original document (buildCurve), which other tests hold to
// published sources; here only the identity of the two paths is claimed.
import { README_DOCUMENT } from '../../helpers/readmeDocument.ts';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildCurve, engineFromAnyDocument, toEngineDocument, unknownSettings, validateDocument, workbenchFromEngine, type Curve } from '../../../src/core/index.ts';
import { demoWorkspace } from '../../../src/state/demoWorkspace.ts';

const fixture = (p: string) => JSON.parse(readFileSync(new URL(`../../fixtures/${p}`, import.meta.url), 'utf8')) as Record<string, unknown>;
const README_DOC = README_DOCUMENT;

const sameCurve = (a: Curve, b: Curve) => {
  expect(b.pillars.map((p) => p.date)).toEqual(a.pillars.map((p) => p.date));
  for (const p of a.pillars) expect(b.lnDiscountAt(p.t)).toBe(a.lnDiscountAt(p.t));
  for (let t = 0.01; t < a.pillars[a.pillars.length - 1]!.t; t += 0.37) expect(b.forwardAt(t)).toBe(a.forwardAt(t));
};

let n = 0;
const id = () => `b${n++}`;

describe('workbenchFromEngine(engine document)', () => {
  it.each([
    ['the README example', README_DOC],
    ['the 40-quote market fixture', fixture('market40/market40.json')],
  ])('opens %s in the sheet and builds the same curve to the last bit', (_name, doc) => {
    const wb = workbenchFromEngine(doc, id);
    if (!wb.ok) throw new Error(JSON.stringify(wb.errors));
    expect(wb.value.quoteUnit).toBe('decimal');
    const direct = buildCurve(doc);
    const viaSheet = buildCurve(toEngineDocument(wb.value).doc);
    expect(viaSheet.errors).toEqual(direct.errors);
    sameCurve(direct.curve!, viaSheet.curve!);
  });

  it('refuses a zero quoted in a compounding the sheet has no column for, naming the quote and field', () => {
    const doc = { ...README_DOC, quotes: [...README_DOC.quotes, { kind: 'zero', tenor: '2Y', rate: 0.033, compounding: 'continuous' }] };
    const wb = workbenchFromEngine(doc, id);
    expect(wb.ok).toBe(false);
    if (wb.ok) return;
    expect(wb.errors).toHaveLength(1);
    expect(wb.errors[0]!.path).toBe('quotes[5]');
    expect(wb.errors[0]!.message).toMatch(/quotes\[5\] \(a zero maturing 2029-03-10\): its compounding \("continuous"\) has no column in the sheet; the file was not opened/);
  });

  it('refuses the shared-workspace fixture, whose zeros quote semiannual rates, and names each such zero', () => {
    const wb = workbenchFromEngine(fixture('share/workspace40.json'), id);
    expect(wb.ok).toBe(false);
    if (wb.ok) return;
    expect(wb.errors.length).toBeGreaterThan(0);
    for (const e of wb.errors) expect(e.message).toMatch(/\(a zero maturing \d{4}-\d\d-\d\d\): its compounding \("semiannual"\) has no column in the sheet/);
  });

  it('keeps a field whose value is what the sheet implies (eom false on a swap, annual compounding on a zero)', () => {
    const doc = { ...README_DOC, quotes: [...README_DOC.quotes, { kind: 'swap', tenor: '7Y', rate: 0.038, eom: false }, { kind: 'zero', tenor: '2Y', rate: 0.033, compounding: 'annual' }] };
    expect(workbenchFromEngine(doc, id).ok).toBe(true);
  });

  it('passes on the engine\'s own refusal', () => {
    const wb = workbenchFromEngine({ ...README_DOC, curve: { dayCount: 'ACT/999' } }, id);
    expect(wb.ok).toBe(false);
    if (!wb.ok) expect(wb.errors[0]!.code).toBe('unknown-identifier');
  });
});

describe('engineFromAnyDocument(document)', () => {
  it('hands an engine document through unchanged', () => {
    expect(engineFromAnyDocument(README_DOC)).toEqual({ doc: README_DOC, errors: [], rowOfQuote: null });
  });

  it('reads the workbench demo as the workbench does: the same curve', () => {
    const demo = demoWorkspace(id);
    const { doc, errors } = engineFromAnyDocument(JSON.parse(JSON.stringify(demo)));
    expect(errors).toEqual([]);
    sameCurve(buildCurve(toEngineDocument(demo).doc).curve!, buildCurve(doc).curve!);
  });

  it('names each wrong cell by row (from 1) and column', () => {
    const demo = demoWorkspace(id);
    const quotes = demo.quotes.map((q, i) => (i === 2 ? { ...q, rate: 'abc' } : q));
    const { errors } = engineFromAnyDocument({ ...demo, quotes });
    expect(errors).toHaveLength(1);
    expect(errors[0]!.path).toBe('quotes[2].rate');
    expect(errors[0]!.message).toMatch(/^row 3, Rate \/ yield: /);
  });

  it('round-trips the sheet: workbench -> engine -> workbench -> engine builds the same curve', () => {
    const demo = demoWorkspace(id);
    const once = engineFromAnyDocument(demo).doc;
    const wb = workbenchFromEngine(once, id);
    if (!wb.ok) throw new Error(JSON.stringify(wb.errors));
    sameCurve(buildCurve(once).curve!, buildCurve(toEngineDocument(wb.value).doc).curve!);
  });
});

describe('market conventions of the workbench (curve.conventions)', () => {
  // The set's fields are MARKET-CONVENTIONS.md section d's (see test/core/kinds/conventionSets.test.ts).
  const wb = (conventions?: string) => {
    const d = demoWorkspace(id);
    const quotes = d.quotes.map((q, i) => (i === 13 ? { ...q, kind: 'ois', maturity: '4Y', rate: '3.85' } : q));
    return { ...d, quotes, curve: { ...d.curve, ...(conventions === undefined ? {} : { conventions }) } };
  };
  it('goes on every deposit and overnight-swap quote of the engine document, and not into its curve settings', () => {
    const e = toEngineDocument(wb('usd-sofr')).doc as { curve: Record<string, unknown>; quotes: Record<string, unknown>[] };
    expect(e.curve).not.toHaveProperty('conventions');
    for (const q of e.quotes) expect(q.conventions, String(q.kind)).toBe(q.kind === 'deposit' || q.kind === 'ois' ? 'usd-sofr' : undefined);
    const none = toEngineDocument(wb('none')).doc as { quotes: Record<string, unknown>[] };
    expect(none.quotes.some((q) => 'conventions' in q)).toBe(false);
    expect(toEngineDocument(wb()).doc).toEqual(toEngineDocument(wb('none')).doc);
  });
  it('moves the deposits to spot: the 1W deposit runs from 2026-12-17 (T+2 on US government securities days) to 2026-12-24', () => {
    const b = buildCurve(toEngineDocument(wb('usd-sofr')).doc, { skipInvalid: true });
    expect(b.errors).toEqual([]);
    expect(b.workspace!.quotes[0]).toMatchObject({ kind: 'deposit', start: '2026-12-17', maturity: '2026-12-24', calendar: 'us-gov-securities', spotLag: 2 });
    for (const r of b.repricing) expect(Math.abs(r.repricingError)).toBeLessThanOrEqual(r.unit === 'price' ? 1e-11 : 1e-14);
  });
  it('an engine document whose deposits and swaps all name one set opens with that setting and the same curve; mixed sets open row by row, each in its Conventions cell, with the same curve', () => {
    const engine = toEngineDocument(wb('eur-estr')).doc;
    const back = workbenchFromEngine(engine, id);
    if (!back.ok) throw new Error(JSON.stringify(back.errors));
    expect(back.value.curve.conventions).toBe('eur-estr');
    sameCurve(buildCurve(engine).curve!, buildCurve(toEngineDocument(back.value).doc).curve!);
    const mixed = { ...engine, quotes: (engine.quotes as Record<string, unknown>[]).map((q, i) => (i === 0 ? { ...q, conventions: 'gbp-sonia' } : q)) };
    const open = workbenchFromEngine(mixed, id);
    if (!open.ok) throw new Error(JSON.stringify(open.errors));
    expect(open.value.curve.conventions).toBeUndefined();
    const kinds = (mixed.quotes as Record<string, unknown>[]).map((q) => q.kind);
    expect(open.value.quotes.map((r) => r.terms ?? '')).toEqual(kinds.map((k, i) => (i === 0 ? 'gbp-sonia' : k === 'deposit' || k === 'ois' ? 'eur-estr' : '')));
    sameCurve(buildCurve(mixed).curve!, buildCurve(toEngineDocument(open.value).doc).curve!);
  });
  it('a set this build does not know opens the document read-only (an unknown setting), never as none', () => {
    expect(unknownSettings({ ...wb('jpy-tona'), curve: { ...wb().curve, conventions: 'jpy-tona' } })).toContainEqual(expect.objectContaining({ path: 'curve.conventions', value: '"jpy-tona"', fallback: 'none' }));
  });
});

describe('calendar edits of the workbench (calendars)', () => {
  const wb = () => {
    const d = demoWorkspace(id);
    return { ...d, curve: { ...d.curve, conventions: 'eur-estr' }, calendars: { target: { add: ['2026-12-16'], remove: [] } } };
  };
  it('go into the engine document as its version 2 calendars section, and a file or link with them validates and keeps them', () => {
    const e = toEngineDocument(wb()).doc;
    expect(e.calendars).toEqual({ target: { add: ['2026-12-16'], remove: [] } });
    // The demo values on Tuesday 2026-12-15; with the 16th closed, €STR spot (T+2 on TARGET) is Friday the 18th.
    expect((buildCurve(e, { skipInvalid: true }).workspace!.quotes[0] as { start: string }).start).toBe('2026-12-18');
    const checked = validateDocument(JSON.parse(JSON.stringify(wb())));
    expect(checked.ok && checked.value.document.calendars).toEqual({ target: { add: ['2026-12-16'], remove: [] } });
  });
  it('an engine document with calendars opens in the workbench with them', () => {
    const e = toEngineDocument(wb()).doc;
    const back = workbenchFromEngine(e, id);
    if (!back.ok) throw new Error(JSON.stringify(back.errors));
    expect(back.value.calendars).toEqual({ target: { add: ['2026-12-16'], remove: [] } });
  });
  it('a calendar of the workspace\'s own joined to the set\'s: the rows\' calendar is target+desk-days in the engine document, and the file opens back with the join and the same curve', () => {
    const joined = { ...wb(), customCalendars: { 'desk-days': { holidays: ['2026-12-17'] } }, curve: { ...wb().curve, joinCalendar: 'desk-days' } };
    const e = toEngineDocument(joined).doc as { quotes: Record<string, unknown>[]; customCalendars: unknown };
    expect(e.customCalendars).toEqual({ 'desk-days': { holidays: ['2026-12-17'] } });
    expect(e.quotes.filter((q) => q.kind === 'deposit').every((q) => q.calendar === 'target+desk-days')).toBe(true);
    // The 16th closed on TARGET (this workspace's edit) and the 17th on desk-days: €STR spot from Tuesday the 15th is Monday the 21st.
    expect((buildCurve(e, { skipInvalid: true }).workspace!.quotes[0] as { start: string }).start).toBe('2026-12-21');
    const back = workbenchFromEngine(e, id);
    if (!back.ok) throw new Error(JSON.stringify(back.errors));
    expect(back.value.curve).toMatchObject({ conventions: 'eur-estr', joinCalendar: 'desk-days' });
    expect(back.value.customCalendars).toEqual({ 'desk-days': { holidays: ['2026-12-17'] } });
    sameCurve(buildCurve(e, { skipInvalid: true }).curve!, buildCurve(toEngineDocument(back.value).doc, { skipInvalid: true }).curve!);
  });
  it('a malformed calendars section in a link is refused by its shape, naming the field', () => {
    const bad = validateDocument({ ...JSON.parse(JSON.stringify(wb())), calendars: { target: { add: [20261216] } } });
    expect(!bad.ok && bad.errors.map((x) => x.path)).toEqual(['calendars']);
  });
});
