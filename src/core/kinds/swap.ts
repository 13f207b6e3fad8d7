import type { DatedSwapQuote, SwapQuote } from '../document/types.ts';
import { compileOis } from '../instruments/ois.ts';
import { oisDollarDuration, oisQuoteDates, readDatedSwapTerms } from './ois.ts';
import { DISCOUNTING_AND_PROJECTING } from '../instruments/instrument.ts';
import { compileSwap, SwapLegs } from '../instruments/swap.ts';
import { ok } from '../result.ts';
import { readDayCount, readEom, readFrequency, readRate, required, RATE_TEXT } from './fields.ts';
import { compoundingOfFrequency, flatDollarDuration, quotedRateOrDefault } from './shared.ts';
import { couponTag } from '../format/conventionTag.ts';
import type { QuoteKindModule } from './types.ts';

/**
 * Single-curve par swap from settlement: fixed rate (decimal) on the fixed leg's frequency
 * (default 1) and day count (default 30/360), `eom` default false; the one curve discounts and
 * projects the floating leg (instruments/swap.ts). A market's swaps share their fixed legs (SwapLegs).
 */
export const SWAP: QuoteKindModule<SwapQuote> = {
  kind: 'swap',
  schema: {
    fields: ['rate', 'frequency', 'dayCount', 'eom', 'calendar', 'spotLag', 'businessDay', 'paymentLag'],
    defaults: { frequency: 1, dayCount: '30/360' },
    read(raw, base, index, maturity, m, tenor, enabled, errors, settlement, calendars) {
      const rate = required(readRate(raw, base, index, errors, 'rate'), 'rate', RATE_TEXT, base, index, errors);
      const frequency = readFrequency(raw, 1, base, index, errors);
      const dayCount = readDayCount(raw, base, index, errors, 'dayCount', '30/360');
      const eom = readEom(raw, base, index, errors, false);
      if (raw.calendar === undefined && raw.spotLag === undefined && raw.businessDay === undefined && raw.paymentLag === undefined) {
        // Today's swap: from the valuation date, unadjusted.
        if (rate === null || frequency === null || !dayCount || eom === null) return null;
        return { kind: 'swap', index, maturity: m, tenor, enabled, rate, frequency, dayCount, eom };
      }
      // On a calendar: the OIS's dates (kinds/ois.ts); on one curve it prices as one (instruments/ois.ts).
      const dated = readDatedSwapTerms(raw, base, index, errors, frequency, eom, settlement, maturity, tenor, calendars);
      if (rate === null || frequency === null || !dayCount || eom === null || dated === null) return null;
      return { kind: 'swap', index, maturity: dated.maturity, tenor, enabled, rate, frequency, dayCount, eom, ...dated.terms };
    },
  },
  sheet: { rateField: 'rate', rateWhat: 'swap rate', priceField: null, missingValue: 'rate', coupon: false, frequency: true, dayCount: 'yes' },
  paste: { kindWords: ['swaps', 'irs'], headerWords: { swaprate: 'rate' } },
  compile: (q, _settlement, s, m, t, time, shared) => (isDated(q) ? compileOis(q, s, time) : compileSwap(q, s, m, t, time, shared as SwapLegs | undefined)),
  // The shared fixed legs are those of today's swaps; a swap on a calendar has its own dates.
  share: (s, time, quotes) => new SwapLegs(s, time, quotes.filter(([q]) => !isDated(q))),
  curves: DISCOUNTING_AND_PROJECTING,
  nodeRole: 'discount',
  // On a projection curve a swap from the valuation date is a term-index swap; a swap on a calendar is not taken there yet.
  onProjection: (q) => (isDated(q) ? null : 'index-swap'),
  convention: (q) => ({ unit: 'rate', compounding: compoundingOfFrequency(q.frequency), dayCount: q.dayCount }),
  yieldLabel: (q) => `swap rate (${couponTag(q.frequency, q.dayCount)})`,
  priceYield: () => null,
  shift: (q, d) => ok({ ...q, rate: q.rate + d }),
  fit: { per100: 100, dollarDuration: (ins) => (isDated(ins.quote as SwapQuote) ? oisDollarDuration(ins) : flatDollarDuration(ins)), richCheap: false },
  solver: { firstRate: quotedRateOrDefault },
  fixedLeg: (q) => ({ frequency: q.frequency, dayCount: q.dayCount, eom: q.eom }),
  // Today's single-curve swap: from the valuation date, unadjusted, paying at its maturity; on a calendar, the OIS's dates.
  dates: (q, valuation) => (isDated(q) ? oisQuoteDates(q, valuation) : { start: valuation, end: q.maturity, payment: q.maturity }),
};

/** Whether a swap quote gave its date conventions (then it carries the OIS's date terms). */
export const isDated = (q: SwapQuote): q is SwapQuote & DatedSwapQuote => q.calendar !== undefined;
