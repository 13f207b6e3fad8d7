import type { ZeroQuote } from '../document/types.ts';
import { DISCOUNTING } from '../instruments/instrument.ts';
import { compileZero } from '../instruments/zero.ts';
import { COMPOUNDINGS, isCompounding, lnDiscountFromRate, rateFromLnDiscount, type Compounding } from '../rates/compounding.ts';
import { rateTag } from '../format/conventionTag.ts';
import { coreError, ok } from '../result.ts';
import { yearFraction } from '../time/dayCount.ts';
import { listOf, noCouponPeriod, oneOf, readDayCount, readPrice, readRate, readSpotSettlement, typeName } from './fields.ts';
import { flatDollarDuration, movedPrice, quotedRateOrDefault, spotSettledDates } from './shared.ts';
import type { QuoteKindModule } from './types.ts';

/**
 * Zero-coupon bond: 100 at maturity, quoted by its price per 100 face (DF = price / 100) or a zero
 * rate in its compounding (default annual) and day count (default ACT/365F) (instruments/zero.ts).
 */
export const ZERO: QuoteKindModule<ZeroQuote> = {
  kind: 'zero',
  schema: {
    fields: ['price', 'rate', 'compounding', 'dayCount', 'calendar', 'spotLag'],
    defaults: { dayCount: 'ACT/365F', compounding: 'annual' },
    read(raw, base, index, maturity, m, tenor, enabled, errors, settlement, calendars) {
      oneOf(raw, 'zero', base, index, errors, 'price', 'rate');
      const price = readPrice(raw, base, index, errors, 'price') ?? null;
      const rate = readRate(raw, base, index, errors, 'rate') ?? null;
      if (raw.rate === undefined && (raw.compounding !== undefined || raw.dayCount !== undefined)) {
        errors.push(coreError('schema', base, `${base}: compounding and dayCount go with a rate; a zero quoted by price takes neither`, index));
      }
      let compounding: Compounding = 'annual';
      if (raw.compounding !== undefined) {
        if (isCompounding(raw.compounding)) compounding = raw.compounding;
        else errors.push(coreError('unknown-identifier', `${base}.compounding`, `${base}.compounding: must be one of ${listOf(COMPOUNDINGS)}, not ${typeName(raw.compounding)}`, index));
      }
      const dayCount = noCouponPeriod(readDayCount(raw, base, index, errors, 'dayCount', 'ACT/365F'), 'zero', base, index, errors);
      // Settled at spot when the quote says so; else on the valuation date, as before.
      const spot = readSpotSettlement(raw, base, index, errors, settlement, maturity, calendars);
      return dayCount && spot !== null ? { kind: 'zero', index, maturity: m, tenor, enabled, price, rate, compounding, dayCount, ...spot } : null;
    },
  },
  sheet: { rateField: 'rate', rateWhat: 'zero rate', priceField: 'price', missingValue: 'rate', coupon: false, frequency: false, dayCount: 'with-rate' },
  paste: { kindWords: ['zeros', 'strip'], headerWords: {} },
  compile: (q, settlement, _s, _m, t, time) => compileZero(q, settlement, t, time),
  dates: spotSettledDates,
  curves: DISCOUNTING,
  nodeRole: 'discount',
  convention: (q) => (q.price !== null ? { unit: 'price', clean: false } : { unit: 'rate', compounding: q.compounding, dayCount: q.dayCount }),
  yieldLabel: (q) => `zero rate (${rateTag(q.compounding, q.dayCount)})`,
  /** By price: its zero rate in the quote's compounding and day count (defaults annual, ACT/365F). */
  priceYield(q, settlement, label) {
    const tau = yearFraction(q.dayCount, q.settle ?? settlement, q.maturity, { termination: q.maturity });
    return {
      toYield: (p) => rateFromLnDiscount(Math.log(p / 100), q.compounding, tau),
      fromYield: (r) => 100 * Math.exp(lnDiscountFromRate(r, q.compounding, tau)),
      label,
    };
  },
  /** A zero rate moves by d; a price moves its zero rate r by d: price = 100 DF(r + d). */
  shift(q, d, valuation) {
    const settlement = q.settle ?? valuation;
    if (q.rate !== null) return ok({ ...q, rate: q.rate + d });
    const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
    const r = rateFromLnDiscount(Math.log(q.price! / 100), q.compounding, tau);
    const price = 100 * Math.exp(lnDiscountFromRate(r + d, q.compounding, tau));
    return movedPrice(q, 'price', price, { ...q, price });
  },
  fit: { per100: 1, dollarDuration: (ins) => flatDollarDuration(ins), richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
};
