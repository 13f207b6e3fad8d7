import type { ParYieldQuote } from '../document/types.ts';
import { DISCOUNTING } from '../instruments/instrument.ts';
import { compileParYield, parYieldDollarDuration, parYieldSchedule, parYieldScheduleCivil } from '../instruments/parYield.ts';
import { ok } from '../result.ts';
import { civilFromIso, isMonthEnd, parseIsoDate } from '../time/date.ts';
import { couponTag } from '../format/conventionTag.ts';
import { RATE_TEXT, readDayCount, readFrequency, readRate, required } from './fields.ts';
import { compoundingOfFrequency, quotedRateOrDefault } from './shared.ts';
import type { QuoteKindModule } from './types.ts';

/**
 * Government par yield (a published par curve's point, such as a US Treasury par yield curve
 * rate): `yield` (decimal) compounded `frequency` times a year (default 2) on `dayCount` (default
 * ACT/ACT-ICMA; any bond day count). Above one year a theoretical par bond (coupon = yield, clean
 * price 100, coupon dates back from maturity, unadjusted); at one year or less a zero: on the US
 * Treasury basis (semiannual, ACT/ACT-ICMA) a bill's bond-equivalent yield (simple on actual/365
 * or 366 up to 182 days, Treasury's half-year-compounded rule beyond), on any other basis
 * DF = (1 + y/f)^(-n) over n coupon periods (instruments/parYield.ts). The end-of-month rule follows the maturity, as a bond's default.
 */
export const PAR_YIELD: QuoteKindModule<ParYieldQuote> = {
  kind: 'par-yield',
  schema: {
    fields: ['yield', 'frequency', 'dayCount'],
    defaults: { frequency: 2, dayCount: 'ACT/ACT-ICMA' },
    read(raw, base, index, maturity, m, tenor, enabled, errors, settlement) {
      const y = required(readRate(raw, base, index, errors, 'yield'), 'yield', RATE_TEXT, base, index, errors);
      const frequency = readFrequency(raw, 2, base, index, errors);
      const dayCount = readDayCount(raw, base, index, errors, 'dayCount', 'ACT/ACT-ICMA');
      const eom = maturity !== null && isMonthEnd(parseIsoDate(maturity)!);
      if (y === null || frequency === null || !dayCount) return null;
      // Which rule reads the yield (the bill's or the par bond's) is known once the dates are: say it on the quote.
      const billBasis = maturity !== null && settlement !== undefined && parYieldScheduleCivil({ maturity, frequency, dayCount, eom }, civilFromIso(settlement), civilFromIso(maturity)).bill !== null;
      return { kind: 'par-yield', index, maturity: m, tenor, enabled, yield: y, frequency, dayCount, eom, billBasis };
    },
  },
  sheet: { rateField: 'yield', rateWhat: 'par yield', priceField: null, missingValue: 'rate', coupon: false, frequency: true, dayCount: 'yes' },
  paste: {
    kindWords: ['par yield', 'par yields', 'paryield', 'par', 'cmt', 'par-yields'],
    headerWords: { paryield: 'rate', cmt: 'rate' },
  },
  compile: (q, _settlement, s, m, t, time) => compileParYield(q, s, m, t, time),
  curves: DISCOUNTING,
  nodeRole: 'discount',
  // A par yield at one year or less on the US Treasury basis is a bill's bond-equivalent yield (instruments/parYield.ts).
  convention: (q) => (q.billBasis ? { unit: 'rate', compounding: 'bill-equivalent', dayCount: 'ACT/365F' } : { unit: 'rate', compounding: compoundingOfFrequency(q.frequency), dayCount: q.dayCount }),
  yieldLabel: (q) => (q.billBasis ? 'par yield (a bill: bond-equivalent, ACT/365 or 366)' : `par yield (${couponTag(q.frequency, q.dayCount)})`),
  priceYield: () => null,
  /** The par yield moves by d (the theoretical bond's coupon moves with it: it stays at par). */
  shift: (q, d) => ok({ ...q, yield: q.yield + d }),
  /** The theoretical security's own dollar duration per 100 face at its yield (par bond, or the zero). */
  fit: { per100: 1, dollarDuration: (_ins, q, settlement, marketYield) => parYieldDollarDuration(parYieldSchedule(q, settlement), marketYield, q.frequency), richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
};
