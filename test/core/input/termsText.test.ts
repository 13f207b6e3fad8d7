// The sheet's Conventions cell (input/termsText.ts) and the workspace's joined calendar.
// Sources: the convention sets' values are MARKET-CONVENTIONS.md sections c and d as
// src/core/kinds/conventionSets.ts holds them (held to that table by conventionSets.test.ts):
// €STR OIS T+2 on TARGET, payment lag 1, ACT/360; SOFR deposits T+2 on the US government
// securities calendar. TARGET closes Good Friday 26 March and Easter Monday 29 March 2027 (ECB,
// held in test/core/time/calendars.test.ts). The quotes and the desk calendar are invented.
import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  engineFromAnyDocument,
  parseRow,
  parseTermsText,
  quoteDates,
  readPastedBlock,
  rowConventions,
  rowTermsOf,
  termsText,
  toEngineDocument,
  validateDocument,
  workbenchFromEngine,
  type QuoteRow,
} from '../../../src/core/index.ts';
import { runCurveCommand } from '../../../src/cli/curveCommand.ts';
import { demoWorkspace } from '../../../src/state/demoWorkspace.ts';

let n = 0;
const id = () => `r${n++}`;
const row = (cells: Partial<QuoteRow>): QuoteRow => ({ id: id(), enabled: true, kind: 'ois', maturity: '1Y', rate: '2.4%', price: '', coupon: '', frequency: '', dayCount: '', ...cells });

describe('parseTermsText(cell)', () => {
  it('reads a set and its overrides into engine fields, and termsText writes them back to the same reading', () => {
    const p = parseTermsText('eur-estr, spot lag 1; calendar target+england-wales, rule following, payment lag 0, no eom, float day count act/365f');
    expect(p).toEqual({
      ok: true,
      value: { set: 'eur-estr', fields: { spotLag: 1, calendar: 'target+england-wales', businessDay: 'following', paymentLag: 0, eom: false, floatDayCount: 'ACT/365F' } },
    });
    if (!p.ok) return;
    const text = termsText(p.value);
    expect(text).toBe('eur-estr, calendar target+england-wales, spot lag 1, rule following, payment lag 0, eom off, float day count ACT/365F');
    expect(parseTermsText(text)).toEqual(p);
    expect(parseTermsText('  ')).toEqual({ ok: true, value: { set: null, fields: {} } });
  });

  it('an unknown set or field lists the sets and the field words; a lag that is not whole, a field given twice and a set after a field say so', () => {
    const msg = (t: string) => {
      const p = parseTermsText(t);
      return p.ok ? '' : p.message;
    };
    expect(msg('jpy-tona')).toMatch(/"jpy-tona" is not a convention set or a field; the sets are usd-sofr, eur-estr, gbp-sonia, us-treasury, euro-govt, uk-gilt, eur-euribor-3m, eur-euribor-6m, then fields such as calendar target, spot lag 2/);
    expect(msg('usd-sofr, fixing lag 2')).toMatch(/"fixing lag 2" is not a field this cell takes/);
    expect(msg('spot lag 1.5')).toMatch(/spot lag takes a whole number of business days, such as spot lag 2, not "1.5"/);
    expect(msg('spot lag 1, spot lag 2')).toMatch(/spot lag is given twice/);
    expect(msg('spot lag 1, usd-sofr')).toMatch(/the convention set \(usd-sofr\) comes first/);
  });
});

describe('a row with a Conventions cell', () => {
  it('becomes an engine quote naming its set with its overrides, whose spot moves by them: eur-estr from Wednesday 2027-03-24 is Tuesday 30 March over Easter, spot lag 1 Thursday the 25th', () => {
    const start = (terms: string) => {
      const q = parseRow(row({ terms }), 'percent').quote!;
      const b = buildCurve({ format: 'tenorscope-workspace', version: 2, valuationDate: '2027-03-24', curve: { interpolation: 'log-linear-discount' }, quotes: [q] });
      expect(b.errors).toEqual([]);
      return { q, start: quoteDates(b.workspace!.quotes[0]!, '2027-03-24').start };
    };
    expect(start('eur-estr')).toEqual({ q: { kind: 'ois', tenor: '1Y', rate: 0.024, conventions: 'eur-estr' }, start: '2027-03-30' });
    expect(start('eur-estr, spot lag 1')).toMatchObject({ q: { conventions: 'eur-estr', spotLag: 1 }, start: '2027-03-25' });
    // An empty cell leaves the row as it always read: no field added.
    expect(parseRow(row({ terms: '' }), 'percent').quote).toEqual({ kind: 'ois', tenor: '1Y', rate: 0.024 });
    expect(parseRow(row({}), 'percent').quote).toEqual({ kind: 'ois', tenor: '1Y', rate: 0.024 });
  });

  it('rowConventions lists what the row overrides against its set, and the fields no set fills as given', () => {
    const c = rowConventions('ois', rowTermsOf('eur-estr, payment lag 2'), '', 'ACT/365F', undefined)!;
    expect(c.set).toBe('eur-estr');
    expect(c.fromWorkspace).toBe(false);
    expect(c.title).toMatch(/this row overrides payment lag 2 \(the set’s 1\), day count ACT\/365F \(the set’s ACT\/360\)/);
    const w = rowConventions('deposit', rowTermsOf('spot lag 0'), '', '', 'usd-sofr')!;
    expect(w).toMatchObject({ set: 'usd-sofr', fromWorkspace: true });
    expect(w.title).toMatch(/overrides spot lag 0 \(the set’s 2\)/);
    expect(rowConventions('bond', rowTermsOf(''), '', '', 'usd-sofr')).toBeNull(); // the set fills no bond
    expect(rowConventions('swap', rowTermsOf('calendar target'), '', '', undefined)!.title).toMatch(/^this row gives calendar target$/);
  });

  it('an engine document whose quotes name their own sets and overrides opens in the sheet with them in the Conventions cells, and builds the same curve', () => {
    const doc = {
      format: 'tenorscope-workspace',
      version: 2,
      valuationDate: '2027-03-24',
      curve: { interpolation: 'monotone-convex' },
      quotes: [
        { kind: 'deposit', tenor: '1M', rate: 0.0234, conventions: 'eur-estr', spotLag: 1 },
        { kind: 'ois', tenor: '6M', rate: 0.0239, conventions: 'eur-estr' },
        { kind: 'ois', tenor: '2Y', rate: 0.0252, conventions: 'gbp-sonia', paymentLag: 2 },
        { kind: 'swap', tenor: '5Y', rate: 0.0268, calendar: 'target', businessDay: 'modified-following' },
      ],
    };
    const wb = workbenchFromEngine(doc, id);
    if (!wb.ok) throw new Error(JSON.stringify(wb.errors));
    expect(wb.value.quotes.map((r) => r.terms ?? '')).toEqual(['eur-estr, spot lag 1', 'eur-estr', 'gbp-sonia, payment lag 2', 'calendar target, rule modified-following']);
    const a = buildCurve(doc).curve!;
    const b = buildCurve(toEngineDocument(wb.value).doc).curve!;
    expect(b.pillars).toEqual(a.pillars);
  });
});

describe('the Conventions cell in files and links (the workbench document)', () => {
  it('is kept by the document check as typed; a row saved before the column existed (no terms key) still reads; a cell over the cell cap is refused naming it', () => {
    const d = demoWorkspace(id);
    const withTerms = { ...d, quotes: d.quotes.map((r, i) => (i === 0 ? { ...r, terms: 'usd-sofr, spot lag 1' } : r)) };
    const ok = validateDocument(JSON.parse(JSON.stringify(withTerms)));
    if (!ok.ok) throw new Error(JSON.stringify(ok.errors));
    expect((ok.value.document as { quotes: { terms?: string }[] }).quotes[0]!.terms).toBe('usd-sofr, spot lag 1');
    const old = { ...d, quotes: d.quotes.map(({ terms: _t, ...r }) => r) };
    expect(validateDocument(JSON.parse(JSON.stringify(old))).ok).toBe(true);
    const long = { ...d, quotes: d.quotes.map((r, i) => (i === 0 ? { ...r, terms: 'x'.repeat(65) } : r)) };
    const bad = validateDocument(long);
    expect(!bad.ok && bad.errors.map((e) => e.path)).toEqual(['quotes[0].terms']);
  });
});

describe('a pasted block with a Conventions column', () => {
  it('maps the header "Conventions" (or "Convention set", "Terms") to the cell, which reads as typed', () => {
    const block = readPastedBlock('Kind\tTenor\tRate\tConvention set\nois\t1Y\t2.4\teur-estr, spot lag 1\nois\t2Y\t2.5\t');
    expect(block.columns.map((c) => c.column)).toEqual(['kind', 'maturity', 'rate', 'terms']);
    expect(block.rows.map((r) => r.terms)).toEqual(['eur-estr, spot lag 1', '']);
    expect(parseRow({ id: 'p', enabled: true, ...block.rows[0]! } as QuoteRow, 'percent').quote).toMatchObject({ conventions: 'eur-estr', spotLag: 1 });
  });
});

describe('a joined calendar with no market conventions (curve.joinCalendar)', () => {
  const joined = (conventions?: string) => {
    const d = demoWorkspace(id);
    return { ...d, customCalendars: { 'desk-days': { holidays: ['2026-12-16'] } }, curve: { ...d.curve, joinCalendar: 'desk-days', ...(conventions ? { conventions } : {}) } };
  };

  it('is said as a warning naming the setting and what to do, and the engine document is as without it', () => {
    const conv = toEngineDocument(joined());
    expect(conv.notes).toEqual([expect.objectContaining({ path: 'curve.joinCalendar', quote: null, code: 'not-applied' })]);
    expect(conv.notes[0]!.message).toMatch(/the calendar "desk-days" .* no market conventions are chosen, .* changes nothing; choose Market conventions in the curve settings, or clear the joined calendar/);
    const { joinCalendar: _j, ...curve } = joined().curve;
    expect(conv.doc).toEqual(toEngineDocument({ ...joined(), curve }).doc);
  });

  it('with market conventions it takes effect and no warning is given: the desk closes 16 December, so SOFR spot from the 15th is the 18th', () => {
    const conv = toEngineDocument(joined('usd-sofr'));
    expect(conv.notes).toEqual([]);
    const b = buildCurve(conv.doc, { skipInvalid: true });
    expect((b.workspace!.quotes[0] as { start: string }).start).toBe('2026-12-18');
  });

  it('the curve command reading the workbench file gives the same warning, and still builds the curve', async () => {
    expect(engineFromAnyDocument(joined()).warnings).toEqual(toEngineDocument(joined()).notes);
    const r = await runCurveCommand(['-'], () => JSON.stringify(joined()));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { warnings: { path: string; code: string; message: string }[] };
    expect(out.warnings).toContainEqual(expect.objectContaining({ path: 'curve.joinCalendar', code: 'not-applied' }));
  });
});
