import type { Instrument } from '../instruments/instrument.ts';
import { moduleOf } from '../kinds/registry.ts';
import type { QuoteYield } from '../kinds/types.ts';
import type { IsoDate } from '../time/date.ts';

export type { QuoteYield } from '../kinds/types.ts';

/**
 * A quote's "own yield": the yield a trader moves when bumping that quote.
 *   rate quotes (deposit rate, swap rate, bill discount yield, zero rate, bond yield): the quote itself;
 *   price quotes: the kind's own yield of the price (`QuoteKindModule.priceYield`, src/core/kinds):
 *   a bond's ICMA yield at its coupon frequency, a bill's bank discount yield (actual days / 360,
 *   US Treasury), a zero's rate in its compounding and day count.
 * All yields are decimals per year; `toYield` and `fromYield` are exact inverses (to rounding).
 */
const IDENTITY = (label: string): QuoteYield => ({ toYield: (v) => v, fromYield: (y) => y, label });

/** The name and convention of a quote's own yield, e.g. "swap rate (ann, 30/360)". */
export function quoteYieldLabel(ins: Instrument): string {
  return moduleOf(ins.quote).yieldLabel(ins.quote);
}

export function quoteYieldOf(ins: Instrument, settlement: IsoDate): QuoteYield {
  const label = quoteYieldLabel(ins);
  if (ins.unit === 'rate') return IDENTITY(label);
  return moduleOf(ins.quote).priceYield(ins.quote, settlement, label) ?? IDENTITY(label);
}

/** The instrument with its quote moved by `dy` (decimal) through its own yield. */
export function bumpThroughYield(ins: Instrument, qy: QuoteYield, dy: number): Instrument {
  return ins.requote(qy.fromYield(qy.toYield(ins.market) + dy));
}

/** Market value of an instrument at its own yield y, in the quote's unit. */
export const requoteAtYield = (ins: Instrument, qy: QuoteYield, y: number): Instrument => ins.requote(qy.fromYield(y));
