import { billDiscountYieldFromPrice, billPriceFromDiscountYield } from '../instruments/bill.ts';
import { bondDirtyFromYield, bondSchedule, bondYieldFromDirty } from '../instruments/bond.ts';
import type { Instrument } from '../instruments/instrument.ts';
import { lnDiscountFromRate, rateFromLnDiscount } from '../rates/compounding.ts';
import { couponTag, rateTag } from '../format/conventionTag.ts';
import { yearFraction } from '../time/dayCount.ts';
import { daysBetween, type IsoDate } from '../time/date.ts';

/**
 * A quote's "own yield": the yield a trader moves when bumping that quote.
 *   rate quotes (deposit rate, swap rate, bill discount yield, zero rate, bond yield): the quote itself;
 *   bond by clean price: its ICMA yield at the coupon frequency (bondYieldFromDirty of clean + accrued);
 *   bill by price: its bank discount yield, actual days / 360 (US Treasury formula);
 *   zero by price: its zero rate in the quote's compounding and day count (defaults annual, ACT/365F).
 * All yields are decimals per year. `toYield` maps a market value in the quote's unit to its own
 * yield, `fromYield` back; both are exact inverses (to rounding). `label` names the yield with its
 * compounding and day count.
 */
export interface QuoteYield {
  toYield(value: number): number;
  fromYield(y: number): number;
  readonly label: string;
}

const IDENTITY = (label: string): QuoteYield => ({ toYield: (v) => v, fromYield: (y) => y, label });

/** The name and convention of a quote's own yield, e.g. "swap rate (ann, 30/360)". */
export function quoteYieldLabel(ins: Instrument): string {
  const q = ins.quote;
  switch (q.kind) {
    case 'deposit':
      return `deposit rate (${rateTag('simple', q.dayCount)})`;
    case 'bill':
      return 'discount yield (ACT/360)';
    case 'zero':
      return `zero rate (${rateTag(q.compounding, q.dayCount)})`;
    case 'bond':
      return `ICMA yield (${couponTag(q.frequency, q.dayCount)})`;
    case 'swap':
      return `swap rate (${couponTag(q.frequency, q.dayCount)})`;
  }
}

export function quoteYieldOf(ins: Instrument, settlement: IsoDate): QuoteYield {
  const q = ins.quote;
  const label = quoteYieldLabel(ins);
  if (ins.unit === 'rate') return IDENTITY(label);
  switch (q.kind) {
    case 'bond': {
      const s = bondSchedule(q, settlement);
      return {
        toYield: (clean) => bondYieldFromDirty(s, clean + s.accrued) ?? Number.NaN,
        fromYield: (y) => bondDirtyFromYield(s, y).price - s.accrued,
        label,
      };
    }
    case 'bill': {
      const days = daysBetween(settlement, q.maturity);
      return {
        toYield: (p) => billDiscountYieldFromPrice(p, days),
        fromYield: (d) => billPriceFromDiscountYield(d, days),
        label,
      };
    }
    case 'zero': {
      const tau = yearFraction(q.dayCount, settlement, q.maturity, { termination: q.maturity });
      return {
        toYield: (p) => rateFromLnDiscount(Math.log(p / 100), q.compounding, tau),
        fromYield: (r) => 100 * Math.exp(lnDiscountFromRate(r, q.compounding, tau)),
        label,
      };
    }
    default:
      return IDENTITY(label);
  }
}

/** The instrument with its quote moved by `dy` (decimal) through its own yield. */
export function bumpThroughYield(ins: Instrument, qy: QuoteYield, dy: number): Instrument {
  return ins.requote(qy.fromYield(qy.toYield(ins.market) + dy));
}

/** Market value of an instrument at its own yield y, in the quote's unit. */
export const requoteAtYield = (ins: Instrument, qy: QuoteYield, y: number): Instrument => ins.requote(qy.fromYield(y));
