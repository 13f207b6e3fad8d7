import type { QuoteKind } from '../document/types.ts';
import { coreError, type CoreError } from '../result.ts';
import { listOf, typeName, type RawQuote } from './fields.ts';

/**
 * Named convention sets: a quote's `"conventions": "<set id>"` fills the fields its market quotes
 * with, for the kinds the set knows; a field the quote gives itself overrides the set's. The ids
 * are our own names; the values are the market's, from MARKET-CONVENTIONS.md sections c and d
 * (spot lags, calendars, payment lags and day counts of overnight-index swaps as the open-source
 * Strata and muRisQ convention files state them; deposits' spot lags as common practice) and g
 * (US Treasury coupons semiannual, ACT/ACT-ICMA). Each set says in `note` what it does not apply.
 */
export interface ConventionSetDefinition {
  readonly id: string;
  /** What the set is, for people (shown with the set). */
  readonly title: string;
  /** Fields filled, by quote kind. A kind not listed cannot name the set. */
  readonly fields: Partial<Readonly<Record<QuoteKind, Readonly<Record<string, string | number | boolean>>>>>;
  /** What the market does that this build does not apply yet, said plainly; empty when nothing. */
  readonly note: string;
}

export const CONVENTION_SETS: readonly ConventionSetDefinition[] = [
  {
    id: 'usd-sofr',
    title: 'US dollar SOFR: overnight-index swaps and deposits',
    fields: {
      // SOFR OIS: T+2 on the US government securities calendar, annual ACT/360 both legs, modified
      // following, paid 2 business days after each accrual end (MARKET-CONVENTIONS.md d; Strata USD_FIXED_1Y_SOFR_OIS).
      ois: { calendar: 'us-gov-securities', spotLag: 2, businessDay: 'modified-following', paymentLag: 2, frequency: 1, dayCount: 'ACT/360', floatDayCount: 'ACT/360' },
      // Dollar deposits: ACT/360 from spot, T+2 (common practice; from memory for cash deposits).
      deposit: { calendar: 'us-gov-securities', spotLag: 2, dayCount: 'ACT/360' },
    },
    note: '',
  },
  {
    id: 'eur-estr',
    title: 'Euro €STR: overnight-index swaps and deposits',
    fields: {
      // €STR OIS: T+2 on TARGET, annual ACT/360, modified following, payment lag 1 (MARKET-CONVENTIONS.md d; muRisQ, Strata).
      ois: { calendar: 'target', spotLag: 2, businessDay: 'modified-following', paymentLag: 1, frequency: 1, dayCount: 'ACT/360', floatDayCount: 'ACT/360' },
      // Euro deposits: T+2 on TARGET, ACT/360 (MARKET-CONVENTIONS.md c, QuantLib euribor.cpp).
      deposit: { calendar: 'target', spotLag: 2, dayCount: 'ACT/360' },
    },
    note: '',
  },
  {
    id: 'gbp-sonia',
    title: 'Sterling SONIA: overnight-index swaps and deposits',
    fields: {
      // SONIA OIS: T+0 on England and Wales days, annual ACT/365F both legs, no payment lag (MARKET-CONVENTIONS.md d; Strata GBP_FIXED_1Y_SONIA_OIS).
      ois: { calendar: 'england-wales', spotLag: 0, businessDay: 'modified-following', paymentLag: 0, frequency: 1, dayCount: 'ACT/365F', floatDayCount: 'ACT/365F' },
      // Sterling deposits: T+0, ACT/365F (common practice; from memory).
      deposit: { calendar: 'england-wales', spotLag: 0, dayCount: 'ACT/365F' },
    },
    note: '',
  },
  {
    id: 'us-treasury',
    title: 'US Treasury bills, notes and bonds',
    // Notes and bonds pay semiannually on ACT/ACT-ICMA; bills and coupons settle T+1 on the US
    // government securities calendar (MARKET-CONVENTIONS.md c, quantlib-old#231); the daily par
    // yield curve is on the coupon basis and is a curve of the day, so it takes no settlement (g).
    fields: {
      bond: { frequency: 2, dayCount: 'ACT/ACT-ICMA', calendar: 'us-gov-securities', spotLag: 1 },
      bill: { calendar: 'us-gov-securities', spotLag: 1 },
      'par-yield': { frequency: 2, dayCount: 'ACT/ACT-ICMA' },
    },
    note: '',
  },
  {
    id: 'euro-govt',
    title: 'Euro area government bonds',
    // Annual ACT/ACT-ICMA coupons, T+2 on TARGET (MARKET-CONVENTIONS.md c, German Bunds: quantlib-old PR#219).
    fields: { bond: { frequency: 1, dayCount: 'ACT/ACT-ICMA', calendar: 'target', spotLag: 2 } },
    note: '',
  },
  {
    id: 'uk-gilt',
    title: 'UK gilts',
    // Semiannual ACT/ACT-ICMA coupons, T+1 on England and Wales days (MARKET-CONVENTIONS.md c, a secondary source).
    fields: { bond: { frequency: 2, dayCount: 'ACT/ACT-ICMA', calendar: 'england-wales', spotLag: 1 } },
    note: 'gilts trade ex-dividend seven business days before a coupon; a gilt quoted in that window is priced here as if cum-dividend',
  },
  {
    id: 'eur-euribor-3m',
    title: 'Euro EURIBOR 3M: deposits and FRAs on the three-month index',
    fields: {
      // EURIBOR: T+2 on TARGET, modified following and end of month for month tenors, ACT/360
      // (MARKET-CONVENTIONS.md c and f; QuantLib euribor.cpp: 2 settlement days, TARGET,
      // euriborConvention, euriborEOM, Actual360).
      deposit: { calendar: 'target', spotLag: 2, businessDay: 'modified-following', eom: true, dayCount: 'ACT/360' },
      fra: { calendar: 'target', spotLag: 2, businessDay: 'modified-following', eom: true, dayCount: 'ACT/360', index: '3M' },
    },
    note: 'one curve both projects the index and discounts (no separate overnight discounting curve yet)',
  },
  {
    id: 'eur-euribor-6m',
    title: 'Euro EURIBOR 6M: deposits and FRAs on the six-month index',
    fields: {
      // As EURIBOR 3M, on the six-month index (QuantLib euribor.cpp, the same conventions for every month tenor).
      deposit: { calendar: 'target', spotLag: 2, businessDay: 'modified-following', eom: true, dayCount: 'ACT/360' },
      fra: { calendar: 'target', spotLag: 2, businessDay: 'modified-following', eom: true, dayCount: 'ACT/360', index: '6M' },
    },
    note: 'one curve both projects the index and discounts (no separate overnight discounting curve yet)',
  },
];

export const CONVENTION_SET_IDS: readonly string[] = CONVENTION_SETS.map((s) => s.id);
const BY_ID: ReadonlyMap<string, ConventionSetDefinition> = new Map(CONVENTION_SETS.map((s) => [s.id, s]));

export const conventionSet = (id: string): ConventionSetDefinition | undefined => BY_ID.get(id);

/**
 * The raw quote with its named set's fields filled in under its own (the quote's explicit fields
 * win). Null, with an error naming `base.conventions`, when the set is unknown (the valid ids
 * listed) or not for this kind (its kinds listed). A quote without `conventions` is returned as is.
 */
export function withConventionSet(raw: RawQuote, kind: QuoteKind, base: string, index: number, errors: CoreError[]): RawQuote | null {
  const id = raw.conventions;
  if (id === undefined) return raw;
  const path = `${base}.conventions`;
  const set = typeof id === 'string' ? BY_ID.get(id) : undefined;
  if (set === undefined) {
    errors.push(coreError('unknown-identifier', path, `${path}: must be one of ${listOf(CONVENTION_SET_IDS)}, not ${typeName(id)}`, index));
    return null;
  }
  const fields = set.fields[kind];
  if (fields === undefined) {
    errors.push(coreError('unknown-identifier', path, `${path}: the set "${set.id}" (${set.title}) fills ${listOf(Object.keys(set.fields))} quotes, not a ${kind}; the sets for a ${kind} are ${listOf(CONVENTION_SETS.filter((s) => s.fields[kind]).map((s) => s.id)) || 'none'}`, index));
    return null;
  }
  return { ...fields, ...raw };
}
