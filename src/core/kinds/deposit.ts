import type { DepositQuote } from '../document/types.ts';
import { compileDeposit } from '../instruments/deposit.ts';
import { DISCOUNTING } from '../instruments/instrument.ts';
import { ok } from '../result.ts';
import { noCouponPeriod, readDayCount, readRate, required, RATE_TEXT } from './fields.ts';
import { flatDollarDuration, quotedRateOrDefault } from './shared.ts';
import type { QuoteKindModule } from './types.ts';
import { rateTag } from '../format/conventionTag.ts';

/**
 * Money-market deposit from settlement to maturity at a simple rate r (decimal) on its day count,
 * default ACT/360: DF(T) = 1 / (1 + r tau) (instruments/deposit.ts). Quoted by rate only.
 */
export const DEPOSIT: QuoteKindModule<DepositQuote> = {
  kind: 'deposit',
  schema: {
    fields: ['rate', 'dayCount'],
    defaults: { dayCount: 'ACT/360' },
    read(raw, base, index, _maturity, m, tenor, enabled, errors) {
      const rate = required(readRate(raw, base, index, errors, 'rate'), 'rate', RATE_TEXT, base, index, errors);
      const dayCount = noCouponPeriod(readDayCount(raw, base, index, errors, 'dayCount', 'ACT/360'), 'deposit', base, index, errors);
      return rate !== null && dayCount ? { kind: 'deposit', index, maturity: m, tenor, enabled, rate, dayCount } : null;
    },
  },
  sheet: { rateField: 'rate', rateWhat: 'deposit rate', priceField: null, missingValue: 'rate', coupon: false, frequency: false, dayCount: 'yes' },
  paste: { kindWords: ['depo', 'deposits'], headerWords: {} },
  compile: (q, settlement, _s, _m, t) => compileDeposit(q, settlement, t),
  curves: DISCOUNTING,
  nodeRole: 'discount',
  convention: (q) => ({ unit: 'rate', compounding: 'simple', dayCount: q.dayCount }),
  yieldLabel: (q) => `deposit rate (${rateTag('simple', q.dayCount)})`,
  priceYield: () => null,
  shift: (q, d) => ok({ ...q, rate: q.rate + d }),
  fit: { per100: 100, dollarDuration: (ins) => flatDollarDuration(ins), richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
};
