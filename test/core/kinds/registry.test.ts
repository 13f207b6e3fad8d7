// The quote-kind registry (src/core/kinds) drives every place that used to switch on a kind's
// name: validation, the sheet, paste, compiling, curves by role, quote conventions, own yields,
// quote-space shifts, fit weighting, the bootstrap's first guess and schedules. These checks fail
// when a kind of QUOTE_KINDS has no module, a module lacks a part or contradicts its own schema,
// a paste word is not recognised, or code outside the registry switches on a kind again.
// The quotes are invented test data; the reference for each round trip is the module's own
// inverse (an own yield and back, a shift by zero, a sheet row and back), checked exactly.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  buildCurve,
  compileQuote,
  fixedLegConvention,
  headerColumn,
  KIND_MODULE_LIST,
  kindModule,
  parseKindText,
  parseRow,
  QUOTE_KIND_MODULES,
  QUOTE_KINDS,
  quoteConvention,
  quoteYieldOf,
  sheetDefault,
  shiftQuote,
  toEngineDocument,
  validateWorkspace,
  workbenchFromEngine,
  type Quote,
  type QuoteKind,
  type QuoteRow,
} from '../../../src/core/index.ts';
import { workspaceDoc } from '../../helpers/markets.ts';

const SETTLEMENT = '2027-03-10';

/**
 * Quotes of every kind, each quoted by rate and, where the kind has one, by price (invented).
 * `satisfies` makes a kind added to QUOTE_KINDS without examples here a type error as well.
 */
const EXAMPLES = {
  deposit: [
    { kind: 'deposit', tenor: '3M', rate: 0.0287 },
    // Overnight (settlement to the next business day) and tom-next (a start after settlement, its target read off the curve).
    { kind: 'deposit', tenor: 'ON', rate: 0.0281 },
    { kind: 'deposit', tenor: 'T/N', rate: 0.0283 },
  ],
  bill: [
    { kind: 'bill', maturity: '2027-09-09', discountYield: 0.0285 },
    { kind: 'bill', maturity: '2027-09-09', price: 98.6 },
  ],
  zero: [
    { kind: 'zero', tenor: '1Y', rate: 0.029 },
    { kind: 'zero', tenor: '1Y', price: 97.12 },
  ],
  bond: [
    { kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, frequency: 2, yield: 0.0331 },
    { kind: 'bond', maturity: '2031-09-20', coupon: 0.0325, frequency: 2, cleanPrice: 99.6 },
  ],
  swap: [{ kind: 'swap', tenor: '7Y', rate: 0.0342 }],
  ois: [
    { kind: 'ois', tenor: '5Y', rate: 0.0331 },
    { kind: 'ois', tenor: '18M', rate: 0.0301, frequency: 1, dayCount: 'ACT/365F' },
  ],
  'par-yield': [
    // Above one year a par bond; at one year or less a zero-coupon bond-equivalent yield.
    { kind: 'par-yield', tenor: '10Y', yield: 0.0412 },
    { kind: 'par-yield', tenor: '3M', yield: 0.0395 },
    { kind: 'par-yield', maturity: '2033-05-15', yield: 0.0421, frequency: 2, dayCount: '30/360' },
  ],
  // SOFR futures by contract month, quoted by price only; the sheet's Maturity cell holds the month (and 1M for a one-month contract).
  future: [
    { kind: 'future', month: '2027-06', price: 96.875 },
    { kind: 'future', contract: '1M', month: '2027-04', price: 96.9 },
  ],
  // Forward rate agreements by period in months from spot; the sheet's Maturity cell holds the period.
  fra: [
    { kind: 'fra', period: '3x6', rate: 0.0312 },
    { kind: 'fra', period: '6x12', rate: 0.0318, dayCount: 'ACT/365F' },
  ],
} satisfies Record<QuoteKind, readonly Record<string, string | number>[]>;

/** An OIS with the date conventions, which have no sheet columns yet (README, instrument table). */
const OIS_WITH_CONVENTIONS = { kind: 'ois', tenor: '18M', rate: 0.0301, calendar: 'us-gov-securities', spotLag: 2, paymentLag: 2, businessDay: 'following' };

const validated = (raw: Record<string, string | number>): Quote => {
  const v = validateWorkspace(workspaceDoc([raw], { settlement: SETTLEMENT }));
  expect(v.errors).toEqual([]);
  return v.workspace!.quotes[0]!;
};

/** Every part a module must have, with its type. */
const PARTS: Readonly<Record<string, 'object' | 'function' | 'string'>> = {
  kind: 'string',
  schema: 'object',
  sheet: 'object',
  paste: 'object',
  compile: 'function',
  curves: 'object',
  nodeRole: 'string',
  convention: 'function',
  yieldLabel: 'function',
  priceYield: 'function',
  shift: 'function',
  fit: 'object',
  solver: 'object',
};

describe('the quote-kind registry', () => {
  it('has one module for every kind of QUOTE_KINDS, and no other', () => {
    expect(Object.keys(QUOTE_KIND_MODULES).sort()).toEqual([...QUOTE_KINDS].sort());
    for (const k of QUOTE_KINDS) expect(kindModule(k).kind).toBe(k);
    expect(KIND_MODULE_LIST.map((m) => m.kind)).toEqual([...QUOTE_KINDS]);
  });

  it('gives every module every part', () => {
    for (const m of KIND_MODULE_LIST) {
      for (const [part, type] of Object.entries(PARTS)) expect(typeof (m as unknown as Record<string, unknown>)[part], `${m.kind}.${part}`).toBe(type);
      expect(typeof m.schema.read, `${m.kind}.schema.read`).toBe('function');
      expect(Array.isArray(m.schema.fields), `${m.kind}.schema.fields`).toBe(true);
      expect(typeof m.fit.dollarDuration, `${m.kind}.fit.dollarDuration`).toBe('function');
      expect(m.fit.per100, `${m.kind}.fit.per100`).toBeGreaterThan(0);
      expect(typeof m.fit.richCheap, `${m.kind}.fit.richCheap`).toBe('boolean');
      expect(typeof m.solver.firstRate, `${m.kind}.solver.firstRate`).toBe('function');
      expect(typeof m.curves.discount, `${m.kind}.curves.discount`).toBe('string');
      expect(m.curves[m.nodeRole], `${m.kind}: its node role names a curve it reads`).toBeDefined();
    }
  });

  it('has examples here for every kind', () => {
    expect(Object.keys(EXAMPLES).sort()).toEqual([...QUOTE_KINDS].sort());
  });

  it('keeps each module consistent with its own schema: sheet fields, defaults', () => {
    for (const m of KIND_MODULE_LIST) {
      if (m.sheet.rateField !== null) expect(m.schema.fields, `${m.kind}: the rate column's field`).toContain(m.sheet.rateField);
      else expect(m.sheet.priceField, `${m.kind}: a kind without a rate column is quoted by price`).not.toBeNull();
      if (m.sheet.priceField !== null) expect(m.schema.fields, `${m.kind}: the price column's field`).toContain(m.sheet.priceField);
      expect(m.schema.fields.includes('coupon'), `${m.kind}: coupon column`).toBe(m.sheet.coupon);
      expect(m.schema.fields.includes('frequency'), `${m.kind}: frequency column`).toBe(m.sheet.frequency);
      expect(m.schema.fields.includes('dayCount'), `${m.kind}: day count column`).toBe(typeof m.sheet.dayCount === 'string');
      for (const f of Object.keys(m.schema.defaults)) expect(m.schema.fields, `${m.kind}: default of ${f}`).toContain(f);
      expect(sheetDefault(m.kind, 'dayCount')).toBe(m.schema.defaults.dayCount);
      expect(sheetDefault(` ${m.kind.toUpperCase()} `, 'frequency')).toBe(m.schema.defaults.frequency === undefined ? undefined : String(m.schema.defaults.frequency));
    }
    expect(sheetDefault('toString', 'dayCount')).toBeUndefined();
  });

  it('validates, compiles and describes every example through its module', () => {
    for (const k of QUOTE_KINDS) {
      for (const raw of EXAMPLES[k]) {
        const q = validated(raw);
        const ins = compileQuote(q, SETTLEMENT, 'ACT/365F');
        expect(ins.kind).toBe(k);
        expect(ins.curves).toBe(kindModule(k).curves);
        const conv = quoteConvention(q);
        expect(conv.unit, `${k} ${ins.field}`).toBe(ins.unit);
        if (conv.unit === 'rate') expect(typeof conv.dayCount).toBe('string');
        expect(Number.isFinite(kindModule(k).solver.firstRate(ins))).toBe(true);
      }
    }
  });

  it('gives every price quote its own yield and back, and leaves a rate quote as its own yield', () => {
    for (const k of QUOTE_KINDS) {
      for (const raw of EXAMPLES[k]) {
        const ins = compileQuote(validated(raw), SETTLEMENT, 'ACT/365F');
        const qy = quoteYieldOf(ins, SETTLEMENT);
        expect(qy.label).toMatch(/\(.*\)/);
        const y = qy.toYield(ins.market);
        expect(Number.isFinite(y), `${k} ${ins.field}`).toBe(true);
        if (ins.unit === 'rate') expect(y).toBe(ins.market);
        else expect(kindModule(k).priceYield(ins.quote, SETTLEMENT, qy.label), `${k} by price`).not.toBeNull();
        expect(qy.fromYield(y)).toBeCloseTo(ins.market, 9);
      }
    }
  });

  it('shifts every quote in quote space: by zero to the same value, by 10 bp through its own yield', () => {
    for (const k of QUOTE_KINDS) {
      for (const raw of EXAMPLES[k]) {
        const q = validated(raw);
        const ins = compileQuote(q, SETTLEMENT, 'ACT/365F');
        const qy = quoteYieldOf(ins, SETTLEMENT);
        const still = shiftQuote(q, 0, SETTLEMENT);
        expect(still.ok).toBe(true);
        if (still.ok) expect(compileQuote(still.value, SETTLEMENT, 'ACT/365F').market).toBeCloseTo(ins.market, 9);
        const moved = shiftQuote(q, 0.001, SETTLEMENT);
        expect(moved.ok, `${k} ${ins.field}`).toBe(true);
        if (moved.ok) expect(qy.toYield(compileQuote(moved.value, SETTLEMENT, 'ACT/365F').market) - qy.toYield(ins.market)).toBeCloseTo(0.001, 9);
      }
    }
  });

  it('weighs every kind in the fit: a positive, finite dollar duration', () => {
    for (const k of QUOTE_KINDS) {
      for (const raw of EXAMPLES[k]) {
        const q = validated(raw);
        const ins = compileQuote(q, SETTLEMENT, 'ACT/365F');
        const dd = kindModule(k).fit.dollarDuration(ins, q, SETTLEMENT, quoteYieldOf(ins, SETTLEMENT).toYield(ins.market));
        expect(dd, `${k} ${ins.field}`).toBeGreaterThan(0);
        expect(Number.isFinite(dd)).toBe(true);
      }
    }
  });

  it('reads every kind word and every kind header word back in a paste', () => {
    const seen = new Map<string, QuoteKind>();
    for (const m of KIND_MODULE_LIST) {
      for (const word of [m.kind, m.kind.toUpperCase(), ...m.paste.kindWords]) {
        const p = parseKindText(` ${word} `);
        expect(p.ok && p.value, `kind word "${word}"`).toBe(m.kind);
      }
      for (const w of m.paste.kindWords) {
        expect(seen.get(w) ?? m.kind, `kind word "${w}" claimed twice`).toBe(m.kind);
        expect(QUOTE_KINDS as readonly string[], `kind word "${w}" is another kind's name`).not.toContain(w);
        seen.set(w, m.kind);
      }
      for (const [word, column] of Object.entries(m.paste.headerWords)) expect(headerColumn(word), `header word "${word}" of ${m.kind}`).toBe(column);
    }
    expect(parseKindText('constructor').ok).toBe(false);
  });

  it('takes every example to a sheet row and back to the same quote', () => {
    let id = 0;
    for (const k of QUOTE_KINDS) {
      for (const raw of EXAMPLES[k]) {
        const wb = workbenchFromEngine(workspaceDoc([raw], { settlement: SETTLEMENT }), () => `r${id++}`);
        expect(wb.ok, `${k}`).toBe(true);
        if (!wb.ok) continue;
        const row = wb.value.quotes[0] as QuoteRow;
        const parsed = parseRow(row, 'decimal');
        expect(parsed.issues, `${k}`).toEqual({});
        expect(validated(parsed.quote as Record<string, string | number>)).toEqual(validated(raw));
      }
    }
  });

  it('validates and compiles an OIS with its date conventions; the sheet opens it with them in its Conventions cell and reads back the same quote', () => {
    const q = validated(OIS_WITH_CONVENTIONS);
    expect(compileQuote(q, SETTLEMENT, 'ACT/365F').kind).toBe('ois');
    const wb = workbenchFromEngine(workspaceDoc([OIS_WITH_CONVENTIONS], { settlement: SETTLEMENT }), () => 'r');
    if (!wb.ok) throw new Error(JSON.stringify(wb.errors));
    expect(wb.value.quotes[0]!.terms).toBe('calendar us-gov-securities, spot lag 2, rule following, payment lag 2');
    const back = validateWorkspace(toEngineDocument(wb.value).doc).workspace!.quotes[0]!;
    expect({ ...back, index: q.index }).toEqual(q);
  });

  it('takes forward par rates\' fixed leg from the first kind that sets one, else annual 30/360', () => {
    const quotes = QUOTE_KINDS.flatMap((k) => EXAMPLES[k].map(validated));
    expect(fixedLegConvention(quotes)).toEqual({ frequency: 1, dayCount: '30/360', eom: false });
    const quarterly = validated({ kind: 'swap', tenor: '5Y', rate: 0.03, frequency: 4, dayCount: 'ACT/360' });
    expect(fixedLegConvention([validated(EXAMPLES.deposit[0]!), quarterly])).toEqual({ frequency: 4, dayCount: 'ACT/360', eom: false });
    expect(fixedLegConvention([validated(EXAMPLES.deposit[0]!)])).toEqual({ frequency: 1, dayCount: '30/360', eom: false });
  });

  it('builds a curve from every kind at once', () => {
    const all = QUOTE_KINDS.map((k) => EXAMPLES[k][0]!);
    const build = buildCurve(workspaceDoc(all, { settlement: SETTLEMENT }));
    expect(build.errors).toEqual([]);
    expect(new Set(build.repricing.map((r) => r.kind))).toEqual(new Set(QUOTE_KINDS));
  });
});

/**
 * No code outside the registry's modules (and the instruments and quote types they are built on)
 * switches on a kind's name. A new place that needs to know a kind adds a part to the modules.
 */
describe('kinds are looked up, not switched on', () => {
  const repo = fileURLToPath(new URL('../../..', import.meta.url));
  const KIND_SWITCH = new RegExp(`(case|kind\\s*[!=]==)\\s*'(${QUOTE_KINDS.join('|')})'`);
  /** Where naming a kind is the point: the modules, the instruments they compile to, the quote types. */
  const OWNERS = [/^src\/core\/kinds\//, /^src\/core\/instruments\//, /^src\/core\/document\/types\.ts$/];
  /** Reviewed exception: a reference curve's own kind ('discount' or 'zero' columns) is not a quote kind. */
  const REVIEWED = ['src/core/scenarios/scenarioReference.ts'];

  it('finds no kind switch outside the registry', () => {
    const files = readdirSync(path.join(repo, 'src'), { withFileTypes: true, recursive: true })
      .filter((e) => e.isFile() && /\.tsx?$/.test(e.name))
      .map((e) => path.relative(repo, path.join(e.parentPath, e.name)).split(path.sep).join('/'));
    expect(files.length).toBeGreaterThan(50);
    const found = files
      .filter((f) => !OWNERS.some((o) => o.test(f)) && !REVIEWED.includes(f))
      .flatMap((f) => readFileSync(path.join(repo, f), 'utf8').split('\n').flatMap((line, i) => (KIND_SWITCH.test(line) ? [`${f}:${i + 1}: ${line.trim()}`] : [])));
    expect(found).toEqual([]);
  });
});
