import type { BondQuote } from '../document/types.ts';
import { bondDirtyFromYield, bondSchedule, bondYieldFromDirty, compileBond } from '../instruments/bond.ts';
import { DISCOUNTING } from '../instruments/instrument.ts';
import { coreError, fail, ok } from '../result.ts';
import { isMonthEnd, parseIsoDate } from '../time/date.ts';
import { COUPON_MAX, COUPON_TEXT, oneOf, readDayCount, readEom, readFrequency, readNumber, readPrice, readRate, readSpotSettlement, required } from './fields.ts';
import { compoundingOfFrequency, movedPrice, quotedRateOrDefault, spotSettledDates } from './shared.ts';
import { couponTag } from '../format/conventionTag.ts';
import type { QuoteKindModule } from './types.ts';

/**
 * Fixed-coupon bond: coupon (decimal per year) paid `frequency` times a year (default 2), quoted
 * by its clean price per 100 face or its ICMA yield compounded at the coupon frequency; day count
 * default ACT/ACT-ICMA; `eom` defaults to whether the maturity is a month end (instruments/bond.ts).
 * With `calendar` or `spotLag` it settles at spot (`settle`): price, accrued interest and yield are
 * at that date, and its value today is the dirty price times DF(settle).
 */
export const BOND: QuoteKindModule<BondQuote> = {
  kind: 'bond',
  schema: {
    fields: ['coupon', 'frequency', 'cleanPrice', 'yield', 'dayCount', 'eom', 'calendar', 'spotLag'],
    defaults: { frequency: 2, dayCount: 'ACT/ACT-ICMA' },
    read(raw, base, index, maturity, m, tenor, enabled, errors, settlement, calendars) {
      const coupon = required(readNumber(raw, base, index, errors, 'coupon', 0, COUPON_MAX, COUPON_TEXT), 'coupon', COUPON_TEXT, base, index, errors);
      const frequency = readFrequency(raw, 2, base, index, errors);
      oneOf(raw, 'bond', base, index, errors, 'cleanPrice', 'yield');
      const cleanPrice = readPrice(raw, base, index, errors, 'cleanPrice') ?? null;
      const y = readRate(raw, base, index, errors, 'yield') ?? null;
      const dayCount = readDayCount(raw, base, index, errors, 'dayCount', 'ACT/ACT-ICMA');
      const eom = readEom(raw, base, index, errors, maturity !== null && isMonthEnd(parseIsoDate(maturity)!));
      // Settled at spot when the quote says so (the market's T+1 or T+2); else on the valuation date, as before.
      const spot = readSpotSettlement(raw, base, index, errors, settlement, maturity, calendars);
      if (coupon === null || frequency === null || !dayCount || eom === null || spot === null) return null;
      return { kind: 'bond', index, maturity: m, tenor, enabled, coupon, frequency, cleanPrice, yield: y, dayCount, eom, ...spot };
    },
  },
  sheet: { rateField: 'yield', rateWhat: 'yield', priceField: 'cleanPrice', missingValue: 'price', coupon: true, frequency: true, dayCount: 'yes' },
  paste: {
    kindWords: ['bonds'],
    headerWords: { cleanprice: 'price', cleanpx: 'price', cpn: 'coupon', couponrate: 'coupon', couponfrequency: 'frequency', cpnfreq: 'frequency' },
  },
  compile: (q, _settlement, s, m, t, time) => compileBond(q, s, m, t, time),
  curves: DISCOUNTING,
  nodeRole: 'discount',
  convention: (q) => (q.cleanPrice !== null ? { unit: 'price', clean: true } : { unit: 'rate', compounding: compoundingOfFrequency(q.frequency), dayCount: q.dayCount }),
  yieldLabel: (q) => `ICMA yield (${couponTag(q.frequency, q.dayCount)})`,
  /** By clean price: its ICMA yield at the coupon frequency (bondYieldFromDirty of clean + accrued). */
  priceYield(q, settlement, label) {
    const s = bondSchedule(q, q.settle ?? settlement);
    return {
      toYield: (clean) => bondYieldFromDirty(s, clean + s.accrued) ?? Number.NaN,
      fromYield: (y) => bondDirtyFromYield(s, y).price - s.accrued,
      label,
    };
  },
  /** A yield moves by d; a clean price moves its ICMA yield y by d: clean = dirty(y + d) - accrued. */
  shift(q, d, settlement) {
    if (q.yield !== null) return ok({ ...q, yield: q.yield + d });
    const s = bondSchedule(q, q.settle ?? settlement);
    const y = bondYieldFromDirty(s, q.cleanPrice! + s.accrued);
    if (y === null) {
      const path = `quotes[${q.index}].cleanPrice`;
      return fail(coreError('no-solution', path, `${path}: no yield gives the clean price ${q.cleanPrice}, so the scenario cannot move it; check the price`, q.index));
    }
    const clean = bondDirtyFromYield(s, y + d).price - s.accrued;
    return movedPrice(q, 'cleanPrice', clean, { ...q, cleanPrice: clean });
  },
  /** The bond's own dollar duration -dP/dy at its ICMA yield (bondDirtyFromYield). */
  fit: { per100: 1, dollarDuration: (_ins, q, settlement, marketYield) => -bondDirtyFromYield(bondSchedule(q, q.settle ?? settlement), marketYield).dPdy, richCheap: true },
  solver: { firstRate: quotedRateOrDefault },
  dates: spotSettledDates,
};
