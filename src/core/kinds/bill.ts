import type { BillQuote } from '../document/types.ts';
import { billDiscountYieldFromPrice, billPriceFromDiscountYield, compileBill } from '../instruments/bill.ts';
import { DISCOUNTING } from '../instruments/instrument.ts';
import { ok } from '../result.ts';
import { daysBetween } from '../time/date.ts';
import { oneOf, readPrice, readRate, readSpotSettlement } from './fields.ts';
import { flatDollarDuration, movedPrice, quotedRateOrDefault, spotSettledDates } from './shared.ts';
import type { QuoteKindModule } from './types.ts';

/**
 * Discount bill: 100 at maturity, quoted by its bank discount yield d (decimal, actual days over
 * 360: price = 100 (1 - d days / 360), US Treasury) or its price per 100 face (instruments/bill.ts).
 * With `calendar` or `spotLag` it settles at spot (`settle`, Treasury bills T+1): the days count
 * from there and the price is paid there, DF(maturity) / DF(settle) = price / 100.
 */
export const BILL: QuoteKindModule<BillQuote> = {
  kind: 'bill',
  schema: {
    fields: ['discountYield', 'price', 'calendar', 'spotLag'],
    defaults: {},
    read(raw, base, index, maturity, m, tenor, enabled, errors, settlement, calendars) {
      oneOf(raw, 'bill', base, index, errors, 'discountYield', 'price');
      const discountYield = readRate(raw, base, index, errors, 'discountYield') ?? null;
      const price = readPrice(raw, base, index, errors, 'price') ?? null;
      // Settled at spot when the quote says so (Treasury bills settle T+1); else on the valuation date.
      const spot = readSpotSettlement(raw, base, index, errors, settlement, maturity, calendars);
      if (spot === null) return null;
      return { kind: 'bill', index, maturity: m, tenor, enabled, discountYield, price, ...spot };
    },
  },
  sheet: {
    rateField: 'discountYield',
    rateWhat: 'discount yield',
    priceField: 'price',
    missingValue: 'rate',
    coupon: false,
    frequency: false,
    dayCount: { refuse: 'day count (a bill is quoted on ACT/360 by definition)' },
  },
  paste: { kindWords: ['bills'], headerWords: { discountyield: 'rate' } },
  compile: (q, settlement, _s, _m, t, time) => compileBill(q, settlement, t, time),
  curves: DISCOUNTING,
  nodeRole: 'discount',
  convention: (q) => (q.price !== null ? { unit: 'price', clean: false } : { unit: 'rate', compounding: 'bank-discount', dayCount: 'ACT/360' }),
  yieldLabel: () => 'discount yield (ACT/360)',
  /** By price: its bank discount yield, actual days / 360 (US Treasury formula). */
  priceYield(q, settlement, label) {
    const days = daysBetween(q.settle ?? settlement, q.maturity);
    return { toYield: (p) => billDiscountYieldFromPrice(p, days), fromYield: (d) => billPriceFromDiscountYield(d, days), label };
  },
  /** A discount yield moves by d; a price moves its discount yield by d: price = 100 (1 - y days/360). */
  shift(q, d, settlement) {
    if (q.discountYield !== null) return ok({ ...q, discountYield: q.discountYield + d });
    const days = daysBetween(q.settle ?? settlement, q.maturity);
    const price = billPriceFromDiscountYield(billDiscountYieldFromPrice(q.price!, days) + d, days);
    return movedPrice(q, 'price', price, { ...q, price });
  },
  fit: { per100: 1, dollarDuration: (ins) => flatDollarDuration(ins), richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
  dates: spotSettledDates,
};
