import { QUOTE_KINDS, type Quote, type QuoteKind } from '../document/types.ts';
import type { QuoteColumn } from '../input/quoteRow.ts';
import { conventionSet } from './conventionSets.ts';
import { BILL } from './bill.ts';
import { BOND } from './bond.ts';
import { DEPOSIT } from './deposit.ts';
import { FRA } from './fra.ts';
import { FUTURE } from './future.ts';
import { OIS } from './ois.ts';
import { PAR_YIELD } from './parYield.ts';
import { SWAP } from './swap.ts';
import type { FixedLegConvention, QuoteConvention, QuoteDates, QuoteKindModule } from './types.ts';
import type { IsoDate } from '../time/date.ts';
import { ZERO } from './zero.ts';

/** Every quote kind the engine offers, by name; each module owns everything about its kind (kinds/types.ts). */
export const QUOTE_KIND_MODULES: { readonly [K in QuoteKind]: QuoteKindModule<Extract<Quote, { kind: K }>> } = {
  deposit: DEPOSIT,
  bill: BILL,
  zero: ZERO,
  bond: BOND,
  swap: SWAP,
  ois: OIS,
  'par-yield': PAR_YIELD,
  future: FUTURE,
  fra: FRA,
};

/** The modules in QUOTE_KINDS order (the order kinds are listed in messages). */
export const KIND_MODULE_LIST: readonly QuoteKindModule[] = QUOTE_KINDS.map((k) => QUOTE_KIND_MODULES[k] as QuoteKindModule);

/** The module of a kind. */
export const kindModule = (kind: QuoteKind): QuoteKindModule => QUOTE_KIND_MODULES[kind] as QuoteKindModule;

/** The module of a validated quote's kind. */
export const moduleOf = (q: Quote): QuoteKindModule => QUOTE_KIND_MODULES[q.kind] as QuoteKindModule;

/** Fields a quote of each kind accepts, the common ones (`kind`, `tenor`, `maturity`, `enabled`) first. */
export const KIND_ALLOWED_FIELDS: Readonly<Record<QuoteKind, ReadonlySet<string>>> = Object.fromEntries(
  QUOTE_KINDS.map((k) => [k, new Set(['kind', 'tenor', 'maturity', 'enabled', 'conventions', ...QUOTE_KIND_MODULES[k].schema.fields])]),
) as unknown as Record<QuoteKind, ReadonlySet<string>>;

/** The fields the sheet's Rate / yield column fills across the kinds (`rate`, `discountYield`, `yield`), each once. */
export const KIND_RATE_FIELDS: readonly string[] = [...new Set(KIND_MODULE_LIST.flatMap((m) => (m.sheet.rateField === null ? [] : [m.sheet.rateField])))];
/** The fields the sheet's Price column fills across the kinds (`price`, `cleanPrice`), each once. */
export const KIND_PRICE_FIELDS: readonly string[] = [...new Set(KIND_MODULE_LIST.flatMap((m) => (m.sheet.priceField === null ? [] : [m.sheet.priceField])))];
/** Every field that holds a quote's quoted value (what a typed number changes): the rate and price fields. */
export const QUOTE_VALUE_FIELDS: readonly string[] = [...KIND_RATE_FIELDS, ...KIND_PRICE_FIELDS];

/** Words a sheet cell or a pasted block may use for a kind besides its name (lower case): `depo`, `irs`, ... */
export const KIND_WORDS: Readonly<Record<string, QuoteKind>> = Object.fromEntries(KIND_MODULE_LIST.flatMap((m) => m.paste.kindWords.map((w) => [w, m.kind])));

/** Header words the kinds contribute to a paste (`swaprate`, `cleanprice`, `cpn`, ...), letters only, lower case. */
export const KIND_HEADER_WORDS: Readonly<Record<string, QuoteColumn>> = Object.fromEntries(KIND_MODULE_LIST.flatMap((m) => Object.entries(m.paste.headerWords)));

/**
 * The default a kind gives an empty Freq or Day count cell (its schema's constant defaults), as
 * the sheet shows it faintly; undefined for any other column, a kind without that default, or text
 * that is not a kind.
 */
export function sheetDefault(kindText: string, column: QuoteColumn, conventions?: string): string | undefined {
  const k = kindText.trim().toLowerCase();
  const m = (QUOTE_KIND_MODULES as Readonly<Record<string, QuoteKindModule>>)[k];
  if (m === undefined || !Object.hasOwn(QUOTE_KIND_MODULES, k)) return undefined;
  // The Conventions cell of a row without a set of its own shows the set it takes, when that set fills its kind.
  if (column === 'terms') return conventions !== undefined && conventionSet(conventions)?.fields[k as QuoteKind] !== undefined ? conventions : undefined;
  // A workspace's market conventions fill the field first, when their set fills it for this kind.
  const filled = conventions === undefined ? undefined : conventionSet(conventions)?.fields[k as QuoteKind]?.[column];
  if (filled !== undefined) return String(filled);
  const d = m.schema.defaults;
  if (column === 'frequency') return d.frequency === undefined ? undefined : String(d.frequency);
  if (column === 'dayCount') return d.dayCount;
  return undefined;
}

/** How a validated quote is quoted (unit, compounding, day count), for the UI to format. */
export const quoteConvention = (q: Quote): QuoteConvention => moduleOf(q).convention(q);

/** A quote's adjusted start, accrual end and last payment (kinds/types.ts QuoteDates); the kind's own, else from the valuation date to the maturity. */
export const quoteDates = (q: Quote, valuation: IsoDate): QuoteDates => moduleOf(q).dates?.(q, valuation) ?? { start: valuation, end: q.maturity, payment: null };


/**
 * The fixed-leg convention forward par swap rates take in a market: that of its first quote whose
 * kind sets one (`fixedLeg`: a swap's), else the swap kind's schema defaults (annual, 30/360, no
 * end-of-month rule: common practice).
 */
export function fixedLegConvention(quotes: readonly Quote[]): FixedLegConvention {
  for (const q of quotes) {
    const leg = moduleOf(q).fixedLeg?.(q);
    if (leg) return leg;
  }
  return { frequency: SWAP.schema.defaults.frequency ?? 1, dayCount: SWAP.schema.defaults.dayCount ?? '30/360', eom: false };
}
